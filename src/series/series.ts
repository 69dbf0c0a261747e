/**
 * Columnar station series: one typed array per variable, sorted by time, duplicates resolved.
 * Canonical units (°C, hPa, m/s, degrees true, epoch ms UTC); missing is NaN.
 */
import type { Observation, ObserverRemark, StationMeta } from '../ingest/types.js';
import { SeriesBuilder } from './seriesBuilder.js';

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
] as const;
export type SeriesField = (typeof SERIES_FIELDS)[number];

/** QC flag bits, one Uint8 per value (see src/qc/). 0 = passed. */
export const QC = {
  RANGE: 1,
  STEP: 2,
  PERSIST: 4,
  CONSISTENCY: 8,
  SPIKE: 16,
} as const;

export interface DuplicateNote {
  timeMs: number;
  /** What happened: `correction-replaced`, `identical-dropped`, `conflict-kept-last`. */
  action: string;
  keptLine: number;
  droppedLine: number;
  file: string;
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

/**
 * Build a sorted columnar series from one station's observations.
 * Duplicate times: a correction (COR) replaces the report it corrects; an identical repeat is dropped;
 * differing repeats keep the later line (METAR over SPECI at the same minute keeps the routine report's
 * values merged with any missing value filled from the other). Every duplicate is noted.
 */
export function buildSeries(station: string, observations: readonly Observation[], meta?: StationMeta): StationSeries {
  const b = new SeriesBuilder(() => station);
  for (const o of observations) b.add(o);
  return b.build(station, meta);
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

/** Group observations by station id (after alias resolution by the caller). Order within a station is kept. */
export function groupByStation(observations: Iterable<Observation>): Map<string, Observation[]> {
  const m = new Map<string, Observation[]>();
  for (const o of observations) {
    let a = m.get(o.station);
    if (!a) m.set(o.station, (a = []));
    a.push(o);
  }
  return m;
}

/** Median spacing between consecutive reports, minutes (NaN for fewer than 2 reports). */
export function medianCadenceMinutes(timeMs: ArrayLike<number>): number {
  const n = timeMs.length;
  if (n < 2) return NaN;
  const d = new Float64Array(n - 1);
  for (let i = 1; i < n; i++) d[i - 1] = (timeMs[i]! - timeMs[i - 1]!) / 60000;
  d.sort();
  return d[(d.length - 1) >> 1]!;
}
