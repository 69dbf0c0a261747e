/**
 * Case-by-case diagnosis of detection on the skill benchmark's network: which planted kinds became which
 * detected kinds, signed timing and zone errors per kind, and every false front with the nearest planted
 * event and the detector's evidence. For tuning: develop on seeds other than the reported one.
 *
 * Usage: node --import tsx bench/skill-diagnose.ts [--seed 777] [--days 90] [--data csv5|metar]
 *        [--show false|misses|kinds|late] [--min-confidence X]
 */
import { rmSync } from 'node:fs';
import { loadPaths } from '../src/pipeline.js';
import { detectStation } from '../src/detect/detect.js';
import type { TruthEvent } from '../tools/synth/types.js';
import { writeBenchNetwork } from './skill-data.js';
import { matchOneToOne } from '../src/verify/contingency.js';
import { quantile } from '../src/verify/quantile.js';

const HOUR = 3_600_000;
const args = process.argv.slice(2);
const arg = (name: string, def: string) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 && args[i + 1] !== undefined ? args[i + 1]! : def;
};
const seed = Number(arg('seed', '777'));
const days = Number(arg('days', '90'));
const data = arg('data', 'csv5');
const show = arg('show', '');
const minConfidence = args.includes('--min-confidence') ? Number(arg('min-confidence', '0.4')) : undefined;

const w = writeBenchNetwork(seed, days);
try {
  const loaded = loadPaths([data === 'metar' ? w.metarDir : w.csvDir], { stationsFile: w.stationsFile });
  const det = loaded.series.flatMap((s) => detectStation(s, minConfidence === undefined ? {} : { minConfidence }));
  const truth: TruthEvent[] = w.net.truth;
  const real = truth.filter((e) => !e.isDecoy && ['cold-front', 'warm-front', 'occluded-front', 'dryline'].includes(e.kind));
  const m = matchOneToOne(real, det, 3 * HOUR);
  const fmt = (t: number) => new Date(t).toISOString().slice(5, 16);
  const confusion: Record<string, Record<string, number>> = {};
  const timing: Record<string, number[]> = {};
  const zone: Record<string, number[]> = {};
  for (const [i, j] of m.pairs) {
    const t = real[i]!;
    const d = det[j]!;
    const row = (confusion[t.kind] ??= {});
    row[d.kind] = (row[d.kind] ?? 0) + 1;
    (timing[t.kind] ??= []).push((d.timeMs - t.timeMs) / 60000);
    if (t.zoneEndMs !== undefined && Number.isFinite(d.zoneHours)) (zone[t.kind] ??= []).push(d.zoneHours - (t.zoneEndMs - t.timeMs) / HOUR);
    if (show === 'kinds' && d.kind !== t.kind) console.log(`KIND ${t.station} ${fmt(t.timeMs)} ${t.kind} → ${d.kind} c${d.confidence} | ${d.evidence.join(' | ')}`);
    if (show === 'late' && Math.abs(d.timeMs - t.timeMs) > 30 * 60000) console.log(`LATE ${t.station} ${t.kind} ${fmt(t.timeMs)} → ${fmt(d.timeMs)} | ${d.evidence.at(-1)}`);
  }
  for (const i of m.unmatchedTruth) {
    const t = real[i]!;
    const row = (confusion[t.kind] ??= {});
    row.MISSED = (row.MISSED ?? 0) + 1;
    if (show === 'misses') console.log(`MISS ${t.station} ${t.kind} ${fmt(t.timeMs)} ΔT ${t.tempChangeC ?? ''}`);
  }
  console.log(`seed ${seed}, ${data}: planted kind → detected kind`);
  for (const [k, row] of Object.entries(confusion)) console.log(`  ${k.padEnd(16)} ${JSON.stringify(row)}`);
  console.log('signed errors (detected − planted): timing minutes, zone hours — median [p10, p90]');
  for (const k of Object.keys(timing)) {
    const t = timing[k]!;
    const z = zone[k] ?? [];
    console.log(`  ${k.padEnd(16)} timing ${quantile(t, 0.5).toFixed(0)} [${quantile(t, 0.1).toFixed(0)}, ${quantile(t, 0.9).toFixed(0)}]   zone ${quantile(z, 0.5).toFixed(2)} [${quantile(z, 0.1).toFixed(2)}, ${quantile(z, 0.9).toFixed(2)}]`);
  }
  const falseFronts: Record<string, number> = {};
  for (const j of m.unmatchedDetections) {
    const d = det[j]!;
    if (!['cold-front', 'warm-front', 'occluded-front', 'dryline'].includes(d.kind)) continue;
    const near = truth
      .filter((e) => e.station === d.station && Math.abs(e.timeMs - d.timeMs) < 8 * HOUR)
      .sort((a, b) => Math.abs(a.timeMs - d.timeMs) - Math.abs(b.timeMs - d.timeMs))[0];
    const key = `${d.kind} near ${near ? near.kind + (near.isDecoy ? ' (decoy)' : '') : 'nothing planted'}`;
    falseFronts[key] = (falseFronts[key] ?? 0) + 1;
    if (show === 'false') console.log(`FALSE ${d.station} ${d.kind} ${fmt(d.timeMs)} c${d.confidence} ${near ? `${near.kind} ${fmt(near.timeMs)}` : ''} | ${d.evidence.join(' | ')}`);
  }
  console.log('false fronts:', JSON.stringify(falseFronts));
} finally {
  rmSync(w.dir, { recursive: true, force: true });
}
