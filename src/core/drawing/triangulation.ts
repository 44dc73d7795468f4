/**
 * The triangulated sphere that a diagram's planar map is circle-packed on.
 *
 * Vertices, per connected piece of the projection: one per crossing (X), one
 * per edge end (S, beside the crossing on that edge), one per edge midpoint (P),
 * one per corner (K, between two consecutive edge ends of a crossing) and one
 * per face (F). Around a crossing the triangles are X·S·K. Inside a face the
 * polygon K, S, P, S, K, … that runs once round it is filled with concentric
 * rings, each six vertices shorter than the one outside it (as in a hexagonal
 * lattice), and F in the middle: a big face then packs as a patch of circles
 * of the common size instead of one huge circle, which would squeeze the
 * crossings along it. The outer face gets rings that grow away from the
 * diagram instead, and its F (removed for the packing) outside them all.
 *
 * Every crossing end and every corner has a vertex of its own, so the result
 * is a simplicial triangulation even for curls (an edge from a crossing to
 * itself) and for crossings that touch one face twice: no two triangles share
 * more than one edge, which circle packing needs.
 */
import { indexDiagram, type LinkDiagram } from '../diagram/model.ts';
import { faceStructure } from '../diagram/faces.ts';

export interface PackingComplex {
  /** Vertex count: 11n + faces for n crossings, and the rings filling the faces. */
  readonly vertexCount: number;
  /** For each face, the ring vertices filling it (none for an outer face). */
  readonly fill: readonly (readonly number[])[];
  /** For each vertex, its neighbours counterclockwise (a closed cycle). */
  readonly flowers: readonly Int32Array[];
}

export const crossingVertex = (c: number): number => c;
export const endVertex = (n: number, slot: number): number => n + slot;
export const midpointVertex = (n: number, edge: number): number => 5 * n + edge;
export const cornerVertex = (n: number, corner: number): number => 7 * n + corner;
export const faceVertex = (n: number, face: number): number => 11 * n + face;

/** The corner that follows corner (c, q) on its face: leave through slot q, arrive at the other end. */
export function nextCornerOfFace(opposite: Int32Array, corner: number): number {
  const arrive = opposite[corner]!;
  return 4 * (arrive >> 2) + (((arrive & 3) + 3) & 3);
}

export function packingComplex(d: LinkDiagram, outerFaces: ReadonlySet<number>): PackingComplex {
  const n = d.crossings.length;
  const { opposite } = indexDiagram(d);
  const { faces, faceCount } = faceStructure(d);
  let vertexCount = 11 * n + faceCount;
  // successor[v] maps a neighbour b to the neighbour after it counterclockwise.
  const successor: Map<number, number>[] = [];
  const around = (v: number): Map<number, number> => (successor[v] ??= new Map());
  const triangle = (a: number, b: number, c: number): void => {
    around(a).set(b, c);
    around(b).set(c, a);
    around(c).set(a, b);
  };
  const fill: number[][] = [];
  for (let c = 0; c < n; c++) {
    for (let q = 0; q < 4; q++) {
      const k = cornerVertex(n, 4 * c + q);
      triangle(crossingVertex(c), endVertex(n, 4 * c + q), k);
      triangle(crossingVertex(c), k, endVertex(n, 4 * c + ((q + 1) & 3)));
    }
  }
  faces.forEach((corners, f) => {
    // The face's boundary, counterclockwise (the face is on the left of each leg).
    let ring = corners.flatMap((corner) => {
      const arrive = opposite[corner]!;
      const edge = d.crossings[corner >> 2]!.edges[corner & 3]!;
      return [cornerVertex(n, corner), endVertex(n, corner), midpointVertex(n, edge), endVertex(n, arrive)];
    });
    const added: number[] = [];
    const addRing = (size: number): void => {
      const inner = Array.from({ length: size }, () => vertexCount++);
      zipRings(ring, inner, triangle);
      added.push(...inner);
      ring = inner;
    };
    if (outerFaces.has(f)) {
      // Seen from the diagram the outer face is the plane around it: rings that grow outwards, as around a hole in a lattice.
      for (let k = 0; k < OUTER_RINGS; k++) addRing(ring.length + RING_STEP);
    } else {
      for (let k = 0; k < MAX_FILL_RINGS && ring.length - RING_STEP >= 3; k++) addRing(ring.length - RING_STEP);
    }
    fill.push(added);
    const centre = faceVertex(n, f);
    ring.forEach((v, i) => triangle(centre, v, ring[(i + 1) % ring.length]!));
  });
  const flowers = Array.from({ length: vertexCount }, (_, v) => {
    const next = successor[v];
    if (!next || next.size === 0) return new Int32Array(0);
    // Start from the smallest neighbour so the order does not depend on insertion order.
    const start = Math.min(...next.keys());
    const cycle = [start];
    for (let v = next.get(start)!; v !== start; v = next.get(v)!) cycle.push(v);
    return Int32Array.from(cycle);
  });
  return { vertexCount, flowers, fill };
}

/** A ring inside another has this many fewer vertices, as the rings of a hexagonal lattice do. */
const RING_STEP = 12;
/** Rings around the outside of each piece: a margin of circles so the diagram's own circles do not touch the boundary. */
const OUTER_RINGS = 0;
/** At most this many rings fill a face: the ones near its edges do the work, and a huge face stays cheap. */
const MAX_FILL_RINGS = 2;

/**
 * Triangulates the band between a counterclockwise ring and a shorter ring
 * inside it, advancing on whichever ring lags behind in proportion.
 */
function zipRings(outer: readonly number[], inner: readonly number[], triangle: (a: number, b: number, c: number) => void): void {
  const a = outer.length;
  const b = inner.length;
  let i = 0;
  let j = 0;
  while (i < a || j < b) {
    const advanceOuter = j >= b || (i < a && (i + 1) * b <= (j + 1) * a);
    if (advanceOuter) {
      triangle(outer[i]!, outer[(i + 1) % a]!, inner[j % b]!);
      i++;
    } else {
      triangle(outer[i % a]!, inner[(j + 1) % b]!, inner[j]!);
      j++;
    }
  }
}
