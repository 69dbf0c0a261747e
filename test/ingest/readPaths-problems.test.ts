/**
 * Folder walks never stop on a bad entry (src/ingest/readPaths.ts expandPaths): symbolic link loops, dangling
 * links, unreadable subfolders and named pipes become messages and the rest is read. The entries are made in
 * a temp folder (POSIX semantics of symlink(2), mkfifo(3), chmod(2)); invented one-line report files.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { chmodSync, mkdirSync, symlinkSync } from 'node:fs';
import { execFileSync } from 'node:child_process';
import { join } from 'node:path';
import { loadPaths } from '../../src/pipeline.js';
import { put, tempDir } from '../cli/io.js';

const REPORT = '202403010051 METAR KXYZ 010051Z 18010KT 10SM CLR 05/01 A3001\n';
const asRoot = typeof process.getuid === 'function' && process.getuid() === 0;

test('symlink loop, dangling link, unreadable folder, FIFO inside a folder: a message each, the good file read', () => {
  const dir = tempDir('fropa-walk-');
  put(dir, 'good_metar.txt', REPORT);
  symlinkSync(dir, join(dir, 'loop')); // a link back to the folder being walked
  symlinkSync(join(dir, 'nowhere.txt'), join(dir, 'dangling.txt'));
  mkdirSync(join(dir, 'locked'));
  put(join(dir, 'locked'), 'hidden_metar.txt', REPORT);
  chmodSync(join(dir, 'locked'), 0o000);
  let fifo = true;
  try {
    execFileSync('mkfifo', [join(dir, 'pipe.txt')]);
  } catch {
    fifo = false;
  }
  const notes: string[] = [];
  const r = loadPaths([dir], { onNote: (m) => notes.push(m) });
  chmodSync(join(dir, 'locked'), 0o755);
  const all = notes.join('\n');
  assert.match(all, /loop.*(loops back|loop)/);
  assert.match(all, /dangling\.txt: symbolic link to nothing/);
  if (!asRoot) assert.match(all, /locked: cannot list the folder \(EACCES\)/);
  if (fifo) assert.match(all, /pipe\.txt: named pipe inside a folder, not read/);
  const parsed = r.reports.reduce((a, f) => a + f.parsed, 0);
  assert.is(parsed, asRoot ? 2 : 1);
});

test.run();
