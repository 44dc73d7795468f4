/**
 * Square integer matrices with few non-zero entries, as the classical
 * invariants produce them (Seifert and Goeritz matrices of planar diagrams),
 * and a bandwidth-reducing order for eliminating them.
 */

export interface SparseMatrix {
  readonly size: number;
  /** Row i as a map from column to the non-zero entry. */
  readonly rows: readonly ReadonlyMap<number, bigint>[];
}

export class SparseMatrixBuilder {
  private readonly rows: Map<number, bigint>[];
  constructor(readonly size: number) {
    this.rows = Array.from({ length: size }, () => new Map<number, bigint>());
  }
  add(i: number, j: number, value: bigint): void {
    if (value === 0n) return;
    const row = this.rows[i]!;
    const next = (row.get(j) ?? 0n) + value;
    if (next === 0n) row.delete(j);
    else row.set(j, next);
  }
  build(): SparseMatrix {
    return { size: this.size, rows: this.rows };
  }
}

export function transpose(m: SparseMatrix): SparseMatrix {
  const b = new SparseMatrixBuilder(m.size);
  m.rows.forEach((row, i) => row.forEach((v, j) => b.add(j, i, v)));
  return b.build();
}

/** a·A + b·B. */
export function combine(a: bigint, left: SparseMatrix, b: bigint, right: SparseMatrix): SparseMatrix {
  const out = new SparseMatrixBuilder(left.size);
  left.rows.forEach((row, i) => row.forEach((v, j) => out.add(i, j, a * v)));
  right.rows.forEach((row, i) => row.forEach((v, j) => out.add(i, j, b * v)));
  return out.build();
}

/** The dense form, for tests and small matrices. */
export function toDense(m: SparseMatrix): bigint[][] {
  const dense = Array.from({ length: m.size }, () => new Array<bigint>(m.size).fill(0n));
  m.rows.forEach((row, i) => row.forEach((v, j) => (dense[i]![j] = v)));
  return dense;
}

/**
 * Reverse Cuthill–McKee order of the symmetrised pattern: breadth-first from a
 * far-out vertex of each connected block, neighbours by increasing degree, then
 * reversed. Planar diagrams give matrices whose band in this order is narrow,
 * which is what keeps the eliminations below near-linear.
 */
export function bandOrder(m: SparseMatrix): number[] {
  const n = m.size;
  const neighbours: Set<number>[] = Array.from({ length: n }, () => new Set<number>());
  m.rows.forEach((row, i) =>
    row.forEach((_, j) => {
      if (i !== j) {
        neighbours[i]!.add(j);
        neighbours[j]!.add(i);
      }
    }),
  );
  const degree = neighbours.map((s) => s.size);
  const placed = new Uint8Array(n);
  const order: number[] = [];
  const bfs = (start: number): number[] => {
    const seen = new Map<number, number>([[start, 0]]);
    const queue = [start];
    for (let h = 0; h < queue.length; h++) {
      const v = queue[h]!;
      const next = [...neighbours[v]!].filter((w) => !seen.has(w) && !placed[w]).sort((a, b) => degree[a]! - degree[b]!);
      for (const w of next) {
        seen.set(w, seen.get(v)! + 1);
        queue.push(w);
      }
    }
    return queue;
  };
  for (let s = 0; s < n; s++) {
    if (placed[s]) continue;
    // A pseudo-peripheral start: the last vertex reached from s, searched twice.
    let start = s;
    for (let round = 0; round < 2; round++) {
      const reach = bfs(start);
      start = reach[reach.length - 1]!;
    }
    for (const v of bfs(start)) {
      placed[v] = 1;
      order.push(v);
    }
  }
  return order.reverse();
}

/** The matrix with rows and columns renumbered: new index k is old index order[k]. */
export function permute(m: SparseMatrix, order: readonly number[]): SparseMatrix {
  const position = new Array<number>(m.size);
  order.forEach((old, k) => (position[old] = k));
  const out = new SparseMatrixBuilder(m.size);
  m.rows.forEach((row, i) => row.forEach((v, j) => out.add(position[i]!, position[j]!, v)));
  return out.build();
}
