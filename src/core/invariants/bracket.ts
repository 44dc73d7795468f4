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
 * One matching's polynomial: coefficient index i holds the exponent lo + i·step,
 * its value is Σ_j limbs[j][i] · 2^(32j).
 */
interface StatePoly {
  lo: number;
  limbs: Float64Array[];
  /** An upper bound on |limbs[j][i]| over all j, i. */
  bound: number;
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
 * code) fall back to a string of the partner positions; numbers and strings
 * never collide as Map keys.
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

const A_SLOT_PARTNER = [1, 0, 3, 2];
const B_SLOT_PARTNER = [3, 2, 1, 0];

/** Runs the contraction with exponents stored at the given step; undefined if a state mixes classes mod `step`. */
function contract(steps: readonly StepPlan[], step: 2 | 4): Laurent | undefined {
  // The empty tangle: one (empty) matching with value 1.
  let keys: MatchingKey[] = [EMPTY_MATCHING];
  let partners = new Uint16Array(0);
  let polys: StatePoly[] = [{ lo: 0, limbs: [Float64Array.of(1)], bound: 1 }];
  // Two slabs take turns: the sources of one step live in one, its targets in the other.
  let sourceSlab = new Float64Array(0);
  let spareSlab = new Float64Array(0);
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
    const stateCount = keys.length;

    // Phase 1: the target matching and loop count of every (state, smoothing).
    const targetIndex = new Map<MatchingKey, number>();
    const nextKeys: MatchingKey[] = [];
    let nextPartners = new Uint16Array(Math.max(16, 4 * w2));
    const contributionTarget = new Int32Array(2 * stateCount);
    const contributionLoops = new Int32Array(2 * stateCount);
    const tLo: number[] = [];
    const tHi: number[] = [];
    const tBound: number[] = [];
    const tLimbs: number[] = [];
    for (let s = 0; s < stateCount; s++) {
      const source = polys[s]!;
      const sourceHi = source.lo + step * (source.limbs[0]!.length - 1);
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
        let t = targetIndex.get(key);
        const base = source.lo + (smoothing === 0 ? 1 : -1) - 2 * loops;
        const top = sourceHi + (smoothing === 0 ? 1 : -1) + 2 * loops;
        if (t === undefined) {
          t = nextKeys.length;
          targetIndex.set(key, t);
          nextKeys.push(key);
          if (nextPartners.length < (t + 1) * w2) {
            const grown = new Uint16Array(2 * nextPartners.length + w2);
            grown.set(nextPartners);
            nextPartners = grown;
          }
          nextPartners.set(codes, t * w2);
          tLo.push(base);
          tHi.push(top);
          tBound.push(0);
          tLimbs.push(0);
        } else {
          if ((base - tLo[t]!) % step !== 0) return undefined;
          if (base < tLo[t]!) tLo[t] = base;
          if (top > tHi[t]!) tHi[t] = top;
        }
        tBound[t]! += source.bound * centralBinomial(loops);
        if (source.limbs.length > tLimbs[t]!) tLimbs[t] = source.limbs.length;
        contributionTarget[2 * s + smoothing] = t;
        contributionLoops[2 * s + smoothing] = loops;
      }
    }

    // Carry every source if some target limb could pass the ceiling.
    if (tBound.some((b) => b >= LIMB_CEILING)) {
      for (const poly of polys) carryLimbs(poly);
      tBound.fill(0);
      tLimbs.fill(0);
      for (let s = 0; s < stateCount; s++) {
        for (let smoothing = 0; smoothing < 2; smoothing++) {
          const t = contributionTarget[2 * s + smoothing]!;
          tBound[t]! += polys[s]!.bound * centralBinomial(contributionLoops[2 * s + smoothing]!);
          if (polys[s]!.limbs.length > tLimbs[t]!) tLimbs[t] = polys[s]!.limbs.length;
        }
      }
      if (tBound.some((b) => b >= LIMB_CEILING)) {
        throw new RangeError('diagram too wide for exact contraction: more than 2^20 matchings merge into one');
      }
    }

    // Phase 2: accumulate every contribution into its target.
    // One zeroed slab for all targets, reused across steps: far cheaper than fresh arrays.
    let slabSize = 0;
    for (let t = 0; t < nextKeys.length; t++) slabSize += ((tHi[t]! - tLo[t]!) / step + 1) * tLimbs[t]!;
    if (spareSlab.length < slabSize) spareSlab = new Float64Array(Math.ceil(slabSize * 1.25));
    else spareSlab.fill(0, 0, slabSize);
    const slab = spareSlab;
    const nextPolys: StatePoly[] = new Array(nextKeys.length);
    for (let t = 0, at = 0; t < nextKeys.length; t++) {
      const length = (tHi[t]! - tLo[t]!) / step + 1;
      const limbs: Float64Array[] = new Array(tLimbs[t]!);
      for (let j = 0; j < limbs.length; j++, at += length) limbs[j] = slab.subarray(at, at + length);
      nextPolys[t] = { lo: tLo[t]!, limbs, bound: tBound[t]! };
    }
    for (let s = 0; s < stateCount; s++) {
      const source = polys[s]!;
      const targetA = nextPolys[contributionTarget[2 * s]!]!;
      const targetB = nextPolys[contributionTarget[2 * s + 1]!]!;
      const loopsA = contributionLoops[2 * s]!;
      const loopsB = contributionLoops[2 * s + 1]!;
      const offsetA = (source.lo + 1 - 2 * loopsA - targetA.lo) / step;
      const offsetB = (source.lo - 1 - 2 * loopsB - targetB.lo) / step;
      for (let j = 0; j < source.limbs.length; j++) {
        if (loopsA <= 1 && loopsB <= 1) {
          addBothSmoothings(source.limbs[j]!, targetA.limbs[j]!, offsetA, loopsA, targetB.limbs[j]!, offsetB, loopsB, dStride);
        } else {
          addTimesLoopPower(targetA.limbs[j]!, source.limbs[j]!, offsetA, loopsA, dStride);
          addTimesLoopPower(targetB.limbs[j]!, source.limbs[j]!, offsetB, loopsB, dStride);
        }
      }
    }
    keys = nextKeys;
    partners = nextPartners;
    polys = nextPolys;
    spareSlab = sourceSlab;
    sourceSlab = slab;
  }

  if (keys.length !== 1 || keys[0] !== EMPTY_MATCHING) throw new Error('internal: contraction ended with an open boundary');
  const final = polys[0]!;
  const length = final.limbs[0]!.length;
  const dense: bigint[] = new Array(length);
  for (let i = 0; i < length; i++) {
    let value = 0n;
    for (let j = final.limbs.length - 1; j >= 0; j--) value = (value << 32n) + BigInt(final.limbs[j]![i]!);
    dense[i] = value;
  }
  return Laurent.fromDense(dense, final.lo, step);
}

/** target[offset + i + m·stride] += (−1)^l C(l, m) · source[i] for m = 0 … l: multiplication by d^l. */
function addTimesLoopPower(target: Float64Array, source: Float64Array, offset: number, loops: number, stride: number): void {
  const n = source.length;
  if (loops === 0) {
    for (let i = 0; i < n; i++) target[offset + i]! += source[i]!;
  } else if (loops === 1) {
    const o2 = offset + stride;
    for (let i = 0; i < n; i++) {
      const v = source[i]!;
      target[offset + i]! -= v;
      target[o2 + i]! -= v;
    }
  } else {
    const row = binomialRow(loops);
    const sign = loops % 2 === 0 ? 1 : -1;
    for (let m = 0; m <= loops; m++) {
      const factor = sign * row[m]!;
      const o = offset + m * stride;
      for (let i = 0; i < n; i++) target[o + i]! += factor * source[i]!;
    }
  }
}

/**
 * Both smoothings of one source in a single pass (the common case: at most one
 * loop closes on each side), reading the source once instead of twice.
 * `targetA` and `targetB` may be the same array.
 */
function addBothSmoothings(
  source: Float64Array,
  targetA: Float64Array,
  offsetA: number,
  loopsA: number,
  targetB: Float64Array,
  offsetB: number,
  loopsB: number,
  stride: number,
): void {
  const n = source.length;
  const a2 = offsetA + stride;
  const b2 = offsetB + stride;
  if (loopsA === 0 && loopsB === 0) {
    for (let i = 0; i < n; i++) {
      const v = source[i]!;
      targetA[offsetA + i]! += v;
      targetB[offsetB + i]! += v;
    }
  } else if (loopsA === 1 && loopsB === 0) {
    for (let i = 0; i < n; i++) {
      const v = source[i]!;
      targetA[offsetA + i]! -= v;
      targetA[a2 + i]! -= v;
      targetB[offsetB + i]! += v;
    }
  } else if (loopsA === 0) {
    for (let i = 0; i < n; i++) {
      const v = source[i]!;
      targetA[offsetA + i]! += v;
      targetB[offsetB + i]! -= v;
      targetB[b2 + i]! -= v;
    }
  } else {
    for (let i = 0; i < n; i++) {
      const v = source[i]!;
      targetA[offsetA + i]! -= v;
      targetA[a2 + i]! -= v;
      targetB[offsetB + i]! -= v;
      targetB[b2 + i]! -= v;
    }
  }
}

/** Carries base-2^32 digits upward, adding limbs while the top one overflows; afterwards every |limb| < 2^32. */
function carryLimbs(poly: StatePoly): void {
  const limbs = poly.limbs;
  const length = limbs[0]!.length;
  for (let i = 0; i < length; i++) {
    let carry = 0;
    for (let j = 0; j < limbs.length - 1; j++) {
      const x = limbs[j]![i]! + carry;
      carry = Math.floor(x / LIMB_BASE);
      limbs[j]![i] = x - carry * LIMB_BASE;
    }
    limbs[limbs.length - 1]![i]! += carry;
  }
  for (;;) {
    const top = limbs[limbs.length - 1]!;
    let overflow = false;
    for (let i = 0; i < length; i++) if (Math.abs(top[i]!) >= LIMB_BASE) overflow = true;
    if (!overflow) break;
    const above = new Float64Array(length);
    for (let i = 0; i < length; i++) {
      const q = Math.floor(top[i]! / LIMB_BASE);
      top[i] = top[i]! - q * LIMB_BASE;
      above[i] = q;
    }
    limbs.push(above);
  }
  poly.bound = LIMB_BASE;
}
