/**
 * The expected diurnal cycle of a station variable, so that evening cooling is not mistaken for a cold
 * front: (a) the station's own robust mean diurnal anomaly by local solar hour when the record is long
 * enough, (b) otherwise a simple solar-aware temperature shape. Profiles are evaluated by periodic linear
 * interpolation in local solar time.
 *
 * Local solar time = UTC + longitude/15 h (+ equation of time when asked), from `solarTimeMs` /
 * `solarHour` in physics/sun.ts. Without the equation of time the error is at most about 16 min (early
 * November; about −14 min in mid February) — small against hourly profile bins.
 */
import { MS_PER_DAY } from '../physics/constants.js';
import { solarHour, solarTimeMs } from '../physics/sun.js';
import { median } from './median.js';

/** A diurnal anomaly profile in local solar time (anomaly from the daily mean; mean over the day ≈ 0). */
export interface DiurnalProfile {
  /** `climatology` = the station's own record, `model` = fallback shape, `none` = no correction (all zeros). */
  source: 'climatology' | 'model' | 'none';
  /** Bins per solar day; bin b covers solar hours [24b/B, 24(b+1)/B). */
  binsPerDay: number;
  /** Interpolation node of each bin, solar hour (the mean solar hour of the samples in the bin, or its centre). */
  hourOfNode: Float64Array;
  /** Anomaly at each node, units of the values. */
  anomaly: Float64Array;
  /** Days that contributed to each bin (0 for a model profile). */
  days: Int32Array;
  /** Whether solar time includes the equation of time. */
  equationOfTime: boolean;
  /** max − min of the anomalies, units of the values. */
  range: number;
}

export interface DiurnalOptions {
  /** Bins per solar day (default 24: hourly bins). */
  binsPerDay?: number;
  /** Every bin needs anomalies from at least this many days for a climatology (default 10). */
  minDays?: number;
  /** Use apparent solar time (default false). */
  equationOfTime?: boolean;
  /** Station latitude, degrees north; used by the fallback model for day length (default: 12-h day). */
  latDeg?: number;
  /** Fallback when the record is too short: `temperature` shape (default) or `none` (no correction). */
  fallback?: 'temperature' | 'none';
  /** Daily range for the fallback when the record has no complete day, units of the values (default 8, i.e. °C). */
  defaultRange?: number;
}


/**
 * The station's own mean diurnal anomaly by local solar time, or a fallback when the record is short.
 *
 * Climatology rule: values are averaged into solar-time bins (B per day, default 24); each bin value's
 * anomaly is taken from a centred one-day moving mean (for even B a 2×B moving average: B + 1 bins, the two
 * end bins weighted ½; for odd B, B bins; at least 80 % of the window's bins present); the profile value of each bin of the day is the
 * MEDIAN of its anomalies over all days (robust, so a few frontal days do not dominate), then the profile is
 * shifted to mean 0. It is used when every bin has anomalies from at least `minDays` (default 10) days;
 * otherwise the fallback is returned (`fallbackDiurnalProfile`), with the daily range taken as the median
 * (max − min) of the bin means over days with at least 80 % of bins present, or `defaultRange` when no
 * day qualifies. Common practice, no source.
 * NaN rule: samples with NaN time or value are ignored.
 * @example
 * meanDiurnalAnomaly(timeMs, temperatureC, -87.9).source // 'climatology' for a month of hourly data
 */
export function meanDiurnalAnomaly(
  timeMs: ArrayLike<number>,
  values: ArrayLike<number>,
  lonDeg: number,
  opts: DiurnalOptions = {},
): DiurnalProfile {
  if (timeMs.length !== values.length) throw new RangeError('meanDiurnalAnomaly requires timeMs and values of equal length');
  if (!Number.isFinite(lonDeg)) throw new RangeError('meanDiurnalAnomaly requires a finite longitude');
  const B = opts.binsPerDay ?? 24;
  if (!Number.isInteger(B) || B < 4 || B > 1440) throw new RangeError('meanDiurnalAnomaly binsPerDay must be an integer in 4–1440');
  const minDays = opts.minDays ?? 10;
  const eot = opts.equationOfTime ?? false;
  const binMs = MS_PER_DAY / B;

  // Absolute solar-time bins.
  let aMin = Infinity;
  let aMax = -Infinity;
  const n = timeMs.length;
  const abs = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const s = solarTimeMs(timeMs[i]!, lonDeg, eot);
    const v = values[i]!;
    if (Number.isNaN(s) || Number.isNaN(v)) {
      abs[i] = NaN;
      continue;
    }
    abs[i] = s / binMs;
    const a = Math.floor(abs[i]!);
    if (a < aMin) aMin = a;
    if (a > aMax) aMax = a;
  }
  const fallback = (range: number): DiurnalProfile =>
    fallbackDiurnalProfile({
      range,
      latDeg: opts.latDeg,
      timeMs: midTime(timeMs),
      binsPerDay: opts.binsPerDay,
      equationOfTime: eot,
      shape: opts.fallback ?? 'temperature',
    });
  if (aMin > aMax) return fallback(opts.defaultRange ?? 8);
  const len = aMax - aMin + 1;
  const sum = new Float64Array(len);
  const cnt = new Int32Array(len);
  const pos = new Float64Array(len); // Σ fractional position within the bin
  for (let i = 0; i < n; i++) {
    const x = abs[i]!;
    if (Number.isNaN(x)) continue;
    const a = Math.floor(x);
    sum[a - aMin] += values[i]!;
    pos[a - aMin] += x - a;
    cnt[a - aMin]++;
  }
  const mean = new Float64Array(len).fill(NaN);
  for (let k = 0; k < len; k++) if (cnt[k]! > 0) mean[k] = sum[k]! / cnt[k]!;

  // Centred 2×B moving mean and anomalies, collected by bin of day.
  // Window j = −half … +half: for even B that is B + 1 bins with the two ends weighted ½ (2×B moving
  // average); for odd B it is B bins of weight 1.
  const half = B >> 1;
  const even = B % 2 === 0;
  const need = 0.8 * (2 * half + 1);
  const byBin: number[][] = Array.from({ length: B }, () => []);
  const posSum = new Float64Array(B);
  const posCnt = new Int32Array(B);
  for (let k = 0; k < len; k++) {
    if (Number.isNaN(mean[k]!)) continue;
    let ws = 0;
    let ww = 0;
    let present = 0;
    for (let j = -half; j <= half; j++) {
      const q = k + j;
      if (q < 0 || q >= len || Number.isNaN(mean[q]!)) continue;
      const w = even && (j === -half || j === half) ? 0.5 : 1;
      ws += w * mean[q]!;
      ww += w;
      present++;
    }
    if (present < need) continue;
    const b = (((k + aMin) % B) + B) % B;
    byBin[b]!.push(mean[k]! - ws / ww);
    posSum[b] += pos[k]! / cnt[k]!;
    posCnt[b]++;
  }

  let minCount = Infinity;
  for (let b = 0; b < B; b++) minCount = Math.min(minCount, byBin[b]!.length);
  if (minCount < minDays) {
    // Daily ranges of bin means over days with ≥ 80 % of bins present.
    const ranges: number[] = [];
    const dayFirst = Math.floor(aMin / B);
    const dayLast = Math.floor(aMax / B);
    for (let day = dayFirst; day <= dayLast; day++) {
      let lo = Infinity;
      let hi = -Infinity;
      let present = 0;
      for (let b = 0; b < B; b++) {
        const k = day * B + b - aMin;
        if (k < 0 || k >= len || Number.isNaN(mean[k]!)) continue;
        present++;
        lo = Math.min(lo, mean[k]!);
        hi = Math.max(hi, mean[k]!);
      }
      if (present >= 0.8 * B) ranges.push(hi - lo);
    }
    return fallback(ranges.length ? median(ranges) : (opts.defaultRange ?? 8));
  }

  const anomaly = new Float64Array(B);
  const days = new Int32Array(B);
  const hourOfNode = new Float64Array(B);
  let total = 0;
  for (let b = 0; b < B; b++) {
    anomaly[b] = median(byBin[b]!);
    days[b] = byBin[b]!.length;
    hourOfNode[b] = ((b + posSum[b]! / posCnt[b]!) * 24) / B;
    total += anomaly[b]!;
  }
  let lo = Infinity;
  let hi = -Infinity;
  for (let b = 0; b < B; b++) {
    anomaly[b] -= total / B;
    lo = Math.min(lo, anomaly[b]!);
    hi = Math.max(hi, anomaly[b]!);
  }
  return { source: 'climatology', binsPerDay: B, hourOfNode, anomaly, days, equationOfTime: eot, range: hi - lo };
}

function midTime(timeMs: ArrayLike<number>): number {
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < timeMs.length; i++) {
    const t = timeMs[i]!;
    if (Number.isNaN(t)) continue;
    lo = Math.min(lo, t);
    hi = Math.max(hi, t);
  }
  return lo <= hi ? 0.5 * (lo + hi) : NaN;
}

export interface FallbackDiurnalOptions {
  /** Daily range (max − min), units of the values (e.g. °C). */
  range: number;
  /** Latitude, degrees north (default: a 12-h day). */
  latDeg?: number;
  /** A time inside the record, for the solar declination (default: an equinox, i.e. a 12-h day). */
  timeMs?: number;
  /** Bins per day (default 96, i.e. 15 min). */
  binsPerDay?: number;
  equationOfTime?: boolean;
  /** `temperature` (default) or `none` (flat zero profile). */
  shape?: 'temperature' | 'none';
}

/** Hours after sunrise of the daytime maximum beyond half the day length (lag of the maximum after solar noon). */
const DAY_LAG_H = 2;
/** e-folding time of nocturnal cooling, hours. */
const NIGHT_TAU_H = 4;

/**
 * A simple expected diurnal temperature shape for records too short for a climatology (common practice,
 * no source; similar in spirit to the sine-by-day, exponential-by-night models of the agronomic literature).
 * Day length from the solar declination δ ≈ 23.44°·sin(2π(284 + N)/365) (N = day of year; a common
 * approximation, from memory) and latitude φ: cos H₀ = −tan φ tan δ, day length D = 2H₀/15 h, sunrise at
 * 12 − D/2 and sunset at 12 + D/2 solar time. By day the temperature rises as
 * T = Tmin + R·sin(π(h − sunrise)/(D + 2·2 h)), so it peaks about 2 h after solar noon (14 h for a 12-h
 * day); by night it cools exponentially with a 4-h e-folding time from its sunset value to Tmin at the next
 * sunrise. The result is shifted to a daily mean of 0. Polar day or night (no sunrise) → flat zero profile.
 * Units: those of `range`. NaN rule: NaN latitude or time → 12-h day.
 * @example expectedDiurnalChange(fallbackDiurnalProfile({ range: 8 }), t18, t23, 0) < 0 // evening cooling
 */
export function fallbackDiurnalProfile(opts: FallbackDiurnalOptions): DiurnalProfile {
  const B = opts.binsPerDay ?? 96;
  if (!Number.isInteger(B) || B < 4 || B > 1440) throw new RangeError('fallbackDiurnalProfile binsPerDay must be an integer in 4–1440');
  const range = opts.range;
  const eot = opts.equationOfTime ?? false;
  const hourOfNode = new Float64Array(B);
  for (let b = 0; b < B; b++) hourOfNode[b] = ((b + 0.5) * 24) / B;
  const anomaly = new Float64Array(B);
  const days = new Int32Array(B);
  const none = (): DiurnalProfile => ({ source: 'none', binsPerDay: B, hourOfNode, anomaly, days, equationOfTime: eot, range: 0 });
  if ((opts.shape ?? 'temperature') === 'none' || !(range > 0)) return none();

  let dayLen = 12;
  const lat = opts.latDeg;
  const t = opts.timeMs;
  if (lat !== undefined && Number.isFinite(lat) && t !== undefined && Number.isFinite(t)) {
    const y = new Date(t).getUTCFullYear();
    const doy = Math.floor((t - Date.UTC(y, 0, 1)) / MS_PER_DAY) + 1;
    const decl = ((23.44 * Math.PI) / 180) * Math.sin((2 * Math.PI * (284 + doy)) / 365);
    const c = -Math.tan((lat * Math.PI) / 180) * Math.tan(decl);
    if (c >= 1 || c <= -1) return none(); // polar night or polar day
    dayLen = (2 * ((Math.acos(c) * 180) / Math.PI)) / 15;
  }
  const sunrise = 12 - dayLen / 2;
  const sunset = 12 + dayLen / 2;
  const nightLen = 24 - dayLen;
  const shape = (h: number): number => {
    if (h >= sunrise && h <= sunset) return Math.sin((Math.PI * (h - sunrise)) / (dayLen + 2 * DAY_LAG_H));
    const since = h > sunset ? h - sunset : h + 24 - sunset;
    const atSunset = Math.sin((Math.PI * dayLen) / (dayLen + 2 * DAY_LAG_H));
    const e = Math.exp(-nightLen / NIGHT_TAU_H);
    return (atSunset * (Math.exp(-since / NIGHT_TAU_H) - e)) / (1 - e);
  };
  let total = 0;
  let lo = Infinity;
  let hi = -Infinity;
  for (let b = 0; b < B; b++) {
    anomaly[b] = range * shape(hourOfNode[b]!);
    total += anomaly[b]!;
  }
  for (let b = 0; b < B; b++) {
    anomaly[b] -= total / B;
    lo = Math.min(lo, anomaly[b]!);
    hi = Math.max(hi, anomaly[b]!);
  }
  return { source: 'model', binsPerDay: B, hourOfNode, anomaly, days, equationOfTime: eot, range: hi - lo };
}

/**
 * Profile value at a solar hour, by periodic linear interpolation between the nodes.
 * NaN rule: NaN hour → NaN.
 * @example diurnalAnomalyAt(profile, 14.5)
 */
export function diurnalAnomalyAt(profile: DiurnalProfile, hour: number): number {
  if (Number.isNaN(hour)) return NaN;
  const B = profile.binsPerDay;
  const nodes = profile.hourOfNode;
  const a = profile.anomaly;
  let h = hour % 24;
  if (h < 0) h += 24;
  // Nodes ascend within [0, 24); find the last node ≤ h (wrapping).
  let k = Math.min(B - 1, Math.floor((h * B) / 24));
  while (k >= 0 && nodes[k]! > h) k--;
  while (k + 1 < B && nodes[k + 1]! <= h) k++;
  let h0: number;
  let h1: number;
  let y0: number;
  let y1: number;
  if (k < 0) {
    h0 = nodes[B - 1]! - 24;
    y0 = a[B - 1]!;
    h1 = nodes[0]!;
    y1 = a[0]!;
  } else if (k === B - 1) {
    h0 = nodes[B - 1]!;
    y0 = a[B - 1]!;
    h1 = nodes[0]! + 24;
    y1 = a[0]!;
  } else {
    h0 = nodes[k]!;
    y0 = a[k]!;
    h1 = nodes[k + 1]!;
    y1 = a[k + 1]!;
  }
  return h1 > h0 ? y0 + ((y1 - y0) * (h - h0)) / (h1 - h0) : y0;
}

/**
 * Expected change from the diurnal cycle alone between two times: profile(solar hour at t1) −
 * profile(solar hour at t0), units of the values (negative = expected cooling). For intervals longer than a
 * day only the phase matters. NaN rule: NaN time → NaN.
 * @example expectedDiurnalChange(profile, t0Ms, t0Ms + 5 * 3600000, lonDeg) // e.g. −3.1 (°C) in the evening
 */
export function expectedDiurnalChange(profile: DiurnalProfile, t0Ms: number, t1Ms: number, lonDeg: number): number {
  const eot = profile.equationOfTime;
  return diurnalAnomalyAt(profile, solarHour(t1Ms, lonDeg, eot)) - diurnalAnomalyAt(profile, solarHour(t0Ms, lonDeg, eot));
}

/**
 * Values with the expected diurnal anomaly removed: values[i] − profile(solar hour of timeMs[i]).
 * Returns a new array (the input is not changed). NaN rule: NaN value or time → NaN.
 * @example removeDiurnal(timeMs, temperatureC, profile, lonDeg)
 */
export function removeDiurnal(
  timeMs: ArrayLike<number>,
  values: ArrayLike<number>,
  profile: DiurnalProfile,
  lonDeg: number,
): Float64Array {
  if (timeMs.length !== values.length) throw new RangeError('removeDiurnal requires timeMs and values of equal length');
  const out = new Float64Array(values.length);
  for (let i = 0; i < values.length; i++) {
    out[i] = values[i]! - diurnalAnomalyAt(profile, solarHour(timeMs[i]!, lonDeg, profile.equationOfTime));
  }
  return out;
}
