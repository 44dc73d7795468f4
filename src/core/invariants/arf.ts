/**
 * The Arf invariant of a knot, and of a proper link, each by two independent routes that must agree.
 *
 * Knots: the z² coefficient of the Conway polynomial mod 2 (Arf(K) = a₂(K) mod 2; see Kauffman, On Knots,
 * 1987), and Levine's theorem (1966): Arf(K) = 0 when Δ(−1) ≡ ±1 (mod 8), 1 when Δ(−1) ≡ ±3 (mod 8).
 *
 * Links: an oriented link is proper when every component has even total linking number with the others
 * (Robertello 1965); only then is its Arf invariant defined.
 * - H. Murakami's theorem (Jones 1985, Bull. AMS 12, Theorem 15): V_L(i) = (−√2)^(μ−1) (−1)^Arf(L) when
 *   L is proper and V_L(i) = 0 otherwise, with t^(1/2) = e^(iπ/4). Evaluated exactly in ℤ[ζ₈]; it also
 *   decides properness independently of the linking numbers.
 * - Robertello's definition (1965): a knot obtained from a proper link by oriented band sums (fusion) has
 *   the link's Arf invariant. The oriented smoothing of a crossing between two different components is
 *   such a band sum (the two strands near the crossing are joined by a saddle), and it merges the two
 *   components; smoothing until no crossing joins two components leaves a split union of knots, whose
 *   band sum is their connected sum, so Arf(L) is the sum mod 2 of the knots' Arf invariants. Each of
 *   those comes from its determinant (Goeritz matrix): det = |Δ(−1)|, so by Levine Arf = 0 exactly when
 *   det ≡ ±1 (mod 8).
 */
import type { LinkingNumber } from '../analyze/report.ts';
import { componentCount, indexDiagram, type LinkDiagram } from '../diagram/model.ts';
import { smoothCrossing, splitPieces } from '../diagram/operations.ts';
import { atImaginaryUnit, equals8, format8, neg8, pow8, SQRT2, ZERO8 } from '../poly/cyclotomic8.ts';
import type { Laurent } from '../poly/laurent.ts';
import { classicalInvariants } from './classical/index.ts';

export type Arf = 0 | 1;

/** The Arf invariant, or why it is not defined for this link. */
export type ArfResult = { readonly value: Arf } | { readonly value: null; readonly notDefined: string };

const mod = (x: bigint, m: bigint): bigint => ((x % m) + m) % m;

/** Arf(K) of a knot from ∇ and Δ, the two routes checked against each other. */
export function arfOfKnot(conway: Laurent, alexander: Laurent): Arf {
  const fromConway = mod(conway.coefficient(2), 2n) === 0n ? 0 : 1;
  const atMinusOne = alexander.terms().reduce((sum, [e, c]) => sum + (Math.abs(e) % 2 === 0 ? c : -c), 0n);
  const fromLevine = levine(atMinusOne);
  if (fromConway !== fromLevine) throw new Error(`internal: Arf invariant ${fromConway} from ∇ but ${fromLevine} from Δ(−1) = ${atMinusOne}`);
  return fromConway;
}

/** Levine: Arf(K) from Δ(−1) (or ±det) mod 8. */
function levine(atMinusOne: bigint): Arf {
  const residue = mod(atMinusOne, 8n);
  if (residue === 1n || residue === 7n) return 0;
  if (residue === 3n || residue === 5n) return 1;
  throw new Error(`internal: Δ(−1) = ${atMinusOne} of a knot is even`);
}

/** A component whose total linking number with the others is odd (0-based index). */
export interface OddComponent {
  readonly component: number;
  readonly total: number;
}

/** The components with odd total linking number with the rest: none exactly when the link is proper. */
export function oddLinkingComponents(linking: readonly LinkingNumber[], components: number): OddComponent[] {
  const totals = new Array<number>(components).fill(0);
  for (const { components: [i, j], value } of linking) {
    totals[i]! += value;
    totals[j]! += value;
  }
  return totals.flatMap((total, component) => (Math.abs(total) % 2 === 1 ? [{ component, total }] : []));
}

/**
 * Which components make a link not proper, in words, numbering components from `firstNumber` (manuscripts
 * count from 1, the `compute` summary from 0).
 */
export function oddComponentsText(odd: readonly OddComponent[], firstNumber: 0 | 1): string {
  const [first] = odd;
  if (!first) throw new Error('internal: a proper link has no component with odd total linking number');
  const rest = odd.slice(1).map((o) => o.component + firstNumber);
  const others = rest.length === 0 ? '' : rest.length === 1 ? ` (so does component ${rest[0]})` : ` (so do components ${rest.join(', ')})`;
  return `component ${first.component + firstNumber} (counted from ${firstNumber} in the code's order) has total linking number ${first.total} with the other components, an odd number${others}`;
}

/** Why the Arf invariant of a link with these odd components is not defined (components counted from 1). */
export function notProperReason(odd: readonly OddComponent[]): string {
  return `the Arf invariant is not defined for this link: it is not proper, since ${oddComponentsText(odd, 1)}`;
}

/**
 * Murakami's theorem read backwards: the Arf invariant from V(i), or null when V(i) = 0 (L not proper).
 * A value of V(i) that is neither 0 nor ±(−√2)^(μ−1) contradicts the theorem and is a bug.
 */
export function arfFromJonesAtI(jones: Laurent, components: number): Arf | null {
  const value = atImaginaryUnit(jones);
  if (equals8(value, ZERO8)) return null;
  const unsigned = pow8(neg8(SQRT2), components - 1);
  if (equals8(value, unsigned)) return 0;
  if (equals8(value, neg8(unsigned))) return 1;
  throw new Error(`internal: V(i) = ${format8(value)} (ζ = e^(iπ/4)) for a ${components}-component link is neither 0 nor ±(−√2)^${components - 1}`);
}

/** The index of a crossing between two different components, or −1 when every crossing is a self-crossing. */
function mixedCrossing(d: LinkDiagram): number {
  const { componentOf } = indexDiagram(d);
  // Slots 0 and 1 hold the under and the over strand.
  return d.crossings.findIndex((c) => componentOf[c.edges[0]] !== componentOf[c.edges[1]]);
}

/** Robertello's route: fuse the components by oriented smoothings, then sum the knots' Arf invariants (Levine on det). */
export function arfByFusion(d: LinkDiagram): Arf {
  let fused = d;
  for (let k = mixedCrossing(fused); k >= 0; k = mixedCrossing(fused)) fused = smoothCrossing(fused, k);
  // Each piece is now a knot (free loops are unknots, Arf 0).
  let sum = 0;
  for (const knot of splitPieces(fused)) {
    if (componentCount(knot) !== 1) throw new Error(`internal: a fused piece has ${componentCount(knot)} components`);
    sum += levine(classicalInvariants(knot).determinant);
  }
  return (sum % 2) as Arf;
}

/** What the Arf invariant of a link needs from its report. */
export interface LinkArfInput {
  readonly diagram: LinkDiagram;
  readonly linking: readonly LinkingNumber[];
  /** Read only for links of two or more components. */
  readonly jones: () => Laurent;
}

/**
 * The Arf invariant of a link of two or more components: properness from the linking numbers and from
 * V(i), the value from V(i) and from fusion; any disagreement is a bug and throws.
 */
export function arfOfLink(input: LinkArfInput): ArfResult {
  const components = componentCount(input.diagram);
  const odd = oddLinkingComponents(input.linking, components);
  const fromJones = arfFromJonesAtI(input.jones(), components);
  if ((fromJones === null) !== (odd.length > 0)) {
    throw new Error(`internal: V(i) ${fromJones === null ? 'vanishes' : 'does not vanish'} but the linking numbers make the link ${odd.length > 0 ? 'not proper' : 'proper'}`);
  }
  if (fromJones === null) return { value: null, notDefined: notProperReason(odd) };
  const fromFusion = arfByFusion(input.diagram);
  if (fromFusion !== fromJones) throw new Error(`internal: Arf invariant ${fromJones} from V(i) but ${fromFusion} by fusion into a knot`);
  return { value: fromJones };
}
