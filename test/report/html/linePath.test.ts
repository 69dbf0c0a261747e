/**
 * Path data builders. Path grammar (M moveto, L lineto, Z closepath, m/l relative) per W3C SVG 1.1 §8.3; lines and
 * dots come from d3-shape's `line` (reference library): gaps as a new subpath (M) where `line.defined` is false, a
 * lone point as `M x,y Z` (d3-shape curveLinear closes a one-point line), a zero-length subpath that is stroked
 * with round caps (SVG 1.1 §11.4, 'stroke-linecap'), so it shows as a dot.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { crossesPath, dotsPath, linePath, px } from '../../../src/report/html/linePath.js';
import { assertPathEqual } from './svgAssert.js';

test('px(x) rounds to one decimal, drops .0 and never prints -0', () => {
  const rows: [number, string][] = [
    [12.345, '12.3'],
    [12.35, '12.4'],
    [5, '5'],
    [5.04, '5'],
    [-0.04, '0'],
    [-3.26, '-3.3'],
    [1000.05, '1000.1'],
  ];
  for (const [x, s] of rows) assert.is(px(x), s, String(x));
});

test('linePath(xs, ys) draws one subpath through defined points, rounded to 0.1 px', () => {
  assert.is(linePath([0, 10.04, 20.06], [5.55, 6.449, 7]), 'M0,5.6L10,6.4L20.1,7');
});

test('linePath: a NaN value starts a new subpath (gap → new M); an isolated point becomes a dot (M x,y Z)', () => {
  assertPathEqual(linePath([0, 10, 20, 30, 40], [1, 2, NaN, 3, 4]), 'M0,1L10,2M30,3L40,4');
  assert.is(linePath([0, 10, 20, 30], [5, NaN, 7, 8]), 'M0,5ZM20,7L30,8');
  assert.is(linePath([0, 10, 20], [NaN, NaN, NaN]), '');
  // a lone point without a dot is left out (a lone moveto draws nothing, SVG 1.1 §11.4)
  assert.is(linePath([0, 10], [1, 2], { isolatedDots: false, defined: (i) => i === 0 }), '');
  assert.is(linePath([0, 10, 20], [1, 2, 3], { isolatedDots: false, defined: (i) => i !== 1 }), '');
});

test('linePath: the same string as d3-shape line() with defined() on the same points (reference library)', async () => {
  const { line } = await import('d3-shape');
  const xs = [0, 10.04, 20.06, 30, 40.55, 50];
  const ys = [5.55, NaN, 7, 8.25, -0.04, 3];
  const ref = line<number>().x((i) => xs[i]!).y((i) => ys[i]!).defined((i) => Number.isFinite(ys[i]!)).digits(1)(xs.map((_, i) => i));
  assert.is(linePath(xs, ys), ref);
});

test('linePath: breakBefore splits at a time gap even when both sides are defined', () => {
  const t = [0, 1, 2, 10, 11];
  const p = linePath([0, 1, 2, 3, 4], [0, 0, 0, 0, 0], { breakBefore: (i) => t[i]! - t[i - 1]! > 2.5 });
  assert.is(p, 'M0,0L1,0L2,0M3,0L4,0');
});

test('dotsPath and crossesPath: one zero-length subpath per dot; × of half-size r', () => {
  assert.is(dotsPath([1, 2, 3], [4, NaN, 6]), 'M1,4ZM3,6Z');
  assert.is(crossesPath([10], [20], 2), 'M8,18l4,4m0,-4l-4,4');
  assert.is(crossesPath([NaN], [20], 2), '');
});

test.run();
