import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { median, medianInPlace } from '../../src/signal/median.js';
import { quantile } from '../../src/verify/quantile.js';

// Definition of the sample median (middle order statistic; mean of the two middle ones for an even count), textbook
test('median() of odd and even counts, ignoring NaN', () => {
  assert.is(median([5, 1, 3]), 3);
  assert.is(median([3, 1, 2, 10]), 2.5);
  assert.is(median([5, NaN, 1, 3]), 3); // our NaN rule: ignored
  assert.ok(Number.isNaN(median([])));
  assert.ok(Number.isNaN(median([NaN, NaN])));
  assert.is(medianInPlace(new Float64Array([3, 1, 2, 10, 99]), 4), 2.5); // first `count` entries only
});

// Hyndman & Fan (1996) definition 7 at q = 0.5 is the same median (up to the last bit)
test('median() equals quantile(·, 0.5) (Hyndman & Fan 1996 def. 7)', () => {
  for (const xs of [[1, 2, 3, 4], [7, -2, 4.5], [0.1, 0.2, 0.3, 0.7, 11, -3]]) {
    assert.ok(Math.abs(median(xs) - quantile(xs, 0.5)) <= 1e-15 * Math.max(1, Math.abs(median(xs))));
  }
});

test.run();
