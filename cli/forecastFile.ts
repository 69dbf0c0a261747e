/** Reading a forecast-passage file for `verify` and `report --forecasts`: the text, the passages, and what to say about them. */
import { readFileSync } from 'node:fs';
import { buildStationIndex, issueLine, readForecastsText, UsageError, type FileReport, type ForecastPassage, type LoadOptions, type LoadResult } from '../src/index.js';
import type { CliIo } from './options.js';

/** The forecast file's text (UsageError when it cannot be read). */
export function readForecastFile(file: string): string {
  try {
    return readFileSync(file, 'utf8');
  } catch {
    throw new UsageError(`${file}: cannot read the forecast file`);
  }
}

/** The forecast passages of the text, resolved against the stations and observations loaded. */
export function parseForecastFile(text: string, file: string, result: LoadResult, opts: LoadOptions): { forecasts: ForecastPassage[]; report: FileReport } {
  const observedSpans = new Map<string, [number, number]>(result.series.filter((s) => s.length > 0).map((s) => [s.station, [s.timeMs[0]!, s.timeMs[s.length - 1]!]]));
  return readForecastsText(text, file, {
    stations: buildStationIndex(result.stations),
    observedStations: new Set(result.series.map((s) => s.station)),
    observedSpans,
    zone: opts.zone,
    offsetMinutes: opts.offsetMinutes,
    standardTime: opts.standardTime,
  });
}

/** Notes of a forecast source (unless quiet) and its rejected lines (always, with the first issues unless quiet). */
export function printForecastReport(label: string, report: FileReport, unit: string, quiet: boolean, io: CliIo): void {
  if (!quiet) for (const n of report.notes) io.stderr(`fropa: note: ${label}: ${n}\n`);
  if (report.rejected) {
    const reasons = Object.entries(report.rejectedByReason).map(([k, n]) => `${k} ${n}`).join(', ');
    io.stderr(`fropa: ${label}: ${report.parsed} ${unit}, ${report.rejected} rejected (${reasons})\n`);
    if (!quiet) for (const i of report.issues.slice(0, 5)) io.stderr(`  ${issueLine(i)}\n`);
  }
}
