/** `fropa verify <paths...> --forecasts FILE`: detect passages in the observations, verify forecast passage times against them. */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { analyseSeries, buildStationIndex, issueLine, loadPaths, readForecastsText, verificationToCsv, verificationToJson, verificationToTable, verifyForecasts, UsageError, noDataMessage } from '../../src/index.js';
import { inputArgs, resolveLoadOptions, writeOutput, type CliIo } from '../options.js';
import { detectOptions, parseKinds } from './detect.js';

/** Run verify; returns the exit code (1 when there are no observations or no usable forecasts). */
export async function run(raw: Record<string, unknown>, io: CliIo): Promise<number> {
  const args = inputArgs(raw);
  const forecastFile = raw.forecasts === undefined ? undefined : String(Array.isArray(raw.forecasts) ? raw.forecasts[raw.forecasts.length - 1] : raw.forecasts);
  if (!forecastFile) throw new UsageError('--forecasts FILE is required: a CSV of station, kind, forecast_time, issued_time');
  const kinds = parseKinds(raw.kinds);
  const dopts = detectOptions(raw);
  const windowHours = raw.windowHours === undefined ? 6 : Number(Array.isArray(raw.windowHours) ? raw.windowHours[raw.windowHours.length - 1] : raw.windowHours);
  if (!(windowHours > 0 && windowHours <= 72)) throw new UsageError('--window-hours must be a number of hours above 0 and at most 72 (default 6)');
  let text: string;
  try {
    text = readFileSync(forecastFile, 'utf8');
  } catch {
    throw new UsageError(`${forecastFile}: cannot read the forecast file`);
  }
  const opts = await resolveLoadOptions(args, io);
  // The forecast file may sit inside an observation folder; the loader's note that it skipped it is noise here.
  const note = opts.onNote;
  if (note) opts.onNote = (m) => (resolve(m.split(':')[0]!) === resolve(forecastFile) ? undefined : note(m));
  const result = loadPaths(args.paths, opts);
  if (result.series.length === 0) {
    io.stderr(noDataMessage(args.paths, result.reports));
    return 1;
  }
  const { events } = analyseSeries(result.series, { ...dopts, network: false });
  const { forecasts, report } = readForecastsText(text, forecastFile, {
    stations: buildStationIndex(result.stations),
    observedStations: new Set(result.series.map((s) => s.station)),
    zone: opts.zone,
    offsetMinutes: opts.offsetMinutes,
    standardTime: opts.standardTime,
  });
  if (!args.quiet) {
    for (const n of report.notes) io.stderr(`fropa: note: ${forecastFile}: ${n}\n`);
    if (report.rejected) {
      const reasons = Object.entries(report.rejectedByReason).map(([k, n]) => `${k} ${n}`).join(', ');
      io.stderr(`fropa: ${forecastFile}: ${report.parsed} forecasts read, ${report.rejected} lines rejected (${reasons})\n`);
      for (const i of report.issues.slice(0, 5)) io.stderr(`  ${issueLine(i)}\n`);
    }
  }
  if (forecasts.length === 0) {
    io.stderr(`fropa: no usable forecasts in ${forecastFile}\n`);
    if (args.quiet) for (const i of report.issues.slice(0, 3)) io.stderr(`  ${issueLine(i)}\n`);
    return 1;
  }
  const r = verifyForecasts(forecasts, events, { windowHours, ...(kinds ? { kinds: [...kinds] } : {}) });
  const format = String(raw.format ?? 'table');
  const out =
    format === 'csv'
      ? verificationToCsv(r)
      : format === 'json'
        ? verificationToJson(r)
        : verificationToTable(r, { forecastFile, observedCount: events.length });
  await writeOutput(out, args.out, io);
  return 0;
}
