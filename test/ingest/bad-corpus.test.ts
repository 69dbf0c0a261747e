/**
 * The bad-input corpus (test/fixtures/bad/, see its README): every damaged file gives its exit code, its line
 * totals and its exact messages, and never a stack trace. Each case names the source of its rule in
 * cases.json (`source`).
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { readFileSync } from 'node:fs';
import { assertNoStack, cli } from '../cli/io.js';

interface BadCase {
  file: string;
  command: string;
  exitCode: number;
  lines: string | null;
  messages: string[];
  source: string;
}

const DIR = 'test/fixtures/bad/';
const cases = JSON.parse(readFileSync(DIR + 'cases.json', 'utf8')) as BadCase[];

test('the corpus holds at least 40 cases, each with a message and a source', () => {
  assert.ok(cases.length >= 40, `${cases.length} cases`);
  for (const c of cases) {
    assert.ok(c.messages.length > 0, `${c.file}: no message`);
    assert.ok(c.source.length > 0, `${c.file}: no source`);
  }
});

for (const c of cases) {
  test(`bad input ${c.file}: exit ${c.exitCode}, its messages (${c.source})`, async () => {
    const r = await cli([c.command, DIR + c.file]);
    const out = r.stdout + r.stderr;
    assert.is(r.code, c.exitCode, `${c.file}: exit code`);
    assertNoStack(out, c.file);
    for (const m of c.messages) assert.ok(out.includes(m), `${c.file}: missing message\n  ${m}\nin\n${out}`);
    if (c.lines !== null) assert.match(out, new RegExp(`lines\\s+${c.lines.replace(/[()]/g, '\\$&')}`), `${c.file}: line totals`);
  });
}

test.run();
