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
 *
 * On small diagrams the contraction takes tens of microseconds, so the walks
 * are kept allocation-free: typed arrays kept from plan to plan, a heap of
 * only the crossings that touch the region with integer keys, widths and
 * costs tracked during the walk, and one plain array built per plan, for the
 * winner.
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
  const { opposite } = indexDiagram(d);
  const runCost = 2 * n * RUN_COST_PER_CROSSING; // two greedy walks
  const minimumStarts = Math.max(1, Math.min(MIN_STARTS, n, Math.floor(BASE_BUDGET / runCost)));
  const buffers = walkBuffers(n);
  buffers.prepare(opposite, n);
  let bestWidth = Infinity;
  let bestCost = Infinity;
  let spent = 0;
  for (let tried = 0; tried < n; tried++) {
    const start = startAt(tried, n, minimumStarts);
    for (const tieBreak of TIE_BREAKS) {
      greedyWalk(opposite, n, start, tieBreak, buffers);
      const { maxWidth, cost } = buffers;
      if (maxWidth < bestWidth || (maxWidth === bestWidth && cost < bestCost)) {
        buffers.keepAsBest(n);
        bestWidth = maxWidth;
        bestCost = cost;
      }
    }
    spent += runCost;
    const overBudget = spent + runCost > Math.min(MAX_BUDGET, SEARCH_FRACTION * bestCost);
    // A small diagram contracts in microseconds: one start (two walks) suffices, where more would cost more than the contraction.
    if (overBudget && (tried + 1 >= minimumStarts || (tried + 1 >= MIN_STARTS_SMALL && n <= SMALL_DIAGRAM))) break;
  }
  return { order: plainArray(buffers.bestOrder, n), widths: plainArray(buffers.bestWidths, n), maxWidth: bestWidth };
}

const TIE_BREAKS = ['oldest', 'newest'] as const;

/** The first n entries as a plain array (a loop: Array.from over a typed array is several times slower here). */
function plainArray(values: Int32Array, n: number): number[] {
  const out: number[] = new Array(n);
  for (let i = 0; i < n; i++) out[i] = values[i]!;
  return out;
}

/**
 * The k-th starting crossing: first `spread` evenly spaced crossings
 * ⌊s·n/spread⌋ (distinct, as spread ≤ n), then the others in index order.
 */
function startAt(k: number, n: number, spread: number): number {
  if (k < spread) return Math.floor((k * n) / spread);
  // Among 0 … n−1 the spread starts are skipped; find the (k − spread)-th of the rest.
  let rest = k - spread;
  for (let c = 0, s = 0; c < n; c++) {
    if (s < spread && Math.floor((s * n) / spread) === c) {
      s++;
      continue;
    }
    if (rest-- === 0) return c;
  }
  throw new RangeError(`crossing order: start ${k} of ${n}`);
}

/** Boundary width after each absorption when the crossings are absorbed in `order` (the walks track it as they go). */
export function boundaryWidths(d: LinkDiagram, order: readonly number[]): number[] {
  const { opposite } = indexDiagram(d);
  const absorbed = new Uint8Array(opposite.length >> 2);
  const widths: number[] = new Array(order.length);
  let width = 0;
  order.forEach((c, k) => {
    absorbed[c] = 1;
    for (let q = 0; q < 4; q++) {
      const other = opposite[4 * c + q]! >> 2;
      if (other === c) continue; // a kink: both ends meet inside this crossing
      width += absorbed[other] ? -1 : 1;
    }
    widths[k] = width;
  });
  return widths;
}

/** Widths past this cost the same (2^1000 already outweighs any order's other terms). */
const MAX_COSTED_WIDTH = 1000;
const POWERS_OF_TWO = Float64Array.from({ length: MAX_COSTED_WIDTH + 1 }, (_, w) => 2 ** w);

/** The most crossings the planner takes: a crossing's index needs this many bits of a 31-bit key. */
const MAX_INDEX_BITS = 21;
/** Bits of a key above contact time and index: (connected?, growth + 4) is below 32. */
const PRIORITY_BITS = 5;

/**
 * How a walk packs (connected?, growth, contact time, index) into one
 * non-negative 31-bit integer, smaller keys picked first. The index takes
 * ⌈log₂ n⌉ bits and contact time the rest, shifted right when it does not fit
 * (only beyond 8,192 crossings, where nearby contact times then tie and the
 * index decides).
 */
class KeyLayout {
  readonly indexBits: number;
  readonly indexMask: number;
  readonly contactShift: number;
  private readonly priorityShift: number;

  constructor(n: number) {
    this.indexBits = Math.max(1, Math.ceil(Math.log2(n)));
    this.indexMask = (1 << this.indexBits) - 1;
    const contactBits = Math.min(this.indexBits, 31 - PRIORITY_BITS - this.indexBits);
    this.contactShift = this.indexBits - contactBits;
    this.priorityShift = contactBits + this.indexBits;
  }

  key(connected: boolean, growth: number, contact: number, c: number): number {
    return ((((connected ? 0 : 1) * 16 + growth + 4) << this.priorityShift) | ((contact >> this.contactShift) << this.indexBits) | c);
  }
}

/**
 * One greedy walk, written into `buffers` (order, widths, widest boundary and
 * cost). The next crossing is the one with the smallest key: touching the
 * region before not touching it, then least growth, then the tie-break on
 * contact time, then the lowest index. A binary heap with lazy deletion keeps
 * each pick logarithmic: a crossing's stale entries are skipped when its key
 * has changed since they were pushed. A crossing's growth is exactly how much
 * absorbing it widens the boundary, so the widths come with the walk.
 */
function greedyWalk(opposite: Int32Array, n: number, start: number, tieBreak: TieBreak, buffers: WalkBuffers): void {
  const { absorbed, connections, growth, currentKey, firstTouch, order, widths, heap, layout } = buffers.cleared(n);
  const newest = tieBreak === 'newest';
  let next = start;
  let width = 0;
  let maxWidth = 0;
  let cost = 0;
  for (let stepIndex = 0; stepIndex < n; stepIndex++) {
    if (stepIndex > 0) next = popFrontier(heap, absorbed, currentKey, layout.indexMask) ?? untouchedMinimum(n, absorbed, currentKey);
    absorbed[next] = 1;
    order[stepIndex] = next;
    width += growth[next]!;
    widths[stepIndex] = width;
    if (width > maxWidth) maxWidth = width;
    // Roughly proportional to the contraction work: states grow about like 2^width, polynomials like the step.
    cost += POWERS_OF_TWO[Math.min(width, MAX_COSTED_WIDTH)]! * (stepIndex + 1);
    for (let q = 0; q < 4; q++) {
      const other = opposite[4 * next + q]! >> 2; // the crossing at the edge's other end
      if (other === next || absorbed[other]) continue;
      connections[other]!++;
      growth[other]! -= 2;
      if (firstTouch[other]! < 0) firstTouch[other] = stepIndex;
      const contact = newest ? n - 1 - stepIndex : firstTouch[other]!;
      currentKey[other] = layout.key(true, growth[other]!, contact, other);
      heap.push(currentKey[other]!);
    }
  }
  buffers.maxWidth = maxWidth;
  buffers.cost = cost;
}

/**
 * The frontier crossing with the smallest key, skipping stale entries; undefined
 * once no unabsorbed crossing touches the region (the heap holds only crossings
 * that touch it, so a walk over a connected diagram never pays for the rest).
 */
function popFrontier(heap: KeyHeap, absorbed: Uint8Array, currentKey: Int32Array, indexMask: number): number | undefined {
  while (heap.size > 0) {
    const key = heap.pop();
    const c = key & indexMask;
    if (!absorbed[c] && currentKey[c] === key) return c;
  }
  return undefined;
}

/**
 * The next region's seed once the frontier is empty: the untouched crossing
 * with the smallest key (every unabsorbed crossing is untouched then, and an
 * untouched crossing's key never changes), as if all of them were in the heap.
 */
function untouchedMinimum(n: number, absorbed: Uint8Array, currentKey: Int32Array): number {
  let best = -1;
  for (let c = 0; c < n; c++) if (!absorbed[c] && (best < 0 || currentKey[c]! < currentKey[best]!)) best = c;
  return best;
}

let sharedBuffers: WalkBuffers | undefined;

/** The walk arrays for n crossings, kept from plan to plan (planning a small diagram costs less than allocating them). */
function walkBuffers(n: number): WalkBuffers {
  if (!sharedBuffers || sharedBuffers.capacity < n) sharedBuffers = new WalkBuffers(Math.max(n, 64));
  return sharedBuffers;
}

/** The per-crossing arrays of a greedy walk and its result, cleared for each walk (only the first n entries are used). */
class WalkBuffers {
  readonly absorbed: Uint8Array;
  readonly connections: Int32Array;
  /** growth[c]: how much absorbing c would widen the boundary (4 − kink slots − 2·connections). */
  readonly growth: Int32Array;
  readonly currentKey: Int32Array;
  readonly firstTouch: Int32Array;
  readonly heap: KeyHeap;
  /** How this plan's keys are packed (set by prepare). */
  layout = new KeyLayout(1);
  readonly order: Int32Array;
  readonly widths: Int32Array;
  readonly bestOrder: Int32Array;
  readonly bestWidths: Int32Array;
  private readonly initialGrowth: Int32Array;
  private readonly initialKey: Int32Array;
  maxWidth = 0;
  cost = 0;

  constructor(readonly capacity: number) {
    const n = capacity;
    this.absorbed = new Uint8Array(n);
    this.connections = new Int32Array(n);
    this.growth = new Int32Array(n);
    this.currentKey = new Int32Array(n);
    this.firstTouch = new Int32Array(n);
    // Each crossing is pushed at most once per slot.
    this.heap = new KeyHeap(4 * n);
    this.order = new Int32Array(n);
    this.widths = new Int32Array(n);
    this.bestOrder = new Int32Array(n);
    this.bestWidths = new Int32Array(n);
    this.initialGrowth = new Int32Array(n);
    this.initialKey = new Int32Array(n);
  }

  /** Sets up the untouched state of the diagram with slots `opposite`, which every walk of a plan starts from. */
  prepare(opposite: Int32Array, n: number): void {
    if (n > 2 ** MAX_INDEX_BITS) throw new RangeError(`crossing order: ${n} crossings is more than the planner supports (${2 ** MAX_INDEX_BITS})`);
    this.layout = new KeyLayout(n);
    for (let c = 0; c < n; c++) {
      let open = 0;
      for (let q = 0; q < 4; q++) if (opposite[4 * c + q]! >> 2 !== c) open++;
      this.initialGrowth[c] = open;
      this.initialKey[c] = this.layout.key(false, open, 0, c);
    }
  }

  cleared(n: number): this {
    this.absorbed.fill(0, 0, n);
    this.connections.fill(0, 0, n);
    this.firstTouch.fill(-1, 0, n);
    this.growth.set(this.initialGrowth.subarray(0, n));
    this.currentKey.set(this.initialKey.subarray(0, n));
    this.heap.clear();
    return this;
  }

  /** Keeps the last walk, over n crossings, as the best so far (the next walk overwrites `order` and `widths`). */
  keepAsBest(n: number): void {
    this.bestOrder.set(this.order.subarray(0, n));
    this.bestWidths.set(this.widths.subarray(0, n));
  }
}

/** A binary min-heap of numbers in a fixed array (a walk knows how many pushes it makes). */
class KeyHeap {
  private readonly items: Int32Array;
  size = 0;

  constructor(capacity: number) {
    this.items = new Int32Array(Math.max(1, capacity));
  }

  clear(): void {
    this.size = 0;
  }

  push(key: number): void {
    const items = this.items;
    let i = this.size++;
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
    const size = --this.size;
    const last = items[size]!;
    if (size > 0) {
      let i = 0;
      for (;;) {
        const left = 2 * i + 1;
        if (left >= size) break;
        const right = left + 1;
        const child = right < size && items[right]! < items[left]! ? right : left;
        if (items[child]! >= last) break;
        items[i] = items[child]!;
        i = child;
      }
      items[i] = last;
    }
    return top;
  }
}
