/**
 * The ordered pool starts its workers only for enough estimated work
 * (src/cli/pool/ordered-pool.ts): the work left is estimated from the pace of
 * the tasks computed in this thread so far. A manuscript asks for more work
 * than a batch before it starts a pool (src/cli/manuscript-pool.ts).
 */
import { describe, expect, it, vi } from 'vitest';
import { computeInOrder } from '../../src/cli/pool/ordered-pool.ts';

/** Workers are counted, not started: a worker that never says it is ready leaves every task to this thread. */
const started = vi.hoisted(() => ({ workers: 0 }));
vi.mock('node:worker_threads', async (original) => ({
  ...(await original<typeof import('node:worker_threads')>()),
  Worker: class {
    constructor() {
      started.workers++;
    }
    on(): void {}
    postMessage(): void {}
    async terminate(): Promise<number> {
      return 0;
    }
  },
}));

/** A task that keeps this thread busy for `ms` (wall time, which is what the pool's estimate measures). */
function busy(ms: number): number {
  const end = performance.now() + ms;
  let spins = 0;
  while (performance.now() < end) spins++;
  return spins;
}

async function* numbers(n: number): AsyncGenerator<number> {
  for (let k = 0; k < n; k++) yield k;
}

describe('when the pool starts', () => {
  /** 200 tasks of 10 ms: after the first 300 ms about 1.7 s are left, over the default 1 s but under 5 s. */
  async function run(poolPaysMs?: number): Promise<{ results: number[]; here: number; workers: number }> {
    started.workers = 0;
    let here = 0;
    const results: number[] = [];
    const outcomes = computeInOrder(numbers(200), {
      jobs: 2,
      total: 200,
      ...(poolPaysMs !== undefined ? { poolPaysMs } : {}),
      inProcessMs: 300,
      job: { kind: 'batch-line', options: { convention: {} } as never },
      runHere: (task) => {
        here++;
        busy(10);
        return task;
      },
      lost: () => -1,
    });
    for await (const r of outcomes) results.push(r);
    return { results, here, workers: started.workers };
  }

  it('starts no worker when the estimated work left is under poolPaysMs, and one with the default of 1 s', async () => {
    const all = Array.from({ length: 200 }, (_, k) => k);
    expect(await run(5000)).toEqual({ results: all, here: 200, workers: 0 });
    const pooled = await run();
    expect(pooled.results).toEqual(all);
    expect(pooled.workers).toBe(1);
  });
});
