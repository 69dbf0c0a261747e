import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { assertClose } from '../helpers/assert.js';
import { generateNetwork } from '../../tools/synth/generateNetwork.js';
import { altimeterHpaFromStation, metarTempToken, tGroupPart, toMetarLines } from '../../tools/synth/toMetarLines.js';
import type { StationMeta } from '../../src/model/index.js';

// AFMAN 15-111 Att. 3 remark 30 / FMH-1 ch. 12: 2.6 °C / −1.5 °C → body `03/M01`, remark `T00261015`.
test('metarTempToken and tGroupPart follow the US rounding and sign rules', () => {
  assert.is(metarTempToken(2.6), '03');
  assert.is(metarTempToken(-1.5), 'M01');
  assert.is(metarTempToken(-0.3), 'M00');
  assert.is(tGroupPart(2.6) + tGroupPart(-1.5), '00261015');
});

// Smithsonian Meteorological Tables (List 1951) p. 269 in NWS form; 1013.25 hPa at 0 m → 1012.95 hPa;
// 965.0 hPa at 365.76 m → 1007.6997 hPa (computed from the published formula).
test('altimeterHpaFromStation matches the Smithsonian altimeter formula', () => {
  assertClose(altimeterHpaFromStation(1013.25, 0), 1012.95, 1e-4);
  assertClose(altimeterHpaFromStation(965.0, 365.76), 1007.6997, 1e-4);
});

const meta: StationMeta = { id: 'XTMA', aliases: [], latDeg: 43.5, lonDeg: -96.0, elevationM: 400 };
const net = generateNetwork({ stations: [meta], startMs: Date.UTC(2026, 2, 1), endMs: Date.UTC(2026, 2, 21), faults: false }, 5);
const series = net.obs.get('XTMA')!;
const lines = toMetarLines(series, meta, { truth: net.truth, fropaRemarkProbability: 1 });

test('toMetarLines writes hourly routine reports at :51 with the archive prefix, plus SPECIs', () => {
  const routine = lines.filter((l) => l.includes(' METAR '));
  assert.ok(routine.length >= 20 * 24 - 2);
  for (const l of routine) assert.match(l, /^\d{10}51 METAR XTMA \d{4}51Z AUTO /);
  assert.ok(lines.some((l) => l.includes(' SPECI ')), 'some SPECIs');
  assert.ok(lines.some((l) => / WSHFT \d{4} FROPA/.test(l)), 'FROPA remark present');
});

const decoderPath = fileURLToPath(new URL('../../src/ingest/metar.ts', import.meta.url));
test('toMetarLines output round-trips through the METAR decoder (T tenths, wind, SLP, altimeter, FROPA)', async () => {
  if (!existsSync(decoderPath)) {
    console.log('  skipped: src/ingest/metar.ts not present');
    return;
  }
  const { decodeMetar } = await import('../../src/ingest/metar.js');
  const KT = 1852 / 3600;
  let n = 0;
  let fropa = 0;
  lines.forEach((l, k) => {
    const t = Date.UTC(Number(l.slice(0, 4)), Number(l.slice(4, 6)) - 1, Number(l.slice(6, 8)), Number(l.slice(8, 10)), Number(l.slice(10, 12)));
    const r = decodeMetar(l.slice(13), { year: t ? new Date(t).getUTCFullYear() : 2026, month: new Date(t).getUTCMonth() + 1, file: 'synthetic', line: k + 1 });
    assert.ok(!('reason' in r), `line ${k + 1} decodes: ${l}`);
    if ('reason' in r) return;
    assert.is(r.timeMs, t, 'report time');
    const i = Math.floor((t - series.timeMs[0]!) / 300_000);
    assertClose(r.temperatureC, series.temperatureC[i]!, 0.051, 0, `T at ${l.slice(0, 12)}`);
    assertClose(r.dewpointC, series.dewpointC[i]!, 0.051, 0, `Td at ${l.slice(0, 12)}`);
    // Wind speed in whole knots (WMO-No. 306 FM 15 wind group).
    assertClose(r.windSpeedMs, Math.round(series.windSpeedMs[i]! / KT) * KT, 1e-6, 0, 'wind speed');
    if (!l.includes('SPECI')) assertClose(r.seaLevelPressureHpa, series.seaLevelPressureHpa[i]!, 0.051, 0, 'SLP');
    // Altimeter rounded down to 0.01 inHg (AFMAN 15-111 §13.4): within 0.34 hPa below the exact value.
    const exact = altimeterHpaFromStation(series.stationPressureHpa[i]!, meta.elevationM);
    assert.ok(r.altimeterHpa <= exact + 1e-6 && r.altimeterHpa > exact - 0.34, 'altimeter');
    if (r.remarks.some((x) => x.frontal)) fropa++;
    n++;
  });
  assert.ok(n > 400);
  assert.ok(fropa >= 1, 'FROPA remarks decode as frontal');
});

test.run();
