import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { readFileSync } from 'node:fs';
import { REALDATA_DIR, realdataTest } from '../helpers/realdata.js';
import { loadMappingFile, mapColumns, matchHeader, parseColumnOverride } from '../../src/ingest/columns.js';

/** A real-data file's header cells (the tests that call this register with realdataTest, so the file exists). */
function headerOf(name: string): string[] {
  const first = readFileSync(REALDATA_DIR + name, 'utf8').split('\n', 1)[0]!;
  return first.split(name.endsWith('.tsv') ? '\t' : ',');
}

// Iowa Environmental Mesonet ASOS download, KJFK file (real header).
realdataTest(test, 'KJFK_2019-11_to_2020-02_asos.csv')('mapColumns() maps the IEM ASOS KJFK header with conventional units', () => {
  const h = headerOf('KJFK_2019-11_to_2020-02_asos.csv');
  const { mapping, unmatched } = mapColumns(h);
  assert.is(mapping.station!.header, 'station');
  assert.is(mapping.time!.header, 'valid');
  assert.equal([mapping.temperature!.header, mapping.temperature!.unit], ['tmpf', 'degF']);
  assert.equal([mapping.dewpoint!.header, mapping.dewpoint!.unit], ['dwpf', 'degF']);
  assert.equal([mapping.windSpeed!.header, mapping.windSpeed!.unit], ['sknt', 'kt']);
  assert.equal([mapping.altimeter!.header, mapping.altimeter!.unit], ['alti', 'inHg']);
  assert.equal([mapping.seaLevelPressure!.header, mapping.seaLevelPressure!.unit], ['mslp', 'hPa']);
  assert.equal([mapping.precip!.header, mapping.precip!.unit], ['p01i', 'in']);
  assert.is(mapping.relativeHumidity!.header, 'relh');
  assert.is(mapping.windDir!.header, 'drct');
  assert.is(mapping.gust!.header, 'gust');
  assert.is(mapping.weatherCodes!.header, 'wxcodes');
  assert.is(mapping.rawReport!.header, 'metar');
  assert.ok(unmatched.includes('peak_wind_gust')); // peak wind is not the gust of the report
  assert.ok(unmatched.includes('feel'));
});

// IEM downloads of Oct 2010 with padded headers (` tmpc `, `  dwpc `).
realdataTest(test, 'oct2010_asos_ORD.csv')('mapColumns() trims padded headers (oct2010 IEM files)', () => {
  const h = headerOf('oct2010_asos_ORD.csv');
  const { mapping, unmatched } = mapColumns(h);
  assert.equal([mapping.temperature!.index, mapping.temperature!.unit], [2, 'degC']);
  assert.equal([mapping.dewpoint!.index, mapping.dewpoint!.unit], [3, 'degC']);
  assert.equal([mapping.windSpeed!.index, mapping.windSpeed!.unit], [5, 'kt']);
  assert.equal([mapping.seaLevelPressure!.index, mapping.seaLevelPressure!.unit], [6, 'hPa']);
  assert.equal([mapping.precip!.index, mapping.precip!.unit], [7, 'mm']);
  assert.equal(unmatched, []);
});

// nycflights13 `weather` table: °F, mph, hPa, inches (its R documentation).
realdataTest(test, 'nyc_2013_EWR_JFK_LGA_hourly.csv')('mapColumns() maps the nycflights13 weather header', () => {
  const h = headerOf('nyc_2013_EWR_JFK_LGA_hourly.csv');
  const { mapping, unmatched } = mapColumns(h);
  assert.is(mapping.station!.header, 'origin');
  assert.is(mapping.time!.header, 'time_hour');
  assert.is(mapping.temperature!.unit, 'degF');
  assert.is(mapping.dewpoint!.unit, 'degF');
  assert.is(mapping.windSpeed!.unit, 'mph');
  assert.is(mapping.gust!.header, 'wind_gust');
  assert.is(mapping.seaLevelPressure!.unit, 'hPa');
  assert.is(mapping.precip!.unit, 'in');
  assert.is(mapping.relativeHumidity!.header, 'humid');
  // nycflights13 R documentation: `visib` visibility in miles
  assert.equal([mapping.visibility!.header, mapping.visibility!.unit], ['visib', 'mi']);
  assert.equal(unmatched, ['year', 'month', 'day', 'hour']); // `hour` is local time: not used
});

realdataTest(test, 'colorado_2017_FNL_LMO_1V6_0CO.tsv')('mapColumns() maps the tab-separated Colorado header', () => {
  const h = headerOf('colorado_2017_FNL_LMO_1V6_0CO.tsv');
  const { mapping } = mapColumns(h);
  assert.equal(Object.keys(mapping).sort(), ['dewpoint', 'seaLevelPressure', 'station', 'temperature', 'time']);
  assert.is(mapping.windSpeed, undefined);
});

// NCEI Local Climatological Data column names (LCD documentation, from memory).
test('mapColumns() maps NCEI LCD names with their units and notes the local standard time', () => {
  const h = ['STATION', 'DATE', 'LATITUDE', 'LONGITUDE', 'ELEVATION', 'NAME', 'REPORT_TYPE', 'SOURCE', 'HourlyAltimeterSetting', 'HourlyDewPointTemperature', 'HourlyDryBulbTemperature', 'HourlyPrecipitation', 'HourlyPresentWeatherType', 'HourlyRelativeHumidity', 'HourlySeaLevelPressure', 'HourlyStationPressure', 'HourlyWindDirection', 'HourlyWindGustSpeed', 'HourlyWindSpeed', 'REM'];
  const { mapping, notes } = mapColumns(h);
  assert.is(mapping.time!.header, 'DATE');
  assert.is(mapping.station!.header, 'STATION');
  assert.is(mapping.reportType!.header, 'REPORT_TYPE');
  assert.is(mapping.temperature!.unit, 'degF');
  assert.is(mapping.windSpeed!.unit, 'mph');
  assert.is(mapping.gust!.unit, 'mph');
  assert.is(mapping.stationPressure!.unit, 'inHg');
  assert.is(mapping.seaLevelPressure!.unit, 'inHg');
  assert.is(mapping.altimeter!.unit, 'inHg');
  assert.is(mapping.precip!.unit, 'in');
  assert.is(mapping.rawReport!.header, 'REM');
  assert.is(mapping.elevation!.header, 'ELEVATION');
  assert.ok(notes.some((n) => /local standard time/.test(n)));
});

// Generic names: common practice, no source.
test('matchHeader() knows generic names, bracketed and suffixed units', () => {
  assert.equal(matchHeader('Timestamp'), { field: 'time' });
  assert.is(matchHeader('date_time')!.field, 'time');
  assert.is(matchHeader('Air Temp')!.field, 'temperature');
  assert.is(matchHeader('Dew Point (°F)')!.field, 'dewpoint');
  assert.is(matchHeader('temp_F')!.field, 'temperature');
  assert.is(matchHeader('wind_speed_ms')!.unit, 'm/s');
  assert.is(matchHeader('QNH')!.field, 'altimeter');
  assert.is(matchHeader('slp')!.field, 'seaLevelPressure');
  assert.is(matchHeader('station_pressure')!.field, 'stationPressure');
  assert.is(matchHeader('RH')!.field, 'relativeHumidity');
  assert.is(matchHeader('visibility')!.field, 'visibility');
  assert.is(matchHeader('ozone'), null);
  const { mapping } = mapColumns(['time', 'Temperature (degF)', 'wspd_kt']);
  assert.equal([mapping.temperature!.unit, mapping.temperature!.unitSource], ['degF', 'header']);
  assert.is(mapping.windSpeed!.unit, 'kt');
});

test('mapColumns() keeps the first column for a field and notes the other', () => {
  const { mapping, notes, unmatched } = mapColumns(['valid', 'tmpf', 'tmpc']);
  assert.is(mapping.temperature!.header, 'tmpf');
  assert.ok(unmatched.includes('tmpc'));
  assert.ok(notes.some((n) => n.includes('tmpc')));
});

test('parseColumnOverride() reads name=field[:unit] and mapColumns() applies it', () => {
  assert.equal(parseColumnOverride('T_air=temperature:F'), { header: 'T_air', field: 'temperature', unit: 'degF' });
  assert.equal(parseColumnOverride('vsby=ignore'), { header: 'vsby', field: 'ignore' });
  const { mapping } = mapColumns(['valid', 'tmpc', 'T_air', 'speed'], [parseColumnOverride('T_air=temperature:degF'), parseColumnOverride('speed=windSpeed:km/h'), parseColumnOverride('tmpc=ignore')]);
  assert.equal([mapping.temperature!.header, mapping.temperature!.unit, mapping.temperature!.unitSource], ['T_air', 'degF', 'override']);
  assert.is(mapping.windSpeed!.unit, 'km/h');
});

test('parseColumnOverride() rejects unknown fields and units with clear RangeErrors', () => {
  assert.throws(() => parseColumnOverride('x=temprature'), /unknown field "temprature"; known fields: time/);
  assert.throws(() => parseColumnOverride('x=temperature:furlongs'), /unknown unit "furlongs"; known units: degC/);
  assert.throws(() => parseColumnOverride('x=temperature:kt'), /kt is a speed unit, but temperature needs a temperature unit/);
  assert.throws(() => parseColumnOverride('novalue'), /name=field/);
});

test('loadMappingFile() reads columns, missing markers and zone', () => {
  const m = loadMappingFile('{ "columns": { "Temp": "temperature:degF", "Gust": "gust:kt" }, "missing": ["-99", -88], "tz": "America/Chicago" }');
  assert.equal(m.overrides, [
    { header: 'Temp', field: 'temperature', unit: 'degF' },
    { header: 'Gust', field: 'gust', unit: 'kt' },
  ]);
  assert.equal(m.missing, ['-99', '-88']);
  assert.is(m.zone, 'America/Chicago');
  assert.throws(() => loadMappingFile('{ "columns": { "T": "temperature:xyz" } }'), /unknown unit "xyz"/);
  assert.throws(() => loadMappingFile('{ "colums": {} }'), /unknown key "colums"/);
  assert.throws(() => loadMappingFile('{ bad json'), /not valid JSON/);
});

test.run();
