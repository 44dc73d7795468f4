/**
 * Independent oracles for the classical-invariant tests: a plain exact
 * determinant over Laurent polynomials (fraction-free elimination), and the
 * Alexander polynomial by Fox calculus on the Wirtinger presentation.
 */
import type { LinkDiagram } from '../../src/core/diagram/model.ts';
import { Laurent } from '../../src/core/poly/laurent.ts';

/** det of a square matrix of Laurent polynomials by Bareiss elimination with row swaps. */
export function laurentDeterminant(matrix: readonly (readonly Laurent[])[]): Laurent {
  const n = matrix.length;
  if (n === 0) return Laurent.one;
  const a = matrix.map((row) => [...row]);
  let previous = Laurent.one;
  let negate = false;
  for (let k = 0; k < n - 1; k++) {
    if (a[k]![k]!.isZero) {
      let s = k + 1;
      while (s < n && a[s]![k]!.isZero) s++;
      if (s === n) return Laurent.zero;
      [a[k], a[s]] = [a[s]!, a[k]!];
      negate = !negate;
    }
    for (let i = k + 1; i < n; i++) {
      for (let j = k + 1; j < n; j++) {
        a[i]![j] = a[k]![k]!.mul(a[i]![j]!).sub(a[i]![k]!.mul(a[k]![j]!)).divExact(previous);
      }
    }
    previous = a[k]![k]!;
  }
  const det = a[n - 1]![n - 1]!;
  return negate ? det.neg() : det;
}

/**
 * Δ of a knot diagram up to a unit ±t^k: the Wirtinger arcs (maximal runs
 * between undercrossings) are the generators, each crossing gives the Fox
 * derivative row (1 − t) over, t incoming under, −1 outgoing under (sign +1;
 * the two under entries swap for sign −1), and any (n−1)-minor is Δ.
 */
export function foxAlexander(d: LinkDiagram): Laurent {
  const n = d.crossings.length;
  // An arc continues through a crossing where its edge passes over.
  const parent = Array.from({ length: d.edgeCount }, (_, e) => e);
  const find = (e: number): number => (parent[e] === e ? e : (parent[e] = find(parent[e]!)));
  d.crossings.forEach((c) => {
    parent[find(c.edges[1])] = find(c.edges[3]);
  });
  const arcIds = new Map<number, number>();
  for (let e = 0; e < d.edgeCount; e++) if (!arcIds.has(find(e))) arcIds.set(find(e), arcIds.size);
  const arc = (e: number): number => arcIds.get(find(e))!;
  const t = Laurent.monomial(1);
  const rows = d.crossings.map((c) => {
    const row = new Array<Laurent>(arcIds.size).fill(Laurent.zero);
    const add = (k: number, v: Laurent): void => {
      row[k] = row[k]!.add(v);
    };
    add(arc(c.edges[1]), Laurent.one.sub(t));
    add(arc(c.edges[0]), c.sign === 1 ? t : Laurent.constant(-1));
    add(arc(c.edges[2]), c.sign === 1 ? Laurent.constant(-1) : t);
    return row;
  });
  const minor = rows.slice(1).map((row) => row.slice(1));
  if (arcIds.size !== n) throw new Error('a knot diagram with n crossings has n arcs');
  return laurentDeterminant(minor);
}

/** True when a = ±t^k·b for some k. */
export function equalUpToUnit(a: Laurent, b: Laurent): boolean {
  if (a.isZero || b.isZero) return a.isZero && b.isZero;
  const shift = b.minDegree! - a.minDegree!;
  return a.shift(shift).equals(b) || a.shift(shift).neg().equals(b);
}
