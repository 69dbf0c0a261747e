/**
 * Fields operators act on, added to a passage event after detection (src/report/operatorFields.ts): levels, not only
 * changes; freeze risk; precipitation type; wind before and after; which pressure; runway components.
 * Canonical units: °C, hPa, m/s, degrees true, epoch ms UTC. Missing is NaN.
 */

/** Precipitation and thunder types named from the present-weather codes (WMO-No. 306, FM 15, code table 4678). */
export const PRECIP_TYPES = ['rain', 'drizzle', 'snow', 'freezing-rain', 'freezing-drizzle', 'ice-pellets', 'hail', 'thunder'] as const;
export type PrecipType = (typeof PRECIP_TYPES)[number];

/** Intensity of precipitation groups: `-` light, no sign moderate, `+` heavy (WMO-No. 306, FM 15, code table 4678). */
export const PRECIP_INTENSITIES = ['light', 'moderate', 'heavy'] as const;
export type PrecipIntensity = (typeof PRECIP_INTENSITIES)[number];

/**
 * Which pressure a series' pressure fields are: station pressure as reported, station pressure derived from the
 * altimeter setting (NWS inversion, physics/pressure.ts), the altimeter setting itself, sea-level pressure, or none.
 */
export type PressureSource = 'station' | 'station-from-altimeter' | 'altimeter' | 'sea-level' | 'none';

/** Wind components along one runway direction, m/s. */
export interface RunwayComponents {
  /** Runway designator as given (`04`, `22L`). */
  runway: string;
  /** Runway heading used, degrees (designator × 10 unless given as three digits). */
  headingDeg: number;
  /** Crosswind, m/s; positive from the right of an aircraft on this heading. */
  crosswindBeforeMs: number;
  /** Tailwind, m/s; negative is a headwind. */
  tailwindBeforeMs: number;
  crosswindAfterMs: number;
  tailwindAfterMs: number;
}

export interface OperatorFields {
  /** Median temperature over the hour before the passage, °C. */
  tempBeforeC: number;
  /** Median temperature 1–3 h after the passage, °C. */
  tempAfterC: number;
  dewpointBeforeC: number;
  dewpointAfterC: number;
  /** Lowest temperature reported in the 6 h and the 12 h after the passage, °C. */
  tempMin6hC: number;
  tempMin12hC: number;
  /** First report at or below 0 °C in the 12 h after the passage, epoch ms UTC; NaN when none. */
  freezeTimeMs: number;
  /** Precipitation reported (present weather or amount) in the 6 h before the passage. */
  precipBefore6h: boolean;
  /** Types reported within ±1 h of the passage, in PRECIP_TYPES order. */
  precipTypes: PrecipType[];
  /** Heavy (`+`) precipitation reported within ±1 h of the passage. */
  precipHeavy: boolean;
  /**
   * The strongest intensity of the precipitation reported within ±1 h (heavy exactly when `precipHeavy`); null when
   * no precipitation group with an intensity was reported there (none, or only codes that carry no intensity).
   */
  precipIntensity: PrecipIntensity | null;
  /** Median wind speed over the hour before the passage, m/s. */
  windSpeedBeforeMs: number;
  /** Prevailing visibility over the hour before the passage and 1–3 h after, m (lower median of the reports). */
  visibilityBeforeM: number;
  visibilityAfterM: number;
  /**
   * Ceiling over the hour before and 1–3 h after, ft (lower median of the reports; the FMH-1 ceiling: lowest BKN, OVC or
   * VV layer). +Infinity: no ceiling (most reports had none); NaN: no sky reported.
   */
  ceilingBeforeFt: number;
  ceilingAfterFt: number;
  /** Which pressure the event's pressure fields (pressure minimum, 3 h rise) were measured on. */
  pressureSource: PressureSource;
  /** Components per runway direction (only with runways asked for). */
  runways?: RunwayComponents[];
}
