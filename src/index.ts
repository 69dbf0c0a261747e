/** fropa library surface. The CLI lives in cli/ and is not exported here. */
export * from './ingest/types.js';
export * from './series/series.js';
