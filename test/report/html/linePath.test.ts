/**
 * Path data builders. Path grammar (M moveto, L lineto, h relative horizontal lineto, m/l relative) per
 * W3C SVG 1.1 §8.3; gaps as a new subpath (M) the way d3-shape's line.defined splits a line (d3-shape
 * README, "line.defined", from memory).
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

test('linePath: a NaN value starts a new subpath (gap → new M); an isolated point becomes a dot (h0)', () => {
  assertPathEqual(linePath([0, 10, 20, 30, 40], [1, 2, NaN, 3, 4]), 'M0,1L10,2M30,3L40,4');
  assert.is(linePath([0, 10, 20, 30], [5, NaN, 7, 8]), 'M0,5h0M20,7L30,8');
  assert.is(linePath([0, 10, 20], [NaN, NaN, NaN]), '');
  assert.is(linePath([0, 10], [1, 2], { isolatedDots: false, defined: (i) => i === 0 }), 'M0,1');
});

test('linePath: breakBefore splits at a time gap even when both sides are defined', () => {
  const t = [0, 1, 2, 10, 11];
  const p = linePath([0, 1, 2, 3, 4], [0, 0, 0, 0, 0], { breakBefore: (i) => t[i]! - t[i - 1]! > 2.5 });
  assert.is(p, 'M0,0L1,0L2,0M3,0L4,0');
});

test('dotsPath and crossesPath: one zero-length segment per dot; × of half-size r', () => {
  assert.is(dotsPath([1, 2, 3], [4, NaN, 6]), 'M1,4h0M3,6h0');
  assert.is(crossesPath([10], [20], 2), 'M8,18l4,4m0,-4l-4,4');
  assert.is(crossesPath([NaN], [20], 2), '');
});

test.run();
