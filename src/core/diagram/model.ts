/**
 * The one internal model of an oriented link diagram that every notation is
 * parsed into and every invariant is computed from.
 *
 * A crossing lists the four edge-ends that meet at it in counterclockwise
 * order, starting with the incoming under-edge (the PD convention of the
 * trade): slots 0 and 2 are the under strand (0 in, 2 out), slots 1 and 3 the
 * over strand. The over strand runs 3 → 1 at a positive crossing and 1 → 3 at a
 * negative one.
 *
 * Edges are numbered 0 … edgeCount−1; every edge occupies exactly two slots
 * (possibly at the same crossing, for a kink). Crossingless components carry no
 * edges and are counted in `freeLoops`.
 */

export type Sign = 1 | -1;

export type Notation = 'pd' | 'braid' | 'gauss' | 'dt' | 'family';

export interface Crossing {
  /** Edge ids at slots 0..3, counterclockwise from the incoming under-edge. */
  readonly edges: readonly [number, number, number, number];
  readonly sign: Sign;
}

export interface LinkDiagram {
  readonly notation: Notation;
  readonly crossings: readonly Crossing[];
  readonly edgeCount: number;
  /** Components that meet crossings: their edge ids in the order of travel. */
  readonly components: readonly (readonly number[])[];
  /** Crossingless components (unknotted circles disjoint from the rest of the projection). */
  readonly freeLoops: number;
  /**
   * False when the notation fixes the knot only up to mirror image (DT codes):
   * checks may then accept a value of the mirror image, with a warning.
   */
  readonly chiralityFixed: boolean;
  /**
   * The choices the code leaves open (DT codes): the code fixes each independent part of the curve only up
   * to reflection, so each part's chirality is open, and a part of one crossing is a kink whose sign is
   * open. Absent when the code fixes the diagram.
   */
  readonly openChoices?: OpenChoices;
}

/** An independent part of a code: crossings interlaced with each other but with no crossing of another part. */
export interface OpenPart {
  /** 0-based indices of its crossings in the diagram (for DT codes: its entries, counted from 0). */
  readonly crossings: readonly number[];
  /** One crossing interlaced with no other: a nugatory crossing, whose sign the code leaves open. */
  readonly kink: boolean;
}

export interface OpenChoices {
  readonly parts: readonly OpenPart[];
  /**
   * The diagram with the first crossing of each part given the sign listed (one per part), which fixes
   * the part's chirality; the result has every choice made (no `openChoices`, `chiralityFixed` true).
   */
  readonly realise: (partSigns: readonly Sign[]) => LinkDiagram;
}

/** A place on the diagram: slot `slot` (0..3) of crossing `crossing`. */
export interface SlotRef {
  readonly crossing: number;
  readonly slot: number;
}

/** Derived lookup tables, computed once per diagram. */
export interface DiagramIndex {
  /** For each edge, the slot where it ends (enters a crossing). */
  readonly head: readonly SlotRef[];
  /** For each edge, the slot where it starts (leaves a crossing). */
  readonly tail: readonly SlotRef[];
  /** For each edge, its component's index in `components`. */
  readonly componentOf: readonly number[];
  /** For each crossing slot (4·crossing + slot), the slot at the other end of its edge. */
  readonly opposite: Int32Array;
}

export function componentCount(d: LinkDiagram): number {
  return d.components.length + d.freeLoops;
}

export function writhe(d: LinkDiagram): number {
  return d.crossings.reduce((s, c) => s + c.sign, 0);
}

/** True when the edge at `slot` of a crossing with sign `sign` enters the crossing. */
export function slotIsIncoming(slot: number, sign: Sign): boolean {
  if (slot === 0) return true;
  if (slot === 2) return false;
  return sign === 1 ? slot === 3 : slot === 1;
}

export function isOverSlot(slot: number): boolean {
  return slot === 1 || slot === 3;
}

const indexCache = new WeakMap<LinkDiagram, DiagramIndex>();

export function indexDiagram(d: LinkDiagram): DiagramIndex {
  const cached = indexCache.get(d);
  if (cached) return cached;
  const head: SlotRef[] = new Array(d.edgeCount);
  const tail: SlotRef[] = new Array(d.edgeCount);
  const firstSlot = new Int32Array(d.edgeCount).fill(-1);
  const opposite = new Int32Array(4 * d.crossings.length).fill(-1);
  d.crossings.forEach((c, ci) => {
    c.edges.forEach((e, slot) => {
      const ref = { crossing: ci, slot };
      if (slotIsIncoming(slot, c.sign)) head[e] = ref;
      else tail[e] = ref;
      const here = 4 * ci + slot;
      if (firstSlot[e]! < 0) firstSlot[e] = here;
      else {
        opposite[here] = firstSlot[e]!;
        opposite[firstSlot[e]!] = here;
      }
    });
  });
  const componentOf = new Array<number>(d.edgeCount).fill(-1);
  d.components.forEach((edges, k) => edges.forEach((e) => (componentOf[e] = k)));
  const index = { head, tail, componentOf, opposite };
  indexCache.set(d, index);
  return index;
}

/**
 * Checks the structural invariants of the model (each edge in exactly two
 * slots, once entering and once leaving, components listing every edge once in
 * the order of travel). Returns a description of the first violation, or
 * undefined. Notation parsers report user errors themselves, in the user's
 * terms; this is the last line of defence used by constructors and tests.
 */
export function structuralProblem(d: LinkDiagram): string | undefined {
  const inCount = new Array<number>(d.edgeCount).fill(0);
  const outCount = new Array<number>(d.edgeCount).fill(0);
  for (const [ci, c] of d.crossings.entries()) {
    for (const [slot, e] of c.edges.entries()) {
      if (!Number.isInteger(e) || e < 0 || e >= d.edgeCount) return `crossing ${ci} slot ${slot}: edge ${e} out of range`;
      if (slotIsIncoming(slot, c.sign)) inCount[e]!++;
      else outCount[e]!++;
    }
  }
  for (let e = 0; e < d.edgeCount; e++) {
    if (inCount[e] !== 1 || outCount[e] !== 1) return `edge ${e} enters ${inCount[e]} and leaves ${outCount[e]} times`;
  }
  const seen = new Array<boolean>(d.edgeCount).fill(false);
  const index = indexDiagramUnchecked(d);
  for (const [k, edges] of d.components.entries()) {
    if (edges.length === 0) return `component ${k} is empty`;
    for (let i = 0; i < edges.length; i++) {
      const e = edges[i]!;
      if (seen[e]) return `edge ${e} listed twice in components`;
      seen[e] = true;
      const next = edges[(i + 1) % edges.length]!;
      const h = index.head[e]!;
      const t = index.tail[next]!;
      if (h.crossing !== t.crossing || (h.slot + 2) % 4 !== t.slot) {
        return `component ${k}: edge ${next} does not continue edge ${e} straight through a crossing`;
      }
    }
  }
  if (seen.some((s) => !s)) return 'some edge belongs to no component';
  return undefined;
}

function indexDiagramUnchecked(d: LinkDiagram): Pick<DiagramIndex, 'head' | 'tail'> {
  const head: SlotRef[] = new Array(d.edgeCount);
  const tail: SlotRef[] = new Array(d.edgeCount);
  d.crossings.forEach((c, ci) =>
    c.edges.forEach((e, slot) => {
      if (slotIsIncoming(slot, c.sign)) head[e] = { crossing: ci, slot };
      else tail[e] = { crossing: ci, slot };
    }),
  );
  return { head, tail };
}

/**
 * The mirror image: every crossing switched. Switching keeps the planar
 * projection and orientation, so the new incoming under-edge is the old
 * incoming over-edge and the cyclic order is kept.
 */
export function mirrorDiagram(d: LinkDiagram): LinkDiagram {
  return {
    ...d,
    crossings: d.crossings.map((c) => {
      const [a, b, cc, dd] = c.edges;
      // Old over strand: 3→1 when positive, 1→3 when negative. It becomes the under strand.
      const edges: [number, number, number, number] = c.sign === 1 ? [dd, a, b, cc] : [b, cc, dd, a];
      return { edges, sign: (c.sign === 1 ? -1 : 1) as Sign };
    }),
  };
}
