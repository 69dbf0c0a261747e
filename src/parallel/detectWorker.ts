/**
 * Worker thread of the detection pool (detectPool.ts): receives one station series at a time, runs the
 * single-station detector on it and posts back its passages, or the reason it failed. Holds no state
 * between stations.
 */
import { parentPort } from 'node:worker_threads';
import { detectWithOperatorFields } from '../report/operatorFields.js';
import type { DetectOptions } from '../detect/types.js';
import type { StationSeries } from '../model/index.js';
import type { PoolReply, PoolTask } from './detectPool.js';

const port = parentPort;
if (port) {
  port.on('message', (task: PoolTask) => {
    let reply: PoolReply;
    try {
      reply = { index: task.index, events: detectWithOperatorFields(task.series as StationSeries, task.opts as DetectOptions) };
    } catch (e) {
      reply = { index: task.index, error: e instanceof Error ? e.message : String(e) };
    }
    port.postMessage(reply);
  });
}
