import { describe, expect, it } from 'vitest';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { classicalInvariants } from '../../src/core/invariants/classical/index.ts';
import { symmetricInertia } from '../../src/core/invariants/classical/inertia.ts';
import { pencilDeterminant } from '../../src/core/invariants/classical/modular.ts';
import { SparseMatrixBuilder, bandOrder, toDense, type SparseMatrix } from '../../src/core/invariants/classical/sparse-matrix.ts';
import { Laurent } from '../../src/core/poly/laurent.ts';
import { randomInt, randomReducedAlternating, rng } from '../support/random-diagrams.ts';
import { componentCount } from '../../src/core/diagram/model.ts';
import { laurentDeterminant } from './support.ts';

function randomSymmetric(random: () => number, size: number, density: number, range: number): SparseMatrix {
  const b = new SparseMatrixBuilder(size);
  for (let i = 0; i < size; i++) {
    for (let j = i; j < size; j++) {
      if (random() > density) continue;
      const v = BigInt(randomInt(random, -range, range));
      b.add(i, j, v);
      if (i !== j) b.add(j, i, v);
    }
  }
  return b.build();
}

/** Coefficients of det(x·I − M), ascending, by exact elimination. */
function characteristicPolynomial(m: SparseMatrix): Laurent {
  const dense = toDense(m);
  const x = Laurent.monomial(1);
  return laurentDeterminant(dense.map((row, i) => row.map((v, j) => (i === j ? x.sub(Laurent.constant(v)) : Laurent.constant(-v)))));
}

/** Sign changes in the coefficient sequence (zeros skipped). */
function signChanges(p: Laurent): number {
  const signs = p.terms().map(([, c]) => c > 0n);
  let changes = 0;
  for (let i = 1; i < signs.length; i++) if (signs[i] !== signs[i - 1]) changes++;
  return changes;
}

describe('exact symmetric inertia', () => {
  it("matches Descartes' rule of signs on the characteristic polynomial (exact for real-rooted polynomials; from memory)", () => {
    const random = rng(31);
    for (let trial = 0; trial < 60; trial++) {
      const size = randomInt(random, 1, 8);
      const m = randomSymmetric(random, size, trial % 3 === 0 ? 0.25 : 0.6, trial % 4 === 0 ? 1 : 3);
      const chi = characteristicPolynomial(m);
      const zeroRoots = chi.minDegree!;
      const reduced = chi.shift(-zeroRoots);
      const inertia = symmetricInertia(m);
      expect(inertia.zero).toBe(zeroRoots);
      expect(inertia.positive).toBe(signChanges(reduced));
      expect(inertia.negative).toBe(signChanges(reduced.alternateSigns(1)));
      const det = chi.coefficient(0);
      expect(inertia.absDeterminant).toBe(det < 0n ? -det : det);
    }
  });
  it('handles an all-zero diagonal (hyperbolic blocks) and zero rows', () => {
    const b = new SparseMatrixBuilder(5);
    for (const [i, j] of [[0, 1], [2, 3]]) {
      b.add(i!, j!, 1n);
      b.add(j!, i!, 1n);
    }
    expect(symmetricInertia(b.build())).toEqual({ positive: 2, negative: 2, zero: 1, absDeterminant: 0n });
  });
  it('refuses a non-symmetric matrix', () => {
    const b = new SparseMatrixBuilder(2);
    b.add(0, 1, 1n);
    expect(() => symmetricInertia(b.build())).toThrow(/not symmetric/);
  });
});

describe('modular determinant of a pencil', () => {
  it('equals exact elimination for random sparse pencils t·A − B, large entries included', () => {
    const random = rng(32);
    for (let trial = 0; trial < 25; trial++) {
      const size = randomInt(random, 1, 7);
      const a = new SparseMatrixBuilder(size);
      const bm = new SparseMatrixBuilder(size);
      for (let i = 0; i < size; i++) {
        for (let j = 0; j < size; j++) {
          if (random() < 0.5) a.add(i, j, BigInt(randomInt(random, -5, 5)) * (trial % 5 === 0 ? 10n ** 12n : 1n));
          if (random() < 0.5) bm.add(i, j, BigInt(randomInt(random, -5, 5)));
        }
      }
      expectPencilMatchesExactElimination(a, bm);
    }
  });
  it('equals exact elimination for banded pencils with zero diagonals, so rows are swapped inside the band', () => {
    const random = rng(34);
    for (let trial = 0; trial < 12; trial++) {
      const size = randomInt(random, 8, 24);
      const below = randomInt(random, 1, 3);
      const above = randomInt(random, 0, 4);
      const a = new SparseMatrixBuilder(size);
      const bm = new SparseMatrixBuilder(size);
      for (let i = 0; i < size; i++) {
        for (let j = Math.max(0, i - below); j <= Math.min(size - 1, i + above); j++) {
          // Empty diagonals (and sparse bands) make the first entry of a column vanish, which forces a row swap.
          if (i === j && random() < 0.7) continue;
          if (random() < 0.6) a.add(i, j, BigInt(randomInt(random, -3, 3)));
          if (random() < 0.6) bm.add(i, j, BigInt(randomInt(random, -3, 3)));
        }
      }
      expectPencilMatchesExactElimination(a, bm);
    }
  });
  it('band order keeps a shuffled path narrow', () => {
    const n = 40;
    const random = rng(33);
    const label = Array.from({ length: n }, (_, i) => i).sort(() => random() - 0.5);
    const b = new SparseMatrixBuilder(n);
    for (let k = 0; k + 1 < n; k++) {
      b.add(label[k]!, label[k + 1]!, 1n);
      b.add(label[k + 1]!, label[k]!, 1n);
    }
    const order = bandOrder(b.build());
    const position = new Map(order.map((v, i) => [v, i]));
    for (let k = 0; k + 1 < n; k++) expect(Math.abs(position.get(label[k]!)! - position.get(label[k + 1]!)!)).toBe(1);
  });
});

describe('genus bounds', () => {
  it('torus knots: span Δ, |σ| and Seifert’s algorithm bound the genus (p−1)(q−1)/2 (from memory)', () => {
    for (const [p, q] of [[2, 3], [2, 5], [3, 4], [3, 5]] as const) {
      const word: number[] = [];
      for (let k = 0; k < q; k++) for (let i = 1; i < p; i++) word.push(i);
      const bounds = classicalInvariants(closeBraid(word, p)).genusBounds;
      const genus = ((p - 1) * (q - 1)) / 2;
      expect(bounds.find((b) => b.reason === 'alexander-span')!.value).toBe(genus);
      expect(bounds.find((b) => b.reason === 'seifert-algorithm')!.value).toBe(genus);
      expect(bounds.find((b) => b.reason === 'signature')!.value).toBeLessThanOrEqual(genus);
      for (const b of bounds) expect(b.text).toMatch(/\.$/);
    }
  });
  it('figure-eight: span bound 1 but signature bound 0 (from memory)', () => {
    const bounds = classicalInvariants(closeBraid([1, -2, 1, -2], 3)).genusBounds;
    expect(bounds.map((b) => [b.reason, b.value])).toEqual([
      ['alexander-span', 1],
      ['signature', 0],
      ['seifert-algorithm', 1],
    ]);
  });
  it('reduced alternating knots: Seifert’s algorithm is minimal, span Δ = 2g, and Δ alternates without gaps (from memory: Crowell, Murasugi)', () => {
    const random = rng(34);
    let knots = 0;
    while (knots < 25) {
      const d = randomReducedAlternating(random, 5 + (knots % 15), 5);
      if (componentCount(d) !== 1) continue;
      knots++;
      const c = classicalInvariants(d);
      const value = (reason: string): number => c.genusBounds.find((b) => b.reason === reason)!.value;
      expect(value('alexander-span')).toBe(value('seifert-algorithm'));
      const terms = c.alexander.terms();
      expect(terms.length).toBe(c.alexander.span + 1);
      terms.forEach(([, coefficient], i) => i > 0 && expect(coefficient > 0n).toBe(terms[i - 1]![1] < 0n));
      expect(terms.reduce((sum, [, coefficient]) => sum + (coefficient < 0n ? -coefficient : coefficient), 0n)).toBe(c.determinant);
    }
  });
});

/** det(t·A − B) by the modular pencil routine equals plain exact elimination over ℤ[t]. */
function expectPencilMatchesExactElimination(a: SparseMatrixBuilder, bm: SparseMatrixBuilder): void {
  const A = toDense(a.build());
  const B = toDense(bm.build());
  const t = Laurent.monomial(1);
  const exact = laurentDeterminant(A.map((row, i) => row.map((v, j) => t.scale(v).sub(Laurent.constant(B[i]![j]!)))));
  const { coefficients } = pencilDeterminant(a.build(), bm.build());
  expect(Laurent.fromDense(coefficients, 0).equals(exact)).toBe(true);
}
