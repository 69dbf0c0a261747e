/**
 * Physical constants and unit factors for fropa, each with its unit and source.
 * Derived constants are computed from their definitions, never retyped.
 *
 * References (keys used across src/physics):
 * - CODATA2018: Tiesinga et al., CODATA recommended values of the fundamental physical constants: 2018.
 * - MetPy: Unidata MetPy `metpy.constants` (molar masses of dry air and water; c_p = 3.5 R_d convention).
 * - ISA / USSA1976: ICAO Standard Atmosphere (Doc 7488) = U.S. Standard Atmosphere 1976 below 11 km.
 * - NIST SP 811 (2008), Appendix B.8 (conversion factors).
 * - WGS84: NIMA TR8350.2 (a = 6378137 m, 1/f = 298.257223563).
 */

/** Molar gas constant R*, J mol⁻¹ K⁻¹ (CODATA2018, exact since the 2019 SI). */
export const MOLAR_GAS_CONSTANT = 8.314462618;
/** Molar mass of dry air M_d, kg mol⁻¹ (MetPy `dry_air_molecular_weight` 28.96546 g/mol). */
export const MOLAR_MASS_DRY_AIR = 0.02896546;
/** Molar mass of water M_w, kg mol⁻¹ (MetPy `water_molecular_weight` 18.015268 g/mol). */
export const MOLAR_MASS_WATER = 0.018015268;

/** Gas constant of dry air R_d = R* / M_d ≈ 287.04749 J kg⁻¹ K⁻¹ (derived). */
export const RD = MOLAR_GAS_CONSTANT / MOLAR_MASS_DRY_AIR;
/** Gas constant of water vapour R_v = R* / M_w ≈ 461.52311 J kg⁻¹ K⁻¹ (derived). */
export const RV = MOLAR_GAS_CONSTANT / MOLAR_MASS_WATER;
/**
 * Specific heat of dry air at constant pressure c_p = 3.5 R_d ≈ 1004.666 J kg⁻¹ K⁻¹
 * (ideal diatomic gas; the MetPy convention). Derived.
 */
export const CP_D = 3.5 * RD;
/** Poisson exponent κ = R_d/c_p = 2/7 (derived). Bolton1980 uses 0.2854 in its own fits. */
export const KAPPA = RD / CP_D;
/** ε = R_d/R_v = M_w/M_d ≈ 0.6219569 (derived; the classic rounded value is 0.622). */
export const EPSILON = RD / RV;

/** Standard acceleration of gravity g0, m s⁻² (exact; 3rd CGPM 1901, NIST SP 811). */
export const G0 = 9.80665;
/** Kelvin offset: T(K) = T(°C) + 273.15 (exact, SI). */
export const ZERO_CELSIUS_K = 273.15;

/** ISA sea-level pressure, hPa (ICAO Doc 7488 / USSA1976). */
export const STANDARD_PRESSURE_HPA = 1013.25;
/** ISA sea-level temperature, K (ICAO Doc 7488 / USSA1976). */
export const STANDARD_TEMPERATURE_K = 288.15;
/** ISA tropospheric lapse rate, K m⁻¹ (ICAO Doc 7488 / USSA1976; 6.5 K/km below 11 km). */
export const STANDARD_LAPSE_RATE_K_PER_M = 0.0065;

/** WGS84 semi-major axis, m (NIMA TR8350.2). */
export const WGS84_A_M = 6378137;
/** WGS84 flattening (NIMA TR8350.2: 1/f = 298.257223563). */
export const WGS84_F = 1 / 298.257223563;
/** WGS84 semi-minor axis b = a(1 − f), m (derived). */
export const WGS84_B_M = WGS84_A_M * (1 - WGS84_F);
/** IUGG mean earth radius R1 = (2a + b)/3 ≈ 6371008.77 m for WGS84 (Moritz 1980 definition; derived). */
export const EARTH_MEAN_RADIUS_M = (2 * WGS84_A_M + WGS84_B_M) / 3;

/** Conventional density of mercury at 0 °C, kg m⁻³ (NIST SP 811 (2008) App. B.8, the "conventional" mercury units). */
export const MERCURY_DENSITY_KG_M3 = 13595.1;
/** Inch, m (exact, 1959 international yard and pound agreement). */
export const INCH_M = 0.0254;
/** Inch, mm (derived: 1000 × INCH_M = 25.4 exactly). */
export const INCH_MM = INCH_M * 1000;
/**
 * hPa per conventional inch of mercury: 0.0254 m × 13595.1 kg m⁻³ × g0 / 100 ≈ 33.8638864 hPa.
 * NIST SP 811 (2008) App. B.8 lists 3.386 389 E+03 Pa (agrees to its 7 printed digits). Derived.
 */
export const HPA_PER_INHG = (INCH_M * MERCURY_DENSITY_KG_M3 * G0) / 100;
/** International foot, m (exact). */
export const FOOT_M = 0.3048;
/** Statute mile = 5280 ft, m (derived: 1609.344 m exactly; NIST SP 811 (2008) App. B.8). */
export const STATUTE_MILE_M = 5280 * FOOT_M;
/** International nautical mile, m (exact by definition; NIST SP 811 (2008) App. B.8). */
export const NAUTICAL_MILE_M = 1852;
/** Knot, m s⁻¹ = 1852 m / 3600 s (exact; NIST SP 811 (2008) App. B.8 "knot 5.144 444 E-01 m/s"). */
export const KNOT_MS = NAUTICAL_MILE_M / 3600;
/** Mile per hour, m s⁻¹ = 1609.344/3600 = 0.44704 exactly (derived; NIST SP 811 (2008) App. B.8). */
export const MPH_MS = STATUTE_MILE_M / 3600;
/** Kilometre per hour, m s⁻¹ = 1/3.6 exactly (SI). */
export const KMH_MS = 1 / 3.6;

/** Milliseconds per second (SI). */
export const MS_PER_SECOND = 1000;
/** Milliseconds per minute (60 s). */
export const MS_PER_MINUTE = 60 * MS_PER_SECOND;
/** Milliseconds per hour (60 min). */
export const MS_PER_HOUR = 60 * MS_PER_MINUTE;
/** Milliseconds per day (24 h; UTC days, leap seconds not counted, as in ECMAScript time values). */
export const MS_PER_DAY = 24 * MS_PER_HOUR;
