/** The braid index, as proven bounds with the theorem behind each. */
import type { Invariant } from '../registry/types.ts';
import { braidIndexLatex, judgeBraidIndexClaim } from '../../claims/skein-polynomial-claims.ts';
import { braidIndexOf } from './skein-values.ts';

export const braidIndexInvariant: Invariant = {
  id: 'braid-index',
  doc: 'The braid index of the link: at least span_v P / 2 + 1 (Morton–Franks–Williams), at most the Seifert circles of the diagram (Yamada 1987), exact when they meet.',
  cost: 'contraction',
  conventions: [],
  claims: [
    {
      key: 'braid-index',
      noun: 'braid index',
      aliases: ['braid index', 'b(K)', 'b(L)'],
      valueDoc: 'a natural number, one bound or a range, written as for the crossing number (`\\le 3`, `2 \\le b \\le 3`, `2–3`); judged agrees, contradicts, or undecided when the proven bounds leave it open',
      example: '2',
      changedBy: [],
      judge: (text, report) => judgeBraidIndexClaim(text, braidIndexOf(report)),
    },
  ],
  fills: [{ key: 'braid-index', valueDoc: 'the braid index when the bounds meet, else the bounds', typeset: (report) => ({ kind: 'math', latex: braidIndexLatex(braidIndexOf(report)) }) }],
  json: [
    {
      field: 'braidIndex',
      example: { lower: 2, upper: 2, exact: 2 },
      value: (r) => {
        const b = braidIndexOf(r);
        return { lower: b.lower, upper: b.upper, exact: b.exact, reasons: b.reasons.map((x) => ({ bound: x.bound, value: x.value, theorem: x.theorem, text: x.text })) };
      },
    },
  ],
  tests: ['test/invariants/braid-index-arf.test.ts'],
};
