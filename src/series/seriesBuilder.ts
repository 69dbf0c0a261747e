/**
 * Typed sink for observations: readers hand each Observation to `SeriesBuilder.add`, which copies its
 * fields into the station's record chunks (Float64Array, one row of STRIDE values per report; chunks grow
 * without copying) and keeps nothing else, so the object may be reused by the caller right after the call.
 * `build` transposes one station's rows into the columns of a StationSeries with exactly the rules of
 * `buildSeries` (stable time sort, duplicate resolution, notes). Station ids can be resolved (aliases) as
 * rows arrive, once per distinct id.
 */
import { allocSeries, type DuplicateNote, type FieldColumns, type Observation, type ObserverRemark, type StationMeta, type StationSeries } from '../model/index.js';

const INITIAL_CAPACITY = 32;
const MAX_CHUNK_ROWS = 2048;
/** Values per row in a station's record array (row-major, so one report writes two cache lines, not sixteen). */
const STRIDE = 16;
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
      altimeterHpa, precipMm, peakWindMs, weather, pressureTrend, reportType, corrected, line, fileIndex,
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

  /** `resolve` maps a raw station id to the id the series is kept under (alias resolution); called once per distinct raw id. */
  constructor(resolve?: (id: string) => string) {
    this.resolve = resolve;
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

  /** Resolved station ids, in order of first appearance. */
  stations(): string[] {
    return [...this.byStation.keys()];
  }

  /** The rows of a station as added (input order; `.columns()` gives them column by column), or undefined. */
  columns(station: string): StationColumns | undefined {
    return this.byStation.get(station);
  }

  /**
   * The series of one station: sorted by time (stable: input order among equal times), duplicates
   * resolved as in `buildSeries`: a correction (COR) replaces the report it corrects; a report repeated
   * after its correction is dropped (`corrected-kept`); an identical repeat is dropped; differing repeats
   * keep the later line with its gaps filled from the earlier one, weather OR-ed and remarks joined.
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
  let order: Int32Array;
  if (sorted) {
    order = new Int32Array(n);
    for (let i = 0; i < n; i++) order[i] = i;
  } else {
    order = stableOrder(T, n);
  }
  // Output rows: one per distinct time.
  let m = n === 0 ? 0 : 1;
  for (let k = 1; k < n; k++) if (T[order[k]!] !== T[order[k - 1]!]) m++;
  const s = allocSeries(station, m, meta);
  const corrected = new Uint8Array(m);
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
  for (let q = 0; q < n; q++) {
    const idx = order[q]!;
    const t = T[idx]!;
    if (k >= 0 && s.timeMs[k] === t) {
      const oc = c.corrected[idx] === 1;
      const pc = corrected[k] === 1;
      const file = files[c.fileIndex[idx]!]!;
      if (oc && !pc) {
        duplicates.push({ timeMs: t, action: 'correction-replaced', keptLine: c.line[idx]!, droppedLine: s.line[k]!, file });
        writeRow(s, k, c, idx);
        corrected[k] = 1;
        weather[k] = c.weather[idx]!;
        fileIndex[k] = c.fileIndex[idx]!;
        if (hasRemarks) rowRemarks[k] = remarkOf(idx);
      } else if (pc && !oc) {
        duplicates.push({ timeMs: t, action: 'corrected-kept', keptLine: s.line[k]!, droppedLine: c.line[idx]!, file });
      } else if (sameRow(s, k, c, idx)) {
        duplicates.push({ timeMs: t, action: 'identical-dropped', keptLine: s.line[k]!, droppedLine: c.line[idx]!, file });
      } else {
        duplicates.push({ timeMs: t, action: 'conflict-kept-last', keptLine: c.line[idx]!, droppedLine: s.line[k]!, file });
        mergeRow(s, k, c, idx);
        corrected[k] = c.corrected[idx]!;
        weather[k] = c.weather[idx]! | weather[k]!;
        fileIndex[k] = c.fileIndex[idx]!;
        // merged remarks: the earlier row's, then this row's (always a list, as buildSeries does)
        const prev = hasRemarks ? rowRemarks[k] : undefined;
        const mine = hasRemarks ? remarkOf(idx) : undefined;
        rowRemarks[k] = [...(prev ?? []), ...(mine ?? [])];
      }
      continue;
    }
    k++;
    s.timeMs[k] = t;
    writeRow(s, k, c, idx);
    corrected[k] = c.corrected[idx]!;
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

/** Stable order of row indices by time (input order among equal times). */
function stableOrder(T: Float64Array, n: number): Int32Array {
  const order = new Int32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  return order.sort((i, j) => T[i]! - T[j]! || i - j);
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
  s.pressureTrend[k] = c.pressureTrend[idx]!;
  s.reportType[k] = c.reportType[idx]!;
  s.line[k] = c.line[idx]!;
}

/** Row idx over series row k: its values where present, the earlier ones in its gaps. */
function mergeRow(s: StationSeries, k: number, c: Columns, idx: number): void {
  let v: number;
  v = c.temperatureC[idx]!;
  if (v === v) s.temperatureC[k] = v;
  v = c.dewpointC[idx]!;
  if (v === v) s.dewpointC[k] = v;
  v = c.windDirDeg[idx]!;
  if (v === v) s.windDirDeg[k] = v;
  v = c.windSpeedMs[idx]!;
  if (v === v) s.windSpeedMs[k] = v;
  v = c.gustMs[idx]!;
  if (v === v) s.gustMs[k] = v;
  v = c.stationPressureHpa[idx]!;
  if (v === v) s.stationPressureHpa[k] = v;
  v = c.seaLevelPressureHpa[idx]!;
  if (v === v) s.seaLevelPressureHpa[k] = v;
  v = c.altimeterHpa[idx]!;
  if (v === v) s.altimeterHpa[k] = v;
  v = c.precipMm[idx]!;
  if (v === v) s.precipMm[k] = v;
  v = c.peakWindMs[idx]!;
  if (v === v) s.peakWindMs[k] = v;
  s.pressureTrend[k] = c.pressureTrend[idx]!;
  s.reportType[k] = c.reportType[idx]!;
  s.line[k] = c.line[idx]!;
}

/** The ten series values of row idx equal those of series row k (NaN equals NaN). */
function sameRow(s: StationSeries, k: number, c: Columns, idx: number): boolean {
  return (
    same(s.temperatureC[k]!, c.temperatureC[idx]!) &&
    same(s.dewpointC[k]!, c.dewpointC[idx]!) &&
    same(s.windDirDeg[k]!, c.windDirDeg[idx]!) &&
    same(s.windSpeedMs[k]!, c.windSpeedMs[idx]!) &&
    same(s.gustMs[k]!, c.gustMs[idx]!) &&
    same(s.stationPressureHpa[k]!, c.stationPressureHpa[idx]!) &&
    same(s.seaLevelPressureHpa[k]!, c.seaLevelPressureHpa[idx]!) &&
    same(s.altimeterHpa[k]!, c.altimeterHpa[idx]!) &&
    same(s.precipMm[k]!, c.precipMm[idx]!) &&
    same(s.peakWindMs[k]!, c.peakWindMs[idx]!)
  );
}
