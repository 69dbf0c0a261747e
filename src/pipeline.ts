/**
 * The one orchestrator of fropa's main job:
 *   read (ingest) → series (one per station) → station pressure → QC → detect → track → frontogenesis.
 * `loadPaths` runs the first four stages over files, `analyseSeries` the last three over series; the CLI commands
 * and library callers share both. Writers (CSV/JSON/tables/HTML) turn the results into outputs.
 */
import type { BoundaryKind, FileReport, FrontTrack, PassageEvent, StationMeta, StationSeries } from './model/index.js';
import { readDataFiles, scanPaths, type DataFile, type ReadOptions, type StationPositions } from './ingest/readPaths.js';
import { buildStationIndex, resolveStation, type StationIndex } from './ingest/stations.js';
import { SeriesBuilder } from './series/seriesBuilder.js';
import type { QcSummary } from './qc/qc.js';
import type { DetectOptions } from './detect/types.js';
import { checkDetectOptions, DEFAULT_MIN_CONFIDENCE } from './detect/detect.js';
import { trackFronts, withTrackSpeeds } from './network/track.js';
import { withFrontogenesisFields, type StationFields, type StationFieldsRef } from './network/frontogenesis.js';
import { FieldSpill } from './parallel/fieldSpill.js';
import { withNetworkCoherence } from './network/coherence.js';
import { defaultJobs, detectInPool, MEMORY_LIMIT, WorkerPool, type PoolResult, type PoolTask, type StationOutcome } from './parallel/detectPool.js';
import { censusFile, detectOutcome, fileForWorker, networkStation, prepareContext, readableByPath, stationSeries, stationWork, type FileCensus, type PreparedContext, type RunContext, type StationPart, type StationResult, type StationTask } from './parallel/stationWork.js';
import type { InspectStation } from './report/inspect.js';
import { inShard, shardToNdjson, type ShardContent, type ShardHeader, type ShardSpec, type ShardStation } from './parallel/shard.js';
import { newFileReport, UsageError } from './model/index.js';
import type { RunwayHeading } from './report/operatorFields.js';

/** How to read the inputs (time zone, column mapping, stations file, …). */
export type LoadOptions = ReadOptions;

export interface LoadResult {
  /** One QC'd series per station, sorted by id. */
  series: StationSeries[];
  /** One report per input file, in reading order. */
  reports: FileReport[];
  /** Stations read from stations files. */
  stations: StationMeta[];
  /** QC summary per station id. */
  qc: Map<string, QcSummary>;
}

/**
 * Read every path and build one QC'd series per station: station ids resolved through the stations files
 * (aliases), metadata attached (or the position CSV rows carried), station pressure derived from the altimeter
 * setting, QC applied. Throws UsageError for a missing path or an unreadable stations file; data problems are
 * counted in the reports, never thrown.
 */
export function loadPaths(paths: readonly string[], opts: LoadOptions = {}): LoadResult {
  const scanned = scanPaths(paths, opts);
  // Every observation goes straight into per-station columns; ids are resolved once per distinct id.
  const index = buildStationIndex(scanned.stations);
  const builder = new SeriesBuilder((id) => resolveStation(index, id).id);
  const read = readDataFiles(scanned.dataFiles, opts, (o) => builder.add(o), index);
  return { ...seriesFromBuilder(builder, index, read.positions), reports: [...scanned.reports, ...read.reports], stations: scanned.stations };
}

/** One series per resolved station (sorted ids): metadata from the index or the CSV position, station pressure, QC. */
function seriesFromBuilder(builder: SeriesBuilder, index: StationIndex, positions: StationPositions): { series: StationSeries[]; qc: Map<string, QcSummary> } {
  const series: StationSeries[] = [];
  const qc = new Map<string, QcSummary>();
  for (const id of builder.stations().sort()) {
    let meta = resolveStation(index, id).meta;
    if (!meta) {
      const pos = positions.get(id);
      if (pos && !Number.isNaN(pos.latDeg)) meta = { id, aliases: [], ...pos };
    }
    const r = stationSeries(builder, id, meta);
    qc.set(id, r.qc);
    series.push(r.series);
  }
  return { series, qc };
}

export interface AnalyseOptions extends DetectOptions {
  /** Track fronts across the network (default true). */
  network?: boolean;
  /** Keep only these kinds in the result (tracking still sees every passage). */
  kinds?: ReadonlySet<BoundaryKind> | null;
  /** Runway directions for the cross- and tailwind components of each event (none by default). */
  runways?: readonly RunwayHeading[];
}

export interface ParallelAnalyseOptions extends AnalyseOptions {
  /** Worker threads for detection (default: the number of cores; 1 runs in this thread). */
  jobs?: number;
  /** Called after each station's detection (for progress) with the station's rows. */
  onStation?: (done: number, total: number, rows: number) => void;
}

/** A station whose detection failed: skipped, the run goes on. */
export interface StationFailure {
  station: string;
  reason: string;
}

export interface Analysis {
  /** Sorted by station, then time, then kind. */
  events: PassageEvent[];
  tracks: FrontTrack[];
  /** Stations whose detection failed (skipped), in series order; empty when all went well. */
  failures: StationFailure[];
}

/** Stable order: station, then time, then kind. Sorts in place and returns the array. */
export function sortEvents(events: PassageEvent[]): PassageEvent[] {
  return events.sort((a, b) => (a.station < b.station ? -1 : a.station > b.station ? 1 : a.timeMs - b.timeMs || (a.kind < b.kind ? -1 : a.kind > b.kind ? 1 : 0)));
}

/** Whether tracking runs, and the confidence detection keeps (with a network, weaker passages too: coherence can keep them, network/coherence.ts). */
function detectionPlan(series: readonly StationSeries[], opts: AnalyseOptions): { network: boolean; floor: number; minConfidence: number } {
  return planFor(series.filter((s) => s.meta !== undefined).length, opts);
}

/** {@link detectionPlan} from the number of stations with metadata. */
function planFor(located: number, opts: AnalyseOptions): { network: boolean; floor: number; minConfidence: number } {
  checkDetectOptions(opts);
  const minConfidence = opts.minConfidence ?? DEFAULT_MIN_CONFIDENCE;
  const network = opts.network !== false && located >= 3;
  return { network, floor: network ? minConfidence * 0.7 : minConfidence, minConfidence };
}

/** The single-station detector's options (what a worker needs). */
function stationOptions(opts: AnalyseOptions, floor: number): DetectOptions & { runways?: readonly RunwayHeading[] } {
  const d: DetectOptions & { runways?: readonly RunwayHeading[] } = { minConfidence: floor };
  if (opts.frontSpeedKmh !== undefined) d.frontSpeedKmh = opts.frontSpeedKmh;
  if (opts.model !== undefined) d.model = opts.model;
  if (opts.runways?.length) d.runways = opts.runways;
  return d;
}

/**
 * Detect, track and measure. A station whose detection fails is listed in `failures` (id and reason) and
 * skipped; the others go on. Throws RangeError for a non-positive or non-finite `frontSpeedKmh` or a
 * `minConfidence` outside 0–1 (checkDetectOptions), before any work.
 */
export function analyseSeries(series: readonly StationSeries[], opts: AnalyseOptions = {}): Analysis {
  const plan = detectionPlan(series, opts);
  const dopts = { ...opts, ...stationOptions(opts, plan.floor) };
  const outcomes: StationOutcome[] = series.map((s) => detectOutcome(s, dopts));
  return networkStage(series, outcomes, opts, plan);
}

/**
 * {@link analyseSeries} with detection spread over `jobs` worker threads (detectPool.ts). The result is
 * identical to analyseSeries' for every `jobs` value: stations are detected independently and put back in
 * series order before tracking.
 */
export async function analyseSeriesParallel(series: readonly StationSeries[], opts: ParallelAnalyseOptions = {}): Promise<Analysis> {
  const jobs = opts.jobs ?? defaultJobs();
  if (!(Number.isInteger(jobs) && jobs >= 1)) throw new RangeError(`jobs must be a whole number of at least 1 (got ${jobs})`);
  const { jobs: _jobs, onStation, ...rest } = opts;
  if (jobs === 1 || series.length < 2) {
    const r = analyseSeries(series, rest);
    series.forEach((s, i) => onStation?.(i + 1, series.length, s.length));
    return r;
  }
  const plan = detectionPlan(series, rest);
  const outcomes = await detectInPool(series, stationOptions(rest, plan.floor), jobs, (done, s) => onStation?.(done, series.length, s.length));
  return networkStage(series, outcomes, rest, plan);
}

function networkStage(series: readonly StationSeries[], outcomes: readonly StationOutcome[], opts: AnalyseOptions, plan: { network: boolean; minConfidence: number }): Analysis {
  const events: PassageEvent[] = [];
  outcomes.forEach((o) => {
    if (!('error' in o)) for (const e of o.events) events.push(e);
  });
  return finishAnalysis(series.map((s, i) => networkStation(s, outcomes[i]!)), events, opts, plan);
}

/**
 * Tracking, network coherence, frontogenesis and track speeds over the stations that were detected
 * (`events`: their passages at the detection floor, in station order). Failed stations take no part.
 */
function finishAnalysis(
  stations: readonly ShardStation[],
  events: PassageEvent[],
  opts: AnalyseOptions,
  plan: { network: boolean; minConfidence: number },
  fields: readonly (StationFields | StationFieldsRef)[] = stations.filter((s) => s.failure === undefined && s.fields !== undefined).map((s) => s.fields!),
): Analysis {
  const failures: StationFailure[] = stations.filter((s) => s.failure !== undefined).map((s) => ({ station: s.station, reason: s.failure! }));
  const ok = stations.filter((s) => s.failure === undefined);
  let all = events;
  // A failed station takes no part in tracking: it neither joins fronts nor counts as a neighbour that saw nothing.
  const metas = ok.map((s) => s.meta).filter((m): m is StationMeta => m !== undefined);
  const network = plan.network && metas.length >= 3;
  // Stations that never reported at the same time are never linked into one network or front.
  const spans = new Map(ok.filter((s) => s.span !== undefined).map((s) => [s.station, s.span!]));
  let allTracks = network ? trackFronts(all, metas, { spans }) : [];
  if (network) {
    all = withNetworkCoherence(all, allTracks, metas, spans).filter((e) => e.confidence >= plan.minConfidence);
    // Tracks are refitted on the passages that remain.
    allTracks = trackFronts(all, metas, { spans });
  } else if (plan.network) all = all.filter((e) => e.confidence >= plan.minConfidence);
  allTracks = opts.network === false ? [] : withFrontogenesisFields(allTracks, fields);
  // The fitted speed is the speed normal to the front; an explicit --front-speed wins.
  if (opts.frontSpeedKmh === undefined) all = withTrackSpeeds(all, allTracks);
  const kinds = opts.kinds;
  return {
    // The operators' fields (levels, freeze, precipitation type, wind before, which pressure, runways) after detection.
    events: sortEvents(all.filter((e) => !kinds || kinds.has(e.kind))),
    tracks: allTracks.filter((t) => !kinds || kinds.has(t.kind)),
    failures,
  };
}

/**
 * One shard of a run (`fropa detect --shard K/N`): detection at the stations of the shard (inShard), the
 * plan decided over the whole archive, and the NDJSON records `mergeShards` needs to finish the run.
 */
export async function analyseShard(series: readonly StationSeries[], shard: ShardSpec, opts: ParallelAnalyseOptions = {}): Promise<{ text: string; stations: number; failures: StationFailure[] }> {
  const { jobs: jobsOpt, onStation, ...rest } = opts;
  const plan = detectionPlan(series, rest);
  const mine = series.filter((s) => inShard(s.station, shard));
  const dopts = stationOptions(rest, plan.floor);
  const jobs = jobsOpt ?? defaultJobs();
  const outcomes: StationOutcome[] =
    jobs > 1 && mine.length > 1
      ? await detectInPool(mine, dopts, jobs, (done, s) => onStation?.(done, mine.length, s.length))
      : mine.map((s, i) => {
          const o = detectOutcome(s, { ...rest, ...dopts });
          onStation?.(i + 1, mine.length, s.length);
          return o;
        });
  const stations = mine.map((s, i) => networkStation(s, outcomes[i]!));
  const events = outcomes.flatMap((o) => ('error' in o ? [] : o.events));
  return shardOutput(shard, plan, series.length, rest, stations, events);
}

/** The NDJSON of a shard and its failures. */
function shardOutput(shard: ShardSpec, plan: { network: boolean; floor: number; minConfidence: number }, archiveStations: number, opts: AnalyseOptions, stations: readonly ShardStation[], events: readonly PassageEvent[]): { text: string; stations: number; failures: StationFailure[] } {
  const header: ShardHeader = { shard, network: plan.network, floor: plan.floor, minConfidence: plan.minConfidence, archiveStations };
  if (opts.frontSpeedKmh !== undefined) header.frontSpeedKmh = opts.frontSpeedKmh;
  return { text: shardToNdjson(header, stations, events), stations: stations.length, failures: stations.filter((s) => s.failure).map((s) => ({ station: s.station, reason: s.failure! })) };
}

/**
 * Combine the outputs of shards 1…N (`fropa merge`) into what one run over the whole archive gives: the
 * passages and failures of every station, tracking, coherence and frontogenesis done on the merged passages.
 * Throws UsageError when a shard is missing or repeated, the shards disagree on the archive or the plan, or a
 * station appears twice.
 */
export function mergeShards(contents: readonly { source: string; content: ShardContent }[], opts: { kinds?: ReadonlySet<BoundaryKind> | null } = {}): Analysis & { stations: string[] } {
  if (contents.length === 0) throw new UsageError('name the shard outputs to merge');
  const first = contents[0]!.content.header;
  const seen = new Set<number>();
  for (const { source, content } of contents) {
    const h = content.header;
    if (h.shard.count !== first.shard.count || h.archiveStations !== first.archiveStations || h.network !== first.network || h.floor !== first.floor || h.minConfidence !== first.minConfidence || h.frontSpeedKmh !== first.frontSpeedKmh) {
      throw new UsageError(`${source}: shard ${h.shard.index}/${h.shard.count} is from another run than ${contents[0]!.source} (archive size, shard count or detection options differ)`);
    }
    if (seen.has(h.shard.index)) throw new UsageError(`${source}: shard ${h.shard.index}/${h.shard.count} given twice`);
    seen.add(h.shard.index);
  }
  const missing = Array.from({ length: first.shard.count }, (_, i) => i + 1).filter((k) => !seen.has(k));
  if (missing.length) throw new UsageError(`missing shard${missing.length > 1 ? 's' : ''} ${missing.join(', ')} of ${first.shard.count}: every shard is needed for the result of one run`);
  const byStation = new Map<string, { st: ShardStation; events: PassageEvent[] }>();
  for (const { source, content } of contents) {
    for (const st of content.stations) {
      if (byStation.has(st.station)) throw new UsageError(`${source}: station ${st.station} is in two shards`);
      byStation.set(st.station, { st, events: [] });
    }
    for (const e of content.events) {
      const entry = byStation.get(e.station);
      if (!entry) throw new UsageError(`${source}: a passage at ${e.station}, which has no station record`);
      entry.events.push(e);
    }
  }
  if (byStation.size !== first.archiveStations) throw new UsageError(`the shards hold ${byStation.size} stations, the archive ${first.archiveStations}`);
  // As in one run: stations in id order (loadPaths sorts them), each station's passages in detection order.
  const ids = [...byStation.keys()].sort();
  const stations = ids.map((id) => byStation.get(id)!.st);
  const events = ids.flatMap((id) => byStation.get(id)!.events);
  const plan = { network: first.network, minConfidence: first.minConfidence };
  // Detection options travel in the header; the merge adds only the kinds to keep.
  const fopts: AnalyseOptions = { kinds: opts.kinds ?? null, network: first.network ? undefined : false };
  if (first.frontSpeedKmh !== undefined) fopts.frontSpeedKmh = first.frontSpeedKmh;
  return { ...finishAnalysis(stations, events, fopts, plan), stations: ids };
}

export interface StreamOptions extends ParallelAnalyseOptions {
  /** Detect only this shard's stations and give its NDJSON records (as analyseShard). */
  shard?: ShardSpec;
  /** Keep every station's inspect details for the load summary (default true; in a shard the other stations are read again for them). */
  details?: boolean;
  /** Called once every file is read, with the number of stations to detect, their rows and the file reports (for progress). */
  onPlan?: (stations: number, rows: number, files: number) => void;
  /** With `jobs` 1, archives with fewer rows to detect than this run their stations in this thread, larger ones in one worker with a bounded heap (default INLINE_MAX_ROWS). */
  inlineMaxRows?: number;
}

/** What a streamed run read: the file reports, the stations, and per station the details of its series. */
export interface StreamedLoad {
  /** One report per input file, in reading order (as LoadResult.reports). */
  reports: FileReport[];
  /** Stations read from stations files. */
  stations: StationMeta[];
  /** Station ids with data, sorted (as LoadResult.series' ids). */
  ids: string[];
  /** Metadata of the stations that have it, in id order (as LoadResult.series' metas). */
  metas: StationMeta[];
  /** Inspect details per station, in id order (absent for a station whose work failed, or with `details: false`). */
  details: InspectStation[];
}

/** Below this many rows to detect, `--jobs 1` runs its stations in the main thread (common practice, no source: about 10 station-years of hourly reports). */
const INLINE_MAX_ROWS = 100_000;

/**
 * `loadPaths` and `analyseSeriesParallel` (or `analyseShard`) in one streamed pass with bounded memory: every data
 * file is read once to learn its stations (its report and notes kept), then each station is done on its own:
 * its rows (from the files that hold only it, read again, and the rows kept of files that hold several) → series
 * → station pressure → QC → detection → the compact record the network stage needs; the series is dropped.
 * Files and stations go to `jobs` worker threads (each reads its own files). Results, reports and notes are
 * those of loadPaths followed by analyseSeriesParallel (or analyseShard), for every `jobs` value and input order.
 * A station whose work fails is reported (failures) and skipped.
 */
export async function detectPaths(paths: readonly string[], loadOpts: LoadOptions, opts: StreamOptions = {}): Promise<{ load: StreamedLoad; analysis?: Analysis; shard?: { text: string; stations: number; failures: StationFailure[] } }> {
  const { jobs: jobsOpt, onStation, onPlan, shard, details: wantDetails, inlineMaxRows = INLINE_MAX_ROWS, ...rest } = opts;
  const jobs = jobsOpt ?? defaultJobs();
  if (!(Number.isInteger(jobs) && jobs >= 1)) throw new RangeError(`jobs must be a whole number of at least 1 (got ${jobs})`);
  checkDetectOptions(rest);
  const scanned = scanPaths(paths, loadOpts);
  const files = scanned.dataFiles;
  const { onNote: _n, stdinText: _t, stdinFd: _f, ...read } = loadOpts;
  const ctx: RunContext = { stations: scanned.stations, read, files };
  const prep = prepareContext(ctx);
  // workers get the files they may read by path (the others are read here)
  const byPath = files.map(readableByPath);
  const workerCtx: RunContext = { ...ctx, files: files.map(fileForWorker) };
  let pool = jobs > 1 && files.length > 0 ? new WorkerPool(jobs, workerCtx) : null;
  let spill: FieldSpill | null = null;
  try {
    // 1. Every file once: its stations, report, notes, positions (and the rows of files read only once).
    const census: FileCensus[] = new Array(files.length);
    const inWorkers = files.map((_, i) => i).filter((i) => pool && byPath[i]);
    const census1 = pool ? pool.run<FileCensus>(inWorkers.map((i) => ({ kind: 'census', at: i, file: fileForWorker(files[i]!) })), {}) : null;
    files.forEach((f, i) => {
      if (!(pool && byPath[i])) census[i] = censusFile(prep, i, f);
    });
    if (census1) (await census1).forEach((r, k) => (census[inWorkers[k]!] = 'error' in r ? failedCensus(files[inWorkers[k]!]!, r.error) : r.value));
    const note = loadOpts.onNote ?? (() => {});
    const reports = [...scanned.reports];
    const positions: StationPositions = new Map();
    const parts = new Map<string, StationPart[]>();
    const rowsOf = new Map<string, number>();
    census.forEach((c, i) => {
      for (const m of c.notes) note(m);
      reports.push(...c.reports);
      for (const [id, pos] of c.positions) positions.set(id, pos);
      c.stations.forEach((id, k) => {
        let list = parts.get(id);
        if (!list) parts.set(id, (list = []));
        list.push(c.held ? { file: i, rows: c.held[k]! } : { file: i });
        rowsOf.set(id, (rowsOf.get(id) ?? 0) + c.rows[k]!);
      });
      // the rows now belong to their stations' tasks only
      delete c.held;
    });
    const ids = [...parts.keys()].sort();
    const metaOf = new Map<string, StationMeta>();
    for (const id of ids) {
      let meta = resolveStation(prep.index, id).meta;
      if (!meta) {
        const pos = positions.get(id);
        if (pos && !Number.isNaN(pos.latDeg)) meta = { id, aliases: [], ...pos };
      }
      if (meta) metaOf.set(id, meta);
    }
    const load: StreamedLoad = { reports, stations: scanned.stations, ids, metas: ids.filter((id) => metaOf.has(id)).map((id) => metaOf.get(id)!), details: [] };
    if (ids.length === 0) return { load };
    // 2. Station by station: the plan is the one loadPaths + analyseSeries would make of the whole archive.
    const plan = planFor(metaOf.size, rest);
    const dopts = stationOptions(rest, plan.floor);
    const detectHere = (id: string) => !shard || inShard(id, shard);
    const todo = ids.filter((id) => detectHere(id) || wantDetails !== false);
    const tasks: StationTask[] = todo.map((id) => {
      const t: StationTask = { station: id, parts: parts.get(id)! };
      const meta = metaOf.get(id);
      if (meta) t.meta = meta;
      if (detectHere(id)) t.detect = dopts;
      return t;
    });
    parts.clear();
    const detected = tasks.filter((t) => t.detect).length;
    const rowsToDetect = tasks.reduce((a, t) => a + (t.detect ? rowsOf.get(t.station)! : 0), 0);
    onPlan?.(detected, rowsToDetect, reports.length);
    let done = 0;
    // The frontogenesis fields of a whole run go to a temporary file as each station is done (not in a shard: its output holds them).
    spill = shard ? null : new FieldSpill();
    const progress = (i: number, t: StationTask, r: PoolResult<StationResult>) => {
      const st = 'value' in r ? r.value.network : undefined;
      if (spill && st?.fields) {
        fieldsKept[i] = spill.keep(st.fields);
        delete st.fields;
      }
      if (t.detect) onStation?.(++done, detected, rowsOf.get(t.station)!);
    };
    const fieldsKept: (StationFields | StationFieldsRef | undefined)[] = new Array(tasks.length);
    /** One station in this thread; its rows are dropped once done. */
    const inline = (i: number, t: StationTask): PoolResult<StationResult> => {
      let r: PoolResult<StationResult>;
      try {
        r = { value: stationWork(prep, t) };
      } catch (e) {
        r = { error: e instanceof Error ? e.message : String(e) };
      }
      tasks[i] = { ...t, parts: [] };
      progress(i, t, r);
      return r;
    };
    let results: PoolResult<StationResult>[];
    // With one job a large archive still runs its stations in one worker with a bounded heap (in this thread V8
    // lets garbage grow with the archive: 200 station-years of hourly METAR reached 756 MB, 412 MB with a 256 MB
    // old generation); a small one runs here (a worker's start-up is not worth it).
    const stationJobs = pool ? jobs : files.length > 0 && rowsToDetect >= inlineMaxRows ? 1 : 0;
    if (stationJobs > 0) {
      // longest first (see detectInPool), stations only read for their details last
      const order = tasks.map((_, i) => i).sort((a, b) => Number(!tasks[a]!.detect) - Number(!tasks[b]!.detect) || rowsOf.get(tasks[b]!.station)! - rowsOf.get(tasks[a]!.station)! || a - b);
      // Memory bounded by the largest station: stations run side by side only while their rows stay within the
      // largest station's plus a median station's per other worker (two of the largest of a mixed archive never run
      // at once, the smaller ones fill the other workers; stations of one size all run side by side).
      const weights = tasks.map((t) => rowsOf.get(t.station)!);
      const sorted = [...weights].sort((a, b) => a - b);
      const largest = sorted[sorted.length - 1]!;
      const budget = largest + (stationJobs - 1) * sorted[sorted.length >> 1]!;
      // The station workers' heaps are bounded too (V8 otherwise lets garbage grow far beyond what a station keeps
      // alive): 128 MB, or 1.5 kB per row of the largest station; a station that needs more is done again here.
      await pool?.close();
      pool = new WorkerPool(stationJobs, workerCtx, { maxOldGenerationSizeMb: Math.max(128, Math.ceil((largest * 1536) / 2 ** 20)) });
      const poolTasks = tasks.map((task): PoolTask => ({ kind: 'station', task }));
      results = await pool.run<StationResult>(poolTasks, {
        order,
        weights,
        budget,
        onDone: (_d, i, r) => {
          if ('error' in r && r.error.includes(MEMORY_LIMIT)) return;
          progress(i, tasks[i]!, r);
          // its rows are not needed any more
          tasks[i] = { ...tasks[i]!, parts: [] };
          poolTasks[i] = { kind: 'station', task: tasks[i]! };
        },
      });
      await pool.close();
      results.forEach((r, i) => {
        if (!('error' in r && r.error.includes(MEMORY_LIMIT))) return;
        results[i] = inline(i, tasks[i]!);
      });
    } else {
      results = tasks.map((t, i) => inline(i, t));
    }
    // the workers' memory is given back before tracking
    await pool?.close();
    const stations: ShardStation[] = [];
    const events: PassageEvent[] = [];
    const fields: (StationFields | StationFieldsRef)[] = [];
    results.forEach((r, i) => {
      const t = tasks[i]!;
      if ('value' in r) load.details.push(r.value.details);
      if (!detectHere(t.station)) return;
      if ('error' in r) {
        // as a worker that stopped during detection of a series (detectInPool)
        const st: ShardStation = { station: t.station, failure: `detection failed: ${r.error}` };
        const meta = metaOf.get(t.station);
        if (meta) st.meta = meta;
        stations.push(st);
        return;
      }
      stations.push(r.value.network!);
      const f = fieldsKept[i] ?? r.value.network!.fields;
      if (f && r.value.network!.failure === undefined) fields.push(f);
      const o = r.value.outcome!;
      if (!('error' in o)) for (const e of o.events) events.push(e);
    });
    if (shard) return { load, shard: shardOutput(shard, plan, ids.length, rest, stations, events) };
    return { load, analysis: finishAnalysis(stations, events, rest, plan, fields) };
  } finally {
    await pool?.close();
    spill?.close();
  }
}

/** The census of a file whose reading failed in a worker: an unreadable file, its reason in its report. */
function failedCensus(f: DataFile, error: string): FileCensus {
  const r: FileReport = { ...newFileReport(f.path, 'unreadable'), notes: [`cannot read the file (${error})`] };
  return { reports: [r], positions: [], notes: [`${f.path}: cannot read the file (${error})`], stations: [], rows: [] };
}
