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
    observerFropaTimeMs: NaN, windShiftTimeMs: NaN, changeStartTimeMs: NaN, timeBasis: 'change-point', evidence: [],
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

test('verifyForecasts: within one issue, a forecast without kind matches any front kind; the matching pairs the most (optimal, not typed first)', () => {
  const obs = [ev('A', 'warm-front', T0), ev('A', 'cold-front', T0 + 2 * H), ev('A', 'sea-breeze-front', T0 + H)];
  const issued = T0 - 12 * H;
  const r = verifyForecasts([fc('A', null, T0 + 1.5 * H, issued), fc('A', 'cold-front', T0 + 1.4 * H, issued)], obs);
  assert.is(r.issueCount, 1);
  assert.is(r.pairs.length, 2, 'untyped → warm front (1.5 h), typed → cold front (0.6 h): two pairs beat one (untyped → cold)');
  const untyped = r.pairs.find((p) => p.forecast.kind === null)!;
  assert.is(untyped.event.kind, 'warm-front', 'the sea breeze is not a front kind');
  assert.is(r.misses.length, 0);
  assert.equal(r.kinds, ['cold-front', 'occluded-front', 'warm-front']);
});

// The valid-window rules are fropa's (README; common practice, no source).
test('verifyForecasts: without a valid window a forecast covers only ±window around itself; sparse forecasts do not make every passage a miss', () => {
  // Three cold-front forecasts (three issues) over 80 h and four observed cold fronts: only the passage
  // next to a forecast that went elsewhere could be a miss; here none is within 6 h of a forecast but unmatched.
  const obs = [ev('A', 'cold-front', T0 - 7 * H), ev('A', 'cold-front', T0 + 30 * H), ev('A', 'cold-front', T0 + 48 * H), ev('A', 'cold-front', T0 + 80 * H)];
  const r = verifyForecasts([fc('A', 'cold-front', T0 + 12 * H), fc('A', 'cold-front', T0 + 48 * H + 10 * MIN), fc('A', 'cold-front', T0)], obs);
  assert.is(r.misses.length, 0, 'T0 − 7 h, T0 + 30 h and T0 + 80 h are farther than 6 h from every forecast');
  assert.is(r.pairs.length, 1);
  assert.is(r.falseAlarms.length, 2);
  // Two observed passages 2 h apart, one forecast: the other passage is within the forecast's ±6 h, a miss.
  const two = verifyForecasts([fc('A', 'cold-front', T0)], [ev('A', 'cold-front', T0 + 30 * MIN), ev('A', 'cold-front', T0 + 2 * H)]);
  assert.equal(two.misses.map((e) => e.timeMs), [T0 + 2 * H]);
});

test('verifyForecasts: a miss is counted inside the valid window of an issue (--valid-hours or valid_from/valid_to), not outside', () => {
  const obs = [ev('A', 'cold-front', T0), ev('A', 'cold-front', T0 + 20 * H), ev('A', 'cold-front', T0 + 40 * H), ev('A', 'cold-front', T0 - 2 * H)];
  const issued = T0 - 6 * H;
  // issued … issued + 36 h = T0 − 6 h … T0 + 30 h: T0 − 2 h and T0 + 20 h are misses; T0 + 40 h lies outside.
  const vh = verifyForecasts([fc('A', 'cold-front', T0 + 10 * MIN, issued)], obs, { validHours: 36 });
  assert.equal(vh.misses.map((e) => (e.timeMs - T0) / H), [-2, 20]);
  assert.is(vh.outcomes.find((o) => o.outcome === 'miss' && o.event!.timeMs === T0 + 20 * H)!.leadHours, 26, 'lead of a miss = observed − issued');
  // Columns valid_from/valid_to win over --valid-hours; the window never starts before the issued time.
  const col = verifyForecasts([{ ...fc('A', 'cold-front', T0 + 10 * MIN, issued), validFromMs: T0 - 12 * H, validToMs: T0 + 24 * H }], obs, { validHours: 100 });
  assert.equal(col.misses.map((e) => (e.timeMs - T0) / H), [-2, 20]);
  assert.is(col.outcomes[0]!.validFromMs, issued);
  assert.is(col.outcomes[0]!.validToMs, T0 + 24 * H);
  assert.throws(() => verifyForecasts([], [], { validHours: 0 }), RangeError);
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
    fc('B', 'cold-front', T0 + 12 * H, T0 - 12 * H), // false alarm, lead 24 h; B's T0 + 6 h passage is > 3 h from every forecast: not verified
  ];
  const r = verifyForecasts(forecasts, obs, { windowHours: 3 });
  assert.equal([r.scores.hits, r.scores.misses, r.scores.falseAlarms], [3, 0, 1]);
  // Wilks 2011 ch. 8: POD = a/(a+c), FAR = b/(a+b), CSI = a/(a+b+c), bias = (a+b)/(a+c); by hand
  assertClose(r.scores.pod, 3 / 3, 1e-12);
  assertClose(r.scores.far, 1 / 4, 1e-12);
  assertClose(r.scores.csi, 3 / 4, 1e-12);
  assertClose(r.scores.bias, 4 / 3, 1e-12);
  assertClose(r.scores.timingErrorMeanMin, 50 / 3, 1e-9);
  assertClose(r.scores.timingErrorMedianMin, 10, 1e-12);
  assertClose(r.scores.timingErrorMaeMin, 30, 1e-12);
  assertClose(r.scores.p90AbsMin, 52, 1e-9, 0, 'type 7: |e| = 10, 20, 60 → h = 1.8 → 20 + 0.8·40');
  assert.equal([...r.byStation.keys()], ['A', 'B']);
  assert.equal([r.byStation.get('B')!.hits, r.byStation.get('B')!.misses, r.byStation.get('B')!.falseAlarms], [1, 0, 1]);
  assert.equal([...r.byLeadTime.keys()], ['0-12h', '12-24h', '24-48h']);
  assert.is(r.byLeadTime.get('24-48h')!.hits, 1);
  assert.is(r.byLeadTime.get('24-48h')!.falseAlarms, 1);
  assert.equal([...r.byKind.keys()], ['cold-front']);
  assert.equal([...r.bySource.keys()], ['f.csv']);
});

// Worked example computed by hand from the standard definitions of Wilks (2011), Statistical Methods in
// the Atmospheric Sciences, 3rd ed., ch. 8 (2×2 contingency table, a hits, b false alarms, c misses):
// a = 6, b = 2, c = 3 → POD = 6/9 = 0.6667, FAR = 2/8 = 0.25, CSI = 6/11 = 0.5455, bias = 8/9 = 0.8889.
// Timing errors of the hits (forecast − observed) −30, −10, 0, +20, +40, +90 min, by hand: mean = 110/6 =
// 18.33; median (type 7, h = 2.5) = (0 + 20)/2 = 10; MAE = 190/6 = 31.67; RMSE = √((900 + 100 + 0 + 400 + 1600 + 8100)/6) = √1850 = 43.01;
// |e| sorted 0, 10, 20, 30, 40, 90 → p90: h = 4.5 → 40 + 0.5·50 = 65 (Hyndman & Fan 1996 type 7).
test('verifyForecasts: contingency and timing scores against a worked example computed by hand (Wilks 2011 ch. 8)', () => {
  const errs = [-30, -10, 0, 20, 40, 90];
  const obs: PassageEvent[] = [];
  const fcs: ForecastPassage[] = [];
  errs.forEach((e, i) => {
    obs.push(ev('A', 'cold-front', T0 + i * 24 * H));
    fcs.push(fc('A', 'cold-front', T0 + i * 24 * H + e * MIN, T0 + i * 24 * H - 12 * H));
  });
  // Two false alarms (quiet days) and three misses (passages within 6 h of a forecast that went elsewhere).
  fcs.push(fc('A', 'cold-front', T0 + 200 * H, T0 + 180 * H), fc('A', 'cold-front', T0 + 260 * H, T0 + 240 * H));
  for (const k of [0, 1, 2]) obs.push(ev('A', 'cold-front', T0 + k * 24 * H + 4 * H));
  const r = verifyForecasts(fcs, obs);
  const s = r.scores;
  assert.equal([s.hits, s.falseAlarms, s.misses], [6, 2, 3]);
  assertClose(s.pod, 6 / 9, 1e-12); // Wilks 2011 ch. 8, by hand
  assertClose(s.far, 0.25, 1e-12); // Wilks 2011 ch. 8, by hand
  assertClose(s.csi, 6 / 11, 1e-12); // Wilks 2011 ch. 8, by hand
  assertClose(s.bias, 8 / 9, 1e-12); // Wilks 2011 ch. 8, by hand
  assertClose(s.timingErrorMeanMin, 110 / 6, 1e-9); // by hand
  assertClose(s.timingErrorMedianMin, 10, 1e-9); // Hyndman & Fan 1996 type 7, by hand
  assertClose(s.timingErrorMaeMin, 190 / 6, 1e-9); // by hand
  assertClose(s.timingErrorRmseMin, Math.sqrt(1850), 1e-9); // by hand
  assertClose(s.p90AbsMin, 65, 1e-9); // Hyndman & Fan 1996 type 7, by hand
  assert.equal([s.nLate, s.nEarly], [3, 2]);
});

// Issues and lead times: fropa's rules (README; common practice, no source).
test('verifyForecasts: three issues of one passage are three hits by lead bin, one headline hit (the latest issue), never a false alarm', () => {
  const obs = [ev('A', 'cold-front', T0), ev('A', 'cold-front', T0 + 30 * H)];
  const fcs = [
    fc('A', 'cold-front', T0 + 90 * MIN, T0 - 40 * H, 2), // lead 41.5 h, +90 min
    fc('A', 'cold-front', T0 + 40 * MIN, T0 - 20 * H, 3), // lead 20 h 40 min, +40 min
    fc('A', 'cold-front', T0 + 10 * MIN, T0 - 6 * H, 4), // lead 6 h 10 min, +10 min
  ];
  const r = verifyForecasts(fcs, obs, { validHours: 48 });
  assert.is(r.issueCount, 3);
  const hits = r.outcomes.filter((o) => o.outcome === 'hit');
  assert.equal(hits.map((o) => [o.leadBin, o.errorMin]), [['0-12h', 10], ['12-24h', 40], ['24-48h', 90]], 'in forecast-time order');
  assert.is(r.outcomes.filter((o) => o.outcome === 'false-alarm').length, 0, 'two issues of one passage are not a hit and a false alarm');
  // Valid windows issued … issued + 48 h: T0 − 40 h … T0 + 8 h, T0 − 20 h … T0 + 28 h, T0 − 6 h … T0 + 42 h.
  const missed = r.outcomes.filter((o) => o.outcome === 'miss');
  assert.equal(missed.map((o) => [o.issuedMs, o.leadHours, o.leadBin]), [[T0 - 6 * H, 36, '24-48h']], 'only the 3rd issue (valid to T0 + 42 h) covers T0 + 30 h');
  assert.equal([r.byLeadTime.get('0-12h')!.hits, r.byLeadTime.get('12-24h')!.hits, r.byLeadTime.get('24-48h')!.hits, r.byLeadTime.get('24-48h')!.misses], [1, 1, 1, 1]);
  // Headline: the latest issue before each passage: the 6 h issue's hit (+10 min) and its miss.
  assert.equal([r.scores.hits, r.scores.misses, r.scores.falseAlarms], [1, 1, 0]);
  assert.is(r.pairs[0]!.errorMin, 10);
  assert.is(r.pairs[0]!.forecast.line, 4);
});

test('verifyForecasts: bootstrap intervals are seeded (same seed, same interval) and bracket the estimate', () => {
  const obs = Array.from({ length: 20 }, (_, i) => ev('A', 'cold-front', T0 + i * 24 * H));
  const fcs = obs.map((e, i) => fc('A', 'cold-front', e.timeMs + ((i * 37) % 120 - 60) * MIN, e.timeMs - 12 * H));
  fcs.push(fc('A', 'cold-front', T0 + 500 * H, T0 + 480 * H));
  const a = verifyForecasts(fcs, obs, { bootstrap: { resamples: 500, seed: 7 } });
  const b = verifyForecasts(fcs, obs, { bootstrap: { resamples: 500, seed: 7 } });
  assert.equal(a.intervals, b.intervals);
  for (const k of ['far', 'csi', 'timingErrorMeanMin', 'timingErrorMaeMin'] as const) {
    assert.ok(a.intervals![k].lo <= a.scores[k] && a.scores[k] <= a.intervals![k].hi, `${k} ${a.scores[k]} in [${a.intervals![k].lo}, ${a.intervals![k].hi}]`);
  }
  assert.is(verifyForecasts(fcs, obs, { bootstrap: false }).intervals, undefined);
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
