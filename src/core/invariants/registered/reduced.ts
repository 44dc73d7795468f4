/** Whether the diagram is reduced (no nugatory crossing), and which crossings are nugatory. */
import type { Invariant } from '../registry/types.ts';
import { judgePropertyClaim } from '../../claims/scalar-claims.ts';

export const reducedInvariant: Invariant = {
  id: 'reduced',
  doc: 'Whether no crossing of the diagram is nugatory (a crossing whose removal disconnects the projection).',
  cost: 'instant',
  conventions: [],
  claims: [
    {
      key: 'reduced',
      noun: 'reduced',
      valueDoc: '`yes`, `no`, `true` or `false` (also inside `\\text{…}`)',
      example: 'yes',
      changedBy: [],
      judge: (text, report) => judgePropertyClaim('reduced', text, report),
    },
  ],
  fills: [],
  json: [
    { field: 'reduced', example: true, value: (r) => r.reduced },
    { field: 'nugatory', example: [], value: (r) => [...r.nugatory] },
  ],
  tests: ['test/properties/properties.test.ts'],
};
