/**
 * Quality control of a station series: range, spike, rate, persistence and consistency tests.
 * Flags go into `series.qc[field]` (QC bits); values are kept and shown, and excluded from detection
 * through `cleanColumn`.
 */
import { QC, SERIES_FIELDS, type SeriesField, type StationSeries } from '../model/index.js';
import { DEWPOINT_EXCESS_C, PERSIST_HOURS, RANGE_LIMITS, RATE_LIMITS_PER_HOUR, SPIKE_LIMITS } from './limits.js';
import { MS_PER_HOUR } from '../physics/constants.js';

export interface QcSummary {
  /** Count of flagged values per field and test. */
  flagged: Record<string, number>;
  total: number;
}

/** Run every QC test on the series in place (only `series.qc` is written). Returns counts. */
export function applyQc(series: StationSeries): QcSummary {
  const flagged: Record<string, number> = {};
  const bump = (field: SeriesField, test: string, n: number) => {
    if (n > 0) flagged[`${field}:${test}`] = (flagged[`${field}:${test}`] ?? 0) + n;
  };
  for (const f of SERIES_FIELDS) {
    const v = series[f];
    const q = series.qc[f];
    const r = RANGE_LIMITS[f];
    if (r) bump(f, 'range', flagRange(v, q, r.min, r.max));
    const s = SPIKE_LIMITS[f];
    if (s !== undefined) bump(f, 'spike', flagSpikes(v, q, s));
    const rate = RATE_LIMITS_PER_HOUR[f];
    if (rate !== undefined) bump(f, 'rate', flagRate(series.timeMs, v, q, rate));
    const p = PERSIST_HOURS[f];
    if (p !== undefined) bump(f, 'persistence', flagPersistence(series.timeMs, v, q, p * MS_PER_HOUR));
  }
  bump('dewpointC', 'above-temperature', flagDewpointAboveTemperature(series.temperatureC, series.dewpointC, series.qc.dewpointC));
  let total = 0;
  for (const k in flagged) total += flagged[k]!;
  return { flagged, total };
}

/** Flag values outside [min, max]. NaN is missing, never flagged. */
export function flagRange(v: ArrayLike<number>, q: Uint8Array, min: number, max: number): number {
  let n = 0;
  for (let i = 0; i < v.length; i++) {
    const x = v[i]!;
    if (x < min || x > max) {
      q[i]! |= QC.RANGE;
      n++;
    }
  }
  return n;
}

/** Flag single-report spikes: departs from both valid neighbours by > limit in the same direction while they agree within limit/2. */
export function flagSpikes(v: ArrayLike<number>, q: Uint8Array, limit: number): number {
  let n = 0;
  let prev = -1;
  for (let i = 0; i < v.length; i++) {
    if (Number.isNaN(v[i]!) || q[i]! & QC.RANGE) continue;
    if (prev < 0) {
      prev = i;
      continue;
    }
    // find next valid
    let next = i + 1;
    while (next < v.length && (Number.isNaN(v[next]!) || q[next]! & QC.RANGE)) next++;
    if (next >= v.length) break;
    const a = v[prev]!;
    const x = v[i]!;
    const b = v[next]!;
    const da = x - a;
    const db = x - b;
    if (Math.abs(da) > limit && Math.abs(db) > limit && Math.sign(da) === Math.sign(db) && Math.abs(a - b) <= limit / 2) {
      q[i]! |= QC.SPIKE;
      n++;
      continue; // keep prev as the last good value
    }
    prev = i;
  }
  return n;
}

/** Flag the later value of a consecutive pair (≥ 10 min apart) whose rate exceeds `perHour`. */
export function flagRate(timeMs: ArrayLike<number>, v: ArrayLike<number>, q: Uint8Array, perHour: number): number {
  let n = 0;
  let prev = -1;
  for (let i = 0; i < v.length; i++) {
    if (Number.isNaN(v[i]!) || q[i]! & (QC.RANGE | QC.SPIKE)) continue;
    if (prev >= 0) {
      const dtH = Math.max(timeMs[i]! - timeMs[prev]!, 600_000) / MS_PER_HOUR;
      if (dtH <= 3 && Math.abs(v[i]! - v[prev]!) / dtH > perHour) {
        q[i]! |= QC.STEP;
        n++;
        continue;
      }
    }
    prev = i;
  }
  return n;
}

/** Flag runs of identical values lasting at least `minDurationMs` (stuck sensor). NaN breaks a run. */
export function flagPersistence(timeMs: ArrayLike<number>, v: ArrayLike<number>, q: Uint8Array, minDurationMs: number): number {
  let n = 0;
  let start = 0;
  const close = (end: number) => {
    // run is [start, end)
    if (end - start >= 3 && timeMs[end - 1]! - timeMs[start]! >= minDurationMs) {
      for (let k = start; k < end; k++) q[k]! |= QC.PERSIST;
      n += end - start;
    }
  };
  for (let i = 1; i <= v.length; i++) {
    if (i === v.length || Number.isNaN(v[i]!) || v[i] !== v[start]) {
      if (!Number.isNaN(v[start]!)) close(i);
      start = i;
    }
  }
  return n;
}

/** Flag dew points above the temperature by more than the rounding allowance. */
export function flagDewpointAboveTemperature(t: ArrayLike<number>, td: ArrayLike<number>, q: Uint8Array): number {
  let n = 0;
  for (let i = 0; i < t.length; i++) {
    if (td[i]! > t[i]! + DEWPOINT_EXCESS_C) {
      q[i]! |= QC.CONSISTENCY;
      n++;
    }
  }
  return n;
}

/** A copy of a field with every QC-flagged value set to NaN, for detection. */
export function cleanColumn(series: StationSeries, field: SeriesField): Float64Array {
  const v = series[field];
  const q = series.qc[field];
  const out = new Float64Array(v.length);
  for (let i = 0; i < v.length; i++) out[i] = q[i] ? NaN : v[i]!;
  return out;
}
