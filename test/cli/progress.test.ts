/** Progress on standard error: only on a terminal, silent with --quiet and under CI (the rules; no external source). */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { PassThrough } from 'node:stream';
import { progressBar } from '../../cli/analysis.js';
import { allocSeries } from '../../src/model/index.js';

function fakeTerminal(): { stream: NodeJS.WriteStream; text: () => string } {
  const p = new PassThrough();
  let out = '';
  p.on('data', (c) => (out += String(c)));
  Object.assign(p, { isTTY: true, columns: 160, cursorTo: () => true, clearLine: () => true, moveCursor: () => true });
  return { stream: p as unknown as NodeJS.WriteStream, text: () => out };
}

test('progressBar(): draws stations, rows, rate and time left on a terminal; null with --quiet, under CI, or without a terminal', async () => {
  const ci = process.env.CI;
  delete process.env.CI;
  try {
    const series = [allocSeries('XA', 100), allocSeries('XB', 50)];
    const term = fakeTerminal();
    const io = { stdout: () => {}, stderr: () => {}, readStdin: async () => '', progress: term.stream };
    const bar = await progressBar(io, false);
    assert.ok(bar);
    bar!.start(series.length, series[0]!.length + series[1]!.length, 2);
    bar!.onStation(1, 2, series[0]!.length);
    bar!.onStation(2, 2, series[1]!.length);
    bar!.stop();
    assert.match(term.text(), /stations/);
    assert.match(term.text(), /150 rows of 2 files/);
    assert.is(await progressBar(io, true), null, '--quiet');
    assert.is(await progressBar({ ...io, progress: undefined }, false), null, 'no terminal');
    process.env.CI = 'true';
    assert.is(await progressBar(io, false), null, 'CI');
  } finally {
    if (ci === undefined) delete process.env.CI;
    else process.env.CI = ci;
  }
});

test.run();
