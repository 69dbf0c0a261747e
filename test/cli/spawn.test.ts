/**
 * The executable as a child process (node --import tsx cli/main.ts): exit status reaches the shell,
 * standard input feeds `-`, errors are one line without a stack trace. Six spawns (~0.5 s each).
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { assertNoStack, put, tempDir } from './io.js';
import { EVENT_COLUMNS } from '../../src/report/format.js';

const root = fileURLToPath(new URL('../../', import.meta.url));
const dir = tempDir('fropa-spawn-');
const multi = put(dir, 'multi.csv', 'station,valid,tmpc\nKAAA,2024-01-01 00:00,5.0\nKBBB,2024-01-01 00:00,4.0\nKAAA,2024-01-01 01:00,3.0\nKBBB,2024-01-01 01:00,2.0\n');
const empty = put(dir, 'empty.txt', '');

function fropa(args: string[], input?: string) {
  const r = spawnSync(process.execPath, ['--import', 'tsx', 'cli/main.ts', ...args], { cwd: root, input, encoding: 'utf8', timeout: 60_000 });
  if (r.error) throw r.error;
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

test('cli/main.ts starts with the node shebang (npm bin entry)', () => {
  assert.is(readFileSync(new URL('../../cli/main.ts', import.meta.url), 'utf8').split('\n')[0], '#!/usr/bin/env node');
});

test('fropa --help exits 0 with examples', () => {
  const r = fropa(['--help']);
  assert.is(r.code, 0);
  assert.match(r.stdout, 'Examples:');
  assert.match(r.stdout, 'stations-demo');
});

test('missing path exits 2 with one line on stderr, no stack trace', () => {
  const r = fropa(['detect', `${dir}/absent.csv`]);
  assert.is(r.code, 2);
  assert.is(r.stderr, `fropa: ${dir}/absent.csv: no such file or directory\n`);
  assert.is(r.stdout, '');
});

test('unknown option exits 2 with a --help hint', () => {
  const r = fropa(['inspect', multi, '--no-such-option']);
  assert.is(r.code, 2);
  assert.match(r.stderr, /Unknown argument/);
  assert.match(r.stderr, '--help');
  assertNoStack(r.stderr);
});

test('empty file exits 1 naming the file', () => {
  const r = fropa(['inspect', empty]);
  assert.is(r.code, 1);
  assert.match(r.stderr, `no usable data in ${empty}`);
  assertNoStack(r.stderr);
});

test('standard input through - (invented FM 15 reports)', () => {
  const input = 'METAR KXYZ 041251Z 20012KT 10SM FEW050 12/06 A2990\nMETAR KXYZ 041351Z 30015G25KT 10SM FEW050 06/01 A3001\n';
  const r = fropa(['inspect', '-', '--month', '2026-03', '--format', 'json'], input);
  assert.is(r.code, 0, r.stderr);
  const f = (JSON.parse(r.stdout) as { file: string; parsed: number }[])[0]!;
  assert.is(f.file, '(stdin)');
  assert.is(f.parsed, 2);
});

test('detect --format csv exits 0; header is the contract', () => {
  const r = fropa(['detect', multi, '--format', 'csv', '--quiet']);
  assert.is(r.code, 0, r.stderr);
  assert.is(r.stdout.split('\n')[0], EVENT_COLUMNS.join(','));
  assert.is(r.stderr, '');
});

test.run();
