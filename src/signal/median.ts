/**
 * The median, fropa's one implementation. Rule: the middle order statistic for an odd count, the mean of the
 * two middle ones, (a + b)/2, for an even count — the 0.5 quantile of Hyndman & Fan (1996) definition 7
 * (`quantile` in verify/quantile.ts), whose interpolation a + (b − a)/2 can differ from (a + b)/2 in the last
 * bit only. NaN rule: NaN entries are ignored; no finite entry → NaN.
 * Why ours and not `simple-statistics`' `median`: that one does not ignore NaN and throws on an empty sample,
 * and its a + (b − a)/2 would change our outputs in the last bit.
 */

/**
 * Median of the first `count` entries of a scratch array, which it reorders (sorts in place). NaN entries are
 * sorted to the end and not counted. NaN when no entry is left.
 * @example medianInPlace(new Float64Array([3, 1, 2, 10])) // 2.5
 */
export function medianInPlace(a: Float64Array, count: number = a.length): number {
  if (count <= 0) return NaN;
  const s = a.subarray(0, count).sort();
  let n = count;
  while (n > 0 && Number.isNaN(s[n - 1]!)) n--;
  if (n === 0) return NaN;
  const h = n >> 1;
  return n % 2 === 1 ? s[h]! : 0.5 * (s[h - 1]! + s[h]!);
}

/**
 * Median of `values` (not modified). NaN entries are ignored; NaN when none is left.
 * @example median([5, NaN, 1, 3]) // 3
 */
export function median(values: ArrayLike<number>): number {
  return medianInPlace(Float64Array.from(values));
}
