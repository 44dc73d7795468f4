/**
 * The inertia (numbers of positive, negative and zero eigenvalues) and the
 * absolute determinant of a symmetric integer matrix, exactly.
 *
 * Fraction-free symmetric elimination (Bareiss): after k pivots every active
 * entry is a (k+1)-minor, an integer, and the k-th pivot over the previous one
 * is the k-th entry of D in a congruence M ~ diag(D). Pivots are taken on the
 * diagonal in band order; a zero diagonal is replaced by a non-zero one of a
 * neighbour, or made non-zero by the congruence row_k += row_j, col_k += col_j;
 * a zero row is a zero eigenvalue. Rows that a pivot does not reach are scaled
 * lazily, so the work stays within the band.
 */
import { bandOrder, type SparseMatrix } from './sparse-matrix.ts';
import { checkTimeBudget } from '../../limits.ts';

export interface Inertia {
  readonly positive: number;
  readonly negative: number;
  readonly zero: number;
  /** |det M|, 0 when singular. */
  readonly absDeterminant: bigint;
}

export function symmetricInertia(matrix: SparseMatrix): Inertia {
  const n = matrix.size;
  const rows = matrix.rows.map((r) => new Map(r));
  rows.forEach((row, i) =>
    row.forEach((v, j) => {
      if ((matrix.rows[j]!.get(i) ?? 0n) !== v) throw new RangeError(`matrix is not symmetric at (${i}, ${j})`);
    }),
  );
  const pivots: bigint[] = [1n]; // pivots[s]: the pivot after s eliminations
  const stamp = new Int32Array(n); // rows are exact as of `stamp` eliminations
  const removed = new Uint8Array(n);
  const current = (i: number): Map<number, bigint> => {
    const row = rows[i]!;
    const s = stamp[i]!;
    const now = pivots.length - 1;
    if (s !== now) {
      const num = pivots[now]!;
      const den = pivots[s]!;
      for (const [j, v] of row) row.set(j, (v * num) / den);
      stamp[i] = now;
    }
    return row;
  };
  let positive = 0;
  let negative = 0;
  let zero = 0;
  const order = bandOrder(matrix);
  let pointer = 0;
  while (pointer < n) {
    const k = order[pointer]!;
    if (removed[k]) {
      pointer++;
      continue;
    }
    const rowK = current(k);
    let pivot = k;
    if ((rowK.get(k) ?? 0n) === 0n) {
      const neighbours = [...rowK.keys()].filter((j) => j !== k);
      const withDiagonal = neighbours.find((j) => (current(j).get(j) ?? 0n) !== 0n);
      if (withDiagonal !== undefined) pivot = withDiagonal;
      else if (neighbours.length > 0) addCongruent(k, neighbours[0]!, current);
      else {
        zero++;
        removed[k] = 1;
        pointer++;
        continue;
      }
    }
    checkTimeBudget();
    const rowP = current(pivot);
    const p = rowP.get(pivot)!;
    const previous = pivots[pivots.length - 1]!;
    if ((p > 0n) === (previous > 0n)) positive++;
    else negative++;
    for (const [i, below] of rowP) {
      if (i === pivot) continue;
      const rowI = current(i);
      for (const [j, v] of rowI) rowI.set(j, (p * v - below * (rowP.get(j) ?? 0n)) / previous);
      for (const [j, above] of rowP) {
        if (j !== pivot && !rowI.has(j)) rowI.set(j, (-below * above) / previous);
      }
      rowI.delete(pivot);
      for (const [j, v] of rowI) if (v === 0n) rowI.delete(j);
      stamp[i] = pivots.length; // exact as of the elimination being recorded now
    }
    pivots.push(p);
    removed[pivot] = 1;
    rowP.clear();
    if (pivot === k) pointer++;
  }
  const last = pivots[pivots.length - 1]!;
  return { positive, negative, zero, absDeterminant: zero > 0 ? 0n : last < 0n ? -last : last };
}

/** The congruence row_k += row_j, col_k += col_j on the active rows (all brought up to date first). */
function addCongruent(k: number, j: number, current: (i: number) => Map<number, bigint>): void {
  const rowK = current(k);
  const rowJ = current(j);
  const touched = new Set<number>([...rowK.keys(), ...rowJ.keys()]);
  touched.delete(k);
  const akj = rowK.get(j) ?? 0n;
  const ajj = rowJ.get(j) ?? 0n;
  const akk = rowK.get(k) ?? 0n;
  for (const i of touched) {
    const rowI = current(i);
    const value = (rowI.get(k) ?? 0n) + (rowI.get(j) ?? 0n);
    if (value === 0n) {
      rowI.delete(k);
      rowK.delete(i);
    } else {
      rowI.set(k, value);
      rowK.set(i, value);
    }
  }
  rowK.set(k, akk + 2n * akj + ajj);
}
