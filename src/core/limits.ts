/**
 * Limits on the work one diagram may cost, so a pasted giant code is refused
 * with an explanation instead of stalling an editor save or exhausting the
 * machine: a crossing count (checked before the code is parsed), an estimate of
 * the bracket's tangle-state memory (checked before contracting) and a time
 * budget for each computation of a diagram (checked between steps).
 *
 * The core sets no limits of its own; front ends pass them (the command line's
 * defaults are DEFAULT_LIMITS). A limit that is hit is a LimitError, an
 * InputError with rule `limit-exceeded` that says the size, what it would need
 * and the option that raises it.
 */
import { InputError } from './errors.ts';
import type { TextSpan } from './diagnostics/diagnostic.ts';

export interface ComputeLimits {
  /** Codes with more crossings are refused before they are parsed. */
  readonly maxCrossings?: number;
  /** Each computation of one diagram (its bracket, its classical invariants) stops after this many milliseconds. */
  readonly timeBudgetMs?: number;
  /** The bracket is refused when its tangle states are estimated to need more bytes than this. */
  readonly maxStateBytes?: number;
}

/**
 * The command line's defaults: a 1000-crossing braid of a few strands still
 * computes in well under a second, and no save waits more than 10 s per diagram.
 */
export const DEFAULT_LIMITS: Required<ComputeLimits> = {
  maxCrossings: 1000,
  timeBudgetMs: 10_000,
  maxStateBytes: 1024 * 1024 * 1024,
};

/** The option that raises each limit, named in the message. */
export const LIMIT_OPTIONS = {
  crossings: '--max-crossings',
  time: '--time-budget',
  'state-memory': '--max-state-memory',
} as const;

/** An InputError with rule `limit-exceeded`. */
export type LimitError = InputError;

function limitError(message: string, span?: TextSpan): LimitError {
  return new InputError('limit-exceeded', message, span);
}

export function isLimitError(e: unknown): e is LimitError {
  return e instanceof InputError && e.ruleId === 'limit-exceeded';
}

/**
 * `compute()`, or `fallback` when it runs into a limit: for glances at other diagrams (a swapped-value
 * diagnosis), whose own limits are reported at their own codes, not at the claim being judged.
 */
export function withinLimitsOr<T>(compute: () => T, fallback: T): T {
  try {
    return compute();
  } catch (error) {
    if (isLimitError(error)) return fallback;
    throw error;
  }
}

const thousands = (k: number): string => Math.round(k).toLocaleString('en-US');

export function formatBytes(bytes: number): string {
  const mib = bytes / (1024 * 1024);
  return mib >= 1024 ? `${(mib / 1024).toFixed(1)} GiB` : `${Math.max(1, Math.round(mib))} MiB`;
}

export function crossingLimitError(crossings: number, limit: number): LimitError {
  return limitError(
    `the code has ${thousands(crossings)} crossings, more than the limit of ${thousands(limit)}: it is not computed, so a pasted giant code cannot stall the run. ` +
      `To compute it anyway, raise the limit with ${LIMIT_OPTIONS.crossings} ${crossings}.`,
  );
}

/**
 * The tangle states of a bracket would outgrow `limit`: the option's limit, or (with `raisable` false)
 * the engine's own ceiling, which no option raises.
 */
export function stateMemoryError(crossings: number, width: number, bytes: number, limit: number, raisable = true): LimitError {
  const mib = Math.ceil(bytes / (1024 * 1024));
  const remedy = raisable
    ? `To compute it anyway, raise the limit with ${LIMIT_OPTIONS['state-memory']} ${mib} (MiB), or give`
    : 'That limit is the most the bracket engine can address, so no option raises it: give';
  return limitError(
    `the bracket of this ${thousands(crossings)}-crossing diagram keeps up to ${width} edge ends open at once, and its tangle states would need about ${formatBytes(bytes)} of memory, ` +
      `more than the limit of ${formatBytes(limit)}: it is not computed. ${remedy} a diagram of the same link drawn as a braid closure on fewer strands.`,
  );
}

/** `compute` run once; a failure (a limit hit) is remembered and thrown again, so a spent budget is not spent twice. */
export function once<T>(compute: () => T): () => T {
  let outcome: { ok: true; value: T } | { ok: false; error: unknown } | undefined;
  return () => {
    if (!outcome) {
      try {
        outcome = { ok: true, value: compute() };
      } catch (error) {
        outcome = { ok: false, error };
      }
    }
    if (!outcome.ok) throw outcome.error;
    return outcome.value;
  };
}

// The time budget: one deadline at a time (JavaScript runs one computation at a time per thread),
// checked by the long loops of the engines between steps.
let deadline = Infinity;
let running: { readonly task: string; readonly budgetMs: number } | undefined;
/** How many budgets ran out in this thread: the only limit whose outcome depends on the clock, not the input. */
let budgetsSpent = 0;

/**
 * How many time budgets have run out in this thread so far. A front end that remembers a whole run's outcome
 * keeps none during which this grew: such an outcome depends on the machine's speed, not only on the input.
 */
export function timeBudgetsSpent(): number {
  return budgetsSpent;
}

/**
 * Runs `compute` with a deadline `budgetMs` from now (none when undefined). Nested
 * calls keep the earlier deadline. `task` names the computation in the message
 * ("its Kauffman bracket").
 */
export function withTimeBudget<T>(budgetMs: number | undefined, task: string, compute: () => T): T {
  if (budgetMs === undefined || running !== undefined) return compute();
  deadline = performance.now() + budgetMs;
  running = { task, budgetMs };
  try {
    return compute();
  } finally {
    deadline = Infinity;
    running = undefined;
  }
}

/** Called by long computations between steps: throws a LimitError once the running budget is spent. */
export function checkTimeBudget(): void {
  if (deadline === Infinity || performance.now() <= deadline) return;
  const { task, budgetMs } = running!;
  budgetsSpent++;
  const seconds = budgetMs / 1000;
  throw limitError(
    `computing ${task} took longer than the time budget of ${seconds} s and was stopped; the rest of the document is still checked. ` +
      `To compute it anyway, raise the budget with ${LIMIT_OPTIONS.time} ${Math.max(60, Math.ceil(seconds * 10))} (seconds).`,
  );
}
