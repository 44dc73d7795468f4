/**
 * Exact evaluations of Jones polynomials used by the identity tests: no
 * floating point, only integer sums over exponent classes.
 */
import type { Laurent } from '../../src/core/poly/laurent.ts';

function integerExponents(v: Laurent): void {
  if (!v.exponents.every(Number.isInteger)) throw new RangeError(`expected integer powers of t, got ${v.toPlainString('t')}`);
}

/** V(ω) for ω = e^(2πi/3), as [a, b] meaning a + bω in ℤ[ω] (ω² = −1 − ω). */
export function valueAtCubeRootOfUnity(v: Laurent): [bigint, bigint] {
  integerExponents(v);
  const sums = [0n, 0n, 0n];
  v.terms().forEach(([e, c]) => (sums[((e % 3) + 3) % 3]! += c));
  return [sums[0]! - sums[2]!, sums[1]! - sums[2]!];
}

/** V′(1) = Σ e·c_e. */
export function derivativeAtOne(v: Laurent): bigint {
  integerExponents(v);
  return v.terms().reduce((s, [e, c]) => s + BigInt(e) * c, 0n);
}

/** V(−1) for a knot (integer powers). */
export function valueAtMinusOne(v: Laurent): bigint {
  integerExponents(v);
  return v.terms().reduce((s, [e, c]) => s + (e % 2 === 0 ? c : -c), 0n);
}

export function largestCoefficient(p: Laurent): bigint {
  return p.coefficients.reduce((m, c) => (c < 0n ? -c : c) > m ? (c < 0n ? -c : c) : m, 0n);
}
