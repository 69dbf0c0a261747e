/**
 * Lasting air-mass change (airmass.ts) on constructed grids: a lasting step (a front), a change that
 * recovers within hours (an outflow), and a pure diurnal cycle (evening cooling), whose day-on-day and
 * daily-mean changes vanish by construction.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { airMassChange } from '../../src/detect/airmass.js';
import type { DetectGrid } from '../../src/detect/grid.js';

const HOUR = 3_600_000;
const STEP = 15 * 60_000;

function grid(n: number, t: (h: number) => number, td: (h: number) => number): DetectGrid {
  const timeMs = Float64Array.from({ length: n }, (_, i) => Date.UTC(2026, 0, 1) + i * STEP);
  const tC = Float64Array.from({ length: n }, (_, i) => t((i * STEP) / HOUR));
  const tdC = Float64Array.from({ length: n }, (_, i) => td((i * STEP) / HOUR));
  const nan = () => new Float64Array(n).fill(NaN);
  return { stepMs: STEP, n, timeMs, tC, tAdjC: tC.slice(), tdC, thetaEK: tC.map((x, i) => x + 2.5 * tdC[i]!), pHpa: nan(), pressureKind: 'none', uMs: nan(), vMs: nan(), speedMs: nan(), diurnalMethod: 'none', cadenceMin: 15 };
}

const at = (g: DetectGrid, h: number) => Math.round((h * HOUR) / STEP);

test('airMassChange: a lasting 8 °C step is seen day on day and in the daily means', () => {
  // constructed: T = 10 °C before hour 48, 2 °C after; Td 5 → −5
  const g = grid(96 * 4, (h) => (h < 48 ? 10 : 2), (h) => (h < 48 ? 5 : -5));
  const a = airMassChange(g, at(g, 48));
  assert.ok(Math.abs(a.tempDayC + 8) < 1e-9, `${a.tempDayC}`);
  assert.ok(Math.abs(a.dewpointDayC + 10) < 1e-9, `${a.dewpointDayC}`);
  assert.ok(Math.abs(a.tempDailyMeanC + 8) < 1e-9, `${a.tempDailyMeanC}`);
  assert.ok(Math.abs(a.tempAdjLastingC + 8) < 1e-9);
  assert.ok(Number.isNaN(a.pressureRise6hHpa)); // no pressure: NaN, not 0
});

test('airMassChange: a 6 °C fall that recovers within 2 h leaves no lasting change', () => {
  // constructed: outflow-like dip of 6 °C between hours 48 and 50
  const g = grid(96 * 4, (h) => (h >= 48 && h < 50 ? 14 : 20), () => 15);
  const a = airMassChange(g, at(g, 48));
  assert.ok(Math.abs(a.tempDayC) < 1e-9, `${a.tempDayC}`);
  assert.ok(Math.abs(a.tempDailyMeanC) < 0.6, `${a.tempDailyMeanC}`); // the 2-h dip is outside the after window's first 2 h
});

test('airMassChange: a pure diurnal cycle gives no day-on-day change', () => {
  // constructed: T = 10 + 6 sin(2π h / 24), any candidate hour
  const g = grid(96 * 4, (h) => 10 + 6 * Math.sin((2 * Math.PI * h) / 24), () => 4);
  const a = airMassChange(g, at(g, 50));
  assert.ok(Math.abs(a.tempDayC) < 1e-9, `${a.tempDayC}`);
  assert.ok(Math.abs(a.tempDailyMeanC) < 0.05, `${a.tempDailyMeanC}`);
});

test('airMassChange: windows without data give NaN', () => {
  const g = grid(40, () => 10, () => 5); // 10 h only: no day before
  const a = airMassChange(g, at(g, 5));
  assert.ok(Number.isNaN(a.tempDayC) && Number.isNaN(a.tempDailyMeanC));
});

test.run();
