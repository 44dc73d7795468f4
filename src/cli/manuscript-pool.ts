/**
 * The diagrams of a manuscript computed before its session: in this thread and
 * a pool of workers (src/cli/pool), each diagram with its claims and fill-ins
 * (./diagram-values.ts). The values come back as the result store's text and
 * are served to the session from memory, so every message and output is the
 * same as a run in one thread.
 *
 * One `ManuscriptValues` lives as long as the command: `watch` keeps it from
 * save to save, so a diagram whose code, claims and fill-ins did not change
 * is not sent again, and its values are still in memory.
 */
import type { ResultStore } from '../core/cache/store.ts';
import { InputError } from '../core/errors.ts';
import type { LinkDiagram } from '../core/diagram/model.ts';
import type { PrecomputeHook, ReadDiagrams, SessionInput } from '../core/manuscript/api.ts';
import { diagramValues, type DiagramJob, type DiagramTask, type DiagramValues } from './diagram-values.ts';
import { computeInOrder, inProcessMsFromEnvironment } from './pool/ordered-pool.ts';
import type { ProgressDisplay } from './progress.ts';
import type { FileResultStore } from './result-store.ts';

type Outcome = DiagramValues | { readonly lost: string };

/**
 * The least work left (at the pace of the diagrams computed so far) for which a manuscript starts its
 * workers. A manuscript pays more for a pool than a batch does: the main thread reads every diagram a
 * worker computed again (its code, claims and fill-ins, to report them in place), its session and
 * output are serial, and each worker starts cold. Measured side by side on the 2-core machine, the
 * 200-diagram manuscript of bench/cache.ts (about 2 s of diagrams) lost with two threads on an idle
 * machine (0.85×), where a batch of 20 s gained 1.14× (two processes 1.23×): at that rate two threads save about
 * a sixth of the work, which pays for the workers' start-up and cold code only from several seconds of diagrams.
 * The estimate is rough (diagrams differ in cost), so the bar is set well above the census's 2–4 s.
 */
const MANUSCRIPT_POOL_PAYS_MS = 8000;
/**
 * The first diagrams run with cold code (several times the later pace), so a manuscript measures its pace
 * over a second, not the batch's 0.3 s: measured over 0.3 s on a loaded machine, the 200-diagram manuscript
 * looked like more than 5 s of work and started a pool it could not use.
 */
const MANUSCRIPT_IN_PROCESS_MS = 1000;

export interface ManuscriptValuesOptions {
  /** Threads computing, this one included. */
  readonly jobs: number;
  /** The disk cache (absent with --no-cache): read by the workers, written by this thread. */
  readonly disk?: FileResultStore;
  readonly progress?: () => ProgressDisplay | undefined;
}

export class ManuscriptValues {
  /** Every value computed or read so far, by the store's key. */
  private readonly memory = new Map<string, string>();
  /** The tasks already computed (by their text and the job's), which need not be sent again. */
  private readonly done = new Set<string>();
  /**
   * The diagrams the sessions read, so a code read before keeps its diagram and the values computed for it.
   * Two generations: what the last session read and what this one reads; a diagram the last session did
   * not read is let go, so a long `watch` does not keep every code an author ever wrote.
   */
  private lastRead = new Map<string, LinkDiagram>();

  /** Diagrams computed so far (by this thread or a worker), over all sessions. */
  computedDiagrams = 0;

  constructor(private readonly options: ManuscriptValuesOptions) {}

  /** The store a session reads: memory first, then the disk cache; what the session computes itself goes to both. */
  readonly store: ResultStore = {
    get: (key) => this.memory.get(key) ?? this.options.disk?.get(key),
    put: (key, text) => {
      this.memory.set(key, text);
      this.options.disk?.put(key, text);
    },
  };

  readonly precompute: PrecomputeHook = async (input) => {
    // Plain data only crosses to a worker (a warning callback stays here).
    const { warn: _warn, ...cache } = this.options.disk?.options ?? { dir: '', engine: '', maxBytes: 0 };
    const job: DiagramJob = {
      convention: input.convention,
      ...(input.limits ? { limits: input.limits } : {}),
      ...(this.options.disk ? { cache } : {}),
    };
    const jobText = JSON.stringify(job);
    const previous = this.lastRead;
    const current = new Map<string, LinkDiagram>();
    this.lastRead = current;
    const readBefore: ReadDiagrams = {
      get: (key) => {
        const diagram = current.get(key) ?? previous.get(key);
        if (diagram) current.set(key, diagram);
        return diagram;
      },
      set: (key, diagram) => void current.set(key, diagram),
    };
    const fresh = tasksOf(input).filter((task) => !this.done.has(fingerprint(task, jobText)));
    const uncomputed = new Map<string, InputError>();
    const progress = fresh.length > 0 ? this.options.progress?.() : undefined;
    progress?.start(fresh.length);
    let index = 0;
    try {
      const outcomes = computeInOrder<DiagramTask, Outcome>(asyncList(fresh), {
        jobs: this.options.jobs,
        total: fresh.length,
        poolPaysMs: MANUSCRIPT_POOL_PAYS_MS,
        inProcessMs: inProcessMsFromEnvironment(MANUSCRIPT_IN_PROCESS_MS),
        job: { kind: 'diagram-values', job },
        // In this thread the values go straight into the session's store, and the diagrams into its `readBefore`.
        runHere: (task) => {
          diagramValues(task, job, this.store, readBefore);
          return { computed: [], read: [] };
        },
        lost: (_task, reason) => ({ lost: reason }),
      });
      for await (const outcome of outcomes) {
        const task = fresh[index++]!;
        progress?.advance(task.id);
        if ('lost' in outcome) {
          uncomputed.set(task.id, workerLost(outcome.lost));
          continue;
        }
        for (const [key, text] of outcome.read) this.memory.set(key, text);
        for (const [key, text] of outcome.computed) this.store.put(key, text);
        this.done.add(fingerprint(task, jobText));
        this.computedDiagrams++;
      }
    } finally {
      progress?.stop();
    }
    return { resultStore: this.store, uncomputed, readBefore };
  };
}

async function* asyncList<T>(items: readonly T[]): AsyncGenerator<T> {
  yield* items;
}

/**
 * What decides which values a task computes: its code and the keys of its claims and fill-ins, not what a
 * claim states (an edited claim needs no new values; whatever else it needs, the session computes).
 */
function fingerprint(task: DiagramTask, jobText: string): string {
  const keys = { ...task, claims: task.claims.map((c) => [c.key, c.cell === true]) };
  return `${JSON.stringify(keys)}\n${jobText}`;
}

/** One task per diagram (the first of each id; a parametric family is left to the session), with its claims and fill-ins. */
function tasksOf(input: SessionInput): DiagramTask[] {
  const tasks = new Map<string, { -readonly [K in keyof DiagramTask]: DiagramTask[K] }>();
  for (const entry of input.diagrams) {
    if (tasks.has(entry.id) || entry.parameter) continue;
    tasks.set(entry.id, {
      id: entry.id,
      notation: entry.notation,
      code: entry.code,
      ...(entry.strands !== undefined ? { strands: entry.strands } : {}),
      ...(entry.partSigns ? { partSigns: entry.partSigns.text } : {}),
      claims: [],
      fills: [],
    });
  }
  for (const claim of input.claims) {
    const task = tasks.get(claim.target);
    if (task) task.claims = [...task.claims, { key: claim.key, text: claim.text, ...(claim.cell ? { cell: true } : {}) }];
  }
  for (const fill of input.fills) {
    const task = tasks.get(fill.target);
    if (task) task.fills = [...task.fills, { key: fill.key, ...(fill.cell ? { cell: true } : {}) }];
  }
  return [...tasks.values()];
}

/** A diagram whose worker died computing it alone, in the words of a limit (the session names the diagram): reported at its code, not computed again. */
function workerLost(reason: string): InputError {
  return new InputError(
    'limit-exceeded',
    `the worker thread computing it stopped (${reason}); each worker's heap is limited to an even share of the machine's memory, so this diagram was not computed. ` +
      'To compute it with the whole heap of the main thread, run with --jobs 1.',
  );
}
