/** Test helpers: numeric closeness with absolute + relative tolerance, printing both values. */
import * as assert from 'uvu/assert';

/** Assert |actual − expected| ≤ abs + rel·|expected| (NaN equals NaN). */
export function assertClose(actual: number, expected: number, abs: number, rel = 0, what = ''): void {
  if (Number.isNaN(expected) && Number.isNaN(actual)) return;
  const tol = abs + rel * Math.abs(expected);
  const ok = Math.abs(actual - expected) <= tol;
  assert.ok(ok, `${what ? what + ': ' : ''}expected ${expected} ± ${tol}, got ${actual}`);
}

/** Element-wise assertClose on arrays. */
export function assertAllClose(actual: ArrayLike<number>, expected: ArrayLike<number>, abs: number, rel = 0, what = ''): void {
  assert.is(actual.length, expected.length, `${what} length`);
  for (let i = 0; i < expected.length; i++) assertClose(actual[i]!, expected[i]!, abs, rel, `${what}[${i}]`);
}
