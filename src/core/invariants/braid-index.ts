/**
 * Bounds on the braid index of the link a diagram shows, each resting on a
 * published theorem and given as data, like the crossing-number bounds:
 *
 * - lower: the Morton–Franks–Williams inequality (Morton 1986, Franks–Williams
 *   1987): a link that is the closure of a b-strand braid has
 *   span_v P(v, z) ≤ 2(b − 1), so b ≥ span_v P / 2 + 1;
 * - upper: Yamada (1987): the braid index is the least number of Seifert
 *   circles over all diagrams of the link, so the Seifert circles of this
 *   diagram (free loops included) bound it from above. For a braid word's
 *   closure these circles are its strands.
 */
import type { Notation } from '../diagram/model.ts';
import type { Laurent2 } from '../poly/laurent2.ts';

export type BraidIndexTheorem = 'morton-franks-williams' | 'yamada-seifert-circles' | 'bounds-meet';

export interface BraidIndexReason {
  readonly bound: 'lower' | 'upper' | 'exact';
  readonly value: number;
  readonly theorem: BraidIndexTheorem;
  /** One sentence saying why the bound holds for this diagram. */
  readonly text: string;
}

export interface BraidIndexBounds {
  readonly lower: number;
  readonly upper: number;
  /** Set when the bounds meet (then lower = upper = exact). */
  readonly exact: number | null;
  readonly reasons: readonly BraidIndexReason[];
}

export function braidIndexBounds(homfly: Laurent2, seifertCircles: number, notation: Notation): BraidIndexBounds {
  const [lo, hi] = homfly.xRange() ?? [0, 0];
  const span = hi - lo;
  const lower = span / 2 + 1;
  if (!Number.isInteger(lower)) throw new Error(`internal: the v-span ${span} of the HOMFLY-PT polynomial is odd`);
  const reasons: BraidIndexReason[] = [
    {
      bound: 'lower',
      value: lower,
      theorem: 'morton-franks-williams',
      text: `The v-span of P(v, z) is ${span}, and a closed b-strand braid has span at most 2(b − 1) (Morton–Franks–Williams), so the braid index is at least ${lower}.`,
    },
    {
      bound: 'upper',
      value: seifertCircles,
      theorem: 'yamada-seifert-circles',
      text:
        notation === 'braid'
          ? `The braid word closes on ${seifertCircles} strands (its Seifert circles), and the braid index is at most the Seifert circles of any diagram (Yamada), so it is at most ${seifertCircles}.`
          : `This diagram has ${seifertCircles} Seifert circles, and the braid index is at most the Seifert circles of any diagram (Yamada), so it is at most ${seifertCircles}.`,
    },
  ];
  if (lower > seifertCircles) throw new Error(`internal: braid index bounds cross (${lower} > ${seifertCircles})`);
  if (lower < seifertCircles) return { lower, upper: seifertCircles, exact: null, reasons };
  reasons.push({
    bound: 'exact',
    value: lower,
    theorem: 'bounds-meet',
    text: `The Morton–Franks–Williams lower bound meets the Seifert-circle upper bound, so the braid index is ${lower}.`,
  });
  return { lower, upper: lower, exact: lower, reasons };
}
