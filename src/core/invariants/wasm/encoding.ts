/**
 * Just enough of the WebAssembly binary format to write small numeric kernels
 * by hand: the opcodes they use, LEB128 integers, and a module of exported
 * functions over one imported memory. No toolchain and no build step: the
 * bytes are put together at load time and compiled with `new WebAssembly.Module`.
 * Opcode values are those of the WebAssembly 2.0 specification (core and
 * fixed-width SIMD).
 */

/** Value types. */
export const I32 = 0x7f;
export const F64 = 0x7c;
export const V128 = 0x7b;
export type ValueType = typeof I32 | typeof F64 | typeof V128;

/** Block type of a block or loop that leaves nothing on the stack. */
export const EMPTY = 0x40;

/** Core opcodes (one byte each). */
export const op = {
  block: 0x02,
  loop: 0x03,
  if: 0x04,
  end: 0x0b,
  br: 0x0c,
  brIf: 0x0d,
  localGet: 0x20,
  localSet: 0x21,
  localTee: 0x22,
  f64Load: 0x2b,
  f64Store: 0x39,
  i32Const: 0x41,
  f64Const: 0x44,
  i32Eqz: 0x45,
  i32LtU: 0x49,
  f64Ge: 0x66,
  i32Add: 0x6a,
  i32Sub: 0x6b,
  i32Or: 0x72,
  i32Shl: 0x74,
  f64Abs: 0x99,
  f64Floor: 0x9c,
  f64Add: 0xa0,
  f64Sub: 0xa1,
  f64Mul: 0xa2,
} as const;

/** SIMD opcodes: the prefix byte 0xfd, then the number as unsigned LEB128. */
export const simd = {
  v128Load: 0x00,
  v128Store: 0x0b,
  f64x2Splat: 0x14,
  f64x2Ge: 0x4c,
  v128AnyTrue: 0x53,
  f64x2Floor: 0x75,
  f64x2Abs: 0xec,
  f64x2Add: 0xf0,
  f64x2Sub: 0xf1,
  f64x2Mul: 0xf2,
} as const;

export function simdOp(code: number): number[] {
  return [0xfd, ...unsignedLeb(code)];
}

export function unsignedLeb(value: number): number[] {
  const bytes: number[] = [];
  let rest = value >>> 0;
  do {
    let byte = rest & 0x7f;
    rest >>>= 7;
    if (rest !== 0) byte |= 0x80;
    bytes.push(byte);
  } while (rest !== 0);
  return bytes;
}

export function signedLeb(value: number): number[] {
  const bytes: number[] = [];
  let rest = value | 0;
  for (;;) {
    const byte = rest & 0x7f;
    rest >>= 7;
    const done = (rest === 0 && (byte & 0x40) === 0) || (rest === -1 && (byte & 0x40) !== 0);
    bytes.push(done ? byte : byte | 0x80);
    if (done) return bytes;
  }
}

export function i32Const(value: number): number[] {
  return [op.i32Const, ...signedLeb(value)];
}

export function f64Const(value: number): number[] {
  const bytes = new Uint8Array(8);
  new DataView(bytes.buffer).setFloat64(0, value, true);
  return [op.f64Const, ...bytes];
}

/** A WebAssembly memory grows in pages of 64 KiB. */
export const PAGE_BYTES = 65536;
/** A wasm32 memory has at most 2^16 pages: 4 GiB. */
export const WASM32_MEMORY_MAX_BYTES = 2 ** 32;

/** The memory immediate of a load or store: 8-byte alignment (every digit is a double), no offset. */
export const DIGIT_ALIGNED = [3, 0];

export interface FunctionSpec {
  readonly name: string;
  readonly params: readonly ValueType[];
  readonly results: readonly ValueType[];
  /** Extra locals, numbered after the parameters. */
  readonly locals: readonly ValueType[];
  /** The instructions, without the final `end`. */
  readonly body: readonly number[];
}

function vector(items: readonly (readonly number[])[]): number[] {
  return [...unsignedLeb(items.length), ...items.flat()];
}

function section(id: number, content: readonly number[]): number[] {
  return [id, ...unsignedLeb(content.length), ...content];
}

function utf8(text: string): number[] {
  return [...unsignedLeb(text.length), ...new TextEncoder().encode(text)];
}

/** A module that imports `env.memory` and exports each function under its name (one type per function). */
export function moduleBytes(functions: readonly FunctionSpec[]): Uint8Array<ArrayBuffer> {
  const types = functions.map((f) => [0x60, ...vector(f.params.map((t) => [t])), ...vector(f.results.map((t) => [t]))]);
  const memoryImport = [...utf8('env'), ...utf8('memory'), 0x02, 0x00, ...unsignedLeb(1)]; // memory, no maximum, at least 1 page
  const declarations = functions.map((_, i) => unsignedLeb(i));
  const exports = functions.map((f, i) => [...utf8(f.name), 0x00, ...unsignedLeb(i)]);
  const bodies = functions.map((f) => {
    const code = [...vector(f.locals.map((t) => [1, t])), ...f.body, op.end];
    return [...unsignedLeb(code.length), ...code];
  });
  return Uint8Array.from([
    ...[0x00, 0x61, 0x73, 0x6d, 0x01, 0x00, 0x00, 0x00], // "\0asm", version 1
    ...section(1, vector(types)),
    ...section(2, vector([memoryImport])),
    ...section(3, vector(declarations)),
    ...section(7, vector(exports)),
    ...section(10, vector(bodies)),
  ]);
}

/** Pushes a local's value. */
export const get = (local: number): number[] => [op.localGet, local];
/** Pops into a local. */
export const set = (local: number): number[] => [op.localSet, local];

/** local += amount (i32; a constant, or instructions that push it). */
export function increase(local: number, amount: number | readonly number[]): number[] {
  return [...get(local), ...(typeof amount === 'number' ? i32Const(amount) : amount), op.i32Add, ...set(local)];
}

/** `body` repeated while the unsigned count in `counter` is at least `step`, taking `step` off it each time. */
export function whileAtLeast(counter: number, step: number, body: readonly number[]): number[] {
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
