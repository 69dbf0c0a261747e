/**
 * Output safety: never over an input, never over an existing file without force, atomic sets (temporary file then
 * rename, POSIX rename(2) replaces the target in one step). Rules from the project's issue on outputs; the
 * behaviour of rename is from the POSIX specification of rename().
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { existsSync, mkdirSync, readdirSync, readFileSync, symlinkSync } from 'node:fs';
import { join } from 'node:path';
import { checkOutputs, writeFilesSafely } from '../../src/report/safeWrite.js';
import { writeOutputFolder } from '../../src/report/outputFolder.js';
import { UsageError } from '../../src/model/index.js';
import { cli, put, tempDir } from '../cli/io.js';

const dir = tempDir('fropa-safe-');
const input = put(dir, 'obs.csv', 'station,valid,tmpc\nKAAA,2024-01-01 00:00,5.0\nKAAA,2024-01-01 01:00,4.0\n');

test('an input file is never written over, even with force, also through a symlink or ./ path', () => {
  assert.throws(() => checkOutputs([input], { inputs: [input], force: true }), (e: Error) => e instanceof UsageError && /is an input file/.test(e.message));
  const link = join(dir, 'link.csv');
  symlinkSync(input, link);
  assert.throws(() => checkOutputs([link], { inputs: [input], force: true }), /is an input file/);
  assert.throws(() => checkOutputs([join(dir, '.', 'obs.csv')], { inputs: [input], force: true }), /is an input file/);
});

test('an existing file needs force; a new one does not; a folder is refused', () => {
  const p = put(dir, 'old.txt', 'old');
  assert.throws(() => writeFilesSafely([{ path: p, text: 'new' }]), /already exists; add --force/);
  assert.is(readFileSync(p, 'utf8'), 'old');
  writeFilesSafely([{ path: p, text: 'new' }], { force: true });
  assert.is(readFileSync(p, 'utf8'), 'new');
  assert.throws(() => checkOutputs([dir], { force: true }), /is a folder/);
});

test('a failing set leaves no file and no temporary file behind', () => {
  const od = join(dir, 'set');
  mkdirSync(od);
  // the second target's folder is missing and mkdirs is off: the write fails after the first temporary file
  assert.throws(() => writeFilesSafely([{ path: join(od, 'a.csv'), text: 'a' }, { path: join(od, 'missing', 'b.csv'), text: 'b' }]), /b\.csv: cannot write the output file \(ENOENT\)/);
  assert.equal(readdirSync(od), []);
});

test('writeOutputFolder refuses a second run over the same folder without force and keeps the first set', () => {
  const od = join(dir, 'bundle');
  writeOutputFolder(od, [{ name: 'a.txt', text: '1' }, { name: 'b.txt', text: '1' }]);
  assert.throws(() => writeOutputFolder(od, [{ name: 'a.txt', text: '2' }, { name: 'b.txt', text: '2' }]), /already exists/);
  assert.is(readFileSync(join(od, 'a.txt'), 'utf8') + readFileSync(join(od, 'b.txt'), 'utf8'), '11');
  writeOutputFolder(od, [{ name: 'a.txt', text: '2' }, { name: 'b.txt', text: '2' }], { force: true });
  assert.is(readFileSync(join(od, 'a.txt'), 'utf8') + readFileSync(join(od, 'b.txt'), 'utf8'), '22');
  assert.equal(readdirSync(od).sort(), ['a.txt', 'b.txt']);
});

test('CLI: --out over the input exits 2 and leaves the input intact; an existing --out needs --force', async () => {
  const before = readFileSync(input, 'utf8');
  const r = await cli(['detect', input, '--format', 'csv', '--out', input, '--force']);
  assert.is(r.code, 2);
  assert.match(r.stderr, 'is an input file');
  assert.is(readFileSync(input, 'utf8'), before);
  const out = join(dir, 'ev.csv');
  assert.is((await cli(['detect', input, '--format', 'csv', '--out', out])).code, 0);
  const again = await cli(['detect', input, '--format', 'csv', '--out', out]);
  assert.is(again.code, 2);
  assert.match(again.stderr, 'already exists; add --force');
  assert.is((await cli(['detect', input, '--format', 'csv', '--out', out, '--force'])).code, 0);
  assert.ok(existsSync(out));
  // refused before any reading or detection (the input named here does not even exist)
  const early = await cli(['detect', join(dir, 'not-there.csv'), '--format', 'csv', '--out', out]);
  assert.is(early.code, 2);
  assert.match(early.stderr, 'already exists; add --force');
});

test.run();
