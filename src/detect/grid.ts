/**
 * The detection grid: one station's QC-clean series put on a regular cadence (never interpolated across
 * long gaps), with wind as u/v, θe, the chosen pressure and a diurnally adjusted temperature.
 */
import { QC, type StationSeries } from '../model/index.js';
import { cleanColumn } from '../qc/qc.js';
import { resampleRegular, resampleWindUV } from '../signal/resample.js';
import { diurnalAdjustment } from './diurnal.js';
import { thetaESeries } from '../physics/theta.js';
import { MS_PER_MINUTE } from '../physics/constants.js';

export interface DetectGrid {
  stepMs: number;
  n: number;
  timeMs: Float64Array;
  tC: Float64Array;
  /** Temperature minus the expected diurnal anomaly (°C). */
  tAdjC: Float64Array;
  tdC: Float64Array;
  thetaEK: Float64Array;
  pHpa: Float64Array;
  /** Which pressure the grid carries. */
  pressureKind: 'station' | 'altimeter' | 'sea-level' | 'none';
  uMs: Float64Array;
  vMs: Float64Array;
  speedMs: Float64Array;
  /** How the diurnal expectation was made. */
  diurnalMethod: string;
  /** Median spacing of the raw reports, minutes. */
  cadenceMin: number;
}

/** Grid step for a report cadence: 5 min for dense data, 10 min for 10–20 min data, 15 min for hourly reports. common practice, no source. */
export function gridStepMs(cadenceMin: number): number {
  if (!(cadenceMin > 0) || cadenceMin <= 7) return 5 * MS_PER_MINUTE;
  if (cadenceMin <= 20) return 10 * MS_PER_MINUTE;
  return 15 * MS_PER_MINUTE;
}

/** Longest gap bridged by interpolation: 2.5 report intervals, at least 90 min. common practice, no source. */
export function gridMaxGapMs(cadenceMin: number): number {
  return Math.max(90 * MS_PER_MINUTE, 2.5 * cadenceMin * MS_PER_MINUTE);
}

/** Fraction of finite values. */
function coverage(v: ArrayLike<number>): number {
  let k = 0;
  for (let i = 0; i < v.length; i++) if (!Number.isNaN(v[i]!)) k++;
  return v.length ? k / v.length : 0;
}

/** Choose the pressure column: station pressure, else altimeter setting, else sea-level pressure (first with ≥ 50 % coverage). */
export function choosePressure(s: StationSeries): { values: Float64Array; kind: DetectGrid['pressureKind'] } {
  const opts: [DetectGrid['pressureKind'], Float64Array][] = [
    ['station', cleanColumn(s, 'stationPressureHpa')],
    ['altimeter', cleanColumn(s, 'altimeterHpa')],
    ['sea-level', cleanColumn(s, 'seaLevelPressureHpa')],
  ];
  for (const [kind, v] of opts) if (coverage(v) >= 0.5) return { values: v, kind };
  let best = opts[0]!;
  for (const o of opts) if (coverage(o[1]) > coverage(best[1])) best = o;
  return coverage(best[1]) > 0 ? { values: best[1], kind: best[0] } : { values: best[1], kind: 'none' };
}

/** Build the detection grid for one station. Returns null when fewer than 6 reports or no temperature. */
export function buildGrid(s: StationSeries, cadenceMin: number): DetectGrid | null {
  if (s.length < 6) return null;
  const stepMs = gridStepMs(cadenceMin);
  const maxGapMs = gridMaxGapMs(cadenceMin);
  const startMs = Math.ceil(s.timeMs[0]! / stepMs) * stepMs;
  const endMs = Math.floor(s.timeMs[s.length - 1]! / stepMs) * stepMs;
  if (!(endMs > startMs)) return null;
  const method = cadenceMin <= 7 ? 'mean' : 'linear';
  const common = { stepMs, startMs, endMs, maxGapMs, method } as const;
  const t = resampleRegular(s.timeMs, cleanColumn(s, 'temperatureC'), common);
  const td = resampleRegular(s.timeMs, cleanColumn(s, 'dewpointC'), common);
  const pr = choosePressure(s);
  const p = resampleRegular(s.timeMs, pr.values, common);
  const dir = cleanColumn(s, 'windDirDeg');
  const spd = cleanColumn(s, 'windSpeedMs');
  // A flagged direction with a valid calm speed stays calm (u = v = 0).
  for (let i = 0; i < s.length; i++) if (s.qc.windDirDeg[i]! & QC.RANGE) dir[i] = NaN;
  const w = resampleWindUV(s.timeMs, dir, spd, common);
  const n = t.timeMs.length;
  // θe needs a pressure; without one use 1000 hPa (changes of θe keep their sign and nearly their size).
  const pForTheta = new Float64Array(n);
  for (let i = 0; i < n; i++) pForTheta[i] = pr.kind === 'station' && !Number.isNaN(p.values[i]!) ? p.values[i]! : 1000;
  const thetaEK = thetaESeries(t.values, td.values, pForTheta);
  const lonDeg = s.meta?.lonDeg ?? NaN;
  const d = diurnalAdjustment(t.timeMs, t.values, td.values, lonDeg, s.meta?.latDeg ?? NaN);
  return {
    stepMs,
    n,
    timeMs: t.timeMs,
    tC: t.values,
    tAdjC: d.adjusted,
    tdC: td.values,
    thetaEK,
    pHpa: p.values,
    pressureKind: pr.kind,
    uMs: w.uMs,
    vMs: w.vMs,
    speedMs: w.scalarSpeedMs,
    diurnalMethod: d.method,
    cadenceMin,
  };
}
