/** The lowest degree of the Jones polynomial, in the declared variable. */
import type { Invariant } from '../registry/types.ts';
import { judgeNumberClaim } from '../../claims/scalar-claims.ts';

export const minDegreeInvariant: Invariant = {
  id: 'min-degree',
  doc: 'The lowest degree of V in the declared variable.',
  cost: 'contraction',
  conventions: ['jones'],
  claims: [
    {
      key: 'min-degree',
      noun: 'lowest degree of V',
      aliases: ['min deg V', 'lowest degree'],
      valueDoc: 'a number, halves allowed, counted in the declared Jones variable',
      example: '1',
      changedBy: ['chirality', 'summand-chirality'],
      judge: (text, report, ctx) => judgeNumberClaim('min-degree', text, report, ctx),
    },
  ],
  fills: [],
  json: [{ field: 'minDegree', example: 1, value: (r) => r.jonesMinDegree }],
  tests: ['test/claims/judge.test.ts'],
};
