/**
 * The demo network (invented data, stations-demo/generate.ts) through the real readers and detector:
 * the planted passages in stations-demo/truth.json must be found. Thresholds are what we measured when the
 * demo was generated, less a margin; they guard against regressions, not claims of skill (see bench:skill).
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { loadPaths } from '../../src/pipeline.js';
import { detectStation } from '../../src/detect/detect.js';
import type { PassageEvent } from '../../src/model/index.js';
import { matchOneToOne, pod, far, contingencyForKind } from '../../src/verify/contingency.js';

const demo = fileURLToPath(new URL('../../stations-demo/', import.meta.url));
const truth = JSON.parse(readFileSync(demo + 'truth.json', 'utf8')) as { passages: { station: string; kind: string; time: string }[] };
const loaded = loadPaths([demo]);
const events: PassageEvent[] = loaded.series.flatMap((s) => detectStation(s));

function scores(kind: string) {
  const t = truth.passages.filter((p) => p.kind === kind).map((p) => ({ station: p.station, timeMs: Date.parse(p.time) }));
  const d = events.filter((e) => e.kind === kind).map((e) => ({ station: e.station, timeMs: e.timeMs }));
  const m = matchOneToOne(t, d, 3 * 3_600_000);
  const c = contingencyForKind(t.map(() => kind), d.map(() => kind), m, kind);
  return { pod: pod(c), far: far(c), n: t.length, pairs: m.pairs.map(([i, j]) => Math.abs(t[i]!.timeMs - d[j]!.timeMs)) };
}

test('the demo loads every station, with stations files found in the folders', () => {
  assert.is(loaded.series.length, 12);
  assert.ok(loaded.series.every((s) => s.meta), 'every station has coordinates');
  assert.ok(loaded.series.some((s) => (s.meta?.latDeg ?? 0) < 0), 'the southern station');
});

test('detectStation() finds the planted cold fronts of the demo', () => {
  const s = scores('cold-front');
  assert.ok(s.n >= 100);
  assert.ok(s.pod >= 0.9, `POD ${s.pod}`);
  assert.ok(s.far <= 0.1, `FAR ${s.far}`);
});

test('detectStation() finds most planted warm fronts of the demo', () => {
  const s = scores('warm-front');
  assert.ok(s.pod >= 0.8, `POD ${s.pod}`);
});

test('detectStation() finds the planted dryline at each of its stations', () => {
  const s = scores('dryline');
  assert.is(s.n, 3);
  assert.is(s.pod, 1);
});

test.run();
