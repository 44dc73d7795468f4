/**
 * Computes a stream of tasks in this thread and a pool of worker threads and
 * hands the results back in task order, whatever order the workers finish in, so every output is
 * the same byte for byte for any pool size.
 *
 * A pool costs something before it pays: each worker loads the program (about
 * a tenth of a second) and every message is copied. So the first tasks are
 * computed in this thread, and the pool starts only once they have taken
 * longer than `inProcessMs` (small runs never start it); until a worker is
 * ready this thread keeps computing. Tasks then travel in chunks sized from the
 * measured cost of a task, so a message carries about CHUNK_MS of work.
 * At most a few chunks per worker are in flight, so memory stays constant
 * however long the input.
 *
 * A worker that dies (out of memory, a crash) is replaced; the tasks of its
 * chunk are sent again one per message, and a task that kills a worker on its
 * own is reported through `lost`: it costs one task, not the run.
 */
import { totalmem } from 'node:os';
import { Worker } from 'node:worker_threads';
import type { PoolJob } from './jobs.ts';

/** About this much work per message: large enough that copying costs little, small enough to share work evenly. */
const CHUNK_MS = 40;
const MAX_CHUNK = 512;
/** Chunks sent to a worker at a time (one computing, the others queued, so a worker never waits on this thread). */
const CHUNKS_PER_WORKER = 3;
/** By default a pool is started only for at least this much work left (when the total is known): less does not pay for the workers' start-up. */
const POOL_PAYS_MS = 1000;
/** Compute in this thread for this long before a pool is started (override: SKEINPROOF_POOL_AFTER_MS). */
const DEFAULT_IN_PROCESS_MS = 300;

export interface PoolSpec<T, R> {
  /** Threads computing, this one included (so jobs − 1 workers); 1 computes everything in this thread. */
  readonly jobs: number;
  /** What the workers compute (they run the same function as `runHere`). */
  readonly job: PoolJob;
  /** Computes one task in this thread. */
  readonly runHere: (task: T) => R;
  /** The result standing for a task whose worker died while computing it alone. */
  readonly lost: (task: T, reason: string) => R;
  /** The number of tasks, when known: a pool is then started only when the work left is worth it. */
  readonly total?: number;
  /** The least work left, estimated from the pace so far, for which a pool is started (default 1 s; needs `total`). */
  readonly poolPaysMs?: number;
  /** Time computed in this thread before a pool is started (default 300 ms; 0 starts it at once and sends every task to the workers). */
  readonly inProcessMs?: number;
}

/**
 * The default time in this thread before a pool starts; tests set SKEINPROOF_POOL_AFTER_MS=0, which sends
 * every task to the workers, to exercise the pool on small inputs.
 */
export function inProcessMsFromEnvironment(fallbackMs = DEFAULT_IN_PROCESS_MS): number {
  const given = Number(process.env['SKEINPROOF_POOL_AFTER_MS'] ?? Number.NaN);
  return Number.isFinite(given) && given >= 0 ? given : fallbackMs;
}

/**
 * Each worker's heap: an even share of the machine's memory (at least 512 MiB), so a runaway task kills
 * its worker, costing that task, before it exhausts the machine. SKEINPROOF_WORKER_HEAP_MIB sets it (tests
 * use a small heap to see a worker die).
 */
function workerHeapMiB(jobs: number): number {
  const given = Number(process.env['SKEINPROOF_WORKER_HEAP_MIB']);
  if (Number.isInteger(given) && given > 0) return given;
  return Math.max(512, Math.floor(totalmem() / (1024 * 1024) / jobs));
}

/**
 * The worker script: the TypeScript source beside this module under tsx, or dist/pool-worker.js in the
 * compiled tool (this module is then bundled into dist/main.js or a chunk in dist/chunks/).
 */
function workerUrl(): URL {
  if (import.meta.url.endsWith('.ts')) return new URL('./worker.ts', import.meta.url);
  const here = new URL('.', import.meta.url);
  return new URL(here.pathname.endsWith('/chunks/') ? '../pool-worker.js' : './pool-worker.js', here);
}

interface Chunk<T> {
  /** Sequence number of its first task; the others follow. */
  readonly first: number;
  readonly tasks: readonly T[];
}

/** Yields one result per task, in the order of `tasks`. */
export async function* computeInOrder<T, R>(tasks: AsyncIterable<T>, spec: PoolSpec<T, R>): AsyncGenerator<R> {
  const iterator = tasks[Symbol.asyncIterator]();
  const limitMs = spec.jobs <= 1 ? Infinity : (spec.inProcessMs ?? inProcessMsFromEnvironment());
  const started = performance.now();
  let computed = 0;
  // With a known total, the pool starts only when the work left, at the pace so far, is worth its start-up.
  const startedCpu = process.cpuUsage();
  // The pace is the smaller of wall and CPU time: on a busy machine wall time counts other people's work,
  // which would start a pool exactly when the machine has no core to spare for it.
  const spentMs = (): number => {
    const cpu = process.cpuUsage(startedCpu);
    return Math.min(performance.now() - started, (cpu.user + cpu.system) / 1000);
  };
  const leftMs = (): number => (spec.total === undefined ? Infinity : (spentMs() / Math.max(computed, 1)) * (spec.total - computed));
  while (performance.now() - started < limitMs || (computed === 0 && limitMs > 0) || (limitMs > 0 && leftMs() < (spec.poolPaysMs ?? POOL_PAYS_MS))) {
    const next = await iterator.next();
    if (next.done) return;
    yield spec.runHere(next.value);
    computed++;
  }
  const meanMs = computed > 0 ? (performance.now() - started) / computed : CHUNK_MS;
  const chunkSize = Math.max(1, Math.min(MAX_CHUNK, Math.floor(CHUNK_MS / Math.max(meanMs, 1e-3))));
  yield* pooled(iterator, spec, chunkSize, limitMs > 0);
}

/** `helpsHere`: this thread computes chunks too (always, except when tests send every task to the workers). */
async function* pooled<T, R>(iterator: AsyncIterator<T>, spec: PoolSpec<T, R>, chunkSize: number, helpsHere: boolean): AsyncGenerator<R> {
  const done = new Map<number, R>();
  /** The chunk each worker is computing or has queued, by its first sequence number. */
  const held = new Map<Worker, Map<number, Chunk<T>>>();
  const ready = new Set<Worker>();
  /** Chunks to send; retries (single tasks of a dead worker's chunk) go first. */
  const queue: Chunk<T>[] = [];
  // Set by every worker event; each pass of the loop below clears it first and reads the state afresh,
  // so an event that arrives while the loop is busy (not waiting) is never missed.
  let signalled = false;
  let wake: (() => void) | undefined;
  const notify = (): void => {
    signalled = true;
    wake?.();
    wake = undefined;
  };
  const nextEvent = (): Promise<void> => (signalled ? Promise.resolve() : new Promise((resolve) => (wake = resolve)));
  const resourceLimits = { maxOldGenerationSizeMb: workerHeapMiB(spec.jobs) };
  const start = (): void => {
    const worker = new Worker(workerUrl(), { workerData: spec.job, resourceLimits });
    held.set(worker, new Map());
    worker.on('message', (message: { ready: true } | { first: number; results: R[] }) => {
      if ('ready' in message) ready.add(worker);
      else {
        held.get(worker)?.delete(message.first);
        message.results.forEach((result, k) => done.set(message.first + k, result));
      }
      notify();
    });
    const fail = (reason: string): void => {
      const lost = held.get(worker);
      if (!lost) return;
      held.delete(worker);
      ready.delete(worker);
      // A worker computes its chunks in the order sent, so the first one held was being computed: alone, its
      // task is what killed the worker. Every other task is sent again, one per message.
      const [computing, ...waiting] = [...lost.values()];
      const retried = computing && computing.tasks.length === 1 ? waiting : [computing, ...waiting];
      if (computing && computing.tasks.length === 1) done.set(computing.first, spec.lost(computing.tasks[0]!, reason));
      queue.unshift(...retried.flatMap((chunk) => (chunk ? chunk.tasks.map((task, k) => ({ first: chunk.first + k, tasks: [task] })) : [])));
      start();
      notify();
    };
    worker.on('error', (error) => fail(error.message));
    worker.on('exit', (code) => fail(`exit code ${code}`));
  };
  for (let k = 1; k < spec.jobs; k++) start();

  // Room for every worker's chunks and as many again read ahead, for this thread and for the slowest chunk.
  const window = 2 * spec.jobs * CHUNKS_PER_WORKER * chunkSize;
  let nextSeq = 0;
  let nextOut = 0;
  let exhausted = false;
  const tick = (): Promise<void> => new Promise((resolve) => setImmediate(resolve));
  try {
    for (;;) {
      signalled = false;
      // Read ahead, in chunks, while the window has room.
      while (!exhausted && nextSeq - nextOut < window) {
        const chunk: T[] = [];
        const first = nextSeq;
        while (chunk.length < chunkSize) {
          const next = await iterator.next();
          if (next.done) {
            exhausted = true;
            break;
          }
          chunk.push(next.value);
          nextSeq++;
        }
        if (chunk.length > 0) queue.push({ first, tasks: chunk });
      }
      // Hand chunks to ready workers with room, the least loaded first.
      for (;;) {
        const worker = [...ready].sort((a, b) => held.get(a)!.size - held.get(b)!.size)[0];
        if (!worker || queue.length === 0 || held.get(worker)!.size >= CHUNKS_PER_WORKER) break;
        const chunk = queue.shift()!;
        held.get(worker)!.set(chunk.first, chunk);
        worker.postMessage(chunk);
      }
      // This thread is one of the `jobs`: it computes the next task whenever the workers have enough queued
      // (or none is ready yet), one task at a time, so a worker that finishes a chunk gets the next one at once.
      if (helpsHere && queue.length > 0) {
        const chunk = queue[0]!;
        done.set(chunk.first, spec.runHere(chunk.tasks[0]!));
        if (chunk.tasks.length === 1) queue.shift();
        else queue[0] = { first: chunk.first + 1, tasks: chunk.tasks.slice(1) };
        await tick(); // lets the workers' messages arrive
      }
      while (done.has(nextOut)) {
        const result = done.get(nextOut)!;
        done.delete(nextOut++);
        yield result;
      }
      if (exhausted && nextOut === nextSeq) return;
      // Wait for a worker unless there is more to read or compute here.
      const canRead = !exhausted && nextSeq - nextOut < window;
      if (!canRead && !done.has(nextOut) && (queue.length === 0 || !helpsHere)) await nextEvent();
    }
  } finally {
    const workers = [...held.keys()];
    held.clear();
    await Promise.all(workers.map((worker) => worker.terminate()));
  }
}
