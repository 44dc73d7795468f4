/**
 * JSON forms shared by registered invariants (`compute --json`). Exact values
 * stay exact: coefficients are decimal strings, exponents JSON numbers (halves
 * and quarters are exact in binary).
 */
import type { Laurent } from '../../poly/laurent.ts';

export interface PolynomialJson {
  readonly variable: string;
  /** [exponent, coefficient] by ascending exponent, zero terms left out. */
  readonly terms: readonly (readonly [number, string])[];
}

export function polynomialJson(p: Laurent, variable: string): PolynomialJson {
  return { variable, terms: p.terms().map(([e, c]) => [e, c.toString()] as const) };
}
