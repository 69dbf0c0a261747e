/**
 * The reading edge of ingest: expand paths, sniff each file's format, read stations files, then hand every
 * observation of the data files to a sink. Bytes in, observations and per-file reports out; building series,
 * station pressure and QC happen downstream (src/pipeline.ts).
 * Every file is accounted for in a FileReport; files that are not observations are skipped with a note.
 */
import { closeSync, openSync, readSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { basename, extname, join } from 'node:path';
import { newFileReport, UsageError, type FileReport, type Observation, type StationMeta } from '../model/index.js';
import { decodeMetarAt, isParseIssue, looksLikeMetar, metarToObservation, readMetarBytes } from './metar.js';
import { readCsvBytes, type CsvOptions, type RawReportDecoded } from './csv.js';
import { buildStationIndex, looksLikeStationsFile, readStationsText, stationFromFileName, type FileNameStation } from './stations.js';
import type { ColumnOverride } from './columns.js';
import { compressionOf, expandBytes } from './decompress.js';
import { isIsdHeaders, readIsdText } from './isd.js';

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
}

/** Extensions that are never observation files; skipped with a note inside directories. */
const NOT_OBSERVATIONS = new Set(['.json', '.geojson', '.md', '.markdown', '.ts', '.js', '.mjs', '.html', '.svg', '.png', '.jpg', '.pdf', '.ndjson']);

interface Candidate {
  path: string;
  /** Came from a directory listing (skip unknown files quietly) rather than named by the user. */
  fromDir: boolean;
}

/** Expand files and directories (recursively, sorted for deterministic output). */
export function expandPaths(paths: readonly string[]): Candidate[] {
  const out: Candidate[] = [];
  const walk = (dir: string) => {
    for (const name of readdirSync(dir).sort()) {
      if (name.startsWith('.') || name === 'node_modules') continue;
      const p = join(dir, name);
      const st = statSync(p);
      if (st.isDirectory()) walk(p);
      else if (st.isFile()) out.push({ path: p, fromDir: true });
    }
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

/** The first bytes of a file as text (for sniffing) and whether it holds a NUL byte. */
function head(path: string, bytes = 8192): { text: string; binary: boolean; raw: Buffer } {
  const fd = openSync(path, 'r');
  try {
    const buf = Buffer.alloc(bytes);
    const n = readSync(fd, buf, 0, bytes, 0);
    const b = buf.subarray(0, n);
    return { text: b.toString('utf8'), binary: b.includes(0), raw: b };
  } finally {
    closeSync(fd);
  }
}

export type SniffedFormat = 'metar' | 'csv' | 'isd' | 'stations' | 'empty' | 'binary' | 'unknown';

/** Decide a file's format from its name and first bytes. */
export function sniffFormat(name: string, sample: string, binary: boolean): SniffedFormat {
  if (binary) return 'binary';
  if (sample.trim() === '') return 'empty';
  if (looksLikeMetar(sample)) return 'metar';
  const first = sample.split(/\r?\n/, 1)[0] ?? '';
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
  const files = expandPaths(paths);
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
    let bytes: Buffer;
    let binary = false;
    const name = c.path === '-' ? '(stdin)' : c.path;
    if (c.path === '-') {
      bytes = Buffer.from(opts.stdinText ?? '', 'utf8');
    } else {
      if (c.fromDir && NOT_OBSERVATIONS.has(extname(c.path).toLowerCase())) {
        note(`${c.path}: skipped (not an observation file)`);
        reports.push({ ...newFileReport(c.path, 'skipped'), notes: ['not an observation file'] });
        continue;
      }
      try {
        const h = head(c.path);
        binary = h.binary;
        const kind = compressionOf(h.raw);
        bytes = kind === 'gzip' || (kind === null && !binary) ? readFileSync(c.path) : kind !== null ? h.raw : Buffer.from(h.text, 'utf8');
      } catch {
        const r = newFileReport(c.path, 'unreadable');
        r.notes.push('cannot read the file (permissions?)');
        reports.push(r);
        note(`${c.path}: cannot read the file`);
        continue;
      }
    }
    // gzip is expanded (bounded); other compressed files are refused with a message (decompress.ts)
    const expanded = expandBytes(bytes);
    if ('reason' in expanded) {
      const r = newFileReport(name, 'skipped');
      r.rejectedByReason[expanded.reason] = 1;
      r.rejected = 1;
      r.issues.push({ file: name, line: 1, reason: expanded.reason, message: expanded.message });
      reports.push(r);
      note(`${name}: ${expanded.message}`);
      continue;
    }
    if (expanded.kind === 'gzip') {
      bytes = expanded.bytes;
      binary = bytes.subarray(0, 8192).includes(0);
    }
    // the first 8192 characters (at most 4 bytes each)
    const sample = bytes.toString('utf8', 0, Math.min(bytes.length, 32_768)).slice(0, 8192);
    if (c.path === '-') binary = sample.includes('\u0000');
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
    dataFiles.push({ path: name, bytes, format, fromDir: c.fromDir });
  }
  const index = buildStationIndex(stations);
  for (const f of dataFiles) if (f.path !== '(stdin)') f.nameStation = stationFromFileName(index, f.path);
  return { stations, reports, dataFiles };
}

/**
 * Second pass: read every data file (METAR or CSV) and hand each observation to `onObservation`. The observation
 * object may be reused by the reader right after the call, so the sink copies what it keeps.
 * Returns the files' reports (in input order) and the station positions CSV rows carried.
 */
export function readDataFiles(
  dataFiles: readonly DataFile[],
  opts: ReadOptions,
  onObservation: (o: Observation) => void,
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
  };
  const csvSinkOpts: CsvOptions = { ...csvOpts, reuseObservation: true };
  for (const f of dataFiles) {
    if (f.format === 'metar') {
      const r = readMetarBytes(f.bytes, f.path, { month: opts.month, onObservation });
      r.report.stationIdRule ??= 'the station indicator of each METAR report';
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
        f.format === 'binary' ? 'binary file (NUL bytes), not text observations' : f.format === 'empty' ? 'empty file' : 'neither METAR reports nor a CSV table';
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
