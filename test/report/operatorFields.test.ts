/**
 * Operators' event fields: levels before/after, minima and first freeze after, precipitation type near the passage,
 * wind before, which pressure, runway components. Real cases from ../shared/realdata (station and time named at each
 * check; expected values read from the reports themselves), constructed cases for the edges.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { loadPaths } from '../../src/pipeline.js';
import { operatorFields, parseRunways, precipIntensityOf, precipTypesOf, pressureSource, windOnRunway, withOperatorFields } from '../../src/report/operatorFields.js';
import { eventToRecord, eventsToCsv, EVENT_COLUMNS, recordColumns } from '../../src/report/format.js';
import { allocSeries, WX } from '../../src/model/index.js';
import { KNOT_MS } from '../../src/physics/constants.js';
import { REALDATA_DIR, realdataTest } from '../helpers/realdata.js';
import { sampleEvent } from './sampleEvent.js';

const KORD = 'KORD_2024-02-27_28_metar.txt';
const real = realdataTest(test, KORD, 'stations.csv', 'oct2010_asos_MSP.csv');
const near = (a: number, b: number, tol: number, what: string) => assert.ok(Math.abs(a - b) <= tol, `${what}: ${a} vs ${b}`);

function kord() {
  const r = loadPaths([REALDATA_DIR + KORD], { stationsFile: REALDATA_DIR + 'stations.csv' });
  return r.series.find((s) => s.station === 'KORD')!;
}

real('KORD 2024-02-28, synoptic cold front about 04:30-05:30Z: levels, minima and first freeze read from the reports', () => {
  const s = kord();
  const t = Date.UTC(2024, 1, 28, 5, 0);
  const f = operatorFields(s, sampleEvent({ station: 'KORD', timeMs: t }));
  // KORD 280451Z `12/10 ... T01220100`: 12.2 °C, dew point 10.0 °C, the only report in the hour before 05:00Z
  near(f.tempBeforeC, 12.2, 0.51, 'temperature before');
  near(f.dewpointBeforeC, 10.0, 0.51, 'dew point before');
  // KORD 280651Z 10 °C (T0100) and 280751Z 7 °C (T0072): median of the 1-3 h after ≈ 8.6 °C
  near(f.tempAfterC, 8.6, 0.51, 'temperature after');
  // KORD 281051Z `00/M04 ... T00001039`: first report at or below 0 °C after the passage
  assert.is(new Date(f.freezeTimeMs).toISOString(), '2024-02-28T10:51:00.000Z');
  // KORD 281551Z `M07/M13 ... T10671128`: lowest in the 12 h after (-6.7 °C, or -7 from the body group)
  near(f.tempMin12hC, -6.7, 0.31, 'minimum 12 h');
  // KORD 281051Z 0.0 °C is the lowest through 11:00Z
  near(f.tempMin6hC, 0, 0.51, 'minimum 6 h');
  // KORD 280223Z `-TSRA` in the 6 h before 05:00Z
  assert.is(f.precipBefore6h, true);
  // KORD 280451Z `25009KT`: 9 kt in the hour before
  near(f.windSpeedBeforeMs, 9 * KNOT_MS, 0.05, 'wind before');
});

real('KORD 2024-02-28 08:51Z `-PLRA` and 09:00Z `-RA`: rain and ice pellets near the passage, not heavy', () => {
  const f = operatorFields(kord(), sampleEvent({ station: 'KORD', timeMs: Date.UTC(2024, 1, 28, 8, 51) }));
  // WMO-No. 306 code table 4678: PL ice pellets, RA rain; `-` light
  assert.equal(f.precipTypes, ['rain', 'ice-pellets']);
  assert.is(f.precipHeavy, false);
  // the reports within ±1 h: 280835Z `-PLRA`, 280851Z `-PLRA`, 280900Z `-RA`, 280942Z none: all light
  assert.is(f.precipIntensity, 'light');
});

real('KORD 2024-02-28 02:23Z `-TSRA` with hail in the remarks window: thunder reported near the squall line', () => {
  const f = operatorFields(kord(), sampleEvent({ station: 'KORD', timeMs: Date.UTC(2024, 1, 28, 2, 10) }));
  assert.ok(f.precipTypes.includes('thunder'), f.precipTypes.join(','));
  assert.ok(f.precipTypes.includes('rain'), f.precipTypes.join(','));
  // 280133Z `-TSRA` ... 280208Z `TSRA` (no sign: moderate, WMO-No. 306 code table 4678): the strongest within ±1 h
  assert.is(f.precipIntensity, 'moderate');
});

test('precipIntensityOf(): the strongest intensity; heavy only with precipitation, as precip_heavy', () => {
  // WMO-No. 306 code table 4678: `-` light, no sign moderate, `+` heavy
  assert.is(precipIntensityOf(WX.RAIN | WX.PRECIP | WX.LIGHT), 'light');
  assert.is(precipIntensityOf(WX.RAIN | WX.PRECIP | WX.LIGHT | WX.MODERATE), 'moderate');
  assert.is(precipIntensityOf(WX.RAIN | WX.PRECIP | WX.LIGHT | WX.HEAVY), 'heavy');
  // constructed: +FC (tornado) without precipitation is not heavy precipitation
  assert.is(precipIntensityOf(WX.HEAVY), null);
  assert.is(precipIntensityOf(WX.THUNDER), null);
  // constructed: precipitation from an LCD section without a sign: intensity unknown
  assert.is(precipIntensityOf(WX.RAIN | WX.PRECIP), null);
});

real('KORD 2024-02-28 visibility and ceiling before and after: the squall line at 02:00Z and the cold front at 05:00Z', () => {
  const s = kord();
  const MILE_M = 1609.344; // NIST SP 811 App. B.8
  // hour before 02:00Z: 280109Z 10SM BKN065, 280133Z 9SM BKN055, 280151Z 4SM BKN050, 280159Z 2SM BKN040 → lower
  // median 4 SM, 5000 ft (FMH-1 §12.6.9: ceiling = lowest BKN/OVC layer; heights in hundreds of feet)
  let f = operatorFields(s, sampleEvent({ station: 'KORD', timeMs: Date.UTC(2024, 1, 28, 2, 0) }));
  near(f.visibilityBeforeM, 4 * MILE_M, 1e-6, 'visibility before');
  assert.is(f.ceilingBeforeFt, 5000);
  // 03:00-05:00Z: 280351Z and 280451Z `10SM FEW050`: no ceiling
  near(f.visibilityAfterM, 10 * MILE_M, 1e-6, 'visibility after');
  assert.is(f.ceilingAfterFt, Infinity);
  assert.is(eventToRecord({ ...sampleEvent({ station: 'KORD' }), operator: f }).ceiling_after_ft, 'none');
  // after 05:00Z: 280651Z `SCT032 BKN250`, 280751Z `SCT035 BKN130 BKN250` → lower median 13000 ft
  f = operatorFields(s, sampleEvent({ station: 'KORD', timeMs: Date.UTC(2024, 1, 28, 5, 0) }));
  assert.is(f.ceilingBeforeFt, Infinity);
  assert.is(f.ceilingAfterFt, 13000);
});

test('visibility and ceiling: no reports in a window give NaN (empty), written null in JSON', () => {
  const s = allocSeries('XTST', 0);
  const f = operatorFields(s, sampleEvent({ station: 'XTST', timeMs: Date.UTC(2026, 2, 4, 12) }));
  assert.ok(Number.isNaN(f.visibilityBeforeM) && Number.isNaN(f.ceilingAfterFt));
  const r = eventToRecord({ ...sampleEvent({ station: 'XTST' }), operator: f });
  assert.is(r.visibility_before_m, null);
  assert.is(r.ceiling_after_ft, null);
});

real('which pressure: KORD (altimeter setting A2922 with elevation 204.8 m) vs MSP October 2010 (sea-level pressure only)', () => {
  // KORD reports carry the altimeter setting; station pressure is derived from it (NWS inversion)
  assert.is(pressureSource(kord()), 'station-from-altimeter');
  const msp = loadPaths([REALDATA_DIR + 'oct2010_asos_MSP.csv']).series[0]!;
  // oct2010 files: columns `station,valid,tmpc,dwpc,drct,sknt,mslp,p01m` (README of the shared data)
  assert.is(pressureSource(msp), 'sea-level');
});

test('windOnRunway: FAA-H-8083-25B crosswind chart example (from memory): 40 kt 30° off the runway → 20 kt cross, ≈35 kt head', () => {
  const c = windOnRunway(70, 40, 40);
  near(c.crosswindMs, 20, 1e-9, 'crosswind');
  near(c.tailwindMs, -40 * Math.cos(Math.PI / 6), 1e-9, 'tailwind');
  // constructed: straight tailwind, left crosswind, calm
  near(windOnRunway(220, 10, 40).tailwindMs, 10, 1e-9, 'tailwind');
  near(windOnRunway(310, 10, 40).crosswindMs, -10, 1e-9, 'crosswind from the left');
  assert.equal(windOnRunway(NaN, 0, 40), { crosswindMs: 0, tailwindMs: 0 });
  assert.ok(Number.isNaN(windOnRunway(NaN, 5, 40).crosswindMs));
});

test('parseRunways: ICAO Annex 14 §5.2.2 designators are the heading ÷ 10; three digits are headings; bad parts refused', () => {
  assert.equal(parseRunways('04/22,13/31').map((r) => [r.runway, r.headingDeg]), [['04', 40], ['22', 220], ['13', 130], ['31', 310]]);
  assert.equal(parseRunways('09L/27R').map((r) => r.headingDeg), [90, 270]);
  assert.equal(parseRunways('36/18').map((r) => r.headingDeg), [360, 180]);
  assert.equal(parseRunways('043').map((r) => r.headingDeg), [43]);
  assert.throws(() => parseRunways('40/22'), /designators run 01–36/);
  assert.throws(() => parseRunways('4x'), /expected a designator/);
});

test('precipTypesOf: WMO-No. 306 code table 4678 (FZRA freezing rain, FZFG fog alone is no precipitation)', () => {
  assert.equal(precipTypesOf(WX.RAIN | WX.FREEZING | WX.PRECIP), ['freezing-rain']);
  assert.equal(precipTypesOf(WX.FREEZING | WX.FOG), []);
  assert.equal(precipTypesOf(WX.SNOW | WX.THUNDER | WX.SHOWER | WX.PRECIP), ['snow', 'thunder']);
  assert.equal(precipTypesOf(WX.DRIZZLE | WX.FREEZING), ['freezing-drizzle']);
});

test('constructed series: no freeze when it stays above 0 °C; levels NaN without reports; QC-flagged values ignored', () => {
  const s = allocSeries('XTST', 4);
  const t0 = Date.UTC(2026, 0, 1, 12);
  [-2, -1, 1.5, 3].forEach((h, i) => (s.timeMs[i] = t0 + h * 3600000));
  s.temperatureC.set([8, 7, 2, 1]);
  s.qc.temperatureC[3] = 1; // flagged: the 1 °C is not used
  const f = operatorFields(s, sampleEvent({ station: 'XTST', timeMs: t0 }));
  assert.is(f.tempBeforeC, 7);
  assert.is(f.tempAfterC, 2);
  assert.is(f.tempMin12hC, 2);
  assert.ok(Number.isNaN(f.freezeTimeMs));
  assert.ok(Number.isNaN(f.dewpointBeforeC));
  assert.is(f.pressureSource, 'none');
});

test('constructed series: window ends as documented (before = [t0 − 1 h, t0), after = [t0 + 1 h, t0 + 3 h], minima and freeze in (t0, t0 + 12 h]), with many reports around', () => {
  // The windows are the ones in the doc comment of operatorFields (common practice, no source); the reports
  // stand exactly on every window end, so a time window found by search must keep each end open or closed.
  const H = 3600000;
  const t0 = Date.UTC(2026, 0, 1, 12);
  const hours = [-6.5, -6, -1.001, -1, -0.5, 0, 0.999, 1, 2, 3, 3.001, 6, 6.001, 12, 12.001];
  const s = allocSeries('XTST', hours.length);
  hours.forEach((h, i) => (s.timeMs[i] = t0 + h * H));
  // Temperatures that tell the reports apart: the report at t0 + 12.001 h is the coldest and outside every window.
  s.temperatureC.set([20, 19, 18, 10, 12, 30, 15, 9, 7, 5, 4, 3, 2, 1, -20]);
  const f = operatorFields(s, sampleEvent({ station: 'XTST', timeMs: t0 }));
  assert.is(f.tempBeforeC, 11, 'median of the reports at −1 h and −0.5 h (the one at t0 is not before)');
  assert.is(f.tempAfterC, 7, 'median of +1, +2 and +3 h (+0.999 h and +3.001 h are outside)');
  assert.is(f.tempMin6hC, 3, 'minimum over (t0, t0 + 6 h]: the report at +6 h counts, +6.001 h does not');
  assert.is(f.tempMin12hC, 1, 'minimum over (t0, t0 + 12 h]: the report at +12.001 h does not count');
  assert.ok(Number.isNaN(f.freezeTimeMs), 'the only freezing report is after t0 + 12 h');
  // Several events of one station (its columns prepared once) give each event's own fields.
  const events = [sampleEvent({ station: 'XTST', timeMs: t0 }), sampleEvent({ station: 'XTST', timeMs: t0 + 2 * H })];
  const both = withOperatorFields(events, [s]);
  assert.equal(both.map((e) => e.operator), events.map((e) => operatorFields(s, e)));
  assert.is(both[1]!.operator!.tempBeforeC, 9, 'second event (t0 + 2 h): the one report in [t0 + 1 h, t0 + 2 h), 9 °C');
});

test('writers: new columns appended after the contract columns; --wind-unit and runway columns only in CSV; JSON keeps m/s', () => {
  const e = sampleEvent({
    windSpeedAfterMs: 10 * KNOT_MS,
    operator: {
      tempBeforeC: 5, tempAfterC: -1, dewpointBeforeC: 3, dewpointAfterC: -6, tempMin6hC: -2, tempMin12hC: -4.04,
      freezeTimeMs: Date.UTC(2026, 2, 4, 15), precipBefore6h: true, precipTypes: ['rain', 'snow'], precipHeavy: false, precipIntensity: 'moderate',
      windSpeedBeforeMs: 5 * KNOT_MS, pressureSource: 'station-from-altimeter',
      visibilityBeforeM: 16093.44, visibilityAfterM: 804.672, ceilingBeforeFt: Infinity, ceilingAfterFt: 800,
      runways: [{ runway: '04', headingDeg: 40, crosswindBeforeMs: 1, tailwindBeforeMs: -2, crosswindAfterMs: 3 * KNOT_MS, tailwindAfterMs: -4 }],
    },
  });
  const cols = recordColumns([e], { windUnit: 'kt' });
  assert.equal(cols.slice(0, EVENT_COLUMNS.length), [...EVENT_COLUMNS]);
  assert.equal(cols.slice(EVENT_COLUMNS.length), ['wind_speed_before_kt', 'wind_speed_after_kt', 'gust_max_kt', 'rwy_04_crosswind_before_kt', 'rwy_04_tailwind_before_kt', 'rwy_04_crosswind_after_kt', 'rwy_04_tailwind_after_kt']);
  const r = eventToRecord(e, { windUnit: 'kt' });
  // NIST SP 811 App. B.8: 1 kt = 1852/3600 m/s
  assert.is(r.wind_speed_after_kt, 10);
  assert.is(r.wind_speed_before_kt, 5);
  assert.is(r.rwy_04_crosswind_after_kt, 3);
  assert.is(r.temp_min_12h_c, -4);
  assert.is(r.freeze_time, '2026-03-04T15:00:00Z');
  assert.equal(r.precip_types, ['rain', 'snow']);
  assert.is(r.pressure_source, 'station-from-altimeter');
  const json = eventToRecord(e);
  assert.is(json.wind_speed_before_ms, 2.6);
  assert.is(json.rwy_04_crosswind_after_ms, 1.5);
  assert.is(json.wind_speed_before_kt, undefined);
  const csv = eventsToCsv([e], { windUnit: 'kt' }).split('\n');
  assert.is(csv[0], cols.join(','));
  // 10 SM and 1/2 SM (FMH-1 §12.6.6; 1 mi = 1609.344 m, NIST SP 811): whole metres; no ceiling is written `none`
  assert.match(csv[1]!, /,rain; snow,false,2\.6,station-from-altimeter,16093,805,none,800,moderate,5,10,/);
  assert.is(json.ceiling_before_ft, 'none');
  assert.is(json.ceiling_after_ft, 800);
});

test.run();
