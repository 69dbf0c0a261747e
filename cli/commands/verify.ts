/**
 * `fropa verify <paths...> --forecasts FILE | --forecast-series PATH`: detect passages in the
 * observations, verify forecast passage times (a forecast file, or passages the same detector finds in
 * forecast series) against them.
 */
import { resolve } from 'node:path';
import {
  analyseSeries, issueLine, loadPaths, seriesForecasts, seriesSpans, verificationScoresToCsv, verificationToCsv, verificationToJson,
  verificationToTable, verifyForecasts, UsageError, noDataMessage, type CoveragePeriod, type FileReport, type ForecastPassage,
} from '../../src/index.js';
import { inputArgs, inputFiles, resolveLoadOptions, writeOutput, type CliIo, printLoadSummary } from '../options.js';
import { detectOptions, parseKinds } from './detect.js';
import { parseForecastFile, printForecastReport, readForecastFile } from '../forecastFile.js';

const last = (v: unknown) => (Array.isArray(v) ? v[v.length - 1] : v);
const all = (v: unknown): string[] => (v === undefined ? [] : (Array.isArray(v) ? v : [v]).map(String));

function numberOption(raw: unknown, name: string, check: (x: number) => boolean, what: string): number | undefined {
  if (raw === undefined) return undefined;
  const x = Number(last(raw));
  if (!check(x)) throw new UsageError(`${name} must be ${what}`);
  return x;
}

/** Run verify; returns the exit code (1 when there are no observations or no usable forecasts). */
export async function run(raw: Record<string, unknown>, io: CliIo): Promise<number> {
  const args = inputArgs(raw);
  const forecastFile = raw.forecasts === undefined ? undefined : String(last(raw.forecasts));
  const seriesPaths = all(raw.forecastSeries);
  if (!forecastFile && seriesPaths.length === 0) {
    throw new UsageError('--forecasts FILE (a CSV of station, kind, forecast_time, issued_time) or --forecast-series PATH is required');
  }
  const kinds = parseKinds(raw.kinds);
  const dopts = detectOptions(raw);
  const windowHours = numberOption(raw.windowHours, '--window-hours', (x) => x > 0 && x <= 72, 'a number of hours above 0 and at most 72 (default 6)') ?? 6;
  const validHours = numberOption(raw.validHours, '--valid-hours', (x) => x > 0 && x <= 24 * 31, 'a number of hours above 0 and at most 744');
  const resamples = numberOption(raw.bootstrapResamples, '--bootstrap-resamples', (x) => Number.isInteger(x) && x >= 0 && x <= 100_000, 'an integer from 0 (no intervals) to 100000 (default 1000)') ?? 1000;
  const seed = numberOption(raw.bootstrapSeed, '--bootstrap-seed', (x) => Number.isInteger(x) && x >= 0 && x < 2 ** 32, 'an integer from 0 to 4294967295 (default 1)') ?? 1;
  const text = forecastFile ? readForecastFile(forecastFile) : undefined;
  const opts = await resolveLoadOptions(args, io);
  // The forecast file may sit inside an observation folder; the loader's note that it skipped it is noise here.
  const note = opts.onNote;
  if (note && forecastFile) opts.onNote = (m) => (resolve(m.split(':')[0]!) === resolve(forecastFile) ? undefined : note(m));
  const result = loadPaths(args.paths, opts);
  if (result.series.length === 0) {
    io.stderr(noDataMessage(args.paths, result.reports));
    return 1;
  }
  printLoadSummary(result, Boolean(args.quiet), io);
  const { events } = analyseSeries(result.series, { ...dopts, network: false });
  const observedSpans = new Map<string, [number, number]>(result.series.filter((s) => s.length > 0).map((s) => [s.station, [s.timeMs[0]!, s.timeMs[s.length - 1]!]]));
  const forecasts: ForecastPassage[] = [];
  const coverage: CoveragePeriod[] = [];
  const reports: { label: string; report: FileReport; unit: string }[] = [];
  if (forecastFile && text !== undefined) {
    const { forecasts: fs, report } = parseForecastFile(text, forecastFile, result, opts);
    forecasts.push(...fs);
    reports.push({ label: forecastFile, report, unit: 'forecasts read' });
  }
  for (const p of seriesPaths) {
    const loaded = loadPaths([p], { ...opts, onNote: opts.onNote });
    if (loaded.series.length === 0) {
      io.stderr(`fropa: ${p}: no usable forecast series\n`);
      for (const r of loaded.reports) for (const i of r.issues.slice(0, 3)) io.stderr(`  ${issueLine(i)}\n`);
      continue;
    }
    const det = analyseSeries(loaded.series, { ...dopts, network: false });
    const sf = seriesForecasts(det.events, seriesSpans(loaded.series), observedSpans, p);
    forecasts.push(...sf.forecasts);
    coverage.push(...sf.coverage);
    reports.push({ label: p, report: sf.report, unit: 'series stations and passages used' });
  }
  if (!args.quiet && validHours === undefined && forecastFile && !forecasts.some((f) => Number.isFinite(f.validFromMs ?? NaN) || Number.isFinite(f.validToMs ?? NaN))) {
    io.stderr(`fropa: note: ${forecastFile}: no valid_from/valid_to and no --valid-hours: each forecast covers only ±${windowHours} h around itself, so a passage far from every forecast is not counted as a miss\n`);
  }
  // The summary line of each forecast source, also under --quiet when lines were rejected.
  for (const { label, report, unit } of reports) printForecastReport(label, report, unit, Boolean(args.quiet), io);
  if (forecasts.length === 0 && coverage.length === 0) {
    io.stderr(`fropa: no usable forecasts in ${[forecastFile, ...seriesPaths].filter(Boolean).join(', ')}\n`);
    if (args.quiet) for (const { report } of reports) for (const i of report.issues.slice(0, 3)) io.stderr(`  ${issueLine(i)}\n`);
    return 1;
  }
  const r = verifyForecasts(forecasts, events, {
    windowHours,
    ...(validHours !== undefined ? { validHours } : {}),
    ...(kinds ? { kinds: [...kinds] } : {}),
    coverage,
    bootstrap: resamples === 0 ? false : { resamples, seed },
  });
  const format = String(raw.format ?? 'table');
  const out =
    format === 'csv'
      ? verificationToCsv(r)
      : format === 'json'
        ? verificationToJson(r)
        : format === 'scores'
          ? verificationScoresToCsv(r)
        : verificationToTable(r, {
            forecastFile: [forecastFile, ...seriesPaths].filter(Boolean).join(', '),
            observedCount: events.length,
            rejected: reports.map(({ label, report }) => ({ file: label, rejected: report.rejected, byReason: report.rejectedByReason })),
          });
  await writeOutput(out, args.out, io, { force: args.force, inputs: inputFiles(result.reports, [...args.paths, ...seriesPaths, forecastFile, args.mapping, args.stations]) });
  return 0;
}
