/**
 * Lends the modular bracket engine a second thread (core/invariants/
 * bracket-modular.ts, ReplayHelper): while this thread replays a long
 * diagram's contraction modulo half of the moduli, a worker replays the other
 * half. The engine runs synchronously, so the results come back through shared
 * memory and this thread waits on it with Atomics.wait.
 *
 * A helper that stops beating (no step done for STALL_MS: it died or ran out
 * of memory) is terminated and its share is replayed here, so a lost helper
 * costs time, never a value; the next long diagram starts a new one.
 */
import { Worker } from 'node:worker_threads';
import type { ContractionRecord } from '../core/invariants/bracket-modular.ts';
import { lendReplayHelper, type HelperShare, type ReplayHelper } from '../core/helper-threads.ts';
import { checkTimeBudget } from '../core/limits.ts';
import { DONE, HEARTBEAT, NEXT, STATUS, type ReplayRequest } from './replay-protocol.ts';

/** No step done by the helper for this long means it is gone (a step takes milliseconds). */
const STALL_MS = 20_000;
const WAIT_SLICE_MS = 250;

/**
 * The worker: dist/replay-worker.js in the compiled tool (this module is then bundled into dist/main.js or a
 * chunk in dist/chunks/). Run from the TypeScript sources (tests, SKEINPROOF_FROM_SOURCE), a worker does not
 * inherit tsx's loader, so a two-line script registers it first and then imports the source beside this module.
 */
function startWorker(): Worker {
  if (import.meta.url.endsWith('.ts')) {
    const tsx = import.meta.resolve('tsx/esm/api');
    const source = new URL('./replay-worker.ts', import.meta.url).href;
    return new Worker(`import(${JSON.stringify(tsx)}).then((tsx) => { tsx.register(); return import(${JSON.stringify(source)}); });`, { eval: true });
  }
  const here = new URL('.', import.meta.url);
  return new Worker(new URL(here.pathname.endsWith('/chunks/') ? '../replay-worker.js' : './replay-worker.js', here));
}

class ThreadHelper implements ReplayHelper {
  private worker: Worker | undefined;

  begin(record: ContractionRecord, moduli: readonly number[]): HelperShare {
    const worker = (this.worker ??= this.start());
    const results = new SharedArrayBuffer(4 * moduli.length * record.length);
    const status = new SharedArrayBuffer(4 * (DONE + moduli.length));
    const state = new Int32Array(status);
    worker.postMessage({ record, moduli, results, status } satisfies ReplayRequest);
    return {
      claim: () => {
        const k = Atomics.add(state, NEXT, 1);
        return k < moduli.length ? k : undefined;
      },
      wait: () => {
        let beat = Atomics.load(state, HEARTBEAT);
        let quietSince = performance.now();
        while (Atomics.load(state, STATUS) === 0) {
          Atomics.wait(state, STATUS, 0, WAIT_SLICE_MS);
          checkTimeBudget();
          const now = Atomics.load(state, HEARTBEAT);
          if (now !== beat) [beat, quietSince] = [now, performance.now()];
          else if (performance.now() - quietSince > STALL_MS) break;
        }
        if (Atomics.load(state, STATUS) !== 1) {
          this.stop();
          return undefined;
        }
        return moduli.map((_, k) => (Atomics.load(state, DONE + k) === 1 ? new Int32Array(results, 4 * k * record.length, record.length) : undefined));
      },
      abandon: () => this.stop(),
    };
  }

  private start(): Worker {
    const worker = startWorker();
    // An idle helper never keeps the process alive; an error ends it, and its share is redone here.
    worker.unref();
    worker.on('error', () => {
      if (this.worker === worker) this.stop();
    });
    return worker;
  }

  private stop(): void {
    void this.worker?.terminate();
    this.worker = undefined;
  }
}

/** A helper backed by one worker thread, started on first use. */
export function threadReplayHelper(): ReplayHelper {
  return new ThreadHelper();
}

/** With more than one thread allowed, lends the engine a helper thread; with one, takes it back. */
export function lendHelperThreads(jobs: number): void {
  lendReplayHelper(jobs >= 2 ? threadReplayHelper() : undefined);
}
