/** The determinant |Δ(−1)|. */
import type { Invariant } from '../registry/types.ts';
import { classicalFill, judgeClassicalClaim } from '../../claims/classical-claims.ts';

export const determinantInvariant: Invariant = {
  id: 'determinant',
  doc: 'The determinant det(L) = |Δ(−1)| = |det G| of a Goeritz matrix, checked both ways.',
  cost: 'polynomial',
  conventions: [],
  claims: [
    {
      key: 'determinant',
      noun: 'determinant',
      aliases: ['det', 'det(K)', 'det(L)'],
      valueDoc: 'an integer',
      example: '3',
      changedBy: [],
      judge: (text, report, ctx) => judgeClassicalClaim('determinant', text, report, ctx),
    },
  ],
  fills: [{ key: 'determinant', valueDoc: 'the determinant', typeset: (report, convention) => classicalFill('determinant', report, convention) }],
  json: [{ field: 'determinant', example: '3', value: (r) => r.classical.determinant.toString() }],
  tests: ['test/classical/families.test.ts', 'test/classical/matrices.test.ts'],
};
