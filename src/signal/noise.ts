/**
 * Robust noise level of a series from its first differences.
 *
 * For y_i = f_i + e_i with a piecewise-smooth signal f and independent noise e of standard deviation σ,
 * the first differences d_i = y_{i+1} − y_i are dominated by e_{i+1} − e_i, whose standard deviation is
 * σ√2; jumps and trends touch only a few differences (or shift their median), so a robust scale of the
 * differences divided by √2 estimates σ without being pulled by the change points themselves.
 * Estimator: σ̂ = 1.4826 · MAD(d) / √2, MAD(d) = median |d − median(d)|.
 * Sources: the MAD with its Gaussian consistency factor 1.4826 = 1/Φ⁻¹(3/4) [Hampel1974]; the use of
 * differences divided by √2 for the noise level in change-point detection is common practice in the
 * change-point literature, e.g. [Fryzlewicz2014] (wild binary segmentation) — from memory.
 */
import { medianInPlace } from './median.js';

/** 1 / Φ⁻¹(0.75): makes the MAD consistent for the standard deviation of Gaussian data [Hampel1974]. */
export const MAD_TO_SIGMA = 1.482602218505602;

/** √(π/2): makes the mean absolute deviation consistent for the Gaussian standard deviation. */
const MEAN_ABS_TO_SIGMA = Math.sqrt(Math.PI / 2);

/**
 * Robust standard deviation of the noise in `values`, from first differences between consecutive
 * valid samples: σ̂ = 1.4826·MAD(d)/√2 [Hampel1974; Fryzlewicz2014 from memory].
 * When more than half the differences are identical (MAD = 0, common with whole-degree METAR values)
 * the mean absolute deviation of the differences about their median, times √(π/2), is used instead.
 * Units: those of `values`. NaN rule: NaN samples are skipped (a difference spans the gap). Returns 0
 * for a constant series and NaN when fewer than 2 valid samples exist.
 * @param lo first index considered (default 0)
 * @param hi one past the last index considered (default values.length)
 * @example robustNoiseSigma([0, 1, 0, 1, 0, 1]) // ≈ 0.709 (MAD of the differences is 0, so the fallback √(π/2)·0.8/√2 applies)
 */
export function robustNoiseSigma(values: ArrayLike<number>, lo = 0, hi = values.length): number {
  lo = Math.max(0, lo);
  hi = Math.min(values.length, hi);
  const d = new Float64Array(Math.max(0, hi - lo));
  let n = 0;
  let prev = NaN;
  for (let i = lo; i < hi; i++) {
    const v = values[i]!;
    if (Number.isNaN(v)) continue;
    if (!Number.isNaN(prev)) d[n++] = v - prev;
    prev = v;
  }
  if (n === 0) return NaN;
  const dev = new Float64Array(n);
  const med = medianInPlace(d.slice(0, n), n);
  let sumAbs = 0;
  for (let i = 0; i < n; i++) {
    dev[i] = Math.abs(d[i]! - med);
    sumAbs += dev[i]!;
  }
  const mad = medianInPlace(dev, n);
  if (mad > 0) return (MAD_TO_SIGMA * mad) / Math.SQRT2;
  return (MEAN_ABS_TO_SIGMA * (sumAbs / n)) / Math.SQRT2;
}
