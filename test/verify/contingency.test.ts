import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { assertClose } from '../helpers/assert.js';
import { contingencyForKind, csi, far, frequencyBias, matchOneToOne, pod, proportionCorrect } from '../../src/verify/contingency.js';

// Finley (1884) tornado forecasts as tabulated in Wilks (2011), Statistical Methods in the Atmospheric
// Sciences, 3rd ed., ch. 8 (table 8.1): a = 28 hits, b = 72 false alarms, c = 23 misses, d = 2680.
// Counts and the derived scores are from memory (not re-checked against the printed page); the scores
// follow from the counts by the ch. 8 definitions.
const finley = { hits: 28, falseAlarms: 72, misses: 23, correctNegatives: 2680 };

test('pod(Finley) = 28/51 ≈ 0.549 (Wilks 2011 ch. 8, from memory)', () => {
  assertClose(pod(finley), 28 / 51, 1e-12);
  assertClose(pod(finley), 0.549, 5e-4);
});

test('far(Finley) = 72/100 = 0.72 (Wilks 2011 ch. 8, from memory)', () => {
  assertClose(far(finley), 0.72, 1e-12);
});

test('csi(Finley) = 28/123 ≈ 0.228 (Wilks 2011 ch. 8, from memory)', () => {
  assertClose(csi(finley), 28 / 123, 1e-12);
  assertClose(csi(finley), 0.228, 5e-4);
});

test('frequencyBias(Finley) = 100/51 ≈ 1.96 and proportionCorrect = 2708/2803 ≈ 0.966 (Wilks 2011 ch. 8, from memory)', () => {
  assertClose(frequencyBias(finley), 100 / 51, 1e-12);
  assertClose(proportionCorrect(finley), 2708 / 2803, 1e-12);
  assertClose(proportionCorrect(finley), 0.966, 5e-4);
});

test('scores of an empty table are NaN', () => {
  assert.ok(Number.isNaN(pod({ hits: 0, falseAlarms: 0, misses: 0 })));
  assert.ok(Number.isNaN(far({ hits: 0, falseAlarms: 0, misses: 0 })));
});

// Matching rules below are fropa's (common practice, no source): nearest pairs first, one-to-one, inclusive window.
test('matchOneToOne pairs nearest first, one-to-one, same station only', () => {
  const H = 3_600_000;
  const truth = [
    { station: 'A', timeMs: 0 },
    { station: 'A', timeMs: 2 * H },
    { station: 'B', timeMs: 0 },
  ];
  const det = [
    { station: 'A', timeMs: 1.5 * H }, // nearest to truth 1 (0.5 h) although truth 0 is within 3 h too
    { station: 'A', timeMs: 0.25 * H },
    { station: 'B', timeMs: 4 * H }, // outside ±3 h
  ];
  const m = matchOneToOne(truth, det, 3 * H);
  assert.equal(m.pairs, [
    [0, 1],
    [1, 0],
  ]);
  assert.equal(m.unmatchedTruth, [2]);
  assert.equal(m.unmatchedDetections, [2]);
});

test('contingencyForKind counts a wrong-kind match as a miss and a false alarm', () => {
  const m = { pairs: [[0, 0], [1, 1]] as [number, number][], unmatchedTruth: [2], unmatchedDetections: [2] };
  const c = contingencyForKind(['cold-front', 'cold-front', 'cold-front'], ['cold-front', 'warm-front', 'cold-front'], m, 'cold-front');
  assert.equal(c, { hits: 1, misses: 2, falseAlarms: 1 });
});

test.run();
