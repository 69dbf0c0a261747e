/**
 * The reading edge of ingest: expand paths, sniff each file's format, read stations files, then hand every
 * observation of the data files to a sink. Bytes in, observations and per-file reports out; building series,
 * station pressure and QC happen downstream (src/pipeline.ts).
 * Every file is accounted for in a FileReport; files that are not observations are skipped with a note.
 */
import { lstatSync, readdirSync, readFileSync, realpathSync, statSync, type Stats } from 'node:fs';
import { basename, extname, join } from 'node:path';
import { newFileReport, UsageError, type FileReport, type Observation, type StationMeta } from '../model/index.js';
import { decodeMetarAt, isParseIssue, looksLikeMetar, metarToObservation, readMetarBytes } from './metar.js';
import { readCsvBytes, type CsvOptions, type RawReportDecoded } from './csv.js';
import { buildStationIndex, looksLikeStationsFile, readStationsText, resolveStation, stationFromFileName, type FileNameStation, type StationIndex } from './stations.js';
import type { ColumnOverride } from './columns.js';
import { compressionOf, expandBytes } from './decompress.js';
import { isIsdHeaders, readIsdText } from './isd.js';
import { looksBinary, prepareText } from './text.js';
import type { TimeWindow } from './plausible.js';

export interface ReadOptions {
  stationsFile?: string;
  /** YYYY-MM for METAR files whose lines carry no archive stamp and whose name has no date. */
  month?: string;
  zone?: string;
  standardTime?: boolean;
  offsetMinutes?: number;
  overrides?: ColumnOverride[];
  missing?: string[];
  /** Text read from standard input when a path is `-`. */
  stdinText?: string;
  /** Accepted observation times (default DEFAULT_TIME_WINDOW of plausible.ts). */
  timeWindow?: TimeWindow;
  /** One-line notes for the user (stderr in the CLI). */
  onNote?: (message: string) => void;
}

/** Where a CSV row placed its station (latitude, longitude, elevation columns). */
export type StationPositions = Map<string, { latDeg: number; lonDeg: number; elevationM: number }>;

/** The inputs after the first pass: stations read, files that are not data accounted for, data files waiting to be read. */
export interface ScannedPaths {
  stations: StationMeta[];
  reports: FileReport[];
  dataFiles: DataFile[];
}

/** One data file, read into memory, with its sniffed format. */
export interface DataFile {
  path: string;
  bytes: Buffer;
  format: SniffedFormat;
  fromDir: boolean;
  /** The station id the file name gives (for files without a station column), with its rule. */
  nameStation?: FileNameStation;
  /** What prepareText noted (encoding, line ends), for the file's report. */
  textNotes?: string[];
  /** The text holds a NUL byte: the readers reject the lines that hold one. */
  hasNul?: boolean;
}

/** Extensions that are never observation files; skipped with a note inside directories. */
const NOT_OBSERVATIONS = new Set(['.json', '.geojson', '.md', '.markdown', '.ts', '.js', '.mjs', '.html', '.svg', '.png', '.jpg', '.pdf', '.ndjson']);

interface Candidate {
  path: string;
  /** Came from a directory listing (skip unknown files quietly) rather than named by the user. */
  fromDir: boolean;
}

/** A folder entry that could not be followed: a message for the user, never a stop. */
export interface PathProblem {
  path: string;
  reason: 'symlink-loop' | 'dangling-link' | 'unreadable-folder' | 'unreadable-entry' | 'named-pipe' | 'special-file';
  message: string;
}

/**
 * Expand files and directories (recursively, sorted for deterministic output). Inside a folder, a symbolic
 * link back to a folder already being walked (a loop), a dangling link, an unreadable subfolder, a named
 * pipe (FIFO: a folder walk never waits on a writer) or another special file becomes a `PathProblem` and the
 * walk goes on. A path named by the user is read whatever it is (a FIFO is read to its end, like a stream).
 */
export function expandPaths(paths: readonly string[], problems: PathProblem[] = []): Candidate[] {
  const out: Candidate[] = [];
  const walking = new Set<string>();
  const walk = (dir: string) => {
    let real: string;
    try {
      real = realpathSync(dir);
    } catch {
      problems.push({ path: dir, reason: 'unreadable-folder', message: `${dir}: cannot resolve the folder; skipped` });
      return;
    }
    if (walking.has(real)) {
      problems.push({ path: dir, reason: 'symlink-loop', message: `${dir}: symbolic link loops back to ${real}; skipped` });
      return;
    }
    let names: string[];
    try {
      names = readdirSync(dir).sort();
    } catch (e) {
      problems.push({ path: dir, reason: 'unreadable-folder', message: `${dir}: cannot list the folder (${errCode(e)}); skipped, the rest is read` });
      return;
    }
    walking.add(real);
    for (const name of names) {
      if (name.startsWith('.') || name === 'node_modules') continue;
      const p = join(dir, name);
      let st: Stats;
      try {
        st = statSync(p);
      } catch (e) {
        const code = errCode(e);
        let link = false;
        try {
          link = lstatSync(p).isSymbolicLink();
        } catch {
          /* gone meanwhile */
        }
        if (link && code === 'ELOOP') problems.push({ path: p, reason: 'symlink-loop', message: `${p}: symbolic link loop; skipped` });
        else if (link) problems.push({ path: p, reason: 'dangling-link', message: `${p}: symbolic link to nothing (${code}); skipped` });
        else problems.push({ path: p, reason: 'unreadable-entry', message: `${p}: cannot read (${code}); skipped` });
        continue;
      }
      if (st.isDirectory()) walk(p);
      else if (st.isFile()) out.push({ path: p, fromDir: true });
      else if (st.isFIFO()) problems.push({ path: p, reason: 'named-pipe', message: `${p}: named pipe inside a folder, not read (name it on the command line to read it)` });
      else problems.push({ path: p, reason: 'special-file', message: `${p}: not a regular file (device or socket); skipped` });
    }
    walking.delete(real);
  };
  for (const p of paths) {
    if (p === '-') {
      out.push({ path: '-', fromDir: false });
      continue;
    }
    let st;
    try {
      st = statSync(p);
    } catch {
      throw new UsageError(`${p}: no such file or directory`);
    }
    if (st.isDirectory()) walk(p);
    else out.push({ path: p, fromDir: false });
  }
  return out;
}

/** The code of a file-system error (`EACCES`...), or its message. */
function errCode(e: unknown): string {
  const x = e as { code?: string; message?: string };
  return x.code ?? x.message ?? String(e);
}

/** Why a file could not be read, in words, from its error. */
function readFailure(e: unknown): string {
  const code = errCode(e);
  if (code === 'EACCES' || code === 'EPERM') return 'cannot read the file: permission denied';
  if (code === 'ERR_FS_FILE_TOO_LARGE' || code === 'ERR_STRING_TOO_LONG' || code === 'ERR_BUFFER_TOO_LARGE')
    return 'cannot read the file: larger than one in-memory read allows (2 GiB); split it (e.g. by month) until streamed reading lands';
  if (code === 'EISDIR') return 'cannot read the file: it is a folder';
  return `cannot read the file (${code})`;
}

export type SniffedFormat = 'metar' | 'csv' | 'isd' | 'stations' | 'empty' | 'binary' | 'unknown';

/** Decide a file's format from its name and first bytes. */
export function sniffFormat(name: string, sample: string, binary: boolean): SniffedFormat {
  if (binary) return 'binary';
  if (sample.charCodeAt(0) === 0xfeff) sample = sample.slice(1);
  if (sample.trim() === '') return 'empty';
  if (looksLikeMetar(sample)) return 'metar';
  const first = sample.split(/\r\n|\r|\n/, 1)[0] ?? '';
  const delim = [',', '\t', ';', '|'].reduce((best, d) => (first.split(d).length > first.split(best).length ? d : best), ',');
  const headers = first.split(delim).map((h) => h.trim().replace(/^"|"$/g, ''));
  if (headers.length >= 3 && looksLikeStationsFile(headers)) return 'stations';
  if (isIsdHeaders(headers)) return 'isd';
  if (headers.length >= 2) return 'csv';
  if (/\.(csv|tsv|txt)$/i.test(name) && /[;,\t]/.test(first)) return 'csv';
  return 'unknown';
}

/** Raw METAR text found in a CSV row (archive exports) → the fields it adds. */
function decodeRawReport(text: string, timeMs: number, file: string, line: number): RawReportDecoded | null {
  const r = decodeMetarAt(text, timeMs, file, line);
  if (isParseIssue(r)) return null;
  return { ...metarToObservation(r, file, line), tempFromRemarks: r.tempFromRemarks };
}

/**
 * First pass over the inputs: expand the paths, read the stations files (the explicit one first, then any found
 * among the inputs) and every other file's bytes. Throws UsageError for a missing path or an unreadable stations
 * file; data problems are counted in the reports, never thrown.
 */
export function scanPaths(paths: readonly string[], opts: ReadOptions = {}): ScannedPaths {
  const note = opts.onNote ?? (() => {});
  const reports: FileReport[] = [];
  const stations: StationMeta[] = [];
  const problems: PathProblem[] = [];
  const files = expandPaths(paths, problems);
  for (const pr of problems) {
    note(pr.message);
    const r = newFileReport(pr.path, 'skipped');
    r.notes.push(pr.message);
    reports.push(r);
  }
  // Stations files first: the explicit one, then any found among the inputs.
  if (opts.stationsFile) {
    let text: string;
    try {
      text = readFileSync(opts.stationsFile, 'utf8');
    } catch {
      throw new UsageError(`${opts.stationsFile}: cannot read the stations file`);
    }
    const r = readStationsText(text, opts.stationsFile);
    stations.push(...r.stations);
    reports.push(r.report);
  }
  const dataFiles: DataFile[] = [];
  for (const c of files) {
    let raw: Buffer;
    const name = c.path === '-' ? '(stdin)' : c.path;
    if (c.path === '-') {
      raw = Buffer.from(opts.stdinText ?? '', 'utf8');
    } else {
      if (c.fromDir && NOT_OBSERVATIONS.has(extname(c.path).toLowerCase())) {
        note(`${c.path}: skipped (not an observation file)`);
        reports.push({ ...newFileReport(c.path, 'skipped'), notes: ['not an observation file'] });
        continue;
      }
      try {
        raw = readFileSync(c.path);
      } catch (e) {
        const why = readFailure(e);
        const r = newFileReport(c.path, 'unreadable');
        r.notes.push(why);
        reports.push(r);
        note(`${c.path}: ${why}`);
        continue;
      }
    }
    // gzip is expanded (bounded); other compressed files are refused with a message (decompress.ts)
    const expanded = expandBytes(raw);
    if ('reason' in expanded) {
      const r = newFileReport(name, 'skipped');
      r.rejectedByReason[expanded.reason] = 1;
      r.rejected = 1;
      r.issues.push({ file: name, line: 1, reason: expanded.reason, message: expanded.message });
      reports.push(r);
      note(`${name}: ${expanded.message}`);
      continue;
    }
    if (expanded.kind === 'gzip') raw = expanded.bytes;
    // binary only when most of the head is not text (text.ts); else decoded, BOM dropped, line ends made one kind
    const binary = looksBinary(raw);
    const prep = binary ? null : prepareText(raw);
    const bytes = prep ? prep.bytes : raw.subarray(0, 8192);
    // the first 8192 characters (at most 4 bytes each)
    const sample = bytes.toString('utf8', 0, Math.min(bytes.length, 32_768)).slice(0, 8192);
    const format = sniffFormat(basename(name).replace(/\.gz$/i, ''), sample, binary);
    if (format === 'stations') {
      if (opts.stationsFile) {
        note(`${name}: stations file ignored (--stations given)`);
        reports.push({ ...newFileReport(name, 'stations'), notes: ['ignored: --stations given'] });
        continue;
      }
      const r = readStationsText(bytes.toString('utf8'), name);
      stations.push(...r.stations);
      reports.push(r.report);
      continue;
    }
    dataFiles.push({ path: name, bytes, format, fromDir: c.fromDir, textNotes: prep?.notes ?? [], hasNul: prep?.hasNul ?? false });
  }
  const index = buildStationIndex(stations);
  for (const f of dataFiles) if (f.path !== '(stdin)') f.nameStation = stationFromFileName(index, f.path);
  return { stations, reports, dataFiles };
}

/**
 * Second pass: read every data file (METAR or CSV) and hand each observation to `onObservation`. The observation
 * object may be reused by the reader right after the call, so the sink copies what it keeps.
 * Returns the files' reports (in input order) and the station positions CSV rows carried. `index` (the stations
 * file's) gives CSV files without a zone the `tz` of their stations.
 */
export function readDataFiles(
  dataFiles: readonly DataFile[],
  opts: ReadOptions,
  onObservation: (o: Observation) => void,
  index?: StationIndex,
): { reports: FileReport[]; positions: StationPositions } {
  const note = opts.onNote ?? (() => {});
  const reports: FileReport[] = [];

  const positions: StationPositions = new Map();
  const csvOpts: CsvOptions = {
    overrides: opts.overrides,
    missing: opts.missing,
    zone: opts.zone,
    standardTime: opts.standardTime,
    offsetMinutes: opts.offsetMinutes,
    decodeRawReport,
    ...(opts.timeWindow ? { timeWindow: opts.timeWindow } : {}),
  };
  // the stations file's zones, for CSV times that give none (only when it lists any)
  if (index !== undefined && [...index.byId.values()].some((m) => m.timeZone !== undefined)) csvOpts.stationZone = (id) => resolveStation(index, id).meta?.timeZone;
  const csvSinkOpts: CsvOptions = { ...csvOpts, reuseObservation: true };
  for (const f of dataFiles) {
    if (f.format === 'metar') {
      const r = readMetarBytes(f.bytes, f.path, { month: opts.month, onObservation, ...(opts.timeWindow ? { timeWindow: opts.timeWindow } : {}) });
      r.report.stationIdRule ??= 'the station indicator of each METAR report';
      if (f.textNotes?.length) r.report.notes.unshift(...f.textNotes);
      reports.push(r.report);
      if (r.report.parsed === 0 && r.report.rejectedByReason['no-year-month']) {
        note(`${f.path}: no year and month for the reports; pass --month YYYY-MM or use a dated file name`);
      }
    } else if (f.format === 'isd') {
      const r = readIsdText(f.bytes.toString('utf8'), f.path, onObservation);
      for (const [id, pos] of r.stationsSeen) positions.set(id, pos);
      reports.push(r.report);
    } else if (f.format === 'csv') {
      const nameStation = f.nameStation;
      const r = readCsvBytes(f.bytes, f.path, nameStation ? { ...csvSinkOpts, stationFromFileName: () => nameStation } : csvSinkOpts, onObservation);
      if (f.textNotes?.length) r.report.notes.unshift(...f.textNotes);
      // A CSV without a single observation inside a directory is most likely something else (a forecast list).
      if (r.report.parsed === 0 && f.fromDir) {
        note(`${f.path}: skipped (no observation columns recognised)`);
        reports.push({ ...r.report, format: 'skipped', notes: [...r.report.notes, 'no observation columns recognised'] });
        continue;
      }
      for (const [id, pos] of r.stationsSeen) positions.set(id, pos);
      reports.push(r.report);
    } else {
      const r = newFileReport(f.path, f.format === 'unknown' ? 'skipped' : f.format);
      const why =
        f.format === 'binary' ? 'binary file (most of its first 64 KiB is not text), not text observations' : f.format === 'empty' ? 'empty file' : 'neither METAR reports nor a CSV table';
      r.notes.push(why);
      if (f.format !== 'unknown') {
        r.rejectedByReason[f.format === 'binary' ? 'binary-file' : 'empty-file'] = 1;
        r.rejected = 1;
      }
      reports.push(r);
      note(`${f.path}: skipped (${why})`);
    }
  }
  return { reports, positions };
}
