/**
 * Resampling of irregular station reports (METAR + SPECI, CSV) onto a regular time grid, with an
 * explicit gap rule, and wind resampled as vector components.
 *
 * Gap rule (all methods): a grid time receives a value only when it coincides with a valid report or
 * lies between two valid reports that are at most `maxGapMs` apart. Outside the span of the data, or
 * inside a longer gap, the grid value is NaN — nothing is invented across a gap.
 * NaN rule: reports whose time or value is NaN are ignored (treated as absent).
 * Times must be non-decreasing (a StationSeries already is); otherwise a RangeError is thrown.
 */

export type ResampleMethod = 'linear' | 'nearest' | 'mean';

export interface ResampleOptions {
  /** Grid spacing, ms (> 0). */
  stepMs: number;
  /** First grid time, ms (default: first valid report time rounded up to a multiple of stepMs since the epoch). */
  startMs?: number;
  /** Last grid time, ms, inclusive (default: last valid report time rounded down to a multiple of stepMs). */
  endMs?: number;
  /** Longest report spacing that may be bridged, ms (≥ 0). */
  maxGapMs: number;
  /**
   * `linear` (default): straight line between the two bracketing reports.
   * `nearest`: the nearer bracketing report (ties to the earlier).
   * `mean`: mean of the valid reports in the centred bin [t − step/2, t + step/2) — for dense data
   * (1–5 min) on a coarser grid; an empty bin falls back to the `linear` rule.
   */
  method?: ResampleMethod;
}

export interface Resampled {
  timeMs: Float64Array;
  values: Float64Array;
}

/** Grid of times from the options and the valid report span. */
function gridTimes(timeMs: ArrayLike<number>, valid: (i: number) => boolean, opts: ResampleOptions): Float64Array {
  const step = opts.stepMs;
  if (!(step > 0) || !Number.isFinite(step)) throw new RangeError('resample stepMs must be a finite number > 0');
  if (!(opts.maxGapMs >= 0)) throw new RangeError('resample maxGapMs must be ≥ 0');
  let first = NaN;
  let lastT = NaN;
  let prev = -Infinity;
  for (let i = 0; i < timeMs.length; i++) {
    const t = timeMs[i]!;
    if (Number.isNaN(t)) continue;
    if (t < prev) throw new RangeError('resample requires timeMs sorted ascending');
    prev = t;
    if (!valid(i)) continue;
    if (Number.isNaN(first)) first = t;
    lastT = t;
  }
  const start = opts.startMs ?? Math.ceil(first / step) * step;
  const end = opts.endMs ?? Math.floor(lastT / step) * step;
  if (!Number.isFinite(start) || !Number.isFinite(end) || end < start) return new Float64Array(0);
  const m = Math.floor((end - start) / step + 1e-9) + 1;
  const out = new Float64Array(m);
  for (let k = 0; k < m; k++) out[k] = start + k * step;
  return out;
}

/**
 * Resample one variable onto a regular grid (see the module comment for the gap rule and NaN rule).
 * Linear interpolation is exact for data lying on a straight line. Common practice, no source.
 * @example
 * resampleRegular([0, 600000], [1, 3], { stepMs: 300000, maxGapMs: 3600000 }).values // [1, 2, 3]
 */
export function resampleRegular(
  timeMs: ArrayLike<number>,
  values: ArrayLike<number>,
  opts: ResampleOptions,
): Resampled {
  if (timeMs.length !== values.length) throw new RangeError('resampleRegular requires timeMs and values of equal length');
  const method = opts.method ?? 'linear';
  if (method !== 'linear' && method !== 'nearest' && method !== 'mean')
    throw new RangeError(`resample method must be linear, nearest or mean, got ${String(method)}`);
  const ok = (i: number) => !Number.isNaN(timeMs[i]!) && !Number.isNaN(values[i]!);
  const grid = gridTimes(timeMs, ok, opts);
  const m = grid.length;
  const out = new Float64Array(m).fill(NaN);
  // Compact the valid reports.
  const t: number[] = [];
  const y: number[] = [];
  for (let i = 0; i < timeMs.length; i++) {
    if (!ok(i)) continue;
    if (t.length > 0 && t[t.length - 1] === timeMs[i]) {
      y[y.length - 1] = values[i]!; // same time twice: the later report wins
      continue;
    }
    t.push(timeMs[i]!);
    y.push(values[i]!);
  }
  const n = t.length;
  const gap = opts.maxGapMs;
  const half = opts.stepMs / 2;
  let j = 0; // first report with time ≥ grid time (bracketing right)
  let lo = 0; // bin pointers for `mean`
  let hi = 0;
  for (let k = 0; k < m; k++) {
    const g = grid[k]!;
    if (method === 'mean') {
      while (lo < n && t[lo]! < g - half) lo++;
      if (hi < lo) hi = lo;
      while (hi < n && t[hi]! < g + half) hi++;
      if (hi > lo) {
        let s = 0;
        for (let q = lo; q < hi; q++) s += y[q]!;
        out[k] = s / (hi - lo);
        continue;
      }
    }
    while (j < n && t[j]! < g) j++;
    if (j < n && t[j] === g) {
      out[k] = y[j]!;
      continue;
    }
    if (j === 0 || j === n) continue; // outside the data span
    const t0 = t[j - 1]!;
    const t1 = t[j]!;
    if (t1 - t0 > gap) continue;
    if (method === 'nearest') out[k] = g - t0 <= t1 - g ? y[j - 1]! : y[j]!;
    else out[k] = y[j - 1]! + ((y[j]! - y[j - 1]!) * (g - t0)) / (t1 - t0);
  }
  return { timeMs: grid, values: out };
}

export interface ResampledWind {
  timeMs: Float64Array;
  /** Eastward component, m/s (u = −s·sin d). */
  uMs: Float64Array;
  /** Northward component, m/s (v = −s·cos d). */
  vMs: Float64Array;
  /** Direction the wind blows from, degrees true in [0, 360), from the resampled u, v; NaN when calm. */
  dirDeg: Float64Array;
  /** Vector speed √(u² + v²), m/s (≤ the mean scalar speed when the direction varies inside a bin). */
  speedMs: Float64Array;
  /** Scalar speed resampled directly, m/s (not reduced by direction changes). */
  scalarSpeedMs: Float64Array;
}

// Wind components follow the meteorological convention of src/physics/wind.ts (u = −s·sin d, v = −s·cos d).
export { windComponents, windFromComponents } from '../physics/wind.js';
import { windComponents, windFromComponents } from '../physics/wind.js';
import { MS_PER_MINUTE } from '../physics/constants.js';
import { medianInPlace } from './median.js';

/**
 * Resample wind as vector components, never averaging raw directions: each report becomes
 * (u, v) = (−s·sin d, −s·cos d); u and v are resampled with resampleRegular (same grid, gap rule, method);
 * direction and speed are recomputed from the resampled components. So 350° and 10° average to 0°, not 180°.
 * NaN rule: a report with NaN speed, or NaN direction and non-zero speed, is ignored; calm reports count
 * as (0, 0).
 * @example
 * resampleWindUV([0, 600000], [350, 10], [5, 5], { stepMs: 300000, maxGapMs: 3600000 }).dirDeg[1] // 0
 */
export function resampleWindUV(
  timeMs: ArrayLike<number>,
  dirDeg: ArrayLike<number>,
  speedMs: ArrayLike<number>,
  opts: ResampleOptions,
): ResampledWind {
  const n = timeMs.length;
  if (dirDeg.length !== n || speedMs.length !== n) throw new RangeError('resampleWindUV requires arrays of equal length');
  const u = new Float64Array(n);
  const v = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const c = windComponents(dirDeg[i]!, speedMs[i]!);
    u[i] = c.uMs;
    v[i] = c.vMs;
  }
  const ru = resampleRegular(timeMs, u, opts);
  // The same grid for every output: pin it explicitly.
  const grid = { ...opts, startMs: ru.timeMs.length ? ru.timeMs[0]! : opts.startMs, endMs: ru.timeMs.length ? ru.timeMs[ru.timeMs.length - 1]! : opts.endMs };
  const rv = ru.timeMs.length ? resampleRegular(timeMs, v, grid) : { timeMs: ru.timeMs, values: new Float64Array(0) };
  // Scalar speed only where the vector is defined, so all outputs share one validity mask.
  const sp = new Float64Array(n);
  for (let i = 0; i < n; i++) sp[i] = Number.isNaN(u[i]!) ? NaN : speedMs[i]!;
  const rs = ru.timeMs.length ? resampleRegular(timeMs, sp, grid) : { timeMs: ru.timeMs, values: new Float64Array(0) };
  const m = ru.timeMs.length;
  const dir = new Float64Array(m);
  const spd = new Float64Array(m);
  for (let k = 0; k < m; k++) {
    const w = windFromComponents(ru.values[k]!, rv.values[k]!);
    dir[k] = w.dirDeg;
    spd[k] = w.speedMs;
  }
  return { timeMs: ru.timeMs, uMs: ru.values, vMs: rv.values, dirDeg: dir, speedMs: spd, scalarSpeedMs: rs.values };
}

/** Candidate grid spacings, minutes. */
const STEP_LADDER_MIN = [1, 2, 5, 10, 15, 20, 30, 60] as const;

/**
 * A regular grid spacing suited to the data: the largest of 1, 2, 5, 10, 15, 20, 30, 60 min not exceeding
 * 1.1 × the median report spacing (10 % allowance for jittered report times), clamped to 1–60 min.
 * So 1-min data → 1 min, 5-min → 5 min, 20-min → 20 min, hourly METAR → 60 min (SPECIs do not pull the
 * median down unless they outnumber routine reports), 3-hourly → 60 min.
 * Why not resample hourly METAR to 20 or 30 min: interpolated points carry no new information, make
 * neighbouring samples dependent and shrink first differences, so the noise estimate and the change-point
 * penalties (which assume roughly independent samples) would be fooled; time a change within the hour from
 * the raw reports instead (bestStepIn on the raw values, or the SPECIs themselves). Common practice, no source.
 * NaN rule: NaN times are ignored; fewer than two valid times → 60 min.
 * @example chooseStepMs([0, 300000, 600000, 900000]) // 300000
 */
export function chooseStepMs(timeMs: ArrayLike<number>): number {
  const t: number[] = [];
  for (let i = 0; i < timeMs.length; i++) if (!Number.isNaN(timeMs[i]!)) t.push(timeMs[i]!);
  if (t.length < 2) return 60 * MS_PER_MINUTE;
  const d = new Float64Array(t.length - 1);
  let k = 0;
  for (let i = 1; i < t.length; i++) {
    const dt = t[i]! - t[i - 1]!;
    if (dt > 0) d[k++] = dt;
  }
  if (k === 0) return 60 * MS_PER_MINUTE;
  const med = medianInPlace(d, k);
  const medMin = med / MS_PER_MINUTE;
  let step: number = STEP_LADDER_MIN[0];
  for (const c of STEP_LADDER_MIN) if (c <= medMin * 1.1) step = c;
  return step * MS_PER_MINUTE;
}

/**
 * Default longest gap to bridge for a grid spacing: max(2.5 × step, 15 min). For hourly data this is
 * 150 min, so one missing routine report (a 2-h spacing, plus jitter) is bridged but two (3 h) are not;
 * for 5-min and 1-min data it is 15 min. Common practice, no source.
 * @example defaultMaxGapMs(3600000) // 9000000 (2.5 h)
 */
export function defaultMaxGapMs(stepMs: number): number {
  if (!(stepMs > 0)) throw new RangeError('defaultMaxGapMs stepMs must be > 0');
  return Math.max(2.5 * stepMs, 15 * MS_PER_MINUTE);
}
