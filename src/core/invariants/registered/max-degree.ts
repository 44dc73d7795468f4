/** The highest degree of the Jones polynomial, in the declared variable. */
import type { Invariant } from '../registry/types.ts';
import { judgeNumberClaim } from '../../claims/scalar-claims.ts';

export const maxDegreeInvariant: Invariant = {
  id: 'max-degree',
  doc: 'The highest degree of V in the declared variable.',
  cost: 'contraction',
  conventions: ['jones'],
  claims: [
    {
      key: 'max-degree',
      noun: 'highest degree of V',
      aliases: ['max deg V', 'highest degree'],
      valueDoc: 'a number, halves allowed, counted in the declared Jones variable',
      example: '4',
      changedBy: ['chirality', 'summand-chirality'],
      judge: (text, report, ctx) => judgeNumberClaim('max-degree', text, report, ctx),
    },
  ],
  fills: [],
  json: [{ field: 'maxDegree', example: 4, value: (r) => r.jonesMaxDegree }],
  tests: ['test/claims/judge.test.ts'],
};
