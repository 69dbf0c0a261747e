/**
 * The "Use as a library" example in README.md runs as written: the test takes the first ```ts block of that
 * section, points `'fropa'` at src/index.ts, runs it from the repository root and checks what it printed.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { EVENT_COLUMNS } from '../src/index.js';

const root = fileURLToPath(new URL('..', import.meta.url));

/** The first ```ts block under the `## Use as a library` heading. */
function libraryExample(): string {
  const readme = readFileSync(join(root, 'README.md'), 'utf8');
  const section = readme.split(/^## /m).find((s) => s.startsWith('Use as a library'));
  assert.ok(section, 'README.md has a "## Use as a library" section');
  const m = /```ts\n([\s\S]*?)```/.exec(section!);
  assert.ok(m, 'the section has a ```ts code block');
  return m![1]!;
}

test('README "Use as a library": the example runs against src/index.ts and prints the demo results', async () => {
  const code = libraryExample();
  assert.match(code, /from 'fropa'/);
  const entry = pathToFileURL(join(root, 'src/index.ts')).href;
  const dir = mkdtempSync(join(tmpdir(), 'fropa-readme-'));
  const file = join(dir, 'example.ts');
  writeFileSync(file, code.replace(/from 'fropa'/g, `from '${entry}'`));
  const printed: string[] = [];
  const log = console.log;
  const cwd = process.cwd();
  try {
    process.chdir(root);
    console.log = (...a: unknown[]) => void printed.push(a.map(String).join(' '));
    await import(pathToFileURL(file).href);
  } finally {
    console.log = log;
    process.chdir(cwd);
    rmSync(dir, { recursive: true, force: true });
  }
  const out = printed.join('\n');
  // stations-demo/README.md: 12 invented stations (stations-demo/generate.ts)
  assert.match(out, / 12 stations/);
  // the CSV header is the output contract (src/report/format.ts EVENT_COLUMNS)
  assert.ok(printed.includes(EVENT_COLUMNS.join(',')), 'CSV header line printed');
  // the demo plants fronts across the network, so the table has the fronts section (common practice, no source)
  assert.match(out, /Fronts across the network/);
});

test.run();
