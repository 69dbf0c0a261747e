/**
 * Inferring a coastal station's onshore sector from its record (seaBreeze.ts) on constructed grids:
 * a daily turn to one sector in the afternoon with moistening, reversing at night, on every day, is
 * found with its bearing; the same wind field with the afternoon direction random day to day is not.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { inferSeaBreezeSector } from '../../src/detect/seaBreeze.js';
import type { DetectGrid } from '../../src/detect/grid.js';
import { windComponents } from '../../src/physics/wind.js';
import { mulberry32 } from '../helpers/random.js';

const HOUR = 3_600_000;
const STEP = 30 * 60_000;

/** 60 days at longitude 0 (solar ≈ UTC): offshore `morningDir` at 4 m/s, afternoon `afternoonDir(day)` at 5 m/s with Td +2 °C, night back to morning. */
function coast(afternoonDir: (day: number) => number, morningDir = 340): DetectGrid {
  const n = (60 * 24 * HOUR) / STEP;
  const timeMs = new Float64Array(n), tC = new Float64Array(n), tdC = new Float64Array(n), uMs = new Float64Array(n), vMs = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const t = Date.UTC(2026, 5, 1) + i * STEP;
    const h = ((t / HOUR) % 24 + 24) % 24;
    const day = Math.floor(t / (24 * HOUR));
    const sea = h >= 11 && h < 19;
    const w = windComponents(sea ? afternoonDir(day) : morningDir, sea ? 5 : 4);
    timeMs[i] = t;
    uMs[i] = w.uMs;
    vMs[i] = w.vMs;
    tC[i] = 20 + 5 * Math.sin((2 * Math.PI * (h - 9)) / 24);
    tdC[i] = sea ? 16 : 14;
  }
  const nan = new Float64Array(n).fill(NaN);
  return { stepMs: STEP, n, timeMs, tC, tAdjC: tC, tdC, thetaEK: tC, pHpa: nan, pressureKind: 'none', uMs, vMs, speedMs: uMs.map((u, i) => Math.hypot(u, vMs[i]!)), diurnalMethod: 'none', cadenceMin: 30 };
}

test('inferSeaBreezeSector finds a daily afternoon turn to the south (constructed)', () => {
  const s = inferSeaBreezeSector(coast(() => 180), 0);
  assert.ok(s, 'sector');
  assert.ok(Math.abs(s!.seaBearingDeg - 180) <= 1, `${s!.seaBearingDeg}`); // constructed: every afternoon from 180°
  assert.ok(s!.days >= 55);
});

test('inferSeaBreezeSector: afternoon turns to random sectors are no sea breeze (constructed)', () => {
  const rng = mulberry32(7);
  const dirs = new Map<number, number>();
  const g = coast((day) => {
    if (!dirs.has(day)) dirs.set(day, Math.floor(rng() * 360));
    return dirs.get(day)!;
  });
  assert.is(inferSeaBreezeSector(g, 0), null);
});

test('inferSeaBreezeSector needs a longitude for solar time', () => {
  assert.is(inferSeaBreezeSector(coast(() => 180), undefined), null);
});

test.run();
