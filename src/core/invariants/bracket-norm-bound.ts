/**
 * A proven bound on the coefficients of the Kauffman bracket, so that the
 * bracket can be computed modulo several word-sized numbers and lifted by the
 * Chinese remainder theorem (bracket-modular.ts).
 *
 * Lemma. Let D be a diagram whose projection is connected and planar, and G
 * one of its two checkerboard (Tait) graphs: vertices the faces of one
 * colour, an edge for each crossing between the two faces of that colour at
 * it. Then the sum of the absolute values of the coefficients of ⟨D⟩ (with
 * ⟨O⟩ = 1) is at most τ(G), the number of spanning trees of G.
 *
 * This is the counting side of Thistlethwaite's spanning tree expansion
 * (M. B. Thistlethwaite, "A spanning tree expansion of the Jones polynomial",
 * Topology 26 (1987) 297–309), in which each spanning tree contributes one
 * monomial ±A^k. The proof is short enough to give in full, so the engine's
 * exactness rests on nothing recalled:
 *
 * Write ‖p‖ for the sum of |coefficients|. τ(G) = τ(G*) for the dual plane
 * graph G* (the other colour), since complements of spanning trees of G are
 * the duals of spanning trees of G*. Induct on the number of crossings. With
 * none, D is one circle, ⟨D⟩ = 1 and G is one vertex: τ = 1. Otherwise take a
 * crossing, an edge e of G; its two smoothings give the diagrams of G − e and
 * G / e, and ⟨D⟩ = A^(±1)⟨D_(G−e)⟩ + A^(∓1)⟨D_(G/e)⟩.
 * - e neither a loop nor a bridge: both graphs are connected, so are their
 *   diagrams, and τ(G) = τ(G − e) + τ(G / e) (trees without e, trees with e).
 *   The triangle inequality gives ‖⟨D⟩‖ ≤ τ(G − e) + τ(G / e) = τ(G).
 * - e a bridge, joining graphs G₁ and G₂: the crossing is nugatory, one
 *   smoothing gives the split diagram D₁ ⊔ D₂ and the other the diagram whose
 *   Tait graph is G₁ and G₂ glued at a vertex, so ⟨D⟩ = (A^(±1)·d + A^(∓1))
 *   ⟨D₁⟩⟨D₂⟩ = −A^(±3)⟨D₁⟩⟨D₂⟩ with d = −A² − A⁻². Since ‖pq‖ ≤ ‖p‖‖q‖ and
 *   every spanning tree contains a bridge, ‖⟨D⟩‖ ≤ τ(G₁)τ(G₂) = τ(G).
 * - e a loop of G: it is a bridge of G*, and the previous case applies to G*.
 *
 * So every coefficient of ⟨D⟩, and of the Jones polynomial (−A³)^(−w)⟨D⟩, is
 * at most τ(G) in absolute value. τ(G) is computed exactly as the determinant
 * of G's Laplacian with one row and column removed (Kirchhoff's matrix-tree
 * theorem), by banded elimination modulo primes (classical/modular.ts).
 */
import { connectedPieces, faceStructure, nonPlanarPieces } from '../diagram/faces.ts';
import type { LinkDiagram } from '../diagram/model.ts';
import { checkerboardColouring } from './classical/goeritz.ts';
import { integerDeterminant } from './classical/modular.ts';
import { SparseMatrixBuilder } from './classical/sparse-matrix.ts';

/**
 * τ(G) for a checkerboard graph G of `d` (free loops aside): a bound on the sum
 * of the absolute values of the coefficients of the bracket of d's crossings.
 * Undefined when the lemma does not apply: no crossings, a projection of
 * several pieces, or a non-planar (virtual) code.
 */
export function bracketNormBound(d: LinkDiagram): bigint | undefined {
  if (d.crossings.length === 0) return undefined;
  if (connectedPieces(d).pieceCount !== 1 || nonPlanarPieces(d).length > 0) return undefined;
  const { faceOfCorner, faceCount } = faceStructure(d);
  const colourOfFace = checkerboardColouring(d);
  // The vertices: faces of colour 0. Corners 0 and 2 of a crossing lie in opposite faces, as do corners 1 and 3.
  const vertexOfFace = new Int32Array(faceCount).fill(-1);
  let vertices = 0;
  for (let f = 0; f < faceCount; f++) if (colourOfFace[f] === 0) vertexOfFace[f] = vertices++;
  // The Laplacian with vertex 0's row and column left out.
  const laplacian = new SparseMatrixBuilder(vertices - 1);
  for (let c = 0; c < d.crossings.length; c++) {
    const even = colourOfFace[faceOfCorner[4 * c]!] === 0;
    const u = vertexOfFace[faceOfCorner[4 * c + (even ? 0 : 1)]!]! - 1;
    const v = vertexOfFace[faceOfCorner[4 * c + (even ? 2 : 3)]!]! - 1;
    if (u === v) continue; // a loop of G lies in no spanning tree
    if (u >= 0) laplacian.add(u, u, 1n);
    if (v >= 0) laplacian.add(v, v, 1n);
    if (u >= 0 && v >= 0) {
      laplacian.add(u, v, -1n);
      laplacian.add(v, u, -1n);
    }
  }
  const spanningTrees = integerDeterminant(laplacian.build());
  if (spanningTrees < 1n) throw new Error('internal: a connected checkerboard graph counted no spanning trees');
  return spanningTrees;
}
