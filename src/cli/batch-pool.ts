/**
 * Computes batch lines in a pool of worker threads and hands the results back
 * in input order, whatever order the workers finish in, so the output is the
 * same byte for byte for any pool size. At most `window` lines are in flight,
 * so memory stays constant however long the input. A worker that dies (out of
 * memory, a crash) costs the lines it held, each reported as an error object,
 * and is replaced.
 */
import { Worker } from 'node:worker_threads';
import { batchLine, type BatchOptions, type BatchResult } from './batch-line.ts';

export interface BatchTask {
  readonly text: string;
  readonly lineNumber: number;
}

/**
 * The worker script: the TypeScript source beside this module under tsx, or dist/batch-worker.js in the
 * compiled tool (this module is then bundled into dist/main.js or a chunk in dist/chunks/).
 */
function workerUrl(): URL {
  if (import.meta.url.endsWith('.ts')) return new URL('./batch-worker.ts', import.meta.url);
  const here = new URL('.', import.meta.url);
  return new URL(here.pathname.endsWith('/chunks/') ? '../batch-worker.js' : './batch-worker.js', here);
}

function workerFailed(task: BatchTask, reason: string): BatchResult {
  return {
    line: task.lineNumber,
    error: { ruleId: 'batch-worker-failed', message: `line ${task.lineNumber} was not computed: the worker computing it stopped (${reason})`, span: null, hints: ['Raise --time-budget or --max-state-memory limits only as far as the machine allows, or run this line alone.'] },
    ok: false,
  };
}

/**
 * Yields one result per task, in the order of `tasks`. `jobs` = 1 computes in this thread.
 */
export async function* computeInOrder(tasks: AsyncIterable<BatchTask>, jobs: number, options: BatchOptions): AsyncGenerator<BatchResult> {
  if (jobs <= 1) {
    for await (const task of tasks) yield batchLine(task.text, task.lineNumber, options);
    return;
  }
  const window = 8 * jobs;
  const done = new Map<number, BatchResult>();
  const held = new Map<Worker, Map<number, BatchTask>>();
  let wake: (() => void) | undefined;
  const notify = () => {
    wake?.();
    wake = undefined;
  };
  const idle: Worker[] = [];
  const start = (): Worker => {
    const worker = new Worker(workerUrl(), { workerData: options });
    held.set(worker, new Map());
    worker.on('message', (message: { seq: number; result: BatchResult }) => {
      held.get(worker)!.delete(message.seq);
      done.set(message.seq, message.result);
      idle.push(worker);
      notify();
    });
    const fail = (reason: string) => {
      const lost = held.get(worker);
      if (!lost) return;
      held.delete(worker);
      for (const [seq, task] of lost) done.set(seq, workerFailed(task, reason));
      const at = idle.indexOf(worker);
      if (at >= 0) idle.splice(at, 1);
      idle.push(start());
      notify();
    };
    worker.on('error', (error) => fail(error.message));
    worker.on('exit', (code) => fail(`exit code ${code}`));
    return worker;
  };
  for (let k = 0; k < jobs; k++) idle.push(start());
  const pending: { seq: number; task: BatchTask }[] = [];
  let nextSeq = 0;
  let nextOut = 0;
  const iterator = tasks[Symbol.asyncIterator]();
  let exhausted = false;
  try {
    for (;;) {
      // Read ahead while the window has room.
      while (!exhausted && nextSeq - nextOut < window) {
        const next = await iterator.next();
        if (next.done) exhausted = true;
        else pending.push({ seq: nextSeq++, task: next.value });
      }
      while (pending.length > 0 && idle.length > 0) {
        const { seq, task } = pending.shift()!;
        const worker = idle.pop()!;
        held.get(worker)!.set(seq, task);
        worker.postMessage({ seq, text: task.text, lineNumber: task.lineNumber });
      }
      while (done.has(nextOut)) {
        const result = done.get(nextOut)!;
        done.delete(nextOut++);
        yield result;
      }
      if (exhausted && nextOut === nextSeq) return;
      if (!done.has(nextOut) && (pending.length === 0 || idle.length === 0)) await new Promise<void>((resolve) => (wake = resolve));
    }
  } finally {
    for (const worker of held.keys()) {
      held.delete(worker);
      await worker.terminate();
    }
  }
}
