/**
 * Columnar station series: one typed array per variable, sorted by time, duplicates resolved.
 * Canonical units: °C, hPa, m/s, degrees true, epoch ms UTC. Missing is NaN.
 */
import type { ObserverRemark } from './observation.js';
import type { StationMeta } from './station.js';

/** The numeric variables a series carries, in canonical units. */
export const SERIES_FIELDS = [
  'temperatureC',
  'dewpointC',
  'windDirDeg',
  'windSpeedMs',
  'gustMs',
  'stationPressureHpa',
  'seaLevelPressureHpa',
  'altimeterHpa',
  'precipMm',
  'peakWindMs',
  'visibilityM',
  'ceilingFt',
] as const;
export type SeriesField = (typeof SERIES_FIELDS)[number];

/** Why a conflicting report was kept over another of the same time (see SeriesBuilder.build). */
export type DuplicateReason = 'correction' | 'more values' | 'report type' | 'values tie-break';

/** Two reports of one station and time: which was kept, which dropped (or merged into the kept one), and why. */
export interface DuplicateNote {
  timeMs: number;
  /**
   * What happened: `correction-replaced` (a COR kept over the report it corrects), `identical-dropped` (the same
   * values again), `conflict-resolved` (different values: the preferred report kept, its gaps filled from the other).
   */
  action: 'correction-replaced' | 'identical-dropped' | 'conflict-resolved';
  keptLine: number;
  droppedLine: number;
  /** File of the kept report. */
  file: string;
  /** File of the dropped report (the same file, or another file of the same station). */
  droppedFile: string;
  /** For `conflict-resolved`: the rule that chose the kept report. */
  reason?: DuplicateReason;
}

/** One Float64Array per numeric variable (canonical units, NaN = missing). */
export type FieldColumns = { [F in SeriesField]: Float64Array };

export interface StationSeries extends FieldColumns {
  station: string;
  meta?: StationMeta;
  length: number;
  timeMs: Float64Array;
  /** WX bit flags per report. */
  weather: Uint16Array;
  /** PRESRR +1 / PRESFR −1 / 0. */
  pressureTrend: Int8Array;
  /** 0 CSV, 1 METAR, 2 SPECI. */
  reportType: Uint8Array;
  /** QC flags per field (QC bits). */
  qc: Record<SeriesField, Uint8Array>;
  /** Source line of each report. */
  line: Int32Array;
  /** Source files (index into by `fileIndex`). */
  files: string[];
  fileIndex: Uint16Array;
  remarks: ObserverRemark[];
  duplicates: DuplicateNote[];
}

/** Allocate an empty series of length n (all values NaN, flags 0). */
export function allocSeries(station: string, n: number, meta?: StationMeta): StationSeries {
  const nan = () => new Float64Array(n).fill(NaN);
  const qc = {} as Record<SeriesField, Uint8Array>;
  for (const f of SERIES_FIELDS) qc[f] = new Uint8Array(n);
  return {
    station,
    meta,
    length: n,
    timeMs: new Float64Array(n),
    temperatureC: nan(),
    dewpointC: nan(),
    windDirDeg: nan(),
    windSpeedMs: nan(),
    gustMs: nan(),
    stationPressureHpa: nan(),
    seaLevelPressureHpa: nan(),
    altimeterHpa: nan(),
    precipMm: nan(),
    peakWindMs: nan(),
    visibilityM: nan(),
    ceilingFt: nan(),
    weather: new Uint16Array(n),
    pressureTrend: new Int8Array(n),
    reportType: new Uint8Array(n),
    qc,
    line: new Int32Array(n),
    files: [],
    fileIndex: new Uint16Array(n),
    remarks: [],
    duplicates: [],
  };
}
