/**
 * Unit factors used when decoding METAR/SPECI groups into canonical units (m/s, m, hPa, mm, ft).
 * Each factor names its source; derived factors are computed, not retyped.
 */

/** International nautical mile, m (exact by definition; NIST SP 811 (2008) App. B.8). */
export const NAUTICAL_MILE_M = 1852;

/** One knot in m/s = 1852/3600 (exact; NIST SP 811 (2008) App. B.8 "knot 5.144 444 E-01 m/s"). */
export const KNOT_MS = NAUTICAL_MILE_M / 3600;

/** One km/h in m/s (SI, exact). */
export const KMH_MS = 1 / 3.6;

/** International foot, m (exact; 1959 international yard and pound agreement). */
export const FOOT_M = 0.3048;

/** Statute mile = 5280 ft, m (exact; NIST SP 811 (2008) App. B.8). */
export const STATUTE_MILE_M = 5280 * FOOT_M;

/** Inch, mm (exact; 1959 agreement). */
export const INCH_MM = 25.4;

/** Standard acceleration of gravity, m s⁻² (exact; CGPM 1901, NIST SP 811 (2008) App. B.8). */
export const STANDARD_GRAVITY = 9.80665;

/** Conventional density of mercury at 0 °C, kg m⁻³ (NIST SP 811 (2008) App. B.8 footnote on "conventional" mercury units). */
export const MERCURY_DENSITY_CONVENTIONAL = 13595.1;

/**
 * Conventional inch of mercury in hPa: 0.0254 m × 13595.1 kg m⁻³ × 9.80665 m s⁻² / 100
 * = 33.8638864 hPa. NIST SP 811 (2008) App. B.8 lists 3.386 389 E+03 Pa.
 * @example INHG_HPA * 29.92 // ≈ 1013.2075
 */
export const INHG_HPA = (INCH_MM / 1000) * MERCURY_DENSITY_CONVENTIONAL * STANDARD_GRAVITY / 100;
