/**
 * Slips shared by every one-variable polynomial key: one coefficient changed,
 * added or left out, or one term written with the wrong exponent.
 */
import { Laurent } from '../poly/laurent.ts';
import type { Diagnosis } from './api.ts';
import { polynomialLatex } from './typeset.ts';

function monomial(letter: string, exponent: number, coefficient = 1n): string {
  return polynomialLatex(Laurent.monomial(exponent, coefficient), letter, { order: 'ascending', halfPowers: 'power' });
}

/** `one-coefficient` when the claim differs from the computed value in exactly one term. */
export function oneCoefficientSlip(claim: Laurent, computed: Laurent, letter: string): Diagnosis | undefined {
  const difference = claim.sub(computed);
  if (difference.termCount !== 1) return undefined;
  const exponent = difference.exponents[0]!;
  const term = { exponent, computed: computed.coefficient(exponent).toString(), claimed: claim.coefficient(exponent).toString() };
  const power = exponent === 0 ? 'the constant term' : `the coefficient of ${monomial(letter, exponent)}`;
  return { kind: 'one-coefficient', term, detail: `only ${power} differs: computed ${term.computed}, claimed ${term.claimed}` };
}

/**
 * `one-exponent` when the claim is the computed value with one term moved to another power that the
 * computed value does not have (`t + t^3 - t^5` for `t + t^3 - t^4`).
 */
export function oneExponentSlip(claim: Laurent, computed: Laurent, letter: string): Diagnosis | undefined {
  const difference = claim.sub(computed);
  if (difference.termCount !== 2 || claim.termCount !== computed.termCount) return undefined;
  const [a, b] = difference.exponents as [number, number];
  const [from, to] = computed.coefficient(a) !== 0n && claim.coefficient(a) === 0n ? [a, b] : [b, a];
  const coefficient = computed.coefficient(from);
  if (coefficient === 0n || claim.coefficient(from) !== 0n || computed.coefficient(to) !== 0n || claim.coefficient(to) !== coefficient) return undefined;
  return {
    kind: 'one-exponent',
    exponent: { computed: from, claimed: to, coefficient: coefficient.toString() },
    detail: `only one exponent differs: the term ${monomial(letter, from, coefficient)} is written ${monomial(letter, to, coefficient)}`,
  };
}
