/**
 * One line of `skeinproof batch`: a JSON object {"id","notation","code"} (optional
 * "strands" and "keys") in, the `compute --json` object with the id first out, or
 * an error object for a line that cannot be read. No I/O but the disk cache's,
 * so a worker thread can run it as well as the command itself.
 */
import { DEFAULT_CONVENTION, type Convention } from '../core/convention/convention.ts';
import type { Notation } from '../core/diagram/model.ts';
import type { ComputeLimits } from '../core/limits.ts';
import { NOTATIONS } from '../core/notation/index.ts';
import { computeCode } from './commands/compute.ts';
import { computeJson, invalidCodeJson, JSON_FIELDS } from './compute-json.ts';
import { FileResultStore, type FileStoreOptions } from './result-store.ts';

export interface BatchOptions {
  readonly convention?: Convention;
  readonly limits?: ComputeLimits;
  /** The disk cache (plain data, so a worker thread can open it too); absent with --no-cache. */
  readonly cache?: FileStoreOptions;
}

const stores = new WeakMap<BatchOptions, FileResultStore>();

/** One store per options object: per worker thread, or for the whole run in this thread. */
function storeFor(options: BatchOptions): FileResultStore | undefined {
  if (!options.cache) return undefined;
  let store = stores.get(options);
  if (!store) stores.set(options, (store = new FileResultStore(options.cache)));
  return store;
}

export type BatchResult = Record<string, unknown> & { readonly ok: boolean };

function lineError(lineNumber: number, id: unknown, message: string): BatchResult {
  return {
    ...(typeof id === 'string' ? { id } : {}),
    line: lineNumber,
    error: { ruleId: 'batch-line-invalid', message, span: null, hints: ['Each line is one JSON object such as {"id": "k1", "notation": "braid", "code": "1 1 1"}.'] },
    ok: false,
  };
}

/** The output object for one input line (1-based `lineNumber`); `ok` is false for an error object and left out when printed. */
export function batchLine(text: string, lineNumber: number, options: BatchOptions = {}): BatchResult {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (error) {
    return lineError(lineNumber, undefined, `line ${lineNumber} is not JSON: ${(error as Error).message}`);
  }
  if (typeof value !== 'object' || value === null || Array.isArray(value)) return lineError(lineNumber, undefined, `line ${lineNumber} is not a JSON object`);
  const entry = value as Record<string, unknown>;
  const { id, code } = entry;
  const notation = typeof entry['notation'] === 'string' ? entry['notation'].toLowerCase() : entry['notation'];
  if (typeof id !== 'string' || id === '') return lineError(lineNumber, id, `line ${lineNumber} has no "id" string`);
  if (typeof code !== 'string') return lineError(lineNumber, id, `line ${lineNumber} (${id}) has no "code" string`);
  if (typeof notation !== 'string' || !(NOTATIONS as readonly string[]).includes(notation)) {
    return lineError(lineNumber, id, `line ${lineNumber} (${id}): "notation" must be one of ${NOTATIONS.join(', ')}`);
  }
  const strands = entry['strands'];
  if (strands !== undefined && !(Number.isInteger(strands) && (strands as number) >= 1)) return lineError(lineNumber, id, `line ${lineNumber} (${id}): "strands" must be a positive whole number`);
  let keys: ReadonlySet<string> | undefined;
  if (entry['keys'] !== undefined) {
    const list = Array.isArray(entry['keys']) ? entry['keys'].map(String) : String(entry['keys']).split(/[\s,]+/).filter(Boolean);
    const unknown = list.filter((key) => !JSON_FIELDS.includes(key));
    if (unknown.length > 0) return lineError(lineNumber, id, `line ${lineNumber} (${id}): unknown key ${unknown.join(', ')}; the keys are ${JSON_FIELDS.join(', ')}`);
    keys = new Set(list);
  }
  const store = storeFor(options);
  const outcome = computeCode(code, notation as Notation, strands !== undefined ? { strands: strands as number } : {}, options.limits ?? {}, false, store);
  if (!outcome.ok) return { id, ...invalidCodeJson(code, outcome.notation, outcome.error), ok: false };
  const json = computeJson(code, outcome.report, options.convention ?? DEFAULT_CONVENTION, keys);
  // Each line's values are on disk before its result is out, so an interrupted run loses none of them.
  store?.flush();
  return { id, ...json, ok: json['notComputed'] === undefined };
}

/** The line `batch` prints for a result. */
export function batchOutputLine(result: BatchResult): string {
  const { ok: _ok, ...printed } = result;
  return `${JSON.stringify(printed)}\n`;
}
