/**
 * The modular bracket engine's row passes (bracket-modular.ts) as WebAssembly
 * with 128-bit SIMD on 32-bit lanes: residues modulo an odd m < 2^31, kept
 * reduced in [0, m) as unsigned 32-bit integers, four per vector.
 *
 * A sum x + y of two residues is below 2^32, so it does not wrap, and the
 * reduced sum is min_u(x + y, x + y − m): when x + y < m the difference wraps
 * to a number above x + y and the minimum keeps x + y; otherwise it is the
 * difference. A difference x − y is reduced as min_u(x − y + m, x − y). Four
 * residues take three instructions and no branch, and half the bytes of a
 * double, which is what the engine's passes wait on.
 *
 * Rows are element indexes into the memory's 32-bit words (as an Int32Array
 * over it would index them); a call's source rows must not overlap its target
 * row.
 */
import { EMPTY, get, I32, i32Const, increase, moduleBytes, op, set, simdOp, unsignedLeb, V128, whileAtLeast, type FunctionSpec, type ValueType } from './encoding.ts';

/** Opcodes beyond those the digit kernels use (WebAssembly 2.0 core and fixed-width SIMD). */
const i32Load = 0x28;
const i32Store = 0x36;
const i32Eq = 0x46;
const i32GtU = 0x4b;
const i32GeU = 0x4f;
const i32And = 0x71;
const i32ShrU = 0x76;
const select = 0x1b;
const call = 0x10;
/** memory.fill on memory 0 (bulk memory, WebAssembly 2.0): pops address, byte value, length. */
const memoryFill = [0xfc, 0x0b, 0x00];
const opElse = 0x05;
const simdI32 = { splat: 0x11, add: 0xae, sub: 0xb1, minU: 0xb7 } as const;
/** The alignment a memory immediate promises: 4 bytes (log2), a word's. */
const WORD_ALIGNMENT = 2;

/** How one iteration touches the residues: four at once in a vector, or one. */
interface Lane {
  readonly residues: number;
  readonly type: ValueType;
  /** A load or store at `offset` bytes past the address on the stack. */
  load(offset: number): number[];
  store(offset: number): number[];
  readonly add: readonly number[];
  readonly subtract: readonly number[];
  /** Pops a value v (in [0, 2m)); pushes v reduced into [0, m). `value` and `modulus` are locals of the lane's type. */
  reduce(value: number, modulus: number): number[];
}


const VECTORS: Lane = {
  residues: 4,
  type: V128,
  load: (offset) => [...simdOp(0x00), WORD_ALIGNMENT, ...unsignedLeb(offset)],
  store: (offset) => [...simdOp(0x0b), WORD_ALIGNMENT, ...unsignedLeb(offset)],
  add: simdOp(simdI32.add),
  subtract: simdOp(simdI32.sub),
  reduce: (value, modulus) => [...set(value), ...get(value), ...get(value), ...get(modulus), ...simdOp(simdI32.sub), ...simdOp(simdI32.minU)],
};

const SINGLES: Lane = {
  residues: 1,
  type: I32,
  load: (offset) => [i32Load, WORD_ALIGNMENT, ...unsignedLeb(offset)],
  store: (offset) => [i32Store, WORD_ALIGNMENT, ...unsignedLeb(offset)],
  add: [op.i32Add],
  subtract: [op.i32Sub],
  reduce: (value, modulus) => [
    ...set(value),
    ...get(value), ...get(modulus), op.i32Sub,
    ...get(value),
    ...get(value), ...get(modulus), i32GeU,
    select,
  ], // prettier-ignore
};

type Kind = 'add' | 'subtract' | 'subtractPair';

/** Vectors per loop iteration on long rows: fewer pointer updates and branches per residue (measured 4 against 1). */
const UNROLL = 4;

/**
 * add: row[i] = row[i] + source[i]; subtract: row[i] − source[i];
 * subtractPair: row[i] − source[i] − other[i]; all modulo m. Parameters: the
 * source rows, n, the target row, m.
 */
function rowKernel(name: string, kind: Kind): FunctionSpec {
  const sourceCount = kind === 'subtractPair' ? 2 : 1;
  const inputs = sourceCount === 1 ? [0] : [0, 1];
  const [n, row, m] = [sourceCount, sourceCount + 1, sourceCount + 2];
  const params: ValueType[] = [...inputs.map((): ValueType => I32), I32, I32, I32];
  const locals: ValueType[] = [];
  const local = (type: ValueType): number => locals.push(type) + params.length - 1;
  const mVector = local(V128);
  /** `unroll` groups of the lane's residues, addressed by offsets from the same pointers, then the pointers move on. */
  const iteration = (lane: Lane, unroll: number): number[] => {
    const value = local(lane.type);
    const modulus = lane.type === V128 ? mVector : m;
    const bytes = 4 * lane.residues;
    // A difference x − y becomes x + (m − y): both summands in [0, m], the sum below 2m.
    const combine = (input: number, offset: number): number[] =>
      kind === 'add'
        ? [...get(input), ...lane.load(offset), ...lane.add]
        : [...get(modulus), ...get(input), ...lane.load(offset), ...lane.subtract, ...lane.add];
    const group = (offset: number): number[] => [
      ...get(row),
      ...get(row), ...lane.load(offset),
      ...combine(inputs[0]!, offset), ...lane.reduce(value, modulus),
      ...(sourceCount === 2 ? [...combine(inputs[1]!, offset), ...lane.reduce(value, modulus)] : []),
      ...lane.store(offset),
    ]; // prettier-ignore
    return [
      ...Array.from({ length: unroll }, (_, u) => group(u * bytes)).flat(),
      ...inputs.flatMap((input) => increase(input, unroll * bytes)),
      ...increase(row, unroll * bytes),
    ];
  };
  const toBytes = (local: number): number[] => [...get(local), ...i32Const(2), op.i32Shl, ...set(local)];
  const body = [
    ...[...inputs, row].flatMap(toBytes),
    ...get(m), ...simdOp(simdI32.splat), ...set(mVector),
    ...whileAtLeast(n, UNROLL * VECTORS.residues, iteration(VECTORS, UNROLL)),
    ...whileAtLeast(n, VECTORS.residues, iteration(VECTORS, 1)),
    ...whileAtLeast(n, SINGLES.residues, iteration(SINGLES, 1)),
  ];
  return { name, params, results: [], locals, body };
}

/** Function indexes in the module, in KERNEL_SOURCES order. */
const ADD_ROW = 0;
const SUBTRACT_ROW = 1;
const SUBTRACT_ROW_PAIR = 2;
const ADD_ONE_LOOP = 3;

/**
 * row[at + i] −= source[i] + source[i − stride] for the source's n residues:
 * adding d·p = −p·A² − p·A⁻², the terms of d `stride` apart. Three passes, each
 * one over one stretch of the target row. Parameters: from, n, at, stride, m.
 */
function addOneLoop(): FunctionSpec {
  const [from, n, at, stride, m] = [0, 1, 2, 3, 4];
  const [head, tail] = [5, 6];
  const body = [
    // head = min(stride, n), tail = max(n, stride)
    ...get(stride), ...get(n), ...get(stride), ...get(n), op.i32LtU, select, ...set(head),
    ...get(n), ...get(stride), ...get(n), ...get(stride), i32GtU, select, ...set(tail),
    ...get(from), ...get(head), ...get(at), ...get(m), call, SUBTRACT_ROW,
    ...get(n), ...get(stride), i32GtU, op.if, EMPTY,
    ...get(from), ...get(stride), op.i32Add, ...get(from), ...get(n), ...get(stride), op.i32Sub, ...get(at), ...get(stride), op.i32Add, ...get(m), call, SUBTRACT_ROW_PAIR,
    op.end,
    ...get(from), ...get(tail), op.i32Add, ...get(stride), op.i32Sub,
    ...get(n), ...get(stride), op.i32Add, ...get(tail), op.i32Sub,
    ...get(at), ...get(tail), op.i32Add,
    ...get(m), call, SUBTRACT_ROW,
  ]; // prettier-ignore
  return { name: 'addOneLoop', params: [I32, I32, I32, I32, I32], results: [], locals: [I32, I32], body };
}

/**
 * One step of the modular contraction, driven by its program at word 0 of the
 * memory: four words per source state, [n, start of the A-smoothing, start of
 * the B-smoothing, loops of A | loops of B << 4]. Source states lie one after
 * another from element `from`; each smoothing adds the source times
 * A^(±1)·d^loops into the target slab at `base` + start, after zeroing its
 * `size` words (memory.fill, a memset, several times faster than filling a
 * typed array from JavaScript). Smoothings closing two or more loops are rare
 * and left to the caller. Parameters: count, from, base, size, stride, m.
 */
function accumulateStep(): FunctionSpec {
  const [count, from, base, size, stride, m] = [0, 1, 2, 3, 4, 5];
  const [pointer, n, packed, loops] = [6, 7, 8, 9];
  const loadWord = (offset: number): number[] => [...get(pointer), i32Load, 2, offset];
  const smoothing = (loopsOf: readonly number[], startOffset: number): number[] => [
    ...loopsOf, ...set(loops),
    ...get(loops), op.i32Eqz, op.if, EMPTY,
    ...get(from), ...get(n), ...get(base), ...loadWord(startOffset), op.i32Add, ...get(m), call, ADD_ROW,
    opElse,
    ...get(loops), ...i32Const(1), i32Eq, op.if, EMPTY,
    ...get(from), ...get(n), ...get(base), ...loadWord(startOffset), op.i32Add, ...get(stride), ...get(m), call, ADD_ONE_LOOP,
    op.end,
    op.end,
  ]; // prettier-ignore
  const body = [
    ...get(base), ...i32Const(2), op.i32Shl, ...i32Const(0), ...get(size), ...i32Const(2), op.i32Shl, ...memoryFill,
    ...i32Const(0), ...set(pointer),
    op.block, EMPTY,
    op.loop, EMPTY,
    ...get(count), op.i32Eqz, op.brIf, 1,
    ...loadWord(0), ...set(n),
    ...loadWord(12), ...set(packed),
    ...smoothing([...get(packed), ...i32Const(15), i32And], 4),
    ...smoothing([...get(packed), ...i32Const(4), i32ShrU], 8),
    ...get(from), ...get(n), op.i32Add, ...set(from),
    ...get(pointer), ...i32Const(16), op.i32Add, ...set(pointer),
    ...get(count), ...i32Const(1), op.i32Sub, ...set(count),
    op.br, 0,
    op.end,
    op.end,
  ]; // prettier-ignore
  return { name: 'accumulateStep', params: [I32, I32, I32, I32, I32, I32], results: [], locals: [I32, I32, I32, I32], body };
}

/** The kernels; every row argument is an element index into the memory's 32-bit words, every residue in [0, m). */
export interface ResidueKernels {
  /** row[i] = (row[i] + source[i]) mod m for i < n. */
  addRow(source: number, n: number, row: number, m: number): void;
  /** row[i] = (row[i] − source[i]) mod m. */
  subtractRow(source: number, n: number, row: number, m: number): void;
  /** row[i] = (row[i] − source[i] − other[i]) mod m. */
  subtractRowPair(source: number, other: number, n: number, row: number, m: number): void;
  /** row[at + i] −= source[from + i] + source[from + i − stride]: adding d times a row (see addOneLoop). */
  addOneLoop(from: number, n: number, at: number, stride: number, m: number): void;
  /** One step of the contraction from the program at word 0 (see accumulateStep); zeroes the target's `size` words first. */
  accumulateStep(count: number, from: number, base: number, size: number, stride: number, m: number): void;
}

const KERNEL_SOURCES: readonly FunctionSpec[] = [
  rowKernel('addRow', 'add'),
  rowKernel('subtractRow', 'subtract'),
  rowKernel('subtractRowPair', 'subtractPair'),
  addOneLoop(),
  accumulateStep(),
];

let compiled: WebAssembly.Module | undefined;

/** The kernels working on `memory` (the module is compiled once, on first use). */
export function residueKernels(memory: WebAssembly.Memory): ResidueKernels {
  compiled ??= new WebAssembly.Module(moduleBytes(KERNEL_SOURCES));
  return new WebAssembly.Instance(compiled, { env: { memory } }).exports as unknown as ResidueKernels;
}
