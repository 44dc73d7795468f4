/**
 * Remembering computed values between runs. The core only defines the
 * interface: a front end that keeps values on disk implements it (the command
 * line's file store, src/cli/result-store.ts). Values pass as text; the core
 * writes and reads that text itself (./codecs.ts), so a store never needs to
 * know what a value is.
 *
 * A key names the value (the codec's name, which carries its format version)
 * and the diagram up to relabelling (./canonical.ts). Only values that are a
 * pure function of that diagram are stored: never anything that depends on a
 * convention, on the notation the diagram was written in, on a family marking,
 * or on a limit. A stored value is served even where the current limits would
 * refuse to compute it: it is exact either way.
 */
import type { LinkDiagram } from '../diagram/model.ts';
import { canonicalDiagramText, labelledDiagramText } from './canonical.ts';
import type { Codec } from './codecs.ts';

/**
 * A key is the quantity (the codec's name, which has no line break), a line break, and the diagram's key
 * text (./canonical.ts): a store may keep all quantities of one diagram together (`splitResultKey`).
 */
export interface ResultStore {
  /** The text stored under `key`, or undefined when there is none or it cannot be trusted. */
  get(key: string): string | undefined;
  /** Stores `text` under `key`, replacing what was there; a failure to store is the store's own business. */
  put(key: string, text: string): void;
}

/** The key of `codec`'s value for the diagram `d` (the engine's version is the store's part of the key). */
export function resultKey(codec: Codec<unknown>, d: LinkDiagram): string {
  return `${codec.name}\n${codec.labelled ? labelledDiagramText(d) : canonicalDiagramText(d)}`;
}

/** A key's quantity and diagram parts. */
export function splitResultKey(key: string): { readonly quantity: string; readonly diagram: string } {
  const newline = key.indexOf('\n');
  return newline < 0 ? { quantity: key, diagram: '' } : { quantity: key.slice(0, newline), diagram: key.slice(newline + 1) };
}

/**
 * The stored value, or `compute()` stored for next time. A text that does not decode is ignored and
 * overwritten: a stored value is never trusted beyond what its codec can check. Nothing is stored when
 * `compute` throws (a limit, a refusal), or when the codec declines the value.
 */
export function throughStore<T>(store: ResultStore | undefined, codec: Codec<T>, d: LinkDiagram, compute: () => T): T {
  if (!store) return compute();
  const key = resultKey(codec as Codec<unknown>, d);
  const text = store.get(key);
  if (text !== undefined) {
    const value = codec.decode(text);
    if (value !== undefined) return value;
  }
  const value = compute();
  const encoded = codec.encode(value);
  if (encoded !== undefined) store.put(key, encoded);
  return value;
}

/** A stored text read as JSON: undefined when there is none or it is not JSON (a damaged or foreign text is never trusted). */
export function storedJson(text: string | undefined): unknown {
  if (text === undefined) return undefined;
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}

const reportStores = new WeakMap<object, ResultStore>();

/** Lets quantities computed later from `report` (registered invariants) use `store`. */
export function attachStore(report: object, store: ResultStore): void {
  reportStores.set(report, store);
}

/** The store the report's diagram was analysed with, if any. */
export function storeOf(report: object): ResultStore | undefined {
  return reportStores.get(report);
}
