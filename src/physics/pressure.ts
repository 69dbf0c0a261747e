/**
 * Station pressure, altimeter setting, sea-level pressure, pressure tendency.
 *
 * References:
 * - Smithsonian1951: List, R. J., 1951: Smithsonian Meteorological Tables, 6th rev. ed., p. 269, eqs. 1 and 3
 *   (altimeter setting A = (p − 0.3) [1 + (p0^n a/T0) H/(p − 0.3)^n]^(1/n), n = a R_d/g = 0.190284,
 *   p0 = 1013.25 hPa, a = 0.0065 K/m, T0 = 288 K, H station elevation in m), the formula of the
 *   NWS "altimeter setting" calculator (wxcalc `altimeterSetting.pdf`) and of MetPy `altimeter_to_station_pressure`.
 * - WMO306-0200: WMO-No. 306, Manual on Codes, code table 0200 (characteristic of pressure tendency, a).
 * - FMH1: Federal Meteorological Handbook No. 1, ch. 12 remarks (`5appp` 3-hourly pressure tendency,
 *   ppp in tenths of hPa).
 * - Hypsometric reduction: p0 = p exp(g0 H / (R_d T_mv)) with T_mv the mean (virtual) temperature of a fictitious
 *   column below the station; T_mv = T_s + a H/2 (+ C_h e) with a = 6.5 K/km — the form documented by the
 *   DWD (VuB 2 BUFR, p. 28; C_h = 0.12 K/hPa) and used in the US with T_s the mean of the current and 12-h-old
 *   temperatures (WMO-No. 8 Part I Ch. 3 discusses the reduction; its exact equation number is not cited here).
 */
import { G0, HPA_PER_INHG, MS_PER_HOUR, RD, STANDARD_PRESSURE_HPA, ZERO_CELSIUS_K } from './constants.js';

/**
 * Inches of mercury to hPa (conventional inch of mercury, 33.8638864 hPa; NIST SP 811 App. B.8).
 * NaN → NaN. @example inHgToHpa(29.92) // ≈ 1013.2075
 */
export function inHgToHpa(inHg: number): number {
  return inHg * HPA_PER_INHG;
}

/** hPa to inches of mercury (inverse of {@link inHgToHpa}). NaN → NaN. @example hpaToInHg(1013.25) // ≈ 29.92126 */
export function hpaToInHg(hpa: number): number {
  return hpa / HPA_PER_INHG;
}

/** Smithsonian1951 exponent n = a R_d / g as printed (0.190284; 1/n = 5.2553). */
export const ALTIMETER_EXPONENT = 0.190284;
/** Smithsonian1951 lapse rate a, K/m, and sea-level temperature T0 = 288 K (not 288.15) of the altimeter formula. */
export const ALTIMETER_LAPSE_K_PER_M = 0.0065;
export const ALTIMETER_T0_K = 288;
/** Derived constant p0^n a / T0 ≈ 8.4228807e-5 hPa^n m⁻¹ (Smithsonian1951 eq. 3). */
export const ALTIMETER_K = (Math.pow(STANDARD_PRESSURE_HPA, ALTIMETER_EXPONENT) * ALTIMETER_LAPSE_K_PER_M) / ALTIMETER_T0_K;

/**
 * Altimeter setting from station pressure, Smithsonian1951 p. 269 eqs. 1 and 3 (the NWS formula):
 * A = ((p − 0.3)^n + K H)^(1/n), n = 0.190284, K = p0^n a/T0 ≈ 8.4228807e-5.
 * Units: p in hPa, H (station elevation) in m → hPa. p ≤ 0.3 hPa or NaN → NaN.
 * US reports round the result *down* to 0.01 inHg (AFMAN 15-111 §13.4); this returns the unrounded value.
 * @example altimeterFromStationPressureHpa(1000, 300) // ≈ 1035.8822
 */
export function altimeterFromStationPressureHpa(stationHpa: number, elevationM: number): number {
  if (!(stationHpa > 0.3)) return NaN;
  return Math.pow(Math.pow(stationHpa - 0.3, ALTIMETER_EXPONENT) + ALTIMETER_K * elevationM, 1 / ALTIMETER_EXPONENT);
}

/**
 * Station pressure from altimeter setting, inverse of Smithsonian1951 eqs. 1 and 3:
 * p = (A^n − K H)^(1/n) + 0.3.
 * Units: A in hPa, H in m → hPa. NaN in or A^n ≤ K H → NaN.
 * @example stationPressureFromAltimeterHpa(inHgToHpa(30.00), 305) // ≈ 980.017
 */
export function stationPressureFromAltimeterHpa(altimeterHpa: number, elevationM: number): number {
  const base = Math.pow(altimeterHpa, ALTIMETER_EXPONENT) - ALTIMETER_K * elevationM;
  if (!(base > 0)) return NaN;
  return Math.pow(base, 1 / ALTIMETER_EXPONENT) + 0.3;
}

/**
 * Sea-level pressure by the hypsometric equation over a fictitious column from the station down to sea level:
 * p0 = p exp(g0 H / (R_d T_mv)),  T_mv = T_s + 273.15 + a H/2 + C_h e,
 * a = 0.0065 K/m (standard lapse rate), C_h = 0.12 K/hPa (humidity term, DWD VuB 2 form; pass e = 0 for a dry column).
 * Assumption: the column's mean virtual temperature is the station temperature extrapolated down at the standard
 * lapse rate, evaluated at mid-column. Pass as `temperatureC` the mean of the current and 12-h-old temperatures to
 * follow US practice. No plateau correction, so values at high, cold stations differ from official SLP.
 * Units: hPa, m, °C, hPa → hPa. NaN in → NaN.
 * @example seaLevelPressureHpa(898.7456, 1000, 8.5) // ≈ 1013.2 (ISA at 1000 m)
 */
export function seaLevelPressureHpa(stationHpa: number, elevationM: number, temperatureC: number, vaporPressureHpa = 0): number {
  const tmv = temperatureC + ZERO_CELSIUS_K + (0.0065 * elevationM) / 2 + 0.12 * vaporPressureHpa;
  return stationHpa * Math.exp((G0 * elevationM) / (RD * tmv));
}

/** Index of the last element of sorted `t` with t[i] ≤ x, or −1. */
function lastAtOrBefore(t: ArrayLike<number>, x: number): number {
  let lo = 0;
  let hi = t.length - 1;
  let ans = -1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    if (t[mid]! <= x) {
      ans = mid;
      lo = mid + 1;
    } else hi = mid - 1;
  }
  return ans;
}

/**
 * Pressure change over a window on an irregular time series: out[i] = p[i] − p[j], where j is the report whose
 * time is closest to t[i] − window among reports with a finite pressure, accepted only if
 * |t[j] − (t[i] − window)| ≤ tolerance; NaN otherwise (and NaN where p[i] is NaN).
 * Ties (two reports equally close) take the earlier one. Time must be sorted ascending (not checked per element;
 * unsorted input gives undefined results). Use window 1 h or 3 h (the 3-h value is the `5appp` tendency).
 * Default tolerance: window/6 (10 min for 1 h, 30 min for 3 h) — common practice, no source.
 * Throws RangeError on length mismatch or non-positive window. Units: ms, hPa → hPa.
 * @example pressureTendencySeries([0, 3600e3], [1010, 1011.5], 3600e3) // Float64Array [NaN, 1.5]
 */
export function pressureTendencySeries(
  timeMs: ArrayLike<number>,
  pHpa: ArrayLike<number>,
  windowMs: number,
  toleranceMs: number = windowMs / 6,
): Float64Array {
  const n = timeMs.length;
  if (pHpa.length !== n) throw new RangeError('pressureTendencySeries requires timeMs and pHpa of equal length');
  if (!(windowMs > 0)) throw new RangeError('pressureTendencySeries requires windowMs > 0');
  if (!(toleranceMs >= 0)) throw new RangeError('pressureTendencySeries requires toleranceMs ≥ 0');
  const out = new Float64Array(n).fill(NaN);
  for (let i = 0; i < n; i++) {
    const pi = pHpa[i]!;
    const ti = timeMs[i]!;
    if (Number.isNaN(pi) || Number.isNaN(ti)) continue;
    const target = ti - windowMs;
    let best = -1;
    let bestDist = Infinity;
    // walk outwards from the insertion point to the nearest finite pressure on each side
    let k = lastAtOrBefore(timeMs, target);
    for (let j = k; j >= 0; j--) {
      const d = target - timeMs[j]!;
      if (d > toleranceMs) break;
      if (!Number.isNaN(pHpa[j]!)) {
        best = j;
        bestDist = d;
        break;
      }
    }
    for (let j = k + 1; j < i; j++) {
      const d = timeMs[j]! - target;
      if (d > toleranceMs || d >= bestDist) break;
      if (!Number.isNaN(pHpa[j]!)) {
        best = j;
        bestDist = d;
        break;
      }
    }
    k = best;
    if (k >= 0 && k !== i) out[i] = pi - pHpa[k]!;
  }
  return out;
}

/**
 * WMO code table 0200 characteristic `a` of the 3-h pressure tendency from a trace of pressures (hPa), oldest first,
 * ideally equally spaced over the 3 h ending at the observation (e.g. hourly: 4 values).
 * Rules (our operationalisation of the table wording; thresholds are common practice, no source):
 * - Δ1 = p(mid) − p(first), Δ2 = p(last) − p(mid), net = p(last) − p(first); p(mid) is interpolated at the middle
 *   of the trace. A half is "rising" if Δ > s, "falling" if Δ < −s, else "steady"; s = `steadyHpa` (default 0.1).
 * - net within ±s ("same"): rising then falling → 0; falling then rising → 5; otherwise 4 (steady).
 * - net > s (higher): rising then falling → 0; rising then steady, or rising then rising at under half the rate → 1;
 *   falling or steady then rising, or rising then rising at over twice the rate → 3; otherwise → 2.
 * - net < −s (lower): falling then rising → 5; falling then steady, or falling then falling at under half the rate → 6;
 *   rising or steady then falling, or falling then falling at over twice the rate → 8; otherwise → 7.
 * NaN values are dropped; fewer than 2 finite values → NaN.
 * @example tendencyCharacteristic([1010, 1011, 1012, 1013]) // 2 (increasing steadily, higher)
 */
export function tendencyCharacteristic(values3h: readonly number[], steadyHpa = 0.1): number {
  const v = values3h.filter((x) => !Number.isNaN(x));
  if (v.length < 2) return NaN;
  const first = v[0]!;
  const last = v[v.length - 1]!;
  const midPos = (v.length - 1) / 2;
  const lo = Math.floor(midPos);
  const mid = v[lo]! + (midPos - lo) * ((v[Math.ceil(midPos)] ?? v[lo]!) - v[lo]!);
  const d1 = mid - first;
  const d2 = last - mid;
  const net = last - first;
  const s = steadyHpa;
  const sense = (d: number) => (d > s ? 1 : d < -s ? -1 : 0);
  const h1 = sense(d1);
  const h2 = sense(d2);
  if (Math.abs(net) <= s) {
    if (h1 > 0 && h2 < 0) return 0;
    if (h1 < 0 && h2 > 0) return 5;
    return 4;
  }
  if (net > 0) {
    if (h1 > 0 && h2 < 0) return 0;
    if (h1 > 0 && (h2 === 0 || (h2 > 0 && d2 < 0.5 * d1))) return 1;
    if (h1 <= 0 && h2 > 0) return 3;
    if (h1 > 0 && h2 > 0 && d2 > 2 * d1) return 3;
    return 2;
  }
  if (h1 < 0 && h2 > 0) return 5;
  if (h1 < 0 && (h2 === 0 || (h2 < 0 && -d2 < -0.5 * d1))) return 6;
  if (h1 >= 0 && h2 < 0) return 8;
  if (h1 < 0 && h2 < 0 && -d2 > -2 * d1) return 8;
  return 7;
}

/** Decoded `5appp` group. */
export interface PressureTendencyGroup {
  /** WMO code table 0200 characteristic, 0–8. */
  characteristic: number;
  /** Signed 3-h change, hPa (NaN when the sign is undetermined: a = 4 with ppp ≠ 000). */
  changeHpa: number;
}

/**
 * Signed 3-h pressure change from the `5appp` characteristic a and amount ppp (tenths of hPa), by WMO-No. 306
 * code table 0200 (WMO306-0200): a = 1, 2, 3 "higher than 3 h ago" → +ppp; a = 0 "same or higher" → +ppp;
 * a = 6, 7, 8 "lower" → −ppp; a = 5 "same or lower" → −ppp; a = 4 "steady, the same as 3 h ago" → 0.
 * A group with a = 4 and ppp ≠ 000 contradicts itself (the table says the pressure is the same, the amount says
 * it changed, and nothing gives the sign): the change is NaN, undefined, by the one missing-value rule.
 * ppp = 000 gives +0 for every a (never −0). NaN amount, or a outside 0–8, → NaN.
 * @example pressureChangeFromTendencyHpa(8, 33) // −3.3
 * @example pressureChangeFromTendencyHpa(4, 3) // NaN
 */
export function pressureChangeFromTendencyHpa(characteristic: number, amountTenthsHpa: number): number {
  if (!(characteristic >= 0 && characteristic <= 8) || Number.isNaN(amountTenthsHpa)) return NaN;
  const v = amountTenthsHpa / 10;
  if (v === 0) return 0;
  if (characteristic === 4) return NaN;
  return characteristic <= 3 ? v : -v;
}

/**
 * Decode a `5appp` pressure-tendency group (FMH1 ch. 12; WMO-No. 306 FM 12 section 1 group 5appp): a = code table
 * 0200 characteristic, ppp = amount in tenths of hPa, signed by {@link pressureChangeFromTendencyHpa}.
 * Returns null when the text is not `5` followed by a digit 0–8 and three digits.
 * @example decodePressureTendencyGroup('58033') // { characteristic: 8, changeHpa: -3.3 }
 */
export function decodePressureTendencyGroup(group: string): PressureTendencyGroup | null {
  const m = /^5([0-8])(\d{3})$/.exec(group.trim());
  if (m === null) return null;
  const a = Number(m[1]);
  return { characteristic: a, changeHpa: pressureChangeFromTendencyHpa(a, Number(m[2])) };
}

/** 1 h and 3 h in ms, for {@link pressureTendencySeries}. */
export const TENDENCY_WINDOW_1H_MS = MS_PER_HOUR;
export const TENDENCY_WINDOW_3H_MS = 3 * MS_PER_HOUR;
