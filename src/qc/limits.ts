/**
 * Quality-control limits, each with its source.
 * WMO488 = WMO-No. 488, Guide to the Global Observing System (2010 ed., updated 2017), Appendix VI.2,
 * "Basic quality control procedures" (plausible values and time consistency). Values marked
 * "from memory" were not re-checked against the printed page.
 */
import type { SeriesField } from '../model/index.js';

export interface RangeLimit {
  min: number;
  max: number;
  source: string;
}

/** Gross plausible-value limits in canonical units. */
export const RANGE_LIMITS: Partial<Record<SeriesField, RangeLimit>> = {
  temperatureC: { min: -80, max: 60, source: 'WMO488 App. VI.2 air temperature -80..+60 °C (from memory)' },
  dewpointC: { min: -80, max: 35, source: 'WMO488 App. VI.2 dew-point temperature -80..+35 °C (from memory)' },
  windDirDeg: { min: 0, max: 360, source: 'WMO488 App. VI.2 wind direction 0..360° (from memory)' },
  windSpeedMs: { min: 0, max: 75, source: 'WMO488 App. VI.2 wind speed 0..75 m/s (from memory)' },
  gustMs: { min: 0, max: 150, source: 'WMO488 App. VI.2 wind gust 0..150 m/s (from memory)' },
  peakWindMs: { min: 0, max: 150, source: 'WMO488 App. VI.2 wind gust 0..150 m/s (from memory)' },
  stationPressureHpa: { min: 500, max: 1100, source: 'WMO488 App. VI.2 station pressure 500..1100 hPa (from memory)' },
  altimeterHpa: { min: 850, max: 1100, source: 'common practice, no source (altimeter setting is reduced to sea level)' },
  seaLevelPressureHpa: { min: 850, max: 1100, source: 'common practice, no source (record sea-level pressures lie near 870 and 1084 hPa)' },
  precipMm: { min: 0, max: 500, source: 'common practice, no source' },
  visibilityM: { min: 0, max: 100000, source: 'common practice, no source (prevailing visibility; METAR caps at 10 km, surface networks report tens of km)' },
  ceilingFt: { min: 0, max: Infinity, source: 'common practice, no source (no negative heights; +Infinity is "no ceiling")' },
};

/**
 * Spike limits: a value that departs from BOTH neighbours by more than this, in the same direction,
 * while the neighbours agree with each other within half of it, is a spike. Sized above what a
 * frontal or outflow passage does between two reports, because such passages do not return.
 * common practice, no source.
 */
export const SPIKE_LIMITS: Partial<Record<SeriesField, number>> = {
  temperatureC: 10,
  dewpointC: 12,
  stationPressureHpa: 6,
  seaLevelPressureHpa: 6,
  altimeterHpa: 6,
  windSpeedMs: 25,
};

/**
 * Largest believable rate of change between consecutive reports at least 10 min apart, per hour.
 * Pressure: mesohigh jumps reach a few hPa within minutes (Wakimoto1982); 10 hPa/h sustained is not
 * seen outside tropical cyclones: common practice, no source.
 */
export const RATE_LIMITS_PER_HOUR: Partial<Record<SeriesField, number>> = {
  stationPressureHpa: 10,
  seaLevelPressureHpa: 10,
  altimeterHpa: 10,
};

/**
 * Persistence: the minimum variability over 60 min in WMO488 App. VI.2 (temperature 0.1 °C, pressure
 * 0.1 hPa, wind speed 0.5 m/s; from memory) assumes instantaneous readings; reports in whole degrees
 * legitimately repeat for hours, so we flag only values unchanged for at least this long.
 * Window: common practice, no source.
 */
export const PERSIST_HOURS: Partial<Record<SeriesField, number>> = {
  temperatureC: 12,
  dewpointC: 12,
  stationPressureHpa: 12,
  seaLevelPressureHpa: 12,
  altimeterHpa: 12,
};

/** Dew point may exceed temperature by rounding only (WMO488 App. VI.2 internal consistency, Td ≤ T; 0.5 °C rounding allowance: common practice). */
export const DEWPOINT_EXCESS_C = 0.5;
