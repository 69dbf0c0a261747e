/**
 * Wind vectors, circular statistics of direction, turning, FMH-1 wind-shift and gust criteria.
 *
 * Conventions: direction is where the wind blows FROM, degrees true, clockwise from north, in [0, 360);
 * u is the eastward and v the northward component: u = −s sin d, v = −s cos d (WMO-No. 306 / any synoptic text).
 * Calm: speed 0 has no direction; components of a calm are (0, 0) whatever the direction (even NaN), and a zero
 * vector converts back to direction NaN with speed 0. Turning: positive = veering (clockwise), negative = backing.
 *
 * References:
 * - MardiaJupp2000: Mardia, K. V., and P. E. Jupp, 2000: Directional Statistics, Wiley, ch. 2 §2.3 (mean direction,
 *   mean resultant length R̄, circular variance 1 − R̄, circular standard deviation √(−2 ln R̄), sample circular
 *   dispersion (1 − ρ̄₂)/(2R̄²)); section/equation details from memory.
 * - FMH1: Federal Meteorological Handbook No. 1, Surface Weather Observations and Reports, ch. 5:
 *   §5.4.4 wind gust ("variation of 10 knots or more between peaks and lulls" in the most recent 10 minutes;
 *   gust speed = maximum instantaneous speed); §5.4.6 wind shift ("a change in wind direction of 45 degrees or more
 *   in less than 15 minutes with sustained winds of 10 knots or more throughout the wind shift"; reported time = time
 *   the shift began). Same wording: AFMAN 15-111 (2019) §7.4.5.
 */
import { KNOT_MS, MS_PER_MINUTE } from './constants.js';

const DEG = Math.PI / 180;

/** FMH1 §5.4.6 minimum direction change, degrees. */
export const FMH1_SHIFT_MIN_TURN_DEG = 45;
/** FMH1 §5.4.6 the change must take less than this, ms (15 min). */
export const FMH1_SHIFT_MAX_DURATION_MS = 15 * MS_PER_MINUTE;
/** FMH1 §5.4.6 sustained speed throughout, m/s (10 kt). */
export const FMH1_SHIFT_MIN_SPEED_MS = 10 * KNOT_MS;
/** FMH1 §5.4.4 peak-to-lull variation for a gust, m/s (10 kt). */
export const FMH1_GUST_MIN_RANGE_MS = 10 * KNOT_MS;
/** FMH1 §5.4.4 evaluation window, ms (most recent 10 min). */
export const FMH1_GUST_WINDOW_MS = 10 * MS_PER_MINUTE;
/**
 * Slack for threshold comparisons so that values converted from whole knots or degrees still meet "≥" criteria
 * despite rounding of the knot factor (1e-5 m/s ≈ 2e-5 kt; 1e-9°).
 */
const SPEED_SLACK_MS = 1e-5;
const ANGLE_SLACK_DEG = 1e-9;

/**
 * Normalise a direction to [0, 360). NaN → NaN. 360 → 0.
 * @example normalizeDirectionDeg(-90) // 270
 */
export function normalizeDirectionDeg(dirDeg: number): number {
  const d = dirDeg % 360;
  const r = d < 0 ? d + 360 : d === 0 ? 0 : d;
  return r >= 360 ? r - 360 : r; // a tiny negative angle rounds to 360 when shifted

}

/**
 * Wind components from direction and speed: u = −s sin d, v = −s cos d (meteorological convention).
 * Units: degrees true (from), m/s → m/s. Speed 0 → (0, 0) even if the direction is NaN (calm);
 * otherwise NaN in → NaN out.
 * @example windComponents(270, 10) // { uMs: 10, vMs: ≈0 } (a west wind blows toward the east)
 */
export function windComponents(dirDeg: number, speedMs: number): { uMs: number; vMs: number } {
  if (speedMs === 0) return { uMs: 0, vMs: 0 };
  const r = dirDeg * DEG;
  return { uMs: -speedMs * Math.sin(r), vMs: -speedMs * Math.cos(r) };
}

/**
 * Direction and speed from components: s = √(u² + v²), d = atan2(−u, −v) in [0, 360).
 * Zero vector → direction NaN, speed 0 (calm has no direction). NaN in → NaN out.
 * @example windFromComponents(0, -5) // { dirDeg: 0, speedMs: 5 } (north wind)
 */
export function windFromComponents(uMs: number, vMs: number): { dirDeg: number; speedMs: number } {
  const s = Math.hypot(uMs, vMs);
  if (s === 0) return { dirDeg: NaN, speedMs: 0 };
  return { dirDeg: normalizeDirectionDeg(Math.atan2(-uMs, -vMs) / DEG), speedMs: s };
}

function checkOut(name: string, out: Float64Array | undefined, n: number): Float64Array {
  if (out === undefined) return new Float64Array(n);
  if (out.length !== n) throw new RangeError(`${name} output array has the wrong length`);
  return out;
}

/**
 * Typed-array {@link windComponents}: u[i], v[i] from dir[i], speed[i]. Same calm and NaN rules, element-wise.
 * Inputs are not mutated; optional outputs are filled and returned. Throws RangeError on length mismatch.
 * @example windToUV([180], [4]).v // Float64Array [4] (south wind blows northward)
 */
export function windToUV(
  dirDeg: ArrayLike<number>,
  speedMs: ArrayLike<number>,
  uOut?: Float64Array,
  vOut?: Float64Array,
): { u: Float64Array; v: Float64Array } {
  const n = dirDeg.length;
  if (speedMs.length !== n) throw new RangeError('windToUV requires dirDeg and speedMs of equal length');
  const u = checkOut('windToUV', uOut, n);
  const v = checkOut('windToUV', vOut, n);
  for (let i = 0; i < n; i++) {
    const s = speedMs[i]!;
    if (s === 0) {
      u[i] = 0;
      v[i] = 0;
    } else {
      const r = dirDeg[i]! * DEG;
      u[i] = -s * Math.sin(r);
      v[i] = -s * Math.cos(r);
    }
  }
  return { u, v };
}

/**
 * Typed-array {@link windFromComponents}. Zero vector → dir NaN, speed 0. Throws RangeError on length mismatch.
 * @example uvToWind([10], [0]).dirDeg // Float64Array [270]
 */
export function uvToWind(
  uMs: ArrayLike<number>,
  vMs: ArrayLike<number>,
  dirOut?: Float64Array,
  speedOut?: Float64Array,
): { dirDeg: Float64Array; speedMs: Float64Array } {
  const n = uMs.length;
  if (vMs.length !== n) throw new RangeError('uvToWind requires uMs and vMs of equal length');
  const dirDeg = checkOut('uvToWind', dirOut, n);
  const speedMs = checkOut('uvToWind', speedOut, n);
  for (let i = 0; i < n; i++) {
    const w = windFromComponents(uMs[i]!, vMs[i]!);
    dirDeg[i] = w.dirDeg;
    speedMs[i] = w.speedMs;
  }
  return { dirDeg, speedMs };
}

/**
 * Signed turn from one direction to another, in (−180, 180]: positive = veering (clockwise), negative = backing.
 * Exactly opposite directions give +180. NaN in → NaN.
 * @example signedTurnDeg(350, 30) // 40 (veer across north)
 */
export function signedTurnDeg(fromDeg: number, toDeg: number): number {
  let d = (toDeg - fromDeg) % 360;
  if (d <= -180) d += 360;
  else if (d > 180) d -= 360;
  return d === 0 ? 0 : d;
}

/**
 * Smallest angle between two directions, in [0, 180]: min(|d2 − d1|, 360 − |d2 − d1|) after reduction. NaN → NaN.
 * @example angularDifferenceDeg(340, 30) // 50
 */
export function angularDifferenceDeg(aDeg: number, bDeg: number): number {
  return Math.abs(signedTurnDeg(aDeg, bDeg));
}

/** Sample circular statistics of directions (MardiaJupp2000 §2.3). */
export interface CircularStats {
  /** Number of directions used (finite direction and, when weighted, finite positive weight). */
  n: number;
  /** Mean direction θ̄ = atan2(S̄, C̄) in [0, 360); NaN when R̄ = 0 or n = 0. */
  meanDeg: number;
  /** Mean resultant length R̄ = √(C̄² + S̄²) in [0, 1]. */
  resultantLength: number;
  /** Circular variance V = 1 − R̄ in [0, 1]. */
  circularVariance: number;
  /** Circular standard deviation √(−2 ln R̄), degrees (∞ when R̄ = 0). */
  circularStdDeg: number;
  /** Sample circular dispersion δ = (1 − ρ̄₂)/(2R̄²), ρ̄₂ = mean of cos 2(θ − θ̄). */
  dispersion: number;
}

/**
 * Circular statistics of directions (directional data, not axial), optionally weighted (e.g. by speed).
 * C̄ = Σw cos θ / Σw, S̄ = Σw sin θ / Σw; see {@link CircularStats}. Source: MardiaJupp2000 §2.3.
 * NaN rule: pairs with a NaN direction or a NaN/non-positive weight are ignored; nothing left → all NaN, n = 0.
 * Throws RangeError if weights are given with a different length.
 * @example circularStatsDeg([350, 10]).meanDeg // 0 (not 180)
 */
export function circularStatsDeg(dirDeg: ArrayLike<number>, weights?: ArrayLike<number>): CircularStats {
  if (weights !== undefined && weights.length !== dirDeg.length) throw new RangeError('circularStatsDeg requires weights of the same length as dirDeg');
  let c = 0;
  let s = 0;
  let wsum = 0;
  let n = 0;
  for (let i = 0; i < dirDeg.length; i++) {
    const d = dirDeg[i]!;
    const w = weights === undefined ? 1 : weights[i]!;
    if (Number.isNaN(d) || !(w > 0)) continue;
    c += w * Math.cos(d * DEG);
    s += w * Math.sin(d * DEG);
    wsum += w;
    n++;
  }
  if (n === 0) return { n: 0, meanDeg: NaN, resultantLength: NaN, circularVariance: NaN, circularStdDeg: NaN, dispersion: NaN };
  const cb = c / wsum;
  const sb = s / wsum;
  const r = Math.min(1, Math.hypot(cb, sb));
  const mean = r > 1e-15 ? normalizeDirectionDeg(Math.atan2(sb, cb) / DEG) : NaN;
  let rho2 = 0;
  if (!Number.isNaN(mean)) {
    for (let i = 0; i < dirDeg.length; i++) {
      const d = dirDeg[i]!;
      const w = weights === undefined ? 1 : weights[i]!;
      if (Number.isNaN(d) || !(w > 0)) continue;
      rho2 += w * Math.cos(2 * (d - mean) * DEG);
    }
    rho2 /= wsum;
  }
  return {
    n,
    meanDeg: mean,
    resultantLength: r,
    circularVariance: 1 - r,
    circularStdDeg: Math.sqrt(-2 * Math.log(r)) / DEG,
    dispersion: r > 1e-15 ? (1 - rho2) / (2 * r * r) : Infinity,
  };
}

/** Result of {@link vectorMeanWind}. */
export interface VectorMeanWind {
  n: number;
  /** Direction of the mean vector (from), [0, 360); NaN if the mean vector is zero. */
  dirDeg: number;
  /** Magnitude of the mean vector (resultant speed), m/s. */
  speedMs: number;
  /** Arithmetic mean of the speeds, m/s. */
  scalarMeanSpeedMs: number;
  /** Steadiness = vector mean speed / scalar mean speed in [0, 1]; NaN when the scalar mean is 0. */
  steadiness: number;
}

/**
 * Speed-weighted vector mean wind: mean of u and v, converted back (equivalently, circular mean weighted by speed).
 * NaN rule: reports with NaN speed are ignored; calm reports (speed 0) count with zero vector; reports with NaN
 * direction and speed > 0 (variable) are ignored. Nothing left → NaN fields, n = 0. A resultant below 1e-12 of the
 * scalar mean (cancelling vectors) counts as zero: direction NaN.
 * Throws RangeError on length mismatch.
 * @example vectorMeanWind([90, 270], [5, 5]).speedMs // 0
 */
export function vectorMeanWind(dirDeg: ArrayLike<number>, speedMs: ArrayLike<number>): VectorMeanWind {
  if (speedMs.length !== dirDeg.length) throw new RangeError('vectorMeanWind requires dirDeg and speedMs of equal length');
  let su = 0;
  let sv = 0;
  let ss = 0;
  let n = 0;
  for (let i = 0; i < dirDeg.length; i++) {
    const { uMs, vMs } = windComponents(dirDeg[i]!, speedMs[i]!);
    if (Number.isNaN(uMs) || Number.isNaN(vMs)) continue;
    su += uMs;
    sv += vMs;
    ss += speedMs[i]!;
    n++;
  }
  if (n === 0) return { n: 0, dirDeg: NaN, speedMs: NaN, scalarMeanSpeedMs: NaN, steadiness: NaN };
  const w = windFromComponents(su / n, sv / n);
  const mean = ss / n;
  // a resultant below 1e-12 of the scalar mean is rounding noise of cancelling vectors: no direction
  if (w.speedMs <= 1e-12 * mean) {
    w.dirDeg = NaN;
    w.speedMs = 0;
  }
  return { n, dirDeg: w.dirDeg, speedMs: w.speedMs, scalarMeanSpeedMs: mean, steadiness: mean > 0 ? w.speedMs / mean : NaN };
}

/**
 * FMH1 §5.4.6 wind-shift test for a pair of reports: 0 < t2 − t1 < 15 min, both speeds ≥ 10 kt, and the
 * direction changed by ≥ 45°. Intermediate reports are not seen here (use {@link fmh1WindShifts} on a series).
 * Units: ms, degrees, m/s. Any NaN → false.
 * @example isFmh1WindShift(0, 180, 7.7, 600000, 270, 9.3) // true (90° in 10 min at 15 → 18 kt)
 */
export function isFmh1WindShift(t1Ms: number, dir1Deg: number, speed1Ms: number, t2Ms: number, dir2Deg: number, speed2Ms: number): boolean {
  const dt = t2Ms - t1Ms;
  if (!(dt > 0 && dt < FMH1_SHIFT_MAX_DURATION_MS)) return false;
  if (!(speed1Ms >= FMH1_SHIFT_MIN_SPEED_MS - SPEED_SLACK_MS && speed2Ms >= FMH1_SHIFT_MIN_SPEED_MS - SPEED_SLACK_MS)) return false;
  return angularDifferenceDeg(dir1Deg, dir2Deg) >= FMH1_SHIFT_MIN_TURN_DEG - ANGLE_SLACK_DEG;
}

/** One wind shift found by {@link fmh1WindShifts}. */
export interface WindShift {
  /** Last report at the old direction (the shift began after it). */
  startIndex: number;
  /** Report where the turn is complete (largest turn in the same sense while the criterion's speeds hold). */
  endIndex: number;
  /** Time the shift began (FMH1 reports this time): time of `startIndex`. */
  timeMs: number;
  /** Signed turn from start to end, (−180, 180], positive = veering. */
  turnDeg: number;
}

/**
 * Wind shifts in a time-sorted series by the FMH1 §5.4.6 criterion: direction change ≥ 45° in < 15 min with every
 * report from start to end (inclusive) at ≥ 10 kt with a known direction.
 * Algorithm: from each candidate start i, find the first later report j within 15 min whose direction differs from
 * report i by ≥ 45° while speeds hold; move the start forward to the last report k < j still ≥ 45° from report j
 * (so the time is when the turn began); then extend the end while the turn from k keeps growing in the same sense
 * (speeds holding, consecutive reports < 15 min apart), so one continuing veer is one shift; resume the search at
 * the end. Shifts therefore do not overlap; the 15-min limit applies to reaching 45°, not to the extension.
 * NaN rule: a NaN speed or direction (variable) breaks the "throughout" condition.
 * Throws RangeError on length mismatch.
 * @example fmh1WindShifts([0, 300000, 600000], [180, 180, 270], [8, 8, 9])[0].timeMs // 300000
 */
export function fmh1WindShifts(timeMs: ArrayLike<number>, dirDeg: ArrayLike<number>, speedMs: ArrayLike<number>): WindShift[] {
  const n = timeMs.length;
  if (dirDeg.length !== n || speedMs.length !== n) throw new RangeError('fmh1WindShifts requires arrays of equal length');
  const ok = (i: number) => speedMs[i]! >= FMH1_SHIFT_MIN_SPEED_MS - SPEED_SLACK_MS && !Number.isNaN(dirDeg[i]!) && !Number.isNaN(timeMs[i]!);
  const big = (a: number, b: number) => angularDifferenceDeg(dirDeg[a]!, dirDeg[b]!) >= FMH1_SHIFT_MIN_TURN_DEG - ANGLE_SLACK_DEG;
  const out: WindShift[] = [];
  let i = 0;
  while (i < n) {
    if (!ok(i)) {
      i++;
      continue;
    }
    let found = -1;
    for (let j = i + 1; j < n; j++) {
      if (!ok(j) || !(timeMs[j]! - timeMs[i]! < FMH1_SHIFT_MAX_DURATION_MS)) break;
      if (big(i, j)) {
        found = j;
        break;
      }
    }
    if (found < 0) {
      i++;
      continue;
    }
    let k = i;
    for (let m = found - 1; m > i; m--) {
      if (big(m, found)) {
        k = m;
        break;
      }
    }
    let end = found;
    let turn = signedTurnDeg(dirDeg[k]!, dirDeg[end]!);
    for (let m = end + 1; m < n; m++) {
      if (!ok(m) || !(timeMs[m]! - timeMs[m - 1]! < FMH1_SHIFT_MAX_DURATION_MS)) break;
      const t = signedTurnDeg(dirDeg[k]!, dirDeg[m]!);
      if (Math.sign(t) === Math.sign(turn) && Math.abs(t) > Math.abs(turn)) {
        end = m;
        turn = t;
      }
    }
    out.push({ startIndex: k, endIndex: end, timeMs: timeMs[k]!, turnDeg: turn });
    i = end;
  }
  return out;
}

/**
 * Gust factor = gust / mean speed (dimensionless). Mean ≤ 0 or NaN → NaN.
 * @example gustFactor(15, 10) // 1.5
 */
export function gustFactor(gustMs: number, meanSpeedMs: number): number {
  if (!(meanSpeedMs > 0)) return NaN;
  return gustMs / meanSpeedMs;
}

/** Result of {@link fmh1Gust}. */
export interface GustCheck {
  /** Gust speed (the peak) when peak − lull ≥ 10 kt, else NaN. */
  gustMs: number;
  /** Highest speed in the window (NaN when the window is empty). */
  peakMs: number;
  /** Lowest speed in the window (NaN when the window is empty). */
  lullMs: number;
}

/**
 * FMH1 §5.4.4 gust criterion at time `atMs`: examine speeds with atMs − window < t ≤ atMs (most recent 10 min by
 * default); a gust exists when peak − lull ≥ 10 kt, and its speed is the peak (pass instantaneous/3-s speeds as the
 * handbook intends; with averaged speeds the result is only indicative).
 * NaN speeds are ignored. Time need not be sorted. Throws RangeError on length mismatch.
 * @example fmh1Gust([0, 60000], [7.2, 12.9], 60000).gustMs // 12.9 (14 → 25 kt)
 */
export function fmh1Gust(timeMs: ArrayLike<number>, speedMs: ArrayLike<number>, atMs: number, windowMs: number = FMH1_GUST_WINDOW_MS): GustCheck {
  if (timeMs.length !== speedMs.length) throw new RangeError('fmh1Gust requires timeMs and speedMs of equal length');
  let peak = -Infinity;
  let lull = Infinity;
  for (let i = 0; i < timeMs.length; i++) {
    const t = timeMs[i]!;
    const s = speedMs[i]!;
    if (!(t > atMs - windowMs && t <= atMs) || Number.isNaN(s)) continue;
    if (s > peak) peak = s;
    if (s < lull) lull = s;
  }
  if (peak === -Infinity) return { gustMs: NaN, peakMs: NaN, lullMs: NaN };
  return { gustMs: peak - lull >= FMH1_GUST_MIN_RANGE_MS - SPEED_SLACK_MS ? peak : NaN, peakMs: peak, lullMs: lull };
}
