/** The Kauffman bracket ⟨D⟩ in A, in the declared normalisation (⟨O⟩ = 1 or −A² − A⁻²). */
import type { Invariant } from '../registry/types.ts';
import { judgePolynomialClaim } from '../../claims/polynomial-claims.ts';
import { bracketLatex } from '../../claims/typeset.ts';
import { polynomialJson } from '../registry/json.ts';

export const bracketInvariant: Invariant = {
  id: 'bracket',
  doc: 'The Kauffman bracket ⟨D⟩ of the diagram in A, by tangle contraction; a diagram invariant (it changes under Reidemeister I).',
  cost: 'contraction',
  conventions: ['bracket', 'order'],
  claims: [
    {
      key: 'bracket',
      noun: 'Kauffman bracket',
      aliases: ['Kauffman bracket', 'bracket', '⟨D⟩', '<D>'],
      valueDoc: 'a Laurent polynomial in A in LaTeX math, in the declared normalisation',
      example: 'A^{-7} - A^{-3} - A^{5}',
      changedBy: ['chirality', 'summand-chirality', 'kink-sign'],
      judge: (text, report, ctx) => judgePolynomialClaim('bracket', text, report, ctx),
    },
  ],
  fills: [{ key: 'bracket', valueDoc: '⟨D⟩ in A, in the declared normalisation and term order', typeset: (report, convention) => ({ kind: 'math', latex: bracketLatex(report, convention) }) }],
  json: [
    { field: 'bracket', example: { variable: 'A', terms: [[-7, '1'], [-3, '-1'], [5, '-1']] }, value: (r) => polynomialJson(r.bracket, 'A') },
    { field: 'boundaryWidth', example: 4, value: (r) => r.boundaryWidth },
  ],
  tests: ['test/invariants/bracket-oracle.test.ts', 'test/invariants/jones-values.test.ts'],
};
