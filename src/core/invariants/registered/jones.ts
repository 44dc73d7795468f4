/** The Jones polynomial V(t), V(unknot) = 1, written in the declared variable. */
import type { Invariant } from '../registry/types.ts';
import { judgePolynomialClaim } from '../../claims/polynomial-claims.ts';
import { jonesLatex } from '../../claims/typeset.ts';
import { polynomialJson } from '../registry/json.ts';

export const jonesInvariant: Invariant = {
  id: 'jones',
  doc: 'The Jones polynomial V, with V(unknot) = 1, computed from the Kauffman bracket as V(t) = (−A³)^{−w}⟨D⟩ at A = t^{−1/4}.',
  cost: 'contraction',
  conventions: ['jones', 'order', 'half-powers'],
  claims: [
    {
      key: 'jones',
      noun: 'Jones polynomial',
      aliases: ['Jones polynomial', 'Jones', 'V(t)', 'V', 'V(q)'],
      valueDoc: 'a Laurent polynomial in LaTeX math, in the declared Jones variable (half powers of t allowed)',
      example: 't + t^3 - t^4',
      changedBy: ['chirality', 'summand-chirality'],
      judge: (text, report, ctx) => judgePolynomialClaim('jones', text, report, ctx),
    },
  ],
  fills: [{ key: 'jones', valueDoc: 'V in the declared variable, term order and half-power style', typeset: (report, convention) => ({ kind: 'math', latex: jonesLatex(report, convention) }) }],
  json: [{ field: 'jones', example: { variable: 't', terms: [[1, '1'], [3, '1'], [4, '-1']] }, value: (r) => polynomialJson(r.jones, 't') }],
  tests: ['test/invariants/jones-values.test.ts', 'test/invariants/jones-identities.test.ts'],
};
