/**
 * Options every input-reading command shares, and their translation into the loader's LoadOptions.
 * Bad values become UsageError (exit code 2) with a message naming the option.
 */
import { readFileSync } from 'node:fs';
import type { Argv } from 'yargs';
import { loadMappingFile, parseColumnOverride, UsageError, writeFilesSafely, type LoadOptions, type SafeWriteOptions, buildInspect, inspectFiles, summaryLine, type LoadResult, type StreamedLoad } from '../src/index.js';

/** Standard streams of one CLI run, injectable for in-process tests. */
export interface CliIo {
  stdout(text: string): void;
  stderr(text: string): void;
  /** All of standard input as text (called only when a path is `-`). */
  readStdin(): Promise<string>;
  /** Standard input as a descriptor, read as a stream when a path is `-` (instead of readStdin). */
  stdinFd?: number;
  /** Where a progress bar may be drawn: standard error when it is a terminal and not under CI; absent otherwise (silent). */
  progress?: NodeJS.WriteStream;
}

/** Last value when an option was given more than once (yargs collects repeats into an array). */
const last = <T>(v: T | T[]): T => (Array.isArray(v) ? v[v.length - 1]! : v);
/** All values of a repeatable option. */
const all = (v: unknown): string[] => (v === undefined ? [] : (Array.isArray(v) ? v : [v]).map(String));

/** Stands for a `-` path between runCli and inputArgs (yargs would drop a lone `-`). */
export const STDIN_TOKEN = '\u0000stdin';

/** Arguments shared by inspect and detect, after yargs. */
export interface InputArgs {
  paths: string[];
  stations?: string;
  month?: string;
  tz?: string;
  standardTime?: boolean;
  utcOffset?: number;
  column: string[];
  mapping?: string;
  missing: string[];
  out?: string;
  force?: boolean;
  quiet?: boolean;
  verbose?: boolean;
}

/** Add the shared input options to a command builder. */
export function withInputOptions<T>(y: Argv<T>) {
  return y
    .positional('paths', { type: 'string', array: true, describe: 'Files or folders to read (folders recursively); - reads standard input', demandOption: true })
    .option('stations', { type: 'string', coerce: last, describe: 'Stations file (CSV: id, alias, name, lat, lon, elevation_m; optional coastal, sea_bearing_deg)', group: 'Input:' })
    .option('month', { type: 'string', coerce: last, describe: 'YYYY-MM for METAR lines that carry no date stamp and files with no date in their name', group: 'Input:' })
    .option('tz', { type: 'string', coerce: last, describe: 'IANA time zone of CSV times written without an offset (e.g. America/Chicago)', group: 'Input:' })
    .option('standard-time', { type: 'boolean', describe: 'With --tz: times are local standard time all year (no DST)', group: 'Input:' })
    .option('utc-offset', { type: 'number', coerce: last, describe: 'Fixed offset of CSV times from UTC, minutes (e.g. -360)', group: 'Input:' })
    .option('column', { type: 'string', describe: 'Map a CSV column: name=field[:unit]; repeatable; field "ignore" drops a column', group: 'Input:' })
    .option('mapping', { type: 'string', coerce: last, describe: 'JSON mapping file: {"columns": {...}, "missing": [...], "tz": "..."}', group: 'Input:' })
    .option('missing', { type: 'string', describe: 'Extra missing-value marker for CSV cells; repeatable', group: 'Input:' })
    .option('out', { type: 'string', coerce: last, describe: 'Write the output to FILE instead of standard output (never over an input; an existing file only with --force)', group: 'Output:' })
    .option('force', { type: 'boolean', describe: 'Replace output files that already exist (input files are never replaced)', group: 'Output:' })
    .conflicts('tz', 'utc-offset');
}

/** Normalise the repeatable options yargs may give as a string, an array or undefined. */
export function inputArgs(a: Record<string, unknown>): InputArgs {
  const paths = all(a.paths).map((p) => (p === STDIN_TOKEN ? '-' : p));
  if (paths.length === 0) throw new UsageError('name at least one file or folder to read (- for standard input)');
  return {
    paths,
    stations: a.stations as string | undefined,
    month: a.month as string | undefined,
    tz: a.tz as string | undefined,
    standardTime: a.standardTime as boolean | undefined,
    utcOffset: a.utcOffset as number | undefined,
    column: all(a.column),
    mapping: a.mapping as string | undefined,
    missing: all(a.missing),
    out: a.out as string | undefined,
    force: Boolean(a.force),
    quiet: Boolean(a.quiet),
    verbose: Boolean(a.verbose),
  };
}

/**
 * Check the shared options and build the loader's options: `--month` YYYY-MM, `--tz` a valid IANA zone,
 * `--utc-offset` within ±14 h, every `--column` parsed, the mapping file read (CLI values win over
 * it), standard input read when a path is `-`. Throws UsageError (exit code 2).
 */
export async function resolveLoadOptions(args: InputArgs, io: CliIo): Promise<LoadOptions> {
  const { IANAZone } = await import('luxon');
  const opts: LoadOptions = {};
  if (args.month !== undefined) {
    if (!/^\d{4}-(0[1-9]|1[0-2])$/.test(args.month)) throw new UsageError(`--month "${args.month}" must be YYYY-MM, e.g. 2024-02`);
    opts.month = args.month;
  }
  if (args.utcOffset !== undefined) {
    if (!Number.isFinite(args.utcOffset) || Math.abs(args.utcOffset) > 14 * 60) {
      throw new UsageError(`--utc-offset must be minutes between -840 and 840, e.g. -360 for UTC−6`);
    }
    opts.offsetMinutes = args.utcOffset;
  }
  if (args.mapping !== undefined) {
    let text: string;
    try {
      text = readFileSync(args.mapping, 'utf8');
    } catch {
      throw new UsageError(`${args.mapping}: cannot read the mapping file`);
    }
    try {
      const m = loadMappingFile(text);
      opts.overrides = [...m.overrides];
      opts.missing = [...m.missing];
      if (m.zone !== undefined && args.utcOffset === undefined) opts.zone = m.zone;
      if (m.standardTime !== undefined) opts.standardTime = m.standardTime;
    } catch (e) {
      throw new UsageError(`${args.mapping}: ${(e as Error).message}`);
    }
  }
  if (args.tz !== undefined) opts.zone = args.tz;
  if (opts.zone !== undefined && !IANAZone.isValidZone(opts.zone)) {
    throw new UsageError(`${args.tz !== undefined ? '--tz' : `${args.mapping}: tz`} "${opts.zone}" is not an IANA time zone name (e.g. America/Chicago, Europe/Berlin, UTC)`);
  }
  if (args.standardTime !== undefined) opts.standardTime = args.standardTime;
  for (const spec of args.column) {
    try {
      (opts.overrides ??= []).push(parseColumnOverride(spec));
    } catch (e) {
      throw new UsageError(`--column: ${(e as Error).message}`);
    }
  }
  if (args.missing.length) opts.missing = [...(opts.missing ?? []), ...args.missing];
  if (args.stations !== undefined) opts.stationsFile = args.stations;
  if (args.paths.includes('-')) {
    // read as a stream when the descriptor is there (the CLI's own standard input), else whole
    if (io.stdinFd !== undefined) opts.stdinFd = io.stdinFd;
    else opts.stdinText = await io.readStdin();
  }
  if (!args.quiet) opts.onNote = (m) => io.stderr(`fropa: note: ${m}\n`);
  return opts;
}

/**
 * Deliver command output: to `--out FILE` or standard output. The file is written atomically, never over an
 * input file, and over an existing file only with `safe.force` (UsageError, exit 2). A write failure is a runtime
 * error (exit 1).
 */
export async function writeOutput(text: string | Iterable<string>, out: string | undefined, io: CliIo, safe: SafeWriteOptions = {}): Promise<void> {
  // runCli carries every lone `-` as STDIN_TOKEN; after --out it means standard output.
  if (out === undefined || out === '-' || out === STDIN_TOKEN) {
    if (typeof text === 'string') io.stdout(text);
    else for (const piece of text) io.stdout(piece);
    return;
  }
  writeFilesSafely([{ path: out, text }], safe);
}

/** The files a load read (data and stations files), for the never-overwrite-an-input rule. */
export function inputFiles(reports: readonly { file: string }[], extra: readonly (string | undefined)[] = []): string[] {
  return [...reports.map((r) => r.file), ...extra.filter((x): x is string => x !== undefined)];
}

/** The one-line summary of what was read, rejected and assumed (the line `inspect` ends with), on standard error unless --quiet. */
export function printLoadSummary(result: LoadResult | StreamedLoad, quiet: boolean, io: CliIo): void {
  if (quiet) return;
  const files = 'series' in result ? buildInspect(result.reports, result.series, result.qc) : inspectFiles(result.reports, result.details);
  io.stderr(`fropa: ${summaryLine(files)}\n`);
}
