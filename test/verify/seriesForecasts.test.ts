/** seriesForecasts(): detected passages of forecast series → forecasts and coverage. Constructed example (invented times); rules are fropa's (common practice, no source). */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import type { PassageEvent } from '../../src/model/index.js';
import { seriesForecasts } from '../../src/verify/seriesForecasts.js';
import { verifyForecasts } from '../../src/verify/verify.js';

const H = 3_600_000;
const T0 = Date.UTC(2026, 2, 2, 12);
const ev = (station: string, kind: PassageEvent['kind'], timeMs: number) => ({ station, kind, timeMs }) as PassageEvent;

test('seriesForecasts: coverage clipped to the observations; unknown stations and passages outside the observations reported with file and line', () => {
  const spans = [
    { station: 'A', firstMs: T0 - 48 * H, lastMs: T0 + 48 * H, file: 'model/A.csv', sourceAt: (t: number) => ({ file: 'model/A.csv', line: 2 + Math.round((t - (T0 - 48 * H)) / H) }) },
    { station: 'Z', firstMs: T0, lastMs: T0 + H, file: 'model/Z.csv' },
  ];
  const observed = new Map<string, [number, number]>([['A', [T0 - 24 * H, T0 + 24 * H]]]);
  const { forecasts, coverage, report } = seriesForecasts([ev('A', 'cold-front', T0 + 2 * H), ev('A', 'warm-front', T0 - 30 * H), ev('Z', 'cold-front', T0)], spans, observed, 'model');
  assert.equal(coverage, [{ source: 'model', station: 'A', fromMs: T0 - 24 * H, toMs: T0 + 24 * H }]);
  assert.equal(forecasts.map((f) => [f.station, f.kind, f.forecastMs, f.source, f.file, f.line]), [['A', 'cold-front', T0 + 2 * H, 'model', 'model/A.csv', 52]]);
  assert.equal(report.issues.map((i) => [i.file, i.line, i.reason]), [
    ['model/Z.csv', 1, 'unknown-station'],
    ['model/A.csv', 20, 'outside-observations'],
  ]);
});

test('seriesForecasts + verifyForecasts: a forecast series without a passage where one was observed gives a miss (its span is its valid window)', () => {
  const observed = new Map<string, [number, number]>([['A', [T0 - 24 * H, T0 + 24 * H]]]);
  const sf = seriesForecasts([], [{ station: 'A', firstMs: T0 - 24 * H, lastMs: T0 + 24 * H, file: 'm.csv' }], observed, 'model');
  const r = verifyForecasts(sf.forecasts, [ev('A', 'cold-front', T0)], { coverage: sf.coverage, kinds: ['cold-front'] });
  assert.equal([r.scores.hits, r.scores.misses, r.scores.falseAlarms], [0, 1, 0]);
  assert.is(r.outcomes[0]!.source, 'model');
});

test.run();
