/**
 * The reading edge of ingest: expand paths, sniff each file's format, read stations files, then hand every
 * observation of the data files to a sink. Bytes in, observations and per-file reports out; building series,
 * station pressure and QC happen downstream (src/pipeline.ts).
 * Every file is accounted for in a FileReport; files that are not observations are skipped with a note.
 */
import { closeSync, lstatSync, openSync, readdirSync, readFileSync, readSync, realpathSync, statSync, type Stats } from 'node:fs';
import { basename, extname, join } from 'node:path';
import { newFileReport, UsageError, type FileReport, type Observation, type StationMeta } from '../model/index.js';
import { decodeMetarAt, isParseIssue, looksLikeMetar, MetarReader, metarToObservation } from './metar.js';
import { CsvReader, type CsvOptions, type RawReportDecoded } from './csv.js';
import { buildStationIndex, looksLikeStationsFile, readStationsText, resolveStation, stationFromFileName, type FileNameStation, type StationIndex } from './stations.js';
import type { ColumnOverride } from './columns.js';
import { compressionOf, expandBytes, GunzipPieces, GzipStreamError } from './decompress.js';
import { isIsdHeaders, readIsdText } from './isd.js';
import { looksBinary, prepareText } from './text.js';
import { encodingOf, LineSplitter, splitWhole, type TextBlock } from './lines.js';
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
  /** Text read from standard input when a path is `-` (wins over `stdinFd`). */
  stdinText?: string;
  /** File descriptor read as a stream when a path is `-` (the CLI gives 0, standard input). */
  stdinFd?: number;
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

/** One data file with its sniffed format: held in memory (`bytes`), or read as a stream when its turn comes (`stream`). */
export interface DataFile {
  path: string;
  /** The file's bytes (prepared text) when held in memory; empty when `stream` is set. */
  bytes: Buffer;
  /** Read in chunks from here: a file path, or an open descriptor (standard input) with the chunk already read from it. */
  stream?: { file: string; gzip?: boolean } | { fd: number; head: Buffer; ended: boolean; gunzip?: GunzipPieces };
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

/** Bytes read at a time from a streamed file (and the head read to sniff its format). */
export const CHUNK_BYTES = 1 << 20;

/** Read into `buf` until it is full or the input ends (a pipe hands over less at a time); the bytes read. */
function readFull(fd: number, buf: Buffer): number {
  let n = 0;
  while (n < buf.length) {
    let k: number;
    try {
      k = readSync(fd, buf, n, buf.length - n, null);
    } catch (e) {
      // a non-blocking descriptor with nothing yet: wait a little and read again
      if (errCode(e) === 'EAGAIN') {
        Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, 5);
        continue;
      }
      throw e;
    }
    if (k === 0) break;
    n += k;
  }
  return n;
}

/** The first CHUNK_BYTES of a file (all of it when shorter). */
function readHead(path: string): Buffer {
  const fd = openSync(path, 'r');
  try {
    const buf = Buffer.allocUnsafe(CHUNK_BYTES);
    return buf.subarray(0, readFull(fd, buf));
  } finally {
    closeSync(fd);
  }
}

/** The rest of a descriptor, to its end. */
function readRest(fd: number): Buffer {
  const parts: Buffer[] = [];
  for (;;) {
    const buf = Buffer.allocUnsafe(CHUNK_BYTES);
    const n = readFull(fd, buf);
    if (n > 0) parts.push(buf.subarray(0, n));
    if (n < CHUNK_BYTES) return Buffer.concat(parts);
  }
}

/**
 * Hand a streamed file's chunks, in order, to `onChunk` (memory holds one chunk); `first` says whether the
 * chunk is the whole input (it ended within the first chunk).
 */
function streamChunks(src: NonNullable<DataFile['stream']>, onChunk: (chunk: Buffer, whole: boolean) => void): void {
  if ('fd' in src) {
    // (gzip on standard input: the head is already expanded, the rest goes through the same expander)
    if (src.head.length > 0 || !src.gunzip) onChunk(src.head, src.ended);
    if (src.ended) return;
    for (;;) {
      const buf = Buffer.allocUnsafe(CHUNK_BYTES);
      const n = readFull(src.fd, buf);
      if (src.gunzip) {
        for (const out of src.gunzip.push(buf.subarray(0, n), n < CHUNK_BYTES)) if (out.length) onChunk(out, false);
      } else if (n > 0) onChunk(buf.subarray(0, n), false);
      if (n < CHUNK_BYTES) return;
    }
  }
  const fd = openSync(src.file, 'r');
  if (src.gzip) {
    // expanded piece by piece (decompress.ts: bounded against decompression bombs); the pieces are never whole
    try {
      const g = new GunzipPieces();
      for (;;) {
        const buf = Buffer.allocUnsafe(CHUNK_BYTES);
        const n = readFull(fd, buf);
        for (const out of g.push(buf.subarray(0, n), n < CHUNK_BYTES)) if (out.length) onChunk(out, false);
        if (n < CHUNK_BYTES) return;
      }
    } finally {
      closeSync(fd);
    }
  }
  try {
    let firstChunk = true;
    for (;;) {
      const buf = Buffer.allocUnsafe(CHUNK_BYTES);
      const n = readFull(fd, buf);
      if (n > 0 || firstChunk) onChunk(buf.subarray(0, n), firstChunk && n < CHUNK_BYTES);
      firstChunk = false;
      if (n < CHUNK_BYTES) return;
    }
  } finally {
    closeSync(fd);
  }
}

/** Why a file could not be read, in words, from its error. */
function readFailure(e: unknown): string {
  const code = errCode(e);
  if (code === 'EACCES' || code === 'EPERM') return 'cannot read the file: permission denied';
  if (code === 'ERR_FS_FILE_TOO_LARGE' || code === 'ERR_STRING_TOO_LONG' || code === 'ERR_BUFFER_TOO_LARGE')
    return 'cannot read the file: a compressed file is expanded in memory, and this one is larger than one in-memory read allows (2 GiB); decompress it first (plain files are streamed)';
  if (code === 'EISDIR') return 'cannot read the file: it is a folder';
  if (e instanceof GzipStreamError) return e.message;
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
  /** A compressed file not expanded: skipped, its one rejection counted and said. */
  const refuse = (name: string, reason: string, message: string): void => {
    const r = newFileReport(name, 'skipped');
    r.rejectedByReason[reason] = 1;
    r.rejected = 1;
    r.issues.push({ file: name, line: 1, reason, message });
    reports.push(r);
    note(`${name}: ${message}`);
  };
  /** A gzip stream that stopped expanding (a bomb or damaged data), refused as above. */
  const refuseGzip = (name: string, e: unknown): void => refuse(name, e instanceof GzipStreamError ? e.reason : 'bad-gzip', (e as Error).message);
  /** A file that could not be read: its report says why. */
  const unreadable = (path: string, e: unknown): void => {
    const why = readFailure(e);
    const r = newFileReport(path, 'unreadable');
    r.notes.push(why);
    reports.push(r);
    note(`${path}: ${why}`);
  };
  for (const c of files) {
    let raw: Buffer;
    const name = c.path === '-' ? '(stdin)' : c.path;
    // plain text is streamed when its turn comes (only its head is read here); compressed files are held whole
    let stream: DataFile['stream'];
    if (c.path === '-') {
      if (opts.stdinText === undefined && opts.stdinFd !== undefined) {
        const head = Buffer.allocUnsafe(CHUNK_BYTES);
        const n = readFull(opts.stdinFd, head);
        raw = head.subarray(0, n);
        const kind = compressionOf(raw);
        if (kind === 'gzip' && n === CHUNK_BYTES) {
          // gzip of 1 MiB or more: expanded as it is read (decompress.ts), its expanded head sniffed here
          const gunzip = new GunzipPieces();
          try {
            raw = Buffer.concat(gunzip.push(raw, false));
          } catch (e) {
            refuseGzip(name, e);
            continue;
          }
          stream = { fd: opts.stdinFd, head: raw, ended: false, gunzip };
        } else if (kind !== null) {
          // smaller compressed input is expanded whole (bounded, decompress.ts)
          raw = n < CHUNK_BYTES ? raw : Buffer.concat([raw, readRest(opts.stdinFd)]);
        } else stream = { fd: opts.stdinFd, head: raw, ended: n < CHUNK_BYTES };
      } else raw = Buffer.from(opts.stdinText ?? '', 'utf8');
    } else {
      if (c.fromDir && NOT_OBSERVATIONS.has(extname(c.path).toLowerCase())) {
        note(`${c.path}: skipped (not an observation file)`);
        reports.push({ ...newFileReport(c.path, 'skipped'), notes: ['not an observation file'] });
        continue;
      }
      try {
        raw = readHead(c.path);
        const kind = compressionOf(raw);
        if (kind === 'gzip' && raw.length === CHUNK_BYTES) {
          // a gzip file of 1 MiB or more is streamed: its expanded head is sniffed here, the rest read in turn
          try {
            raw = Buffer.concat(new GunzipPieces().push(raw, false));
          } catch (e) {
            refuseGzip(c.path, e);
            continue;
          }
          stream = { file: c.path, gzip: true };
        } else if (kind !== null) raw = readFileSync(c.path);
        else stream = { file: c.path };
      } catch (e) {
        unreadable(c.path, e);
        continue;
      }
    }
    if (stream === undefined) {
      // gzip is expanded (bounded); other compressed files are refused with a message (decompress.ts)
      const expanded = expandBytes(raw);
      if ('reason' in expanded) {
        refuse(name, expanded.reason, expanded.message);
        continue;
      }
      if (expanded.kind === 'gzip') raw = expanded.bytes;
    }
    // binary only when most of the head is not text (text.ts); else decoded, BOM dropped, line ends made one kind
    const binary = looksBinary(raw);
    const wholeHere = stream === undefined || ('fd' in stream ? stream.ended : !stream.gzip && raw.length < CHUNK_BYTES);
    const bytes = binary ? raw.subarray(0, 8192) : Buffer.concat(splitWhole(raw, new LineSplitter(wholeHere ? { encoding: encodingOf(raw) } : {})).map((b) => b.bytes));
    // the first 8192 characters (at most 4 bytes each)
    const sample = bytes.toString('utf8', 0, Math.min(bytes.length, 32_768)).slice(0, 8192);
    const format = sniffFormat(basename(name).replace(/\.gz$/i, ''), sample, binary);
    const streamed = stream !== undefined && (format === 'metar' || format === 'csv');
    // stations and ISD files are read whole; binary, empty and unknown files need no more than their head
    const whole = stream !== undefined && (format === 'stations' || format === 'isd');
    if (whole && stream && !('fd' in stream)) {
      try {
        raw = readFileSync(c.path);
        if (stream.gzip) {
          const ex = expandBytes(raw);
          if ('reason' in ex) {
            refuse(c.path, ex.reason, ex.message);
            continue;
          }
          raw = ex.bytes;
        }
      } catch (e) {
        unreadable(c.path, e);
        continue;
      }
    } else if (whole && stream && 'fd' in stream) {
      try {
        raw = Buffer.concat(stream.gunzip ? [raw, ...stream.gunzip.push(readRest(stream.fd), true)] : [raw, readRest(stream.fd)]);
      } catch (e) {
        refuseGzip(name, e);
        continue;
      }
    }
    if (format === 'stations') {
      if (opts.stationsFile) {
        note(`${name}: stations file ignored (--stations given)`);
        reports.push({ ...newFileReport(name, 'stations'), notes: ['ignored: --stations given'] });
        continue;
      }
      const prep = prepareText(raw);
      const r = readStationsText(prep.bytes.toString('utf8'), name);
      stations.push(...r.stations);
      reports.push(r.report);
      continue;
    }
    if (streamed) dataFiles.push({ path: name, bytes: Buffer.alloc(0), stream, format, fromDir: c.fromDir });
    else if (binary) dataFiles.push({ path: name, bytes: raw.subarray(0, 8192), format, fromDir: c.fromDir, textNotes: [], hasNul: false });
    else {
      const prep = prepareText(raw);
      dataFiles.push({ path: name, bytes: prep.bytes, format, fromDir: c.fromDir, textNotes: prep.notes, hasNul: prep.hasNul });
    }
  }
  const index = buildStationIndex(stations);
  for (const f of dataFiles) if (f.path !== '(stdin)') f.nameStation = stationFromFileName(index, f.path);
  return { stations, reports, dataFiles };
}

/**
 * A data file's text as blocks of whole lines (lines.ts), from its stream or the bytes held; the notes on its text
 * (encoding, line ends) and, when reading stopped on an error, why (the lines before it are kept).
 */
function readBlocks(f: DataFile, onBlock: (b: TextBlock) => void, note: (m: string) => void): { text: string[]; failure?: string } {
  if (!f.stream) {
    // held in memory: already prepared (prepareText); one block
    onBlock({ bytes: f.bytes, firstLine: 1, hasNul: f.hasNul ?? f.bytes.indexOf(0) >= 0, last: true });
    return { text: f.textNotes ?? [] };
  }
  let splitter: LineSplitter | null = null;
  try {
    streamChunks(f.stream, (chunk, whole) => {
      splitter ??= new LineSplitter(whole ? { encoding: encodingOf(chunk) } : {});
      const b = splitter.push(chunk);
      if (b) onBlock(b);
    });
  } catch (e) {
    const why = `reading stopped: ${readFailure(e)}; the lines before are read`;
    note(`${f.path}: ${why}`);
    const s: LineSplitter = splitter ?? new LineSplitter();
    const b = s.end();
    if (b) onBlock(b);
    return { text: s.notes(), failure: why };
  }
  const s: LineSplitter = splitter ?? new LineSplitter();
  const b = s.end();
  if (b) onBlock(b);
  return { text: s.notes() };
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
  // and their coordinates, for local-standard-time files that name no zone (the zone at the station)
  if (index !== undefined && [...index.byId.values()].some((m) => Number.isFinite(m.latDeg) && Number.isFinite(m.lonDeg))) csvOpts.stationPosition = (id) => resolveStation(index, id).meta;
  const csvSinkOpts: CsvOptions = { ...csvOpts, reuseObservation: true };
  for (const f of dataFiles) {
    if (f.format === 'metar') {
      const reader = new MetarReader(f.path, { month: opts.month, onObservation, ...(opts.timeWindow ? { timeWindow: opts.timeWindow } : {}) });
      const notes = readBlocks(f, (b) => reader.block(b), note);
      const r = reader.finish(notes.text);
      if (notes.failure) r.report.notes.push(notes.failure);
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
      const reader = new CsvReader(f.path, nameStation ? { ...csvSinkOpts, stationFromFileName: () => nameStation } : csvSinkOpts, onObservation);
      const notes = readBlocks(f, (b) => reader.block(b), note);
      const r = reader.finish(notes.text);
      if (notes.failure) r.report.notes.push(notes.failure);
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
