import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { seasonSummary, seasonToCsv } from '../../src/index.js';
import type { FrontTrack, PassageEvent, StationMeta } from '../../src/model/index.js';

const HOUR = 3_600_000;
function event(station: string, kind: PassageEvent['kind'], timeMs: number, tempChangeC: number): PassageEvent {
  return {
    station, kind, timeMs, timeEarliestMs: timeMs, timeLatestMs: timeMs, confidence: 1, tempChangeC,
    dewpointChangeC: NaN, thetaEChangeK: NaN, pressureMinHpa: NaN, pressureMinTimeMs: NaN, pressureRise3hHpa: 2,
    windBeforeDeg: NaN, windAfterDeg: NaN, windTurnDeg: NaN, windSpeedAfterMs: NaN, gustMaxMs: NaN, precipNear: false,
    zoneStartMs: timeMs, zoneEndMs: timeMs + HOUR, zoneHours: 1, zoneDepthKm: NaN, gradientKPer100km: NaN,
    observerFropaTimeMs: NaN, windShiftTimeMs: NaN, changeStartTimeMs: NaN, timeBasis: 'change-point', evidence: [],
  };
}

// Analytic construction: invented stations and passages with hand-counted months and hours.
test('seasonSummary(): passages by kind and month, UTC and mean solar hour, distributions, fronts by sector; --since/--until bounds', () => {
  const stations: StationMeta[] = [
    { id: 'XA', aliases: [], latDeg: 40, lonDeg: -90, elevationM: 0 },
    { id: 'XB', aliases: [], latDeg: 40, lonDeg: 15, elevationM: 0 },
  ];
  const events = [
    event('XA', 'cold-front', Date.UTC(2026, 0, 5, 12), -4), // January, 12 UTC; solar 06 at 90° W (solarHour doc example)
    event('XA', 'cold-front', Date.UTC(2026, 1, 5, 18), -6),
    event('XB', 'warm-front', Date.UTC(2026, 1, 7, 23), 3), // solar 00 (23 UTC + 1 h at 15° E)
    event('XB', 'cold-front', Date.UTC(2026, 2, 1, 0), NaN), // outside --until
  ];
  const track = { t0Ms: Date.UTC(2026, 0, 5, 12), speedKmh: 30, directionDeg: 100 } as FrontTrack; // toward 100°: sector E (67.5–112.5°)
  const s = seasonSummary(events, [track], stations, ['XA', 'XB', 'XC'], Date.UTC(2026, 0, 1), Date.UTC(2026, 2, 1));
  assert.is(s.network.passages, 3);
  assert.equal(s.network.byKindMonth['cold-front'].slice(0, 3), [1, 1, 0]);
  assert.equal(s.network.byKindMonth['warm-front'].slice(0, 3), [0, 1, 0]);
  assert.is(s.network.hourUtc[12], 1);
  assert.is(s.network.hourUtc[23], 1);
  assert.is(s.network.hourSolar[6], 1);
  assert.is(s.network.hourSolar[0], 1);
  assert.is(s.network.hourSolar[12], 1, '18 UTC at 90° W');
  // Hyndman & Fan (1996) definition 7 on (-6, -4, 3): median -4, p10 = -6 + 0.2·2 = -5.6
  assert.is(s.network.distributions.tempChangeC.median, -4);
  assert.ok(Math.abs(s.network.distributions.tempChangeC.p10 - -5.6) < 1e-12);
  assert.equal(s.stations.map((g) => [g.scope, g.passages]), [['XA', 2], ['XB', 1], ['XC', 0]]);
  assert.is(s.fronts.fronts, 1);
  assert.equal(s.fronts.towardSector, [0, 0, 1, 0, 0, 0, 0, 0]);
  const csv = seasonToCsv(s);
  assert.ok(csv.startsWith('scope,measure,bin,value\nnetwork,passages,all,3\n'));
  assert.match(csv, '\nXA,passages_cold-front,02,1\n');
  assert.match(csv, '\nnetwork,front_toward,E,1\n');
});

test.run();
