/**
 * The skill benchmark's invented network, generated from a seed and written to a temporary folder as
 * 5-minute CSV (three header conventions) and hourly METAR with SPECIs, with a stations file.
 * Shared by bench/skill.ts (scores) and bench/skill-diagnose.ts (what went wrong, case by case).
 */
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { StationMeta } from '../src/model/index.js';
import { generateNetwork } from '../tools/synth/generateNetwork.js';
import { toCsvText, type CsvConvention } from '../tools/synth/toCsvText.js';
import { toMetarLines } from '../tools/synth/toMetarLines.js';

const HOUR = 3_600_000;

/** Invented benchmark network: 11 inland/coastal stations near 41–46° N plus one southern station. */
export function benchStations(): StationMeta[] {
  const rows: [string, number, number, number, boolean?][] = [
    ['QBAA', 45.6, -99.2, 520],
    ['QBAB', 44.1, -98.6, 430],
    ['QBAC', 42.7, -99.0, 610],
    ['QBAD', 41.3, -98.1, 560],
    ['QBAE', 45.2, -96.9, 350],
    ['QBAF', 43.6, -96.5, 400],
    ['QBAG', 42.1, -96.2, 340],
    ['QBAH', 44.8, -94.6, 300],
    ['QBAI', 43.1, -94.1, 330],
    ['QBAJ', 41.6, -93.7, 280],
    ['QBAK', 44.0, -92.3, 190, true],
    ['QBSA', -36.4, 146.2, 160],
  ];
  return rows.map(([id, lat, lon, el, coastal]) => ({
    id,
    aliases: [id.slice(1)],
    name: `Bench ${id}`,
    latDeg: lat,
    lonDeg: lon,
    elevationM: el,
    coastal: coastal ?? false,
    seaBearingDeg: coastal ? 80 : undefined,
  }));
}

/** A stations file the readers accept (id, alias, name, position, coastal flag, sea bearing). */
export function stationsCsvText(stations: readonly StationMeta[]): string {
  return (
    'id,alias,name,lat,lon,elevation_m,coastal,sea_bearing_deg\n' +
    stations.map((s) => [s.id, s.aliases[0], s.name, s.latDeg, s.lonDeg, s.elevationM, s.coastal ? 'yes' : 'no', s.seaBearingDeg ?? ''].join(',')).join('\n') +
    '\n'
  );
}

/** Generate the network for `seed` over `days` from 1 March 2026 and write it under a new temporary folder. */
export function writeBenchNetwork(seed: number, days: number) {
  const stations = benchStations();
  const startMs = Date.UTC(2026, 2, 1);
  const endMs = startMs + days * 24 * HOUR;
  const net = generateNetwork(
    {
      stations,
      startMs,
      endMs,
      events: { occluded: 2, prefrontalTroughs: 4, drylines: 2, outflows: 3, seaBreezeDays: 8, calmNights: 8 },
      faults: { gaps: 6, stuck: 2, spikes: 8 },
    },
    seed,
  );
  const dir = mkdtempSync(join(tmpdir(), 'fropa-skill-'));
  const csvDir = join(dir, 'csv5');
  const metarDir = join(dir, 'metar');
  mkdirSync(csvDir);
  mkdirSync(metarDir);
  const stationsFile = join(dir, 'stations.csv');
  writeFileSync(stationsFile, stationsCsvText(stations));
  const conventions: CsvConvention[] = ['iem', 'metric', 'local-offset'];
  stations.forEach((s, k) => {
    const series = net.obs.get(s.id)!;
    const conv = conventions[k % conventions.length]!;
    const zone = s.latDeg < 0 ? 'Australia/Melbourne' : 'America/Chicago';
    writeFileSync(join(csvDir, `${s.id}.csv`), toCsvText(series, s, conv, { zone, duplicates: 2, badLines: 2, seed: seed + k }));
    writeFileSync(join(metarDir, `${s.id}.metar.txt`), toMetarLines(series, s, { truth: net.truth, duplicates: 2, badLines: 2, seed: seed + k }).join('\n') + '\n');
  });
  return { stations, net, dir, csvDir, metarDir, stationsFile };
}
