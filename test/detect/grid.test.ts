/** The detection grid (src/detect/grid.ts): grid step by cadence, the gap rule, pressure choice, wind as u/v. */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { assertClose } from '../helpers/assert.js';
import { buildGrid, gridMaxGapMs, gridStepMs } from '../../src/detect/grid.js';
import { allocSeries, QC, type StationSeries } from '../../src/series/series.js';

const MIN = 60_000;
const HOUR = 60 * MIN;
const T0 = Date.UTC(2026, 2, 1, 0, 0);

/** Reports at T0 + hours[i]·HOUR: T = 10 + 0.5·h, Td = 5, wind 270° 10 m/s, station pressure 1000 − 0.1·h. No longitude. */
function hourly(hours: number[], fill?: (s: StationSeries, i: number, h: number) => void): StationSeries {
  const s = allocSeries('QGRD', hours.length);
  hours.forEach((h, i) => {
    s.timeMs[i] = T0 + h * HOUR;
    s.temperatureC[i] = 10 + 0.5 * h;
    s.dewpointC[i] = 5;
    s.windDirDeg[i] = 270;
    s.windSpeedMs[i] = 10;
    s.stationPressureHpa[i] = 1000 - 0.1 * h;
    fill?.(s, i, h);
  });
  return s;
}

const range = (a: number, b: number) => Array.from({ length: b - a }, (_, k) => a + k);

/** Grid index of a time. */
const idx = (g: { timeMs: Float64Array }, tMs: number) => g.timeMs.indexOf(tMs);

test('gridStepMs(cadenceMin): 5 min up to 7-min data, 10 min up to 20-min data, 15 min beyond', () => {
  // common practice, no source (the rule in the function's doc)
  assert.is(gridStepMs(1), 5 * MIN);
  assert.is(gridStepMs(7), 5 * MIN);
  assert.is(gridStepMs(10), 10 * MIN);
  assert.is(gridStepMs(20), 10 * MIN);
  assert.is(gridStepMs(60), 15 * MIN);
  // constructed: expected by construction, an unknown cadence (NaN, 0) takes the finest step
  assert.is(gridStepMs(NaN), 5 * MIN);
  assert.is(gridStepMs(0), 5 * MIN);
});

test('gridMaxGapMs(cadenceMin) bridges 2.5 report intervals, at least 90 min', () => {
  // common practice, no source: 2.5 × 60 min = 150 min for hourly reports
  assert.is(gridMaxGapMs(60), 150 * MIN);
  // common practice, no source: 2.5 × 20 = 50 min < 90 min floor
  assert.is(gridMaxGapMs(20), 90 * MIN);
  assert.is(gridMaxGapMs(5), 90 * MIN);
  // common practice, no source: 3-hourly synoptic reports, 2.5 × 180 = 450 min
  assert.is(gridMaxGapMs(180), 450 * MIN);
});

test('buildGrid(s) is null for fewer than 6 reports', () => {
  // constructed: expected by construction (documented minimum)
  assert.is(buildGrid(hourly(range(0, 5)), 60), null);
  assert.ok(buildGrid(hourly(range(0, 6)), 60) !== null);
});

test('buildGrid(s, 60) puts hourly reports on a 15-min grid, linear between reports', () => {
  const g = buildGrid(hourly(range(0, 12)), 60)!;
  // constructed: expected by construction, 0 h to 11 h every 15 min
  assert.is(g.stepMs, 15 * MIN);
  assert.is(g.n, 11 * 4 + 1);
  assert.is(g.timeMs[0], T0);
  // constructed: expected by construction, T = 10 + 0.5 h is a straight line, so linear interpolation is exact
  assertClose(g.tC[idx(g, T0 + 2.25 * HOUR)]!, 11.125, 1e-9, 0, 'T at 02:15');
  assertClose(g.pHpa[idx(g, T0 + 7.5 * HOUR)]!, 999.25, 1e-9, 0, 'p at 07:30');
  assert.is(g.pressureKind, 'station');
  assert.is(g.cadenceMin, 60);
});

test('buildGrid bridges a gap of 2 h in hourly reports but not one of 4 h (over 2.5 report intervals)', () => {
  // hours 0–4, 6–11 (a 2-h gap), then 15–20 (a 4-h gap)
  const g = buildGrid(hourly([...range(0, 5), ...range(6, 12), ...range(15, 21)]), 60)!;
  // common practice, no source: a 120-min gap ≤ 150 min is interpolated (constructed: exact on the line)
  assertClose(g.tC[idx(g, T0 + 5 * HOUR)]!, 12.5, 1e-9, 0, 'T at 05:00 inside the 2-h gap');
  // common practice, no source: a 240-min gap > 150 min is never interpolated across
  for (const h of [11.25, 12, 13.5, 14.75]) {
    const k = idx(g, T0 + h * HOUR);
    assert.ok(Number.isNaN(g.tC[k]!) && Number.isNaN(g.uMs[k]!) && Number.isNaN(g.pHpa[k]!), `NaN at ${h} h`);
  }
  // constructed: expected by construction, the reports on each side of the gap are kept
  assertClose(g.tC[idx(g, T0 + 11 * HOUR)]!, 15.5, 1e-9);
  assertClose(g.tC[idx(g, T0 + 15 * HOUR)]!, 17.5, 1e-9);
});

test('buildGrid(s, 1) averages dense reports in each 5-min bin (method mean)', () => {
  // one report a minute for 2 h, alternating 0 and 10 °C
  const s = allocSeries('QDNS', 120);
  for (let i = 0; i < 120; i++) {
    s.timeMs[i] = T0 + i * MIN;
    s.temperatureC[i] = i % 2 ? 10 : 0;
    s.dewpointC[i] = -5;
  }
  const g = buildGrid(s, 1)!;
  assert.is(g.stepMs, 5 * MIN);
  // constructed: expected by construction, the bin of 00:10 holds minutes 8–12 = 0, 10, 0, 10, 0 → 4
  assertClose(g.tC[idx(g, T0 + 10 * MIN)]!, 4, 1e-12);
  // constructed: expected by construction, the bin of 00:15 holds minutes 13–17 = 10, 0, 10, 0, 10 → 6
  assertClose(g.tC[idx(g, T0 + 15 * MIN)]!, 6, 1e-12);
});

test('buildGrid carries wind as u/v in the meteorological convention', () => {
  const g = buildGrid(hourly(range(0, 8)), 60)!;
  const k = idx(g, T0 + 3 * HOUR);
  // WMO-No. 8 (2018) Vol. I ch. 5: u = −s sin d, v = −s cos d, so a west wind (270°) blows toward +x (from memory)
  assertClose(g.uMs[k]!, 10, 1e-9);
  assertClose(g.vMs[k]!, 0, 1e-9);
  assertClose(g.speedMs[k]!, 10, 1e-9);
});

test('buildGrid keeps a calm report calm even when its direction is flagged', () => {
  const g = buildGrid(
    hourly(range(0, 8), (s, i) => {
      if (i === 4) {
        s.windSpeedMs[i] = 0;
        s.windDirDeg[i] = 999;
        s.qc.windDirDeg[i] = QC.RANGE;
      }
    }),
    60,
  )!;
  const k = idx(g, T0 + 4 * HOUR);
  // WMO-No. 306 FM 15 (00000KT): calm has speed 0 and no direction; constructed: u = v = 0 at the calm report
  assert.is(g.uMs[k], 0);
  assert.is(g.vMs[k], 0);
});

test('buildGrid chooses station pressure, else altimeter, else sea-level pressure (≥ 50 % coverage)', () => {
  const noStation = (s: StationSeries, i: number) => {
    s.stationPressureHpa[i] = i < 3 ? 990 : NaN; // 3 of 10: under half
    s.altimeterHpa[i] = 1015;
    s.seaLevelPressureHpa[i] = 1016;
  };
  const g1 = buildGrid(hourly(range(0, 10), noStation), 60)!;
  // constructed: expected by construction (rule in choosePressure's doc)
  assert.is(g1.pressureKind, 'altimeter');
  assertClose(g1.pHpa[idx(g1, T0 + 6 * HOUR)]!, 1015, 1e-9);
  const onlySlpSparse = (s: StationSeries, i: number) => {
    s.stationPressureHpa[i] = NaN;
    s.seaLevelPressureHpa[i] = i % 3 === 0 ? 1016 : NaN; // 4 of 10: under half, but the best there is
  };
  // constructed: expected by construction, no column reaches 50 %: the best covered one
  assert.is(buildGrid(hourly(range(0, 10), onlySlpSparse), 60)!.pressureKind, 'sea-level');
  const none = (s: StationSeries, i: number) => {
    s.stationPressureHpa[i] = NaN;
  };
  const g3 = buildGrid(hourly(range(0, 10), none), 60)!;
  // constructed: expected by construction
  assert.is(g3.pressureKind, 'none');
  assert.ok(Number.isNaN(g3.pHpa[0]!));
});

test('buildGrid computes θe at station pressure, else at 1000 hPa', () => {
  const at900 = buildGrid(hourly(range(0, 8), (s, i) => (s.stationPressureHpa[i] = 900)), 60)!;
  const noP = buildGrid(hourly(range(0, 8), (s, i) => (s.stationPressureHpa[i] = NaN)), 60)!;
  const alt900 = buildGrid(hourly(range(0, 8), (s, i) => ((s.stationPressureHpa[i] = NaN), (s.altimeterHpa[i] = 900))), 60)!;
  const k = 8;
  // constructed: expected by construction, an altimeter setting is not used for θe (both at 1000 hPa)
  assertClose(alt900.thetaEK[k]!, noP.thetaEK[k]!, 1e-9);
  // Poisson's equation θ = T (1000/p)^κ (from memory): lower pressure, higher θe at the same T and Td
  assert.ok(at900.thetaEK[k]! > noP.thetaEK[k]! + 5, `${at900.thetaEK[k]} vs ${noP.thetaEK[k]}`);
});

test('buildGrid without a station longitude leaves temperature unadjusted', () => {
  const g = buildGrid(hourly(range(0, 8)), 60)!;
  // constructed: expected by construction (diurnalAdjustment needs a longitude for solar time)
  assert.equal(Array.from(g.tAdjC), Array.from(g.tC));
  assert.match(g.diurnalMethod, /^none/);
});

test.run();
