/** The Conway polynomial ∇(z). */
import type { Invariant } from '../registry/types.ts';
import { classicalFill, judgeClassicalClaim } from '../../claims/classical-claims.ts';
import { polynomialJson } from '../registry/json.ts';

export const conwayInvariant: Invariant = {
  id: 'conway',
  doc: 'The Conway polynomial ∇(z), with Δ(t) = ∇(t^{1/2} − t^{−1/2}); 0 for a split diagram.',
  cost: 'polynomial',
  conventions: ['order'],
  claims: [
    {
      key: 'conway',
      noun: 'Conway polynomial',
      aliases: ['Conway polynomial', 'Conway', '∇(z)', '∇', '\\nabla(z)', '\\nabla'],
      valueDoc: 'a polynomial in z; see the section on classical invariants',
      example: '1 + z^2',
      changedBy: [],
      judge: (text, report, ctx) => judgeClassicalClaim('conway', text, report, ctx),
    },
  ],
  fills: [{ key: 'conway', valueDoc: '∇(z) in the declared term order', typeset: (report, convention) => classicalFill('conway', report, convention) }],
  json: [{ field: 'conway', example: { variable: 'z', terms: [[0, '1'], [2, '1']] }, value: (r) => polynomialJson(r.classical.conway, 'z') }],
  tests: ['test/classical/alexander.test.ts', 'test/classical/families.test.ts'],
};
