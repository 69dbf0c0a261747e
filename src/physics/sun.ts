/**
 * Solar position, sunrise/sunset and daylight, after the NOAA Global Monitoring Laboratory solar calculator
 * equations, which implement the low-precision Sun of Meeus (Astronomical Algorithms, 2nd ed. 1998, ch. 25):
 * geometric mean longitude L0, mean anomaly M, equation of centre C, apparent longitude corrected for nutation
 * and aberration (−0.00569 − 0.00478 sin Ω), obliquity corrected by 0.00256 cos Ω, equation of time from
 * y = tan²(ε/2), refraction by the NOAA piecewise formula, sunrise/sunset at zenith 90.833°.
 * Accuracy (NOAA's statement, from memory): about 1 min for rise/set and 0.01° for position between ±72° latitude
 * for years 1800–2100. UT is used for dynamical time (ΔT ignored, ~70 s, negligible here).
 *
 * References:
 * - Meeus1998: Meeus, J., 1998: Astronomical Algorithms, 2nd ed., Willmann-Bell, ch. 25 (Example 25.a).
 * - NOAAsolar: NOAA GML Solar Calculator and its "NOAA_Solar_Calculations" spreadsheet (equations as above).
 */
import { MS_PER_DAY, MS_PER_HOUR, MS_PER_MINUTE } from './constants.js';

const DEG = Math.PI / 180;
/** Julian date of the Unix epoch 1970-01-01T00:00Z. */
const JD_UNIX_EPOCH = 2440587.5;
/** Standard zenith angle for sunrise/sunset (refraction 34′ + semi-diameter 16′), degrees. */
export const SUNRISE_ZENITH_DEG = 90.833;

/** Julian date from epoch ms (UTC). @example julianDate(Date.UTC(2000, 0, 1, 12)) // 2451545 */
export function julianDate(timeMs: number): number {
  return timeMs / MS_PER_DAY + JD_UNIX_EPOCH;
}

/** Apparent geocentric Sun coordinates and equation of time (Meeus1998 ch. 25 low precision, NOAAsolar). */
export interface SunEquatorial {
  /** Julian centuries since J2000.0. */
  julianCentury: number;
  /** True geometric longitude, degrees [0, 360). */
  trueLongitudeDeg: number;
  /** Apparent longitude, degrees. */
  apparentLongitudeDeg: number;
  /** Apparent right ascension, degrees [0, 360). */
  rightAscensionDeg: number;
  /** Apparent declination, degrees. */
  declinationDeg: number;
  /** Equation of time (apparent − mean solar time), minutes. */
  equationOfTimeMin: number;
}

/**
 * Apparent right ascension, declination and equation of time of the Sun at an instant.
 * Source: Meeus1998 ch. 25 (eqs. 25.2–25.8, low accuracy ~0.01°) as used by NOAAsolar; equation of time per NOAAsolar
 * (Meeus1998 eq. 28.3 with y = tan²(ε/2)). NaN time → NaN fields.
 * @example sunEquatorial(Date.UTC(1992, 9, 13)).declinationDeg // ≈ −7.78507 (Meeus Example 25.a)
 */
export function sunEquatorial(timeMs: number): SunEquatorial {
  const t = (julianDate(timeMs) - 2451545) / 36525;
  const l0 = mod360(280.46646 + t * (36000.76983 + t * 0.0003032));
  const m = 357.52911 + t * (35999.05029 - 0.0001537 * t);
  const e = 0.016708634 - t * (0.000042037 + 0.0000001267 * t);
  const mr = m * DEG;
  const c =
    Math.sin(mr) * (1.914602 - t * (0.004817 + 0.000014 * t)) +
    Math.sin(2 * mr) * (0.019993 - 0.000101 * t) +
    Math.sin(3 * mr) * 0.000289;
  const trueLong = mod360(l0 + c);
  const omega = (125.04 - 1934.136 * t) * DEG;
  const lambda = trueLong - 0.00569 - 0.00478 * Math.sin(omega);
  const eps0 = 23 + (26 + (21.448 - t * (46.815 + t * (0.00059 - t * 0.001813))) / 60) / 60;
  const eps = (eps0 + 0.00256 * Math.cos(omega)) * DEG;
  const lr = lambda * DEG;
  const ra = mod360(Math.atan2(Math.cos(eps) * Math.sin(lr), Math.cos(lr)) / DEG);
  const dec = Math.asin(Math.sin(eps) * Math.sin(lr)) / DEG;
  const y = Math.tan(eps / 2) ** 2;
  const l0r = l0 * DEG;
  const eqt =
    (4 / DEG) *
    (y * Math.sin(2 * l0r) -
      2 * e * Math.sin(mr) +
      4 * e * y * Math.sin(mr) * Math.cos(2 * l0r) -
      0.5 * y * y * Math.sin(4 * l0r) -
      1.25 * e * e * Math.sin(2 * mr));
  return { julianCentury: t, trueLongitudeDeg: trueLong, apparentLongitudeDeg: lambda, rightAscensionDeg: ra, declinationDeg: dec, equationOfTimeMin: eqt };
}

function mod360(x: number): number {
  const r = x % 360;
  return r < 0 ? r + 360 : r;
}

/**
 * Atmospheric refraction correction to add to the geometric elevation, degrees (NOAAsolar piecewise formula:
 * 0 above 85°; 58.1/tan h − 0.07/tan³ h + 0.000086/tan⁵ h arcsec above 5°; a polynomial down to −0.575°;
 * −20.774/tan h below; all /3600). NaN → NaN.
 * @example refractionCorrectionDeg(0) // ≈ 0.4819
 */
export function refractionCorrectionDeg(elevationDeg: number): number {
  const h = elevationDeg;
  if (h > 85) return 0;
  const te = Math.tan(h * DEG);
  let arcsec: number;
  if (h > 5) arcsec = 58.1 / te - 0.07 / te ** 3 + 0.000086 / te ** 5;
  else if (h > -0.575) arcsec = 1735 + h * (-518.2 + h * (103.4 + h * (-12.79 + h * 0.711)));
  else arcsec = -20.774 / te;
  return arcsec / 3600;
}

/** Solar position at a place and time. */
export interface SolarPosition {
  /** Elevation above the horizon including refraction, degrees. */
  elevationDeg: number;
  /** Geometric (airless) elevation, degrees. */
  geometricElevationDeg: number;
  /** Azimuth clockwise from true north, degrees [0, 360). */
  azimuthDeg: number;
  /** Hour angle, degrees (negative before local apparent noon). */
  hourAngleDeg: number;
  declinationDeg: number;
  equationOfTimeMin: number;
}

/**
 * Solar elevation and azimuth (NOAAsolar / Meeus1998 ch. 25 and ch. 13 horizontal coordinates).
 * cos z = sin φ sin δ + cos φ cos δ cos H; azimuth = atan2(sin H, cos H sin φ − tan δ cos φ) + 180°.
 * Units: epoch ms UTC, degrees (latitude north +, longitude east +) → degrees. NaN in → NaN out.
 * @example solarPosition(Date.UTC(2021, 5, 21, 18), 35.2226, -97.4395).elevationDeg // ≈ 76.3576
 */
export function solarPosition(timeMs: number, latDeg: number, lonDeg: number): SolarPosition {
  const sun = sunEquatorial(timeMs);
  const minutesOfDay = (((timeMs % MS_PER_DAY) + MS_PER_DAY) % MS_PER_DAY) / MS_PER_MINUTE;
  const trueSolarMin = mod1440(minutesOfDay + sun.equationOfTimeMin + 4 * lonDeg);
  let ha = trueSolarMin / 4 - 180;
  if (ha < -180) ha += 360;
  const phi = latDeg * DEG;
  const dec = sun.declinationDeg * DEG;
  const har = ha * DEG;
  const cosZ = Math.min(1, Math.max(-1, Math.sin(phi) * Math.sin(dec) + Math.cos(phi) * Math.cos(dec) * Math.cos(har)));
  const geom = 90 - Math.acos(cosZ) / DEG;
  const az = mod360(Math.atan2(Math.sin(har), Math.cos(har) * Math.sin(phi) - Math.tan(dec) * Math.cos(phi)) / DEG + 180);
  return {
    elevationDeg: geom + refractionCorrectionDeg(geom),
    geometricElevationDeg: geom,
    azimuthDeg: az,
    hourAngleDeg: ha,
    declinationDeg: sun.declinationDeg,
    equationOfTimeMin: sun.equationOfTimeMin,
  };
}

function mod1440(x: number): number {
  const r = x % 1440;
  return r < 0 ? r + 1440 : r;
}

/** Sunrise, solar noon and sunset (epoch ms UTC). */
export interface SunTimes {
  /** NaN when the Sun does not rise (polar night) or does not set (polar day). */
  sunriseMs: number;
  solarNoonMs: number;
  sunsetMs: number;
  /** 'normal' | 'polar-day' (Sun above the rise/set altitude all day) | 'polar-night'. */
  kind: 'normal' | 'polar-day' | 'polar-night';
}

/**
 * Sunrise, solar noon and sunset for the local solar day containing `dayMs` (the UTC date of dayMs + lon/15 h, i.e.
 * the local mean-solar date), NOAAsolar method: noon = 720 − 4 λ − EoT minutes; rise/set = noon ∓ 4 H0 with
 * cos H0 = cos 90.833°/(cos φ cos δ) − tan φ tan δ; δ and EoT re-evaluated at each event time (3 iterations).
 * Events can fall on the neighbouring UTC date (e.g. US evening sunsets after 00Z).
 * Units: epoch ms, degrees → epoch ms UTC. NaN in → NaN out.
 * @example sunTimes(Date.UTC(2021, 5, 21, 12), 35.2226, -97.4395).sunriseMs // ≈ Date.UTC(2021, 5, 21, 11, 15, 38)
 */
export function sunTimes(dayMs: number, latDeg: number, lonDeg: number): SunTimes {
  const day0 = Math.floor((dayMs + (lonDeg / 15) * MS_PER_HOUR) / MS_PER_DAY) * MS_PER_DAY;
  if (Number.isNaN(day0) || Number.isNaN(latDeg)) return { sunriseMs: NaN, solarNoonMs: NaN, sunsetMs: NaN, kind: 'normal' };
  const atMin = (min: number) => day0 + min * MS_PER_MINUTE;
  let noonMin = 720 - 4 * lonDeg;
  for (let k = 0; k < 3; k++) noonMin = 720 - 4 * lonDeg - sunEquatorial(atMin(noonMin)).equationOfTimeMin;
  const phi = latDeg * DEG;
  const event = (sign: -1 | 1): { min: number; kind: SunTimes['kind'] } => {
    let min = noonMin;
    for (let k = 0; k < 3; k++) {
      const s = sunEquatorial(atMin(min));
      const dec = s.declinationDeg * DEG;
      const cosH = Math.cos(SUNRISE_ZENITH_DEG * DEG) / (Math.cos(phi) * Math.cos(dec)) - Math.tan(phi) * Math.tan(dec);
      if (cosH > 1) return { min: NaN, kind: 'polar-night' };
      if (cosH < -1) return { min: NaN, kind: 'polar-day' };
      const h0 = Math.acos(cosH) / DEG;
      min = 720 - 4 * (lonDeg - sign * h0) - s.equationOfTimeMin;
    }
    return { min, kind: 'normal' };
  };
  const rise = event(-1);
  const set = event(1);
  const kind = rise.kind !== 'normal' ? rise.kind : set.kind;
  return { sunriseMs: atMin(rise.min), solarNoonMs: atMin(noonMin), sunsetMs: atMin(set.min), kind };
}

/**
 * True when the Sun's centre is above the sunrise/sunset altitude (geometric elevation > −0.833°), i.e. between
 * sunrise and sunset as defined by NOAAsolar. NaN in → false.
 * @example isDaylight(Date.UTC(2021, 5, 21, 18), 35.2226, -97.4395) // true
 */
export function isDaylight(timeMs: number, latDeg: number, lonDeg: number): boolean {
  return solarPosition(timeMs, latDeg, lonDeg).geometricElevationDeg > 90 - SUNRISE_ZENITH_DEG;
}

/**
 * Local solar time as an epoch-like ms count: timeMs + lonDeg/15 h (east positive), plus the equation of time
 * when `apparent` is true. Mean solar time (`apparent` false) = UTC + 4 min per degree of east longitude;
 * apparent (true) solar time adds the equation of time of `sunEquatorial` (NOAAsolar "true solar time").
 * Dividing by MS_PER_HOUR and wrapping to [0, 24) gives `solarHour`; binning it by fractions of a day gives
 * solar-time bins that do not wrap at midnight. NaN time or longitude → NaN.
 * @example solarTimeMs(Date.UTC(2024, 0, 1, 12), -90) // Date.UTC(2024, 0, 1, 6)
 */
export function solarTimeMs(timeMs: number, lonDeg: number, apparent = false): number {
  return timeMs + (lonDeg / 15) * MS_PER_HOUR + (apparent ? sunEquatorial(timeMs).equationOfTimeMin * MS_PER_MINUTE : 0);
}

/**
 * Local solar hour in [0, 24): UTC hour + lonDeg/15 (east positive) — mean solar time — or, with `apparent`,
 * apparent (true) solar time including the equation of time (NOAAsolar "true solar time"; 12 = local apparent
 * noon). Mean solar time differs from apparent by at most about 16 min (early November). NaN in → NaN.
 * @example solarHour(Date.UTC(2024, 0, 1, 12), -90) // 6
 * @example solarHour(Date.UTC(2021, 2, 20, 12, 7, 22), 0, true) // ≈ 12.0
 */
export function solarHour(timeMs: number, lonDeg: number, apparent = false): number {
  const s = solarTimeMs(timeMs, lonDeg, apparent);
  if (Number.isNaN(s)) return NaN;
  const h = (s / MS_PER_HOUR) % 24;
  return h < 0 ? h + 24 : h;
}
