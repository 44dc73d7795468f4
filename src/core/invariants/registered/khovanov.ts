/** Khovanov homology over ℤ and what is read from it: reduced homology, width, thinness, Rasmussen's s. */
import type { Invariant } from '../registry/types.ts';
import type { DiagramReport } from '../../analyze/report.ts';
import { InputError } from '../../errors.ts';
import {
  judgeBidegreeClaim,
  judgePoincareClaim,
  judgeRasmussenClaim,
  judgeThinClaim,
  judgeWidthClaim,
  khovanovFill,
  khovanovInapplicable,
  khovanovOf,
} from '../../claims/khovanov-claims.ts';
import type { KhovanovReport } from '../khovanov/index.ts';

/**
 * `compute --json` computes Khovanov homology unasked only up to this many
 * crossings (beyond, the work can take up to the engine's budget per diagram);
 * a claim asks for it at any size.
 */
export const KHOVANOV_JSON_CROSSINGS = 30;

/** Why the JSON fields are null for this diagram, or null when they are computed. */
function jsonRefusal(report: DiagramReport): string | null {
  const n = report.diagram.crossings.length;
  if (n > KHOVANOV_JSON_CROSSINGS) {
    return `not computed unasked for diagrams of more than ${KHOVANOV_JSON_CROSSINGS} crossings (this one has ${n}); a Khovanov claim (--claim khovanov=…) computes it`;
  }
  try {
    khovanovOf(report);
    return null;
  } catch (e) {
    if (e instanceof InputError) return e.message;
    throw e;
  }
}

/** The value, or null when the diagram is over the limit (the reason is the field `khovanovOverLimit`). */
function orNull<T>(report: DiagramReport, read: (kh: KhovanovReport) => T): T | null {
  return jsonRefusal(report) === null ? read(khovanovOf(report)) : null;
}

const homologyJson = (h: KhovanovReport['homology']): { ranks: number[][]; torsion: number[][] } => ({
  ranks: h.ranks.map((e) => [...e]),
  torsion: h.torsion.map((e) => [...e]),
});

export const khovanovInvariant: Invariant = {
  id: 'khovanov',
  doc:
    "Khovanov homology over ℤ by Bar-Natan's local algorithm (ranks and torsion by bidegree), reduced homology of knots, " +
    "the homological width over ℚ, thinness and Rasmussen's s over ℚ from Bar-Natan's deformation; the grading is declared " +
    '(right-handed trefoil q + q³ + t²q⁵ + t³q⁹ with ℤ/2 at (3, 7) by default).',
  cost: 'contraction',
  inapplicable: khovanovInapplicable,
  conventions: ['khovanov', 'order'],
  claims: [
    {
      key: 'khovanov',
      noun: 'Khovanov Poincaré polynomial',
      aliases: ['Kh', 'Kh(K)', 'Kh(L)', 'Khovanov homology', 'Khovanov polynomial'],
      valueDoc: 'the rational Poincaré polynomial Σ rank·t^i q^j in LaTeX math, in the declared Khovanov grading',
      example: 'q + q^3 + t^2 q^5 + t^3 q^9',
      changedBy: ['chirality', 'summand-chirality'],
      judge: (text, report, ctx) => judgePoincareClaim('khovanov', text, report, ctx),
    },
    {
      key: 'khovanov-reduced',
      noun: 'reduced Khovanov Poincaré polynomial',
      aliases: ['reduced Kh', 'Khr', '\\widetilde{Kh}', 'reduced Khovanov homology'],
      valueDoc: 'the reduced Poincaré polynomial of a knot (the unknot is 1), as for `khovanov`',
      example: 'q^2 + t^2 q^6 + t^3 q^8',
      changedBy: ['chirality', 'summand-chirality'],
      judge: (text, report, ctx) => judgePoincareClaim('khovanov-reduced', text, report, ctx),
    },
    {
      key: 'khovanov-rank',
      noun: 'rank of Khovanov homology',
      valueDoc: 'a bidegree and a rank, as `3, 9: 1` or `(3, 9) = 1`',
      example: '3, 9: 1',
      changedBy: ['chirality', 'summand-chirality'],
      judge: (text, report, ctx) => judgeBidegreeClaim('khovanov-rank', text, report, ctx),
    },
    {
      key: 'khovanov-torsion',
      noun: 'torsion of Khovanov homology',
      valueDoc: 'a bidegree and a finite abelian group, as `3, 7: \\mathbb{Z}/2` or `(0, 1) = 0`',
      example: '3, 7: \\mathbb{Z}/2',
      changedBy: ['chirality', 'summand-chirality'],
      judge: (text, report, ctx) => judgeBidegreeClaim('khovanov-torsion', text, report, ctx),
    },
    {
      key: 'khovanov-group',
      noun: 'integral Khovanov homology',
      valueDoc: 'a bidegree and the whole integral group there, as `3, 7: \\mathbb{Z}/2` or `(2, 5) = \\mathbb{Z} \\oplus \\mathbb{Z}/2` (a bare count r is ℤ^r)',
      example: '3, 7: \\mathbb{Z}/2',
      changedBy: ['chirality', 'summand-chirality'],
      judge: (text, report, ctx) => judgeBidegreeClaim('khovanov-group', text, report, ctx),
    },
    {
      key: 'khovanov-width',
      noun: 'homological width',
      aliases: ['width', 'w_{Kh}', 'hw'],
      valueDoc: 'an integer: the number of diagonals j − 2i from the lowest to the highest that carry rational homology',
      example: '2',
      changedBy: [],
      judge: (text, report) => judgeWidthClaim(text, report),
    },
    {
      key: 'thin',
      noun: 'Khovanov-thin',
      valueDoc: '`yes`, `no`, `true` or `false`: whether rational Khovanov homology lies on two adjacent diagonals',
      example: 'yes',
      changedBy: [],
      judge: (text, report) => judgeThinClaim(text, report),
    },
    {
      key: 'rasmussen',
      noun: 'Rasmussen invariant',
      aliases: ['s', 's(K)', "Rasmussen's s", 'Rasmussen invariant'],
      valueDoc: 'an even integer, s(right-handed trefoil) = 2 (knots only)',
      example: '2',
      changedBy: ['chirality', 'summand-chirality'],
      judge: (text, report) => judgeRasmussenClaim(text, report),
    },
  ],
  fills: [
    { key: 'khovanov', valueDoc: 'the Poincaré polynomial in the declared grading and term order', typeset: (r, c) => khovanovFill('khovanov', r, c) },
    { key: 'khovanov-reduced', valueDoc: 'the reduced Poincaré polynomial of a knot', typeset: (r, c) => khovanovFill('khovanov-reduced', r, c) },
    { key: 'khovanov-width', valueDoc: 'the homological width', typeset: (r, c) => khovanovFill('khovanov-width', r, c) },
    { key: 'rasmussen', valueDoc: "Rasmussen's s of a knot", typeset: (r, c) => khovanovFill('rasmussen', r, c) },
  ],
  json: [
    {
      field: 'khovanov',
      example: { ranks: [[0, 1, 1], [0, 3, 1], [2, 5, 1], [3, 9, 1]], torsion: [[3, 7, 2, 1]] },
      value: (r) => orNull(r, (kh) => homologyJson(kh.homology)),
    },
    { field: 'khovanovReduced', example: { ranks: [[0, 2, 1], [2, 6, 1], [3, 8, 1]], torsion: [] }, value: (r) => orNull(r, (kh) => (kh.reduced ? homologyJson(kh.reduced) : null)) },
    { field: 'khovanovWidth', example: 2, value: (r) => orNull(r, (kh) => kh.width) },
    { field: 'thin', example: true, value: (r) => orNull(r, (kh) => kh.thin) },
    { field: 'rasmussen', example: 2, value: (r) => orNull(r, (kh) => kh.rasmussen) },
    { field: 'khovanovOverLimit', example: null, value: (r) => jsonRefusal(r) },
  ],
  tests: [
    'test/invariants/khovanov/values.test.ts',
    'test/invariants/khovanov/oracle.test.ts',
    'test/invariants/khovanov/theorems.test.ts',
    'test/invariants/khovanov/claims.test.ts',
    'test/invariants/khovanov/grid.test.ts',
  ],
};
