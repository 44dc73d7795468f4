/** Whether the diagram is adequate (both all-A and all-B states adequate), with the state circle counts. */
import type { Invariant } from '../registry/types.ts';
import { judgePropertyClaim } from '../../claims/scalar-claims.ts';

export const adequateInvariant: Invariant = {
  id: 'adequate',
  doc: 'Whether both the all-A and the all-B state of the diagram are adequate (no state circle meets itself at a crossing).',
  cost: 'instant',
  conventions: [],
  claims: [
    {
      key: 'adequate',
      noun: 'adequate',
      valueDoc: '`yes`, `no`, `true` or `false` (also inside `\\text{…}`)',
      example: 'yes',
      changedBy: ['summand-chirality'],
      judge: (text, report) => judgePropertyClaim('adequate', text, report),
    },
  ],
  fills: [],
  json: [
    { field: 'adequate', example: true, value: (r) => r.adequate },
    { field: 'aAdequate', example: true, value: (r) => r.aAdequate },
    { field: 'bAdequate', example: true, value: (r) => r.bAdequate },
    { field: 'stateCircles', example: { a: 2, b: 3 }, value: (r) => ({ a: r.stateCircles.a, b: r.stateCircles.b }) },
  ],
  tests: ['test/properties/properties.test.ts'],
};
