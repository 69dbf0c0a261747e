/** Seeded percentile bootstrap (Efron & Tibshirani 1993 ch. 13, from memory); invented samples. */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { bootstrapIntervals, mulberry32 } from '../../src/verify/bootstrap.js';

const mean = (xs: readonly number[]) => ({ mean: xs.reduce((s, x) => s + x, 0) / xs.length });

test('bootstrapIntervals: a constant sample gives a zero-width interval at the constant (every resample is the same)', () => {
  assert.equal(bootstrapIntervals([5, 5, 5], ['mean'], mean).mean, { lo: 5, hi: 5 });
});

test('bootstrapIntervals: deterministic for a seed, inside the sample range, different for another seed', () => {
  const xs = [1, 2, 3, 4, 10, 12, 3, 5];
  const a = bootstrapIntervals(xs, ['mean'], mean, { seed: 3, resamples: 400 });
  const b = bootstrapIntervals(xs, ['mean'], mean, { seed: 3, resamples: 400 });
  const c = bootstrapIntervals(xs, ['mean'], mean, { seed: 4, resamples: 400 });
  assert.equal(a, b);
  assert.not.equal(a, c);
  // common practice, no source: a 95% interval of the mean lies within the sample's range and brackets the sample mean (5)
  assert.ok(a.mean.lo >= 1 && a.mean.hi <= 12 && a.mean.lo < 5 && a.mean.hi > 5, JSON.stringify(a));
});

test('bootstrapIntervals: empty sample and statistics undefined in most replicates give NaN ends; bad settings throw', () => {
  assert.ok(Number.isNaN(bootstrapIntervals([], ['mean'], mean).mean.lo));
  assert.ok(Number.isNaN(bootstrapIntervals([1, 2], ['x'], () => ({ x: NaN })).x.hi));
  assert.throws(() => bootstrapIntervals([1], ['mean'], mean, { resamples: 0 }), RangeError);
  assert.throws(() => bootstrapIntervals([1], ['mean'], mean, { level: 1 }), RangeError);
});

test('mulberry32: same seed, same sequence, values in [0, 1)', () => {
  const r1 = mulberry32(42);
  const r2 = mulberry32(42);
  const a = Array.from({ length: 5 }, r1);
  assert.equal(a, Array.from({ length: 5 }, r2));
  assert.ok(a.every((x) => x >= 0 && x < 1));
});

test.run();
