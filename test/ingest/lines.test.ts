/**
 * lines.ts: a byte stream cut into blocks of whole lines, whatever the chunk sizes (module comment of
 * src/ingest/lines.ts), checked against the whole-buffer rules of text.ts (prepareText).
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import fc from 'fast-check';
import { encodingOf, LineSplitter, splitWhole, type TextBlock } from '../../src/ingest/lines.js';
import { prepareText } from '../../src/ingest/text.js';
import { MetarReader, readMetarBytes } from '../../src/ingest/metar.js';

/** Push `bytes` in pieces cut at `cuts` (sorted offsets), then end. */
function splitAt(bytes: Buffer, cuts: number[], s: LineSplitter): TextBlock[] {
  const out: TextBlock[] = [];
  let at = 0;
  for (const c of [...cuts, bytes.length]) {
    const b = s.push(bytes.subarray(at, c));
    if (b) out.push(b);
    at = c;
  }
  const e = s.end();
  if (e) out.push(e);
  return out;
}

/** Line numbers of every line start in the blocks, counted from each block's firstLine. */
function lineStarts(blocks: TextBlock[]): { line: number; text: string }[] {
  const out: { line: number; text: string }[] = [];
  for (const b of blocks) {
    const t = b.bytes.toString('utf8');
    if (t === '') continue;
    const parts = t.split('\n');
    if (parts[parts.length - 1] === '') parts.pop();
    parts.forEach((p, i) => out.push({ line: b.firstLine + i, text: p }));
  }
  return out;
}

test('a CRLF split over two chunks ends one line, not two (Unicode Standard §5.8: CR LF is one line end)', () => {
  const s = new LineSplitter();
  assert.is(s.push(Buffer.from('a\r')), null);
  const b = s.push(Buffer.from('\nb'))!;
  assert.is(b.bytes.toString(), 'a\r\n');
  const e = s.end()!;
  assert.is(e.bytes.toString(), 'b');
  assert.is(e.firstLine, 2);
  assert.equal(s.notes(), []);
});

test('a BOM split over chunks is dropped (Unicode Standard §23.8: EF BB BF at the start)', () => {
  const s = new LineSplitter();
  const blocks = splitAt(Buffer.from('\ufeffx\ny\n'), [1, 2], s);
  assert.is(Buffer.concat(blocks.map((b) => b.bytes)).toString(), 'x\ny\n');
  assert.ok(s.bom);
});

test('lone CRs across chunks: one physical line each, rewritten to LF, noted as prepareText notes them (Unicode Standard §5.8)', () => {
  const text = Buffer.from('a\rb\rc\r\nd\ne');
  const s = new LineSplitter();
  const blocks = splitAt(text, [1, 2, 5, 6], s);
  assert.equal(
    lineStarts(blocks).map((l) => [l.line, l.text]),
    [
      [1, 'a'],
      [2, 'b'],
      [3, 'c'],
      [4, 'd'],
      [5, 'e'],
    ],
  );
  assert.equal(s.notes(), prepareText(text).notes);
});

test('a UTF-8 sequence cut by a chunk boundary stays whole (RFC 3629 §3)', () => {
  const text = Buffer.from('t,°F\n1,2\n');
  const s = new LineSplitter();
  const blocks = splitAt(text, [3], s);
  assert.is(Buffer.concat(blocks.map((b) => b.bytes)).toString(), 't,°F\n1,2\n');
  assert.is(s.encodingUsed, 'utf-8');
});

test('not UTF-8 after the first block: read as Windows-1252 from that line on, and said so (WHATWG Encoding Standard, windows-1252 index: B0 is °)', () => {
  const s = new LineSplitter();
  const a = s.push(Buffer.from('x,y\n1,2\n'))!;
  const b = s.push(Buffer.from('3,\xb0\n', 'latin1'))!;
  s.end();
  assert.is(a.bytes.toString(), 'x,y\n1,2\n');
  assert.is(b.bytes.toString(), '3,°\n');
  assert.is(b.firstLine, 3);
  assert.match(s.notes()[0]!, /from line 3 on/);
  // decided on the whole buffer (what prepareText does): the note of prepareText
  const whole = Buffer.from('x\n\xb0\n', 'latin1');
  const w = new LineSplitter({ encoding: encodingOf(whole) });
  splitWhole(whole, w);
  assert.equal(w.notes(), prepareText(whole).notes);
});

test('any chunking gives the text and line numbers of the whole buffer (random texts and cuts; common practice, no source)', () => {
  const piece = fc.constantFrom('a', 'bc', ' ', '°', '\r', '\n', '\r\n', '\u0000', 'é');
  fc.assert(
    fc.property(fc.array(piece, { maxLength: 60 }), fc.boolean(), fc.array(fc.nat(200), { maxLength: 8 }), (parts, bom, rawCuts) => {
      const bytes = Buffer.from((bom ? '\ufeff' : '') + parts.join(''), 'utf8');
      const cuts = [...new Set(rawCuts.map((c) => c % (bytes.length + 1)))].sort((x, y) => x - y);
      const s = new LineSplitter({ lf: true });
      const blocks = splitAt(bytes, cuts, s);
      const expected = prepareText(bytes).bytes.toString('utf8').replace(/\r\n/g, '\n');
      assert.is(Buffer.concat(blocks.map((b) => b.bytes)).toString('utf8'), expected);
      const want = expected.split('\n');
      if (want[want.length - 1] === '') want.pop();
      assert.equal(
        lineStarts(blocks).map((l) => l.line),
        want.map((_, i) => i + 1),
      );
      assert.equal(s.notes(), prepareText(bytes).notes);
      assert.is(blocks.some((b) => b.hasNul), prepareText(bytes).hasNul);
    }),
    { numRuns: 500 },
  );
});

test('the METAR reader fed in small chunks gives what it gives on the whole file (WMO-No. 306 FM 15 reports, invented)', () => {
  const lines = Array.from({ length: 40 }, (_, h) => `2024030${1 + Math.floor(h / 24)}${String(h % 24).padStart(2, '0')}51 METAR KXYZ 0${1 + Math.floor(h / 24)}${String(h % 24).padStart(2, '0')}51Z 18010KT 10SM CLR 05/01 A3001 RMK AO2 T00500011`);
  lines[7] = '# a comment';
  lines[9] = 'garbage';
  const bytes = Buffer.from(lines.join('\r\n') + '\r\n');
  const whole = readMetarBytes(bytes, 'k.txt');
  for (const size of [1, 7, 64, 1000]) {
    const s = new LineSplitter();
    const r = new MetarReader('k.txt');
    for (let i = 0; i < bytes.length; i += size) {
      const b = s.push(bytes.subarray(i, i + size));
      if (b) r.block(b);
    }
    const e = s.end();
    if (e) r.block(e);
    const got = r.finish(s.notes());
    assert.equal(got.report, whole.report);
    assert.equal(got.observations, whole.observations);
  }
});

test.run();
