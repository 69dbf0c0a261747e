/** `fropa report <paths...>`: detect passages and track fronts as `detect` does, then write one self-contained HTML page. */
import {
  analyseSeries, CAUTION, loadGeography, eventsInPeriod, loadPaths, parsePeriodTime, periodOutsideData, reportHtml, seasonSection, seasonSummary, selectStations, UsageError,
  verificationSection, verifyForecasts, type ReportSection, type StationMeta, noDataMessage,
} from '../../src/index.js';
import { parseForecastFile, printForecastReport, readForecastFile } from '../forecastFile.js';
import { STDIN_TOKEN, inputArgs, inputFiles, resolveLoadOptions, writeOutput, type CliIo, printLoadSummary } from '../options.js';
import { detectOptions, parseKinds } from './detect.js';
import { analysisStatus, parseJobs, runAnalysis } from '../analysis.js';

/** The last value of `--from`/`--to` (undefined when absent) as epoch ms UTC; see parsePeriodTime. */
export function parseReportTime(v: unknown, name: string, endOfDay = false): number | undefined {
  if (v === undefined) return undefined;
  return parsePeriodTime(String(Array.isArray(v) ? v[v.length - 1] : v), name, endOfDay);
}

/** `--station A --station B,C` → set of ids (null when absent). */
function parseStations(v: unknown): Set<string> | null {
  if (v === undefined) return null;
  const ids = (Array.isArray(v) ? v : [v]).flatMap((s) => String(s).split(',')).map((s) => s.trim()).filter(Boolean);
  if (!ids.length) throw new UsageError('--station needs a station id, e.g. --station XAVN');
  return new Set(ids);
}

/** Run report; returns the exit code (1 when no station has data). */
export async function run(raw: Record<string, unknown>, io: CliIo): Promise<number> {
  const args = inputArgs(raw);
  const kinds = parseKinds(raw.kinds);
  const dopts = detectOptions(raw);
  const fromMs = parseReportTime(raw.from, '--from');
  const toMs = parseReportTime(raw.to, '--to', true);
  if (fromMs !== undefined && toMs !== undefined && !(toMs > fromMs)) throw new UsageError('--to must be later than --from');
  const wanted = parseStations(raw.station);
  const jobs = parseJobs(raw.jobs);
  const local = Boolean(raw.local);
  const last = (v: unknown) => (Array.isArray(v) ? v[v.length - 1] : v);
  const forecastFile = raw.forecasts === undefined ? undefined : String(last(raw.forecasts));
  const windowHours = raw.windowHours === undefined ? 6 : Number(last(raw.windowHours));
  if (!(windowHours > 0 && windowHours <= 72)) throw new UsageError('--window-hours must be a number of hours above 0 and at most 72 (default 6)');
  const forecastText = forecastFile === undefined ? undefined : readForecastFile(forecastFile);
  if (local && args.tz === undefined) throw new UsageError('--local needs --tz ZONE: fropa shows local time only in a zone you name');
  const opts = await resolveLoadOptions(args, io);
  const result = loadPaths(args.paths, opts);
  if (result.series.length === 0) {
    io.stderr(noDataMessage(args.paths, result.reports));
    return 1;
  }
  printLoadSummary(result, Boolean(args.quiet), io);
  const series = selectStations(result.series, wanted);
  const outside = periodOutsideData(series, fromMs, toMs);
  if (outside) {
    io.stderr(`fropa: ${outside}\n`);
    return 1;
  }
  // Detection and tracking on all the data (context outside the period helps), as in `fropa detect`.
  const analysis = await runAnalysis(result.series, { ...dopts, network: raw.network !== false, kinds, jobs }, io, { files: result.reports.length, quiet: Boolean(args.quiet) });
  if (analysis.failures.length >= result.series.length) return analysisStatus(analysis, result.series.length, io);
  const { events, tracks } = analysis;
  const files = result.reports
    .filter((f) => f.format !== 'skipped' && f.format !== 'stations')
    .map((f) => ({ file: f.file, format: f.format, parsed: f.parsed, rejected: f.rejected }));
  const metas = result.series.map((s) => s.meta).filter((m): m is StationMeta => m !== undefined);
  // Season and verification: the stations and period of the report.
  const sections: ReportSection[] = [];
  const shownIds = series.map((s) => s.station);
  const shown = new Set(shownIds);
  const inPeriod = (t: number) => (fromMs === undefined || t >= fromMs) && (toMs === undefined || t <= toMs);
  const shownEvents = events.filter((e) => shown.has(e.station) && inPeriod(e.timeMs));
  if (raw.season) sections.push(seasonSection(seasonSummary(shownEvents, tracks, metas, shownIds, fromMs ?? -Infinity, toMs === undefined ? Infinity : toMs + 1)));
  if (forecastFile !== undefined && forecastText !== undefined) {
    const { forecasts, report } = parseForecastFile(forecastText, forecastFile, result, opts);
    printForecastReport(forecastFile, report, 'forecasts read', Boolean(args.quiet), io);
    const mine = forecasts.filter((f) => shown.has(f.station) && inPeriod(f.forecastMs));
    if (mine.length === 0) {
      io.stderr(`fropa: no usable forecasts in ${forecastFile} for the stations and period of the report\n`);
      return 1;
    }
    // The observed passages as `fropa verify` finds them (detection without the network stage), so the numbers agree.
    const observed = analyseSeries(series, { ...dopts, network: false }).events.filter((e) => inPeriod(e.timeMs));
    const v = verifyForecasts(mine, observed, { windowHours, ...(kinds ? { kinds: [...kinds] } : {}), bootstrap: false });
    sections.push(verificationSection(v, forecastFile));
  }
  const html = reportHtml({ series, events, tracks, stations: metas, files, fromMs, toMs, caution: CAUTION, localZone: local ? opts.zone : undefined, geography: tracks.length ? loadGeography() : undefined, sections });
  const rawOut = raw.out as string | undefined;
  const out = rawOut === undefined ? 'report.html' : rawOut;
  await writeOutput(html, out, io, { force: args.force, inputs: inputFiles(result.reports, [...args.paths, args.mapping, args.stations]) });
  if (out !== '-' && out !== STDIN_TOKEN) {
    const n = eventsInPeriod(events, series, fromMs, toMs).length;
    io.stdout(`wrote ${out} (${(Buffer.byteLength(html) / 1024).toFixed(0)} KiB): ${series.length} station${series.length === 1 ? '' : 's'}, ${n} passage${n === 1 ? '' : 's'}\n${CAUTION}\n`);
  }
  return analysisStatus(analysis, result.series.length, io);
}
