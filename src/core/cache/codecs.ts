/**
 * Faithful text forms of the values the result store keeps, one codec per
 * stored quantity. Exponents are JSON numbers (quarter-integers are exact in
 * binary), coefficients decimal strings (BigInt, any size). `decode` checks
 * the shape and returns undefined for anything else, so a damaged or foreign
 * text is recomputed, never trusted. A codec's name carries its format version:
 * change the format, change the name.
 */
import { Laurent } from '../poly/laurent.ts';
import { Laurent2 } from '../poly/laurent2.ts';
import type { KhovanovHomology, KhovanovReport, RankEntry, TorsionEntry } from '../invariants/khovanov/index.ts';

export interface Codec<T> {
  /** The quantity and the version of its text form, e.g. `bracket/1`; part of every key. */
  readonly name: string;
  /**
   * True for a value that depends on how the diagram is numbered (its crossing order and edge labels), not
   * only on the diagram: it is keyed by the diagram exactly as numbered (./canonical.ts, labelledDiagramText).
   */
  readonly labelled?: boolean;
  /** The value as text, or undefined when this value is not to be stored. */
  encode(value: T): string | undefined;
  /** The value, or undefined when `text` is not a text this codec writes. */
  decode(text: string): T | undefined;
}

/** A codec from a JSON form: `fromJson` returns undefined for any shape it does not write. */
function jsonCodec<T>(name: string, toJson: (value: T) => unknown, fromJson: (json: unknown) => T | undefined): Codec<T> {
  return {
    name,
    encode: (value) => JSON.stringify(toJson(value)),
    decode: (text) => {
      let json: unknown;
      try {
        json = JSON.parse(text);
      } catch {
        return undefined;
      }
      return fromJson(json);
    },
  };
}

const isInteger = (x: unknown): x is number => typeof x === 'number' && Number.isSafeInteger(x);
const isDecimal = (x: unknown): x is string => typeof x === 'string' && /^-?(0|[1-9][0-9]*)$/.test(x);
const isIntegerList = (x: unknown, length: number): x is number[] => Array.isArray(x) && x.length === length && x.every(isInteger);

function laurentToJson(p: Laurent): unknown {
  return p.terms().map(([e, c]) => [e, c.toString()]);
}

function laurentFromJson(json: unknown): Laurent | undefined {
  if (!Array.isArray(json)) return undefined;
  const terms: [number, bigint][] = [];
  for (const term of json) {
    if (!Array.isArray(term) || term.length !== 2) return undefined;
    const [e, c] = term as unknown[];
    if (typeof e !== 'number' || !Number.isFinite(e) || !Number.isInteger(4 * e) || !isDecimal(c) || c === '0') return undefined;
    if (terms.length > 0 && terms[terms.length - 1]![0] >= e) return undefined;
    terms.push([e, BigInt(c)]);
  }
  return Laurent.fromTerms(terms);
}

export const laurentCodec = (name: string): Codec<Laurent> => jsonCodec(name, laurentToJson, laurentFromJson);

export const laurent2Codec = (name: string): Codec<Laurent2> =>
  jsonCodec(
    name,
    (p) => p.terms().map(([x, y, c]) => [x, y, c.toString()]),
    (json) => {
      if (!Array.isArray(json)) return undefined;
      const terms: [number, number, bigint][] = [];
      const seen = new Set<string>();
      for (const term of json) {
        if (!Array.isArray(term) || term.length !== 3) return undefined;
        const [x, y, c] = term as unknown[];
        if (!isInteger(x) || !isInteger(y) || !isDecimal(c) || c === '0' || seen.has(`${x},${y}`)) return undefined;
        seen.add(`${x},${y}`);
        terms.push([x, y, BigInt(c)]);
      }
      return Laurent2.fromTerms(terms);
    },
  );

export const bigintCodec = (name: string): Codec<bigint> =>
  jsonCodec(
    name,
    (n) => n.toString(),
    (json) => (isDecimal(json) ? BigInt(json) : undefined),
  );

export const integerCodec = (name: string, labelled = false): Codec<number> => ({
  ...jsonCodec(name, (n: number) => n, (json) => (isInteger(json) ? json : undefined)),
  ...(labelled ? { labelled } : {}),
});

function homologyToJson(h: KhovanovHomology): unknown {
  return { ranks: h.ranks, torsion: h.torsion };
}

function homologyFromJson(json: unknown): KhovanovHomology | undefined {
  if (typeof json !== 'object' || json === null) return undefined;
  const { ranks, torsion } = json as Record<string, unknown>;
  if (!Array.isArray(ranks) || !ranks.every((r) => isIntegerList(r, 3))) return undefined;
  if (!Array.isArray(torsion) || !torsion.every((t) => isIntegerList(t, 4))) return undefined;
  return { ranks: ranks as unknown as RankEntry[], torsion: torsion as unknown as TorsionEntry[] };
}

/** Khovanov homology with its reduced homology, width, thinness and s, as `khovanovReport` gives them. */
export const khovanovCodec = (name: string): Codec<KhovanovReport> =>
  jsonCodec(
    name,
    (k) => ({ homology: homologyToJson(k.homology), reduced: k.reduced && homologyToJson(k.reduced), width: k.width, thin: k.thin, rasmussen: k.rasmussen }),
    (json) => {
      if (typeof json !== 'object' || json === null) return undefined;
      const fields = json as Record<string, unknown>;
      const homology = homologyFromJson(fields['homology']);
      const reduced = fields['reduced'] === null ? null : homologyFromJson(fields['reduced']);
      const { width, thin, rasmussen } = fields;
      if (!homology || reduced === undefined || !isInteger(width) || typeof thin !== 'boolean' || !(rasmussen === null || isInteger(rasmussen))) return undefined;
      return { homology, reduced, width, thin, rasmussen };
    },
  );
