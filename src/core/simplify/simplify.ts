/**
 * A budgeted search for Reidemeister moves and flypes that lower the crossing
 * count. Every step is a move that keeps the link, so the smallest diagram
 * found is a proof that the crossing number is at most its count. Moves I and
 * II (and the removal of nugatory crossings) are taken greedily; when none
 * applies, flypes and slides across triangles (III), which keep the count,
 * are tried a few in a row for one that opens a move I or II: first flypes
 * that bring a crossing beside another (the likeliest to make a bigon), then
 * slides, then the other flypes.
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
   * Work allowed for slides and flypes over the whole search, counted as the sum of the crossing counts
   * of the diagrams they are tried on (each one costs time linear in the crossings).
   */
  readonly work: number;
  /** Slides and flypes chained before giving up on a branch. */
  readonly depth: number;
  /** Whether flypes are tried (benchmarks and tests compare the search without them). */
  readonly flypes: boolean;
}

export const DEFAULT_BUDGET: SimplifyBudget = { maxCrossings: 200, work: 2500, depth: 2, flypes: true };

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

/**
 * The diagrams one slide or flype away, in the order they are tried. Each is made only when asked
 * for, so a search that runs out of budget pays for none beyond it; a flype site that bounds no
 * tangle yields nothing.
 */
function* sideSteps(state: State, withFlypes: boolean): Generator<State | undefined> {
  const { diagram, moves } = state;
  const sites = withFlypes ? flypeSites(diagram) : [];
  const flyped = function* (meeting: boolean) {
    for (const site of sites) {
      if (site.farEdgesMeet !== meeting) continue;
      const result = flype(diagram, site);
      yield result && { diagram: checked(result, diagram), moves: { ...moves, flypes: moves.flypes + 1 } };
    }
  };
  yield* flyped(true);
  for (const triangle of slidableTriangles(diagram)) {
    yield { diagram: checked(slideTriangle(diagram, triangle), diagram), moves: { ...moves, slides: moves.slides + 1 } };
  }
  yield* flyped(false);
}

export function simplifyDiagram(d: LinkDiagram, budget: SimplifyBudget = DEFAULT_BUDGET): Simplification {
  let best = reduceGreedily({ diagram: d, moves: { nugatory: 0, bigons: 0, slides: 0, flypes: 0 } });
  if (best.diagram.crossings.length > budget.maxCrossings) return best;
  let workLeft = budget.work;
  // Depth-first over slides and flypes from the best diagram so far; restart from each improvement.
  const improve = (state: State, depth: number): State | undefined => {
    if (depth === 0) return undefined;
    for (const step of sideSteps(state, budget.flypes)) {
      workLeft -= state.diagram.crossings.length;
      if (workLeft < 0) return undefined;
      if (!step) continue;
      const reduced = reduceGreedily(step);
      if (reduced.diagram.crossings.length < state.diagram.crossings.length) return reduced;
      const deeper = improve(step, depth - 1);
      if (deeper) return deeper;
    }
    return undefined;
  };
  for (;;) {
    const found = improve(best, budget.depth);
    if (!found) return best;
    best = found;
  }
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
