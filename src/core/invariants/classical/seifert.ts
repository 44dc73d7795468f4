/**
 * Seifert circles, the Seifert surface of Seifert's algorithm and its Seifert
 * matrix V, V_ij = lk(a_i, a_j⁺), for a connected diagram.
 *
 * How V is found without coordinates. Smoothing every crossing along the
 * orientation gives the Seifert circles; a crossing becomes a half-twisted band
 * joining two different circles, and the faces of the diagram are exactly the
 * pieces of the plane cut out by the circles and the bands. The circles cut the
 * sphere into regions; the faces inside one region, minus any one of them, give
 * loops (each runs once around its face, face on its left, through the bands
 * at the face's corners) and all regions together give a basis of H₁ of the
 * surface (rank n − s + 1). The surface is a Murasugi sum of one flat piece per
 * region, glued along the circle disks, so V has two kinds of entries:
 *
 * - within a region the piece is a flat disk-and-band surface, where the loops
 *   meet only in the bands: a band of sign ε adds −ε/2 to V(f,f) for each of
 *   its two faces f, and, with N the face between the two outgoing strands and
 *   S the face between the two incoming ones, V(N,S) += 1 if ε = +1 and
 *   V(S,N) −= 1 if ε = −1;
 * - across a circle H the loops of its two regions meet only in the disk of H,
 *   where their arcs are chords; the intersection number of two chords is read
 *   off the order of their end points along H. Stack the disks so that at each
 *   circle everything on its far side (away from the point at infinity) lies
 *   on the side of the disk's positive normal — nested height intervals make
 *   that possible. A sphere through the disk then separates the far loops from
 *   the near loops pushed off negatively, so V(near, far) = 0, and with
 *   ι = V − Vᵀ = −(intersection number), V(far, near) = ι(far, near).
 *
 * The choice of the outer region (the point at infinity) decides which side of
 * each circle is "inside"; any choice gives a Seifert matrix of the same link,
 * which the tests use as a check.
 */
import { faceStructure } from '../../diagram/faces.ts';
import { indexDiagram, type LinkDiagram } from '../../diagram/model.ts';
import { SparseMatrixBuilder, type SparseMatrix } from './sparse-matrix.ts';

/** One passage of a Seifert circle through a crossing. */
export interface CircleVisit {
  readonly crossing: number;
  readonly inSlot: number;
  readonly outSlot: number;
  /** Which side of the circle (in its direction of travel) the crossing's band lies on. */
  readonly bandSide: 'left' | 'right';
  /** The corner beside the circle's arc, on the side away from the band: 4·crossing + corner. */
  readonly circleCorner: number;
}

/** The slot an oriented smoothing joins to an incoming slot: A-smoothing at positive, B at negative crossings. */
function smoothingPartner(slot: number, sign: 1 | -1): number {
  return sign === 1 ? [1, 0, 3, 2][slot]! : [3, 2, 1, 0][slot]!;
}

/** The corners (4·c + q) between the two outgoing strands (N) and between the two incoming ones (S). */
export function bandCorners(sign: 1 | -1, crossing: number): { north: number; south: number } {
  return sign === 1 ? { north: 4 * crossing + 1, south: 4 * crossing + 3 } : { north: 4 * crossing + 2, south: 4 * crossing };
}

/** The Seifert circles of the diagram's crossings (free loops are not included), each as its visits in order of travel. */
export function seifertCircles(d: LinkDiagram): CircleVisit[][] {
  const { opposite } = indexDiagram(d);
  const incomingSeen = new Uint8Array(4 * d.crossings.length);
  const circles: CircleVisit[][] = [];
  d.crossings.forEach((c, ci) => {
    for (const startSlot of [0, 1, 3]) {
      const incoming = startSlot === 0 || (c.sign === 1 ? startSlot === 3 : startSlot === 1);
      if (!incoming || incomingSeen[4 * ci + startSlot]) continue;
      const circle: CircleVisit[] = [];
      let crossing = ci;
      let inSlot = startSlot;
      while (!incomingSeen[4 * crossing + inSlot]) {
        incomingSeen[4 * crossing + inSlot] = 1;
        const sign = d.crossings[crossing]!.sign;
        const outSlot = smoothingPartner(inSlot, sign);
        // Turning counterclockwise (out = in + 1) leaves the corner between them on the right.
        const turnsLeft = outSlot === (inSlot + 1) % 4;
        circle.push({
          crossing,
          inSlot,
          outSlot,
          bandSide: turnsLeft ? 'left' : 'right',
          circleCorner: 4 * crossing + (turnsLeft ? inSlot : outSlot),
        });
        const next = opposite[4 * crossing + outSlot]!;
        crossing = next >> 2;
        inSlot = next & 3;
      }
      circles.push(circle);
    }
  });
  return circles;
}

export interface SeifertSurface {
  readonly circles: readonly (readonly CircleVisit[])[];
  /** The face (of faces.ts) each basis loop runs around. */
  readonly basisFaces: readonly number[];
  /** V_ij = lk(a_i, a_j⁺) in the basis `basisFaces`. */
  readonly matrix: SparseMatrix;
}

class UnionFind {
  private readonly parent: Int32Array;
  constructor(n: number) {
    this.parent = Int32Array.from({ length: n }, (_, i) => i);
  }
  find(x: number): number {
    while (this.parent[x] !== x) {
      this.parent[x] = this.parent[this.parent[x]!]!;
      x = this.parent[x]!;
    }
    return x;
  }
  union(a: number, b: number): void {
    this.parent[this.find(a)] = this.find(b);
  }
}

/**
 * The Seifert matrix of a connected diagram with at least one crossing.
 * `outerFace` picks the face holding the point at infinity (default 0).
 */
export function seifertSurface(d: LinkDiagram, outerFace = 0): SeifertSurface {
  const n = d.crossings.length;
  if (n === 0) throw new RangeError('the Seifert matrix needs a diagram with crossings');
  const { faceOfCorner, faceCount } = faceStructure(d);
  const circles = seifertCircles(d);

  // Regions of the sphere minus the circles: faces joined across each band.
  const regionSets = new UnionFind(faceCount);
  const bands = d.crossings.map((c, ci) => {
    const { north, south } = bandCorners(c.sign, ci);
    const band = { north: faceOfCorner[north]!, south: faceOfCorner[south]!, sign: c.sign };
    regionSets.union(band.north, band.south);
    return band;
  });
  const regionOfFace = Array.from({ length: faceCount }, (_, f) => regionSets.find(f));

  // Each circle separates the region on its left from the region on its right.
  const sides = circles.map((circle) => {
    const sidesAt = (visit: CircleVisit): { left: number; right: number } => {
      const bandRegion = regionOfFace[bands[visit.crossing]!.north]!;
      const otherRegion = regionOfFace[faceOfCorner[visit.circleCorner]!]!;
      return visit.bandSide === 'left' ? { left: bandRegion, right: otherRegion } : { left: otherRegion, right: bandRegion };
    };
    const first = sidesAt(circle[0]!);
    for (const visit of circle) {
      const here = sidesAt(visit);
      if (here.left !== first.left || here.right !== first.right) throw new Error('internal: a Seifert circle meets more than two regions');
    }
    return first;
  });

  // Depth of each region from the outer one, through the tree of regions and circles.
  const depth = new Map<number, number>([[regionOfFace[outerFace]!, 0]]);
  const queue = [regionOfFace[outerFace]!];
  for (let h = 0; h < queue.length; h++) {
    const r = queue[h]!;
    for (const s of sides) {
      const other = s.left === r ? s.right : s.right === r ? s.left : undefined;
      if (other !== undefined && !depth.has(other)) {
        depth.set(other, depth.get(r)! + 1);
        queue.push(other);
      }
    }
  }

  // Basis: all faces but the first one of each region.
  const dropped = new Set<number>();
  const basisIndex = new Int32Array(faceCount).fill(-1);
  const basisFaces: number[] = [];
  for (let f = 0; f < faceCount; f++) {
    const r = regionOfFace[f]!;
    if (!dropped.has(r)) {
      dropped.add(r);
      continue;
    }
    basisIndex[f] = basisFaces.length;
    basisFaces.push(f);
  }
  // Twice V, so the half-integer band terms stay integers until the end.
  const twice = new SparseMatrixBuilder(basisFaces.length);
  const addTwice = (f: number, g: number, v: number): void => {
    const i = basisIndex[f]!;
    const j = basisIndex[g]!;
    if (i >= 0 && j >= 0) twice.add(i, j, BigInt(v));
  };

  for (const band of bands) {
    addTwice(band.north, band.north, -band.sign);
    addTwice(band.south, band.south, -band.sign);
    if (band.sign === 1) addTwice(band.north, band.south, 2);
    else addTwice(band.south, band.north, -2);
  }

  circles.forEach((circle, h) => {
    const { left, right } = sides[h]!;
    const leftIsFar = depth.get(left)! > depth.get(right)!;
    const chordsOn = (side: 'left' | 'right'): { face: number; from: number; to: number }[] => {
      const positions = circle.map((v, k) => (v.bandSide === side ? k : -1)).filter((k) => k >= 0);
      if (positions.length < 2) return []; // a chord all the way round meets nothing
      return positions.map((k, idx) => {
        const next = positions[(idx + 1) % positions.length]!;
        const face = bands[circle[k]!.crossing]!.north;
        // A loop keeps its face on the left: along the circle on the left side, against it on the right.
        return side === 'left' ? { face, from: k, to: next } : { face, from: next, to: k };
      });
    };
    const leftChords = chordsOn('left');
    const rightChords = chordsOn('right');
    if (leftChords.length === 0 || rightChords.length === 0) return;
    const length = circle.length;
    const strictlyBetween = (x: number, from: number, to: number): boolean => {
      const a = (x - from + length) % length;
      const b = (to - from + length) % length;
      return a > 0 && a < b;
    };
    for (const a of leftChords) {
      for (const b of rightChords) {
        const fromInside = strictlyBetween(b.from, a.from, a.to);
        const toInside = strictlyBetween(b.to, a.from, a.to);
        // Along the circle: a.from, b.from, a.to, b.to gives +1; a.from, b.to, a.to, b.from gives −1.
        const intersection = fromInside === toInside ? 0 : fromInside ? 1 : -1;
        if (intersection === 0) continue;
        const iota = -intersection; // ι(a, b) = V(a,b) − V(b,a)
        if (leftIsFar) addTwice(a.face, b.face, 2 * iota);
        else addTwice(b.face, a.face, -2 * iota); // ι(b, a) = −ι(a, b)
      }
    }
  });

  const builtTwice = twice.build();
  const matrix = new SparseMatrixBuilder(basisFaces.length);
  builtTwice.rows.forEach((row, i) =>
    row.forEach((v, j) => {
      if (v % 2n !== 0n) throw new Error('internal: Seifert matrix entry is not an integer');
      matrix.add(i, j, v / 2n);
    }),
  );
  return { circles, basisFaces, matrix: matrix.build() };
}
