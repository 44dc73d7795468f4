/**
 * Where a front end lends the modular bracket engine (invariants/bracket-modular.ts) a
 * helper thread. Kept apart from the engine so that a front end can lend one
 * without loading the engine: a replayed run never computes.
 */
import type { ContractionRecord } from './invariants/bracket-modular.ts';

/**
 * Replays of a recording run in another thread at the same time as this
 * one's: a front end that may start threads lends one (the core starts none).
 * `begin` returns at once. Both threads then take the moduli one at a time,
 * whichever is free first: `claim` gives this thread the index of the next
 * modulus nobody has taken (undefined when all are taken). `wait` blocks until
 * the helper has finished and returns what it replayed (by index; missing
 * entries, or undefined if it failed, are replayed here). `abandon` is called
 * instead of `wait` when this thread gives up (a time budget ran out).
 */
export interface ReplayHelper {
  begin(record: ContractionRecord, moduli: readonly number[]): HelperShare;
}

export interface HelperShare {
  claim(): number | undefined;
  wait(): readonly (Int32Array | undefined)[] | undefined;
  abandon(): void;
}

let lent: ReplayHelper | undefined;

/** Lends the modular engine a helper for the rest of the process (undefined takes it back). */
export function lendReplayHelper(helper: ReplayHelper | undefined): void {
  lent = helper;
}

/** The helper lent, if any. */
export function lentReplayHelper(): ReplayHelper | undefined {
  return lent;
}
