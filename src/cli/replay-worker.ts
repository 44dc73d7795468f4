/**
 * The helper thread of ./replay-helper.ts: for each recording it is sent,
 * claims moduli from the shared counter (the other thread claims from it
 * too), writes each one's residues into the shared results and marks it
 * done, then sets the shared status (1 finished, 2 failed). It beats the
 * heart after every step, so the waiting thread can tell a slow helper from a
 * dead one.
 */
import { parentPort } from 'node:worker_threads';
import { replayModulo, slabsFor } from '../core/invariants/bracket-modular.ts';
import { DONE, HEARTBEAT, NEXT, STATUS, type ReplayRequest } from './replay-protocol.ts';

parentPort!.on('message', ({ record, moduli, results, status }: ReplayRequest) => {
  const state = new Int32Array(status);
  try {
    const slabs = slabsFor(record);
    for (let k = Atomics.add(state, NEXT, 1); k < moduli.length; k = Atomics.add(state, NEXT, 1)) {
      const residues = replayModulo(record, moduli[k]!, slabs, () => Atomics.add(state, HEARTBEAT, 1));
      new Int32Array(results, 4 * k * record.length, record.length).set(residues);
      Atomics.store(state, DONE + k, 1);
    }
    Atomics.store(state, STATUS, 1);
  } catch {
    Atomics.store(state, STATUS, 2);
  }
  Atomics.notify(state, STATUS);
});
