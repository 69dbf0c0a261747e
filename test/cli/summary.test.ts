/**
 * The one-line load summary on detect, verify and report (as inspect ends with it), and UTC-by-convention times
 * under --tz / --local. Fixtures are small invented files for input handling, not physics checks.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { cli, put, tempDir } from './io.js';

const dir = tempDir();
// IEM ASOS download layout: `valid` is UTC by convention (IEM download page, from memory); tmpf (°F) and sknt (kt)
// name their units, so no unit is assumed
const iem = put(dir, 'iem.csv', 'station,valid,tmpf,drct,sknt\nKAAA,2024-01-01 00:00,41,270,5\nKAAA,2024-01-01 01:00,40,280,6\nKAAA,2024-01-01 01:00,40,280,6\nKAAA,garbage,40,280,6\n');

test('detect, verify and report print the summary line inspect ends with; --quiet silences it', async () => {
  const ins = await cli(['inspect', iem]);
  const line = ins.stdout.trimEnd().split('\n').pop()!;
  assert.is(line, '1 file(s), 3 line(s) parsed, 1 rejected (bad-time 1), 1 station(s); assumed: times UTC by convention (1 file); 1 duplicate time(s)');
  const det = await cli(['detect', iem, '--format', 'csv']);
  assert.match(det.stderr, `fropa: ${line}\n`);
  const rep = await cli(['report', iem, '--out', put(dir, 'unused.txt', '').replace(/unused\.txt$/, 'r.html')]);
  assert.match(rep.stderr, `fropa: ${line}\n`);
  const fc = put(dir, 'fc.csv', 'station,kind,forecast_time\nKAAA,cold-front,2024-01-01T00:30Z\n');
  const ver = await cli(['verify', iem, '--forecasts', fc, '--bootstrap-resamples', '0']);
  assert.match(ver.stderr, `fropa: ${line}\n`);
  const q = await cli(['detect', iem, '--format', 'csv', '--quiet']);
  assert.not.match(q.stderr, 'file(s)');
});

test('--tz with --local does not shift times that are UTC by convention (IEM valid): inspect periods equal', async () => {
  const plain = await cli(['inspect', iem, '--format', 'json']);
  const tz = await cli(['inspect', iem, '--format', 'json', '--tz', 'America/Chicago']);
  const first = (s: string) => (JSON.parse(s) as { station_details: { first: string }[] }[])[0]!.station_details[0]!.first;
  assert.is(first(plain.stdout), '2024-01-01T00:00:00Z');
  assert.is(first(tz.stdout), first(plain.stdout));
  assert.match(tz.stdout, '--tz not applied'); // said in the file's notes
  const det = await cli(['detect', iem, '--tz', 'America/Chicago', '--local']);
  assert.is(det.code, 0, det.stderr);
});

test.run();
