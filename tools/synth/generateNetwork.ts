/**
 * Seeded synthetic weather for a network of stations: 5-minute series with planted fronts, decoys
 * and faults, plus the truth list. Pure: the same config and seed always give the same output.
 * Southern-hemisphere stations form their own group, generated in mirrored space: station y and wind
 * directions are mirrored (d → 180° − d), so a cold front that veers in the north backs in the south.
 */
import type { StationMeta } from '../../src/model/index.js';
import { applyFaultsInPlace } from './applyFaults.js';
import { planGroup, type PlaneStation } from './planNetwork.js';
import { makeRng } from './random.js';
import { renderStation } from './renderStation.js';
import type { SynthConfig, SynthNetwork, SynthSeries, TruthEvent } from './types.js';

/** Mirror a direction about the east–west axis: d → 180° − d (mod 360). @example mirrorDirectionDeg(200) // 340 */
export function mirrorDirectionDeg(d: number): number {
  return (((180 - d) % 360) + 360) % 360;
}

/** Stations on a local plane (km east/north of the group mean), y mirrored for the south. */
function toPlane(stations: StationMeta[], south: boolean): PlaneStation[] {
  const lat0 = stations.reduce((a, s) => a + s.latDeg, 0) / stations.length;
  const lon0 = stations.reduce((a, s) => a + s.lonDeg, 0) / stations.length;
  const kx = 111.32 * Math.cos((lat0 * Math.PI) / 180);
  return stations.map((meta) => {
    const y = (meta.latDeg - lat0) * 110.57;
    const ps: PlaneStation = { meta, xKm: (meta.lonDeg - lon0) * kx, yKm: south ? -y : y };
    if (meta.coastal && meta.seaBearingDeg !== undefined) ps.onshoreFromDeg = south ? mirrorDirectionDeg(meta.seaBearingDeg) : meta.seaBearingDeg;
    return ps;
  });
}

/**
 * Generate a network's observations and truth.
 * @example
 * const net = generateNetwork({ stations, startMs: Date.UTC(2026, 2, 1), endMs: Date.UTC(2026, 4, 1) }, 7);
 * net.obs.get('XABC')!.temperatureC.length // 5-min samples
 */
export function generateNetwork(config: SynthConfig, seed: number): SynthNetwork {
  if (!(config.endMs > config.startMs)) throw new RangeError('generateNetwork requires endMs > startMs');
  if (config.stations.length === 0) throw new RangeError('generateNetwork requires at least one station');
  const stepMs = (config.stepMinutes ?? 5) * 60000;
  if (!(stepMs > 0)) throw new RangeError('generateNetwork requires a positive stepMinutes');
  const startMs = Math.ceil(config.startMs / stepMs) * stepMs;
  const n = Math.floor((config.endMs - startMs) / stepMs) + 1;
  const root = makeRng(seed);
  const obs = new Map<string, SynthSeries>();
  const truth: TruthEvent[] = [];
  const groups: [string, StationMeta[], boolean][] = [
    ['N', config.stations.filter((s) => s.latDeg >= 0), false],
    ['S', config.stations.filter((s) => s.latDeg < 0), true],
  ];
  for (const [prefix, members, south] of groups) {
    const groupRng = root.fork(`group-${prefix}`);
    if (members.length === 0) continue;
    const plane = toPlane(members, south);
    const plan = planGroup(plane, startMs, startMs + (n - 1) * stepMs, config.events ?? {}, groupRng.fork('plan'), prefix);
    for (const sched of plan.schedules) {
      const { series, truth: tr } = renderStation(sched, plan, startMs, n, stepMs, groupRng.fork(`station-${sched.station.meta.id}`));
      if (south) {
        for (let i = 0; i < n; i++) if (series.windSpeedMs[i]! > 0) series.windDirDeg[i] = mirrorDirectionDeg(series.windDirDeg[i]!);
        for (const e of tr) {
          if (e.windBeforeDeg !== undefined) e.windBeforeDeg = mirrorDirectionDeg(e.windBeforeDeg);
          if (e.windAfterDeg !== undefined) e.windAfterDeg = mirrorDirectionDeg(e.windAfterDeg);
        }
      }
      obs.set(sched.station.meta.id, series);
      truth.push(...tr);
    }
  }
  truth.sort((a, b) => a.timeMs - b.timeMs || a.station.localeCompare(b.station));
  const faults = config.faults === false ? [] : applyFaultsInPlace([...obs.values()], truth, config.faults ?? {}, root.fork('faults'));
  return { stations: config.stations.map((s) => ({ ...s, aliases: [...s.aliases] })), obs, truth, faults };
}
