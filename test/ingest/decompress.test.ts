/** gzip inputs (src/ingest/decompress.ts and the loader). */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { compressionOf, expandBytes, GunzipPieces, GzipStreamError } from '../../src/ingest/decompress.js';
import { loadPaths } from '../../src/pipeline.js';

const dir = mkdtempSync(join(tmpdir(), 'fropa-gz-'));
const CSV = 'station,valid,tmpf,drct,sknt\nKORD,2019-01-01 00:51,30,270,10\nKORD,2019-01-01 01:51,29,280,12\n';

test('compressionOf() reads the magic bytes', () => {
  assert.is(compressionOf(gzipSync('x')), 'gzip'); // RFC 1952 §2.3.1: ID1 = 31, ID2 = 139
  assert.is(compressionOf(Buffer.from('PK\x03\x04rest', 'latin1')), 'zip'); // PKWARE APPNOTE 4.3.7 local file header signature
  assert.is(compressionOf(Buffer.from([0xfd, 0x37, 0x7a, 0x58, 0x5a, 0x00])), 'xz'); // xz file format §2.1.1.1
  assert.is(compressionOf(Buffer.from([0x28, 0xb5, 0x2f, 0xfd])), 'zstd'); // RFC 8878 §3.1.1
  assert.is(compressionOf(Buffer.from('BZh9', 'latin1')), 'bzip2'); // common practice, no source
  assert.is(compressionOf(Buffer.from('station,valid\n')), null);
});

test('expandBytes(): gzip expanded (multi-member too), bombs and other formats refused', () => {
  const one = expandBytes(gzipSync(CSV));
  assert.ok('bytes' in one && one.bytes.toString() === CSV);
  // RFC 1952 §2.2: a gzip file is a series of members, read as one
  const two = expandBytes(Buffer.concat([gzipSync('a\n'), gzipSync('b\n')]));
  assert.ok('bytes' in two && two.bytes.toString() === 'a\nb\n');
  // 8 MiB of zeros compress about 1000:1: above the bound (a decompression bomb in small)
  const bomb = expandBytes(gzipSync(Buffer.alloc(8 << 20)));
  assert.ok('reason' in bomb && bomb.reason === 'decompression-bomb', JSON.stringify(bomb));
  const bad = expandBytes(gzipSync(CSV).subarray(0, 20));
  assert.ok('reason' in bad && bad.reason === 'bad-gzip');
  const zip = expandBytes(Buffer.from('PK\x03\x04rest', 'latin1'));
  assert.ok('reason' in zip && zip.reason === 'compressed-format' && zip.message.includes('unzip'));
});

test('loadPaths() reads .gz files (and gzip without the extension), refuses other archives with a reason', () => {
  writeFileSync(join(dir, 'KORD_2019.csv.gz'), gzipSync(CSV));
  writeFileSync(join(dir, 'noext'), gzipSync(CSV.replace(/KORD/g, 'KMDW')));
  writeFileSync(join(dir, 'obs.zip'), Buffer.from('PK\x03\x04rest', 'latin1'));
  const { reports, series } = loadPaths([dir]);
  const by = new Map(reports.map((r) => [r.file.replace(/^.*[\\/]/, ''), r]));
  assert.is(by.get('KORD_2019.csv.gz')!.parsed, 2);
  assert.is(by.get('noext')!.parsed, 2);
  assert.equal(by.get('obs.zip')!.rejectedByReason, { 'compressed-format': 1 });
  assert.equal(series.map((s) => s.station).sort(), ['KMDW', 'KORD']);
});


test('GunzipPieces expands piece by piece (several members, RFC 1952 §2.2) and stops a bomb and damaged data', () => {
  const gz = Buffer.concat([gzipSync('a,b\n1,2\n'), gzipSync('3,4\n')]);
  const out: Buffer[] = [];
  const g = new GunzipPieces();
  for (let i = 0; i < gz.length; i += 5) out.push(...g.push(gz.subarray(i, i + 5), i + 5 >= gz.length));
  assert.is(Buffer.concat(out).toString(), 'a,b\n1,2\n3,4\n');
  // 8 MiB of zeros compress about 1000:1, above the 200× bound
  const bomb = gzipSync(Buffer.alloc(8 << 20));
  const b = new GunzipPieces();
  assert.throws(() => {
    for (let i = 0; i < bomb.length; i += 1024) b.push(bomb.subarray(i, i + 1024), i + 1024 >= bomb.length);
  }, (e: unknown) => e instanceof GzipStreamError && e.reason === 'decompression-bomb');
  const cut = gzipSync(CSV).subarray(0, 20);
  assert.throws(() => new GunzipPieces().push(cut, true), (e: unknown) => e instanceof GzipStreamError && e.reason === 'bad-gzip');
});

test('loadPaths(): a damaged gzip file of 1 MiB or more (read as a stream) is refused as bad-gzip, its reason in the report', () => {
  // RFC 1952: magic 1f 8b, method 8 (deflate), no flags, then a deflate stream, here bytes that are not one
  let x = 12345;
  const junk = Buffer.alloc(2 << 20, 0).map(() => ((x = (Math.imul(x, 1103515245) + 12345) >>> 0), x >>> 24));
  writeFileSync(join(dir, 'damaged.txt.gz'), Buffer.concat([Buffer.from([0x1f, 0x8b, 8, 0, 0, 0, 0, 0, 0, 3]), junk]));
  const r = loadPaths([join(dir, 'damaged.txt.gz')]).reports[0]!;
  assert.is(r.format, 'skipped');
  assert.equal(r.rejectedByReason, { 'bad-gzip': 1 });
  rmSync(join(dir, 'damaged.txt.gz'));
});

test.run();
