/**
 * Worker thread of the pool (detectPool.ts): receives one task at a time (detect one series; read one file;
 * the whole work of one station, stationWork.ts) and posts back its value, or the reason it failed. Holds no
 * state between tasks but the run's context (its workerData: stations, reading options, data files).
 */
import { parentPort, workerData } from 'node:worker_threads';
import { censusFile, detectOutcome, prepareContext, stationWork, type PreparedContext, type RunContext } from './stationWork.js';
import { transferables, type PoolReply, type PoolTask } from './detectPool.js';
import type { StationSeries } from '../model/index.js';

const port = parentPort;
let prepared: PreparedContext | null = null;
const context = (): PreparedContext => (prepared ??= prepareContext(workerData as RunContext));

if (port) {
  port.on('message', ({ index, task }: { index: number; task: PoolTask }) => {
    let reply: PoolReply;
    try {
      const value =
        task.kind === 'detect'
          ? detectOutcome(task.series as StationSeries, task.opts)
          : task.kind === 'census'
            ? censusFile(context(), task.at, task.file)
            : stationWork(context(), task.task);
      // the detect outcome of a series is small; the rows of a census and a station's fields are handed over
      port.postMessage({ index, value } satisfies PoolReply, task.kind === 'detect' ? [] : transferables(value));
      return;
    } catch (e) {
      reply = { index, error: e instanceof Error ? e.message : String(e) };
    }
    port.postMessage(reply);
  });
}
