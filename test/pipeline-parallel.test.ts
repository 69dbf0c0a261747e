/**
 * The worker pool and local faults: detection spread over worker threads gives the same bytes as in one
 * thread, for every number of workers and every order of input files; a station whose detection fails is
 * reported with its id and reason and skipped, and the rest of the run is what it would be without it.
 * Reference for all checks: the same library run in one thread on the same input (a self-consistency
 * contract of the issue, no external source).
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { analyseSeries, analyseSeriesParallel, eventsToCsv, loadPaths, type StationSeries } from '../src/index.js';
import { tracksToCsv } from '../src/report/fronts.js';
import { analysisStatus, EXIT_SOME_FAILED } from '../cli/analysis.js';

const DEMO = fileURLToPath(new URL('../stations-demo/', import.meta.url));
// Four demo stations keep the run short and still make a network without any one of them (three or more with coordinates).
const files = readdirSync(DEMO).filter((f) => /\.(txt|csv)$/.test(f) && f !== 'stations.csv').sort().slice(0, 4);
const load = (order: string[]) => loadPaths(order.map((f) => join(DEMO, f)), { stationsFile: join(DEMO, 'stations.csv') });
const bytes = (a: { events: Parameters<typeof eventsToCsv>[0]; tracks: Parameters<typeof tracksToCsv>[0] }) => eventsToCsv(a.events) + tracksToCsv(a.tracks);

test('analyseSeriesParallel(): byte-identical events and fronts with 2 workers and with one thread and for reversed input order', async () => {
  const series = load(files).series;
  assert.ok(series.length >= 3, `${series.length} stations`);
  const one = bytes(analyseSeries(series));
  for (const jobs of [2]) assert.is(bytes(await analyseSeriesParallel(series, { jobs })), one, `jobs ${jobs}`);
  assert.is(bytes(await analyseSeriesParallel(load([...files].reverse()).series, { jobs: 2 })), one, 'reversed file order');
});

/** A series whose temperature column is gone: the detector cannot run on it (stands for a station that breaks detection). */
function broken(s: StationSeries): StationSeries {
  return { ...s, temperatureC: undefined as unknown as Float64Array };
}

test('a station whose detection fails is named with its reason and skipped; the others give what they give without it', async () => {
  const series = load(files).series;
  const bad = series.map((s, i) => (i === 1 ? broken(s) : s));
  const without = bytes(analyseSeries(series.filter((_, i) => i !== 1)));
  for (const jobs of [1, 2]) {
    const a = jobs === 1 ? analyseSeries(bad) : await analyseSeriesParallel(bad, { jobs });
    assert.is(a.failures.length, 1, `jobs ${jobs}`);
    assert.is(a.failures[0]!.station, series[1]!.station);
    assert.match(a.failures[0]!.reason, /^detection failed: /);
    assert.ok(bytes(a) === without, `jobs ${jobs}: the result differs from the run without the station`);
  }
});

test('exit status after an analysis: 0 all analysed, 3 some failed (with a summary line), 1 all failed', () => {
  let err = '';
  const io = { stdout: () => {}, stderr: (t: string) => void (err += t), readStdin: async () => '' };
  const f = { station: 'XAAA', reason: 'detection failed: test' };
  assert.is(analysisStatus({ events: [], tracks: [], failures: [] }, 4, io), 0);
  assert.is(analysisStatus({ events: [], tracks: [], failures: [f] }, 4, io), EXIT_SOME_FAILED);
  assert.match(err, '1 of 4 stations failed and was skipped (XAAA)');
  assert.is(analysisStatus({ events: [], tracks: [], failures: [f] }, 1, io), 1);
  assert.match(err, 'nothing usable remains');
});

test.run();
