/** The span of the Jones polynomial, counted in the declared variable. */
import type { Invariant } from '../registry/types.ts';
import { judgeNumberClaim } from '../../claims/scalar-claims.ts';
import { numberLatex } from '../../claims/typeset.ts';
import { conventionJones } from '../../convention/convert.ts';

export const spanInvariant: Invariant = {
  id: 'span',
  doc: 'The span of V (highest minus lowest degree); with jones=q it is counted in q, twice the span in t.',
  cost: 'contraction',
  conventions: ['jones'],
  claims: [
    {
      key: 'span',
      noun: 'span of V',
      aliases: ['span V', 'span of V', 'span'],
      valueDoc: 'a number, halves allowed (`5/2`, `\\frac{5}{2}`), counted in the declared Jones variable',
      example: '3',
      changedBy: [],
      judge: (text, report, ctx) => judgeNumberClaim('span', text, report, ctx),
    },
  ],
  fills: [{ key: 'span', valueDoc: 'the span of V in the declared variable', typeset: (report, convention) => ({ kind: 'math', latex: numberLatex(conventionJones(report.jones, convention).span) }) }],
  json: [{ field: 'span', example: 3, value: (r) => r.span }],
  tests: ['test/invariants/jones-identities.test.ts', 'test/claims/judge.test.ts'],
};
