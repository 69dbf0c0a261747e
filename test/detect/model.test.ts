/**
 * The fitted classifier: softmax regression (Hastie, Tibshirani & Friedman 2009, §4.4), its fit, the
 * decision rules around it, and that the committed parameters are what the documented fit gives.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { existsSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { calibrate, composeCalibration, decideKind, fitSoftmax, FEATURE_NAMES, MODEL_CLASSES, predictProbabilities, type ModelParams } from '../../src/detect/model.js';
import { MODEL_PARAMS } from '../../src/detect/modelParams.js';
import type { AirMassChange } from '../../src/detect/airmass.js';
import type { Classification } from '../../src/detect/classify.js';
import type { Features } from '../../src/detect/features.js';

test('predictProbabilities(x, params) is the softmax of the linear scores', () => {
  const params: ModelParams = { classes: ['a', 'b'], features: ['x'], weights: [[0, 0], [1, 0]] };
  const p = predictProbabilities([Math.log(3)], params);
  // softmax([0, ln 3]) = [1/4, 3/4], by the definition (HTF 2009 eq. 4.17)
  assert.ok(Math.abs(p[0]! - 0.25) < 1e-12 && Math.abs(p[1]! - 0.75) < 1e-12, `${p[0]} ${p[1]}`);
});

test('composeCalibration: two Platt scalings in a row equal the composed one', () => {
  // Platt 1999: p' = 1 / (1 + exp(−(a + b·logit p))); applying it twice is again of that form.
  assert.equal(composeCalibration([-1, 1], [0.5, 2]), [-1.5, 2]);
  for (const p of [0.01, 0.2, 0.5, 0.77, 0.99]) {
    const twice = calibrate(calibrate(p, [-1.19, 0.98]), [0.4, 0.6]);
    const once = calibrate(p, composeCalibration([-1.19, 0.98], [0.4, 0.6]));
    assert.ok(Math.abs(twice - once) < 1e-9, `${p}: ${twice} vs ${once}`);
  }
});

test('fitSoftmax(X, y) separates two constructed classes and is deterministic', () => {
  const X: Float64Array[] = [];
  const y: number[] = [];
  for (let i = 0; i < 40; i++) {
    const v = (i % 20) / 10 - 1; // -1 .. 0.9
    X.push(Float64Array.from([v + (i < 20 ? -1.5 : 1.5)]));
    y.push(i < 20 ? 0 : 1);
  }
  const w1 = fitSoftmax(X, y, 2, { iterations: 300 });
  const w2 = fitSoftmax(X, y, 2, { iterations: 300 });
  assert.equal(w1, w2); // constructed: same data, same weights
  const params: ModelParams = { classes: ['a', 'b'], features: ['x'], weights: w1 };
  // constructed: class 0 lies at x < -0.5, class 1 at x > 0.5
  assert.ok(predictProbabilities([-2], params)[0]! > 0.9);
  assert.ok(predictProbabilities([2], params)[1]! > 0.9);
});

const hand = (kind: Classification['kind'], scores: Partial<Classification['scores']> = {}): Classification => ({
  kind,
  confidence: 0.5,
  evidence: [],
  scores: { 'cold-front': 0, 'warm-front': 0, 'occluded-front': 0, dryline: 0, 'outflow-boundary': 0, 'sea-breeze-front': 0, 'wind-shift': 0, ...scores },
});
const air = (o: Partial<AirMassChange>): AirMassChange => ({
  tempDayC: 0, dewpointDayC: 0, thetaEDayK: 0, tempAdjLastingC: 0, dewpointLastingC: 0, thetaELastingK: 0, pressureRise6hHpa: NaN, tempDailyMeanC: 0, dewpointDailyMeanC: 0, ...o,
});
/** A model that always believes "cold front" with probability 0.6 (constructed). */
const coldish: ModelParams = { classes: MODEL_CLASSES, features: ['x'], weights: MODEL_CLASSES.map((k) => [0, k === 'cold-front' ? Math.log(0.6 / 0.1) : 0]) };

test('decideKind: a dew-point crash followed by lasting cold is the cold front, not a dryline', () => {
  // Schaefer1986 (from memory): the dryline has no cold air behind it; common practice, no source, for the 2 °C.
  const d = decideKind([0], air({ tempDayC: -6, dewpointDayC: -10 }), hand('dryline', { dryline: 0.9 }), coldish);
  assert.is(d.kind, 'cold-front');
});

test('decideKind: a sharp dew-point crash from moist air to dry air, temperature holding, stays a dryline', () => {
  // Schaefer1986 (from memory): moist air ahead, dry air behind, no cooling; constructed features
  const f = { dewpointBeforeC: 16, dewpointDropMaxC: -13, tempChangeC: 0.5 } as unknown as Features;
  const d = decideKind([0], air({ tempDayC: 1, dewpointDayC: -1 }), hand('dryline', { dryline: 0.9 }), coldish, f);
  assert.is(d.kind, 'dryline');
  // common practice, no source: a fall that leaves the air moist (16 → 11 °C) is a front's drying
  const moist = { dewpointBeforeC: 16, dewpointDropMaxC: -5, tempChangeC: 0.5 } as unknown as Features;
  assert.is(decideKind([0], air({}), hand('dryline', { dryline: 0.9 }), coldish, moist).kind, 'cold-front');
});

test('decideKind: an outflow that leaves colder, drier air behind for half a day is a cold front', () => {
  // Wakimoto1982 (from memory): outflow air is rain-cooled but moist and gone within hours; a lasting colder
  // and drier air mass is a front's. constructed; common practice, no source, for the 3 °C and 2 °C.
  const outflowish: ModelParams = { classes: MODEL_CLASSES, features: ['x'], weights: MODEL_CLASSES.map((k) => [0, k === 'outflow-boundary' ? Math.log(0.6 / 0.1) : 0]) };
  const storm = hand('outflow-boundary', { 'outflow-boundary': 0.7 });
  assert.is(decideKind([0], air({ tempDayC: -5, dewpointDayC: -4 }), storm, outflowish).kind, 'cold-front');
  // the same storm with the moist air back (dew point as the day before) stays an outflow
  assert.is(decideKind([0], air({ tempDayC: -5, dewpointDayC: -0.5 }), storm, outflowish).kind, 'outflow-boundary');
  assert.is(decideKind([0], air({ tempDayC: -1, dewpointDayC: -4 }), storm, outflowish).kind, 'outflow-boundary');
});

test('decideKind: "none" becomes a wind shift only when the shift score holds', () => {
  const noneModel: ModelParams = { classes: MODEL_CLASSES, features: ['x'], weights: MODEL_CLASSES.map((k) => [0, k === 'none' ? 5 : 0]) };
  assert.is(decideKind([0], air({}), hand('wind-shift', { 'wind-shift': 0.6 }), noneModel).kind, 'wind-shift');
  const dropped = decideKind([0], air({}), hand('cold-front', { 'cold-front': 0.2 }), noneModel);
  assert.is(dropped.confidence, 0);
});

test('the committed parameters name the model inputs in order', () => {
  if (!MODEL_PARAMS) return;
  assert.equal([...MODEL_PARAMS.features], [...FEATURE_NAMES]);
  assert.equal([...MODEL_PARAMS.classes], [...MODEL_CLASSES]);
  for (const w of MODEL_PARAMS.weights) assert.is(w.length, FEATURE_NAMES.length + 1);
});

const shared = fileURLToPath(new URL('../../../shared/realskill/', import.meta.url));
// FROPA_SKIP_REFIT=1 skips the 4-5 min refit locally (CI never sets it).
const haveShared = existsSync(shared) && !process.env.FROPA_SHARED && !process.env.FROPA_SKIP_REFIT;
(haveShared ? test : test.skip)('src/detect/modelParams.ts equals a fresh `npm run fit:model` (needs ../shared/realskill)', async () => {
  const { paramsText } = await import('../../bench/real/fit.js');
  const committed = readFileSync(new URL('../../src/detect/modelParams.ts', import.meta.url), 'utf8');
  assert.ok(paramsText().text === committed, 'modelParams.ts differs from a fresh fit: run npm run fit:model');
});

test.run();
