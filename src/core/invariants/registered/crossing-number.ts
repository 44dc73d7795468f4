/** The crossing number of the link, as proven bounds with the theorem behind each. */
import type { Invariant } from '../registry/types.ts';
import { crossingNumberFill, crossingNumberStatement, judgeCrossingNumberClaim } from '../../claims/crossing-number.ts';

export const crossingNumberInvariant: Invariant = {
  id: 'crossing-number',
  doc: 'The crossing number of the link: a lower bound from span V (Kauffman–Murasugi–Thistlethwaite and its relatives) and an upper bound from the diagram, exact when a theorem makes them meet.',
  cost: 'contraction',
  conventions: ['jones'],
  claims: [
    {
      key: 'crossing-number',
      noun: 'crossing number',
      aliases: ['crossing number', 'c(K)', 'c(L)'],
      valueDoc:
        'a natural number `k`, or `\\le k`, `\\leq k`, `≤ k`, `<= k`, `< k`, `at most k`, and likewise `\\ge`, `\\geq`, `≥`, `>=`, `>`, `at least`; a left-hand side is skipped (`c(K) \\le 7`), a bound may be turned round (`5 \\le c(K)`), and a range has two relations pointing the same way (`5 \\le c(K) \\le 7`) or reads `between 5 and 7`, `5–7` or `5-7` (ends included)',
      example: '3',
      changedBy: [],
      judge: (text, report) => judgeCrossingNumberClaim(text, report),
    },
  ],
  fills: [
    {
      key: 'crossing-number',
      valueDoc: 'the crossing number when proven exact, else its bounds in words (in a table cell the compact range $a$–$b$)',
      typeset: (report, _convention, options) => crossingNumberFill(report, options?.compact === true),
    },
    { key: 'statement', valueDoc: 'a proof-style sentence giving the crossing number or its bounds and the theorem behind them', typeset: (report, convention) => ({ kind: 'text', text: crossingNumberStatement(report, convention) }) },
  ],
  json: [
    {
      field: 'crossingNumber',
      example: { lower: 3, upper: 3, exact: 3 },
      value: (r) => ({
        lower: r.crossingNumber.lower,
        upper: r.crossingNumber.upper,
        exact: r.crossingNumber.exact,
        reasons: r.crossingNumber.reasons.map((x) => ({ bound: x.bound, value: x.value, theorem: x.theorem, text: x.text })),
      }),
    },
  ],
  tests: ['test/claims/judge.test.ts', 'test/properties/split-union.test.ts'],
};
