import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { applyQc, cleanColumn, flagPersistence, flagSpikes } from '../../src/qc/qc.js';
import { allocSeries, QC } from '../../src/model/index.js';

const H = 3_600_000;

function hourly(values: number[]) {
  const s = allocSeries('QTST', values.length);
  for (let i = 0; i < values.length; i++) s.timeMs[i] = i * H;
  return s;
}

// WMO-No. 488 App. VI.2 plausible values: air temperature -80..+60 °C (from memory)
test('applyQc() flags a temperature outside the WMO plausible range and keeps the value', () => {
  const s = hourly([10, 11, 75, 12]);
  s.temperatureC.set([10, 11, 75, 12]);
  const r = applyQc(s);
  assert.ok(s.qc.temperatureC[2]! & QC.RANGE);
  assert.is(s.temperatureC[2], 75, 'value kept');
  assert.ok(r.flagged['temperatureC:range'] === 1);
  assert.ok(Number.isNaN(cleanColumn(s, 'temperatureC')[2]!), 'excluded from detection');
});

// WMO-No. 488 App. VI.2 internal consistency: dew point not above temperature (from memory)
test('applyQc() flags dew point above temperature beyond rounding', () => {
  const s = hourly([10, 10, 10]);
  s.temperatureC.set([10, 10, 10]);
  s.dewpointC.set([9, 10.4, 12]);
  applyQc(s);
  assert.equal(Array.from(s.qc.dewpointC).map((x) => (x & QC.CONSISTENCY ? 1 : 0)), [0, 0, 1]);
});

// common practice, no source: a lone departure that returns is a spike; a step that stays (a front) is not
test('flagSpikes() flags a returning spike but not a sustained frontal drop', () => {
  const q = new Uint8Array(6);
  flagSpikes([10, 10, 25, 10, 10, 10], q, 10);
  assert.equal(Array.from(q), [0, 0, QC.SPIKE, 0, 0, 0]);
  const q2 = new Uint8Array(6);
  flagSpikes([20, 20, 8, 7, 6, 6], q2, 10);
  assert.equal(Array.from(q2), [0, 0, 0, 0, 0, 0]);
});

// WMO-No. 488 App. VI.2 minimum variability (from memory), window lengthened: common practice, no source
test('flagPersistence() flags a stuck value lasting 12 h, not a 3 h plateau', () => {
  const t = Array.from({ length: 20 }, (_, i) => i * H);
  const v = Array.from({ length: 20 }, (_, i) => (i >= 2 && i <= 15 ? 5 : i));
  const q = new Uint8Array(20);
  flagPersistence(t, v, q, 12 * H);
  assert.ok(q[2]! & QC.PERSIST && q[15]! & QC.PERSIST);
  assert.is(q[1], 0);
  const q2 = new Uint8Array(6);
  flagPersistence(t.slice(0, 6), [1, 2, 2, 2, 2, 3], q2, 12 * H);
  assert.equal(Array.from(q2), [0, 0, 0, 0, 0, 0]);
});

// common practice, no source: 10 hPa/h is beyond mesohigh jumps (Wakimoto 1982 reports a few hPa)
test('applyQc() flags an impossible pressure jump', () => {
  const s = hourly([0, 0, 0, 0]);
  s.seaLevelPressureHpa.set([1010, 1010.5, 1030, 1030.2]);
  applyQc(s);
  assert.ok(s.qc.seaLevelPressureHpa[2]! & QC.STEP);
});

test.run();
