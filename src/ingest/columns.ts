/**
 * CSV header → field mapping by the names networks and archives use, with units by convention, plus
 * user overrides (`--column name=field[:unit]`) and a small JSON mapping file.
 *
 * Name sources: Iowa Environmental Mesonet (IEM) ASOS download columns; NCEI Local Climatological Data
 * (LCD) CSV columns (LCD documentation, from memory for units: °F, mph, inHg, inches); the nycflights13
 * `weather` table (°F, mph, hPa, inches; documented in its R help page); and generic names (common
 * practice, no source). Headers are trimmed and matched case-insensitively; then after dropping a bracketed
 * unit; then with punctuation removed; then with a unit suffix removed (`temp_f` → `temp` + °F).
 */
import { parseUnitName, unitFromHeader, unitQuantity, UNIT_NAMES, type Quantity, type UnitName } from './units.js';
import { timeColumnIndices, type TimeColumns } from './time.js';

export const FIELDS = [
  'time',
  'station',
  'lat',
  'lon',
  'elevation',
  'temperature',
  'dewpoint',
  'relativeHumidity',
  'windDir',
  'windSpeed',
  'gust',
  'stationPressure',
  'seaLevelPressure',
  'altimeter',
  'precip',
  'weatherCodes',
  'rawReport',
  'utcOffset',
  'reportType',
  'visibility',
  // sky layers in one text cell (NCEI LCD `HourlySkyConditions`, e.g. `FEW:02 45 BKN:07 100`)
  'skyConditions',
  // sky layers: cover (FEW SCT BKN OVC VV CLR...) and height in feet (IEM `skyc1..4`, `skyl1..4`)
  'skyCover1',
  'skyCover2',
  'skyCover3',
  'skyCover4',
  'skyLevel1',
  'skyLevel2',
  'skyLevel3',
  'skyLevel4',
  // parts of a time spread over several columns (see TIME_PART_NAMES)
  'date',
  'timeOfDay',
  'year',
  'month',
  'day',
  'hour',
  'minute',
  'dayOfYear',
] as const;
export type Field = (typeof FIELDS)[number];

/** Numeric fields (they carry a unit). */
export const NUMERIC_FIELDS = [
  'lat',
  'lon',
  'elevation',
  'temperature',
  'dewpoint',
  'relativeHumidity',
  'windDir',
  'windSpeed',
  'gust',
  'stationPressure',
  'seaLevelPressure',
  'altimeter',
  'precip',
  'visibility',
] as const satisfies readonly Field[];
export type NumericField = (typeof NUMERIC_FIELDS)[number];

/** Quantity each numeric field measures (units must match it). */
export const FIELD_QUANTITY: Record<NumericField, Quantity> = {
  lat: 'angle',
  lon: 'angle',
  elevation: 'height',
  temperature: 'temperature',
  dewpoint: 'temperature',
  relativeHumidity: 'fraction',
  windDir: 'angle',
  windSpeed: 'speed',
  gust: 'speed',
  stationPressure: 'pressure',
  seaLevelPressure: 'pressure',
  altimeter: 'pressure',
  precip: 'depth',
  visibility: 'height',
};

export function isField(s: string): s is Field {
  return (FIELDS as readonly string[]).includes(s);
}
export function isNumericField(f: string): f is NumericField {
  return Object.prototype.hasOwnProperty.call(FIELD_QUANTITY, f);
}

/** A user's instruction for one column; field `ignore` drops a column that would match by name. */
export interface ColumnOverride {
  header: string;
  field: Field | 'ignore';
  unit?: UnitName;
}

/** How a column's unit was decided. */
export type UnitSource = 'override' | 'header' | 'convention' | 'inferred' | 'default';

export interface MappedColumn {
  /** 0-based column index. */
  index: number;
  /** Header as written in the file (untrimmed). */
  header: string;
  unit?: UnitName;
  unitSource?: UnitSource;
}
export type ColumnMapping = { [F in Field]?: MappedColumn };

interface KnownName {
  field: Field;
  unit?: UnitName;
}

/** Known names (lower-case) → field and conventional unit. */
const KNOWN: Record<string, KnownName> = {};
function known(field: Field, unit: UnitName | undefined, ...names: string[]): void {
  for (const n of names) {
    const k = n.toLowerCase();
    if (!(k in KNOWN)) KNOWN[k] = unit ? { field, unit } : { field }; // first (source-specific) entry wins
  }
}

// Iowa Environmental Mesonet ASOS download (station, valid [UTC], tmpf, dwpf, relh, drct, sknt, p01i, alti, mslp, gust, wxcodes, metar, tmpc, dwpc, p01m, lat, lon)
known('station', undefined, 'station');
known('time', undefined, 'valid', 'valid(utc)', 'valid_utc');
known('temperature', 'degF', 'tmpf');
known('temperature', 'degC', 'tmpc');
known('dewpoint', 'degF', 'dwpf');
known('dewpoint', 'degC', 'dwpc');
known('relativeHumidity', '%', 'relh');
known('windDir', 'deg', 'drct');
known('windSpeed', 'kt', 'sknt');
known('windSpeed', 'mph', 'sped'); // IEM ASOS download option "wind speed in mph"
known('gust', 'mph', 'gust_mph');
known('precip', 'in', 'p01i');
known('precip', 'mm', 'p01m');
known('altimeter', 'inHg', 'alti');
known('seaLevelPressure', 'hPa', 'mslp');
known('weatherCodes', undefined, 'wxcodes', 'presentwx', 'present_weather', 'wx', 'weather');
known('visibility', 'mi', 'vsby');
known('skyCover1', undefined, 'skyc1');
known('skyCover2', undefined, 'skyc2');
known('skyCover3', undefined, 'skyc3');
known('skyCover4', undefined, 'skyc4');
known('skyLevel1', undefined, 'skyl1');
known('skyLevel2', undefined, 'skyl2');
known('skyLevel3', undefined, 'skyl3');
known('skyLevel4', undefined, 'skyl4');
known('rawReport', undefined, 'metar', 'raw_metar', 'raw_text', 'rawob', 'raw', 'report');
known('lat', 'deg', 'lat', 'latitude', 'lat_deg');
known('lon', 'deg', 'lon', 'lng', 'long', 'longitude', 'lon_deg');
// NCEI Local Climatological Data
known('station', undefined, 'station_id', 'stid', 'site', 'icao', 'stn', 'wban', 'id');
known('time', undefined, 'date');
known('reportType', undefined, 'report_type', 'reporttype');
known('temperature', 'degF', 'hourlydrybulbtemperature');
known('dewpoint', 'degF', 'hourlydewpointtemperature');
known('relativeHumidity', '%', 'hourlyrelativehumidity');
known('windDir', 'deg', 'hourlywinddirection');
known('windSpeed', 'mph', 'hourlywindspeed');
known('gust', 'mph', 'hourlywindgustspeed');
known('stationPressure', 'inHg', 'hourlystationpressure');
known('seaLevelPressure', 'inHg', 'hourlysealevelpressure');
known('altimeter', 'inHg', 'hourlyaltimetersetting');
known('precip', 'in', 'hourlyprecipitation');
known('weatherCodes', undefined, 'hourlypresentweathertype');
known('visibility', 'mi', 'hourlyvisibility');
known('skyConditions', undefined, 'hourlyskyconditions');
known('elevation', 'm', 'elevation', 'elev', 'elevation_m', 'elev_m', 'height', 'altitude', 'station_elevation');
known('rawReport', undefined, 'rem', 'remarks');
// nycflights13 weather: origin, time_hour (UTC), temp, dewp, humid, wind_dir, wind_speed, wind_gust (mph), precip (in), pressure (hPa)
known('station', undefined, 'origin');
known('time', undefined, 'time_hour');
known('temperature', 'degF', 'temp');
known('dewpoint', 'degF', 'dewp');
known('relativeHumidity', '%', 'humid');
known('windDir', 'deg', 'wind_dir');
known('windSpeed', 'mph', 'wind_speed');
known('precip', 'in', 'precip');
known('seaLevelPressure', 'hPa', 'pressure');
known('visibility', 'mi', 'visib');
// Generic names (common practice, no source); units from the name when it carries one.
known('time', undefined, 'time', 'datetime', 'date_time', 'timestamp', 'obs_time', 'observation_time', 'time_utc', 'utc', 'date_utc', 'datetime_utc', 'valid_time', 'epoch', 'unix_time', 'epoch_s');
known('station', undefined, 'stationid', 'site_id');
known('temperature', undefined, 'temperature', 'air_temperature', 'air_temp', 'airtemp', 't', 'ta', 'tair');
known('temperature', 'degC', 'temp_c', 'temperature_c', 'air_temp_c');
known('temperature', 'degF', 'temp_f', 'temperature_f', 'air_temp_f');
known('dewpoint', undefined, 'dew_point', 'dewpoint', 'dew_point_temperature', 'dewpoint_temperature', 'td', 'dew');
known('relativeHumidity', '%', 'rh', 'relative_humidity', 'relhum', 'humidity', 'hum');
known('windDir', 'deg', 'wind_direction', 'wdir', 'wd', 'dir', 'winddir', 'wind_dir_deg');
known('windSpeed', undefined, 'wind_speed', 'wspd', 'ws', 'wind', 'windspeed', 'ff');
known('windSpeed', 'm/s', 'wind_speed_ms', 'wspd_ms', 'wind_ms');
known('windSpeed', 'kt', 'wind_speed_kt', 'wspd_kt');
known('gust', undefined, 'gust', 'wind_gust', 'gust_speed', 'windgust', 'wgust', 'gst');
known('gust', 'm/s', 'gust_ms', 'wind_gust_ms');
known('gust', 'kt', 'gust_kt');
known('stationPressure', undefined, 'station_pressure', 'stn_pressure', 'pres', 'stnp', 'press', 'psfc', 'pressure_station', 'p');
known('seaLevelPressure', undefined, 'slp', 'sea_level_pressure', 'mean_sea_level_pressure', 'msl', 'pmsl', 'qff');
known('altimeter', undefined, 'altimeter', 'altimeter_setting', 'qnh', 'alt_setting', 'altim');
known('precip', undefined, 'precipitation', 'prcp', 'rain', 'precip_mm', 'rainfall', 'pcp');
known('visibility', undefined, 'visibility', 'vis', 'vis_m', 'visibility_m', 'vsby_m');
known('visibility', 'km', 'visibility_km', 'vis_km');
known('visibility', 'mi', 'visibility_mi', 'visibility_sm', 'vis_mi', 'vis_sm');
// Wind direction ("from", degrees true) and speeds with their unit in the name (common practice, no source);
// a unit written in the header (`wind_speed_kmh`, `Wind Spd (km/h)`) wins over these conventions.
known('windDir', 'deg', 'wind_from', 'wind_from_direction', 'wind_direction_from', 'wind_dir_from', 'dir_from', 'direction_from', 'from', 'wind_direction_deg', 'wdir_deg', 'wd_deg', 'direction', 'wind dir', 'dd');
known('windSpeed', 'km/h', 'wind_speed_kmh', 'wind_kmh', 'wspd_kmh', 'ws_kmh', 'wind_speed_kph', 'wind_kph');
known('windSpeed', 'mph', 'wind_speed_mph', 'wind_mph', 'wspd_mph', 'ws_mph', 'speed_mph');
known('windSpeed', 'kt', 'wind_speed_knots', 'wind_kt', 'wind_kts', 'wind_knots', 'ws_kt', 'wspd_kts');
known('windSpeed', 'm/s', 'wind_speed_mps', 'wind_mps', 'ws_ms', 'ws_mps', 'wspd_mps');
known('windSpeed', undefined, 'speed', 'wind spd', 'wind_spd', 'windspd');
known('gust', 'mph', 'gust_mph', 'wind_gust_mph');
known('gust', 'km/h', 'gust_kmh', 'wind_gust_kmh');
// Environment and Climate Change Canada hourly CSV (climate.weather.gc.ca bulk download; names from its
// published column list, from memory): units are in the brackets of each header.
known('time', undefined, 'date/time (lst)', 'date/time (utc)', 'date/time');
known('station', undefined, 'climate id', 'climate_id');
known('dewpoint', undefined, 'dew point temp', 'dew_point_temp', 'dewpoint_temp');
known('stationPressure', undefined, 'stn press', 'stn_press');
known('precip', undefined, 'precip. amount', 'precip amount', 'precip_amount');
known('utcOffset', undefined, 'utc_offset', 'utcoffset', 'tz_offset', 'offset', 'gmt_offset', 'timezone_offset');

// Conventional units are those of the source listed first for a name; a unit in the header always wins.
// Gust columns carry no conventional unit: the CSV reader gives them the wind-speed column's unit.

/** Normalised key (punctuation and blanks removed) → known name. */
const KNOWN_NORMALISED: Record<string, KnownName> = {};
for (const [k, v] of Object.entries(KNOWN)) {
  const nk = normaliseKey(k);
  if (!(nk in KNOWN_NORMALISED)) KNOWN_NORMALISED[nk] = v;
}

function normaliseKey(s: string): string {
  return s.toLowerCase().replace(/[^a-z0-9]/g, '');
}

/** Strip a trailing bracketed part (`Temperature (°F)` → `Temperature`). */
function stripBracket(h: string): string {
  return h.replace(/\s*[([][^)\]]*[)\]]\s*$/, '');
}

/** Strip a separated unit suffix (`temp_f` → `temp`), only when the rest is non-empty. */
function stripSuffix(h: string): string {
  const m = /^(.+?)[_\-. ]+(degf|degc|f|c|k|kt|kts|knots|mph|kmh|kph|ms|mps|hpa|mb|mbar|inhg|kpa|pa|mm|in|m|ft|deg|pct)$/.exec(h);
  return m ? m[1]! : h;
}

/** Look a header up among known names; returns the match and how. */
export function matchHeader(header: string): KnownName | null {
  const h = header.trim().replace(/^\uFEFF/, '').toLowerCase();
  if (h === '') return null;
  const exact = KNOWN[h];
  if (exact) return exact;
  const nb = stripBracket(h);
  if (nb !== h && KNOWN[nb]) return { field: KNOWN[nb]!.field };
  const nk = normaliseKey(nb);
  if (KNOWN_NORMALISED[nk]) return nb === h ? KNOWN_NORMALISED[nk]! : { field: KNOWN_NORMALISED[nk]!.field };
  const ns = stripSuffix(nb);
  if (ns !== nb) {
    const k = KNOWN[ns] ?? KNOWN_NORMALISED[normaliseKey(ns)];
    if (k) return { field: k.field };
  }
  return null;
}

/**
 * True when the headers look like an NCEI Local Climatological Data export: at least three `Hourly…` columns beside
 * `REPORT_TYPE`, or beside `DATE` (a file reduced to a few LCD columns keeps their names; common practice, no source).
 * @example isLcdHeaders(['DATE', 'HourlyDryBulbTemperature', 'HourlyWindDirection', 'HourlyWindSpeed']) // true
 */
export function isLcdHeaders(headers: readonly string[]): boolean {
  let hourly = 0;
  let reportType = false;
  let date = false;
  for (const h of headers) {
    const t = h.trim().replace(/^\uFEFF/, '').toLowerCase();
    if (t.startsWith('hourly')) hourly++;
    if (t === 'report_type') reportType = true;
    if (t === 'date') date = true;
  }
  return (reportType || date) && hourly >= 3;
}

/**
 * Map headers to fields. Order of decisions per column: an override; else a known name. A field is taken
 * by its first matching column; later columns matching the same field are noted and left unmatched.
 * Units: override > unit written in the header > convention of the known name > left undefined (the CSV
 * reader infers it from values).
 * @example mapColumns(['station', 'valid', 'tmpf']).mapping.temperature // { index: 2, header: 'tmpf', unit: 'degF', unitSource: 'header' }
 */
export function mapColumns(
  headers: readonly string[],
  overrides: readonly ColumnOverride[] = [],
): { mapping: ColumnMapping; unmatched: string[]; notes: string[]; timeColumns?: TimeColumns } {
  const mapping: ColumnMapping = {};
  const unmatched: string[] = [];
  const notes: string[] = [];
  const trimmed = headers.map((h) => h.trim().replace(/^\uFEFF/, ''));
  const lower = trimmed.map((h) => h.toLowerCase());
  const taken = new Set<number>();

  for (const o of overrides) {
    const i = lower.indexOf(o.header.trim().toLowerCase());
    if (i < 0) {
      notes.push(`column override "${o.header}" matches no header (headers: ${trimmed.join(', ')})`);
      continue;
    }
    taken.add(i);
    if (o.field === 'ignore') continue;
    if (mapping[o.field]) notes.push(`override maps "${trimmed[i]}" to ${o.field}, replacing "${mapping[o.field]!.header.trim()}"`);
    const col: MappedColumn = { index: i, header: headers[i]! };
    if (o.unit) {
      col.unit = o.unit;
      col.unitSource = 'override';
    } else if (isNumericField(o.field)) {
      const u = unitFromHeader(trimmed[i]!);
      if (u && unitQuantity(u) === FIELD_QUANTITY[o.field]) {
        col.unit = u;
        col.unitSource = 'header';
      }
    }
      mapping[o.field] = col;
  }

  // A time spread over several columns, unless one column holds the whole time.
  const partOf = (i: number): TimePartField | null => {
    const o = overrides.find((x) => x.header.trim().toLowerCase() === lower[i]);
    if (o) return (TIME_PARTS as readonly string[]).includes(o.field) ? (o.field as TimePartField) : null;
    return timePartOf(trimmed[i]!);
  };
  const parts: Partial<Record<TimePartField, number>> = {};
  let wholeTime = mapping.time !== undefined;
  for (let i = 0; i < headers.length; i++) {
    const part = partOf(i);
    if (part !== null) {
      if (parts[part] === undefined) parts[part] = i;
    } else if (!taken.has(i) && matchHeader(trimmed[i]!)?.field === 'time') wholeTime = true;
  }
  const timeColumns = wholeTime ? null : timeColumnsFrom(parts);
  if (timeColumns) {
    const idx = timeColumnIndices(timeColumns);
    for (const i of idx) taken.add(i);
    mapping.time = { index: idx[0]!, header: headers[idx[0]!]! };
    notes.push(`time read from ${idx.length} columns: ${idx.map((i) => trimmed[i]).join(' + ')}`);
  }

  for (let i = 0; i < headers.length; i++) {
    if (taken.has(i)) continue;
    const m = matchHeader(trimmed[i]!);
    if (!m) {
      if (trimmed[i] !== '') unmatched.push(trimmed[i]!);
      continue;
    }
    if (mapping[m.field]) {
      notes.push(`"${trimmed[i]}" also looks like ${m.field}; using "${mapping[m.field]!.header.trim()}" (choose with --column)`);
      unmatched.push(trimmed[i]!);
      continue;
    }
    const col: MappedColumn = { index: i, header: headers[i]! };
    if (isNumericField(m.field)) {
      const q = FIELD_QUANTITY[m.field];
      const u = unitFromHeader(trimmed[i]!);
      if (u && unitQuantity(u) === q) {
        col.unit = u;
        col.unitSource = 'header';
      } else if (m.unit) {
        col.unit = m.unit;
        col.unitSource = 'convention';
      }
    }
    mapping[m.field] = col;
  }
  if (isLcdHeaders(trimmed)) notes.push('NCEI Local Climatological Data layout: DATE is local standard time (no DST)');
  return timeColumns ? { mapping, unmatched, notes, timeColumns } : { mapping, unmatched, notes };
}

/** The fields that are parts of a time spread over several columns. */
export const TIME_PARTS = ['date', 'timeOfDay', 'year', 'month', 'day', 'hour', 'minute', 'dayOfYear'] as const satisfies readonly Field[];
export type TimePartField = (typeof TIME_PARTS)[number];

/**
 * Header names of the parts of a time (lower-case, compared also without punctuation; common practice, no
 * source, except `year,month,day,hour` of the nycflights weather tables, documented in their R help pages).
 */
const TIME_PART_NAMES: Record<TimePartField, string[]> = {
  date: ['date', 'date_local', 'local_date', 'obs_date', 'date_utc', 'utc_date', 'date_lst', 'date_gmt', 'gmt_date', 'day_date'],
  timeOfDay: ['time', 'time_local', 'local_time', 'obs_time', 'time_utc', 'utc_time', 'time_lst', 'time_gmt', 'gmt_time', 'hhmm', 'hour_minute', 'hrmn', 'clock'],
  year: ['year', 'yr', 'yyyy'],
  month: ['month', 'mon', 'mo'],
  day: ['day', 'dd', 'dom', 'day_of_month', 'mday'],
  hour: ['hour', 'hr', 'hh', 'hour_utc', 'hour_local', 'hour_lst', 'hour_gmt'],
  minute: ['minute', 'min', 'minutes', 'mi'],
  dayOfYear: ['doy', 'day_of_year', 'dayofyear', 'julian_day', 'jday', 'yday', 'julian'],
};
const TIME_PART_BY_KEY = new Map<string, TimePartField>();
for (const [f, names] of Object.entries(TIME_PART_NAMES) as [TimePartField, string[]][]) {
  for (const n of names) {
    if (!TIME_PART_BY_KEY.has(n)) TIME_PART_BY_KEY.set(n, f);
    const k = normaliseKey(n);
    if (!TIME_PART_BY_KEY.has(k)) TIME_PART_BY_KEY.set(k, f);
  }
}

/** Which part of a time a header names (`Date`, `time_local`, `Time (LST)`, `year`, `doy`...), or null. */
export function timePartOf(header: string): TimePartField | null {
  const h = header.trim().replace(/^\uFEFF/, '').toLowerCase();
  const nb = stripBracket(h);
  return TIME_PART_BY_KEY.get(h) ?? TIME_PART_BY_KEY.get(nb) ?? TIME_PART_BY_KEY.get(normaliseKey(nb)) ?? null;
}

/**
 * How the time is assembled from the part columns found, in this order: a date and a time of day; year,
 * month and day (with hour and minute, or a time of day as `hhmm`); year and day of year (likewise); else null.
 * `dd` as a day is used only with year and month beside it (alone it is the WMO wind direction).
 */
function timeColumnsFrom(p: Partial<Record<TimePartField, number>>): TimeColumns | null {
  const clock = p.hour !== undefined ? { hour: p.hour, ...(p.minute !== undefined ? { minute: p.minute } : {}) } : p.timeOfDay !== undefined ? { hhmm: p.timeOfDay } : {};
  if (p.date !== undefined && p.timeOfDay !== undefined) return { kind: 'date-time', date: p.date, time: p.timeOfDay };
  if (p.year !== undefined && p.month !== undefined && p.day !== undefined) return { kind: 'year-month-day', year: p.year, month: p.month, day: p.day, ...clock };
  if (p.year !== undefined && p.dayOfYear !== undefined) return { kind: 'year-doy', year: p.year, doy: p.dayOfYear, ...clock };
  return null;
}

/**
 * Parse a `--column` value `name=field[:unit]` (field `ignore` drops the column). Throws RangeError with
 * the list of known fields/units when one is unknown or the unit does not fit the field.
 * @example parseColumnOverride('Temp=temperature:degF') // { header: 'Temp', field: 'temperature', unit: 'degF' }
 */
export function parseColumnOverride(spec: string): ColumnOverride {
  const eq = spec.lastIndexOf('=');
  if (eq <= 0) throw new RangeError(`column override "${spec}" must look like name=field[:unit], e.g. Temp=temperature:degF`);
  return overrideFrom(spec.slice(0, eq), spec.slice(eq + 1), `column override "${spec}"`);
}

function overrideFrom(header: string, target: string, what: string): ColumnOverride {
  const colon = target.indexOf(':');
  const fieldText = (colon < 0 ? target : target.slice(0, colon)).trim();
  const unitText = colon < 0 ? '' : target.slice(colon + 1).trim();
  const field = fieldText === 'skip' ? 'ignore' : fieldText;
  if (field !== 'ignore' && !isField(field)) {
    throw new RangeError(`${what}: unknown field "${fieldText}"; known fields: ${FIELDS.join(', ')}, ignore`);
  }
  const o: ColumnOverride = { header: header.trim(), field };
  if (unitText) {
    const unit = parseUnitName(unitText);
    if (!unit) throw new RangeError(`${what}: unknown unit "${unitText}"; known units: ${UNIT_NAMES.join(', ')}`);
    if (field === 'ignore' || !isNumericField(field)) throw new RangeError(`${what}: field ${field} takes no unit`);
    if (unitQuantity(unit) !== FIELD_QUANTITY[field]) {
      throw new RangeError(`${what}: unit ${unit} is a ${unitQuantity(unit)} unit, but ${field} needs a ${FIELD_QUANTITY[field]} unit`);
    }
    o.unit = unit;
  }
  return o;
}

/** Contents of a mapping file. */
export interface MappingFile {
  overrides: ColumnOverride[];
  missing: string[];
  zone?: string;
  standardTime?: boolean;
}

/**
 * Read a JSON mapping file: `{ "columns": { "HeaderName": "field:unit" }, "missing": ["-99"], "tz": "America/Chicago",
 * "standardTime": false }`. Throws TypeError/RangeError naming the bad entry.
 * @example loadMappingFile('{"columns":{"T":"temperature:degF"}}').overrides[0].unit // 'degF'
 */
export function loadMappingFile(json: string | unknown): MappingFile {
  let obj: unknown = json;
  if (typeof json === 'string') {
    try {
      obj = JSON.parse(json);
    } catch (e) {
      throw new TypeError(`mapping file is not valid JSON: ${(e as Error).message}`);
    }
  }
  if (!obj || typeof obj !== 'object' || Array.isArray(obj)) throw new TypeError('mapping file must hold a JSON object');
  const o = obj as Record<string, unknown>;
  for (const k of Object.keys(o)) {
    if (!['columns', 'missing', 'tz', 'zone', 'standardTime'].includes(k)) throw new RangeError(`mapping file: unknown key "${k}" (known: columns, missing, tz, standardTime)`);
  }
  const overrides: ColumnOverride[] = [];
  if (o.columns !== undefined) {
    if (!o.columns || typeof o.columns !== 'object' || Array.isArray(o.columns)) throw new TypeError('mapping file: "columns" must be an object of "header": "field[:unit]"');
    for (const [h, v] of Object.entries(o.columns as Record<string, unknown>)) {
      if (typeof v !== 'string') throw new TypeError(`mapping file: column "${h}" must map to a string "field[:unit]"`);
      overrides.push(overrideFrom(h, v, `mapping file column "${h}"`));
    }
  }
  let missing: string[] = [];
  if (o.missing !== undefined) {
    if (!Array.isArray(o.missing)) throw new TypeError('mapping file: "missing" must be an array of strings');
    missing = o.missing.map((m) => String(m));
  }
  const tz = o.tz ?? o.zone;
  if (tz !== undefined && typeof tz !== 'string') throw new TypeError('mapping file: "tz" must be an IANA zone name string');
  if (o.standardTime !== undefined && typeof o.standardTime !== 'boolean') throw new TypeError('mapping file: "standardTime" must be true or false');
  const out: MappingFile = { overrides, missing };
  if (tz !== undefined) out.zone = tz as string;
  if (o.standardTime !== undefined) out.standardTime = o.standardTime as boolean;
  return out;
}
