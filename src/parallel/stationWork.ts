/**
 * The work of one data file and of one station in a streamed run (src/pipeline.ts `detectPaths`), the same
 * functions in a worker thread (detectWorker.ts) and in the main thread (one job), so that results never
 * depend on where they ran:
 *  - `censusFile`: read one file whole and say which stations it holds (and its report, notes, positions);
 *    the rows of a file that cannot be read again by path, or that holds several stations, are handed back;
 *  - `stationWork`: one station's rows (handed-back rows and its own files read again, in reading order) →
 *    series → station pressure → QC → detection → what the network stage needs; the series is then dropped.
 * Every builder shares one file table (the data files in reading order), so duplicate resolution, which
 * compares file order, is the same as when every file is read into one builder.
 */
import type { FileReport, PassageEvent, StationMeta, StationSeries } from '../model/index.js';
import { readDataFiles, type DataFile, type ReadOptions } from '../ingest/readPaths.js';
import { buildStationIndex, resolveStation, type StationIndex } from '../ingest/stations.js';
import { SeriesBuilder, type StationRows } from '../series/seriesBuilder.js';
import { deriveStationPressure } from '../series/deriveStationPressure.js';
import { applyQc, type QcSummary } from '../qc/qc.js';
import type { DetectOptions } from '../detect/types.js';
import { fieldsOf } from '../network/frontogenesis.js';
import { detectWithOperatorFields, type RunwayHeading } from '../report/operatorFields.js';
import { inspectStation, type InspectStation } from '../report/inspect.js';
import type { ShardStation } from './shard.js';

/** Per station: its passages, or why detection failed. */
export type StationOutcome = { events: PassageEvent[] } | { error: string };

/** What the single-station detector needs (detection options and runways). */
export type StationDetectOptions = DetectOptions & { runways?: readonly RunwayHeading[] };

/** The reading options a worker can be given (no callbacks, no standard input). */
export type WorkerReadOptions = Omit<ReadOptions, 'onNote' | 'stdinText' | 'stdinFd'>;

/** What every task of one run shares: the stations files' stations, how to read, the data files in reading order. */
export interface RunContext {
  stations: StationMeta[];
  read: WorkerReadOptions;
  /** The data files; a file whose `stream` names a path can be read in any thread (its `bytes` are left out). */
  files: DataFile[];
}

/** A context made ready for work: the station index and the shared file table. */
export interface PreparedContext {
  ctx: RunContext;
  index: StationIndex;
  names: string[];
}

export function prepareContext(ctx: RunContext): PreparedContext {
  return { ctx, index: buildStationIndex(ctx.stations), names: ctx.files.map((f) => f.path) };
}

/** Whether a data file can be read again from its path (in a worker, or a second time). */
export function readableByPath(f: DataFile): boolean {
  return f.stream !== undefined && 'file' in f.stream;
}

/** What reading one file whole gave. */
export interface FileCensus {
  reports: FileReport[];
  /** Station positions its CSV or ISD rows carried (raw id → position). */
  positions: [string, { latDeg: number; lonDeg: number; elevationM: number }][];
  notes: string[];
  /** Resolved station ids with rows in the file, in order of first appearance, and their row counts. */
  stations: string[];
  rows: number[];
  /** The rows per station when the file is not read again (several stations, or not readable by path). */
  held?: StationRows[];
}

/** A data file as a worker is given it: without the bytes held in memory (only path-streamed files go to workers). */
export function fileForWorker(f: DataFile): DataFile {
  return { ...f, bytes: Buffer.alloc(0) };
}

function builderOf(p: PreparedContext): SeriesBuilder {
  return new SeriesBuilder((id) => resolveStation(p.index, id).id, p.names);
}

/** Read data file number `at` whole (`f` given when it is held in this thread's memory). */
export function censusFile(p: PreparedContext, at: number, f: DataFile = p.ctx.files[at]!): FileCensus {
  const notes: string[] = [];
  const builder = builderOf(p);
  const read = readDataFiles([restoreBytes(f)], { ...p.ctx.read, onNote: (m) => notes.push(m) }, (o) => builder.add(o), p.index);
  const stations = builder.stations();
  const c: FileCensus = { reports: read.reports, positions: [...read.positions], notes, stations, rows: stations.map((id) => builder.columns(id)!.length) };
  // each station's rows are forgotten by the builder as they are handed over (not two copies of a large file at once)
  if (stations.length > 1 || !readableByPath(f)) c.held = stations.map((id) => builder.take(id));
  return c;
}

/** A structured clone turns a Buffer into a Uint8Array: the readers need a Buffer. */
function restoreBytes(f: DataFile): DataFile {
  if (Buffer.isBuffer(f.bytes)) return f;
  const b = f.bytes as Uint8Array;
  return { ...f, bytes: Buffer.from(b.buffer, b.byteOffset, b.byteLength) };
}

/** One station's rows, file by file in reading order: rows handed back by the census, or a file read again. */
export type StationPart = { file: number; rows: StationRows } | { file: number };

export interface StationTask {
  station: string;
  meta?: StationMeta;
  parts: StationPart[];
  /** Detect (with these options); without, only the series' details for the load summary. */
  detect?: StationDetectOptions;
}

export interface StationResult {
  station: string;
  /** Inspect details of the series (QC counts only when detected). */
  details: InspectStation;
  rows: number;
  outcome?: StationOutcome;
  network?: ShardStation;
}

/** Build one station's QC'd series: rows in, station pressure derived, QC applied. */
export function stationSeries(builder: SeriesBuilder, id: string, meta: StationMeta | undefined): { series: StationSeries; qc: QcSummary } {
  const s = builder.build(id, meta);
  deriveStationPressure(s);
  return { series: s, qc: applyQc(s) };
}

/** Single-station detection with the operators' fields; a failure becomes the outcome's reason. */
export function detectOutcome(s: StationSeries, opts: StationDetectOptions): StationOutcome {
  try {
    return { events: detectWithOperatorFields(s, opts) };
  } catch (e) {
    return { error: e instanceof Error ? e.message : String(e) };
  }
}

/** What the network stage needs of a station: from its series in one run, from a shard output in a merge. */
export function networkStation(s: StationSeries, outcome: StationOutcome): ShardStation {
  const st: ShardStation = { station: s.station };
  if (s.meta) st.meta = s.meta;
  if (s.length > 0) st.span = { startMs: s.timeMs[0]!, endMs: s.timeMs[s.length - 1]! };
  if ('error' in outcome) st.failure = `detection failed: ${outcome.error}`;
  else if (s.meta && Number.isFinite(s.meta.latDeg)) st.fields = fieldsOf(s, s.meta);
  return st;
}

/** One station of a streamed run, its series held only here. */
export function stationWork(p: PreparedContext, task: StationTask): StationResult {
  const builder = builderOf(p);
  for (const part of task.parts) {
    if ('rows' in part) builder.addRows(task.station, part.rows);
    else readDataFiles([p.ctx.files[part.file]!], { ...p.ctx.read, onNote: () => {} }, (o) => builder.add(o), p.index);
  }
  if (!task.detect) {
    const s = builder.build(task.station, task.meta);
    return { station: task.station, details: inspectStation(s), rows: s.length };
  }
  const { series: s, qc } = stationSeries(builder, task.station, task.meta);
  const outcome = detectOutcome(s, task.detect);
  return { station: task.station, details: inspectStation(s, qc), rows: s.length, outcome, network: networkStation(s, outcome) };
}
