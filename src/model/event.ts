/**
 * Output contract of detection: one PassageEvent per boundary passage at a station.
 * Canonical units: °C, hPa, m/s, degrees true, epoch ms UTC. Missing is NaN.
 */

import type { OperatorFields } from './operator.js';

export const BOUNDARY_KINDS = [
  'cold-front',
  'warm-front',
  'occluded-front',
  'dryline',
  'outflow-boundary',
  'sea-breeze-front',
  'wind-shift',
] as const;
export type BoundaryKind = (typeof BOUNDARY_KINDS)[number];

export interface PassageEvent {
  station: string;
  kind: BoundaryKind;
  /** Leading edge (wind shift, or start of the sharp change), epoch ms UTC. */
  timeMs: number;
  timeEarliestMs: number;
  timeLatestMs: number;
  /** In [0, 1]. */
  confidence: number;
  /** After minus before, °C (negative = cooling). */
  tempChangeC: number;
  /** Temperature change with the expected diurnal change removed, °C (for along-track strength; not in the output contract). */
  tempChangeAdjustedC?: number;
  dewpointChangeC: number;
  thetaEChangeK: number;
  pressureMinHpa: number;
  pressureMinTimeMs: number;
  /** Pressure change over the 3 h after the passage, hPa. */
  pressureRise3hHpa: number;
  windBeforeDeg: number;
  windAfterDeg: number;
  /** Signed turn, positive = veering (clockwise). */
  windTurnDeg: number;
  windSpeedAfterMs: number;
  gustMaxMs: number;
  /** Precipitation reported within ±1 h of the passage. */
  precipNear: boolean;
  zoneStartMs: number;
  zoneEndMs: number;
  zoneHours: number;
  zoneDepthKm: number;
  gradientKPer100km: number;
  /** Nearest observer frontal/wind-shift remark time (NaN when none). */
  observerFropaTimeMs: number;
  /** When the wind shift began (FMH-1 §5.4.6), epoch ms UTC; NaN when the wind did not shift measurably. */
  windShiftTimeMs: number;
  /** Start of the temperature change (of the dew-point change for drylines), epoch ms UTC; NaN when none. */
  changeStartTimeMs: number;
  /** Which time `timeMs` is: the wind shift, the start of the temperature or dew-point change, or the change point itself. */
  timeBasis: 'wind-shift' | 'temperature-change' | 'dew-point-change' | 'change-point';
  /** Criteria that held (`+ …`) and failed (`− …`), in plain words. */
  evidence: string[];
  /** Levels, freeze risk, precipitation type, wind before, which pressure, runway components (added after detection). */
  operator?: OperatorFields;
}
