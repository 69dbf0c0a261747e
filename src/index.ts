/** fropa library surface. The CLI lives in cli/ and is not exported here. */
export * from './ingest/types.js';
export * from './series/series.js';
export { loadPaths, UsageError, type LoadOptions, type LoadResult } from './ingest/load.js';
export { readMetarText, decodeMetar } from './ingest/metar.js';
export { readCsvText, readCsvStream } from './ingest/csv.js';
export { readStationsText } from './ingest/stations.js';
export { applyQc, cleanColumn } from './qc/qc.js';
export { detectStation } from './detect/detect.js';
export * from './detect/types.js';
export * from './report/format.js';
export * from './report/fronts.js';
export * from './network/track.js';
export { withFrontogenesis, petterssenFrontogenesis } from './network/frontogenesis.js';
export { planeGradient } from './network/gradient.js';
export * from './verify/contingency.js';
export { verifyForecasts } from './verify/verify.js';
export { readForecastsText } from './verify/forecasts.js';
export * as physics from './physics/index.js';
