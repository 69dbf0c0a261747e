/**
 * Bad-input fuzzing of ingest. Seeded invented METAR lines and CSV rows are mutated (bit flips,
 * truncations, swapped and duplicated groups, huge numbers, unicode, NUL, CR, stray quotes, far years) and
 * read the way the loader reads a file (text preparation, then readMetarBytes / readCsvBytes into a
 * SeriesBuilder, then one series per station). Counts and prints:
 *   crashes      exceptions thrown by the readers or the series builder (must be 0);
 *   unaccounted  non-blank physical lines neither parsed, rejected with a reason, nor counted as the
 *                continuation of a multi-line CSV row; and files whose parsed + rejected (+ header) differ
 *                from the lines they say they saw (must be 0);
 *   peak memory  the highest RSS and heap seen; run time.
 * Run: npm run bench:fuzz [-- --lines 1000000 --seed 1]
 */
import { prepareText } from '../src/ingest/text.js';
import { readMetarBytes } from '../src/ingest/metar.js';
import { readCsvBytes } from '../src/ingest/csv.js';
import { SeriesBuilder } from '../src/series/seriesBuilder.js';
import { makeRng } from '../tools/synth/random.js';
import type { FileReport } from '../src/model/index.js';

const arg = (name: string, dflt: number) => {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 ? Number(process.argv[i + 1]) : dflt;
};
const TOTAL = arg('lines', 1_000_000);
const SEED = arg('seed', 1);
const PER_FILE = 5000;
const rng = makeRng(SEED);
const rand = rng.next;
const pick = <T>(a: readonly T[]): T => a[Math.floor(rand() * a.length)]!;
const pad = (n: number, w: number) => String(Math.trunc(n)).padStart(w, '0');

const STATIONS = ['KXAA', 'KXAB', 'EXAC', 'CXAD', 'YXAE'];
function metarLine(i: number): string {
  const d = 1 + (i % 28);
  const h = i % 24;
  const t = Math.round(rand() * 30 - 5);
  const tt = (x: number) => (x < 0 ? 'M' + pad(-x, 2) : pad(x, 2));
  return `2024${pad(1 + (i % 12), 2)}${pad(d, 2)}${pad(h, 2)}51 METAR ${pick(STATIONS)} ${pad(d, 2)}${pad(h, 2)}51Z AUTO ${pad(Math.floor(rand() * 36) * 10, 3)}${pad(rand() * 25, 2)}KT 10SM FEW050 ${tt(t)}/${tt(t - 4)} A${pad(2950 + rand() * 100, 4)} RMK AO2 SLP${pad(rand() * 300, 3)} T${t < 0 ? 1 : 0}${pad(Math.abs(t) * 10, 3)}${t < 0 ? 1 : 0}${pad(Math.abs(t - 4) * 10, 3)}`;
}
const CSV_HEADER = 'station,valid,tmpf,dwpf,drct,sknt,mslp,note';
function csvRow(i: number): string {
  const t = Date.UTC(2024, 0, 1) + i * 300_000;
  const iso = new Date(t).toISOString().slice(0, 16).replace('T', ' ');
  return `${pick(STATIONS)},${iso},${(rand() * 80).toFixed(1)},${(rand() * 60).toFixed(1)},${Math.floor(rand() * 36) * 10},${Math.floor(rand() * 25)},${(1000 + rand() * 30).toFixed(1)},${pick(['ok', '"quoted, fine"', '', 'M'])}`;
}

const UNICODE = ['é', '°', '☃', '０', '\u00a0', '\u200b', '𝟙', '\ufeff', 'Ω'];
/** One mutation of a line (the kinds of the module comment). */
function mutate(s: string): string {
  const k = Math.floor(rand() * 11);
  const at = Math.floor(rand() * (s.length + 1));
  switch (k) {
    case 0: {
      // bit flip
      const b = Buffer.from(s, 'utf8');
      if (b.length) b[Math.floor(rand() * b.length)]! ^= 1 << Math.floor(rand() * 8);
      return b.toString('latin1'); // raw bytes, may be invalid UTF-8 once re-encoded as a file
    }
    case 1:
      return s.slice(0, at); // truncation
    case 2: {
      const g = s.split(/([ ,])/);
      const i = Math.floor(rand() * g.length);
      const j = Math.floor(rand() * g.length);
      [g[i], g[j]] = [g[j]!, g[i]!]; // swapped groups
      return g.join('');
    }
    case 3: {
      const g = s.split(' ');
      const i = Math.floor(rand() * g.length);
      g.splice(i, 0, g[i]!); // duplicated group
      return g.join(' ');
    }
    case 4:
      return s.slice(0, at) + pick(['99999999999', '1e308', '-0', '0x7fffffff', '123456789012345678901234567890', 'Infinity', 'NaN']) + s.slice(at);
    case 5:
      return s.slice(0, at) + pick(UNICODE) + s.slice(at);
    case 6:
      return s.slice(0, at) + '\u0000' + s.slice(at);
    case 7:
      return s.slice(0, at) + '\r' + s.slice(at);
    case 8:
      return s.slice(0, at) + '"' + s.slice(at);
    case 9:
      return s.replace(/20\d\d/, pick(['0001', '9999', '1066', '2999', '0000']));
    default:
      return s.replace(/ \d\d(\d\d)(\d\d)Z/, ' 3$1$2Z'); // day 30–39
  }
}

/** Bytes of a file: mutated lines (latin1 strings from bit flips keep their raw bytes). */
function fileBytes(lines: string[]): Buffer {
  return Buffer.concat(lines.map((l) => Buffer.from(l + '\n', /[^\x00-\xff]/.test(l) ? 'utf8' : 'latin1')));
}

/**
 * Non-blank physical lines as the readers see them (after the text preparation). Blank: only white space as
 * String.prototype.trim sees it (ECMA-262 WhiteSpace and LineTerminator, e.g. U+00A0, U+FEFF), which both
 * readers skip without counting (documented in their module comments).
 */
function nonBlankLines(u: Buffer): number {
  let n = 0;
  let p = 0;
  while (p <= u.length) {
    let e = u.indexOf(10, p);
    if (e < 0) e = u.length;
    let high = false;
    let text = false;
    for (let i = p; i < e; i++) {
      const c = u[i]!;
      if (c >= 0x80) high = true;
      else if (c > 32) {
        text = true;
        break;
      }
    }
    if (text || (high && u.toString('utf8', p, e).trim() !== '')) n++;
    p = e + 1;
  }
  return n;
}

let crashes = 0;
let unaccounted = 0;
let badTotals = 0;
let lines = 0;
let parsed = 0;
let rejected = 0;
let continuation = 0;
const reasons: Record<string, number> = {};
let peakRss = 0;
let peakHeap = 0;
const sample = () => {
  const m = process.memoryUsage();
  if (m.rss > peakRss) peakRss = m.rss;
  if (m.heapUsed > peakHeap) peakHeap = m.heapUsed;
};
const firstCrashes: string[] = [];

function account(r: FileReport, physical: number, header: number): void {
  lines += physical;
  parsed += r.parsed;
  rejected += r.rejected;
  continuation += r.continuationLines ?? 0;
  for (const [k, v] of Object.entries(r.rejectedByReason)) reasons[k] = (reasons[k] ?? 0) + v;
  // whole-file verdicts (no header, no time column...) count the file, not a line
  const seen = r.lines + (r.continuationLines ?? 0);
  if (seen < physical) {
    unaccounted += physical - seen;
    if (process.env.FUZZ_DEBUG) console.log(`${r.file}: ${physical} physical, ${r.lines} lines + ${r.continuationLines ?? 0} continued`);
  }
  if (r.parsed + r.rejected + header !== r.lines && !(r.lines === 0 && r.rejected === 1)) badTotals++;
}

const t0 = performance.now();
let made = 0;
let fileNo = 0;
while (made < TOTAL) {
  const csv = fileNo % 2 === 1;
  const n = Math.min(PER_FILE, TOTAL - made);
  const out: string[] = csv ? [CSV_HEADER] : [];
  for (let i = 0; i < n; i++) {
    let l = csv ? csvRow(made + i) : metarLine(made + i);
    const m = rand();
    if (m < 0.5) l = mutate(l);
    if (m < 0.15) l = mutate(l);
    out.push(l);
  }
  made += n;
  const raw = fileBytes(out);
  const file = `fuzz-${fileNo}.${csv ? 'csv' : 'txt'}`;
  fileNo++;
  try {
    if (process.env.FUZZ_DUMP === file) (await import('node:fs')).writeFileSync((await import('node:path')).join((await import('node:os')).tmpdir(), file), raw);
    const prep = prepareText(raw);
    const physical = nonBlankLines(prep.bytes);
    const b = new SeriesBuilder();
    const r = csv ? readCsvBytes(raw, file, { reuseObservation: true }, (o) => b.add(o)).report : readMetarBytes(raw, file, { onObservation: (o) => b.add(o) }).report;
    for (const s of b.stations()) b.build(s);
    account(r, physical, csv && r.lines > 0 && !r.rejectedByReason['empty'] ? 1 : 0);
  } catch (e) {
    crashes++;
    if (firstCrashes.length < 5) firstCrashes.push(`${file}: ${(e as Error).stack ?? e}`);
  }
  if (fileNo % 20 === 0) sample();
}
sample();
const seconds = (performance.now() - t0) / 1000;
const mb = (x: number) => (x / 2 ** 20).toFixed(0);
console.log(`fuzz: ${made} lines generated (seed ${SEED}), ${fileNo} files of ${PER_FILE}, ~57% mutated (some twice)`);
console.log(`  physical non-blank lines ${lines}: parsed ${parsed}, rejected ${rejected}, continuation of multi-line rows ${continuation}`);
console.log(`  rejected by reason: ${Object.entries(reasons).sort((a, b) => b[1] - a[1]).map(([k, v]) => `${k} ${v}`).join(', ')}`);
console.log(`  crashes ${crashes}, unaccounted lines ${unaccounted}, files whose totals do not add up ${badTotals}`);
console.log(`  peak memory: rss ${mb(peakRss)} MiB, heap ${mb(peakHeap)} MiB; run time ${seconds.toFixed(1)} s (${Math.round(made / seconds)} lines/s incl. generation)`);
for (const c of firstCrashes) console.log(c);
if (crashes > 0 || unaccounted > 0 || badTotals > 0) process.exitCode = 1;
