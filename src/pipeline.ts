/**
 * The one orchestrator of fropa's main job:
 *   read (ingest) → series (one per station) → station pressure → QC → detect → track → frontogenesis.
 * `loadPaths` runs the first four stages over files, `analyseSeries` the last three over series; the CLI commands
 * and library callers share both. Writers (CSV/JSON/tables/HTML) turn the results into outputs.
 */
import type { BoundaryKind, FileReport, FrontTrack, PassageEvent, StationMeta, StationSeries } from './model/index.js';
import { readDataFiles, scanPaths, type ReadOptions, type StationPositions } from './ingest/readPaths.js';
import { buildStationIndex, resolveStation, type StationIndex } from './ingest/stations.js';
import { SeriesBuilder } from './series/seriesBuilder.js';
import { deriveStationPressure } from './series/deriveStationPressure.js';
import { applyQc, type QcSummary } from './qc/qc.js';
import type { DetectOptions } from './detect/types.js';
import { checkDetectOptions, DEFAULT_MIN_CONFIDENCE, detectStation } from './detect/detect.js';
import { trackFronts, withTrackSpeeds } from './network/track.js';
import { withFrontogenesis } from './network/frontogenesis.js';
import { withNetworkCoherence } from './network/coherence.js';
import { withOperatorFields, type RunwayHeading } from './report/operatorFields.js';

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
  const read = readDataFiles(scanned.dataFiles, opts, (o) => builder.add(o));
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
    const s = builder.build(id, meta);
    deriveStationPressure(s);
    qc.set(id, applyQc(s));
    series.push(s);
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

export interface Analysis {
  /** Sorted by station, then time, then kind. */
  events: PassageEvent[];
  tracks: FrontTrack[];
}

/** Stable order: station, then time, then kind. Sorts in place and returns the array. */
export function sortEvents(events: PassageEvent[]): PassageEvent[] {
  return events.sort((a, b) => (a.station < b.station ? -1 : a.station > b.station ? 1 : a.timeMs - b.timeMs || (a.kind < b.kind ? -1 : a.kind > b.kind ? 1 : 0)));
}

/**
 * Detect, track and measure. A failure at one station is re-thrown with the station's id.
 * Throws RangeError for a non-positive or non-finite `frontSpeedKmh` or a `minConfidence` outside 0–1
 * (checkDetectOptions), before any work.
 */
export function analyseSeries(series: readonly StationSeries[], opts: AnalyseOptions = {}): Analysis {
  checkDetectOptions(opts);
  let all: PassageEvent[] = [];
  const minConfidence = opts.minConfidence ?? DEFAULT_MIN_CONFIDENCE;
  const metas = series.map((s) => s.meta).filter((m): m is StationMeta => m !== undefined);
  const network = opts.network !== false && metas.length >= 3;
  // With a network, weaker passages are detected too: network coherence can keep them (network/coherence.ts).
  const floor = network ? minConfidence * 0.7 : minConfidence;
  for (const s of series) {
    try {
      all.push(...detectStation(s, { ...opts, minConfidence: floor }));
    } catch (e) {
      throw new Error(`${s.station}: detection failed: ${(e as Error).message}`, { cause: e });
    }
  }
  let allTracks = network ? trackFronts(all, metas) : [];
  if (network) {
    all = withNetworkCoherence(all, allTracks, metas, series).filter((e) => e.confidence >= minConfidence);
    // Tracks are refitted on the passages that remain.
    allTracks = trackFronts(all, metas);
  }
  allTracks = opts.network === false ? [] : withFrontogenesis(allTracks, series);
  // The fitted speed is the speed normal to the front; an explicit --front-speed wins.
  if (opts.frontSpeedKmh === undefined) all = withTrackSpeeds(all, allTracks);
  const kinds = opts.kinds;
  return {
    // The operators' fields (levels, freeze, precipitation type, wind before, which pressure, runways) after detection.
    events: sortEvents(withOperatorFields(all.filter((e) => !kinds || kinds.has(e.kind)), series, opts.runways)),
    tracks: allTracks.filter((t) => !kinds || kinds.has(t.kind)),
  };
}
