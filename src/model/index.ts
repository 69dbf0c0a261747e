/** The domain model every stage imports downward: observations, stations, reader reports, series, flags, events, tracks. */
export * from './flags.js';
export * from './observation.js';
export * from './station.js';
export * from './fileReport.js';
export * from './series.js';
export * from './event.js';
export * from './operator.js';
export * from './track.js';
export * from './usageError.js';
