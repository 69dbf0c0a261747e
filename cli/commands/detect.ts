/** `fropa detect <paths...>`: load, detect passages at every station, write them out. */
import { analyseShard, parseShard, BOUNDARY_KINDS, eventsToCsv, eventsToJson, eventsToNdjson, loadPaths, outputFolderFiles, passagesToTable, writeOutputFolder, type BoundaryKind, type DetectOptions, UsageError, noDataMessage } from '../../src/index.js';
import { inputArgs, printLoadSummary, resolveLoadOptions, writeOutput, type CliIo } from '../options.js';
import { analysisStatus, parseJobs, runAnalysis } from '../analysis.js';

/** Parse `--kinds a,b` against the known kinds (UsageError on an unknown one). */
export function parseKinds(spec: unknown): Set<BoundaryKind> | null {
  if (spec === undefined) return null;
  const parts = (Array.isArray(spec) ? spec : [spec]).flatMap((s) => String(s).split(',')).map((s) => s.trim()).filter(Boolean);
  const out = new Set<BoundaryKind>();
  for (const p of parts) {
    if (!(BOUNDARY_KINDS as readonly string[]).includes(p)) throw new UsageError(`--kinds: unknown kind "${p}"; known kinds: ${BOUNDARY_KINDS.join(', ')}`);
    out.add(p as BoundaryKind);
  }
  if (out.size === 0) throw new UsageError(`--kinds needs at least one kind: ${BOUNDARY_KINDS.join(', ')}`);
  return out;
}

/** Detection options from the arguments, range-checked (UsageError). */
export function detectOptions(raw: Record<string, unknown>): DetectOptions {
  const opts: DetectOptions = {};
  const mc = lastNumber(raw.minConfidence);
  if (mc !== undefined) {
    if (!(mc >= 0 && mc <= 1)) throw new UsageError('--min-confidence must be a number from 0 to 1');
    opts.minConfidence = mc;
  }
  const fs = lastNumber(raw.frontSpeed);
  if (fs !== undefined) {
    if (!(fs > 0 && fs < 500)) throw new UsageError('--front-speed must be a speed in km/h above 0 (typical fronts move 10 to 60 km/h)');
    opts.frontSpeedKmh = fs;
  }
  return opts;
}

function lastNumber(v: unknown): number | undefined {
  if (v === undefined) return undefined;
  const x = Array.isArray(v) ? v[v.length - 1] : v;
  return typeof x === 'number' ? x : Number(x);
}

/** Run detect; returns the exit code (1 when no station has data or every station failed, 3 when some failed). */
export async function run(raw: Record<string, unknown>, io: CliIo): Promise<number> {
  const args = inputArgs(raw);
  const kinds = parseKinds(raw.kinds);
  const dopts = detectOptions(raw);
  const jobs = parseJobs(raw.jobs);
  const local = Boolean(raw.local);
  if (local && args.tz === undefined) throw new UsageError('--local needs --tz ZONE: fropa shows local time only in a zone you name');
  const shard = raw.shard === undefined ? undefined : parseShard(String(Array.isArray(raw.shard) ? raw.shard[raw.shard.length - 1] : raw.shard));
  if (shard && (raw.outDir !== undefined || (raw.format !== undefined && raw.format !== 'ndjson' && raw.format !== 'table'))) {
    throw new UsageError('--shard writes the shard records (NDJSON) that fropa merge combines; leave out --format and --out-dir');
  }
  if (shard && kinds) throw new UsageError('--kinds with --shard: give --kinds to fropa merge (tracking needs every kind)');
  const opts = await resolveLoadOptions(args, io);
  const result = loadPaths(args.paths, opts);
  if (result.series.length === 0) {
    io.stderr(noDataMessage(args.paths, result.reports));
    return 1;
  }
  printLoadSummary(result, Boolean(args.quiet), io);
  if (shard) {
    const r = await analyseShard(result.series, shard, { ...dopts, network: raw.network !== false, jobs });
    for (const f of r.failures) io.stderr(`fropa: station ${f.station} skipped: ${f.reason}\n`);
    await writeOutput(r.text, args.out, io);
    if (!args.quiet) io.stderr(`fropa: shard ${shard.index}/${shard.count}: ${r.stations} of ${result.series.length} stations\n`);
    return r.failures.length === 0 ? 0 : r.failures.length >= r.stations ? 1 : 3;
  }
  const analysis = await runAnalysis(result.series, { ...dopts, network: raw.network !== false, kinds, jobs }, io, { files: result.reports.length, quiet: Boolean(args.quiet) });
  if (analysis.failures.length >= result.series.length) return analysisStatus(analysis, result.series.length, io);
  const { events, tracks } = analysis;
  const stations = result.series.map((s) => s.station);
  const outDir = raw.outDir as string | undefined;
  if (outDir !== undefined) {
    const { summary, files } = outputFolderFiles(events, tracks, stations);
    const written = writeOutputFolder(outDir, files);
    io.stdout(summary + written.map((p) => `wrote ${p}`).join('\n') + '\n');
    return analysisStatus(analysis, result.series.length, io);
  }
  const format = String(raw.format ?? 'table');
  const text =
    format === 'csv'
      ? eventsToCsv(events)
      : format === 'json'
        ? eventsToJson(events)
        : format === 'ndjson'
          ? eventsToNdjson(events)
          : passagesToTable(events, tracks, { zone: local ? opts.zone : undefined, stations });
  await writeOutput(text, args.out, io);
  return analysisStatus(analysis, result.series.length, io);
}

