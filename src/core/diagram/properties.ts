/**
 * Exact combinatorial properties of one diagram, read off the model and its
 * planar structure: signs, linking numbers, connectedness, nugatory
 * crossings, alternation and the all-A / all-B states with their adequacy.
 *
 * Smoothing convention (shared with the bracket engines): at a crossing with
 * slots 0..3 counterclockwise from the incoming under-edge, the A-smoothing
 * joins slots 0–1 and 2–3, the B-smoothing joins slots 0–3 and 1–2.
 */
import { componentCount, indexDiagram, type LinkDiagram } from './model.ts';
import { connectedPieces, faceStructure } from './faces.ts';
import type { LinkingNumber } from '../analyze/report.ts';

export type Smoothing = 'A' | 'B';

export interface SignCounts {
  readonly positive: number;
  readonly negative: number;
}

export function crossingSignCounts(d: LinkDiagram): SignCounts {
  let positive = 0;
  for (const c of d.crossings) if (c.sign === 1) positive++;
  return { positive, negative: d.crossings.length - positive };
}

/**
 * The linking number of every pair of components: half the signed count of
 * the crossings between them. Components are 0-based with i < j; free loops
 * are numbered after the components listed in the model and link nothing.
 */
export function linkingNumbers(d: LinkDiagram): LinkingNumber[] {
  const mu = componentCount(d);
  const { componentOf } = indexDiagram(d);
  // twice the linking number, indexed i·μ + j for i < j
  const doubled = new Map<number, number>();
  for (const c of d.crossings) {
    const under = componentOf[c.edges[0]]!;
    const over = componentOf[c.edges[1]]!;
    if (under === over) continue;
    const key = Math.min(under, over) * mu + Math.max(under, over);
    doubled.set(key, (doubled.get(key) ?? 0) + c.sign);
  }
  const result: LinkingNumber[] = [];
  for (let i = 0; i < mu; i++) {
    for (let j = i + 1; j < mu; j++) {
      const twice = doubled.get(i * mu + j) ?? 0;
      // Each pair of components crosses an even number of times in a planar diagram.
      result.push({ components: [i, j], value: twice / 2 });
    }
  }
  return result;
}

/** Connected pieces of the projection, each free loop counting as a piece of its own. */
export function projectionPieceCount(d: LinkDiagram): number {
  return connectedPieces(d).pieceCount + d.freeLoops;
}

/** One piece of the projection (a lone free loop is connected; several pieces or loops are not). */
export function isConnectedDiagram(d: LinkDiagram): boolean {
  return projectionPieceCount(d) <= 1;
}

/**
 * The nugatory crossings, ascending: crossing c is nugatory exactly when one
 * face touches it at two opposite corners, since a closed curve through that
 * face and c then meets the diagram only at c.
 */
export function nugatoryCrossings(d: LinkDiagram): number[] {
  const { faceOfCorner } = faceStructure(d);
  const result: number[] = [];
  for (let c = 0; c < d.crossings.length; c++) {
    const corner = 4 * c;
    if (faceOfCorner[corner] === faceOfCorner[corner + 2] || faceOfCorner[corner + 1] === faceOfCorner[corner + 3]) {
      result.push(c);
    }
  }
  return result;
}

/**
 * Alternating: along every edge one end is an over slot (1, 3) and the other an
 * under slot (0, 2), so travel meets over and under in turn. Free loops and a
 * crossingless diagram are alternating.
 */
export function isAlternatingDiagram(d: LinkDiagram): boolean {
  const { opposite } = indexDiagram(d);
  for (let s = 0; s < opposite.length; s++) {
    if ((s & 1) === (opposite[s]! & 1)) return false;
  }
  return true;
}

export interface StateCircles {
  /** Number of circles, free loops included. */
  readonly count: number;
  /** For each crossing slot 4·c + q, the circle through the state arc at that slot. */
  readonly circleOfSlot: Int32Array;
}

const A_PARTNER = [1, 0, 3, 2] as const;
const B_PARTNER = [3, 2, 1, 0] as const;

/** The circles of the state that smooths every crossing the same way. */
export function uniformStateCircles(d: LinkDiagram, smoothing: Smoothing): StateCircles {
  const partner = smoothing === 'A' ? A_PARTNER : B_PARTNER;
  const { opposite } = indexDiagram(d);
  const circleOfSlot = new Int32Array(opposite.length).fill(-1);
  let count = 0;
  for (let start = 0; start < opposite.length; start++) {
    if (circleOfSlot[start]! >= 0) continue;
    let slot = start;
    while (circleOfSlot[slot]! < 0) {
      circleOfSlot[slot] = count;
      const across = 4 * (slot >> 2) + partner[slot & 3]!;
      circleOfSlot[across] = count;
      slot = opposite[across]!;
    }
    count++;
  }
  return { count: count + d.freeLoops, circleOfSlot };
}

/**
 * A-adequate (B-adequate): in the all-A (all-B) state the two arcs at each
 * crossing lie on different circles, so switching any one smoothing merges two
 * circles rather than splitting one.
 */
export function isAdequateFor(d: LinkDiagram, smoothing: Smoothing, circles = uniformStateCircles(d, smoothing)): boolean {
  // Slot 0 lies on one arc of either smoothing; the other arc contains slot 2 (A) or slot 1 (B).
  const otherArcSlot = smoothing === 'A' ? 2 : 1;
  for (let c = 0; c < d.crossings.length; c++) {
    if (circles.circleOfSlot[4 * c] === circles.circleOfSlot[4 * c + otherArcSlot]) return false;
  }
  return true;
}

export interface DiagramProperties {
  readonly crossings: number;
  readonly components: number;
  readonly signs: SignCounts;
  readonly writhe: number;
  readonly linking: readonly LinkingNumber[];
  readonly pieces: number;
  readonly connected: boolean;
  readonly nugatory: readonly number[];
  readonly reduced: boolean;
  readonly alternating: boolean;
  readonly stateCircles: { readonly a: number; readonly b: number };
  readonly aAdequate: boolean;
  readonly bAdequate: boolean;
  readonly adequate: boolean;
}

export function diagramProperties(d: LinkDiagram): DiagramProperties {
  const signs = crossingSignCounts(d);
  const nugatory = nugatoryCrossings(d);
  const pieces = projectionPieceCount(d);
  const aCircles = uniformStateCircles(d, 'A');
  const bCircles = uniformStateCircles(d, 'B');
  const aAdequate = isAdequateFor(d, 'A', aCircles);
  const bAdequate = isAdequateFor(d, 'B', bCircles);
  return {
    crossings: d.crossings.length,
    components: componentCount(d),
    signs,
    writhe: signs.positive - signs.negative,
    linking: linkingNumbers(d),
    pieces,
    connected: pieces <= 1,
    nugatory,
    reduced: nugatory.length === 0,
    alternating: isAlternatingDiagram(d),
    stateCircles: { a: aCircles.count, b: bCircles.count },
    aAdequate,
    bAdequate,
    adequate: aAdequate && bAdequate,
  };
}
