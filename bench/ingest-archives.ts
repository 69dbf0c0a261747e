/**
 * `npm run bench:archives`: the cost of the ingest conventions of issue 11 against plain ingest of the same
 * rows, measured in the same run: a gzip file against the same file uncompressed, and a time spread over
 * date + time-of-day columns (and over year/month/day/hour/minute) against one ISO time column.
 * Rows are synthetic (a seeded random walk), written to a temporary folder. Optional argument: rows (default 500,000).
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir, loadavg, cpus } from 'node:os';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { loadPaths } from '../src/pipeline.js';

const rows = Number(process.argv[2] ?? 500_000);
const dir = mkdtempSync(join(tmpdir(), 'fropa-bench-arch-'));
let seed = 20240227;
const rand = () => ((seed = (seed * 1103515245 + 12345) >>> 0) / 2 ** 32);
const t0 = Date.UTC(2020, 0, 1);
const pad = (n: number) => String(n).padStart(2, '0');
const single: string[] = ['station,valid,tmpc,dwpc,drct,sknt'];
const split: string[] = ['station,date_utc,time_utc,tmpc,dwpc,drct,sknt'];
const parts: string[] = ['station,year,month,day,hour,minute,tmpc,dwpc,drct,sknt'];
let t = 10;
for (let i = 0; i < rows; i++) {
  const d = new Date(t0 + i * 5 * 60_000);
  t += rand() - 0.5;
  const vals = `${t.toFixed(1)},${(t - 3).toFixed(1)},${Math.floor(rand() * 36) * 10},${Math.floor(rand() * 20)}`;
  const date = `${d.getUTCFullYear()}-${pad(d.getUTCMonth() + 1)}-${pad(d.getUTCDate())}`;
  const hm = `${pad(d.getUTCHours())}:${pad(d.getUTCMinutes())}`;
  single.push(`XBEN,${date} ${hm},${vals}`);
  split.push(`XBEN,${date},${hm},${vals}`);
  parts.push(`XBEN,${d.getUTCFullYear()},${d.getUTCMonth() + 1},${d.getUTCDate()},${d.getUTCHours()},${d.getUTCMinutes()},${vals}`);
}
const files = {
  plain: join(dir, 'XBEN_plain.csv'),
  gzip: join(dir, 'XBEN_gzip.csv.gz'),
  dateTime: join(dir, 'XBEN_datetime.csv'),
  ymdhm: join(dir, 'XBEN_ymdhm_utc.csv'), // naive parts: the file name says UTC
};
const plainText = single.join('\n') + '\n';
writeFileSync(files.plain, plainText);
const gz = gzipSync(plainText);
writeFileSync(files.gzip, gz);
writeFileSync(files.dateTime, split.join('\n') + '\n');
writeFileSync(files.ymdhm, parts.join('\n') + '\n');

function best(path: string, repeats = 3): { ms: number; parsed: number } {
  let ms = Infinity;
  let parsed = 0;
  for (let r = 0; r < repeats; r++) {
    const a = performance.now();
    const res = loadPaths([path]);
    ms = Math.min(ms, performance.now() - a);
    parsed = res.reports.reduce((s, x) => s + x.parsed, 0);
  }
  return { ms, parsed };
}
console.log(`${rows} rows, 5-minute cadence; gzip ${(gz.length / 1e6).toFixed(1)} MB of ${(plainText.length / 1e6).toFixed(1)} MB (ratio ${(plainText.length / gz.length).toFixed(1)}); node ${process.version}`);
const res = Object.fromEntries(Object.entries(files).map(([k, p]) => [k, best(p)])) as Record<keyof typeof files, { ms: number; parsed: number }>;
for (const [k, v] of Object.entries(res)) console.log(`${k.padEnd(9)} loadPaths ${v.ms.toFixed(0)} ms, ${v.parsed} rows parsed, ${(v.parsed / (v.ms / 1000) / 1000).toFixed(0)} k rows/s`);
console.log(`ratio gzip / plain:               ${(res.gzip.ms / res.plain.ms).toFixed(2)} (time; the same rows)`);
console.log(`ratio date+time columns / plain:  ${(res.dateTime.ms / res.plain.ms).toFixed(2)}`);
console.log(`ratio y/m/d/h/min columns / plain: ${(res.ymdhm.ms / res.plain.ms).toFixed(2)}`);
console.log(`load average ${loadavg().map((x) => x.toFixed(1)).join(' ')} on ${cpus().length} cores`);
rmSync(dir, { recursive: true, force: true });
