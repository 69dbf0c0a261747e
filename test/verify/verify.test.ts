/**
 * verifyForecasts(): sign convention, matching rules, strict kinds, misses within the forecast period,
 * lead-time bins. Constructed examples (invented times); the rules are fropa's (common practice, no
 * source) except the scores, which follow Wilks (2011) ch. 8 (tested in contingency.test.ts).
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { assertClose } from '../helpers/assert.js';
import type { BoundaryKind, PassageEvent } from '../../src/model/index.js';
import type { ForecastPassage } from '../../src/verify/forecasts.js';
import { leadBin, scoresOf, verifyForecasts } from '../../src/verify/verify.js';

const H = 3_600_000;
const MIN = 60_000;
const T0 = Date.UTC(2026, 2, 2, 12);

function ev(station: string, kind: BoundaryKind, timeMs: number): PassageEvent {
  return {
    station, kind, timeMs, timeEarliestMs: timeMs, timeLatestMs: timeMs, confidence: 0.9, tempChangeC: -5, dewpointChangeC: -3, thetaEChangeK: -8,
    pressureMinHpa: 1000, pressureMinTimeMs: timeMs, pressureRise3hHpa: 2, windBeforeDeg: 220, windAfterDeg: 300, windTurnDeg: 80, windSpeedAfterMs: 8,
    gustMaxMs: NaN, precipNear: false, zoneStartMs: timeMs, zoneEndMs: timeMs + H, zoneHours: 1, zoneDepthKm: NaN, gradientKPer100km: NaN,
    observerFropaTimeMs: NaN, evidence: [],
  };
}
function fc(station: string, kind: BoundaryKind | null, forecastMs: number, issuedMs = forecastMs - 24 * H, line = 2): ForecastPassage {
  return { station, kind, forecastMs, issuedMs, file: 'f.csv', line };
}

// Convention (README; common practice, no source): timing error = forecast − observed, positive = late.
test('verifyForecasts: a forecast 30 min after the observed passage has error +30 (late); 30 min before has −30 (early)', () => {
  const late = verifyForecasts([fc('A', 'cold-front', T0 + 30 * MIN)], [ev('A', 'cold-front', T0)]);
  assert.is(late.pairs.length, 1);
  assert.is(late.pairs[0]!.errorMin, 30);
  assert.is(late.scores.nLate, 1);
  assert.is(late.scores.nEarly, 0);
  const early = verifyForecasts([fc('A', 'cold-front', T0 - 30 * MIN)], [ev('A', 'cold-front', T0)]);
  assert.is(early.pairs[0]!.errorMin, -30);
  assert.is(early.scores.nEarly, 1);
  assertClose(early.scores.timingErrorMeanMin, -30, 1e-12);
});

test('verifyForecasts: one forecast, two observed passages: the nearer one is the hit, the other a miss', () => {
  const obs = [ev('A', 'cold-front', T0), ev('A', 'cold-front', T0 + 5 * H)];
  const r = verifyForecasts([fc('A', 'cold-front', T0 + 3.5 * H)], obs);
  assert.is(r.pairs.length, 1);
  assert.is(r.pairs[0]!.event.timeMs, T0 + 5 * H);
  assert.is(r.pairs[0]!.errorMin, -90);
  assert.equal(r.misses.map((e) => e.timeMs), [T0]);
  assert.is(r.falseAlarms.length, 0);
});

test('verifyForecasts: the window is inclusive (exactly 6 h matches, 6 h 1 min does not)', () => {
  const at = verifyForecasts([fc('A', 'cold-front', T0 + 6 * H)], [ev('A', 'cold-front', T0)]);
  assert.is(at.pairs.length, 1);
  assert.is(at.pairs[0]!.errorMin, 360);
  const beyond = verifyForecasts([fc('A', 'cold-front', T0 + 6 * H + MIN)], [ev('A', 'cold-front', T0)]);
  assert.is(beyond.pairs.length, 0);
  assert.is(beyond.falseAlarms.length, 1);
  assert.is(beyond.misses.length, 0, 'the passage lies outside the forecast period (first forecast − window), so it is not verified');
  const narrow = verifyForecasts([fc('A', 'cold-front', T0 + 2 * H)], [ev('A', 'cold-front', T0)], { windowHours: 1 });
  assert.is(narrow.pairs.length, 0);
  assert.throws(() => verifyForecasts([], [], { windowHours: 0 }), RangeError);
});

test('verifyForecasts: matching is per station', () => {
  const r = verifyForecasts([fc('A', 'cold-front', T0)], [ev('B', 'cold-front', T0)]);
  assert.is(r.pairs.length, 0);
  assert.is(r.falseAlarms.length, 1);
  assert.is(r.misses.length, 0, 'station B has no forecasts, so it is not verified');
});

test('verifyForecasts: kinds are strict; a cold-front forecast next to an observed occluded front is a false alarm listed in kindMismatches', () => {
  const r = verifyForecasts([fc('A', 'cold-front', T0 + 20 * MIN)], [ev('A', 'occluded-front', T0)]);
  assert.is(r.pairs.length, 0);
  assert.is(r.falseAlarms.length, 1);
  assert.is(r.kindMismatches.length, 1);
  assert.is(r.kindMismatches[0]!.event.kind, 'occluded-front');
  assert.is(r.kindMismatches[0]!.errorMin, 20);
  assert.is(r.misses.length, 0, 'occluded fronts were not forecast, so they are not verified');
  assert.equal(r.kinds, ['cold-front']);
});

test('verifyForecasts: a forecast without kind matches any front kind, after the typed forecasts', () => {
  const obs = [ev('A', 'warm-front', T0), ev('A', 'cold-front', T0 + 2 * H), ev('A', 'sea-breeze-front', T0 + H)];
  const r = verifyForecasts([fc('A', null, T0 + 1.5 * H), fc('A', 'cold-front', T0 + 1.4 * H)], obs);
  assert.is(r.pairs.length, 2);
  const untyped = r.pairs.find((p) => p.forecast.kind === null)!;
  assert.is(untyped.event.kind, 'warm-front', 'the cold front went to the typed forecast; the sea breeze is not a front kind');
  assert.is(r.misses.length, 0);
  assert.equal(r.kinds, ['cold-front', 'occluded-front', 'warm-front']);
});

test('verifyForecasts: misses only within the forecast period at a station (first − window … last + window)', () => {
  const obs = [ev('A', 'cold-front', T0 - 7 * H), ev('A', 'cold-front', T0 + 30 * H), ev('A', 'cold-front', T0 + 48 * H), ev('A', 'cold-front', T0 + 80 * H)];
  const r = verifyForecasts([fc('A', 'cold-front', T0 + 12 * H), fc('A', 'cold-front', T0 + 48 * H + 10 * MIN), fc('A', 'cold-front', T0)], obs);
  assert.equal(r.misses.map((e) => (e.timeMs - T0) / H), [30], 'T0 − 7 h and T0 + 80 h lie outside the period T0 − 6 h … T0 + 54 h 10 min');
  assert.is(r.pairs.length, 1);
  assert.is(r.falseAlarms.length, 2);
});

test('verifyForecasts: --kinds leaves other kinds out', () => {
  const r = verifyForecasts([fc('A', 'warm-front', T0), fc('A', 'cold-front', T0 + 10 * H)], [ev('A', 'warm-front', T0), ev('A', 'cold-front', T0 + 10 * H)], {
    kinds: ['cold-front'],
  });
  assert.is(r.pairs.length, 1);
  assert.is(r.excluded.length, 1);
  assert.is(r.misses.length, 0);
});

test('verifyForecasts: scores overall, per station and per lead-time bin', () => {
  const obs = [ev('A', 'cold-front', T0), ev('A', 'cold-front', T0 + 24 * H), ev('B', 'cold-front', T0), ev('B', 'cold-front', T0 + 6 * H)];
  const forecasts = [
    fc('A', 'cold-front', T0 + 60 * MIN, T0 - 6 * H), // hit +60, lead 7 h
    fc('A', 'cold-front', T0 + 24 * H - 20 * MIN, T0), // hit −20, lead 23 h 40 min
    fc('B', 'cold-front', T0 + 10 * MIN, T0 - 30 * H), // hit +10, lead 30 h 10 min
    fc('B', 'cold-front', T0 + 12 * H, T0 - 12 * H), // false alarm, lead 24 h; B's T0 + 6 h passage is a miss (window ±3 h)
  ];
  const r = verifyForecasts(forecasts, obs, { windowHours: 3 });
  assert.equal([r.scores.hits, r.scores.misses, r.scores.falseAlarms], [3, 1, 1]);
  assertClose(r.scores.pod, 3 / 4, 1e-12);
  assertClose(r.scores.far, 1 / 4, 1e-12);
  assertClose(r.scores.csi, 3 / 5, 1e-12);
  assertClose(r.scores.bias, 4 / 4, 1e-12);
  assertClose(r.scores.timingErrorMeanMin, 50 / 3, 1e-9);
  assertClose(r.scores.timingErrorMedianMin, 10, 1e-12);
  assertClose(r.scores.timingErrorMaeMin, 30, 1e-12);
  assertClose(r.scores.p90AbsMin, 52, 1e-9, 0, 'type 7: |e| = 10, 20, 60 → h = 1.8 → 20 + 0.8·40');
  assert.equal([...r.byStation.keys()], ['A', 'B']);
  assert.equal([r.byStation.get('B')!.hits, r.byStation.get('B')!.misses, r.byStation.get('B')!.falseAlarms], [1, 1, 1]);
  assert.equal([...r.byLeadTime.keys()], ['0-12h', '12-24h', '24-48h']);
  assert.is(r.byLeadTime.get('24-48h')!.hits, 1);
  assert.is(r.byLeadTime.get('24-48h')!.falseAlarms, 1);
  assert.ok(Number.isNaN(r.byLeadTime.get('24-48h')!.pod), 'a miss has no lead time');
});

test('leadBin: [0, 12), [12, 24), [24, 48), [48, ∞) hours; unknown without an issue time', () => {
  assert.is(leadBin(12 * H - 1, 0), '0-12h');
  assert.is(leadBin(12 * H, 0), '12-24h');
  assert.is(leadBin(24 * H, 0), '24-48h');
  assert.is(leadBin(48 * H, 0), '48h+');
  assert.is(leadBin(T0, NaN), 'unknown');
});

test('scoresOf: empty input gives NaN scores, not a throw', () => {
  const s = scoresOf(0, 0, 0, []);
  assert.ok(Number.isNaN(s.pod) && Number.isNaN(s.timingErrorMedianMin) && Number.isNaN(s.p90AbsMin));
});

test.run();
