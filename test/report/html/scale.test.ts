/**
 * Scales and ticks. Nice steps of 1, 2, 5 × 10^k: the rule d3-array documents for `ticks` ("uniformly-spaced, nicely-rounded
 * values ... each value is a power of ten multiplied by 1, 2 or 5", d3-array README), which the report now uses.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { linearScale, niceStep, niceTicks, paddedDomain } from '../../../src/report/html/scale.js';
import { timeLabel, timeTicks, utcMinute } from '../../../src/report/html/timeAxis.js';
import { escapeXml } from '../../../src/report/html/escape.js';

const H = 3_600_000;

test('linearScale maps the domain ends to the range ends (inverted range for y)', () => {
  const y = linearScale(0, 10, 100, 0);
  assert.is(y(0), 100);
  assert.is(y(10), 0);
  assert.is(y(2.5), 75);
  assert.is(linearScale(5, 5, 0, 10)(123), 5);
});

test('niceStep/niceTicks pick 1-2-5 steps inside the domain', () => {
  assert.is(niceStep(0, 10, 5), 2);
  // d3-array tickStep(0, 1, 4): 0.2 (its error thresholds √50, √10, √2 pick 2 × 10^-1 for a raw step of 0.25)
  assert.is(niceStep(0, 1, 4), 0.2);
  assert.equal(niceTicks(-1.3, 8.2, 5), [0, 2, 4, 6, 8]);
  assert.equal(niceTicks(1003.2, 1011.9, 4), [1004, 1006, 1008, 1010]);
  assert.equal(niceTicks(1003.2, 1011.9, 5), [1004, 1006, 1008, 1010]);
  for (const v of niceTicks(-3, 3, 6)) assert.ok(!Object.is(v, -0), 'no -0 tick');
  assert.equal(niceTicks(0.11, 0.49, 4), [0.2, 0.3, 0.4]);
});

test('paddedDomain widens by 8 % and to a least span; NaN pair without values', () => {
  assert.equal(paddedDomain([1, 3], 10), [-3, 7]);
  const [a, b] = paddedDomain([0, 100, NaN], 1);
  assert.is(a, -8);
  assert.is(b, 108);
  assert.ok(paddedDomain([NaN], 1).every(Number.isNaN));
});

test('timeTicks: whole UTC hours, smallest step within the tick budget', () => {
  const t0 = Date.UTC(2026, 2, 1, 0, 10);
  const ticks = timeTicks(t0, t0 + 24 * H, 10);
  // 24 h with at most 10 ticks → 3-hourly from 03 UTC
  assert.equal(ticks.map((t) => new Date(t).getUTCHours()), [3, 6, 9, 12, 15, 18, 21, 0]);
  const long = timeTicks(Date.UTC(2026, 2, 1), Date.UTC(2026, 4, 1), 12);
  assert.ok(long.length <= 12 && long.length >= 4, `${long.length} ticks`);
  assert.ok(long.every((t) => t % (24 * H) === 0), 'multi-day ticks fall on 00 UTC');
});

test('timeLabel and utcMinute are UTC', () => {
  assert.is(timeLabel(Date.UTC(2026, 2, 2, 6), 3 * H), '06:00');
  assert.is(timeLabel(Date.UTC(2026, 2, 2, 0), 3 * H), '2 Mar');
  assert.is(timeLabel(Date.UTC(2026, 3, 9, 0), 48 * H), '9 Apr');
  assert.is(utcMinute(Date.UTC(2026, 2, 2, 14, 21, 30)), '2026-03-02 14:21');
  assert.is(utcMinute(NaN), '');
});

test('escapeXml escapes the five XML special characters (XML 1.0 §4.6 predefined entities)', () => {
  assert.is(escapeXml(`K<A>&"B'`), 'K&lt;A&gt;&amp;&quot;B&#39;');
  assert.is(escapeXml('plain − text °C'), 'plain − text °C');
});

test.run();
