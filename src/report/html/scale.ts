/** Linear scales and "nice" tick values for the report's charts (written here; no d3 package). */

/**
 * A linear map from [d0, d1] to [r0, r1]; a zero-width domain maps everything to the middle of the range.
 * @example linearScale(0, 10, 100, 200)(2.5) // 125
 */
export function linearScale(d0: number, d1: number, r0: number, r1: number): (v: number) => number {
  if (!(d1 !== d0)) return () => (r0 + r1) / 2;
  const k = (r1 - r0) / (d1 - d0);
  return (v) => r0 + (v - d0) * k;
}

/**
 * Tick step of 1, 2 or 5 × 10^k giving about `count` intervals over [lo, hi] (the usual "nice numbers"
 * choice; common practice, no source).
 * @example niceStep(0, 10, 5) // 2
 */
export function niceStep(lo: number, hi: number, count: number): number {
  const span = hi - lo;
  if (!(span > 0) || !(count > 0)) return 1;
  const raw = span / count;
  const mag = Math.pow(10, Math.floor(Math.log10(raw)));
  const f = raw / mag;
  return (f <= 1 ? 1 : f <= 2 ? 2 : f <= 5 ? 5 : 10) * mag;
}

/**
 * Tick values: multiples of {@link niceStep} inside [lo, hi], rounded to the step's decimals.
 * @example niceTicks(-1.3, 8.2, 5) // [0, 2, 4, 6, 8]
 */
export function niceTicks(lo: number, hi: number, count: number): number[] {
  const step = niceStep(lo, hi, count);
  const decimals = Math.max(0, -Math.floor(Math.log10(step)));
  const out: number[] = [];
  for (let v = Math.ceil(lo / step - 1e-9) * step; v <= hi + step * 1e-9; v += step) {
    const r = Number(v.toFixed(decimals));
    out.push(r === 0 ? 0 : r);
  }
  return out;
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
