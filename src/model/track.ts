/**
 * Output contract of tracking: a front followed across the station network.
 * Canonical units: °C, hPa, m/s, degrees true, epoch ms UTC. Missing is NaN.
 */
import type { BoundaryKind, PassageEvent } from './event.js';

export interface TrackMember {
  station: string;
  event: PassageEvent;
  xKm: number;
  yKm: number;
  /** Observed minus fitted passage time, minutes. */
  residualMin: number;
  /** Distance along the direction of motion from the network origin, km. */
  alongKm: number;
  /** Petterssen frontogenesis at this passage, K per 100 km per 3 h (see frontogenesis.ts; NaN until computed). */
  frontogenesisKPer100kmPer3h?: number;
}

export type StrengthTrend = 'strengthening' | 'weakening' | 'steady' | 'unknown';


export interface FrontTrack {
  id: string;
  kind: BoundaryKind;
  members: TrackMember[];
  /** Fitted passage time at the network origin. */
  t0Ms: number;
  /** Speed normal to the front, km/h. */
  speedKmh: number;
  /** Direction the front moves toward, degrees true. */
  directionDeg: number;
  /** Root-mean-square residual of the members, minutes. */
  rmsResidualMin: number;
  /** Along-track change of |ΔT| (|ΔTd| for drylines), °C per 100 km (positive = strengthening); NaN for warm and occluded fronts. */
  strengthSlopeCPer100km: number;
  /** Along-track change of the zone depth, km per 100 km (positive = widening). */
  zoneSlopeKmPer100km: number;
  trend: StrengthTrend;
  /** Median Petterssen frontogenesis over the passages, K per 100 km per 3 h (NaN until computed). */
  frontogenesisKPer100kmPer3h?: number;
  /** Stations of the same network without a passage in this track: when the fit says it passed or will pass. */
  expected: { station: string; timeMs: number }[];
  /** Origin of the local projection. */
  origin: { latDeg: number; lonDeg: number };
}
