/** Types of the synthetic weather generator: configuration, columnar output, planted truth. */
import type { BoundaryKind, FieldColumns, StationMeta } from '../../src/model/index.js';

/** Decoy kinds: things that look a little like fronts but are not synoptic fronts. */
export const DECOY_KINDS = ['night-cooling', 'outflow-boundary', 'sea-breeze-front', 'prefrontal-trough', 'dryline-retreat'] as const;
export type DecoyKind = (typeof DECOY_KINDS)[number];

/** One planted passage (or decoy) at one station. */
export interface TruthEvent {
  station: string;
  kind: BoundaryKind | DecoyKind;
  /** Leading edge (start of the wind shift / of the sharp change), epoch ms UTC. */
  timeMs: number;
  /** End of the transition zone (90 % of the planted change complete), or end of a decoy episode. */
  zoneEndMs?: number;
  /** Planted temperature change across the passage, °C (negative = cooling). */
  tempChangeC?: number;
  /** Planted dew-point change, °C. */
  dewpointChangeC?: number;
  /** Planted wind direction before and after, degrees true. */
  windBeforeDeg?: number;
  windAfterDeg?: number;
  /** Network-wide id of the front (same for every station it crosses). */
  frontId?: string;
  /** Free note, e.g. `arctic`, `frontolysis`, `frontogenesis`, `prefrontal-trough ahead`. */
  note?: string;
  /** True for decoys (not a boundary the detector should report as a front). */
  isDecoy: boolean;
}

/** A planted data fault, for the record (already applied to `obs`). */
export interface FaultRecord {
  station: string;
  kind: 'gap' | 'stuck' | 'spike';
  startMs: number;
  endMs: number;
  field?: string;
}

/**
 * Columnar 5-minute series (canonical units; NaN = missing), the columns of a StationSeries that the
 * generator makes: wind direction 0 when calm; gust = highest 3-s gust within the 5 min; precipitation in
 * the 5 min ending at timeMs, mm.
 */
export interface SynthSeries
  extends Pick<FieldColumns, 'temperatureC' | 'dewpointC' | 'windDirDeg' | 'windSpeedMs' | 'gustMs' | 'stationPressureHpa' | 'seaLevelPressureHpa' | 'precipMm'> {
  station: string;
  length: number;
  timeMs: Float64Array;
  /** WX bit flags (src/ingest/types.ts). */
  weather: Uint16Array;
  /** Cloud cover fraction 0–1 (for encoders' sky groups). */
  cloudFraction: Float32Array;
}

/** Which special events to plant. Counts are over the whole period and network. */
export interface SynthEventPlan {
  /** Mean spacing of cyclone passages, days (range). Default [3.5, 6]. */
  cycleDays?: [number, number];
  /** Probability that a cyclone brings a warm front ahead of its cold front. Default 0.6. */
  warmFrontProbability?: number;
  /** Plant one strong arctic front. Default true. */
  arctic?: boolean;
  /** Plant one weakening front (frontolysis across the network). Default true. */
  frontolysis?: boolean;
  /** Plant one strengthening front (frontogenesis). Default true. */
  frontogenesis?: boolean;
  /** Occluded fronts/troughs. Default 1. */
  occluded?: number;
  /** Cold fronts preceded by a prefrontal trough. Default 2. */
  prefrontalTroughs?: number;
  /** Dryline days. Default 1. */
  drylines?: number;
  /** Outflow boundaries (each at one or two stations). Default 1. */
  outflows?: number;
  /** Maximum sea-breeze days at coastal stations. Default 6. */
  seaBreezeDays?: number;
  /** Network-wide clear calm nights. Default 4. */
  calmNights?: number;
  /** Ranges of the ordinary cold and warm fronts (arctic, frontolysis, frontogenesis keep their own). Defaults: the standard set. */
  fronts?: SynthFrontRanges;
}

/**
 * Signal ranges of ordinary fronts, each drawn uniformly from [lo, hi]. Every default is the standard generator's
 * range, so leaving a field out (or giving its default) draws exactly the same numbers. Degrees true, NH-equivalent.
 */
export interface SynthFrontRanges {
  /** Cold fronts: temperature fall across the front, °C (positive). Default [4, 10]. */
  coldContrastC?: [number, number];
  /** Cold fronts: probability of a sharp (5-minute) wind shift; otherwise it turns over `coldShiftMin`. Default 0.6. */
  coldSharpShiftProbability?: number;
  /** Cold fronts: minutes a slow wind shift takes. Default [30, 90]. */
  coldShiftMin?: [number, number];
  /** Cold fronts: veer, degrees; when unset the post-frontal direction is drawn from 280–320° (veer about 55–130°). */
  coldVeerDeg?: [number, number];
  /** Warm fronts: temperature rise, °C. Default [3, 7]. */
  warmContrastC?: [number, number];
  /** Warm fronts: hours to 90 % of the rise. Default [2.5, 6]. */
  warmZoneH?: [number, number];
  /** Warm fronts: dew-point rise as a multiple of the temperature rise. Default [1.1, 1.6]. */
  warmDewRatio?: [number, number];
  /** Warm fronts: direction ahead of the front. Default [95, 140]. */
  warmPreDirDeg?: [number, number];
  /** Warm fronts: veer, degrees; when unset the direction behind is drawn from 180–215°. */
  warmVeerDeg?: [number, number];
  /** Warm fronts: minutes the wind takes to turn. Default [60, 150]. */
  warmShiftMin?: [number, number];
}

/** Faults to plant. */
export interface SynthFaultPlan {
  /** Gaps of 1–6 h (number over the network). Default 3. */
  gaps?: number;
  /** Stuck temperature sensors (6–12 h). Default 1. */
  stuck?: number;
  /** Single-sample spikes. Default 4. */
  spikes?: number;
}

export interface SynthConfig {
  stations: StationMeta[];
  startMs: number;
  endMs: number;
  /** Sample spacing, minutes. Default 5. */
  stepMinutes?: number;
  events?: SynthEventPlan;
  /** `false` for clean data. */
  faults?: SynthFaultPlan | false;
}

export interface SynthNetwork {
  stations: StationMeta[];
  obs: Map<string, SynthSeries>;
  truth: TruthEvent[];
  faults: FaultRecord[];
}
