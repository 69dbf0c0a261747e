import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { bestStepIn, pettittTest, stepFit } from '../../src/signal/stepfit.js';
import { assertClose } from '../helpers/assert.js';
import { NILE, PAGE } from '../fixtures/changepoint-data.js';

test("pettittTest(Page's data): K = 232, change after t = 17, p ≈ 0.014 (Pettitt 1979 Table 1)", () => {
  // R wql::pett example: "K=232, p=0.0146, change-point=17, the same results as Pettitt".
  const r = pettittTest(PAGE);
  assert.is(r.statistic, 232);
  assert.is(r.u, -232);
  assert.is(r.index, 17); // first index of the new segment, 0-based = Pettitt's t = 17 (1-based last of the old)
  assertClose(r.p, 0.0146, 5e-4);
});

test('pettittTest(Nile): change after 1898 (index 28), K = 1617 (Pettitt1979 formula, value from an independent script)', () => {
  const r = pettittTest(NILE);
  assert.is(r.index, 28);
  assert.is(r.statistic, 1617);
  assert.ok(r.p < 1e-6);
});

test("bestStepIn(Page's data) splits at 17 with means −0.1118 / 0.9843 (least-squares split; arithmetic)", () => {
  const r = bestStepIn(PAGE, 0, PAGE.length, 1);
  assert.is(r.index, 17);
  assertClose(r.meanBefore, -0.1117647, 1e-6);
  assertClose(r.meanAfter, 0.9843478, 1e-6);
  assertClose(r.size, 1.0961125, 1e-6);
});

test('bestStepIn(Nile) splits at 28 (1899), size −247.78 (strucchange breakpoint 28; Cobb 1978)', () => {
  const r = bestStepIn(NILE, 0, NILE.length, 2);
  assert.is(r.index, 28);
  assertClose(r.size, 849.9722222 - 1097.75, 1e-6);
});

test('bestStepIn() score is |Z| = |Δ|/(σ√(1/n₁+1/n₂)) at the best split (two-sample z, textbook)', () => {
  const y = [0, 0, 0, 0, 2, 2, 2, 2];
  const r = bestStepIn(y, 0, y.length, 1, 1);
  assert.is(r.index, 4);
  assertClose(r.score, 2 / Math.sqrt(0.5), 1e-12);
});

test('bestStepIn() honours lo/hi, minSeg and skips NaN', () => {
  const y = [5, 5, 0, 0, NaN, 0, 3, 3, 3, 9, 9];
  const r = bestStepIn(y, 2, 9, 2, 1);
  assert.is(r.index, 6);
  assertClose(r.meanBefore, 0, 1e-12);
  assertClose(r.meanAfter, 3, 1e-12);
  assert.is(bestStepIn([1, 2, 3], 0, 3, 2).index, -1); // too short for two segments of 2
});

test('stepFit() difference of means and t = Δ/(σ√(1/n₁+1/n₂)) (two-sample z, textbook)', () => {
  const r = stepFit([0, 0, 0, 1, 1, 1], 3, 3, 3, 0.5);
  assert.is(r.change, 1);
  assertClose(r.t, 1 / (0.5 * Math.sqrt(2 / 3)), 1e-12);
  const c = stepFit([1, NaN, 1, 4, 4, NaN, 4], 3, 5, 5, 1); // windows clipped, NaN skipped
  assert.is(c.countBefore, 2);
  assert.is(c.countAfter, 3);
  assert.is(c.change, 3);
  assert.throws(() => stepFit([1, 2], 1, 0, 1), RangeError);
});

test.run();
