/**
 * A worker thread of the pool (./ordered-pool.ts): says when it is ready, then
 * computes each chunk of tasks it is sent and posts the chunk's results back in one message.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { taskRunner, type PoolJob } from './jobs.ts';

const run = (await taskRunner(workerData as PoolJob)) as (task: unknown) => unknown;
parentPort!.on('message', (chunk: { readonly first: number; readonly tasks: readonly unknown[] }) => {
  parentPort!.postMessage({ first: chunk.first, results: chunk.tasks.map(run) });
});
parentPort!.postMessage({ ready: true });
