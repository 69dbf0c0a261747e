/**
 * METAR/SPECI decoder (WMO-No. 306, Manual on Codes, FM 15 METAR / FM 16 SPECI; US practice and
 * remarks per FMH-1 ch. 12). Hand-written char-code tokenizer: no regular expression runs per group.
 * A report decodes into a MetarReport, or into a ParseIssue when it has no usable station and time.
 * Unknown or cut-off groups are kept in `unknownGroups` and never abort a report.
 */
import { WX, type ParseIssue } from '../../model/index.js';
import { reportTimeMs, type MonthRef } from './calendar.js';
import { asciiBytes } from './ascii.js';
import { asciiView, compassSuffix, dg, digits, isWord, k3, kw, noCeiling, pressureGroup, skyGroup, slashes, statuteMiles, tempGroup, windGroup } from './groups.js';
import { decodeRemarks } from './remarks.js';
import { STATUTE_MILE_M } from '../../physics/constants.js';
import { weatherFlagsAt } from './weather.js';
import { newMetarReport, resetReport, unknown, type MetarReport } from './metarReport.js';

/** @deprecated Re-exported for old import paths; the report record lives in ./metarReport.ts. */
export { newMetarReport, resetReport, unknown, type MetarReport, type SkyLayer } from './metarReport.js';

// ---------------------------------------------------------------------------------------------
// Tokens: start/end indices of blank-separated groups, kept in module-level buffers (no substrings).

/** Token start/end indices (shared buffers; valid until the next tokenize call). */
export let tokStart = new Int32Array(256);
export let tokEnd = new Int32Array(256);

function tokenize(s: string, start: number, end: number): number {
  let n = 0;
  let p = start;
  let ts = tokStart;
  let te = tokEnd;
  while (p < end) {
    let c = s.charCodeAt(p);
    while (c <= 32 && p < end) c = s.charCodeAt(++p);
    if (p >= end) break;
    const a = p;
    while (p < end && s.charCodeAt(p) > 32) p++;
    let b = p;
    let last = false;
    if (s.charCodeAt(b - 1) === 61 /* = */) {
      b--;
      last = true;
    }
    if (b > a) {
      if (n === ts.length) {
        const ns = new Int32Array(n * 2);
        ns.set(ts);
        tokStart = ts = ns;
        const ne = new Int32Array(n * 2);
        ne.set(te);
        tokEnd = te = ne;
      }
      ts[n] = a;
      te[n] = b;
      n++;
    }
    if (last) break;
  }
  return n;
}

const K_RMK = kw('RMK');

/** Tokens that end the observed part: trend forecasts (FM 15 §15.14). Their groups are skipped up to RMK. */
function isTrend(u: Uint8Array, a: number, b: number): boolean {
  return isWord(u, a, b, 'BECMG') || isWord(u, a, b, 'TEMPO');
}

// ---------------------------------------------------------------------------------------------

/** Interned station ids by base-37 key (ids of 3–5 letters/digits are unique keys). */
const STATION_IDS = new Map<number, string>();

/**
 * Code words that can stand where the station group belongs when a report lost it (`METAR AUTO 301451Z`,
 * `KORD` cut off): report modifiers, sky and station-type groups, remark and trend keywords (WMO-No. 306
 * FM 15 §15.1–15.9 and code table 4678 words; FMH-1 §12.6 AUTO/AO1/AO2). Never read as a station id.
 */
export const NOT_STATION_IDS = ['METAR', 'SPECI', 'COR', 'AUTO', 'NIL', 'CLR', 'SKC', 'NSC', 'NCD', 'CAVOK', 'RMK', 'AO1', 'AO2', 'AO1A', 'AO2A', 'NOSIG', 'TEMPO', 'BECMG', 'VRB', 'FEW', 'SCT', 'BKN', 'OVC'];

/** base-37 key of an id as decodeInto and the byte decoder compute it. */
function stationKey(id: string): number {
  let key = id.charCodeAt(0) - 54;
  for (let k = 1; k < id.length; k++) {
    const q = id.charCodeAt(k);
    key = key * 37 + (q >= 65 ? q - 54 : q - 47);
  }
  return key;
}

const NOT_STATION_KEYS = new Set(NOT_STATION_IDS.map(stationKey));

/** True when a base-37 station key is one of NOT_STATION_IDS. */
export function isNotStationKey(key: number): boolean {
  return NOT_STATION_KEYS.has(key);
}

/** The interned station id of a base-37 key, if seen before. */
export function knownStation(key: number): string | undefined {
  return STATION_IDS.get(key);
}

/** Interned station id for s[a, b) whose base-37 key is `key` (as decodeInto computes it). */
export function internStation(s: string, a: number, b: number, key: number): string {
  let id = STATION_IDS.get(key);
  if (id === undefined) {
    if (STATION_IDS.size > 200_000) STATION_IDS.clear();
    id = s.slice(a, b);
    STATION_IDS.set(key, id);
  }
  return id;
}

/** Where a report sits and how to date it. */
export interface DecodeRef extends MonthRef {
  file: string;
  line: number;
  /** Index in the line where `text` starts, to report 1-based columns against the line. */
  column0?: number;
}

function issue(ref: DecodeRef, reason: string, message: string, s: string, a: number, b: number, start: number): ParseIssue {
  const is: ParseIssue = { file: ref.file, line: ref.line, reason, message };
  if (b > a) {
    is.group = s.slice(a, b);
    is.column = a - start + 1 + (ref.column0 ?? 0);
  }
  return is;
}

/**
 * Decode the report in s[start, end) into `r` (reset first). Returns null on success, else the issue.
 * `lite` skips the string/object parts (weatherCodes, sky, rvr) that an Observation does not carry.
 */
export function decodeInto(
  r: MetarReport,
  s: string,
  start: number,
  end: number,
  ref: DecodeRef,
  lite: boolean,
): ParseIssue | null {
  resetReport(r);
  const n = tokenize(s, start, end);
  const u = asciiView(s, end); // the same characters as bytes, for the group decoders
  if (n === 0) return issue(ref, 'empty', 'empty report', s, 0, 0, start);
  const TS = tokStart;
  const TE = tokEnd;
  let i = 0;
  let a = TS[0]!;
  let b = TE[0]!;
  let keyword = false;
  if (isWord(u, a, b, 'METAR')) keyword = true;
  else if (isWord(u, a, b, 'SPECI')) {
    keyword = true;
    r.type = 'SPECI';
  }
  if (keyword) i++;
  if (i < n && isWord(u, TS[i]!, TE[i]!, 'COR')) {
    r.corrected = true;
    i++;
  }
  // Station: ICAO location indicator, 4 letters/digits starting with a letter (3–5 accepted).
  if (i >= n) return issue(ref, 'no-station', 'report has no station identifier after METAR/SPECI', s, a, b, start);
  a = TS[i]!;
  b = TE[i]!;
  {
    const len = b - a;
    let ok = len >= 3 && len <= 5;
    const c = s.charCodeAt(a);
    if (!(c >= 65 && c <= 90)) ok = false;
    // base-37 key of the id: interns station strings without allocating a substring per report
    let key = c - 54;
    for (let k = a + 1; ok && k < b; k++) {
      const q = s.charCodeAt(k);
      if (q >= 65 && q <= 90) key = key * 37 + (q - 54);
      else if (q >= 48 && q <= 57) key = key * 37 + (q - 47);
      else ok = false;
    }
    if (ok && NOT_STATION_KEYS.has(key))
      return issue(ref, 'no-station', `"${s.slice(a, b)}" stands where the station identifier belongs; the report lost its station group`, s, a, b, start);
    if (ok) {
      let id = STATION_IDS.get(key);
      if (id === undefined) {
        if (STATION_IDS.size > 200_000) STATION_IDS.clear();
        id = s.slice(a, b);
        STATION_IDS.set(key, id);
      }
      r.station = id;
    }
    if (!ok) {
      if (!keyword && i === 0)
        return issue(ref, 'not-a-report', 'line does not start with METAR, SPECI or a station identifier; is this a METAR file?', s, a, b, start);
      return issue(ref, 'no-station', `"${s.slice(a, b)}" is not a station identifier (4-letter ICAO id expected)`, s, a, b, start);
    }
  }
  i++;
  // Time DDHHMMZ (FM 15 YYGGggZ).
  if (i >= n) return issue(ref, 'no-time', `report for ${r.station} has no DDHHMMZ time group`, s, a, b, start);
  a = TS[i]!;
  b = TE[i]!;
  {
    const len = b - a;
    const zOk = (len === 7 && s.charCodeAt(a + 6) === 90) || len === 6;
    const day = dg(u, a) * 10 + dg(u, a + 1);
    const hh = dg(u, a + 2) * 10 + dg(u, a + 3);
    const mm = dg(u, a + 4) * 10 + dg(u, a + 5);
    if (!zOk || day < 0 || hh < 0 || mm < 0)
      return issue(ref, 'no-time', `expected the DDHHMMZ time group after ${r.station}`, s, a, b, start);
    if (day < 1 || day > 31 || hh > 24 || mm > 59 || (hh === 24 && mm !== 0))
      return issue(ref, 'bad-time', `time group ${s.slice(a, b)} is not a valid day/hour/minute`, s, a, b, start);
    r.timeMs = reportTimeMs(day, hh, mm, ref);
    if (Number.isNaN(r.timeMs))
      return issue(ref, 'bad-time', `day ${day} does not exist in ${ref.year}-${String(ref.month).padStart(2, '0')} or next to it; check --month`, s, a, b, start);
  }
  i++;
  // Body groups.
  let visSet = false;
  let trend = false;
  for (; i < n; i++) {
    a = TS[i]!;
    b = TE[i]!;
    const len = b - a;
    const c0 = s.charCodeAt(a);
    if (len === 3 && k3(u, a) === K_RMK) {
      decodeRemarks(s, u, TS, TE, i + 1, n, r, ref.file, ref.line, lite);
      i = n;
      break;
    }
    if (trend) continue;
    if (c0 >= 48 && c0 <= 57) {
      // digit first: wind, variable wind, visibility, temperature
      if (windGroup(u, a, b, r)) continue;
      if (len === 7 && s.charCodeAt(a + 3) === 86 /* V */) {
        const x = digits(u, a, a + 3);
        const y = digits(u, a + 4, b);
        if (x >= 0 && y >= 0 && x <= 360 && y <= 360) {
          r.windVarFromDeg = x;
          r.windVarToDeg = y;
          continue;
        }
      }
      if (len >= 4 && len <= 7) {
        const v = digits(u, a, a + 4);
        if (v >= 0 && (len === 4 || compassSuffix(u, a + 4, b))) {
          if (!visSet) {
            r.visibilityM = v === 9999 ? 10000 : v;
            visSet = true;
          }
          continue;
        }
      }
      const cl = s.charCodeAt(b - 1);
      if (cl === 77 /* M */ && s.charCodeAt(b - 2) === 83 /* S */) {
        const miles = statuteMiles(u, a, b);
        if (!Number.isNaN(miles)) {
          r.visibilityM = miles * STATUTE_MILE_M;
          visSet = true;
          continue;
        }
      }
      if (len <= 2 && i + 1 < n) {
        // whole miles followed by a fraction: `1 1/2SM`
        const na = TS[i + 1]!;
        const nb = TE[i + 1]!;
        if (s.charCodeAt(nb - 1) === 77 && s.charCodeAt(nb - 2) === 83) {
          const whole = digits(u, a, b);
          const frac = statuteMiles(u, na, nb);
          if (whole >= 0 && frac < 1) {
            r.visibilityM = (whole + frac) * STATUTE_MILE_M;
            visSet = true;
            i++;
            continue;
          }
        }
      }
      if ((len === 5 || len === 6) && i + 1 < n) {
        // wind group split from its unit, `04015 KT` (seen in real archives)
        const na = TS[i + 1]!;
        const nb = TE[i + 1]!;
        if (isWord(u, na, nb, 'KT') || isWord(u, na, nb, 'MPS') || isWord(u, na, nb, 'KMH')) {
          const joined = s.slice(a, b) + s.slice(na, nb);
          if (windGroup(asciiBytes(joined), 0, joined.length, r)) {
            i++;
            continue;
          }
        }
      }
      if (tempGroup(u, a, b, r)) continue;
      unknown(r, s, a, b);
      continue;
    }
    switch (c0) {
      case 77: // M: M1/4SM, M05/M07
        if (s.charCodeAt(b - 1) === 77 && s.charCodeAt(b - 2) === 83) {
          const miles = statuteMiles(u, a, b);
          if (!Number.isNaN(miles)) {
            r.visibilityM = miles * STATUTE_MILE_M;
            visSet = true;
            continue;
          }
        }
        if (tempGroup(u, a, b, r)) continue;
        break;
      case 80: // P: P6SM
        if (s.charCodeAt(b - 1) === 77 && s.charCodeAt(b - 2) === 83) {
          const miles = statuteMiles(u, a, b);
          if (!Number.isNaN(miles)) {
            r.visibilityM = miles * STATUTE_MILE_M;
            visSet = true;
            continue;
          }
        }
        break;
      case 47: // '/': missing groups
        if (windGroup(u, a, b, r)) continue;
        if (len === 4 && slashes(u, a, b)) {
          visSet = true;
          continue;
        }
        if (skyGroup(u, a, b, r, lite)) continue;
        if (weatherFlagsAt(u, a, b) >= 0) continue;
        if (tempGroup(u, a, b, r)) continue;
        break;
      case 86: // V: VRB wind, VV sky, VC weather
        if (windGroup(u, a, b, r)) continue;
        if (skyGroup(u, a, b, r, lite)) continue;
        break;
      case 67: // C: CAVOK, COR, CCA.., CLR
        if (isWord(u, a, b, 'CAVOK')) {
          r.cavok = true;
          r.visibilityM = 10000;
          noCeiling(r);
          visSet = true;
          continue;
        }
        if (isWord(u, a, b, 'COR') || (len === 3 && s.charCodeAt(a + 1) === 67)) {
          r.corrected = true;
          continue;
        }
        break;
      case 65: // A: AUTO, Ahhhh, AO2 (remarks without RMK)
        if (isWord(u, a, b, 'AUTO')) {
          r.auto = true;
          continue;
        }
        if (pressureGroup(u, a, b, r)) continue;
        if (len >= 3 && s.charCodeAt(a + 1) === 79 /* O */) {
          decodeRemarks(s, u, TS, TE, i, n, r, ref.file, ref.line, lite);
          i = n;
          continue;
        }
        break;
      case 81: // Q
        if (pressureGroup(u, a, b, r)) continue;
        break;
      case 78: // N: NIL, NOSIG, NSC, NCD, NSW
        if (isWord(u, a, b, 'NIL')) {
          r.nil = true;
          continue;
        }
        if (isWord(u, a, b, 'NOSIG')) continue;
        break;
      case 82: // R: RVR, recent weather RE..
        if (len >= 5 && dg(u, a + 1) >= 0 && s.indexOf('/', a) < b && s.indexOf('/', a) > 0) {
          if (!lite) r.rvr.push(s.slice(a, b));
          continue;
        }
        if (len >= 4 && s.charCodeAt(a + 1) === 69 /* E */ && weatherFlagsAt(u, a + 2, b) >= 0) continue;
        break;
      case 84: // T: TEMPO
        if (isTrend(u, a, b)) {
          trend = true;
          continue;
        }
        break;
      case 66: // B: BECMG
        if (isTrend(u, a, b)) {
          trend = true;
          continue;
        }
        break;
      case 87: // W: WS (wind shear, FM 15 §15.13.3), sea state Wxx/Sx
        if (isWord(u, a, b, 'WS')) {
          while (i + 1 < n && (isWord(u, TS[i + 1]!, TE[i + 1]!, 'ALL') || isWord(u, TS[i + 1]!, TE[i + 1]!, 'RWY') || s.charCodeAt(TS[i + 1]!) === 82)) i++;
          continue;
        }
        if (len >= 5 && dg(u, a + 1) >= 0 && s.indexOf('/', a) < b && s.indexOf('/', a) > 0) continue;
        break;
      case 83: // S: SLP (remarks without RMK)
        if (len >= 5 && s.charCodeAt(a + 1) === 76 && s.charCodeAt(a + 2) === 80) {
          decodeRemarks(s, u, TS, TE, i, n, r, ref.file, ref.line, lite);
          i = n;
          continue;
        }
        break;
      case 36: // $ maintenance
        if (len === 1) {
          r.maintenance = true;
          continue;
        }
        break;
    }
    // Letters: sky or present weather.
    if (skyGroup(u, a, b, r, lite)) continue;
    const wf = weatherFlagsAt(u, a, b);
    if (wf >= 0) {
      r.weather |= wf;
      if (!lite) r.weatherCodes.push(s.slice(a, b));
      continue;
    }
    unknown(r, s, a, b);
  }
  return null;
}


/**
 * Decode one METAR/SPECI report (text starts at METAR/SPECI or the station; no archive prefix).
 * Year and month come from `ref`; with `refDay` the report day is placed relative to it
 * (see MonthRef). Returns a ParseIssue (`empty`, `not-a-report`, `no-station`, `no-time`, `bad-time`)
 * when the report has no usable station and time.
 * @example decodeMetar('KSFO 240156Z 26016G22KT 9SM BKN012 13/08 A3006', { year: 2024, month: 1, file: 'x', line: 1 })
 */
export function decodeMetar(
  text: string,
  ref: { year: number; month: number; file: string; line: number; refDay?: number; refMode?: 'archive' | 'nearest' },
): MetarReport | ParseIssue {
  const r = newMetarReport();
  const is = decodeInto(r, text, 0, text.length, ref, false);
  return is ?? r;
}

/**
 * Decode a raw report whose observation time is already known (e.g. the `metar` column of an
 * archive CSV next to its `valid` time): year and month come from `timeMs`, the report's own
 * DDHHMM gives the time (placed within ±15 days of `timeMs`).
 */
export function decodeMetarAt(text: string, timeMs: number, file: string, line: number): MetarReport | ParseIssue {
  if (!Number.isFinite(timeMs))
    return { file, line, reason: 'no-time', message: 'observation time is missing; cannot date the METAR text' };
  const d = new Date(timeMs);
  return decodeMetar(text, {
    year: d.getUTCFullYear(),
    month: d.getUTCMonth() + 1,
    refDay: d.getUTCDate(),
    refMode: 'nearest',
    file,
    line,
  });
}

/** True for a ParseIssue returned in place of a report. */
export function isParseIssue(x: MetarReport | ParseIssue): x is ParseIssue {
  return (x as ParseIssue).reason !== undefined;
}
