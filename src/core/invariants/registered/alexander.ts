/** The Alexander polynomial Δ(t) in Conway's symmetric normalisation. */
import type { Invariant } from '../registry/types.ts';
import { classicalFill, judgeClassicalClaim } from '../../claims/classical-claims.ts';
import { polynomialJson } from '../registry/json.ts';

export const alexanderInvariant: Invariant = {
  id: 'alexander',
  doc: "The Alexander polynomial Δ(t) in Conway's normalisation, Δ(t) = ∇(t^{1/2} − t^{−1/2}), from a Seifert matrix; 0 for a split diagram.",
  cost: 'polynomial',
  conventions: ['order', 'half-powers'],
  claims: [
    {
      key: 'alexander',
      noun: 'Alexander polynomial',
      aliases: ['Alexander polynomial', 'Alexander', 'Δ(t)', 'Δ', '\\Delta(t)', '\\Delta'],
      valueDoc:
        "a polynomial in t (Conway's symmetric normalisation) or in z; see the section on classical invariants. An Alexander polynomial stated with `\\doteq` (≐), as in `\\Delta(t) \\doteq t^2 - t + 1`, is checked only up to a unit ±t^k",
      example: 't^{-1} - 1 + t',
      changedBy: [],
      judge: (text, report, ctx) => judgeClassicalClaim('alexander', text, report, ctx),
    },
  ],
  fills: [{ key: 'alexander', valueDoc: 'Δ(t) in the declared term order', typeset: (report, convention) => classicalFill('alexander', report, convention) }],
  json: [{ field: 'alexander', example: { variable: 't', terms: [[-1, '1'], [0, '-1'], [1, '1']] }, value: (r) => polynomialJson(r.classical.alexander, 't') }],
  tests: ['test/classical/alexander.test.ts', 'test/classical/families.test.ts'],
};
