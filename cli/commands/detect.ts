/** `fropa detect <paths...>`: load, detect passages at every station, write them out. */
import { arrivalsAt, arrivalsToCsv, arrivalsToJson, arrivalsToTable, CAUTION, parsePoint, parsePointsFile, toGeoJson, type PointOfInterest, BOUNDARY_KINDS, eventsAndTracksToJson, eventsToCsv, eventsToJson, eventsToNdjsonPieces, eventsToTable, detectPaths, outputFolderFiles, parseRunways, passagesToTable, tracksToCsv, tracksToJson, tracksToNdjson, tracksToTable, writeOutputFolder, type BoundaryKind, type DetectOptions, type RunwayHeading, type WindUnit, UsageError, noDataMessage, parseShard, checkOutputs } from '../../src/index.js';
import { inputArgs, inputFiles, printLoadSummary, resolveLoadOptions, STDIN_TOKEN, writeOutput, type CliIo } from '../options.js';
import { analysisStatus, parseJobs, progressBar, reportFailures } from '../analysis.js';

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

/** `--runway 04/22,13/31` (repeatable) → runway directions (UsageError on a bad designator). */
export function runwayOption(v: unknown): RunwayHeading[] {
  if (v === undefined) return [];
  const spec = (Array.isArray(v) ? v : [v]).map(String).join(',');
  try {
    return parseRunways(spec);
  } catch (e) {
    throw new UsageError(`--runway: ${(e as Error).message}`);
  }
}

/** `--at LAT,LON[,NAME]` (repeatable) and `--points FILE` → points of interest (UsageError on bad values). */
export async function pointsOption(at: unknown, file: unknown): Promise<PointOfInterest[]> {
  const out: PointOfInterest[] = [];
  for (const spec of at === undefined ? [] : (Array.isArray(at) ? at : [at]).map(String)) {
    try {
      out.push(parsePoint(spec));
    } catch (e) {
      throw new UsageError(`--at ${(e as Error).message}`);
    }
  }
  for (const f of file === undefined ? [] : (Array.isArray(file) ? file : [file]).map(String)) {
    const { readFileSync } = await import('node:fs');
    let text: string;
    try {
      text = readFileSync(f, 'utf8');
    } catch {
      throw new UsageError(`${f}: cannot read the points file`);
    }
    try {
      out.push(...parsePointsFile(text, f));
    } catch (e) {
      throw new UsageError((e as Error).message);
    }
  }
  return out;
}

/** Run detect; returns the exit code (1 when no station has data or every station failed, 3 when some failed). */
export async function run(raw: Record<string, unknown>, io: CliIo): Promise<number> {
  const args = inputArgs(raw);
  const kinds = parseKinds(raw.kinds);
  const dopts = detectOptions(raw);
  const jobs = parseJobs(raw.jobs);
  const local = Boolean(raw.local);
  const runways = runwayOption(raw.runway);
  const windUnit = (Array.isArray(raw.windUnit) ? raw.windUnit[raw.windUnit.length - 1] : raw.windUnit) as WindUnit | undefined;
  const format = String(raw.format ?? 'table');
  const what = (raw.what as 'events' | 'fronts' | 'arrivals' | 'all' | undefined) ?? (format === 'table' || format === 'geojson' ? 'all' : 'events');
  const points = await pointsOption(raw.at, raw.points);
  if (what === 'arrivals' && points.length === 0) throw new UsageError('--what arrivals needs points: --at LAT,LON[,NAME] or --points FILE');
  if (format === 'csv' && what === 'all') throw new UsageError('--format csv holds one table: use --what events or --what fronts (or --out-dir for both)');
  if (local && args.tz === undefined) throw new UsageError('--local needs --tz ZONE: fropa shows local time only in a zone you name');
  const shard = raw.shard === undefined ? undefined : parseShard(String(Array.isArray(raw.shard) ? raw.shard[raw.shard.length - 1] : raw.shard));
  if (shard && (raw.outDir !== undefined || (raw.format !== undefined && raw.format !== 'ndjson' && raw.format !== 'table'))) {
    throw new UsageError('--shard writes the shard records (NDJSON) that fropa merge combines; leave out --format and --out-dir');
  }
  if (shard && kinds) throw new UsageError('--kinds with --shard: give --kinds to fropa merge (tracking needs every kind)');
  const opts = await resolveLoadOptions(args, io);
  const quiet = Boolean(args.quiet);
  // An --out that would be refused is refused before the work, not after an archive's detection (checked again on writing).
  if (args.out !== undefined && args.out !== '-' && args.out !== STDIN_TOKEN) checkOutputs([args.out], { force: args.force, inputs: [...args.paths, args.mapping, args.stations].filter((x): x is string => x !== undefined) });
  // Streamed: each station's series is held only while it is detected (detectPaths).
  const bar = await progressBar(io, quiet);
  let run: Awaited<ReturnType<typeof detectPaths>>;
  try {
    run = await detectPaths(args.paths, opts, {
      ...dopts, network: raw.network !== false, kinds, jobs, runways, details: !quiet,
      ...(shard ? { shard } : {}),
      ...(bar ? { onPlan: bar.start, onStation: bar.onStation } : {}),
    });
  } finally {
    bar?.stop();
  }
  const result = run.load;
  if (result.ids.length === 0) {
    io.stderr(noDataMessage(args.paths, result.reports));
    return 1;
  }
  printLoadSummary(result, quiet, io);
  if (run.shard) {
    const r = run.shard;
    reportFailures(r.failures, io);
    await writeOutput(r.text, args.out, io);
    if (!args.quiet) io.stderr(`fropa: shard ${shard!.index}/${shard!.count}: ${r.stations} of ${result.ids.length} stations\n`);
    return r.failures.length === 0 ? 0 : r.failures.length >= r.stations ? 1 : 3;
  }
  const analysis = run.analysis!;
  reportFailures(analysis.failures, io);
  if (analysis.failures.length >= result.ids.length) return analysisStatus(analysis, result.ids.length, io);
  const { events, tracks } = analysis;
  const stations = result.ids;
  const safe = { force: args.force, inputs: inputFiles(result.reports, [...args.paths, args.mapping, args.stations]) };
  const outDir = raw.outDir as string | undefined;
  if (outDir !== undefined) {
    const metas = result.metas;
    const { summary, files } = outputFolderFiles(events, tracks, stations, metas);
    const written = writeOutputFolder(outDir, files, safe);
    io.stdout(summary + written.map((p) => `wrote ${p}`).join('\n') + '\n');
    return analysisStatus(analysis, result.ids.length, io);
  }
  const tableOpts = { zone: local ? opts.zone : undefined, stations, windUnit };
  const arrivals = arrivalsAt(points, tracks);
  let text: string;
  if (what === 'arrivals' && format !== 'table' && format !== 'geojson') text = format === 'csv' ? arrivalsToCsv(arrivals) : arrivalsToJson(arrivals, format === 'ndjson');
  else if (format === 'geojson') {
    const metas = result.metas;
    text = toGeoJson({ events: what === 'fronts' || what === 'arrivals' ? [] : events, tracks: what === 'events' || what === 'arrivals' ? [] : tracks, stations: metas, arrivals });
  } else if (format === 'csv') text = what === 'fronts' ? tracksToCsv(tracks) : eventsToCsv(events, { windUnit });
  else if (format === 'json') text = what === 'fronts' ? tracksToJson(tracks) : what === 'all' ? eventsAndTracksToJson(events, tracks) : eventsToJson(events);
  else if (format === 'ndjson' && what === 'events') {
    // written piece by piece: a whole archive's passages are never held as one text
    await writeOutput(eventsToNdjsonPieces(events), args.out, io, safe);
    return analysisStatus(analysis, result.ids.length, io);
  } else if (format === 'ndjson') text = what === 'fronts' ? tracksToNdjson(tracks) : eventsAndTracksToJson(events, tracks, true);
  else {
    text = what === 'fronts' ? tracksToTable(tracks) || 'no fronts tracked\n' : what === 'events' ? eventsToTable(events, tableOpts) : what === 'arrivals' ? '' : passagesToTable(events, tracks, tableOpts);
    if (points.length && (what === 'all' || what === 'arrivals')) {
      const block = arrivalsToTable(arrivals) || `no tracked front to estimate arrivals at ${points.map((p) => p.name).join(', ')}\n`;
      const at = text.lastIndexOf(CAUTION);
      text = at < 0 ? text + (text ? '\n' : '') + block + CAUTION + '\n' : text.slice(0, at) + block + '\n' + text.slice(at);
    }
  }
  await writeOutput(text, args.out, io, safe);
  return analysisStatus(analysis, result.ids.length, io);
}

