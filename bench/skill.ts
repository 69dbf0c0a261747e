/**
 * Seeded synthetic skill benchmark: fropa against the naive rule of thumb, on the same invented
 * network encoded two ways (5-minute CSV and hourly METAR with SPECIs), read back through the real
 * readers. Scores (Wilks 2011 ch. 8): POD, FAR, CSI per kind, kind accuracy, timing and zone errors,
 * and how often decoys are called fronts.
 *
 * Usage: npm run bench:skill [-- --seed 20260301 --days 90 --json out.json]
 */
import { rmSync, writeFileSync } from 'node:fs';
import type { StationSeries } from '../src/model/index.js';
import { writeBenchNetwork } from './skill-data.js';
import type { TruthEvent } from '../tools/synth/types.js';
import { naiveDetect } from './naive.js';
import { score, type Detected, type Scores } from './skill-score.js';

const args = process.argv.slice(2);
const arg = (name: string, def: string) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 && args[i + 1] !== undefined ? args[i + 1]! : def;
};
const seed = Number(arg('seed', '20260301'));
const days = Number(arg('days', '90'));
const jsonOut = args.includes('--json') ? arg('json', '') : '';

type LoadFn = (paths: string[], opts?: { stationsFile?: string }) => Promise<{ series: StationSeries[] }> | { series: StationSeries[] };
type DetectFn = (s: StationSeries) => Detected[];

async function importOrExplain(): Promise<{ loadPaths: LoadFn; detectStation: DetectFn }> {
  let loadPaths: LoadFn;
  let detectStation: DetectFn;
  try {
    ({ loadPaths } = (await import('../src/pipeline.js')) as unknown as { loadPaths: LoadFn });
  } catch (e) {
    throw new Error(`bench:skill needs src/pipeline.ts (loadPaths), which could not be loaded: ${(e as Error).message}`);
  }
  try {
    ({ detectStation } = (await import('../src/detect/detect.js')) as unknown as { detectStation: DetectFn });
  } catch (e) {
    throw new Error(`bench:skill needs src/detect/detect.ts (detectStation), which could not be loaded: ${(e as Error).message}`);
  }
  if (typeof loadPaths !== 'function') throw new Error('src/pipeline.ts does not export loadPaths');
  if (typeof detectStation !== 'function') throw new Error('src/detect/detect.ts does not export detectStation');
  return { loadPaths, detectStation };
}

async function main(): Promise<void> {
  const { loadPaths, detectStation } = await importOrExplain();
  const t0 = Date.now();
  const { stations, net, csvDir, metarDir, stationsFile, dir } = writeBenchNetwork(seed, days);
  const genMs = Date.now() - t0;
  const truth = net.truth;
  const count = (pred: (e: TruthEvent) => boolean) => truth.filter(pred).length;
  console.log(`fropa skill benchmark — seed ${seed}, ${days} days, ${stations.length} stations (generated in ${genMs} ms)`);
  console.log(
    `planted: cold ${count((e) => e.kind === 'cold-front')}, warm ${count((e) => e.kind === 'warm-front')}, occluded ${count((e) => e.kind === 'occluded-front')}, dryline ${count((e) => e.kind === 'dryline')}; decoys: ` +
      ['night-cooling', 'outflow-boundary', 'sea-breeze-front', 'prefrontal-trough', 'dryline-retreat'].map((k) => `${k} ${count((e) => e.kind === k)}`).join(', ') +
      `; faults ${net.faults.length}`,
  );

  const results: Record<string, Record<string, Scores>> = {};
  for (const [label, path] of [
    ['5-min CSV', csvDir],
    ['hourly METAR', metarDir],
  ] as const) {
    const t1 = Date.now();
    const loaded = await loadPaths([path], { stationsFile });
    const tLoad = Date.now() - t1;
    const fropaDet: Detected[] = [];
    const naiveDet: Detected[] = [];
    const t2 = Date.now();
    for (const s of loaded.series) fropaDet.push(...detectStation(s));
    const tDet = Date.now() - t2;
    for (const s of loaded.series) naiveDet.push(...naiveDetect(s));
    const known = new Set(stations.map((s) => s.id));
    const unknown = loaded.series.filter((s) => !known.has(s.station)).map((s) => s.station);
    if (unknown.length) console.log(`  note: series with unexpected station ids in ${label}: ${unknown.join(', ')}`);
    console.log(`  ${label}: ${loaded.series.length} series, load ${tLoad} ms, detect ${tDet} ms`);
    results[label] = { fropa: score(truth, fropaDet), naive: score(truth, naiveDet) };
  }
  rmSync(dir, { recursive: true, force: true });

  const f2 = (x: number) => (Number.isNaN(x) ? '  —  ' : x.toFixed(2));
  const f0 = (x: number) => (Number.isNaN(x) ? '  —' : x.toFixed(0));
  const rows: [string, (s: Scores) => string, (label: string) => string][] = [
    ['cold-front POD', (s) => f2(s.cold.pod), () => '≥ 0.95'],
    ['cold-front FAR', (s) => f2(s.cold.far), () => '≤ 0.05'],
    ['cold-front CSI', (s) => f2(s.cold.csi), () => ''],
    ['cold hits/miss/FA', (s) => `${s.cold.hits}/${s.cold.misses}/${s.cold.falseAlarms}`, () => ''],
    ['warm-front POD', (s) => f2(s.warm.pod), () => '≥ 0.80'],
    ['warm-front FAR', (s) => f2(s.warm.far), () => ''],
    ['warm-front CSI', (s) => f2(s.warm.csi), () => ''],
    ['warm hits/miss/FA', (s) => `${s.warm.hits}/${s.warm.misses}/${s.warm.falseAlarms}`, () => ''],
    ['kind accuracy', (s) => f2(s.kindAccuracy), () => ''],
    ['timing median (min)', (s) => f0(s.timingMedianMin), (l) => (l.startsWith('5') ? '≤ 15' : '≤ 30')],
    ['timing p90 (min)', (s) => f0(s.timingP90Min), () => ''],
    ['zone hours |err| med', (s) => f2(s.zoneHoursMedianAbsErr), () => ''],
    ['detections', (s) => String(s.detections), () => ''],
  ];
  const decoyKinds = ['night-cooling', 'outflow-boundary', 'sea-breeze-front', 'prefrontal-trough', 'dryline-retreat'];
  for (const k of decoyKinds) rows.push([`decoy ${k} → front %`, (s) => (s.decoysCalledFront[k] ? `${s.decoysCalledFront[k]!.pct.toFixed(0)} (${s.decoysCalledFront[k]!.called}/${s.decoysCalledFront[k]!.n})` : '—'), () => '≤ 3']);
  for (const label of Object.keys(results)) {
    const r = results[label]!;
    console.log(`\n${label}`);
    console.log(`${'metric'.padEnd(28)}${'fropa'.padStart(14)}${'naive'.padStart(14)}${'target'.padStart(10)}`);
    for (const [name, get, target] of rows) console.log(`${name.padEnd(28)}${get(r.fropa!).padStart(14)}${get(r.naive!).padStart(14)}${target(label).padStart(10)}`);
  }
  const json = JSON.stringify({ seed, days, stations: stations.length, results }, (_k, v) => (typeof v === 'number' && Number.isNaN(v) ? null : v), 2);
  if (jsonOut) {
    writeFileSync(jsonOut, json + '\n');
    console.log(`\nfigures written to ${jsonOut}`);
  } else console.log('\n' + json);
}

main().catch((e: unknown) => {
  console.error(`bench:skill failed: ${(e as Error).message}`);
  process.exitCode = 1;
});
