/**
 * Generate the invented demo network (run: npm run demo:generate). Deterministic for the seed below.
 * All stations, ids, names and observations are invented; no real station is represented.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { join } from 'node:path';
import type { StationMeta } from '../src/model/index.js';
import { generateNetwork } from '../tools/synth/generateNetwork.js';
import { makeRng } from '../tools/synth/random.js';
import { toCsvText, type CsvConvention } from '../tools/synth/toCsvText.js';
import { toMetarLines } from '../tools/synth/toMetarLines.js';
import type { SynthNetwork, TruthEvent } from '../tools/synth/types.js';

export const DEMO_SEED = 20260301;
const here = fileURLToPath(new URL('.', import.meta.url));
const START = Date.UTC(2026, 2, 1);
const END = Date.UTC(2026, 3, 30, 23, 55);
const TAG = '2026-03_2026-04';

type Enc = { kind: 'metar'; minute: number } | { kind: 'csv'; convention: CsvConvention; cadence: number; zone?: string };
interface DemoStation extends StationMeta {
  enc: Enc;
}

const st = (id: string, name: string, lat: number, lon: number, el: number, enc: Enc, coastal = false, sea?: number): DemoStation => ({
  id,
  aliases: [id.slice(1)],
  name,
  latDeg: lat,
  lonDeg: lon,
  elevationM: el,
  coastal,
  seaBearingDeg: sea,
  enc,
});

const NORTH: DemoStation[] = [
  st('XAVN', 'Avenmoor', 45.4, -99.0, 560, { kind: 'metar', minute: 51 }),
  st('XBRL', 'Brellin Ford', 44.2, -98.4, 470, { kind: 'metar', minute: 53 }),
  st('XCDR', 'Cedrow Plains', 43.0, -98.9, 610, { kind: 'csv', convention: 'iem', cadence: 5 }),
  st('XDVK', 'Dovekirk', 41.6, -98.0, 540, { kind: 'metar', minute: 51 }),
  st('XEMB', 'Embervale', 45.0, -96.7, 380, { kind: 'metar', minute: 53 }),
  st('XFAL', 'Fallowmere', 43.5, -96.3, 410, { kind: 'csv', convention: 'metric', cadence: 5 }),
  st('XGWN', 'Gorwen', 42.0, -96.0, 350, { kind: 'metar', minute: 51 }),
  st('XHLT', 'Halterby', 44.6, -94.5, 310, { kind: 'metar', minute: 53 }),
  st('XIRV', 'Irvanne', 42.9, -93.9, 320, { kind: 'csv', convention: 'local-offset', cadence: 5, zone: 'America/Chicago' }),
  st('XJSP', 'Jessop Wells', 41.4, -93.5, 290, { kind: 'metar', minute: 51 }),
  st('XKPT', 'Kestrel Point', 44.1, -92.2, 185, { kind: 'metar', minute: 53 }, true, 80),
];
const SOUTH: DemoStation[] = [st('XSWD', 'Swandown', -36.8, 145.9, 180, { kind: 'csv', convention: 'local-offset', cadence: 10, zone: 'Australia/Melbourne' })];

function stationsCsv(list: DemoStation[]): string {
  const rows = list.map((s) => [s.id, s.aliases[0], s.name, s.latDeg.toFixed(3), s.lonDeg.toFixed(3), s.elevationM, s.coastal ? 'yes' : 'no', s.seaBearingDeg ?? ''].join(','));
  return ['id,alias,name,lat,lon,elevation_m,coastal,sea_bearing_deg', ...rows].join('\n') + '\n';
}

function writeStationFiles(dir: string, list: DemoStation[], net: SynthNetwork, seed: number): void {
  list.forEach((s, k) => {
    const series = net.obs.get(s.id)!;
    const damage = { duplicates: k % 3 === 0 ? 2 : 0, badLines: k % 2 === 0 ? 2 : 1, seed: seed + k };
    if (s.enc.kind === 'metar') {
      const lines = toMetarLines(series, s, { ...damage, routineMinute: s.enc.minute, truth: net.truth });
      writeFileSync(join(dir, `${s.id}_${TAG}.metar.txt`), lines.join('\n') + '\n');
    } else {
      const text = toCsvText(series, s, s.enc.convention, { ...damage, cadenceMinutes: s.enc.cadence, zone: s.enc.zone });
      writeFileSync(join(dir, `${s.id}_${TAG}.csv`), text);
    }
  });
}

const iso = (ms: number) => new Date(ms).toISOString().slice(0, 16) + 'Z';
const truthRow = (e: TruthEvent) => ({
  station: e.station,
  kind: e.kind,
  time: iso(e.timeMs),
  zoneEnd: e.zoneEndMs !== undefined ? iso(e.zoneEndMs) : undefined,
  tempChangeC: e.tempChangeC,
  dewpointChangeC: e.dewpointChangeC,
  windBeforeDeg: e.windBeforeDeg,
  windAfterDeg: e.windAfterDeg,
  frontId: e.frontId,
  note: e.note,
});

/** Forecast passages: truth ± realistic errors, issued 12–36 h ahead; one miss and one false alarm. */
function forecasts(truth: TruthEvent[], seed: number): { csv: string; miss: TruthEvent; falseAlarm: { station: string; kind: string; time: string } } {
  const rng = makeRng(seed);
  const fronts = truth.filter((e) => !e.isDecoy && (e.kind === 'cold-front' || e.kind === 'warm-front'));
  const missIdx = rng.int(0, fronts.length - 1);
  const rows: string[] = ['station,kind,forecast_time,issued_time'];
  fronts.forEach((e, i) => {
    if (i === missIdx) return;
    const sd = e.kind === 'cold-front' ? 75 : 150;
    const errMin = Math.round(rng.normal() * sd + (e.kind === 'warm-front' ? 30 : 10));
    const ft = e.timeMs + errMin * 60000;
    const issued = Math.floor((e.timeMs - rng.uniform(12, 36) * 3_600_000) / 3_600_000) * 3_600_000;
    rows.push([e.station, e.kind, iso(ft), iso(issued)].join(','));
  });
  // False alarm: a cold front forecast on a quiet day at one station.
  const station = fronts[0]!.station;
  let t = Date.UTC(2026, 3, 8, 15);
  while (truth.some((e) => e.station === station && Math.abs(e.timeMs - t) < 36 * 3_600_000)) t += 12 * 3_600_000;
  rows.push([station, 'cold-front', iso(t), iso(t - 24 * 3_600_000)].join(','));
  return { csv: rows.join('\n') + '\n', miss: fronts[missIdx]!, falseAlarm: { station, kind: 'cold-front', time: iso(t) } };
}

function check(net: SynthNetwork, need: string[]): void {
  for (const k of need) {
    const ok = k.startsWith('note:') ? net.truth.some((e) => e.note === k.slice(5)) : net.truth.some((e) => e.kind === k);
    if (!ok) throw new Error(`demo: no ${k} was planted with this seed; choose another seed`);
  }
}

function main(): void {
  const north = generateNetwork(
    { stations: NORTH, startMs: START, endMs: END, events: { occluded: 1, prefrontalTroughs: 2, drylines: 1, outflows: 1, seaBreezeDays: 6, calmNights: 4 }, faults: { gaps: 3, stuck: 1, spikes: 4 } },
    DEMO_SEED,
  );
  check(north, ['cold-front', 'warm-front', 'occluded-front', 'dryline', 'outflow-boundary', 'sea-breeze-front', 'night-cooling', 'prefrontal-trough', 'note:arctic', 'note:frontolysis', 'note:frontogenesis']);
  const south = generateNetwork(
    { stations: SOUTH, startMs: START, endMs: END, events: { arctic: false, frontolysis: false, frontogenesis: false, occluded: 0, prefrontalTroughs: 0, drylines: 0, outflows: 0, calmNights: 2 }, faults: { gaps: 1, stuck: 0, spikes: 1 } },
    DEMO_SEED + 1,
  );
  check(south, ['cold-front']);
  mkdirSync(join(here, 'southern'), { recursive: true });
  mkdirSync(join(here, 'forecasts'), { recursive: true });
  writeFileSync(join(here, 'stations.csv'), stationsCsv(NORTH));
  writeFileSync(join(here, 'southern', 'stations.csv'), stationsCsv(SOUTH));
  writeStationFiles(here, NORTH, north, DEMO_SEED);
  writeStationFiles(join(here, 'southern'), SOUTH, south, DEMO_SEED + 1);
  const allTruth = [...north.truth, ...south.truth].sort((a, b) => a.timeMs - b.timeMs || a.station.localeCompare(b.station));
  const fc = forecasts(north.truth, DEMO_SEED + 2);
  writeFileSync(join(here, 'forecasts', 'forecast_passages.csv'), fc.csv);
  const truthJson = {
    about: 'Invented data. Planted passages and decoys of the demo network, generated by stations-demo/generate.ts.',
    seed: DEMO_SEED,
    southernSeed: DEMO_SEED + 1,
    period: { start: iso(START), end: iso(END) },
    conventions: 'time = leading edge (start of wind shift / sharp change), UTC; zoneEnd = 90 % of the planted change; tempChangeC negative = cooling; directions in degrees true',
    passages: allTruth.filter((e) => !e.isDecoy).map(truthRow),
    decoys: allTruth.filter((e) => e.isDecoy).map(truthRow),
    faults: [...north.faults, ...south.faults].map((f) => ({ station: f.station, kind: f.kind, start: iso(f.startMs), end: iso(f.endMs), field: f.field })),
    forecasts: { file: 'forecasts/forecast_passages.csv', missedPassage: truthRow(fc.miss), falseAlarm: fc.falseAlarm },
  };
  writeFileSync(join(here, 'truth.json'), JSON.stringify(truthJson, null, 1) + '\n');
  const count = (k: string) => allTruth.filter((e) => e.kind === k).length;
  console.log(`demo written to ${here}: ${NORTH.length} + ${SOUTH.length} stations; cold ${count('cold-front')}, warm ${count('warm-front')}, occluded ${count('occluded-front')}, dryline ${count('dryline')}, decoys ${allTruth.filter((e) => e.isDecoy).length}`);
}

main();
