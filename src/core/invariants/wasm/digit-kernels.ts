/**
 * The bracket engine's digit loops as WebAssembly with 128-bit SIMD: each
 * kernel is one pass over a target row of digits, adding or subtracting source
 * digits two doubles at a time (f64x2), then one more when the length is odd.
 * f64x2.add is the same IEEE addition as the scalar one, so the exactness
 * argument of the digits (integers kept below 2^53, see bracket.ts) holds
 * unchanged.
 *
 * Each kernel is written once against a `Lane` (how many digits one iteration
 * handles and the instructions for them) and emitted twice: a loop over pairs,
 * then a loop for the odd one left. Rows are given as element indexes into the
 * memory's doubles (as a Float64Array over it would index them) and turned
 * into byte addresses on entry. A call's source rows must not overlap its
 * target row (in the engine they lie in the other slab); the target rows of
 * successive calls may overlap freely.
 */
import {
  DIGIT_ALIGNED,
  F64,
  f64Const,
  get,
  I32,
  i32Const,
  increase,
  moduleBytes,
  op,
  simd,
  set,
  simdOp,
  V128,
  whileAtLeast,
  type FunctionSpec,
  type ValueType,
} from './encoding.ts';

/** How one iteration of a kernel's loop touches the digits. */
interface Lane {
  /** Digits per iteration. */
  readonly digits: number;
  readonly type: ValueType;
  readonly load: readonly number[];
  readonly store: readonly number[];
  readonly add: readonly number[];
  readonly subtract: readonly number[];
  readonly multiply: readonly number[];
  readonly floor: readonly number[];
  readonly abs: readonly number[];
  /** Turns a double on the stack into this lane's type. */
  readonly fromDouble: readonly number[];
  /** Pops a, b; pushes the i32 1 if a ≥ b in some lane, else 0. */
  readonly atLeastSomewhere: readonly number[];
}

const PAIRS: Lane = {
  digits: 2,
  type: V128,
  load: [...simdOp(simd.v128Load), ...DIGIT_ALIGNED],
  store: [...simdOp(simd.v128Store), ...DIGIT_ALIGNED],
  add: simdOp(simd.f64x2Add),
  subtract: simdOp(simd.f64x2Sub),
  multiply: simdOp(simd.f64x2Mul),
  floor: simdOp(simd.f64x2Floor),
  abs: simdOp(simd.f64x2Abs),
  fromDouble: simdOp(simd.f64x2Splat),
  atLeastSomewhere: [...simdOp(simd.f64x2Ge), ...simdOp(simd.v128AnyTrue)],
};

const SINGLES: Lane = {
  digits: 1,
  type: F64,
  load: [op.f64Load, ...DIGIT_ALIGNED],
  store: [op.f64Store, ...DIGIT_ALIGNED],
  add: [op.f64Add],
  subtract: [op.f64Sub],
  multiply: [op.f64Mul],
  floor: [op.f64Floor],
  abs: [op.f64Abs],
  fromDouble: [],
  atLeastSomewhere: [op.f64Ge],
};

const constant = (lane: Lane, value: number): number[] => [...f64Const(value), ...lane.fromDouble];

/** Turns an element index held in `local` into a byte address. */
function toByteAddress(local: number): number[] {
  return [...get(local), ...i32Const(3), op.i32Shl, ...set(local)];
}

/** Numbers the parameters 0 … k−1 and hands out further locals by type. */
class Frame {
  readonly locals: ValueType[] = [];
  constructor(private readonly paramCount: number) {}
  local(type: ValueType): number {
    this.locals.push(type);
    return this.paramCount + this.locals.length - 1;
  }
}

type Sign = 'add' | 'subtract';

/**
 * row[i] ±= source[i] (+ other[i]) (· factor) for i < n. Parameters: the source
 * rows, n, the target row (all element indexes), then the factor if `scaled`.
 */
function rowKernel(name: string, sign: Sign, sources: 1 | 2, scaled = false): FunctionSpec {
  const inputs = sources === 1 ? [0] : [0, 1];
  const n = sources;
  const row = sources + 1;
  const factor = sources + 2;
  const params: ValueType[] = [...inputs.map((): ValueType => I32), I32, I32, ...(scaled ? [F64 as ValueType] : [])];
  const frame = new Frame(params.length);
  const iteration = (lane: Lane): number[] => {
    const bytes = 8 * lane.digits;
    return [
      ...get(row), ...get(row), ...lane.load,
      ...get(inputs[0]!), ...lane.load,
      ...(sources === 2 ? [...get(inputs[1]!), ...lane.load, ...lane.add] : []),
      ...(scaled ? [...get(factor), ...lane.fromDouble, ...lane.multiply] : []),
      ...lane[sign], ...lane.store,
      ...inputs.flatMap((input) => increase(input, bytes)),
      ...increase(row, bytes),
    ]; // prettier-ignore
  };
  const body = [
    ...[...inputs, row].flatMap(toByteAddress),
    ...whileAtLeast(n, PAIRS.digits, iteration(PAIRS)),
    ...whileAtLeast(n, SINGLES.digits, iteration(SINGLES)),
  ];
  return { name, params, results: [], locals: frame.locals, body };
}

const LIMB_BASE = 2 ** 32;

/**
 * The carry of bracket.ts for one state: its `limbs` rows of `n` digits start at
 * element `at`; each coefficient's digits are carried upward (digit −
 * floor(digit / 2^32)·2^32 stays, the quotient moves one row up) and the top row
 * keeps what reaches it. Returns 1 if some top digit has |digit| ≥ 2^32 (the
 * state needs one more row), else 0. Dividing by 2^32 is multiplying by 2^−32,
 * exact for doubles.
 */
function carryRows(): FunctionSpec {
  const [at, n, limbs] = [0, 1, 2];
  const frame = new Frame(3);
  const rowBytes = frame.local(I32);
  const row = frame.local(I32);
  const below = frame.local(I32);
  const overflow = frame.local(I32);
  const iteration = (lane: Lane): number[] => {
    const digit = frame.local(lane.type);
    const carried = frame.local(lane.type);
    const climb = [
      ...get(row), ...lane.load, ...get(carried), ...lane.add, ...set(digit),
      ...get(digit), ...constant(lane, 1 / LIMB_BASE), ...lane.multiply, ...lane.floor, ...set(carried),
      ...get(row), ...get(digit), ...get(carried), ...constant(lane, LIMB_BASE), ...lane.multiply, ...lane.subtract, ...lane.store,
      ...increase(row, get(rowBytes)),
    ]; // prettier-ignore
    return [
      ...get(at), ...set(row),
      ...constant(lane, 0), ...set(carried),
      ...get(limbs), ...i32Const(1), op.i32Sub, ...set(below),
      ...whileAtLeast(below, 1, climb),
      ...get(row), ...get(row), ...lane.load, ...get(carried), ...lane.add, op.localTee, digit, ...lane.store,
      ...get(overflow), ...get(digit), ...lane.abs, ...constant(lane, LIMB_BASE), ...lane.atLeastSomewhere, op.i32Or, ...set(overflow),
      ...increase(at, 8 * lane.digits),
    ]; // prettier-ignore
  };
  const body = [
    ...toByteAddress(at),
    ...get(n), ...i32Const(3), op.i32Shl, ...set(rowBytes),
    ...whileAtLeast(n, PAIRS.digits, iteration(PAIRS)),
    ...whileAtLeast(n, SINGLES.digits, iteration(SINGLES)),
    ...get(overflow),
  ]; // prettier-ignore
  return { name: 'carryRows', params: [I32, I32, I32], results: [I32], locals: frame.locals, body };
}

/** The kernels; every row argument is an element index into the memory's doubles. */
export interface DigitKernels {
  /** row[i] += source[i] for i < n. */
  addRow(source: number, n: number, row: number): void;
  /** row[i] −= source[i]. */
  subtractRow(source: number, n: number, row: number): void;
  /** row[i] −= source[i] + other[i]. */
  subtractRowPair(source: number, other: number, n: number, row: number): void;
  /** row[i] += factor·source[i]. */
  addMultiple(source: number, n: number, row: number, factor: number): void;
  /** See carryRows above: 1 if the state's top row overflowed. */
  carryRows(at: number, n: number, limbs: number): number;
}

const KERNEL_SOURCES: readonly FunctionSpec[] = [
  rowKernel('addRow', 'add', 1),
  rowKernel('subtractRow', 'subtract', 1),
  rowKernel('subtractRowPair', 'subtract', 2),
  rowKernel('addMultiple', 'add', 1, true),
  carryRows(),
];

let compiled: WebAssembly.Module | undefined;

/** The kernels working on `memory` (the module is compiled once, on first use). */
export function digitKernels(memory: WebAssembly.Memory): DigitKernels {
  compiled ??= new WebAssembly.Module(moduleBytes(KERNEL_SOURCES));
  return new WebAssembly.Instance(compiled, { env: { memory } }).exports as unknown as DigitKernels;
}
