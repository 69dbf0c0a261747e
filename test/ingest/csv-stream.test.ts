/**
 * The CSV reader over a stream of blocks (CsvReader, fed by LineSplitter) against the reader of the whole buffer
 * (readCsvBytes) on the same bytes: observations, issues, notes, value counts and units must be the same,
 * whatever the chunk sizes. Reference: readCsvBytes, itself held to papaparse in csv-scan.test.ts; the rows are
 * invented (seeded), with quoted cells, quoted fields over several lines (RFC 4180 §2 rule 6), unclosed quotes,
 * NUL bytes, blank lines and CRLF line ends mixed in.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { CsvReader, readCsvBytes, type CsvOptions } from '../../src/ingest/csv.js';
import { LineSplitter } from '../../src/ingest/lines.js';
import { makeRng } from '../../tools/synth/random.js';
import { REALDATA_DIR, realdataTest } from '../helpers/realdata.js';

/** Read `bytes` through a splitter in chunks of `size` bytes into a CsvReader that streams above `wholeBytes`. */
function streamed(bytes: Buffer, size: number, wholeBytes: number, opts: CsvOptions = {}) {
  const s = new LineSplitter();
  const r = new CsvReader('s.csv', opts, undefined, wholeBytes);
  for (let i = 0; i < bytes.length; i += size) {
    const b = s.push(bytes.subarray(i, i + size));
    if (b) r.block(b);
  }
  const e = s.end();
  if (e) r.block(e);
  return r.finish(s.notes());
}

/** Rows in the style of an hourly export (invented station and values), with oddities. */
function makeText(n: number, seed: number, quoted: boolean): string {
  const rand = makeRng(seed).next;
  const q = (x: string) => (quoted ? `"${x}"` : x);
  const lines = [[q('station'), q('valid'), q('tmpf'), q('dwpf'), q('sknt'), q('remark')].join(',')];
  const t0 = Date.UTC(2021, 2, 1);
  for (let i = 0; i < n; i++) {
    const time = new Date(t0 + i * 3_600_000).toISOString().slice(0, 16).replace('T', ' ');
    let remark = q(rand() < 0.5 ? 'ok' : 'gusty');
    const x = rand();
    if (quoted && x < 0.03) remark = '"first line\nsecond line"'; // a quoted field over two lines
    else if (x < 0.05) remark = '"unclosed'; // an unclosed quote: that line only is rejected
    else if (x < 0.06) remark = 'bad\u0000byte';
    const row = [q('XQAZ'), q(time), (40 + rand() * 30).toFixed(1), (20 + rand() * 20).toFixed(1), String(Math.floor(rand() * 30)), remark].join(',');
    lines.push(row);
    if (rand() < 0.02) lines.push('');
  }
  return lines.join('\n') + '\n';
}

function same(a: ReturnType<typeof readCsvBytes>, b: ReturnType<typeof readCsvBytes>): void {
  assert.equal(a.observations, b.observations);
  assert.equal(a.report, b.report);
  assert.equal(a.valueCounts, b.valueCounts);
  assert.equal(a.units, b.units);
}

for (const quoted of [false, true]) {
  test(`streamed CSV (${quoted ? 'quoted cells, multi-line fields' : 'plain cells'}) = the whole-buffer reader, any chunk size`, () => {
    for (const seed of [1, 2, 3]) {
      const bytes = Buffer.from(makeText(3000, seed, quoted));
      const whole = readCsvBytes(bytes, 's.csv');
      assert.ok(whole.report.parsed > 2500);
      for (const size of [997, 4096, 65_536]) same(streamed(bytes, size, 8192), whole);
    }
  });
}

test('streamed CSV with CRLF line ends = the whole-buffer reader (RFC 4180 §2 rule 1: CRLF ends a record)', () => {
  const bytes = Buffer.from(makeText(2000, 9, false).replace(/\n/g, '\r\n'));
  same(streamed(bytes, 5000, 8192), readCsvBytes(bytes, 's.csv'));
});

test('a stray quote near a block end: the rows after it are read, line numbers kept (common practice, no source)', () => {
  const rows = ['station,valid,tmpf'];
  for (let i = 0; i < 400; i++) rows.push(`XQAZ,2021-03-01 ${String(i % 24).padStart(2, '0')}:00,${i % 50}`);
  rows[150] = 'XQAZ,"2021-03-01 06:00,50';
  const bytes = Buffer.from(rows.join('\n') + '\n');
  const whole = readCsvBytes(bytes, 's.csv');
  assert.is(whole.report.rejectedByReason['bad-quotes'], 1);
  for (const size of [100, 1000, 3000]) same(streamed(bytes, size, 2048), whole);
});

test('a text over 64 KiB whose only quote is unclosed, and a NUL line: both lines rejected and counted, streamed or whole (every line parsed or rejected; common practice, no source)', () => {
  const rows = ['station,valid,tmpf'];
  for (let i = 0; i < 3000; i++) rows.push(`XQAZ,2021-03-01 ${String(i % 24).padStart(2, '0')}:00,${i % 50}`);
  rows[100] = 'XQAZ,"2021-03-01 06:00,50';
  rows[200] = 'XQAZ,2021-03-01 07:00,5\u00000';
  const bytes = Buffer.from(rows.join('\n') + '\n');
  assert.ok(bytes.length > 1 << 16);
  const whole = readCsvBytes(bytes, 's.csv');
  assert.is(whole.report.lines, 3001);
  assert.equal(whole.report.rejectedByReason, { 'bad-quotes': 1, 'control-bytes': 1 });
  assert.equal(
    whole.report.issues.map((i) => i.line),
    [101, 201],
  );
  same(streamed(bytes, 4096, 8192), whole);
});

const check = realdataTest(test);
check('streamed real CSV files = the whole-buffer reader (NCEI LCD, IEM ASOS exports in ../shared/realdata)', () => {
  for (const name of readdirSync(REALDATA_DIR).filter((n) => /\.(csv|tsv)$/.test(n))) {
    const bytes = readFileSync(REALDATA_DIR + name);
    same(streamed(bytes, 1 << 16, 1 << 17), readCsvBytes(bytes, 's.csv'));
  }
});

test.run();
