/**
 * Bigraded integral homology as the Khovanov engines report it, and the one
 * place where a finished complex of free abelian groups becomes homology.
 *
 * Indexing (the project's default): cohomological degree i (the differential
 * raises i by one) and quantum degree j, with the right-handed trefoil at
 * q + q³ + t²q⁵ + t³q⁹ and ℤ/2 torsion at (3, 7).
 */
import { diagonalForm } from './smith.ts';

export type RankEntry = readonly [i: number, j: number, rank: number];
/** `order` is the order of a cyclic summand ℤ/order (at least 2), `multiplicity` how many there are. */
export type TorsionEntry = readonly [i: number, j: number, order: number, multiplicity: number];

export interface KhovanovHomology {
  /** Ranks of the free part (the rational homology), sorted by i, then j; zero ranks omitted. */
  readonly ranks: readonly RankEntry[];
  /** Torsion of the integral homology, sorted by i, j, order. */
  readonly torsion: readonly TorsionEntry[];
}

const key = (h: number, q: number): string => `${h},${q}`;

/**
 * A complex of free abelian groups graded by (h, q) whose differential raises
 * h by one and keeps q. Generators are numbered within their bidegree.
 */
export class GradedComplex {
  private readonly dims = new Map<string, number>();
  /** For a source bidegree, the differential's rows: `rows[target][source] = entry`. */
  private readonly maps = new Map<string, Map<number, number>[]>();

  addGenerator(h: number, q: number): number {
    const k = key(h, q);
    const index = this.dims.get(k) ?? 0;
    this.dims.set(k, index + 1);
    return index;
  }

  /** Adds `value` to the entry from generator `source` in (h, q) to generator `target` in (h + 1, q). */
  addEntry(h: number, q: number, source: number, target: number, value: number): void {
    if (value === 0) return;
    const k = key(h, q);
    let rows = this.maps.get(k);
    if (!rows) this.maps.set(k, (rows = []));
    while (rows.length <= target) rows.push(new Map());
    const row = rows[target]!;
    const sum = (row.get(source) ?? 0) + value;
    if (!Number.isSafeInteger(sum)) throw new RangeError('Khovanov complex: an entry left the exact integer range');
    if (sum === 0) row.delete(source);
    else row.set(source, sum);
  }

  homology(): KhovanovHomology {
    const rankOf = new Map<string, number>();
    const torsion: TorsionEntry[] = [];
    for (const [k, rows] of this.maps) {
      const [h, q] = k.split(',').map(Number) as [number, number];
      const diagonal = diagonalForm(rows);
      rankOf.set(k, diagonal.length);
      const counts = new Map<bigint, number>();
      for (const d of diagonal) for (const part of primaryParts(d)) counts.set(part, (counts.get(part) ?? 0) + 1);
      for (const [order, multiplicity] of counts) {
        if (order > BigInt(Number.MAX_SAFE_INTEGER)) throw new RangeError(`Khovanov homology: torsion of order ${order} is beyond the reported range`);
        torsion.push([h + 1, q, Number(order), multiplicity]);
      }
    }
    const ranks: RankEntry[] = [];
    for (const [k, n] of this.dims) {
      const [h, q] = k.split(',').map(Number) as [number, number];
      const free = n - (rankOf.get(k) ?? 0) - (rankOf.get(key(h - 1, q)) ?? 0);
      if (free < 0) throw new Error('internal: negative Betti number; the differential does not square to zero');
      if (free > 0) ranks.push([h, q, free]);
    }
    return { ranks: sortEntries(ranks), torsion: sortEntries(torsion) };
  }
}

/**
 * ℤ/d as a sum of cyclic groups of prime-power order (ℤ/10 = ℤ/2 ⊕ ℤ/5), the
 * canonical form the torsion is reported in. Empty for d = 1.
 */
export function primaryParts(d: bigint): bigint[] {
  const parts: bigint[] = [];
  let rest = d < 0n ? -d : d;
  for (let p = 2n; p * p <= rest; p++) {
    if (p > 1n << 26n) throw new RangeError(`Khovanov homology: torsion of order ${d} is too large to factor`);
    let power = 1n;
    while (rest % p === 0n) {
      rest /= p;
      power *= p;
    }
    if (power > 1n) parts.push(power);
  }
  if (rest > 1n) parts.push(rest);
  return parts;
}

export function sortEntries<T extends readonly number[]>(entries: T[]): T[] {
  return entries.sort((a, b) => a[0]! - b[0]! || a[1]! - b[1]! || (a[2] ?? 0) - (b[2] ?? 0));
}

/** Kh of the crossingless unknot: ℤ at (0, ±1). */
export const UNKNOT_HOMOLOGY: KhovanovHomology = { ranks: [[0, -1, 1], [0, 1, 1]], torsion: [] };

/** The crossingless diagram of `circles` ≥ 1 round circles. */
export function unlinkHomology(circles: number): KhovanovHomology {
  if (circles < 1) throw new RangeError('the empty diagram has no Khovanov homology');
  return withUnknottedCircles(UNKNOT_HOMOLOGY, circles - 1);
}

/** Kh(D ⊔ O) = Kh(D) ⊗ Kh(O) with Kh(O) = ℤ at q = ±1, free over ℤ, so ranks and torsion both split in two. */
export function withUnknottedCircles(homology: KhovanovHomology, circles: number): KhovanovHomology {
  let result = homology;
  for (let k = 0; k < circles; k++) {
    const ranks = new Map<string, number>();
    for (const [i, j, r] of result.ranks) {
      for (const s of [1, -1]) ranks.set(key(i, j + s), (ranks.get(key(i, j + s)) ?? 0) + r);
    }
    const torsion = new Map<string, number>();
    for (const [i, j, o, m] of result.torsion) {
      for (const s of [1, -1]) {
        const tk = `${i},${j + s},${o}`;
        torsion.set(tk, (torsion.get(tk) ?? 0) + m);
      }
    }
    result = {
      ranks: sortEntries([...ranks].map(([k2, r]) => [...(k2.split(',').map(Number) as [number, number]), r] as const)),
      torsion: sortEntries([...torsion].map(([k2, m]) => [...(k2.split(',').map(Number) as [number, number, number]), m] as const)),
    };
  }
  return result;
}

/** The graded Euler characteristic Σ (−1)^i rank · q^j as exponent → coefficient. */
export function eulerCharacteristic(homology: KhovanovHomology): Map<number, number> {
  const chi = new Map<number, number>();
  for (const [i, j, r] of homology.ranks) {
    const v = (chi.get(j) ?? 0) + (i % 2 === 0 ? r : -r);
    if (v === 0) chi.delete(j);
    else chi.set(j, v);
  }
  return chi;
}
