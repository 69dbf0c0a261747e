/**
 * Optimal assignment (Kuhn 1955; Munkres 1957) and optimal one-to-one matching of passage times.
 * Expected values are computed by hand or by enumerating every assignment (brute force) of small,
 * seeded random instances.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { matchOneToOne } from '../../src/verify/contingency.js';
import { matchOptimal, minCostAssignment } from '../../src/verify/assignment.js';
import { mulberry32 } from '../helpers/random.js';

const MIN = 60_000;

test('minCostAssignment: a 3 × 3 example checked by hand (all 6 permutations enumerated)', () => {
  // Costs: rows workers, columns jobs. Permutation totals, by hand: (0,1,2) 4+5+9 = 18, (0,2,1) 4+8+6 = 18,
  // (1,0,2) 1+2+9 = 12, (1,2,0) 1+8+3 = 12, (2,0,1) 3+2+6 = 11, (2,1,0) 3+5+3 = 11 → minimum 11, twice.
  const cost = [
    [4, 1, 3],
    [2, 5, 8],
    [3, 6, 9],
  ];
  const col = minCostAssignment(cost);
  assert.is(col.reduce((s, j, i) => s + cost[i]![j]!, 0), 11);
  assert.equal([...col].sort(), [0, 1, 2], 'one column per row');
});

test('minCostAssignment: rectangular (2 rows, 3 columns) and bad input', () => {
  // By hand: row 0 → column 2 (1), row 1 → column 0 (2): total 3; every other choice costs more.
  assert.equal(minCostAssignment([[5, 4, 1], [2, 6, 3]]), [2, 0]);
  assert.equal(minCostAssignment([]), []);
  assert.throws(() => minCostAssignment([[1], [2]]), RangeError);
  assert.throws(() => minCostAssignment([[1, NaN]]), RangeError);
});

/** Best (pairs, total |Δt|) over every one-to-one matching, by enumeration. */
function brute(o: number[], f: number[], w: number): [number, number] {
  let best: [number, number] = [0, 0];
  const usedF = new Array<boolean>(f.length).fill(false);
  const rec = (i: number, n: number, tot: number) => {
    if (n > best[0] || (n === best[0] && tot < best[1])) best = [n, tot];
    if (i === o.length) return;
    rec(i + 1, n, tot);
    for (let j = 0; j < f.length; j++) {
      if (usedF[j] || Math.abs(f[j]! - o[i]!) > w) continue;
      usedF[j] = true;
      rec(i + 1, n + 1, tot + Math.abs(f[j]! - o[i]!));
      usedF[j] = false;
    }
  };
  rec(0, 0, 0);
  return best;
}

// Constructed cases where greedy nearest-first matching is not optimal (the rule: most pairs, then least
// total |error|, is fropa's; common practice, no source).
test('matchOptimal: greedy nearest-first pairs fewer; the optimal matching pairs both', () => {
  const obs = [0, 60 * MIN];
  const fc = [50 * MIN, 110 * MIN];
  const greedy = matchOneToOne(obs.map((t) => ({ station: 'A', timeMs: t })), fc.map((t) => ({ station: 'A', timeMs: t })), 60 * MIN);
  assert.equal(greedy.pairs, [[1, 0]], 'greedy takes the 10-min pair first and strands the others (50 and 110 min apart from 0)');
  const opt = matchOptimal(obs, fc, 60 * MIN);
  assert.equal(opt.pairs, [[0, 0], [1, 1]], 'by hand: 0↔50 and 60↔110, both 50 min, within ±60 min');
  assert.equal(opt.unmatchedObserved, []);
});

test('matchOptimal: same number of pairs, less total error than greedy', () => {
  const obs = [0, 10 * MIN];
  const fc = [9 * MIN, 30 * MIN];
  const greedy = matchOneToOne(obs.map((t) => ({ station: 'A', timeMs: t })), fc.map((t) => ({ station: 'A', timeMs: t })), 30 * MIN);
  // By hand: greedy pairs 10↔9 (1 min) then 0↔30 (30 min): total 31 min; optimal 0↔9 (9) + 10↔30 (20) = 29 min.
  assert.equal([...greedy.pairs].sort(), [[0, 1], [1, 0]]);
  const opt = matchOptimal(obs, fc, 30 * MIN);
  assert.equal(opt.pairs, [[0, 0], [1, 1]]);
});

test('matchOptimal: inclusive window, compatibility, and agreement with brute force on 200 seeded random cases', () => {
  assert.equal(matchOptimal([0], [60], 60).pairs, [[0, 0]]);
  assert.equal(matchOptimal([0], [61], 60).pairs, []);
  assert.equal(matchOptimal([0, 5], [1], 60, (i) => i === 1).pairs, [[1, 0]]);
  const r = mulberry32(20260304);
  for (let k = 0; k < 200; k++) {
    const o = Array.from({ length: 1 + Math.floor(r() * 5) }, () => Math.round(r() * 600));
    const f = Array.from({ length: 1 + Math.floor(r() * 5) }, () => Math.round(r() * 600));
    const m = matchOptimal(o, f, 120);
    const tot = m.pairs.reduce((s, [i, j]) => s + Math.abs(f[j]! - o[i]!), 0);
    assert.equal([m.pairs.length, tot], brute(o, f, 120), `case ${k}: o=${o} f=${f}`);
  }
});

test.run();
