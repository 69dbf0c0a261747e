/**
 * @deprecated The record types moved to src/model/ (observation, station, fileReport, flags). This re-export keeps
 * old import paths compiling; import from src/model/ (or the library entry src/index.ts) instead.
 */
export * from '../model/observation.js';
export * from '../model/station.js';
export * from '../model/fileReport.js';
export { WX } from '../model/flags.js';
