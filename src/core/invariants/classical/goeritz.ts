/**
 * The checkerboard surface and its Goeritz matrix, giving the determinant
 * and, with the Gordon–Litherland correction, the signature — independently
 * of the Seifert surface.
 *
 * Shade one colour class of faces; the shaded faces joined by a half-twisted
 * band at each crossing form a spanning surface F. Loops around the unshaded
 * faces, all but one, are a basis of H₁(F), and the Gordon–Litherland form
 * G(a, b) = lk(a, τb) (τ the double push-off) is the Goeritz matrix:
 * a crossing whose band twists by η = ±1 adds η to G(w,w) and G(w′,w′) and −η to
 * G(w,w′) for its two unshaded faces w ≠ w′. Here η = +1 when the shaded corners
 * are those just counterclockwise after the over slots (corners 1 and 3).
 * Pushing the link into F links it with itself Σ_c (ε_c + η_c) times, so
 * Gordon–Litherland's σ(L) = sign(G) + e(F)/2 with e(F) = −lk(L, L^F) reads
 *
 *   σ(L) = sign(G) − ½·Σ_c (ε_c + η_c),
 *
 * where only crossings with η_c = ε_c contribute. |det G| is the determinant of the link.
 */
import { faceStructure } from '../../diagram/faces.ts';
import type { LinkDiagram } from '../../diagram/model.ts';
import { symmetricInertia } from './inertia.ts';
import { SparseMatrixBuilder, type SparseMatrix } from './sparse-matrix.ts';

export interface GoeritzData {
  /** Colour (0 or 1) of each face; adjacent faces differ. */
  readonly colourOfFace: readonly number[];
  readonly shadedColour: 0 | 1;
  readonly matrix: SparseMatrix;
  /** ½·Σ_c (ε_c + η_c): the Gordon–Litherland correction subtracted from sign(G). */
  readonly correction: number;
}

/** Checkerboard colouring of a connected planar diagram's faces. */
export function checkerboardColouring(d: LinkDiagram): number[] {
  const { faceOfCorner, faceCount } = faceStructure(d);
  const colour = new Array<number>(faceCount).fill(-1);
  // Across each slot the two corners beside it lie in faces of opposite colour.
  const neighbours: [number, number][][] = Array.from({ length: faceCount }, () => []);
  for (let c = 0; c < d.crossings.length; c++) {
    for (let q = 0; q < 4; q++) {
      const f = faceOfCorner[4 * c + q]!;
      const g = faceOfCorner[4 * c + ((q + 1) % 4)]!;
      neighbours[f]!.push([g, 1]);
      neighbours[g]!.push([f, 1]);
    }
  }
  for (let start = 0; start < faceCount; start++) {
    if (colour[start]! >= 0) continue;
    colour[start] = 0;
    const queue = [start];
    for (let h = 0; h < queue.length; h++) {
      const f = queue[h]!;
      for (const [g, flip] of neighbours[f]!) {
        const want = colour[f]! ^ flip;
        if (colour[g]! < 0) {
          colour[g] = want;
          queue.push(g);
        } else if (colour[g] !== want) throw new RangeError('the diagram is not planar: its faces admit no checkerboard colouring');
      }
    }
  }
  return colour;
}

export function goeritzData(d: LinkDiagram, shadedColour: 0 | 1 = 0): GoeritzData {
  const { faceOfCorner, faceCount } = faceStructure(d);
  const colourOfFace = checkerboardColouring(d);
  const unshaded: number[] = [];
  for (let f = 0; f < faceCount; f++) if (colourOfFace[f] !== shadedColour) unshaded.push(f);
  const index = new Int32Array(faceCount).fill(-1);
  unshaded.slice(1).forEach((f, i) => (index[f] = i)); // the first unshaded face is left out
  const builder = new SparseMatrixBuilder(Math.max(0, unshaded.length - 1));
  let twiceCorrection = 0;
  d.crossings.forEach((c, ci) => {
    const shadedOdd = colourOfFace[faceOfCorner[4 * ci + 1]!] === shadedColour;
    const eta = shadedOdd ? 1 : -1;
    twiceCorrection += c.sign + eta;
    const w1 = faceOfCorner[4 * ci + (shadedOdd ? 0 : 1)]!;
    const w2 = faceOfCorner[4 * ci + (shadedOdd ? 2 : 3)]!;
    if (w1 === w2) return;
    const i = index[w1]!;
    const j = index[w2]!;
    const e = BigInt(eta);
    if (i >= 0) builder.add(i, i, e);
    if (j >= 0) builder.add(j, j, e);
    if (i >= 0 && j >= 0) {
      builder.add(i, j, -e);
      builder.add(j, i, -e);
    }
  });
  return { colourOfFace, shadedColour, matrix: builder.build(), correction: twiceCorrection / 2 };
}

export interface GoeritzInvariants {
  readonly determinant: bigint;
  /** In the convention σ(positive trefoil) = −2. */
  readonly signature: number;
  /** sign(G) alone, before the Gordon–Litherland correction (a value authors sometimes state by mistake). */
  readonly uncorrected: number;
}

/** Determinant and signature of a connected diagram with crossings, from one checkerboard surface. */
export function goeritzInvariants(d: LinkDiagram, shadedColour: 0 | 1 = 0): GoeritzInvariants {
  const data = goeritzData(d, shadedColour);
  const inertia = symmetricInertia(data.matrix);
  const uncorrected = inertia.positive - inertia.negative;
  return { determinant: inertia.absDeterminant, signature: uncorrected - data.correction, uncorrected };
}
