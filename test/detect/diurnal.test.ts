/** Diurnal adjustment for detection (src/detect/diurnal.ts): remove the expected cycle, damped near saturation. */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { assertClose } from '../helpers/assert.js';
import { diurnalAdjustment } from '../../src/detect/diurnal.js';

const HOUR = 3_600_000;
const T0 = Date.UTC(2026, 5, 1, 0, 0);
const STEP = HOUR / 4;

/** 15 days on a 15-min grid at longitude 0: T = 15 + 5 cos(2π (h − 15) / 24), warmest at 15 solar time. */
function cycle(depressionC: number) {
  const n = 15 * 96;
  const timeMs = new Float64Array(n);
  const tC = new Float64Array(n);
  const tdC = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    timeMs[i] = T0 + i * STEP;
    const h = (i * STEP) / HOUR;
    tC[i] = 15 + 5 * Math.cos(((h - 15) / 24) * 2 * Math.PI);
    tdC[i] = tC[i]! - depressionC;
  }
  return { timeMs, tC, tdC };
}

/** Largest |x − c| over the middle days (the first and last day lack a centred daily mean). */
function maxDeviation(x: Float64Array, c: number): number {
  let m = 0;
  for (let i = 2 * 96; i < x.length - 2 * 96; i++) m = Math.max(m, Math.abs(x[i]! - c));
  return m;
}

test('diurnalAdjustment() without a longitude returns a copy of the temperature', () => {
  const { timeMs, tC, tdC } = cycle(10);
  const d = diurnalAdjustment(timeMs, tC, tdC, NaN, 45);
  // constructed: expected by construction (solar time needs the longitude)
  assert.equal(Array.from(d.adjusted), Array.from(tC));
  assert.is(d.method, 'none (no station longitude)');
  // constructed: expected by construction, a copy, not the input array itself
  assert.ok(d.adjusted !== tC);
});

test('diurnalAdjustment() in dry air removes a repeating daily cycle', () => {
  const { timeMs, tC, tdC } = cycle(10);
  const d = diurnalAdjustment(timeMs, tC, tdC, 0, 45);
  // constructed: expected by construction, 15 identical days give the station's own (climatology) profile
  assert.match(d.method, /^climatology profile/);
  // constructed: the cycle is removed, leaving the daily mean 15 °C (hourly profile nodes: interpolation error
  // of a 5 °C cosine between nodes is about 5·(2π/24)²/8 ≈ 0.04 °C)
  const dev = maxDeviation(d.adjusted, 15);
  assert.ok(dev < 0.15, `max deviation ${dev}`);
  // constructed: the raw temperature does vary by the full ±5 °C
  assert.ok(maxDeviation(tC, 15) > 4.9);
});

test('diurnalAdjustment() leaves the temperature alone at a dew-point depression of 1 °C or less', () => {
  const { timeMs, tC, tdC } = cycle(0.5);
  const d = diurnalAdjustment(timeMs, tC, tdC, 0, 45);
  // common practice, no source: no damping factor at depression ≤ 1 °C (cloud and rain flatten the cycle)
  for (let i = 0; i < tC.length; i++) assertClose(d.adjusted[i]!, tC[i]!, 1e-12, 0, `i=${i}`);
});

test('diurnalAdjustment() removes half the cycle at a depression of 3 °C', () => {
  const { timeMs, tC, tdC } = cycle(3);
  const d = diurnalAdjustment(timeMs, tC, tdC, 0, 45);
  // common practice, no source: damping (d − 1)/4 = 0.5 at d = 3 °C, so half of the anomaly is removed
  const k = 7 * 96 + 60; // day 7, 15:00 solar time: the raw anomaly is +5 °C
  assertClose(tC[k]! - 15, 5, 1e-9);
  assertClose(d.adjusted[k]! - 15, 2.5, 0.1);
});

test('diurnalAdjustment() keeps NaN where the temperature is missing', () => {
  const { timeMs, tC, tdC } = cycle(10);
  tC[500] = NaN;
  const d = diurnalAdjustment(timeMs, tC, tdC, 0, 45);
  // constructed: expected by construction (missing stays missing)
  assert.ok(Number.isNaN(d.adjusted[500]!));
  assert.ok(Number.isFinite(d.adjusted[501]!));
});

test.run();
