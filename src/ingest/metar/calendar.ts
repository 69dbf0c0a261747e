/**
 * Year and month for METAR/SPECI reports. A report carries only day, hour and minute (WMO-No. 306,
 * FM 15, group YYGGggZ), so the year and month come from an archive timestamp in front of the
 * report, an explicit month option, or a date in the file name — across month and year ends.
 */
import { MS_PER_DAY, MS_PER_HOUR, MS_PER_MINUTE } from '../../physics/constants.js';

/** Same month first, then the previous, then the next. */
const MONTH_STEPS = [0, -1, 1] as const;

/** Reference for placing a report's day-of-month in a calendar month. */
export interface MonthRef {
  year: number;
  /** 1–12. */
  month: number;
  /** Day of month of the reference date, when known. Without it the report lies in `year`-`month`. */
  refDay?: number;
  /**
   * How a report day relates to `refDay`:
   * - `archive` (default): the reference is an archive stamp taken at or shortly after the report;
   *   the report lies from 25 days before to 3 days after it (a report day more than a few days
   *   greater than the reference day belongs to the previous month).
   * - `nearest`: the report lies within ±15 days of the reference (running reference, CSV time).
   */
  refMode?: 'archive' | 'nearest';
}

const MONTH_DAYS = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

/** Days in a month (month 1–12), proleptic Gregorian. */
export function daysInMonth(year: number, month: number): number {
  if (month === 2) return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0 ? 29 : 28;
  return MONTH_DAYS[month - 1]!;
}

/**
 * Days since 1970-01-01 of a proleptic Gregorian date (integer arithmetic, no Date object).
 * Algorithm: H. Hinnant, "chrono-Compatible Low-Level Date Algorithms", days_from_civil.
 * @example daysFromCivil(2000, 3, 1) // 11017
 */
export function daysFromCivil(y: number, m: number, d: number): number {
  y -= m <= 2 ? 1 : 0;
  const era = Math.floor(y / 400);
  const yoe = y - era * 400;
  const doy = Math.floor((153 * (m > 2 ? m - 3 : m + 9) + 2) / 5) + d - 1;
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy;
  return era * 146097 + doe - 719468;
}

/**
 * Calendar date of a day count since 1970-01-01, written into `out` = [year, month, day].
 * Algorithm: H. Hinnant, civil_from_days.
 */
export function civilFromDays(z: number, out: [number, number, number]): void {
  z += 719468;
  const era = Math.floor(z / 146097);
  const doe = z - era * 146097;
  const yoe = Math.floor((doe - Math.floor(doe / 1460) + Math.floor(doe / 36524) - Math.floor(doe / 146096)) / 365);
  const doy = doe - (365 * yoe + Math.floor(yoe / 4) - Math.floor(yoe / 100));
  const mp = Math.floor((5 * doy + 2) / 153);
  const d = doy - Math.floor((153 * mp + 2) / 5) + 1;
  const m = mp < 10 ? mp + 3 : mp - 9;
  out[0] = yoe + era * 400 + (m <= 2 ? 1 : 0);
  out[1] = m;
  out[2] = d;
}

/**
 * Epoch ms (UTC) of a report's day/hour/minute placed in the month chosen by `ref`, or NaN when the
 * day does not exist in any admissible month (e.g. day 31 next to a 30-day month with no neighbour fitting).
 * Rule: see MonthRef.refMode (common practice, no source; the example "archive stamp 2020-01-01,
 * report day 31 → 2019-12-31" is the case it exists for).
 * @example reportTimeMs(31, 23, 51, { year: 2020, month: 1, refDay: 1 }) // Date.UTC(2019, 11, 31, 23, 51)
 */
export function reportTimeMs(day: number, hour: number, minute: number, ref: MonthRef): number {
  // one-entry cache: consecutive reports usually share the reference and the day
  if (ref.year === cacheYear && ref.month === cacheMonth && ref.refDay === cacheRefDay && ref.refMode === cacheMode && day === cacheDay)
    return Number.isNaN(cacheDays) ? NaN : cacheDays * MS_PER_DAY + hour * MS_PER_HOUR + minute * MS_PER_MINUTE;
  const days = reportDays(day, ref);
  cacheYear = ref.year;
  cacheMonth = ref.month;
  cacheRefDay = ref.refDay;
  cacheMode = ref.refMode;
  cacheDay = day;
  cacheDays = days;
  return Number.isNaN(days) ? NaN : days * MS_PER_DAY + hour * MS_PER_HOUR + minute * MS_PER_MINUTE;
}

let cacheYear = NaN;
let cacheMonth = NaN;
let cacheRefDay: number | undefined = NaN;
let cacheMode: MonthRef['refMode'] = undefined;
let cacheDay = NaN;
let cacheDays = NaN;

/** Day number (days since 1970-01-01) of a report day under `ref`, NaN when impossible. */
function reportDays(day: number, ref: MonthRef): number {
  const y = ref.year;
  const m = ref.month;
  if (ref.refDay === undefined) {
    if (day > daysInMonth(y, m)) return NaN;
    return daysFromCivil(y, m, day);
  }
  const refDays = daysFromCivil(y, m, ref.refDay);
  const lo = ref.refMode === 'nearest' ? -15 : -25;
  const hi = ref.refMode === 'nearest' ? 15 : 3;
  let best = NaN;
  let bestDist = Infinity;
  for (const k of MONTH_STEPS) {
    const cy = m + k < 1 ? y - 1 : m + k > 12 ? y + 1 : y;
    const cm = m + k < 1 ? 12 : m + k > 12 ? 1 : m + k;
    if (day > daysInMonth(cy, cm)) continue;
    const days = daysFromCivil(cy, cm, day);
    const off = days - refDays;
    if (off >= lo && off <= hi) return days;
    const dist = Math.min(Math.abs(off - lo), Math.abs(off - hi));
    if (dist < bestDist) {
      bestDist = dist;
      best = days;
    }
  }
  // Outside the window in every month. An archive stamp is taken at the report: a day that fits none of
  // its months is an error (NaN), never a report a month away. A running reference (a gap of more than two
  // weeks in a dated file) takes the closest candidate.
  return ref.refMode === 'nearest' ? best : NaN;
}

/** A year, month and optional day found in a file name. */
export interface NameDate {
  year: number;
  month: number;
  day?: number;
}

function valid(y: number, m: number, d?: number): boolean {
  if (y < 1900 || y > 2100 || m < 1 || m > 12) return false;
  return d === undefined || (d >= 1 && d <= daysInMonth(y, m));
}

/**
 * First date in a file name: `YYYY-MM-DD` / `YYYY_MM_DD`, `YYYYMMDD`, `YYYY-MM` / `YYYY_MM`, `YYYYMM`
 * (digit runs must stand alone, so a station number like `72530094846` is not read as a date).
 * The date of a name is taken as the first day the file covers.
 * @example yearMonthFromFileName('KORD_2024-02-27_28_metar.txt') // { year: 2024, month: 2, day: 27 }
 */
export function yearMonthFromFileName(name: string): NameDate | null {
  const base = name.replace(/^.*[\\/]/, '');
  let m = /(?<!\d)(\d{4})([-_])(\d{2})\2(\d{2})(?!\d)/.exec(base);
  if (m && valid(+m[1]!, +m[3]!, +m[4]!)) return { year: +m[1]!, month: +m[3]!, day: +m[4]! };
  m = /(?<!\d)(\d{4})(\d{2})(\d{2})(?!\d)/.exec(base);
  if (m && valid(+m[1]!, +m[2]!, +m[3]!)) return { year: +m[1]!, month: +m[2]!, day: +m[3]! };
  m = /(?<!\d)(\d{4})[-_](\d{2})(?![\d])/.exec(base);
  if (m && valid(+m[1]!, +m[2]!)) return { year: +m[1]!, month: +m[2]! };
  m = /(?<!\d)(\d{4})(\d{2})(?!\d)/.exec(base);
  if (m && valid(+m[1]!, +m[2]!)) return { year: +m[1]!, month: +m[2]! };
  return null;
}

/** Parse a `--month` option `YYYY-MM`; null when malformed. */
export function parseMonthOption(s: string): NameDate | null {
  const m = /^(\d{4})-(\d{2})$/.exec(s.trim());
  if (!m || !valid(+m[1]!, +m[2]!)) return null;
  return { year: +m[1]!, month: +m[2]! };
}

/** An archive timestamp found at the start of a line. */
export interface ArchiveStamp {
  year: number;
  month: number;
  day: number;
  /** Index in the line where the report text starts (after the stamp and blanks). */
  next: number;
}

const D0 = 48;
/** Digit value of u[i], or -1000 (so that sums with a non-digit go negative). */
function dgAt(u: Uint8Array, i: number): number {
  const c = u[i]! - D0;
  return c >= 0 && c <= 9 ? c : -1000;
}

/**
 * Archive timestamp at `start` of a line of bytes: `YYYYMMDDHHMM` (12 digits), `YYYY-MM-DDTHH:MM[:SS][.fff][Z]`
 * or `YYYY-MM-DD HH:MM[:SS]`, followed by a blank or comma; false when there is none (allocation-free hot
 * path: the result goes into `out`).
 */
export function archiveStampInto(u: Uint8Array, start: number, end: number, out: ArchiveStamp): boolean {
  if (end - start < 13) return false;
  const y = dgAt(u, start) * 1000 + dgAt(u, start + 1) * 100 + dgAt(u, start + 2) * 10 + dgAt(u, start + 3);
  if (y < 0) return false;
  let month: number;
  let day: number;
  let p: number;
  if (u[start + 4] === 45) {
    if (u[start + 7] !== 45) return false;
    month = dgAt(u, start + 5) * 10 + dgAt(u, start + 6);
    day = dgAt(u, start + 8) * 10 + dgAt(u, start + 9);
    const sep = u[start + 10];
    if (sep !== 84 && sep !== 32) return false;
    if (dgAt(u, start + 11) < 0 || dgAt(u, start + 12) < 0 || u[start + 13] !== 58) return false;
    if (dgAt(u, start + 14) < 0 || dgAt(u, start + 15) < 0) return false;
    p = start + 16;
    if (u[p] === 58) p += 3;
    if (u[p] === 46) {
      p++;
      while (p < end && dgAt(u, p) >= 0) p++;
    }
    if (u[p] === 90) p++;
  } else {
    for (let i = 4; i < 12; i++) if (dgAt(u, start + i) < 0) return false;
    month = dgAt(u, start + 4) * 10 + dgAt(u, start + 5);
    day = dgAt(u, start + 6) * 10 + dgAt(u, start + 7);
    p = start + 12;
  }
  if (!(month >= 1 && month <= 12 && day >= 1 && day <= 31)) return false;
  const c = u[p];
  if (!(c === 32 || c === 9 || c === 44)) return false;
  while (p < end) {
    const q = u[p];
    if (q !== 32 && q !== 9 && q !== 44) break;
    p++;
  }
  out.year = y;
  out.month = month;
  out.day = day;
  out.next = p;
  return true;
}
