/**
 * The WebAssembly digit kernels of the bracket engine against scalar
 * references written here in plain JavaScript (the loops the kernels
 * replaced), on random rows: any element offset (so pairs of doubles straddle
 * 16-byte boundaries), odd and even lengths, digits near 2^52, and target rows
 * of successive calls that overlap. IEEE addition is the same operation in a
 * SIMD lane as in a scalar register, so results must agree bit for bit; below
 * 2^53 they are also the exact integers (checked with BigInt).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { digitKernels, type DigitKernels } from '../../src/core/invariants/wasm/digit-kernels.ts';
import { DIGIT_MEMORY_MAX_BYTES, DigitSlabs } from '../../src/core/invariants/wasm/digit-slabs.ts';
import { isLimitError, stateMemoryError } from '../../src/core/limits.ts';

const SIZE = 4096;
const memory = new WebAssembly.Memory({ initial: 1 });
const kernels: DigitKernels = digitKernels(memory);
const digits = new Float64Array(memory.buffer, 0, SIZE);

/** Integers of every size a digit takes: small ones, 32-bit ones, and ones within 1000 of ±2^52. */
const digit = fc.oneof(
  fc.integer({ min: -1000, max: 1000 }),
  fc.integer({ min: -(2 ** 31), max: 2 ** 31 - 1 }).map((x) => x * 2 ** 21 + 17),
  fc.tuple(fc.integer({ min: 0, max: 1000 }), fc.boolean()).map(([k, negative]) => (negative ? -1 : 1) * (2 ** 52 - k)),
);

const memoryContents = fc.array(digit, { minLength: SIZE, maxLength: SIZE });

type RowCall = { kernel: 'addRow' | 'subtractRow' | 'subtractRowPair' | 'addMultiple'; source: number; other: number; n: number; row: number; factor: number };

/** The scalar loops the kernels replace. */
function referenceCall(m: Float64Array, c: RowCall): void {
  for (let i = 0; i < c.n; i++) {
    const s = m[c.source + i]!;
    if (c.kernel === 'addRow') m[c.row + i] = m[c.row + i]! + s;
    else if (c.kernel === 'subtractRow') m[c.row + i] = m[c.row + i]! - s;
    else if (c.kernel === 'subtractRowPair') m[c.row + i] = m[c.row + i]! - (s + m[c.other + i]!);
    else m[c.row + i] = m[c.row + i]! + s * c.factor;
  }
}

function kernelCall(c: RowCall): void {
  if (c.kernel === 'subtractRowPair') kernels.subtractRowPair(c.source, c.other, c.n, c.row);
  else if (c.kernel === 'addMultiple') kernels.addMultiple(c.source, c.n, c.row, c.factor);
  else kernels[c.kernel](c.source, c.n, c.row);
}

/** Sources in [0, 2000), targets in [2100, 4000): a call's sources never overlap its target, as in the engine. */
function rowCall(targetSpread: number): fc.Arbitrary<RowCall> {
  return fc.record({
    kernel: fc.constantFrom('addRow', 'subtractRow', 'subtractRowPair', 'addMultiple'),
    source: fc.integer({ min: 0, max: 900 }),
    other: fc.integer({ min: 1000, max: 1900 }),
    n: fc.integer({ min: 0, max: 67 }),
    row: fc.integer({ min: 2100, max: 2100 + targetSpread }),
    factor: fc.constantFrom(1, -1, 2, -3, 6, -20, 70),
  }) as fc.Arbitrary<RowCall>;
}

function sameBits(a: Float64Array, b: Float64Array): boolean {
  for (let i = 0; i < a.length; i++) if (!Object.is(a[i], b[i])) return false;
  return true;
}

describe('the digit row kernels (WebAssembly SIMD) against the scalar loops', () => {
  it('agree bit for bit on one call at any offset and length, and touch nothing outside the target row', () => {
    fc.assert(
      fc.property(memoryContents, rowCall(1800), (contents, call) => {
        digits.set(contents);
        const expected = Float64Array.from(contents);
        referenceCall(expected, call);
        kernelCall(call);
        return sameBits(digits, expected);
      }),
      { numRuns: 300 },
    );
  });

  it('agree on sequences of calls whose target rows overlap (the two smoothings of a source may land in one row)', () => {
    fc.assert(
      fc.property(memoryContents, fc.array(rowCall(6), { minLength: 2, maxLength: 8 }), (contents, calls) => {
        digits.set(contents);
        const expected = Float64Array.from(contents);
        for (const call of calls) {
          referenceCall(expected, call);
          kernelCall(call);
        }
        return sameBits(digits, expected);
      }),
      { numRuns: 200 },
    );
  });

  it('give the exact integers while results stay below 2^53 (row − (source + other) with digits up to 2^51)', () => {
    const small = fc.integer({ min: -(2 ** 30), max: 2 ** 30 }).map((x) => x * 2 ** 21 + 5);
    fc.assert(
      fc.property(fc.array(small, { minLength: SIZE, maxLength: SIZE }), rowCall(1800), (contents, call) => {
        digits.set(contents);
        kernels.subtractRowPair(call.source, call.other, call.n, call.row);
        for (let i = 0; i < call.n; i++) {
          const exact = BigInt(contents[call.row + i]!) - (BigInt(contents[call.source + i]!) + BigInt(contents[call.other + i]!));
          if (BigInt(digits[call.row + i]!) !== exact) return false;
        }
        return true;
      }),
      { numRuns: 200 },
    );
  });
});

/** The carry loop the kernel replaces, as it was written in JavaScript; returns 1 if a top digit overflows. */
function referenceCarry(m: Float64Array, at: number, n: number, limbs: number): number {
  let overflow = 0;
  const topRow = at + (limbs - 1) * n;
  for (let i = 0; i < n; i++) {
    let carried = 0;
    for (let x = at + i; x < topRow; x += n) {
      const value = m[x]! + carried;
      carried = Math.floor(value / 2 ** 32);
      m[x] = value - carried * 2 ** 32;
    }
    const top = m[topRow + i]! + carried;
    m[topRow + i] = top;
    if (Math.abs(top) >= 2 ** 32) overflow = 1;
  }
  return overflow;
}

function coefficient(m: Float64Array, at: number, n: number, limbs: number, i: number): bigint {
  let value = 0n;
  for (let j = limbs - 1; j >= 0; j--) value = (value << 32n) + BigInt(m[at + j * n + i]!);
  return value;
}

describe('the carry kernel', () => {
  const state = fc.record({ at: fc.integer({ min: 0, max: 51 }), n: fc.integer({ min: 0, max: 9 }), limbs: fc.integer({ min: 1, max: 4 }) });
  // Digits reach the carry below 2^52 (bracket.ts carries before any could pass it).
  const belowCeiling = fc.oneof(digit.filter((x) => Math.abs(x) < 2 ** 52), fc.integer({ min: -(2 ** 31), max: 2 ** 31 }));

  it('agrees bit for bit with the scalar carry, flags the same overflows, and keeps every coefficient (BigInt)', () => {
    fc.assert(
      fc.property(fc.array(belowCeiling, { minLength: 100, maxLength: 100 }), state, (contents, { at, n, limbs }) => {
        digits.fill(7, 0, 200);
        digits.set(contents);
        const before = Float64Array.from(digits.subarray(0, 200));
        const expected = Float64Array.from(before);
        const expectedOverflow = referenceCarry(expected, at, n, limbs);
        const overflow = kernels.carryRows(at, n, limbs);
        const after = digits.subarray(0, 200);
        if (overflow !== expectedOverflow || !sameBits(after, expected)) return false;
        for (let i = 0; i < n; i++) {
          if (coefficient(after, at, n, limbs, i) !== coefficient(before, at, n, limbs, i)) return false;
          for (let j = 0; j < limbs - 1; j++) {
            const low = after[at + j * n + i]!;
            if (low < 0 || low >= 2 ** 32) return false;
          }
        }
        return true;
      }),
      { numRuns: 300 },
    );
  });
});

describe('the digit slabs in WebAssembly memory', () => {
  it('keep the other slab when one grows (slab 1 moves up to the new middle)', () => {
    const slabs = new DigitSlabs();
    expect(slabs.reserve(1, 1000)).toBe(true);
    for (let i = 0; i < 1000; i++) slabs.digits[slabs.start(1) + i] = i * 3 - 7;
    expect(slabs.reserve(0, 200_000)).toBe(true);
    expect(slabs.start(1)).toBeGreaterThanOrEqual(200_000);
    for (let i = 0; i < 1000; i++) expect(slabs.digits[slabs.start(1) + i]).toBe(i * 3 - 7);
  });

  it('refuse two slabs that do not fit into a wasm32 memory (4 GiB) instead of failing, and the engine says so as a limit', () => {
    const slabs = new DigitSlabs();
    expect(slabs.reserve(0, DIGIT_MEMORY_MAX_BYTES / 16 + 1)).toBe(false);
    expect(slabs.bytes).toBe(65536); // nothing was grown
    const error = stateMemoryError(2000, 16, 5 * 2 ** 30, DIGIT_MEMORY_MAX_BYTES, false);
    expect(isLimitError(error)).toBe(true);
    expect(error.message).toContain('more than the limit of 4.0 GiB');
    expect(error.message).not.toContain('--max-state-memory');
  });
});
