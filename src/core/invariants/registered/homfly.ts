/** The HOMFLY-PT polynomial P, P(unknot) = 1, in the declared variables (v, z) or (a, z). */
import type { Invariant } from '../registry/types.ts';
import { homflyValues, judgeSkeinClaim, twoVariableLatex } from '../../claims/skein-polynomial-claims.ts';
import { twoVariableJson } from '../registry/json.ts';
import { homflyOf } from './skein-values.ts';

export const homflyInvariant: Invariant = {
  id: 'homfly',
  doc: 'The HOMFLY-PT polynomial P with P(unknot) = 1, by contraction in the skein module of a disk (layered tangles, Lickorish–Millett 1987): v⁻¹P₊ − vP₋ = zP₀, or aP₊ − a⁻¹P₋ = zP₀ under `homfly=az`.',
  cost: 'contraction',
  conventions: ['homfly', 'order'],
  claims: [
    {
      key: 'homfly',
      noun: 'HOMFLY-PT polynomial',
      aliases: ['HOMFLY-PT', 'HOMFLY-PT polynomial', 'HOMFLY', 'P(v,z)', 'P(a,z)'],
      valueDoc: 'a Laurent polynomial in v and z (in a and z under `homfly=az`) in LaTeX math',
      example: '2v^2 - v^4 + v^2z^2',
      changedBy: ['chirality', 'summand-chirality'],
      judge: (text, report, ctx) => judgeSkeinClaim('homfly', 'HOMFLY-PT polynomial', text, homflyValues(homflyOf(report), ctx.convention), report, ctx.convention),
    },
  ],
  fills: [
    {
      key: 'homfly',
      valueDoc: 'P in the declared variables, grouped by powers of z',
      typeset: (report, convention) => {
        const values = homflyValues(homflyOf(report), convention);
        return { kind: 'math', latex: twoVariableLatex(values.declared, values.letters, convention) };
      },
    },
  ],
  json: [{ field: 'homfly', example: { variables: ['v', 'z'], terms: [[2, 0, '2'], [2, 2, '1'], [4, 0, '-1']] }, value: (r) => twoVariableJson(homflyOf(r), ['v', 'z']) }],
  tests: ['test/invariants/homfly.test.ts'],
};
