/**
 * The "broad" synthetic configuration: the standard generator with wider signal ranges, for a benchmark that shows
 * where detection gets weak. Weaker cold fronts (a fall of 2 °C upward), smaller and slower veers, warm fronts
 * turning 100–130° from about ESE to SW with temperature and dew point rising 2–3 °C over about 5 h among the
 * stronger ones; every station written at 5, 10, 20, 30 and 60 minutes and in every CSV convention of toCsvText
 * (local-time files included). Only options: the generator's defaults are untouched.
 * Ranges are common practice, no source (chosen to straddle what a front signature needs, not from a climatology).
 */
import type { StationMeta } from '../../src/model/index.js';
import { generateNetwork } from './generateNetwork.js';
import { CSV_CONVENTIONS, CSV_NEEDS_ZONE, toCsvText, type CsvConvention } from './toCsvText.js';
import type { SynthConfig, SynthFrontRanges, SynthNetwork } from './types.js';

const HOUR = 3_600_000;

/** Cadences every station is written at, minutes. */
export const BROAD_CADENCES = [5, 10, 20, 30, 60] as const;

/** Front ranges of the broad set (see SynthFrontRanges for the standard ones). */
export const BROAD_FRONTS: Required<SynthFrontRanges> = {
  coldContrastC: [2, 10],
  coldSharpShiftProbability: 0.4,
  coldShiftMin: [30, 90],
  coldVeerDeg: [30, 130],
  warmContrastC: [2, 7],
  warmZoneH: [3, 6],
  warmDewRatio: [0.9, 1.4],
  warmPreDirDeg: [100, 125],
  warmVeerDeg: [100, 130],
  warmShiftMin: [30, 150],
};

/** Invented broad-benchmark network: ten stations near 40–46° N (one coastal) and two southern stations. */
export function broadStations(): StationMeta[] {
  const rows: [string, number, number, number, boolean?][] = [
    ['QWAA', 45.9, -100.1, 560],
    ['QWAB', 44.3, -99.4, 480],
    ['QWAC', 42.6, -100.3, 700],
    ['QWAD', 40.9, -99.0, 600],
    ['QWAE', 45.0, -97.4, 380],
    ['QWAF', 43.2, -97.0, 420],
    ['QWAG', 41.5, -96.6, 350],
    ['QWAH', 44.6, -95.0, 310],
    ['QWAI', 42.4, -94.4, 320],
    ['QWAJ', 43.8, -92.6, 200, true],
    ['QWSA', -36.9, 145.4, 150],
    ['QWSB', -35.6, 147.1, 240],
  ];
  return rows.map(([id, lat, lon, el, coastal]) => ({
    id,
    aliases: [id.slice(1)],
    name: `Broad ${id}`,
    latDeg: lat,
    lonDeg: lon,
    elevationM: el,
    coastal: coastal ?? false,
    seaBearingDeg: coastal ? 90 : undefined,
  }));
}

/** Generator configuration of the broad set over `days` from 1 March 2026. */
export function broadConfig(days: number, stations: StationMeta[] = broadStations()): SynthConfig {
  const startMs = Date.UTC(2026, 2, 1);
  return {
    stations,
    startMs,
    endMs: startMs + days * 24 * HOUR,
    events: { occluded: 2, prefrontalTroughs: 3, drylines: 2, outflows: 3, seaBreezeDays: 6, calmNights: 8, fronts: BROAD_FRONTS },
    faults: { gaps: 4, stuck: 1, spikes: 6 },
  };
}

/** Generate the broad network for a seed. */
export function generateBroad(seed: number, days: number): SynthNetwork {
  return generateNetwork(broadConfig(days), seed);
}

/** Time zone a station's local-time files are written in. */
export function broadZone(s: StationMeta): string {
  return s.latDeg < 0 ? 'Australia/Melbourne' : 'America/Chicago';
}

/** CSV convention of station k at cadence index c: rotates so every station meets several conventions. */
export function broadConvention(k: number, c: number): CsvConvention {
  return CSV_CONVENTIONS[(k + 2 * c) % CSV_CONVENTIONS.length]!;
}

/** One rendered file of the broad set. */
export interface BroadFile {
  station: string;
  cadenceMinutes: number;
  convention: CsvConvention;
  /** Zone the reader must be given (naive local times), or undefined when the file says its offset or UTC. */
  readerZone?: string;
  name: string;
  text: string;
}

/** Render every station of a network at one cadence (index into BROAD_CADENCES), with a little damage. */
export function renderBroadFiles(net: SynthNetwork, cadenceIndex: number, seed: number): BroadFile[] {
  const cadence = BROAD_CADENCES[cadenceIndex]!;
  return net.stations.map((s, k) => {
    const convention = broadConvention(k, cadenceIndex);
    const zone = broadZone(s);
    const text = toCsvText(net.obs.get(s.id)!, s, convention, { zone, cadenceMinutes: cadence, duplicates: 1, badLines: 1, seed: seed + 31 * k + cadenceIndex });
    const f: BroadFile = { station: s.id, cadenceMinutes: cadence, convention, name: `${s.id}_${cadence}min_${convention}.csv`, text };
    if (CSV_NEEDS_ZONE.has(convention)) f.readerZone = zone;
    return f;
  });
}
