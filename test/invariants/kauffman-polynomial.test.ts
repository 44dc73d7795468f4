import { describe, expect, it } from 'vitest';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { componentCount, mirrorDiagram, type LinkDiagram } from '../../src/core/diagram/model.ts';
import { addCurl, connectedSum, disjointUnion } from '../../src/core/diagram/operations.ts';
import { kauffmanBracket } from '../../src/core/invariants/bracket.ts';
import { jonesPolynomial } from '../../src/core/invariants/jones.ts';
import { KAUFFMAN_RULES, kauffmanPolynomial } from '../../src/core/invariants/kauffman-polynomial/kauffman.ts';
import { Laurent } from '../../src/core/poly/laurent.ts';
import { Laurent2 } from '../../src/core/poly/laurent2.ts';
import { randomDiagram, randomReducedAlternating, rng } from '../support/random-diagrams.ts';

const F = (d: LinkDiagram): Laurent2 => kauffmanPolynomial(d).polynomial;
const Y = (d: LinkDiagram): Laurent2 => kauffmanPolynomial(d, 'dubrovnik').polynomial;
const poly = (terms: [number, number, number][]): Laurent2 => Laurent2.fromTerms(terms);

function diagrams(seed: number, count: number, maxCrossings: number, maxStrands: number): LinkDiagram[] {
  const random = rng(seed);
  return Array.from({ length: count }, (_, i) => (i % 3 === 0 ? randomReducedAlternating(random, 4 + (i % 9), maxStrands) : randomDiagram(random, maxCrossings, maxStrands)));
}

describe('Kauffman polynomial F(a, z): worked values (from memory, up to the a ↔ a⁻¹ of chirality)', () => {
  it('the positive trefoil, its mirror and the figure-eight knot', () => {
    const positive = poly([[-4, 0, -1], [-2, 0, -2], [-5, 1, 1], [-3, 1, 1], [-4, 2, 1], [-2, 2, 1]]);
    expect(F(closeBraid([1, 1, 1], 2)).equals(positive)).toBe(true);
    expect(F(closeBraid([-1, -1, -1], 2)).equals(positive.substituteMonomials(-1, 0, 0, 1))).toBe(true);
    const figureEight = poly([[-2, 0, -1], [0, 0, -1], [2, 0, -1], [-1, 1, -1], [1, 1, -1], [-2, 2, 1], [0, 2, 2], [2, 2, 1], [-1, 3, 1], [1, 3, 1]]);
    expect(F(closeBraid([1, -2, 1, -2], 3)).equals(figureEight)).toBe(true);
  });
  it('the unknot with curls has F = 1 (F is an ambient isotopy invariant)', () => {
    const curled = addCurl(addCurl(closeBraid([1], 2), 0, 1, true), 1, -1, false);
    expect(F(curled).equals(Laurent2.one)).toBe(true);
  });
});

describe("Kauffman's substitution to the Jones polynomial (Kauffman 1990, Trans. AMS 318)", () => {
  it('V(t) = F(−t^(−3/4), t^(1/4) + t^(−1/4)) on 60 random diagrams up to 16 crossings', () => {
    const a = Laurent.monomial(-0.75, -1);
    const z = Laurent.fromTerms([[0.25, 1n], [-0.25, 1n]]);
    for (const d of diagrams(911, 60, 16, 5)) {
      const f = F(d);
      const low = f.yRange()![0];
      // F may have negative powers of z (links); clear them before substituting the binomial.
      expect(f.shift(0, -low).evaluate(a, z).equals(jonesPolynomial(d).mul(z.pow(-low)))).toBe(true);
    }
  });
  it('the Dubrovnik variant at a = −A³, z = A − A⁻¹ is the normalised bracket (−A³)^(−w)⟨D⟩', () => {
    const a = Laurent.monomial(3, -1);
    const z = Laurent.fromTerms([[1, 1n], [-1, -1n]]);
    for (const d of diagrams(912, 60, 16, 5)) {
      const y = Y(d);
      const low = y.yRange()![0];
      const w = d.crossings.reduce((s, c) => s + c.sign, 0);
      const bracket = kauffmanBracket(d).bracket;
      const normalised = (w % 2 === 0 ? bracket : bracket.neg()).shift(-3 * w);
      expect(y.shift(0, -low).evaluate(a, z).equals(normalised.mul(z.pow(-low)))).toBe(true);
    }
  });
});

describe('relations', () => {
  it('Dubrovnik and Kauffman: Y(a, z) = (−1)^(μ−1) F(ia, −iz) (Lickorish; stated in Kauffman 1990, from memory)', () => {
    for (const d of diagrams(913, 80, 16, 5)) {
      const mu = componentCount(d);
      // F(ia, −iz): the term a^j z^k gains i^j (−i)^k = (−1)^k i^(j+k), and j + k is always even.
      const twisted = Laurent2.fromTerms(
        F(d).terms().map(([j, k, c]) => {
          if ((j + k) % 2 !== 0) throw new Error('odd j + k');
          const sign = (Math.abs(k) % 2 === 0 ? 1n : -1n) * (Math.abs((j + k) / 2) % 2 === 0 ? 1n : -1n) * (mu % 2 === 1 ? 1n : -1n);
          return [j, k, sign * c] as const;
        }),
      );
      expect(Y(d).equals(twisted)).toBe(true);
    }
  });
  it('the mirror image has F(a⁻¹, z); connected sums multiply; a split union gains ((a + a⁻¹)/z − 1)', () => {
    const a = diagrams(914, 20, 10, 4);
    const b = diagrams(915, 20, 10, 4);
    for (let i = 0; i < a.length; i++) {
      expect(F(mirrorDiagram(a[i]!)).equals(F(a[i]!).substituteMonomials(-1, 0, 0, 1))).toBe(true);
      if (a[i]!.crossings.length === 0 || b[i]!.crossings.length === 0) continue;
      expect(F(connectedSum(a[i]!, b[i]!)).equals(F(a[i]!).mul(F(b[i]!)))).toBe(true);
      expect(F(disjointUnion(a[i]!, b[i]!)).equals(F(a[i]!).mul(F(b[i]!)).mul(KAUFFMAN_RULES.loop))).toBe(true);
    }
  });
  it('a diagram over the work budget is refused as over the limit', () => {
    expect(() => kauffmanPolynomial(closeBraid([1, 2, 3, 1, 2, 3, 1, 2, 3, 1, 2, 3], 4), 'kauffman', { maxWidth: 18, maxWork: 200 })).toThrow(/over the work limit/);
  });
});
