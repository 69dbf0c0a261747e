/**
 * One variable as path data: QC-flagged values leave the line and become crosses; gaps longer than the
 * limit break the line; thinning keeps the first, lowest, highest and last point per pixel column
 * (M4, Jugel et al. 2014, PVLDB 7(10)).
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { chartLine, m4Indices, windowRange } from '../../../src/report/html/chartLine.js';

const id = (v: number) => v;

test('chartLine: a flagged value is not on the line (gap) and is drawn as a cross at its value', () => {
  const r = chartLine({ timeMs: [0, 1, 2, 3], values: [1, 99, 3, 4], qc: [0, 1, 0, 0], from: 0, to: 4, x: (t) => t * 10, y: id, gapMs: 5 });
  assert.is(r.path, 'M0,1ZM20,3L30,4');
  assert.is(r.flagged, 'M7,96l6,6m0,-6l-6,6');
  assert.is(r.flaggedCount, 1);
});

test('chartLine: a flagged value outside the row is clamped to its edge, not hidden', () => {
  const r = chartLine({ timeMs: [0, 1], values: [1, 500], qc: [0, 1], from: 0, to: 2, x: (t) => t * 10, y: id, gapMs: 5 }, [0, 50]);
  assert.is(r.flagged, 'M7,47l6,6m0,-6l-6,6');
});

test('chartLine: a step longer than gapMs breaks the line', () => {
  const r = chartLine({ timeMs: [0, 10, 20, 80, 90], values: [1, 1, 1, 2, 2], from: 0, to: 5, x: id, y: id, gapMs: 25 });
  assert.is(r.path, 'M0,1L10,1L20,1M80,2L90,2');
});

test('chartLine dots: one dot per value that passed QC', () => {
  const r = chartLine({ timeMs: [0, 1, 2], values: [90, NaN, 180], from: 0, to: 3, x: id, y: id, gapMs: 5, dots: true });
  assert.is(r.path, 'M0,90ZM2,180Z');
});

test('m4Indices keeps first, lowest, highest and last per pixel column, and missing values', () => {
  const xs = [0, 0.2, 0.4, 0.6, 0.8, 1, 1.5, 2];
  const ys = [5, 1, 9, 4, 6, NaN, 3, 3];
  assert.equal(m4Indices(xs, ys, 0, xs.length, 3), [0, 1, 2, 4, 5, 6, 7]);
  assert.equal(m4Indices(xs, ys, 0, 3, 10), [0, 1, 2]);
});

test('chartLine with many more points than pixels: thinned, gaps still break the line', () => {
  const n = 10_000;
  const t = new Float64Array(n).map((_, i) => i);
  const v = new Float64Array(n).map((_, i) => Math.sin(i / 50));
  t.fill(NaN, 0, 0);
  // a gap: shift the second half later
  for (let i = n / 2; i < n; i++) t[i] = i + 1000;
  const r = chartLine({ timeMs: t, values: v, from: 0, to: n, x: (x) => x / 20, y: (y) => 50 - 40 * y, gapMs: 10 });
  assert.ok(r.path.length < 60_000, `path ${r.path.length} chars`);
  assert.is((r.path.match(/M/g) ?? []).length, 2, 'two subpaths: one per side of the gap');
});

test('windowRange: reports inside [t0, t1] plus one on each side', () => {
  assert.equal(windowRange([0, 10, 20, 30, 40], 15, 25), [1, 4]);
  assert.equal(windowRange([0, 10, 20, 30, 40], 10, 30), [0, 5]);
  assert.equal(windowRange([0, 10], 100, 200), [1, 2]);
});

test.run();
