/** Whether the diagram is alternating. */
import type { Invariant } from '../registry/types.ts';
import { judgePropertyClaim } from '../../claims/scalar-claims.ts';

export const alternatingInvariant: Invariant = {
  id: 'alternating',
  doc: 'Whether over- and under-crossings alternate along every component of the diagram.',
  cost: 'instant',
  conventions: [],
  claims: [
    {
      key: 'alternating',
      noun: 'alternating',
      valueDoc: '`yes`, `no`, `true` or `false` (also inside `\\text{…}`)',
      example: 'yes',
      changedBy: [],
      judge: (text, report) => judgePropertyClaim('alternating', text, report),
    },
  ],
  fills: [],
  json: [{ field: 'alternating', example: true, value: (r) => r.alternating }],
  tests: ['test/properties/properties.test.ts'],
};
