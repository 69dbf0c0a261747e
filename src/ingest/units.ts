/**
 * Unit names, exact conversion factors, and unit detection from column headers and value ranges.
 *
 * Canonical units (what `toCanonical` returns): temperature °C, speed m/s, pressure hPa, angle degrees,
 * humidity %, precipitation depth mm (for `mm` and `in`), heights and distances m (for `m`, `ft`, `km`, `mi`:
 * elevation, visibility). Lengths come in two families on purpose: a precipitation depth in inches becomes mm,
 * a height in feet or a visibility in statute miles becomes metres.
 *
 * Factors (exact unless stated), NIST SP 811 (2008 ed.) Appendix B.8 and the definitions it cites:
 * - 1 ft = 0.3048 m, 1 in = 0.0254 m, 1 mi (statute) = 1609.344 m (international yard and pound, 1959); 1 km = 1000 m.
 * - 1 nautical mile = 1852 m, so 1 kn = 1852/3600 m/s.
 * - 1 mph = 1609.344/3600 m/s = 0.44704 m/s; 1 km/h = 1/3.6 m/s (SI).
 * - °C = (°F − 32)/1.8; °C = K − 273.15 (SI definition of the Celsius scale).
 * - inch of mercury, conventional: 0.0254 m × 13595.1 kg/m³ × 9.80665 m/s² = 3386.38864 Pa (HPA_PER_INHG,
 *   physics/constants.ts; SP 811 B.8 prints 3.386 389 E+03); 1 hPa = 100 Pa; 1 kPa = 10 hPa.
 */

import { FOOT_M, HPA_PER_INHG, INCH_M, KNOT_MS, MPH_MS, STATUTE_MILE_M, ZERO_CELSIUS_K } from '../physics/constants.js';
import { medianInPlace } from '../signal/median.js';

export type UnitName =
  | 'degC'
  | 'degF'
  | 'K'
  | 'm/s'
  | 'kt'
  | 'mph'
  | 'km/h'
  | 'hPa'
  | 'inHg'
  | 'kPa'
  | 'Pa'
  | 'mm'
  | 'in'
  | 'm'
  | 'ft'
  | 'km'
  | 'mi'
  | 'deg'
  | 'deg10'
  | '%';

/** Every unit name, in a stable order (for messages). */
export const UNIT_NAMES: readonly UnitName[] = ['degC', 'degF', 'K', 'm/s', 'kt', 'mph', 'km/h', 'hPa', 'inHg', 'kPa', 'Pa', 'mm', 'in', 'm', 'ft', 'km', 'mi', 'deg', 'deg10', '%'];

/** Kind of quantity a unit measures. `depth` = precipitation (canonical mm), `height` = elevation and visibility (canonical m). */
export type Quantity = 'temperature' | 'speed' | 'pressure' | 'depth' | 'height' | 'angle' | 'fraction';

const QUANTITY: Record<UnitName, Quantity> = {
  degC: 'temperature',
  degF: 'temperature',
  K: 'temperature',
  'm/s': 'speed',
  kt: 'speed',
  mph: 'speed',
  'km/h': 'speed',
  hPa: 'pressure',
  inHg: 'pressure',
  kPa: 'pressure',
  Pa: 'pressure',
  mm: 'depth',
  in: 'depth',
  m: 'height',
  ft: 'height',
  km: 'height',
  mi: 'height',
  deg: 'angle',
  deg10: 'angle',
  '%': 'fraction',
};

/** The quantity a unit measures. */
export function unitQuantity(unit: UnitName): Quantity {
  return QUANTITY[unit];
}

/** True when `s` is one of our unit names (exact spelling). */
export function isUnitName(s: string): s is UnitName {
  return Object.prototype.hasOwnProperty.call(QUANTITY, s);
}

/** Other spellings accepted from users and headers (lower-case keys). */
const ALIASES: Record<string, UnitName> = {
  degc: 'degC', c: 'degC', '°c': 'degC', 'deg c': 'degC', celsius: 'degC', 'deg_c': 'degC', 'ºc': 'degC',
  degf: 'degF', f: 'degF', '°f': 'degF', 'deg f': 'degF', fahrenheit: 'degF', 'deg_f': 'degF', 'ºf': 'degF',
  k: 'K', kelvin: 'K',
  'm/s': 'm/s', ms: 'm/s', mps: 'm/s', 'm s-1': 'm/s', 'm s^-1': 'm/s', 'm_s': 'm/s', 'meters/second': 'm/s',
  kt: 'kt', kts: 'kt', kn: 'kt', knot: 'kt', knots: 'kt',
  mph: 'mph', 'mi/h': 'mph',
  'km/h': 'km/h', kmh: 'km/h', kph: 'km/h', 'km h-1': 'km/h', kmph: 'km/h',
  hpa: 'hPa', mb: 'hPa', mbar: 'hPa', millibar: 'hPa', millibars: 'hPa',
  inhg: 'inHg', 'in hg': 'inHg', 'in_hg': 'inHg', 'inches hg': 'inHg',
  kpa: 'kPa', pa: 'Pa',
  mm: 'mm', millimeters: 'mm', millimetres: 'mm',
  in: 'in', inch: 'in', inches: 'in', '"': 'in',
  m: 'm', meters: 'm', metres: 'm', meter: 'm', metre: 'm',
  ft: 'ft', feet: 'ft', foot: 'ft',
  km: 'km', kilometers: 'km', kilometres: 'km',
  mi: 'mi', sm: 'mi', miles: 'mi', 'statute miles': 'mi',
  deg: 'deg', degrees: 'deg', '°': 'deg', degree: 'deg',
  // tens of degrees: Environment and Climate Change Canada `Wind Dir (10s deg)` (27 = 270°)
  '10s deg': 'deg10', '10s of degrees': 'deg10', 'tens of degrees': 'deg10', deg10: 'deg10', '10deg': 'deg10',
  '%': '%', pct: '%', percent: '%',
};

/**
 * Parse a unit written by a person (`F`, `°C`, `knots`, `mb`, `inHg`, ...) into a UnitName, or null.
 * @example parseUnitName('knots') // 'kt'
 */
export function parseUnitName(text: string): UnitName | null {
  const t = text.trim();
  if (isUnitName(t)) return t;
  return ALIASES[t.toLowerCase()] ?? null;
}

/**
 * A fast function converting a value in `unit` to the canonical unit of its quantity.
 * °F: (t − 32)/1.8; K: t − 273.15; kt ×1852/3600; mph ×0.44704; km/h ÷3.6; inHg ×33.8638864; kPa ×10; Pa ÷100;
 * in ×25.4 (to mm); ft ×0.3048, km ×1000, mi ×1609.344 (to m). NaN stays NaN. Sources in the module comment. Built from the one
 * table in `conversionOf`.
 * @example converter('kt')(10) // 5.1444…
 */
export function converter(unit: UnitName): (v: number) => number {
  if (!isUnitName(unit)) throw new TypeError(`converter: unknown unit ${JSON.stringify(unit)}`);
  const { op, k } = conversionOf(unit);
  switch (op) {
    case 0:
      return (v: number) => v;
    case 1:
      return (v: number) => (v - 32) / 1.8;
    case 2:
      return (v: number) => v - k;
    case 3:
      return (v: number) => v * k;
    case 4:
      return (v: number) => v / k;
  }
}

/**
 * The unit conversions as data (the one table; `converter` builds its closures from it), for hot loops
 * that switch instead of calling a closure: `op` 0 identity, 1 °F (v − 32)/1.8, 2 v − k, 3 v × k, 4 v / k. Gives bit-identical results.
 * @example conversionOf('kt') // { op: 3, k: 0.5144… }
 */
export function conversionOf(unit: UnitName): { op: 0 | 1 | 2 | 3 | 4; k: number } {
  switch (unit) {
    case 'degF':
      return { op: 1, k: 0 };
    case 'K':
      return { op: 2, k: ZERO_CELSIUS_K };
    case 'kt':
      return { op: 3, k: KNOT_MS };
    case 'mph':
      return { op: 3, k: MPH_MS };
    case 'km/h':
      return { op: 4, k: 3.6 };
    case 'inHg':
      return { op: 3, k: HPA_PER_INHG };
    case 'kPa':
      return { op: 3, k: 10 };
    case 'Pa':
      return { op: 4, k: 100 };
    case 'in':
      return { op: 3, k: INCH_M * 1000 };
    case 'ft':
      return { op: 3, k: FOOT_M };
    case 'km':
      return { op: 3, k: 1000 };
    case 'mi':
      return { op: 3, k: STATUTE_MILE_M };
    case 'deg10':
      return { op: 3, k: 10 };
    case 'degC':
    case 'm/s':
    case 'hPa':
    case 'mm':
    case 'm':
    case 'deg':
    case '%':
      return { op: 0, k: 0 };
    default:
      throw new TypeError(`conversionOf: unknown unit ${JSON.stringify(unit)}`);
  }
}

/**
 * Convert one value from `unit` to canonical units (see module comment).
 * @example toCanonical(98.6, 'degF') // 37
 */
export function toCanonical(value: number, unit: UnitName): number {
  return converter(unit)(value);
}

/**
 * Convert a canonical value (°C, m/s, hPa, mm, m, deg, %) to `unit`, the inverse of `toCanonical`.
 * @example fromCanonical(0, 'degF') // 32
 */
export function fromCanonical(value: number, unit: UnitName): number {
  switch (unit) {
    case 'degF':
      return value * 1.8 + 32;
    case 'K':
      return value + ZERO_CELSIUS_K;
    case 'kt':
      return value / KNOT_MS;
    case 'mph':
      return value / MPH_MS;
    case 'km/h':
      return value * 3.6;
    case 'inHg':
      return value / HPA_PER_INHG;
    case 'kPa':
      return value / 10;
    case 'Pa':
      return value * 100;
    case 'in':
      return value / (INCH_M * 1000);
    case 'ft':
      return value / FOOT_M;
    case 'km':
      return value / 1000;
    case 'mi':
      return value / STATUTE_MILE_M;
    case 'deg10':
      return value / 10;
    default:
      if (!isUnitName(unit)) throw new TypeError(`fromCanonical: unknown unit ${JSON.stringify(unit)}`);
      return value;
  }
}

/** Exact header names whose unit is part of the name (Iowa Environmental Mesonet ASOS download names). */
const NAME_UNITS: Record<string, UnitName> = {
  tmpf: 'degF', dwpf: 'degF', feel: 'degF', tmpc: 'degC', dwpc: 'degC', sknt: 'kt',
  alti: 'inHg', p01i: 'in', p01m: 'mm', drct: 'deg', relh: '%', peak_wind_gust: 'kt', sped: 'mph', gust_mph: 'mph',
  vsby: 'mi',
};

/** Suffixes after `_`, `-`, `.` or a space that name a unit (`temp_f`, `wind_kt`, `pressure_inhg`). */
const SUFFIX_UNITS: Record<string, UnitName> = {
  f: 'degF', degf: 'degF', c: 'degC', degc: 'degC', k: 'K', kelvin: 'K',
  kt: 'kt', kts: 'kt', knots: 'kt', kn: 'kt', mph: 'mph', kmh: 'km/h', kph: 'km/h', ms: 'm/s', mps: 'm/s',
  hpa: 'hPa', mb: 'hPa', mbar: 'hPa', inhg: 'inHg', kpa: 'kPa', pa: 'Pa',
  mm: 'mm', in: 'in', inch: 'in', inches: 'in', m: 'm', ft: 'ft', deg: 'deg', pct: '%', percent: '%',
};
/** Unit words that can end a name without a separator (`windmph`, `presinhg`, `airtempdegf`). */
const GLUED_SUFFIXES: [string, UnitName][] = [
  ['inhg', 'inHg'], ['hpa', 'hPa'], ['kpa', 'kPa'], ['mph', 'mph'], ['kmh', 'km/h'], ['kph', 'km/h'], ['knots', 'kt'], ['degf', 'degF'], ['degc', 'degC'],
];

/**
 * Unit named by a column header, or null: a bracketed unit (`(degF)`, `[°C]`, `(m/s)`), an IEM ASOS name
 * (`tmpf`, `sknt`, `alti`, `p01i`...), a separated suffix (`temp_F`, `wind_kt`, `slp_hPa`, `elevation_m`)
 * or a glued unit word (`windmph`, `pressinhg`). Case-insensitive; surrounding blanks ignored.
 * @example unitFromHeader(' tmpf ') // 'degF'
 * @example unitFromHeader('HourlyDryBulbTemperature (°F)') // 'degF'
 */
export function unitFromHeader(header: string): UnitName | null {
  const h = header.trim();
  const bracket = /[([]\s*([^)\]]+?)\s*[)\]]\s*$/.exec(h);
  if (bracket) {
    const u = parseUnitName(bracket[1]!);
    if (u) return u;
  }
  const lower = h.toLowerCase();
  const named = NAME_UNITS[lower];
  if (named) return named;
  if (lower.includes('m/s')) return 'm/s';
  if (lower.includes('km/h')) return 'km/h';
  const sep = /[_\-. ]([a-z%]+)$/.exec(lower);
  if (sep) {
    const u = SUFFIX_UNITS[sep[1]!];
    if (u) return u;
  }
  for (const [word, unit] of GLUED_SUFFIXES) if (lower.length > word.length && lower.endsWith(word)) return unit;
  return null;
}

/** Field groups for `inferUnit` (matches the numeric fields of columns.ts). */
export type InferField =
  | 'temperature'
  | 'dewpoint'
  | 'windSpeed'
  | 'gust'
  | 'stationPressure'
  | 'seaLevelPressure'
  | 'altimeter'
  | 'precip'
  | 'elevation'
  | 'visibility'
  | 'windDir'
  | 'relativeHumidity';

export interface InferredUnit {
  unit: UnitName;
  /** Why: the statistic and the rule used. */
  why: string;
  /** True when the values cannot tell units apart and a default was taken. */
  ambiguous: boolean;
}

function finiteMedianMax(values: ArrayLike<number>): { median: number; max: number; n: number } {
  let n = 0;
  let max = -Infinity;
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if (Number.isFinite(v)) {
      n++;
      if (v > max) max = v;
    }
  }
  if (n === 0) return { median: NaN, max: NaN, n: 0 };
  const finite = Float64Array.from(values).map((v) => (Number.isFinite(v) ? v : NaN));
  return { median: medianInPlace(finite), max, n };
}

/**
 * Guess the unit of a numeric column from plausible surface values (common practice, no source):
 * - temperature/dew point: median > 200 → K; median > 45 or max > 60 (impossible in °C at the surface,
 *   ordinary in °F) → °F; else °C (ambiguous for a cold °F record: say so in the header or an override).
 * - pressure: median 15–32.5 → inHg; 40–110 → kPa; 400–1100 → hPa; 40000–110000 → Pa (station pressure at
 *   high stations is lower than sea-level values, hence the wide lower bounds).
 * - speed, precipitation, elevation: values cannot tell units apart → m/s, mm, m defaults (ambiguous).
 * - visibility: max above 100 → m (no visibility in km or miles is that large); else statute miles assumed (ambiguous).
 * - wind direction → deg; relative humidity → %.
 * @example inferUnit('temperature', [50, 55, 61]).unit // 'degF'
 */
export function inferUnit(field: InferField, values: ArrayLike<number>): InferredUnit {
  const { median, max, n } = finiteMedianMax(values);
  const stat = n ? `median ${round(median)}, max ${round(max)} over ${n} values` : 'no numeric values';
  switch (field) {
    case 'temperature':
    case 'dewpoint':
      if (n === 0) return { unit: 'degC', why: `${stat}; assumed °C`, ambiguous: true };
      if (median > 200) return { unit: 'K', why: `${stat}: above 200 means kelvin`, ambiguous: false };
      if (median > 45 || max > 60) return { unit: 'degF', why: `${stat}: too warm for °C, so °F`, ambiguous: false };
      return { unit: 'degC', why: `${stat}: fits °C (a cold °F record would look the same; name the unit if so)`, ambiguous: true };
    case 'stationPressure':
    case 'seaLevelPressure':
    case 'altimeter':
      if (n > 0) {
        if (median >= 15 && median <= 32.5) return { unit: 'inHg', why: `${stat}: inches of mercury range`, ambiguous: false };
        if (median >= 40 && median <= 110) return { unit: 'kPa', why: `${stat}: kPa range`, ambiguous: false };
        if (median >= 400 && median <= 1100) return { unit: 'hPa', why: `${stat}: hPa range`, ambiguous: false };
        if (median >= 40000 && median <= 110000) return { unit: 'Pa', why: `${stat}: Pa range`, ambiguous: false };
      }
      return { unit: 'hPa', why: `${stat}: no pressure unit fits; assumed hPa`, ambiguous: true };
    case 'windSpeed':
    case 'gust':
      return { unit: 'm/s', why: `speed units cannot be told from values (${stat}); assumed m/s — name the unit (e.g. name=windSpeed:kt)`, ambiguous: true };
    case 'precip':
      return { unit: 'mm', why: `precipitation units cannot be told from values (${stat}); assumed mm`, ambiguous: true };
    case 'elevation':
      return { unit: 'm', why: `elevation units cannot be told from values (${stat}); assumed m`, ambiguous: true };
    case 'visibility':
      if (n > 0 && max > 100) return { unit: 'm', why: `${stat}: above 100, so metres`, ambiguous: false };
      return { unit: 'mi', why: `visibility of at most 100 (${stat}); assumed statute miles — name the unit (e.g. name=visibility:km)`, ambiguous: true };
    case 'windDir':
      return { unit: 'deg', why: 'wind direction is in degrees', ambiguous: false };
    case 'relativeHumidity':
      return { unit: '%', why: n && max <= 1 ? `${stat}: looks like a fraction, but read as %` : 'relative humidity in %', ambiguous: n > 0 && max <= 1 };
    default:
      throw new TypeError(`inferUnit: unknown field ${JSON.stringify(field)}`);
  }
}

function round(v: number): number {
  return Math.round(v * 100) / 100;
}
