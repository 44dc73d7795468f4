/** The Arf invariant of a knot or a proper link (not defined for other links). */
import type { Invariant } from '../registry/types.ts';
import { definedArf, judgeArfClaim } from '../../claims/skein-polynomial-claims.ts';
import { notProperReason, oddLinkingComponents } from '../arf.ts';
import { arfOf } from './skein-values.ts';

export const arfInvariant: Invariant = {
  id: 'arf',
  doc: 'The Arf invariant of a knot (the z² coefficient of ∇ mod 2, checked against Levine’s Δ(−1) mod 8) or of a proper link (from V(i) by Murakami’s theorem, checked by fusing the link into a knot); not defined for a link that is not proper.',
  cost: 'contraction',
  conventions: [],
  // From the linking numbers alone, so a table can accept an empty cell without computing V.
  inapplicable: (report) => {
    if (report.components === 1) return undefined;
    const odd = oddLinkingComponents(report.linking, report.components);
    return odd.length === 0 ? undefined : notProperReason(odd);
  },
  claims: [
    {
      key: 'arf',
      noun: 'Arf invariant',
      aliases: ['Arf invariant', 'Arf', 'Arf(K)', 'Arf(L)'],
      valueDoc: '0 or 1 (knots and proper links)',
      example: '1',
      changedBy: [],
      judge: (text, report) => judgeArfClaim(text, arfOf(report), report.components),
    },
  ],
  fills: [{ key: 'arf', valueDoc: 'the Arf invariant of a knot or a proper link', typeset: (report) => ({ kind: 'math', latex: `${definedArf(arfOf(report))}` }) }],
  json: [
    { field: 'arf', example: 1, value: (r) => arfOf(r).value },
    {
      field: 'arfNotDefined',
      example: null,
      value: (r) => {
        const result = arfOf(r);
        return result.value === null ? result.notDefined : null;
      },
    },
  ],
  tests: ['test/invariants/braid-index-arf.test.ts', 'test/invariants/arf-links.test.ts'],
};
