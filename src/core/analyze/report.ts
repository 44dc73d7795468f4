/**
 * Everything the core computes about one diagram, as data. Front ends and the
 * claims layer read this; they never recompute.
 */
import type { Laurent } from '../poly/laurent.ts';
import type { LinkDiagram, Notation } from '../diagram/model.ts';
import type { ClassicalInvariants } from '../invariants/classical/index.ts';
import type { FamilyIdentity } from '../families/identity.ts';
import type { MoveCounts } from '../simplify/simplify.ts';
import type { ComputeLimits } from '../limits.ts';

/** Theorems a bound can rest on; the claims layer names them in its verdicts. */
export type TheoremId =
  | 'nugatory-removal' // each nugatory crossing can be removed by a flip
  | 'kauffman-murasugi-thistlethwaite' // span V ≤ n for connected diagrams; = n for reduced alternating
  | 'menasco' // reduced alternating connected diagrams are non-split
  | 'linking-graph' // a connected graph of non-zero linking numbers certifies non-splitness
  | 'split-span-bound' // span V ≤ c(L) + μ − 1 without a non-splitness certificate
  | 'split-union' // crossing numbers add under split union: bound each piece of a disconnected diagram
  | 'thistlethwaite-adequate' // a reduced adequate diagram has minimal crossing number
  | 'trivial' // no crossings / unknot facts
  | 'murasugi-torus' // c(T(p, q)) = min(|p|(|q|−1), |q|(|p|−1)) for torus knots (Murasugi 1991)
  | 'lickorish-thistlethwaite' // reduced Montesinos diagrams with ≥ 3 tangles are minimal (1988)
  | 'reidemeister-moves' // moves that keep the link reduced the diagram: an upper bound
  | 'two-bridge-alternating'; // the continued fraction of one sign draws a reduced alternating diagram (KMT)

export interface BoundReason {
  readonly bound: 'lower' | 'upper' | 'exact';
  readonly value: number;
  readonly theorem: TheoremId;
  /** One sentence, in our own words, saying why the bound holds for this diagram. */
  readonly text: string;
  /** Set when the theorem was applied to a smaller diagram that Reidemeister moves and flypes reached: how ("3 moves (…)"). */
  readonly afterMoves?: string;
}

export interface CrossingNumberBounds {
  readonly lower: number;
  readonly upper: number;
  /** Set when the bounds meet by a theorem (then lower = upper = exact). */
  readonly exact: number | null;
  readonly reasons: readonly BoundReason[];
}

export interface LinkingNumber {
  /** 0-based component indices, i < j. */
  readonly components: readonly [number, number];
  readonly value: number;
}

export interface DiagramReport {
  readonly diagram: LinkDiagram;
  /** The limits the diagram is analysed under: its engines' memory, time and work budgets. */
  readonly limits: ComputeLimits;
  readonly notation: Notation;
  readonly crossings: number;
  readonly components: number;
  readonly writhe: number;
  readonly positiveCrossings: number;
  readonly negativeCrossings: number;
  readonly linking: readonly LinkingNumber[];
  /** Kauffman bracket in A with ⟨O⟩ = 1 and loop value −A² − A⁻². */
  readonly bracket: Laurent;
  /** Jones polynomial in t (half-integer exponents allowed), V(unknot) = 1. */
  readonly jones: Laurent;
  readonly span: number;
  readonly jonesMinDegree: number;
  readonly jonesMaxDegree: number;
  readonly bracketSpan: number;
  readonly bracketMinDegree: number;
  readonly bracketMaxDegree: number;
  readonly connected: boolean;
  /** 0-based indices of the nugatory crossings, ascending. */
  readonly nugatory: readonly number[];
  readonly reduced: boolean;
  readonly alternating: boolean;
  readonly aAdequate: boolean;
  readonly bAdequate: boolean;
  readonly adequate: boolean;
  /** Circle counts of the all-A and all-B states. */
  readonly stateCircles: { readonly a: number; readonly b: number };
  readonly chiralityFixed: boolean;
  readonly crossingNumber: CrossingNumberBounds;
  /** Largest open boundary (edge ends) the tangle contraction reached. */
  readonly boundaryWidth: number;
  /** Alexander and Conway polynomials, determinant, signature (σ(positive trefoil) = −2) and genus bounds. */
  readonly classical: ClassicalInvariants;
  /** What the diagram is, when it was built from a family or is a literal torus braid, and how reports name it. */
  readonly family?: { readonly identity: FamilyIdentity; readonly description: string };
  /**
   * A diagram of the same link with fewer crossings than the upper bound from nugatory crossings, found by
   * Reidemeister moves and flypes; only sought when the crossing number is not already exact.
   */
  readonly simplified?: { readonly diagram: LinkDiagram; readonly moves: MoveCounts; readonly description: string };
}
