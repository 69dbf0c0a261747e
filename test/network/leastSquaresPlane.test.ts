import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { assertClose } from '../helpers/assert.js';
import { leastSquaresPlane } from '../../src/network/leastSquaresPlane.js';

// Exact plane f = 10 + 0.02 x − 0.05 y through four points (computed by hand)
test('leastSquaresPlane() recovers an exact plane and its value at the centroid', () => {
  const x = [0, 100, 30, 60], y = [0, 10, 90, 40];
  const f = x.map((xi, i) => 10 + 0.02 * xi - 0.05 * y[i]!);
  const p = leastSquaresPlane(x, y, f);
  assert.is(p.n, 4);
  assertClose(p.dfdx, 0.02, 1e-12);
  assertClose(p.dfdy, -0.05, 1e-12);
  assertClose(p.mean, 10 + 0.02 * p.meanX - 0.05 * p.meanY, 1e-12);
});

// The module's stated rules (our rule, no source): NaN values, coordinates and zero weights are ignored
test('leastSquaresPlane() ignores non-finite values and coordinates and weights ≤ 0', () => {
  const x = [0, 100, 30, NaN, 50], y = [0, 10, 90, 5, 50];
  const f = [10, 12 - 0.5, 10.6 - 4.5, 99, 99];
  const p = leastSquaresPlane(x, y, f, [1, 1, 1, 1, 0]);
  assert.is(p.n, 3);
  const q = leastSquaresPlane([0, 100, 30], [0, 10, 90], [10, 11.5, 6.1]);
  assert.is(p.dfdx, q.dfdx);
  assert.is(p.dfdy, q.dfdy);
});

// Collinear or too few points: slopes undefined → NaN (our rule); mean still given
test('leastSquaresPlane() gives NaN slopes for fewer than 3 or collinear points', () => {
  const two = leastSquaresPlane([0, 1], [0, 1], [1, 3]);
  assert.ok(Number.isNaN(two.dfdx) && Number.isNaN(two.dfdy));
  assert.is(two.mean, 2);
  assert.ok(Number.isNaN(leastSquaresPlane([0, 100, 200], [0, 0, 0.01], [1, 2, 3]).dfdx), 'spread across the line 0.005 % of along it');
  assert.ok(Number.isFinite(leastSquaresPlane([0, 100, 200], [0, 0, 10], [1, 2, 3]).dfdx));
  assert.is(leastSquaresPlane([], [], []).n, 0);
  assert.throws(() => leastSquaresPlane([0], [0, 1], [1, 2]), RangeError);
});

test.run();
