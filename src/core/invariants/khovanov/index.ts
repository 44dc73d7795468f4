/**
 * Khovanov homology and what is read from it, for one diagram: the integral
 * homology (local.ts), the reduced homology of a knot, the rational Poincaré
 * polynomial, homological width, thinness and Rasmussen's s (rasmussen.ts).
 *
 * Width. Rational Khovanov homology of a knot sits on diagonals δ = j − 2i;
 * the homological width is the number of diagonals from the lowest to the
 * highest occupied one, (δ_max − δ_min)/2 + 1, over ℚ. A link is thin when its
 * width is at most 2 (the unknot and every alternating knot: Lee 2005).
 */
import { componentCount, type LinkDiagram } from '../../diagram/model.ts';
import type { KhovanovHomology, RankEntry } from './homology.ts';
import { khovanovAndReduced, KhovanovBudgetError, type LocalOptions } from './local.ts';
import { rasmussenInvariant } from './rasmussen.ts';

export type { KhovanovHomology, RankEntry, TorsionEntry } from './homology.ts';
export { KhovanovBudgetError, WORK_UNITS_PER_SECOND, workBudgetFor } from './local.ts';

export interface KhovanovReport {
  /** Integral Khovanov homology: rational ranks and torsion. */
  readonly homology: KhovanovHomology;
  /** Reduced homology over ℤ (knots only; the unknot has ℤ at (0, 0)). */
  readonly reduced: KhovanovHomology | null;
  /** Homological width over ℚ (number of diagonals j − 2i spanned). */
  readonly width: number;
  /** Width at most 2. */
  readonly thin: boolean;
  /** Rasmussen's s over ℚ (knots only), s(right-handed trefoil) = 2. */
  readonly rasmussen: number | null;
}

/** The homological width over ℚ: (δ_max − δ_min)/2 + 1 for δ = j − 2i; 0 for zero homology. */
export function homologicalWidth(ranks: readonly RankEntry[]): number {
  if (ranks.length === 0) return 0;
  const deltas = ranks.map(([i, j]) => j - 2 * i);
  return (Math.max(...deltas) - Math.min(...deltas)) / 2 + 1;
}

/**
 * Everything at once. Throws a KhovanovBudgetError when the diagram is beyond
 * the work budget (callers report it as over the limit).
 */
export function khovanovReport(d: LinkDiagram, options: LocalOptions = {}): KhovanovReport {
  const { unreduced, reduced } = khovanovAndReduced(d, options);
  const knot = componentCount(d) === 1;
  const width = homologicalWidth(unreduced.ranks);
  return {
    homology: unreduced,
    reduced: knot ? reduced : null,
    width,
    thin: width <= 2,
    rasmussen: knot ? rasmussenInvariant(d, options) : null,
  };
}

export function isOverBudget(e: unknown): e is KhovanovBudgetError {
  return e instanceof KhovanovBudgetError;
}
