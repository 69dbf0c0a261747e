import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { pelt, peltMulti, type PeltCost } from '../../src/signal/pelt.js';
import { robustNoiseSigma } from '../../src/signal/noise.js';
import { assertClose } from '../helpers/assert.js';
import { gaussian, mulberry32 } from '../helpers/random.js';
import { NILE, PAGE } from '../fixtures/changepoint-data.js';

/**
 * Reference: optimal partitioning without pruning (Jackson et al. 2005, Signal Process. Lett. 12, 105–108),
 * O(n²), mean cost Σ(y − ȳ)²/σ², β per change, minimum segment length. Written independently of PELT.
 */
function optimalPartitioningMean(y: number[], sigma: number, beta: number, minSeg: number): number[] {
  const n = y.length;
  const F = new Array<number>(n + 1).fill(Infinity);
  const prev = new Array<number>(n + 1).fill(-1);
  F[0] = -beta;
  for (let t = minSeg; t <= n; t++) {
    for (let s = 0; s <= t - minSeg; s++) {
      if (F[s] === Infinity) continue;
      let mean = 0;
      for (let i = s; i < t; i++) mean += y[i]!;
      mean /= t - s;
      let c = 0;
      for (let i = s; i < t; i++) c += (y[i]! - mean) ** 2;
      const v = F[s]! + c / (sigma * sigma) + beta;
      if (v < F[t]!) {
        F[t] = v;
        prev[t] = s;
      }
    }
  }
  const cps: number[] = [];
  for (let t = n; t > 0; t = prev[t]!) if (prev[t]! > 0) cps.push(prev[t]!);
  return cps.reverse();
}

test('pelt(Nile, mean, β = 2 ln n) → one change at index 28 (1899 starts the new regime; Cobb 1978: change near 1898)', () => {
  // strucchange::breakpoints(Nile ~ 1) reports observation 28 (= 1898) as the last of the first regime
  // (Zeileis et al. 2002, J. Stat. Softw. 7(2)); our index is the first sample of the new segment, 0-based = 28.
  const r = pelt(NILE, { cost: 'mean', penalty: 2 * Math.log(100), minSegment: 2 });
  assert.equal(Array.from(r.changePoints), [28]);
  assertClose(r.segments[0]!.mean, 1097.75, 1e-9, 0, 'mean 1871–1898'); // exact arithmetic mean of the first 28 values
  assertClose(r.segments[1]!.mean, 849.9722222, 1e-6, 0, 'mean 1899–1970');
  assert.is(r.segments[0]!.count, 28);
});

test('pelt(Nile) with the defaults (mean, MBIC, min segment 2) and with bic also finds only 1898|1899', () => {
  assert.equal(Array.from(pelt(NILE).changePoints), [28]);
  assert.equal(Array.from(pelt(NILE, { penalty: 'bic' }).changePoints), [28]);
  assert.equal(Array.from(pelt(NILE, { cost: 'meanvar', penalty: 'bic' }).changePoints), [28]);
  assert.equal(Array.from(pelt(NILE, { cost: 'linear' }).changePoints), [28]);
});

test('pelt(Nile, β = 2) equals unpruned optimal partitioning (Jackson2005 reference in this file)', () => {
  const sigma = robustNoiseSigma(NILE);
  const expected = optimalPartitioningMean(NILE, sigma, 2, 2);
  // 14 changes {7, 9, 17, 19, 28, 37, 40, 45, 47, 63, 68, 71, 83, 95}.
  assert.is(expected.length, 14);
  assert.equal(Array.from(pelt(NILE, { penalty: 2, minSegment: 2 }).changePoints), expected);
});

test('pelt() pruning is exact: equals optimal partitioning on seeded series for minSegment 1–4', () => {
  for (let seed = 1; seed <= 12; seed++) {
    const r = mulberry32(seed);
    const y = Array.from({ length: 90 }, (_, i) => (i % 30 < 15 ? 0 : 1.5) + gaussian(r));
    for (const minSeg of [1, 2, 3, 4]) {
      for (const beta of [1, 4, 10]) {
        const got = Array.from(pelt(y, { sigma: 1, penalty: beta, minSegment: minSeg }).changePoints);
        assert.equal(got, optimalPartitioningMean(y, 1, beta, minSeg), `seed ${seed} minSeg ${minSeg} β ${beta}`);
      }
    }
  }
});

test("pelt(Page's data) → change at index 17 (Pettitt 1979: change after t = 17)", () => {
  for (const cost of ['mean', 'meanvar'] as PeltCost[]) {
    const r = pelt(PAGE, { cost });
    assert.equal(Array.from(r.changePoints), [17], cost);
  }
  const r = pelt(PAGE);
  assertClose(r.segments[0]!.mean, -0.1117647, 1e-6); // arithmetic means of t = 1–17 and 18–40
  assertClose(r.segments[1]!.mean, 0.9843478, 1e-6);
});

test('pelt() recovers piecewise-constant change points within ±1 sample at SNR 3 and 4 (synthetic, seeded)', () => {
  // Jumps of δσ between levels; segments 40–70 samples. Location error theory (common practice, no source):
  // moving the split k samples past a jump of δσ lowers the cost only if a sum of k noise terms exceeds
  // kδ/2, so P(|error| ≥ 2) ≈ 2Φ(−δ√2/2) ≈ 0.034 for δ = 3 and ≈ 0.005 for δ = 4.
  const truth = [60, 100, 170, 230];
  for (const [delta, maxFarFraction] of [
    [3, 0.06],
    [4, 0.01],
  ] as const) {
    const levels = [0, delta, 0, -delta, 0];
    let far = 0;
    let wrongCount = 0;
    for (let seed = 1; seed <= 100; seed++) {
      const r = mulberry32(seed);
      const y = new Float64Array(300);
      let seg = 0;
      for (let i = 0; i < y.length; i++) {
        while (seg < truth.length && i >= truth[seg]!) seg++;
        y[i] = 20 + levels[seg]! + gaussian(r);
      }
      const cps = Array.from(pelt(y).changePoints);
      if (cps.length !== truth.length) {
        wrongCount++;
        continue;
      }
      for (let k = 0; k < truth.length; k++) if (Math.abs(cps[k]! - truth[k]!) > 1) far++;
    }
    assert.ok(wrongCount <= 5, `δ=${delta}: ${wrongCount} of 100 series with a wrong number of changes`);
    assert.ok(far <= maxFarFraction * 400, `δ=${delta}: ${far} of 400 changes off by more than 1 sample`);
  }
});

test('pelt() default penalty: no change points on pure noise in ≥ 95 of 100 seeded trials (n = 500)', () => {
  for (const cost of ['mean', 'meanvar', 'linear'] as PeltCost[]) {
    let falseAlarms = 0;
    for (let seed = 1; seed <= 100; seed++) {
      const r = mulberry32(1000 + seed);
      const y = Float64Array.from({ length: 500 }, () => 10 + 2 * gaussian(r));
      if (pelt(y, { cost }).changePoints.length > 0) falseAlarms++;
    }
    assert.ok(falseAlarms <= 5, `${cost}: ${falseAlarms} false alarms`);
  }
  let multi = 0;
  for (let seed = 1; seed <= 100; seed++) {
    const r = mulberry32(5000 + seed);
    const u = Float64Array.from({ length: 500 }, () => gaussian(r));
    const v = Float64Array.from({ length: 500 }, () => 3 * gaussian(r));
    if (peltMulti([u, v]).changePoints.length > 0) multi++;
  }
  assert.ok(multi <= 5, `peltMulti: ${multi} false alarms`);
});

test('pelt(linear) locates the kink of a pressure V within ±2 samples and returns both slopes', () => {
  // Falling 0.1 hPa per step for 60 steps, then rising 0.15 hPa per step; noise 0.1 hPa (synthetic;
  // at 5-min steps a fall of 1.2 hPa/h then a rise of 1.8 hPa/h). Continuity is not imposed, so the
  // kink is only known to a few samples; ±2 is asked in at least 47 of 50 seeded series.
  let misses = 0;
  for (let seed = 1; seed <= 50; seed++) {
    const r = mulberry32(200 + seed);
    const y = Float64Array.from({ length: 120 }, (_, i) => (i < 60 ? 1010 - 0.1 * i : 1004 + 0.15 * (i - 60)) + 0.1 * gaussian(r));
    const res = pelt(y, { cost: 'linear' });
    if (res.changePoints.length !== 1 || Math.abs(res.changePoints[0]! - 60) > 2) {
      misses++;
      continue;
    }
    assertClose(res.segments[0]!.slope, -0.1, 0.01, 0, 'slope before');
    assertClose(res.segments[1]!.slope, 0.15, 0.01, 0, 'slope after');
  }
  assert.ok(misses <= 3, `${misses} of 50 kinks missed`);
});

test('peltMulti([u, v]) finds a 90° wind turn at constant speed more reliably than u or v alone', () => {
  // Wind from 180° then 270° at speed s: u goes 0 → s, v goes s → 0 (u = −s·sin d, v = −s·cos d, textbook).
  // Each channel alone carries half the evidence (Z² ≈ 16 per channel); the pair carries both.
  const L = 50;
  const s = Math.sqrt((2 * 16) / L);
  let multi = 0;
  let uOnly = 0;
  let vOnly = 0;
  const hit = (c: Int32Array) => c.length === 1 && Math.abs(c[0]! - L) <= 3;
  for (let seed = 1; seed <= 100; seed++) {
    const r = mulberry32(seed);
    const u = new Float64Array(2 * L);
    const v = new Float64Array(2 * L);
    for (let i = 0; i < 2 * L; i++) {
      const d = ((i < L ? 180 : 270) * Math.PI) / 180;
      u[i] = -s * Math.sin(d) + gaussian(r);
      v[i] = -s * Math.cos(d) + gaussian(r);
    }
    if (hit(peltMulti([u, v]).changePoints)) multi++;
    if (hit(pelt(u).changePoints)) uOnly++;
    if (hit(pelt(v).changePoints)) vOnly++;
  }
  assert.ok(multi >= 60, `pair found ${multi}/100`);
  assert.ok(multi - Math.max(uOnly, vOnly) >= 15, `pair ${multi}, u ${uOnly}, v ${vOnly}`);
});

test('pelt() skips NaN: a change inside a gap is reported at the first valid sample after it', () => {
  const y = new Float64Array(60);
  for (let i = 0; i < 60; i++) y[i] = i < 30 ? 0 : 10;
  for (let i = 25; i < 35; i++) y[i] = NaN;
  const r = pelt(y, { sigma: 1 });
  assert.equal(Array.from(r.changePoints), [35]);
  assert.is(r.segments[0]!.end, 25);
  assert.is(r.segments[1]!.start, 35);
  assert.is(r.n, 50);
});

test('pelt() rejects bad parameters with RangeError', () => {
  assert.throws(() => pelt([1, 2, 3], { minSegment: 0 }), RangeError);
  assert.throws(() => pelt([1, 2, 3], { penalty: -1 }), RangeError);
  assert.throws(() => peltMulti([[1, 2], [1]]), RangeError);
  assert.throws(() => pelt([1, 2, 3], { minSegment: 3, maxSegment: 4 }), RangeError);
});

test('pelt() maxSegment bounds segment length (approximation for long quiet records)', () => {
  const r = mulberry32(9);
  const y = Float64Array.from({ length: 400 }, () => gaussian(r));
  const res = pelt(y, { maxSegment: 100 });
  for (const s of res.segments) assert.ok(s.count <= 100);
});

test.run();
