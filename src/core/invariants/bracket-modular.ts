/**
 * The Kauffman bracket modulo several word-sized numbers, lifted by the
 * Chinese remainder theorem: the tangle contraction of bracket.ts with one
 * 32-bit residue per coefficient instead of all of its digits.
 *
 * Why: on long diagrams (hundreds of crossings) the coefficients reach
 * hundreds of digits, the digit engine's states hold all of them at once
 * (hundreds of MB), and its passes wait on memory. Here the shape of the
 * contraction (which state feeds which target, shifted where, through how
 * many closed loops) is worked out once and recorded; the arithmetic is then
 * replayed once per modulus on states of one residue per coefficient, which
 * stay small enough to keep close to the processor.
 *
 * Exactness: residues modulo odd, pairwise coprime m < 2^31 are kept reduced
 * in [0, m) as 32-bit integers (wasm/residue-kernels.ts), so no step can
 * overflow. The moduli's product exceeds twice the bound of
 * bracket-norm-bound.ts on every coefficient, so the lift with symmetric
 * residues is the coefficient itself. As a guard against any slip, the lifted
 * bracket is compared with one more pass modulo a further modulus; a mismatch
 * is an internal error, never a value.
 */
import { checkTimeBudget, stateMemoryError } from '../limits.ts';
import { Laurent } from '../poly/laurent.ts';
import { liftOneModulus, symmetricResidues } from './chinese-remainder.ts';
import { lentReplayHelper } from '../helper-threads.ts';
import { binomialRow, Contributions, matchSmoothings, States, TargetTable, widestBoundary, type StepPlan } from './bracket.ts';
import type { ResidueKernels } from './wasm/residue-kernels.ts';
import type { SlabIndex } from './wasm/digit-slabs.ts';
import { RESIDUE_MEMORY_MAX_BYTES, ResidueSlabs } from './wasm/residue-slabs.ts';

/** One step of a recorded contraction. The states of a slab lie one after another in state order. */
interface RecordedStep {
  /**
   * Four words per source state, as accumulateStep (wasm/residue-kernels.ts)
   * reads them: its number of coefficients; where in the target slab its A-
   * and its B-smoothing put their first coefficient; the loops each closes
   * (A | B << 4).
   */
  readonly program: Int32Array;
  /** The smoothings closing two or more loops, which the kernel leaves out: [from (in the source slab), n, start, loops] each. */
  readonly heavy: Int32Array;
  /** Coefficients in the target slab. */
  readonly targetSize: number;
}

export interface ContractionRecord {
  /** Exponents of a state step this far apart (4 for planar diagrams, 2 otherwise). */
  readonly step: 2 | 4;
  readonly steps: readonly RecordedStep[];
  /** Exponent of the final polynomial's first coefficient, and its number of coefficients. */
  readonly lo: number;
  readonly length: number;
  /** Bytes the recording holds. */
  readonly bytes: number;
  /** For limit messages: the diagram's crossings and the widest boundary. */
  readonly crossings: number;
  readonly width: number;
}

/**
 * Records the contraction `steps` with exponents `step` apart; undefined if a
 * state mixes exponent classes (retry with 2), 'too-large' once the recording
 * would pass `maxBytes`.
 */
export function recordContraction(steps: readonly StepPlan[], step: 2 | 4, maxBytes: number): ContractionRecord | undefined | 'too-large' {
  let states = new States(0);
  states.reserve(1, 0);
  states.count = 1;
  states.len[0] = 1;
  let next = new States(1);
  const work = new Contributions();
  const table = new TargetTable();
  const recorded: RecordedStep[] = [];
  let bytes = 0;
  for (let k = 0; k < steps.length; k++) {
    checkTimeBudget();
    if (!matchSmoothings(states, next, steps[k]!, k === steps.length - 1, step, work, table)) return undefined;
    const count = states.count;
    bytes += 16 * count;
    if (bytes > maxBytes) return 'too-large';
    const offset = new Int32Array(next.count);
    let size = 0;
    for (let t = 0; t < next.count; t++) {
      offset[t] = size;
      size += next.len[t]!;
    }
    const program = new Int32Array(4 * count);
    const heavy: number[] = [];
    let from = 0;
    for (let s = 0; s < count; s++) {
      const n = states.len[s]!;
      program[4 * s] = n;
      for (let smoothing = 0; smoothing < 2; smoothing++) {
        const c = 2 * s + smoothing;
        const t = work.target[c]!;
        const loops = work.loops[c]!;
        const start = offset[t]! + (states.lo[s]! + (smoothing === 0 ? 1 : -1) - 2 * loops - next.lo[t]!) / step;
        program[4 * s + 1 + smoothing] = start;
        program[4 * s + 3]! |= loops << (4 * smoothing);
        if (loops >= 2) heavy.push(from, n, start, loops);
      }
      from += n;
    }
    recorded.push({ program, heavy: Int32Array.from(heavy), targetSize: size });
    [states, next] = [next, states];
  }
  if (states.count !== 1) throw new Error('internal: contraction ended with an open boundary');
  return { step, steps: recorded, lo: states.lo[0]!, length: states.len[0]!, bytes, crossings: steps.length, width: widestBoundary(steps) };
}

/** The bracket's coefficients modulo `m` (odd, below 2^31), each in [0, m); `onStep` is called after every step. */
export function replayModulo(record: ContractionRecord, m: number, slabs: ResidueSlabs, onStep?: () => void): Int32Array {
  const { kernels } = slabs;
  const dStride = 4 / record.step;
  let source: SlabIndex = 0;
  slabs.reserve(0, 1);
  slabs.words[slabs.start(0)] = 1;
  for (const { program, heavy, targetSize } of record.steps) {
    checkTimeBudget();
    const target: SlabIndex = source === 0 ? 1 : 0;
    if (!slabs.reserve(target, targetSize)) {
      throw stateMemoryError(record.crossings, record.width, 8 * targetSize, RESIDUE_MEMORY_MAX_BYTES, false);
    }
    const base = slabs.start(target);
    const from = slabs.start(source);
    slabs.words.set(program, 0);
    kernels.accumulateStep(program.length >> 2, from, base, targetSize, dStride, m);
    for (let h = 0; h < heavy.length; h += 4) addLoopPower(kernels, m, from + heavy[h]!, heavy[h + 1]!, base + heavy[h + 2]!, heavy[h + 3]!, dStride);
    source = target;
    onStep?.();
  }
  const first = slabs.start(source);
  return slabs.words.slice(first, first + record.length);
}

/**
 * row[at + i + j·stride] += (−1)^l C(l, j) · row[from + i] modulo m: adding d^l
 * times a row, d^l = (−1)^l Σ C(l, j) A^(2l − 4j). At most four loops close at
 * once, so C(l, j) ≤ 6 passes each.
 */
function addLoopPower(kernels: ResidueKernels, m: number, from: number, n: number, at: number, loops: number, stride: number): void {
  const row = binomialRow(loops);
  for (let j = 0; j <= loops; j++) {
    for (let times = 0; times < row[j]!; times++) {
      if (loops % 2 === 0) kernels.addRow(from, n, at + j * stride, m);
      else kernels.subtractRow(from, n, at + j * stride, m);
    }
  }
}

const moduliFound: number[] = [];

/** The k-th modulus: odd numbers below 2^31 counting down, each kept when coprime to all kept before it. */
export function modulus(k: number): number {
  let candidate = moduliFound.length === 0 ? 2 ** 31 + 1 : moduliFound[moduliFound.length - 1]!;
  while (moduliFound.length <= k) {
    candidate -= 2;
    if (moduliFound.every((m) => gcd(m, candidate) === 1)) moduliFound.push(candidate);
  }
  return moduliFound[k]!;
}

function gcd(a: number, b: number): number {
  while (b !== 0) [a, b] = [b, a % b];
  return a;
}

/** The bracket of the recorded contraction, given a bound on the absolute values of its coefficients. */
export function bracketByModuli(record: ContractionRecord, coefficientBound: bigint): { bracket: Laurent; moduli: number } {
  // Enough moduli for a product above twice the bound, then one more for the check.
  const moduli: number[] = [];
  let product = 1n;
  while (product <= 2n * coefficientBound) {
    moduli.push(modulus(moduli.length));
    product *= BigInt(moduli[moduli.length - 1]!);
  }
  const check = modulus(moduli.length);
  const residues = residuesModulo(record, [...moduli, check]);
  let lifted = new Array<bigint>(record.length).fill(0n);
  let liftedModulus = 1n;
  moduli.forEach((m, k) => {
    lifted = liftOneModulus(lifted, liftedModulus, residues[k]!, m);
    liftedModulus *= BigInt(m);
  });
  const coefficients = symmetricResidues(lifted, product);
  const checkBig = BigInt(check);
  const checkResidues = residues[moduli.length]!;
  coefficients.forEach((c, i) => {
    let r = c % checkBig;
    if (r < 0n) r += checkBig;
    if (Number(r) !== checkResidues[i]) throw new Error('internal: the bracket lifted from its residues failed the check modulo a further number');
  });
  return { bracket: Laurent.fromDense(coefficients, record.lo, record.step), moduli: moduli.length + 1 };
}

/** Memory for replaying `record`: room for its longest step program, slabs grown on demand. */
export function slabsFor(record: ContractionRecord): ResidueSlabs {
  return new ResidueSlabs(record.steps.reduce((most, step) => Math.max(most, step.program.length), 0));
}

/** The residues modulo each of `moduli`, a lent helper replaying some of them meanwhile. */
function residuesModulo(record: ContractionRecord, moduli: readonly number[]): Int32Array[] {
  const slabs = slabsFor(record);
  const results: Int32Array[] = new Array(moduli.length);
  const lent = lentReplayHelper();
  const helper = lent && moduli.length >= 2 ? lent.begin(record, moduli) : undefined;
  if (!helper) return moduli.map((m) => replayModulo(record, m, slabs));
  let waited = false;
  try {
    for (let k = helper.claim(); k !== undefined; k = helper.claim()) results[k] = replayModulo(record, moduli[k]!, slabs);
    const fromHelper = helper.wait();
    waited = true;
    moduli.forEach((m, k) => (results[k] ??= fromHelper?.[k] ?? replayModulo(record, m, slabs)));
  } finally {
    if (!waited) helper.abandon();
  }
  return results;
}
