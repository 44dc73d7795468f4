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
import { EMPTY, I32, i32Const, moduleBytes, op, simdOp, V128, type FunctionSpec, type ValueType } from './encoding.ts';

/** Opcodes beyond those the digit kernels use (WebAssembly 2.0 core and fixed-width SIMD). */
const i32Load = 0x28;
const i32Store = 0x36;
const i32GeU = 0x4f;
const select = 0x1b;
const simdI32 = { splat: 0x11, add: 0xae, sub: 0xb1, minU: 0xb7 } as const;
/** The memory immediate of a 32-bit load or store: 4-byte alignment, no offset. */
const WORD_ALIGNED = [2, 0];

/** How one iteration touches the residues: four at once in a vector, or one. */
interface Lane {
  readonly residues: number;
  readonly type: ValueType;
  readonly load: readonly number[];
  readonly store: readonly number[];
  readonly add: readonly number[];
  readonly subtract: readonly number[];
  /** Pops a value v (in [0, 2m)); pushes v reduced into [0, m). `value` and `modulus` are locals of the lane's type. */
  reduce(value: number, modulus: number): number[];
}

const get = (local: number): number[] => [op.localGet, local];
const set = (local: number): number[] => [op.localSet, local];

const VECTORS: Lane = {
  residues: 4,
  type: V128,
  load: [...simdOp(0x00), ...WORD_ALIGNED],
  store: [...simdOp(0x0b), ...WORD_ALIGNED],
  add: simdOp(simdI32.add),
  subtract: simdOp(simdI32.sub),
  reduce: (value, modulus) => [...set(value), ...get(value), ...get(value), ...get(modulus), ...simdOp(simdI32.sub), ...simdOp(simdI32.minU)],
};

const SINGLES: Lane = {
  residues: 1,
  type: I32,
  load: [i32Load, ...WORD_ALIGNED],
  store: [i32Store, ...WORD_ALIGNED],
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

/** local += amount (i32). */
function increase(local: number, amount: number): number[] {
  return [...get(local), ...i32Const(amount), op.i32Add, ...set(local)];
}

/** `body` repeated while the unsigned count in `counter` is at least `step`, taking `step` off it each time. */
function whileAtLeast(counter: number, step: number, body: readonly number[]): number[] {
  return [
    op.block, EMPTY,
    op.loop, EMPTY,
    ...get(counter), ...i32Const(step), op.i32LtU, op.brIf, 1,
    ...body,
    ...get(counter), ...i32Const(step), op.i32Sub, ...set(counter),
    op.br, 0,
    op.end,
    op.end,
  ]; // prettier-ignore
}

type Kind = 'add' | 'subtract' | 'subtractPair';

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
  const iteration = (lane: Lane): number[] => {
    const value = local(lane.type);
    const modulus = lane.type === V128 ? mVector : m;
    const bytes = 4 * lane.residues;
    // A difference x − y becomes x + (m − y): both summands in [0, m], the sum below 2m.
    const combine = (input: number): number[] =>
      kind === 'add'
        ? [...get(input), ...lane.load, ...lane.add]
        : [...get(modulus), ...get(input), ...lane.load, ...lane.subtract, ...lane.add];
    return [
      ...get(row),
      ...get(row), ...lane.load,
      ...combine(inputs[0]!), ...lane.reduce(value, modulus),
      ...(sourceCount === 2 ? [...combine(inputs[1]!), ...lane.reduce(value, modulus)] : []),
      ...lane.store,
      ...inputs.flatMap((input) => increase(input, bytes)),
      ...increase(row, bytes),
    ]; // prettier-ignore
  };
  const toBytes = (local: number): number[] => [...get(local), ...i32Const(2), op.i32Shl, ...set(local)];
  const body = [
    ...[...inputs, row].flatMap(toBytes),
    ...get(m), ...simdOp(simdI32.splat), ...set(mVector),
    ...whileAtLeast(n, VECTORS.residues, iteration(VECTORS)),
    ...whileAtLeast(n, SINGLES.residues, iteration(SINGLES)),
  ];
  return { name, params, results: [], locals, body };
}

/** The kernels; every row argument is an element index into the memory's 32-bit words, every residue in [0, m). */
export interface ResidueKernels {
  /** row[i] = (row[i] + source[i]) mod m for i < n. */
  addRow(source: number, n: number, row: number, m: number): void;
  /** row[i] = (row[i] − source[i]) mod m. */
  subtractRow(source: number, n: number, row: number, m: number): void;
  /** row[i] = (row[i] − source[i] − other[i]) mod m. */
  subtractRowPair(source: number, other: number, n: number, row: number, m: number): void;
}

const KERNEL_SOURCES: readonly FunctionSpec[] = [rowKernel('addRow', 'add'), rowKernel('subtractRow', 'subtract'), rowKernel('subtractRowPair', 'subtractPair')];

let compiled: WebAssembly.Module | undefined;

/** The kernels working on `memory` (the module is compiled once, on first use). */
export function residueKernels(memory: WebAssembly.Memory): ResidueKernels {
  compiled ??= new WebAssembly.Module(moduleBytes(KERNEL_SOURCES));
  return new WebAssembly.Instance(compiled, { env: { memory } }).exports as unknown as ResidueKernels;
}
