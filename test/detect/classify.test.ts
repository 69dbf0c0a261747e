/**
 * Classification of measured features (src/detect/classify.ts): hand-built feature sets with one clear
 * signature each, both hemispheres for the turning sense. Thresholds are the module's (common practice,
 * no source); what each test names is the signature from the literature the module cites.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { assertClose } from '../helpers/assert.js';
import { classify, ramp } from '../../src/detect/classify.js';
import type { Features } from '../../src/detect/features.js';

const T = Date.UTC(2026, 2, 10, 12, 0);

/** Quiet features: steady 200° wind at 8 m/s, no temperature, moisture or pressure change, midday. */
function quiet(over: Partial<Features> = {}): Features {
  return {
    index: 100, timeMs: T, fmh1WindShiftNear: false,
    windBeforeDeg: 200, windAfterDeg: 200, speedBeforeMs: 8, speedAfterMs: 8, turnDeg: 0,
    tempChangeC: 0, frontalChangeAdjC: 0, tempAdjChangeC: 0, abruptChangeC: 0, recoveryFraction: 0,
    dewpointChangeC: 0, dewpointDropMaxC: 0, thetaEChangeK: 0,
    pressureMinHpa: 1010, pressureMinTimeMs: T, pressureFallBeforeHpa: 0, pressureRiseAfterHpa: 0,
    pressureRise3hHpa: 0, pressureJumpHpa: 0, gustMaxMs: 8, precipNear: false, convectiveNear: false,
    solarHour: 13, zoneEndMs: T + 3_600_000, zoneHours: 1, moistureZoneEndMs: NaN,
    tempAdjChangeLongC: 0, dewpointChangeLongC: 0, turnLongDeg: 0, windAfterLongDeg: 200,
    onsetDelayH: 0, pressureChangeBefore3hHpa: 0, dewpointBeforeC: 10, depressionBeforeC: 5,
    windReturnDeg: 0, pressureFallAfterPeakHpa: 0,
    ...over,
  };
}

/** A textbook cold front: 90° turn in the cold-front sense, 6 °C cooling, drying, a trough then a rise. */
function coldFront(turnDeg: number, over: Partial<Features> = {}): Features {
  return quiet({
    windAfterDeg: 200 + turnDeg, turnDeg, tempChangeC: -6, tempAdjChangeC: -6, frontalChangeAdjC: -6,
    dewpointChangeC: -5, dewpointDropMaxC: -6, thetaEChangeK: -12, pressureFallBeforeHpa: -2,
    pressureRiseAfterHpa: 2.5, pressureRise3hHpa: 2, pressureChangeBefore3hHpa: -1.5, abruptChangeC: -2,
    gustMaxMs: 12, windReturnDeg: 90, onsetDelayH: 0.1,
    ...over,
  });
}

test('ramp(x, a, b) rises linearly from 0 at a to 1 at b, in either order; NaN gives 0', () => {
  // constructed: expected by construction
  assert.is(ramp(5, 0, 10), 0.5);
  assert.is(ramp(-1, 0, 10), 0);
  assert.is(ramp(11, 0, 10), 1);
  assertClose(ramp(2, 4, 1), 2 / 3, 1e-12);
  assert.is(ramp(10, 10, 0), 0);
  assert.is(ramp(NaN, 0, 1), 0);
});

test('classify() calls a veering, cooling, drying trough a cold front in the north (Sanders1999)', () => {
  const c = classify(coldFront(90), undefined, 1);
  assert.is(c.kind, 'cold-front');
  // constructed: every factor of the cold-front score is saturated by these features
  assertClose(c.confidence, 1, 1e-12);
  // constructed: the evidence names the sense fronts turn in this hemisphere
  assert.match(c.evidence[0]!, /^\+ wind 200° → 290° \(veering 90°; fronts veer in this hemisphere\)/);
});

test('classify() calls the mirror image, a backing cold front, a cold front in the south', () => {
  const north = classify(coldFront(90), undefined, 1);
  const south = classify(coldFront(-90), undefined, -1);
  // common practice, no source: a cold front backs south of the equator (mirror image of the northern veer)
  assert.is(south.kind, 'cold-front');
  // constructed: the scores are mirror-symmetric
  assertClose(south.scores['cold-front'], north.scores['cold-front'], 1e-12);
  assert.match(south.evidence[0]!, /^\+ wind 200° → 110° \(backing 90°; fronts back in this hemisphere\)/);
});

test('classify() gives less credit to a turn in the wrong sense for the hemisphere', () => {
  const right = classify(coldFront(-90), undefined, -1);
  const wrong = classify(coldFront(90), undefined, -1);
  // common practice, no source: veering is not the cold-front sense in the south; the trough and
  // pressure kink still count
  assert.ok(wrong.scores['cold-front'] < 0.8 * right.scores['cold-front'], `${wrong.scores['cold-front']} vs ${right.scores['cold-front']}`);
  assert.match(wrong.evidence[0]!, /^− wind 200° → 290° \(veering/);
});

test('classify() calls a 60° turn at 8 m/s with nothing else a wind shift (FMH-1 §5.4.6)', () => {
  const c = classify(quiet({ turnDeg: 60, windAfterDeg: 260 }), undefined, 1);
  // FMH-1 §5.4.6: 45° or more with 10 kt or more throughout (8 m/s ≈ 15.6 kt); no air-mass change → unclassified
  assert.is(c.kind, 'wind-shift');
  // constructed: the wind-shift score saturates at 0.6
  assertClose(c.confidence, 0.6, 1e-12);
  // FMH-1 §5.4.6 via check-values 7: 35° is no wind shift
  assert.is(classify(quiet({ turnDeg: 35, windAfterDeg: 235 }), undefined, 1).scores['wind-shift'], 0);
});

test('classify() does not call a turn in light wind a wind shift (FMH-1 §5.4.6: 10 kt or more)', () => {
  // FMH-1 §5.4.6: sustained 10 kt (5.1 m/s) or more throughout; 3 m/s ≈ 5.8 kt is below
  const c = classify(quiet({ turnDeg: 90, windAfterDeg: 290, speedBeforeMs: 3, speedAfterMs: 3 }), undefined, 1);
  assert.is(c.scores['wind-shift'], 0);
});

test('classify() scores calm evening cooling with no turn or trough as a weak candidate', () => {
  const f = quiet({ speedBeforeMs: 0.5, speedAfterMs: 0.5, turnDeg: NaN, tempChangeC: -4, tempAdjChangeC: -4, dewpointChangeC: -0.5, thetaEChangeK: -2 });
  const c = classify(f, undefined, 1);
  // common practice, no source: radiative cooling under calm wind is the commonest false cold front
  assert.ok(c.confidence < 0.1, `confidence ${c.confidence}`);
  assert.ok(c.evidence.includes('− light or calm wind after, no turn: radiative cooling looks like this'));
  assert.ok(c.evidence.includes('− no evidence beyond temperature (no turn, no trough, no drying): likely diurnal or local cooling'));
});

test('classify() calls a daytime dew-point fall at steady temperature with a westerly wind a dryline (Schaefer1986)', () => {
  const f = quiet({ turnDeg: 30, windBeforeDeg: 220, windAfterDeg: 250, dewpointDropMaxC: -10, dewpointChangeC: -8, thetaEChangeK: -8, dewpointBeforeC: 14, tempAdjChangeC: -0.2 });
  const day = classify(f, undefined, 1);
  assert.is(day.kind, 'dryline');
  assertClose(day.confidence, 1, 1e-12);
  assert.ok(day.evidence.includes('+ dew point falls 10.0 °C within 3 h while temperature holds, by day'));
  // common practice, no source: drylines are a daytime feature; by night the score keeps 30 %
  const night = classify({ ...f, solarHour: 2 }, undefined, 1);
  assertClose(night.scores.dryline, 0.3 * day.scores.dryline, 1e-12);
});

test('classify() mirrors the dryline wind test in the south (dry side westerly, 290°)', () => {
  const f = quiet({ turnDeg: -30, windBeforeDeg: 320, windAfterDeg: 290, dewpointDropMaxC: -10, dewpointChangeC: -8, thetaEChangeK: -8, dewpointBeforeC: 14, tempAdjChangeC: -0.2 });
  // constructed: the southern mirror image of the northern case scores the same
  assertClose(classify(f, undefined, -1).scores.dryline, 1, 1e-12);
});

test('classify() calls a midday onshore turn with slight cooling at a coastal station a sea-breeze front (Miller2003)', () => {
  const f = quiet({ turnDeg: -90, windBeforeDeg: 200, windAfterDeg: 110, tempChangeC: -2, tempAdjChangeC: -2, dewpointChangeC: 0.5, thetaEChangeK: -1, solarHour: 13 });
  const coast = { id: 'QCST', aliases: [], latDeg: 30, lonDeg: -80, elevationM: 5, coastal: true, seaBearingDeg: 110 };
  const c = classify(f, coast, 1);
  assert.is(c.kind, 'sea-breeze-front');
  assert.ok(c.confidence > 0.9, `confidence ${c.confidence}`);
  // constructed: inland (no coastal flag) the sea-breeze score is 0
  assert.is(classify(f, { ...coast, coastal: false }, 1).scores['sea-breeze-front'], 0);
  // constructed: an offshore wind after the turn is no sea breeze
  assert.is(classify({ ...f, windAfterDeg: 290, turnDeg: 90 }, coast, 1).scores['sea-breeze-front'], 0);
});

test('classify() calls an abrupt cooling that recovers, with a pressure jump and gusts, an outflow boundary (Wakimoto1982)', () => {
  const f = coldFront(90, { abruptChangeC: -5, tempAdjChangeC: -5, recoveryFraction: 0.7, pressureJumpHpa: 2.5, gustMaxMs: 20, convectiveNear: true, pressureFallBeforeHpa: 0, pressureRiseAfterHpa: 0 });
  const c = classify(f, undefined, 1);
  // Wakimoto1982 (as cited by the module): gust front with a sharp temperature fall, pressure jump and gusts,
  // followed by recovery; constructed: every factor of the outflow score is saturated
  assert.is(c.kind, 'outflow-boundary');
  assertClose(c.confidence, 1, 1e-12);
  assert.ok(c.evidence.includes('+ pressure jump 2.5 hPa within 30 min'));
  assert.ok(c.evidence.includes('+ temperature recovers 70 % within 3 h'));
});

test('classify() calls warming and moistening on an equatorward wind with falling pressure a warm front, per hemisphere', () => {
  const warm = { turnDeg: 30, tempChangeC: 4, tempAdjChangeC: 4, dewpointChangeC: 3, thetaEChangeK: 8, pressureFallBeforeHpa: -2 };
  const north = classify(quiet({ ...warm, windBeforeDeg: 170, windAfterDeg: 200 }), undefined, 1);
  // common practice, no source: warm air comes on a southerly wind in the north
  assert.is(north.kind, 'warm-front');
  assertClose(north.confidence, 1, 1e-12);
  // common practice, no source: and on a northerly wind in the south (turn mirrored)
  const south = classify(quiet({ ...warm, turnDeg: -30, windBeforeDeg: 10, windAfterDeg: 340 }), undefined, -1);
  assert.is(south.kind, 'warm-front');
  assertClose(south.confidence, 1, 1e-12);
  // constructed: a northerly wind after the warming in the north keeps only 40 % of the score
  const wrongSide = classify(quiet({ ...warm, windBeforeDeg: 310, windAfterDeg: 340 }), undefined, 1);
  assertClose(wrongSide.scores['warm-front'], 0.4, 1e-12);
});

test('classify() keeps every score in [0, 1] and lists evidence as + / − lines', () => {
  for (const f of [quiet(), coldFront(90), coldFront(-90), quiet({ turnDeg: NaN, pressureRise3hHpa: NaN })]) {
    for (const h of [1, -1] as const) {
      const c = classify(f, undefined, h);
      // constructed: expected by construction (products of ramps)
      for (const [k, v] of Object.entries(c.scores)) assert.ok(v >= 0 && v <= 1, `${k} ${v}`);
      assert.ok(c.confidence >= 0 && c.confidence <= 1);
      for (const e of c.evidence) assert.match(e, /^[+−] /);
    }
  }
});

test.run();
