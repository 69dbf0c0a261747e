/**
 * Weighted least-squares plane f ≈ f̄ + a·(x − x̄) + b·(y − ȳ) through scattered points: the one plane fit
 * behind the front tracker (arrival times, `fitPlane`) and the station-network gradient (`planeGradient`).
 * Normal equations on coordinates centred on the weighted centroid (for conditioning):
 * a = (Sxf·Syy − Syf·Sxy)/D, b = (Syf·Sxx − Sxf·Sxy)/D, D = Sxx·Syy − Sxy² (Davies-Jones1993; for three
 * points it equals the triangle method of Bellamy1949).
 *
 * Missing-value rule: a point is ignored when its value, either coordinate or its weight is not finite, or its
 * weight is ≤ 0. Degeneracy rule: fewer than three points used, or points (nearly) on one line —
 * D ≤ 1e-6·(Sxx + Syy)², i.e. the spread across the best-fitting line is below about 0.1 % of the spread
 * along it — gives NaN slopes (the centroid and mean value are still returned when a point was used).
 */

export interface LeastSquaresPlane {
  /** Points used. */
  n: number;
  /** Weighted centroid of the points used (NaN when none). */
  meanX: number;
  meanY: number;
  /** Weighted mean value = the plane's value at the centroid (NaN when none). */
  mean: number;
  /** Slopes ∂f/∂x and ∂f/∂y, units of f per unit of x and y (NaN when degenerate). */
  dfdx: number;
  dfdy: number;
}

/** Relative determinant below which the points count as collinear (see the module comment). */
export const PLANE_DEGENERATE_RATIO = 1e-6;

/**
 * Fit the plane (see the module comment for the equations, the missing-value and the degeneracy rules).
 * `weights` default to 1. Throws RangeError when the lengths differ.
 * @example leastSquaresPlane([0, 100, 30], [0, 10, 90], [20, 16.7, 14.6]).dfdx // ≈ −0.02793
 */
export function leastSquaresPlane(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  f: ArrayLike<number>,
  weights?: ArrayLike<number>,
): LeastSquaresPlane {
  const len = f.length;
  if (x.length !== len || y.length !== len || (weights !== undefined && weights.length !== len)) {
    throw new RangeError('leastSquaresPlane requires x, y, f (and weights) of equal length');
  }
  const used = (i: number, wi: number) => Number.isFinite(f[i]!) && Number.isFinite(x[i]!) && Number.isFinite(y[i]!) && Number.isFinite(wi) && wi > 0;
  let n = 0, sw = 0, sx = 0, sy = 0, sf = 0;
  for (let i = 0; i < len; i++) {
    const wi = weights ? weights[i]! : 1;
    if (!used(i, wi)) continue;
    n++;
    sw += wi;
    sx += wi * x[i]!;
    sy += wi * y[i]!;
    sf += wi * f[i]!;
  }
  if (n === 0) return { n, meanX: NaN, meanY: NaN, mean: NaN, dfdx: NaN, dfdy: NaN };
  const mx = sx / sw, my = sy / sw, mf = sf / sw;
  if (n < 3) return { n, meanX: mx, meanY: my, mean: mf, dfdx: NaN, dfdy: NaN };
  let sxx = 0, sxy = 0, syy = 0, sxf = 0, syf = 0;
  for (let i = 0; i < len; i++) {
    const wi = weights ? weights[i]! : 1;
    if (!used(i, wi)) continue;
    const dx = x[i]! - mx, dy = y[i]! - my, df = f[i]! - mf;
    sxx += wi * dx * dx;
    sxy += wi * dx * dy;
    syy += wi * dy * dy;
    sxf += wi * dx * df;
    syf += wi * dy * df;
  }
  const det = sxx * syy - sxy * sxy;
  if (!(Math.abs(det) > PLANE_DEGENERATE_RATIO * (sxx + syy) * (sxx + syy))) return { n, meanX: mx, meanY: my, mean: mf, dfdx: NaN, dfdy: NaN };
  return { n, meanX: mx, meanY: my, mean: mf, dfdx: (sxf * syy - syf * sxy) / det, dfdy: (syf * sxx - sxf * sxy) / det };
}
