/** Kauffman's two-variable polynomial F(a, z), or its Dubrovnik variant under `kauffman=dubrovnik`. */
import type { Invariant } from '../registry/types.ts';
import { judgeSkeinClaim, kauffmanValues, twoVariableLatex } from '../../claims/skein-polynomial-claims.ts';
import { twoVariableJson } from '../registry/json.ts';
import { dubrovnikOf, kauffmanOf } from './skein-values.ts';

export const kauffmanInvariant: Invariant = {
  id: 'kauffman',
  doc: "Kauffman's polynomial F(a, z) = a^{−w}Λ, Λ₊ + Λ₋ = z(Λ₀ + Λ∞), Λ(positive curl) = aΛ, F(unknot) = 1 (or the Dubrovnik variant, Λ₊ − Λ₋ = z(Λ₀ − Λ∞)), by contraction in the unoriented skein module of a disk.",
  cost: 'contraction',
  conventions: ['kauffman', 'order'],
  claims: [
    {
      key: 'kauffman',
      noun: 'Kauffman polynomial',
      aliases: ['Kauffman polynomial', 'F(a,z)', 'Dubrovnik polynomial'],
      valueDoc: 'a Laurent polynomial in a and z in LaTeX math (F, or the Dubrovnik polynomial under `kauffman=dubrovnik`)',
      example: '-a^{-4} - 2a^{-2} + a^{-5}z + a^{-3}z + a^{-4}z^2 + a^{-2}z^2',
      changedBy: ['chirality', 'summand-chirality'],
      judge: (text, report, ctx) =>
        judgeSkeinClaim('kauffman', 'Kauffman polynomial', text, kauffmanValues(kauffmanOf(report), dubrovnikOf(report), ctx.convention), report, ctx.convention),
    },
  ],
  fills: [
    {
      key: 'kauffman',
      valueDoc: 'F (or the Dubrovnik polynomial) in a and z, grouped by powers of z',
      typeset: (report, convention) => {
        const f = kauffmanOf(report);
        const values = kauffmanValues(f, convention.kauffmanVariant === 'kauffman' ? f : dubrovnikOf(report), convention);
        return { kind: 'math', latex: twoVariableLatex(values.declared, values.letters, convention) };
      },
    },
  ],
  json: [
    {
      field: 'kauffman',
      example: { variables: ['a', 'z'], terms: [[-5, 1, '1'], [-4, 0, '-1'], [-4, 2, '1'], [-3, 1, '1'], [-2, 0, '-2'], [-2, 2, '1']] },
      value: (r) => twoVariableJson(kauffmanOf(r), ['a', 'z']),
    },
  ],
  tests: ['test/invariants/kauffman-polynomial.test.ts'],
};
