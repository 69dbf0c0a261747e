/**
 * Saturation vapour pressure over liquid water and over ice.
 *
 * References:
 * - Bolton1980: Bolton, D., 1980: The computation of equivalent potential temperature.
 *   Mon. Wea. Rev. 108, 1046–1053.
 * - AlduchovEskridge1996: Alduchov, O. A., and R. E. Eskridge, 1996: Improved Magnus form approximation of
 *   saturation vapor pressure. J. Appl. Meteor. 35, 601–609 (eq. 21, "AERK", over water).
 * - WMO8-2008: WMO-No. 8, Guide to Meteorological Instruments and Methods of Observation, 7th ed. (2008),
 *   Part I Ch. 4 Annex 4.B (Sonntag 1990 coefficients).
 * - MurphyKoop2005: Murphy, D. M., and T. Koop, 2005: Review of the vapour pressures of ice and supercooled
 *   water for atmospheric applications. Q. J. R. Meteorol. Soc. 131, 1539–1565 (eq. 7 ice, eq. 10 liquid).
 */
import { ZERO_CELSIUS_K } from './constants.js';

/** Magnus-form coefficients: e_s(t) = A exp(B t / (C + t)), t in °C, e_s in hPa. */
export interface MagnusCoefficients {
  /** hPa */
  readonly a: number;
  /** dimensionless */
  readonly b: number;
  /** °C */
  readonly c: number;
  /** Citation key + equation, for messages and docs. */
  readonly source: string;
}

/** Bolton1980 eq. 10: A = 6.112 hPa, B = 17.67, C = 243.5 °C (accuracy 0.1 % for −35…35 °C, from memory). */
export const MAGNUS_BOLTON1980: MagnusCoefficients = Object.freeze({ a: 6.112, b: 17.67, c: 243.5, source: 'Bolton1980 eq. 10' });
/** AlduchovEskridge1996 eq. 21 ("AERK", over water): A = 6.1094 hPa, B = 17.625, C = 243.04 °C. */
export const MAGNUS_AERK1996: MagnusCoefficients = Object.freeze({ a: 6.1094, b: 17.625, c: 243.04, source: 'AlduchovEskridge1996 eq. 21' });
/** WMO8-2008 Annex 4.B over water (−45…60 °C): A = 6.112 hPa, B = 17.62, C = 243.12 °C. */
export const MAGNUS_WMO2008: MagnusCoefficients = Object.freeze({ a: 6.112, b: 17.62, c: 243.12, source: 'WMO-No. 8 (2008) Annex 4.B' });
/** WMO8-2008 Annex 4.B over ice (−65…0.01 °C): A = 6.112 hPa, B = 22.46, C = 272.62 °C. */
export const MAGNUS_WMO2008_ICE: MagnusCoefficients = Object.freeze({ a: 6.112, b: 22.46, c: 272.62, source: 'WMO-No. 8 (2008) Annex 4.B (ice)' });

/**
 * Saturation vapour pressure, Magnus form with any coefficient set.
 * e_s = A exp(B t / (C + t)).
 * Units: t in °C → hPa. NaN in → NaN out. Valid range: that of the coefficient set.
 * @example saturationVaporPressureMagnusHpa(20, MAGNUS_AERK1996) // ≈ 23.3344
 */
export function saturationVaporPressureMagnusHpa(tC: number, k: MagnusCoefficients = MAGNUS_BOLTON1980): number {
  return k.a * Math.exp((k.b * tC) / (k.c + tC));
}

/**
 * Saturation vapour pressure over liquid water, Bolton1980 eq. 10:
 * e_s = 6.112 exp(17.67 t / (t + 243.5)).
 * Units: t in °C → hPa. Validity: about −35…35 °C to 0.1 % (Bolton's statement, from memory);
 * below 0 °C this is over supercooled water. NaN in → NaN out.
 * @example saturationVaporPressureHpa(25) // ≈ 31.6742944
 */
export function saturationVaporPressureHpa(tC: number): number {
  return 6.112 * Math.exp((17.67 * tC) / (tC + 243.5));
}

/**
 * Saturation vapour pressure over liquid water with the AlduchovEskridge1996 eq. 21 (AERK) coefficients:
 * e_s = 6.1094 exp(17.625 t / (t + 243.04)).
 * Units: t in °C → hPa. Validity: −40…50 °C (the fit range of the paper, from memory). NaN in → NaN out.
 * @example saturationVaporPressureAerkHpa(0) // 6.1094
 */
export function saturationVaporPressureAerkHpa(tC: number): number {
  return 6.1094 * Math.exp((17.625 * tC) / (tC + 243.04));
}

/**
 * Saturation vapour pressure over plane ice, MurphyKoop2005 eq. 7:
 * ln e_i = 9.550426 − 5723.265/T + 3.53068 ln T − 0.00728332 T  (e_i in Pa, T in K).
 * Units: t in °C → hPa. Validity: T > 110 K, up to the triple point 273.16 K (returns the formula value
 * above 0.01 °C too, where ice is not stable; callers decide). NaN in → NaN out.
 * @example saturationVaporPressureIceHpa(-10) // ≈ 2.5987
 */
export function saturationVaporPressureIceHpa(tC: number): number {
  const t = tC + ZERO_CELSIUS_K;
  return Math.exp(9.550426 - 5723.265 / t + 3.53068 * Math.log(t) - 0.00728332 * t) / 100;
}

/**
 * Saturation vapour pressure over liquid (incl. supercooled) water, MurphyKoop2005 eq. 10:
 * ln e_w = 54.842763 − 6763.22/T − 4.21 ln T + 0.000367 T
 *          + tanh[0.0415 (T − 218.8)] (53.878 − 1331.22/T − 9.44523 ln T + 0.014025 T)  (Pa, K).
 * A reference formulation used to size the error of the Magnus forms.
 * Units: t in °C → hPa. Validity: 123–332 K. NaN in → NaN out.
 * @example saturationVaporPressureMurphyKoopHpa(0.01) // ≈ 6.11657 (triple point)
 */
export function saturationVaporPressureMurphyKoopHpa(tC: number): number {
  const t = tC + ZERO_CELSIUS_K;
  const lnT = Math.log(t);
  const lnE =
    54.842763 - 6763.22 / t - 4.21 * lnT + 0.000367 * t +
    Math.tanh(0.0415 * (t - 218.8)) * (53.878 - 1331.22 / t - 9.44523 * lnT + 0.014025 * t);
  return Math.exp(lnE) / 100;
}
