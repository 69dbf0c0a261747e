/** Empirical quantiles for verification statistics (timing-error median, p90); the median elsewhere is signal/median.ts (the same rule at q = 0.5). */

/**
 * Empirical quantile with linear interpolation between order statistics: Hyndman & Fan (1996),
 * Am. Stat. 50, definition 7 (the default of R and NumPy). Ignores NaN; NaN for no data; q in [0, 1].
 * `simple-statistics`' quantile uses the same definition 7 but neither ignores NaN nor accepts an empty sample,
 * hence this helper.
 * @example quantile([1, 2, 3, 4], 0.5) // 2.5
 */
export function quantile(values: readonly number[], q: number): number {
  const v = values.filter((x) => !Number.isNaN(x)).sort((a, b) => a - b);
  if (v.length === 0) return NaN;
  const h = (v.length - 1) * q;
  const lo = Math.floor(h);
  const hi = Math.ceil(h);
  return v[lo]! + (v[hi]! - v[lo]!) * (h - lo);
}
