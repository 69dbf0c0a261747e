import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { bestStepIn, pettittTest, stepFit } from '../../src/signal/stepfit.js';
import { assertClose } from '../helpers/assert.js';

// Page's data (Page 1955, Biometrika 42, 523–527) as analysed in Pettitt (1979, J. R. Stat. Soc. C 28,
// 126–135) Table 1; values as printed in the examples of the R packages `wql` (pett) and `trend` (PagesData).
const PAGE = [
  -1.05, 0.96, 1.22, 0.58, -0.98, -0.03, -1.54, -0.71, -0.35, 0.66, 0.44, 0.91, -0.02, -1.42, 1.26, -1.02, -0.81,
  1.66, 1.05, 0.97, 2.14, 1.22, -0.24, 1.6, 0.72, -0.12, 0.44, 0.03, 0.66, 0.56, 1.37, 1.66, 0.1, 0.8, 1.29, 0.49,
  -0.07, 1.18, 3.29, 1.84,
];

// Nile flow at Aswan 1871–1970 (Cobb 1978 Table 1; R datasets::Nile).
const NILE = [
  1120, 1160, 963, 1210, 1160, 1160, 813, 1230, 1370, 1140, 995, 935, 1110, 994, 1020, 960, 1180, 799, 958, 1140,
  1100, 1210, 1150, 1250, 1260, 1220, 1030, 1100, 774, 840, 874, 694, 940, 833, 701, 916, 692, 1020, 1050, 969,
  831, 726, 456, 824, 702, 1120, 1100, 832, 764, 821, 768, 845, 864, 862, 698, 845, 744, 796, 1040, 759,
  781, 865, 845, 944, 984, 897, 822, 1010, 771, 676, 649, 846, 812, 742, 801, 1040, 860, 874, 848, 890,
  744, 749, 838, 1050, 918, 986, 797, 923, 975, 815, 1020, 906, 901, 1170, 912, 746, 919, 718, 714, 740,
];

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
