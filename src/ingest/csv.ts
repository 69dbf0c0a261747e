/**
 * CSV / TSV station time series → Observations in canonical units, with a FileReport accounting for every
 * line. Parsing is papaparse in chunk mode (blocks of rows, still streaming), over a string or a Node readable
 * stream; both entry points share one row handler (`CsvCore`). A large file without any quote character,
 * where CSV is nothing but a split on the line ending and on the delimiter (what papaparse itself does in
 * its fast mode), is scanned in place instead, as UTF-8 bytes, with papaparse's guess of delimiter and line
 * ending: cells are read where they stand, without a string per cell (same rows, values, issues and notes;
 * `readCsvBytes`, which the loader uses).
 *
 * Rules (decided here; tests pin them):
 * - The first non-blank row is the header (see columns.ts for names). Blank lines are skipped, not counted.
 * - Line numbers are 1-based physical lines; a quoted field holding line breaks makes one row of several lines
 *   (the lines after the first are counted in `continuationLines`).
 * - A data line is either parsed (one Observation) or rejected with a reason (`addIssue`):
 *   `truncated` (fewer fields than the header), `no-time`, `bad-time`, `ambiguous-time`, `nonexistent-time`,
 *   `needs-zone`, `no-station`, `summary-row` (LCD daily/monthly summary), `no-time-column`,
 *   `no-data-columns`, `wrong-delimiter`, `bad-quotes` (also an unclosed quote running past its line:
 *   `checkQuotes`), `control-bytes` (a NUL byte in the line); whole-file reason `empty`.
 * - A bad VALUE never rejects its row: the value becomes NaN and is counted per field and reason
 *   (`bad-value`, `sentinel`, `missing`, flags `suspect`/`trace`/`estimated`...) in `valueCounts` and in a
 *   report note. Times going backwards within a station are accepted and counted (`time-backwards`); the
 *   series builder sorts.
 * - Missing markers: empty, `M`, `MM`, `NA`, `N/A`, `NaN`, `null`, `None`, `-`, `--`, `missing` (any case),
 *   plus the caller's list (compared as text and, when numeric, as a number). Numeric sentinels (common
 *   practice, no source): −999, −999.9, −9999, −9999.9, −99999 for every field; 999, 999.9, 9999, 9999.9,
 *   99999, 99999.9 for temperature, dew point, humidity, wind, gust, precipitation, lat/lon (impossible
 *   values there); for pressure only 9999, 9999.9, 99999.9, and 99999 unless the unit is Pa (999.9 hPa is
 *   a real pressure); for elevation only 99999 and 99999.9 (9999 ft is a real elevation).
 * - NCEI LCD cell flags (LCD documentation, from memory): a trailing `s` (suspect) or `*`/`A`/`E` is
 *   stripped and the value kept and counted; `T` (trace) reads as 0 for precipitation; `VRB` wind
 *   direction is NaN (variable).
 * - Dew point missing but temperature and relative humidity present → dew point from the inverse Magnus form
 *   (`dewpointFromRelativeHumidity`, physics/dewpoint.ts) with the AlduchovEskridge1996 eq. 21 coefficients
 *   (`MAGNUS_AERK1996`: the set recommended there for −40…50 °C, and the one the reader has always used; the
 *   Bolton1980 default differs by about 0.01 °C at 20 °C, 50 %); RH outside (0, 100] % → NaN;
 *   counted in a note.
 * - Raw report column (IEM `metar`, LCD `REM`) with a `decodeRawReport` callback: the decoded report fills
 *   every field the columns leave missing; temperature and dew point from the decoder REPLACE the column
 *   values when the decoder sets `tempFromRemarks` (tenths of °C from the US `T` remark group, FMH-1
 *   Ch. 12, are more precise than whole °F/°C columns); weather flags are OR-ed; remarks, pressure
 *   tendency (PRESRR/PRESFR), peak wind and the COR flag come from the decoder.
 * - `source` is `METAR`/`SPECI` for LCD `FM-15`/`FM-16` rows (or what the decoder says when there is no
 *   report-type column), otherwise `CSV`.
 * - Station: the station column, else `defaultStation`, else the file name without directory and extension
 *   (noted). Ids are trimmed, case kept.
 */
import Papa from 'papaparse';
import { addIssue, emptyObservation, newFileReport, WX, type FileReport, type Observation } from '../model/index.js';
import { FIELD_QUANTITY, isLcdHeaders, mapColumns, NUMERIC_FIELDS, TIME_PARTS, type ColumnMapping, type ColumnOverride, type NumericField, type UnitSource } from './columns.js';
import { conversionOf, converter, inferUnit, unitQuantity, type UnitName } from './units.js';
import { assembleTimeText, makeTimeReader, parseOffsetMinutes, timeColumnIndices, type TimeColumns, type TimeReader } from './time.js';
import { looksLikeStationsFile } from './stations.js';
import { weatherFlags } from './metar/weather.js';
import { ecccProvince, ecccWeatherFlags, isEcccHeaders } from './eccc.js';
import { NEAR_KM, utcOffsetLabel, zoneAtCoordinates } from './zones.js';
import { dewpointFromRelativeHumidity } from '../physics/dewpoint.js';
import { MAGNUS_AERK1996 } from '../physics/vapor.js';
import { lineEndsToLf, normalizeLineEnds, prepareText } from './text.js';
import { LineSplitter, type TextBlock } from './lines.js';
import { DEFAULT_TIME_WINDOW, outOfWindowMessage, type TimeWindow } from './plausible.js';

/** What rows of naive local time without a known zone need (the notes' remedy). */
const ZONE_REMEDY = '--utc-offset MINUTES or --tz ZONE';

/** What a raw-report decoder returns: any Observation fields, plus whether T/Td came from the T remark group. */
export type RawReportDecoded = Partial<Observation> & { tempFromRemarks?: boolean };
export type RawReportDecoder = (text: string, timeMs: number, file: string, line: number) => RawReportDecoded | null;

export interface CsvOptions {
  overrides?: ColumnOverride[];
  /** Extra missing markers, e.g. ['-99']. */
  missing?: string[];
  /** IANA zone for times without offset. */
  zone?: string;
  /** Naive times are the zone's standard time all year (NCEI LCD; defaults to true for LCD files). */
  standardTime?: boolean;
  /** Fixed UTC offset (minutes east) for naive times; wins over zone. */
  offsetMinutes?: number;
  defaultStation?: string;
  /** The IANA zone of a station's naive local times (the stations file's `tz`), when neither zone nor offset is given. */
  stationZone?: (station: string) => string | undefined;
  /** A station's coordinates (the stations file's), for the zone of local-standard-time files that give none (zones.ts). */
  stationPosition?: (station: string) => { latDeg: number; lonDeg: number } | undefined;
  /** The station id a file without a station column takes from its name, and the rule that gave it (stations.ts). */
  stationFromFileName?: (file: string) => { id: string; rule: string };
  /** Force a delimiter (default: detect among comma, tab, semicolon, pipe). */
  delimiter?: string;
  decodeRawReport?: RawReportDecoder;
  /** Rows buffered to infer units of columns that do not name one (default 1000). */
  inferRows?: number;
  /**
   * Hand the same Observation object to the row callback every time (no object per row): the callback
   * must copy what it keeps (e.g. `SeriesBuilder.add`). Remarks arrays are not reused.
   */
  reuseObservation?: boolean;
  /**
   * `papaparse` parses every text with papaparse; `auto` (default) scans a large text without quote
   * characters in place (same results, faster; see the module comment).
   */
  parser?: 'auto' | 'papaparse';
  /** Accepted observation times (default DEFAULT_TIME_WINDOW, plausible.ts); rows outside are `time-out-of-range`. */
  timeWindow?: Readonly<TimeWindow>;
}

export interface StationPosition {
  latDeg: number;
  lonDeg: number;
  elevationM: number;
}

export interface UnitChoice {
  unit: UnitName;
  source: UnitSource;
  why: string;
}

export interface CsvResult {
  report: FileReport;
  stationsSeen: Map<string, StationPosition>;
  /** Value-level counts keyed `reason:field` (e.g. `bad-value:temperature`). */
  valueCounts: Record<string, number>;
  /** Unit decided per numeric field, with its source and reason. */
  units: Partial<Record<NumericField, UnitChoice>>;
}

/** Sky covers that are no ceiling (FMH-1 §12.6.9: only BKN, OVC and VV make one). */
const NO_CEILING_COVERS = new Set(['CLR', 'SKC', 'NCD', 'NSC', 'FEW', 'SCT']);

/**
 * Ceiling, ft, from a sky-conditions text of layers `COVER:oktas height`, the height in hundreds of feet, as NCEI
 * LCD writes `HourlySkyConditions` (e.g. `FEW:02 45 BKN:07 100 OVC:08 250`; layout from the LCD documentation,
 * from memory): the lowest BKN, OVC or VV layer (FMH-1 §12.6.9); +Infinity when only layers without a ceiling are
 * given (CLR, SKC, FEW, SCT); NaN for an empty or missing cell; null when the text holds no layer at all (counted
 * as a bad value by the caller). Only the first `|`-separated section is read.
 * @example ceilingFromSkyText('FEW:02 45 BKN:07 100') // 10000
 */
export function ceilingFromSkyText(text: string): number | null {
  const t = text.split('|', 1)[0]!.trim().toUpperCase();
  if (t === '' || MISSING.has(t.toLowerCase())) return NaN;
  let ceiling = NaN;
  let layers = 0;
  for (const m of t.matchAll(/\b(FEW|SCT|BKN|OVC|VV|CLR|SKC|X)(?::(\d{1,2}))?(?:\s+(\d{1,3}))?(?=\s|$)/g)) {
    layers++;
    const cover = m[1]!;
    if (cover !== 'BKN' && cover !== 'OVC' && cover !== 'VV') {
      if (NO_CEILING_COVERS.has(cover) && ceiling !== ceiling) ceiling = Infinity;
      continue;
    }
    if (m[3] === undefined) continue;
    const h = Number(m[3]) * 100;
    if (!(ceiling <= h)) ceiling = h;
  }
  return layers === 0 ? null : ceiling;
}

const MISSING = new Set(['', 'm', 'mm', 'na', 'n/a', 'nan', 'null', 'none', '-', '--', 'missing', '#n/a']);

/**
 * WX flags of a present-weather text such as `-RA BR`, `+TSRA`, or LCD `-RA:02 BR:1 |RA BR |`: each token
 * (split on blanks, `|`, `,`, `;`; an LCD `:n` suffix dropped) is one FM 15 w'w' group read by the METAR
 * decoder's table (`weatherFlags`, WMO-No. 306 code table 4678; FMH-1 §12.6.8), so `VC` groups keep only
 * their SH/TS flags. Tokens that are not weather groups are ignored. Intensity (WX.LIGHT, WX.MODERATE) is read
 * only before the first `|`: in LCD the later sections (from memory: the AW and MW code lists) carry no sign.
 * @example weatherFlagsFromCodes('-RA BR') // WX.RAIN | WX.PRECIP | WX.LIGHT
 */
export function weatherFlagsFromCodes(text: string): number {
  let flags = 0;
  const sections = text.toUpperCase().split('|');
  for (let k = 0; k < sections.length; k++) {
    for (const raw of sections[k]!.split(/[\s,;]+/)) {
      const tok = raw.split(':')[0]!;
      if (tok === '') continue;
      let f = weatherFlags(tok, 0, tok.length);
      // LCD: only the first section (automated codes) writes intensity; the others have no sign to read
      if (k > 0 && f > 0) f &= ~(WX.LIGHT | WX.MODERATE);
      if (f > 0) flags |= f;
    }
  }
  return flags;
}

interface Col {
  field: NumericField;
  index: number;
  unit: UnitName;
  conv: (v: number) => number;
  /** The conversion as data (see conversionOf): the hot path switches on `op`. */
  op: number;
  k: number;
  /** Which sentinel set applies: 0 negatives only, 1 full, 2 pressure, 3 pressure in Pa, 4 elevation. */
  sentinels: number;
}

function sentinelKind(field: NumericField, unit: UnitName): number {
  const q = FIELD_QUANTITY[field];
  if (q === 'pressure') return unit === 'Pa' ? 3 : 2;
  if (q === 'height') return 4;
  return 1;
}

function isSentinel(v: number, kind: number): boolean {
  if (v < 0) return v === -999 || v === -999.9 || v === -9999 || v === -9999.9 || v === -99999;
  switch (kind) {
    case 1:
      return v === 999 || v === 999.9 || v === 9999 || v === 9999.9 || v === 99999 || v === 99999.9;
    case 2:
      return v === 9999 || v === 9999.9 || v === 99999 || v === 99999.9;
    case 3:
      return v === 9999 || v === 9999.9 || v === 99999.9;
    case 4:
      return v === 99999 || v === 99999.9;
    default:
      return false;
  }
}

const POW10 = [1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15];

/** Plain decimal notation, blanks around allowed: no hex (`0x10`), exponent (`1e5`), `Infinity` or digit separators. */
const PLAIN_DECIMAL = /^\s*[-+]?(?:\d+\.?\d*|\.\d+)\s*$/;

/** Number of a plain decimal text (PLAIN_DECIMAL), NaN for anything else (blank text included). */
export function plainNumber(raw: string): number {
  return PLAIN_DECIMAL.test(raw) ? +raw : NaN;
}

/**
 * Decimal text → number without allocation for the common `[-]digits[.digits]` form, falling back to
 * `plainNumber` otherwise: only plain decimal notation is a number (`0x10`, `1e5`, `Infinity` are NaN, read
 * as bad values; a station file never writes them, so they are damage, common practice, no source). With at most 15 significant digits the mantissa
 * and the power of ten are exact doubles, so mantissa / 10^k is correctly rounded: the same value `Number()` gives.
 */
export function decimalValue(raw: string): number {
  const n = raw.length;
  let i = 0;
  let neg = false;
  let c = raw.charCodeAt(0);
  if (c === 45) {
    neg = true;
    i = 1;
  }
  let mant = 0;
  let digits = 0;
  let frac = -1;
  for (; i < n; i++) {
    c = raw.charCodeAt(i);
    if (c >= 48 && c <= 57) {
      mant = mant * 10 + (c - 48);
      digits++;
      if (frac >= 0) frac++;
    } else if (c === 46 && frac < 0) frac = 0;
    else return plainNumber(raw);
  }
  if (digits === 0 || digits > 15) return plainNumber(raw);
  const v = frac > 0 ? mant / POW10[frac]! : mant;
  return neg ? -v : v;
}

/** decimalValue of the bytes u[a, b) (b > a) when they are the plain `[-]digits[.digits]` form (≤ 15 digits), else NaN. */
function decimalBytes(u: Uint8Array, a: number, b: number): number {
  let i = a;
  let neg = false;
  if (u[a] === 45) {
    neg = true;
    i = a + 1;
  }
  let mant = 0;
  let digits = 0;
  let frac = -1;
  for (; i < b; i++) {
    const c = u[i]! - 48;
    if (c >= 0 && c <= 9) {
      mant = mant * 10 + c;
      digits++;
      if (frac >= 0) frac++;
    } else if (c === -2 && frac < 0) frac = 0;
    else return NaN;
  }
  if (digits === 0 || digits > 15) return NaN;
  const v = frac > 0 ? mant / POW10[frac]! : mant;
  return neg ? -v : v;
}

interface Counter {
  count: number;
  line: number;
  example: string;
}

const NO_COL = -1;

/** The shared row handler behind readCsvText and readCsvStream. */
export class CsvCore {
  readonly report: FileReport;
  readonly stationsSeen = new Map<string, StationPosition>();
  readonly valueCounts: Record<string, number> = {};
  readonly units: Partial<Record<NumericField, UnitChoice>> = {};
  private readonly counters = new Map<string, Counter>();
  private readonly opts: CsvOptions;
  private readonly emit: (o: Observation) => void;
  private header: string[] | null = null;
  private headerLen = 0;
  private line = 0;
  private fatal: { reason: string; message: string } | null = null;
  private mapping: ColumnMapping = {};
  private pending: { fields: string[]; line: number }[] | null = null;
  private cols: Partial<Record<NumericField, Col>> = {};
  private timeParser: TimeReader | null = null;
  private offsetParsers = new Map<number, TimeReader>();
  private lastStation = '';
  private lastStationTime = NaN;
  /** The row being processed: its cells (papaparse), or (line mode, `rowFields` null) the bytes and cell bounds. */
  private rowFields: string[] | null = null;
  private rowBytes: Buffer = Buffer.alloc(0);
  private cellStart = new Int32Array(64);
  private cellEnd = new Int32Array(64);
  private cellCount = 0;
  /** Line mode: where the last station cell stood, and its id (consecutive rows usually share it). */
  private stationAt = 0;
  private stationLen = -1;
  private stationTrimmed = '';
  private timeCol = NO_COL;
  /** The time's columns when it is spread over several (date + time of day, year/month/day/hour...). */
  private timeColumns: TimeColumns | null = null;
  private stationCol = NO_COL;
  private wxCol = NO_COL;
  /** Sky cover and sky level (ft) columns, pairwise (IEM `skyc1..4`, `skyl1..4`); empty when none. */
  private skyCols: { cover: number; level: number }[] = [];
  /** A sky-conditions text column (NCEI LCD `HourlySkyConditions`), read when no cover/level pairs are given. */
  private skyTextCol = NO_COL;
  private rawCol = NO_COL;
  private offsetCol = NO_COL;
  private typeCol = NO_COL;
  private defaultStation = '';
  private userMissingText = new Set<string>();
  private userMissingNum: number[] = [];
  private wxCache = new Map<string, number>();
  /** ECCC layout: `Weather` holds words (eccc.ts), and cells with words not known, with those words. */
  private ecccWords = false;
  private wxUnknown = new Map<string, string>();
  /** Naive times without --tz/--utc-offset: the zone of the row's station in the stations file, per station. */
  private zoneByStation = false;
  private stationReaders = new Map<string, TimeReader | null>();
  private fileStandardTime = false;
  /** ECCC LST times without --tz/--utc-offset: each row's offset from its Climate ID (eccc.ts), per id. */
  private ecccZone = false;
  private ecccReaders = new Map<string, TimeReader | null>();
  /** Local standard time with no zone from the rules before: the zone at the station's coordinates (zones.ts), per station. */
  private coordZone = false;
  private coordReaders = new Map<string, TimeReader | null>();
  private coordMissing = new Set<string>();
  /** Reads a naive time as if UTC: the year of a row, before its zone is known. */
  private yearProbe: TimeReader | null = null;
  private lastTime = new Map<string, number>();
  private decimalComma = false;
  private aborted = false;
  /** Accepted observation times (plausible.ts). */
  private readonly window: Readonly<TimeWindow>;
  /** The one Observation handed to `emit` when `opts.reuseObservation` is set. */
  private readonly scratch: Observation | null;

  constructor(file: string, opts: CsvOptions, emit: (o: Observation) => void) {
    this.report = newFileReport(file, 'csv');
    this.opts = opts;
    this.window = opts.timeWindow ?? DEFAULT_TIME_WINDOW;
    this.emit = emit;
    if (opts.reuseObservation) {
      this.scratch = emptyObservation('', NaN, file, 0);
      this.scratch.remarks = undefined;
    } else this.scratch = null;
    for (const m of opts.missing ?? []) {
      const t = m.trim();
      this.userMissingText.add(t.toLowerCase());
      const v = Number(t);
      if (t !== '' && Number.isFinite(v)) this.userMissingNum.push(v);
    }
  }

  /** Handle one parsed row. Returns false when the rest of the input should not be read. */
  row(fields: string[], errors?: readonly { code?: string; message?: string }[]): boolean {
    return this.handle(fields, errors && errors.length ? errors[0] : undefined);
  }

  /**
   * Handle a block of parsed rows (papaparse chunk mode). `errors` are papaparse's for the block: `row` is
   * the index in `rows` (errors for a row not in the block, i.e. the unfinished last line papaparse carries
   * to the next block, are dropped: it reports them again then); an error without `row` (papaparse's
   * delimiter-guess error) belongs to the block's first row, after that row's own errors, which is where
   * step mode puts it. Each row is handled as `row()` would with its first error. Returns false when the
   * rest of the input should not be read.
   */
  rows(rows: readonly string[][], errors: readonly { code?: string; message?: string; row?: number }[]): boolean {
    const n = rows.length;
    let first: ({ code?: string; message?: string } | undefined)[] | null = null;
    if (errors.length !== 0) {
      first = new Array(n).fill(undefined);
      for (const e of errors) {
        const r = e.row ?? 0;
        if (r >= 0 && r < n && first[r] === undefined) first[r] = e;
      }
    }
    if (first === null) {
      for (let i = 0; i < n; i++) if (!this.handle(rows[i]!, undefined)) return false;
    } else for (let i = 0; i < n; i++) if (!this.handle(rows[i]!, first[i])) return false;
    return true;
  }

  /** Lines rejected by checkQuotes (physical line → message). */
  private quoteBad: Map<number, { reason: string; message: string }> | null = null;
  /** Physical line of the next row: rows whose quoted fields hold line breaks span several lines. */
  private nextLine = 1;
  /** The text holds a NUL byte: rows holding one are rejected (`control-bytes`). */
  private checkNul = true;

  /** Take what checkQuotes found (before the first row) and whether the text holds NUL bytes (default: check). */
  useTextChecks(q: QuoteCheck | null, hasNul: boolean): void {
    if (q) this.quoteBad = q.bad.size ? q.bad : null;
    this.checkNul = hasNul;
  }

  /**
   * A piece of a longer text ended with its line end, which the parsers read as one more (empty) row before
   * the end: take it back, since that line is the first of the next piece.
   */
  takeBackEmptyTail(): void {
    this.line--;
    this.nextLine--;
  }

  /** The next row starts on physical line `line` (a piece of a longer text was parsed up to that line). */
  continueAt(line: number): void {
    this.nextLine = line;
  }

  private handle(fields: string[], err: { code?: string; message?: string } | undefined): boolean {
    this.line++;
    const line = this.nextLine;
    let breaks = 0;
    let continued = 0;
    const quoteError = err !== undefined && (err.code === 'MissingQuotes' || err.code === 'InvalidQuotes');
    for (let i = 0; i < fields.length; i++) {
      const f = fields[i]!;
      for (let k = f.indexOf('\n'); k >= 0; ) {
        breaks++;
        const next = f.indexOf('\n', k + 1);
        // a continuation line counts when it holds text: in this field, or on the field's last line its closing
        // quote (not to be trusted when papaparse found the quotes broken: the field may run to the end of the input)
        const seg = f.slice(k + 1, next < 0 ? f.length : next);
        if (seg.trim() !== '' || (next < 0 && (i < fields.length - 1 || !quoteError))) continued++;
        k = next;
      }
    }
    this.nextLine = line + 1 + breaks;
    if (continued > 0) this.report.continuationLines = (this.report.continuationLines ?? 0) + continued;
    if (this.quoteBad !== null) {
      const why = this.quoteBad.get(line);
      if (why !== undefined) {
        this.report.lines++;
        this.reject(line, why.reason, why.message);
        return true;
      }
    }
    if (fields.length === 1 && fields[0]!.trim() === '') return true;
    this.report.lines++;
    if (this.checkNul && fields.some((f) => f.includes('\u0000'))) {
      this.reject(line, 'control-bytes', 'the line holds NUL bytes (damaged); line skipped, the rest of the file is read');
      return true;
    }
    if (this.header === null) return this.setHeader(fields);
    if (this.fatal) {
      this.reject(line, this.fatal.reason, this.fatal.message);
      return true;
    }
    if (err !== undefined && (err.code === 'MissingQuotes' || err.code === 'InvalidQuotes')) {
      this.reject(line, 'bad-quotes', `unbalanced quotes (${err.message ?? err.code}); fix the quoting in the file`);
      return true;
    }
    if (this.pending) {
      this.pending.push({ fields, line });
      if (this.pending.length >= (this.opts.inferRows ?? 1000)) this.decideUnits();
      return true;
    }
    this.rowFields = fields;
    this.process(line);
    return true;
  }

  /**
   * Handle the lines of UTF-8 bytes that hold no quote character, from `from` on, as papaparse would hand
   * them over split on `newline` and then on `delimiter` (one ASCII character). Cells are read in place (no
   * string per cell) once the header and the unit decision are behind; rows before that are split into cells.
   */
  scanBytes(u: Buffer, from: number, newline: string, delimiter: string): void {
    const len = u.length;
    const nl = Buffer.from(newline, 'utf8');
    const nlLen = nl.length;
    const nl0 = nl[0]!;
    const d = delimiter.charCodeAt(0);
    this.rowBytes = u;
    this.stationLen = -1;
    let p = from;
    for (;;) {
      let e = nlLen === 1 ? u.indexOf(nl0, p) : u.indexOf(nl, p);
      if (e < 0) e = len;
      if (this.header === null || this.fatal !== null || this.pending !== null) {
        if (!this.handle(u.toString('utf8', p, e).split(delimiter), undefined)) return;
      } else {
        // cell bounds
        let k = 0;
        let a = p;
        let cs = this.cellStart;
        let ce = this.cellEnd;
        for (let i = p; i < e; i++) {
          if (u[i] !== d) continue;
          if (k === cs.length - 1) {
            this.growCells();
            cs = this.cellStart;
            ce = this.cellEnd;
          }
          cs[k] = a;
          ce[k] = i;
          k++;
          a = i + 1;
        }
        cs[k] = a;
        ce[k] = e;
        this.cellCount = k + 1;
        this.line++;
        const line = this.nextLine++;
        // as handle(): a line of one blank cell is skipped
        if (k !== 0 || u.toString('utf8', p, e).trim() !== '') {
          this.report.lines++;
          this.rowFields = null;
          this.process(line);
        }
      }
      if (e === len) return;
      p = e + nlLen;
    }
  }

  private growCells(): void {
    const n = this.cellStart.length * 2;
    const cs = new Int32Array(n);
    const ce = new Int32Array(n);
    cs.set(this.cellStart);
    ce.set(this.cellEnd);
    this.cellStart = cs;
    this.cellEnd = ce;
  }

  /** Number of cells of the current row. */
  private cells(): number {
    const f = this.rowFields;
    return f !== null ? f.length : this.cellCount;
  }

  /** Text of cell i of the current row (i < cells()). */
  private cell(i: number): string {
    const f = this.rowFields;
    return f !== null ? f[i]! : this.rowBytes.toString('utf8', this.cellStart[i]!, this.cellEnd[i]!);
  }

  /** True once a row asked to stop reading (binary content). */
  get stopped(): boolean {
    return this.aborted;
  }

  /** Finish: decide units if still pending, write notes. */
  finish(): CsvResult {
    if (this.header === null && !this.aborted) {
      addIssue(this.report, { file: this.report.file, line: 1, reason: 'empty', message: 'the file has no header and no data; check the file' });
    }
    if (this.pending) this.decideUnits();
    const cont = this.report.continuationLines;
    if (cont) this.report.notes.push(`${cont} line(s) continue a quoted field of the row above (multi-line rows; line numbers are physical lines)`);
    for (const [key, c] of this.counters) {
      const [reason, field] = key.split(':');
      this.valueCounts[key] = c.count;
      this.report.notes.push(`${reason} in ${field}: ${c.count} value${c.count === 1 ? '' : 's'} (first at line ${c.line}: "${c.example}")${VALUE_NOTE[reason!] ?? ''}`);
    }
    return { report: this.report, stationsSeen: this.stationsSeen, valueCounts: this.valueCounts, units: this.units };
  }

  /** Record an assumption for the one-line summary (once per phrase). */
  private assume(what: string): void {
    const a = (this.report.assumed ??= []);
    if (!a.includes(what)) a.push(what);
  }

  private reject(line: number, reason: string, message: string, group?: string, column?: number): void {
    const issue = { file: this.report.file, line, reason, message } as Parameters<typeof addIssue>[1];
    if (group !== undefined) issue.group = group;
    if (column !== undefined) issue.column = column;
    addIssue(this.report, issue);
  }

  private count(reason: string, field: string, line: number, example: string): void {
    const key = `${reason}:${field}`;
    const c = this.counters.get(key);
    if (c) c.count++;
    else this.counters.set(key, { count: 1, line, example: example.length > 40 ? example.slice(0, 40) + '…' : example });
  }

  private setHeader(fields: string[]): boolean {
    const report = this.report;
    const file = report.file;
    if (fields[0]!.charCodeAt(0) === 0xfeff) fields[0] = fields[0]!.slice(1);
    this.header = fields;
    this.headerLen = fields.length;
    const { mapping, unmatched, notes, timeColumns } = mapColumns(fields, this.opts.overrides ?? []);
    this.mapping = mapping;
    this.timeColumns = timeColumns ?? null;
    report.notes.push(...notes);
    report.columns = {};
    for (const [field, col] of Object.entries(mapping)) if (col) report.columns[col.header.trim()] = field;
    if (timeColumns) for (const i of timeColumnIndices(timeColumns)) report.columns[fields[i]!.trim()] = 'time';
    if (unmatched.length) report.notes.push(`columns not used: ${unmatched.join(', ')}`);

    if (fields.length === 1) {
      const h = fields[0]!;
      const d = h.includes(';') ? 'semicolons' : h.includes('\t') ? 'tabs' : h.includes(',') ? 'commas' : h.includes('|') ? 'pipes' : '';
      if (d) {
        this.fatal = { reason: 'wrong-delimiter', message: `the header is one column but holds ${d}; the file is delimited by ${d} (set the delimiter)` };
        return true;
      }
    }
    if (!mapping.time) {
      this.fatal = looksLikeStationsFile(fields)
        ? { reason: 'no-time-column', message: 'this looks like a stations file (id, lat, lon); pass it as the stations list, not as data' }
        : { reason: 'no-time-column', message: `no time column among: ${fields.map((f) => f.trim()).join(', ')}; map one with --column NAME=time` };
      return true;
    }
    const measured = ['temperature', 'dewpoint', 'relativeHumidity', 'windDir', 'windSpeed', 'gust', 'stationPressure', 'seaLevelPressure', 'altimeter', 'precip'] as const;
    const hasRaw = mapping.rawReport && this.opts.decodeRawReport;
    if (!measured.some((f) => mapping[f]) && !hasRaw) {
      this.fatal = { reason: 'no-data-columns', message: 'no weather columns recognised (temperature, wind, pressure...); map them with --column NAME=field[:unit]' };
      return true;
    }

    this.timeCol = mapping.time.index;
    this.stationCol = mapping.station?.index ?? NO_COL;
    this.wxCol = mapping.weatherCodes?.index ?? NO_COL;
    for (const [c, l] of [['skyCover1', 'skyLevel1'], ['skyCover2', 'skyLevel2'], ['skyCover3', 'skyLevel3'], ['skyCover4', 'skyLevel4']] as const) {
      const cover = mapping[c];
      const level = mapping[l];
      if (cover && level) this.skyCols.push({ cover: cover.index, level: level.index });
    }
    if (this.skyCols.length === 0 && mapping.skyConditions) this.skyTextCol = mapping.skyConditions.index;
    this.rawCol = hasRaw ? mapping.rawReport!.index : NO_COL;
    this.offsetCol = mapping.utcOffset?.index ?? NO_COL;
    this.typeCol = mapping.reportType?.index ?? NO_COL;
    if (this.stationCol === NO_COL) {
      const base = file.replace(/^.*[\\/]/, '').replace(/\.[^.]*$/, '');
      const fromName = this.opts.stationFromFileName?.(file);
      this.defaultStation = this.opts.defaultStation ?? fromName?.id ?? base;
      const rule = this.opts.defaultStation ? 'the option' : (fromName?.rule ?? 'the file name');
      if (this.rawCol !== NO_COL) {
        report.stationIdRule = `the METAR text of "${mapping.rawReport!.header.trim()}" (else ${rule})`;
        report.notes.push(`no station column; station id from the METAR text of each row, else "${this.defaultStation}" from ${rule}`);
      } else {
        report.stationIdRule = rule;
        if (!this.opts.defaultStation) this.assume('station id from the file name');
        report.notes.push(`no station column; station id "${this.defaultStation}" taken from ${rule}`);
      }
    } else report.stationIdRule = `station column "${mapping.station!.header.trim()}"`;
    const th = (timeColumns ? timeColumnIndices(timeColumns).map((i) => fields[i]!).join(' ') : mapping.time.header).trim().toLowerCase();
    const epoch = /epoch|unix/.test(th);
    // Times that are UTC by convention (IEM `valid`, a time column or file name saying UTC) are never
    // reinterpreted by --tz or --utc-offset: those apply to naive local times only. Mapping the time column
    // yourself (--column valid=time) lifts the convention, for a file exported in local time.
    let zone = this.opts.zone;
    let offsetMinutes = this.opts.offsetMinutes;
    const stem = file.replace(/^.*[\\/]/, '');
    const timeMappedByUser = (this.opts.overrides ?? []).some((o) => o.field === 'time' || (TIME_PARTS as readonly string[]).includes(o.field));
    const utcBecause =
      timeMappedByUser || this.offsetCol !== NO_COL
        ? null
        : th === 'valid'
          ? 'the Iowa Environmental Mesonet download default for `valid`'
          : /(^|[^a-z])(utc|gmt|z)([^a-z]|$)/.test(th)
            ? `the time column "${th}" says so`
            : /(^|[^a-z0-9])utc([^a-z0-9]|$)/i.test(stem)
              ? `the file name "${stem}" says so`
              : null;
    if (utcBecause !== null) {
      const given = offsetMinutes !== undefined ? '--utc-offset' : zone !== undefined && zone.toUpperCase() !== 'UTC' ? '--tz' : null;
      zone = 'UTC';
      offsetMinutes = undefined;
      this.assume('times UTC by convention');
      report.notes.push(
        `times without offset read as UTC (${utcBecause})` +
          (given ? `; ${given} not applied to them (it is for naive local times; map the column with --column to read it as local)` : '; map the time column with --column and give --tz if the file was exported in local time'),
      );
    }
    let standardTime = this.opts.standardTime;
    if (utcBecause === null && offsetMinutes !== undefined) this.assume(`naive times at ${utcOffsetLabel(offsetMinutes)} (given)`);
    else if (utcBecause === null && zone !== undefined) this.assume(`naive times in ${zone} (given)`);
    if (standardTime === undefined && /(^|[^a-z])lst([^a-z]|$)/.test(th)) {
      standardTime = true;
      this.assume('local standard time all year');
      report.notes.push('times read as local standard time all year (the time column says LST, as in Environment and Climate Change Canada files)');
    }
    if (standardTime === undefined && isLcdHeaders(fields)) {
      standardTime = true;
      this.assume('local standard time all year');
      report.notes.push('times read as local standard time all year (NCEI LCD convention)');
    }
    this.fileStandardTime = !!standardTime;
    const noZoneGiven = utcBecause === null && zone === undefined && offsetMinutes === undefined && !epoch;
    if (noZoneGiven && this.opts.stationZone !== undefined) this.zoneByStation = true;
    // local standard time and nothing else names the zone: the zone at the station's coordinates (never for
    // times UTC by convention, nor for naive times that may keep daylight saving)
    const latLon = mapping.lat && mapping.lon ? `the file's ${mapping.lat.header.trim()} and ${mapping.lon.header.trim()} columns` : null;
    if (noZoneGiven && this.fileStandardTime && this.offsetCol === NO_COL && (latLon !== null || this.opts.stationPosition !== undefined)) this.coordZone = true;
    const byCoordinates = this.coordZone ? ` take the standard time of the zone at the station's coordinates (${latLon ?? 'the stations file'}), else they` : '';
    if (isEcccHeaders(fields)) {
      this.ecccWords = this.wxCol !== NO_COL;
      if (utcBecause === null && zone === undefined && offsetMinutes === undefined && this.stationCol !== NO_COL && /(^|[^a-z])lst([^a-z]|$)/.test(th)) {
        this.ecccZone = true;
        report.notes.push(
          `no --tz or --utc-offset: the standard time of each row is taken from the province its Climate ID names, where the province keeps one (AB, MB, NB, NS, PE, NT); rows of other provinces${byCoordinates} need --utc-offset (e.g. -300 for Eastern Standard Time) or --tz`,
        );
      }
    }
    this.timeParser = makeTimeReader({
      ...(zone !== undefined ? { zone } : {}),
      ...(offsetMinutes !== undefined ? { offsetMinutes } : {}),
      standardTime: !!standardTime,
      epoch,
    });
    if (epoch) report.notes.push(`time column "${mapping.time.header.trim()}" read as epoch seconds (ms when above 1e11)`);

    // Units known now; the rest wait for values.
    let needInference = false;
    for (const f of NUMERIC_FIELDS) {
      const c = mapping[f];
      if (!c) continue;
      if (c.unit) this.units[f] = { unit: c.unit, source: c.unitSource ?? 'header', why: `${c.unitSource ?? 'header'} "${c.header.trim()}"` };
      else needInference = true;
    }
    if (needInference) this.pending = [];
    else this.buildCols();
    return true;
  }

  /** Decide units still unknown from buffered values, then process the buffer. */
  private decideUnits(): void {
    const pending = this.pending ?? [];
    this.pending = null;
    const pairs: [NumericField, NumericField][] = [
      ['dewpoint', 'temperature'],
      ['temperature', 'dewpoint'],
      ['gust', 'windSpeed'],
      ['windSpeed', 'gust'],
    ];
    const notes: string[] = [];
    for (const f of NUMERIC_FIELDS) {
      const c = this.mapping[f];
      if (!c || this.units[f]) continue;
      const partner = pairs.find((p) => p[0] === f)?.[1];
      const pc = partner ? this.units[partner] : undefined;
      if (pc) {
        this.units[f] = { unit: pc.unit, source: 'inferred', why: `same unit as the ${partner} column` };
        notes.push(`${f} (${c.header.trim()}): ${pc.unit}, same as ${partner}`);
        continue;
      }
      if (f === 'lat' || f === 'lon') {
        this.units[f] = { unit: 'deg', source: 'default', why: 'degrees' };
        continue;
      }
      const values = new Float64Array(pending.length);
      for (let i = 0; i < pending.length; i++) {
        const raw = pending[i]!.fields[c.index];
        values[i] = raw === undefined ? NaN : plainNumber(raw);
      }
      const inf = inferUnit(f, values);
      this.units[f] = { unit: inf.unit, source: inf.ambiguous ? 'default' : 'inferred', why: inf.why };
      notes.push(`${f} (${c.header.trim()}): ${inf.unit}, ${inf.ambiguous ? 'assumed' : 'inferred'} — ${inf.why}`);
    }
    if (notes.length) this.report.notes.push(`units not named by the file: ${notes.join('; ')}`);
    this.buildCols();
    for (const p of pending) {
      this.rowFields = p.fields;
      this.process(p.line);
    }
  }

  private buildCols(): void {
    const parts: string[] = [];
    for (const f of NUMERIC_FIELDS) {
      const c = this.mapping[f];
      const u = this.units[f];
      if (!c || !u) continue;
      if (unitQuantity(u.unit) !== FIELD_QUANTITY[f]) throw new RangeError(`unit ${u.unit} does not fit field ${f}`);
      const cv = conversionOf(u.unit);
      this.cols[f] = { field: f, index: c.index, unit: u.unit, conv: converter(u.unit), op: cv.op, k: cv.k, sentinels: sentinelKind(f, u.unit) };
      this.report.units[f] = u.unit;
      parts.push(`${f}=${u.unit} (${u.source})`);
      if (u.source === 'convention') this.assume('units by convention');
      else if (u.source === 'inferred' || u.source === 'default') this.assume('units from values');
    }
    if (parts.length) this.report.notes.push(`units: ${parts.join(', ')}`);
  }

  /** One numeric cell of the current row → canonical value or NaN (counted). */
  private val(c: Col | undefined, line: number): number {
    if (c === undefined) return NaN;
    const i = c.index;
    const f = this.rowFields;
    let v: number;
    let c0: number;
    if (f !== null) {
      const raw = f[i];
      if (raw === undefined || raw.length === 0) return NaN;
      c0 = raw.charCodeAt(0);
      // `M` is a missing marker whatever the options (see slowValue), and the commonest non-number
      if (raw.length === 1 && c0 === 77) return NaN;
      v = decimalValue(raw);
    } else {
      if (i >= this.cellCount) return NaN;
      const u = this.rowBytes;
      const a = this.cellStart[i]!;
      const b = this.cellEnd[i]!;
      if (b === a) return NaN;
      c0 = u[a]!;
      if (b - a === 1 && c0 === 77) return NaN;
      v = decimalBytes(u, a, b);
      if (v !== v) v = decimalValue(this.cell(i)); // not the plain form: read as the text reads
    }
    if (v !== v) {
      v = this.slowValue(this.cell(i), c, line);
      if (v !== v) return NaN;
    } else if (v === 0) {
      // `+raw` reads a blank cell as 0; a cell starting with - . / or a digit is not blank
      if (!(c0 >= 45 && c0 <= 57) && this.cell(i).trim() === '') return NaN;
    }
    if ((v >= 999 || v <= -999) && (isSentinel(v, c.sentinels) || !Number.isFinite(v))) {
      this.count(Number.isFinite(v) ? 'sentinel' : 'bad-value', c.field, line, this.cell(i));
      return NaN;
    }
    if (this.userMissingNum.length !== 0 && this.userMissingNum.includes(v)) return NaN;
    // = c.conv(v), without a call through a closure
    switch (c.op) {
      case 0:
        return v;
      case 1:
        return (v - 32) / 1.8;
      case 2:
        return v - c.k;
      case 3:
        return v * c.k;
      default:
        return v / c.k;
    }
  }

  /** Cells `+raw` could not read: missing markers, LCD flags, decimal commas, garbage. */
  private slowValue(raw: string, c: Col, line: number): number {
    const t = raw.trim();
    const lower = t.toLowerCase();
    if (MISSING.has(lower) || this.userMissingText.has(lower)) return NaN;
    if (t === '') return NaN;
    if (lower === 'vrb' || lower === 'v') {
      if (c.field === 'windDir') this.count('variable', c.field, line, raw);
      else this.count('bad-value', c.field, line, raw);
      return NaN;
    }
    if (t === 'T' && c.field === 'precip') {
      this.count('trace', c.field, line, raw);
      return 0;
    }
    const m = /^([-+]?(?:\d+\.?\d*|\.\d+))([sTAE*]+)$/.exec(t);
    if (m) {
      const flag = m[2]!.includes('s') ? 'suspect' : m[2]!.includes('T') ? 'trace' : m[2]!.includes('E') ? 'estimated' : 'flagged';
      this.count(flag, c.field, line, raw);
      return Number(m[1]);
    }
    if (/^[-+]?\d+,\d+$/.test(t) && this.opts.delimiter !== ',') {
      if (!this.decimalComma) {
        this.decimalComma = true;
        this.report.notes.push(`decimal commas read as decimal points (first at line ${line}: "${t}")`);
      }
      return Number(t.replace(',', '.'));
    }
    if (this.userMissingNum.length && this.userMissingNum.includes(Number(t))) return NaN;
    this.count('bad-value', c.field, line, raw);
    return NaN;
  }

  private timeOf(line: number): number {
    if (this.timeColumns !== null) return this.assembledTimeOf(line, this.timeColumns);
    if (this.rowFields === null && this.offsetCol === NO_COL && !this.ecccZone && !this.zoneByStation && !this.coordZone) {
      // line mode: the common ISO form straight from the bytes
      const ms = this.timeParser!.readQuickBytes(this.rowBytes, this.cellStart[this.timeCol]!, this.cellEnd[this.timeCol]!);
      if (ms === ms) return ms;
      if (this.timeParser!.error !== null) return this.badTime(line, this.timeParser!, this.cell(this.timeCol));
    }
    const raw = this.cell(this.timeCol);
    if (raw.length < 8) {
      const t = raw.trim();
      if (t === '' || MISSING.has(t.toLowerCase())) {
        this.reject(line, 'no-time', 'the time cell is empty or missing; the line is skipped', raw, this.timeCol + 1);
        return NaN;
      }
    }
    return this.readTime(line, raw);
  }

  /** The time of a row whose time is spread over several columns: the cells joined, then read as one. */
  private assembledTimeOf(line: number, t: TimeColumns): number {
    const n = this.cells();
    const idx = timeColumnIndices(t);
    if (idx.every((i) => i >= n || MISSING.has(this.cell(i).trim().toLowerCase()))) {
      this.reject(line, 'no-time', 'the time cells are empty or missing; the line is skipped', '', idx[0]! + 1);
      return NaN;
    }
    const a = assembleTimeText(t, (i) => (i < n ? this.cell(i) : ''));
    if ('error' in a) {
      this.reject(line, 'bad-time', `${a.error}; the line is skipped`, idx.map((i) => (i < n ? this.cell(i).trim() : '')).join(' '), idx[0]! + 1);
      return NaN;
    }
    return this.readTime(line, a.text);
  }

  /** A time text read with the file's reader, or the reader for the row's UTC-offset cell. */
  private readTime(line: number, raw: string): number {
    let parser = this.timeParser!;
    // a zone the stations file gives for the row's station, else (ECCC) the Climate ID's province, else (local
    // standard time) the zone at the station's coordinates
    let r: TimeReader | null = null;
    if (this.zoneByStation) r = this.stationZoneReader();
    if (r === null && this.ecccZone) r = this.ecccReader();
    if (r === null && this.coordZone) r = this.coordinateReader(raw);
    if (r !== null) parser = r;
    if (this.offsetCol !== NO_COL) {
      const off = parseOffsetMinutes(this.offsetCol < this.cells() ? this.cell(this.offsetCol) : '');
      if (Number.isFinite(off) && Math.abs(off) <= 18 * 60) {
        let p = this.offsetParsers.get(off);
        if (!p) this.offsetParsers.set(off, (p = makeTimeReader({ offsetMinutes: off })));
        parser = p;
      }
    }
    const ms = parser.read(raw);
    if (ms === ms) return ms;
    return this.badTime(line, parser, raw);
  }

  /** The time reader in the stations file's zone of the current row's station, or null (none listed). */
  private stationZoneReader(): TimeReader | null {
    const id = this.rowStation();
    let r = this.stationReaders.get(id);
    if (r === undefined) {
      const zone = id === '' ? undefined : this.opts.stationZone!(id);
      r = zone === undefined ? null : makeTimeReader({ zone, standardTime: this.fileStandardTime });
      if (this.stationReaders.size < 10000) this.stationReaders.set(id, r);
      if (zone !== undefined) {
        this.assume('zone from the stations file');
        this.report.notes.push(`station ${id}: naive times read in ${zone}${this.fileStandardTime ? ' standard time' : ''} (the stations file's tz)`);
      }
    }
    return r;
  }

  /** The time reader for the current row's Climate ID (its province's standard offset), or null (needs a zone). */
  private ecccReader(): TimeReader | null {
    const id = this.stationCol < this.cells() ? this.cell(this.stationCol).trim() : '';
    let r = this.ecccReaders.get(id);
    if (r === undefined) {
      const p = ecccProvince(id);
      const off = p?.standardOffsetMinutes ?? null;
      r = off === null ? null : makeTimeReader({ offsetMinutes: off });
      if (this.ecccReaders.size < 10000) this.ecccReaders.set(id, r);
      if (off !== null) {
        this.assume('standard time from the ECCC Climate ID province');
        this.report.notes.push(`Climate ID ${id}: ${p!.name}, LST read as ${utcOffsetLabel(off)}`);
      } else if (id !== '' && !this.coordZone) {
        this.report.notes.push(
          `Climate ID ${id}: ${p ? `${p.name} keeps more than one standard time` : 'names no known province'}; its rows need ${ZONE_REMEDY}`,
        );
      }
    }
    return r;
  }

  /** The current row's station id (the station column, else the file's default). */
  private rowStation(): string {
    return this.stationCol === NO_COL ? this.defaultStation : this.stationCol < this.cells() ? this.cell(this.stationCol).trim() : '';
  }

  /**
   * The time reader in the standard time of the zone at the current row's station (zones.ts), or null: no
   * coordinates (the row's lat/lon cells, else the stations file's), none that give a civil zone, or (ECCC) a zone
   * whose standard time is none of the province's. Decided once per station, on its first row with coordinates.
   */
  private coordinateReader(raw: string): TimeReader | null {
    const id = this.rowStation();
    const known = this.coordReaders.get(id);
    if (known !== undefined) return known;
    const latCol = this.mapping.lat?.index ?? NO_COL;
    const lonCol = this.mapping.lon?.index ?? NO_COL;
    let latDeg = NaN;
    let lonDeg = NaN;
    let from = '';
    if (latCol !== NO_COL && lonCol !== NO_COL && latCol < this.cells() && lonCol < this.cells()) {
      latDeg = plainNumber(this.cell(latCol).trim());
      lonDeg = plainNumber(this.cell(lonCol).trim());
      from = "the station's coordinates";
    }
    if (!(latDeg === latDeg && lonDeg === lonDeg)) {
      const p = id === '' ? undefined : this.opts.stationPosition?.(id);
      if (p && p.latDeg === p.latDeg && p.lonDeg === p.lonDeg) {
        latDeg = p.latDeg;
        lonDeg = p.lonDeg;
        from = "the station's coordinates in the stations file";
      } else {
        // the row has no coordinates: a later row of the station may (none will when the file has no such columns)
        const why = `station ${id}: no coordinates for the zone (${latCol === NO_COL || lonCol === NO_COL ? 'none in the file' : 'empty or unreadable cells'}, none in a stations file); its rows without them need ${ZONE_REMEDY}`;
        if (latCol === NO_COL || lonCol === NO_COL) this.keepCoordReader(id, null, why);
        else if (!this.coordMissing.has(id) && this.coordMissing.size < 100) {
          this.coordMissing.add(id);
          this.report.notes.push(why);
        }
        return null;
      }
    }
    this.yearProbe ??= makeTimeReader({ offsetMinutes: 0 });
    const probe = this.yearProbe.read(raw);
    if (probe !== probe) return null; // not a time: rejected by the file's reader, with its reason
    const year = new Date(probe).getUTCFullYear();
    const at = `${latDeg}, ${lonDeg}`;
    const z = zoneAtCoordinates(latDeg, lonDeg, year);
    if ('error' in z) {
      this.keepCoordReader(id, null, `station ${id}: no zone from its coordinates (${at}): ${z.error}; its rows need ${ZONE_REMEDY}`);
      return null;
    }
    const zoneText = `zone ${utcOffsetLabel(z.standardOffsetMinutes)} (standard time of ${z.zone}, from ${from})`;
    const province = this.ecccZone ? ecccProvince(id) : null;
    if (province && !province.standardOffsetsMinutes.includes(z.standardOffsetMinutes)) {
      this.keepCoordReader(
        id,
        null,
        `station ${id}: ${zoneText} refused: ${province.name} keeps ${province.standardOffsetsMinutes.map(utcOffsetLabel).join(' and ')} (check the sign of the longitude, ${at}); its rows need ${ZONE_REMEDY}`,
      );
      return null;
    }
    const near = z.near ? `; within about ${NEAR_KM} km of ${z.near.zone} (${utcOffsetLabel(z.near.standardOffsetMinutes)}): check it, a tz in the stations file wins` : '';
    this.assume(`zone from the station's coordinates (${utcOffsetLabel(z.standardOffsetMinutes)}, ${z.zone}${z.near ? ', near a zone boundary' : ''})`);
    return this.keepCoordReader(id, makeTimeReader({ zone: z.zone, standardTime: true }), `station ${id}: ${zoneText}, ${at}${near}`);
  }

  private keepCoordReader(id: string, r: TimeReader | null, note: string): TimeReader | null {
    if (this.coordReaders.size < 10000) this.coordReaders.set(id, r);
    if (this.coordReaders.size <= 100) this.report.notes.push(note);
    return r;
  }

  /** Reject the row for the time the parser could not read (its `error`); NaN. */
  private badTime(line: number, parser: TimeReader, raw: string): number {
    const e = parser.error!;
    const reason = e.error === 'unparsable' ? 'bad-time' : e.error === 'needs-zone' ? 'needs-zone' : `${e.error}-time`;
    this.reject(line, reason, e.message, raw, this.timeCol + 1);
    return NaN;
  }

  /** Process the current row (`rowFields`, or the line-mode cell bounds). */
  private process(line: number): void {
    const nCells = this.cells();
    if (nCells < this.headerLen) {
      this.reject(line, 'truncated', `line has ${nCells} of ${this.headerLen} fields; the file may be cut short or the row damaged`);
      return;
    }
    let source: Observation['source'] = 'CSV';
    if (this.typeCol !== NO_COL) {
      const rt = this.cell(this.typeCol).trim().toUpperCase();
      if (rt === 'FM-15') source = 'METAR';
      else if (rt === 'FM-16') source = 'SPECI';
      else if (rt === 'SOD' || rt === 'SOM') {
        this.reject(line, 'summary-row', `report type ${rt} is a daily/monthly summary, not an observation`, rt, this.typeCol + 1);
        return;
      }
    }
    const timeMs = this.timeOf(line);
    if (timeMs !== timeMs) return;
    const w = this.window;
    if (!(timeMs >= w.fromMs && timeMs < w.toMs)) {
      this.reject(line, 'time-out-of-range', outOfWindowMessage(timeMs, w), this.cell(this.timeCol), this.timeCol + 1);
      return;
    }
    let station = this.defaultStation;
    if (this.stationCol !== NO_COL) {
      if (this.rowFields === null) {
        // line mode: reuse the previous row's id when the cell holds the same bytes
        const u = this.rowBytes;
        const a = this.cellStart[this.stationCol]!;
        const n = this.cellEnd[this.stationCol]! - a;
        let same = n === this.stationLen;
        for (let k = 0, q = this.stationAt; same && k < n; k++) same = u[a + k] === u[q + k];
        if (same) station = this.stationTrimmed;
        else station = this.stationTrimmed = u.toString('utf8', a, a + n).trim();
        this.stationAt = a;
        this.stationLen = n;
      } else station = this.rowFields[this.stationCol]!.trim();
      if (station === '') {
        if (this.opts.defaultStation) station = this.opts.defaultStation;
        else {
          this.reject(line, 'no-station', 'the station cell is empty; fill it or give a default station', '', this.stationCol + 1);
          return;
        }
      }
    }
    const cols = this.cols;
    const file = this.report.file;
    let o: Observation;
    const scratch = this.scratch;
    if (scratch !== null) {
      // same values, same order of evaluation (value counts are noted in first-seen order)
      o = scratch;
      o.station = station;
      o.timeMs = timeMs;
      o.source = source;
      o.corrected = false;
      o.temperatureC = this.val(cols.temperature, line);
      o.dewpointC = this.val(cols.dewpoint, line);
      o.windDirDeg = this.val(cols.windDir, line);
      o.windSpeedMs = this.val(cols.windSpeed, line);
      o.gustMs = this.val(cols.gust, line);
      o.stationPressureHpa = this.val(cols.stationPressure, line);
      o.seaLevelPressureHpa = this.val(cols.seaLevelPressure, line);
      o.altimeterHpa = this.val(cols.altimeter, line);
      o.precipMm = this.val(cols.precip, line);
      o.weather = 0;
      o.peakWindMs = NaN;
      o.pressureTrend = 0;
      o.visibilityM = NaN;
      o.ceilingFt = NaN;
      o.latDeg = this.val(cols.lat, line);
      o.lonDeg = this.val(cols.lon, line);
      o.elevationM = this.val(cols.elevation, line);
      o.file = file;
      o.line = line;
      o.remarks = undefined;
    } else
      o = {
        station,
        timeMs,
        source,
        corrected: false,
        temperatureC: this.val(cols.temperature, line),
        dewpointC: this.val(cols.dewpoint, line),
        windDirDeg: this.val(cols.windDir, line),
        windSpeedMs: this.val(cols.windSpeed, line),
        gustMs: this.val(cols.gust, line),
        stationPressureHpa: this.val(cols.stationPressure, line),
        seaLevelPressureHpa: this.val(cols.seaLevelPressure, line),
        altimeterHpa: this.val(cols.altimeter, line),
        precipMm: this.val(cols.precip, line),
        weather: 0,
        peakWindMs: NaN,
        pressureTrend: 0,
        visibilityM: NaN,
        ceilingFt: NaN,
        latDeg: this.val(cols.lat, line),
        lonDeg: this.val(cols.lon, line),
        elevationM: this.val(cols.elevation, line),
        file,
        line,
      };
    if (o.dewpointC !== o.dewpointC && cols.relativeHumidity !== undefined) {
      const rh = this.val(cols.relativeHumidity, line);
      if (rh === rh && o.temperatureC === o.temperatureC) {
        // RH above 100 % is bad data here, not supersaturation
        o.dewpointC = rh > 0 && rh <= 100 ? dewpointFromRelativeHumidity(o.temperatureC, rh / 100, MAGNUS_AERK1996) : NaN;
        if (o.dewpointC === o.dewpointC) this.count('derived-from-rh', 'dewpoint', line, `${rh}%`);
      }
    }
    if (this.wxCol !== NO_COL) {
      const w = this.cell(this.wxCol);
      if (w.length !== 0 && w !== 'M') {
        let f = this.wxCache.get(w);
        if (f === undefined) {
          if (this.ecccWords) {
            const e = ecccWeatherFlags(w);
            f = e.flags;
            if (e.unknown.length && this.wxUnknown.size < 10000) this.wxUnknown.set(w, e.unknown.join(','));
          } else f = weatherFlagsFromCodes(w);
          if (this.wxCache.size < 10000) this.wxCache.set(w, f);
        }
        o.weather = f;
        if (this.ecccWords && this.wxUnknown.size !== 0) {
          const u = this.wxUnknown.get(w);
          if (u !== undefined) this.count('unknown-words', 'weather', line, u);
        }
      }
    }
    // read after the other fields, so that the notes of their values keep their order
    if (cols.visibility !== undefined) o.visibilityM = this.val(cols.visibility, line);
    if (this.skyCols.length !== 0) o.ceilingFt = this.ceilingOf(line);
    else if (this.skyTextCol !== NO_COL) {
      const text = this.cell(this.skyTextCol);
      const c = ceilingFromSkyText(text);
      if (c === null) this.count('bad-value', 'ceiling', line, text.trim());
      else o.ceilingFt = c;
    }
    if (this.rawCol !== NO_COL) {
      this.mergeRaw(o, this.cell(this.rawCol), line);
      station = o.station;
    }
    if (o.latDeg === o.latDeg && o.lonDeg === o.lonDeg && !this.stationsSeen.has(station)) {
      this.stationsSeen.set(station, { latDeg: o.latDeg, lonDeg: o.lonDeg, elevationM: o.elevationM });
    }
    if (station !== this.lastStation) {
      if (this.lastStation !== '') this.lastTime.set(this.lastStation, this.lastStationTime);
      this.lastStation = station;
      this.lastStationTime = this.lastTime.get(station) ?? -Infinity;
    }
    if (timeMs < this.lastStationTime) this.count('time-backwards', 'time', line, this.cell(this.timeCol).trim());
    else this.lastStationTime = timeMs;
    this.report.parsed++;
    this.emit(o);
  }

  /**
   * Ceiling of the current row from its sky columns, ft: the lowest layer whose cover is BKN, OVC or VV (FMH-1
   * §12.6.9); +Infinity when the covers name only layers without a ceiling (CLR SKC NCD NSC FEW SCT); NaN when no
   * cover is given. A level that is not a number is counted (`bad-value`), its layer skipped.
   */
  private ceilingOf(line: number): number {
    let ceiling = NaN;
    for (const k of this.skyCols) {
      const cover = this.cell(k.cover).trim().toUpperCase();
      if (cover !== 'BKN' && cover !== 'OVC' && cover !== 'VV') {
        if (NO_CEILING_COVERS.has(cover) && ceiling !== ceiling) ceiling = Infinity;
        continue;
      }
      const raw = this.cell(k.level).trim();
      const lower = raw.toLowerCase();
      if (raw === '' || MISSING.has(lower) || this.userMissingText.has(lower)) continue;
      const h = plainNumber(raw);
      if (h === -9999 || h === -999 || this.userMissingNum.includes(h)) continue;
      if (!(h >= 0)) {
        this.count('bad-value', 'ceiling', line, raw);
        continue;
      }
      if (!(ceiling <= h)) ceiling = h;
    }
    return ceiling;
  }

  private mergeRaw(o: Observation, cell: string, line: number): void {
    let text = cell.trim();
    if (text === '' || text === 'M') return;
    // NCEI LCD REM cells start with a header (e.g. `MET101...`) before `METAR KORD ...`.
    const k = text.search(/\b(METAR|SPECI) /);
    if (k > 0) text = text.slice(k);
    let d: RawReportDecoded | null = null;
    try {
      d = this.opts.decodeRawReport!(text, o.timeMs, this.report.file, line);
    } catch (e) {
      this.count('raw-report-error', 'rawReport', line, (e as Error).message ?? String(e));
      return;
    }
    if (!d) {
      this.count('raw-report-undecoded', 'rawReport', line, text);
      return;
    }
    const fill = (k: keyof Observation & ('temperatureC' | 'dewpointC' | 'windDirDeg' | 'windSpeedMs' | 'gustMs' | 'stationPressureHpa' | 'seaLevelPressureHpa' | 'altimeterHpa' | 'precipMm' | 'peakWindMs' | 'visibilityM' | 'ceilingFt')) => {
      const v = d![k];
      if (typeof v === 'number' && v === v && o[k] !== o[k]) o[k] = v;
    };
    if (d.tempFromRemarks) {
      if (typeof d.temperatureC === 'number' && d.temperatureC === d.temperatureC) o.temperatureC = d.temperatureC;
      if (typeof d.dewpointC === 'number' && d.dewpointC === d.dewpointC) o.dewpointC = d.dewpointC;
    }
    fill('temperatureC');
    fill('dewpointC');
    fill('windDirDeg');
    fill('windSpeedMs');
    fill('gustMs');
    fill('stationPressureHpa');
    fill('seaLevelPressureHpa');
    fill('altimeterHpa');
    fill('precipMm');
    fill('peakWindMs');
    fill('visibilityM');
    fill('ceilingFt');
    if (d.weather) o.weather |= d.weather;
    if (o.pressureTrend === 0 && d.pressureTrend) o.pressureTrend = d.pressureTrend;
    if (d.corrected) o.corrected = true;
    if (d.remarks && d.remarks.length) o.remarks = d.remarks;
    // no station column: the report's own station id
    if (this.stationCol === NO_COL && !this.opts.defaultStation && typeof d.station === 'string' && /^[A-Z0-9]{3,5}$/.test(d.station)) o.station = d.station;
    if (this.typeCol === NO_COL && (d.source === 'METAR' || d.source === 'SPECI')) o.source = d.source;
  }
}

const VALUE_NOTE: Record<string, string> = {
  'bad-value': '; not a number, read as missing (row kept)',
  sentinel: '; missing-value code, read as missing',
  suspect: '; flagged suspect (s), value kept',
  trace: '; trace, read as 0',
  estimated: '; flagged estimated, value kept',
  flagged: '; flag stripped, value kept',
  variable: '; variable direction, read as missing',
  'derived-from-rh': '; dew point computed from relative humidity (Magnus, Alduchov & Eskridge 1996)',
  'time-backwards': '; times go backwards within the station (accepted; the series is sorted)',
  'raw-report-undecoded': '; raw report could not be decoded',
  'raw-report-error': '; raw report decoder failed',
  'unknown-words': '; weather words not known, no weather flag from them (row kept)',
};

/** A quoted field may hold line breaks for at most this many lines (common practice, no source). */
export const MAX_RECORD_LINES = 50;

/** What `checkQuotes` found: lines to blank and report, and where each record starts. */
export interface QuoteCheck {
  /** Text to parse: the lines of unclosed quotes blanked (their line ends kept, so numbering holds). */
  text: string;
  /** Physical line (1-based) → reason and message, for each line rejected (an unclosed quote, `bad-quotes`; a
   * line of one empty quoted cell, which papaparse hands over like a blank line, `empty-row`). */
  bad: Map<number, { reason: string; message: string }>;
  /** Physical lines that continue a multi-line record (counted, not rows of their own). */
  continued: number;
  /** Where the records looked at end (`text.length` unless `more` was set): the rest waits for more text. */
  end: number;
  /** Fields of the header record (-1 while none was seen), to pass on to the check of the text that follows. */
  headerFields: number;
}

/** Where a text checked by `checkQuotes` stands in its input. */
export interface QuoteCheckAt {
  /** Physical line (1-based) of the text's first line (default 1). */
  firstLine?: number;
  /** Fields of the input's header record, found in an earlier piece (default: the first non-blank record here). */
  headerFields?: number;
  /**
   * More text follows: records are looked at only while at least MAX_RECORD_LINES + 2 line ends follow their
   * start (all a record's decision can depend on); `end` says where the rest begins.
   */
  more?: boolean;
}

/**
 * Find quoted fields that run past the end of their line (RFC 4180 §2 rules 5–7, as papaparse reads them: a
 * field opens with `"` at its start; `""` inside is one quote; it closes at a `"` followed by blanks and then
 * the delimiter, a line end or the end of the text). A record whose quote stays open past its line is kept as
 * one multi-line record only when the quote closes within MAX_RECORD_LINES lines with no lone quote inside, the record then has the
 * header's number of fields, and no line wholly inside the quoted field holds a whole row's delimiters; otherwise its first line is an unclosed quote (rejected, `bad-quotes`) and
 * reading starts again on the next line, so one stray quote never swallows the rows after it.
 */
export function checkQuotes(text: string, delimiter: string, at: QuoteCheckAt = {}): QuoteCheck {
  const bad = new Map<number, { reason: string; message: string }>();
  let continued = 0;
  const n = text.length;
  const d = delimiter;
  const dl = d.length;
  let headerFields = at.headerFields ?? -1;
  let pos = 0;
  let line = at.firstLine ?? 1;
  const blanks: [number, number][] = [];
  // with more text to come: the last record start looked at has MAX_RECORD_LINES + 2 line ends after it
  let lastStart = n;
  if (at.more) {
    lastStart = n;
    for (let i = 0; i < MAX_RECORD_LINES + 2 && lastStart >= 0; i++) lastStart = lastStart > 0 ? text.lastIndexOf('\n', lastStart - 1) : -1;
  }
  while (pos < n) {
    if (at.more && pos > lastStart) break;
    // one record from pos, starting on physical line `line`
    const recStart = pos;
    const recLine = line;
    let fields = 1;
    let p = pos;
    let lines = 1;
    let ok = true;
    let end = -1; // index of the record's line end (or n)
    let openedAt = -1;
    let invalid = false;
    while (p <= n) {
      // at a field start
      if (p < n && text.charCodeAt(p) === 34) {
        openedAt = p;
        let q = p + 1;
        let closed = false;
        for (;;) {
          const k = text.indexOf('"', q);
          // line ends crossed before the next quote
          const stop = k < 0 ? n : k;
          for (let j = text.indexOf('\n', q); j >= 0 && j < stop; j = text.indexOf('\n', j + 1)) lines++;
          if (k < 0 || lines > MAX_RECORD_LINES) break;
          if (text.charCodeAt(k + 1) === 34) {
            q = k + 2;
            continue;
          }
          let r = k + 1;
          while (r < n && (text.charCodeAt(r) === 32 || text.charCodeAt(r) === 9)) r++;
          if (r >= n || text.startsWith(d, r) || text.charCodeAt(r) === 10 || (text.charCodeAt(r) === 13 && text.charCodeAt(r + 1) === 10)) {
            p = r;
            closed = true;
            break;
          }
          invalid = true; // a lone quote inside a quoted field (papaparse: InvalidQuotes)
          q = k + 1;
        }
        if (!closed) {
          ok = false;
          break;
        }
      }
      // unquoted rest of the field: to the delimiter or the line end
      const nl = text.indexOf('\n', p);
      const lineEnd = nl < 0 ? n : nl;
      const dd = dl ? text.indexOf(d, p) : -1;
      if (dd >= 0 && dd < lineEnd) {
        fields++;
        p = dd + dl;
        continue;
      }
      end = lineEnd;
      break;
    }
    if (ok && lines > 1) {
      if (invalid || lines > MAX_RECORD_LINES || (headerFields >= 0 && fields !== headerFields)) ok = false;
      else if (headerFields > 1 && dl > 0) {
        // a line wholly inside the quoted field that holds a whole row's delimiters is a row swallowed by a stray quote
        let a = text.indexOf('\n', recStart) + 1;
        for (let b = text.indexOf('\n', a); ok && b >= 0 && b < end; a = b + 1, b = text.indexOf('\n', a)) {
          let k = 0;
          for (let j = text.indexOf(d, a); j >= 0 && j < b; j = text.indexOf(d, j + dl)) k++;
          if (k >= headerFields - 1) ok = false;
        }
      }
    }
    if (!ok) {
      // reject the first line only; read on from the next
      const nl = text.indexOf('\n', recStart);
      const lineEnd = nl < 0 ? n : nl;
      const col = openedAt >= 0 && openedAt < lineEnd ? openedAt - recStart + 1 : 1;
      bad.set(recLine, {
        reason: 'bad-quotes',
        message: `unclosed quote (") at character ${col} runs past the end of its line; line skipped, the rest of the file is read (close or remove the quote)`,
      });
      blanks.push([recStart, lineEnd > recStart && text.charCodeAt(lineEnd - 1) === 13 ? lineEnd - 1 : lineEnd]);
      pos = lineEnd + 1;
      line = recLine + 1;
      continue;
    }
    const blank = end === recStart || text.slice(recStart, end).trim() === '';
    if (!blank && fields === 1 && lines === 1 && openedAt >= 0 && text.slice(recStart, end).replace(/"/g, '').trim() === '') {
      // `""` alone: one empty cell, which would pass for a blank line
      bad.set(recLine, { reason: 'empty-row', message: 'the line holds only an empty quoted cell; nothing to read' });
      blanks.push([recStart, end > recStart && text.charCodeAt(end - 1) === 13 ? end - 1 : end]);
    }
    if (headerFields < 0 && !blank) headerFields = fields;
    if (lines > 1) continued += lines - 1;
    pos = end + 1;
    line = recLine + lines;
  }
  const end = Math.min(pos, n);
  let out = end === n ? text : text.slice(0, end);
  if (blanks.length) {
    const parts: string[] = [];
    let from = 0;
    for (const [a, b] of blanks) {
      parts.push(text.slice(from, a));
      from = b;
    }
    parts.push(text.slice(from, end));
    out = parts.join('');
  }
  return { text: out, bad, continued, end, headerFields };
}

/** papaparse options in chunk mode (`chunk` is not in the synchronous `ParseConfig` type). */
type ChunkConfig = Papa.ParseConfig<string[]> & {
  chunk: (results: Papa.ParseResult<string[]>, parser: Papa.Parser) => void;
};

/** Delimiters papaparse may guess. */
const GUESS_DELIMITERS = [',', '\t', ';', '|'];

function papaConfig(opts: CsvOptions, core: CsvCore): ChunkConfig {
  return {
    delimiter: opts.delimiter ?? '',
    delimitersToGuess: GUESS_DELIMITERS,
    skipEmptyLines: false,
    header: false,
    dynamicTyping: false,
    chunk: (results: Papa.ParseResult<string[]>, parser: Papa.Parser) => {
      if (!core.rows(results.data, results.errors)) parser.abort();
    },
  };
}

/** Characters per papaparse block when reading a text (as a 64 KiB file stream hands them over). */
const TEXT_BLOCK = 1 << 16;
/** papaparse guesses the line ending from the first 1 MiB of its first block. */
const GUESS_PREFIX = 1 << 20;

/**
 * The delimiter and line ending papaparse guesses when the whole text is its first block: the line ending
 * from the first 1 MiB, the delimiter from the first 10 rows. Guessed on the first 1 MiB alone when that
 * gives the same answer for sure (it holds 11 whole lines and no quote character), else on the whole text.
 */
function guessFormat(text: string, opts: CsvOptions): { delimiter: string; newline: Papa.ParseConfig['newline'] } {
  if (text.length > GUESS_PREFIX) {
    const g = guessFromPrefix(text.slice(0, GUESS_PREFIX), opts);
    if (g) return g;
  }
  const g = Papa.parse<string[]>(text, guessProbe(opts));
  return { delimiter: g.meta.delimiter, newline: g.meta.linebreak as Papa.ParseConfig['newline'] };
}

/** papaparse's delimiter and line-ending guess, with the options' delimiter if given (as papaConfig). */
function guessProbe(opts: CsvOptions): Papa.ParseConfig<string[]> {
  return { delimiter: opts.delimiter ?? '', delimitersToGuess: GUESS_DELIMITERS, preview: 1 } as Papa.ParseConfig<string[]>;
}

/** guessFormat from the first GUESS_PREFIX characters of a longer text, or null when they do not settle it. */
function guessFromPrefix(prefix: string, opts: CsvOptions): { delimiter: string; newline: Papa.ParseConfig['newline'] } | null {
  const g = Papa.parse<string[]>(prefix, guessProbe(opts));
  const nl = g.meta.linebreak;
  let lines = 0;
  for (let k = prefix.indexOf(nl); k >= 0 && lines < 11; k = prefix.indexOf(nl, k + nl.length)) lines++;
  if (lines >= 11 && prefix.indexOf('"') < 0) return { delimiter: g.meta.delimiter, newline: nl as Papa.ParseConfig['newline'] };
  return null;
}

/** The in-place line scan applies: a one-character ASCII delimiter and a known line ending. */
function lineModeFits(g: { delimiter: string; newline: Papa.ParseConfig['newline'] }): boolean {
  return g.delimiter.length === 1 && g.delimiter.charCodeAt(0) < 128 && typeof g.newline === 'string' && g.newline.length > 0;
}

/**
 * Parse a text in TEXT_BLOCK pieces through papaparse's stream input, synchronously (a minimal source that
 * hands the pieces to papaparse's listeners), so blocks of rows stay small. Errors thrown while handling rows
 * are rethrown here (papaparse's stream input would pass them to `error`).
 */
function parseInBlocks(text: string, config: ChunkConfig, core: CsvCore): void {
  const on: Record<string, ((x?: unknown) => void) | undefined> = {};
  const source = {
    readable: true,
    read: () => null,
    on(event: string, f: (x?: unknown) => void) {
      on[event] = f;
      return source;
    },
    removeListener(event: string) {
      on[event] = undefined;
      return source;
    },
  };
  let failed = false;
  let failure: unknown;
  const onError = (e: unknown) => {
    failed = true;
    failure = e;
  };
  Papa.parse(source as unknown as string, { ...config, error: onError } as unknown as Papa.ParseConfig<string[]>);
  for (let i = 0; i < text.length && on.data && !core.stopped; i += TEXT_BLOCK) on.data(text.slice(i, i + TEXT_BLOCK));
  if (on.end && !core.stopped) on.end();
  if (failed) throw failure;
}

/**
 * Read a whole CSV text. See the module comment for the rules. With `onObservation`, rows go to it
 * (see `CsvOptions.reuseObservation`) and `observations` stays empty.
 * @example readCsvText('station,valid,tmpf\nKJFK,2019-11-01 00:51Z,67\n', 'x.csv', {}).observations[0].temperatureC // 19.44…
 */
export function readCsvText(
  text: string,
  file: string,
  opts: CsvOptions = {},
  onObservation?: (o: Observation) => void,
): CsvResult & { observations: Observation[] } {
  const observations: Observation[] = [];
  const core = new CsvCore(file, opts, onObservation ?? ((o) => observations.push(o)));
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  const ends = normalizeLineEnds(text);
  text = ends.text;
  if (ends.note !== null) core.report.notes.push(ends.note);
  const hasQuote = text.indexOf('"') >= 0;
  if (hasQuote && text.trim() !== '') {
    // one stray quote must not swallow the rows after it
    const q = checkQuotes(text, opts.delimiter ?? guessFormat(text, opts).delimiter);
    core.useTextChecks(q, text.indexOf('\u0000') >= 0);
    text = q.text;
  } else core.useTextChecks(null, text.indexOf('\u0000') >= 0);
  if (text.trim() !== '') {
    const config = papaConfig(opts, core);
    if (text.length <= TEXT_BLOCK) Papa.parse<string[]>(text, config as Papa.ParseConfig<string[]>);
    else {
      // In blocks, with the delimiter and line ending papaparse guesses when the text is one block (not from
      // the first block only); papaparse drops a leading BOM from a string, not from a stream.
      const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
      const g = guessFormat(body, opts);
      config.delimiter = g.delimiter;
      config.newline = g.newline;
      // No quote character anywhere: CSV is a plain split on line ending and delimiter (papaparse's fast mode).
      // Not after the quote check blanked lines, nor with NUL bytes: papaparse's row handler rejects those lines.
      if (opts.parser !== 'papaparse' && lineModeFits(g) && !hasQuote && body.indexOf('\u0000') < 0) core.scanBytes(Buffer.from(body, 'utf8'), 0, g.newline!, g.delimiter);
      else parseInBlocks(body, config, core);
    }
  }
  return { ...core.finish(), observations };
}

/**
 * readCsvText on a file's bytes (UTF-8). A large file without a quote character is scanned as bytes
 * (no decoding of the whole file to a string, no string per cell); anything else is decoded and goes
 * through readCsvText. Same results either way.
 */
export function readCsvBytes(
  bytes: Uint8Array,
  file: string,
  opts: CsvOptions = {},
  onObservation?: (o: Observation) => void,
): CsvResult & { observations: Observation[] } {
  // not UTF-8 → Windows-1252; BOM dropped; lone CRs and mixed line ends made LF (text.ts)
  const prep = prepareText(bytes);
  const r = readPreparedCsv(prep.bytes, file, opts, onObservation);
  if (prep.notes.length) r.report.notes.unshift(...prep.notes);
  return r;
}

/** readCsvBytes on bytes already prepared (UTF-8, no BOM, one kind of line end), without the text notes. */
function readPreparedCsv(u: Buffer, file: string, opts: CsvOptions, onObservation?: (o: Observation) => void): CsvResult & { observations: Observation[] } {
  const bom = 0;
  // the text path's checks: NUL in the first 8192 characters; a text that is not blank (first printable byte is ASCII)
  let first = bom;
  while (first < u.length && u[first]! <= 32) first++;
  const plain = opts.parser !== 'papaparse' && u.length - bom > GUESS_PREFIX && first < u.length && u[first]! < 128 && u.indexOf(34) < 0 && u.indexOf(0) < 0;
  if (plain) {
    const prefix = u.toString('utf8', bom, bom + 4 * GUESS_PREFIX);
    const g = prefix.length > GUESS_PREFIX ? guessFromPrefix(prefix.slice(0, GUESS_PREFIX), opts) : null;
    if (g && lineModeFits(g)) {
      const observations: Observation[] = [];
      const core = new CsvCore(file, opts, onObservation ?? ((o) => observations.push(o)));
      core.scanBytes(u, bom, g.newline!, g.delimiter);
      return { ...core.finish(), observations };
    }
  }
  return readCsvText(u.toString('utf8'), file, opts, onObservation);
}

/** Bytes a CsvReader holds before it reads as a stream (below this a file is read whole, as readCsvBytes reads it). */
export const CSV_WHOLE_BYTES = 4 << 20;

/**
 * The CSV reader over blocks of whole lines (a LineSplitter's output, in order), with the rules of readCsvText.
 * An input up to `wholeBytes` (default CSV_WHOLE_BYTES) is read whole, exactly as readCsvBytes reads it. A
 * longer one is read piece by piece: delimiter and line ending are papaparse's guess on the first `wholeBytes`;
 * each piece's quotes are checked (`checkQuotes`, with what the piece before found) up to the last record whose
 * decision fits in it, the rest waits for the next block; pieces without quotes or NUL are scanned in place,
 * the others parsed by papaparse. Memory holds one block and the lines carried over.
 */
export class CsvReader {
  private readonly core: CsvCore;
  private readonly observations: Observation[] = [];
  private readonly opts: CsvOptions;
  private readonly onObservation: ((o: Observation) => void) | undefined;
  private readonly file: string;
  private readonly wholeBytes: number;
  private held: Buffer[] | null = [];
  private heldBytes = 0;
  private heldFirstLine = 1;
  private delimiter = ',';
  private lineMode = false;
  private carry = '';
  private carryLine = 1;
  private headerFields = -1;
  private wholeResult: (CsvResult & { observations: Observation[] }) | null = null;

  constructor(file: string, opts: CsvOptions = {}, onObservation?: (o: Observation) => void, wholeBytes = CSV_WHOLE_BYTES) {
    this.file = file;
    this.opts = opts;
    this.onObservation = onObservation;
    this.wholeBytes = wholeBytes;
    this.core = new CsvCore(file, opts, onObservation ?? ((o) => this.observations.push(o)));
  }

  /** Read one block. */
  block(b: TextBlock): void {
    if (this.held !== null) {
      if (this.heldBytes === 0) this.heldFirstLine = b.firstLine;
      this.held.push(b.bytes);
      this.heldBytes += b.bytes.length;
      if (this.heldBytes <= this.wholeBytes && !b.last) return;
      if (b.last) return;
      // long input: read as a stream from here
      const head = this.held;
      this.held = null;
      const text = lfText(Buffer.concat(head));
      const g = guessFormat(text.charCodeAt(0) === 0xfeff ? text.slice(1) : text, this.opts);
      this.delimiter = g.delimiter;
      this.lineMode = this.opts.parser !== 'papaparse' && lineModeFits(g);
      this.piece(text, this.heldFirstLine, false);
      return;
    }
    if (this.core.stopped) return;
    const u = b.bytes.indexOf(13) >= 0 ? lineEndsToLf(b.bytes) : b.bytes;
    if (this.carry === '' && this.lineMode && u.indexOf(34) < 0 && !b.hasNul) {
      // no quote: a plain split on line end and delimiter, read in place
      this.core.useTextChecks(null, false);
      this.core.scanBytes(u, 0, '\n', this.delimiter);
      if (!b.last) this.core.takeBackEmptyTail();
      return;
    }
    const line = this.carry === '' ? b.firstLine : this.carryLine;
    this.piece(this.carry + u.toString('utf8'), line, b.last);
  }

  /** Check the quotes of a piece of text (physical line `firstLine` on) and parse what they settle; carry the rest. */
  private piece(text: string, firstLine: number, last: boolean): void {
    const core = this.core;
    let body = text;
    let end = text.length;
    const quoted = text.indexOf('"') >= 0;
    if (quoted) {
      const q = checkQuotes(text, this.delimiter, { firstLine, headerFields: this.headerFields, more: !last });
      this.headerFields = q.headerFields;
      core.useTextChecks(q, text.indexOf('\u0000') >= 0);
      body = q.text;
      end = q.end;
    } else core.useTextChecks(null, text.indexOf('\u0000') >= 0);
    // physical line where the rest (or the next block) begins
    let lines = 0;
    if (!last || end < text.length) for (let k = text.indexOf('\n'); k >= 0 && k < end; k = text.indexOf('\n', k + 1)) lines++;
    this.carry = end < text.length ? text.slice(end) : '';
    this.carryLine = firstLine + lines;
    if (body === '') return;
    // (lines blanked by the quote check are rejected by the row handler papaparse feeds, not by the scan)
    if (this.lineMode && !quoted && body.indexOf('\u0000') < 0) core.scanBytes(Buffer.from(body, 'utf8'), 0, '\n', this.delimiter);
    else {
      const config = papaConfig(this.opts, core);
      config.delimiter = this.delimiter;
      config.newline = '\n';
      if (body.length <= TEXT_BLOCK) Papa.parse<string[]>(body, config as Papa.ParseConfig<string[]>);
      else parseInBlocks(body, config, core);
    }
    // the piece ends with its line end unless it is the input's last: the line after it is the next piece's first
    if (!last || end < text.length) core.continueAt(this.carryLine);
  }

  /** The observations (when collected) and the file's result; `textNotes` (encoding, line ends) go first. */
  finish(textNotes: readonly string[] = []): CsvResult & { observations: Observation[] } {
    let r: CsvResult & { observations: Observation[] };
    if (this.held !== null) {
      // read whole: the bytes prepareText would give (one kind of line end throughout)
      let u: Buffer = Buffer.concat(this.held);
      if (textNotes.some((n) => n.startsWith('line ends'))) u = lineEndsToLf(u);
      r = readPreparedCsv(u, this.file, this.opts, this.onObservation);
    } else {
      if (this.carry !== '' && !this.core.stopped) this.piece(this.carry, this.carryLine, true);
      r = { ...this.core.finish(), observations: this.observations };
    }
    if (textNotes.length) r.report.notes.unshift(...textNotes);
    return r;
  }
}

/** A block's text with LF line ends. */
function lfText(u: Buffer): string {
  return (u.indexOf(13) >= 0 ? lineEndsToLf(u) : u).toString('utf8');
}

/**
 * Read a CSV from a Node readable stream, calling `onObservation` for each parsed row (memory stays flat). The
 * bytes go the way the command line reads a file: cut into blocks of whole lines (LineSplitter: encoding, BOM,
 * line ends) and read by a CsvReader (quotes checked piece by piece, so an unclosed quote rejects its line only,
 * `bad-quotes`; pieces without quotes scanned in place). Chunks may be Buffers or strings (a stream with an
 * encoding set).
 * Resolves with the report when the stream ends; rejects on stream errors and on errors thrown by
 * `onObservation` (bad data never throws: it is counted in the report).
 */
export async function readCsvStream(
  stream: NodeJS.ReadableStream,
  file: string,
  opts: CsvOptions,
  onObservation: (o: Observation) => void,
): Promise<CsvResult> {
  const splitter = new LineSplitter();
  const reader = new CsvReader(file, opts, onObservation);
  for await (const chunk of stream as AsyncIterable<Buffer | string>) {
    const b = splitter.push(typeof chunk === 'string' ? Buffer.from(chunk, 'utf8') : chunk);
    if (b) reader.block(b);
  }
  const e = splitter.end();
  if (e) reader.block(e);
  const r = reader.finish(splitter.notes());
  return { report: r.report, stationsSeen: r.stationsSeen, valueCounts: r.valueCounts, units: r.units };
}
