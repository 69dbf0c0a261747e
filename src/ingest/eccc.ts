/**
 * Conventions of the Environment and Climate Change Canada (ECCC) hourly CSV (climate.weather.gc.ca bulk
 * download) that the CSV reader needs beyond its column names (columns.ts):
 * - `Date/Time (LST)` is local standard time all year. The file gives no zone, but its `Climate ID` does
 *   name the province: ECCC climate identifiers are seven characters whose first one or two give the
 *   province or territory (from memory of the ECCC station inventory; not re-checked against a printed
 *   source). A province gives the UTC offset only where all of it keeps one standard time; the others
 *   (British Columbia, Saskatchewan's Lloydminster area, Ontario, Quebec, Newfoundland and Labrador, Yukon,
 *   Nunavut) take the zone at the station's coordinates (zones.ts), and a zone found there whose standard time
 *   is none of the province's is refused (a longitude whose sign was lost, say); without coordinates they need
 *   `--tz` or `--utc-offset`. Longitude alone is never used as a zone.
 * - `Weather` holds words ("Rain", "Snow Showers", "Freezing Rain,Fog"), read here into the WX flags the
 *   METAR decoder gives the matching WMO-No. 306 code table 4678 groups (words and their meaning from
 *   memory of the ECCC historical climate data glossary, "Weather").
 */
import { WX } from '../model/index.js';
import { weatherFlags } from './metar/weather.js';

/** A province or territory as a climate identifier names it. */
export interface EcccProvince {
  /** Two-letter postal abbreviation. */
  code: string;
  name: string;
  /** Its one standard time as minutes east of UTC, or null when it keeps more than one. */
  standardOffsetMinutes: number | null;
  /** Every standard time its zones keep (minutes east of UTC). */
  standardOffsetsMinutes: readonly number[];
}

/**
 * Leading characters of a climate identifier → province (from memory, see the module comment). Standard
 * offsets: Mountain −7 h, Central −6 h, Atlantic −4 h (IANA tz database: America/Edmonton, America/Winnipeg,
 * America/Halifax, America/Moncton, America/Yellowknife). The standard times of the provinces with several are
 * those of the zones the IANA tz database's zone.tab names for them in its comments: BC Pacific and Mountain
 * (America/Vancouver; America/Edmonton "BC(E)", Creston, Dawson_Creek, Fort_Nelson MST), Yukon Pacific until 2020
 * and MST since (America/Whitehorse, America/Dawson), Nunavut Eastern, Central and Mountain (Iqaluit, Atikokan
 * "NU (Coral H)", Rankin_Inlet, Resolute, Cambridge_Bay), Saskatchewan Central and Mountain (Regina,
 * Swift_Current; America/Edmonton "SK(W)"), Ontario Eastern and Central (Toronto, Atikokan; America/Winnipeg
 * "ON (west)"), Quebec Eastern and Atlantic (Toronto; Blanc-Sablon "QC (Lower North Shore)"), Newfoundland and
 * Labrador Newfoundland and Atlantic time (St_Johns; Goose_Bay).
 */
/** A province and its standard times; the one standard offset is derived (null when it keeps more than one). */
function province(code: string, name: string, offsets: readonly number[]): EcccProvince {
  return { code, name, standardOffsetMinutes: offsets.length === 1 ? offsets[0]! : null, standardOffsetsMinutes: offsets };
}

const PROVINCES: readonly [prefix: string, p: EcccProvince][] = [
  ['1', province('BC', 'British Columbia', [-480, -420])],
  ['21', province('YT', 'Yukon', [-480, -420])],
  ['22', province('NT', 'Northwest Territories', [-420])],
  ['23', province('NU', 'Nunavut', [-300, -360, -420])],
  ['24', province('NU', 'Nunavut', [-300, -360, -420])],
  ['25', province('NU', 'Nunavut', [-300, -360, -420])],
  ['3', province('AB', 'Alberta', [-420])],
  ['4', province('SK', 'Saskatchewan', [-360, -420])],
  ['5', province('MB', 'Manitoba', [-360])],
  ['6', province('ON', 'Ontario', [-300, -360])],
  ['7', province('QC', 'Quebec', [-300, -240])],
  ['81', province('NB', 'New Brunswick', [-240])],
  ['82', province('NS', 'Nova Scotia', [-240])],
  ['83', province('PE', 'Prince Edward Island', [-240])],
  ['84', province('NL', 'Newfoundland and Labrador', [-210, -240])],
];

/**
 * The province or territory an ECCC climate identifier names (seven characters, the first a digit), or null.
 * @example ecccProvince('8202250') // { code: 'NS', name: 'Nova Scotia', standardOffsetMinutes: -240, standardOffsetsMinutes: [-240] }
 */
export function ecccProvince(climateId: string): EcccProvince | null {
  const id = climateId.trim().toUpperCase();
  if (!/^[0-9][0-9A-Z]{6}$/.test(id)) return null;
  for (const [prefix, p] of PROVINCES) if (id.startsWith(prefix)) return p;
  return null;
}

/** ECCC `Date/Time (LST)` headers and a `Climate ID` column: the hourly layout. */
export function isEcccHeaders(headers: readonly string[]): boolean {
  let climateId = false;
  let lst = false;
  for (const h of headers) {
    const t = h.trim().toLowerCase();
    if (t === 'climate id' || t === 'climate_id') climateId = true;
    if (t === 'date/time (lst)') lst = true;
  }
  return climateId && lst;
}

/** ECCC weather words (lower case) → the FM 15 group they stand for (code table 4678). */
const WORDS: Record<string, string> = {
  rain: 'RA',
  'rain showers': 'SHRA',
  drizzle: 'DZ',
  'freezing rain': 'FZRA',
  'freezing drizzle': 'FZDZ',
  snow: 'SN',
  'snow showers': 'SHSN',
  'snow grains': 'SG',
  'snow pellets': 'GS',
  'ice pellets': 'PL',
  'ice pellet showers': 'SHPL',
  'ice crystals': 'IC',
  hail: 'GR',
  thunderstorms: 'TS',
  thunderstorm: 'TS',
  fog: 'FG',
  'freezing fog': 'FZFG',
  'ice fog': 'FG',
  haze: 'HZ',
  smoke: 'FU',
  dust: 'DU',
  'blowing dust': 'BLDU',
  'blowing snow': 'BLSN',
  'drifting snow': 'DRSN',
  'funnel cloud': 'FC',
  tornado: '+FC',
  waterspout: 'FC',
  squalls: 'SQ',
};

/** Sky states and markers that carry no present weather. */
const NO_WEATHER = new Set(['clear', 'mainly clear', 'mostly cloudy', 'cloudy', 'na', '']);

/**
 * WX flags of an ECCC `Weather` cell: comma-separated words, each optionally after `Light`, `Moderate` or
 * `Heavy` (`Heavy` adds WX.HEAVY, as `+` does in a METAR group; `Light` and `Moderate` add WX.LIGHT and WX.MODERATE
 * to precipitation). A word without one carries no intensity: the METAR convention that no sign means moderate is
 * not the words'. Words it does not know are returned, to be counted by the caller.
 * @example ecccWeatherFlags('Freezing Rain,Fog').flags // WX.FREEZING | WX.RAIN | WX.PRECIP | WX.FOG
 */
export function ecccWeatherFlags(text: string): { flags: number; unknown: string[] } {
  let flags = 0;
  const unknown: string[] = [];
  for (const part of text.split(',')) {
    let w = part.trim().toLowerCase().replace(/\s+/g, ' ');
    if (NO_WEATHER.has(w)) continue;
    let heavy = false;
    let intensity = 0;
    const m = /^(light|moderate|heavy) (.*)$/.exec(w);
    if (m) {
      heavy = m[1] === 'heavy';
      intensity = m[1] === 'light' ? WX.LIGHT : m[1] === 'moderate' ? WX.MODERATE : 0;
      w = m[2]!;
    }
    const code = WORDS[w];
    if (code === undefined) {
      unknown.push(part.trim());
      continue;
    }
    const f = weatherFlags(code, 0, code.length) & ~(WX.LIGHT | WX.MODERATE);
    flags |= f | (heavy ? WX.HEAVY : 0) | (f & WX.PRECIP ? intensity : 0);
  }
  return { flags, unknown };
}
