/**
 * A pool of worker threads (`node:worker_threads`) that runs single-station detection in parallel.
 * Stations are independent until tracking, so each series goes to the next free worker, longest first; the results are
 * put back in the order of the input, so the output is the same for every number of workers and every
 * completion order. A station whose detection throws, or whose worker dies, is reported with its reason
 * and skipped; the others go on.
 */
import { Worker } from 'node:worker_threads';
import { availableParallelism } from 'node:os';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { PassageEvent, StationSeries } from '../model/index.js';
import type { DetectOptions } from '../detect/types.js';

/** One station for a worker. */
export interface PoolTask {
  index: number;
  series: StationSeries;
  opts: DetectOptions;
}

/** A worker's answer: the passages, or why detection failed. */
export type PoolReply = { index: number; events: PassageEvent[] } | { index: number; error: string };

/** Per station, in input order: its passages or the reason it failed. */
export type StationOutcome = { events: PassageEvent[] } | { error: string };

/** Default number of workers: the cores this process may use. */
export function defaultJobs(): number {
  return Math.max(1, availableParallelism());
}

/**
 * A new detection worker: the compiled `.js` beside this file, or, when fropa runs from its TypeScript
 * sources (tests, benchmarks through tsx), the `.ts` source loaded after registering tsx in the worker
 * (a worker thread does not inherit the parent's module hooks).
 */
function newWorker(): Worker {
  const js = new URL('./detectWorker.js', import.meta.url);
  if (existsSync(fileURLToPath(js))) return new Worker(js);
  const ts = new URL('./detectWorker.ts', import.meta.url).href;
  const api = import.meta.resolve('tsx/esm/api');
  return new Worker(`import(${JSON.stringify(api)}).then((m) => { m.register(); return import(${JSON.stringify(ts)}); });`, { eval: true });
}

/**
 * Detect passages at every station with `jobs` worker threads (at least 1, at most one per station).
 * `onStation` is called after each station (for progress). Resolves to one outcome per series, in input order.
 */
export async function detectInPool(
  series: readonly StationSeries[],
  opts: DetectOptions,
  jobs: number,
  onStation?: (done: number, s: StationSeries) => void,
): Promise<StationOutcome[]> {
  const out: (StationOutcome | undefined)[] = new Array(series.length);
  const n = Math.max(1, Math.min(Math.floor(jobs), series.length));
  if (series.length === 0) return [];
  // Longest series first (ties in input order), so that no long station is left to run alone at the end
  // (longest-processing-time-first scheduling, Graham 1969); the outcomes go back in input order.
  const order = Array.from(series, (_, i) => i).sort((a, b) => series[b]!.length - series[a]!.length || a - b);
  let next = 0;
  let done = 0;
  await new Promise<void>((resolve) => {
    let live = 0;
    const finish = (index: number, outcome: StationOutcome) => {
      if (out[index] !== undefined) return;
      out[index] = outcome;
      done++;
      onStation?.(done, series[index]!);
    };
    const start = () => {
      const w = newWorker();
      live++;
      let current = -1;
      const feed = () => {
        if (next >= series.length) {
          current = -1;
          void w.terminate();
          return;
        }
        current = order[next++]!;
        w.postMessage({ index: current, series: series[current]!, opts } satisfies PoolTask);
      };
      w.on('message', (r: PoolReply) => {
        finish(r.index, 'error' in r ? { error: r.error } : { events: r.events });
        feed();
      });
      w.on('error', (e) => {
        // The worker died (out of memory, a crash): its station fails, a fresh worker takes over.
        if (current >= 0) finish(current, { error: `worker stopped: ${e.message}` });
        current = -1;
      });
      w.on('exit', () => {
        live--;
        if (current >= 0) finish(current, { error: 'worker stopped' });
        if (next < series.length) start();
        else if (live === 0) resolve();
      });
      feed();
    };
    for (let i = 0; i < n; i++) start();
  });
  return out.map((o) => o ?? { error: 'not processed' });
}
