/**
 * The classical invariants of a diagram: Alexander and Conway polynomials
 * (from the Seifert matrix of Seifert's algorithm), determinant (from a Goeritz
 * matrix) and signature (from V + Vᵀ), each checked at run time against a
 * second, independent route: det = |Δ(−1)|, and σ from the Goeritz matrices of
 * both checkerboard surfaces with the Gordon–Litherland correction (and
 * Traczyk's formula when it applies).
 * A disagreement is a bug and throws.
 */
import { componentCount, type LinkDiagram } from '../../diagram/model.ts';
import { Laurent } from '../../poly/laurent.ts';
import { alexanderFromSeifertMatrix } from './alexander.ts';
import { goeritzInvariants } from './goeritz.ts';
import { diagramPieces } from './pieces.ts';
import { seifertSurface } from './seifert.ts';
import { signatureFromSeifertMatrix } from './signature.ts';
import { traczykSignature } from './traczyk.ts';

export type GenusBoundReason = 'alexander-span' | 'signature' | 'seifert-algorithm';

export interface GenusBound {
  readonly bound: 'lower' | 'upper';
  readonly value: number;
  readonly reason: GenusBoundReason;
  /** One sentence saying why the bound holds for this diagram. */
  readonly text: string;
}

export interface ClassicalInvariants {
  /** Δ(t) in Conway's normalisation, Δ(t) = ∇(t^(1/2) − t^(−1/2)); 0 for a split diagram. */
  readonly alexander: Laurent;
  /** ∇(z); 0 for a split diagram. */
  readonly conway: Laurent;
  /** det(L) = |Δ(−1)| = |det G|. */
  readonly determinant: bigint;
  /** σ(L) with σ(positive trefoil) = −2 (see `signatureInConvention` for the other sign). */
  readonly signature: number;
  /** Signature by Traczyk's formula when the diagram is reduced, alternating and connected; else null. */
  readonly traczykSignature: number | null;
  /**
   * sign(G) of the Goeritz matrix of each of the two checkerboard surfaces,
   * before the Gordon–Litherland correction; empty for split or crossingless diagrams.
   */
  readonly goeritzUncorrected: readonly number[];
  /** The projection has more than one piece (free loops count), so the link is split. */
  readonly split: boolean;
  /**
   * Δ, ∇ and det of each piece of the projection (one entry when it is connected): what an
   * author may have multiplied for a split diagram, which gives the value of their connected sum.
   */
  readonly pieces: readonly { readonly alexander: Laurent; readonly conway: Laurent; readonly determinant: bigint }[];
  /** Seifert circles of the diagram, free loops included. */
  readonly seifertCircles: number;
  /** Bounds on the genus of a Seifert surface of the link (for links: of any connected one). */
  readonly genusBounds: readonly GenusBound[];
}

interface PieceInvariants {
  readonly alexander: Laurent;
  readonly conway: Laurent;
  readonly signature: number;
  readonly determinant: bigint;
  readonly circles: number;
  readonly goeritzUncorrected: readonly number[];
}

function pieceInvariants(piece: LinkDiagram): PieceInvariants {
  if (piece.crossings.length === 0) return { alexander: Laurent.one, conway: Laurent.one, signature: 0, determinant: 1n, circles: piece.freeLoops, goeritzUncorrected: [] };
  const surface = seifertSurface(piece);
  const { alexander, conway } = alexanderFromSeifertMatrix(surface.matrix);
  const signature = signatureFromSeifertMatrix(surface.matrix);
  const surfaces = [goeritzInvariants(piece, 0), goeritzInvariants(piece, 1)];
  for (const g of surfaces) {
    if (g.signature !== signature) throw new Error(`internal: signature ${signature} from V + Vᵀ but ${g.signature} from a Goeritz matrix`);
  }
  const goeritz = surfaces[0]!;
  // Δ(t⁻¹) = (−1)^(μ−1)·Δ(t), and Δ(1) = 1 for a knot, 0 for a link.
  const mu = componentCount(piece);
  const mirrored = alexander.substitutePower(-1);
  if (!(mu % 2 === 1 ? mirrored : mirrored.neg()).equals(alexander) || alexander.valueAtOne() !== (mu === 1 ? 1n : 0n)) {
    throw new Error(`internal: Δ = ${alexander.toPlainString('t')} is not a Conway-normalised Alexander polynomial of a ${mu}-component link`);
  }
  const atMinusOne = absoluteValueAtMinusOne(alexander);
  if (atMinusOne !== goeritz.determinant) {
    throw new Error(`internal: |Δ(−1)| = ${atMinusOne} but |det G| = ${goeritz.determinant}`);
  }
  return { alexander, conway, signature, determinant: goeritz.determinant, circles: surface.circles.length, goeritzUncorrected: surfaces.map((g) => g.uncorrected) };
}

/** |Δ(−1)| with t^(1/2) = i: all exponents 2e share a parity, so the value is real or purely imaginary. */
export function absoluteValueAtMinusOne(alexander: Laurent): bigint {
  let value = 0n;
  for (const [e, c] of alexander.terms()) {
    const k = (((2 * e) % 4) + 4) % 4; // i^(2e)
    value += k === 0 || k === 1 ? c : -c;
  }
  return value < 0n ? -value : value;
}

export function classicalInvariants(d: LinkDiagram): ClassicalInvariants {
  const pieces = diagramPieces(d).map(pieceInvariants);
  const split = pieces.length > 1;
  const alexander = split ? Laurent.zero : pieces[0]!.alexander;
  const signature = pieces.reduce((s, p) => s + p.signature, 0);
  const mu = componentCount(d);
  const circles = pieces.reduce((s, p) => s + p.circles, 0);
  const traczyk = traczykSignature(d);
  if (traczyk !== null && traczyk !== signature) {
    throw new Error(`internal: signature ${signature} from V + Vᵀ but ${traczyk} by Traczyk's formula`);
  }
  return {
    alexander,
    conway: split ? Laurent.zero : pieces[0]!.conway,
    determinant: split ? 0n : pieces[0]!.determinant,
    signature,
    traczykSignature: traczyk,
    goeritzUncorrected: split ? [] : pieces[0]!.goeritzUncorrected,
    split,
    pieces: pieces.map((p) => ({ alexander: p.alexander, conway: p.conway, determinant: p.determinant })),
    seifertCircles: circles,
    genusBounds: split ? [] : genusBounds(alexander, signature, mu, d.crossings.length, circles),
  };
}

function genusBounds(alexander: Laurent, signature: number, mu: number, crossings: number, circles: number): GenusBound[] {
  const bounds: GenusBound[] = [];
  const extra = mu - 1;
  const spanBound = Math.max(0, Math.ceil((alexander.span - extra) / 2));
  bounds.push({
    bound: 'lower',
    value: spanBound,
    reason: 'alexander-span',
    text: alexander.isZero
      ? 'Δ = 0 has no span, so it gives no lower bound.'
      : mu === 1
        ? `span Δ = ${alexander.span} is at most twice the genus of any Seifert surface, so the genus is at least ${spanBound}.`
        : `span Δ = ${alexander.span} is at most 2g + μ − 1 for a connected Seifert surface of genus g of this ${mu}-component link, so g ≥ ${spanBound}.`,
  });
  const signatureBound = Math.max(0, Math.ceil((Math.abs(signature) - extra) / 2));
  bounds.push({
    bound: 'lower',
    value: signatureBound,
    reason: 'signature',
    text:
      mu === 1
        ? `|σ| = ${Math.abs(signature)} is at most twice the genus of any Seifert surface, so the genus is at least ${signatureBound}.`
        : `|σ| = ${Math.abs(signature)} is at most 2g + μ − 1 for a connected Seifert surface of genus g, so g ≥ ${signatureBound}.`,
  });
  // Seifert's algorithm on a connected diagram: 2g + μ − 1 = n − s + 1.
  const canonical = (crossings - circles + 2 - mu) / 2;
  bounds.push({
    bound: 'upper',
    value: canonical,
    reason: 'seifert-algorithm',
    text: `Seifert's algorithm on this diagram (${crossings} crossings, ${circles} Seifert circles) builds a connected surface of genus ${canonical}.`,
  });
  return bounds;
}
