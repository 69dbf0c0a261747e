/**
 * `npm run bench:broad`: a broader synthetic skill benchmark of our own. Seeded networks of the broad configuration
 * (tools/synth/broad.ts: cold fronts from a 2 °C fall, veers from 30°, slow wind shifts, weak warm fronts), every
 * station written at 5, 10, 20, 30 and 60 minutes in every CSV convention the readers accept (local-time files
 * included), read back through the real readers (`loadPaths`) and analysed by the main job (`analyseSeries`:
 * detection, tracking); the naive rule of thumb (bench/naive.ts) runs on the same series. Prints per cadence the
 * scores of bench/skill-score.ts and skill against signal strength (temperature contrast, veer) so weak spots show.
 *
 * Seeds. TUNING seeds are for whoever tunes the detector (look at cases with `--part tune`); REPORTING seeds are
 * only for the figures and must never be used to tune. Both lists are fixed here; change them only with a note in
 * the README. Synthetic skill from our own generator is an upper bound.
 *
 * Usage: npm run bench:broad [-- --part tune|report] [--days 90] [--json out.json]
 */
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { analyseSeries, loadPaths, type StationSeries } from '../src/index.js';
import { contingencyForKind, matchOneToOne, pod } from '../src/verify/contingency.js';
import { BROAD_CADENCES, generateBroad, renderBroadFiles } from '../tools/synth/broad.js';
import type { TruthEvent } from '../tools/synth/types.js';
import { naiveDetect } from './naive.js';
import { stationsCsvText } from './skill-data.js';
import { MATCH_WINDOW_MS, REAL_KINDS, score, type Detected, type Scores } from './skill-score.js';

/** Seeds to tune on (never reported). */
const TUNING_SEEDS = [5101, 5102, 5103] as const;
/** Seeds to report on (never used to tune). */
const REPORTING_SEEDS = [6201, 6202, 6203] as const;

const args = process.argv.slice(2);
const arg = (name: string, def: string) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 && args[i + 1] !== undefined ? args[i + 1]! : def;
};
const part = arg('part', 'report');
if (part !== 'tune' && part !== 'report') {
  console.error(`bench:broad: --part must be tune or report, got ${part}`);
  process.exit(2);
}
const days = Number(arg('days', '90'));
const jsonOut = args.includes('--json') ? arg('json', '') : '';
const seeds = part === 'tune' ? TUNING_SEEDS : REPORTING_SEEDS;

/** Signal-strength bins: [label, lo (inclusive), hi (exclusive)]. */
const CONTRAST_BINS: [string, number, number][] = [
  ['ΔT 2–3 °C', 0, 3],
  ['ΔT 3–5 °C', 3, 5],
  ['ΔT 5–8 °C', 5, 8],
  ['ΔT ≥ 8 °C', 8, Infinity],
];
const VEER_BINS: [string, number, number][] = [
  ['turn < 45°', 0, 45],
  ['turn 45–70°', 45, 70],
  ['turn 70–100°', 70, 100],
  ['turn ≥ 100°', 100, Infinity],
];

const turnDeg = (e: TruthEvent) =>
  e.windBeforeDeg === undefined || e.windAfterDeg === undefined ? NaN : Math.abs(((((e.windAfterDeg - e.windBeforeDeg) % 360) + 540) % 360) - 180);

interface CadenceRun {
  truth: TruthEvent[];
  fropa: Detected[];
  naive: Detected[];
  series: number;
  reports: number;
  loadMs: number;
  analyseMs: number;
}

/** Station ids carry the seed, so networks of several seeds score as one set. */
const tag = (seed: number, station: string) => `${seed}:${station}`;

function runSeed(seed: number, runs: CadenceRun[]): { planted: TruthEvent[]; genMs: number } {
  const t0 = Date.now();
  const net = generateBroad(seed, days);
  const genMs = Date.now() - t0;
  const dir = mkdtempSync(join(tmpdir(), 'fropa-broad-'));
  try {
    const stationsFile = join(dir, 'stations.csv');
    writeFileSync(stationsFile, stationsCsvText(net.stations));
    const truth = net.truth.map((e) => ({ ...e, station: tag(seed, e.station) }));
    BROAD_CADENCES.forEach((cadence, c) => {
      // Files that need the reader to be told their zone go in a folder per zone; the rest say their offset or UTC.
      const groups = new Map<string, string>();
      for (const f of renderBroadFiles(net, c, seed)) {
        const key = f.readerZone ?? '';
        let sub = groups.get(key);
        if (!sub) {
          sub = join(dir, `${cadence}min`, key === '' ? 'self-described' : key.replace('/', '_'));
          mkdirSync(sub, { recursive: true });
          groups.set(key, sub);
        }
        writeFileSync(join(sub, f.name), f.text);
      }
      const t1 = Date.now();
      const series: StationSeries[] = [];
      for (const [zone, sub] of groups) series.push(...loadPaths([sub], zone === '' ? { stationsFile } : { stationsFile, zone }).series);
      const t2 = Date.now();
      const { events } = analyseSeries(series);
      const t3 = Date.now();
      const run = runs[c]!;
      run.truth.push(...truth);
      run.fropa.push(...events.map((e) => ({ station: tag(seed, e.station), kind: e.kind, timeMs: e.timeMs, zoneHours: e.zoneHours })));
      for (const s of series) run.naive.push(...naiveDetect(s).map((e) => ({ ...e, station: tag(seed, e.station) })));
      run.series += series.length;
      run.reports += series.reduce((n, s) => n + s.length, 0);
      run.loadMs += t2 - t1;
      run.analyseMs += t3 - t2;
    });
    return { planted: truth, genMs };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

interface Extra {
  drylinePod: number;
  drylineN: number;
  warmAnyKindPod: number;
  /** Bin label → [hits (kind must match), planted]. */
  coldByContrast: Record<string, [number, number]>;
  coldByVeer: Record<string, [number, number]>;
  warmByContrast: Record<string, [number, number]>;
  warmByVeer: Record<string, [number, number]>;
}

function extraScores(truth: readonly TruthEvent[], det: readonly Detected[]): Extra {
  const real = truth.filter((e) => !e.isDecoy && REAL_KINDS.has(e.kind));
  const m = matchOneToOne(real, det, MATCH_WINDOW_MS);
  const dryline = contingencyForKind(
    real.map((e) => e.kind as string),
    det.map((d) => d.kind),
    m,
    'dryline',
  );
  const pairedKind = new Map<number, string>();
  for (const [i, j] of m.pairs) pairedKind.set(i, det[j]!.kind);
  const bins = (kind: string, value: (e: TruthEvent) => number, spec: [string, number, number][]) => {
    const out: Record<string, [number, number]> = {};
    for (const [label] of spec) out[label] = [0, 0];
    real.forEach((e, i) => {
      if (e.kind !== kind) return;
      const v = value(e);
      const b = spec.find(([, lo, hi]) => v >= lo && v < hi);
      if (!b) return;
      const cell = out[b[0]]!;
      cell[1]++;
      if (pairedKind.get(i) === kind) cell[0]++;
    });
    return out;
  };
  const warm = real.map((e, i) => [e, i] as const).filter(([e]) => e.kind === 'warm-front');
  const contrast = (e: TruthEvent) => Math.abs(e.tempChangeC ?? NaN);
  return {
    drylinePod: pod(dryline),
    drylineN: dryline.hits + dryline.misses,
    warmAnyKindPod: warm.length ? warm.filter(([, i]) => pairedKind.has(i)).length / warm.length : NaN,
    coldByContrast: bins('cold-front', contrast, CONTRAST_BINS),
    coldByVeer: bins('cold-front', turnDeg, VEER_BINS),
    warmByContrast: bins('warm-front', contrast, CONTRAST_BINS),
    warmByVeer: bins('warm-front', turnDeg, VEER_BINS),
  };
}

function main(): void {
  const tStart = Date.now();
  const runs: CadenceRun[] = BROAD_CADENCES.map(() => ({ truth: [], fropa: [], naive: [], series: 0, reports: 0, loadMs: 0, analyseMs: 0 }));
  let planted: TruthEvent[] = [];
  let genMs = 0;
  for (const seed of seeds) {
    const r = runSeed(seed, runs);
    planted = planted.concat(r.planted);
    genMs += r.genMs;
  }
  const count = (k: string) => planted.filter((e) => e.kind === k).length;
  console.log(`fropa broad synthetic benchmark — ${part} seeds ${seeds.join(', ')}; ${days} days each, 12 stations, cadences ${BROAD_CADENCES.join('/')} min`);
  console.log(
    `planted per cadence: cold ${count('cold-front')}, warm ${count('warm-front')}, occluded ${count('occluded-front')}, dryline ${count('dryline')}; decoys: ` +
      ['night-cooling', 'outflow-boundary', 'sea-breeze-front', 'prefrontal-trough', 'dryline-retreat'].map((k) => `${k} ${count(k)}`).join(', '),
  );
  const results = runs.map((r, c) => ({
    cadenceMinutes: BROAD_CADENCES[c]!,
    reports: r.reports,
    loadMs: r.loadMs,
    analyseMs: r.analyseMs,
    fropa: { ...score(r.truth, r.fropa), ...extraScores(r.truth, r.fropa) },
    naive: { ...score(r.truth, r.naive), ...extraScores(r.truth, r.naive) },
  }));
  for (const r of results) console.log(`  ${String(r.cadenceMinutes).padStart(2)} min: ${r.reports.toLocaleString('en-US')} reports, load ${(r.loadMs / 1000).toFixed(1)} s, analyse ${(r.analyseMs / 1000).toFixed(1)} s`);

  const f2 = (x: number) => (Number.isNaN(x) ? '—' : x.toFixed(2));
  const f0 = (x: number) => (Number.isNaN(x) ? '—' : x.toFixed(0));
  const pct = (d: Scores['decoysCalledFront'][string] | undefined) => (d ? `${d.pct.toFixed(1)}%` : '—');
  type Row = [string, (s: Scores & Extra) => string, string];
  const rows: Row[] = [
    ['cold POD', (s) => f2(s.cold.pod), '≥ 0.95'],
    ['cold FAR', (s) => f2(s.cold.far), '≤ 0.03'],
    ['warm POD (kind must match)', (s) => f2(s.warm.pod), '≥ 0.80'],
    ['warm found as any kind', (s) => f2(s.warmAnyKindPod), ''],
    ['warm FAR', (s) => f2(s.warm.far), ''],
    ['kind accuracy', (s) => f2(s.kindAccuracy), '≥ 0.90'],
    ['dryline POD', (s) => f2(s.drylinePod), '≥ 0.80'],
    ['calm nights called fronts', (s) => pct(s.decoysCalledFront['night-cooling']), '≤ 1%'],
    ['outflows called fronts', (s) => pct(s.decoysCalledFront['outflow-boundary']), ''],
    ['sea breezes called fronts', (s) => pct(s.decoysCalledFront['sea-breeze-front']), ''],
    ['prefrontal troughs → front', (s) => pct(s.decoysCalledFront['prefrontal-trough']), ''],
    ['timing median (min)', (s) => f0(s.timingMedianMin), ''],
    ['timing p90 (min)', (s) => f0(s.timingP90Min), ''],
  ];
  const colW = 13;
  const head = (first: string) => first.padEnd(30) + results.map((r) => `${r.cadenceMinutes} min`.padStart(colW)).join('');
  for (const who of ['fropa', 'naive'] as const) {
    console.log(`\n${who === 'fropa' ? 'fropa (loadPaths → analyseSeries)' : 'naive rule (fall ≥ 3 °C in 3 h with a turn ≥ 45°)'}`);
    console.log(head('metric') + 'target'.padStart(9));
    for (const [name, get, target] of rows) console.log(name.padEnd(30) + results.map((r) => get(r[who]).padStart(colW)).join('') + target.padStart(9));
  }
  const binTable = (title: string, key: 'coldByContrast' | 'coldByVeer' | 'warmByContrast' | 'warmByVeer') => {
    console.log(`\n${title}: POD fropa / naive (kind must match), by cadence`);
    console.log(head('bin (planted per cadence)'));
    for (const label of Object.keys(results[0]!.fropa[key])) {
      const n = results[0]!.fropa[key][label]![1];
      if (n === 0) continue;
      const cell = (r: (typeof results)[number]) => {
        const [hf, nf] = r.fropa[key][label]!;
        const [hn] = r.naive[key][label]!;
        return `${f2(hf / nf)} / ${f2(hn / nf)}`;
      };
      console.log(`${label} (${n})`.padEnd(30) + results.map((r) => cell(r).padStart(colW)).join(''));
    }
  };
  binTable('cold fronts by temperature contrast', 'coldByContrast');
  binTable('cold fronts by wind turn', 'coldByVeer');
  binTable('warm fronts by temperature contrast', 'warmByContrast');
  binTable('warm fronts by wind turn', 'warmByVeer');
  console.log(`\ngenerated in ${(genMs / 1000).toFixed(1)} s; whole run ${((Date.now() - tStart) / 1000).toFixed(0)} s`);
  if (jsonOut) {
    writeFileSync(jsonOut, JSON.stringify({ part, seeds, days, results }, (_k, v) => (typeof v === 'number' && !Number.isFinite(v) ? null : v), 2) + '\n');
    console.log(`figures written to ${jsonOut}`);
  }
}

main();
