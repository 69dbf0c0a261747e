/**
 * Horizontal gradient of a field observed at irregularly placed stations: the least-squares plane
 * f ≈ a + b·x + c·y (x, y local east/north km), so ∂f/∂x = b and ∂f/∂y = c. For exactly three stations it
 * equals the triangle (line-integral) method of Bellamy (1949); Davies-Jones (1993) shows the methods agree
 * for three stations and that the least-squares fit generalises them; Spencer & Doswell (2001) compare them.
 */
import { leastSquaresPlane } from './leastSquaresPlane.js';

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
 * Least-squares plane gradient over the stations with a finite value, by `leastSquaresPlane` (x, y centred on
 * their centroid for conditioning; its missing-value and collinearity rules). NaN gradient with fewer than 3
 * stations or (nearly) collinear ones.
 * Source: normal equations of the plane fit (Davies-Jones1993); Bellamy1949 for n = 3.
 * @example planeGradient([0, 100, 30], [0, 10, 90], [20, 16.7, 14.6]).dfdxPerKm // −0.03 (°C/km)
 */
export function planeGradient(xKm: ArrayLike<number>, yKm: ArrayLike<number>, f: ArrayLike<number>): PlaneGradient {
  const p = leastSquaresPlane(xKm, yKm, f);
  return { mean: p.mean, dfdxPerKm: p.dfdx, dfdyPerKm: p.dfdy, n: p.n };
}
