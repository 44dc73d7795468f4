/**
 * The planar structure of a diagram's projection: its faces, its connected
 * pieces, and the Euler-characteristic test that tells a planar diagram from a
 * virtual one.
 *
 * A corner (c, q) is the angle at crossing c between slot q and slot q+1
 * (counterclockwise). Walking a face: arrive at c through slot q+1, pass the
 * corner (c, q), leave through slot q, arrive at the other end (c', p'), and
 * pass the corner (c', p'−1) next.
 */
import { indexDiagram, type LinkDiagram } from './model.ts';

export interface FaceStructure {
  /** For each corner id 4·c + q, the face it lies in. */
  readonly faceOfCorner: Int32Array;
  readonly faceCount: number;
  /** For each face, its corner ids in the order walked. */
  readonly faces: readonly (readonly number[])[];
}

export interface Pieces {
  /** For each crossing, the index of its connected piece of the projection. */
  readonly pieceOfCrossing: Int32Array;
  /** Pieces that contain crossings (free loops are not counted here). */
  readonly pieceCount: number;
}

const faceCache = new WeakMap<LinkDiagram, FaceStructure>();

export function faceStructure(d: LinkDiagram): FaceStructure {
  const cached = faceCache.get(d);
  if (cached) return cached;
  const { opposite } = indexDiagram(d);
  const cornerCount = 4 * d.crossings.length;
  const faceOfCorner = new Int32Array(cornerCount).fill(-1);
  const faces: number[][] = [];
  for (let start = 0; start < cornerCount; start++) {
    if (faceOfCorner[start]! >= 0) continue;
    const face: number[] = [];
    const id = faces.length;
    let corner = start;
    while (faceOfCorner[corner]! < 0) {
      faceOfCorner[corner] = id;
      face.push(corner);
      const arrive = opposite[corner]!; // leave through slot q: same id as the corner
      corner = 4 * (arrive >> 2) + (((arrive & 3) + 3) & 3);
    }
    faces.push(face);
  }
  const result = { faceOfCorner, faceCount: faces.length, faces };
  faceCache.set(d, result);
  return result;
}

export function connectedPieces(d: LinkDiagram): Pieces {
  const n = d.crossings.length;
  const parent = Int32Array.from({ length: n }, (_, i) => i);
  const find = (x: number): number => {
    while (parent[x] !== x) {
      parent[x] = parent[parent[x]!]!;
      x = parent[x]!;
    }
    return x;
  };
  const { opposite } = indexDiagram(d);
  for (let s = 0; s < 4 * n; s++) {
    const a = find(s >> 2);
    const b = find(opposite[s]! >> 2);
    if (a !== b) parent[a] = b;
  }
  const pieceOfCrossing = new Int32Array(n);
  const ids = new Map<number, number>();
  for (let c = 0; c < n; c++) {
    const root = find(c);
    if (!ids.has(root)) ids.set(root, ids.size);
    pieceOfCrossing[c] = ids.get(root)!;
  }
  return { pieceOfCrossing, pieceCount: ids.size };
}

/**
 * Euler's formula V − E + F = 2 on each connected piece of the projection.
 * Returns the pieces where it fails (those are not planar: the code describes
 * a virtual diagram), with the face count found and the count planarity needs.
 */
export function nonPlanarPieces(d: LinkDiagram): { piece: number; faces: number; expected: number }[] {
  const { pieceOfCrossing, pieceCount } = connectedPieces(d);
  const { faces } = faceStructure(d);
  const vertices = new Array<number>(pieceCount).fill(0);
  const faceCounts = new Array<number>(pieceCount).fill(0);
  for (let c = 0; c < d.crossings.length; c++) vertices[pieceOfCrossing[c]!]!++;
  for (const face of faces) faceCounts[pieceOfCrossing[face[0]! >> 2]!]!++;
  const bad: { piece: number; faces: number; expected: number }[] = [];
  for (let p = 0; p < pieceCount; p++) {
    // A 4-valent piece with V crossings has E = 2V edges, so F must be V + 2.
    const expected = vertices[p]! + 2;
    if (faceCounts[p] !== expected) bad.push({ piece: p, faces: faceCounts[p]!, expected });
  }
  return bad;
}
