/** Window statistics over grid arrays (src/detect/window.ts): clamping, the NaN rule, extremes, running mean. */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { assertAllClose, assertClose } from '../helpers/assert.js';
import { argExtremeIn, at, meanIn, runningMean } from '../../src/detect/window.js';

const v = [1, 2, NaN, 4, 10];

test('meanIn(v, lo, hi) averages the finite values of [lo, hi)', () => {
  // constructed: expected by construction, (1 + 2 + 4) / 3 with the NaN ignored
  assertClose(meanIn(v, 0, 4), 7 / 3, 1e-12);
  // constructed: expected by construction, hi is exclusive
  assertClose(meanIn(v, 3, 4), 4, 0);
});

test('meanIn clamps the window to the array and floors lo, ceils hi', () => {
  // constructed: expected by construction, [-5, 99) clamps to the whole array
  assertClose(meanIn(v, -5, 99), 17 / 4, 1e-12);
  // constructed: expected by construction, [0.5, 1.2) becomes [0, 2)
  assertClose(meanIn(v, 0.5, 1.2), 1.5, 1e-12);
});

test('meanIn is NaN for an empty or all-NaN window', () => {
  // constructed: expected by construction (module doc: NaN when none)
  assert.ok(Number.isNaN(meanIn(v, 2, 3)));
  assert.ok(Number.isNaN(meanIn(v, 4, 4)));
  assert.ok(Number.isNaN(meanIn(v, 7, 9)));
});

test('argExtremeIn(v, lo, hi) finds the minimum, or the maximum with sign −1', () => {
  const w = [5, 3, NaN, 3, 8, 1];
  // constructed: expected by construction, the first of two equal minima in [0, 5)
  assert.is(argExtremeIn(w, 0, 5), 1);
  // constructed: expected by construction
  assert.is(argExtremeIn(w, 0, 5, -1), 4);
  // constructed: expected by construction, the window clamps at the end
  assert.is(argExtremeIn(w, 2, 50), 5);
});

test('argExtremeIn is −1 when the window holds no finite value', () => {
  // constructed: expected by construction
  assert.is(argExtremeIn([NaN, NaN], 0, 2), -1);
  assert.is(argExtremeIn([1, 2], 5, 9), -1);
});

test('runningMean(v, half) is a centred mean that ignores NaN and shrinks at the ends', () => {
  // constructed: expected by construction: windows [0,1], [0,2], [1,3], [2,4], [3,4]
  assertAllClose(runningMean([1, 2, 3, 4, 5], 1), [1.5, 2, 3, 4, 4.5], 1e-12);
  // constructed: expected by construction, the NaN is skipped in each window
  assertAllClose(runningMean([1, NaN, 3], 1), [1, 2, 3], 1e-12);
  // constructed: expected by construction, an all-NaN window stays NaN
  const out = runningMean([NaN, NaN, NaN, 6], 1);
  assert.ok(Number.isNaN(out[0]!) && Number.isNaN(out[1]!));
  assertAllClose(out.subarray(2), [6, 6], 0);
});

test('runningMean(v, 0) returns a copy of the input', () => {
  // constructed: expected by construction
  assertAllClose(runningMean([3, NaN, 7], 0), [3, NaN, 7], 0);
});

test('at(v, i) reads v[i] and is NaN outside the array', () => {
  // constructed: expected by construction
  assert.is(at(v, 1), 2);
  assert.ok(Number.isNaN(at(v, -1)));
  assert.ok(Number.isNaN(at(v, 5)));
  // constructed: expected by construction, a fractional index rounds
  assert.is(at(v, 3.4), 4);
});

test.run();
