/**
 * Scores of a synthetic skill benchmark (Wilks 2011 ch. 8): one-to-one matching of planted and detected passages
 * at the same station within ±3 h, POD, FAR, CSI per kind, kind accuracy, timing and zone errors, and how often
 * decoys are called fronts. Shared by bench/skill.ts and bench/broad.ts.
 */
import type { TruthEvent } from '../tools/synth/types.js';
import { contingencyForKind, csi, far, matchOneToOne, pod, type Contingency } from '../src/verify/contingency.js';
import { quantile } from '../src/verify/quantile.js';

const HOUR = 3_600_000;
/** Matching window, planted vs detected time (common practice, no source). */
export const MATCH_WINDOW_MS = 3 * HOUR;

/** What a detector reports, as far as scoring needs. */
export interface Detected {
  station: string;
  kind: string;
  timeMs: number;
  zoneHours: number;
}

/** Detected kinds that count as a front when no planted event matches them. */
export const FRONT_KINDS = new Set(['cold-front', 'warm-front', 'occluded-front']);
/** Planted kinds a detector should report. */
export const REAL_KINDS = new Set(['cold-front', 'warm-front', 'occluded-front', 'dryline']);

export interface Scores {
  detections: number;
  cold: Contingency & { pod: number; far: number; csi: number };
  warm: Contingency & { pod: number; far: number; csi: number };
  matched: number;
  kindAccuracy: number;
  timingMedianMin: number;
  timingP90Min: number;
  zoneHoursMedianAbsErr: number;
  decoysCalledFront: Record<string, { n: number; called: number; pct: number }>;
}

/** Score detections against the planted truth (matching within ±MATCH_WINDOW_MS at the same station). */
export function score(truth: readonly TruthEvent[], det: readonly Detected[]): Scores {
  const real = truth.filter((e) => !e.isDecoy && REAL_KINDS.has(e.kind));
  const decoys = truth.filter((e) => e.isDecoy);
  const m = matchOneToOne(real, det, MATCH_WINDOW_MS);
  const tk = real.map((e) => e.kind as string);
  const dk = det.map((d) => d.kind);
  const withScores = (c: Contingency) => ({ ...c, pod: pod(c), far: far(c), csi: csi(c) });
  const cold = withScores(contingencyForKind(tk, dk, m, 'cold-front'));
  const warm = withScores(contingencyForKind(tk, dk, m, 'warm-front'));
  let right = 0;
  const timing: number[] = [];
  const zoneErr: number[] = [];
  for (const [i, j] of m.pairs) {
    const t = real[i]!;
    const d = det[j]!;
    if (t.kind === d.kind) right++;
    if (t.kind === 'cold-front' || t.kind === 'warm-front') {
      timing.push(Math.abs(d.timeMs - t.timeMs) / 60000);
      if (t.zoneEndMs !== undefined && Number.isFinite(d.zoneHours)) zoneErr.push(Math.abs(d.zoneHours - (t.zoneEndMs - t.timeMs) / HOUR));
    }
  }
  const free = m.unmatchedDetections.map((j) => det[j]!).filter((d) => FRONT_KINDS.has(d.kind));
  const decoysCalledFront: Scores['decoysCalledFront'] = {};
  for (const e of decoys) {
    const r = (decoysCalledFront[e.kind] ??= { n: 0, called: 0, pct: NaN });
    r.n++;
    const a = e.zoneEndMs !== undefined ? e.timeMs - HOUR : e.timeMs - 3 * HOUR;
    const b = e.zoneEndMs !== undefined ? e.zoneEndMs + HOUR : e.timeMs + 3 * HOUR;
    if (free.some((d) => d.station === e.station && d.timeMs >= a && d.timeMs <= b)) r.called++;
  }
  for (const r of Object.values(decoysCalledFront)) r.pct = (100 * r.called) / r.n;
  return {
    detections: det.length,
    cold,
    warm,
    matched: m.pairs.length,
    kindAccuracy: m.pairs.length ? right / m.pairs.length : NaN,
    timingMedianMin: quantile(timing, 0.5),
    timingP90Min: quantile(timing, 0.9),
    zoneHoursMedianAbsErr: quantile(zoneErr, 0.5),
    decoysCalledFront,
  };
}
