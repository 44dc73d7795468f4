/** The writhe of the diagram: positive minus negative crossings. */
import type { Invariant } from '../registry/types.ts';
import { judgeNumberClaim } from '../../claims/scalar-claims.ts';
import { numberLatex } from '../../claims/typeset.ts';

export const writheInvariant: Invariant = {
  id: 'writhe',
  doc: 'The writhe w: the number of positive crossings minus the number of negative ones (a diagram invariant).',
  cost: 'instant',
  conventions: [],
  claims: [
    {
      key: 'writhe',
      noun: 'writhe',
      aliases: ['w', 'w(D)'],
      valueDoc: 'an integer',
      example: '3',
      changedBy: ['chirality', 'summand-chirality', 'kink-sign'],
      judge: (text, report, ctx) => judgeNumberClaim('writhe', text, report, ctx),
    },
  ],
  fills: [{ key: 'writhe', valueDoc: 'the writhe', typeset: (report) => ({ kind: 'math', latex: numberLatex(report.writhe) }) }],
  json: [
    { field: 'writhe', example: 3, value: (r) => r.writhe },
    { field: 'positiveCrossings', example: 3, value: (r) => r.positiveCrossings },
    { field: 'negativeCrossings', example: 0, value: (r) => r.negativeCrossings },
  ],
  tests: ['test/notation/known-knots.test.ts', 'test/claims/judge.test.ts'],
};
