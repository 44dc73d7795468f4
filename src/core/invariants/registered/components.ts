/** The number of components of the link, and whether the projection is connected. */
import type { Invariant } from '../registry/types.ts';
import { judgeNumberClaim } from '../../claims/scalar-claims.ts';
import { numberLatex } from '../../claims/typeset.ts';

export const componentsInvariant: Invariant = {
  id: 'components',
  doc: 'The number of components of the link (closed curves of the diagram, free loops included).',
  cost: 'instant',
  conventions: [],
  claims: [
    {
      key: 'components',
      noun: 'component count',
      aliases: ['number of components', 'μ'],
      valueDoc: 'an integer',
      example: '1',
      changedBy: [],
      judge: (text, report, ctx) => judgeNumberClaim('components', text, report, ctx),
    },
  ],
  fills: [{ key: 'components', valueDoc: 'the number of components', typeset: (report) => ({ kind: 'math', latex: numberLatex(report.components) }) }],
  json: [
    { field: 'components', example: 1, value: (r) => r.components },
    { field: 'connected', example: true, value: (r) => r.connected },
  ],
  tests: ['test/notation/known-knots.test.ts'],
};
