/**
 * Building one station's series from its observations, and the cadence of a series. The series type itself
 * lives in src/model/series.ts.
 */
import type { Observation, StationMeta, StationSeries } from '../model/index.js';
import { SeriesBuilder } from './seriesBuilder.js';

/** @deprecated Re-exported for old import paths; import from src/model/. */
export { allocSeries, QC, SERIES_FIELDS, type SeriesField, type StationSeries, type FieldColumns, type DuplicateNote } from '../model/index.js';

/**
 * Build a sorted columnar series from one station's observations.
 * Duplicate times are resolved as SeriesBuilder.build states (a COR over the report it corrects; identical
 * repeats dropped; of differing reports the preferred one by an order-independent rule, gaps filled from the
 * others). Every duplicate is noted.
 */
export function buildSeries(station: string, observations: readonly Observation[], meta?: StationMeta): StationSeries {
  const b = new SeriesBuilder(() => station);
  for (const o of observations) b.add(o);
  return b.build(station, meta);
}

/** Median spacing between consecutive reports, minutes (NaN for fewer than 2 reports). */
export function medianCadenceMinutes(timeMs: ArrayLike<number>): number {
  const n = timeMs.length;
  if (n < 2) return NaN;
  const d = new Float64Array(n - 1);
  for (let i = 1; i < n; i++) d[i - 1] = (timeMs[i]! - timeMs[i - 1]!) / 60000;
  d.sort();
  return d[(d.length - 1) >> 1]!;
}
