/**
 * Scores of detections against the labelled real set (the project's own judgement, by eye).
 * Pure: labels, coverage and detections in, figures out.
 */
import { coveredBy, KINDS_FRONT, partOfStationYear, type Coverage, type Label } from './data.js';

const HOUR = 3_600_000;
/** A labelled passage and a detection match within this (hourly data, labels timed to the report). */
export const MATCH_MS = 3 * HOUR;
/** A decoy is "called a front" when a front is detected this close to it. */
export const DECOY_MS = 2 * HOUR;

export interface Detection {
  station: string;
  kind: string;
  timeMs: number;
  timeEarliestMs?: number;
  timeLatestMs?: number;
  confidence?: number;
}

export interface KindScore {
  kind: string;
  labels: number;
  found: number;
  recall: number;
  detections: number;
  correct: number;
  precision: number;
  timingMedianMin: number;
  timingP90Min: number;
}

export interface RealScores {
  kinds: KindScore[];
  /** Cold-front recall over the labels marked `sure` only. */
  coldSure: { labels: number; found: number; recall: number };
  coldBySeason: { season: string; detections: number; correct: number; precision: number; labels: number; found: number; recall: number }[];
  decoys: { kind: string; n: number; calledFront: number; pct: number }[];
  drylineDetections: number;
  reliability: { lo: number; hi: number; n: number; correct: number; freq: number }[];
  unmatchedColdInCoverage: Detection[];
  missedCold: Label[];
}

const quant = (xs: number[], q: number) => {
  if (!xs.length) return NaN;
  const s = xs.slice().sort((a, b) => a - b);
  const p = (s.length - 1) * q;
  const lo = Math.floor(p);
  return s[lo]! + (s[Math.min(s.length - 1, lo + 1)]! - s[lo]!) * (p - lo);
};

/** Nearest-first one-to-one matching of labels and detections of the same station within `windowMs`. */
export function matchNearest<L extends { station: string; timeMs: number }, D extends { station: string; timeMs: number }>(
  labels: readonly L[],
  dets: readonly D[],
  windowMs: number,
  compatible: (l: L, d: D) => boolean,
): Map<L, D> {
  const pairs: [number, L, D][] = [];
  for (const l of labels) for (const d of dets) if (d.station === l.station && Math.abs(d.timeMs - l.timeMs) <= windowMs && compatible(l, d)) pairs.push([Math.abs(d.timeMs - l.timeMs), l, d]);
  pairs.sort((a, b) => a[0] - b[0]);
  const usedL = new Set<L>();
  const usedD = new Set<D>();
  const out = new Map<L, D>();
  for (const [, l, d] of pairs) {
    if (usedL.has(l) || usedD.has(d)) continue;
    usedL.add(l);
    usedD.add(d);
    out.set(l, d);
  }
  return out;
}

const isWarmSeason = (t: number) => {
  const m = new Date(t).getUTCMonth() + 1;
  return m >= 5 && m <= 9;
};

/** Score detections against labels of one part. `dets` may include detections outside the labelled files. */
export function scoreReal(labels: readonly Label[], coverage: readonly Coverage[], dets: readonly Detection[], part: 'tune' | 'report'): RealScores {
  const L = labels.filter((l) => l.part === part);
  const C = coverage.filter((c) => c.part === part);
  const covered = coveredBy(C);
  const D = dets.filter((d) => partOfStationYear(d.station, new Date(d.timeMs).toISOString().slice(0, 4)) === part);
  const inCov = D.filter((d) => covered(d.station, d.timeMs));
  // Synoptic front labels against detections of the same kind.
  const kinds: KindScore[] = [];
  const frontLabels = L.filter((l) => KINDS_FRONT.has(l.kind));
  const sameKind = matchNearest(frontLabels, D, MATCH_MS, (l, d) => l.kind === d.kind);
  // For precision: a detection in a covered month is correct when it matches a label of its kind.
  const anyLabels = L.filter((l) => covered(l.station, l.timeMs));
  const detMatch = matchNearest(anyLabels, inCov, MATCH_MS, (l, d) => l.kind === d.kind);
  const correctDets = new Set(detMatch.values());
  for (const kind of ['cold-front', 'warm-front', 'occluded-front', 'outflow-boundary', 'sea-breeze-front']) {
    const lk = L.filter((l) => l.kind === kind);
    const m = KINDS_FRONT.has(kind) ? sameKind : matchNearest(lk, D, MATCH_MS, (l, d) => l.kind === d.kind);
    const found = lk.filter((l) => m.has(l));
    const errs = found.map((l) => Math.abs(m.get(l)!.timeMs - l.timeMs) / 60_000);
    const dk = inCov.filter((d) => d.kind === kind);
    const correct = dk.filter((d) => correctDets.has(d)).length;
    kinds.push({
      kind,
      labels: lk.length,
      found: found.length,
      recall: lk.length ? found.length / lk.length : NaN,
      detections: dk.length,
      correct,
      precision: dk.length ? correct / dk.length : NaN,
      timingMedianMin: quant(errs, 0.5),
      timingP90Min: quant(errs, 0.9),
    });
  }
  const coldBySeason = [
    { season: 'Oct-Apr', f: (t: number) => !isWarmSeason(t) },
    { season: 'May-Sep', f: isWarmSeason },
  ].map(({ season, f }) => {
    const dk = inCov.filter((d) => d.kind === 'cold-front' && f(d.timeMs));
    const correct = dk.filter((d) => correctDets.has(d)).length;
    const lk = L.filter((l) => l.kind === 'cold-front' && f(l.timeMs));
    const found = lk.filter((l) => sameKind.has(l)).length;
    return { season, detections: dk.length, correct, precision: dk.length ? correct / dk.length : NaN, labels: lk.length, found, recall: lk.length ? found / lk.length : NaN };
  });
  const sure = L.filter((l) => l.kind === 'cold-front' && l.certainty === 'sure');
  const sureFound = sure.filter((l) => sameKind.has(l)).length;
  const coldSure = { labels: sure.length, found: sureFound, recall: sure.length ? sureFound / sure.length : NaN };
  const decoys = ['outflow-boundary', 'sea-breeze-front', 'evening-cooling', 'shower', 'other'].map((kind) => {
    const lk = L.filter((l) => l.kind === kind);
    const called = lk.filter((l) => D.some((d) => d.station === l.station && KINDS_FRONT.has(d.kind) && Math.abs(d.timeMs - l.timeMs) <= DECOY_MS)).length;
    return { kind, n: lk.length, calledFront: called, pct: lk.length ? (100 * called) / lk.length : NaN };
  });
  const drylineDetections = D.filter((d) => d.kind === 'dryline').length;
  // Reliability: detections of front kinds in covered months, by confidence.
  const bins = [0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1.0001];
  const reliability = bins.slice(0, -1).map((lo, i) => {
    const hi = bins[i + 1]!;
    const ds = inCov.filter((d) => KINDS_FRONT.has(d.kind) && (d.confidence ?? 0) >= lo && (d.confidence ?? 0) < hi);
    const correct = ds.filter((d) => correctDets.has(d)).length;
    return { lo, hi: Math.min(1, hi), n: ds.length, correct, freq: ds.length ? correct / ds.length : NaN };
  });
  return {
    kinds,
    coldSure,
    coldBySeason,
    decoys,
    drylineDetections,
    reliability,
    unmatchedColdInCoverage: inCov.filter((d) => d.kind === 'cold-front' && !correctDets.has(d)),
    missedCold: L.filter((l) => l.kind === 'cold-front' && !sameKind.has(l)),
  };
}
