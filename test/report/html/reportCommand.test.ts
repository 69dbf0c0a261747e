/**
 * `fropa report` through runCli in-process: the demo network gives a page of reasonable size with a chart
 * for every demo station; usage errors exit 2. (A browser look at the page is manual, not part of CI.)
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { existsSync, readFileSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { assertNoStack, cli, tempDir } from '../../cli/io.js';
import { parsePeriodTime, UsageError } from '../../../src/index.js';
import { CAUTION } from '../../../src/report/caution.js';

const demo = fileURLToPath(new URL('../../../stations-demo/', import.meta.url));
const dir = tempDir('fropa-report-');

/** Demo station ids from the demo's station files (main and southern networks). */
function demoStations(): string[] {
  const ids: string[] = [];
  for (const f of [join(demo, 'stations.csv'), join(demo, 'southern', 'stations.csv')]) {
    if (!existsSync(f)) continue;
    for (const line of readFileSync(f, 'utf8').trim().split('\n').slice(1)) ids.push(line.split(',')[0]!.trim());
  }
  return ids;
}

test('fropa report stations-demo --out r.html: exit 0, under 5 MB, a chart for each demo station, caution twice', async () => {
  const out = join(dir, 'r.html');
  const r = await cli(['report', demo, '--out', out, '--quiet']);
  assert.is(r.code, 0, r.stderr);
  assert.match(r.stdout, /wrote .*r\.html/);
  const size = statSync(out).size;
  assert.ok(size > 50_000 && size < 5_000_000, `size ${size} bytes`);
  const html = readFileSync(out, 'utf8');
  const ids = demoStations();
  assert.ok(ids.length >= 12, `${ids.length} demo stations`);
  for (const id of ids) assert.ok(new RegExp(`<title id="st-\\d+-p0s-t">${id}: observations`).test(html), `chart of ${id}`);
  assert.match(html, 'Fronts across the network');
  assert.match(html, '<svg class="map"');
  assert.is(html.split(CAUTION).length - 1, 2, 'caution at top and bottom');
});

test('fropa report with --station and --from/--to: one station, one chart over the short period', async () => {
  const out = join(dir, 'one.html');
  const r = await cli(['report', demo, '--station', 'XAVN', '--from', '2026-03-02', '--to', '2026-03-03', '--out', out, '--quiet']);
  assert.is(r.code, 0, r.stderr);
  const html = readFileSync(out, 'utf8');
  assert.is((html.match(/<svg class="panel"/g) ?? []).length, 1);
  assert.match(html, '<title id="st-0-p0s-t">XAVN: observations from 2026-03-02 00:00 to 2026-03-03 23:59 UTC</title>');
  assert.not.match(html, '<h2>XBRL', 'no section for other stations (they still appear on the front maps)');
});

test('fropa report: usage errors exit 2 without a stack trace', async () => {
  const cases: [string[], RegExp][] = [
    [['report', demo, '--from', 'yesterday', '--out', join(dir, 'x.html')], /--from "yesterday" must be an ISO date/],
    [['report', demo, '--from', '2026-03-05', '--to', '2026-03-02', '--out', join(dir, 'x.html')], /--to must be later than --from/],
    [['report', demo, '--station', 'NOPE', '--out', join(dir, 'x.html'), '--quiet'], /--station: no data for NOPE/],
  ];
  for (const [argv, msg] of cases) {
    const r = await cli(argv);
    assert.is(r.code, 2, argv.join(' '));
    assert.match(r.stderr, msg);
    assertNoStack(r.stderr);
  }
  assert.not.ok(readdirSync(dir).includes('x.html'));
});

test('fropa report --out - writes the page to standard output; a period without data exits 1 with the data period', async () => {
  const r = await cli(['report', demo, '--station', 'XAVN', '--from', '2026-03-02', '--to', '2026-03-02T12:00Z', '--out', '-', '--quiet']);
  assert.is(r.code, 0, r.stderr);
  assert.ok(r.stdout.startsWith('<!DOCTYPE html>'));
  const none = await cli(['report', demo, '--from', '2027-01-01', '--out', join(dir, 'none.html'), '--quiet']);
  assert.is(none.code, 1);
  assert.match(none.stderr, 'no observations between 2027-01-01 00:00 and the end UTC; the data run from 2026-03-01');
  assertNoStack(none.stderr);
});

test('parsePeriodTime: ISO dates and times, UTC unless an offset is given; a date alone ends at 23:59 with endOfDay', () => {
  // ISO 8601-1:2019 calendar dates and UTC offsets; the end-of-day rule is fropa's own (common practice, no source)
  assert.is(parsePeriodTime('2026-03-02', '--from'), Date.UTC(2026, 2, 2));
  assert.is(parsePeriodTime('2026-03-02', '--to', true), Date.UTC(2026, 2, 2, 23, 59));
  assert.is(parsePeriodTime('2026-03-02T06:30Z', '--from'), Date.UTC(2026, 2, 2, 6, 30));
  assert.is(parsePeriodTime('2026-03-02T06:30-05:00', '--from'), Date.UTC(2026, 2, 2, 11, 30));
  assert.throws(() => parsePeriodTime('2026-02-30', '--from'), (e: unknown) => e instanceof UsageError && /not a valid date/.test((e as Error).message));
});

test('fropa report --season --forecasts: season and verification sections, with the numbers fropa verify prints; absent by default', async () => {
  const out = join(dir, 'sv.html');
  const fc = join(demo, 'forecasts', 'forecast_passages.csv');
  const r = await cli(['report', demo, '--season', '--forecasts', fc, '--out', out, '--quiet']);
  assert.is(r.code, 0, r.stderr);
  const html = readFileSync(out, 'utf8');
  for (const id of ['season', 'season-months', 'season-hours-utc', 'verification', 'verify-stations', 'verify-timing']) assert.match(html, `id="${id}"`);
  assert.match(html, '<a href="#season">Season</a>');
  assert.is(html.split(CAUTION).length - 1, 2, 'caution at top and bottom');
  // the headline counts of `fropa verify` on the same files (its table's `all` row)
  const v = await cli(['verify', demo, '--forecasts', fc, '--bootstrap-resamples', '0', '--quiet']);
  assert.is(v.code, 0, v.stderr);
  const all = /^all\s+(\d+)\s+(\d+)\s+(\d+)/m.exec(v.stdout);
  assert.ok(all, v.stdout);
  assert.match(html, `Hits ${all![1]}, misses ${all![2]}, false alarms ${all![3]}`);
  // without the options: no such sections, and no bar-chart style rules
  const plain = join(dir, 'plain.html');
  assert.is((await cli(['report', demo, '--out', plain, '--quiet'])).code, 0);
  const p = readFileSync(plain, 'utf8');
  assert.not.match(p, 'id="season"');
  assert.not.match(p, 'id="verification"');
  assert.not.match(p, 'svg.bars');
});

test('fropa report --forecasts: an unreadable file or a bad --window-hours is a usage error (exit 2)', async () => {
  const r = await cli(['report', demo, '--forecasts', join(dir, 'nope.csv'), '--out', join(dir, 'x.html'), '--quiet']);
  assert.is(r.code, 2);
  assert.match(r.stderr, 'cannot read the forecast file');
  assertNoStack(r.stderr);
  const w = await cli(['report', demo, '--forecasts', join(demo, 'forecasts', 'forecast_passages.csv'), '--window-hours', '0', '--out', join(dir, 'y.html'), '--quiet']);
  assert.is(w.code, 2);
  assertNoStack(w.stderr);
});

test('fropa report --help lists the options and an example with stations-demo', async () => {
  const r = await cli(['report', '--help']);
  assert.is(r.code, 0);
  for (const o of ['--from', '--to', '--station', '--out', 'fropa report stations-demo']) assert.match(r.stdout, o);
});

test.run();
