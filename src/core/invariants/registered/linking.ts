/** Linking numbers of the pairs of components of a link. */
import type { Invariant } from '../registry/types.ts';
import { judgeNumberClaim, linkingInapplicable, linkingLatex } from '../../claims/scalar-claims.ts';

export const linkingInvariant: Invariant = {
  id: 'linking',
  doc: 'The linking number of each pair of components: half the sum of the signs of the crossings between them.',
  cost: 'instant',
  conventions: [],
  inapplicable: linkingInapplicable,
  claims: [
    {
      key: 'linking',
      noun: 'linking number',
      aliases: ['lk', 'linking number'],
      valueDoc:
        'an integer for a two-component link; for more components, one value per pair in the order (1,2), (1,3), …, (2,3), … separated by commas or semicolons, optionally in parentheses (`(1, 0, 1)`); a left-hand side such as `\\operatorname{lk}(K_1, K_2) =` is skipped',
      example: '1',
      changedBy: ['chirality', 'summand-chirality'],
      judge: (text, report, ctx) => judgeNumberClaim('linking', text, report, ctx),
    },
  ],
  fills: [
    {
      key: 'linking',
      valueDoc: 'the linking number of a two-component link; for more components, one value per pair in the order of the claims',
      typeset: (report) => ({ kind: 'math', latex: linkingLatex(report) }),
    },
  ],
  json: [
    {
      field: 'linking',
      example: [],
      value: (r) => r.linking.map((l) => ({ components: [l.components[0], l.components[1]] as const, value: l.value })),
    },
  ],
  tests: ['test/properties/properties.test.ts'],
};
