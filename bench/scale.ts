/**
 * `npm run bench:scale`: whole-archive scale. Generates seeded invented archives at three sizes (by default
 * 50, 200 and 1,000 hourly METAR stations × 1 year, plus 5 % as many 5-minute CSV stations, so the largest
 * is 1,000 METAR + 50 CSV station-years), written as files with a stations file, and prints in one run:
 *  - end-to-end `fropa detect` (a fresh process, start included, the built dist/) in rows/s, beside two
 *    references on the same files measured in the same run: plain read + line split, and papaparse
 *    parse-only (ratios);
 *  - `--jobs 2` against `--jobs 1`;
 *  - peak resident memory of the detect process (GNU time %M) at each size;
 *  - tracking time against the number of stations (trackFronts on planted plane-wave passages: one front
 *    every 3 days over the year, at every station).
 * The generator runs in groups of 10 stations (its planner is made for regional networks), so planted fronts
 * do not cross groups; tracking still sees the whole station graph.
 * Usage: npm run bench:scale [-- --sizes 50,200,1000 --days 365 --seed 7 --jobs 1,2 --keep DIR --tracking-only]
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import Papa from 'papaparse';
import { generateNetwork } from '../tools/synth/generateNetwork.js';
import { toMetarLines } from '../tools/synth/toMetarLines.js';
import { toCsvText } from '../tools/synth/toCsvText.js';
import type { PassageEvent, StationMeta } from '../src/model/index.js';
import { trackFronts } from '../src/network/track.js';
import { projectLocalKm } from '../src/physics/geo.js';

const ROOT = fileURLToPath(new URL('../', import.meta.url));
const args = process.argv.slice(2);
const arg = (name: string, def: string) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 && args[i + 1] !== undefined ? args[i + 1]! : def;
};
const sizes = arg('sizes', '50,200,1000').split(',').map(Number);
const days = Number(arg('days', '365'));
const seed = Number(arg('seed', '7'));
const jobsList = arg('jobs', '1,2').split(',').map(Number);
const keep = args.includes('--keep') ? arg('keep', '') : '';
const DAY = 86_400_000;
const HOUR = 3_600_000;
const START = Date.UTC(2025, 0, 1);

/**
 * Invented stations on a jittered grid over 30–48° N, 105–75° W (deterministic), ids the prefix and three base-36
 * characters (XM000…, up to 46,656 stations): a METAR station indicator has 3–5 characters (WMO-No. 306, FM 15,
 * CCCC), so a longer id would have every METAR line rejected.
 */
function gridStations(n: number, prefix: string, offset: number): StationMeta[] {
  const cols = Math.ceil(Math.sqrt(n * 1.6));
  return Array.from({ length: n }, (_, i) => {
    const r = Math.floor(i / cols), c = i % cols;
    const rows = Math.ceil(n / cols);
    return { id: `${prefix}${(i + offset).toString(36).toUpperCase().padStart(3, '0')}`, aliases: [], name: `Bench ${i}`, latDeg: 30 + ((r + 0.5) / rows) * 18 + ((i * 7) % 10) * 0.01, lonDeg: -105 + ((c + 0.5) / cols) * 30 + ((i * 3) % 10) * 0.01, elevationM: 200 };
  });
}

/** Write an archive: hourly METAR files and 5-minute CSV files, one per station, and stations.csv. Returns data rows. */
function writeArchive(dir: string, metarStations: StationMeta[], csvStations: StationMeta[]): number {
  mkdirSync(dir, { recursive: true });
  let rows = 0;
  const all: StationMeta[] = [];
  const write = (group: StationMeta[], step: number, kind: 'metar' | 'csv', g: number) => {
    const net = generateNetwork({ stations: group, startMs: START, endMs: START + days * DAY, stepMinutes: step, faults: false }, seed * 1000 + g);
    for (const m of group) {
      const syn = net.obs.get(m.id)!;
      if (kind === 'metar') {
        const lines = toMetarLines(syn, m, { truth: net.truth });
        rows += lines.length;
        writeFileSync(join(dir, `${m.id}_${new Date(START).toISOString().slice(0, 7)}.metar.txt`), lines.join('\n') + '\n');
      } else {
        const text = toCsvText(syn, m, 'metric');
        rows += text.split('\n').filter(Boolean).length - 1;
        writeFileSync(join(dir, `${m.id}.csv`), text);
      }
    }
    all.push(...group);
  };
  for (let g = 0; g * 10 < metarStations.length; g++) write(metarStations.slice(g * 10, g * 10 + 10), 60, 'metar', g);
  for (let g = 0; g * 10 < csvStations.length; g++) write(csvStations.slice(g * 10, g * 10 + 10), 5, 'csv', 500 + g);
  writeFileSync(join(dir, 'stations.csv'), 'id,alias,name,lat,lon,elevation_m\n' + all.map((s) => `${s.id},,${s.name},${s.latDeg.toFixed(4)},${s.lonDeg.toFixed(4)},${s.elevationM}`).join('\n') + '\n');
  return rows;
}

function dataFiles(dir: string): string[] {
  return readdirSync(dir).filter((f) => f !== 'stations.csv').sort().map((f) => join(dir, f));
}

/** Reference 1: read every file and split it into lines (wall seconds). */
function readSplit(files: string[]): { s: number; lines: number } {
  const t = performance.now();
  let lines = 0;
  for (const f of files) lines += readFileSync(f, 'utf8').split('\n').length;
  return { s: (performance.now() - t) / 1000, lines };
}

/** Reference 2: papaparse parse-only of every file (delimiter guessed, as fropa lets it guess), wall seconds. */
function papaOnly(files: string[]): number {
  const t = performance.now();
  let rows = 0;
  for (const f of files) rows += Papa.parse<string[]>(readFileSync(f, 'utf8'), { skipEmptyLines: true }).data.length;
  if (rows === 0) throw new Error('papaparse read nothing');
  return (performance.now() - t) / 1000;
}

/** End-to-end detect in a fresh process under GNU time: wall seconds and peak RSS (MiB). */
function detect(dir: string, jobs: number): { s: number; rssMiB: number; events: number; stations: number } {
  const out = join(dir, '..', `events-${jobs}.ndjson`);
  const t = performance.now();
  const r = spawnSync('/usr/bin/time', ['-f', '%M', process.execPath, join(ROOT, 'dist/cli/main.js'), 'detect', dir, '--stations', join(dir, 'stations.csv'), '--format', 'ndjson', '--out', out, '--jobs', String(jobs), '--quiet'], { encoding: 'utf8', maxBuffer: 1 << 26 });
  const s = (performance.now() - t) / 1000;
  if (r.status !== 0) throw new Error(`detect failed (${r.status}): ${r.stderr.slice(-2000)}`);
  const rssKb = Number(r.stderr.trim().split('\n').pop());
  const lines = readFileSync(out, 'utf8').split('\n').filter(Boolean);
  // Stations with at least one passage: a check that every generated station was read (planted fronts cross them all).
  const stations = new Set(lines.map((l) => (JSON.parse(l) as { station: string }).station)).size;
  return { s, rssMiB: rssKb / 1024, events: lines.length, stations };
}

function passage(station: string, timeMs: number): PassageEvent {
  return {
    station, kind: 'cold-front', timeMs, timeEarliestMs: timeMs, timeLatestMs: timeMs, confidence: 1, tempChangeC: -5,
    dewpointChangeC: NaN, thetaEChangeK: NaN, pressureMinHpa: NaN, pressureMinTimeMs: NaN, pressureRise3hHpa: NaN,
    windBeforeDeg: NaN, windAfterDeg: NaN, windTurnDeg: NaN, windSpeedAfterMs: NaN, gustMaxMs: NaN, precipNear: false,
    zoneStartMs: timeMs, zoneEndMs: timeMs + HOUR, zoneHours: 1, zoneDepthKm: NaN, gradientKPer100km: NaN,
    observerFropaTimeMs: NaN, windShiftTimeMs: NaN, changeStartTimeMs: NaN, timeBasis: 'change-point', evidence: [],
  };
}

/** Tracking alone: planted straight fronts every 3 days for `days` days at every station (±20 min), seconds and fronts found. */
function trackingTime(n: number): { s: number; passages: number; fronts: number } {
  const stations = gridStations(n, 'XT', 0);
  const proj = projectLocalKm(stations);
  const events: PassageEvent[] = [];
  let r = seed >>> 0;
  const rand = () => ((r = (Math.imul(r, 1664525) + 1013904223) >>> 0) / 4294967296);
  for (let f = 0; f * 3 < days; f++) {
    const dir = ((60 + (f * 37) % 90) * Math.PI) / 180, speed = 25 + (f % 5) * 8, t0 = START + f * 3 * DAY;
    stations.forEach((s, i) => events.push(passage(s.id, Math.round(t0 + ((proj.xKm[i]! * Math.sin(dir) + proj.yKm[i]! * Math.cos(dir)) / speed) * HOUR + (rand() - 0.5) * (40 / 60) * HOUR))));
  }
  const t = performance.now();
  const tracks = trackFronts(events, stations);
  return { s: (performance.now() - t) / 1000, passages: events.length, fronts: tracks.length };
}

const trackingOnly = args.includes('--tracking-only');
if (!trackingOnly) execFileSync('npx', ['tsc', '-p', 'tsconfig.build.json'], { cwd: ROOT, stdio: 'inherit' });
const base = keep || mkdtempSync(join(tmpdir(), 'fropa-scale-'));
console.log(`bench:scale  seed ${seed}, ${days} days, sizes ${sizes.join(', ')} METAR stations (+5 % 5-min CSV), jobs ${jobsList.join(' vs ')}; files in ${base}`);
const results: string[] = [];
const header = ['METAR+CSV stations', 'rows', 'MB', 'read+split rows/s', 'papaparse rows/s', ...jobsList.map((j) => `detect --jobs ${j} rows/s`), 'detect / papaparse', `jobs ${jobsList.at(-1)} / jobs ${jobsList[0]}`, 'peak RSS MiB', 'µs per row (jobs 1)'];
for (const n of trackingOnly ? [] : sizes) {
  const dir = join(base, `size-${n}`, 'archive');
  const tg = performance.now();
  const rows = writeArchive(dir, gridStations(n, 'XM', 0), gridStations(Math.max(1, Math.round(n * 0.05)), 'XC', 0));
  const genS = (performance.now() - tg) / 1000;
  const files = dataFiles(dir);
  const mb = files.reduce((a, f) => a + statSync(f).size, 0) / 1e6;
  // Warm the page cache, then the references.
  readSplit(files);
  const split = readSplit(files);
  const papa = papaOnly(files);
  const runs = jobsList.map((j) => detect(dir, j));
  const same = runs.every((x) => readFileSync(join(dir, '..', `events-${jobsList[0]}.ndjson`), 'utf8') === readFileSync(join(dir, '..', `events-${jobsList[runs.indexOf(x)]}.ndjson`), 'utf8'));
  const rate = (s: number) => Math.round(rows / s).toLocaleString('en-US');
  results.push(
    [
      `${n}+${Math.max(1, Math.round(n * 0.05))}`, rows.toLocaleString('en-US'), mb.toFixed(0), rate(split.s), rate(papa), ...runs.map((x) => rate(x.s)),
      (papa / runs[runs.length - 1]!.s).toFixed(2), (runs[0]!.s / runs[runs.length - 1]!.s).toFixed(2), Math.max(...runs.map((x) => x.rssMiB)).toFixed(0), ((runs[0]!.s * 1e6) / rows).toFixed(1),
    ].join(' | '),
  );
  console.log(`size ${n}: generated in ${genS.toFixed(0)} s; ${runs[0]!.events} passages at ${runs[0]!.stations} of ${n + Math.max(1, Math.round(n * 0.05))} stations; outputs identical across jobs: ${same}`);
  console.log(`| ${header.join(' | ')} |\n| ${results.at(-1)} |`);
}
if (!trackingOnly) console.log(`\n| ${header.join(' | ')} |\n| ${header.map(() => '---').join(' | ')} |\n${results.map((r) => `| ${r} |`).join('\n')}`);
console.log('\nTracking alone (trackFronts, planted fronts every 3 days at every station):');
for (const n of [...new Set([...sizes, 1000])].sort((a, b) => a - b)) {
  const t = trackingTime(n);
  console.log(`  ${String(n).padStart(5)} stations × ${days} days: ${t.passages.toLocaleString('en-US')} passages, ${t.fronts} fronts, ${t.s.toFixed(2)} s (${((t.s * 1e6) / t.passages).toFixed(1)} µs per passage)`);
}
if (!keep) rmSync(base, { recursive: true, force: true });
