import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { BROAD_CADENCES, BROAD_FRONTS, broadConfig, broadStations, generateBroad, renderBroadFiles } from '../../tools/synth/broad.js';
import { generateNetwork } from '../../tools/synth/generateNetwork.js';
import { CSV_CONVENTIONS } from '../../tools/synth/toCsvText.js';
import type { TruthEvent } from '../../tools/synth/types.js';
import { readCsvText } from '../../src/index.js';

const DAYS = 20;
const net = generateBroad(41, DAYS);
const turn = (e: TruthEvent) => Math.abs(((((e.windAfterDeg! - e.windBeforeDeg!) % 360) + 540) % 360) - 180);
// The special fronts (arctic, frontolysis, frontogenesis, occluded, prefrontal, dryline days) keep their own ranges;
// without them every cold and warm front is an ordinary one drawn from the broad ranges.
const cfg = broadConfig(40);
const plain = generateNetwork(
  { ...cfg, events: { ...cfg.events, arctic: false, frontolysis: false, frontogenesis: false, occluded: 0, prefrontalTroughs: 0, drylines: 0 }, faults: false },
  41,
);
const ordinary = (kind: string) => plain.truth.filter((e) => e.kind === kind);

test('broad configuration is deterministic for a seed: same truth, series and rendered files', () => {
  const again = generateBroad(41, DAYS);
  assert.equal(JSON.stringify(again.truth), JSON.stringify(net.truth)); // constructed
  for (const s of net.stations) assert.equal(Array.from(again.obs.get(s.id)!.temperatureC), Array.from(net.obs.get(s.id)!.temperatureC)); // constructed
  assert.equal(
    renderBroadFiles(again, 2, 41).map((f) => f.text),
    renderBroadFiles(net, 2, 41).map((f) => f.text),
  ); // constructed
  const other = generateBroad(42, DAYS);
  assert.not.equal(JSON.stringify(other.truth), JSON.stringify(net.truth)); // constructed
});

test('front ranges left out or given at their defaults draw the standard numbers', () => {
  const stations = broadStations();
  const base = { stations, startMs: Date.UTC(2026, 2, 1), endMs: Date.UTC(2026, 2, 21), faults: false as const };
  const standard = JSON.stringify(generateNetwork(base, 7).truth);
  const defaults = { coldContrastC: [4, 10] as [number, number], coldSharpShiftProbability: 0.6, coldShiftMin: [30, 90] as [number, number], warmContrastC: [3, 7] as [number, number] };
  assert.is(JSON.stringify(generateNetwork({ ...base, events: { fronts: {} } }, 7).truth), standard); // constructed
  assert.is(JSON.stringify(generateNetwork({ ...base, events: { fronts: defaults } }, 7).truth), standard); // constructed
});

test('broad set plants weak cold fronts (2 °C up) and small veers, within the configured ranges', () => {
  const cold = ordinary('cold-front');
  assert.ok(cold.length >= 40, `ordinary cold fronts ${cold.length}`);
  const [lo, hi] = BROAD_FRONTS.coldContrastC;
  // Station jitter ×0.92–1.08 and along-front spread ×0.85–1.15, then rounding to 0.1 °C (constructed).
  for (const e of cold) assert.ok(-e.tempChangeC! >= lo * 0.92 * 0.85 - 0.05 && -e.tempChangeC! <= hi * 1.08 * 1.15 + 0.05, `cold ΔT ${e.tempChangeC}`);
  assert.ok(cold.some((e) => -e.tempChangeC! < 3), 'some cold fronts under 3 °C'); // constructed
  // Veer 30–130° at the front, ±8° at each station on both sides (constructed).
  for (const e of cold) assert.ok(turn(e) >= BROAD_FRONTS.coldVeerDeg[0] - 16 && turn(e) <= BROAD_FRONTS.coldVeerDeg[1] + 16, `cold turn ${turn(e)}`);
  assert.ok(cold.some((e) => turn(e) < 45), 'some cold fronts turn under 45°'); // constructed
});

test('broad set plants weak warm fronts veering 100–130° from about ESE', () => {
  const warm = ordinary('warm-front');
  assert.ok(warm.length >= 10, `warm fronts ${warm.length}`);
  for (const e of warm) {
    assert.ok(e.tempChangeC! >= 2 * 0.92 - 0.05 && e.tempChangeC! <= 7 * 1.15 * 1.08 + 0.05, `warm ΔT ${e.tempChangeC}`); // constructed
    assert.ok(turn(e) >= 100 - 16 && turn(e) <= 130 + 16, `warm turn ${turn(e)}`); // constructed
  }
  assert.ok(warm.some((e) => e.tempChangeC! < 3), 'some warm fronts under 3 °C'); // constructed
  const north = warm.filter((e) => !e.station.startsWith('QWS'));
  for (const e of north) assert.ok(e.windBeforeDeg! >= 100 - 8 && e.windBeforeDeg! <= 125 + 8, `warm wind before ${e.windBeforeDeg}`); // constructed
});

test('broad files: every cadence and every CSV convention, read back at the planted times and values', () => {
  assert.equal([...BROAD_CADENCES], [5, 10, 20, 30, 60]); // constructed
  const seen = new Set<string>();
  BROAD_CADENCES.forEach((cadence, c) => {
    for (const f of renderBroadFiles(net, c, 41)) {
      seen.add(f.convention);
      const r = readCsvText(f.text, f.name, f.readerZone ? { zone: f.readerZone } : {});
      const s = net.obs.get(f.station)!;
      assert.ok(r.observations.length > 0.9 * ((DAYS * 1440) / cadence), `${f.name}: ${r.observations.length} rows`);
      const gaps = new Map<number, number>();
      for (let i = 1; i < r.observations.length; i++) {
        const g = r.observations[i]!.timeMs - r.observations[i - 1]!.timeMs;
        gaps.set(g, (gaps.get(g) ?? 0) + 1);
      }
      const commonest = [...gaps].sort((a, b) => b[1] - a[1])[0]![0];
      assert.is(commonest, cadence * 60000, `${f.name} spacing`); // constructed
      for (const o of r.observations) {
        const i = Math.round((o.timeMs - s.timeMs[0]!) / 300000);
        assert.is(s.timeMs[i], o.timeMs, `${f.name}: time on the 5-minute grid`); // constructed
        // Whole °F (LCD) rounds by up to 0.28 °C; other conventions by 0.1 °F or 0.1 °C (constructed).
        if (Number.isFinite(o.temperatureC) && Number.isFinite(s.temperatureC[i]!)) assert.ok(Math.abs(o.temperatureC - s.temperatureC[i]!) <= 0.3, `${f.name}: T ${o.temperatureC} vs ${s.temperatureC[i]}`);
      }
    }
  });
  assert.equal([...seen].sort(), [...CSV_CONVENTIONS].sort()); // constructed
});

test('broadConfig keeps the standard event plan shape and asks for the broad ranges', () => {
  const cfg = broadConfig(10);
  assert.is(cfg.events!.fronts, BROAD_FRONTS); // constructed
  assert.is(cfg.endMs - cfg.startMs, 10 * 86_400_000); // constructed
});

test.run();
