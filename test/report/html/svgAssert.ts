/**
 * Assertions on SVG text in the manner of d3-shape's `assertPathEqual`: numbers in path data and attributes
 * are normalised to one decimal before comparing, so a test checks geometry and not float noise.
 */
import * as assert from 'uvu/assert';

/** Every number in `text` rounded to one decimal (`12.34` → `12.3`, `-0.01` → `0`, `5.0` → `5`). */
export function normaliseNumbers(text: string): string {
  return text.replace(/-?\d+(?:\.\d+)?(?:e[-+]?\d+)?/gi, (m) => {
    const r = Math.round(Number(m) * 10) / 10;
    return r === 0 ? '0' : String(r);
  });
}

/** Path data equal after normalising numbers. */
export function assertPathEqual(actual: string, expected: string, what = ''): void {
  assert.is(normaliseNumbers(actual), normaliseNumbers(expected), what);
}

/** `fragment` (after normalising numbers) occurs in `svg` (after normalising numbers). */
export function assertHasFragment(svg: string, fragment: string, what = ''): void {
  const a = normaliseNumbers(svg);
  const f = normaliseNumbers(fragment);
  assert.ok(a.includes(f), `${what ? what + ': ' : ''}fragment ${f} not found`);
}
