/**
 * What a reader says about its input: where a line came from, why a line was rejected, and per-file accounting
 * (the raw material for `fropa inspect`).
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
  /** What the reader assumed rather than read (units by convention, UTC by convention, a zone, ids from the file name), one short phrase each. */
  assumed?: string[];
  /** Which rule gave the station ids (a station column, the METAR text, the file name...), when a reader says. */
  stationIdRule?: string;
  /** Physical lines that continue a multi-line record (a CSV quoted field holding line breaks). */
  continuationLines?: number;
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
