/** Output contract of detection: one PassageEvent per boundary passage at a station. */

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
  /** When the wind shift began (FMH-1), epoch ms UTC; NaN when the wind did not shift measurably. */
  windShiftTimeMs: number;
  /** Start of the temperature change (dew-point change for drylines), epoch ms UTC; NaN when none. */
  changeStartTimeMs: number;
  /** Which of the two `timeMs` is: the wind shift, the start of the change, or the change point itself. */
  timeBasis: 'wind-shift' | 'temperature-change' | 'dew-point-change' | 'change-point';
  /** Criteria that held (`+ …`) and failed (`− …`), in plain words. */
  evidence: string[];
}

export interface DetectOptions {
  /** Front speed normal to the front, km/h, for zone depth and gradient. */
  frontSpeedKmh?: number;
  /** Drop events below this confidence. Default 0.4 (DEFAULT_MIN_CONFIDENCE). */
  minConfidence?: number;
  /** Classifier parameters: the fitted ones by default; `null` for the hand signatures alone. */
  model?: import('./model.js').ModelParams | null;
}
