/**
 * The Kauffman bracket by tangle contraction.
 *
 * Crossings are absorbed one at a time (in the order chosen by
 * crossing-order.ts). The absorbed region is a tangle whose open boundary is
 * the list of edges with exactly one end inside it. Its value is a map from
 * the ways its arcs pair up the boundary ends (perfect matchings) to Laurent
 * polynomials in A. Absorbing a crossing splits every matching into its A- and
 * B-smoothing, glues the crossing's slots to the boundary ends they meet, and
 * multiplies by the loop value d = −A² − A⁻² for every arc that closes up. The
 * work is exponential in the boundary width only, not in the crossing count.
 *
 * Smoothing convention (shared with state-sum.ts, the oracle): at a crossing
 * with slots 0..3 counterclockwise from the incoming under-edge, the
 * A-smoothing joins slots 0–1 and 2–3, the B-smoothing joins 0–3 and 1–2.
 * Normalisation: ⟨O⟩ = 1, so a diagram whose states close c circles
 * contributes d^(c−1); the last absorbed crossing therefore counts one loop
 * fewer, and crossingless components multiply by d each.
 *
 * Arithmetic is exact without BigInt in the inner loop: the contraction only
 * adds, negates and shifts coefficients, so every coefficient is kept as
 * base-2^32 digits ("limbs") in Float64Arrays, each limb updated by the same
 * linear map. Before a step could push a limb past 2^52, all digits are carried
 * (and a limb added when the top one overflows), so every double stays an exact
 * integer. Diagrams with small coefficients run with one limb, i.e. plain
 * floating-point adds.
 */
import { Laurent } from '../poly/laurent.ts';
import { indexDiagram, type LinkDiagram } from '../diagram/model.ts';
import { InputError } from '../errors.ts';
import { planContraction } from './crossing-order.ts';
import { checkTimeBudget, stateMemoryError } from '../limits.ts';

export interface BracketResult {
  /** ⟨D⟩ ∈ ℤ[A, A⁻¹] with ⟨O⟩ = 1. */
  readonly bracket: Laurent;
  /** The largest number of open edge ends the contraction reached. */
  readonly boundaryWidth: number;
}

/** The loop value d = −A² − A⁻². */
export const LOOP_VALUE = Laurent.fromTerms([
  [2, -1n],
  [-2, -1n],
]);

/**
 * Beyond this many open edge ends the matchings alone (about 2^width / width^1.5
 * of them) outgrow any machine; refusing up front beats running out of memory
 * after minutes.
 */
export const MAX_BOUNDARY_WIDTH = 28;

/**
 * ⟨D⟩ by tangle contraction. `order` (a permutation of the crossing indices)
 * overrides the planned absorption order; the value does not depend on it,
 * only the work does.
 */
export function kauffmanBracket(d: LinkDiagram, order?: readonly number[], limits: { readonly maxStateBytes?: number } = {}): BracketResult {
  const n = d.crossings.length;
  if (n === 0) {
    if (d.freeLoops === 0) throw new RangeError('the empty diagram (no crossings, no loops) has no Kauffman bracket');
    return { bracket: LOOP_VALUE.pow(d.freeLoops - 1), boundaryWidth: 0 };
  }
  const chosen = order ?? planContraction(d).order;
  checkPermutation(chosen, n);
  const steps = planSteps(d, chosen);
  const boundaryWidth = steps.reduce((m, s) => Math.max(m, s.newWidth), 0);
  if (boundaryWidth > MAX_BOUNDARY_WIDTH) {
    throw new InputError(
      'diagram-too-wide',
      `this ${n}-crossing diagram cannot be cut into pieces small enough for the bracket computation: ` +
        `the best crossing order found keeps ${boundaryWidth} edge ends open at once, and beyond ${MAX_BOUNDARY_WIDTH} ` +
        'the work and memory grow past what any machine has. Give a diagram of the same link with fewer crossings, ' +
        'or one drawn as a braid closure on fewer strands.',
    );
  }
  if (limits.maxStateBytes !== undefined) {
    const bytes = estimateStateBytes(steps);
    if (bytes > limits.maxStateBytes) throw stateMemoryError(n, boundaryWidth, bytes, limits.maxStateBytes);
  }
  // Planar diagrams keep all exponents of one state in one class mod 4; a
  // virtual (non-planar) input can break that, and is then redone with step 2.
  const contracted = contract(steps, 4) ?? contract(steps, 2);
  if (!contracted) throw new Error('internal: bracket contraction failed with exponent step 2');
  const bracket = d.freeLoops > 0 ? contracted.mul(LOOP_VALUE.pow(d.freeLoops)) : contracted;
  return { bracket, boundaryWidth };
}

/** Catalan numbers as doubles: the number of non-crossing matchings of 2m boundary ends. */
function catalan(m: number): number {
  let c = 1;
  for (let i = 0; i < m; i++) c = (c * 2 * (2 * i + 1)) / (i + 2);
  return c;
}

/**
 * An estimate of the peak memory of the contraction, before it runs. After k
 * crossings at width w there are at most 2^k states and (for a disk-shaped
 * region) at most Catalan(w/2) of them; each holds a polynomial of about k + 1
 * terms whose coefficients need one 32-bit limb per ~48 crossings (measured on
 * alternating closures), kept in two slabs, plus about 250 bytes of bookkeeping
 * and 100 per limb array. Calibrated against peak resident size at widths 16–24.
 */
export function estimateStateBytes(steps: readonly { readonly newWidth: number }[]): number {
  let peak = 0;
  steps.forEach((step, k) => {
    const absorbed = k + 1;
    const states = Math.min(2 ** absorbed, catalan(step.newWidth / 2));
    const limbs = 1 + Math.floor(absorbed / 48);
    peak = Math.max(peak, states * (250 + limbs * (100 + 16 * (absorbed + 1))));
  });
  return peak;
}

function checkPermutation(order: readonly number[], n: number): void {
  const seen = new Uint8Array(n);
  if (order.length !== n) throw new RangeError(`crossing order has ${order.length} entries for ${n} crossings`);
  for (const c of order) {
    if (!Number.isInteger(c) || c < 0 || c >= n || seen[c]) throw new RangeError(`crossing order is not a permutation of 0…${n - 1}`);
    seen[c] = 1;
  }
}

/**
 * The state-independent part of absorbing one crossing. Positions during the
 * step ("scratch" positions): 0 … oldWidth−1 are the old boundary ends,
 * oldWidth + q is slot q of the new crossing.
 */
export interface StepPlan {
  readonly oldWidth: number;
  readonly newWidth: number;
  /** Pairs of scratch positions glued together (an edge between them), flattened. */
  readonly joins: Int32Array;
  /** For each new boundary position, the scratch position it comes from. */
  readonly layout: Int32Array;
  /** For each scratch position, its new boundary position, or −1 once glued. */
  readonly compact: Int32Array;
}

/**
 * The absorption steps for `order`. The two ends of edge `cut` (if given) are
 * never glued, so the last step leaves them open (the Khovanov engine cuts a
 * knot open this way).
 */
export function planSteps(d: LinkDiagram, order: readonly number[], cut = -1): StepPlan[] {
  const { opposite } = indexDiagram(d);
  // Boundary ends are identified by the slot (4c+q) inside the region they hang from.
  let boundary: number[] = [];
  const positionOfSlot = new Int32Array(4 * d.crossings.length).fill(-1);
  const steps: StepPlan[] = [];
  for (const c of order) {
    const w = boundary.length;
    const glued = new Uint8Array(w + 4);
    const joins: number[] = [];
    for (let q = 0; q < 4; q++) {
      if (glued[w + q] || d.crossings[c]!.edges[q] === cut) continue;
      const far = opposite[4 * c + q]!;
      if (far >> 2 === c) {
        // A kink: the edge runs from this slot to another slot of the same crossing.
        const q2 = far & 3;
        joins.push(w + q, w + q2);
        glued[w + q] = glued[w + q2] = 1;
      } else if (positionOfSlot[far]! >= 0) {
        const p = positionOfSlot[far]!;
        joins.push(p, w + q);
        glued[p] = glued[w + q] = 1;
      }
    }
    const layout: number[] = [];
    const nextBoundary: number[] = [];
    for (let p = 0; p < w; p++) {
      if (!glued[p]) {
        layout.push(p);
        nextBoundary.push(boundary[p]!);
      } else positionOfSlot[boundary[p]!] = -1;
    }
    for (let q = 0; q < 4; q++) {
      if (!glued[w + q]) {
        layout.push(w + q);
        nextBoundary.push(4 * c + q);
      }
    }
    const compact = new Int32Array(w + 4).fill(-1);
    layout.forEach((p, i) => (compact[p] = i));
    nextBoundary.forEach((slot, i) => (positionOfSlot[slot] = i));
    boundary = nextBoundary;
    steps.push({ oldWidth: w, newWidth: layout.length, joins: Int32Array.from(joins), layout: Int32Array.from(layout), compact });
  }
  return steps;
}

/**
 * The states of one step, in flat typed arrays: state s's polynomial has `len[s]`
 * coefficients, coefficient i holding the exponent lo[s] + i·step, stored as
 * `limbs[s]` base-2^32 digits: digit j of coefficient i is slab[offset[s] + j·len[s] + i].
 * `bound[s]` bounds |digit| over all its digits. No object per state, so the
 * garbage collector has nothing to trace.
 */
interface States {
  count: number;
  lo: Int32Array;
  len: Int32Array;
  limbs: Int32Array;
  offset: Int32Array;
  bound: Float64Array;
  slab: Float64Array;
}

const LIMB_BASE = 2 ** 32;
/** Limbs may grow to this before a carry; leaves room for the carry itself below 2^53. */
const LIMB_CEILING = 2 ** 52;

/** Largest binomial coefficient C(l, ⌊l/2⌋): the growth factor of d^l. At most two loops close per crossing. */
function centralBinomial(l: number): number {
  return l < 2 ? 1 : l === 2 ? 2 : binomialRow(l)[l >> 1]!;
}

function binomialRow(l: number): number[] {
  const row = [1];
  for (let i = 1; i <= l; i++) row.push((row[i - 1]! * (l - i + 1)) / i);
  return row;
}

/**
 * A canonical key for a matching given as partner positions. Non-crossing
 * matchings (the only kind a disk-shaped region produces) are fixed by which
 * ends open an arc, so their key is that bit pattern as a number: cheap to
 * build and to hash. Crossing matchings (a region with holes, or a non-planar
 * code) fall back to a string of the partner positions, kept apart from the numbers.
 */
type MatchingKey = number | string;

/** The key of the empty matching (width 0): the bit pattern with no bits. */
const EMPTY_MATCHING = 1;

function matchingKey(partner: Uint16Array, width: number, stack: Int32Array): MatchingKey {
  if (width <= 52) {
    let key = 1; // a leading 1 keeps the pattern's length
    let depth = 0;
    let nonCrossing = true;
    for (let i = 0; i < width && nonCrossing; i++) {
      const p = partner[i]!;
      if (p > i) {
        stack[depth++] = p;
        key = key * 2 + 1;
      } else {
        nonCrossing = depth > 0 && stack[--depth] === i;
        key = key * 2;
      }
    }
    if (nonCrossing) return key;
  }
  return String.fromCharCode.apply(null, partner as unknown as number[]);
}

/**
 * Matching key → target index for one step: open addressing over doubles for the
 * numeric keys (all ≥ 1, so 0 marks an empty slot), a Map for the rare string keys.
 */
class TargetTable {
  private keys = new Float64Array(0);
  private values = new Int32Array(0);
  private mask = 0;
  private readonly strings = new Map<string, number>();

  /** Empties the table, sized for up to `expected` keys at load ≤ 1/2. */
  reset(expected: number): void {
    let capacity = 16;
    while (capacity < 2 * expected) capacity *= 2;
    if (capacity > this.keys.length) {
      this.keys = new Float64Array(capacity);
      this.values = new Int32Array(capacity);
    } else this.keys.fill(0, 0, capacity);
    this.mask = capacity - 1;
    this.strings.clear();
  }

  /** The index stored for `key`, or −1. */
  get(key: MatchingKey): number {
    if (typeof key === 'string') return this.strings.get(key) ?? -1;
    const keys = this.keys;
    for (let i = slotOf(key) & this.mask; ; i = (i + 1) & this.mask) {
      const k = keys[i]!;
      if (k === key) return this.values[i]!;
      if (k === 0) return -1;
    }
  }

  set(key: MatchingKey, value: number): void {
    if (typeof key === 'string') {
      this.strings.set(key, value);
      return;
    }
    const keys = this.keys;
    let i = slotOf(key) & this.mask;
    while (keys[i] !== 0) i = (i + 1) & this.mask;
    keys[i] = key;
    this.values[i] = value;
  }
}

/** Mixes both 32-bit halves of a key below 2^53. */
function slotOf(key: number): number {
  const high = Math.floor(key / LIMB_BASE) | 0;
  return (Math.imul(key | 0, 0x9e3779b1) ^ Math.imul(high ^ (high >>> 15), 0x85ebca77)) >>> 7;
}

const A_SLOT_PARTNER = [1, 0, 3, 2];
const B_SLOT_PARTNER = [3, 2, 1, 0];

/** Runs the contraction with exponents stored at the given step; undefined if a state mixes classes mod `step`. */
function contract(steps: readonly StepPlan[], step: 2 | 4): Laurent | undefined {
  // The empty tangle: one (empty) matching with value 1.
  let states: States = {
    count: 1,
    lo: Int32Array.of(0),
    len: Int32Array.of(1),
    limbs: Int32Array.of(1),
    offset: Int32Array.of(0),
    bound: Float64Array.of(1),
    slab: Float64Array.of(1),
  };
  let partners = new Uint16Array(0);
  let lastKey: MatchingKey = EMPTY_MATCHING;
  // Two slabs take turns: the sources of one step live in one, its targets in the other.
  let spareSlab: Float64Array = new Float64Array(0);
  const table = new TargetTable();
  const dStride = 4 / step; // index distance between the terms A^(2l−4j) of d^l

  for (let k = 0; k < steps.length; k++) {
    checkTimeBudget();
    const plan = steps[k]!;
    const isLast = k === steps.length - 1;
    const w = plan.oldWidth;
    const w2 = plan.newWidth;
    const { joins, layout, compact } = plan;
    const scratch = new Int32Array(w + 4);
    const codes = new Uint16Array(w2);
    const stack = new Int32Array(w2);
    const { count, lo, len, limbs, bound } = states;

    // Phase 1: the target matching and loop count of every (state, smoothing).
    table.reset(2 * count);
    let targets = 0;
    let nextPartners = new Uint16Array(Math.max(16, 4 * w2));
    const contributionTarget = new Int32Array(2 * count);
    const contributionLoops = new Int32Array(2 * count);
    const tLo = new Int32Array(2 * count);
    const tHi = new Int32Array(2 * count);
    const tBound = new Float64Array(2 * count);
    const tLimbs = new Int32Array(2 * count);
    for (let s = 0; s < count; s++) {
      const sourceLo = lo[s]!;
      const sourceHi = sourceLo + step * (len[s]! - 1);
      for (let smoothing = 0; smoothing < 2; smoothing++) {
        for (let p = 0; p < w; p++) scratch[p] = partners[s * w + p]!;
        const slotPartner = smoothing === 0 ? A_SLOT_PARTNER : B_SLOT_PARTNER;
        for (let q = 0; q < 4; q++) scratch[w + q] = w + slotPartner[q]!;
        let loops = 0;
        for (let j = 0; j < joins.length; j += 2) {
          const x = joins[j]!;
          const y = joins[j + 1]!;
          const px = scratch[x]!;
          if (px === y) loops++;
          else {
            const py = scratch[y]!;
            scratch[px] = py;
            scratch[py] = px;
          }
        }
        for (let i = 0; i < w2; i++) codes[i] = compact[scratch[layout[i]!]!]!;
        const key = matchingKey(codes, w2, stack);
        if (isLast) loops--; // ⟨O⟩ = 1: the final picture's first circle is free
        let t = table.get(key);
        const base = sourceLo + (smoothing === 0 ? 1 : -1) - 2 * loops;
        const top = sourceHi + (smoothing === 0 ? 1 : -1) + 2 * loops;
        if (t < 0) {
          t = targets++;
          table.set(key, t);
          lastKey = key;
          if (nextPartners.length < (t + 1) * w2) {
            const grown = new Uint16Array(2 * nextPartners.length + w2);
            grown.set(nextPartners);
            nextPartners = grown;
          }
          nextPartners.set(codes, t * w2);
          tLo[t] = base;
          tHi[t] = top;
        } else {
          if ((base - tLo[t]!) % step !== 0) return undefined;
          if (base < tLo[t]!) tLo[t] = base;
          if (top > tHi[t]!) tHi[t] = top;
        }
        tBound[t]! += bound[s]! * centralBinomial(loops);
        if (limbs[s]! > tLimbs[t]!) tLimbs[t] = limbs[s]!;
        contributionTarget[2 * s + smoothing] = t;
        contributionLoops[2 * s + smoothing] = loops;
      }
    }

    // Carry every source if some target limb could pass the ceiling.
    if (tBound.subarray(0, targets).some((b) => b >= LIMB_CEILING)) {
      states = carried(states);
      tBound.fill(0);
      tLimbs.fill(0);
      for (let s = 0; s < count; s++) {
        for (let smoothing = 0; smoothing < 2; smoothing++) {
          const t = contributionTarget[2 * s + smoothing]!;
          tBound[t]! += states.bound[s]! * centralBinomial(contributionLoops[2 * s + smoothing]!);
          if (states.limbs[s]! > tLimbs[t]!) tLimbs[t] = states.limbs[s]!;
        }
      }
      if (tBound.subarray(0, targets).some((b) => b >= LIMB_CEILING)) {
        throw new RangeError('diagram too wide for exact contraction: more than 2^20 matchings merge into one');
      }
    }

    // Phase 2: accumulate every contribution into its target, in one zeroed slab reused across steps.
    const next: States = {
      count: targets,
      lo: tLo.slice(0, targets),
      len: new Int32Array(targets),
      limbs: tLimbs.slice(0, targets),
      offset: new Int32Array(targets),
      bound: tBound.slice(0, targets),
      slab: spareSlab,
    };
    let slabSize = 0;
    for (let t = 0; t < targets; t++) {
      const length = (tHi[t]! - tLo[t]!) / step + 1;
      next.len[t] = length;
      next.offset[t] = slabSize;
      slabSize += length * next.limbs[t]!;
    }
    if (spareSlab.length < slabSize) next.slab = new Float64Array(Math.ceil(slabSize * 1.25));
    else spareSlab.fill(0, 0, slabSize);
    const source = states.slab;
    const target = next.slab;
    for (let s = 0; s < count; s++) {
      const tA = contributionTarget[2 * s]!;
      const tB = contributionTarget[2 * s + 1]!;
      const loopsA = contributionLoops[2 * s]!;
      const loopsB = contributionLoops[2 * s + 1]!;
      const n = states.len[s]!;
      const startA = next.offset[tA]! + (states.lo[s]! + 1 - 2 * loopsA - next.lo[tA]!) / step;
      const startB = next.offset[tB]! + (states.lo[s]! - 1 - 2 * loopsB - next.lo[tB]!) / step;
      const strideA = next.len[tA]!;
      const strideB = next.len[tB]!;
      for (let j = 0, from = states.offset[s]!; j < states.limbs[s]!; j++, from += n) {
        if (loopsA <= 1 && loopsB <= 1) {
          addBothSmoothings(source, from, n, target, startA + j * strideA, loopsA, startB + j * strideB, loopsB, dStride);
        } else {
          addTimesLoopPower(target, startA + j * strideA, source, from, n, loopsA, dStride);
          addTimesLoopPower(target, startB + j * strideB, source, from, n, loopsB, dStride);
        }
      }
    }
    partners = nextPartners;
    spareSlab = states.slab;
    states = next;
  }

  if (states.count !== 1 || lastKey !== EMPTY_MATCHING) throw new Error('internal: contraction ended with an open boundary');
  const length = states.len[0]!;
  const dense: bigint[] = new Array(length);
  for (let i = 0; i < length; i++) {
    let value = 0n;
    for (let j = states.limbs[0]! - 1; j >= 0; j--) value = (value << 32n) + BigInt(states.slab[states.offset[0]! + j * length + i]!);
    dense[i] = value;
  }
  return Laurent.fromDense(dense, states.lo[0]!, step);
}

/** target[at + i + m·stride] += (−1)^l C(l, m) · source[from + i] for i < n, m = 0 … l: multiplication by d^l. */
function addTimesLoopPower(target: Float64Array, at: number, source: Float64Array, from: number, n: number, loops: number, stride: number): void {
  if (loops === 0) {
    for (let i = 0; i < n; i++) target[at + i]! += source[from + i]!;
  } else if (loops === 1) {
    const at2 = at + stride;
    for (let i = 0; i < n; i++) {
      const v = source[from + i]!;
      target[at + i]! -= v;
      target[at2 + i]! -= v;
    }
  } else {
    const row = binomialRow(loops);
    const sign = loops % 2 === 0 ? 1 : -1;
    for (let m = 0; m <= loops; m++) {
      const factor = sign * row[m]!;
      const o = at + m * stride;
      for (let i = 0; i < n; i++) target[o + i]! += factor * source[from + i]!;
    }
  }
}

/**
 * Both smoothings of one source digit row in a single pass (the common case: at
 * most one loop closes on each side), reading the source once instead of twice.
 * The two target rows may be the same.
 */
function addBothSmoothings(
  source: Float64Array,
  from: number,
  n: number,
  target: Float64Array,
  atA: number,
  loopsA: number,
  atB: number,
  loopsB: number,
  stride: number,
): void {
  const a2 = atA + stride;
  const b2 = atB + stride;
  if (loopsA === 0 && loopsB === 0) {
    for (let i = 0; i < n; i++) {
      const v = source[from + i]!;
      target[atA + i]! += v;
      target[atB + i]! += v;
    }
  } else if (loopsA === 1 && loopsB === 0) {
    for (let i = 0; i < n; i++) {
      const v = source[from + i]!;
      target[atA + i]! -= v;
      target[a2 + i]! -= v;
      target[atB + i]! += v;
    }
  } else if (loopsA === 0) {
    for (let i = 0; i < n; i++) {
      const v = source[from + i]!;
      target[atA + i]! += v;
      target[atB + i]! -= v;
      target[b2 + i]! -= v;
    }
  } else {
    for (let i = 0; i < n; i++) {
      const v = source[from + i]!;
      target[atA + i]! -= v;
      target[a2 + i]! -= v;
      target[atB + i]! -= v;
      target[b2 + i]! -= v;
    }
  }
}

/**
 * The same states with base-2^32 digits carried upward, digits added where a top
 * one overflows; afterwards every |digit| < 2^32 (the bounds say so).
 */
function carried(states: States): States {
  const { count, len, offset, slab } = states;
  const digits: Float64Array[][] = [];
  const limbs = new Int32Array(count);
  const newOffset = new Int32Array(count);
  let size = 0;
  for (let s = 0; s < count; s++) {
    const n = len[s]!;
    const rows: Float64Array[] = [];
    for (let j = 0; j < states.limbs[s]!; j++) rows.push(slab.slice(offset[s]! + j * n, offset[s]! + (j + 1) * n));
    for (let i = 0; i < n; i++) {
      let carry = 0;
      for (let j = 0; j < rows.length - 1; j++) {
        const x = rows[j]![i]! + carry;
        carry = Math.floor(x / LIMB_BASE);
        rows[j]![i] = x - carry * LIMB_BASE;
      }
      rows[rows.length - 1]![i]! += carry;
    }
    for (;;) {
      const top = rows[rows.length - 1]!;
      if (!top.some((x) => Math.abs(x) >= LIMB_BASE)) break;
      const above = new Float64Array(n);
      for (let i = 0; i < n; i++) {
        const q = Math.floor(top[i]! / LIMB_BASE);
        top[i] = top[i]! - q * LIMB_BASE;
        above[i] = q;
      }
      rows.push(above);
    }
    digits.push(rows);
    limbs[s] = rows.length;
    newOffset[s] = size;
    size += rows.length * n;
  }
  const newSlab = new Float64Array(size);
  for (let s = 0; s < count; s++) digits[s]!.forEach((row, j) => newSlab.set(row, newOffset[s]! + j * len[s]!));
  return { count, lo: states.lo, len, limbs, offset: newOffset, bound: new Float64Array(count).fill(LIMB_BASE), slab: newSlab };
}
