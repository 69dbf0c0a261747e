/**
 * Bit flags carried per report (present weather) and per value (quality control).
 * Canonical units: °C, hPa, m/s, degrees true, epoch ms UTC. Missing is NaN.
 */

/** Present-weather bit flags (WMO-No. 306 code table 4678 phenomena of interest to fronts). */
export const WX = {
  RAIN: 1 << 0,
  SNOW: 1 << 1,
  DRIZZLE: 1 << 2,
  THUNDER: 1 << 3,
  HAIL: 1 << 4,
  SHOWER: 1 << 5,
  FOG: 1 << 6,
  SQUALL: 1 << 7,
  FREEZING: 1 << 8,
  HEAVY: 1 << 9,
  ICE_PELLETS: 1 << 10,
  DUST: 1 << 11,
  /** Any precipitation (RA, SN, DZ, GR, GS, PL, SG, IC, UP) */
  PRECIP: 1 << 12,
  /** Lightning or CB reported (remarks or cloud type). */
  CONVECTIVE: 1 << 13,
  /** A precipitation group with the `-` sign: light (WMO-No. 306 code table 4678, intensity; FMH-1 §12.6.8). */
  LIGHT: 1 << 14,
  /** A precipitation group without an intensity sign: moderate (same sources). `+` (heavy) sets HEAVY. */
  MODERATE: 1 << 15,
} as const;

/** The intensity bits of precipitation groups. */
export const WX_INTENSITY = WX.LIGHT | WX.MODERATE | WX.HEAVY;

/** QC flag bits, one Uint8 per value (set by src/qc/). 0 = passed. */
export const QC = {
  RANGE: 1,
  STEP: 2,
  PERSIST: 4,
  CONSISTENCY: 8,
  SPIKE: 16,
} as const;
