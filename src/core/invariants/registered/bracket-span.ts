/** The span of the Kauffman bracket in A, in the declared normalisation. */
import type { Invariant } from '../registry/types.ts';
import { judgeNumberClaim } from '../../claims/scalar-claims.ts';

export const bracketSpanInvariant: Invariant = {
  id: 'bracket-span',
  doc: 'The span of ⟨D⟩ in A (four times the span of V, plus 4 with the loop normalisation).',
  cost: 'contraction',
  conventions: ['bracket'],
  claims: [
    {
      key: 'bracket-span',
      noun: 'span of the bracket',
      aliases: ['span ⟨D⟩', 'bracket span'],
      valueDoc: "an integer, the bracket's span in the declared normalisation",
      example: '12',
      changedBy: [],
      judge: (text, report, ctx) => judgeNumberClaim('bracket-span', text, report, ctx),
    },
  ],
  fills: [],
  json: [
    { field: 'bracketSpan', example: 12, value: (r) => r.bracketSpan },
    { field: 'bracketMinDegree', example: -7, value: (r) => r.bracketMinDegree },
    { field: 'bracketMaxDegree', example: 5, value: (r) => r.bracketMaxDegree },
  ],
  tests: ['test/claims/judge.test.ts'],
};
