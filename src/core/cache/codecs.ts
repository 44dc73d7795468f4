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
import type { BoundReason, CrossingNumberBounds, TheoremId } from '../analyze/report.ts';
import { structuralProblem, type Crossing, type LinkDiagram, type Notation } from '../diagram/model.ts';
import type { MoveCounts } from '../simplify/simplify.ts';

export interface Codec<T> {
  /** The quantity and the version of its text form, e.g. `bracket/1`; part of every key. */
  readonly name: string;
  /**
   * True for a value that depends on how the diagram is numbered (its crossing order and edge labels) or on
   * its family marking, not only on the diagram: it is keyed by the diagram exactly as numbered, with its
   * notation and marking (./canonical.ts, labelledDiagramText).
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

const isBound = (x: unknown): x is BoundReason['bound'] => x === 'lower' || x === 'upper' || x === 'exact';

function reasonFromJson(json: unknown): BoundReason | undefined {
  if (typeof json !== 'object' || json === null) return undefined;
  const { bound, value, theorem, text, afterMoves } = json as Record<string, unknown>;
  if (!isBound(bound) || !isInteger(value) || typeof theorem !== 'string' || !/^[a-z-]+$/.test(theorem) || typeof text !== 'string') return undefined;
  if (afterMoves !== undefined && typeof afterMoves !== 'string') return undefined;
  return { bound, value, theorem: theorem as TheoremId, text, ...(afterMoves !== undefined ? { afterMoves } : {}) };
}

/** Crossing-number bounds with their reasons (keyed by the labelled diagram: the reasons read the family marking). */
export const crossingBoundsCodec = (name: string): Codec<CrossingNumberBounds> => ({
  labelled: true,
  ...jsonCodec<CrossingNumberBounds>(
    name,
    (b) => ({ lower: b.lower, upper: b.upper, exact: b.exact, reasons: b.reasons }),
    (json) => {
      if (typeof json !== 'object' || json === null) return undefined;
      const { lower, upper, exact, reasons } = json as Record<string, unknown>;
      if (!isInteger(lower) || !isInteger(upper) || lower > upper || !(exact === null || isInteger(exact)) || !Array.isArray(reasons)) return undefined;
      const read = reasons.map(reasonFromJson);
      if (read.some((r) => r === undefined)) return undefined;
      return { lower, upper, exact, reasons: read as BoundReason[] };
    },
  ),
});

const NOTATION_NAMES: readonly Notation[] = ['pd', 'braid', 'gauss', 'dt', 'family'];

function diagramToJson(d: LinkDiagram): unknown {
  return { notation: d.notation, crossings: d.crossings.map((c) => [c.sign, ...c.edges]), edgeCount: d.edgeCount, components: d.components, freeLoops: d.freeLoops, chiralityFixed: d.chiralityFixed };
}

/** A diagram, refused unless it passes the model's structural check. */
function diagramFromJson(json: unknown): LinkDiagram | undefined {
  if (typeof json !== 'object' || json === null) return undefined;
  const { notation, crossings, edgeCount, components, freeLoops, chiralityFixed } = json as Record<string, unknown>;
  if (!NOTATION_NAMES.includes(notation as Notation) || !isInteger(edgeCount) || !isInteger(freeLoops) || freeLoops < 0 || typeof chiralityFixed !== 'boolean') return undefined;
  if (!Array.isArray(crossings) || !crossings.every((c) => isIntegerList(c, 5) && (c[0] === 1 || c[0] === -1))) return undefined;
  if (!Array.isArray(components) || !components.every((k) => Array.isArray(k) && k.every(isInteger))) return undefined;
  const d: LinkDiagram = {
    notation: notation as Notation,
    crossings: (crossings as number[][]).map(([sign, ...edges]) => ({ sign, edges }) as unknown as Crossing),
    edgeCount,
    components: components as number[][],
    freeLoops,
    chiralityFixed,
  };
  return structuralProblem(d) === undefined ? d : undefined;
}

export interface StoredSimplification {
  readonly diagram: LinkDiagram;
  readonly moves: MoveCounts;
  readonly description: string;
}

const MOVE_NAMES = ['nugatory', 'bigons', 'slides', 'flypes'] as const;

/** The smaller diagram the simplifier reached, or null when it found none (keyed by the labelled diagram). */
export const simplificationCodec = (name: string): Codec<StoredSimplification | null> => ({
  labelled: true,
  ...jsonCodec<StoredSimplification | null>(
    name,
    (s) => s && { diagram: diagramToJson(s.diagram), moves: s.moves, description: s.description },
    (json) => {
      if (json === null) return null;
      if (typeof json !== 'object') return undefined;
      const { diagram, moves, description } = json as Record<string, unknown>;
      const d = diagramFromJson(diagram);
      if (!d || typeof description !== 'string' || typeof moves !== 'object' || moves === null) return undefined;
      const counts = moves as Record<string, unknown>;
      if (Object.keys(counts).length !== MOVE_NAMES.length || !MOVE_NAMES.every((m) => isInteger(counts[m]))) return undefined;
      return { diagram: d, moves: counts as unknown as MoveCounts, description };
    },
  ),
});
