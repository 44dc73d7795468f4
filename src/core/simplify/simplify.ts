/**
 * A budgeted search for Reidemeister moves and flypes that lower the crossing
 * count. Every step is a move that keeps the link, so the smallest diagram
 * found is a proof that the crossing number is at most its count. Moves I and
 * II (and the removal of nugatory crossings) are taken greedily; when none
 * applies, slides across triangles (III) and flypes, which keep the count,
 * are tried a few in a row for one that opens a move I or II: flypes that
 * open a bigon, then slides, then the other flypes, each kind within a budget
 * of its own so that neither starves the other. The search also runs without
 * flypes, and the smaller result wins.
 */
import { nonPlanarPieces } from '../diagram/faces.ts';
import type { LinkDiagram } from '../diagram/model.ts';
import { nugatoryCrossings } from '../diagram/properties.ts';
import { flype, flypeSites } from './flype.ts';
import { deleteCrossings, overBigons, slideTriangle, slidableTriangles } from './moves.ts';

export interface MoveCounts {
  /** Nugatory crossings removed (Reidemeister I is the case of a kink). */
  readonly nugatory: number;
  /** Bigons removed (Reidemeister II), each taking two crossings. */
  readonly bigons: number;
  /** Triangle slides (Reidemeister III) on the way to the smallest diagram. */
  readonly slides: number;
  /** Flypes on the way to the smallest diagram. */
  readonly flypes: number;
}

export interface Simplification {
  readonly diagram: LinkDiagram;
  readonly moves: MoveCounts;
}

/** Limits that keep a check fast: diagrams above `maxCrossings` are only reduced greedily by moves I and II. */
export interface SimplifyBudget {
  readonly maxCrossings: number;
  /**
   * Work allowed for triangle slides over the whole search, counted as the sum of the crossing counts
   * of the diagrams slid (each slide costs time linear in the crossings).
   */
  readonly work: number;
  /** Work allowed for flypes, counted the same way, apart from the slides' work. 0 leaves flypes out. */
  readonly flypeWork: number;
  /** Slides and flypes chained before giving up on a branch. */
  readonly depth: number;
}

export const DEFAULT_BUDGET: SimplifyBudget = { maxCrossings: 200, work: 2500, flypeWork: 2500, depth: 2 };

interface State {
  readonly diagram: LinkDiagram;
  readonly moves: MoveCounts;
}

/** Takes moves I and II while any applies. */
function reduceGreedily(start: State): State {
  let { diagram, moves } = start;
  for (;;) {
    const nugatory = nugatoryCrossings(diagram);
    if (nugatory.length > 0) {
      // One at a time: removing one nugatory crossing can change which others are nugatory.
      diagram = checked(deleteCrossings(diagram, new Set([nugatory[0]!])), diagram);
      moves = { ...moves, nugatory: moves.nugatory + 1 };
      continue;
    }
    // Bigons with no crossing in common do not touch each other's faces: all of them go in one step.
    const doomed = new Set<number>();
    let removed = 0;
    for (const [a, b] of overBigons(diagram)) {
      if (doomed.has(a) || doomed.has(b)) continue;
      doomed.add(a).add(b);
      removed++;
    }
    if (removed > 0) {
      diagram = checked(deleteCrossings(diagram, doomed), diagram);
      moves = { ...moves, bigons: moves.bigons + removed };
      continue;
    }
    return { diagram, moves };
  }
}

/** Every move must give a planar diagram; anything else is a bug in the move, never a result. */
function checked(result: LinkDiagram, from: LinkDiagram): LinkDiagram {
  if (nonPlanarPieces(result).length > 0) throw new Error(`internal: a Reidemeister move on a ${from.crossings.length}-crossing diagram gave a non-planar diagram`);
  return result;
}

/** A slide or a flype that keeps the count; `make` gives the diagram after it (undefined: a flype site that bounds no tangle). */
interface SideStep {
  readonly kind: 'slide' | 'flype';
  readonly make: () => State | undefined;
}

/**
 * The slides and flypes from a diagram, in the order they are tried: flypes that open a bigon for
 * Reidemeister II, slides, the other flypes. Each is made only when the search can pay for it.
 */
function* sideSteps(state: State, withFlypes: boolean): Generator<SideStep> {
  const { diagram, moves } = state;
  const sites = withFlypes ? flypeSites(diagram) : [];
  const flyped = function* (opensBigon: boolean): Generator<SideStep> {
    for (const site of sites) {
      if (site.opensBigon !== opensBigon) continue;
      yield {
        kind: 'flype',
        make: () => {
          const result = flype(diagram, site);
          return result && { diagram: checked(result, diagram), moves: { ...moves, flypes: moves.flypes + 1 } };
        },
      };
    }
  };
  yield* flyped(true);
  for (const triangle of slidableTriangles(diagram)) {
    yield { kind: 'slide', make: () => ({ diagram: checked(slideTriangle(diagram, triangle), diagram), moves: { ...moves, slides: moves.slides + 1 } }) };
  }
  yield* flyped(false);
}

/** Work left for each kind of side step; each kind stops when its own runs out. */
interface WorkLeft {
  slide: number;
  flype: number;
}

/**
 * A search from `state` for side steps after which moves I and II lower the count: every single step
 * first, then (depth permitting) the steps after each of them.
 */
function improve(state: State, depth: number, work: WorkLeft): State | undefined {
  if (depth === 0 || (work.slide <= 0 && work.flype <= 0)) return undefined;
  const stepped: State[] = [];
  for (const { kind, make } of sideSteps(state, work.flype > 0)) {
    if (work.slide <= 0 && work.flype <= 0) return undefined;
    if (work[kind] <= 0) continue;
    work[kind] -= state.diagram.crossings.length;
    const result = make();
    if (!result) continue;
    const reduced = reduceGreedily(result);
    if (reduced.diagram.crossings.length < state.diagram.crossings.length) return reduced;
    if (depth > 1) stepped.push(result);
  }
  for (const step of stepped) {
    const deeper = improve(step, depth - 1, work);
    if (deeper) return deeper;
  }
  return undefined;
}

/**
 * The search runs with slides alone and again with flypes too, and the smaller result wins (on a tie
 * the one without flypes): a flype can lead the greedy moves away from what slides alone would have
 * found, so this way flypes never make the result worse.
 */
export function simplifyDiagram(d: LinkDiagram, budget: SimplifyBudget = DEFAULT_BUDGET): Simplification {
  const start = reduceGreedily({ diagram: d, moves: { nugatory: 0, bigons: 0, slides: 0, flypes: 0 } });
  if (start.diagram.crossings.length > budget.maxCrossings) return start;
  const search = (work: WorkLeft): State => {
    let best = start;
    for (;;) {
      const found = improve(best, budget.depth, work);
      if (!found) return best;
      best = found;
    }
  };
  const bySlides = search({ slide: budget.work, flype: 0 });
  if (budget.flypeWork <= 0) return bySlides;
  const withFlypes = search({ slide: budget.work, flype: budget.flypeWork });
  return withFlypes.diagram.crossings.length < bySlides.diagram.crossings.length ? withFlypes : bySlides;
}

/** "3 moves (1 nugatory crossing removed, 1 Reidemeister II, 1 flype)". */
export function describeMoves(moves: MoveCounts): string {
  const total = moves.nugatory + moves.bigons + moves.slides + moves.flypes;
  const parts: string[] = [];
  if (moves.nugatory > 0) parts.push(`${moves.nugatory} nugatory crossing${moves.nugatory === 1 ? '' : 's'} removed (Reidemeister I for a kink)`);
  if (moves.bigons > 0) parts.push(`${moves.bigons} Reidemeister II`);
  if (moves.slides > 0) parts.push(`${moves.slides} Reidemeister III`);
  if (moves.flypes > 0) parts.push(`${moves.flypes} flype${moves.flypes === 1 ? '' : 's'}`);
  return `${total} move${total === 1 ? '' : 's'} (${parts.join(', ')})`;
}
