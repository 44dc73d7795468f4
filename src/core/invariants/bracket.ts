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
 * floating-point adds. The digits live in a WebAssembly memory and the passes
 * over them (accumulating contributions, carrying) are SIMD kernels, see
 * wasm/digit-kernels.ts; the matchings stay here.
 */
import { Laurent } from '../poly/laurent.ts';
import { indexDiagram, type LinkDiagram } from '../diagram/model.ts';
import { InputError } from '../errors.ts';
import { planContraction } from './crossing-order.ts';
import { checkTimeBudget, stateMemoryError, type LimitError } from '../limits.ts';
import { borrowDigitSlabs, DIGIT_MEMORY_MAX_BYTES, returnDigitSlabs, type DigitSlabs, type SlabIndex } from './wasm/digit-slabs.ts';
import type { DigitKernels } from './wasm/digit-kernels.ts';
import { bracketByModuli, recordContraction } from './bracket-modular.ts';
import { bracketNormBound } from './bracket-norm-bound.ts';
import { isAlternatingDiagram } from '../diagram/properties.ts';

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
export function kauffmanBracket(
  d: LinkDiagram,
  order?: readonly number[],
  limits: { readonly maxStateBytes?: number } = {},
  arithmetic: BracketArithmetic = 'auto',
): BracketResult {
  const n = d.crossings.length;
  if (n === 0) {
    if (d.freeLoops === 0) throw new RangeError('the empty diagram (no crossings, no loops) has no Kauffman bracket');
    return { bracket: LOOP_VALUE.pow(d.freeLoops - 1), boundaryWidth: 0 };
  }
  const chosen = order ?? planContraction(d).order;
  checkPermutation(chosen, n);
  const steps = planSteps(d, chosen);
  const boundaryWidth = widestBoundary(steps);
  if (boundaryWidth > MAX_BOUNDARY_WIDTH) {
    throw new InputError(
      'diagram-too-wide',
      `this ${n}-crossing diagram cannot be cut into pieces small enough for the bracket computation: ` +
        `the best crossing order found keeps ${boundaryWidth} edge ends open at once, and beyond ${MAX_BOUNDARY_WIDTH} ` +
        'the work and memory grow past what any machine has. Give a diagram of the same link with fewer crossings, ' +
        'or one drawn as a braid closure on fewer strands.',
    );
  }
  const byModuli = arithmetic === 'digits' ? undefined : bracketModuloMany(d, steps, arithmetic === 'moduli', limits.maxStateBytes);
  if (byModuli) return { bracket: withFreeLoops(d, byModuli), boundaryWidth };
  if (limits.maxStateBytes !== undefined) {
    const bytes = estimateStateBytes(steps);
    if (bytes > limits.maxStateBytes) throw stateMemoryError(n, boundaryWidth, bytes, limits.maxStateBytes);
  }
  // Planar diagrams keep all exponents of one state in one class mod 4; a
  // virtual (non-planar) input can break that, and is then redone with step 2.
  const slabs = borrowDigitSlabs();
  let contracted: Laurent | undefined;
  try {
    contracted = contract(slabs, steps, 4) ?? contract(slabs, steps, 2);
  } finally {
    returnDigitSlabs();
  }
  if (!contracted) throw new Error('internal: bracket contraction failed with exponent step 2');
  return { bracket: withFreeLoops(d, contracted), boundaryWidth };
}

function withFreeLoops(d: LinkDiagram, contracted: Laurent): Laurent {
  return d.freeLoops > 0 ? contracted.mul(LOOP_VALUE.pow(d.freeLoops)) : contracted;
}

/**
 * Which arithmetic contracts a diagram: 'digits' keeps every coefficient's
 * digits in the states (bracket.ts), 'moduli' replays the contraction modulo
 * several numbers (bracket-modular.ts); 'auto' picks moduli where they pay.
 */
export type BracketArithmetic = 'auto' | 'digits' | 'moduli';

/**
 * Where 'auto' contracts by moduli, measured side by side with the digit
 * engine on alternating braid closures (one thread, best of two, load ≈ 1):
 * moduli pay once the digit engine's states outgrow the processor's caches and
 * there are many of them (9 strands, 300 crossings: 0.80 s against 1.46 s;
 * 10 strands, 400: 6.9 s against 10.7 s; 8 strands, 400: 0.49 s against
 * 0.65 s), and lose on narrow diagrams, whose few long states the digit engine
 * streams well (4 strands, 3,000 crossings: 2.0 s against 1.6 s; 5 strands,
 * 1,500: 0.96 s against 0.65 s), or small ones (8 strands, 300: even).
 */
const MODULI_FROM_CROSSINGS = 300;
const MODULI_FROM_WIDTH = 12;
const MODULI_FROM_STATE_BYTES = 64 * 1024 * 1024;

/**
 * Whether 'auto' contracts `d` by moduli. Also only on alternating diagrams:
 * the replays cost as many passes as the coefficient bound has bits, and the
 * bound is tight only where few terms cancel (on alternating diagrams it
 * equalled the sum of the |coefficients| in every case measured; on a
 * 640-crossing torus closure it has 434 bits where the coefficients have 4).
 */
export function moduliPay(d: LinkDiagram, steps: readonly StepPlan[]): boolean {
  return (
    d.crossings.length >= MODULI_FROM_CROSSINGS &&
    widestBoundary(steps) >= MODULI_FROM_WIDTH &&
    estimateStateBytes(steps) >= MODULI_FROM_STATE_BYTES &&
    isAlternatingDiagram(d)
  );
}

/** The recording of the contraction is not allowed to hold more than this. */
const MAX_RECORD_BYTES = 512 * 1024 * 1024;

/** ⟨D⟩ without free loops by the modular engine, or undefined where the digit engine is the one to use. */
function bracketModuloMany(d: LinkDiagram, steps: readonly StepPlan[], forced: boolean, maxStateBytes = Infinity): Laurent | undefined {
  if (!forced && !moduliPay(d, steps)) return undefined;
  const bound = bracketNormBound(d);
  if (bound === undefined) return undefined;
  const budget = Math.min(MAX_RECORD_BYTES, maxStateBytes);
  const record = recordContraction(steps, 4, budget) ?? recordContraction(steps, 2, budget);
  if (record === undefined) throw new Error('internal: bracket contraction failed with exponent step 2');
  if (record === 'too-large') return undefined;
  return bracketByModuli(record, bound).bracket;
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
 * alternating closures), kept in two slabs allocated a quarter larger than
 * needed (20 bytes per digit), plus about 250 bytes of bookkeeping and 100 per
 * limb. Calibrated against peak resident size at widths 16–24; rechecked for the
 * flat layout: 8-strand alternating closures of 300 and 600 crossings grew the
 * resident size by about 60 and 180 MiB (estimates 44 and 176 MiB), T(12,13)
 * by about 230 MiB (estimate 788 MiB).
 */
export function estimateStateBytes(steps: readonly { readonly newWidth: number }[]): number {
  let peak = 0;
  steps.forEach((step, k) => {
    const absorbed = k + 1;
    const states = Math.min(2 ** absorbed, catalan(step.newWidth / 2));
    const limbs = 1 + Math.floor(absorbed / 48);
    peak = Math.max(peak, states * (250 + limbs * (100 + 20 * (absorbed + 1))));
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
 * The states of one step in flat typed arrays, no object per state (so the
 * garbage collector has nothing to trace). State s's polynomial has `len[s]`
 * coefficients, coefficient i holding the exponent lo[s] + i·step, stored as
 * `limbs[s]` base-2^32 digits: digit j of coefficient i is
 * digits[start(slab) + offset[s] + j·len[s] + i] of the DigitSlabs. `bound[s]`
 * bounds |digit| over all its digits. With w open ends, state s's matching is
 * partners[s·w … s·w + w − 1]. Two of these take turns (sources and targets of
 * a step), so their arrays are allocated only when a step needs more room than
 * any before it.
 */
export class States {
  constructor(public slab: SlabIndex) {}

  count = 0;
  lo = new Int32Array(1);
  len = new Int32Array(1);
  limbs = new Int32Array(1);
  offset = new Int32Array(1);
  bound = new Float64Array(1);
  /** Boundary positions are below MAX_BOUNDARY_WIDTH + 4, so a byte holds one. */
  partners = new Uint8Array(0);

  /** Room for up to `count` states of `width` ends (contents are not kept). */
  reserve(count: number, width: number): void {
    if (this.lo.length < count) {
      const room = Math.ceil(count * 1.25);
      this.lo = new Int32Array(room);
      this.len = new Int32Array(room);
      this.limbs = new Int32Array(room);
      this.offset = new Int32Array(room);
      this.bound = new Float64Array(room);
    }
    if (this.partners.length < count * width) this.partners = new Uint8Array(Math.ceil(count * width * 1.25));
  }
}

/** Per-contribution scratch of one step (contribution 2s + smoothing comes from state s), reused across steps. */
export class Contributions {
  target = new Int32Array(0);
  loops = new Int32Array(0);
  /** Per target: the highest exponent any contribution reaches. */
  hi = new Int32Array(0);

  reserve(sources: number): void {
    const count = 2 * sources;
    if (this.target.length >= count) return;
    const room = Math.ceil(count * 1.25);
    this.target = new Int32Array(room);
    this.loops = new Int32Array(room);
    this.hi = new Int32Array(room);
  }
}

/**
 * When set, every step checks each target digit against its bound (and that it
 * is an integer below 2^53), throwing if one is not: a pass over all digits, so
 * only the tests turn it on.
 */
export const digitBoundCheck = { enabled: false };

const LIMB_BASE = 2 ** 32;
/** Limbs may grow to this before a carry; leaves room for the carry itself below 2^53. */
const LIMB_CEILING = 2 ** 52;

/**
 * How much multiplying by d^l can grow the largest |digit|: an entry of d^l·p
 * sums C(l, m)·|p_i| over m = 0 … l, so the factor is Σ C(l, m) = 2^l.
 */
function loopGrowth(l: number): number {
  return 2 ** l;
}

export function binomialRow(l: number): number[] {
  const row = [1];
  for (let i = 1; i <= l; i++) row.push((row[i - 1]! * (l - i + 1)) / i);
  return row;
}

/**
 * A number that tells perfect matchings of `width` ends apart, for any
 * matching (crossing or not, so any region shape and non-planar codes too):
 * scanning the ends upward, each end not yet paired with a lower one adds the
 * rank of its partner among the ends still unpaired, in radix (ends still
 * unpaired − 1). A mixed-radix number below (width − 1)!!, which is at most
 * 27!! < 2^48 for width ≤ 28, so it is exact in a double.
 */
export function matchingNumber(partner: Uint8Array, width: number): number {
  return matchingNumberThrough(partner, IDENTITY, IDENTITY, width);
}

const IDENTITY = Int32Array.from({ length: MAX_BOUNDARY_WIDTH + 4 }, (_, i) => i);

/**
 * The matching number of the matching in which end i is paired with
 * compact[scratch[layout[i]]]: a step reads its targets' matchings straight
 * from its scratch positions, writing them out only for new targets.
 */
function matchingNumberThrough(scratch: ArrayLike<number>, layout: Int32Array, compact: Int32Array, width: number): number {
  if (width > MAX_BOUNDARY_WIDTH) throw new RangeError(`matchingNumber: width ${width} is more than ${MAX_BOUNDARY_WIDTH}`);
  let unpaired = (1 << width) - 1;
  let left = width;
  let key = 0;
  for (let i = 0; i < width; i++) {
    if (((unpaired >>> i) & 1) === 0) continue;
    const p = compact[scratch[layout[i]!]!]!;
    // Ends still unpaired below p: i itself and the ones between.
    key = key * (left - 1) + bitCount(unpaired & ((1 << p) - 1)) - 1;
    unpaired &= ~((1 << i) | (1 << p));
    left -= 2;
  }
  return key;
}

function bitCount(x: number): number {
  x -= (x >>> 1) & 0x55555555;
  x = (x & 0x33333333) + ((x >>> 2) & 0x33333333);
  return Math.imul((x + (x >>> 4)) & 0x0f0f0f0f, 0x01010101) >>> 24;
}

/** Matching number → target index for one step: open addressing over the numbers plus one (0 marks an empty slot). */
export class TargetTable {
  private keys = new Float64Array(0);
  private values = new Int32Array(0);
  private mask = 0;

  /** Empties the table, sized for up to `expected` keys at load ≤ 1/2. */
  reset(expected: number): void {
    let capacity = 16;
    while (capacity < 2 * expected) capacity *= 2;
    if (capacity > this.keys.length) {
      this.keys = new Float64Array(capacity);
      this.values = new Int32Array(capacity);
    } else this.keys.fill(0, 0, capacity);
    this.mask = capacity - 1;
  }

  /** The index stored for matching number `key`; if there is none yet, stores `fresh` and returns it. */
  lookup(key: number, fresh: number): number {
    const keys = this.keys;
    const stored = key + 1;
    let i = slotOf(stored) & this.mask;
    for (;;) {
      const k = keys[i]!;
      if (k === stored) return this.values[i]!;
      if (k === 0) break;
      i = (i + 1) & this.mask;
    }
    keys[i] = stored;
    this.values[i] = fresh;
    return fresh;
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
function contract(slabs: DigitSlabs, steps: readonly StepPlan[], step: 2 | 4): Laurent | undefined {
  // The empty tangle: one (empty) matching with value 1.
  let states = new States(0);
  states.reserve(1, 0);
  states.count = 1;
  states.len[0] = 1;
  states.limbs[0] = 1;
  states.bound[0] = 1;
  if (!slabs.reserve(0, 1)) throw slabMemoryError(steps, 1);
  slabs.digits[slabs.start(0)] = 1;
  let next = new States(1);
  const work = new Contributions();
  const table = new TargetTable();
  const dStride = 4 / step; // index distance between the terms A^(2l−4j) of d^l

  for (let k = 0; k < steps.length; k++) {
    checkTimeBudget();
    const plan = steps[k]!;
    const isLast = k === steps.length - 1;
    // Phase 1: the target matching and loop count of every (state, smoothing), and each target's exponent range.
    if (!matchSmoothings(states, next, plan, isLast, step, work, table)) return undefined;

    // Carry every source if some target digit could pass the ceiling.
    if (!boundTargets(states, next, work)) {
      carry(slabs, states, next, steps);
      if (!boundTargets(states, next, work)) {
        throw new RangeError('diagram too wide for exact contraction: more than 2^20 matchings merge into one');
      }
    }

    // Phase 2: accumulate every contribution into its target.
    let slabSize = 0;
    for (let t = 0; t < next.count; t++) {
      next.offset[t] = slabSize;
      slabSize += next.len[t]! * next.limbs[t]!;
    }
    if (!slabs.reserve(next.slab, slabSize)) throw slabMemoryError(steps, slabSize);
    accumulate(slabs, states, next, slabSize, work, step, dStride);
    if (digitBoundCheck.enabled) checkDigitBounds(slabs, next);
    [states, next] = [next, states];
  }

  if (states.count !== 1 || steps[steps.length - 1]!.newWidth !== 0) throw new Error('internal: contraction ended with an open boundary');
  const length = states.len[0]!;
  const dense: bigint[] = new Array(length);
  const first = slabs.start(states.slab) + states.offset[0]!;
  for (let i = 0; i < length; i++) {
    let value = 0n;
    for (let j = states.limbs[0]! - 1; j >= 0; j--) value = (value << 32n) + BigInt(slabs.digits[first + j * length + i]!);
    dense[i] = value;
  }
  return Laurent.fromDense(dense, states.lo[0]!, step);
}

/**
 * Phase 1 of a step, the part that does not look at coefficients: the target
 * matching and loop count of every (state, smoothing), the targets' matchings,
 * and each target's exponent range and length. False if a target would mix
 * exponent classes mod `step` (a non-planar code; redo with step 2).
 */
export function matchSmoothings(states: States, next: States, plan: StepPlan, isLast: boolean, step: number, work: Contributions, table: TargetTable): boolean {
  const w = plan.oldWidth;
  const w2 = plan.newWidth;
  const { joins, layout, compact } = plan;
  const scratch = new Int32Array(w + 4);
  const { count, lo, len } = states;
  const partners = states.partners;
  next.reserve(2 * count, w2);
  work.reserve(count);
  table.reset(2 * count);
  let targets = 0;
  const tLo = next.lo;
  const tHi = work.hi;
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
      if (isLast) loops--; // ⟨O⟩ = 1: the final picture's first circle is free
      const t = table.lookup(matchingNumberThrough(scratch, layout, compact, w2), targets);
      const base = sourceLo + (smoothing === 0 ? 1 : -1) - 2 * loops;
      const top = sourceHi + (smoothing === 0 ? 1 : -1) + 2 * loops;
      if (t === targets) {
        targets++;
        for (let i = 0; i < w2; i++) next.partners[t * w2 + i] = compact[scratch[layout[i]!]!]!;
        tLo[t] = base;
        tHi[t] = top;
      } else {
        if ((base - tLo[t]!) % step !== 0) return false;
        if (base < tLo[t]!) tLo[t] = base;
        if (top > tHi[t]!) tHi[t] = top;
      }
      work.target[2 * s + smoothing] = t;
      work.loops[2 * s + smoothing] = loops;
    }
  }
  next.count = targets;
  for (let t = 0; t < targets; t++) next.len[t] = (tHi[t]! - tLo[t]!) / step + 1;
  return true;
}

/**
 * Sets each target's digit count and digit bound from its contributions; false
 * when some bound reaches the ceiling (the sources must be carried first).
 */
function boundTargets(sources: States, targets: States, work: Contributions): boolean {
  targets.bound.fill(0, 0, targets.count);
  targets.limbs.fill(0, 0, targets.count);
  for (let c = 0; c < 2 * sources.count; c++) {
    const s = c >> 1;
    const t = work.target[c]!;
    targets.bound[t]! += sources.bound[s]! * loopGrowth(work.loops[c]!);
    if (sources.limbs[s]! > targets.limbs[t]!) targets.limbs[t] = sources.limbs[s]!;
  }
  for (let t = 0; t < targets.count; t++) if (targets.bound[t]! >= LIMB_CEILING) return false;
  return true;
}

/**
 * Writes every target polynomial: the target slab is zeroed, then each source
 * adds A^(±1)·d^loops times itself into its two targets. Going source by source
 * reads each source once (grouping by target instead read every source twice
 * and was slower on long polynomials).
 */
function accumulate(slabs: DigitSlabs, sources: States, targets: States, slabSize: number, work: Contributions, step: number, dStride: number): void {
  const { kernels } = slabs;
  const sourceStart = slabs.start(sources.slab);
  const targetStart = slabs.start(targets.slab);
  slabs.digits.fill(0, targetStart, targetStart + slabSize);
  for (let s = 0; s < sources.count; s++) {
    const tA = work.target[2 * s]!;
    const tB = work.target[2 * s + 1]!;
    const loopsA = work.loops[2 * s]!;
    const loopsB = work.loops[2 * s + 1]!;
    const n = sources.len[s]!;
    const startA = targetStart + targets.offset[tA]! + (sources.lo[s]! + 1 - 2 * loopsA - targets.lo[tA]!) / step;
    const startB = targetStart + targets.offset[tB]! + (sources.lo[s]! - 1 - 2 * loopsB - targets.lo[tB]!) / step;
    const strideA = targets.len[tA]!;
    const strideB = targets.len[tB]!;
    for (let j = 0, from = sourceStart + sources.offset[s]!; j < sources.limbs[s]!; j++, from += n) {
      addSmoothing(kernels, from, n, startA + j * strideA, loopsA, dStride);
      addSmoothing(kernels, from, n, startB + j * strideB, loopsB, dStride);
    }
  }
}

function checkDigitBounds(slabs: DigitSlabs, states: States): void {
  const start = slabs.start(states.slab);
  for (let t = 0; t < states.count; t++) {
    const end = start + states.offset[t]! + states.len[t]! * states.limbs[t]!;
    for (let at = start + states.offset[t]!; at < end; at++) {
      const x = slabs.digits[at]!;
      if (!Number.isSafeInteger(x) || Math.abs(x) > states.bound[t]!) {
        throw new Error(`internal: digit ${x} of tangle state ${t} is outside its bound ${states.bound[t]}`);
      }
    }
  }
}

/**
 * digits[at …] += d^loops · digits[from … from + n − 1], the terms of d^l being
 * `stride` apart. Each call of a kernel is one pass over the target row, so no
 * row is read while a store to an overlapping address is still in flight (a
 * pass per term of d at stride 1 made the loads straddle the stores just made,
 * and ran at a third of the speed). The two smoothings of one source are added
 * one after the other: the source row is then still in the first-level cache.
 */
function addSmoothing(kernels: DigitKernels, from: number, n: number, at: number, loops: number, stride: number): void {
  if (loops === 0) kernels.addRow(from, n, at);
  else if (loops === 1) {
    // d·p = −p·A² − p·A⁻²: target entry i receives −source[i] − source[i − stride].
    const head = Math.min(stride, n);
    kernels.subtractRow(from, head, at);
    if (n > stride) kernels.subtractRowPair(from + stride, from, n - stride, at + stride);
    const tail = Math.max(n, stride);
    kernels.subtractRow(from + tail - stride, n + stride - tail, at + tail);
  } else addTimesLoopPower(kernels, from, n, at, loops, stride);
}

/**
 * digits[at + i + m·stride] += (−1)^l C(l, m) · digits[from + i] for i < n, m = 0 … l:
 * multiplication by d^l. The products are exact: the target's bound allows for
 * the factor 2^l ≥ C(l, m).
 */
function addTimesLoopPower(kernels: DigitKernels, from: number, n: number, at: number, loops: number, stride: number): void {
  const row = binomialRow(loops);
  const sign = loops % 2 === 0 ? 1 : -1;
  for (let m = 0; m <= loops; m++) kernels.addMultiple(from, n, at + m * stride, sign * row[m]!);
}

/**
 * Carries every state's base-2^32 digits upward so that afterwards each
 * |digit| < 2^32 (the bounds then say so), giving one more digit to the states
 * whose top digit overflows. Digits are below 2^53 beforehand, so the carry out
 * of the top is below 2^21 and one added digit always suffices. A new layout
 * is written into the targets' slab (free until phase 2), which then becomes
 * the states' slab, so no third slab is ever held.
 */
function carry(slabs: DigitSlabs, states: States, targets: States, steps: readonly StepPlan[]): void {
  const { count, len, limbs, offset } = states;
  const overflows = new Uint8Array(count);
  let anyOverflow = false;
  const start = slabs.start(states.slab);
  for (let s = 0; s < count; s++) {
    overflows[s] = slabs.kernels.carryRows(start + offset[s]!, len[s]!, limbs[s]!);
    anyOverflow ||= overflows[s] === 1;
  }
  states.bound.fill(LIMB_BASE, 0, count);
  if (!anyOverflow) return;
  // Some states need one more digit: lay the digits out again, with a zero row on top of those, and carry into it.
  const newOffset = new Int32Array(count);
  let size = 0;
  for (let s = 0; s < count; s++) {
    newOffset[s] = size;
    size += len[s]! * (limbs[s]! + overflows[s]!);
  }
  if (!slabs.reserve(targets.slab, size)) throw slabMemoryError(steps, size);
  const from = slabs.start(states.slab);
  const to = slabs.start(targets.slab);
  for (let s = 0; s < count; s++) {
    const digits = limbs[s]! * len[s]!;
    slabs.digits.copyWithin(to + newOffset[s]!, from + offset[s]!, from + offset[s]! + digits);
    if (overflows[s]) {
      slabs.digits.fill(0, to + newOffset[s]! + digits, to + newOffset[s]! + digits + len[s]!);
      limbs[s]!++;
      slabs.kernels.carryRows(to + newOffset[s]!, len[s]!, limbs[s]!);
    }
    offset[s] = newOffset[s]!;
  }
  [states.slab, targets.slab] = [targets.slab, states.slab];
}

/** Two slabs of `digits` doubles do not fit into the WebAssembly memory (at most 4 GiB). */
function slabMemoryError(steps: readonly StepPlan[], digits: number): LimitError {
  return stateMemoryError(steps.length, widestBoundary(steps), 2 * 8 * digits, DIGIT_MEMORY_MAX_BYTES, false);
}

export function widestBoundary(steps: readonly StepPlan[]): number {
  return steps.reduce((m, s) => Math.max(m, s.newWidth), 0);
}

