/**
 * The triangulated sphere that a diagram's planar map is circle-packed on.
 *
 * Vertices, per connected piece of the projection: one per crossing (X), one
 * per edge end (S, beside the crossing on that edge), one per edge midpoint (P),
 * one per corner (K, between two consecutive edge ends of a crossing) and one
 * per face (F). Around a crossing the triangles are X·S·K; inside a face, a fan
 * from F over the polygon K, S, P, S, K, … that runs once round the face.
 *
 * Every crossing end and every corner has a vertex of its own, so the result
 * is a simplicial triangulation even for curls (an edge from a crossing to
 * itself) and for crossings that touch one face twice: no two triangles share
 * more than one edge, which circle packing needs.
 */
import { indexDiagram, type LinkDiagram } from '../diagram/model.ts';
import { faceStructure } from '../diagram/faces.ts';

export interface PackingComplex {
  /** Vertex count: 11n + faces for n crossings. */
  readonly vertexCount: number;
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

export function packingComplex(d: LinkDiagram): PackingComplex {
  const n = d.crossings.length;
  const { opposite } = indexDiagram(d);
  const { faces, faceCount } = faceStructure(d);
  const vertexCount = 11 * n + faceCount;
  // successor[v] maps a neighbour b to the neighbour after it counterclockwise.
  const successor: Map<number, number>[] = Array.from({ length: vertexCount }, () => new Map());
  const triangle = (a: number, b: number, c: number): void => {
    successor[a]!.set(b, c);
    successor[b]!.set(c, a);
    successor[c]!.set(a, b);
  };
  for (let c = 0; c < n; c++) {
    for (let q = 0; q < 4; q++) {
      const k = cornerVertex(n, 4 * c + q);
      triangle(crossingVertex(c), endVertex(n, 4 * c + q), k);
      triangle(crossingVertex(c), k, endVertex(n, 4 * c + ((q + 1) & 3)));
    }
  }
  faces.forEach((corners, f) => {
    const centre = faceVertex(n, f);
    for (const corner of corners) {
      const leave = corner;
      const arrive = opposite[leave]!;
      const edge = d.crossings[leave >> 2]!.edges[leave & 3]!;
      const polygon = [cornerVertex(n, corner), endVertex(n, leave), midpointVertex(n, edge), endVertex(n, arrive), cornerVertex(n, nextCornerOfFace(opposite, corner))];
      for (let i = 0; i + 1 < polygon.length; i++) triangle(centre, polygon[i]!, polygon[i + 1]!);
    }
  });
  const flowers = successor.map((next) => {
    if (next.size === 0) return new Int32Array(0);
    // Start from the smallest neighbour so the order does not depend on insertion order.
    const start = Math.min(...next.keys());
    const cycle = [start];
    for (let v = next.get(start)!; v !== start; v = next.get(v)!) cycle.push(v);
    return Int32Array.from(cycle);
  });
  return { vertexCount, flowers };
}
