/**
 * `batch` lines through the ordered pool: each line is computed where the pool sends it, and comes back
 * as the text `batch` prints (a string crosses between threads far more cheaply than the object), in input order.
 */
import { batchLine, batchOutputLine, type BatchOptions, type BatchResult } from './batch-line.ts';
import { computeInOrder } from './pool/ordered-pool.ts';

export interface BatchTask {
  readonly text: string;
  readonly lineNumber: number;
}

/** One printed output line, whether it is an error object, and what the progress bar names it. */
export interface PrintedLine {
  readonly text: string;
  readonly ok: boolean;
  readonly label: string;
}

export function printedLine(result: BatchResult): PrintedLine {
  return { text: batchOutputLine(result), ok: result.ok, label: typeof result['id'] === 'string' ? result['id'] : `line ${String(result['line'])}` };
}

function workerFailed(task: BatchTask, reason: string): PrintedLine {
  return printedLine({
    line: task.lineNumber,
    error: { ruleId: 'batch-worker-failed', message: `line ${task.lineNumber} was not computed: the worker computing it stopped (${reason})`, span: null, hints: ['Raise --time-budget or --max-state-memory limits only as far as the machine allows, or run this line alone.'] },
    ok: false,
  });
}

/** One printed line per task, in the order of `tasks` (`total` of them, when known); `jobs` = 1 computes in this thread. */
export function computeBatch(tasks: AsyncIterable<BatchTask>, jobs: number, options: BatchOptions, total?: number): AsyncGenerator<PrintedLine> {
  return computeInOrder(tasks, {
    jobs,
    ...(total !== undefined ? { total } : {}),
    job: { kind: 'batch-line', options },
    runHere: (task) => printedLine(batchLine(task.text, task.lineNumber, options)),
    lost: workerFailed,
  });
}
