import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { assertClose } from '../helpers/assert.js';
import { quantile } from '../../src/verify/quantile.js';

// Hyndman & Fan (1996), Am. Stat. 50, definition 7; values checked by hand: h = (n − 1)q,
// [1,2,3,4] q=0.5 → h=1.5 → 2.5; [10..50] q=0.9 → h=3.6 → 40 + 0.6·10 = 46 (also R quantile(type = 7), from memory).
test('quantile uses linear interpolation (Hyndman & Fan 1996 type 7)', () => {
  assertClose(quantile([1, 2, 3, 4], 0.5), 2.5, 1e-12);
  assertClose(quantile([10, 20, 30, 40, 50], 0.9), 46, 1e-12);
  assert.ok(Number.isNaN(quantile([], 0.5)));
});

test('quantile ignores NaN', () => {
  assertClose(quantile([NaN, 3, 1, NaN, 2], 0.5), 2, 1e-12);
});

test.run();
