/**
 * METAR/SPECI reader: text files with one report per line (optionally after an archive timestamp)
 * → Observations in canonical units, with a FileReport accounting for every line.
 * Code forms: WMO-No. 306 Manual on Codes FM 15 METAR / FM 16 SPECI; US remarks FMH-1 ch. 12.
 */
import { addIssue, emptyObservation, newFileReport, type FileReport, type Observation, type ParseIssue } from '../model/index.js';
import { archiveStampInto, civilFromDays, daysInMonth, parseMonthOption, yearMonthFromFileName, type ArchiveStamp, type MonthRef } from './metar/calendar.js';
import { decodeInto, type DecodeRef } from './metar/decodeMetar.js';
import { newMetarReport, type MetarReport } from './metar/metarReport.js';
import { decodeBytesInto } from './metar/byteMetar.js';
import { MS_PER_DAY } from '../physics/constants.js';
import { encodingOf, LineSplitter, splitWhole, type TextBlock } from './lines.js';
import { DEFAULT_TIME_WINDOW, outOfWindowMessage, type TimeWindow } from './plausible.js';

export { decodeMetar, decodeMetarAt, isParseIssue, newMetarReport } from './metar/decodeMetar.js';
export type { MetarReport, SkyLayer } from './metar/decodeMetar.js';
export { yearMonthFromFileName, reportTimeMs, daysInMonth } from './metar/calendar.js';
export type { MonthRef, NameDate } from './metar/calendar.js';
export { weatherFlags } from './metar/weather.js';

/**
 * Observation from a decoded report. Temperatures prefer the `T` remark tenths; altimeter is the `A`
 * group, or QNH (`Q`) when no `A` group was given (both are altimeter settings in hPa, ICAO Annex 3);
 * `precipMm` is the `Prrrr` hourly amount; station pressure stays NaN (it needs the elevation).
 */
export function metarToObservation(r: MetarReport, file: string, line: number): Observation {
  const o: Observation = {
    station: r.station,
    timeMs: r.timeMs,
    source: r.type,
    corrected: r.corrected,
    temperatureC: r.temperatureC,
    dewpointC: r.dewpointC,
    windDirDeg: r.windDirDeg,
    windSpeedMs: r.windSpeedMs,
    gustMs: r.gustMs,
    stationPressureHpa: NaN,
    seaLevelPressureHpa: r.seaLevelPressureHpa,
    altimeterHpa: Number.isNaN(r.altimeterHpa) ? r.qnhHpa : r.altimeterHpa,
    precipMm: r.precip1hMm,
    weather: r.weather,
    peakWindMs: r.peakWindMs,
    pressureTrend: r.pressureTrend,
    visibilityM: r.visibilityM,
    ceilingFt: r.ceilingFt,
    latDeg: NaN,
    lonDeg: NaN,
    elevationM: NaN,
    remarks: r.remarks.length ? r.remarks : undefined,
    file,
    line,
  };
  return o;
}

/** True when a line (after an optional archive stamp) begins like a METAR/SPECI report. */
function lineLooksLikeReport(s: string, start: number, end: number): boolean {
  // the stamp is ASCII: its byte length is its length in characters
  const u = Buffer.from(s.slice(start, end), 'utf8');
  const st: ArchiveStamp = { year: 0, month: 0, day: 0, next: 0 };
  let p = archiveStampInto(u, 0, u.length, st) ? start + st.next : start;
  while (p < end && s.charCodeAt(p) <= 32) p++;
  const rest = s.slice(p, Math.min(end, p + 40));
  return /^(?:(?:METAR|SPECI)\s+(?:COR\s+)?)?[A-Z][A-Z0-9]{3}\s+\d{6}Z?\s/.test(rest) || /^(?:METAR|SPECI)\s/.test(rest);
}

/**
 * Sniff a sample (the first lines of a file): true when most non-blank, non-comment lines among the
 * first 20 look like METAR/SPECI reports.
 */
export function looksLikeMetar(sample: string): boolean {
  let seen = 0;
  let hits = 0;
  let p = 0;
  while (p < sample.length && seen < 20) {
    let e = sample.indexOf('\n', p);
    if (e < 0) e = sample.length;
    let a = p;
    while (a < e && sample.charCodeAt(a) <= 32) a++;
    if (a < e && sample.charCodeAt(a) !== 35 /* # */) {
      seen++;
      if (lineLooksLikeReport(sample, a, e)) hits++;
    }
    p = e + 1;
  }
  return seen > 0 && hits * 2 > seen;
}

/**
 * Read a METAR/SPECI text file: one report per line, optionally after an archive timestamp
 * (`YYYYMMDDHHMM`, `YYYY-MM-DDTHH:MM[:SS]Z`, `YYYY-MM-DD HH:MM`); `METAR`/`SPECI` optional; `=` end mark.
 * Year and month: from the line's archive stamp; else `opts.month` (`YYYY-MM`); else a date in the file
 * name (a dated name is the first day covered; later reports follow on from the previous one, so month
 * and year ends roll over). Without any of them every report line is rejected (`no-year-month`).
 * Every non-blank line is either an Observation or a counted issue (`#` lines count as `comment`;
 * NIL reports as `nil-report`).
 */
export function readMetarText(
  text: string,
  file: string,
  opts: MetarReadOptions = {},
): { observations: Observation[]; report: FileReport; reports?: never } {
  return readMetarBytes(Buffer.from(text, 'utf8'), file, opts);
}

/** readMetarText on the file's bytes (UTF-8; the usual input: no decoding of the whole file to a string). */
export function readMetarBytes(
  bytes: Uint8Array,
  file: string,
  opts: MetarReadOptions = {},
): { observations: Observation[]; report: FileReport; reports?: never } {
  // not UTF-8 → Windows-1252 (decided on the whole buffer, as prepareText); BOM dropped; line ends (lines.ts)
  const splitter = new LineSplitter({ encoding: encodingOf(bytes) });
  const reader = new MetarReader(file, opts);
  for (const b of splitWhole(bytes, splitter)) reader.block(b);
  return reader.finish(splitter.notes());
}

/**
 * The METAR reader over blocks of whole lines (a LineSplitter's output, in order): the rules of readMetarText.
 * Without `opts.onObservation` the observations are collected.
 */
export class MetarReader {
  private readonly observations: Observation[] = [];
  private readonly scan: MetarScan;

  constructor(file: string, opts: MetarReadOptions = {}) {
    const sink = opts.onObservation;
    const window = opts.timeWindow ?? DEFAULT_TIME_WINDOW;
    if (sink) {
      const o = emptyObservation('', NaN, file, 0);
      o.remarks = undefined;
      this.scan = new MetarScan(file, opts.month, window, (r, line) => {
        fillObservation(r, line, o);
        sink(o);
      });
    } else this.scan = new MetarScan(file, opts.month, window, (r, line) => this.observations.push(metarToObservation(r, file, line)));
  }

  /** Read the lines of one block. */
  block(b: TextBlock): void {
    this.scan.block(b.bytes, b.firstLine);
  }

  /** The observations (when collected) and the file's report; `textNotes` (encoding, line ends) go first. */
  finish(textNotes: readonly string[] = []): { observations: Observation[]; report: FileReport; reports?: never } {
    const report = this.scan.finish();
    if (textNotes.length) report.notes.unshift(...textNotes);
    return { observations: this.observations, report };
  }
}

/** Options of readMetarText. */
export interface MetarReadOptions {
  /** `YYYY-MM` for reports whose lines carry no archive stamp (wins over a date in the file name). */
  month?: string;
  /**
   * Receive each observation instead of collecting them (`observations` then stays empty). The object is
   * reused for the next report: copy what you keep (e.g. `SeriesBuilder.add`); its `remarks` array is not reused.
   */
  onObservation?: (o: Observation) => void;
  /** Accepted report times (default DEFAULT_TIME_WINDOW, plausible.ts); reports outside are `time-out-of-range`. */
  timeWindow?: Readonly<TimeWindow>;
}

/** Write a decoded report into a reused Observation (the fields metarToObservation sets). */
function fillObservation(r: MetarReport, line: number, o: Observation): void {
  o.station = r.station;
  o.timeMs = r.timeMs;
  o.source = r.type;
  o.corrected = r.corrected;
  o.temperatureC = r.temperatureC;
  o.dewpointC = r.dewpointC;
  o.windDirDeg = r.windDirDeg;
  o.windSpeedMs = r.windSpeedMs;
  o.gustMs = r.gustMs;
  o.seaLevelPressureHpa = r.seaLevelPressureHpa;
  const alt = r.altimeterHpa;
  o.altimeterHpa = alt === alt ? alt : r.qnhHpa;
  o.precipMm = r.precip1hMm;
  o.weather = r.weather;
  o.peakWindMs = r.peakWindMs;
  o.pressureTrend = r.pressureTrend;
  o.visibilityM = r.visibilityM;
  o.ceilingFt = r.ceilingFt;
  o.remarks = r.remarks.length ? r.remarks : undefined;
  o.line = line;
}

/** The line loop of the METAR reader, block by block: calls `emit` with each usable report (r is reused). */
class MetarScan {
  private readonly report: FileReport;
  private unknownGroups = 0;
  // Year/month sources other than archive stamps.
  private fixed: MonthRef | null = null;
  private running: MonthRef | null = null;
  private sourceNote = '';
  private readonly r = newMetarReport();
  private readonly ref: DecodeRef;
  private readonly st: ArchiveStamp = { year: 0, month: 0, day: 0, next: 0 };
  private readonly civil: [number, number, number] = [0, 0, 0];
  private lastDay = NaN;
  private stamped = 0;
  private noYearMonth = 0;

  constructor(
    private readonly file: string,
    month: string | undefined,
    private readonly window: Readonly<TimeWindow>,
    private readonly emit: (r: MetarReport, line: number) => void,
  ) {
    this.report = newFileReport(file, 'metar');
    if (month !== undefined) {
      const m = parseMonthOption(month);
      if (!m) throw new RangeError(`month must be YYYY-MM, got "${month}"`);
      this.fixed = { year: m.year, month: m.month };
      this.sourceNote = `year and month ${month} taken from the month option`;
    } else {
      const d = yearMonthFromFileName(file);
      if (d) {
        const ym = `${d.year}-${String(d.month).padStart(2, '0')}`;
        if (d.day !== undefined) {
          this.running = { year: d.year, month: d.month, refDay: d.day, refMode: 'nearest' };
          this.sourceNote = `year and month taken from the file name (${ym}-${String(d.day).padStart(2, '0')}, read as the first day covered; month ends roll over)`;
        } else {
          this.fixed = { year: d.year, month: d.month };
          this.sourceNote = `year and month ${ym} taken from the file name`;
        }
      }
    }
    this.ref = { year: 0, month: 0, file, line: 0, refDay: undefined, refMode: undefined, column0: 0 };
  }

  /** Read the lines of `u` (whole lines, LF or CRLF ends), the first being physical line `firstLine`. */
  block(u: Uint8Array, firstLine: number): void {
    const { file, report, r, ref, st, civil, window, emit, fixed, running } = this;
    const buf = Buffer.isBuffer(u) ? u : Buffer.from(u.buffer, u.byteOffset, u.byteLength);
    let lineNo = firstLine - 1;
    let p = 0;
    const len = u.length;
    while (p <= len) {
      let e = buf.indexOf(10, p);
      if (e < 0) e = len;
      lineNo++;
      let a = p;
      let b = e;
      p = e + 1;
      while (a < b && u[a]! <= 32) a++;
      while (b > a && u[b - 1]! <= 32) b--;
      if (a === b) {
        if (e === len) break;
        continue;
      }
      report.lines++;
      if (u[a] === 35 /* # */) {
        addIssue(report, { file, line: lineNo, reason: 'comment', message: 'comment line (#) skipped' });
        continue;
      }
      ref.line = lineNo;
      ref.column0 = 0;
      const stamped1 = u[a]! <= 57 && archiveStampInto(u, a, b, st);
      let start = a;
      if (stamped1 && st.day > daysInMonth(st.year, st.month)) {
        addIssue(report, {
          file,
          line: lineNo,
          reason: 'bad-stamp',
          message: `archive stamp day ${st.day} does not exist in ${st.year}-${String(st.month).padStart(2, '0')}; fix the stamp`,
          column: 1,
        });
        continue;
      }
      if (stamped1) {
        ref.year = st.year;
        ref.month = st.month;
        ref.refDay = st.day;
        ref.refMode = 'archive';
        ref.column0 = st.next - a;
        start = st.next;
        this.stamped++;
      } else if (running) {
        ref.year = running.year;
        ref.month = running.month;
        ref.refDay = running.refDay;
        ref.refMode = 'nearest';
      } else if (fixed) {
        ref.year = fixed.year;
        ref.month = fixed.month;
        ref.refDay = undefined;
        ref.refMode = undefined;
      } else {
        this.noYearMonth++;
        addIssue(report, {
          file,
          line: lineNo,
          reason: 'no-year-month',
          message: 'no year and month for this report: pass --month YYYY-MM or use a dated file name (e.g. KORD_2024-02-27_metar.txt)',
        });
        continue;
      }
      // Common lines take the single-pass byte decoder; it gives up on anything unusual, and the line is
      // then decoded as text by the general decoder (same results either way).
      let is: ParseIssue | null = null;
      if (!decodeBytesInto(r, u, start, b, ref)) {
        // the byte decoder gives up on control bytes: a damaged line is rejected here, the rest read
        let ctl = -1;
        for (let i = a; i < b; i++) {
          const c = u[i]!;
          if ((c < 32 && c !== 9 && c !== 11 && c !== 12) || c === 127) {
            ctl = i;
            break;
          }
        }
        if (ctl >= 0) {
          addIssue(report, {
            file,
            line: lineNo,
            reason: 'control-bytes',
            message: `the line holds a ${u[ctl] === 0 ? 'NUL' : 'control'} byte at character ${ctl - a + 1} (damaged); line skipped, the rest of the file is read`,
          });
          continue;
        }
        const line = buf.toString('utf8', a, b);
        const s0 = start - a; // the stamp and the blanks before it are ASCII: byte and character offsets agree
        is = decodeInto(r, line, s0, line.length, ref, true);
      }
      if (is) {
        addIssue(report, is);
        continue;
      }
      if (!(r.timeMs >= window.fromMs && r.timeMs < window.toMs)) {
        addIssue(report, { file, line: lineNo, reason: 'time-out-of-range', message: outOfWindowMessage(r.timeMs, window) });
        continue;
      }
      this.unknownGroups += r.unknownGroups.length;
      if (r.nil) {
        addIssue(report, { file, line: lineNo, reason: 'nil-report', message: `NIL report for ${r.station}: no observation to use` });
        continue;
      }
      if (running && !stamped1) {
        const dayNo = Math.floor(r.timeMs / MS_PER_DAY);
        if (dayNo !== this.lastDay) {
          this.lastDay = dayNo;
          civilFromDays(dayNo, civil);
          running.year = civil[0];
          running.month = civil[1];
          running.refDay = civil[2];
        }
      }
      emit(r, lineNo);
      report.parsed++;
      if (e === len) break;
    }
  }

  /** The file's report, with the notes on year/month sources and unknown groups. */
  finish(): FileReport {
    const { report, stamped, sourceNote, noYearMonth, unknownGroups } = this;
    report.unknownGroups = unknownGroups;
    if (stamped > 0) report.notes.push(`year and month taken from archive timestamps on ${stamped} line(s)`);
    if (sourceNote && stamped < report.parsed + report.rejected) report.notes.push(sourceNote);
    if (noYearMonth > 0)
      report.notes.push(
        `${noYearMonth} report line(s) refused: no year/month source. Pass --month YYYY-MM or name the file with its date (YYYY-MM-DD, YYYYMMDD, YYYY-MM)`,
      );
    if (unknownGroups > 0) report.notes.push(`${unknownGroups} unrecognised group(s) kept as unknown`);
    return report;
  }
}
