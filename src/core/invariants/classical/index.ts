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
import { once, withTimeBudget } from '../../limits.ts';

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

/**
 * One connected piece (or free loop), each invariant computed on first use: det and σ from the two
 * Goeritz matrices and V + Vᵀ cost a few eliminations, Δ a polynomial determinant 100–700 times dearer,
 * so a determinant or signature claim never pays for Δ. Every cross-check runs once both of its sides
 * are computed.
 */
class Piece {
  private surfaceValue: ReturnType<typeof seifertSurface> | undefined;
  private goeritzValue: ReturnType<typeof goeritzInvariants>[] | undefined;
  private alexanderValue: { readonly alexander: Laurent; readonly conway: Laurent } | undefined;
  private signatureValue: number | undefined;

  constructor(private readonly piece: LinkDiagram) {}

  private get crossingless(): boolean {
    return this.piece.crossings.length === 0;
  }

  private get surface(): ReturnType<typeof seifertSurface> {
    return (this.surfaceValue ??= seifertSurface(this.piece));
  }

  /** Both checkerboard surfaces; their |det G| must agree (each is det L). */
  private get goeritz(): ReturnType<typeof goeritzInvariants>[] {
    if (this.goeritzValue) return this.goeritzValue;
    const surfaces = [goeritzInvariants(this.piece, 0), goeritzInvariants(this.piece, 1)];
    if (surfaces[0]!.determinant !== surfaces[1]!.determinant) {
      throw new Error(`internal: |det G| = ${surfaces[0]!.determinant} and ${surfaces[1]!.determinant} for the two checkerboard surfaces`);
    }
    return (this.goeritzValue = surfaces);
  }

  get circles(): number {
    return this.crossingless ? this.piece.freeLoops : this.surface.circles.length;
  }

  get determinant(): bigint {
    return this.crossingless ? 1n : this.goeritz[0]!.determinant;
  }

  get goeritzUncorrected(): readonly number[] {
    return this.crossingless ? [] : this.goeritz.map((g) => g.uncorrected);
  }

  get signature(): number {
    if (this.crossingless) return 0;
    if (this.signatureValue !== undefined) return this.signatureValue;
    const signature = signatureFromSeifertMatrix(this.surface.matrix);
    for (const g of this.goeritz) {
      if (g.signature !== signature) throw new Error(`internal: signature ${signature} from V + Vᵀ but ${g.signature} from a Goeritz matrix`);
    }
    return (this.signatureValue = signature);
  }

  get alexander(): Laurent {
    return this.alexanderAndConway.alexander;
  }

  get conway(): Laurent {
    return this.alexanderAndConway.conway;
  }

  private get alexanderAndConway(): { readonly alexander: Laurent; readonly conway: Laurent } {
    if (this.crossingless) return { alexander: Laurent.one, conway: Laurent.one };
    if (this.alexanderValue) return this.alexanderValue;
    const { alexander, conway } = alexanderFromSeifertMatrix(this.surface.matrix);
    // Δ(t⁻¹) = (−1)^(μ−1)·Δ(t), and Δ(1) = 1 for a knot, 0 for a link.
    const mu = componentCount(this.piece);
    const mirrored = alexander.substitutePower(-1);
    if (!(mu % 2 === 1 ? mirrored : mirrored.neg()).equals(alexander) || alexander.valueAtOne() !== (mu === 1 ? 1n : 0n)) {
      throw new Error(`internal: Δ = ${alexander.toPlainString('t')} is not a Conway-normalised Alexander polynomial of a ${mu}-component link`);
    }
    const atMinusOne = absoluteValueAtMinusOne(alexander);
    if (atMinusOne !== this.determinant) throw new Error(`internal: |Δ(−1)| = ${atMinusOne} but |det G| = ${this.determinant}`);
    return (this.alexanderValue = { alexander, conway });
  }
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

/**
 * The classical invariants of `d`, each field computed on first read (see Piece). With a time budget,
 * each field's computation gets its own (src/core/limits.ts), and a field over it throws the same
 * limit error on every read.
 */
export function classicalInvariants(d: LinkDiagram): ClassicalInvariants {
  return classicalInvariantsWithin(d, undefined);
}

export function classicalInvariantsWithin(d: LinkDiagram, timeBudgetMs: number | undefined): ClassicalInvariants {
  const pieces = diagramPieces(d).map((piece) => new Piece(piece));
  const split = pieces.length > 1;
  const first = pieces[0]!;
  const mu = componentCount(d);
  const result = { split } as Record<string, unknown>;
  const lazy = (name: keyof ClassicalInvariants, task: string, compute: () => unknown): void => {
    const value = once(() => withTimeBudget(timeBudgetMs, task, compute));
    Object.defineProperty(result, name, { enumerable: true, get: value });
  };
  lazy('alexander', 'its Alexander polynomial', () => (split ? Laurent.zero : first.alexander));
  lazy('conway', 'its Conway polynomial', () => (split ? Laurent.zero : first.conway));
  lazy('determinant', 'its determinant', () => (split ? 0n : first.determinant));
  lazy('signature', 'its signature', () => {
    const signature = pieces.reduce((s, p) => s + p.signature, 0);
    const traczyk = traczykSignature(d);
    if (traczyk !== null && traczyk !== signature) throw new Error(`internal: signature ${signature} from V + Vᵀ but ${traczyk} by Traczyk's formula`);
    return signature;
  });
  lazy('traczykSignature', 'its signature by Traczyk\'s formula', () => traczykSignature(d));
  lazy('goeritzUncorrected', 'its Goeritz matrices', () => (split ? [] : first.goeritzUncorrected));
  lazy('pieces', 'the Alexander polynomials of its pieces', () => pieces.map((p) => ({ alexander: p.alexander, conway: p.conway, determinant: p.determinant })));
  lazy('seifertCircles', 'its Seifert circles', () => pieces.reduce((s, p) => s + p.circles, 0));
  lazy('genusBounds', 'its genus bounds (Alexander polynomial and signature)', () =>
    split ? [] : genusBounds(result['alexander'] as Laurent, result['signature'] as number, mu, d.crossings.length, result['seifertCircles'] as number),
  );
  return result as unknown as ClassicalInvariants;
}

/** The genus bounds from Δ, σ and Seifert's algorithm on this diagram (for a connected diagram). */
export function genusBounds(alexander: Laurent, signature: number, mu: number, crossings: number, circles: number): GenusBound[] {
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
