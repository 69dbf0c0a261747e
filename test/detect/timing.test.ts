/** Timing on the raw reports (src/detect/timing.ts): the wind split and the start of a temperature change. */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { assertClose } from '../helpers/assert.js';
import { changeStart, windSplit } from '../../src/detect/timing.js';
import type { RawColumns } from '../../src/detect/features.js';

const MIN = 60_000;
const HOUR = 60 * MIN;
const T0 = Date.UTC(2026, 2, 10, 0, 0);
const NOON = T0 + 12 * HOUR;

/** Reports every `stepMin` from 06:00 to 18:00 with direction `dirAt(t)` and speed `spdAt(t)`. */
function reports(stepMin: number, dirAt: (tMs: number) => number, spdAt: (tMs: number) => number = () => 8) {
  const times: number[] = [];
  for (let t = T0 + 6 * HOUR; t <= T0 + 18 * HOUR; t += stepMin * MIN) times.push(t);
  const n = times.length;
  const nan = () => new Float64Array(n).fill(NaN);
  const raw: RawColumns = {
    gust: nan(),
    peak: nan(),
    spd: Float64Array.from(times, spdAt),
    dir: Float64Array.from(times, dirAt),
    tC: nan(),
    tdC: nan(),
    dirResolutionDeg: 10,
  };
  return { timeMs: Float64Array.from(times), raw };
}

const step = (before: number, after: number, atMs = NOON) => (t: number) => (t < atMs ? before : after);

test('windSplit() times an abrupt veer between the last report before and the first after (5-min reports)', () => {
  const { timeMs, raw } = reports(5, step(200, 290));
  const w = windSplit(timeMs, raw, NOON)!;
  // FMH-1 §5.4.6: 45° or more in under 15 min at 10 kt or more (8 m/s ≈ 15.6 kt): a wind shift; it began
  // after the 11:55 report and by the 12:00 report (constructed: the estimate is the midpoint)
  assert.is(w.earliestMs, NOON - 5 * MIN);
  assert.is(w.latestMs, NOON);
  assert.is(w.timeMs, NOON - 2.5 * MIN);
  // constructed: 200° → 290°, clockwise
  assertClose(w.turnDeg, 90, 1e-6);
  assert.ok(w.strength > 0);
});

test('windSplit() brackets a shift between hourly reports', () => {
  const { timeMs, raw } = reports(60, step(200, 290, NOON - 20 * MIN));
  const w = windSplit(timeMs, raw, NOON)!;
  // constructed: the shift lies between the 11:00 and 12:00 reports
  assert.is(w.earliestMs, NOON - HOUR);
  assert.is(w.latestMs, NOON);
  assert.is(w.timeMs, NOON - 30 * MIN);
});

test('windSplit() gives a negative turn for a backing shift (a cold front south of the equator)', () => {
  const { timeMs, raw } = reports(5, step(340, 250));
  const w = windSplit(timeMs, raw, NOON)!;
  // common practice, no source: fronts back in the southern hemisphere; constructed: 340° → 250° is −90°
  assertClose(w.turnDeg, -90, 1e-6);
  assert.is(w.latestMs, NOON);
});

test('windSplit() dates a shift that turns over several reports from the first report that turned', () => {
  // 200° until 11:40, then 230°, 260°, 290° at 11:45, 11:50, 11:55 and after
  const dirs = (t: number) => (t <= NOON - 20 * MIN ? 200 : t === NOON - 15 * MIN ? 230 : t === NOON - 10 * MIN ? 260 : 290);
  const { timeMs, raw } = reports(5, dirs);
  const w = windSplit(timeMs, raw, NOON)!;
  // FMH-1 §5.4.6: "The time reported is the time the shift began": between 11:40 and 11:45
  assert.ok(w.timeMs > NOON - 20 * MIN && w.timeMs < NOON - 15 * MIN, `${new Date(w.timeMs).toISOString()}`);
  // The window brackets the shift (common practice, no source): it opens at the last report with the old
  // wind (11:40, 200°) and closes at the first report nearer the new wind than the old (11:50, 260°; the
  // 11:45 report at 230° is still nearer the old 200°)
  assert.is(w.earliestMs, NOON - 20 * MIN);
  assert.is(w.latestMs, NOON - 10 * MIN);
  // constructed: the turn is that of the mean winds either side of the split, so the transitional reports
  // on one side make it a little under the full 90°
  assert.ok(w.turnDeg > 80 && w.turnDeg <= 90, `turn ${w.turnDeg}`);
});

test('windSplit() is null when no split turns the wind by 30° or more', () => {
  // FMH-1 §5.4.6 via check-values 7: 35° is no wind shift; constructed: the split needs ≥ minTurnDeg (30°)
  assert.is(windSplit(...pair(reports(5, step(200, 225))), NOON), null);
  // constructed: a steady wind has nothing to split
  assert.is(windSplit(...pair(reports(5, () => 200)), NOON), null);
  // constructed: with minTurnDeg 20 the 25° turn is found
  assert.ok(windSplit(...pair(reports(5, step(200, 225))), NOON, 2 * HOUR, 1.5 * HOUR, 20) !== null);
});

test('windSplit() is null with fewer than 4 usable reports, or calm on one side', () => {
  const few = reports(60, step(200, 290));
  // constructed: a 10-min search and side window holds only the 12:00 report
  assert.is(windSplit(few.timeMs, few.raw, NOON, 10 * MIN, 10 * MIN), null);
  // WMO-No. 306 FM 15: calm has no direction; constructed: calm before the "shift" is not a turn
  const calmBefore = reports(5, step(0, 290), (t) => (t < NOON ? 0 : 8));
  assert.is(windSplit(calmBefore.timeMs, calmBefore.raw, NOON), null);
});

function pair(r: { timeMs: Float64Array; raw: RawColumns }): [Float64Array, RawColumns] {
  return [r.timeMs, r.raw];
}

test('changeStart() finds the last report within 15 % of the level and the next one', () => {
  const timeMs = Float64Array.from([0, 1, 2, 3, 4, 5, 6], (h) => NOON + h * HOUR);
  const values = Float64Array.from([20, 20, 20, 19.5, 17, 14, 12]);
  const c = changeStart(timeMs, values, 20, -8, NOON, NOON + 7 * HOUR)!;
  // constructed: 19.5 is 6 % of the −8 °C change (still at the level), 17 is 38 % (departed)
  assert.is(c.earliestMs, NOON + 3 * HOUR);
  assert.is(c.latestMs, NOON + 4 * HOUR);
  assert.is(c.timeMs, NOON + 3.5 * HOUR);
  // constructed: no wind turn in a temperature split
  assert.ok(Number.isNaN(c.turnDeg));
});

test('changeStart() skips missing values and works for rises', () => {
  const timeMs = Float64Array.from([0, 1, 2, 3, 4], (h) => NOON + h * HOUR);
  const values = Float64Array.from([5, 5.2, NaN, 8, 9]);
  const c = changeStart(timeMs, values, 5, 4, NOON, NOON + 5 * HOUR)!;
  // constructed: 5.2 is 5 % of the +4 °C rise; the missing 02:00 report is passed over
  assert.is(c.earliestMs, NOON + HOUR);
  assert.is(c.latestMs, NOON + 3 * HOUR);
});

test('changeStart() is null for no change, a change already under way, or one that never starts', () => {
  const timeMs = Float64Array.from([0, 1, 2], (h) => NOON + h * HOUR);
  // constructed: expected by construction
  assert.is(changeStart(timeMs, Float64Array.from([1, 2, 3]), 1, 0, NOON, NOON + 3 * HOUR), null);
  assert.is(changeStart(timeMs, Float64Array.from([1, 2, 3]), 1, NaN, NOON, NOON + 3 * HOUR), null);
  // constructed: every report in the window has departed from the level
  assert.is(changeStart(timeMs, Float64Array.from([15, 14, 12]), 20, -8, NOON, NOON + 3 * HOUR), null);
  // constructed: no report has departed
  assert.is(changeStart(timeMs, Float64Array.from([20, 20, 19.9]), 20, -8, NOON, NOON + 3 * HOUR), null);
});

test.run();
