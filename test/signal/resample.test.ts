import { test } from 'uvu';
import * as assert from 'uvu/assert';
import {
  chooseStepMs,
  defaultMaxGapMs,
  resampleRegular,
  resampleWindUV,
  windComponents,
  windFromComponents,
} from '../../src/signal/resample.js';
import { assertAllClose, assertClose } from '../helpers/assert.js';

const MIN = 60000;
const HOUR = 3600000;

test('resampleRegular() linear values are exact on a straight line (linear interpolation, textbook)', () => {
  const t = [0, 7 * MIN, 31 * MIN, 60 * MIN];
  const y = t.map((x) => 1000 + 0.002 * (x / MIN)); // 0.002 per minute
  const r = resampleRegular(t, y, { stepMs: 5 * MIN, maxGapMs: HOUR });
  assert.is(r.timeMs.length, 13);
  assertAllClose(r.values, Array.from(r.timeMs, (x) => 1000 + 0.002 * (x / MIN)), 1e-9);
});

test('resampleRegular() never interpolates across a 3-h gap when maxGap is 2 h (gap rule, common practice)', () => {
  const t = [0, HOUR, 4 * HOUR, 5 * HOUR];
  const y = [10, 11, 14, 15];
  const r = resampleRegular(t, y, { stepMs: 30 * MIN, maxGapMs: 2 * HOUR });
  // grid 0, 0.5, ..., 5 h
  assert.equal(Array.from(r.timeMs, (x) => x / HOUR), [0, 0.5, 1, 1.5, 2, 2.5, 3, 3.5, 4, 4.5, 5]);
  assert.equal(Array.from(r.values.slice(0, 3)), [10, 10.5, 11]);
  for (let k = 3; k <= 7; k++) assert.ok(Number.isNaN(r.values[k]!), `grid ${k} inside the gap is NaN`);
  assert.equal(Array.from(r.values.slice(8)), [14, 14.5, 15]);
  // The same 3-h spacing is bridged when maxGap allows it.
  const r2 = resampleRegular(t, y, { stepMs: 30 * MIN, maxGapMs: 3 * HOUR });
  assertClose(r2.values[5]!, 12.5, 1e-12);
});

test('resampleRegular() treats NaN reports as absent and leaves the outside of the data span NaN', () => {
  const t = [10 * MIN, 20 * MIN, 30 * MIN];
  const r = resampleRegular(t, [1, NaN, 3], { stepMs: 10 * MIN, startMs: 0, endMs: 40 * MIN, maxGapMs: HOUR });
  assert.ok(Number.isNaN(r.values[0]!));
  assert.equal(Array.from(r.values.slice(1, 4)), [1, 2, 3]);
  assert.ok(Number.isNaN(r.values[4]!));
  assert.throws(() => resampleRegular([2, 1], [0, 0], { stepMs: 1, maxGapMs: 10 }), RangeError);
});

test("resampleRegular('nearest') and ('mean') follow their documented rules", () => {
  const t = [0, 4 * MIN, 10 * MIN];
  const n = resampleRegular(t, [0, 4, 10], { stepMs: 5 * MIN, maxGapMs: HOUR, method: 'nearest' });
  assert.equal(Array.from(n.values), [0, 4, 10]);
  // 1-min data to 5-min bin means, bins centred [t − 2.5, t + 2.5) min.
  const tt = Array.from({ length: 11 }, (_, i) => i * MIN);
  const yy = tt.map((_, i) => i);
  const m = resampleRegular(tt, yy, { stepMs: 5 * MIN, maxGapMs: HOUR, method: 'mean' });
  assert.equal(Array.from(m.values), [1, 5, 9]); // {0,1,2}, {3..7}, {8,9,10}
});

test('resampleWindUV() across north: 350° and 10° average to 0°, not 180° (u = −s·sin d, v = −s·cos d; textbook)', () => {
  const r = resampleWindUV([0, 10 * MIN], [350, 10], [5, 5], { stepMs: 5 * MIN, maxGapMs: HOUR });
  assertClose(r.dirDeg[1]!, 0, 1e-9);
  assertClose(r.uMs[1]!, 0, 1e-12);
  assertClose(r.vMs[1]!, -5 * Math.cos((10 * Math.PI) / 180), 1e-12);
  assertClose(r.speedMs[1]!, 5 * Math.cos((10 * Math.PI) / 180), 1e-12); // vector mean is slightly slower
  assertClose(r.scalarSpeedMs[1]!, 5, 1e-12);
  assertClose(r.dirDeg[0]!, 350, 1e-9);
  assertClose(r.dirDeg[2]!, 10, 1e-9);
});

test('windComponents()/windFromComponents(): meteorological convention round trip (textbook; direction from which it blows, WMO-No. 8)', () => {
  // A west wind (from 270°) blows towards the east: u > 0; a south wind (180°): v > 0.
  assertClose(windComponents(270, 10).uMs, 10, 1e-12);
  assertClose(windComponents(180, 10).vMs, 10, 1e-12);
  for (const d of [0, 45, 90, 135, 225, 300, 359]) {
    const c = windComponents(d, 7);
    const w = windFromComponents(c.uMs, c.vMs);
    assertClose(w.dirDeg, d, 1e-9, 0, `dir ${d}`);
    assertClose(w.speedMs, 7, 1e-12);
  }
  assert.equal(windComponents(NaN, 0), { uMs: 0, vMs: 0 }); // calm counts as zero vector
  assert.ok(Number.isNaN(windFromComponents(0, 0).dirDeg)); // calm has no direction
});

test('chooseStepMs() from the median spacing; defaultMaxGapMs() = max(2.5·step, 15 min) (our rule, common practice)', () => {
  const grid = (n: number, dt: number, jitter = 0) => Array.from({ length: n }, (_, i) => i * dt + (i % 2) * jitter);
  assert.is(chooseStepMs(grid(50, 5 * MIN)), 5 * MIN);
  assert.is(chooseStepMs(grid(50, MIN)), MIN);
  assert.is(chooseStepMs(grid(50, HOUR, 2 * MIN)), HOUR); // hourly METAR with jittered times
  assert.is(chooseStepMs(grid(50, 20 * MIN)), 20 * MIN);
  assert.is(chooseStepMs(grid(50, 3 * HOUR)), HOUR);
  assert.is(chooseStepMs([0]), HOUR);
  assert.is(defaultMaxGapMs(HOUR), 2.5 * HOUR);
  assert.is(defaultMaxGapMs(5 * MIN), 15 * MIN);
});

test.run();
