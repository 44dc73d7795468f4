/**
 * Bounds on the crossing number of the link a diagram represents, each with
 * the theorem it rests on as data. Only proven statements are used; when no
 * theorem closes the gap the bounds stay apart and `exact` is null.
 */
import type { BoundReason, CrossingNumberBounds, TheoremId } from '../analyze/report.ts';
import type { DiagramProperties } from './properties.ts';
import { describeFamily, type FamilyIdentity } from '../families/identity.ts';
import { gcd } from '../families/build.ts';

/** What the bounds need to know: the diagram's properties and the span of its Jones polynomial. */
export interface CrossingBoundInput {
  readonly properties: DiagramProperties;
  readonly jonesSpan: number;
  /**
   * For a disconnected diagram: the bounds of each connected piece with
   * crossings, each analysed as a diagram of its own (crossingless circles
   * contribute 0 and are not listed).
   */
  readonly pieces?: readonly CrossingNumberBounds[];
  /** What the diagram is, when it was built from a family (or is a literal torus braid). */
  readonly family?: FamilyIdentity;
  /** A smaller diagram of the same link that Reidemeister moves (and flypes) reached, with the bounds of its own analysis. */
  readonly simplified?: SimplifiedBounds;
}

export interface SimplifiedBounds {
  readonly crossings: number;
  /** How it was reached, e.g. "3 moves (2 Reidemeister II, 1 flype)". */
  readonly moves: string;
  /** Whether flypes were among the moves (the reason then names them). */
  readonly flyped: boolean;
  readonly bounds: CrossingNumberBounds;
}

export function crossingNumberBounds({ properties: p, jonesSpan, pieces, family, simplified }: CrossingBoundInput): CrossingNumberBounds {
  const n = p.crossings;
  if (n === 0) {
    const text = 'The diagram has no crossings, so it shows an unlink of circles, whose crossing number is 0.';
    return { lower: 0, upper: 0, exact: 0, reasons: [{ bound: 'exact', value: 0, theorem: 'trivial', text }] };
  }

  let lower = spanLowerBound(p, jonesSpan);
  let upper = nugatoryUpperBound(p);
  const exactReasons = theoremsFixingTheCrossingNumber(p);
  if (family) exactReasons.push(...familyTheorems(p, family));
  if (simplified && simplified.crossings < upper.value) {
    const kinds = simplified.flyped ? 'Reidemeister moves and flypes' : 'Reidemeister moves';
    upper = reason('upper', simplified.crossings, 'reidemeister-moves', `${kinds} reduce the diagram to ${simplified.crossings} crossing${simplified.crossings === 1 ? '' : 's'}, by ${simplified.moves}; the moves keep the link, so c ≤ ${simplified.crossings}.`);
    // What decides the smaller diagram decides the link; bounds that merely meet are found again below.
    const smaller = simplified.bounds;
    const smallerLower = smaller.reasons.find((r) => r.bound === 'lower');
    if (smallerLower && smallerLower.value > lower.value) lower = { ...smallerLower, text: `After ${simplified.moves}: ${smallerLower.text}`, afterMoves: simplified.moves };
    for (const r of smaller.reasons) {
      if (r.bound === 'exact' && r.theorem !== 'trivial' && r.theorem !== 'nugatory-removal') {
        exactReasons.push({ ...r, afterMoves: simplified.moves, text: `After ${simplified.moves} the diagram has ${simplified.crossings} crossing${simplified.crossings === 1 ? '' : 's'}. ${r.text}` });
      }
    }
  }
  if (pieces && !p.connected) {
    const split = splitUnionBounds(pieces, p.pieces);
    if (split.lower.value > lower.value) lower = split.lower;
    if (split.exact) exactReasons.push(split.exact);
  }
  if (exactReasons.length === 0 && lower.value === upper.value) {
    // Named after the upper bound: the diagram itself (less its nugatory crossings) is then minimal.
    // The exact-value theorems keep their ids for the cases they decide on their own.
    exactReasons.push({
      bound: 'exact',
      value: upper.value,
      theorem: upper.theorem,
      text: `The lower bound ${lower.value} (${THEOREM_TITLES[lower.theorem]}) meets the upper bound ${upper.value}, so the crossing number is ${upper.value}.`,
    });
  }
  const reasons = [lower, upper, ...exactReasons];
  if (exactReasons.length === 0) return { lower: lower.value, upper: upper.value, exact: null, reasons };

  const exact = exactReasons[0]!.value;
  // These are theorems; a disagreement means an engine computed a wrong value.
  if (exactReasons.some((r) => r.value !== exact) || exact < lower.value || exact > upper.value) {
    throw new Error(`internal: crossing-number bounds disagree (${reasons.map((r) => `${r.bound} ${r.value} by ${r.theorem}`).join('; ')})`);
  }
  return { lower: exact, upper: exact, exact, reasons };
}

/** Short names for the lower-bound theorems, used inside reason sentences. */
const THEOREM_TITLES: Readonly<Record<BoundReason['theorem'], string>> = {
  'nugatory-removal': 'nugatory crossings removed',
  'kauffman-murasugi-thistlethwaite': 'span V, Kauffman–Murasugi–Thistlethwaite',
  menasco: 'span V for a link that is non-split by Menasco',
  'linking-graph': 'span V for a link that is non-split by its linking numbers',
  'split-span-bound': 'span V − (μ − 1) for a possibly split link',
  'thistlethwaite-adequate': 'Thistlethwaite',
  trivial: 'the crossing count',
  'split-union': 'the pieces of a split diagram, summed',
  'murasugi-torus': 'Murasugi, torus knots',
  'lickorish-thistlethwaite': 'Lickorish–Thistlethwaite, reduced Montesinos diagrams',
  'two-bridge-alternating': 'Kauffman–Murasugi–Thistlethwaite, two-bridge links',
  'reidemeister-moves': 'Reidemeister moves and flypes',
};

/**
 * span V ≤ c for every connected diagram with c crossings (L. H. Kauffman, State models and the Jones
 * polynomial, Topology 26 (1987); K. Murasugi, Jones polynomials and classical conjectures in knot
 * theory, Topology 26 (1987); M. B. Thistlethwaite, A spanning tree expansion of the Jones polynomial,
 * Topology 26 (1987)); a link with a connected alternating diagram is non-split (W. Menasco, Closed
 * incompressible surfaces in alternating knot and link complements, Topology 23 (1984)), so all its
 * diagrams are connected.
 */
function spanLowerBound(p: DiagramProperties, jonesSpan: number): BoundReason {
  if (p.components === 1) {
    return reason('lower', jonesSpan, 'kauffman-murasugi-thistlethwaite', `Every diagram of a knot has at least span V crossings (Kauffman–Murasugi–Thistlethwaite), and span V is ${jonesSpan} here.`);
  }
  if (p.alternating && p.connected) {
    return reason('lower', jonesSpan, 'menasco', `The diagram is alternating and connected, so the link is non-split (Menasco), hence all of its diagrams are connected and have at least span V = ${jonesSpan} crossings (Kauffman–Murasugi–Thistlethwaite).`);
  }
  if (linkingGraphConnected(p)) {
    return reason('lower', jonesSpan, 'linking-graph', `The non-zero linking numbers join all ${p.components} components, so the link is non-split, hence all of its diagrams are connected and have at least span V = ${jonesSpan} crossings (Kauffman–Murasugi–Thistlethwaite).`);
  }
  const value = Math.max(0, jonesSpan - (p.components - 1));
  return reason('lower', value, 'split-span-bound', `No certificate that the link is non-split is at hand; a diagram with c crossings in k ≤ μ pieces has span V ≤ c + k − 1, so c ≥ span V − (μ − 1) = ${jonesSpan} − ${p.components - 1}${value === 0 ? ', no better than c ≥ 0' : ` = ${value}`}.`);
}

function nugatoryUpperBound(p: DiagramProperties): BoundReason {
  const k = p.nugatory.length;
  if (k === 0) return reason('upper', p.crossings, 'trivial', `The diagram itself has ${p.crossings} crossings.`);
  return reason('upper', p.crossings - k, 'nugatory-removal', `${k === 1 ? 'The nugatory crossing' : `Each of the ${k} nugatory crossings`} can be undone by turning over one side of the diagram, leaving ${p.crossings - k} crossings.`);
}

/**
 * A reduced alternating connected diagram has the fewest crossings of its link (the three 1987 papers
 * above); so does a reduced adequate one (M. B. Thistlethwaite, Kauffman's polynomial and alternating
 * links, Topology 27 (1988); an adequate diagram has no nugatory crossing anyway). Connectedness is
 * required here for both, the safe reading.
 */
function theoremsFixingTheCrossingNumber(p: DiagramProperties): BoundReason[] {
  const found: BoundReason[] = [];
  const n = p.crossings;
  const k = p.nugatory.length;
  if (p.alternating && p.connected) {
    const text = k === 0
      ? `A reduced alternating connected diagram has the fewest crossings of any diagram of its link (Kauffman–Murasugi–Thistlethwaite), so c = ${n}.`
      : `Undoing the ${k} nugatory crossing${k === 1 ? '' : 's'} leaves a reduced alternating connected diagram, which has the fewest crossings of any diagram of its link (Kauffman–Murasugi–Thistlethwaite), so c = ${n - k}.`;
    found.push(reason('exact', n - k, 'kauffman-murasugi-thistlethwaite', text));
  }
  if (p.adequate && p.reduced && p.connected) {
    found.push(reason('exact', n, 'thistlethwaite-adequate', `The diagram is connected, reduced and adequate, and such a diagram has the fewest crossings of any diagram of its link (Thistlethwaite), so c = ${n}.`));
  }
  return found;
}

/**
 * Theorems about the family a diagram was built from, each applied only
 * within its published statement:
 * - torus knots T(p, q), gcd(p, q) = 1, |p|, |q| ≥ 2: c = min(|p|(|q|−1), |q|(|p|−1))
 *   (K. Murasugi, On the braid index of alternating links, Trans. AMS 326 (1991)).
 *   Torus links (gcd > 1) are left to the other theorems.
 * - a reduced Montesinos diagram with at least three rational tangles has the
 *   fewest crossings (W. B. R. Lickorish and M. B. Thistlethwaite, Some links with
 *   non-trivial polynomials and their crossing-numbers, Comment. Math. Helv. 63
 *   (1988)). Applied only to pretzel diagrams P(a₁, …, a_k), k ≥ 3, every |aᵢ| ≥ 2,
 *   which are reduced Montesinos diagrams; other tangles are left out.
 * - a two-bridge link drawn from a continued fraction with all terms of one sign
 *   and no nugatory twist is a reduced alternating connected diagram
 *   (Kauffman–Murasugi–Thistlethwaite), so c = the sum of the terms' absolute values.
 */
function familyTheorems(p: DiagramProperties, family: FamilyIdentity): BoundReason[] {
  const name = describeFamily(family, p.components);
  switch (family.kind) {
    case 'torus': {
      const [a, b] = [Math.abs(family.p), Math.abs(family.q)];
      if (a < 2 || b < 2 || gcd(a, b) !== 1) return [];
      const c = Math.min(a * (b - 1), b * (a - 1));
      const how = family.fromBraid ? 'The braid word is literally a torus braid, so its closure is' : 'The diagram is';
      return [reason('exact', c, 'murasugi-torus', `${how} ${name}, and a torus knot T(p, q) has crossing number min(|p|(|q| − 1), |q|(|p| − 1)) (Murasugi 1991, Trans. Amer. Math. Soc. 326), so c = min(${a}·${b - 1}, ${b}·${a - 1}) = ${c}.`)];
    }
    case 'montesinos': {
      const columns = family.pretzel;
      if (!columns || columns.length < 3 || columns.some((x) => Math.abs(x) < 2)) return [];
      return [reason('exact', p.crossings, 'lickorish-thistlethwaite', `The diagram is the standard diagram of ${name}: a Montesinos diagram of ${columns.length} ≥ 3 rational tangles 1/aᵢ with every |aᵢ| ≥ 2, hence reduced, and a reduced Montesinos diagram with at least three rational tangles has the fewest crossings of any diagram of its link (Lickorish–Thistlethwaite 1988, Comment. Math. Helv. 63), so c = ${columns.map((x) => Math.abs(x)).join(' + ')} = ${p.crossings}.`)];
    }
    case 'two-bridge': {
      if (Math.abs(family.p) < 2 || !p.alternating || !p.reduced || !p.connected) return [];
      const total = family.terms.reduce((s, b) => s + Math.abs(b), 0);
      if (total !== p.crossings) return [];
      return [reason('exact', total, 'two-bridge-alternating', `The diagram is ${name}, drawn from the continued fraction [${family.terms.join(', ')}] whose terms all have one sign; that drawing is reduced, alternating and connected, so its crossing count, the sum of the terms, is the crossing number (Kauffman–Murasugi–Thistlethwaite): c = ${total}.`)];
    }
  }
}

/**
 * Crossing numbers add under split union: c(L₁ ⊔ L₂) ≤ c(L₁) + c(L₂) from the
 * split diagram, and ≥ because deleting L₂'s components from any diagram of
 * the union leaves a diagram of L₁ (and vice versa) with the crossings between
 * them gone. So each piece of a disconnected diagram can be bounded on its own
 * and the bounds summed; this is never weaker than span V − (μ − 1).
 */
function splitUnionBounds(pieces: readonly CrossingNumberBounds[], pieceCount: number): { lower: BoundReason; exact?: BoundReason } {
  const lowers = pieces.map((b) => b.lower);
  const sum = lowers.reduce((s, v) => s + v, 0);
  const circles = pieceCount - pieces.length;
  const parts = `${pieces.length} piece${pieces.length === 1 ? '' : 's'} with crossings${circles > 0 ? ` and ${circles} crossingless circle${circles === 1 ? '' : 's'}` : ''}`;
  const lower = reason('lower', sum, 'split-union', `The projection falls apart into ${parts}; crossing numbers add under split union (deleting the other pieces' components from any diagram of the link leaves a diagram of each piece), so c ≥ ${lowers.length > 1 ? `${lowers.join(' + ')} = ` : ''}${sum}, summing the lower bounds of the pieces.`);
  if (pieces.some((b) => b.exact === null)) return { lower };
  const exacts = pieces.map((b) => b.exact!);
  const total = exacts.reduce((s, v) => s + v, 0);
  const exact = reason('exact', total, 'split-union', `The projection falls apart into ${parts}, each of known crossing number (${exacts.join(', ')}${circles > 0 ? ', and 0 for each circle' : ''}); crossing numbers add under split union, so c = ${total}.`);
  return { lower, exact };
}

/** True when the graph on the components with an edge for every non-zero linking number is connected. */
function linkingGraphConnected(p: DiagramProperties): boolean {
  const parent = Array.from({ length: p.components }, (_, i) => i);
  const find = (x: number): number => (parent[x] === x ? x : (parent[x] = find(parent[x]!)));
  let groups = p.components;
  for (const { components: [i, j], value } of p.linking) {
    if (value === 0) continue;
    const a = find(i);
    const b = find(j);
    if (a !== b) {
      parent[a] = b;
      groups--;
    }
  }
  return groups === 1;
}

function reason(bound: BoundReason['bound'], value: number, theorem: TheoremId, text: string): BoundReason {
  return { bound, value, theorem, text };
}
