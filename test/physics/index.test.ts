import { test } from 'uvu';
import * as assert from 'uvu/assert';
import * as physics from '../../src/physics/index.js';

test('index re-exports one function from every module without name clashes', () => {
  for (const name of ['RD', 'saturationVaporPressureHpa', 'dewpointFromRelativeHumidity', 'mixingRatio', 'thetaESeries',
    'wetBulbStull2011C', 'altimeterFromStationPressureHpa', 'windToUV', 'fmh1WindShifts', 'solarPosition', 'sunTimes',
    'geodesicInverse', 'projectLocalKm']) {
    assert.ok(name in physics, name);
  }
});

test.run();
