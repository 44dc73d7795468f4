/**
 * Diagram surgery: the local and global moves that skein relations and
 * product formulas talk about. Every result is a fresh, structurally valid
 * LinkDiagram (rebuilt through assembleDiagram, so edges are renumbered in
 * order of travel); the mirror image is `mirrorDiagram` in model.ts.
 */
import { assembleDiagram, type RawCrossing } from './assemble.ts';
import { connectedPieces } from './faces.ts';
import { indexDiagram, type Crossing, type LinkDiagram, type Sign } from './model.ts';

/** Slot pairs joined by the oriented smoothing: incoming to the adjacent outgoing slot. */
const ORIENTED_SMOOTHING: Record<Sign, readonly [readonly [number, number], readonly [number, number]]> = {
  // Positive: in at 0 and 3, out at 1 and 2.
  1: [
    [0, 1],
    [3, 2],
  ],
  // Negative: in at 0 and 1, out at 3 and 2.
  [-1]: [
    [0, 3],
    [1, 2],
  ],
};

function checkCrossingIndex(d: LinkDiagram, k: number): void {
  if (!Number.isInteger(k) || k < 0 || k >= d.crossings.length) {
    throw new RangeError(`crossing ${k} does not exist: the diagram has ${d.crossings.length} crossings`);
  }
}

/** Crossing `c` with its over and under strands exchanged (same projection, same orientation). */
export function switchedCrossing(c: Crossing): Crossing {
  const [a, b, cc, dd] = c.edges;
  // The old over strand becomes the under strand; its incoming end becomes slot 0.
  const edges: [number, number, number, number] = c.sign === 1 ? [dd, a, b, cc] : [b, cc, dd, a];
  return { edges, sign: c.sign === 1 ? -1 : 1 };
}

/** The diagram with crossing `k` switched (L₊ ↔ L₋ in a skein triple). */
export function switchCrossing(d: LinkDiagram, k: number): LinkDiagram {
  checkCrossingIndex(d, k);
  return { ...d, crossings: d.crossings.map((c, i) => (i === k ? switchedCrossing(c) : c)) };
}

/**
 * The diagram with crossing `k` replaced by its oriented smoothing (L₀ in a
 * skein triple). Arcs that lose their only crossing become free loops.
 */
export function smoothCrossing(d: LinkDiagram, k: number): LinkDiagram {
  checkCrossingIndex(d, k);
  const crossing = d.crossings[k]!;
  // Union–find on edge ids: each smoothing arc fuses the edge entering with the edge leaving.
  const parent = Array.from({ length: d.edgeCount }, (_, e) => e);
  const find = (e: number): number => {
    while (parent[e] !== e) e = parent[e] = parent[parent[e]!]!;
    return e;
  };
  for (const [p, q] of ORIENTED_SMOOTHING[crossing.sign]) {
    const a = find(crossing.edges[p]!);
    const b = find(crossing.edges[q]!);
    if (a !== b) parent[b] = a;
  }
  const raw: RawCrossing[] = d.crossings
    .filter((_, i) => i !== k)
    .map((c) => ({ sign: c.sign, edges: c.edges.map(find) as unknown as RawCrossing['edges'] }));
  const stillUsed = new Set(raw.flatMap((c) => c.edges));
  const closedOff = new Set(crossing.edges.map(find).filter((e) => !stillUsed.has(e)));
  return assembleDiagram(raw, {
    notation: d.notation,
    freeLoops: d.freeLoops + closedOff.size,
    chiralityFixed: d.chiralityFixed,
  });
}

/** Side by side: the split union of two diagrams. */
export function disjointUnion(d1: LinkDiagram, d2: LinkDiagram): LinkDiagram {
  const raw: RawCrossing[] = [
    ...d1.crossings,
    ...d2.crossings.map((c) => ({ sign: c.sign, edges: c.edges.map((e) => e + d1.edgeCount) as unknown as RawCrossing['edges'] })),
  ];
  return assembleDiagram(raw, {
    notation: d1.notation,
    freeLoops: d1.freeLoops + d2.freeLoops,
    chiralityFixed: d1.chiralityFixed && d2.chiralityFixed,
  });
}

/** The diagram with `count` crossingless unknotted circles added beside it. */
export function withFreeLoops(d: LinkDiagram, count = 1): LinkDiagram {
  if (!Number.isInteger(count) || count < 0) throw new RangeError(`free loop count ${count} must be a natural number`);
  return { ...d, freeLoops: d.freeLoops + count };
}

/**
 * The connected sum along edge `edge1` of `d1` and edge `edge2` of `d2`: both
 * edges are cut and reconnected crosswise, respecting orientation (edge1 now
 * runs into d2, edge2 back into d1). This stays planar: the two faces beside
 * each cut edge merge pairwise. A crossingless operand is an unknot, so the
 * sum is the other diagram with one circle fewer.
 */
export function connectedSum(d1: LinkDiagram, d2: LinkDiagram, edge1 = 0, edge2 = 0): LinkDiagram {
  if (d2.crossings.length === 0 || d1.crossings.length === 0) {
    const [withCrossings, loopsOnly] = d1.crossings.length === 0 ? [d2, d1] : [d1, d2];
    if (loopsOnly.freeLoops === 0) throw new RangeError('connected sum with the empty diagram is undefined');
    return {
      ...withCrossings,
      freeLoops: withCrossings.freeLoops + loopsOnly.freeLoops - 1,
      chiralityFixed: d1.chiralityFixed && d2.chiralityFixed,
    };
  }
  for (const [d, e, name] of [[d1, edge1, 'first'], [d2, edge2, 'second']] as const) {
    if (!Number.isInteger(e) || e < 0 || e >= d.edgeCount) throw new RangeError(`edge ${e} does not exist in the ${name} diagram`);
  }
  const shift = d1.edgeCount;
  const raw: [number, number, number, number][] = [
    ...d1.crossings.map((c) => [...c.edges] as [number, number, number, number]),
    ...d2.crossings.map((c) => c.edges.map((e) => e + shift) as [number, number, number, number]),
  ];
  const head1 = indexDiagram(d1).head[edge1]!;
  const head2 = indexDiagram(d2).head[edge2]!;
  // edge1 now ends where edge2 ended, and edge2 where edge1 ended.
  raw[head1.crossing]![head1.slot] = edge2 + shift;
  raw[d1.crossings.length + head2.crossing]![head2.slot] = edge1;
  const signs = [...d1.crossings, ...d2.crossings].map((c) => c.sign);
  return assembleDiagram(
    raw.map((edges, i) => ({ edges, sign: signs[i]! })),
    { notation: d1.notation, freeLoops: d1.freeLoops + d2.freeLoops, chiralityFixed: d1.chiralityFixed && d2.chiralityFixed },
  );
}

/**
 * A Reidemeister I curl inserted on edge `edge`: the strand crosses itself once
 * around a small loop. `sign` is the sign of the new crossing, `underFirst`
 * whether the strand passes under on its first visit. ⟨D⟩ changes by the
 * factor −A^(3·sign); the link type does not change.
 */
export function addCurl(d: LinkDiagram, edge: number, sign: Sign, underFirst: boolean): LinkDiagram {
  if (!Number.isInteger(edge) || edge < 0 || edge >= d.edgeCount) {
    throw new RangeError(`edge ${edge} does not exist: the diagram has ${d.edgeCount} edges`);
  }
  const raw = d.crossings.map((c) => [...c.edges] as [number, number, number, number]);
  const head = indexDiagram(d).head[edge]!;
  const loop = d.edgeCount;
  const onward = d.edgeCount + 1;
  raw[head.crossing]![head.slot] = onward;
  // Slots counterclockwise from the incoming under-edge; the loop always joins two adjacent slots.
  const curl: [number, number, number, number] = underFirst
    ? sign === 1
      ? [edge, onward, loop, loop]
      : [edge, loop, loop, onward]
    : sign === 1
      ? [loop, loop, onward, edge]
      : [loop, edge, onward, loop];
  const signs = [...d.crossings.map((c) => c.sign), sign];
  return assembleDiagram(
    [...raw, curl].map((edges, i) => ({ edges, sign: signs[i]! })),
    { notation: d.notation, freeLoops: d.freeLoops, chiralityFixed: d.chiralityFixed },
  );
}

/**
 * The connected pieces of the projection as diagrams of their own, one per
 * piece with crossings; crossingless circles are left out (the caller knows
 * them as `freeLoops`). The link of the whole diagram is the split union of the
 * links of its pieces.
 */
export function splitPieces(d: LinkDiagram): LinkDiagram[] {
  const { pieceOfCrossing, pieceCount } = connectedPieces(d);
  const raw: RawCrossing[][] = Array.from({ length: pieceCount }, () => []);
  d.crossings.forEach((c, i) => raw[pieceOfCrossing[i]!]!.push(c));
  return raw.map((crossings) => assembleDiagram(crossings, { notation: d.notation, chiralityFixed: d.chiralityFixed }));
}
