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

/** Rough work units per crossing of one greedy walk (heap operations and the width simulation). */
const RUN_COST_PER_CROSSING = 64;
/** Starts tried on every diagram (fewer when a huge n would make planning itself slow). */
const MIN_STARTS = 24;
/** Up to this many crossings, planning stops after MIN_STARTS_SMALL starts once it costs more than SEARCH_FRACTION of the contraction. */
const SMALL_DIAGRAM = 60;
const MIN_STARTS_SMALL = 1;
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
  const runCost = 2 * n * RUN_COST_PER_CROSSING; // two greedy walks
  const minimumStarts = Math.max(1, Math.min(MIN_STARTS, n, Math.floor(BASE_BUDGET / runCost)));
  const buffers = new WalkBuffers(n);
  let best: ContractionPlan | undefined;
  let bestCost = Infinity;
  let spent = 0;
  for (const start of startOrder(n, minimumStarts)) {
    for (const tieBreak of ['oldest', 'newest'] as const) {
      const order = greedyOrder(neighbours, n, start, tieBreak, buffers);
      const widths = widthsAlong(neighbours, order);
      const maxWidth = widths.reduce((m, w) => Math.max(m, w), 0);
      const cost = orderCost(widths);
      if (!best || maxWidth < best.maxWidth || (maxWidth === best.maxWidth && cost < bestCost)) {
        best = { order, widths, maxWidth };
        bestCost = cost;
      }
    }
    spent += runCost;
    const tried = spent / runCost;
    const overBudget = spent + runCost > Math.min(MAX_BUDGET, SEARCH_FRACTION * bestCost);
    // A small diagram contracts in microseconds: one start (two walks) suffices, where more would cost more than the contraction.
    if (overBudget && (tried >= minimumStarts || (tried >= MIN_STARTS_SMALL && n <= SMALL_DIAGRAM))) break;
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
  return widthsAlong(neighbourTable(d), order);
}

function widthsAlong(neighbours: Int32Array, order: readonly number[]): number[] {
  const absorbed = new Uint8Array(neighbours.length >> 2);
  const widths: number[] = new Array(order.length);
  let width = 0;
  order.forEach((c, k) => {
    absorbed[c] = 1;
    for (let q = 0; q < 4; q++) {
      const other = neighbours[4 * c + q]!;
      if (other === c) continue; // a kink: both ends meet inside this crossing
      width += absorbed[other] ? -1 : 1;
    }
    widths[k] = width;
  });
  return widths;
}

/** For slot 4c+q, the crossing at the other end of its edge. */
function neighbourTable(d: LinkDiagram): Int32Array {
  const { opposite } = indexDiagram(d);
  const neighbours = new Int32Array(opposite.length);
  for (let s = 0; s < opposite.length; s++) neighbours[s] = opposite[s]! >> 2;
  return neighbours;
}

/** Roughly proportional to the contraction work: states grow about like 2^width, polynomials like the step. */
function orderCost(widths: readonly number[]): number {
  return widths.reduce((s, w, k) => s + 2 ** Math.min(w, 1000) * (k + 1), 0);
}

/** Priority keys pack (connected?, growth, contact time, index) into one exact double; this bounds n. */
const KEY_FIELD = 2 ** 21;

/**
 * One greedy walk. The next crossing is the one with the smallest key:
 * touching the region before not touching it, then least growth, then the
 * tie-break on contact time, then the lowest index. A binary heap with lazy
 * deletion keeps each pick logarithmic: a crossing's stale entries are
 * skipped when its key has changed since they were pushed.
 */
function greedyOrder(neighbours: Int32Array, n: number, start: number, tieBreak: TieBreak, buffers: WalkBuffers): number[] {
  if (n >= KEY_FIELD) throw new RangeError(`crossing order: ${n} crossings is more than the planner supports (${KEY_FIELD - 1})`);
  const { absorbed, connections, growth, currentKey, firstTouch } = buffers.cleared();
  const heap = new KeyHeap();
  const keyOf = (c: number, touchedAt: number): number => {
    const connected = connections[c]! > 0;
    const contact = !connected ? 0 : tieBreak === 'oldest' ? touchedAt : KEY_FIELD - 1 - touchedAt;
    return (((connected ? 0 : 1) * 16 + growth[c]! + 4) * KEY_FIELD + contact) * KEY_FIELD + c;
  };
  for (let c = 0; c < n; c++) {
    let open = 0;
    for (let q = 0; q < 4; q++) if (neighbours[4 * c + q] !== c) open++;
    growth[c] = open;
    currentKey[c] = keyOf(c, 0);
    if (c !== start) heap.push(currentKey[c]!);
  }
  const order: number[] = [];
  let next = start;
  for (let stepIndex = 0; stepIndex < n; stepIndex++) {
    if (stepIndex > 0) {
      for (;;) {
        const key = heap.pop();
        const c = key % KEY_FIELD;
        if (!absorbed[c] && currentKey[c] === key) {
          next = c;
          break;
        }
      }
    }
    absorbed[next] = 1;
    order.push(next);
    for (let q = 0; q < 4; q++) {
      const other = neighbours[4 * next + q]!;
      if (other === next || absorbed[other]) continue;
      connections[other]!++;
      growth[other]! -= 2;
      if (firstTouch[other]! < 0) firstTouch[other] = stepIndex;
      currentKey[other] = keyOf(other, tieBreak === 'oldest' ? firstTouch[other]! : stepIndex);
      heap.push(currentKey[other]!);
    }
  }
  return order;
}

/** The per-crossing arrays of a greedy walk, allocated once per plan and cleared for each walk. */
class WalkBuffers {
  readonly absorbed: Uint8Array;
  readonly connections: Int32Array;
  /** growth[c]: how much absorbing c would widen the boundary (4 − kink slots − 2·connections). */
  readonly growth: Int32Array;
  readonly currentKey: Float64Array;
  readonly firstTouch: Int32Array;

  constructor(n: number) {
    this.absorbed = new Uint8Array(n);
    this.connections = new Int32Array(n);
    this.growth = new Int32Array(n);
    this.currentKey = new Float64Array(n);
    this.firstTouch = new Int32Array(n);
  }

  cleared(): this {
    this.absorbed.fill(0);
    this.connections.fill(0);
    this.firstTouch.fill(-1);
    return this;
  }
}

/** A binary min-heap of numbers. */
class KeyHeap {
  private items: number[] = [];

  push(key: number): void {
    const items = this.items;
    let i = items.length;
    items.push(key);
    while (i > 0) {
      const parent = (i - 1) >> 1;
      if (items[parent]! <= key) break;
      items[i] = items[parent]!;
      i = parent;
    }
    items[i] = key;
  }

  pop(): number {
    const items = this.items;
    const top = items[0]!;
    const last = items.pop()!;
    if (items.length > 0) {
      let i = 0;
      for (;;) {
        const left = 2 * i + 1;
        if (left >= items.length) break;
        const right = left + 1;
        const child = right < items.length && items[right]! < items[left]! ? right : left;
        if (items[child]! >= last) break;
        items[i] = items[child]!;
        i = child;
      }
      items[i] = last;
    }
    return top;
  }
}
