/**
 * Observation time text → epoch ms UTC.
 *
 * Accepted forms (digits read by hand; luxon is used only for time-zone offsets):
 * - ISO 8601 `YYYY-MM-DDTHH:MM[:SS[.fff]]` or with a blank instead of `T`, optional `Z` / `±HH:MM` /
 *   `±HHMM` / `±HH` (ISO 8601-1:2019 §5.4); a date alone `YYYY-MM-DD` means 00:00; `/` may replace `-`.
 * - Compact `YYYYMMDDHHMM[SS]`.
 * - US `MM/DD/YYYY HH:MM[:SS]` with optional `AM`/`PM`.
 * - Epoch seconds (or ms when |value| > 1e11) only when the caller says so (`epoch: true`, for a column
 *   named e.g. `epoch` or `unix_time`).
 *
 * A time without an offset is local to `zone` (IANA name) or shifted by `offsetMinutes`, else it is an
 * error `needs-zone`. With a zone, a local time repeated at a fall-back change is `ambiguous` and a local
 * time skipped at a spring-forward change is `nonexistent`: both are reported, never guessed. Offsets come
 * from the IANA tz database (through luxon's `IANAZone`, which uses the runtime's Intl data).
 *
 * `standardTime: true` reads naive times as the zone's STANDARD time all year (no DST), the convention of
 * NCEI Local Climatological Data, whose `DATE` is local standard time (LCD documentation, from memory).
 * The standard offset is the smaller of the zone's 1 January and 1 July offsets of that year, so it also
 * holds in the southern hemisphere (Sydney: +10:00, not the January DST offset +11:00).
 */
import { IANAZone } from 'luxon';
import { MS_PER_DAY, MS_PER_HOUR, MS_PER_MINUTE } from '../physics/constants.js';

export type TimeError = 'ambiguous' | 'nonexistent' | 'unparsable' | 'needs-zone';
export type TimeResult = { ms: number } | { error: TimeError; message: string };

export interface TimeOptions {
  /** IANA zone for times without an offset, e.g. `America/Chicago`. `UTC` is accepted. */
  zone?: string;
  /** Fixed offset from UTC, minutes east (e.g. −300 for UTC−5), for times without an offset; wins over `zone`. */
  offsetMinutes?: number;
  /** Read naive times as the zone's standard time all year (NCEI LCD convention). */
  standardTime?: boolean;
  /** The text is an epoch number (seconds, or ms when |value| > 1e11). */
  epoch?: boolean;
}

/** Fields read from the text; `offset` NaN when the text has none. */
interface Parts {
  y: number;
  mo: number;
  d: number;
  h: number;
  mi: number;
  s: number;
  ms: number;
  offset: number;
}

const scratch: Parts = { y: 0, mo: 0, d: 0, h: 0, mi: 0, s: 0, ms: 0, offset: NaN };

function digit(t: string, i: number): number {
  const c = t.charCodeAt(i) - 48;
  return c >= 0 && c <= 9 ? c : -1000;
}
function num2(t: string, i: number): number {
  return digit(t, i) * 10 + digit(t, i + 1);
}
function num4(t: string, i: number): number {
  return digit(t, i) * 1000 + digit(t, i + 1) * 100 + digit(t, i + 2) * 10 + digit(t, i + 3);
}

function daysInMonth(y: number, mo: number): number {
  return mo === 2 ? ((y % 4 === 0 && y % 100 !== 0) || y % 400 === 0 ? 29 : 28) : mo === 4 || mo === 6 || mo === 9 || mo === 11 ? 30 : 31;
}

/** Read the clock and offset starting at `i` (after the date). Returns false when malformed. */
function readClock(t: string, i: number, p: Parts): boolean {
  const n = t.length;
  p.h = 0;
  p.mi = 0;
  p.s = 0;
  p.ms = 0;
  p.offset = NaN;
  if (i >= n) return true;
  const sep = t.charCodeAt(i);
  if (sep !== 84 /*T*/ && sep !== 32 /* */ && sep !== 116 /*t*/) return readOffset(t, i, p);
  i++;
  while (i < n && t.charCodeAt(i) === 32) i++;
  p.h = num2(t, i);
  if (t.charCodeAt(i + 2) !== 58 /*:*/) return false;
  p.mi = num2(t, i + 3);
  i += 5;
  if (t.charCodeAt(i) === 58) {
    p.s = num2(t, i + 1);
    i += 3;
    if (t.charCodeAt(i) === 46 /*.*/ || t.charCodeAt(i) === 44 /*,*/) {
      i++;
      let scale = 100;
      let frac = 0;
      while (i < n) {
        const c = digit(t, i);
        if (c < 0) break;
        frac += c * scale;
        scale /= 10;
        i++;
      }
      p.ms = Math.round(frac);
    }
  }
  return readOffset(t, i, p);
}

function readOffset(t: string, i: number, p: Parts): boolean {
  const n = t.length;
  while (i < n && t.charCodeAt(i) === 32) i++;
  if (i >= n) return true;
  const c = t.charCodeAt(i);
  if ((c === 90 || c === 122) && i === n - 1) {
    p.offset = 0;
    return true;
  }
  if (c === 85 && t.slice(i) === 'UTC') {
    p.offset = 0;
    return true;
  }
  if (c === 43 || c === 45 /* + - */) {
    const sign = c === 43 ? 1 : -1;
    const hh = num2(t, i + 1);
    let mm = 0;
    const rest = n - i - 3;
    if (rest === 3 && t.charCodeAt(i + 3) === 58) mm = num2(t, i + 4);
    else if (rest === 2) mm = num2(t, i + 3);
    else if (rest !== 0) return false;
    if (hh < 0 || hh > 18 || mm < 0 || mm > 59) return false;
    p.offset = sign * (hh * 60 + mm);
    return true;
  }
  return false;
}

/**
 * The commonest forms `YYYY-MM-DD HH:MM` / `YYYY-MM-DDTHH:MM`, optionally with `Z`, all digits present:
 * the parts readParts would give, read in one go; false sends the text to readParts.
 */
function readPartsQuick(t: string, p: Parts): boolean {
  const n = t.length;
  if (n !== 16 && n !== 17) return false;
  const u = QUICK;
  for (let i = 0; i < n; i++) {
    const c = t.charCodeAt(i);
    if (c > 127) return false;
    u[i] = c;
  }
  return readPartsQuickBytes(u, 0, n, p);
}

/** Scratch bytes for readPartsQuick. */
const QUICK = new Uint8Array(17);

/** The quick form `YYYY-MM-DD[T t ]HH:MM[Z z]` in the bytes u[a, b) into `p`; false when it does not fit. */
function readPartsQuickBytes(u: Uint8Array, a: number, b: number, p: Parts): boolean {
  const n = b - a;
  if (n !== 16 && n !== 17) return false;
  if (u[a + 4] !== 45 || u[a + 7] !== 45 || u[a + 13] !== 58) return false;
  const sep = u[a + 10];
  if (sep !== 84 && sep !== 32 && sep !== 116) return false;
  let offset = NaN;
  if (n === 17) {
    const z = u[a + 16];
    if (z !== 90 && z !== 122) return false;
    offset = 0;
  }
  const y0 = u[a]! - 48;
  const y1 = u[a + 1]! - 48;
  const y2 = u[a + 2]! - 48;
  const y3 = u[a + 3]! - 48;
  const m0 = u[a + 5]! - 48;
  const m1 = u[a + 6]! - 48;
  const d0 = u[a + 8]! - 48;
  const d1 = u[a + 9]! - 48;
  const h0 = u[a + 11]! - 48;
  const h1 = u[a + 12]! - 48;
  const i0 = u[a + 14]! - 48;
  const i1 = u[a + 15]! - 48;
  if ((y0 | y1 | y2 | y3 | m0 | m1 | d0 | d1 | h0 | h1 | i0 | i1) >>> 0 > 15) return false;
  if (y0 > 9 || y1 > 9 || y2 > 9 || y3 > 9 || m0 > 9 || m1 > 9 || d0 > 9 || d1 > 9 || h0 > 9 || h1 > 9 || i0 > 9 || i1 > 9) return false;
  p.y = y0 * 1000 + y1 * 100 + y2 * 10 + y3;
  p.mo = m0 * 10 + m1;
  p.d = d0 * 10 + d1;
  p.h = h0 * 10 + h1;
  p.mi = i0 * 10 + i1;
  p.s = 0;
  p.ms = 0;
  p.offset = offset;
  return true;
}

/** Split `text` into parts; false when no accepted form matches. */
function readParts(t: string, p: Parts): boolean {
  const n = t.length;
  if (n >= 10 && (t.charCodeAt(4) === 45 || t.charCodeAt(4) === 47) && t.charCodeAt(7) === t.charCodeAt(4)) {
    // YYYY-MM-DD..., YYYY/MM/DD...
    p.y = num4(t, 0);
    p.mo = num2(t, 5);
    p.d = num2(t, 8);
    return readClock(t, 10, p);
  }
  if (n >= 10 && t.charCodeAt(2) === 47 && t.charCodeAt(5) === 47) {
    // MM/DD/YYYY[ HH:MM[:SS]][ AM|PM]
    p.mo = num2(t, 0);
    p.d = num2(t, 3);
    p.y = num4(t, 6);
    let body = t;
    let ampm = 0;
    const tail = t.slice(-2).toUpperCase();
    if (tail === 'AM' || tail === 'PM') {
      ampm = tail === 'AM' ? 1 : 2;
      body = t.slice(0, -2).trimEnd();
    }
    // allow a single-digit hour: `1/5` forms are not accepted, but `01/05/2024 7:05` is
    if (body.length > 11 && body.charCodeAt(12) === 58) body = body.slice(0, 11) + '0' + body.slice(11);
    if (!readClock(body, 10, p)) return false;
    if (ampm) {
      if (p.h < 1 || p.h > 12) return false;
      p.h = (p.h % 12) + (ampm === 2 ? 12 : 0);
    }
    return true;
  }
  if ((n === 12 || n === 14) && /^\d+$/.test(t)) {
    p.y = num4(t, 0);
    p.mo = num2(t, 4);
    p.d = num2(t, 6);
    p.h = num2(t, 8);
    p.mi = num2(t, 10);
    p.s = n === 14 ? num2(t, 12) : 0;
    p.ms = 0;
    p.offset = NaN;
    return true;
  }
  return false;
}

function validParts(p: Parts): boolean {
  if (!(p.y >= 0 && p.mo >= 1 && p.mo <= 12 && p.d >= 1 && p.d <= daysInMonth(p.y, p.mo))) return false;
  if (!(p.h >= 0 && p.mi >= 0 && p.mi <= 59 && p.s >= 0 && p.s <= 60)) return false;
  // ISO 8601 allows 24:00 as the end of a day.
  return p.h < 24 || (p.h === 24 && p.mi === 0 && p.s === 0 && p.ms === 0);
}

/** Offset lookups for one zone, cached per UTC hour (an hour holding a transition is not cached). */
class ZoneOffsets {
  readonly zone: IANAZone;
  private cache = new Map<number, number>();
  private standardCache = new Map<number, number>();
  constructor(name: string) {
    this.zone = IANAZone.create(name);
  }
  /** Offset in minutes east of UTC at instant `ms`. */
  at(ms: number): number {
    const hour = Math.floor(ms / MS_PER_HOUR);
    const c = this.cache.get(hour);
    if (c !== undefined) return Number.isNaN(c) ? this.zone.offset(ms) : c;
    const a = this.zone.offset(hour * MS_PER_HOUR);
    const b = this.zone.offset(hour * MS_PER_HOUR + MS_PER_HOUR - 1);
    if (this.cache.size > 200000) this.cache.clear();
    this.cache.set(hour, a === b ? a : NaN);
    return a === b ? a : this.zone.offset(ms);
  }
  /** Standard (non-DST) offset for the year: min of the 1 January and 1 July offsets. */
  standard(year: number): number {
    let s = this.standardCache.get(year);
    if (s === undefined) {
      s = Math.min(this.zone.offset(Date.UTC(year, 0, 1)), this.zone.offset(Date.UTC(year, 6, 1)));
      this.standardCache.set(year, s);
    }
    return s;
  }
}

/**
 * The standard (non-DST) offset of an IANA zone in `year`, minutes east of UTC: the smaller of its 1 January and
 * 1 July offsets (module comment), the offset `standardTime: true` reads naive times with.
 * @example standardOffsetMinutes('Australia/Sydney', 2023) // 600 (AEST; the January offset +660 is daylight time)
 */
export function standardOffsetMinutes(zone: string, year: number): number {
  if (!IANAZone.isValidZone(zone)) throw new RangeError(`unknown time zone "${zone}"`);
  return new ZoneOffsets(zone).standard(year);
}

function fmtOffset(min: number): string {
  const s = min < 0 ? '-' : '+';
  const a = Math.abs(min);
  return `${s}${String(Math.floor(a / 60)).padStart(2, '0')}:${String(a % 60).padStart(2, '0')}`;
}

/**
 * Convert a local wall time (given as if it were UTC, `wallMs`) in `zone` to UTC, detecting DST gaps and
 * overlaps: the offsets one day before and after are the only candidates; a candidate instant is valid when
 * the zone's offset at that instant equals the candidate offset.
 */
function localToUtc(wallMs: number, z: ZoneOffsets, text: string): TimeResult {
  const o1 = z.at(wallMs - MS_PER_DAY);
  const o2 = z.at(wallMs + MS_PER_DAY);
  const u1 = wallMs - o1 * MS_PER_MINUTE;
  const ok1 = z.at(u1) === o1;
  if (o1 === o2) {
    if (ok1) return { ms: u1 };
    // Two changes within two days (rare); fall back to the offset at the wall time itself.
    const o = z.at(wallMs);
    const u = wallMs - o * MS_PER_MINUTE;
    if (z.at(u) === o) return { ms: u };
    return { error: 'nonexistent', message: `${text} does not exist in ${z.zone.name} (clock change); give times in UTC or with an offset` };
  }
  const u2 = wallMs - o2 * MS_PER_MINUTE;
  const ok2 = z.at(u2) === o2;
  if (ok1 && ok2) {
    return {
      error: 'ambiguous',
      message: `${text} happens twice in ${z.zone.name} (clocks go back: ${fmtOffset(o1)} and ${fmtOffset(o2)}); give times in UTC or with an offset`,
    };
  }
  if (ok1) return { ms: u1 };
  if (ok2) return { ms: u2 };
  return {
    error: 'nonexistent',
    message: `${text} does not exist in ${z.zone.name} (clocks go forward from ${fmtOffset(o1)} to ${fmtOffset(o2)}); check the time column or give times in UTC`,
  };
}

const UTC_NAMES = new Set(['utc', 'z', 'etc/utc', 'gmt', 'etc/gmt', 'zulu', 'universal', 'etc/universal']);

/** A reusable parser with its zone and offset cache bound (use one per file/column). */
export type TimeParser = (text: string) => TimeResult;

/**
 * Allocation-free time reading for hot loops: `read(text)` returns epoch ms or NaN, and on NaN `error`
 * holds the reason. Build with `makeTimeReader`; `makeTimeParser` wraps it.
 */
export interface TimeReader {
  read(text: string): number;
  /**
   * read() of the bytes u[a, b) when they hold exactly `YYYY-MM-DD[T ]HH:MM[Z]`; otherwise NaN with
   * `error` null (decode the text and call read()).
   */
  readQuickBytes(u: Uint8Array, a: number, b: number): number;
  error: { error: TimeError; message: string } | null;
}

/**
 * True for a zone name makeTimeReader accepts: an IANA tz database name or a name of UTC.
 * @example isKnownZone('America/Halifax') // true
 */
export function isKnownZone(name: string): boolean {
  return UTC_NAMES.has(name.trim().toLowerCase()) || IANAZone.isValidZone(name);
}

/**
 * Build an allocation-free time reader for fixed options; throws RangeError for an unknown zone or a bad offset.
 */
export function makeTimeReader(opts: TimeOptions = {}): TimeReader {
  const { zone, offsetMinutes, standardTime, epoch } = opts;
  if (offsetMinutes !== undefined && !(Number.isFinite(offsetMinutes) && Math.abs(offsetMinutes) <= 18 * 60)) {
    throw new RangeError(`offsetMinutes must be within ±1080, got ${offsetMinutes}`);
  }
  let z: ZoneOffsets | null = null;
  let fixed = offsetMinutes ?? NaN;
  if (zone !== undefined && Number.isNaN(fixed)) {
    if (UTC_NAMES.has(zone.trim().toLowerCase())) fixed = 0;
    else {
      if (!IANAZone.isValidZone(zone)) throw new RangeError(`unknown time zone "${zone}"; use an IANA name such as America/Chicago`);
      z = new ZoneOffsets(zone);
    }
  }
  const p: Parts = { ...scratch };
  let dayY = NaN;
  let dayMo = NaN;
  let dayD = NaN;
  let dayMs = NaN;
  const reader: TimeReader = {
    error: null,
    read(raw: string): number {
      const text = raw.length !== 0 && (raw.charCodeAt(0) <= 32 || raw.charCodeAt(raw.length - 1) <= 32) ? raw.trim() : raw;
      if (epoch) {
        const v = Number(text);
        if (text === '' || !Number.isFinite(v)) return fail('unparsable', `"${text}" is not an epoch number`);
        return Math.abs(v) > 1e11 ? v : v * 1000;
      }
      if (!readPartsQuick(text, p) && !readParts(text, p)) return fail('unparsable', `"${text}" is not a time fropa reads (use ISO 8601, e.g. 2024-02-27T08:51Z)`);
      return fromParts(text);
    },
    readQuickBytes(u: Uint8Array, a: number, b: number): number {
      if (epoch || !readPartsQuickBytes(u, a, b, p)) {
        reader.error = null;
        return NaN;
      }
      bytesU = u;
      bytesA = a;
      bytesB = b;
      return fromParts(null);
    },
  };
  let bytesU: Uint8Array | null = null;
  let bytesA = 0;
  let bytesB = 0;
  /** Epoch ms of the parts in `p`; `text` (null: the bytes last given to readQuickBytes) only for messages and zones. */
  function fromParts(text: string | null): number {
    if (!validParts(p)) return fail('unparsable', `"${text ?? bytesText()}" is not a valid calendar date and time`);
    // = Date.UTC(y, mo − 1, d, h, mi, s, ms): the day part is cached (consecutive rows share the date)
    if (p.y !== dayY || p.mo !== dayMo || p.d !== dayD) {
      dayY = p.y;
      dayMo = p.mo;
      dayD = p.d;
      dayMs = Date.UTC(p.y, p.mo - 1, p.d);
      // Date.UTC reads years 0–99 as 1900–1999 (ECMA-262 §21.4.3.4 MakeFullYear); year 0001 is year 1
      if (p.y >= 0 && p.y <= 99) dayMs = new Date(dayMs).setUTCFullYear(p.y);
    }
    const wall = dayMs + p.h * MS_PER_HOUR + p.mi * MS_PER_MINUTE + p.s * 1000 + p.ms;
    if (!Number.isNaN(p.offset)) return wall - p.offset * MS_PER_MINUTE;
    if (!Number.isNaN(fixed)) return wall - fixed * MS_PER_MINUTE;
    if (z) {
      if (standardTime) return wall - z.standard(p.y) * MS_PER_MINUTE;
      const r = localToUtc(wall, z, text ?? bytesText());
      if ('ms' in r) return r.ms;
      reader.error = r;
      return NaN;
    }
    return fail('needs-zone', `"${text ?? bytesText()}" has no UTC offset; give the time zone (IANA name, e.g. --tz America/Chicago) or a UTC offset column`);
  }
  function bytesText(): string {
    const u = bytesU!;
    return Buffer.from(u.buffer, u.byteOffset, u.byteLength).toString('utf8', bytesA, bytesB);
  }
  function fail(error: TimeError, message: string): number {
    reader.error = { error, message };
    return NaN;
  }
  return reader;
}

/**
 * Build a time parser for fixed options; throws RangeError for an unknown zone or a bad offset.
 * @example makeTimeParser({ zone: 'America/New_York' })('2019-11-03 01:30') // { error: 'ambiguous', ... }
 */
export function makeTimeParser(opts: TimeOptions = {}): TimeParser {
  const r = makeTimeReader(opts);
  return (text: string): TimeResult => {
    const ms = r.read(text);
    return ms === ms ? { ms } : r.error!;
  };
}

const parserCache = new Map<string, TimeParser>();

/**
 * Parse one time text to epoch ms UTC, or explain why not (see module comment for forms and rules).
 * Parsers are cached per option set, so repeated calls share the zone-offset cache.
 * @example parseTime('2024-02-27T08:51Z', {}) // { ms: 1709023860000 }
 * @example parseTime('2019-03-10 02:30', { zone: 'America/New_York' }).error // 'nonexistent'
 */
export function parseTime(text: string, opts: TimeOptions = {}): TimeResult {
  const key = `${opts.zone ?? ''}|${opts.offsetMinutes ?? ''}|${opts.standardTime ? 1 : 0}|${opts.epoch ? 1 : 0}`;
  let f = parserCache.get(key);
  if (!f) {
    f = makeTimeParser(opts);
    if (parserCache.size > 100) parserCache.clear();
    parserCache.set(key, f);
  }
  return f(text);
}

/**
 * Parse a UTC-offset cell into minutes east: `-05:00`, `-0500`, `+5:30` as hours:minutes; a bare number
 * within ±18 as hours (`-5`, `5.5`), otherwise as minutes (`-300`). NaN when unreadable.
 * @example parseOffsetMinutes('-0500') // -300
 */
export function parseOffsetMinutes(text: string): number {
  const t = text.trim().replace(/^(UTC|GMT)/i, '');
  let m = /^([+-])?(\d{1,2}):(\d{2})$/.exec(t);
  if (m) return (m[1] === '-' ? -1 : 1) * (Number(m[2]) * 60 + Number(m[3]));
  m = /^([+-])(\d{2})(\d{2})$/.exec(t);
  if (m) return (m[1] === '-' ? -1 : 1) * (Number(m[2]) * 60 + Number(m[3]));
  if (t === '') return NaN;
  const v = Number(t);
  if (!Number.isFinite(v)) return NaN;
  return Math.abs(v) <= 18 ? Math.round(v * 60) : v;
}

/**
 * Where the parts of a time stand when a file spreads one time over several columns (0-based column
 * indices): a date column and a time-of-day column (`date_local,time_local`, `Date,Time`); year, month, day
 * and optional hour, minute or `hhmm` columns (`year,month,day,hour` as in the nycflights weather tables);
 * or year and day of year (`year,doy,hhmm`) with an optional hour, minute or `hhmm`.
 */
export type TimeColumns =
  | { kind: 'date-time'; date: number; time: number }
  | { kind: 'year-month-day'; year: number; month: number; day: number; hour?: number; minute?: number; hhmm?: number }
  | { kind: 'year-doy'; year: number; doy: number; hour?: number; minute?: number; hhmm?: number };

/** Column indices a TimeColumns reads (for messages and checks). */
export function timeColumnIndices(t: TimeColumns): number[] {
  if (t.kind === 'date-time') return [t.date, t.time];
  const out = t.kind === 'year-month-day' ? [t.year, t.month, t.day] : [t.year, t.doy];
  for (const k of [t.hour, t.minute, t.hhmm]) if (k !== undefined) out.push(k);
  return out;
}

const pad2 = (n: number) => (n < 10 ? '0' : '') + n;

/** A whole number written with digits only (blanks trimmed), else NaN. */
function wholeNumber(text: string | undefined): number {
  if (text === undefined) return NaN;
  const t = text.trim();
  return /^\d{1,4}(\.0+)?$/.test(t) ? Number(t) : NaN;
}

/**
 * A date cell (`2024-02-27`, `2024/02/27`, `20240227`, US `02/27/2024`) → [year, month, day], or null.
 * A cell that also carries a time of day is not a date cell (null).
 */
function dateCell(text: string): [number, number, number] | null {
  const t = text.trim();
  let m = /^(\d{4})[-/.](\d{1,2})[-/.](\d{1,2})$/.exec(t) ?? /^(\d{4})(\d{2})(\d{2})$/.exec(t);
  if (m) return [Number(m[1]), Number(m[2]), Number(m[3])];
  m = /^(\d{1,2})\/(\d{1,2})\/(\d{4})$/.exec(t);
  if (m) return [Number(m[3]), Number(m[1]), Number(m[2])];
  return null;
}

/**
 * A time-of-day cell → minutes and seconds after midnight, or null: `13:05`, `13:05:30`, `1:05 PM`, `1305`,
 * `105` and `5` as `hhmm` (ISD and many loggers write `hhmm` without leading zeros), `24:00` (the end of the
 * day, ISO 8601-1:2019 §5.3.2).
 */
function timeOfDayCell(text: string): { h: number; mi: number; s: number } | null {
  const t = text.trim();
  let m = /^(\d{1,2}):(\d{2})(?::(\d{2})(?:\.\d+)?)?(?:\s*([AaPp])\.?[Mm]\.?)?$/.exec(t);
  if (m) {
    let h = Number(m[1]);
    if (m[4]) {
      if (h < 1 || h > 12) return null;
      h = (h % 12) + (m[4].toLowerCase() === 'p' ? 12 : 0);
    }
    return { h, mi: Number(m[2]), s: m[3] ? Number(m[3]) : 0 };
  }
  m = /^(\d{1,4})$/.exec(t);
  if (m) {
    const v = Number(m[1]);
    return { h: Math.floor(v / 100), mi: v % 100, s: 0 };
  }
  return null;
}

/**
 * Join the cells of a time spread over several columns into one naive ISO text `YYYY-MM-DD HH:MM:SS` that
 * the time reader reads (zone, offset and standard-time rules apply to it as to a single column), or an
 * error message naming the cell that cannot be read. Rules: hour 24 with minute 0 is 00:00 of the next day
 * (ISO 8601-1:2019 §5.3.2); a day of year runs 1 … 365 (366 in a leap year, Gregorian rule); an hour column
 * alone means minute 0; no hour column means 00:00.
 * @example assembleTimeText({ kind: 'date-time', date: 0, time: 1 }, ['2024-02-27', '8:51 PM']) // { text: '2024-02-27 20:51:00' }
 * @example assembleTimeText({ kind: 'year-month-day', year: 0, month: 1, day: 2, hour: 3 }, ['2022', '1', '1', '0']) // { text: '2022-01-01 00:00:00' }
 */
export function assembleTimeText(t: TimeColumns, cells: readonly string[] | ((i: number) => string)): { text: string } | { error: string } {
  const cell = typeof cells === 'function' ? cells : (i: number) => cells[i] ?? '';
  let y: number;
  let mo: number;
  let d: number;
  let h = 0;
  let mi = 0;
  let s = 0;
  if (t.kind === 'date-time') {
    const dc = cell(t.date);
    const ymd = dateCell(dc);
    // a date column that holds the whole time (`2019-01-01T00:51`) is read alone
    if (!ymd && /^\d{4}-\d{2}-\d{2}[T ]\d{2}:\d{2}/.test(dc.trim())) return { text: dc.trim() };
    if (!ymd) return { error: `date "${dc.trim()}" is not a date fropa reads (2024-02-27, 20240227 or 02/27/2024)` };
    [y, mo, d] = ymd;
    const tc = cell(t.time);
    const tod = timeOfDayCell(tc);
    if (!tod) return { error: `time of day "${tc.trim()}" is not a time fropa reads (13:05, 13:05:30, 1:05 PM or 1305)` };
    ({ h, mi, s } = tod);
  } else {
    y = wholeNumber(cell(t.year));
    if (!(y >= 1000)) return { error: `year "${cell(t.year).trim()}" is not a four-digit year` };
    if (t.kind === 'year-month-day') {
      mo = wholeNumber(cell(t.month));
      d = wholeNumber(cell(t.day));
      if (!(mo >= 1 && mo <= 12)) return { error: `month "${cell(t.month).trim()}" is not 1 to 12` };
      if (!(d >= 1 && d <= 31)) return { error: `day "${cell(t.day).trim()}" is not 1 to 31` };
    } else {
      const doy = wholeNumber(cell(t.doy));
      const leap = (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0;
      if (!(doy >= 1 && doy <= (leap ? 366 : 365))) return { error: `day of year "${cell(t.doy).trim()}" is not 1 to ${leap ? 366 : 365} in ${y}` };
      const date = new Date(Date.UTC(y, 0, doy));
      mo = date.getUTCMonth() + 1;
      d = date.getUTCDate();
    }
    if (t.hhmm !== undefined) {
      const tc = cell(t.hhmm);
      const tod = timeOfDayCell(tc);
      if (!tod) return { error: `time of day "${tc.trim()}" is not a time fropa reads (1305, 13:05)` };
      ({ h, mi, s } = tod);
    } else {
      if (t.hour !== undefined) {
        h = wholeNumber(cell(t.hour));
        if (!(h >= 0 && h <= 24)) return { error: `hour "${cell(t.hour).trim()}" is not 0 to 24` };
      }
      if (t.minute !== undefined) {
        mi = wholeNumber(cell(t.minute));
        if (!(mi >= 0 && mi <= 59)) return { error: `minute "${cell(t.minute).trim()}" is not 0 to 59` };
      }
    }
  }
  if (h === 24 && mi === 0 && s === 0) {
    const next = new Date(Date.UTC(y, mo - 1, d + 1));
    [y, mo, d, h] = [next.getUTCFullYear(), next.getUTCMonth() + 1, next.getUTCDate(), 0];
  }
  if (!(h >= 0 && h <= 23 && mi >= 0 && mi <= 59 && s >= 0 && s <= 59)) return { error: `time of day ${h}:${pad2(mi)} is not a valid time` };
  return { text: `${y}-${pad2(mo)}-${pad2(d)} ${pad2(h)}:${pad2(mi)}:${pad2(s)}` };
}
