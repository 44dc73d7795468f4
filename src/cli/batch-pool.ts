/** `batch` lines through the ordered pool: each line is computed where the pool sends it, results in input order. */
import { batchLine, type BatchOptions, type BatchResult } from './batch-line.ts';
import { computeInOrder } from './pool/ordered-pool.ts';

export interface BatchTask {
  readonly text: string;
  readonly lineNumber: number;
}

function workerFailed(task: BatchTask, reason: string): BatchResult {
  return {
    line: task.lineNumber,
    error: { ruleId: 'batch-worker-failed', message: `line ${task.lineNumber} was not computed: the worker computing it stopped (${reason})`, span: null, hints: ['Raise --time-budget or --max-state-memory limits only as far as the machine allows, or run this line alone.'] },
    ok: false,
  };
}

/** One result per task, in the order of `tasks`; `jobs` = 1 computes in this thread. */
export function computeBatch(tasks: AsyncIterable<BatchTask>, jobs: number, options: BatchOptions): AsyncGenerator<BatchResult> {
  return computeInOrder(tasks, {
    jobs,
    job: { kind: 'batch-line', options },
    runHere: (task) => batchLine(task.text, task.lineNumber, options),
    lost: workerFailed,
  });
}
