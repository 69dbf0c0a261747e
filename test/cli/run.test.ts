/**
 * runCli in-process: exit codes (0 ok, 1 no usable data / runtime failure, 2 usage error), messages that
 * name the file and line, never a stack trace without --verbose, inspect JSON shape, detect outputs.
 * Input files are small invented fixtures for input-handling cases (malformed on purpose), not physics checks.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { chmodSync, existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import Papa from 'papaparse';
import { assertNoStack, cli, put, tempDir } from './io.js';
import { EVENT_COLUMNS } from '../../src/report/format.js';
import { CAUTION } from '../../src/report/caution.js';

const dir = tempDir();
const semi = put(dir, 'semi.csv', 'station;valid;tmpc;dwpc\nKAAA;2024-01-01 00:00;5.0;1.0\nKAAA;2024-01-01 01:00;4.0;0.5\n');
const mix = put(dir, 'mix.csv', 'station;valid;tmpc;dwpc\nKAAA;2024-01-01 00:00;5.0;1.0\nKAAA,2024-01-01 01:00,4.0,0.5\nKAAA;2024-01-01 02:00;3.0;0.0\n');
const trunc = put(dir, 'trunc.csv', 'station,valid,tmpc,dwpc,sknt\nKAAA,2024-01-01 00:00,5.0,1.0,5\nKAAA,2024-01-01 01:00,4.0\nKAAA,2024-01-01 02:00\nKAAA,2024-01-01 03:00,3.0,0.0,4\n');
const back = put(dir, 'back.csv', 'station,valid,tmpc\nKAAA,2024-01-01 03:00,5.0\nKAAA,2024-01-01 01:00,4.0\nKAAA,2024-01-01 02:00,3.0\n');
const multi = put(dir, 'multi.csv', 'station,valid,tmpc\nKAAA,2024-01-01 00:00,5.0\nKBBB,2024-01-01 00:00,4.0\nKAAA,2024-01-01 01:00,3.0\nKBBB,2024-01-01 01:00,2.0\n');
const norows = put(dir, 'norows.csv', 'station,valid,tmpc\nKAAA,garbage,5.0\nKAAA,,4.0\n');
const empty = put(dir, 'empty.csv', '');
const binary = put(dir, 'blob.dat', Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x00, 0x00, 0xff, 0x10, 0x00]));
const custom = put(dir, 'custom.csv', 'Site,When,Air\nX1,2024-01-01 00:00,41\nX1,2024-01-01 01:00,40\n');
const mappingOk = put(dir, 'map.json', JSON.stringify({ columns: { Site: 'station', When: 'time', Air: 'temperature:degF' }, tz: 'UTC' }));
const mappingBad = put(dir, 'bad-map.json', '{"columns": ');
const asRoot = typeof process.getuid === 'function' && process.getuid() === 0;

test('fropa --help: exit 0, examples with stations-demo, exit codes and the caution', async () => {
  const r = await cli(['--help']);
  assert.is(r.code, 0);
  assert.match(r.stdout, 'Examples:');
  assert.match(r.stdout, 'fropa detect stations-demo');
  assert.match(r.stdout, 'Exit status: 0 success, 1 no usable data');
  assert.match(r.stdout.replace(/\s+/g, ' '), CAUTION);
  assert.is(r.stderr, '');
});

test('fropa inspect --help and detect --help carry examples', async () => {
  for (const cmd of ['inspect', 'detect']) {
    const r = await cli([cmd, '--help']);
    assert.is(r.code, 0, cmd);
    assert.match(r.stdout, 'Examples:');
    assert.match(r.stdout, `fropa ${cmd} stations-demo`);
    assert.match(r.stdout, '--column');
  }
  const d = await cli(['detect', '--help']);
  for (const o of ['--kinds', '--min-confidence', '--front-speed', '--local', '--out-dir', 'ndjson']) assert.match(d.stdout, o);
});

test('fropa --version prints the package version', async () => {
  const pkg = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string };
  const r = await cli(['--version']);
  assert.is(r.code, 0);
  assert.is(r.stdout.trim(), pkg.version);
});

test('usage errors exit 2 with a message and a --help hint, no stack trace', async () => {
  const cases: [string[], RegExp][] = [
    [[], /Name a command/],
    [['inspect'], /Not enough non-option arguments/],
    [['inspect', semi, '--bogus'], /Unknown argument: bogus/],
    [['frobnicate', semi], /Unknown arguments: frobnicate/],
    [['detect', semi, '--format', 'xml'], /Invalid values/],
    [['inspect', semi, '--tz', 'UTC', '--utc-offset', '60'], /mutually exclusive/],
  ];
  for (const [argv, re] of cases) {
    const r = await cli(argv);
    assert.is(r.code, 2, argv.join(' '));
    assert.match(r.stderr, /^fropa: /);
    assert.match(r.stderr, re);
    assert.match(r.stderr, '--help');
    assertNoStack(r.stderr);
  }
});

test('missing path: exit 2, the message names the path', async () => {
  const gone = join(dir, 'no-such-file.csv');
  const r = await cli(['inspect', gone]);
  assert.is(r.code, 2);
  assert.is(r.stderr, `fropa: ${gone}: no such file or directory\n`);
});

test('bad option values exit 2 naming the option', async () => {
  const cases: [string[], RegExp][] = [
    [['--column', 'Temp'], /--column: column override "Temp" must look like name=field\[:unit\]/],
    [['--column', 'Temp=temprature'], /unknown field "temprature"; known fields: time, station/],
    [['--column', 'Temp=temperature:furlongs'], /unknown unit "furlongs"; known units: /],
    [['--column', 'Temp=temperature:kt'], /unit kt is a speed unit, but temperature needs a temperature unit/],
    [['--month', '2024-13'], /--month "2024-13" must be YYYY-MM/],
    [['--month', '02/2024'], /must be YYYY-MM/],
    [['--tz', 'Mars/Olympus'], /--tz "Mars\/Olympus" is not an IANA time zone name/],
    [['--utc-offset', '900'], /--utc-offset must be minutes between -840 and 840/],
    [['--stations', join(dir, 'nope.csv')], /nope\.csv: cannot read the stations file/],
    [['--mapping', join(dir, 'nope.json')], /nope\.json: cannot read the mapping file/],
    [['--mapping', mappingBad], /bad-map\.json: mapping file is not valid JSON/],
  ];
  for (const [opts, re] of cases) {
    const r = await cli(['inspect', semi, ...opts]);
    assert.is(r.code, 2, opts.join(' '));
    assert.match(r.stderr, re);
    assertNoStack(r.stderr);
  }
  const d: [string[], RegExp][] = [
    [['--kinds', 'cold-front,tornado'], /--kinds: unknown kind "tornado"; known kinds: cold-front/],
    [['--min-confidence', '1.5'], /--min-confidence must be a number from 0 to 1/],
    [['--front-speed', '0'], /--front-speed must be a speed in km\/h above 0/],
    [['--local'], /--local needs --tz ZONE/],
  ];
  for (const [opts, re] of d) {
    const r = await cli(['detect', semi, ...opts]);
    assert.is(r.code, 2, opts.join(' '));
    assert.match(r.stderr, re);
    assertNoStack(r.stderr);
  }
});

test('--verbose adds the stack trace to an error', async () => {
  const r = await cli(['inspect', join(dir, 'gone.csv'), '--verbose']);
  assert.is(r.code, 2);
  assert.match(r.stderr, /^\s{4}at /m);
});

test('empty file: exit 1, "no usable data" naming the file', async () => {
  const r = await cli(['inspect', empty]);
  assert.is(r.code, 1);
  assert.match(r.stderr, `fropa: note: ${empty}: skipped (empty file)`);
  assert.match(r.stderr, `fropa: no usable data in ${empty}`);
  assertNoStack(r.stderr);
  const d = await cli(['detect', empty, '--quiet']);
  assert.is(d.code, 1);
  assert.not.match(d.stderr, 'note:');
  assert.match(d.stderr, `no usable data in ${empty}`);
});

test('binary file: exit 1, said to be binary (a zip file by its magic bytes, PKWARE APPNOTE 4.3.7: refused as compressed)', async () => {
  const r = await cli(['detect', binary]);
  assert.is(r.code, 1);
  assert.match(r.stderr, `${binary}: zip compressed file: fropa expands only gzip`);
  assert.match(r.stderr, 'no usable data');
  assertNoStack(r.stderr);
});

test('file with no usable rows: exit 1, issues named file:line: reason', async () => {
  const r = await cli(['inspect', norows]);
  assert.is(r.code, 1);
  assert.match(r.stderr, `${norows}:2: bad-time: "garbage" is not a time`);
  assert.match(r.stderr, `${norows}:3: no-time:`);
  assert.match(r.stdout, `${norows}:2: bad-time`);
  assertNoStack(r.stderr);
});

test('inspect --format json: array, one object per file with the contract keys', async () => {
  const r = await cli(['inspect', semi, multi, '--format', 'json']);
  assert.is(r.code, 0);
  const files = JSON.parse(r.stdout) as Record<string, unknown>[];
  assert.ok(Array.isArray(files));
  assert.is(files.length, 2);
  for (const f of files) {
    for (const k of ['file', 'format', 'stations', 'parsed', 'rejected', 'rejected_by_reason', 'units', 'notes', 'issues', 'station_details']) {
      assert.ok(k in f, `key ${k}`);
    }
  }
  assert.is(files[0]!.file, semi);
  assert.is(files[0]!.format, 'csv');
  // Semicolon-separated: the reader detects the delimiter.
  assert.is(files[0]!.parsed, 2);
  assert.equal(files[0]!.units, { temperature: 'degC', dewpoint: 'degC' });
  // Several stations in one file.
  assert.equal(files[1]!.stations, ['KAAA', 'KBBB']);
  const d = (files[1]!.station_details as Record<string, unknown>[])[1]!;
  assert.is(d.station, 'KBBB');
  assert.is(d.first, '2024-01-01T00:00:00Z');
  assert.is(d.last, '2024-01-01T01:00:00Z');
  assert.is(d.reports, 2);
  assert.is(d.median_cadence_min, 60);
  assert.is(d.lat, null);
  assert.equal(d.qc_flags, {});
});

test('mixed delimiters and truncated lines: rejected rows named by line, the rest kept', async () => {
  const r = await cli(['inspect', mix, trunc, '--format', 'json']);
  assert.is(r.code, 0);
  const [m, t] = JSON.parse(r.stdout) as { parsed: number; rejected: number; rejected_by_reason: Record<string, number>; issues: { line: number; reason: string }[] }[];
  assert.is(m!.parsed, 2);
  assert.equal(m!.rejected_by_reason, { truncated: 1 });
  assert.is(m!.issues[0]!.line, 3);
  assert.is(t!.parsed, 2);
  assert.equal(t!.issues.map((i) => [i.line, i.reason]), [
    [3, 'truncated'],
    [4, 'truncated'],
  ]);
});

test('times going backwards: accepted, sorted, with a note naming the line', async () => {
  const r = await cli(['inspect', back]);
  assert.is(r.code, 0);
  assert.match(r.stdout, /times go backwards/);
  assert.match(r.stdout, /first at line 3/);
  assert.match(r.stdout, 'period     2024-01-01T01:00:00Z to 2024-01-01T03:00:00Z');
});

test('--mapping names columns and units; --column does the same', async () => {
  const a = await cli(['inspect', custom, '--mapping', mappingOk, '--format', 'json']);
  assert.is(a.code, 0, a.stderr);
  const fa = (JSON.parse(a.stdout) as { parsed: number; stations: string[]; units: Record<string, string> }[])[0]!;
  assert.is(fa.parsed, 2);
  assert.equal(fa.stations, ['X1']);
  assert.is(fa.units.temperature, 'degF');
  const b = await cli(['inspect', custom, '--column', 'Site=station', '--column', 'When=time', '--column', 'Air=temperature:degF', '--tz', 'UTC', '--format', 'json']);
  assert.is(b.code, 0, b.stderr);
  assert.is((JSON.parse(b.stdout) as { parsed: number }[])[0]!.parsed, 2);
});

test('path - reads standard input', async () => {
  // Invented report in WMO-No. 306 FM 15 form with a US altimeter group.
  const stdin = 'METAR KXYZ 041251Z 20012KT 10SM FEW050 12/06 A2990\nMETAR KXYZ 041351Z 30015G25KT 10SM FEW050 06/01 A3001\n';
  const r = await cli(['inspect', '-', '--month', '2026-03', '--format', 'json'], stdin);
  assert.is(r.code, 0, r.stderr);
  const f = (JSON.parse(r.stdout) as { file: string; format: string; parsed: number; stations: string[] }[])[0]!;
  assert.is(f.file, '(stdin)');
  assert.is(f.format, 'metar');
  assert.is(f.parsed, 2);
  assert.equal(f.stations, ['KXYZ']);
});

test('detect --format csv: header is the contract, no comment line; --out writes a file', async () => {
  const r = await cli(['detect', multi, '--format', 'csv']);
  assert.is(r.code, 0, r.stderr);
  assert.is(r.stdout.split('\n')[0], EVENT_COLUMNS.join(','));
  assert.not.match(r.stdout, CAUTION);
  const out = join(dir, 'events-out.csv');
  const w = await cli(['detect', multi, '--format', 'csv', '--out', out]);
  assert.is(w.code, 0);
  assert.is(w.stdout, '');
  assert.is(readFileSync(out, 'utf8'), r.stdout);
});

test('detect table ends with the caution; json is an array', async () => {
  const t = await cli(['detect', multi]);
  assert.is(t.code, 0);
  assert.is(t.stdout.trimEnd().split('\n').pop(), CAUTION);
  const j = await cli(['detect', multi, '--format', 'json']);
  assert.ok(Array.isArray(JSON.parse(j.stdout)));
});

test('detect --local --tz ZONE: table times in that zone', async () => {
  const r = await cli(['detect', multi, '--tz', 'America/Chicago', '--local']);
  assert.is(r.code, 0, r.stderr);
  assert.match(r.stdout, /time \(America\/Chicago\)|no passages found/);
  assert.match(r.stdout, 'KAAA  no passages');
});

test('detect --out-dir writes events.csv, events.json, summary.txt and says where', async () => {
  const od = join(dir, 'out', 'nested');
  const r = await cli(['detect', multi, '--out-dir', od]);
  assert.is(r.code, 0, r.stderr);
  for (const f of ['events.csv', 'events.json', 'summary.txt']) {
    assert.ok(existsSync(join(od, f)), f);
    assert.match(r.stdout, `wrote ${join(od, f)}`);
  }
  assert.is(Papa.parse(readFileSync(join(od, 'events.csv'), 'utf8').trim(), { header: true }).meta.fields!.join(','), EVENT_COLUMNS.join(','));
  assert.ok(Array.isArray(JSON.parse(readFileSync(join(od, 'events.json'), 'utf8'))));
  assert.match(readFileSync(join(od, 'summary.txt'), 'utf8'), CAUTION);
});

test('runtime failure (output file cannot be written): exit 1, no stack trace', async () => {
  const r = await cli(['detect', multi, '--format', 'csv', '--out', join(dir, 'missing-dir', 'x.csv')]);
  assert.is(r.code, 1);
  assert.match(r.stderr, /x\.csv: cannot write the output file \(ENOENT\)/);
  assertNoStack(r.stderr);
});

test('unreadable data file: exit 1 naming the file; unreadable stations file: exit 2', async () => {
  if (asRoot) {
    console.log('  skipped: running as root, which reads a chmod 000 file anyway');
    return;
  }
  const locked = put(dir, 'locked.csv', 'station,valid,tmpc\nKAAA,2024-01-01 00:00,5.0\n');
  chmodSync(locked, 0o000);
  const r = await cli(['inspect', locked]);
  assert.is(r.code, 1);
  assert.match(r.stderr, `${locked}: cannot read the file`);
  const s = await cli(['inspect', semi, '--stations', locked]);
  assert.is(s.code, 2);
  assert.match(s.stderr, `${locked}: cannot read the stations file`);
  chmodSync(locked, 0o644);
});

test('detect --out - writes to standard output (a lone - after --out is not standard input)', async () => {
  const r = await cli(['detect', multi, '--format', 'csv', '--out', '-']);
  assert.is(r.code, 0, r.stderr);
  assert.ok(r.stdout.startsWith('station,kind,time,'), r.stdout.slice(0, 80));
  assertNoStack(r.stderr);
});

test.run();
