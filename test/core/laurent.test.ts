import { describe, expect, it } from 'vitest';
import { Laurent } from '../../src/core/poly/laurent.ts';

describe('Laurent polynomials (exact arithmetic, common practice)', () => {
  const x = Laurent.monomial(1);
  it('adds, multiplies and cancels exactly', () => {
    const p = Laurent.fromTerms([[-1, 1], [1, 1]]); // x + 1/x
    expect(p.mul(p).terms()).toEqual([[-2, 1n], [0, 2n], [2, 1n]]);
    expect(p.sub(p).isZero).toBe(true);
    expect(x.pow(5).shift(-5).equals(Laurent.one)).toBe(true);
  });
  it('keeps coefficients exact past 2^53', () => {
    const big = Laurent.fromTerms([[0, 1], [1, 1]]).pow(200); // (1 + x)^200
    // C(200,100) = 90548514656103281165404177077484163874504589675413336841320 (binomial coefficient)
    expect(big.coefficient(100)).toBe(90548514656103281165404177077484163874504589675413336841320n);
    expect(big.valueAtOne()).toBe(2n ** 200n);
  });
  it('divides exactly and refuses inexact division', () => {
    const d = Laurent.fromTerms([[2, -1], [-2, -1]]);
    const q = Laurent.fromTerms([[3, 2], [-1, -1], [0, 5]]);
    expect(q.mul(d).divExact(d).equals(q)).toBe(true);
    expect(() => Laurent.fromTerms([[0, 1], [1, 1]]).divExact(d)).toThrow(RangeError);
  });
  it('substitutes powers and handles half-integer exponents', () => {
    const p = Laurent.fromTerms([[0.5, -1], [2.5, -1]]);
    expect(p.substitutePower(-1).terms()).toEqual([[-2.5, -1n], [-0.5, -1n]]);
    expect(p.substitutePower(2).terms()).toEqual([[1, -1n], [5, -1n]]);
    expect(p.toPlainString('t')).toBe('-t^(1/2) - t^(5/2)');
    expect(() => Laurent.monomial(1 / 3)).toThrow(RangeError);
  });
});

describe('plain text order (common practice: either order is a valid way to write a polynomial)', () => {
  it('writes the highest power first when asked', () => {
    const v = Laurent.fromTerms([[1, 1], [3, 1], [4, -1]]);
    expect(v.toPlainString('t')).toBe('t + t^3 - t^4');
    expect(v.toPlainString('t', 'descending')).toBe('-t^4 + t^3 + t');
  });
});
