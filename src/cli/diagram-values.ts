/**
 * One diagram of a manuscript computed on its own, where the pool sends it
 * (a worker thread, or this thread): the session is run on the diagram with
 * its claims and fill-ins, so exactly the values the manuscript needs are
 * computed, and the values the result store keeps (src/core/cache/stored.ts)
 * are handed back as text. The main thread's session then reads them from
 * memory instead of computing them. Messages of this run are dropped: the
 * main session reports everything, in document order, with real places.
 */
import type { Convention } from '../core/convention/convention.ts';
import type { ResultStore } from '../core/cache/store.ts';
import type { Notation } from '../core/diagram/model.ts';
import type { ReadDiagrams } from '../core/manuscript/api.ts';
import type { ClaimKey, FillKey } from '../core/claims/api.ts';
import type { ComputeLimits } from '../core/limits.ts';
import type { SourceLocation } from '../core/diagnostics/diagnostic.ts';
import { runSession } from '../core/manuscript/session.ts';
import { FileResultStore, type FileStoreOptions } from './result-store.ts';

export interface DiagramTask {
  readonly id: string;
  readonly notation: Notation;
  readonly code: string;
  readonly strands?: number;
  readonly partSigns?: string;
  readonly claims: readonly { readonly key: ClaimKey; readonly text: string; readonly cell?: boolean }[];
  readonly fills: readonly { readonly key: FillKey; readonly cell?: boolean }[];
}

export interface DiagramJob {
  readonly convention: Convention;
  readonly limits?: ComputeLimits;
  /** The disk cache to read from (its values are handed back too); absent with --no-cache. */
  readonly cache?: FileStoreOptions;
}

export interface DiagramValues {
  /** Values computed here: the main thread stores them on disk. */
  readonly computed: readonly (readonly [string, string])[];
  /** Values read from the disk cache. */
  readonly read: readonly (readonly [string, string])[];
}

const nowhere: SourceLocation = { file: '', start: { line: 1, column: 1 } };
const locate = () => nowhere;

/**
 * The stored values the manuscript needs of one diagram; none when it cannot be computed alone (the main
 * session then tells why). `store` is read first and receives every value computed; in this thread it is
 * the session's own store, and `readBefore` the session's, so the session then finds the very diagram and
 * report this computed, with nothing left to compute.
 */
export function diagramValues(task: DiagramTask, job: DiagramJob, store?: ResultStore, readBefore?: ReadDiagrams): DiagramValues {
  const computed = new Map<string, string>();
  const read = new Map<string, string>();
  const recorder: ResultStore = {
    get: (key) => {
      const text = store?.get(key);
      if (text !== undefined) read.set(key, text);
      return text;
    },
    put: (key, text) => {
      computed.set(key, text);
      store?.put(key, text);
    },
  };
  try {
    runSession({
      diagrams: [
        {
          id: task.id,
          notation: task.notation,
          code: task.code,
          ...(task.strands !== undefined ? { strands: task.strands } : {}),
          ...(task.partSigns !== undefined ? { partSigns: { text: task.partSigns, locate } } : {}),
          locateCode: locate,
          locateHeader: locate,
        },
      ],
      claims: task.claims.map((c) => ({ target: task.id, key: c.key, text: c.text, locate, ...(c.cell ? { cell: true } : {}) })),
      fills: task.fills.map((f) => ({ target: task.id, key: f.key, locate, ...(f.cell ? { cell: true } : {}) })),
      convention: job.convention,
      resultStore: recorder,
      ...(job.limits ? { limits: job.limits } : {}),
      ...(readBefore ? { readBefore } : {}),
    });
  } catch {
    // A bug: the main session computes this diagram again and reports it as an internal error there.
  }
  return { computed: [...computed], read: [...read] };
}

/** The task runner of a worker: opens the disk cache once (read only: the main thread writes). */
export function diagramValuesRunner(job: DiagramJob): (task: DiagramTask) => DiagramValues {
  const cache = job.cache ? new FileResultStore(job.cache) : undefined;
  const disk: ResultStore | undefined = cache ? { get: (key) => cache.get(key), put: () => undefined } : undefined;
  return (task) => diagramValues(task, job, disk);
}
