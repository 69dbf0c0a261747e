/**
 * fropa library surface: the pipeline, the readers, the writers and the domain types. The CLI (cli/) imports
 * only this module; nothing here imports the CLI. Internals (cell formatters, builder helpers, issue counters)
 * stay behind it.
 */

// Domain model (canonical units: °C, hPa, m/s, degrees true, epoch ms UTC; missing is NaN).
export { BOUNDARY_KINDS, QC, SERIES_FIELDS, UsageError, WX } from './model/index.js';
export type {
  BoundaryKind,
  DuplicateNote,
  DuplicateReason,
  FieldColumns,
  FileReport,
  FrontTrack,
  Observation,
  ObserverRemark,
  ParseIssue,
  PassageEvent,
  SeriesField,
  SourceLine,
  StationMeta,
  StationSeries,
  StrengthTrend,
  TrackMember,
} from './model/index.js';

// The pipeline: read → series → station pressure → QC (loadPaths); detect → track → frontogenesis (analyseSeries).
export { analyseSeries, analyseSeriesParallel, loadPaths, sortEvents, type ParallelAnalyseOptions, type StationFailure } from './pipeline.js';
export { defaultJobs } from './parallel/detectPool.js';
export { analyseShard, detectPaths, mergeShards, type StreamOptions, type StreamedLoad } from './pipeline.js';
export { fnv1a32, inShard, parseShard, shardFromNdjson, type ShardContent, type ShardSpec } from './parallel/shard.js';
export type { AnalyseOptions, Analysis, LoadOptions, LoadResult } from './pipeline.js';

// Readers: text or bytes → observations (or parse issues) and a file report.
export { decodeMetar, isParseIssue, readMetarBytes, readMetarText } from './ingest/metar.js';
export type { MetarReadOptions, MetarReport } from './ingest/metar.js';
export { readCsvBytes, readCsvStream, readCsvText } from './ingest/csv.js';
export type { CsvOptions, CsvResult } from './ingest/csv.js';
export { buildStationIndex, readStationsText, resolveStation } from './ingest/stations.js';
export type { ResolvedStation, StationIndex } from './ingest/stations.js';
export { loadMappingFile, parseColumnOverride } from './ingest/columns.js';
export type { ColumnOverride, MappingFile } from './ingest/columns.js';
export { readForecastsText } from './verify/forecasts.js';
export type { ForecastPassage, ForecastReadOptions } from './verify/forecasts.js';

// Stages, for callers who assemble their own pipeline.
export { buildSeries } from './series/series.js';
export { applyQc } from './qc/qc.js';
export type { QcSummary } from './qc/qc.js';
export { checkDetectOptions, detectStation } from './detect/detect.js';
export type { DetectOptions } from './detect/types.js';
export { trackFronts } from './network/track.js';
export type { TrackOptions } from './network/track.js';
export { withFrontogenesis } from './network/frontogenesis.js';
export { verifyForecasts } from './verify/verify.js';
export type { VerifyOptions, VerifyResult } from './verify/verify.js';
export { csi, far, frequencyBias, pod, proportionCorrect, type Contingency } from './verify/contingency.js';

// Writers: records, CSV, JSON, NDJSON, tables, the output folder, the HTML report, inspect, verification.
export { EVENT_COLUMNS, WIND_UNITS, eventToRecord, eventsToCsv, eventsToJson, eventsToNdjson, eventsToNdjsonPieces, eventsToTable, recordColumns, summaryLines } from './report/format.js';
export type { EventColumn, EventRecord, RecordOptions, RecordValue, TableOptions, WindUnit } from './report/format.js';
export { operatorFields, parseRunways, precipIntensityOf, precipTypesOf, pressureSource, windOnRunway, withOperatorFields, type RunwayHeading } from './report/operatorFields.js';
export { FRONT_COLUMNS, eventsAndTracksToJson, passagesToTable, trackToRecord, tracksToCsv, tracksToJson, tracksToNdjson, tracksToTable } from './report/fronts.js';
export type { FrontColumn } from './report/fronts.js';
export { outputFolderFiles, writeOutputFolder, type OutputFile } from './report/outputFolder.js';
export { arrivalsAt, arrivalsToCsv, arrivalsToJson, arrivalsToTable, arrivalToRecord, ARRIVAL_COLUMNS, parsePoint, parsePointsFile, type Arrival, type PointOfInterest } from './report/arrivals.js';
export { toGeoJson, type GeoJsonInput } from './report/geojson.js';
export { fittedPassageMs, isochrone } from './network/fittedTime.js';
export { checkOutputs, writeFilesSafely, type PlannedFile, type SafeWriteOptions } from './report/safeWrite.js';
export { eventsInPeriod, parsePeriodTime, periodOutsideData, selectStations } from './report/period.js';
export { reportHtml } from './report/html/reportHtml.js';
export { loadGeography, type Geography } from './report/html/geography.js';
export type { ReportFile, ReportInput } from './report/html/reportHtml.js';
export { buildInspect, inspectFiles, inspectToTable, issueLine, noDataMessage, summaryLine } from './report/inspect.js';
export type { InspectFile, InspectStation } from './report/inspect.js';
export { VERIFY_COLUMNS, verificationRecords, verificationToCsv, verificationToJson, verificationToTable } from './verify/format.js';
export type { VerifyColumn, VerifyRecord, VerifyTableContext } from './verify/format.js';
export { CAUTION } from './report/caution.js';

// Formulas (dew point, potential temperature, pressure reduction, wind, sun, geodesy), as a namespace.
export * as physics from './physics/index.js';

// Verification: optimal matching, issues and lead times, forecast series, bootstrap intervals.
export { matchOptimal, minCostAssignment } from './verify/assignment.js';
export { bootstrapIntervals, mulberry32 } from './verify/bootstrap.js';
export type { BootstrapOptions, Interval } from './verify/bootstrap.js';
export { CI_SCORES, LEAD_BINS, leadBin, scoresOf, scoresOfOutcomes } from './verify/verify.js';
export type { CiScore, CoveragePeriod, LeadBin, OutcomeKind, VerifiedOutcome, VerifiedPair, VerifyScores } from './verify/verify.js';
export { seriesForecasts, seriesSpans } from './verify/seriesForecasts.js';
export type { ForecastSeriesSpan } from './verify/seriesForecasts.js';
export { SCORE_COLUMNS, verificationScoresToCsv } from './verify/format.js';
// Season summaries (fropa season).
export { distribution, seasonSummary, SEASON_MEASURES, type Distribution, type SeasonGroup, type SeasonSummary } from './season/season.js';
export { seasonToCsv, seasonToJson, seasonToTable } from './season/seasonFormat.js';
export { seasonSection } from './season/seasonHtml.js';
export { timingHistogram, verificationSection } from './verify/verifyHtml.js';
export type { ReportSection } from './report/html/reportHtml.js';
