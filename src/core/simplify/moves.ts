/**
 * Reidemeister moves on the diagram model, each returning a new diagram of the
 * same link: removing a nugatory crossing (Reidemeister I is the case of a
 * kink), removing the two crossings of a bigon that one strand passes over
 * twice (Reidemeister II), and sliding a strand across the crossing opposite
 * to it in a triangle (Reidemeister III), which keeps the count but can make
 * the first two possible.
 */
import { assembleDiagram, type RawCrossing } from '../diagram/assemble.ts';
import { faceStructure } from '../diagram/faces.ts';
import { indexDiagram, isOverSlot, type LinkDiagram } from '../diagram/model.ts';

type Edges = [number, number, number, number];

/**
 * The diagram with these crossings deleted and both strands of each carried
 * straight through (slot k joined to slot k + 2). For a nugatory crossing this
 * is the diagram after turning one side over: the two sides are then joined
 * by two arcs, a connected sum of their closures, which is planar and the same
 * link. For the two crossings of an over–over bigon it is the diagram after
 * pulling the over strand off. Closed circles left without crossings become
 * free loops.
 */
export function deleteCrossings(d: LinkDiagram, doomed: ReadonlySet<number>): LinkDiagram {
  const parent = Array.from({ length: d.edgeCount }, (_, e) => e);
  const find = (e: number): number => {
    while (parent[e] !== e) e = parent[e] = parent[parent[e]!]!;
    return e;
  };
  const union = (a: number, b: number) => {
    const [ra, rb] = [find(a), find(b)];
    if (ra !== rb) parent[ra] = rb;
  };
  for (const k of doomed) {
    const e = d.crossings[k]!.edges;
    union(e[0], e[2]);
    union(e[1], e[3]);
  }
  const raw: RawCrossing[] = d.crossings.filter((_, i) => !doomed.has(i)).map((c) => ({ sign: c.sign, edges: c.edges.map(find) as Edges }));
  const used = new Set(raw.flatMap((c) => c.edges));
  const vanished = new Set<number>();
  for (let e = 0; e < d.edgeCount; e++) if (!used.has(find(e))) vanished.add(find(e));
  return assembleDiagram(raw, { notation: d.notation, freeLoops: d.freeLoops + vanished.size, chiralityFixed: d.chiralityFixed });
}

/** Pairs of crossings bounding a bigon face that one strand passes over at both ends (Reidemeister II). */
export function overBigons(d: LinkDiagram): [number, number][] {
  const { opposite } = indexDiagram(d);
  const found: [number, number][] = [];
  for (const face of faceStructure(d).faces) {
    if (face.length !== 2) continue;
    const [a, b] = [face[0]! >> 2, face[1]! >> 2];
    if (a === b) continue;
    const slot = face[0]! & 3;
    const across = opposite[4 * a + slot]!;
    if (isOverSlot(slot) === isOverSlot(across & 3)) found.push([a, b]);
  }
  return found;
}

/** A triangle face of three crossings where some strand passes over (or under) both of its crossings. */
export interface Triangle {
  /** Corner ids 4·crossing + slot of the face, in walking order. */
  readonly corners: readonly [number, number, number];
}

export function slidableTriangles(d: LinkDiagram): Triangle[] {
  const { opposite } = indexDiagram(d);
  const found: Triangle[] = [];
  for (const face of faceStructure(d).faces) {
    if (face.length !== 3) continue;
    const crossings = face.map((c) => c >> 2);
    if (new Set(crossings).size !== 3) continue;
    // The face leaves corner (c, q) through slot q along one side; that side's strand is over at c iff slot q is.
    let slidable = false;
    for (const corner of face) {
      const here = corner & 3;
      const there = opposite[corner]! & 3;
      if (isOverSlot(here) === isOverSlot(there)) slidable = true;
    }
    if (slidable) found.push({ corners: face as unknown as [number, number, number] });
  }
  return found;
}

/**
 * Reidemeister III across a triangle: every crossing stays where it is, but
 * each strand meets the triangle's two crossings in the opposite order. At
 * each crossing the slot that held a side of the triangle now holds the outer
 * edge that strand had at the side's other end, and the slot that held the
 * outer edge holds the new side.
 */
export function slideTriangle(d: LinkDiagram, triangle: Triangle): LinkDiagram {
  const { opposite } = indexDiagram(d);
  const edges = d.crossings.map((c) => [...c.edges] as Edges);
  let next = d.edgeCount;
  for (const corner of triangle.corners) {
    // Side from slot (corner) of crossing X to slot (far) of crossing Y.
    const far = opposite[corner]!;
    const [x, xs] = [corner >> 2, corner & 3];
    const [y, ys] = [far >> 2, far & 3];
    const outerAtX = d.crossings[x]!.edges[(xs + 2) & 3];
    const outerAtY = d.crossings[y]!.edges[(ys + 2) & 3];
    const side = next++;
    edges[x]![xs] = outerAtY;
    edges[y]![ys] = outerAtX;
    edges[x]![(xs + 2) & 3] = side;
    edges[y]![(ys + 2) & 3] = side;
  }
  return assembleDiagram(
    edges.map((e, i) => ({ edges: e, sign: d.crossings[i]!.sign })),
    { notation: d.notation, freeLoops: d.freeLoops, chiralityFixed: d.chiralityFixed },
  );
}
