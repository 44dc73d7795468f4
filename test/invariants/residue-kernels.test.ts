/**
 * The WebAssembly residue kernels of the modular bracket engine against scalar
 * references written here with BigInt, on random memory: residues in [0, m)
 * for odd moduli from 3 up to 2^31 − 1 (sums of two residues then pass 2^31
 * and must not be read as negative), rows at any word offset (so vectors of
 * four lanes straddle 16-byte boundaries), lengths 0 … 67 (every unrolled,
 * vector and single tail), and no word outside the target row may change.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { residueKernels, type ResidueKernels } from '../../src/core/invariants/wasm/residue-kernels.ts';
import { ResidueSlabs } from '../../src/core/invariants/wasm/residue-slabs.ts';

const SIZE = 4096;
const memory = new WebAssembly.Memory({ initial: 1 });
const kernels: ResidueKernels = residueKernels(memory);
/** Residues are below 2^31, so signed and unsigned views agree on them; the unsigned one shows a lane that wrapped. */
const words = new Uint32Array(memory.buffer, 0, SIZE);

/** Odd moduli: tiny ones, ones just below 2^31, and any in between. */
const modulus = fc.oneof(
  fc.constantFrom(3, 5, 7, 2 ** 31 - 1, 2 ** 31 - 3, 2 ** 31 - 5),
  fc.integer({ min: 1, max: 2 ** 30 - 1 }).map((k) => 2 * k + 1),
  fc.integer({ min: 0, max: 1000 }).map((k) => 2 ** 31 - 1 - 2 * k),
);

/** Raw words, mapped to residues once m is known: values near 0, values near m − 1, and any. */
const rawWord = fc.oneof(fc.integer({ min: 0, max: 3 }), fc.integer({ min: -4, max: -1 }), fc.integer({ min: 0, max: 2 ** 31 - 1 }));
const rawContents = fc.array(rawWord, { minLength: SIZE, maxLength: SIZE });

function residuesOf(raw: readonly number[], m: number): Uint32Array {
  return Uint32Array.from(raw, (x) => (x < 0 ? Math.max(0, m + x) : x % m));
}

type Kernel = 'addRow' | 'subtractRow' | 'subtractRowPair' | 'addOneLoop';
type RowCall = { kernel: Kernel; source: number; other: number; n: number; row: number; stride: number };

/** Sources in [0, 2000), targets in [2100, 4000): a call's sources never overlap its target, as the kernels require. */
const rowCall: fc.Arbitrary<RowCall> = fc.record({
  kernel: fc.constantFrom<Kernel>('addRow', 'subtractRow', 'subtractRowPair', 'addOneLoop'),
  source: fc.integer({ min: 0, max: 900 }),
  other: fc.integer({ min: 1000, max: 1900 }),
  n: fc.integer({ min: 0, max: 67 }),
  row: fc.integer({ min: 2100, max: 3900 }),
  stride: fc.constantFrom(1, 2),
});

/** Reduction into [0, m) of an exact integer (BigInt `%` keeps the sign of the dividend). */
function reduce(x: bigint, m: bigint): number {
  return Number(((x % m) + m) % m);
}

/** The kernels' definitions (residue-kernels.ts), computed on exact integers. */
function referenceCall(w: Uint32Array, c: RowCall, m: number): void {
  const M = BigInt(m);
  const at = (i: number): bigint => BigInt(w[i]!);
  if (c.kernel === 'addOneLoop') {
    // Adding d·p with d = −A² − A⁻²: the target row spans n + stride words, p subtracted at shifts 0 and stride.
    for (let j = 0; j < c.n + c.stride; j++) {
      const near = j < c.n ? at(c.source + j) : 0n;
      const far = j >= c.stride && j - c.stride < c.n ? at(c.source + j - c.stride) : 0n;
      w[c.row + j] = reduce(at(c.row + j) - near - far, M);
    }
    return;
  }
  for (let i = 0; i < c.n; i++) {
    const s = at(c.source + i);
    const t = at(c.row + i);
    if (c.kernel === 'addRow') w[c.row + i] = reduce(t + s, M);
    else if (c.kernel === 'subtractRow') w[c.row + i] = reduce(t - s, M);
    else w[c.row + i] = reduce(t - s - at(c.other + i), M);
  }
}

function kernelCall(c: RowCall, m: number): void {
  if (c.kernel === 'subtractRowPair') kernels.subtractRowPair(c.source, c.other, c.n, c.row, m);
  else if (c.kernel === 'addOneLoop') kernels.addOneLoop(c.source, c.n, c.row, c.stride, m);
  else kernels[c.kernel](c.source, c.n, c.row, m);
}

function firstDifference(a: Uint32Array, b: Uint32Array): number {
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return i;
  return -1;
}

describe('the residue row kernels (WebAssembly SIMD on 32-bit lanes) against BigInt references', () => {
  it('agree on one call at any offset and length for any odd m < 2^31, and touch nothing outside the target row', () => {
    fc.assert(
      fc.property(modulus, rawContents, rowCall, (m, raw, call) => {
        const contents = residuesOf(raw, m);
        words.set(contents);
        const expected = Uint32Array.from(contents);
        referenceCall(expected, call, m);
        kernelCall(call, m);
        return firstDifference(words, expected) === -1;
      }),
      { numRuns: 300 },
    );
  });

  it('agree on sequences of calls whose target rows overlap, and keep every residue in [0, m)', () => {
    const nearbyCall = rowCall.map((c) => ({ ...c, row: 2100 + (c.row % 7) }));
    fc.assert(
      fc.property(modulus, rawContents, fc.array(nearbyCall, { minLength: 2, maxLength: 8 }), (m, raw, calls) => {
        const contents = residuesOf(raw, m);
        words.set(contents);
        const expected = Uint32Array.from(contents);
        for (const call of calls) {
          referenceCall(expected, call, m);
          kernelCall(call, m);
        }
        return firstDifference(words, expected) === -1 && words.every((x) => x < m);
      }),
      { numRuns: 150 },
    );
  });

  it('reduce the extreme cases: (m−1) + (m−1), 0 − (m−1), (m−1) − 0 − 0 and 0 − (m−1) − (m−1) at m = 2^31 − 1 (worked by hand)', () => {
    const m = 2 ** 31 - 1;
    for (const n of [1, 4, 5, 16, 17]) {
      words.fill(m - 1, 0, 100);
      words.fill(m - 1, 200, 300);
      kernels.addRow(0, n, 200, m);
      expect(Array.from(words.subarray(200, 200 + n))).toEqual(new Array(n).fill(m - 2)); // 2m − 2 ≡ m − 2
      words.fill(0, 200, 300);
      kernels.subtractRow(0, n, 200, m);
      expect(Array.from(words.subarray(200, 200 + n))).toEqual(new Array(n).fill(1)); // −(m − 1) ≡ 1
      words.fill(0, 0, 100);
      words.fill(m - 1, 200, 300);
      kernels.subtractRowPair(0, 50, n, 200, m);
      expect(Array.from(words.subarray(200, 200 + n))).toEqual(new Array(n).fill(m - 1));
      words.fill(m - 1, 0, 100);
      words.fill(0, 200, 300);
      kernels.subtractRowPair(0, 50, n, 200, m);
      expect(Array.from(words.subarray(200, 200 + n))).toEqual(new Array(n).fill(2)); // −2(m − 1) ≡ 2
    }
  });
});

describe('the residue slabs in WebAssembly memory', () => {
  it('keep slab 1 when slab 0 grows (slab 1 moves up), and slab 0 when slab 1 grows', () => {
    const slabs = new ResidueSlabs(40);
    expect(slabs.reserve(1, 1000)).toBe(true);
    expect(slabs.reserve(0, 1000)).toBe(true);
    for (let i = 0; i < 1000; i++) {
      slabs.words[slabs.start(0) + i] = 7 * i + 1;
      slabs.words[slabs.start(1) + i] = 2 ** 31 - 1 - i;
    }
    const before = slabs.bytes;
    expect(slabs.reserve(0, 300_000)).toBe(true);
    expect(slabs.bytes).toBeGreaterThan(before);
    expect(slabs.start(1) - slabs.start(0)).toBeGreaterThanOrEqual(300_000);
    expect(slabs.start(0)).toBe(40); // after the program's words
    for (let i = 0; i < 1000; i++) expect(slabs.words[slabs.start(1) + i]).toBe(2 ** 31 - 1 - i);
    for (let i = 0; i < 300_000; i++) slabs.words[slabs.start(0) + i] = i;
    expect(slabs.reserve(1, 900_000)).toBe(true);
    for (let i = 0; i < 300_000; i++) if (slabs.words[slabs.start(0) + i] !== i) expect.fail(`slab 0 lost word ${i}`);
    // The slab being reserved only needs room: writing its last word must not reach past the memory.
    slabs.words[slabs.start(1) + 900_000 - 1] = 5;
    expect(slabs.start(1) + 900_000).toBeLessThanOrEqual(slabs.words.length);
  });

  it('give kernels that see the grown memory (the instance shares it)', () => {
    const slabs = new ResidueSlabs(4);
    expect(slabs.reserve(0, 100_000)).toBe(true);
    expect(slabs.reserve(1, 100_000)).toBe(true);
    const m = 2 ** 31 - 1;
    const [a, b] = [slabs.start(0) + 99_990, slabs.start(1) + 99_990];
    for (let i = 0; i < 10; i++) {
      slabs.words[a + i] = m - 1 - i;
      slabs.words[b + i] = 3 + i;
    }
    slabs.kernels.addRow(a, 10, b, m);
    for (let i = 0; i < 10; i++) expect(slabs.words[b + i]).toBe(2); // (m − 1 − i) + (3 + i) = m + 2 ≡ 2
  });
});
