/**
 * Encode a synthetic series as CSV text in one of several header conventions and units:
 * - `iem`: Iowa Environmental Mesonet ASOS-download style `station,valid,tmpf,dwpf,drct,sknt,gust,alti,mslp,p01i`
 *   (UTC `YYYY-MM-DD HH:MM`, °F, kt, inHg altimeter, hPa SLP, inches since the top of the hour, `M` missing);
 * - `metric`: `time,station,temp_c,dewpoint_c,wind_dir_deg,wind_speed_ms,gust_ms,station_pressure_hpa`
 *   (ISO 8601 UTC with `Z`, empty = missing);
 * - `local-offset`: semicolon-delimited, local wall-clock time plus a `utc_offset` column, °F, relative
 *   humidity instead of dew point, mph, station pressure in inHg, `NA` missing;
 * - `local-naive`: as `local-offset` without the offset column (the reader needs the zone, e.g. `--tz`);
 * - `lcd`: NCEI Local Climatological Data style `STATION,DATE,REPORT_TYPE,HourlyDryBulbTemperature,...`, `DATE` in
 *   local STANDARD time all year (the reader needs the zone), whole °F, mph, inHg, hourly inches, empty missing;
 * - `generic-tab`: tab-delimited generic names with units as suffixes (`air_temp_c`, `wind_speed_kt`, `pres_hpa`,
 *   `precip_mm`), local time with its ISO 8601 offset (`2026-03-01T06:00-06:00`);
 * - `epoch-pipe`: pipe-delimited, epoch seconds, `tmpc`/`dwpc`, m/s, altimeter setting in hPa;
 * - `us-ampm`: US `MM/DD/YYYY hh:mm AM` local wall-clock time (the reader needs the zone), units in brackets
 *   (`Temp (°F)`, `Wind Speed (mph)`, `Station Pressure (inHg)`);
 * - `decimal-comma`: semicolon-delimited with decimal commas, `datetime_utc` without offset (read as UTC by its
 *   name), °C, m/s, hPa.
 * Every convention is one the CSV reader accepts by its header names (src/ingest/columns.ts).
 */
import { DateTime } from 'luxon';
import type { StationMeta } from '../../src/model/index.js';
import { makeRng } from './random.js';
import { altimeterHpaFromStation } from './toMetarLines.js';
import type { SynthSeries } from './types.js';

export type CsvConvention = 'iem' | 'metric' | 'local-offset' | 'local-naive' | 'lcd' | 'generic-tab' | 'epoch-pipe' | 'us-ampm' | 'decimal-comma';

/** Every convention, in a fixed order. */
export const CSV_CONVENTIONS: readonly CsvConvention[] = ['iem', 'metric', 'local-offset', 'local-naive', 'lcd', 'generic-tab', 'epoch-pipe', 'us-ampm', 'decimal-comma'];

/** Conventions whose times carry neither an offset nor a UTC marker: the reader needs the zone. */
export const CSV_NEEDS_ZONE: ReadonlySet<CsvConvention> = new Set(['local-naive', 'lcd', 'us-ampm']);

/** Standard (non-DST) offset of a zone in the year of `timeMs`, minutes east: the smaller of the 1 January and 1 July offsets. */
function standardOffsetMinutes(timeMs: number, zone: string): number {
  const y = new Date(timeMs).getUTCFullYear();
  return Math.min(DateTime.fromMillis(Date.UTC(y, 0, 1), { zone }).offset, DateTime.fromMillis(Date.UTC(y, 6, 1), { zone }).offset);
}

export interface CsvEncodeOptions {
  /** IANA zone for the local conventions (default `America/Chicago`). */
  zone?: string;
  /** Write every k-th sample so the cadence is this many minutes (default: the series cadence). */
  cadenceMinutes?: number;
  /** Exact duplicate rows to insert (default 0). */
  duplicates?: number;
  /** Damaged rows to insert (default 0). */
  badLines?: number;
  /** Seed for damage positions. */
  seed?: number;
}

/** 1 kt = 1852/3600 m/s exactly; 1 mph = 0.44704 m/s exactly (NIST SP 811 App. B.8). */
const MS_PER_KT = 1852 / 3600;
const MS_PER_MPH = 0.44704;
/** Conventional inch of mercury, hPa (NIST SP 811: 3386.389 Pa). */
const HPA_PER_INHG = 33.86389;

/**
 * Relative humidity, %, from T and Td (°C): 100·es(Td)/es(T) with the Magnus form
 * es = 6.1094 exp(17.625 T/(T + 243.04)) hPa, AlduchovEskridge1996 eq. 21. NaN in → NaN out.
 * @example relativeHumidityPct(20, 10) // ≈ 52.54
 */
export function relativeHumidityPct(tC: number, tdC: number): number {
  const es = (t: number) => 6.1094 * Math.exp((17.625 * t) / (t + 243.04));
  return (100 * es(tdC)) / es(tC);
}

const fmt = (v: number, digits: number, missing: string) => (Number.isFinite(v) ? v.toFixed(digits) : missing);
const cToF = (c: number) => c * 1.8 + 32;

/** Encode a series; returns the whole file text with a trailing newline. */
export function toCsvText(series: SynthSeries, station: StationMeta, convention: CsvConvention, opts: CsvEncodeOptions = {}): string {
  const rng = makeRng(opts.seed ?? 1);
  const n = series.length;
  const step = n > 1 ? series.timeMs[1]! - series.timeMs[0]! : 300000;
  const every = Math.max(1, Math.round(((opts.cadenceMinutes ?? step / 60000) * 60000) / step));
  const zone = opts.zone ?? 'America/Chicago';
  const elev = Number.isFinite(station.elevationM) ? station.elevationM : 0;
  const rows: string[] = [];
  let header: string;
  const delim = convention === 'local-offset' || convention === 'local-naive' || convention === 'decimal-comma' ? ';' : convention === 'generic-tab' ? '\t' : convention === 'epoch-pipe' ? '|' : ',';
  if (convention === 'iem') header = 'station,valid,tmpf,dwpf,drct,sknt,gust,alti,mslp,p01i';
  else if (convention === 'metric') header = 'time,station,temp_c,dewpoint_c,wind_dir_deg,wind_speed_ms,gust_ms,station_pressure_hpa';
  else if (convention === 'local-offset') header = 'datetime;utc_offset;station;temp_f;rh;wind_dir;wind_speed_mph;gust_mph;station_pressure_inhg';
  else if (convention === 'local-naive') header = 'datetime;station;temp_f;rh;wind_dir;wind_speed_mph;gust_mph;station_pressure_inhg';
  else if (convention === 'lcd')
    header =
      'STATION,DATE,REPORT_TYPE,HourlyDryBulbTemperature,HourlyDewPointTemperature,HourlyRelativeHumidity,HourlyWindDirection,HourlyWindSpeed,HourlyWindGustSpeed,HourlyStationPressure,HourlySeaLevelPressure,HourlyAltimeterSetting,HourlyPrecipitation';
  else if (convention === 'generic-tab') header = ['timestamp', 'site_id', 'air_temp_c', 'dew_point_c', 'wind_dir', 'wind_speed_kt', 'gust_kt', 'pres_hpa', 'precip_mm'].join('\t');
  else if (convention === 'epoch-pipe') header = 'epoch|stn|tmpc|dwpc|drct|wind_speed_ms|gust_ms|altimeter_hpa';
  else if (convention === 'us-ampm') header = 'Date/Time,Station,Temp (°F),Dew Point (°F),Wind Dir,Wind Speed (mph),Gust (mph),Station Pressure (inHg)';
  else header = 'datetime_utc;station;temp_c;dewpoint_c;wind_dir_deg;wind_speed_ms;gust_ms;station_pressure_hpa';
  const sid = convention === 'iem' ? (station.aliases[0] ?? station.id) : station.id;
  let hourAcc = 0;
  let hourKey = -1;
  for (let i = 0; i < n; i++) {
    const t = series.timeMs[i]!;
    const hk = Math.floor((t - 1) / 3600000);
    if (hk !== hourKey) {
      hourKey = hk;
      hourAcc = 0;
    }
    if (series.precipMm[i]! > 0) hourAcc += series.precipMm[i]!;
    if (i % every !== 0) continue;
    const T = series.temperatureC[i]!;
    const Td = series.dewpointC[i]!;
    const dir = series.windDirDeg[i]!;
    const spd = series.windSpeedMs[i]!;
    const gst = series.gustMs[i]!;
    const stn = series.stationPressureHpa[i]!;
    const down = Number.isNaN(T) && Number.isNaN(spd) && Number.isNaN(stn);
    if (down && convention !== 'iem') continue; // loggers write nothing while down; IEM rows with all M are kept
    if (convention === 'iem') {
      const kt = spd / MS_PER_KT;
      const gkt = gst / MS_PER_KT;
      const d = new Date(t).toISOString();
      rows.push(
        [
          sid,
          `${d.slice(0, 10)} ${d.slice(11, 16)}`,
          fmt(cToF(T), 2, 'M'),
          fmt(cToF(Td), 2, 'M'),
          fmt(Math.round(dir / 10) * 10, 2, 'M'),
          fmt(Math.round(kt), 2, 'M'),
          Number.isFinite(gkt) && Math.round(gkt) - Math.round(kt) >= 5 && gkt >= 12 ? fmt(Math.round(gkt), 2, 'M') : 'M',
          fmt(Math.floor((altimeterHpaFromStation(stn, elev) / HPA_PER_INHG) * 100 + 1e-9) / 100, 2, 'M'),
          fmt(series.seaLevelPressureHpa[i]!, 1, 'M'),
          down ? 'M' : fmt(hourAcc / 25.4, 2, 'M'),
        ].join(','),
      );
    } else if (convention === 'metric') {
      rows.push(
        [new Date(t).toISOString().replace('.000Z', 'Z'), sid, fmt(T, 1, ''), fmt(Td, 1, ''), fmt(dir, 0, ''), fmt(spd, 1, ''), fmt(gst, 1, ''), fmt(stn, 1, '')].join(','),
      );
    } else if (convention === 'lcd') {
      const local = new Date(t + standardOffsetMinutes(t, zone) * 60000).toISOString().slice(0, 19);
      const mph = Math.round(spd / MS_PER_MPH);
      const gmph = Math.round(gst / MS_PER_MPH);
      rows.push(
        [
          sid,
          local,
          'FM-15',
          fmt(Math.round(cToF(T)), 0, ''),
          fmt(Math.round(cToF(Td)), 0, ''),
          fmt(Math.round(relativeHumidityPct(T, Td)), 0, ''),
          fmt(Math.round(dir / 10) * 10, 0, ''),
          fmt(mph, 0, ''),
          Number.isFinite(gmph) && gmph - mph >= 5 ? fmt(gmph, 0, '') : '',
          fmt(stn / HPA_PER_INHG, 2, ''),
          fmt(series.seaLevelPressureHpa[i]! / HPA_PER_INHG, 2, ''),
          fmt(altimeterHpaFromStation(stn, elev) / HPA_PER_INHG, 2, ''),
          fmt(hourAcc / 25.4, 2, ''),
        ].join(','),
      );
    } else if (convention === 'generic-tab') {
      const lt = DateTime.fromMillis(t, { zone });
      rows.push(
        [lt.toFormat("yyyy-MM-dd'T'HH:mmZZ"), sid, fmt(T, 1, ''), fmt(Td, 1, ''), fmt(dir, 0, ''), fmt(spd / MS_PER_KT, 1, ''), fmt(gst / MS_PER_KT, 1, ''), fmt(stn, 1, ''), fmt(series.precipMm[i]!, 1, '')].join(
          '\t',
        ),
      );
    } else if (convention === 'epoch-pipe') {
      rows.push([String(Math.round(t / 1000)), sid, fmt(T, 1, 'NA'), fmt(Td, 1, 'NA'), fmt(dir, 0, 'NA'), fmt(spd, 1, 'NA'), fmt(gst, 1, 'NA'), fmt(altimeterHpaFromStation(stn, elev), 1, 'NA')].join('|'));
    } else if (convention === 'us-ampm') {
      const lt = DateTime.fromMillis(t, { zone });
      rows.push([lt.toFormat('MM/dd/yyyy hh:mm a'), sid, fmt(cToF(T), 1, ''), fmt(cToF(Td), 1, ''), fmt(dir, 0, ''), fmt(spd / MS_PER_MPH, 1, ''), fmt(gst / MS_PER_MPH, 1, ''), fmt(stn / HPA_PER_INHG, 3, '')].join(','));
    } else if (convention === 'decimal-comma') {
      const c = (v: number, digits: number) => fmt(v, digits, '').replace('.', ',');
      const d = new Date(t).toISOString();
      rows.push([`${d.slice(0, 10)} ${d.slice(11, 16)}`, sid, c(T, 1), c(Td, 1), c(dir, 0), c(spd, 1), c(gst, 1), c(stn, 1)].join(';'));
    } else {
      const lt = DateTime.fromMillis(t, { zone });
      const cells = [lt.toFormat('yyyy-MM-dd HH:mm')];
      if (convention === 'local-offset') cells.push(lt.toFormat('ZZ'));
      cells.push(
        sid,
        fmt(cToF(T), 1, 'NA'),
        fmt(relativeHumidityPct(T, Td), 1, 'NA'),
        fmt(dir, 0, 'NA'),
        fmt(spd / MS_PER_MPH, 1, 'NA'),
        fmt(gst / MS_PER_MPH, 1, 'NA'),
        fmt(stn / HPA_PER_INHG, 3, 'NA'),
      );
      rows.push(cells.join(delim));
    }
  }
  for (let k = 0; k < (opts.duplicates ?? 0) && rows.length > 2; k++) {
    const j = rng.int(1, rows.length - 2);
    rows.splice(j + 1, 0, rows[j]!);
  }
  for (let k = 0; k < (opts.badLines ?? 0) && rows.length > 2; k++) {
    const j = rng.int(1, rows.length - 2);
    const src = rows[j]!.split(delim);
    const kind = rng.int(0, 2);
    let bad: string;
    if (kind === 0) bad = src.slice(0, Math.max(2, Math.floor(src.length / 2))).join(delim); // truncated row
    else if (kind === 1) bad = [src[0], ...src.slice(1).map((c, m) => (m === 2 ? '#VALUE!' : c))].join(delim); // garbled cell
    else bad = src.map((c, m) => (m === (convention === 'iem' || convention === 'lcd' ? 1 : 0) ? 'not-a-time' : c)).join(delim); // bad time
    rows.splice(j + 1, 0, bad);
  }
  return [header, ...rows].join('\n') + '\n';
}
