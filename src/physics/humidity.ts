/**
 * Moisture variables of moist air: mixing ratio, specific humidity, vapour pressure, virtual temperature.
 *
 * References:
 * - WallaceHobbs2006: Wallace, J. M., and P. V. Hobbs, 2006: Atmospheric Science, 2nd ed., ch. 3
 *   (r = ε e/(p − e); T_v = T (r + ε)/(ε (1 + r)); equation numbers from memory: 3.62–3.63 and 3.59).
 * - WMO8-2008: WMO-No. 8 (2008) Annex 4.A (eq. 4.A.16, w = ε w_s U/(ε + w_s(1 − U)), equivalent to e = U e_s).
 */
import { EPSILON, ZERO_CELSIUS_K } from './constants.js';
import { MAGNUS_BOLTON1980, type MagnusCoefficients, saturationVaporPressureMagnusHpa } from './vapor.js';

/**
 * Mixing ratio r = ε e/(p − e) (WallaceHobbs2006 ch. 3).
 * Units: e, p in hPa → kg/kg. e ≥ p, e < 0 or NaN → NaN.
 * @example mixingRatio(25, 1000) // ≈ 0.0159476131
 */
export function mixingRatio(eHpa: number, pHpa: number, epsilon: number = EPSILON): number {
  if (!(eHpa >= 0 && eHpa < pHpa)) return NaN;
  return (epsilon * eHpa) / (pHpa - eHpa);
}

/**
 * Mixing ratio from dew point and pressure: r = ε e_s(Td)/(p − e_s(Td)) (Magnus, Bolton1980 eq. 10 by default).
 * Units: °C, hPa → kg/kg. NaN in → NaN out.
 * @example mixingRatioFromDewpoint(18, 850) // ≈ 0.01546755
 */
export function mixingRatioFromDewpoint(tdC: number, pHpa: number, k: MagnusCoefficients = MAGNUS_BOLTON1980): number {
  return mixingRatio(saturationVaporPressureMagnusHpa(tdC, k), pHpa);
}

/**
 * Mixing ratio from temperature, relative humidity (fraction) and pressure, WMO8-2008 eq. 4.A.16
 * (w = ε w_s U/(ε + w_s (1 − U)), which equals ε U e_s/(p − U e_s)).
 * Units: °C, fraction, hPa → kg/kg. NaN in → NaN out.
 * @example mixingRatioFromRelativeHumidity(28.1, 0.65, 1000) // ≈ 0.0157646969
 */
export function mixingRatioFromRelativeHumidity(tC: number, rh: number, pHpa: number, k: MagnusCoefficients = MAGNUS_BOLTON1980): number {
  if (!(rh >= 0)) return NaN;
  return mixingRatio(rh * saturationVaporPressureMagnusHpa(tC, k), pHpa);
}

/**
 * Vapour pressure from mixing ratio: e = p r/(r + ε) (inverse of r = ε e/(p − e)).
 * Units: hPa, kg/kg → hPa. r < 0 or NaN → NaN.
 * @example vaporPressureFromMixingRatio(0.018, 988) // ≈ 27.789371
 */
export function vaporPressureFromMixingRatio(r: number, pHpa: number, epsilon: number = EPSILON): number {
  if (!(r >= 0)) return NaN;
  return (pHpa * r) / (r + epsilon);
}

/**
 * Specific humidity from mixing ratio: q = r/(1 + r) (definition). Units: kg/kg → kg/kg. NaN → NaN.
 * @example specificHumidityFromMixingRatio(0.01) // ≈ 0.00990099
 */
export function specificHumidityFromMixingRatio(r: number): number {
  return r / (1 + r);
}

/**
 * Mixing ratio from specific humidity: r = q/(1 − q) (definition). Units: kg/kg → kg/kg. q ≥ 1 or NaN → NaN.
 * @example mixingRatioFromSpecificHumidity(0.00990099) // ≈ 0.01
 */
export function mixingRatioFromSpecificHumidity(q: number): number {
  if (!(q < 1)) return NaN;
  return q / (1 - q);
}

/**
 * Virtual temperature T_v = T (r + ε)/(ε (1 + r)) (WallaceHobbs2006 ch. 3; ≈ T (1 + 0.61 r)).
 * Units: T in °C, r in kg/kg → K (note: Kelvin out). NaN in → NaN out.
 * @example virtualTemperatureK(25, 0.015) // ≈ 300.853
 */
export function virtualTemperatureK(tC: number, r: number, epsilon: number = EPSILON): number {
  return ((tC + ZERO_CELSIUS_K) * (r + epsilon)) / (epsilon * (1 + r));
}

/**
 * Virtual temperature from temperature, dew point and pressure (mixing ratio via Bolton1980 eq. 10).
 * Units: °C, °C, hPa → K. NaN in → NaN out.
 * @example virtualTemperatureFromDewpointK(25, 18, 980) // ≈ 300.58
 */
export function virtualTemperatureFromDewpointK(tC: number, tdC: number, pHpa: number): number {
  return virtualTemperatureK(tC, mixingRatioFromDewpoint(tdC, pHpa));
}
