/**
 * Rasmussen's invariant s over ℚ from Bar-Natan's deformation of Khovanov
 * homology (Frobenius algebra ℚ[h][X]/(X² − hX), h of quantum degree −2). Its
 * homology of a knot is ℚ[h] ⊕ ℚ[h] ⊕ (h-torsion), the free part generated
 * in homological degree 0 and quantum degrees s − 1 and s + 1 (Rasmussen,
 * Khovanov homology and the slice genus, Invent. Math. 182 (2010), defined via
 * Lee's deformation; the same s from Bar-Natan's: Mackaay, Turner, Vaz, A
 * remark on Rasmussen's invariant of knots, J. Knot Theory Ramifications 16
 * (2007)).
 *
 * The local algorithm (local.ts) gives the deformed complex of the diagram cut
 * open; closing it gives a complex of free graded ℚ[h]-modules whose entries
 * are c·h^k with k fixed by the degrees of their ends. Gaussian elimination in
 * order of increasing k splits it into pieces ℚ[h]{a} → ℚ[h]{b} (cancelled or
 * h-torsion) and leaves exactly the free generators; their degrees give s.
 */
import type { LinkDiagram } from '../../diagram/model.ts';
import { componentCount } from '../../diagram/model.ts';
import { arcComplex, type LocalOptions } from './local.ts';

/** An exact rational n/d with d > 0, in lowest terms. */
type Rational = readonly [n: bigint, d: bigint];

function gcd(a: bigint, b: bigint): bigint {
  a = a < 0n ? -a : a;
  b = b < 0n ? -b : b;
  while (b) [a, b] = [b, a % b];
  return a;
}

function normal(n: bigint, d: bigint): Rational {
  if (d < 0n) [n, d] = [-n, -d];
  const g = gcd(n, d);
  return g > 1n ? [n / g, d / g] : [n, d];
}

const sub = (a: Rational, b: Rational): Rational => normal(a[0] * b[1] - b[0] * a[1], a[1] * b[1]);
const mul = (a: Rational, b: Rational): Rational => normal(a[0] * b[0], a[1] * b[1]);
const div = (a: Rational, b: Rational): Rational => normal(a[0] * b[1], a[1] * b[0]);

interface Generator {
  readonly h: number;
  readonly q: number;
}

/**
 * The quantum degrees of the free generators, by homological degree, of a
 * complex of free graded ℚ[h]-modules given by its generators and its entries
 * (from, to, coefficient of h^k with k = (q_to − q_from)/2).
 */
export function freeGeneratorDegrees(generators: readonly Generator[], entries: readonly (readonly [number, number, bigint])[]): Map<number, number[]> {
  const out: Map<number, Rational>[] = generators.map(() => new Map());
  const inc: Set<number>[] = generators.map(() => new Set());
  const alive = new Uint8Array(generators.length).fill(1);
  const power = (from: number, to: number): number => (generators[to]!.q - generators[from]!.q) / 2;
  const buckets = new Map<number, [number, number][]>();
  const enqueue = (from: number, to: number): void => {
    const k = power(from, to);
    if (!Number.isInteger(k) || k < 0) throw new Error('internal: an entry of the deformed complex has a negative or fractional power of h');
    let bucket = buckets.get(k);
    if (!bucket) buckets.set(k, (bucket = []));
    bucket.push([from, to]);
  };
  const setEntry = (from: number, to: number, value: Rational): void => {
    if (value[0] === 0n) {
      out[from]!.delete(to);
      inc[to]!.delete(from);
    } else {
      if (!out[from]!.has(to)) enqueue(from, to);
      out[from]!.set(to, value);
      inc[to]!.add(from);
    }
  };
  for (const [from, to, c] of entries) {
    const sum = sub(out[from]!.get(to) ?? [0n, 1n], [-c, 1n]);
    setEntry(from, to, sum);
  }
  for (;;) {
    const levels = [...buckets.keys()].filter((k) => buckets.get(k)!.length > 0);
    if (levels.length === 0) break;
    const bucket = buckets.get(Math.min(...levels))!;
    const [x, y] = bucket.pop()!;
    if (!alive[x] || !alive[y]) continue;
    const p = out[x]!.get(y);
    if (!p) continue;
    const sources = [...inc[y]!].filter((s) => s !== x);
    const targets = [...out[x]!].filter(([t]) => t !== y);
    for (const s of sources) {
      const a = div(out[s]!.get(y)!, p);
      for (const [t, b] of targets) setEntry(s, t, sub(out[s]!.get(t) ?? [0n, 1n], mul(a, b)));
    }
    for (const g of [x, y]) {
      alive[g] = 0;
      for (const s of inc[g]!) out[s]!.delete(g);
      for (const t of out[g]!.keys()) inc[t]!.delete(g);
      out[g]!.clear();
      inc[g]!.clear();
    }
  }
  const free = new Map<number, number[]>();
  generators.forEach((g, i) => {
    if (!alive[i]) return;
    const list = free.get(g.h) ?? [];
    list.push(g.q);
    free.set(g.h, list.sort((u, v) => u - v));
  });
  return free;
}

/**
 * Rasmussen's s of a knot diagram, in the convention s(right-handed trefoil) = 2
 * (positive knots have s ≥ 0).
 */
export function rasmussenInvariant(d: LinkDiagram, options: LocalOptions = {}): number {
  if (componentCount(d) !== 1) throw new RangeError('Rasmussen\'s s is computed for knots only');
  if (d.crossings.length === 0) return 0;
  const arc = arcComplex(d, 'deformed', options);
  const shiftQ = arc.nPlus - 2 * arc.nMinus;
  const generators: Generator[] = [];
  for (const o of arc.objects) {
    generators.push({ h: o.h - arc.nMinus, q: o.s + 1 + shiftQ }, { h: o.h - arc.nMinus, q: o.s - 1 + shiftQ });
  }
  const entries: [number, number, bigint][] = [];
  for (const [from, to, plain, dotted] of arc.entries) {
    // Closing the arc: the plain disk is the identity on A; the dotted one multiplies by X (1 ↦ X, X ↦ hX).
    if (plain !== 0) entries.push([2 * from, 2 * to, BigInt(plain)], [2 * from + 1, 2 * to + 1, BigInt(plain)]);
    if (dotted !== 0) entries.push([2 * from, 2 * to + 1, BigInt(dotted)], [2 * from + 1, 2 * to + 1, BigInt(dotted)]);
  }
  const free = freeGeneratorDegrees(generators, entries);
  const inDegreeZero = free.get(0) ?? [];
  const total = [...free.values()].reduce((n, l) => n + l.length, 0);
  if (total !== 2 || inDegreeZero.length !== 2 || inDegreeZero[1]! - inDegreeZero[0]! !== 2) {
    throw new Error(`internal: the deformed homology of a knot has free generators ${JSON.stringify([...free])}, not two in degree 0 two apart`);
  }
  return inDegreeZero[0]! + 1;
}
