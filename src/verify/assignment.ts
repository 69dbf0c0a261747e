/**
 * Optimal one-to-one matching of forecast and observed passages (pure functions).
 *
 * minCostAssignment solves the rectangular assignment problem with the Hungarian method of Kuhn (1955),
 * "The Hungarian method for the assignment problem", Naval Research Logistics Quarterly 2, 83–97, in the
 * form of Munkres (1957), "Algorithms for the assignment and transportation problems", J. SIAM 5, 32–38,
 * implemented with row and column potentials and shortest augmenting paths (O(n²·m) for n rows ≤ m
 * columns; the potential formulation is textbook, from memory).
 */

/**
 * Minimum-cost assignment of every row to a distinct column of a rows × cols cost matrix with
 * rows ≤ cols (Kuhn 1955; Munkres 1957). Costs must be finite. Returns the column of each row.
 * Deterministic for a given matrix (ties resolved by index order).
 * @example minCostAssignment([[4, 1], [2, 3]]) // [1, 0] (total 3)
 */
export function minCostAssignment(cost: readonly (readonly number[])[]): number[] {
  const n = cost.length;
  if (n === 0) return [];
  const m = cost[0]!.length;
  if (m < n) throw new RangeError('minCostAssignment needs rows <= columns');
  for (const row of cost) {
    if (row.length !== m) throw new RangeError('minCostAssignment needs a rectangular matrix');
    for (const c of row) if (!Number.isFinite(c)) throw new RangeError('minCostAssignment needs finite costs');
  }
  // 1-based arrays: u row potentials, v column potentials, p[j] = row assigned to column j (0 = none).
  const u = new Float64Array(n + 1);
  const v = new Float64Array(m + 1);
  const p = new Int32Array(m + 1);
  const way = new Int32Array(m + 1);
  for (let i = 1; i <= n; i++) {
    p[0] = i;
    let j0 = 0;
    const minv = new Float64Array(m + 1).fill(Infinity);
    const used = new Uint8Array(m + 1);
    do {
      used[j0] = 1;
      const i0 = p[j0]!;
      let delta = Infinity;
      let j1 = 0;
      for (let j = 1; j <= m; j++) {
        if (used[j]) continue;
        const cur = cost[i0 - 1]![j - 1]! - u[i0]! - v[j]!;
        if (cur < minv[j]!) {
          minv[j] = cur;
          way[j] = j0;
        }
        if (minv[j]! < delta) {
          delta = minv[j]!;
          j1 = j;
        }
      }
      for (let j = 0; j <= m; j++) {
        if (used[j]) {
          u[p[j]!] += delta;
          v[j] -= delta;
        } else minv[j] -= delta;
      }
      j0 = j1;
    } while (p[j0] !== 0);
    do {
      const j1 = way[j0]!;
      p[j0] = p[j1]!;
      j0 = j1;
    } while (j0 !== 0);
  }
  const colOf = new Array<number>(n).fill(-1);
  for (let j = 1; j <= m; j++) if (p[j]! > 0) colOf[p[j]! - 1] = j - 1;
  return colOf;
}

/**
 * Optimal one-to-one matching of observed times (rows) and forecast times (columns): among the
 * matchings whose pairs are compatible and within ±windowMs (inclusive), the one with the most pairs,
 * and among those the least total |forecast − observed|. Nearest-first (greedy) matching can pair
 * fewer or worse (see test/verify/assignment.test.ts). Solved as one assignment problem
 * (minCostAssignment, Kuhn 1955 / Munkres 1957): a pair costs |Δt| − B with B larger than any sum of
 * errors, so one more pair always beats a smaller total error; each observed time also has its own
 * "unmatched" column of cost 0; an incompatible or out-of-window pair costs more than leaving both
 * unmatched. Ranking pairs count first is fropa's rule (common practice, no source).
 * @returns pairs [observed index, forecast index] in observed order, and the unmatched indices.
 * @example matchOptimal([0, 60], [50, 110], 60).pairs // [[0, 0], [1, 1]] (greedy would pair 60–50 and leave two unmatched)
 */
export function matchOptimal(
  observedMs: readonly number[],
  forecastMs: readonly number[],
  windowMs: number,
  compatible: (observed: number, forecast: number) => boolean = () => true,
): { pairs: [number, number][]; unmatchedObserved: number[]; unmatchedForecasts: number[] } {
  if (!(windowMs >= 0)) throw new RangeError('matchOptimal requires windowMs >= 0');
  const nO = observedMs.length;
  const nF = forecastMs.length;
  const ok = (i: number, j: number) => Math.abs(forecastMs[j]! - observedMs[i]!) <= windowMs && compatible(i, j);
  // Admissible pairs split the items into independent groups (connected components, union–find);
  // each group is one small assignment problem. Items without an admissible partner stay unmatched.
  const parent = Array.from({ length: nO + nF }, (_, k) => k);
  const find = (k: number): number => {
    while (parent[k] !== k) k = parent[k] = parent[parent[k]!]!;
    return k;
  };
  const edges: [number, number][] = [];
  for (let i = 0; i < nO; i++) {
    for (let j = 0; j < nF; j++) {
      if (!ok(i, j)) continue;
      edges.push([i, j]);
      const a = find(i);
      const b = find(nO + j);
      if (a !== b) parent[Math.max(a, b)] = Math.min(a, b);
    }
  }
  const comps = new Map<number, { rows: number[]; cols: number[] }>();
  const seenCol = new Uint8Array(nF);
  const seenRow = new Uint8Array(nO);
  for (const [i, j] of edges) {
    const r = find(i);
    let c = comps.get(r);
    if (!c) comps.set(r, (c = { rows: [], cols: [] }));
    if (!seenRow[i]) (seenRow[i] = 1), c.rows.push(i);
    if (!seenCol[j]) (seenCol[j] = 1), c.cols.push(j);
  }
  const pairs: [number, number][] = [];
  for (const { rows, cols } of comps.values()) {
    rows.sort((x, y) => x - y);
    cols.sort((x, y) => x - y);
    const maxErr = Math.max(windowMs, 1);
    const B = maxErr * (Math.min(rows.length, cols.length) + 1);
    const forbidden = B * (rows.length + cols.length + 2);
    const matrix = rows.map((i, r) => {
      const row = cols.map((j) => (ok(i, j) ? Math.abs(forecastMs[j]! - observedMs[i]!) - B : forbidden));
      for (let k = 0; k < rows.length; k++) row.push(k === r ? 0 : forbidden);
      return row;
    });
    const colOf = minCostAssignment(matrix);
    rows.forEach((i, r) => {
      const c = colOf[r]!;
      if (c < cols.length && ok(i, cols[c]!)) pairs.push([i, cols[c]!]);
    });
  }
  pairs.sort((x, y) => x[0] - y[0]);
  const mo = new Uint8Array(nO);
  const mf = new Uint8Array(nF);
  for (const [i, j] of pairs) (mo[i] = 1), (mf[j] = 1);
  const unmatchedObserved: number[] = [];
  const unmatchedForecasts: number[] = [];
  mo.forEach((x, i) => x || unmatchedObserved.push(i));
  mf.forEach((x, j) => x || unmatchedForecasts.push(j));
  return { pairs, unmatchedObserved, unmatchedForecasts };
}
