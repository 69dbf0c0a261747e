/**
 * Streamed reading (src/ingest/readPaths.ts): a file over several read chunks, and standard input given as a
 * descriptor, give what the readers give on the whole text held in memory. Invented reports in the FM 15 form
 * (WMO-No. 306) and an invented CSV, written to a temp folder; chunk boundaries fall inside lines, inside CRLF
 * pairs and inside UTF-8 sequences by construction of the line lengths.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { closeSync, openSync, readFileSync } from 'node:fs';
import { gzipSync } from 'node:zlib';
import { join } from 'node:path';
import { CHUNK_BYTES, readDataFiles, scanPaths } from '../../src/ingest/readPaths.js';
import { readMetarBytes } from '../../src/ingest/metar.js';
import { readCsvBytes } from '../../src/ingest/csv.js';
import type { Observation } from '../../src/model/index.js';
import { put, tempDir } from '../cli/io.js';

/** About `bytes` of hourly reports from a few invented stations, CRLF ends, a non-ASCII remark now and then. */
function metarText(bytes: number): string {
  const out: string[] = [];
  let n = 0;
  for (let i = 0; n < bytes; i++) {
    const st = ['QAAA', 'QBBB', 'QCCC'][i % 3]!;
    const h = Math.floor(i / 3);
    const day = 1 + (Math.floor(h / 24) % 28);
    const hh = String(h % 24).padStart(2, '0');
    const dd = String(day).padStart(2, '0');
    const t = (h % 30) - 10;
    const tt = `${t < 0 ? 'M' : ''}${String(Math.abs(t)).padStart(2, '0')}`;
    const line = `202403${dd}${hh}51 METAR ${st} ${dd}${hh}51Z 18010KT 10SM CLR ${tt}/M12 A3001 RMK AO2${i % 97 === 0 ? ' CAFÉ' : ''}`;
    out.push(line);
    n += line.length + 2;
  }
  return out.join('\r\n') + '\r\n';
}

/** Every observation of loadPaths' read stage, copied (the readers reuse one object). */
function readAll(paths: string[], opts: Parameters<typeof scanPaths>[1] = {}) {
  const scanned = scanPaths(paths, opts);
  const obs: Observation[] = [];
  const read = readDataFiles(scanned.dataFiles, opts, (o) => obs.push({ ...o, remarks: o.remarks ? [...o.remarks] : undefined }));
  return { obs, reports: read.reports };
}

test('a METAR file over three read chunks = the reader on the whole text (line numbers, counts, notes)', () => {
  const dir = tempDir('fropa-stream-');
  const text = metarText(Math.floor(2.6 * CHUNK_BYTES));
  const path = put(dir, 'big_metar.txt', text);
  const whole = readMetarBytes(readFileSync(path), path);
  const got = readAll([path]);
  assert.ok(whole.observations.length > 20_000);
  assert.is(got.obs.length, whole.observations.length);
  assert.equal(
    got.obs.map((o) => [o.station, o.timeMs, o.temperatureC, o.line]),
    whole.observations.map((o) => [o.station, o.timeMs, o.temperatureC, o.line]),
  );
  const r = got.reports[0]!;
  whole.report.stationIdRule = r.stationIdRule;
  assert.equal(r, whole.report);
});

test('standard input as a descriptor is read as a stream: the same as the file read by path', () => {
  const dir = tempDir('fropa-stdin-');
  const path = put(dir, 'in_metar.txt', metarText(Math.floor(1.5 * CHUNK_BYTES)));
  const byPath = readAll([path]);
  const fd = openSync(path, 'r');
  try {
    const bySdtin = readAll(['-'], { stdinFd: fd });
    assert.is(bySdtin.obs.length, byPath.obs.length);
    assert.equal(
      bySdtin.obs.map((o) => [o.station, o.timeMs, o.line]),
      byPath.obs.map((o) => [o.station, o.timeMs, o.line]),
    );
    assert.is(bySdtin.reports[0]!.file, '(stdin)');
    assert.is(bySdtin.reports[0]!.parsed, byPath.reports[0]!.parsed);
  } finally {
    closeSync(fd);
  }
});

test('a CSV file over several read chunks (read piece by piece) = the reader on the whole text', () => {
  const dir = tempDir('fropa-stream-csv-');
  const rows = ['station,valid,tmpf,remark'];
  for (let i = 0; rows.length < 200_000; i++) {
    const h = String(i % 24).padStart(2, '0');
    rows.push(`XQAZ,2021-03-${String(1 + (Math.floor(i / 24) % 28)).padStart(2, '0')} ${h}:00,${(i % 60) + 0.5},${i % 501 === 0 ? '"two\nlines"' : i % 733 === 0 ? '"unclosed' : 'ok'}`);
  }
  const path = put(dir, 'big.csv', rows.join('\n') + '\n');
  const bytes = readFileSync(path);
  assert.ok(bytes.length > 4 * CHUNK_BYTES);
  const whole = readCsvBytes(bytes, path, { reuseObservation: false });
  const got = readAll([path]);
  assert.is(got.obs.length, whole.observations.length);
  assert.equal(
    got.obs.map((o) => [o.timeMs, o.temperatureC, o.line]),
    whole.observations.map((o) => [o.timeMs, o.temperatureC, o.line]),
  );
  assert.equal(got.reports[0]!.issues, whole.report.issues);
  assert.is(got.reports[0]!.lines, whole.report.lines);
});

test('a gzip file of 1 MiB or more is expanded as it is read (RFC 1952, several members): the same as the plain file', () => {
  const dir = tempDir('fropa-stream-gz-');
  const text = metarText(Math.floor(2.3 * CHUNK_BYTES));
  const plain = put(dir, 'big_metar.txt', text);
  // level 0 (stored blocks) keeps the compressed file over one read chunk; two members, split inside a line
  const cut = Math.floor(text.length / 2) + 7;
  const gz = Buffer.concat([gzipSync(text.slice(0, cut), { level: 0 }), gzipSync(text.slice(cut), { level: 0 })]);
  assert.ok(gz.length > 2 * CHUNK_BYTES);
  const gzPath = put(dir, 'big_metar.txt.gz', gz);
  const a = readAll([plain]);
  const b = readAll([gzPath]);
  assert.ok(a.obs.length > 20_000);
  assert.equal(
    b.obs.map((o) => [o.station, o.timeMs, o.temperatureC, o.line]),
    a.obs.map((o) => [o.station, o.timeMs, o.temperatureC, o.line]),
  );
  assert.is(b.reports[0]!.parsed, a.reports[0]!.parsed);
  assert.is(b.reports[0]!.rejected, a.reports[0]!.rejected);
});

test('gzip on standard input (a descriptor) is expanded as it is read: the same as the gzip file by path', () => {
  const dir = tempDir('fropa-stdin-gz-');
  const gz = gzipSync(metarText(Math.floor(2.1 * CHUNK_BYTES)), { level: 0 });
  const path = put(dir, 'in_metar.txt.gz', gz);
  const byPath = readAll([path]);
  const fd = openSync(path, 'r');
  try {
    const byStdin = readAll(['-'], { stdinFd: fd });
    assert.ok(byPath.obs.length > 20_000);
    assert.equal(
      byStdin.obs.map((o) => [o.station, o.timeMs, o.line]),
      byPath.obs.map((o) => [o.station, o.timeMs, o.line]),
    );
    assert.is(byStdin.reports[0]!.parsed, byPath.reports[0]!.parsed);
  } finally {
    closeSync(fd);
  }
});

test('a streamed gzip file cut short: the lines before are read and the file says why reading stopped', () => {
  const dir = tempDir('fropa-stream-gzcut-');
  const text = metarText(Math.floor(2.3 * CHUNK_BYTES));
  const gz = gzipSync(text, { level: 0 });
  const path = put(dir, 'cut_metar.txt.gz', gz.subarray(0, Math.floor(gz.length * 0.7)));
  const got = readAll([path]);
  assert.ok(got.obs.length > 10_000);
  assert.ok(got.reports[0]!.notes.some((n) => /reading stopped: gzip data is damaged/.test(n)), JSON.stringify(got.reports[0]!.notes));
});

test.run();
