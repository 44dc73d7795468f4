/**
 * Exact arithmetic in ℤ[ζ₈], ζ₈ = e^(iπ/4): an element is c₀ + c₁ζ + c₂ζ² + c₃ζ³ with BigInt
 * coefficients, reduced by ζ⁴ = −1. Enough to evaluate a Jones polynomial at t = i (t^(1/2) = ζ₈)
 * without floats; √2 = ζ + ζ⁻¹ = ζ − ζ³ lives here too.
 */
import type { Laurent } from './laurent.ts';

export type Cyclotomic8 = readonly [bigint, bigint, bigint, bigint];

export const ZERO8: Cyclotomic8 = [0n, 0n, 0n, 0n];
export const ONE8: Cyclotomic8 = [1n, 0n, 0n, 0n];
/** √2 = ζ₈ + ζ₈⁻¹ = ζ₈ − ζ₈³. */
export const SQRT2: Cyclotomic8 = [0n, 1n, 0n, -1n];

/** c · ζ₈^k for any integer k. */
export function zetaPower(k: number, c: bigint = 1n): Cyclotomic8 {
  const r = ((k % 8) + 8) % 8;
  const coefficient = r < 4 ? c : -c;
  const out: bigint[] = [0n, 0n, 0n, 0n];
  out[r % 4] = coefficient;
  return out as unknown as Cyclotomic8;
}

export function add8(x: Cyclotomic8, y: Cyclotomic8): Cyclotomic8 {
  return [x[0] + y[0], x[1] + y[1], x[2] + y[2], x[3] + y[3]];
}

export function mul8(x: Cyclotomic8, y: Cyclotomic8): Cyclotomic8 {
  const out = [0n, 0n, 0n, 0n];
  for (let i = 0; i < 4; i++) {
    for (let j = 0; j < 4; j++) {
      const k = i + j;
      if (k < 4) out[k]! += x[i]! * y[j]!;
      else out[k - 4]! -= x[i]! * y[j]!;
    }
  }
  return out as unknown as Cyclotomic8;
}

export function pow8(x: Cyclotomic8, n: number): Cyclotomic8 {
  if (!Number.isInteger(n) || n < 0) throw new RangeError(`power ${n} must be a natural number`);
  let result = ONE8;
  let base = x;
  for (let e = n; e > 0; e >>= 1) {
    if (e & 1) result = mul8(result, base);
    base = mul8(base, base);
  }
  return result;
}

export function neg8(x: Cyclotomic8): Cyclotomic8 {
  return [-x[0], -x[1], -x[2], -x[3]];
}

export function equals8(x: Cyclotomic8, y: Cyclotomic8): boolean {
  return x[0] === y[0] && x[1] === y[1] && x[2] === y[2] && x[3] === y[3];
}

/**
 * p(t) at t = i with t^(1/2) = ζ₈, so t^e = ζ₈^(2e). Exponents must be half-integers, as those of a
 * Jones polynomial are.
 */
export function atImaginaryUnit(p: Laurent): Cyclotomic8 {
  let sum = ZERO8;
  for (const [e, c] of p.terms()) {
    const k = 2 * e;
    if (!Number.isInteger(k)) throw new RangeError(`exponent ${e} is not a half-integer: t = i is not defined for it`);
    sum = add8(sum, zetaPower(k, c));
  }
  return sum;
}

/** As text, for messages: a + bζ + cζ² + dζ³ with ζ = e^(iπ/4). */
export function format8(x: Cyclotomic8): string {
  const parts = x.flatMap((c, k) => (c === 0n ? [] : [`${c}${k === 0 ? '' : k === 1 ? 'ζ' : `ζ^${k}`}`]));
  return parts.length === 0 ? '0' : parts.join(' + ').replace(/\+ -/g, '- ');
}
