/**
 * Exact Laurent polynomials in one variable with BigInt coefficients.
 *
 * Exponents are JavaScript numbers restricted to multiples of 1/4: such
 * dyadic fractions are represented exactly in binary floating point and their
 * sums and integer multiples stay exact, which is all the Jones polynomial
 * (half-integer powers of t) and the bracket substitutions need. Coefficients
 * are always BigInt, never floats.
 */

export type Term = readonly [exponent: number, coefficient: bigint];

const EXPONENT_QUANTUM = 4;

/** True when `e` is a finite multiple of 1/4 (the exponents this type admits). */
export function isQuarterInteger(e: number): boolean {
  return Number.isFinite(e) && Number.isInteger(e * EXPONENT_QUANTUM);
}

export class Laurent {
  /** Ascending exponents, no zero coefficients, no repeats. */
  readonly exponents: readonly number[];
  readonly coefficients: readonly bigint[];

  private constructor(exponents: number[], coefficients: bigint[]) {
    this.exponents = exponents;
    this.coefficients = coefficients;
  }

  static readonly zero = new Laurent([], []);
  static readonly one = new Laurent([0], [1n]);

  /** Builds from terms in any order; equal exponents are summed, zeros dropped. */
  static fromTerms(terms: Iterable<readonly [number, bigint | number]>): Laurent {
    const sums = new Map<number, bigint>();
    for (const [e, c] of terms) {
      if (!isQuarterInteger(e)) throw new RangeError(`exponent ${e} is not a multiple of 1/4`);
      const key = e === 0 ? 0 : e; // fold -0 into 0
      sums.set(key, (sums.get(key) ?? 0n) + BigInt(c));
    }
    const exps = [...sums.keys()].filter((e) => sums.get(e) !== 0n).sort((a, b) => a - b);
    return new Laurent(exps, exps.map((e) => sums.get(e)!));
  }

  static monomial(exponent: number, coefficient: bigint | number = 1n): Laurent {
    return Laurent.fromTerms([[exponent, coefficient]]);
  }

  static constant(c: bigint | number): Laurent {
    return Laurent.fromTerms([[0, c]]);
  }

  /**
   * From a dense coefficient array: coefficient `dense[i]` belongs to exponent
   * `offset + i * step`. Used by the engines, which work on dense arrays.
   */
  static fromDense(dense: readonly bigint[], offset: number, step = 1): Laurent {
    const exps: number[] = [];
    const coeffs: bigint[] = [];
    for (let i = 0; i < dense.length; i++) {
      if (dense[i] !== 0n) {
        const e = offset + i * step;
        exps.push(e === 0 ? 0 : e);
        coeffs.push(dense[i]!);
      }
    }
    return new Laurent(exps, coeffs);
  }

  get isZero(): boolean {
    return this.exponents.length === 0;
  }

  get termCount(): number {
    return this.exponents.length;
  }

  /** Terms in ascending order of exponent. */
  terms(): Term[] {
    return this.exponents.map((e, i) => [e, this.coefficients[i]!] as const);
  }

  coefficient(exponent: number): bigint {
    const i = this.exponents.indexOf(exponent);
    return i < 0 ? 0n : this.coefficients[i]!;
  }

  /** Lowest exponent; undefined for the zero polynomial. */
  get minDegree(): number | undefined {
    return this.exponents[0];
  }

  /** Highest exponent; undefined for the zero polynomial. */
  get maxDegree(): number | undefined {
    return this.exponents[this.exponents.length - 1];
  }

  /** maxDegree − minDegree; 0 for the zero polynomial. */
  get span(): number {
    return this.isZero ? 0 : this.maxDegree! - this.minDegree!;
  }

  add(other: Laurent): Laurent {
    return Laurent.fromTerms([...this.terms(), ...other.terms()]);
  }

  sub(other: Laurent): Laurent {
    return this.add(other.neg());
  }

  neg(): Laurent {
    return new Laurent([...this.exponents], this.coefficients.map((c) => -c));
  }

  scale(k: bigint): Laurent {
    if (k === 0n) return Laurent.zero;
    return new Laurent([...this.exponents], this.coefficients.map((c) => c * k));
  }

  /** Multiplies by x^k. */
  shift(k: number): Laurent {
    if (!isQuarterInteger(k)) throw new RangeError(`shift ${k} is not a multiple of 1/4`);
    return new Laurent(this.exponents.map((e) => (e + k === 0 ? 0 : e + k)), [...this.coefficients]);
  }

  mul(other: Laurent): Laurent {
    if (this.isZero || other.isZero) return Laurent.zero;
    const terms: [number, bigint][] = [];
    for (let i = 0; i < this.exponents.length; i++) {
      for (let j = 0; j < other.exponents.length; j++) {
        terms.push([this.exponents[i]! + other.exponents[j]!, this.coefficients[i]! * other.coefficients[j]!]);
      }
    }
    return Laurent.fromTerms(terms);
  }

  pow(n: number): Laurent {
    if (!Number.isInteger(n) || n < 0) throw new RangeError(`power ${n} must be a natural number`);
    let result: Laurent = Laurent.one;
    let base: Laurent = this;
    let k = n;
    while (k > 0) {
      if (k & 1) result = result.mul(base);
      base = base.mul(base);
      k >>= 1;
    }
    return result;
  }

  /**
   * Substitutes x ↦ x^factor (factor a non-zero multiple of 1/4, e.g. −1 for
   * the mirror t ↦ t⁻¹, or 2 for t = q²). Throws if an exponent leaves the
   * quarter-integer lattice.
   */
  substitutePower(factor: number): Laurent {
    return Laurent.fromTerms(this.terms().map(([e, c]) => [e * factor, c] as const));
  }

  /** Multiplies each coefficient of x^e by (−1)^(e·k); e·k must be an integer. */
  alternateSigns(k: number): Laurent {
    return Laurent.fromTerms(
      this.terms().map(([e, c]) => {
        const p = e * k;
        if (!Number.isInteger(p)) throw new RangeError(`sign twist needs integer e·k, got ${p}`);
        return [e, p % 2 === 0 ? c : -c] as const;
      }),
    );
  }

  equals(other: Laurent): boolean {
    if (this.exponents.length !== other.exponents.length) return false;
    for (let i = 0; i < this.exponents.length; i++) {
      if (this.exponents[i] !== other.exponents[i] || this.coefficients[i] !== other.coefficients[i]) return false;
    }
    return true;
  }

  /** Sum of coefficients: the value at x = 1. */
  valueAtOne(): bigint {
    return this.coefficients.reduce((s, c) => s + c, 0n);
  }

  /**
   * Exact division by `divisor`. Throws when the division leaves a remainder:
   * callers use it only where the quotient is known to be a Laurent polynomial.
   */
  divExact(divisor: Laurent): Laurent {
    if (divisor.isZero) throw new RangeError('division by the zero polynomial');
    if (this.isZero) return Laurent.zero;
    const lead = divisor.maxDegree!;
    const leadCoeff = divisor.coefficients[divisor.coefficients.length - 1]!;
    let rest: Laurent = this;
    const quotient: [number, bigint][] = [];
    const stop = this.minDegree! - divisor.minDegree!;
    while (!rest.isZero) {
      const e = rest.maxDegree! - lead;
      const c = rest.coefficients[rest.coefficients.length - 1]!;
      if (e < stop || c % leadCoeff !== 0n) throw new RangeError('division is not exact');
      const q = c / leadCoeff;
      quotient.push([e, q]);
      rest = rest.sub(divisor.shift(e).scale(q));
    }
    return Laurent.fromTerms(quotient);
  }

  /** A plain, unambiguous text form, e.g. `-t^(1/2) - t^(5/2)`; for logs and plain CLI output. */
  toPlainString(variable: string, order: 'ascending' | 'descending' = 'ascending'): string {
    if (this.isZero) return '0';
    const parts: string[] = [];
    const terms = this.terms();
    if (order === 'descending') terms.reverse();
    terms.forEach(([e, c], i) => {
      const negative = c < 0n;
      const abs = negative ? -c : c;
      const sign = i === 0 ? (negative ? '-' : '') : negative ? ' - ' : ' + ';
      const power = e === 0 ? '' : e === 1 ? variable : `${variable}^${formatExponent(e)}`;
      const coeff = abs === 1n && power !== '' ? '' : abs.toString();
      parts.push(sign + coeff + power);
    });
    return parts.join('');
  }
}

/** Exponent as text: integers plain, fractions as (p/q) in lowest terms. */
export function formatExponent(e: number): string {
  if (Number.isInteger(e)) return e < 0 ? `(${e})` : `${e}`;
  const [p, q] = toFraction(e);
  return `(${p}/${q})`;
}

/** The exponent as a fraction p/q in lowest terms, q ∈ {1, 2, 4}. */
export function toFraction(e: number): [number, number] {
  let q = 1;
  while (!Number.isInteger(e * q)) q *= 2;
  return [e * q, q];
}
