/**
 * `npm run bench:season`: detection at season scale. Generates a seeded synthetic year of 5-minute data
 * (about 105,000 reports per station) for a few invented stations, then times the whole analysis (QC,
 * detection at every station, tracking across the network) beside the naive rule of thumb on the same
 * series in the same run, and prints reports/s, seconds per station-year, the projection for a national
 * network of 1,000 stations on one core, and the peak resident memory.
 * Usage: npm run bench:season [-- --stations 6 --days 365 --seed 20260301]
 */
import { generateNetwork } from '../tools/synth/generateNetwork.js';
import { allocSeries, SERIES_FIELDS, type StationSeries } from '../src/model/index.js';
import { applyQc } from '../src/qc/qc.js';
import { analyseSeries } from '../src/pipeline.js';
import { naiveDetect } from './naive.js';
import { benchStations } from './skill-data.js';

const args = process.argv.slice(2);
const arg = (name: string, def: string) => {
  const i = args.indexOf(`--${name}`);
  return i >= 0 && args[i + 1] !== undefined ? args[i + 1]! : def;
};
const nStations = Number(arg('stations', '6'));
const days = Number(arg('days', '365'));
const seed = Number(arg('seed', '20260301'));
const DAY = 86_400_000;

const stations = benchStations().filter((s) => s.latDeg > 0).slice(0, nStations);
const t0 = performance.now();
const net = generateNetwork({ stations, startMs: Date.UTC(2026, 0, 1), endMs: Date.UTC(2026, 0, 1) + days * DAY, faults: false }, seed);
const genMs = performance.now() - t0;

// Synthetic columns → station series (the readers' output shape), then QC as the loader does.
const series: StationSeries[] = stations.map((m) => {
  const syn = net.obs.get(m.id)!;
  const s = allocSeries(m.id, syn.length, m);
  s.timeMs.set(syn.timeMs);
  for (const f of SERIES_FIELDS) {
    const col = (syn as unknown as Record<string, Float64Array | undefined>)[f];
    if (col) s[f].set(col);
  }
  s.weather.set(syn.weather);
  s.files.push('synthetic');
  applyQc(s);
  return s;
});
const reports = series.reduce((n, s) => n + s.length, 0);

const tNaive0 = performance.now();
let naiveEvents = 0;
for (const s of series) naiveEvents += naiveDetect(s).length;
const naiveMs = performance.now() - tNaive0;

const cpu0 = process.cpuUsage();
const tA = performance.now();
const { events, tracks } = analyseSeries(series);
const fropaMs = performance.now() - tA;
const cpu = process.cpuUsage(cpu0);

const stationYears = (nStations * days) / 365;
const perStationYearS = fropaMs / 1000 / stationYears;
console.log(`fropa season benchmark — seed ${seed}, ${nStations} stations × ${days} days of 5-minute data (generated in ${(genMs / 1000).toFixed(1)} s)`);
console.log(`reports                        ${reports.toLocaleString('en-US')}`);
console.log(`fropa analysis (detect + track) ${(fropaMs / 1000).toFixed(2)} s wall, ${((cpu.user + cpu.system) / 1e6).toFixed(2)} s CPU; ${Math.round(reports / (fropaMs / 1000)).toLocaleString('en-US')} reports/s; ${events.length} passages, ${tracks.length} fronts`);
console.log(`naive rule (same series)       ${(naiveMs / 1000).toFixed(2)} s wall; ${Math.round(reports / (naiveMs / 1000)).toLocaleString('en-US')} reports/s; ${naiveEvents} events`);
console.log(`ratio fropa / naive time       ${(fropaMs / naiveMs).toFixed(1)}×`);
console.log(`seconds per station-year       ${perStationYearS.toFixed(2)} s (one core)`);
console.log(`1,000 stations × 1 year        ≈ ${((perStationYearS * 1000) / 60).toFixed(0)} min on one core (stations are independent until tracking; shard by station across cores)`);
console.log(`peak resident memory           ${(process.memoryUsage().rss / 2 ** 20).toFixed(0)} MiB`);
