/**
 * Shared record types for every reader: raw line → parsed observation, or a reason it was rejected.
 * Canonical internal units: °C, hPa, m/s, degrees true, epoch ms UTC. Missing is NaN.
 */

/** One line of input with where it came from. */
export interface SourceLine {
  text: string;
  file: string;
  /** 1-based line number in `file`. */
  line: number;
}

/** Why a line (or a group in it) could not be used. */
export interface ParseIssue {
  file: string;
  /** 1-based line number. */
  line: number;
  /** Short machine-friendly reason key, e.g. `no-time`, `bad-wind-group`, `truncated`. */
  reason: string;
  /** Human-readable explanation with a remedy where possible. */
  message: string;
  /** Offending group or cell, when there is one. */
  group?: string;
  /** 1-based column (character for METAR, field for CSV), when known. */
  column?: number;
}

/** Present-weather bit flags (WMO-No. 306 code table 4678 phenomena of interest to fronts). */
export const WX = {
  RAIN: 1 << 0,
  SNOW: 1 << 1,
  DRIZZLE: 1 << 2,
  THUNDER: 1 << 3,
  HAIL: 1 << 4,
  SHOWER: 1 << 5,
  FOG: 1 << 6,
  SQUALL: 1 << 7,
  FREEZING: 1 << 8,
  HEAVY: 1 << 9,
  ICE_PELLETS: 1 << 10,
  DUST: 1 << 11,
  /** Any precipitation (RA, SN, DZ, GR, GS, PL, SG, IC, UP) */
  PRECIP: 1 << 12,
  /** Lightning or CB reported (remarks or cloud type). */
  CONVECTIVE: 1 << 13,
} as const;

/** Observer remark about a wind shift or frontal passage (FMH-1 §12.7 remarks `WSHFT hhmm [FROPA]`). */
export interface ObserverRemark {
  /** Time of the report carrying the remark. */
  reportTimeMs: number;
  /** `WSHFT` (wind shift without frontal label), `FROPA`, `WRM FROPA`, `APRNT FROPA`, ... the literal label. */
  label: string;
  /** True when the remark says the shift was frontal. */
  frontal: boolean;
  /** Time the wind shift began (`WSHFT hhmm`), NaN when not given. */
  shiftTimeMs: number;
  file: string;
  line: number;
}

/**
 * One observation in canonical units. Produced by every reader (METAR, CSV) and consumed by the
 * series builder. All numbers are NaN when missing.
 */
export interface Observation {
  station: string;
  timeMs: number;
  /** 'METAR' | 'SPECI' | 'CSV' */
  source: 'METAR' | 'SPECI' | 'CSV';
  /** Report is a correction (COR / CCA) of an earlier one at the same time. */
  corrected: boolean;
  temperatureC: number;
  dewpointC: number;
  /** Degrees true the wind blows FROM; 0 with speed 0 for calm; NaN for variable/missing. */
  windDirDeg: number;
  windSpeedMs: number;
  gustMs: number;
  stationPressureHpa: number;
  seaLevelPressureHpa: number;
  altimeterHpa: number;
  /** Precipitation amount over the reporting period, mm (NaN unknown). */
  precipMm: number;
  /** Bit set of WX flags. */
  weather: number;
  /** Peak wind since last report, m/s (PK WND), NaN if none. */
  peakWindMs: number;
  /** PRESRR = +1, PRESFR = -1, none = 0. */
  pressureTrend: number;
  /** Station latitude/longitude/elevation from the row itself (CSV), NaN otherwise. */
  latDeg: number;
  lonDeg: number;
  elevationM: number;
  /** Observer remarks (WSHFT / FROPA) in this report. */
  remarks?: ObserverRemark[];
  file: string;
  line: number;
}

/** Make an Observation with every measurement missing. */
export function emptyObservation(station: string, timeMs: number, file: string, line: number): Observation {
  return {
    station,
    timeMs,
    source: 'CSV',
    corrected: false,
    temperatureC: NaN,
    dewpointC: NaN,
    windDirDeg: NaN,
    windSpeedMs: NaN,
    gustMs: NaN,
    stationPressureHpa: NaN,
    seaLevelPressureHpa: NaN,
    altimeterHpa: NaN,
    precipMm: NaN,
    weather: 0,
    peakWindMs: NaN,
    pressureTrend: 0,
    latDeg: NaN,
    lonDeg: NaN,
    elevationM: NaN,
    file,
    line,
  };
}

/** Station metadata (from a stations file or from CSV columns). */
export interface StationMeta {
  id: string;
  /** Other ids some files use for the same station (e.g. 3-letter id for a 4-letter ICAO id). */
  aliases: string[];
  name?: string;
  latDeg: number;
  lonDeg: number;
  elevationM: number;
  /** Coastal flag from the stations file (`coastal` column), used by the sea-breeze classifier. */
  coastal?: boolean;
  /** Direction the sea lies toward, degrees true (onshore wind blows from it), when known. */
  seaBearingDeg?: number;
}

/** Per-file accounting, the raw material for `fropa inspect`. */
export interface FileReport {
  file: string;
  /** 'metar' | 'csv' | 'stations' | 'skipped' */
  format: string;
  /** Total non-blank input lines seen (header included for CSV). */
  lines: number;
  parsed: number;
  rejected: number;
  rejectedByReason: Record<string, number>;
  /** First few issues, for display (all are counted). */
  issues: ParseIssue[];
  /** Units inferred per field, e.g. { temperature: 'degF' }. */
  units: Record<string, string>;
  /** Column → field mapping (CSV). */
  columns?: Record<string, string>;
  /** Notes for the user (e.g. "year and month taken from file name"). */
  notes: string[];
  /** Groups the METAR decoder did not recognise, counted. */
  unknownGroups?: number;
}

export function newFileReport(file: string, format: string): FileReport {
  return { file, format, lines: 0, parsed: 0, rejected: 0, rejectedByReason: {}, issues: [], units: {}, notes: [] };
}

/** Count a rejection in a file report, keeping the first `keep` issues for display. */
export function addIssue(report: FileReport, issue: ParseIssue, keep = 50): void {
  report.rejected++;
  report.rejectedByReason[issue.reason] = (report.rejectedByReason[issue.reason] ?? 0) + 1;
  if (report.issues.length < keep) report.issues.push(issue);
}
