/** The number of crossings of the diagram as drawn. */
import type { Invariant } from '../registry/types.ts';
import { judgeNumberClaim } from '../../claims/scalar-claims.ts';
import { numberLatex } from '../../claims/typeset.ts';

export const crossingsInvariant: Invariant = {
  id: 'crossings',
  doc: 'The number of crossings of the diagram as drawn (not the crossing number of the link).',
  cost: 'instant',
  conventions: [],
  claims: [
    {
      key: 'crossings',
      noun: 'crossing count',
      aliases: ['crossing count'],
      valueDoc: 'an integer',
      example: '3',
      changedBy: [],
      judge: (text, report, ctx) => judgeNumberClaim('crossings', text, report, ctx),
    },
  ],
  fills: [{ key: 'crossings', valueDoc: 'the number of crossings', typeset: (report) => ({ kind: 'math', latex: numberLatex(report.crossings) }) }],
  json: [{ field: 'crossings', example: 3, value: (r) => r.crossings }],
  tests: ['test/notation/known-knots.test.ts'],
};
