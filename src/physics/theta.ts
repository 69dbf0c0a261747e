/**
 * Potential temperature, lifting-condensation-level temperature and equivalent potential temperature.
 *
 * References:
 * - Bolton1980: Bolton, D., 1980: The computation of equivalent potential temperature. Mon. Wea. Rev. 108,
 *   1046–1053 — eq. 15 (T_L from dew point, p. 1048), eq. 21 (T_L from e), eq. 22 (T_L from RH),
 *   eq. 24 (θ_DL), eq. 39 (θ_E, most accurate non-iterative form per DaviesJones2009), eq. 43 (θ_E).
 *   Numbers 21 and 22 are from memory.
 * - DaviesJones2009: Davies-Jones, R., 2009: On formulas for equivalent potential temperature.
 *   Mon. Wea. Rev. 137, 3137–3148 (from memory for pages).
 * - Poisson equation θ = T (p0/p)^κ with κ = R_d/c_p (any thermodynamics text, e.g. WallaceHobbs2006 ch. 3).
 */
import { KAPPA, ZERO_CELSIUS_K } from './constants.js';
import { mixingRatio } from './humidity.js';
import { saturationVaporPressureHpa } from './vapor.js';

/**
 * Potential temperature, Poisson: θ = T (1000/p)^κ, κ = R_d/c_p = 2/7 by default.
 * Units: T in °C, p in hPa → K. p ≤ 0 or NaN → NaN.
 * @example potentialTemperatureK(-0.15, 800) // ≈ 290.972015 (273 K at 800 hPa)
 */
export function potentialTemperatureK(tC: number, pHpa: number, kappa: number = KAPPA): number {
  if (!(pHpa > 0)) return NaN;
  return (tC + ZERO_CELSIUS_K) * Math.pow(1000 / pHpa, kappa);
}

/**
 * Temperature at the lifting condensation level from T and dew point, Bolton1980 eq. 15:
 * T_L = 1/(1/(T_D − 56) + ln(T_K/T_D)/800) + 56 (K).
 * Units: °C, °C → K. NaN in → NaN out. Bolton states about 0.1 K accuracy (from memory).
 * @example lclTemperatureK(20, 18) // ≈ 290.67777
 */
export function lclTemperatureK(tC: number, tdC: number): number {
  const tk = tC + ZERO_CELSIUS_K;
  const tdk = tdC + ZERO_CELSIUS_K;
  return 1 / (1 / (tdk - 56) + Math.log(tk / tdk) / 800) + 56;
}

/**
 * LCL temperature from T and vapour pressure, Bolton1980 eq. 21 (number from memory):
 * T_L = 2840/(3.5 ln T_K − ln e − 4.805) + 55 (K), e in hPa.
 * Units: °C, hPa → K. e ≤ 0 or NaN → NaN.
 * @example lclTemperatureFromVaporPressureK(20, 20.6) // ≈ 290.7
 */
export function lclTemperatureFromVaporPressureK(tC: number, eHpa: number): number {
  if (!(eHpa > 0)) return NaN;
  const tk = tC + ZERO_CELSIUS_K;
  return 2840 / (3.5 * Math.log(tk) - Math.log(eHpa) - 4.805) + 55;
}

/**
 * LCL temperature from T and relative humidity, Bolton1980 eq. 22 (number from memory):
 * T_L = 1/(1/(T_K − 55) − ln(U/100)/2840) + 55 (K), U in %.
 * Units: °C, RH as a fraction (0, 1] → K. RH ≤ 0 or NaN → NaN.
 * @example lclTemperatureFromRelativeHumidityK(20, 0.8825) // ≈ 290.7
 */
export function lclTemperatureFromRelativeHumidityK(tC: number, rh: number): number {
  if (!(rh > 0)) return NaN;
  const tk = tC + ZERO_CELSIUS_K;
  return 1 / (1 / (tk - 55) - Math.log(rh) / 2840) + 55;
}

/**
 * Equivalent potential temperature, Bolton1980 eq. 39 with eq. 24 and eq. 15 (the form MetPy implements):
 * θ_DL = T_K (1000/(p − e))^κ (T_K/T_L)^(0.28 r),  θ_E = θ_DL exp[(3036/T_L − 1.78) r (1 + 0.448 r)],
 * r in kg/kg from e = e_s(Td) (Bolton1980 eq. 10), κ = 2/7.
 * Units: °C, °C, hPa → K. NaN in → NaN out; e ≥ p → NaN.
 * @example equivalentPotentialTemperatureK(20, 18, 850) // ≈ 353.937994
 */
export function equivalentPotentialTemperatureK(tC: number, tdC: number, pHpa: number, kappa: number = KAPPA): number {
  const tk = tC + ZERO_CELSIUS_K;
  const e = saturationVaporPressureHpa(tdC);
  const r = mixingRatio(e, pHpa);
  const tl = lclTemperatureK(tC, tdC);
  const thetaDL = tk * Math.pow(1000 / (pHpa - e), kappa) * Math.pow(tk / tl, 0.28 * r);
  return thetaDL * Math.exp((3036 / tl - 1.78) * r * (1 + 0.448 * r));
}

/**
 * Equivalent potential temperature, Bolton1980 eq. 43:
 * θ_E = T_K (1000/p)^(0.2854 (1 − 0.28e-3 r)) exp[(3.376/T_L − 0.00254) r (1 + 0.81e-3 r)], r in g/kg,
 * T_L from eq. 15, e from eq. 10, r = ε e/(p − e) with the classic ε = 0.622 by default.
 * Within about 0.05 K of eq. 39 at surface conditions.
 * Units: °C, °C, hPa → K. NaN in → NaN out.
 * @example equivalentPotentialTemperatureBolton43K(20, 18, 850) // ≈ 353.8917
 */
export function equivalentPotentialTemperatureBolton43K(tC: number, tdC: number, pHpa: number, epsilon = 0.622): number {
  const tk = tC + ZERO_CELSIUS_K;
  const r = 1000 * mixingRatio(saturationVaporPressureHpa(tdC), pHpa, epsilon);
  const tl = lclTemperatureK(tC, tdC);
  return tk * Math.pow(1000 / pHpa, 0.2854 * (1 - 0.28e-3 * r)) * Math.exp((3.376 / tl - 0.00254) * r * (1 + 0.81e-3 * r));
}

/**
 * θ_E series (Bolton1980 eq. 39, as {@link equivalentPotentialTemperatureK}) over typed arrays.
 * NaN propagates element-wise. Inputs are not mutated. Throws RangeError on length mismatch.
 * Units: °C, °C, hPa → K.
 * @example thetaESeries([20], [18], [850]) // Float64Array [≈353.938]
 */
export function thetaESeries(
  tC: ArrayLike<number>,
  tdC: ArrayLike<number>,
  pHpa: ArrayLike<number>,
  out?: Float64Array,
): Float64Array {
  const n = tC.length;
  if (tdC.length !== n || pHpa.length !== n) throw new RangeError('thetaESeries requires arrays of equal length');
  if (out !== undefined && out.length !== n) throw new RangeError('thetaESeries output array has the wrong length');
  const res = out ?? new Float64Array(n);
  for (let i = 0; i < n; i++) res[i] = equivalentPotentialTemperatureK(tC[i]!, tdC[i]!, pHpa[i]!);
  return res;
}
