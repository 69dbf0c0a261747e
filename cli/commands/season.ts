/** `fropa season <paths...>`: passages by kind and month, hour of day, distributions and front motion, per station and network. */
import { CAUTION, loadPaths, noDataMessage, parsePeriodTime, seasonSummary, seasonToCsv, seasonToJson, seasonToTable, UsageError, type StationMeta } from '../../src/index.js';
import { inputArgs, resolveLoadOptions, writeOutput, type CliIo } from '../options.js';
import { detectOptions, parseKinds } from './detect.js';
import { analysisStatus, parseJobs, runAnalysis } from '../analysis.js';

/** Run season; exit code as detect (1 no data or every station failed, 3 some failed). */
export async function run(raw: Record<string, unknown>, io: CliIo): Promise<number> {
  const args = inputArgs(raw);
  const kinds = parseKinds(raw.kinds);
  const dopts = detectOptions(raw);
  const jobs = parseJobs(raw.jobs);
  const sinceMs = raw.since === undefined ? -Infinity : parsePeriodTime(String(raw.since), '--since');
  const untilMs = raw.until === undefined ? Infinity : parsePeriodTime(String(raw.until), '--until', true);
  if (!(untilMs > sinceMs)) throw new UsageError('--until must be later than --since');
  const opts = await resolveLoadOptions(args, io);
  const result = loadPaths(args.paths, opts);
  if (result.series.length === 0) {
    io.stderr(noDataMessage(args.paths, result.reports));
    return 1;
  }
  const analysis = await runAnalysis(result.series, { ...dopts, network: raw.network !== false, kinds, jobs }, io, { files: result.reports.length, quiet: Boolean(args.quiet) });
  if (analysis.failures.length >= result.series.length) return analysisStatus(analysis, result.series.length, io);
  const metas = result.series.map((s) => s.meta).filter((m): m is StationMeta => m !== undefined);
  const summary = seasonSummary(analysis.events, analysis.tracks, metas, result.series.map((s) => s.station), sinceMs, untilMs);
  const format = String(raw.format ?? 'table');
  const text = format === 'csv' ? seasonToCsv(summary) : format === 'json' ? seasonToJson(summary) : seasonToTable(summary) + '\n' + CAUTION + '\n';
  await writeOutput(text, args.out, io);
  return analysisStatus(analysis, result.series.length, io);
}
