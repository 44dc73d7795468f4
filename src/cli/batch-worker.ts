/** A worker thread of `batch --jobs N`: computes the lines it is sent and posts each result back with its sequence number. */
import { parentPort, workerData } from 'node:worker_threads';
import { batchLine, type BatchOptions } from './batch-line.ts';

const options = workerData as BatchOptions;
parentPort!.on('message', (task: { readonly seq: number; readonly text: string; readonly lineNumber: number }) => {
  parentPort!.postMessage({ seq: task.seq, result: batchLine(task.text, task.lineNumber, options) });
});
