/**
 * Horizontal gradient of a field observed at irregularly placed stations: the least-squares plane
 * f ≈ a + b·x + c·y (x, y local east/north km), so ∂f/∂x = b and ∂f/∂y = c. For exactly three stations it
 * equals the triangle (line-integral) method of Bellamy (1949); Davies-Jones (1993) shows the methods agree
 * for three stations and that the least-squares fit generalises them; Spencer & Doswell (2001) compare them.
 */

export interface PlaneGradient {
  /** Value of the plane at the centroid of the stations used. */
  mean: number;
  /** ∂f/∂x, ∂f/∂y in units of f per km. */
  dfdxPerKm: number;
  dfdyPerKm: number;
  /** Stations used (finite values). */
  n: number;
}

/**
 * Least-squares plane gradient over the stations with a finite value (x, y centred on their centroid for
 * conditioning). NaN gradient with fewer than 3 stations or collinear ones.
 * Source: normal equations of the plane fit (Davies-Jones1993); Bellamy1949 for n = 3.
 * @example planeGradient([0, 100, 30], [0, 10, 90], [20, 16.7, 14.6]).dfdxPerKm // −0.03 (°C/km)
 */
export function planeGradient(xKm: ArrayLike<number>, yKm: ArrayLike<number>, f: ArrayLike<number>): PlaneGradient {
  let n = 0, mx = 0, my = 0, mf = 0;
  for (let i = 0; i < f.length; i++) {
    if (!Number.isFinite(f[i]!)) continue;
    n++;
    mx += xKm[i]!;
    my += yKm[i]!;
    mf += f[i]!;
  }
  if (n < 3) return { mean: n ? mf / n : NaN, dfdxPerKm: NaN, dfdyPerKm: NaN, n };
  mx /= n;
  my /= n;
  mf /= n;
  let sxx = 0, sxy = 0, syy = 0, sxf = 0, syf = 0;
  for (let i = 0; i < f.length; i++) {
    if (!Number.isFinite(f[i]!)) continue;
    const dx = xKm[i]! - mx, dy = yKm[i]! - my, df = f[i]! - mf;
    sxx += dx * dx;
    sxy += dx * dy;
    syy += dy * dy;
    sxf += dx * df;
    syf += dy * df;
  }
  const det = sxx * syy - sxy * sxy;
  if (!(Math.abs(det) > 1e-9 * (sxx + syy) * (sxx + syy))) return { mean: mf, dfdxPerKm: NaN, dfdyPerKm: NaN, n };
  return { mean: mf, dfdxPerKm: (sxf * syy - syf * sxy) / det, dfdyPerKm: (syf * sxx - sxf * sxy) / det, n };
}
