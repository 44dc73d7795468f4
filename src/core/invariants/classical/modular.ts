/**
 * Exact polynomial determinants by modular evaluation: det(t·A − B) for
 * sparse integer matrices A, B is computed modulo word-sized primes at many
 * points t, interpolated, and lifted by the Chinese remainder theorem until
 * the product of the primes exceeds twice a proven bound on the coefficients.
 *
 * Primes stay below 2^26 so that a product of two residues is below 2^52 and
 * exact in a double; no coefficient ever passes through a float.
 */
import { bandOrder, permute, SparseMatrixBuilder, type SparseMatrix } from './sparse-matrix.ts';
import { liftOneModulus, symmetricResidues } from '../chinese-remainder.ts';
import { checkTimeBudget } from '../../limits.ts';

const PRIME_CEILING = 1 << 26;

function isPrime(p: number): boolean {
  if (p < 2) return false;
  for (let d = 2; d * d <= p; d++) if (p % d === 0) return false;
  return true;
}

const primeCache: number[] = [];
/** The k-th prime below 2^26, counting down. */
function prime(k: number): number {
  let p = primeCache.length === 0 ? PRIME_CEILING : primeCache[primeCache.length - 1]!;
  while (primeCache.length <= k) {
    p--;
    while (!isPrime(p)) p--;
    primeCache.push(p);
  }
  return primeCache[k]!;
}

function mulMod(a: number, b: number, p: number): number {
  return (a * b) % p;
}

function powMod(base: number, exponent: number, p: number): number {
  let result = 1;
  let b = base % p;
  let e = exponent;
  while (e > 0) {
    if (e & 1) result = mulMod(result, b, p);
    b = mulMod(b, b, p);
    e = Math.floor(e / 2);
  }
  return result;
}

/** 1/a mod p by the extended Euclidean algorithm (a few dozen integer steps, all below p). */
function invMod(a: number, p: number): number {
  let [r0, r1] = [p, ((a % p) + p) % p];
  let [s0, s1] = [0, 1];
  while (r1 !== 0) {
    const q = Math.floor(r0 / r1);
    [r0, r1] = [r1, r0 - q * r1];
    [s0, s1] = [s1, s0 - q * s1];
  }
  if (r0 !== 1) throw new Error(`internal: ${a} has no inverse modulo ${p}`);
  return s0 < 0 ? s0 + p : s0;
}

function reduce(v: bigint, p: number): number {
  const r = Number(v % BigInt(p));
  return r < 0 ? r + p : r;
}

/**
 * A reusable banded eliminator: the pencil t·A − B in an order with lower
 * bandwidth `lower` and upper bandwidth `upper`, evaluated and reduced with
 * partial pivoting inside the band. Pivoting lets a row reach at most
 * lower + upper columns right of the diagonal, so each row is stored as the
 * `width` = 2·lower + upper + 1 columns from its diagonal − lower on: time and
 * memory per evaluation stay proportional to the band, not to size².
 */
class BandedPencil {
  private readonly size: number;
  private readonly entries: { i: number; j: number; a: number; b: number }[];
  private readonly lower: number;
  /** How far right of the diagonal a row can reach once rows have been swapped. */
  private readonly reach: number;
  private readonly width: number;
  /** Row i, column j at i·width + (j − i + lower). */
  private readonly work: Float64Array;
  /** The last column of each row that may be non-zero: rows are narrower than the widest one. */
  private readonly lastColumn: Int32Array;
  constructor(a: SparseMatrix, b: SparseMatrix, private readonly p: number) {
    this.size = a.size;
    const merged = new Map<number, { i: number; j: number; a: number; b: number }>();
    const put = (m: SparseMatrix, which: 'a' | 'b'): void =>
      m.rows.forEach((row, i) =>
        row.forEach((v, j) => {
          const key = i * this.size + j;
          const e = merged.get(key) ?? { i, j, a: 0, b: 0 };
          e[which] = reduce(v, p);
          merged.set(key, e);
        }),
      );
    put(a, 'a');
    put(b, 'b');
    this.entries = [...merged.values()];
    this.lower = this.entries.reduce((w, e) => Math.max(w, e.i - e.j), 0);
    this.reach = this.lower + this.entries.reduce((w, e) => Math.max(w, e.j - e.i), 0);
    this.width = this.lower + this.reach + 1;
    this.work = new Float64Array(this.size * this.width);
    this.lastColumn = new Int32Array(this.size);
  }

  determinantAt(t: number): number {
    const { size: n, p, work: m, lower, width, lastColumn } = this;
    m.fill(0);
    lastColumn.fill(-1);
    for (const e of this.entries) {
      m[e.i * width + e.j - e.i + lower] = (mulMod(t, e.a, p) - e.b + p) % p;
      if (e.j > lastColumn[e.i]!) lastColumn[e.i] = e.j;
    }
    // Offset of row i's column 0 in `work` (column j is at rowStart(i) + j).
    const rowStart = (i: number): number => i * width - i + lower;
    const inverseP = 1 / p;
    let det = 1;
    for (let k = 0; k < n; k++) {
      const rowLimit = Math.min(n - 1, k + lower);
      let pivotRow = -1;
      for (let i = k; i <= rowLimit; i++) {
        if (m[rowStart(i) + k] !== 0) {
          pivotRow = i;
          break;
        }
      }
      if (pivotRow < 0) return 0;
      const rk = rowStart(k);
      if (pivotRow !== k) {
        const rp = rowStart(pivotRow);
        const swapLimit = Math.max(lastColumn[k]!, lastColumn[pivotRow]!);
        for (let j = k; j <= swapLimit; j++) {
          const tmp = m[rk + j]!;
          m[rk + j] = m[rp + j]!;
          m[rp + j] = tmp;
        }
        const tmpLast = lastColumn[k]!;
        lastColumn[k] = lastColumn[pivotRow]!;
        lastColumn[pivotRow] = tmpLast;
        det = p - det;
      }
      const pivot = m[rk + k]!;
      det = mulMod(det, pivot, p);
      const inverse = invMod(pivot, p);
      const colLimit = lastColumn[k]!;
      for (let i = k + 1; i <= rowLimit; i++) {
        const ri = rowStart(i);
        const below = m[ri + k]!;
        if (below === 0) continue;
        const factor = mulMod(below, inverse, p);
        for (let j = k + 1; j <= colLimit; j++) {
          // |x| < 2^52 is exact; the quotient estimate x·(1/p) is off by at most one either way.
          const x = m[ri + j]! - factor * m[rk + j]!;
          let r = x - Math.floor(x * inverseP) * p;
          if (r < 0) r += p;
          else if (r >= p) r -= p;
          m[ri + j] = r;
        }
        m[ri + k] = 0;
        if (colLimit > lastColumn[i]!) lastColumn[i] = colLimit;
      }
    }
    return det % p;
  }
}

/**
 * inverses[m] = 1 / value(m) mod p for m < count, with one modular inversion
 * in all (Montgomery's trick: invert the product, then peel off the factors).
 */
function batchInverses(count: number, value: (m: number) => number, inverses: number[], p: number): void {
  let product = 1;
  for (let m = 0; m < count; m++) {
    inverses[m] = product; // the product of the values before m
    product = mulMod(product, value(m), p);
  }
  let inverse = invMod(product, p);
  for (let m = count - 1; m >= 0; m--) {
    const before = inverses[m]!;
    inverses[m] = mulMod(inverse, before, p);
    inverse = mulMod(inverse, value(m), p);
  }
}

/** Coefficients (ascending) of the polynomial of degree < xs.length through the points, modulo p (Newton form). */
function interpolate(xs: readonly number[], ys: readonly number[], p: number): number[] {
  const n = xs.length;
  const c = [...ys];
  const inverses = new Array<number>(n).fill(0);
  for (let k = 1; k < n; k++) {
    batchInverses(n - k, (m) => (xs[m + k]! - xs[m]! + p) % p, inverses, p);
    for (let i = n - 1; i >= k; i--) {
      const num = (c[i]! - c[i - 1]! + p) % p;
      c[i] = mulMod(num, inverses[i - k]!, p); // 1 / (xs[i] − xs[i − k])
    }
  }
  // Expand the Newton form into ordinary coefficients.
  const coeffs = new Array<number>(n).fill(0);
  for (let k = n - 1; k >= 0; k--) {
    // coeffs ← coeffs·(x − xs[k]) + c[k]
    for (let i = n - 1; i >= 1; i--) coeffs[i] = (coeffs[i - 1]! - mulMod(coeffs[i]!, xs[k]!, p) + p) % p;
    coeffs[0] = (c[k]! - mulMod(coeffs[0]!, xs[k]!, p) + p) % p;
  }
  return coeffs;
}

/**
 * A proven bound on the coefficients of det(t·A − B): each coefficient is at
 * most the maximum of |det| on the unit circle, which Hadamard's inequality
 * bounds by the product of the row norms there. Returned squared, exactly.
 */
export function squaredCoefficientBound(a: SparseMatrix, b: SparseMatrix): bigint {
  let bound = 1n;
  for (let i = 0; i < a.size; i++) {
    // |t·a_ij − b_ij|² summed over j ≤ Σ (a_ij² + b_ij²) + 2·|Σ a_ij b_ij| for |t| = 1.
    let squares = 0n;
    let cross = 0n;
    const rowA = a.rows[i]!;
    const rowB = b.rows[i]!;
    rowA.forEach((v, j) => {
      squares += v * v;
      cross += v * (rowB.get(j) ?? 0n);
    });
    rowB.forEach((v) => (squares += v * v));
    bound *= squares + 2n * (cross < 0n ? -cross : cross);
  }
  return bound;
}

export interface PencilDeterminant {
  /** Coefficients of det(t·A − B), ascending, degree ≤ size. */
  readonly coefficients: bigint[];
  readonly primes: number;
}

/**
 * det(t·A − B) exactly. When `reciprocal` is given (±1), the caller asserts
 * det(t⁻¹·A − B) = reciprocal · t^(−size) · det(t·A − B), which halves the
 * evaluations; the result is verified at a fresh prime and point either way.
 */
export function pencilDeterminant(a: SparseMatrix, b: SparseMatrix, reciprocal?: 1 | -1): PencilDeterminant {
  const n = a.size;
  const limit = 4n * squaredCoefficientBound(a, b); // need M² > 4·bound²
  let modulus = 1n;
  let lifted = new Array<bigint>(n + 1).fill(0n);
  let k = 0;
  while (modulus * modulus <= limit) {
    const p = prime(k++);
    lifted = liftOneModulus(lifted, modulus, coefficientsModPrime(a, b, p, reciprocal), p);
    modulus *= BigInt(p);
  }
  const coefficients = symmetricResidues(lifted, modulus);
  // Verification at a fresh prime and a point not used for interpolation.
  const p = prime(k);
  const t = 7919 % p;
  const direct = new BandedPencil(a, b, p).determinantAt(t);
  let value = 0;
  for (let i = coefficients.length - 1; i >= 0; i--) value = (mulMod(value, t, p) + reduce(coefficients[i]!, p)) % p;
  if (value !== direct) throw new Error('internal: modular determinant failed its verification');
  return { coefficients, primes: k };
}

function coefficientsModPrime(a: SparseMatrix, b: SparseMatrix, p: number, reciprocal?: 1 | -1): number[] {
  const n = a.size;
  const pencil = new BandedPencil(a, b, p);
  const xs: number[] = [];
  const ys: number[] = [];
  const used = new Set<number>();
  for (let t = 2; xs.length < n + 1; t++) {
    if (used.has(t)) continue;
    checkTimeBudget();
    const value = pencil.determinantAt(t);
    xs.push(t);
    ys.push(value);
    used.add(t);
    if (reciprocal !== undefined && xs.length < n + 1) {
      const inverse = invMod(t, p);
      if (!used.has(inverse)) {
        // det(t⁻¹A − B) = ± t^(−n) det(tA − B)
        const scaled = mulMod(value, powMod(inverse, n, p), p);
        xs.push(inverse);
        ys.push(reciprocal === 1 ? scaled : (p - scaled) % p);
        used.add(inverse);
      }
    }
  }
  return interpolate(xs, ys, p);
}

/**
 * det M for a square integer matrix, exactly: the banded elimination modulo
 * word-sized primes (in band order), lifted by the Chinese remainder theorem
 * past Hadamard's bound and verified at one more prime. Near-linear for the
 * narrow bands of planar diagrams, where the fraction-free elimination of
 * inertia.ts multiplies integers that grow to the size of the determinant.
 */
export function integerDeterminant(m: SparseMatrix): bigint {
  if (m.size === 0) return 1n;
  const ordered = permute(m, bandOrder(m));
  const zero = new SparseMatrixBuilder(m.size).build();
  // det(t·0 − B) = det(−B): the pencil with B = −M evaluates det M at any t.
  const negated = new SparseMatrixBuilder(m.size);
  ordered.rows.forEach((row, i) => row.forEach((v, j) => negated.add(i, j, -v)));
  const b = negated.build();
  const limit = 4n * squaredCoefficientBound(zero, b); // need product² > 4·bound²
  let product = 1n;
  let lifted: bigint = 0n;
  let k = 0;
  while (product * product <= limit) {
    checkTimeBudget();
    const p = prime(k++);
    [lifted] = liftOneModulus([lifted], product, [new BandedPencil(zero, b, p).determinantAt(0)], p);
    product *= BigInt(p);
  }
  const [determinant] = symmetricResidues([lifted], product) as [bigint];
  const check = prime(k);
  if (reduce(determinant, check) !== new BandedPencil(zero, b, check).determinantAt(0)) {
    throw new Error('internal: modular determinant failed its verification');
  }
  return determinant;
}
