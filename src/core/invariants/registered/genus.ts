/** Bounds on the Seifert genus, stated in prose. */
import type { Invariant } from '../registry/types.ts';
import { genusStatement } from '../../claims/classical-claims.ts';

export const genusInvariant: Invariant = {
  id: 'genus',
  doc: "Bounds on the genus of a Seifert surface: below by span Δ and |σ|, above by Seifert's algorithm on the diagram.",
  cost: 'polynomial',
  conventions: [],
  claims: [],
  fills: [{ key: 'genus', valueDoc: 'a paragraph giving the genus bounds and where they come from', typeset: (report) => genusStatement(report) }],
  json: [],
  withoutJson: 'the bounds are prose; their ingredients are the fields alexander and signature',
  tests: ['test/classical/families.test.ts'],
};
