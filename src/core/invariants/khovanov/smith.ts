/**
 * A diagonal form of an integer matrix (the nonzero diagonal entries of a
 * matrix equivalent to it over ℤ, as positive BigInts), as the Khovanov engines
 * need it: its length is the rank, and the cokernel's torsion is the sum of the
 * cyclic groups ℤ/dᵢ (not necessarily with d₁ | d₂ | …; see primaryParts).
 *
 * Two phases. Khovanov differentials are sparse and most pivots either are ±1
 * or divide their whole row and column (2·identity pieces, say), so first
 * every such entry is used as a pivot on sparse rows with number entries (each
 * step checks that its results stay safe integers, and leaves the pivot to the
 * exact phase otherwise). What is left, usually a small block, goes through
 * the classical dense Smith reduction with BigInt entries.
 */
export function diagonalForm(rowsIn: readonly ReadonlyMap<number, number>[]): bigint[] {
  const rows: Map<number, number>[] = rowsIn.map((r) => new Map([...r].filter(([, v]) => v !== 0)));
  const columns = new Map<number, Set<number>>();
  rows.forEach((row, r) => {
    for (const c of row.keys()) {
      let set = columns.get(c);
      if (!set) columns.set(c, (set = new Set()));
      set.add(r);
    }
  });
  const pivots = dividingPivotPhase(rows, columns);
  for (const d of denseSmith(rows.filter((row) => row.size > 0))) pivots.push(d);
  return pivots;
}

/**
 * Eliminates pivots that divide their whole row and column, in passes over the
 * rows (in each row such an entry with the shortest column, to limit fill-in)
 * until a pass finds none; returns the pivots. Leaves the rest in `rows`.
 */
function dividingPivotPhase(rows: Map<number, number>[], columns: Map<number, Set<number>>): bigint[] {
  const pivots: bigint[] = [];
  for (let progress = true; progress; ) {
    progress = false;
    for (let r = 0; r < rows.length; r++) {
      const row = rows[r]!;
      if (row.size === 0) continue;
      let bestColumn = -1;
      let bestSize = Infinity;
      let rowDivisor = 0;
      for (const v of row.values()) rowDivisor = gcd(rowDivisor, v);
      for (const [c, v] of row) {
        if (Math.abs(v) !== rowDivisor) continue;
        const column = columns.get(c)!;
        if (column.size >= bestSize) continue;
        let divides = true;
        if (rowDivisor !== 1) for (const o of column) if (rows[o]!.get(c)! % v !== 0) divides = false;
        if (divides) {
          bestSize = column.size;
          bestColumn = c;
        }
      }
      if (bestColumn >= 0) {
        const pivot = row.get(bestColumn)!;
        if (eliminatePivot(rows, columns, r, bestColumn)) {
          pivots.push(BigInt(Math.abs(pivot)));
          progress = true;
        }
      }
    }
  }
  return pivots;
}

function gcd(a: number, b: number): number {
  a = Math.abs(a);
  b = Math.abs(b);
  while (b) [a, b] = [b, a % b];
  return a;
}

/**
 * Clears column `c` with the pivot at (r, c), which divides its row and
 * column, then drops row r (the column operations that would clear the rest
 * of row r change nothing else).
 * Returns false, changing nothing, if some entry would leave the safe range.
 */
function eliminatePivot(rows: Map<number, number>[], columns: Map<number, Set<number>>, r: number, c: number): boolean {
  const pivotRow = rows[r]!;
  const pivot = pivotRow.get(c)!;
  const others = [...columns.get(c)!].filter((x) => x !== r);
  for (const o of others) {
    const factor = rows[o]!.get(c)! / pivot;
    for (const [k, v] of pivotRow) {
      const updated = (rows[o]!.get(k) ?? 0) - factor * v;
      if (!Number.isSafeInteger(updated) || !Number.isSafeInteger(factor * v)) return false;
    }
  }
  for (const o of others) {
    const row = rows[o]!;
    const factor = row.get(c)! / pivot;
    for (const [k, v] of pivotRow) {
      const updated = (row.get(k) ?? 0) - factor * v;
      if (updated === 0) {
        row.delete(k);
        columns.get(k)!.delete(o);
      } else {
        if (!row.has(k)) columns.get(k)!.add(o);
        row.set(k, updated);
      }
    }
  }
  for (const k of pivotRow.keys()) columns.get(k)!.delete(r);
  pivotRow.clear();
  return true;
}

/** The classical Smith reduction on a dense BigInt copy; returns the positive invariant factors. */
function denseSmith(sparse: readonly Map<number, number>[]): bigint[] {
  if (sparse.length === 0) return [];
  const columnIds = [...new Set(sparse.flatMap((row) => [...row.keys()]))];
  const columnIndex = new Map(columnIds.map((c, i) => [c, i]));
  const m = sparse.map((row) => {
    const dense: bigint[] = new Array<bigint>(columnIds.length).fill(0n);
    for (const [c, v] of row) dense[columnIndex.get(c)!] = BigInt(v);
    return dense;
  });
  return smithOfDense(m);
}

const abs = (x: bigint): bigint => (x < 0n ? -x : x);

/** Invariant factors of a dense BigInt matrix (modified in place). */
export function smithOfDense(m: bigint[][]): bigint[] {
  const rowCount = m.length;
  const colCount = rowCount === 0 ? 0 : m[0]!.length;
  const diagonal: bigint[] = [];
  let t = 0;
  while (t < rowCount && t < colCount) {
    // The smallest nonzero entry of the remaining block becomes the pivot.
    let pr = -1;
    let pc = -1;
    for (let r = t; r < rowCount; r++) {
      for (let c = t; c < colCount; c++) {
        const v = m[r]![c]!;
        if (v !== 0n && (pr < 0 || abs(v) < abs(m[pr]![pc]!))) {
          pr = r;
          pc = c;
        }
      }
    }
    if (pr < 0) break;
    [m[t], m[pr]] = [m[pr]!, m[t]!];
    for (const row of m) [row[t], row[pc]] = [row[pc]!, row[t]!];
    let settled = false;
    while (!settled) {
      settled = true;
      const p = m[t]![t]!;
      for (let r = t + 1; r < rowCount; r++) {
        const q = m[r]![t]! / p;
        if (q !== 0n) for (let c = t; c < colCount; c++) m[r]![c]! -= q * m[t]![c]!;
        if (m[r]![t] !== 0n) settled = false;
      }
      for (let c = t + 1; c < colCount; c++) {
        const q = m[t]![c]! / p;
        if (q !== 0n) for (let r = t; r < rowCount; r++) m[r]![c]! -= q * m[r]![t]!;
        if (m[t]![c] !== 0n) settled = false;
      }
      if (!settled) {
        // A remainder smaller than the pivot: move it to the pivot place and repeat.
        let br = t;
        let bc = t;
        for (let r = t; r < rowCount; r++) if (m[r]![t] !== 0n && abs(m[r]![t]!) < abs(m[br]![bc]!)) [br, bc] = [r, t];
        for (let c = t; c < colCount; c++) if (m[t]![c] !== 0n && abs(m[t]![c]!) < abs(m[br]![bc]!)) [br, bc] = [t, c];
        [m[t], m[br]] = [m[br]!, m[t]!];
        for (const row of m) [row[t], row[bc]] = [row[bc]!, row[t]!];
        continue;
      }
      // The pivot must divide every remaining entry; otherwise add that row and redo.
      const pivot = m[t]![t]!;
      outer: for (let r = t + 1; r < rowCount; r++) {
        for (let c = t + 1; c < colCount; c++) {
          if (m[r]![c]! % pivot !== 0n) {
            for (let k = t; k < colCount; k++) m[t]![k]! += m[r]![k]!;
            settled = false;
            break outer;
          }
        }
      }
    }
    diagonal.push(abs(m[t]![t]!));
    t++;
  }
  return diagonal;
}
