/**
 * NCEI global-hourly CSV (the Integrated Surface Database, ISD, as the NCEI access service writes it: one
 * quoted CSV row per report, `STATION,DATE,SOURCE,LATITUDE,LONGITUDE,ELEVATION,NAME,REPORT_TYPE,
 * CALL_SIGN,QUALITY_CONTROL,WND,CIG,VIS,TMP,DEW,SLP,...,REM`) → Observations in canonical units.
 *
 * The measurements are packed fields, decoded per the "Federal Climate Complex Data Documentation for
 * Integrated Surface Data" (NCEI ISD format document), mandatory data section and additional data section:
 * - `WND` = direction (deg, 999 missing), its quality code, type code (`C` calm, `V` variable, `9` missing),
 *   speed (m/s, scale factor 10, 9999 missing), its quality code: `270,1,N,0046,1` = 270° 4.6 m/s.
 * - `TMP`, `DEW` = signed °C with scale factor 10 (+9999 missing) and a quality code: `-0017,1` = −1.7 °C.
 * - `SLP` = sea-level pressure, hPa with scale factor 10 (99999 missing), and a quality code.
 * - `MA1` = altimeter setting (hPa ×10, 99999 missing), its quality, station pressure (hPa ×10), its quality.
 * - `AA1` = liquid precipitation: period (hours, 99 missing), depth (mm ×10, 9999 missing), condition,
 *   quality; used only for a one-hour period.
 * - `OC1` = wind gust (m/s ×10, 9999 missing), quality.
 * - `VIS` = visibility distance (m, 999999 missing), its quality code, variability code, its quality code.
 * - `CIG` = ceiling height (m, 99999 missing, 22000 unlimited: no ceiling, +Infinity), its quality code, determination code,
 *   CAVOK code; the format document defines it as the lowest layer with 5/8 or more sky cover (broken or overcast) or an
 *   obscuration, the FMH-1 ceiling; converted to feet (÷ 0.3048). The sky-cover layers `GA1`…/`GD1`… are not read.
 * Quality codes: 0/1/4/5 passed (4, 5: NCEI data source), 2/6 suspect, 3/7 erroneous, 9 missing, letters are
 * other-source flags (A, C, I, M, P, R, U: kept). Erroneous values are read as missing and counted; suspect
 * values are kept and counted. `DATE` is UTC (the format document: "GMT").
 * `REPORT_TYPE` `FM-15`/`FM-16` → source METAR/SPECI; `SOD  `/`SOM  ` (daily and monthly summaries) rows are
 * rejected as `summary-row`. `CALL_SIGN` (when not `99999`) is the station id, else `STATION`.
 * Every line is parsed, or rejected with file, line and reason; bad packed values are counted per field.
 */
import Papa from 'papaparse';
import { addIssue, emptyObservation, newFileReport, type FileReport, type Observation } from '../model/index.js';
import { FOOT_M } from '../physics/constants.js';

export interface IsdResult {
  report: FileReport;
  /** Station positions from the LATITUDE/LONGITUDE/ELEVATION columns. */
  stationsSeen: Map<string, { latDeg: number; lonDeg: number; elevationM: number }>;
  /** Value counts keyed `reason:field` (e.g. `erroneous:temperature`). */
  valueCounts: Record<string, number>;
}

/** True when a header row is the NCEI global-hourly layout (STATION, DATE and the packed WND and TMP fields). */
export function isIsdHeaders(headers: readonly string[]): boolean {
  const h = new Set(headers.map((x) => x.trim().replace(/^\uFEFF/, '').replace(/^"|"$/g, '').toUpperCase()));
  return h.has('STATION') && h.has('DATE') && h.has('WND') && h.has('TMP');
}

/** A packed numeric part: the number divided by `scale`, or NaN when it is the missing code (all 9s after the sign). */
function packedNumber(text: string | undefined, scale: number): number {
  if (text === undefined) return NaN;
  const t = text.trim();
  if (!/^[+-]?\d+$/.test(t)) return NaN;
  if (/^[+-]?9+$/.test(t)) return NaN;
  return Number(t) / scale;
}

type Quality = 'ok' | 'suspect' | 'erroneous' | 'missing';

/** ISD quality code → what fropa does with the value (format document, quality code table). */
export function isdQuality(code: string | undefined): Quality {
  switch ((code ?? '').trim()) {
    case '2':
    case '6':
      return 'suspect';
    case '3':
    case '7':
      return 'erroneous';
    case '9':
      return 'missing';
    default:
      return 'ok';
  }
}

/**
 * Decode a packed `WND` field: [direction deg, speed m/s]; direction NaN when calm, variable or missing.
 * @example decodeIsdWind('270,1,N,0046,1') // { dirDeg: 270, speedMs: 4.6, ... }
 */
export function decodeIsdWind(text: string): { dirDeg: number; speedMs: number; dirQuality: Quality; speedQuality: Quality; type: string } {
  const p = text.split(',');
  const type = (p[2] ?? '').trim();
  let dirDeg = packedNumber(p[0], 1);
  const speedMs = packedNumber(p[3], 10);
  if (type === 'C' || type === 'V' || !(dirDeg >= 0 && dirDeg <= 360)) dirDeg = NaN;
  return { dirDeg, speedMs: type === 'C' && !(speedMs === speedMs) ? 0 : speedMs, dirQuality: isdQuality(p[1]), speedQuality: isdQuality(p[4]), type };
}

/**
 * Decode a packed value-and-quality field (`TMP`, `DEW`: scale 10; `SLP`: scale 10).
 * @example decodeIsdValue('-0017,1', 10) // { value: -1.7, quality: 'ok' }
 */
export function decodeIsdValue(text: string, scale: number): { value: number; quality: Quality } {
  const p = text.split(',');
  return { value: packedNumber(p[0], scale), quality: isdQuality(p[1]) };
}

/** Read an NCEI global-hourly CSV text (see the module comment). */
export function readIsdText(text: string, file: string, onObservation?: (o: Observation) => void): IsdResult & { observations: Observation[] } {
  const report = newFileReport(file, 'isd');
  const observations: Observation[] = [];
  const emit = onObservation ?? ((o: Observation) => observations.push(o));
  const stationsSeen = new Map<string, { latDeg: number; lonDeg: number; elevationM: number }>();
  const counters = new Map<string, { count: number; line: number; example: string }>();
  const count = (reason: string, field: string, line: number, example: string) => {
    const k = `${reason}:${field}`;
    const c = counters.get(k);
    if (c) c.count++;
    else counters.set(k, { count: 1, line, example });
  };
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const parsed = Papa.parse<string[]>(body, { header: false, skipEmptyLines: false, dynamicTyping: false, delimiter: ',' });
  const rows = parsed.data;
  const badQuotes = new Set<number>();
  for (const e of parsed.errors) if (e.row !== undefined && (e.code === 'MissingQuotes' || e.code === 'InvalidQuotes')) badQuotes.add(e.row);
  let header: string[] | null = null;
  const col: Record<string, number> = {};
  const get = (row: string[], name: string): string | undefined => (col[name] === undefined ? undefined : row[col[name]!]);
  for (let r = 0; r < rows.length; r++) {
    const row = rows[r]!;
    const line = r + 1;
    if (row.length === 1 && row[0]!.trim() === '') continue;
    report.lines++;
    if (header === null) {
      header = row.map((h) => h.trim().toUpperCase());
      header.forEach((h, i) => (col[h] = i));
      report.columns = {};
      for (const [h, f] of [['DATE', 'time'], ['STATION', 'station'], ['CALL_SIGN', 'station'], ['WND', 'windDir+windSpeed'], ['TMP', 'temperature'], ['DEW', 'dewpoint'], ['SLP', 'seaLevelPressure'], ['MA1', 'altimeter+stationPressure'], ['AA1', 'precip'], ['OC1', 'gust'], ['VIS', 'visibility'], ['CIG', 'ceiling'], ['LATITUDE', 'lat'], ['LONGITUDE', 'lon'], ['ELEVATION', 'elevation']] as const) {
        if (col[h] !== undefined) report.columns[h] = f;
      }
      report.units = { temperature: 'degC', dewpoint: 'degC', windSpeed: 'm/s', windDir: 'deg', seaLevelPressure: 'hPa' };
      report.notes.push('NCEI global-hourly (ISD) layout: packed fields decoded per the ISD format document; DATE is UTC');
      report.stationIdRule = 'CALL_SIGN column, else STATION';
      continue;
    }
    if (badQuotes.has(r)) {
      addIssue(report, { file, line, reason: 'bad-quotes', message: 'unbalanced quotes; fix the quoting in the file' });
      continue;
    }
    if (row.length < header.length) {
      addIssue(report, { file, line, reason: 'truncated', message: `line has ${row.length} of ${header.length} fields; the file may be cut short or the row damaged` });
      continue;
    }
    const type = (get(row, 'REPORT_TYPE') ?? '').trim().toUpperCase();
    if (type === 'SOD' || type === 'SOM') {
      addIssue(report, { file, line, reason: 'summary-row', message: `report type ${type} is a daily/monthly summary, not an observation`, group: type });
      continue;
    }
    const dateText = (get(row, 'DATE') ?? '').trim();
    const m = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})(?::(\d{2}))?$/.exec(dateText);
    const timeMs = m ? Date.UTC(+m[1]!, +m[2]! - 1, +m[3]!, +m[4]!, +m[5]!, m[6] ? +m[6] : 0) : NaN;
    if (!m || !(+m[2]! >= 1 && +m[2]! <= 12 && +m[3]! >= 1 && +m[3]! <= 31 && +m[4]! <= 23 && +m[5]! <= 59) || new Date(timeMs).getUTCDate() !== +m[3]!) {
      addIssue(report, { file, line, reason: dateText === '' ? 'no-time' : 'bad-time', message: `DATE "${dateText}" is not an ISD time (YYYY-MM-DDTHH:MM:SS, UTC); the line is skipped`, group: dateText });
      continue;
    }
    const call = (get(row, 'CALL_SIGN') ?? '').trim();
    const station = call !== '' && !/^9+$/.test(call) ? call : (get(row, 'STATION') ?? '').trim();
    if (station === '') {
      addIssue(report, { file, line, reason: 'no-station', message: 'neither CALL_SIGN nor STATION names the station' });
      continue;
    }
    const o = emptyObservation(station, timeMs, file, line);
    if (type === 'FM-15') o.source = 'METAR';
    else if (type === 'FM-16') o.source = 'SPECI';
    const take = (value: number, q: Quality, field: string, raw: string): number => {
      if (q === 'erroneous') {
        count('erroneous', field, line, raw);
        return NaN;
      }
      if (q === 'suspect' && value === value) count('suspect', field, line, raw);
      return value;
    };
    const wnd = get(row, 'WND');
    if (wnd !== undefined && wnd.trim() !== '') {
      const w = decodeIsdWind(wnd);
      o.windDirDeg = take(w.dirDeg, w.dirQuality, 'windDir', wnd);
      o.windSpeedMs = take(w.speedMs, w.speedQuality, 'windSpeed', wnd);
      if (w.type === 'V') count('variable', 'windDir', line, wnd);
    }
    for (const [name, key, scale] of [['TMP', 'temperatureC', 10], ['DEW', 'dewpointC', 10], ['SLP', 'seaLevelPressureHpa', 10]] as const) {
      const cell = get(row, name);
      if (cell === undefined || cell.trim() === '') continue;
      const v = decodeIsdValue(cell, scale);
      o[key] = take(v.value, v.quality, key, cell);
    }
    const ma1 = get(row, 'MA1');
    if (ma1 !== undefined && ma1.trim() !== '') {
      const p = ma1.split(',');
      o.altimeterHpa = take(packedNumber(p[0], 10), isdQuality(p[1]), 'altimeterHpa', ma1);
      o.stationPressureHpa = take(packedNumber(p[2], 10), isdQuality(p[3]), 'stationPressureHpa', ma1);
    }
    const aa1 = get(row, 'AA1');
    if (aa1 !== undefined && aa1.trim() !== '') {
      const p = aa1.split(',');
      if (packedNumber(p[0], 1) === 1) o.precipMm = take(packedNumber(p[1], 10), isdQuality(p[3]), 'precipMm', aa1);
    }
    const oc1 = get(row, 'OC1');
    if (oc1 !== undefined && oc1.trim() !== '') {
      const p = oc1.split(',');
      o.gustMs = take(packedNumber(p[0], 10), isdQuality(p[1]), 'gustMs', oc1);
    }
    const vis = get(row, 'VIS');
    if (vis !== undefined && vis.trim() !== '') {
      const p = vis.split(',');
      o.visibilityM = take(packedNumber(p[0], 1), isdQuality(p[1]), 'visibilityM', vis);
    }
    const cig = get(row, 'CIG');
    if (cig !== undefined && cig.trim() !== '') {
      const p = cig.split(',');
      const h = packedNumber(p[0], 1);
      o.ceilingFt = take(h === 22000 ? Infinity : h / FOOT_M, isdQuality(p[1]), 'ceilingFt', cig);
    }
    const lat = Number(get(row, 'LATITUDE'));
    const lon = Number(get(row, 'LONGITUDE'));
    const elev = Number(get(row, 'ELEVATION'));
    if (Number.isFinite(lat) && Number.isFinite(lon) && Math.abs(lat) <= 90 && Math.abs(lon) <= 180) {
      o.latDeg = lat;
      o.lonDeg = lon;
      o.elevationM = Number.isFinite(elev) && elev > -400 && elev < 9000 ? elev : NaN;
      if (!stationsSeen.has(station)) stationsSeen.set(station, { latDeg: lat, lonDeg: lon, elevationM: o.elevationM });
    }
    report.parsed++;
    emit(o);
  }
  if (header === null) addIssue(report, { file, line: 1, reason: 'empty', message: 'the file has no header and no data; check the file' });
  const valueCounts: Record<string, number> = {};
  for (const [k, c] of counters) {
    valueCounts[k] = c.count;
    const [reason, field] = k.split(':');
    const what = reason === 'erroneous' ? 'quality code says erroneous, read as missing' : reason === 'suspect' ? 'quality code says suspect, value kept' : 'variable direction, read as missing';
    report.notes.push(`${reason} in ${field}: ${c.count} value${c.count === 1 ? '' : 's'} (first at line ${c.line}: "${c.example}"); ${what}`);
  }
  return { report, stationsSeen, valueCounts, observations };
}
