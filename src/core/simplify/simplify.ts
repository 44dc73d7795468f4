/**
 * A budgeted search for Reidemeister moves that lower the crossing count.
 * Every step is a move that keeps the link, so the smallest diagram found is a
 * proof that the crossing number is at most its count. Moves I and II (and the
 * removal of nugatory crossings) are taken greedily; when none applies, slides
 * across triangles (III) are tried, a few at a time, for one that opens a move
 * I or II. Flypes are not searched.
 */
import { nonPlanarPieces } from '../diagram/faces.ts';
import type { LinkDiagram } from '../diagram/model.ts';
import { nugatoryCrossings } from '../diagram/properties.ts';
import { deleteCrossings, overBigons, slideTriangle, slidableTriangles } from './moves.ts';

export interface MoveCounts {
  /** Nugatory crossings removed (Reidemeister I is the case of a kink). */
  readonly nugatory: number;
  /** Bigons removed (Reidemeister II), each taking two crossings. */
  readonly bigons: number;
  /** Triangle slides (Reidemeister III) on the way to the smallest diagram. */
  readonly slides: number;
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
  /** Slides chained before giving up on a branch. */
  readonly depth: number;
}

export const DEFAULT_BUDGET: SimplifyBudget = { maxCrossings: 200, work: 2500, depth: 2 };

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

export function simplifyDiagram(d: LinkDiagram, budget: SimplifyBudget = DEFAULT_BUDGET): Simplification {
  let best = reduceGreedily({ diagram: d, moves: { nugatory: 0, bigons: 0, slides: 0 } });
  if (best.diagram.crossings.length > budget.maxCrossings) return best;
  let workLeft = budget.work;
  // Depth-first over slides from the best diagram so far; restart from each improvement.
  const improve = (state: State, depth: number): State | undefined => {
    if (depth === 0) return undefined;
    for (const triangle of slidableTriangles(state.diagram)) {
      workLeft -= state.diagram.crossings.length;
      if (workLeft < 0) return undefined;
      const slid = { diagram: checked(slideTriangle(state.diagram, triangle), state.diagram), moves: { ...state.moves, slides: state.moves.slides + 1 } };
      const reduced = reduceGreedily(slid);
      if (reduced.diagram.crossings.length < state.diagram.crossings.length) return reduced;
      const deeper = improve(slid, depth - 1);
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

/** "3 moves (1 nugatory crossing removed, 1 Reidemeister II, 1 Reidemeister III)". */
export function describeMoves(moves: MoveCounts): string {
  const total = moves.nugatory + moves.bigons + moves.slides;
  const parts: string[] = [];
  if (moves.nugatory > 0) parts.push(`${moves.nugatory} nugatory crossing${moves.nugatory === 1 ? '' : 's'} removed (Reidemeister I for a kink)`);
  if (moves.bigons > 0) parts.push(`${moves.bigons} Reidemeister II`);
  if (moves.slides > 0) parts.push(`${moves.slides} Reidemeister III`);
  return `${total} move${total === 1 ? '' : 's'} (${parts.join(', ')})`;
}
