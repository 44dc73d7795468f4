/** The Arf invariant of a knot (null for links). */
import type { Invariant } from '../registry/types.ts';
import { judgeArfClaim } from '../../claims/skein-polynomial-claims.ts';
import { arfOf } from './skein-values.ts';

export const arfInvariant: Invariant = {
  id: 'arf',
  doc: 'The Arf invariant of a knot: the z² coefficient of ∇ mod 2, checked against Levine’s Δ(−1) mod 8; not computed for links.',
  cost: 'polynomial',
  conventions: [],
  claims: [
    {
      key: 'arf',
      noun: 'Arf invariant',
      aliases: ['Arf invariant', 'Arf', 'Arf(K)'],
      valueDoc: '0 or 1 (knots only)',
      example: '1',
      changedBy: [],
      judge: (text, report) => judgeArfClaim(text, arfOf(report), report.components),
    },
  ],
  fills: [
    {
      key: 'arf',
      valueDoc: 'the Arf invariant of a knot, or a note that it is not computed for links',
      typeset: (report) => {
        const arf = arfOf(report);
        return arf === null ? { kind: 'text', text: 'not defined here (skeinproof computes the Arf invariant of knots only)' } : { kind: 'math', latex: `${arf}` };
      },
    },
  ],
  json: [{ field: 'arf', example: 1, value: (r) => arfOf(r) }],
  tests: ['test/invariants/braid-index-arf.test.ts'],
};
