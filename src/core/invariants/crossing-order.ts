/**
 * Chooses the order in which the tangle engine absorbs crossings. The cost of
 * contraction is exponential in the open boundary (the number of edge ends
 * leading out of the absorbed region), so the order is picked to keep that
 * boundary small, whatever order the notation listed the crossings in.
 *
 * Strategy: a greedy walk that always absorbs the crossing that shrinks (or
 * least grows) the boundary, i.e. the one with most edges already on it. The
 * walk is cheap to simulate, so it is run from several starting crossings and
 * with two tie-breaks (oldest boundary contact first, which grows a compact
 * blob, and newest first, which sweeps), and the order with the smallest
 * widest boundary wins. Wide diagrams, whose contraction is expensive, earn a
 * longer search (up to every starting crossing).
 */
import { indexDiagram, type LinkDiagram } from '../diagram/model.ts';

export interface ContractionPlan {
  /** Crossing indices in the order they are absorbed; a permutation of 0 … n−1. */
  readonly order: readonly number[];
  /** Boundary width (open edge ends) after each absorption. */
  readonly widths: readonly number[];
  /** The largest entry of `widths` (0 for a crossingless diagram). */
  readonly maxWidth: number;
}

/** Starts tried on every diagram (fewer when n² would make planning itself slow). */
const MIN_STARTS = 24;
const BASE_BUDGET = 3e7;
/**
 * Further starts are tried while planning has cost (in scan steps) less than
 * this fraction of the estimated contraction work of the best order so far:
 * a wide diagram is worth a longer search, a narrow one is not.
 */
const SEARCH_FRACTION = 0.04;
const MAX_BUDGET = 2e8;

type TieBreak = 'oldest' | 'newest';

export function planContraction(d: LinkDiagram): ContractionPlan {
  const n = d.crossings.length;
  if (n === 0) return { order: [], widths: [], maxWidth: 0 };
  const neighbours = neighbourTable(d);
  const runCost = 2 * n * n; // two greedy walks, each scanning all crossings per pick
  const minimumStarts = Math.max(1, Math.min(MIN_STARTS, n, Math.floor(BASE_BUDGET / runCost)));
  let best: ContractionPlan | undefined;
  let bestCost = Infinity;
  let spent = 0;
  for (const start of startOrder(n, minimumStarts)) {
    for (const tieBreak of ['oldest', 'newest'] as const) {
      const order = greedyOrder(neighbours, n, start, tieBreak);
      const widths = boundaryWidths(d, order);
      const maxWidth = widths.reduce((m, w) => Math.max(m, w), 0);
      const cost = orderCost(widths);
      if (!best || maxWidth < best.maxWidth || (maxWidth === best.maxWidth && cost < bestCost)) {
        best = { order, widths, maxWidth };
        bestCost = cost;
      }
    }
    spent += runCost;
    const tried = spent / runCost;
    if (tried >= minimumStarts && spent + runCost > Math.min(MAX_BUDGET, SEARCH_FRACTION * bestCost)) break;
  }
  return best!;
}

/** `first` evenly spread starting crossings, then every other crossing. */
function* startOrder(n: number, first: number): Generator<number> {
  const spread = new Set<number>();
  for (let s = 0; s < first; s++) spread.add(Math.floor((s * n) / first));
  yield* spread;
  for (let c = 0; c < n; c++) if (!spread.has(c)) yield c;
}

/** Boundary width after each absorption when the crossings are absorbed in `order`. */
export function boundaryWidths(d: LinkDiagram, order: readonly number[]): number[] {
  const neighbours = neighbourTable(d);
  const absorbed = new Uint8Array(d.crossings.length);
  const widths: number[] = [];
  let width = 0;
  for (const c of order) {
    absorbed[c] = 1;
    for (let q = 0; q < 4; q++) {
      const other = neighbours[4 * c + q]!;
      if (other === c) continue; // a kink: both ends meet inside this crossing
      width += absorbed[other] ? -1 : 1;
    }
    widths.push(width);
  }
  return widths;
}

/** For slot 4c+q, the crossing at the other end of its edge. */
function neighbourTable(d: LinkDiagram): Int32Array {
  const { opposite } = indexDiagram(d);
  return Int32Array.from(opposite, (slot) => slot >> 2);
}

/** Roughly proportional to the contraction work: states grow about like 2^width, polynomials like the step. */
function orderCost(widths: readonly number[]): number {
  return widths.reduce((s, w, k) => s + 2 ** Math.min(w, 1000) * (k + 1), 0);
}

function greedyOrder(neighbours: Int32Array, n: number, start: number, tieBreak: TieBreak): number[] {
  const absorbed = new Uint8Array(n);
  // connections[c]: slots of c whose edge leads into the absorbed region.
  const connections = new Int32Array(n);
  // growth[c]: how much absorbing c would widen the boundary (4 − kink slots − 2·connections).
  const growth = new Int32Array(n);
  // touched[c]: the absorption step at which c first (oldest) or last (newest) met the region.
  const touched = new Float64Array(n).fill(Infinity);
  for (let c = 0; c < n; c++) {
    let open = 0;
    for (let q = 0; q < 4; q++) if (neighbours[4 * c + q] !== c) open++;
    growth[c] = open;
  }
  const order: number[] = [];
  let next = start;
  for (let stepIndex = 0; stepIndex < n; stepIndex++) {
    if (stepIndex > 0) next = pickNext(absorbed, connections, growth, touched, tieBreak);
    absorbed[next] = 1;
    order.push(next);
    for (let q = 0; q < 4; q++) {
      const other = neighbours[4 * next + q]!;
      if (other === next || absorbed[other]) continue;
      connections[other]!++;
      growth[other]! -= 2;
      if (tieBreak === 'newest' || touched[other] === Infinity) touched[other] = stepIndex;
    }
  }
  return order;
}

function pickNext(
  absorbed: Uint8Array,
  connections: Int32Array,
  growth: Int32Array,
  touched: Float64Array,
  tieBreak: TieBreak,
): number {
  let best = -1;
  for (let c = 0; c < absorbed.length; c++) {
    if (absorbed[c]) continue;
    if (best < 0) {
      best = c;
      continue;
    }
    // A crossing touching the region always beats a fresh start elsewhere.
    const connectedC = connections[c]! > 0;
    const connectedBest = connections[best]! > 0;
    if (connectedC !== connectedBest) {
      if (connectedC) best = c;
      continue;
    }
    if (growth[c]! !== growth[best]!) {
      if (growth[c]! < growth[best]!) best = c;
      continue;
    }
    const earlier = touched[c]! < touched[best]!;
    const later = touched[c]! > touched[best]! && touched[c] !== Infinity;
    if (tieBreak === 'oldest' ? earlier : later) best = c;
  }
  return best;
}
