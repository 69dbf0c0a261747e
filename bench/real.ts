/**
 * bench:real — detection skill on real observations, scored against the project's own labels (made by
 * eye; see bench/real/labels/CRITERIA.md), for fropa and the naive rule, on the reporting part
 * (`--part tune` scores the tuning part instead). Also: how often the timing window brackets the wind
 * shift, and how close detections come to the observers' FROPA remarks in the raw-METAR files.
 *
 *   npm run bench:real                 # reporting part
 *   node --import tsx bench/real.ts --part tune --list   # tuning part, with the misses and false alarms
 */
import { join } from 'node:path';
import { analyseSeries, loadPaths, type PassageEvent, type StationSeries } from '../src/index.js';
import { naiveDetect } from './naive.js';
import { readLabels, SHARED } from './real/data.js';
import { detectReal, loadRealFiles } from './real/run.js';
import { scoreReal, type Detection, type RealScores } from './real/score.js';

const HOUR = 3_600_000;
const args = process.argv.slice(2);
const part = (args.includes('--part') ? args[args.indexOf('--part') + 1] : 'report') as 'tune' | 'report';
const list = args.includes('--list');

const f2 = (x: number) => (Number.isNaN(x) ? '  n/a' : x.toFixed(2).padStart(5));
const f0 = (x: number) => (Number.isNaN(x) ? 'n/a' : x.toFixed(0));
const iso = (t: number) => new Date(t).toISOString().slice(0, 16) + 'Z';

function print(name: string, s: RealScores) {
  console.log(`\n${name}`);
  console.log('  kind               labels found recall | detections correct precision | timing |err| median/p90 min');
  for (const k of s.kinds) {
    console.log(`  ${k.kind.padEnd(18)} ${String(k.labels).padStart(6)} ${String(k.found).padStart(5)} ${f2(k.recall)}  | ${String(k.detections).padStart(10)} ${String(k.correct).padStart(7)} ${f2(k.precision)}     | ${f0(k.timingMedianMin)} / ${f0(k.timingP90Min)}`);
  }
  console.log(`  cold fronts labelled "sure": recall ${f2(s.coldSure.recall)} (${s.coldSure.found}/${s.coldSure.labels})`);
  for (const c of s.coldBySeason) console.log(`  cold fronts ${c.season}: precision ${f2(c.precision)} (${c.correct}/${c.detections}), recall ${f2(c.recall)} (${c.found}/${c.labels})`);
  console.log('  decoys called a front (cold, warm or occluded within ±2 h):');
  for (const d of s.decoys) if (d.n) console.log(`    ${d.kind.padEnd(18)} ${d.calledFront}/${d.n} = ${f0(d.pct)} %`);
  console.log(`  dryline detections in these stations' data: ${s.drylineDetections}`);
  if (s.reliability.some((r) => r.n)) {
    console.log('  reliability (front detections in covered months): confidence bin -> fraction correct');
    for (const r of s.reliability) if (r.n) console.log(`    ${r.lo.toFixed(1)}-${r.hi.toFixed(1)}: ${f2(r.freq)} of ${r.n}`);
  }
}

/** Fraction of wind-shift-timed passages whose window brackets the shift: old wind at time_earliest, new at time_latest. */
function bracketRate(events: readonly PassageEvent[], series: readonly StationSeries[]): { n: number; ok: number } {
  const byId = new Map(series.map((s) => [s.station, s]));
  let n = 0;
  let ok = 0;
  const ang = (a: number, b: number) => Math.abs(((a - b + 540) % 360) - 180);
  const dirAt = (s: StationSeries, t: number) => {
    let lo = 0, hi = s.length;
    while (lo < hi) { const m = (lo + hi) >> 1; if (s.timeMs[m]! < t) lo = m + 1; else hi = m; }
    return lo < s.length && s.timeMs[lo] === t && s.windSpeedMs[lo]! > 0 ? s.windDirDeg[lo]! : NaN;
  };
  for (const e of events) {
    const basis = (e as { timeBasis?: string }).timeBasis ?? (e.evidence.some((x) => x.startsWith('timed at the wind shift')) ? 'wind-shift' : '');
    if (basis !== 'wind-shift') continue;
    const s = byId.get(e.station);
    if (!s || Number.isNaN(e.windBeforeDeg) || Number.isNaN(e.windAfterDeg) || ang(e.windBeforeDeg, e.windAfterDeg) < 30) continue;
    const d0 = dirAt(s, e.timeEarliestMs);
    const d1 = dirAt(s, e.timeLatestMs);
    if (Number.isNaN(d0) || Number.isNaN(d1)) continue;
    n++;
    if (ang(d0, e.windBeforeDeg) < ang(d0, e.windAfterDeg) && ang(d1, e.windAfterDeg) < ang(d1, e.windBeforeDeg)) ok++;
  }
  return { n, ok };
}

/** Observer FROPA remarks in the raw-METAR files of ../shared/realdata: nearest front detection. */
function observerRemarks() {
  const files = ['KJFK_2019-11_to_2020-02_asos.csv', 'KORD_2024-02-27_28_metar.txt'].map((f) => join(SHARED, 'realdata', f));
  const r = loadPaths(files, { stationsFile: join(SHARED, 'realdata', 'stations.csv') });
  const events = analyseSeries(r.series, { network: false }).events;
  const rows: string[] = [];
  let n = 0;
  let within60 = 0;
  for (const s of r.series) {
    const seen = new Set<number>();
    for (const rm of s.remarks) {
      if (!rm.frontal) continue;
      const t = Number.isNaN(rm.shiftTimeMs) ? rm.reportTimeMs : rm.shiftTimeMs;
      if ([...seen].some((x) => Math.abs(x - t) < 3 * HOUR)) continue;
      seen.add(t);
      n++;
      let best: PassageEvent | undefined;
      for (const e of events) if (e.station === s.station && e.kind !== 'wind-shift' && (!best || Math.abs(e.timeMs - t) < Math.abs(best.timeMs - t))) best = e;
      const dMin = best ? (best.timeMs - t) / 60_000 : NaN;
      if (Math.abs(dMin) <= 60) within60++;
      rows.push(`    ${s.station} ${rm.label} shift ${iso(t)}: nearest front ${best ? `${best.kind} ${iso(best.timeMs)} (${dMin >= 0 ? '+' : ''}${f0(dMin)} min)` : 'none'}`);
    }
  }
  return { n, within60, rows };
}

function main() {
  const { labels, coverage, problems } = readLabels();
  for (const p of problems) process.stderr.write(`bench:real: ${p}\n`);
  if (!labels.length) {
    console.log('bench:real: no labels found (bench/real/labels/*-events.csv); nothing to score');
    return;
  }
  const t0 = performance.now();
  const loaded = loadRealFiles();
  const series = loaded.flatMap((l) => l.series);
  const events = detectReal(loaded);
  const t1 = performance.now();
  const nParts = labels.filter((l) => l.part === part).length;
  console.log(`bench:real — part "${part}": ${nParts} labels (the project's own, by eye) in ${coverage.filter((c) => c.part === part).length} covered station-months; ${series.length} station series, ${series.reduce((a, s) => a + s.length, 0)} reports, detection ${((t1 - t0) / 1000).toFixed(1)} s`);
  const byKind = new Map<string, number>();
  for (const l of labels.filter((l) => l.part === part)) byKind.set(l.kind, (byKind.get(l.kind) ?? 0) + 1);
  console.log('  labels by kind: ' + [...byKind].map(([k, v]) => `${k} ${v}`).join(', '));
  const dets: Detection[] = events.map((e) => ({ station: e.station, kind: e.kind, timeMs: e.timeMs, timeEarliestMs: e.timeEarliestMs, timeLatestMs: e.timeLatestMs, confidence: e.confidence }));
  const fropa = scoreReal(labels, coverage, dets, part);
  print('fropa', fropa);
  const naive: Detection[] = series.flatMap((s) => naiveDetect(s).map((e) => ({ station: s.station, kind: e.kind, timeMs: e.timeMs })));
  print('naive rule (fall >= 3 °C in 3 h with a turn >= 45°: cold front)', scoreReal(labels, coverage, naive, part));
  const br = bracketRate(events, series);
  console.log(`\nwindow brackets the shift (old wind at time_earliest, new at time_latest): ${br.ok}/${br.n} = ${f0((100 * br.ok) / Math.max(1, br.n))} % of wind-shift-timed passages (all files)`);
  const obs = observerRemarks();
  console.log(`observer FROPA remarks (weak labels, ../shared/realdata): ${obs.within60}/${obs.n} matched by a front within 60 min`);
  for (const r of obs.rows) console.log(r);
  if (list) {
    console.log('\ncold-front detections in covered months matching no cold-front label:');
    for (const d of fropa.unmatchedColdInCoverage) {
      const near = labels.find((l) => l.station === d.station && Math.abs(l.timeMs - d.timeMs) <= 3 * HOUR);
      console.log(`  ${d.station} ${iso(d.timeMs)} conf ${d.confidence?.toFixed(2)}${near ? `  (label ${near.kind} ${iso(near.timeMs)}: ${near.notes})` : ''}`);
    }
    console.log('\ncold-front labels not detected as cold fronts:');
    for (const l of fropa.missedCold) {
      const near = events.filter((e) => e.station === l.station && Math.abs(e.timeMs - l.timeMs) <= 6 * HOUR);
      console.log(`  ${l.station} ${iso(l.timeMs)} ${l.notes}${near.length ? `  [near: ${near.map((e) => `${e.kind} ${iso(e.timeMs)} ${e.confidence}`).join('; ')}]` : ''}`);
    }
  }
}

main();
