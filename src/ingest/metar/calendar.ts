/**
 * Year and month for METAR/SPECI reports. A report carries only day, hour and minute (WMO-No. 306,
 * FM 15, group YYGGggZ), so the year and month come from an archive timestamp in front of the
 * report, an explicit month option, or a date in the file name — across month and year ends.
 */

const DAY_MS = 86_400_000;
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

/** Days in a month (month 1–12), proleptic Gregorian. */
export function daysInMonth(year: number, month: number): number {
  return new Date(Date.UTC(year, month, 0)).getUTCDate();
}

/**
 * Epoch ms (UTC) of a report's day/hour/minute placed in the month chosen by `ref`, or NaN when the
 * day does not exist in any admissible month (e.g. day 31 next to a 30-day month with no neighbour fitting).
 * Rule: see MonthRef.refMode (common practice, no source; the example "archive stamp 2020-01-01,
 * report day 31 → 2019-12-31" is the case it exists for).
 * @example reportTimeMs(31, 23, 51, { year: 2020, month: 1, refDay: 1 }) // Date.UTC(2019, 11, 31, 23, 51)
 */
export function reportTimeMs(day: number, hour: number, minute: number, ref: MonthRef): number {
  const y = ref.year;
  const m = ref.month;
  if (ref.refDay === undefined) {
    if (day > daysInMonth(y, m)) return NaN;
    return Date.UTC(y, m - 1, day, hour, minute);
  }
  const refMs = Date.UTC(y, m - 1, ref.refDay);
  const lo = ref.refMode === 'nearest' ? -15 : -25;
  const hi = ref.refMode === 'nearest' ? 15 : 3;
  let best = NaN;
  let bestDist = Infinity;
  for (const k of MONTH_STEPS) {
    const cy = m + k < 1 ? y - 1 : m + k > 12 ? y + 1 : y;
    const cm = m + k < 1 ? 12 : m + k > 12 ? 1 : m + k;
    if (day > daysInMonth(cy, cm)) continue;
    const dayMs = Date.UTC(cy, cm - 1, day);
    const off = (dayMs - refMs) / DAY_MS;
    if (off >= lo && off <= hi) return dayMs + hour * 3_600_000 + minute * 60_000;
    const dist = Math.min(Math.abs(off - lo), Math.abs(off - hi));
    if (dist < bestDist) {
      bestDist = dist;
      best = dayMs + hour * 3_600_000 + minute * 60_000;
    }
  }
  // Outside the window in every month (a gap of more than two weeks): the closest candidate.
  return best;
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
function dg(s: string, i: number): number {
  const c = s.charCodeAt(i) - D0;
  return c >= 0 && c <= 9 ? c : -1000;
}

/**
 * Archive timestamp at `start` of a line: `YYYYMMDDHHMM` (12 digits), `YYYY-MM-DDTHH:MM[:SS][Z]` or
 * `YYYY-MM-DD HH:MM[:SS]`, followed by a blank; null when there is none. Charcode scanning (hot path).
 */
export function archiveStamp(s: string, start: number, end: number): ArchiveStamp | null {
  if (end - start < 13) return null;
  const y = dg(s, start) * 1000 + dg(s, start + 1) * 100 + dg(s, start + 2) * 10 + dg(s, start + 3);
  if (y < 0) return null;
  let month: number;
  let day: number;
  let p: number;
  const c4 = s.charCodeAt(start + 4);
  if (c4 === 45 /* - */) {
    if (s.charCodeAt(start + 7) !== 45) return null;
    month = dg(s, start + 5) * 10 + dg(s, start + 6);
    day = dg(s, start + 8) * 10 + dg(s, start + 9);
    const sep = s.charCodeAt(start + 10);
    if (sep !== 84 /* T */ && sep !== 32) return null;
    // HH:MM
    if (dg(s, start + 11) < 0 || dg(s, start + 12) < 0 || s.charCodeAt(start + 13) !== 58) return null;
    if (dg(s, start + 14) < 0 || dg(s, start + 15) < 0) return null;
    p = start + 16;
    if (s.charCodeAt(p) === 58) p += 3; // :SS
    if (s.charCodeAt(p) === 46) { // .fff
      p++;
      while (p < end && dg(s, p) >= 0) p++;
    }
    if (s.charCodeAt(p) === 90 /* Z */) p++;
  } else {
    for (let i = 4; i < 12; i++) if (dg(s, start + i) < 0) return null;
    month = dg(s, start + 4) * 10 + dg(s, start + 5);
    day = dg(s, start + 6) * 10 + dg(s, start + 7);
    p = start + 12;
  }
  if (!(month >= 1 && month <= 12 && day >= 1 && day <= 31)) return null;
  const c = s.charCodeAt(p);
  if (!(c === 32 || c === 9 || c === 44 /* , */)) return null;
  while (p < end) {
    const q = s.charCodeAt(p);
    if (q !== 32 && q !== 9 && q !== 44) break;
    p++;
  }
  return { year: y, month, day, next: p };
}
