/**
 * Exact Laurent polynomials in two variables x, y with integer exponents and
 * BigInt coefficients: the ring of the HOMFLY-PT (v, z) and Kauffman (a, z)
 * polynomials. Terms are kept in a map keyed by one packed number, so sums and
 * products never sort until terms are asked for.
 */
import { Laurent } from './laurent.ts';

export type Term2 = readonly [xExponent: number, yExponent: number, coefficient: bigint];

/** Exponents must lie in (−2^20, 2^20); packed as (x + OFFSET)·SPAN + (y + OFFSET), exact in a double. */
const OFFSET = 2 ** 20;
const SPAN = 2 ** 21;

function pack(x: number, y: number): number {
  if (!Number.isInteger(x) || !Number.isInteger(y) || Math.abs(x) >= OFFSET || Math.abs(y) >= OFFSET) {
    throw new RangeError(`exponents (${x}, ${y}) must be integers below 2^20 in size`);
  }
  return (x + OFFSET) * SPAN + (y + OFFSET);
}

function unpackX(key: number): number {
  return Math.floor(key / SPAN) - OFFSET;
}

function unpackY(key: number): number {
  return (key % SPAN) - OFFSET;
}

export class Laurent2 {
  private constructor(private readonly map: ReadonlyMap<number, bigint>) {}

  static readonly zero = new Laurent2(new Map());
  static readonly one = Laurent2.monomial(0, 0, 1n);

  static monomial(x: number, y: number, coefficient: bigint | number = 1n): Laurent2 {
    const c = BigInt(coefficient);
    return new Laurent2(c === 0n ? new Map() : new Map([[pack(x, y), c]]));
  }

  /** Equal exponent pairs are summed and zero terms dropped. */
  static fromTerms(terms: Iterable<readonly [number, number, bigint | number]>): Laurent2 {
    const map = new Map<number, bigint>();
    for (const [x, y, c] of terms) addInto(map, pack(x, y), BigInt(c));
    return new Laurent2(map);
  }

  get isZero(): boolean {
    return this.map.size === 0;
  }

  get termCount(): number {
    return this.map.size;
  }

  /** Terms sorted by x exponent, then y exponent. */
  terms(): Term2[] {
    return [...this.map.keys()].sort((a, b) => a - b).map((k) => [unpackX(k), unpackY(k), this.map.get(k)!] as const);
  }

  coefficient(x: number, y: number): bigint {
    return this.map.get(pack(x, y)) ?? 0n;
  }

  add(other: Laurent2): Laurent2 {
    const map = new Map(this.map);
    for (const [k, c] of other.map) addInto(map, k, c);
    return new Laurent2(map);
  }

  sub(other: Laurent2): Laurent2 {
    return this.add(other.neg());
  }

  neg(): Laurent2 {
    return this.scale(-1n);
  }

  scale(k: bigint): Laurent2 {
    if (k === 0n) return Laurent2.zero;
    const map = new Map<number, bigint>();
    for (const [key, c] of this.map) map.set(key, c * k);
    return new Laurent2(map);
  }

  /** Multiplies by x^dx y^dy. */
  shift(dx: number, dy: number): Laurent2 {
    const map = new Map<number, bigint>();
    for (const [key, c] of this.map) map.set(pack(unpackX(key) + dx, unpackY(key) + dy), c);
    return new Laurent2(map);
  }

  mul(other: Laurent2): Laurent2 {
    const map = new Map<number, bigint>();
    const zeroKey = pack(0, 0);
    for (const [k1, c1] of this.map) {
      for (const [k2, c2] of other.map) addInto(map, k1 + k2 - zeroKey, c1 * c2);
    }
    return new Laurent2(map);
  }

  pow(n: number): Laurent2 {
    if (!Number.isInteger(n) || n < 0) throw new RangeError(`power ${n} must be a natural number`);
    let result: Laurent2 = Laurent2.one;
    for (let i = 0; i < n; i++) result = result.mul(this);
    return result;
  }

  equals(other: Laurent2): boolean {
    if (this.map.size !== other.map.size) return false;
    for (const [k, c] of this.map) if (other.map.get(k) !== c) return false;
    return true;
  }

  /** Substitutes x ↦ x^px·y^qx and y ↦ x^py·y^qy (a monomial change of variables, e.g. x ↦ x⁻¹ for a mirror). */
  substituteMonomials(px: number, qx: number, py: number, qy: number): Laurent2 {
    return Laurent2.fromTerms(this.terms().map(([x, y, c]) => [px * x + py * y, qx * x + qy * y, c] as const));
  }

  /** Multiplies the coefficient of x^i y^j by (−1)^(si·i + sj·j). */
  alternateSigns(si: number, sj: number): Laurent2 {
    return Laurent2.fromTerms(this.terms().map(([x, y, c]) => [x, y, (si * x + sj * y) % 2 === 0 ? c : -c] as const));
  }

  /** Lowest and highest x exponent; undefined for zero. */
  xRange(): [number, number] | undefined {
    return this.range(unpackX);
  }

  yRange(): [number, number] | undefined {
    return this.range(unpackY);
  }

  private range(part: (key: number) => number): [number, number] | undefined {
    if (this.isZero) return undefined;
    let lo = Infinity;
    let hi = -Infinity;
    for (const k of this.map.keys()) {
      const e = part(k);
      if (e < lo) lo = e;
      if (e > hi) hi = e;
    }
    return [lo, hi];
  }

  /** The coefficient of y^j as a Laurent polynomial in x. */
  yCoefficient(j: number): Laurent {
    return Laurent.fromTerms(this.terms().filter(([, y]) => y === j).map(([x, , c]) => [x, c] as const));
  }

  /**
   * Evaluates at x = X, y = Y for one-variable Laurent polynomials X and Y in a
   * common variable; Y may be inverted only when it is a monomial.
   */
  evaluate(x: Laurent, y: Laurent): Laurent {
    const powers = (base: Laurent, e: number): Laurent => {
      if (e >= 0) return base.pow(e);
      if (base.termCount !== 1 || (base.coefficients[0] !== 1n && base.coefficients[0] !== -1n)) {
        throw new RangeError('a negative power needs a unit monomial');
      }
      const inverse = Laurent.monomial(-base.exponents[0]!, base.coefficients[0]!);
      return inverse.pow(-e);
    };
    let total = Laurent.zero;
    for (const [i, j, c] of this.terms()) total = total.add(powers(x, i).mul(powers(y, j)).scale(c));
    return total;
  }

  /** A plain text form, e.g. `2v^2 - v^4 + v^2z^2`, terms by ascending y then x. */
  toPlainString(xName: string, yName: string): string {
    if (this.isZero) return '0';
    const terms = this.terms().sort((a, b) => a[1] - b[1] || a[0] - b[0]);
    return terms
      .map(([x, y, c], i) => {
        const negative = c < 0n;
        const abs = negative ? -c : c;
        const sign = i === 0 ? (negative ? '-' : '') : negative ? ' - ' : ' + ';
        const power = (name: string, e: number): string => (e === 0 ? '' : e === 1 ? name : `${name}^${e < 0 ? `(${e})` : e}`);
        const monomial = power(xName, x) + power(yName, y);
        return sign + (abs === 1n && monomial !== '' ? '' : abs.toString()) + monomial;
      })
      .join('');
  }

  /** Internal access for the engines' in-place accumulation. */
  entries(): IterableIterator<[number, bigint]> {
    return this.map.entries();
  }

  static fromPackedMap(map: Map<number, bigint>): Laurent2 {
    for (const [k, c] of map) if (c === 0n) map.delete(k);
    return new Laurent2(map);
  }
}

function addInto(map: Map<number, bigint>, key: number, c: bigint): void {
  const sum = (map.get(key) ?? 0n) + c;
  if (sum === 0n) map.delete(key);
  else map.set(key, sum);
}

/** The packed key of x^0 y^0: adding two packed keys and subtracting it multiplies monomials. */
export const PACKED_ONE = pack(0, 0);

/** In place: target += source · factor (both as packed maps). */
export function addProductInto(target: Map<number, bigint>, source: Laurent2, factor: Laurent2): void {
  for (const [k1, c1] of source.entries()) {
    for (const [k2, c2] of factor.entries()) {
      const key = k1 + k2 - PACKED_ONE;
      const sum = (target.get(key) ?? 0n) + c1 * c2;
      if (sum === 0n) target.delete(key);
      else target.set(key, sum);
    }
  }
}

/**
 * Exact division: the Q with Q·divisor = dividend. Long division by leading
 * terms in the lexicographic order (x exponent, then y), a total order that
 * multiplication respects: the dividend is laid out densely and scanned once
 * from its highest term down, each nonzero term fixing one term of Q. Throws
 * when the division leaves a remainder.
 */
export function divideExactly(dividend: Laurent2, divisor: Laurent2): Laurent2 {
  if (divisor.isZero) throw new RangeError('division by the zero polynomial');
  if (dividend.isZero) return Laurent2.zero;
  const [xLo, xHi] = dividend.xRange()!;
  const [yLo, yHi] = dividend.yRange()!;
  const divisorTerms = divisor.terms();
  const [leadX, leadY, leadCoefficient] = divisorTerms[divisorTerms.length - 1]!;
  const width = yHi - yLo + 1;
  const rest: bigint[] = new Array((xHi - xLo + 1) * width).fill(0n);
  for (const [x, y, c] of dividend.terms()) rest[(x - xLo) * width + (y - yLo)] = c;
  const quotient: [number, number, bigint][] = [];
  for (let x = xHi; x >= xLo; x--) {
    for (let y = yHi; y >= yLo; y--) {
      const c = rest[(x - xLo) * width + (y - yLo)]!;
      if (c === 0n) continue;
      if (c % leadCoefficient !== 0n) throw new RangeError('division is not exact');
      const factor = c / leadCoefficient;
      const qx = x - leadX;
      const qy = y - leadY;
      quotient.push([qx, qy, factor]);
      for (const [dx, dy, d] of divisorTerms) {
        const tx = qx + dx;
        const ty = qy + dy;
        if (tx < xLo || tx > xHi || ty < yLo || ty > yHi) throw new RangeError('division is not exact');
        rest[(tx - xLo) * width + (ty - yLo)]! -= factor * d;
      }
    }
  }
  return Laurent2.fromTerms(quotient);
}
