/** Shared helpers of the notation tests. */
import { expect } from 'vitest';
import { isInputError, type InputError } from '../../src/core/errors.ts';
import { writhe, type LinkDiagram, type Notation } from '../../src/core/diagram/model.ts';
import { Laurent } from '../../src/core/poly/laurent.ts';
import { bracketByStateSum } from '../../src/core/invariants/state-sum.ts';
import { parseDiagramCode, type ParseOptions } from '../../src/core/notation/index.ts';

/** The Jones polynomial from the bracket: V(t) = (−A³)^(−w) ⟨D⟩ at A = t^(−1/4) (Kauffman 1987, common practice). */
export function jonesByStateSum(d: LinkDiagram): Laurent {
  const w = writhe(d);
  return bracketByStateSum(d)
    .mul(Laurent.monomial(-3 * w, w % 2 === 0 ? 1n : -1n))
    .substitutePower(-1 / 4);
}

export function poly(terms: [number, number][]): Laurent {
  return Laurent.fromTerms(terms);
}

export function equalUpToMirror(a: Laurent, b: Laurent): boolean {
  return a.equals(b) || a.equals(b.substitutePower(-1));
}

/** Parses and returns the InputError it must throw. */
export function parseError(text: string, notation: Notation, options?: ParseOptions): InputError {
  try {
    parseDiagramCode(text, notation, options);
  } catch (e) {
    if (isInputError(e)) return e;
    throw e;
  }
  throw new Error(`expected ${JSON.stringify(text)} to be refused as ${notation}`);
}

/** Asserts a code-invalid error whose span covers exactly `spanned` (the first occurrence after `from`) and whose message contains every phrase. */
export function expectCodeError(error: InputError, text: string, spanned: string, phrases: string[], from = 0): void {
  expect(error.ruleId).toBe('code-invalid');
  const start = text.indexOf(spanned, from);
  expect(start).toBeGreaterThanOrEqual(0);
  expect(error.span).toEqual({ start, end: start + spanned.length });
  for (const phrase of phrases) expect(error.message).toContain(phrase);
}
