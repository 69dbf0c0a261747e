import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { buildSeries, medianCadenceMinutes } from '../../src/series/series.js';
import { emptyObservation } from '../../src/model/index.js';

// FMH-1 §12 (COR): a corrected report replaces the original for the same time. Common practice for merging.
test('buildSeries() sorts by time and lets a COR replace the report it corrects', () => {
  const a = { ...emptyObservation('KXYZ', 2000, 'f', 2), temperatureC: 5 };
  const b = { ...emptyObservation('KXYZ', 1000, 'f', 1), temperatureC: 4 };
  const c = { ...emptyObservation('KXYZ', 2000, 'f', 3), temperatureC: 6, corrected: true };
  const s = buildSeries('KXYZ', [a, b, c]);
  assert.is(s.length, 2);
  assert.equal(Array.from(s.timeMs), [1000, 2000]);
  assert.equal(Array.from(s.temperatureC), [4, 6]);
  assert.is(s.duplicates.length, 1);
  assert.is(s.duplicates[0]!.action, 'correction-replaced');
});

test('buildSeries() drops identical repeats and reports them', () => {
  const a = { ...emptyObservation('KXYZ', 1000, 'f', 1), temperatureC: 4 };
  const b = { ...emptyObservation('KXYZ', 1000, 'f', 2), temperatureC: 4 };
  const s = buildSeries('KXYZ', [a, b]);
  assert.is(s.length, 1);
  assert.is(s.duplicates[0]!.action, 'identical-dropped');
});

test('medianCadenceMinutes() of an hourly record is 60', () => {
  assert.is(medianCadenceMinutes([0, 3600e3, 7200e3, 10800e3]), 60);
});

test.run();
