/**
 * The streamed run (detectPaths: each file read once for its stations, then station by station) gives what
 * loadPaths followed by analyseSeriesParallel or analyseShard gives on the same files, for every number of
 * workers and every file order, also when a station's reports are split between a file of several stations
 * (some under an alias) and its own file, and when reports of one time conflict across files. Reference: the
 * load-everything run on the same input (a self-consistency contract of the issue, no external source).
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { readdirSync, readFileSync } from 'node:fs';
import { gzipSync } from 'node:zlib';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { analyseSeriesParallel, analyseShard, detectPaths, eventsToCsv, inspectFiles, loadPaths, summaryLine, buildInspect } from '../src/index.js';
import { tracksToCsv } from '../src/report/fronts.js';
import { withFrontogenesisFields, type StationFields } from '../src/network/frontogenesis.js';
import { FieldSpill } from '../src/parallel/fieldSpill.js';
import { put, tempDir } from './cli/io.js';

const DEMO = fileURLToPath(new URL('../stations-demo/', import.meta.url));
const metar = readdirSync(DEMO).filter((f) => f.endsWith('.metar.txt')).sort();
const lines = (f: string) => readFileSync(join(DEMO, f), 'utf8').split('\n').filter(Boolean);
const dir = tempDir('fropa-stream-');
const [a, b, c, d] = [lines(metar[0]!), lines(metar[1]!), lines(metar[2]!), lines(metar[3]!)];
const idA = a[0]!.split(' ')[2]!;
// A file of two stations (every seventh report of the first under its alias: the id without its first letter,
// as stations.csv lists it), the rest of each in its own file, the last reports of the first repeated there with one changed.
const first = a.slice(0, 600).map((l, i) => (i % 7 === 6 ? l.replace(` ${idA} `, ` ${idA.slice(1)} `) : l));
const mixed = first.flatMap((l, i) => (i < 500 ? [l, b[i]!] : [l]));
put(dir, 'both_2026-03.metar.txt', mixed.join('\n') + '\n');
put(dir, 'rest-a_2026-03.metar.txt', [...a.slice(590, 600).map((l, i) => (i === 3 ? l.replace(/ (M?\d\d)\/(M?\d\d) /, ' 99/$2 ') : l)), ...a.slice(600)].join('\n') + '\n');
put(dir, 'rest-b_2026-03.metar.txt', b.slice(500).join('\n') + '\n');
put(dir, 'c_2026-03.metar.txt.gz', gzipSync(c.join('\n') + '\n'));
put(dir, 'd_2026-03.metar.txt', d.join('\n') + '\n');
put(dir, 'stations.csv', readFileSync(join(DEMO, 'stations.csv'), 'utf8'));
const files = readdirSync(dir).sort().map((f) => join(dir, f));
const bytes = (x: { events: Parameters<typeof eventsToCsv>[0]; tracks: Parameters<typeof tracksToCsv>[0] }) => eventsToCsv(x.events) + tracksToCsv(x.tracks);

test('detectPaths(): the bytes, reports and load summary of loadPaths + analyseSeriesParallel, for 1 and 2 workers and reversed file order', async () => {
  const load = loadPaths([dir]);
  assert.ok(load.series.length >= 4, `${load.series.length} stations`);
  assert.ok(load.series.some((s) => s.duplicates.some((x) => x.action === 'conflict-resolved')), 'a conflict across files');
  const ref = bytes(await analyseSeriesParallel(load.series, { jobs: 1 }));
  const refSummary = summaryLine(buildInspect(load.reports, load.series, load.qc));
  // [paths, jobs, inlineMaxRows]: one job in this thread, one job in one worker (as a large archive runs), two workers
  for (const [paths, jobs, inlineMaxRows] of [[[dir], 1, undefined], [[dir], 1, 0], [[dir], 2, undefined], [[...files].reverse(), 2, undefined]] as const) {
    const notes: string[] = [];
    const r = await detectPaths(paths, { onNote: (m) => notes.push(m) }, { jobs, ...(inlineMaxRows === undefined ? {} : { inlineMaxRows }) });
    assert.is(bytes(r.analysis!), paths.length > 1 ? bytes(await analyseSeriesParallel(loadPaths(paths).series, { jobs: 1 })) : ref, `jobs ${jobs}, ${paths.length} paths`);
    if (paths.length === 1) {
      assert.equal(r.load.reports, load.reports);
      assert.equal(r.load.ids, load.series.map((s) => s.station));
      assert.is(summaryLine(inspectFiles(r.load.reports, r.load.details)), refSummary);
    }
  }
});

test('detectPaths() with a shard: the NDJSON of analyseShard', async () => {
  const load = loadPaths([dir]);
  for (const k of [1, 2]) {
    const want = (await analyseShard(load.series, { index: k, count: 2 }, { jobs: 1 })).text;
    assert.is((await detectPaths([dir], {}, { jobs: 2, shard: { index: k, count: 2 } })).shard!.text, want, `shard ${k}/2`);
  }
});

test('frontogenesis from fields kept in a temporary file (FieldSpill) equals that from the fields in memory', async () => {
  const load = loadPaths([dir]);
  const tracks = (await analyseSeriesParallel(load.series, { jobs: 1 })).tracks;
  assert.ok(tracks.length > 0);
  const { fieldsOf } = await import('../src/network/frontogenesis.js');
  const fields: StationFields[] = load.series.filter((s) => s.meta).map((s) => fieldsOf(s, s.meta!));
  const { tmpdir } = await import('node:os');
  const spills = () => readdirSync(tmpdir()).filter((n) => n.startsWith('fropa-fields-')).length;
  const before = spills();
  const spill = new FieldSpill();
  // POSIX: the file is used through its descriptor with no name left, so a killed run leaves nothing behind
  if (process.platform !== 'win32') assert.is(spills(), before, 'no temporary folder left in place');
  try {
    const kept = fields.map((f) => spill.keep(f));
    assert.ok(kept.every((k) => 'load' in k), 'written to the file');
    assert.equal(withFrontogenesisFields(tracks, kept), withFrontogenesisFields(tracks, fields));
  } finally {
    spill.close();
  }
});

test.run();
