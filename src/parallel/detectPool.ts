/**
 * A pool of worker threads (`node:worker_threads`) for the work that stations (and files) allow in parallel:
 * single-station detection of a series (`detectInPool`), and, in a streamed run, reading a file and the whole
 * work of one station (stationWork.ts). The workers live for the whole run, so each loads the detector once.
 * Tasks go to the next free worker in the order given (longest first, for example); the results are put back
 * in task order, so the output is the same for every number of workers and every completion order. A task
 * that throws, or whose worker dies, gets its reason as its result; the others go on.
 */
import { Worker, type ResourceLimits } from 'node:worker_threads';
import { availableParallelism } from 'node:os';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { StationSeries } from '../model/index.js';
import type { DataFile } from '../ingest/readPaths.js';
import type { RunContext, StationDetectOptions, StationOutcome, StationTask } from './stationWork.js';

export type { StationOutcome } from './stationWork.js';

/** One task for a worker. */
export type PoolTask =
  | { kind: 'detect'; series: StationSeries; opts: StationDetectOptions }
  | { kind: 'census'; at: number; file: DataFile }
  | { kind: 'station'; task: StationTask };

/** A worker's answer to task `index`: its value, or why it failed. */
export type PoolReply = { index: number; value: unknown } | { index: number; error: string };

/** A task's result: its value, or why it failed. */
export type PoolResult<R> = { value: R } | { error: string };

/** Said in the reason of a task whose worker reached the pool's memory limits. */
export const MEMORY_LIMIT = 'worker memory limit';

/** Default number of workers: the cores this process may use. */
export function defaultJobs(): number {
  return Math.max(1, availableParallelism());
}

/**
 * A new worker: the compiled `.js` beside this file, or, when fropa runs from its TypeScript sources (tests,
 * benchmarks through tsx), the `.ts` source loaded after registering tsx in the worker (a worker thread does
 * not inherit the parent's module hooks). `context` reaches it as its workerData.
 */
function newWorker(context: RunContext | undefined, resourceLimits: ResourceLimits | undefined): Worker {
  const js = new URL('./detectWorker.js', import.meta.url);
  const limits = resourceLimits ? { resourceLimits } : {};
  if (existsSync(fileURLToPath(js))) return new Worker(js, { workerData: context, ...limits });
  const ts = new URL('./detectWorker.ts', import.meta.url).href;
  const api = import.meta.resolve('tsx/esm/api');
  return new Worker(`import(${JSON.stringify(api)}).then((m) => { m.register(); return import(${JSON.stringify(ts)}); });`, { eval: true, workerData: context, ...limits });
}

/** The buffers of the typed arrays inside a value (each once), handed over instead of copied. */
export function transferables(value: unknown, out = new Set<ArrayBuffer>(), depth = 0): ArrayBuffer[] {
  if (depth > 6 || value === null || typeof value !== 'object') return [...out];
  if (ArrayBuffer.isView(value)) {
    if (value.buffer instanceof ArrayBuffer && value.byteOffset === 0 && value.byteLength === value.buffer.byteLength) out.add(value.buffer);
    return [...out];
  }
  for (const v of Array.isArray(value) ? value : Object.values(value)) if (v !== null && typeof v === 'object') transferables(v, out, depth + 1);
  return [...out];
}

/** Worker threads kept for a run; `run` may be called several times, `close` ends them. */
export class WorkerPool {
  private readonly idle: Worker[] = [];
  private readonly all = new Set<Worker>();
  private readonly size: number;
  private readonly context: RunContext | undefined;
  private readonly limits: ResourceLimits | undefined;

  /** `limits` bound each worker's heap (a worker that reaches them stops: its task fails with `MEMORY_LIMIT` in its reason). */
  constructor(size: number, context?: RunContext, limits?: ResourceLimits) {
    this.size = Math.max(1, Math.floor(size));
    this.context = context;
    this.limits = limits;
  }

  /**
   * Run the tasks (in the order given by `order`, default task order; `transfer` says whether the typed
   * arrays of a task are handed over rather than copied) and resolve to one result per task, in task order.
   */
  async run<R>(
    tasks: readonly PoolTask[],
    opts: { order?: readonly number[]; transfer?: boolean; weights?: readonly number[]; budget?: number; onDone?: (done: number, index: number, r: PoolResult<R>) => void } = {},
  ): Promise<PoolResult<R>[]> {
    const out: (PoolResult<R> | undefined)[] = new Array(tasks.length);
    if (tasks.length === 0) return [];
    const pending = [...(opts.order ?? tasks.map((_, i) => i))];
    const total = pending.length;
    let next = 0;
    let done = 0;
    // With weights and a budget, a worker takes the first pending task (in order) that keeps the weight of the
    // running tasks within the budget, or waits; with nothing running it takes the first one.
    const weights = opts.weights;
    const budget = opts.budget ?? Infinity;
    let running = 0;
    const waiting: Worker[] = [];
    const take = (): number | undefined => {
      let k = 0;
      if (weights) while (k < pending.length && running > 0 && running + weights[pending[k]!]! > budget) k++;
      if (k >= pending.length) return undefined;
      next++;
      return pending.splice(k, 1)[0]!;
    };
    await new Promise<void>((resolve) => {
      let busy = 0;
      const finish = (index: number, r: PoolResult<R>) => {
        if (out[index] !== undefined) return;
        out[index] = r;
        done++;
        opts.onDone?.(done, index, r);
      };
      const feed = (w: Worker) => {
        if (next >= total) {
          this.idle.push(w);
          if (busy === 0) resolve();
          return;
        }
        const index = take();
        if (index === undefined) {
          waiting.push(w);
          return;
        }
        const weight = weights?.[index] ?? 0;
        running += weight;
        busy++;
        let settled = false;
        const settle = (r: PoolResult<R>) => {
          if (settled) return;
          settled = true;
          w.off('message', onMessage);
          w.off('error', onError);
          w.off('exit', onExit);
          busy--;
          running -= weight;
          finish(index, r);
          // a task ended: the workers that waited for room try again
          for (const x of waiting.splice(0)) feed(x);
        };
        const onMessage = (m: PoolReply) => {
          settle('error' in m ? { error: m.error } : { value: m.value as R });
          feed(w);
        };
        // The worker died (out of memory, a crash): its task fails, a fresh worker takes over.
        const dead = (reason: string) => {
          if (settled) return;
          this.all.delete(w);
          void w.terminate();
          settle({ error: reason });
          if (next < total) feed(this.spawn());
          else if (busy === 0) resolve();
        };
        const onError = (e: Error & { code?: string }) => dead(`worker stopped: ${e.message}${e.code === 'ERR_WORKER_OUT_OF_MEMORY' ? ` (${MEMORY_LIMIT})` : ''}`);
        const onExit = () => dead('worker stopped');
        w.on('message', onMessage);
        w.on('error', onError);
        w.on('exit', onExit);
        const task = tasks[index]!;
        w.postMessage({ index, task }, opts.transfer ? transferables(task) : []);
      };
      const start = Math.min(this.size, total);
      const ready = this.idle.splice(0, start);
      while (ready.length < start) ready.push(this.spawn());
      for (const w of ready) feed(w);
    });
    return out.map((r) => r ?? { error: 'not processed' });
  }

  private spawn(): Worker {
    const w = newWorker(this.context, this.limits);
    this.all.add(w);
    // an idle worker that stops is dropped (a busy one is handled by its task)
    w.on('error', () => {});
    w.on('exit', () => {
      this.all.delete(w);
      const i = this.idle.indexOf(w);
      if (i >= 0) this.idle.splice(i, 1);
    });
    return w;
  }

  async close(): Promise<void> {
    const ws = [...this.all];
    this.all.clear();
    this.idle.length = 0;
    await Promise.all(ws.map((w) => w.terminate()));
  }
}

/**
 * Detect passages at every station with `jobs` worker threads (at least 1, at most one per station).
 * `onStation` is called after each station (for progress). Resolves to one outcome per series, in input order.
 */
export async function detectInPool(series: readonly StationSeries[], opts: StationDetectOptions, jobs: number, onStation?: (done: number, s: StationSeries) => void): Promise<StationOutcome[]> {
  if (series.length === 0) return [];
  const pool = new WorkerPool(Math.min(Math.floor(jobs), series.length));
  try {
    // Longest series first (ties in input order), so that no long station is left to run alone at the end
    // (longest-processing-time-first scheduling, Graham 1969); the outcomes go back in input order.
    const order = Array.from(series, (_, i) => i).sort((a, b) => series[b]!.length - series[a]!.length || a - b);
    const results = await pool.run<StationOutcome>(
      series.map((s) => ({ kind: 'detect', series: s, opts })),
      { order, onDone: (done, i) => onStation?.(done, series[i]!) },
    );
    return results.map((r) => ('error' in r ? { error: r.error } : r.value));
  } finally {
    await pool.close();
  }
}
