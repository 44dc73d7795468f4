/**
 * The Alexander polynomial in Conway's normalisation and the Conway
 * polynomial, from a Seifert matrix V (V_ij = lk(a_i, a_j⁺), size m):
 *
 *   ∇(z) = det(t^(−1/2)·V − t^(1/2)·Vᵀ) with z = t^(1/2) − t^(−1/2),
 *   Δ(t) = ∇(t^(1/2) − t^(−1/2)).
 *
 * This is the normalisation that satisfies the skein relation
 * ∇(L₊) − ∇(L₋) = z·∇(L₀) with ∇(unknot) = 1; it gives Δ(t) = Δ(t⁻¹), Δ(1) = 1
 * for knots, half-integer exponents for an even number of components, and
 * ∇(positive Hopf link) = z. (With the factors t^(±1/2) the other way round,
 * links with an even number of components would change sign.)
 */
import { Laurent } from '../../poly/laurent.ts';
import { pencilDeterminant } from './modular.ts';
import { bandOrder, combine, permute, transpose, type SparseMatrix } from './sparse-matrix.ts';

export interface AlexanderResult {
  /** Δ(t), exponents in ½ℤ. */
  readonly alexander: Laurent;
  /** ∇(z), integer exponents. */
  readonly conway: Laurent;
  /** Primes used by the modular determinant. */
  readonly primes: number;
}

export function alexanderFromSeifertMatrix(seifert: SparseMatrix): AlexanderResult {
  const m = seifert.size;
  if (m === 0) return { alexander: Laurent.one, conway: Laurent.one, primes: 0 };
  const order = bandOrder(combine(1n, seifert, 1n, transpose(seifert)));
  const v = permute(seifert, order);
  const vt = transpose(v);
  const sign = m % 2 === 0 ? 1 : -1;
  // det(t^(−1/2)V − t^(1/2)Vᵀ) = (−1)^m · t^(−m/2) · det(t·Vᵀ − V).
  const { coefficients, primes } = pencilDeterminant(vt, v, sign);
  const alexander = Laurent.fromDense(sign === 1 ? coefficients : coefficients.map((c) => -c), -m / 2);
  return { alexander, conway: conwayFromAlexander(alexander), primes };
}

/**
 * Rewrites a Δ(t) that is symmetric under t^(1/2) ↦ −t^(−1/2) as ∇(z): with
 * x = t^(1/2), peel off the top term c·x^k as c·z^k = c·(x − x⁻¹)^k.
 */
export function conwayFromAlexander(alexander: Laurent): Laurent {
  if (alexander.isZero) return Laurent.zero;
  const rest = new Map<number, bigint>();
  for (const [e, c] of alexander.terms()) rest.set(2 * e, c);
  const conway: [number, bigint][] = [];
  let top = Math.max(...rest.keys());
  while (top >= 0) {
    const c = rest.get(top) ?? 0n;
    if (c !== 0n) {
      conway.push([top, c]);
      // (x − x⁻¹)^k = Σ_i C(k,i)·(−1)^i·x^(k−2i)
      let binomial = 1n;
      for (let i = 0; i <= top; i++) {
        const e = top - 2 * i;
        const term = i % 2 === 0 ? c * binomial : -c * binomial;
        rest.set(e, (rest.get(e) ?? 0n) - term);
        binomial = (binomial * BigInt(top - i)) / BigInt(i + 1);
      }
    }
    rest.delete(top);
    top--;
  }
  for (const [e, c] of rest) {
    if (c !== 0n) throw new Error(`internal: Δ is not a polynomial in t^(1/2) − t^(−1/2) (left x^${e})`);
  }
  return Laurent.fromTerms(conway);
}
