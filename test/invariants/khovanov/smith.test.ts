import { describe, expect, it } from 'vitest';
import { primaryParts } from '../../../src/core/invariants/khovanov/homology.ts';
import { diagonalForm, smithOfDense } from '../../../src/core/invariants/khovanov/smith.ts';
import { randomInt, rng } from '../../support/random-diagrams.ts';

/** The cokernel's torsion as a sorted list of prime-power orders, and the rank. */
function group(diagonal: bigint[]): { rank: number; torsion: bigint[] } {
  return { rank: diagonal.length, torsion: diagonal.flatMap(primaryParts).sort((a, b) => (a < b ? -1 : a > b ? 1 : 0)) };
}

const sparse = (m: number[][]): Map<number, number>[] => m.map((row) => new Map(row.flatMap((v, c) => (v === 0 ? [] : [[c, v] as [number, number]]))));

describe('Smith normal form over ℤ', () => {
  it('a textbook example: [[2, 4, 4], [−6, 6, 12], [10, −4, −16]] has invariant factors 2, 6, 12 (common practice; from memory)', () => {
    expect(smithOfDense([[2n, 4n, 4n], [-6n, 6n, 12n], [10n, -4n, -16n]])).toEqual([2n, 6n, 12n]);
    expect(group(diagonalForm(sparse([[2, 4, 4], [-6, 6, 12], [10, -4, -16]])))).toEqual({ rank: 3, torsion: [2n, 2n, 3n, 3n, 4n] });
  });
  it('recovers D from U·D·V for random unimodular U, V (the definition of equivalence over ℤ)', () => {
    const random = rng(1401);
    for (let trial = 0; trial < 200; trial++) {
      const rows = randomInt(random, 1, 7);
      const cols = randomInt(random, 1, 7);
      const diagonal = Array.from({ length: Math.min(rows, cols) }, () => [0, 1, 1, 2, 3, 4, 5, 6, 8, 9][randomInt(random, 0, 9)]!);
      let m = Array.from({ length: rows }, (_, r) => Array.from({ length: cols }, (_, c) => (r === c ? diagonal[r]! : 0)));
      for (let step = 0; step < 12; step++) {
        // Elementary row or column operation: add a multiple of one line to another.
        const k = randomInt(random, -2, 2);
        if (random() < 0.5 && rows > 1) {
          const [a, b] = [randomInt(random, 0, rows - 1), randomInt(random, 0, rows - 1)];
          if (a !== b) m = m.map((row, r) => (r === a ? row.map((v, c) => v + k * m[b]![c]!) : row));
        } else if (cols > 1) {
          const [a, b] = [randomInt(random, 0, cols - 1), randomInt(random, 0, cols - 1)];
          if (a !== b) m = m.map((row) => row.map((v, c) => (c === a ? v + k * row[b]! : v)));
        }
      }
      const expected = group(diagonal.filter((d) => d !== 0).map(BigInt));
      expect(group(diagonalForm(sparse(m)))).toEqual(expected);
      expect(group(smithOfDense(m.map((row) => row.map(BigInt))))).toEqual(expected);
    }
  });
  it('primary parts: ℤ/360 = ℤ/8 ⊕ ℤ/9 ⊕ ℤ/5 (the Chinese remainder theorem)', () => {
    expect(primaryParts(360n)).toEqual([8n, 9n, 5n]);
    expect(primaryParts(1n)).toEqual([]);
    expect(primaryParts(97n)).toEqual([97n]);
  });
});
