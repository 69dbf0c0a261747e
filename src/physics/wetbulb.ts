/**
 * Wet-bulb temperature: Stull (2011) empirical formula and an iterative psychrometric solution.
 *
 * References:
 * - Stull2011: Stull, R., 2011: Wet-bulb temperature from relative humidity and air temperature.
 *   J. Appl. Meteor. Climatol. 50, 2267–2269, doi:10.1175/JAMC-D-11-0143.1 (eq. 1).
 * - WMO8-2008: WMO-No. 8 (2008) Part I Ch. 4 Annex 4.B psychrometer formula
 *   e = e_w(t_w) − 6.53e-4 (1 + 0.000944 t_w) p (t − t_w) (Assmann psychrometer; coefficients from memory).
 */
import { dewpointFromRelativeHumidity } from './dewpoint.js';
import { saturationVaporPressureHpa } from './vapor.js';

/**
 * Wet-bulb temperature, Stull2011 eq. 1 (fit at 1013.25 hPa):
 * T_w = T atan[0.151977 (RH% + 8.313659)^½] + atan(T + RH%) − atan(RH% − 1.676331)
 *       + 0.00391838 (RH%)^{3/2} atan(0.023101 RH%) − 4.686035   (atan in radians).
 * Validity (Stull2011 abstract): RH 5–99 %, T −20…50 °C, except where both humidity and temperature are low;
 * errors −1 … +0.65 °C, mean absolute error < 0.3 °C. Outside the range the formula is still evaluated
 * (no clipping) — callers check. Units: T in °C, RH in **percent** → °C. NaN in → NaN out.
 * @example wetBulbStull2011C(20, 50) // ≈ 13.70
 */
export function wetBulbStull2011C(tC: number, rhPercent: number): number {
  const rh = rhPercent;
  return (
    tC * Math.atan(0.151977 * Math.sqrt(rh + 8.313659)) +
    Math.atan(tC + rh) -
    Math.atan(rh - 1.676331) +
    0.00391838 * Math.pow(rh, 1.5) * Math.atan(0.023101 * rh) -
    4.686035
  );
}

/** Psychrometer coefficient A(t_w) in K⁻¹ for e = e_s(t_w) − A p (t − t_w). */
export type PsychrometerCoefficient = (twC: number) => number;

/** WMO8-2008 Annex 4.B, ventilated (Assmann) psychrometer, wet bulb (not iced): 6.53e-4 (1 + 0.000944 t_w) K⁻¹ (from memory). */
export const PSYCHROMETER_WMO: PsychrometerCoefficient = (tw) => 6.53e-4 * (1 + 0.000944 * tw);

/**
 * Wet-bulb temperature by solving the psychrometer equation e = e_s(T_w) − A(T_w) p (T − T_w) for T_w,
 * with e = e_s(Td) and e_s from Bolton1980 eq. 10 (over water, also below 0 °C), A from WMO8-2008 Annex 4.B
 * by default. Bisection on [Td, T] to 1e-9 °C (the residual is monotonic there).
 * Units: °C, °C, hPa → °C. NaN in → NaN; Td > T (supersaturation) → NaN; p ≤ 0 → NaN.
 * @example wetBulbPsychrometricC(20, 9.2701, 1013.25) // ≈ 13.8
 */
export function wetBulbPsychrometricC(tC: number, tdC: number, pHpa: number, coefficient: PsychrometerCoefficient = PSYCHROMETER_WMO): number {
  if (!(tdC <= tC) || !(pHpa > 0)) return NaN;
  const e = saturationVaporPressureHpa(tdC);
  let lo = tdC;
  let hi = tC;
  for (let i = 0; i < 200 && hi - lo > 1e-9; i++) {
    const mid = 0.5 * (lo + hi);
    const f = saturationVaporPressureHpa(mid) - coefficient(mid) * pHpa * (tC - mid) - e;
    if (f > 0) hi = mid;
    else lo = mid;
  }
  return 0.5 * (lo + hi);
}

/**
 * Wet-bulb temperature from T and relative humidity (fraction) by the psychrometric solution:
 * Td from RH (Bolton1980 eq. 10 inverse), then {@link wetBulbPsychrometricC}.
 * Units: °C, fraction, hPa → °C. NaN in → NaN out.
 * @example wetBulbFromRelativeHumidityC(20, 0.5, 1013.25) // ≈ 13.8
 */
export function wetBulbFromRelativeHumidityC(tC: number, rh: number, pHpa: number, coefficient: PsychrometerCoefficient = PSYCHROMETER_WMO): number {
  return wetBulbPsychrometricC(tC, Math.min(dewpointFromRelativeHumidity(tC, rh), tC), pHpa, coefficient);
}
