import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { MAD_TO_SIGMA, robustNoiseSigma } from '../../src/signal/noise.js';
import { medianInPlace } from '../../src/signal/median.js';
import { assertClose } from '../helpers/assert.js';
import { gaussian, mulberry32 } from '../helpers/random.js';
import { NILE } from '../fixtures/changepoint-data.js';

test('MAD_TO_SIGMA = 1/Φ⁻¹(0.75) ≈ 1.4826 (Hampel1974)', () => {
  assertClose(MAD_TO_SIGMA, 1.4826, 1e-4);
});

test('robustNoiseSigma(Nile) = 1.4826·MAD(diff)/√2 ≈ 115.319 (formula above; value from an independent script)', () => {
  // 115.3192 with the factor rounded to 1.4826; 115.3194 with 1/Φ⁻¹(0.75).
  assertClose(robustNoiseSigma(NILE), 115.3192, 5e-4);
});

test('robustNoiseSigma() recovers σ of Gaussian noise under steps and a trend (synthetic, seeded)', () => {
  const r = mulberry32(4);
  const y = Float64Array.from({ length: 5000 }, (_, i) => 0.001 * i + (i % 1000 < 500 ? 0 : 8) + 0.7 * gaussian(r));
  // Standard error of the MAD-based σ from 5000 differences ≈ 0.7·1.17/√5000 ≈ 0.012 (efficiency 37 %, textbook).
  assertClose(robustNoiseSigma(y), 0.7, 0.05);
});

test('robustNoiseSigma() NaN rule and the whole-degree fallback', () => {
  assert.ok(Number.isNaN(robustNoiseSigma([1])));
  assert.is(robustNoiseSigma([3, 3, 3, 3]), 0);
  assertClose(robustNoiseSigma([1, NaN, 2, NaN, 1, 2]), robustNoiseSigma([1, 2, 1, 2]), 1e-12);
  // Whole-degree METAR-like values: most differences 0 → MAD 0 → mean absolute deviation × √(π/2).
  const y = [10, 10, 10, 11, 11, 11, 10, 10, 10, 11];
  assert.ok(robustNoiseSigma(y) > 0);
  assert.is(medianInPlace(new Float64Array([3, 1, 2, 10])), 2.5);
});

test.run();
