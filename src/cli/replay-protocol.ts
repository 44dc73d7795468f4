/** What the main thread and the replay helper thread share (./replay-helper.ts, ./replay-worker.ts). */
import type { ContractionRecord } from '../core/invariants/bracket-modular.ts';

export interface ReplayRequest {
  readonly record: ContractionRecord;
  readonly moduli: readonly number[];
  /** moduli.length × record.length residues, modulus by modulus. */
  readonly results: SharedArrayBuffer;
  /** Int32 [status, heartbeat, next modulus to claim, then one done flag per modulus]. */
  readonly status: SharedArrayBuffer;
}

export const STATUS = 0;
export const HEARTBEAT = 1;
export const NEXT = 2;
export const DONE = 3;
