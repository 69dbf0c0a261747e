/**
 * Present-weather groups on bytes (src/ingest/metar/weather.ts; WMO-No. 306 FM 15 code table 4678,
 * FMH-1 §12.6.8). Phenomena flags already checked through weatherFlags in test/ingest/metar.test.ts
 * are not repeated here; these are the byte reader, ranges, and the group-structure rules.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { weatherFlags, weatherFlagsAt } from '../../../src/ingest/metar/weather.js';
import { asciiBytes } from '../../../src/ingest/metar/ascii.js';
import { WX } from '../../../src/ingest/types.js';

const f = (g: string) => weatherFlagsAt(asciiBytes(g), 0, g.length);

test('weatherFlagsAt() reads the M1 groups -RA and BR (check-values M1: light rain and mist)', () => {
  // WMO-No. 306 code table 4678: "-" light, RA rain; light intensity adds WX.LIGHT
  assert.is(f('-RA'), WX.RAIN | WX.PRECIP | WX.LIGHT);
  // WMO-No. 306 code table 4678: BR mist is an obscuration, known but without a flag
  assert.is(f('BR'), 0);
});

test('weatherFlagsAt() adds WX.HEAVY for "+" and reads several phenomena in one group', () => {
  // WMO-No. 306 code table 4678: "+" heavy; +SHRA heavy rain showers (check-values 6.2 example)
  assert.is(f('+SHRA'), WX.HEAVY | WX.SHOWER | WX.RAIN | WX.PRECIP);
  // WMO-No. 306 code table 4678: phenomena may be combined, RASN rain and snow
  assert.is(f('RASN'), WX.RAIN | WX.SNOW | WX.PRECIP | WX.MODERATE);
  // WMO-No. 306 code table 4678: DZ drizzle, SG snow grains, GS small hail, UP unknown precipitation (automatic)
  assert.is(f('-DZ'), WX.DRIZZLE | WX.PRECIP | WX.LIGHT);
  assert.is(f('SG'), WX.SNOW | WX.PRECIP | WX.MODERATE);
  assert.is(f('GS'), WX.HAIL | WX.PRECIP | WX.MODERATE);
  assert.is(f('UP'), WX.PRECIP | WX.MODERATE);
});

test('weatherFlagsAt() knows +FC (tornado or waterspout) and the obscurations without flags', () => {
  // check-values 6.2: +FC = tornado/waterspout; FC carries no flag of its own, "+" gives HEAVY
  assert.is(f('+FC'), WX.HEAVY);
  // WMO-No. 306 code table 4678: FU smoke, HZ haze, VA volcanic ash, PY spray are known obscurations
  for (const g of ['FU', 'HZ', 'VA', 'PY', 'MIFG']) assert.ok(f(g) >= 0, g);
  // WMO-No. 306 code table 4678: MIFG shallow fog (descriptor MI has no flag, FG does)
  assert.is(f('MIFG'), WX.FOG);
});

test('weatherFlagsAt() reads // (not observable) and NSW as weather groups without flags', () => {
  // WMO-No. 306 FM 15: "//" present weather not observable (automatic stations); NSW nil significant weather (trend)
  assert.is(f('//'), 0);
  assert.is(f('NSW'), 0);
  // constructed: "+//" and "-NSW" are no groups
  assert.is(f('+//'), -1);
  assert.is(f('-NSW'), -1);
});

test('weatherFlagsAt() refuses intensity with VC, VC without a phenomenon, and odd lengths', () => {
  // WMO-No. 306 FM 15: intensity is not reported with VC (in the vicinity) (from memory)
  assert.is(f('-VCSH'), -1);
  assert.is(f('+VCTS'), -1);
  // constructed: VC alone names no phenomenon
  assert.is(f('VC'), -1);
  // constructed: a group is pairs of letters after the optional sign
  assert.is(f('-'), -1);
  assert.is(f('R'), -1);
  assert.is(f('SHR'), -1);
});

test('weatherFlagsAt() keeps only the SH/TS flags of a VC group (weather near, not at, the station)', () => {
  // FMH-1 §12.6.8 (from memory): VC is 5–10 SM from the point of observation; no precipitation at the station
  assert.is(f('VCSHRA'), WX.SHOWER);
  assert.is(f('VCFG'), 0);
  assert.is(f('VCDS'), 0);
});

test('weatherFlagsAt() refuses lower case and bytes above 127', () => {
  // constructed: code table 4678 letters are upper case
  assert.is(f('ra'), -1);
  // constructed: asciiBytes turns non-ASCII into 255, which is no letter
  assert.is(f('RÄ'), -1);
});

test('weatherFlagsAt(u, a, b) reads only u[a, b) of a longer line', () => {
  const line = 'KXYZ 121755Z -TSRA BKN015';
  const u = asciiBytes(line);
  const a = line.indexOf('-TSRA');
  // constructed: expected by construction
  assert.is(weatherFlagsAt(u, a, a + 5), WX.THUNDER | WX.RAIN | WX.PRECIP | WX.LIGHT);
  // constructed: the station id is no weather group
  assert.is(weatherFlagsAt(u, 0, 4), -1);
});

test('weatherFlags(s, a, b) reads a text range the same way', () => {
  // constructed: same answer as the byte reader (its @example: -SHRA)
  assert.is(weatherFlags('-SHRA', 0, 5), WX.SHOWER | WX.RAIN | WX.PRECIP | WX.LIGHT);
  assert.is(weatherFlags('xx FZDZ yy', 3, 7), WX.FREEZING | WX.DRIZZLE | WX.PRECIP | WX.MODERATE);
});

test('weatherFlagsAt() intensity of precipitation groups: "-" light, no sign moderate, "+" heavy (WMO-No. 306 code table 4678)', () => {
  const intensity = (g: string) => f(g) & (WX.LIGHT | WX.MODERATE | WX.HEAVY);
  assert.is(intensity('-RA'), WX.LIGHT);
  assert.is(intensity('RA'), WX.MODERATE);
  assert.is(intensity('+RA'), WX.HEAVY);
  assert.is(intensity('-TSRA'), WX.LIGHT);
  assert.is(intensity('TSRA'), WX.MODERATE);
  assert.is(intensity('+SHSN'), WX.HEAVY);
  // no precipitation, no intensity: thunder alone, fog, mist
  assert.is(intensity('TS'), 0);
  assert.is(intensity('FG'), 0);
  assert.is(intensity('BR'), 0);
  // FMH-1 §12.6.8: VC (in the vicinity) and BL/DR (snow lifted by the wind) are not precipitation falling at the station
  assert.is(intensity('VCSH'), 0);
  assert.is(intensity('BLSN'), 0);
  assert.is(intensity('DRSN'), 0);
});

test.run();
