/** Linear scales and "nice" tick values for the report's charts, on d3-scale and d3-array. */
import { scaleLinear } from 'd3-scale';
import { tickStep, ticks } from 'd3-array';

/**
 * A linear map from [d0, d1] to [r0, r1]; a zero-width domain maps everything to the middle of the range.
 * @example linearScale(0, 10, 100, 200)(2.5) // 125
 */
export function linearScale(d0: number, d1: number, r0: number, r1: number): (v: number) => number {
  // d3-scale maps a zero-width domain to the middle of the range, as this function always has.
  const sc = scaleLinear().domain([d0, d1]).range([r0, r1]);
  return (v) => sc(v);
}

/**
 * Tick step of 1, 2 or 5 × 10^k giving about `count` intervals over [lo, hi] (d3-array `tickStep`).
 * @example niceStep(0, 10, 5) // 2
 */
export function niceStep(lo: number, hi: number, count: number): number {
  if (!(hi - lo > 0) || !(count > 0)) return 1;
  return Math.abs(tickStep(lo, hi, count));
}

/**
 * Tick values inside [lo, hi]: multiples of 1, 2 or 5 × 10^k, about `count` of them (d3-array `ticks`), never −0.
 * @example niceTicks(-1.3, 8.2, 5) // [0, 2, 4, 6, 8]
 */
export function niceTicks(lo: number, hi: number, count: number): number[] {
  if (!(hi >= lo) || !(count > 0)) return [];
  return ticks(lo, hi, count).map((v) => (v === 0 ? 0 : v));
}

/**
 * Padded value domain for a chart row: min and max of the finite values, widened by 8 % each side and to at
 * least `minSpan` (so a flat line does not fill the row). NaN pair when no value is finite.
 * @example paddedDomain([1, 3], 10) // [-3, 7]
 */
export function paddedDomain(values: Iterable<number>, minSpan: number): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of values) {
    if (!Number.isFinite(v)) continue;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  if (lo > hi) return [NaN, NaN];
  const pad = (hi - lo) * 0.08;
  lo -= pad;
  hi += pad;
  if (hi - lo < minSpan) {
    const mid = (lo + hi) / 2;
    lo = mid - minSpan / 2;
    hi = mid + minSpan / 2;
  }
  return [lo, hi];
}
