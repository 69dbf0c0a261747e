/** The library checks its own options: bad values throw before any work, never a silent NaN downstream. */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { allocSeries } from '../src/model/index.js';
import { analyseSeries, checkDetectOptions, detectStation, loadPaths, UsageError } from '../src/index.js';

const isRange = (pattern: RegExp) => (e: unknown) => e instanceof RangeError && pattern.test((e as Error).message);

test('analyseSeries(series, { frontSpeedKmh }) throws RangeError for 0, a negative speed, NaN and Infinity', () => {
  // a speed is positive and finite (common practice, no source)
  for (const v of [0, -10, NaN, Infinity]) assert.throws(() => analyseSeries([], { frontSpeedKmh: v }), isRange(/frontSpeedKmh/), String(v));
});

test('analyseSeries(series, { minConfidence }) throws RangeError outside 0–1 and for NaN; 0 and 1 are accepted', () => {
  // confidence is defined on [0, 1] (src/model/event.ts PassageEvent.confidence)
  for (const v of [-0.1, 1.01, NaN]) assert.throws(() => analyseSeries([], { minConfidence: v }), isRange(/minConfidence/), String(v));
  for (const v of [0, 1]) assert.equal(analyseSeries([], { minConfidence: v }), { events: [], tracks: [], failures: [] });
});

test('detectStation(series, opts) checks the same options (checkDetectOptions)', () => {
  const s = allocSeries('XTST', 0);
  assert.throws(() => detectStation(s, { frontSpeedKmh: -1 }), isRange(/frontSpeedKmh/));
  assert.throws(() => detectStation(s, { minConfidence: 2 }), isRange(/minConfidence/));
  assert.not.throws(() => checkDetectOptions({ frontSpeedKmh: 30, minConfidence: 0.4 }));
});

test('loadPaths([missing]) throws UsageError, which is a RangeError', () => {
  let caught: unknown;
  try {
    loadPaths(['/nonexistent/fropa-test-path']);
  } catch (e) {
    caught = e;
  }
  assert.ok(caught instanceof UsageError, 'UsageError');
  assert.ok(caught instanceof RangeError, 'RangeError');
  assert.match((caught as Error).message, /no such file or directory/);
});

test.run();
