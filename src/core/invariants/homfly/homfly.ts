/**
 * The HOMFLY-PT polynomial P(v, z) in the convention v⁻¹P(L₊) − vP(L₋) = zP(L₀),
 * P(unknot) = 1, computed by contraction in the HOMFLY-PT skein module of a disk
 * (layered-skein/engine.ts): the work grows with the factorial of half the
 * boundary width, not exponentially in the crossing count.
 */
import type { LinkDiagram, Sign } from '../../diagram/model.ts';
import { Laurent2 } from '../../poly/laurent2.ts';
import type { ContractionLimits, SkeinRules } from '../layered-skein/engine.ts';
import { skeinPolynomial } from '../layered-skein/polynomial.ts';

/** δ = (v⁻¹ − v)/z: a loop beside the rest. */
export const HOMFLY_LOOP = Laurent2.fromTerms([
  [-1, -1, 1],
  [1, -1, -1],
]);

const ONE = Laurent2.one;
const SWITCH: Record<Sign, Laurent2> = { 1: Laurent2.monomial(2, 0), [-1]: Laurent2.monomial(-2, 0) };
const SMOOTH: Record<Sign, Laurent2> = { 1: Laurent2.monomial(1, 1), [-1]: Laurent2.monomial(-1, 1, -1) };

/** P(L₊) = v²P(L₋) + vzP(L₀) and P(L₋) = v⁻²P(L₊) − v⁻¹zP(L₀); L₀ is the A-smoothing of L₊ and the B-smoothing of L₋. */
export const HOMFLY_RULES: SkeinRules = {
  oriented: true,
  loop: HOMFLY_LOOP,
  curl: () => ONE,
  crossing: (sign) => ({
    switched: SWITCH[sign],
    smoothA: sign === 1 ? SMOOTH[1] : Laurent2.zero,
    smoothB: sign === -1 ? SMOOTH[-1] : Laurent2.zero,
  }),
};

/**
 * Work budget, in the engine's units (about 10⁵ a second on the development
 * machine): a 16-crossing knot needs a few thousand, a 30-crossing alternating
 * knot a few ten thousand; beyond the budget (about ten seconds) the answer is
 * refused as over the limit rather than left running.
 */
export const HOMFLY_LIMITS: ContractionLimits = { maxWidth: 22, maxWork: 1e6 };

export interface HomflyResult {
  /** P(v, z): x is v, y is z. */
  readonly polynomial: Laurent2;
  readonly boundaryWidth: number;
}

export function homflyPolynomial(d: LinkDiagram, limits: ContractionLimits = HOMFLY_LIMITS): HomflyResult {
  const { value, width } = skeinPolynomial(d, HOMFLY_RULES, limits, 'HOMFLY-PT polynomial');
  return { polynomial: value, boundaryWidth: width };
}
