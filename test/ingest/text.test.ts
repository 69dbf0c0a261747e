/**
 * text.ts: binary decision, encoding, BOM, line ends (module comment of src/ingest/text.ts).
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { looksBinary, nonTextShare, normalizeLineEnds, prepareText } from '../../src/ingest/text.js';
import { readMetarText } from '../../src/ingest/metar.js';
import { readCsvBytes } from '../../src/ingest/csv.js';

const REPORT = (h: number) => `2024030${1}${String(h).padStart(2, '0')}51 METAR KXYZ 01${String(h).padStart(2, '0')}51Z 18010KT 10SM CLR 05/01 A3001`;

test('CR-only line ends: every METAR report is read (Unicode Standard §5.8: CR alone is a line end)', () => {
  const lines = Array.from({ length: 24 }, (_, h) => REPORT(h));
  const r = readMetarText(lines.join('\r') + '\r', 'cr.txt');
  assert.is(r.report.parsed, 24);
  assert.is(r.observations[23]!.line, 24);
  assert.match(r.report.notes[0]!, /24 CR/);
});

test('mixed LF / CRLF / CR: one row per physical line in CSV (Unicode Standard §5.8)', () => {
  const t = 'station,time,tmpc\r\nA,2024-01-01T00:00Z,1\nA,2024-01-01T01:00Z,2\r\nA,2024-01-01T02:00Z,3\rA,2024-01-01T03:00Z,4\n';
  const r = readCsvBytes(Buffer.from(t), 'mix.csv', {});
  assert.is(r.report.parsed, 4);
  assert.equal(
    r.observations.map((o) => o.line),
    [2, 3, 4, 5],
  );
  assert.equal(normalizeLineEnds('a\r\nb\nc\rd').text, 'a\nb\nc\nd');
  // all CRLF or all LF: left as it is (no copy)
  const crlf = Buffer.from('a\r\nb\r\n');
  assert.is(prepareText(crlf).bytes, crlf);
});

test('a UTF-8 BOM at the start of a METAR file is dropped (Unicode Standard §23.8): the first report is read', () => {
  const r = readMetarText('\ufeff' + REPORT(0) + '\n' + REPORT(1) + '\n', 'bom.txt');
  assert.is(r.report.parsed, 2);
  assert.is(r.report.rejected, 0);
});

test('Latin-1 / Windows-1252 bytes: decoded as such and noted; B0 is the degree sign (WHATWG Encoding Standard, windows-1252 index)', () => {
  const latin = Buffer.from('station,time,Temp (\xb0F)\nKAAA,2024-01-01T00:00Z,50\n', 'latin1');
  const p = prepareText(latin);
  assert.is(p.encoding, 'windows-1252');
  assert.ok(p.bytes.toString('utf8').includes('Temp (°F)'));
  const r = readCsvBytes(latin, 'l.csv', {});
  assert.is(r.report.units.temperature, 'degF');
  // 50 °F = 10 °C (NIST SP 811 B.8: t/°C = (t/°F − 32)/1.8)
  assert.ok(Math.abs(r.observations[0]!.temperatureC - 10) < 1e-9);
  assert.match(r.report.notes.join('\n'), /Windows-1252/);
  const utf8 = readCsvBytes(Buffer.from('station,time,Temp (°F)\nKAAA,2024-01-01T00:00Z,50\n'), 'u.csv', {});
  assert.is(utf8.report.units.temperature, 'degF');
  assert.not.match(utf8.report.notes.join('\n'), /Windows-1252/);
});

test('binary only when most of the head is not text; one NUL rejects its line only (common practice, no source)', () => {
  let seed = 7;
  const rnd = Buffer.alloc(8192);
  for (let i = 0; i < rnd.length; i++) rnd[i] = (seed = (seed * 1103515245 + 12345) >>> 0) >>> 24;
  assert.ok(looksBinary(rnd), `random bytes: ${nonTextShare(rnd)}`);
  const text = Buffer.from(REPORT(0) + '\n' + REPORT(1).slice(0, 20) + '\u0000' + REPORT(1).slice(21) + '\n' + REPORT(2) + '\n');
  assert.not.ok(looksBinary(text));
  const r = readMetarText(text.toString('utf8'), 'n.txt');
  assert.is(r.report.parsed, 2);
  assert.is(r.report.rejectedByReason['control-bytes'], 1);
  assert.is(r.report.issues[0]!.line, 2);
});

test.run();
