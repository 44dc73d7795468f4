/**
 * Diagrams of the families, each built explicitly in the one diagram model and
 * marked with what it is (identity.ts). Parameters are checked by the parser
 * (parse.ts) in the author's terms; these builders throw RangeError only on
 * input it should have refused.
 */
import { assembleDiagram } from '../diagram/assemble.ts';
import { closeBraid } from '../diagram/braid-closure.ts';
import { mirrorDiagram, type LinkDiagram } from '../diagram/model.ts';
import { connectedSum, disjointUnion } from '../diagram/operations.ts';
import { familyOf, markFamily, mirrorIdentity, type Fraction } from './identity.ts';
import { TangleBuilder } from './tangle.ts';

export function gcd(a: number, b: number): number {
  a = Math.abs(a);
  b = Math.abs(b);
  while (b !== 0) [a, b] = [b, a % b];
  return a;
}

/**
 * The regular continued fraction of p/q (q ≠ 0): terms b₀, b₁, …, bₘ with
 * p/q = b₀ + 1/(b₁ + 1/(… + 1/bₘ)), all of the sign of p/q, b₁…bₘ non-zero and
 * |bₘ| ≥ 2 when m ≥ 1. For p = 0 it is [0].
 */
export function continuedFraction(p: number, q: number): number[] {
  if (q === 0) throw new RangeError('a fraction needs a non-zero denominator');
  const sign = Math.sign(p) * Math.sign(q);
  let [a, b] = [Math.abs(p), Math.abs(q)];
  const terms: number[] = [];
  do {
    terms.push(sign * Math.floor(a / b) || 0);
    [a, b] = [b, a % b];
  } while (b !== 0);
  return terms;
}

/** Crossings of a torus link diagram built here: the closure of (σ₁…σ_{m−1})^k, m = min(|p|, |q|), k = max. */
export function torusCrossings(p: number, q: number): number {
  const m = Math.min(Math.abs(p), Math.abs(q));
  return m <= 1 ? 0 : Math.max(Math.abs(p), Math.abs(q)) * (m - 1);
}

const asFamily = (d: LinkDiagram): LinkDiagram => ({ ...d, notation: 'family' });

function unlink(circles: number): LinkDiagram {
  return assembleDiagram([], { notation: 'family', freeLoops: circles });
}

/**
 * T(p, q): the closure of the braid (σ₁σ₂…σ_{m−1})^k on m = min(|p|, |q|)
 * strands, k = max(|p|, |q|), every crossing of the sign of p·q (T(2, 3) is
 * the positive trefoil). T(p, 0) and T(0, q) are unlinks of |p| or |q|
 * circles, T(±1, q) the unknot.
 */
export function torusLink(p: number, q: number): LinkDiagram {
  if (p === 0 && q === 0) throw new RangeError('T(0, 0) is not a link');
  const m = Math.min(Math.abs(p), Math.abs(q));
  const k = Math.max(Math.abs(p), Math.abs(q));
  if (m === 0) return markFamily(unlink(k), { kind: 'torus', p, q });
  const sign = Math.sign(p * q);
  const word: number[] = [];
  for (let r = 0; r < k; r++) for (let i = 1; i < m; i++) word.push(sign * i);
  return markFamily(asFamily(closeBraid(word, m)), { kind: 'torus', p, q });
}

/** The numerator closure of the sum of the rational tangles with these continued fractions. */
function closedTangleSum(tangleTerms: readonly (readonly number[])[]): LinkDiagram {
  const builder = new TangleBuilder();
  let sum = builder.rational(tangleTerms[0]!);
  for (const terms of tangleTerms.slice(1)) sum = builder.sum(sum, builder.rational(terms));
  builder.closeNumerator(sum);
  return builder.orientAndAssemble();
}

/**
 * The Montesinos link of rational tangles p₁/q₁, …, p_r/q_r: the numerator
 * closure of their sum, each tangle drawn alternating from the continued
 * fraction of its fraction. When every tangle is 1/aᵢ with |aᵢ| ≥ 2 the drawing
 * is the pretzel diagram P(a₁, …, a_r) (the continued fraction of 1/a is then
 * [0, a], the column `pretzelLink` draws), and it is marked as one.
 */
export function montesinosLink(tangles: readonly Fraction[]): LinkDiagram {
  if (tangles.length === 0) throw new RangeError('a Montesinos link needs at least one tangle');
  const d = closedTangleSum(tangles.map((f) => continuedFraction(f.p, f.q)));
  const lowest = tangles.map((f) => reduced(f));
  const columns = lowest.every((f) => Math.abs(f.p) === 1 && f.q >= 2) ? { pretzel: lowest.map((f) => f.p * f.q) } : {};
  return markFamily(d, { kind: 'montesinos', tangles: lowest, ...columns });
}

/** P(a₁, …, a_k): the Montesinos link of the tangles 1/a₁, …, 1/a_k (column i has |aᵢ| crossings). */
export function pretzelLink(twists: readonly number[]): LinkDiagram {
  if (twists.length === 0 || twists.some((a) => a === 0)) throw new RangeError('a pretzel link needs columns of at least one crossing');
  const d = closedTangleSum(twists.map((a) => [0, a]));
  return markFamily(d, { kind: 'montesinos', tangles: twists.map((a) => reduced({ p: 1, q: a })), pretzel: [...twists] });
}

function reduced(f: Fraction): Fraction {
  const g = gcd(f.p, f.q) || 1;
  const s = f.q < 0 ? -1 : 1;
  return { p: (s * f.p) / g, q: (s * f.q) / g };
}

/**
 * The two-bridge link of p/q (gcd(p, q) = 1, q ≠ 0): the numerator closure of
 * the rational tangle ±|p|/q′ with q′ ≡ |q| (mod |p|), 0 < q′ < |p|, which is
 * the same link (twists at the bottom of a tangle undo under that closure) and
 * whose continued fraction has all terms of one sign and no nugatory twist.
 * p = 0 is the two-component unlink, |p| = 1 the unknot.
 */
export function twoBridgeLink(p: number, q: number, twist?: number): LinkDiagram {
  if (q === 0 || gcd(p, q) !== 1) throw new RangeError(`${p}/${q} is not a fraction in lowest terms`);
  if (p === 0) return markFamily(unlink(2), { kind: 'two-bridge', p, q, terms: [0] });
  if (Math.abs(p) === 1) return markFamily(unlink(1), { kind: 'two-bridge', p, q, terms: [] });
  const big = Math.abs(p);
  const terms = continuedFraction(Math.sign(p) * Math.sign(q) * big, Math.abs(q) % big);
  return markFamily(closedTangleSum([terms]), { kind: 'two-bridge', p, q, terms, ...(twist !== undefined ? { twist } : {}) });
}

/**
 * The twist knot with n half twists (n ≠ 0): a clasp and n half twists, the
 * two-bridge knot of (2n + 1)/2 (continued fraction [n, 2]); n = 1 is the
 * trefoil, n = 2 the figure-eight knot. Negative n gives the mirror image of
 * the knot with |n| half twists.
 */
export function twistKnot(n: number): LinkDiagram {
  if (n === 0 || !Number.isInteger(n)) throw new RangeError('a twist knot needs a non-zero whole number of half twists');
  const p = n > 0 ? 2 * n + 1 : 2 * n - 1;
  return twoBridgeLink(p, 2, n);
}

/** The mirror image, keeping (mirrored) what it is. */
export function mirrorOf(d: LinkDiagram): LinkDiagram {
  const mirrored = asFamily(mirrorDiagram(d));
  const identity = familyOf(d);
  return identity ? markFamily(mirrored, mirrorIdentity(identity)) : mirrored;
}

/** The connected sum of the diagrams in order, each joined along its first edge. No family identity: it is a sum. */
export function connectedSumOf(diagrams: readonly LinkDiagram[]): LinkDiagram {
  return asFamily(diagrams.slice(1).reduce((sum, d) => connectedSum(sum, d), diagrams[0]!));
}

/** The split union of the diagrams side by side. */
export function splitUnionOf(diagrams: readonly LinkDiagram[]): LinkDiagram {
  return asFamily(diagrams.slice(1).reduce((union, d) => disjointUnion(union, d), diagrams[0]!));
}
