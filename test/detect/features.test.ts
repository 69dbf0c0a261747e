/** Measurements around a candidate (src/detect/features.ts) on hand-made 5-minute series with known answers. */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { assertClose } from '../helpers/assert.js';
import { endOfSteepChange, lowerBound, measure, rawColumns } from '../../src/detect/features.js';
import { buildGrid } from '../../src/detect/grid.js';
import { runningMean } from '../../src/detect/window.js';
import { allocSeries, QC, type StationSeries } from '../../src/series/series.js';
import { WX } from '../../src/ingest/types.js';

const MIN = 60_000;
const HOUR = 60 * MIN;
const T0 = Date.UTC(2026, 2, 10, 0, 0);
const FRONT = T0 + 12 * HOUR;

interface Spec {
  lonDeg?: number;
  /** Wind direction after the shift at FRONT (before: 200°). */
  dirAfter?: number;
  /** Per-report extras. */
  fill?: (s: StationSeries, i: number, xH: number) => void;
}

/**
 * 24 h of 5-min reports with a step change at 12:00: T 20 → 12 °C falling linearly over 12:00–13:00,
 * Td 15 → 5 °C over the same hour, wind 200° 8 m/s → `dirAfter` 8 m/s at 12:00, station pressure a V
 * 1008.5 + 0.5 |x| hPa (x hours from 12:00): a trough at the shift.
 */
function front(spec: Spec = {}): StationSeries {
  const n = 24 * 12;
  const meta = { id: 'QFNT', aliases: [], latDeg: 40, lonDeg: spec.lonDeg ?? NaN, elevationM: 100 };
  const s = allocSeries('QFNT', n, meta);
  for (let i = 0; i < n; i++) {
    const t = T0 + i * 5 * MIN;
    const x = (t - FRONT) / HOUR;
    const f = Math.min(1, Math.max(0, x));
    s.timeMs[i] = t;
    s.temperatureC[i] = 20 - 8 * f;
    s.dewpointC[i] = 15 - 10 * f;
    s.windDirDeg[i] = x < 0 ? 200 : spec.dirAfter ?? 290;
    s.windSpeedMs[i] = 8;
    s.stationPressureHpa[i] = 1008.5 + 0.5 * Math.abs(x);
    spec.fill?.(s, i, x);
  }
  return s;
}

/** Measure the series at FRONT as the detector does (30-min running means of adjusted and raw temperature). */
function measureAtFront(s: StationSeries) {
  const g = buildGrid(s, 5)!;
  const half = Math.max(1, Math.round(HOUR / g.stepMs / 4));
  const i = g.timeMs.indexOf(FRONT);
  return measure(g, s, rawColumns(s), i, runningMean(g.tAdjC, half), runningMean(g.tC, half));
}

test('lowerBound(t, x) is the first index with t[k] ≥ x', () => {
  const t = [10, 20, 20, 30];
  // constructed: expected by construction (binary search on a sorted array)
  assert.is(lowerBound(t, 20), 1);
  assert.is(lowerBound(t, 25), 3);
  assert.is(lowerBound(t, 5), 0);
  assert.is(lowerBound(t, 40), 4);
  assert.is(lowerBound([], 1), 0);
});

test('endOfSteepChange() ends a ramp where its rate drops below a fraction of the peak', () => {
  const ramp = [0, 0, 0, 0, 1, 2, 3, 4, 4, 4, 4];
  // constructed: centred rates (half 1) are 0.5, 1, 1, 1, 0.5, 0 at k = 3…8: the first below 7 % of 1 is k = 8
  assert.is(endOfSteepChange(ramp, 0, 10, 1, 1, 0.07), 8);
  // constructed: the same ramp falling, read with dir −1
  assert.is(endOfSteepChange(ramp.map((x) => -x), 0, 10, 1, -1, 0.07), 8);
  // constructed: a rising ramp has no falling rate: returns `to`
  assert.is(endOfSteepChange(ramp, 0, 10, 1, -1, 0.07), 10);
  // constructed: a rate that never drops within [from, to] returns `to`
  assert.is(endOfSteepChange([0, 1, 2, 3, 4, 5, 6], 0, 5, 1, 1, 0.07), 5);
});

test('rawColumns(s) blanks flagged values and finds the direction resolution', () => {
  const s = front();
  // constructed: every direction is a multiple of 10° (METAR style)
  assert.is(rawColumns(s).dirResolutionDeg, 10);
  s.windDirDeg[3] = 203;
  // constructed: one direction to the degree → 1° resolution
  assert.is(rawColumns(s).dirResolutionDeg, 1);
  s.qc.temperatureC[5] = QC.SPIKE;
  const raw = rawColumns(s);
  // constructed: a QC-flagged value is missing (NaN) in the clean column
  assert.ok(Number.isNaN(raw.tC[5]!));
  assert.is(raw.tC[6], 20);
});

test('measure() at a veering step change: wind before/after and a +90° turn', () => {
  const f = measureAtFront(front());
  // constructed: expected by construction, 200° before and 290° after, steady speed 8 m/s
  assertClose(f.windBeforeDeg, 200, 1e-6);
  assertClose(f.windAfterDeg, 290, 1e-6);
  assertClose(f.speedBeforeMs, 8, 1e-9);
  assertClose(f.speedAfterMs, 8, 1e-9);
  // FMH-1 §5.4.6: a turn of 45° or more (here 90°, clockwise = veering, positive) with 10 kt or more (8 m/s ≈ 15.6 kt)
  assertClose(f.turnDeg, 90, 1e-6);
  // constructed: the anchor is the grid point at 12:00
  assert.is(f.timeMs, FRONT);
});

test('measure() at a backing shift gives a negative turn', () => {
  const f = measureAtFront(front({ dirAfter: 110 }));
  // constructed: 200° → 110° is a 90° anticlockwise turn (backing, negative)
  assertClose(f.turnDeg, -90, 1e-6);
});

test('measure() turn across north takes the short way (340° → 30° is +50°)', () => {
  const s = front({ fill: (q, _i, x) => (q.windDirDeg[_i] = x < 0 ? 340 : 30) });
  // FMH-1 §5.4.6 via check-values 7 (angular difference min(|d2 − d1|, 360 − |d2 − d1|)): 50°, veering
  assertClose(measureAtFront(s).turnDeg, 50, 1e-6);
});

test('measure() at a step change: temperature, dew point and zone', () => {
  const f = measureAtFront(front());
  // constructed: 20 → 12 °C (no longitude, so no diurnal adjustment: adjusted = observed)
  assertClose(f.tempAdjChangeC, -8, 1e-9);
  assertClose(f.tempChangeC, -8, 0.3);
  assertClose(f.frontalChangeAdjC, -8, 0.3);
  // constructed: mean Td 1–3 h after (5 °C) minus the hour before (15 °C)
  assertClose(f.dewpointChangeC, -10, 1e-9);
  assertClose(f.dewpointDropMaxC, -10, 1e-9);
  assertClose(f.dewpointBeforeC, 15, 1e-9);
  assertClose(f.depressionBeforeC, 5, 1e-9);
  // constructed: the largest 30-min fall of a linear 8 °C/h fall is 4 °C
  assertClose(f.abruptChangeC, -4, 1e-9);
  // constructed: 90 % of a linear 1-h change is done after 0.9 h (30-min smoothing moves it by a few minutes)
  assertClose(f.zoneHours, 0.9, 0.15);
  // constructed: the fall starts at the anchor (12.5 % of it is done after about 8 min)
  assert.ok(f.onsetDelayH >= 0 && f.onsetDelayH < 0.3, `onset ${f.onsetDelayH}`);
  // constructed: the temperature does not come back
  assert.is(f.recoveryFraction, 0);
  // constructed: θe falls with the cooler, drier air (sign only)
  assert.ok(f.thetaEChangeK < -10, `θe ${f.thetaEChangeK}`);
});

test('measure() at a trough: pressure minimum, fall before, rise after', () => {
  const f = measureAtFront(front());
  // constructed: the V's minimum 1008.5 hPa at 12:00
  assertClose(f.pressureMinHpa, 1008.5, 1e-9);
  assert.is(f.pressureMinTimeMs, FRONT);
  // constructed: 0.5 hPa/h over 3 h = 1.5 hPa (the half-open ±15-min averaging windows shift it by ≤ 0.03)
  assertClose(f.pressureFallBeforeHpa, -1.5, 0.03);
  assertClose(f.pressureRiseAfterHpa, 1.5, 0.03);
  assertClose(f.pressureRise3hHpa, 1.5, 0.1);
  assertClose(f.pressureChangeBefore3hHpa, -1.5, 0.1);
  // constructed: a steady 0.5 hPa/h rise gives at most 0.25 hPa in 30 min
  assertClose(f.pressureJumpHpa, 0.25, 1e-6);
});

test('measure() reads gusts, precipitation and convection from the raw reports near the anchor', () => {
  const s = front({
    fill: (q, i, x) => {
      if (Math.abs(x - 1 / 6) < 1e-9) q.gustMs[i] = 15; // 12:10
      if (Math.abs(x - 0.5) < 1e-9) q.weather[i] = WX.RAIN | WX.PRECIP; // 12:30
      if (Math.abs(x - 1.5) < 1e-9) q.weather[i] = WX.THUNDER; // 13:30, more than 1 h after
    },
  });
  const f = measureAtFront(s);
  // constructed: the 15 m/s gust is the largest of gust, peak wind and speed within −1 h…+2 h
  assertClose(f.gustMaxMs, 15, 0);
  // constructed: rain reported within ±1 h
  assert.is(f.precipNear, true);
  // constructed: the thunder report lies outside ±1 h
  assert.is(f.convectiveNear, false);
  // constructed: without gust reports the largest speed counts
  assertClose(measureAtFront(front()).gustMaxMs, 8, 0);
  assert.is(measureAtFront(front()).precipNear, false);
});

test('measure() gives the local solar hour from the longitude (NaN without one)', () => {
  // constructed: mean solar time = UTC + lon/15 h, so 12:00 UTC at 90° W is 06:00
  assertClose(measureAtFront(front({ lonDeg: -90 })).solarHour, 6, 1e-9);
  assertClose(measureAtFront(front({ lonDeg: 150 })).solarHour, 22, 1e-9);
  // constructed: expected by construction
  assert.ok(Number.isNaN(measureAtFront(front()).solarHour));
});

test('measure() has no turn when the wind is calm', () => {
  const s = front({ fill: (q, i) => (q.windSpeedMs[i] = 0) });
  const f = measureAtFront(s);
  // WMO-No. 306 FM 15: calm (00000KT) has no direction; constructed: no turn can be measured
  assert.ok(Number.isNaN(f.turnDeg));
});

test.run();
