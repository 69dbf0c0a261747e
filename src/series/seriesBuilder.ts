/**
 * Typed sink for observations: readers hand each Observation to `SeriesBuilder.add`, which copies its
 * fields into the station's record chunks (Float64Array, one row of STRIDE values per report; chunks grow
 * without copying) and keeps nothing else, so the object may be reused by the caller right after the call.
 * `build` transposes one station's rows into the columns of a StationSeries (time sort, duplicate
 * resolution by an order-independent rule, notes); `buildSeries` is the same on an array of observations. Station ids can be resolved (aliases) as
 * rows arrive, once per distinct id.
 */
import { allocSeries, SERIES_FIELDS, type DuplicateNote, type DuplicateReason, type FieldColumns, type Observation, type ObserverRemark, type StationMeta, type StationSeries } from '../model/index.js';

const INITIAL_CAPACITY = 32;
const MAX_CHUNK_ROWS = 2048;
/** Values per row in a station's record array (row-major, so one report writes three cache lines, not eighteen). */
const STRIDE = 18;
// record slots
const R_TIME = 0;
const R_T = 1;
const R_TD = 2;
const R_DIR = 3;
const R_SPD = 4;
const R_GUST = 5;
const R_PSTN = 6;
const R_SLP = 7;
const R_ALT = 8;
const R_PCP = 9;
const R_PK = 10;
const R_WX = 11;
const R_TREND = 12;
/** reportType + 4 × corrected */
const R_KIND = 13;
const R_LINE = 14;
const R_FILE = 15;
const R_VIS = 16;
const R_CIG = 17;

/** One station's rows column by column (exact length), in input order. */
export interface Columns extends FieldColumns {
  length: number;
  timeMs: Float64Array;
  /** WX flags as the Observation held them (32-bit, stored 16-bit in the series). */
  weather: Int32Array;
  pressureTrend: Int8Array;
  reportType: Uint8Array;
  corrected: Uint8Array;
  line: Int32Array;
  /** Index into the builder's file table. */
  fileIndex: Int32Array;
  /** Rows that carry observer remarks, ascending, with their remark lists. */
  remarkRows: readonly number[];
  remarkLists: readonly ObserverRemark[][];
}

/**
 * One station's rows as records (STRIDE doubles each, exact length) with its observer remarks: what a reader thread
 * hands over so that another thread appends them (`SeriesBuilder.addRows`); structured-clonable, its buffer transferable.
 */
export interface StationRows {
  length: number;
  records: Float64Array;
  remarkRows: number[];
  remarkLists: ObserverRemark[][];
}

/** One station's rows as they arrived (input order), one record of STRIDE doubles per row, in chunks (no copying on growth). */
export class StationColumns {
  readonly station: string;
  length = 0;
  /** Full chunks, then the current one. */
  private readonly chunks: Float64Array[] = [];
  private cur: Float64Array = new Float64Array(0);
  /** Rows used in the current chunk, and its capacity in rows. */
  private used = 0;
  private rows = 0;
  /** Rows that carry observer remarks, ascending, with their remark lists. */
  remarkRows: number[] = [];
  remarkLists: ObserverRemark[][] = [];

  constructor(station: string) {
    this.station = station;
  }

  private grow(): void {
    const rows = this.rows === 0 ? INITIAL_CAPACITY : Math.min(this.rows * 2, MAX_CHUNK_ROWS);
    this.cur = new Float64Array(rows * STRIDE);
    this.chunks.push(this.cur);
    this.rows = rows;
    this.used = 0;
  }

  /** Append the fields of `o` (copied; `o` is not kept, its remarks array is). */
  push(o: Observation, fileIndex: number): void {
    const i = this.length;
    if (this.used === this.rows) this.grow();
    const r = this.cur;
    const p = this.used * STRIDE;
    this.used++;
    r[p + R_TIME] = o.timeMs;
    r[p + R_T] = o.temperatureC;
    r[p + R_TD] = o.dewpointC;
    r[p + R_DIR] = o.windDirDeg;
    r[p + R_SPD] = o.windSpeedMs;
    r[p + R_GUST] = o.gustMs;
    r[p + R_PSTN] = o.stationPressureHpa;
    r[p + R_SLP] = o.seaLevelPressureHpa;
    r[p + R_ALT] = o.altimeterHpa;
    r[p + R_PCP] = o.precipMm;
    r[p + R_PK] = o.peakWindMs;
    r[p + R_VIS] = o.visibilityM;
    r[p + R_CIG] = o.ceilingFt;
    // integer slots hold what the typed columns of the series would hold
    r[p + R_WX] = o.weather | 0;
    r[p + R_TREND] = (o.pressureTrend << 24) >> 24;
    const src = o.source;
    r[p + R_KIND] = (src === 'METAR' ? 1 : src === 'SPECI' ? 2 : 0) + (o.corrected ? 4 : 0);
    r[p + R_LINE] = o.line | 0;
    r[p + R_FILE] = fileIndex;
    const rm = o.remarks;
    if (rm !== undefined) {
      this.remarkRows.push(i);
      this.remarkLists.push(rm);
    }
    this.length = i + 1;
  }

  /** The rows as one record array (a copy; see StationRows). */
  exportRows(): StationRows {
    const records = new Float64Array(this.length * STRIDE);
    let at = 0;
    for (const r of this.chunks) {
      const k = Math.min(r.length, records.length - at);
      records.set(k === r.length ? r : r.subarray(0, k), at);
      at += k;
    }
    return { length: this.length, records, remarkRows: [...this.remarkRows], remarkLists: [...this.remarkLists] };
  }

  /** Append rows handed over by `exportRows()` (their file indices are kept as they are). */
  appendRows(rows: StationRows): void {
    for (let k = 0; k < rows.length; k++) {
      if (this.used === this.rows) this.grow();
      this.cur.set(rows.records.subarray(k * STRIDE, (k + 1) * STRIDE), this.used * STRIDE);
      this.used++;
    }
    const base = this.length;
    for (let k = 0; k < rows.remarkRows.length; k++) {
      this.remarkRows.push(base + rows.remarkRows[k]!);
      this.remarkLists.push(rows.remarkLists[k]!);
    }
    this.length = base + rows.length;
  }

  /** The rows as exact-length columns (fresh arrays). */
  columns(): Columns {
    const n = this.length;
    const timeMs = new Float64Array(n);
    const temperatureC = new Float64Array(n);
    const dewpointC = new Float64Array(n);
    const windDirDeg = new Float64Array(n);
    const windSpeedMs = new Float64Array(n);
    const gustMs = new Float64Array(n);
    const stationPressureHpa = new Float64Array(n);
    const seaLevelPressureHpa = new Float64Array(n);
    const altimeterHpa = new Float64Array(n);
    const precipMm = new Float64Array(n);
    const peakWindMs = new Float64Array(n);
    const visibilityM = new Float64Array(n);
    const ceilingFt = new Float64Array(n);
    const weather = new Int32Array(n);
    const pressureTrend = new Int8Array(n);
    const reportType = new Uint8Array(n);
    const corrected = new Uint8Array(n);
    const line = new Int32Array(n);
    const fileIndex = new Int32Array(n);
    let i = 0;
    for (const r of this.chunks) {
      const end = Math.min(n, i + r.length / STRIDE);
      for (let p = 0; i < end; i++, p += STRIDE) {
      timeMs[i] = r[p + R_TIME]!;
      temperatureC[i] = r[p + R_T]!;
      dewpointC[i] = r[p + R_TD]!;
      windDirDeg[i] = r[p + R_DIR]!;
      windSpeedMs[i] = r[p + R_SPD]!;
      gustMs[i] = r[p + R_GUST]!;
      stationPressureHpa[i] = r[p + R_PSTN]!;
      seaLevelPressureHpa[i] = r[p + R_SLP]!;
      altimeterHpa[i] = r[p + R_ALT]!;
      precipMm[i] = r[p + R_PCP]!;
      peakWindMs[i] = r[p + R_PK]!;
      visibilityM[i] = r[p + R_VIS]!;
      ceilingFt[i] = r[p + R_CIG]!;
      weather[i] = r[p + R_WX]!;
      pressureTrend[i] = r[p + R_TREND]!;
      const kind = r[p + R_KIND]!;
      reportType[i] = kind & 3;
      corrected[i] = kind >> 2;
      line[i] = r[p + R_LINE]!;
      fileIndex[i] = r[p + R_FILE]!;
      }
    }
    return {
      length: n, timeMs, temperatureC, dewpointC, windDirDeg, windSpeedMs, gustMs, stationPressureHpa, seaLevelPressureHpa,
      altimeterHpa, precipMm, peakWindMs, visibilityM, ceilingFt, weather, pressureTrend, reportType, corrected, line, fileIndex,
      remarkRows: this.remarkRows, remarkLists: this.remarkLists,
    };
  }
}

/** NaN-aware equality of one value. */
function same(x: number, y: number): boolean {
  return x === y || (x !== x && y !== y);
}

/**
 * Collects observations of many stations into columns; builds one StationSeries per station.
 * @example
 * const b = new SeriesBuilder();
 * for (const o of observations) b.add(o);
 * const series = b.stations().map((id) => b.build(id));
 */
export class SeriesBuilder {
  /** Source files seen, indexed by the columns' fileIndex. */
  readonly files: string[] = [];
  private readonly fileIdx = new Map<string, number>();
  private lastFile: string | null = null;
  private lastFileIndex = -1;
  /** Raw id → columns of its resolved station. */
  private readonly byRawId = new Map<string, StationColumns>();
  private readonly byStation = new Map<string, StationColumns>();
  private lastRawId: string | null = null;
  private lastColumns: StationColumns | null = null;
  private readonly resolve: ((id: string) => string) | undefined;

  /**
   * `resolve` maps a raw station id to the id the series is kept under (alias resolution); called once per distinct raw id.
   * `files` fixes the file table in advance (file names in reading order), so that builders of different threads or
   * stations give every file the same index; without it files are numbered in order of first appearance.
   */
  constructor(resolve?: (id: string) => string, files?: readonly string[]) {
    this.resolve = resolve;
    if (files) for (const f of files) if (!this.fileIdx.has(f)) {
      this.fileIdx.set(f, this.files.length);
      this.files.push(f);
    }
  }

  /** Number of rows added so far. */
  get rows(): number {
    let n = 0;
    for (const c of this.byStation.values()) n += c.length;
    return n;
  }

  private fileIndexOf(file: string): number {
    if (file === this.lastFile) return this.lastFileIndex;
    let k = this.fileIdx.get(file);
    if (k === undefined) {
      k = this.files.length;
      this.files.push(file);
      this.fileIdx.set(file, k);
    }
    this.lastFile = file;
    this.lastFileIndex = k;
    return k;
  }

  private columnsOf(rawId: string): StationColumns {
    if (rawId === this.lastRawId) return this.lastColumns!;
    let c = this.byRawId.get(rawId);
    if (c === undefined) {
      const id = this.resolve ? this.resolve(rawId) : rawId;
      c = this.byStation.get(id);
      if (c === undefined) {
        c = new StationColumns(id);
        this.byStation.set(id, c);
      }
      this.byRawId.set(rawId, c);
    }
    this.lastRawId = rawId;
    this.lastColumns = c;
    return c;
  }

  /** Copy one observation in (the object may be reused by the caller afterwards). */
  add(o: Observation): void {
    this.columnsOf(o.station).push(o, this.fileIndexOf(o.file));
  }

  /** Append rows of a station (resolved id) handed over by another builder with the same file table. */
  addRows(station: string, rows: StationRows): void {
    let c = this.byStation.get(station);
    if (c === undefined) {
      c = new StationColumns(station);
      this.byStation.set(station, c);
    }
    c.appendRows(rows);
  }

  /** A station's rows handed over (exportRows), then forgotten here so that their memory can be given back. */
  take(station: string): StationRows {
    const c = this.byStation.get(station);
    if (c === undefined) return { length: 0, records: new Float64Array(0), remarkRows: [], remarkLists: [] };
    const rows = c.exportRows();
    this.byStation.delete(station);
    for (const [raw, col] of this.byRawId) if (col === c) this.byRawId.delete(raw);
    if (this.lastColumns === c) {
      this.lastRawId = null;
      this.lastColumns = null;
    }
    return rows;
  }

  /** Resolved station ids, in order of first appearance. */
  stations(): string[] {
    return [...this.byStation.keys()];
  }

  /** The rows of a station as added (input order; `.columns()` gives them column by column), or undefined. */
  columns(station: string): StationColumns | undefined {
    return this.byStation.get(station);
  }

  /**
   * The series of one station, sorted by time, one row per time. Reports of the same time are resolved by
   * `preferRow`, from the reports alone (never from their order in the input): a correction (COR) is kept over
   * the report it corrects (`correction-replaced`); a repeat with the same values is dropped
   * (`identical-dropped`, counted); of reports with differing values the preferred one is kept, its gaps filled
   * from the others in order of preference, weather OR-ed and remarks joined (`conflict-resolved`, with the
   * rule that chose it). Every duplicate is noted with the file and line of both reports.
   */
  build(station: string, meta?: StationMeta): StationSeries {
    const c = this.byStation.get(station);
    if (c === undefined) return allocSeries(station, 0, meta);
    return buildFromColumns(station, c.columns(), this.files, meta);
  }
}

/** See SeriesBuilder.build. */
function buildFromColumns(station: string, c: Columns, files: readonly string[], meta?: StationMeta): StationSeries {
  const n = c.length;
  const T = c.timeMs;
  let sorted = true;
  let distinct = true;
  for (let i = 1; i < n; i++) {
    const a = T[i - 1]!;
    const b = T[i]!;
    if (b < a) {
      sorted = false;
      break;
    }
    if (b === a) distinct = false;
  }
  if (sorted && distinct) return copyColumns(station, c, files, meta);
  // by time, and among equal times by preference (preferRow): the first row of each time is the one kept
  const order = new Int32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  order.sort((i, j) => T[i]! - T[j]! || preferRow(c, i, j));
  // Output rows: one per distinct time.
  let m = n === 0 ? 0 : 1;
  for (let k = 1; k < n; k++) if (T[order[k]!] !== T[order[k - 1]!]) m++;
  const s = allocSeries(station, m, meta);
  const weather = new Int32Array(m);
  const fileIndex = new Int32Array(m);
  const rowRemarks: (ObserverRemark[] | undefined)[] = new Array(m);
  const remarkOf = (idx: number): ObserverRemark[] | undefined => {
    // remarkRows is ascending: binary search
    const rows = c.remarkRows;
    let lo = 0;
    let hi = rows.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (rows[mid]! < idx) lo = mid + 1;
      else hi = mid;
    }
    return lo < rows.length && rows[lo] === idx ? c.remarkLists[lo] : undefined;
  };
  const hasRemarks = c.remarkRows.length > 0;
  const duplicates: DuplicateNote[] = [];
  let k = -1;
  /** The kept row of the current time. */
  let best = -1;
  for (let q = 0; q < n; q++) {
    const idx = order[q]!;
    const t = T[idx]!;
    if (k >= 0 && s.timeMs[k] === t) {
      const note = (action: DuplicateNote['action'], reason?: DuplicateReason): DuplicateNote => {
        const d: DuplicateNote = { timeMs: t, action, keptLine: c.line[best]!, droppedLine: c.line[idx]!, file: files[c.fileIndex[best]!]!, droppedFile: files[c.fileIndex[idx]!]! };
        if (reason !== undefined) d.reason = reason;
        return d;
      };
      if (c.corrected[best] === 1 && c.corrected[idx] !== 1) {
        duplicates.push(note('correction-replaced'));
      } else if (sameValues(c, best, idx)) {
        duplicates.push(note('identical-dropped'));
      } else {
        duplicates.push(note('conflict-resolved', preferenceReason(c, best, idx)));
        fillGaps(s, k, c, idx);
        weather[k] = c.weather[idx]! | weather[k]!;
        // remarks of both (always a list), in order of preference
        const mine = hasRemarks ? remarkOf(idx) : undefined;
        rowRemarks[k] = [...(rowRemarks[k] ?? []), ...(mine ?? [])];
      }
      continue;
    }
    k++;
    best = idx;
    s.timeMs[k] = t;
    writeRow(s, k, c, idx);
    weather[k] = c.weather[idx]!;
    fileIndex[k] = c.fileIndex[idx]!;
    if (hasRemarks) rowRemarks[k] = remarkOf(idx);
  }
  s.weather.set(weather);
  finishFiles(s, fileIndex, m, files);
  for (let i = 0; i < m; i++) {
    const r = rowRemarks[i];
    if (r) for (const x of r) s.remarks.push(x);
  }
  s.duplicates = duplicates;
  s.remarks.sort((a, b) => a.reportTimeMs - b.reportTimeMs);
  return s;
}

/** Rank of a report type (0 CSV, 1 METAR, 2 SPECI) when reports of one minute conflict: the routine METAR first, then a SPECI, then a CSV row. */
const TYPE_RANK = [2, 0, 1];

/**
 * The fields whose presence and values choose which report of one time is kept: SERIES_FIELDS without visibility and
 * ceiling. Those two are compared for identity (`sameValues`) and fill gaps (`fillGaps`) but choose nothing, so the
 * values detection sees (temperature, dew point, wind, pressure) do not depend on whether a file carries them.
 */
const PREFERENCE_FIELDS = SERIES_FIELDS.filter((f) => f !== 'visibilityM' && f !== 'ceilingFt');

/** Values present in row i: the PREFERENCE_FIELDS that are not NaN, plus one for a present-weather report. */
function elementCount(c: Columns, i: number): number {
  let k = c.weather[i] !== 0 ? 1 : 0;
  for (const f of PREFERENCE_FIELDS) if (c[f][i] === c[f][i]) k++;
  return k;
}

/**
 * Which of two rows of one time is kept, decided from the rows alone, never from their order in the input:
 * negative when row i is preferred. In turn: a correction (COR) over a report that is not one (FMH-1 §12);
 * more values present (`elementCount`); the routine METAR over a SPECI over a CSV row; then, at the first of
 * PREFERENCE_FIELDS where the two differ, a value over a missing one, else the smaller value; then fewer weather
 * bits, then the smaller pressure-trend code (the last three an arbitrary but fixed tie-break: common practice,
 * no source). Rows equal in all of these differ in nothing the series keeps but file and line: the earlier
 * file of the load, then the earlier line, is named as kept.
 */
function preferRow(c: Columns, i: number, j: number): number {
  return (
    c.corrected[j]! - c.corrected[i]! ||
    elementCount(c, j) - elementCount(c, i) ||
    TYPE_RANK[c.reportType[i]!]! - TYPE_RANK[c.reportType[j]!]! ||
    compareValues(c, i, j) ||
    c.fileIndex[i]! - c.fileIndex[j]! ||
    c.line[i]! - c.line[j]! ||
    i - j
  );
}

/** The values tie-break of preferRow (over PREFERENCE_FIELDS): negative when row i is preferred. */
function compareValues(c: Columns, i: number, j: number): number {
  for (const f of PREFERENCE_FIELDS) {
    const x = c[f][i]!;
    const y = c[f][j]!;
    if (same(x, y)) continue;
    if (x !== x) return 1;
    if (y !== y) return -1;
    return x < y ? -1 : 1;
  }
  return c.weather[i]! - c.weather[j]! || c.pressureTrend[i]! - c.pressureTrend[j]!;
}

/** Why preferRow keeps row a over row b: the first of its rules that tells them apart. */
function preferenceReason(c: Columns, a: number, b: number): DuplicateReason {
  if (c.corrected[a] !== c.corrected[b]) return 'correction';
  if (elementCount(c, a) !== elementCount(c, b)) return 'more values';
  if (c.reportType[a] !== c.reportType[b]) return 'report type';
  return 'values tie-break';
}

/** Station-local file table in order of first appearance among the kept rows. */
function finishFiles(s: StationSeries, globalIndex: Int32Array, m: number, files: readonly string[]): void {
  const local = new Map<number, number>();
  let lastG = -1;
  let lastL = -1;
  for (let i = 0; i < m; i++) {
    const g = globalIndex[i]!;
    if (g !== lastG) {
      let l = local.get(g);
      if (l === undefined) {
        l = s.files.length;
        s.files.push(files[g]!);
        local.set(g, l);
      }
      lastG = g;
      lastL = l;
    }
    s.fileIndex[i] = lastL;
  }
}

/** Fast path: rows already in strictly increasing time order; columns are copied whole. */
function copyColumns(station: string, c: Columns, files: readonly string[], meta?: StationMeta): StationSeries {
  const n = c.length;
  const s = allocSeries(station, 0, meta);
  const qc = s.qc;
  for (const f of Object.keys(qc) as (keyof typeof qc)[]) qc[f] = new Uint8Array(n);
  s.length = n;
  s.timeMs = c.timeMs;
  s.temperatureC = c.temperatureC;
  s.dewpointC = c.dewpointC;
  s.windDirDeg = c.windDirDeg;
  s.windSpeedMs = c.windSpeedMs;
  s.gustMs = c.gustMs;
  s.stationPressureHpa = c.stationPressureHpa;
  s.seaLevelPressureHpa = c.seaLevelPressureHpa;
  s.altimeterHpa = c.altimeterHpa;
  s.precipMm = c.precipMm;
  s.peakWindMs = c.peakWindMs;
  s.visibilityM = c.visibilityM;
  s.ceilingFt = c.ceilingFt;
  s.weather = new Uint16Array(n);
  s.weather.set(c.weather);
  s.pressureTrend = c.pressureTrend;
  s.reportType = c.reportType;
  s.line = c.line;
  s.fileIndex = new Uint16Array(n);
  finishFiles(s, c.fileIndex, n, files);
  for (const list of c.remarkLists) for (const x of list) s.remarks.push(x);
  s.remarks.sort((a, b) => a.reportTimeMs - b.reportTimeMs);
  return s;
}

/** Write row idx of the columns into series row k (all values but time, weather and file). */
function writeRow(s: StationSeries, k: number, c: Columns, idx: number): void {
  s.temperatureC[k] = c.temperatureC[idx]!;
  s.dewpointC[k] = c.dewpointC[idx]!;
  s.windDirDeg[k] = c.windDirDeg[idx]!;
  s.windSpeedMs[k] = c.windSpeedMs[idx]!;
  s.gustMs[k] = c.gustMs[idx]!;
  s.stationPressureHpa[k] = c.stationPressureHpa[idx]!;
  s.seaLevelPressureHpa[k] = c.seaLevelPressureHpa[idx]!;
  s.altimeterHpa[k] = c.altimeterHpa[idx]!;
  s.precipMm[k] = c.precipMm[idx]!;
  s.peakWindMs[k] = c.peakWindMs[idx]!;
  s.visibilityM[k] = c.visibilityM[idx]!;
  s.ceilingFt[k] = c.ceilingFt[idx]!;
  s.pressureTrend[k] = c.pressureTrend[idx]!;
  s.reportType[k] = c.reportType[idx]!;
  s.line[k] = c.line[idx]!;
}

/** Fill the gaps (NaN) of series row k from row idx of the columns. */
function fillGaps(s: StationSeries, k: number, c: Columns, idx: number): void {
  for (const f of SERIES_FIELDS) {
    const col = s[f];
    if (col[k] !== col[k]) col[k] = c[f][idx]!;
  }
}

/** The series values of rows i and j are equal (NaN equals NaN), visibility and ceiling included. */
function sameValues(c: Columns, i: number, j: number): boolean {
  for (const f of SERIES_FIELDS) if (!same(c[f][i]!, c[f][j]!)) return false;
  return true;
}
