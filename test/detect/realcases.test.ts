/**
 * Named real cases from the longer real series in the shared `realskill/` folder (US ASOS reports from the
 * Iowa Environmental Mesonet archive and the nycflights22 weather table; public domain), read as a user
 * would: through the readers without column options, with the project's coordinates file
 * (bench/real/stations.csv). The expected kinds and times are the project's own labels, made by eye from
 * the reports (bench/real/labels/, criteria in CRITERIA.md): our judgement, not an official list. All the
 * cases below are in the tuning part of the development set (bench/real/data.ts SPLIT), so they guard the
 * behaviour; they are not skill figures. Skipped when the shared folder is absent.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { fileURLToPath } from 'node:url';
import { loadPaths } from '../../src/pipeline.js';
import { detectStation } from '../../src/detect/detect.js';
import type { PassageEvent, StationSeries } from '../../src/model/index.js';
import { REALSKILL_DIR, realskillTest } from '../helpers/realdata.js';

const STATIONS = fileURLToPath(new URL('../../bench/real/stations.csv', import.meta.url));
const HOUR = 3_600_000;
const NYC = 'nyc_2022_EWR_JFK_LGA_hourly_utc.csv';
const SUT = 'SUT_2013-2017_iem.csv';
const HXD = 'HXD_2013-2017_iem.csv';

const cache = new Map<string, StationSeries[]>();
function seriesOf(file: string): StationSeries[] {
  if (!cache.has(file)) cache.set(file, loadPaths([REALSKILL_DIR + file], { stationsFile: STATIONS }).series);
  return cache.get(file)!;
}

/** Events of one station within [from, to] (detection runs on the station's whole record). */
const eventsCache = new Map<string, PassageEvent[]>();
function events(file: string, station: string, from: string, to: string): PassageEvent[] {
  const key = `${file} ${station}`;
  if (!eventsCache.has(key)) {
    const s = seriesOf(file).find((x) => x.station === station);
    assert.ok(s, `series ${station} in ${file}: ${seriesOf(file).map((x) => x.station).join(', ')}`);
    eventsCache.set(key, detectStation(s!));
  }
  const a = Date.parse(from), b = Date.parse(to);
  return eventsCache.get(key)!.filter((e) => e.timeMs >= a && e.timeMs <= b);
}

const show = (ev: readonly PassageEvent[]) => ev.map((e) => `${e.kind} ${new Date(e.timeMs).toISOString().slice(0, 16)} c=${e.confidence}`).join(' | ') || 'none';
const nearest = (ev: readonly PassageEvent[], iso: string) => ev.slice().sort((x, y) => Math.abs(x.timeMs - Date.parse(iso)) - Math.abs(y.timeMs - Date.parse(iso)))[0];
const FRONTS = new Set(['cold-front', 'warm-front', 'occluded-front']);

// 2022-02-23, New York: the dew point crashed from about 11-12 °C to near 0 °C from 16-18Z in a westerly
// wind while the temperature still rose (a record-warm day), and the cold front (wind to NW-NNW, a fall of
// 5-7 °C in an hour, pressure rising fast) came at 23Z (labels: KEWR, KJFK, KLGA 23:00Z, "sure"). The early
// crash looks like a dryline at one station; the cold air behind it says it is the front's dry leading edge.
for (const station of ['KEWR', 'KJFK', 'KLGA']) {
  realskillTest(test, NYC)(`${station} 2022-02-23: a cold front with an early dew-point crash is one cold front at the wind shift, no dryline`, () => {
    const ev = events(NYC, station, '2022-02-23T12:00Z', '2022-02-24T06:00Z');
    const front = nearest(ev.filter((e) => e.kind === 'cold-front'), '2022-02-23T23:00Z');
    assert.ok(front, show(ev));
    assert.ok(Math.abs(front!.timeMs - Date.parse('2022-02-23T23:00Z')) <= HOUR, show(ev));
    assert.is(front!.timeBasis, 'wind-shift', show(ev));
    assert.ok(front!.tempChangeC <= -5, `fall ${front!.tempChangeC}`);
    assert.ok(!ev.some((e) => e.kind === 'dryline'), `no dryline: ${show(ev)}`);
    assert.is(ev.filter((e) => FRONTS.has(e.kind)).length, 1, `one front: ${show(ev)}`);
  });
}

// Timing window on a real wind shift (hourly reports): the window runs from the last report with the old
// wind to the first with the new one, and a passage timed at the wind shift is placed at that first report
// (as the labelling criteria and an observer's FROPA remark place it). KJFK 2022-02-23: W 280 at 22Z, NNW 340 at 23Z.
realskillTest(test, NYC)('KJFK 2022-02-23: the window brackets the wind shift; time is the first report with the new wind', () => {
  const ev = events(NYC, 'KJFK', '2022-02-23T20:00Z', '2022-02-24T02:00Z').filter((e) => e.kind === 'cold-front');
  assert.is(ev.length, 1, show(ev));
  const e = ev[0]!;
  const s = seriesOf(NYC).find((x) => x.station === 'KJFK')!;
  const dirAt = (t: number) => s.windDirDeg[s.timeMs.indexOf(t)]!;
  const ang = (a: number, b: number) => Math.abs(((a - b + 540) % 360) - 180);
  const d0 = dirAt(e.timeEarliestMs), d1 = dirAt(e.timeLatestMs);
  assert.ok(ang(d0, e.windBeforeDeg) < ang(d0, e.windAfterDeg), `old wind ${d0}° at time_earliest (before ${e.windBeforeDeg}°, after ${e.windAfterDeg}°)`);
  assert.ok(ang(d1, e.windAfterDeg) < ang(d1, e.windBeforeDeg), `new wind ${d1}° at time_latest`);
  assert.is(e.timeMs, e.timeLatestMs);
  assert.ok(e.timeLatestMs - e.timeEarliestMs <= 2 * HOUR, 'one or two report intervals');
  // FMH-1 §5.4.6: the shift began within the window.
  assert.ok(e.windShiftTimeMs >= e.timeEarliestMs && e.windShiftTimeMs <= e.timeLatestMs);
});

/** The event nearest `at` in [from, to] is of `kind` within an hour of it, and no front is found in the window. */
function assertDecoy(file: string, station: string, from: string, to: string, at: string, kind: string): void {
  const ev = events(file, station, from, to);
  const e = nearest(ev, at);
  assert.ok(e && e.kind === kind && Math.abs(e.timeMs - Date.parse(at)) <= HOUR, show(ev));
  assert.ok(!ev.some((x) => FRONTS.has(x.kind)), `no front: ${show(ev)}`);
}

// Thunderstorm outflows (labels "sure"): abrupt fall with gusts and rain, the same air back within hours.
realskillTest(test, SUT)('KSUT 2013-06-03 17:35Z: a thunderstorm outflow is an outflow boundary, not a front', () => {
  // SSW 5 m/s to W-WNW 8 m/s gusting 17, rain 6 mm, T 25.3 to 20.5 °C; S wind and 22 °C back by 23Z.
  assertDecoy(SUT, 'KSUT', '2013-06-03T15:00Z', '2013-06-03T20:00Z', '2013-06-03T17:35Z', 'outflow-boundary');
});

realskillTest(test, HXD)('KHXD 2015-07-22 21:50Z: an evening storm outflow is an outflow boundary, not a front', () => {
  assertDecoy(HXD, 'KHXD', '2015-07-22T19:50Z', '2015-07-22T23:50Z', '2015-07-22T21:50Z', 'outflow-boundary');
});

// Sea breezes (labels "sure") at coastal stations, with no coastline given: recognised from the record.
realskillTest(test, HXD)('KHXD 2016-08-20 16:50Z: a sea breeze is a sea-breeze front, not a cold front', () => {
  // Sunny: W 260-280 to SE 130; the warming stops at 35-36 °C and the dew point rises 24 to 26 °C.
  assertDecoy(HXD, 'KHXD', '2016-08-20T14:50Z', '2016-08-20T18:50Z', '2016-08-20T16:50Z', 'sea-breeze-front');
});

realskillTest(test, SUT)('KSUT 2014-03-09 18:35Z: a spring sea breeze is a sea-breeze front, not a cold front', () => {
  assertDecoy(SUT, 'KSUT', '2014-03-09T16:35Z', '2014-03-09T20:35Z', '2014-03-09T18:35Z', 'sea-breeze-front');
});

test.run();
