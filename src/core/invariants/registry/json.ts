/**
 * JSON forms shared by registered invariants (`compute --json`). Exact values
 * stay exact: coefficients are decimal strings, exponents JSON numbers (halves
 * and quarters are exact in binary).
 */
import type { Laurent } from '../../poly/laurent.ts';
import type { Laurent2 } from '../../poly/laurent2.ts';

export interface PolynomialJson {
  readonly variable: string;
  /** [exponent, coefficient] by ascending exponent, zero terms left out. */
  readonly terms: readonly (readonly [number, string])[];
}

export function polynomialJson(p: Laurent, variable: string): PolynomialJson {
  return { variable, terms: p.terms().map(([e, c]) => [e, c.toString()] as const) };
}

export interface TwoVariableJson {
  readonly variables: readonly [string, string];
  /** [first exponent, second exponent, coefficient], sorted by the first exponent, then the second; zero terms left out. */
  readonly terms: readonly (readonly [number, number, string])[];
}

export function twoVariableJson(p: Laurent2, variables: readonly [string, string]): TwoVariableJson {
  return { variables, terms: p.terms().map(([i, j, c]) => [i, j, c.toString()] as const) };
}
