import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { generateNetwork, mirrorDirectionDeg } from '../../tools/synth/generateNetwork.js';
import type { SynthSeries, TruthEvent } from '../../tools/synth/types.js';
import type { StationMeta } from '../../src/model/index.js';

const H = 3_600_000;
const st = (id: string, lat: number, lon: number, el = 300): StationMeta => ({ id, aliases: [], latDeg: lat, lonDeg: lon, elevationM: el });
const stations = [st('XTAA', 44.0, -97.0), st('XTAB', 42.5, -95.5), st('XTAC', 44.5, -94.0), st('XTSA', -37.0, 145.0, 100)];
const config = { stations, startMs: Date.UTC(2026, 2, 1), endMs: Date.UTC(2026, 3, 1), faults: false as const };
const net = generateNetwork(config, 11);

/** Circular mean direction (Mardia & Jupp 2000, §2.2) of samples in [t0, t1) with wind ≥ 1 m/s. */
function meanDir(s: SynthSeries, t0: number, t1: number): number {
  let sx = 0;
  let sy = 0;
  for (let i = 0; i < s.length; i++) {
    const t = s.timeMs[i]!;
    if (t < t0 || t >= t1 || !(s.windSpeedMs[i]! >= 1)) continue;
    sx += Math.sin((s.windDirDeg[i]! * Math.PI) / 180);
    sy += Math.cos((s.windDirDeg[i]! * Math.PI) / 180);
  }
  return ((Math.atan2(sx, sy) * 180) / Math.PI + 360) % 360;
}
const signedTurn = (a: number, b: number) => ((((b - a) % 360) + 540) % 360) - 180;
const idx = (s: SynthSeries, t: number) => Math.round((t - s.timeMs[0]!) / (s.timeMs[1]! - s.timeMs[0]!));

function coldFronts(station: string): TruthEvent[] {
  return net.truth.filter((e) => e.station === station && e.kind === 'cold-front' && e.timeMs > config.startMs + 12 * H && e.timeMs < config.endMs - 12 * H);
}

test('generateNetwork(config, seed) is deterministic for a seed and differs between seeds', () => {
  const again = generateNetwork(config, 11);
  assert.equal(JSON.stringify(again.truth), JSON.stringify(net.truth));
  for (const s of stations) {
    const a = net.obs.get(s.id)!;
    const b = again.obs.get(s.id)!;
    assert.equal(Array.from(b.temperatureC), Array.from(a.temperatureC));
    assert.equal(Array.from(b.windDirDeg), Array.from(a.windDirDeg));
    assert.equal(Array.from(b.stationPressureHpa), Array.from(a.stationPressureHpa));
  }
  const other = generateNetwork(config, 12);
  assert.not.equal(Array.from(other.obs.get('XTAA')!.temperatureC.slice(0, 500)), Array.from(net.obs.get('XTAA')!.temperatureC.slice(0, 500)));
});

test('generateNetwork plants cold fronts at every station, five-minute spacing, canonical ranges', () => {
  for (const s of stations) {
    assert.ok(coldFronts(s.id).length >= 3, `${s.id} cold fronts`);
    const series = net.obs.get(s.id)!;
    assert.is(series.timeMs[1]! - series.timeMs[0]!, 300_000);
    for (let i = 0; i < series.length; i++) {
      assert.ok(series.dewpointC[i]! <= series.temperatureC[i]!, 'dew point ≤ temperature');
      assert.ok(series.windDirDeg[i]! >= 0 && series.windDirDeg[i]! < 360, 'direction in [0, 360)');
    }
  }
});

// Northern cold-front signature: wind veers, pressure minimum at or just before the wind shift, fall
// mostly behind the leading edge. Common practice, no source (signatures as summarised by Schultz 2005,
// Mon. Wea. Rev. 133; wind-shift threshold 45° after FMH-1 §5.4.6).
test('a planted northern cold front veers ≥ 45°, has its pressure minimum near the leading edge and cools behind it', () => {
  let n = 0;
  for (const s of stations.filter((x) => x.latDeg > 0)) {
    const series = net.obs.get(s.id)!;
    for (const e of coldFronts(s.id)) {
      if (e.note === 'prefrontal trough ahead') continue;
      n++;
      const before = meanDir(series, e.timeMs - 2 * H, e.timeMs - 0.25 * H);
      const after = meanDir(series, e.timeMs + 2 * H, e.timeMs + 3 * H);
      assert.ok(signedTurn(before, after) >= 45, `${s.id} ${e.frontId}: turn ${signedTurn(before, after)}`);
      // Pressure minimum within −90 … +30 min of the leading edge, searching ±6 h.
      let iMin = -1;
      for (let i = idx(series, e.timeMs - 6 * H); i <= idx(series, e.timeMs + 6 * H); i++) if (iMin < 0 || series.seaLevelPressureHpa[i]! < series.seaLevelPressureHpa[iMin]!) iMin = i;
      const dtMin = (series.timeMs[iMin]! - e.timeMs) / 60000;
      assert.ok(dtMin >= -90 && dtMin <= 30, `${s.id} ${e.frontId}: pressure minimum at ${dtMin} min`);
      // Cooler at the zone end than just before the leading edge.
      const tBefore = series.temperatureC[idx(series, e.timeMs - 10 * 60000)]!;
      const tAfter = series.temperatureC[idx(series, e.zoneEndMs!)]!;
      assert.ok(tAfter < tBefore - 1, `${s.id} ${e.frontId}: ${tBefore} → ${tAfter}`);
    }
  }
  assert.ok(n >= 6, 'enough fronts tested');
});

test('a planted southern cold front backs (turns anticlockwise) by ≥ 45°', () => {
  const series = net.obs.get('XTSA')!;
  const fronts = coldFronts('XTSA').filter((e) => e.note !== 'prefrontal trough ahead');
  assert.ok(fronts.length >= 3);
  for (const e of fronts) {
    const before = meanDir(series, e.timeMs - 2 * H, e.timeMs - 0.25 * H);
    const after = meanDir(series, e.timeMs + 2 * H, e.timeMs + 3 * H);
    assert.ok(signedTurn(before, after) <= -45, `${e.frontId}: turn ${signedTurn(before, after)}`);
    assert.ok(signedTurn(e.windBeforeDeg!, e.windAfterDeg!) < 0, 'truth record backs too');
  }
});

test('mirrorDirectionDeg maps SSW to NNW and W to W (reflection about the east–west axis)', () => {
  assert.is(mirrorDirectionDeg(200), 340);
  assert.is(mirrorDirectionDeg(270), 270);
  assert.is(mirrorDirectionDeg(0), 180);
});

test('faults are planted and recorded when asked', () => {
  const f = generateNetwork({ ...config, faults: { gaps: 2, stuck: 1, spikes: 2 } }, 11);
  assert.is(f.faults.filter((x) => x.kind === 'gap').length, 2);
  const gap = f.faults.find((x) => x.kind === 'gap')!;
  const s = f.obs.get(gap.station)!;
  assert.ok(Number.isNaN(s.temperatureC[idx(s, gap.startMs)]!));
});

test.run();
