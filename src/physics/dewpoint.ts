/**
 * Dew point, relative humidity and vapour pressure, by inverting the Magnus form
 * (default coefficients Bolton1980 eq. 10; AlduchovEskridge1996 and WMO-No. 8 sets available).
 * Relative humidity is the WMO vapour-pressure ratio RH = e(Td)/e_s(T), as a fraction 0…1.
 */
import { MAGNUS_BOLTON1980, type MagnusCoefficients, saturationVaporPressureMagnusHpa } from './vapor.js';

/**
 * Vapour pressure from dew point: e = e_s(Td) (definition of the dew point; Magnus form, Bolton1980 eq. 10 by default).
 * Units: Td in °C → hPa. NaN in → NaN out.
 * @example vaporPressureFromDewpointHpa(12) // ≈ 14.0158
 */
export function vaporPressureFromDewpointHpa(tdC: number, k: MagnusCoefficients = MAGNUS_BOLTON1980): number {
  return saturationVaporPressureMagnusHpa(tdC, k);
}

/**
 * Dew point from vapour pressure, algebraic inverse of the Magnus form:
 * Td = C ln(e/A) / (B − ln(e/A)). With Bolton1980 coefficients this is the inverse of eq. 10
 * (Bolton1980 eq. 11 is the same inverse with rounded constants).
 * Units: e in hPa → °C. e ≤ 0 or NaN → NaN.
 * @example dewpointFromVaporPressure(22) // ≈ 19.0291018
 */
export function dewpointFromVaporPressure(eHpa: number, k: MagnusCoefficients = MAGNUS_BOLTON1980): number {
  if (!(eHpa > 0)) return NaN;
  const g = Math.log(eHpa / k.a);
  return (k.c * g) / (k.b - g);
}

/**
 * Dew point from temperature and relative humidity (fraction), inverse Magnus:
 * γ = ln(RH) + B t/(C + t), Td = C γ / (B − γ).
 * Units: t in °C, RH as a fraction (0, 1] (values above 1, supersaturation, are accepted) → °C.
 * RH ≤ 0 or NaN → NaN.
 * @example dewpointFromRelativeHumidity(20, 0.5) // ≈ 9.2701
 */
export function dewpointFromRelativeHumidity(tC: number, rh: number, k: MagnusCoefficients = MAGNUS_BOLTON1980): number {
  if (!(rh > 0)) return NaN;
  const g = Math.log(rh) + (k.b * tC) / (k.c + tC);
  return (k.c * g) / (k.b - g);
}

/**
 * Relative humidity (fraction) from temperature and dew point: RH = e_s(Td)/e_s(T) (WMO definition by
 * vapour pressure; Magnus form, Bolton1980 eq. 10 by default).
 * Units: °C, °C → fraction (1 at Td = T; > 1 if Td > T, not clipped). NaN in → NaN out.
 * @example relativeHumidityFromDewpoint(25, 12) // ≈ 0.442484765
 */
export function relativeHumidityFromDewpoint(tC: number, tdC: number, k: MagnusCoefficients = MAGNUS_BOLTON1980): number {
  return Math.exp((k.b * tdC) / (k.c + tdC) - (k.b * tC) / (k.c + tC));
}
