import { test } from 'uvu';
import * as assert from 'uvu/assert';
import {
  diurnalAnomalyAt,
  expectedDiurnalChange,
  fallbackDiurnalProfile,
  meanDiurnalAnomaly,
  removeDiurnal,
} from '../../src/signal/diurnal.js';
import { solarHour } from '../../src/physics/sun.js';
import { assertClose } from '../helpers/assert.js';
import { gaussian, mulberry32 } from '../helpers/random.js';

const HOUR = 3600000;

function variance(a: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < a.length; i++) m += a[i]!;
  m /= a.length;
  let v = 0;
  for (let i = 0; i < a.length; i++) v += (a[i]! - m) ** 2;
  return v / a.length;
}

/** 30 days of synthetic data: 12 + 5·sin(2π(h − 9)/24) in local solar hour h, optional noise. */
function synthetic(lonDeg: number, stepMs: number, noiseSd: number, seed = 1) {
  const r = mulberry32(seed);
  const t0 = Date.UTC(2024, 4, 1);
  const timeMs: number[] = [];
  const values: number[] = [];
  const pure: number[] = [];
  for (let t = t0; t < t0 + 30 * 24 * HOUR; t += stepMs) {
    const h = solarHour(t, lonDeg);
    const p = 12 + 5 * Math.sin((2 * Math.PI * (h - 9)) / 24);
    timeMs.push(t);
    pure.push(p);
    values.push(p + noiseSd * gaussian(r));
  }
  return { timeMs, values, pure };
}

test('meanDiurnalAnomaly(): 30-day hourly sinusoid + noise → profile within 0.45 of the truth (synthetic)', () => {
  // Noise σ = 0.5; the median of ~29 daily anomalies has standard error ≈ 1.2533·0.5/√29 ≈ 0.12 (Gaussian
  // efficiency of the median, textbook); 0.45 is about 4 standard errors.
  const lon = -87.3; // solar time = UTC − 5.82 h: samples sit 0.18 h into each solar-hour bin
  const { timeMs, values } = synthetic(lon, HOUR, 0.5);
  const p = meanDiurnalAnomaly(timeMs, values, lon);
  assert.is(p.source, 'climatology');
  assert.is(p.binsPerDay, 24);
  for (let b = 0; b < 24; b++) {
    const h = p.hourOfNode[b]!;
    assertClose(p.anomaly[b]!, 5 * Math.sin((2 * Math.PI * (h - 9)) / 24), 0.45, 0, `bin ${b}`);
    assert.ok(p.days[b]! >= 28);
  }
  assertClose(p.range, 10, 0.6);
});

test('removeDiurnal() removes > 90 % of the variance of a pure diurnal cycle (5-min data, synthetic)', () => {
  const lon = 14.2;
  const { timeMs, pure } = synthetic(lon, 5 * 60000, 0);
  const p = meanDiurnalAnomaly(timeMs, pure, lon);
  assert.is(p.source, 'climatology');
  const residual = removeDiurnal(timeMs, pure, p, lon);
  assert.ok(variance(residual) < 0.1 * variance(pure), `residual variance ${variance(residual)}`);
  // A profile learnt from noisy data does nearly as well on the pure cycle.
  const noisy = synthetic(lon, 5 * 60000, 1, 7);
  const pn = meanDiurnalAnomaly(noisy.timeMs, noisy.values, lon);
  assert.ok(variance(removeDiurnal(timeMs, pure, pn, lon)) < 0.1 * variance(pure));
});

test('meanDiurnalAnomaly() is robust: a few frontal days barely move the profile (median; synthetic)', () => {
  const lon = 0;
  const { timeMs, values } = synthetic(lon, HOUR, 0.3, 3);
  const clean = meanDiurnalAnomaly(timeMs, values, lon);
  // Three cold-front drops of 10 °C at 18 UTC on days 5, 12, 20, each recovering over the next day.
  const fronted = values.slice();
  for (const day of [5, 12, 20]) for (let k = 0; k < 24; k++) fronted[day * 24 + 18 + k] = fronted[day * 24 + 18 + k]! - 10 * (1 - k / 24);
  const p = meanDiurnalAnomaly(timeMs, fronted, lon);
  for (let b = 0; b < 24; b++) assertClose(p.anomaly[b]!, clean.anomaly[b]!, 0.6, 0, `bin ${b}`);
});

test('meanDiurnalAnomaly() falls back to the model on a short record (< 10 days per bin; our rule)', () => {
  const lon = -100;
  const { timeMs, values } = synthetic(lon, HOUR, 0.2);
  const p = meanDiurnalAnomaly(timeMs.slice(0, 5 * 24), values.slice(0, 5 * 24), lon, { latDeg: 40 });
  assert.is(p.source, 'model');
  assertClose(p.range, 10, 1.5); // range from the record's own daily ranges
  const none = meanDiurnalAnomaly(timeMs.slice(0, 48), values.slice(0, 48), lon, { fallback: 'none' });
  assert.is(none.source, 'none');
  assert.is(diurnalAnomalyAt(none, 15), 0);
});

test('fallback model: expected change from 18 to 23 local solar time is negative (evening cooling; common practice, no source)', () => {
  for (const latDeg of [undefined, 0, 35, 55]) {
    for (const month of [0, 3, 6, 9]) {
      const day = Date.UTC(2024, month, 15);
      const p = fallbackDiurnalProfile({ range: 8, latDeg, timeMs: day });
      const lon = 0;
      const change = expectedDiurnalChange(p, day + 18 * HOUR, day + 23 * HOUR, lon);
      assert.ok(change < -1, `lat ${latDeg} month ${month + 1}: ${change}`);
      // Morning warming 08 → 13 solar time.
      assert.ok(expectedDiurnalChange(p, day + 8 * HOUR, day + 13 * HOUR, lon) > 1);
    }
  }
  // Maximum in the early afternoon, minimum near sunrise (12-h day: 06 solar time).
  const p = fallbackDiurnalProfile({ range: 8 });
  let hMax = 0;
  let hMin = 0;
  for (let b = 0; b < p.binsPerDay; b++) {
    if (p.anomaly[b]! > p.anomaly[hMax]!) hMax = b;
    if (p.anomaly[b]! < p.anomaly[hMin]!) hMin = b;
  }
  assertClose(p.hourOfNode[hMax]!, 14, 0.5);
  assertClose(p.hourOfNode[hMin]!, 6, 0.5);
  assertClose(p.range, 8, 0.05);
});

test('expectedDiurnalChange() uses local solar time from longitude (same UTC times, opposite phases)', () => {
  const p = fallbackDiurnalProfile({ range: 8 });
  const t0 = Date.UTC(2024, 2, 20, 18);
  const t1 = t0 + 5 * HOUR;
  assert.ok(expectedDiurnalChange(p, t0, t1, 0) < 0); // 18 → 23 solar: cooling
  assert.ok(expectedDiurnalChange(p, t0, t1, 180) > 0); // 06 → 11 solar: warming
  const y = removeDiurnal([t0, NaN], [10, 10], p, 0);
  assert.ok(Number.isNaN(y[1]!));
});

test.run();
