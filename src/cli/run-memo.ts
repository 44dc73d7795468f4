/**
 * Remembered runs: the outcome of checking or building one manuscript, kept in
 * the disk cache and replayed without parsing anything while nothing the run
 * depends on has changed.
 *
 * What a format's check or build returns (its diagnostics as data, the output
 * texts, the files read, whether it failed, the counts) is a function of
 *   - the tool: its version and a digest of all its sources and its package
 *     lock (./engine-version.ts, toolVersion), and the Node.js version with
 *     its ICU version;
 *   - the command kind (check or build), the manuscript path as given and the
 *     working directory it is resolved against;
 *   - the format options that shape the outcome (KEYED below: convention,
 *     strictness, output path, HTML page, raw HTML, limits);
 *   - the bytes of every file the format read, the absence of every file it
 *     looked for, and every real path it resolved (./read-log.ts);
 * except through the clock: a time budget that runs out. So the key is the
 * first four, the stored entry holds the read log beside the outcome, and a
 * replay first checks every logged file against the disk. A run is not
 * remembered when its read log is unsound, when a time budget ran out during
 * it, or when it reports a limit (a diagram refused over a limit, a worker
 * that died): those outcomes depend on the machine, not only on the input.
 * The report is rendered afresh from the replayed diagnostics (format and
 * colour of today's run), and the command writes the outputs as after a full
 * run. Stored values decode only from the exact shape written here, inside a
 * checksummed entry of the file store (./result-store.ts), so a damaged or
 * foreign entry means a full run, never a wrong outcome.
 */
import type { Diagnostic } from '../core/diagnostics/diagnostic.ts';
import { timeBudgetsSpent } from '../core/limits.ts';
import { storedJson, type ResultStore } from '../core/cache/store.ts';
import { toolVersion } from './engine-version.ts';
import type { FormatOptions, FormatResult, ManuscriptFormat, OutputFile } from './formats/types.ts';
import { ReadLog, stillAsRead, type ReadRecord } from './read-log.ts';

/** The stored quantity's name; the number is its format's version. */
const QUANTITY = 'run-memo 1';

export type RunKind = 'check' | 'build';

/**
 * Every format option, and whether it is part of the key. A new option fails to compile here until it is
 * placed: `key` when it can change the outcome, `how` when it only changes how the outcome is found.
 */
const KEYED: { readonly [K in keyof Required<FormatOptions>]: 'key' | 'how' } = {
  convention: 'key',
  strict: 'key',
  output: 'key',
  html: 'key',
  allowHtml: 'key',
  limits: 'key',
  resultStore: 'how',
  precompute: 'how',
  readLog: 'how',
};

/** What, besides the command and its options, a run's key holds (tests pass their own). */
export interface RunSetting {
  readonly tool: string;
  readonly node: string;
  readonly cwd: string;
}

/** This process's setting. The Node version names its ICU too: messages format numbers with `toLocaleString`. */
export const currentSetting = (): RunSetting => ({ tool: toolVersion(), node: `${process.version} icu ${process.versions.icu ?? 'none'}`, cwd: process.cwd() });

/** The store key of a run. */
export function runKey(kind: RunKind, path: string, options: FormatOptions, setting: RunSetting): string {
  const keyed = Object.fromEntries(Object.entries(KEYED).flatMap(([name, role]) => (role === 'key' && options[name as keyof FormatOptions] !== undefined ? [[name, options[name as keyof FormatOptions]]] : [])));
  return `${QUANTITY}\n${JSON.stringify({ ...setting, kind, path, options: keyed })}`;
}

/**
 * The format's check or build of `path`: replayed from the store when a remembered run's files are all as it
 * read them, else run (and remembered when its outcome depends on nothing but the key and the files read).
 */
export async function throughRunMemo(kind: RunKind, format: ManuscriptFormat, path: string, options: FormatOptions, setting?: RunSetting): Promise<FormatResult> {
  const store = options.resultStore;
  if (!store) return format[kind](path, options);
  const key = runKey(kind, path, options, setting ?? currentSetting());
  const stored = decodeRun(store.get(key));
  if (stored && stillAsRead(stored.reads)) return stored.result;
  const log = new ReadLog();
  const spent = timeBudgetsSpent();
  const result = await format[kind](path, { ...options, readLog: log });
  const reads = log.record();
  if (reads && timeBudgetsSpent() === spent && !result.diagnostics.some((d) => d.ruleId === 'limit-exceeded')) remember(store, key, reads, result);
  return result;
}

interface StoredRun {
  readonly reads: ReadRecord;
  readonly result: FormatResult;
}

function remember(store: ResultStore, key: string, reads: ReadRecord, result: FormatResult): void {
  const outputs = result.outputs.map((o) => ({
    path: o.path,
    ...(typeof o.content === 'string' ? { text: o.content } : { base64: Buffer.from(o.content).toString('base64') }),
    ...(o.ownMark !== undefined ? { ownMark: o.ownMark } : {}),
  }));
  const stored = { reads, diagnostics: result.diagnostics, outputs, inputs: result.inputs, failed: result.failed ?? null, counts: result.counts ?? null };
  // Only plain data survives a JSON round trip unchanged; anything else is not remembered.
  if (isPlainData(stored)) store.put(key, JSON.stringify(stored));
}

/** True for strings, finite numbers, booleans, null, and arrays and plain objects of them (undefined properties are dropped, as JSON drops them). */
function isPlainData(value: unknown): boolean {
  if (value === null || typeof value === 'string' || typeof value === 'boolean') return true;
  if (typeof value === 'number') return Number.isFinite(value);
  if (Array.isArray(value)) return value.every(isPlainData);
  if (typeof value !== 'object') return false;
  const prototype = Object.getPrototypeOf(value);
  if (prototype !== Object.prototype && prototype !== null) return false;
  return Object.values(value).every((v) => v === undefined || isPlainData(v));
}

const isObject = (x: unknown): x is Record<string, unknown> => typeof x === 'object' && x !== null && !Array.isArray(x);
const isStringRecord = (x: unknown): x is Record<string, string> => isObject(x) && Object.values(x).every((v) => typeof v === 'string');
const isStringList = (x: unknown): x is string[] => Array.isArray(x) && x.every((v) => typeof v === 'string');
const SEVERITIES = ['error', 'warning', 'note'];

/** A stored run, or undefined for anything but the exact shape `remember` writes. */
function decodeRun(text: string | undefined): StoredRun | undefined {
  const json = storedJson(text);
  if (!isObject(json)) return undefined;
  const { reads, diagnostics, outputs, inputs, failed, counts } = json;
  if (!isObject(reads) || !isStringRecord(reads['files']) || !isStringRecord(reads['realpaths'])) return undefined;
  if (!Array.isArray(diagnostics) || !diagnostics.every(isDiagnostic) || !isStringList(inputs)) return undefined;
  if (!(failed === null || typeof failed === 'boolean') || !(counts === null || (isObject(counts) && Object.values(counts).every(Number.isSafeInteger)))) return undefined;
  if (!Array.isArray(outputs)) return undefined;
  const files: OutputFile[] = [];
  for (const o of outputs) {
    if (!isObject(o) || typeof o['path'] !== 'string' || !(o['ownMark'] === undefined || typeof o['ownMark'] === 'string')) return undefined;
    const content = typeof o['text'] === 'string' ? o['text'] : typeof o['base64'] === 'string' ? new Uint8Array(Buffer.from(o['base64'], 'base64')) : undefined;
    if (content === undefined) return undefined;
    files.push({ path: o['path'], content, ...(typeof o['ownMark'] === 'string' ? { ownMark: o['ownMark'] } : {}) });
  }
  const result: FormatResult = {
    diagnostics: diagnostics as Diagnostic[],
    outputs: files,
    inputs,
    ...(failed !== null ? { failed } : {}),
    ...(counts !== null ? { counts: counts as unknown as FormatResult['counts'] & object } : {}),
  };
  return { reads: { files: reads['files'], realpaths: reads['realpaths'] }, result };
}

function isDiagnostic(x: unknown): boolean {
  return isObject(x) && SEVERITIES.includes(x['severity'] as string) && typeof x['ruleId'] === 'string' && typeof x['message'] === 'string';
}
