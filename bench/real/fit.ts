/**
 * Fit the classifier (src/detect/model.ts) on the TUNING part of the real development set and write
 * src/detect/modelParams.ts. The labels are the project's own judgement, made by eye
 * (bench/real/labels/CRITERIA.md); the reporting part is never read here.
 *
 *   npm run fit:model            # writes src/detect/modelParams.ts
 *   node --import tsx bench/real/fit.ts --check   # exit 1 when the committed file differs
 *
 * Training examples: every change-point candidate at a tuning station-year. A candidate within 1.5 h of
 * a label takes the label's class (decoys `evening-cooling`, `shower`, `other` are `none`); one farther
 * than 3 h from every label inside a covered station-month (where every synoptic front was labelled) is
 * `none`; the rest are left out (too close to call, or outside the covered months). Synthetic examples
 * from SYNTHETIC_TUNING_SEEDS are added (planted passages within 1 h take their kind; decoys are `none`).
 */
import { readFileSync, rmSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { modelCandidates, type ModelCandidate } from '../../src/detect/detect.js';
import { composeCalibration, FEATURE_NAMES, fitSoftmax, MODEL_CLASSES, type ModelParams } from '../../src/detect/model.js';
import { matchNearest } from './score.js';
import { loadPaths } from '../../src/index.js';
import { writeBenchNetwork } from '../skill-data.js';
import { coveredBy, partOfStationYear, readLabels, type Label } from './data.js';
import { detectReal, loadRealFiles, type LoadedFile } from './run.js';

/**
 * Synthetic tuning seeds (never the reporting seed of bench:skill, 20260301, nor the demo's): the
 * generator's planted passages, written as 5-minute CSV and hourly METAR and read back, add cases the
 * real set has few of (5-minute data, weak warm fronts, the southern hemisphere).
 */
export const SYNTHETIC_TUNING_SEEDS = [777];
const SYNTHETIC_DAYS = 60;
const SYNTHETIC_CLASS: Record<string, string> = {
  'cold-front': 'cold-front',
  'warm-front': 'warm-front',
  'outflow-boundary': 'outflow-boundary',
  'sea-breeze-front': 'sea-breeze-front',
  'night-cooling': 'none',
  'prefrontal-trough': 'none',
  'dryline-retreat': 'none',
};

function syntheticExamples(seed: number, X: Float64Array[], y: number[], counts: Record<string, number>): void {
  const net = writeBenchNetwork(seed, SYNTHETIC_DAYS);
  try {
    for (const dir of [net.csvDir, net.metarDir]) {
      const r = loadPaths([dir], { stationsFile: net.stationsFile });
      for (const s of r.series) {
        const truth = net.net.truth.filter((t) => t.station === s.station);
        for (const c of modelCandidates(s)) {
          let near: (typeof truth)[number] | undefined;
          for (const t of truth) if (!near || Math.abs(t.timeMs - c.timeMs) < Math.abs(near.timeMs - c.timeMs)) near = t;
          const d = near ? Math.abs(near.timeMs - c.timeMs) : Infinity;
          let cls: string | undefined;
          if (near && d <= HOUR) cls = SYNTHETIC_CLASS[near.kind];
          else if (d > 3 * HOUR) cls = 'none';
          if (cls === undefined) continue;
          X.push(c.inputs);
          y.push(MODEL_CLASSES.indexOf(cls as (typeof MODEL_CLASSES)[number]));
          counts[`synthetic ${cls}`] = (counts[`synthetic ${cls}`] ?? 0) + 1;
        }
      }
    }
  } finally {
    rmSync(net.dir, { recursive: true, force: true });
  }
}

const HOUR = 3_600_000;
/** A candidate this close to a label takes its class (an hourly report or so either side of the labelled time). */
const POSITIVE_MS = Number(process.env.FIT_POSITIVE_H ?? 1.5) * HOUR;
const OUT = join(dirname(fileURLToPath(import.meta.url)), '../../src/detect/modelParams.ts');

const CLASS_OF: Record<string, string> = {
  'cold-front': 'cold-front',
  'warm-front': 'warm-front',
  'outflow-boundary': 'outflow-boundary',
  'sea-breeze-front': 'sea-breeze-front',
  'evening-cooling': 'none',
  shower: 'none',
  other: 'none',
};

export function trainingSet(loaded: readonly LoadedFile[] = loadRealFiles()): { X: Float64Array[]; y: number[]; w: number[]; counts: Record<string, number> } {
  const { labels, coverage } = readLabels();
  const tune = labels.filter((l) => l.part === 'tune');
  const covered = coveredBy(coverage.filter((c) => c.part === 'tune'));
  const byStation = new Map<string, Label[]>();
  for (const l of tune) byStation.set(l.station, [...(byStation.get(l.station) ?? []), l]);
  const X: Float64Array[] = [];
  const y: number[] = [];
  const counts: Record<string, number> = {};
  for (const file of loaded) {
    for (const s of file.series) {
      const cands: ModelCandidate[] = modelCandidates(s);
      const ls = byStation.get(s.station) ?? [];
      for (const c of cands) {
        if (partOfStationYear(c.station, new Date(c.timeMs).toISOString().slice(0, 4)) !== 'tune') continue;
        let near: Label | undefined;
        for (const l of ls) if (!near || Math.abs(l.timeMs - c.timeMs) < Math.abs(near.timeMs - c.timeMs)) near = l;
        const d = near ? Math.abs(near.timeMs - c.timeMs) : Infinity;
        let cls: string | undefined;
        if (near && d <= POSITIVE_MS) cls = CLASS_OF[near.kind];
        else if (d > 3 * HOUR && covered(c.station, c.timeMs)) cls = 'none';
        if (cls === undefined) continue;
        X.push(c.inputs);
        y.push(MODEL_CLASSES.indexOf(cls as (typeof MODEL_CLASSES)[number]));
        counts[cls] = (counts[cls] ?? 0) + 1;
      }
    }
  }
  const nReal = X.length;
  for (const seed of SYNTHETIC_TUNING_SEEDS) syntheticExamples(seed, X, y, counts);
  // The synthetic examples together weigh as much as the real ones (5-minute data has many more change points).
  const wSynth = X.length > nReal ? nReal / (X.length - nReal) : 1;
  const base = X.map((_, i) => (i < nReal ? 1 : wSynth));
  // Classes are weighed towards balance (by the square root of their rarity), so the rare kinds shape the
  // fit; the event-level calibration then restores probabilities that mean frequencies.
  const classTotal = new Array<number>(MODEL_CLASSES.length).fill(0);
  y.forEach((c, i) => (classTotal[c]! += base[i]!));
  const all = classTotal.reduce((a, b) => a + b, 0);
  const w = base.map((b, i) => Math.round(b * Math.sqrt(all / (MODEL_CLASSES.length * Math.max(1, classTotal[y[i]!]!))) * 1e6) / 1e6);
  return { X, y, w, counts };
}

/** Kinds calibrated at the event level (the labelled ones with enough detections). */
const CALIBRATED = ['cold-front', 'warm-front', 'outflow-boundary', 'sea-breeze-front'];

/**
 * Platt scaling per kind (Platt 1999): run the detector with the fitted weights and no calibration on the
 * tuning part, mark each detection in a covered month correct when it matches a label of its kind
 * (±3 h, one to one), and fit P(correct) = σ(a + b·logit(p)). Sampled kinds (outflows, sea breezes) use only
 * the detections within 3 h of some label. With `first` (a first pass), the detector runs with that scaling
 * and a second one is fitted on the detections from SECOND_PASS_FLOOR up and composed with it.
 */
export function calibration(weights: number[][], loaded: readonly LoadedFile[] = loadRealFiles(), first?: Record<string, [number, number]>): Record<string, [number, number]> {
  const { labels, coverage } = readLabels();
  const tune = labels.filter((l) => l.part === 'tune');
  const covered = coveredBy(coverage.filter((c) => c.part === 'tune'));
  const params: ModelParams = { classes: MODEL_CLASSES, features: FEATURE_NAMES, weights };
  if (first) params.calibration = first;
  const events = detectReal(loaded, { model: params, minConfidence: first ? SECOND_PASS_FLOOR : 0.05 }).filter(
    (e) => partOfStationYear(e.station, new Date(e.timeMs).toISOString().slice(0, 4)) === 'tune' && covered(e.station, e.timeMs),
  );
  const m = matchNearest(tune.filter((l) => covered(l.station, l.timeMs)), events, 3 * HOUR, (l, d) => l.kind === d.kind);
  const correct = new Set(m.values());
  const out: Record<string, [number, number]> = {};
  // Cold and warm fronts were labelled exhaustively in the covered months; outflows and sea breezes only as
  // a sample, so theirs are calibrated on the detections within 3 h of some label (where the labeller looked).
  const nearLabel = (e: { station: string; timeMs: number }) => tune.some((l) => l.station === e.station && Math.abs(l.timeMs - e.timeMs) <= 3 * HOUR);
  for (const kind of CALIBRATED) {
    const ev = events.filter((e) => e.kind === kind && (kind === 'cold-front' || kind === 'warm-front' || nearLabel(e)));
    if (ev.length < 10) continue;
    const X = ev.map((e) => {
      const q = Math.min(1 - 1e-6, Math.max(1e-6, e.confidence));
      return Float64Array.from([Math.log(q / (1 - q))]);
    });
    const y = ev.map((e) => (correct.has(e) ? 1 : 0));
    const w = fitSoftmax(X, y, 2, { l2: 1e-3, iterations: 800, learningRate: 0.05 });
    const ab: [number, number] = [w[1]![1]! - w[0]![1]!, w[1]![0]! - w[0]![0]!];
    const prior = first?.[kind];
    const composed = prior ? composeCalibration(prior, ab) : ab;
    out[kind] = [Math.round(composed[0] * 1e4) / 1e4, Math.round(composed[1] * 1e4) / 1e4];
  }
  // A kind the second pass could not refit keeps its first-pass scaling.
  if (first) for (const [k, ab] of Object.entries(first)) if (!(k in out)) out[k] = ab;
  return out;
}

/**
 * The second pass is fitted on the detections users can see (confidence from this floor up, the range of
 * any sensible --min-confidence), where the first pass, fitted on everything the detector proposes, is
 * least accurate. common practice, no source, for the 0.2.
 */
const SECOND_PASS_FLOOR = 0.2;


export function paramsText(): { text: string; counts: Record<string, number> } {
  // The real files are read once, for the examples and for the calibration.
  const loaded = loadRealFiles();
  const { X, y, w, counts } = trainingSet(loaded);
  const weights = fitSoftmax(X, y, MODEL_CLASSES.length, { l2: 3e-3, iterations: 800, learningRate: 0.05, sampleWeight: w });
  // Two passes of Platt scaling: on every proposal, then on the detections the first lets through.
  const cal = calibration(weights, loaded, calibration(weights, loaded));
  const lines = [
    '/**',
    ' * Fitted parameters of the classifier (model.ts), generated by `npm run fit:model` from the tuning part',
    ' * of the real development set (labels: the project\'s own judgement, by eye). Do not edit by hand.',
    ` * Training examples: ${Object.entries(counts).sort().map(([k, v]) => `${k} ${v}`).join(', ')}.`,
    ' */',
    "import type { ModelParams } from './model.js';",
    '',
    'export const MODEL_PARAMS: ModelParams | null = {',
    `  classes: ${JSON.stringify(MODEL_CLASSES)},`,
    `  features: ${JSON.stringify(FEATURE_NAMES)},`,
    '  weights: [',
    ...weights.map((w) => `    [${w.join(', ')}],`),
    '  ],',
    `  calibration: ${JSON.stringify(cal).replace(/"([a-z-]+)":/g, "'$1': ").replace(/,'/g, ", '")},`,
    '};',
    '',
  ];
  return { text: lines.join('\n'), counts };
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const { text, counts } = paramsText();
  if (process.argv.includes('--check')) {
    const same = readFileSync(OUT, 'utf8') === text;
    console.log(same ? 'modelParams.ts is up to date' : 'modelParams.ts differs from a fresh fit: run npm run fit:model');
    process.exit(same ? 0 : 1);
  }
  writeFileSync(OUT, text);
  console.log(`wrote ${OUT}: ${Object.entries(counts).map(([k, v]) => `${k} ${v}`).join(', ')}`);
}
