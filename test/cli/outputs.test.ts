/**
 * `fropa detect` output choices: --what events|fronts|all in csv/json/ndjson, --wind-unit, --runway. Run on the
 * invented demo network (three stations of stations-demo/ with its stations file, so fronts are tracked).
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import Papa from 'papaparse';
import { cli } from './io.js';
import { EVENT_COLUMNS } from '../../src/report/format.js';
import { FRONT_COLUMNS } from '../../src/report/fronts.js';

const demo = ['XAVN', 'XBRL', 'XDVK'].map((id) => `stations-demo/${id}_2026-03_2026-04.metar.txt`).concat(['--stations', 'stations-demo/stations.csv']);

test('--what fronts --format csv writes the fronts table; --what all --format json both; csv + all is a usage error', async () => {
  const f = await cli(['detect', ...demo, '--quiet', '--format', 'csv', '--what', 'fronts']);
  assert.is(f.code, 0, f.stderr);
  assert.is(f.stdout.split('\n')[0], FRONT_COLUMNS.join(','));
  const rows = Papa.parse<Record<string, string>>(f.stdout.trim(), { header: true }).data;
  assert.ok(rows.length > 0, 'the demo network has tracked fronts');
  const j = await cli(['detect', ...demo, '--quiet', '--format', 'json', '--what', 'all']);
  const o = JSON.parse(j.stdout) as { events: unknown[]; fronts: unknown[] };
  assert.ok(o.events.length > 0 && o.fronts.length === rows.length);
  const n = await cli(['detect', ...demo, '--quiet', '--format', 'ndjson', '--what', 'all']);
  const recs = n.stdout.trim().split('\n').map((l) => JSON.parse(l) as { record: string });
  assert.is(recs.filter((r) => r.record === 'front').length, rows.length);
  assert.is(recs.filter((r) => r.record === 'event').length, o.events.length);
  const bad = await cli(['detect', ...demo, '--quiet', '--format', 'csv', '--what', 'all']);
  assert.is(bad.code, 2);
  assert.match(bad.stderr, '--what events or --what fronts');
});

test('--wind-unit kt --runway 04/22: CSV gains knot and runway columns after the contract; JSON stays m/s', async () => {
  const c = await cli(['detect', ...demo, '--quiet', '--format', 'csv', '--wind-unit', 'kt', '--runway', '04/22']);
  assert.is(c.code, 0, c.stderr);
  const head = c.stdout.split('\n')[0]!.split(',');
  assert.equal(head.slice(0, EVENT_COLUMNS.length), [...EVENT_COLUMNS]);
  assert.ok(head.includes('gust_max_kt') && head.includes('rwy_22_tailwind_after_kt'), head.slice(EVENT_COLUMNS.length).join(','));
  const rows = Papa.parse<Record<string, string>>(c.stdout.trim(), { header: true }).data;
  // NIST SP 811 App. B.8: 1 kt = 0.514444 m/s; the kt column is the m/s column converted (both rounded to 0.1)
  for (const r of rows.slice(0, 10)) if (r.gust_max_ms) assert.ok(Math.abs(Number(r.gust_max_kt) - Number(r.gust_max_ms) / 0.514444) < 0.25, `${r.gust_max_kt} kt vs ${r.gust_max_ms} m/s`);
  // constructed identity: opposite runway ends see opposite components
  for (const r of rows.slice(0, 10)) if (r.rwy_04_tailwind_after_kt) assert.ok(Math.abs(Number(r.rwy_04_tailwind_after_kt) + Number(r.rwy_22_tailwind_after_kt)) < 0.11);
  const j = await cli(['detect', ...demo, '--quiet', '--format', 'json', '--wind-unit', 'kt', '--runway', '04/22']);
  const first = (JSON.parse(j.stdout) as Record<string, unknown>[])[0]!;
  assert.ok('rwy_04_crosswind_before_ms' in first && !('gust_max_kt' in first));
  const t = await cli(['detect', ...demo, '--quiet', '--wind-unit', 'kt', '--runway', '04/22']);
  assert.match(t.stdout, 'gust kt');
  assert.match(t.stdout, /rwy 04 \(40°\): cross [+-]?\d+ → [+-]?\d+, tail/);
  const bad = await cli(['detect', ...demo, '--quiet', '--runway', '45/27']);
  assert.is(bad.code, 2);
  assert.match(bad.stderr, '--runway: runway "45"');
});

test('--format geojson --at: a FeatureCollection with isochrones and arrivals; table lists arrivals as estimates; --at checked', async () => {
  const g = await cli(['detect', ...demo, '--quiet', '--format', 'geojson', '--at', '44.5,-98.5,Midway']);
  assert.is(g.code, 0, g.stderr);
  const doc = JSON.parse(g.stdout) as { type: string; features: { properties: { feature: string } }[] };
  assert.is(doc.type, 'FeatureCollection');
  const kinds = new Set(doc.features.map((f) => f.properties.feature));
  for (const k of ['station', 'passage', 'isochrone', 'arrival']) assert.ok(kinds.has(k), k);
  const t = await cli(['detect', ...demo, '--quiet', '--what', 'arrivals', '--at', '44.5,-98.5,Midway']);
  assert.match(t.stdout, 'Estimated arrivals at points');
  assert.match(t.stdout, /Midway\s+cold-front/);
  assert.match(t.stdout, 'Caution: fropa is not a certified');
  const bad = await cli(['detect', ...demo, '--quiet', '--at', '200,1']);
  assert.is(bad.code, 2);
  assert.match(bad.stderr, '--at "200,1"');
});

test.run();
