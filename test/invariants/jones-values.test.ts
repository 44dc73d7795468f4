import { describe, expect, it } from 'vitest';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { jonesFromBracket, jonesPolynomial } from '../../src/core/invariants/jones.ts';
import { kauffmanBracket } from '../../src/core/invariants/bracket.ts';
import { Laurent } from '../../src/core/poly/laurent.ts';
import { writhe } from '../../src/core/diagram/model.ts';
import { addCurl, disjointUnion } from '../../src/core/diagram/operations.ts';
import { rng, shuffleDiagram } from '../support/random-diagrams.ts';

const t = (terms: [number, number][]): Laurent => Laurent.fromTerms(terms);
const jonesText = (word: number[], strands: number): string => jonesPolynomial(closeBraid(word, strands)).toPlainString('t');

/** The braid (σ1 … σ_{p−1})^q, whose closure is the torus link T(p, q). */
function torusBraid(p: number, q: number): number[] {
  return Array.from({ length: q }, () => Array.from({ length: p - 1 }, (_, i) => i + 1)).flat();
}

function gcd(a: number, b: number): number {
  return b === 0 ? a : gcd(b, a % b);
}

describe('worked Jones polynomials (from memory; Jones 1985, Bull. AMS 12)', () => {
  it('unknot: 1, also drawn with curls of both signs', () => {
    expect(jonesText([], 1)).toBe('1');
    expect(jonesText([1], 2)).toBe('1');
    expect(jonesText([-1, -2], 3)).toBe('1');
    expect(jonesPolynomial(addCurl(addCurl(closeBraid([1], 2), 0, -1, true), 1, -1, false)).equals(Laurent.one)).toBe(true);
  });
  it('positive Hopf link: −t^(1/2) − t^(5/2); negative: −t^(−1/2) − t^(−5/2)', () => {
    expect(jonesText([1, 1], 2)).toBe('-t^(1/2) - t^(5/2)');
    expect(jonesText([-1, -1], 2)).toBe('-t^(-5/2) - t^(-1/2)');
  });
  it('right-handed trefoil t + t³ − t⁴, left-handed t⁻¹ + t⁻³ − t⁻⁴', () => {
    expect(jonesText([1, 1, 1], 2)).toBe('t + t^3 - t^4');
    expect(jonesText([-1, -1, -1], 2)).toBe('-t^(-4) + t^(-3) + t^(-1)');
  });
  it('figure-eight: t⁻² − t⁻¹ + 1 − t + t², from σ1σ2⁻¹σ1σ2⁻¹', () => {
    expect(jonesText([1, -2, 1, -2], 3)).toBe('t^(-2) - t^(-1) + 1 - t + t^2');
  });
  it('cinquefoil T(2,5): t² + t⁴ − t⁵ + t⁶ − t⁷', () => {
    expect(jonesText([1, 1, 1, 1, 1], 2)).toBe('t^2 + t^4 - t^5 + t^6 - t^7');
  });
  it('the trefoil value survives shuffling the crossings and relabelling the edges', () => {
    const random = rng(9);
    for (let i = 0; i < 10; i++) {
      expect(jonesPolynomial(shuffleDiagram(closeBraid([1, 1, 1], 2), random)).toPlainString('t')).toBe('t + t^3 - t^4');
    }
  });
  it('jonesFromBracket: the trefoil bracket A⁻⁷ − A⁻³ − A⁵ with writhe 3 gives t + t³ − t⁴ (Kauffman 1987)', () => {
    const bracket = t([[-7, 1], [-3, -1], [5, -1]]);
    expect(jonesFromBracket(bracket, 3).toPlainString('t')).toBe('t + t^3 - t^4');
    const d = closeBraid([1, 1, 1], 2);
    expect(jonesFromBracket(kauffmanBracket(d).bracket, writhe(d)).toPlainString('t')).toBe('t + t^3 - t^4');
  });
});

describe('the (2, n) torus links σ1^n', () => {
  // Skein relation (Jones 1985) at one crossing of σ1^n: switching gives σ1^(n−2), smoothing σ1^(n−1), so
  // V_n = t² V_(n−2) + t (t^(1/2) − t^(−1/2)) V_(n−1), with V_0 the 2-component unlink and V_1 = 1.
  const z = t([[0.5, 1], [-0.5, -1]]);
  const expected: Laurent[] = [t([[0.5, -1], [-0.5, -1]]), Laurent.one];
  for (let n = 2; n <= 16; n++) expected.push(expected[n - 2]!.shift(2).add(z.mul(expected[n - 1]!).shift(1)));
  for (let n = 0; n <= 16; n++) {
    it(`n = ${n} follows the skein recursion`, () => {
      expect(jonesPolynomial(closeBraid(Array(n).fill(1), 2)).equals(expected[n]!)).toBe(true);
      expect(jonesPolynomial(closeBraid(Array(n).fill(-1), 2)).equals(expected[n]!.substitutePower(-1))).toBe(true);
    });
  }
});

describe("Jones' torus-knot formula (Jones 1987, Annals of Mathematics 126)", () => {
  // V(T(p,q)) = t^((p−1)(q−1)/2) (1 − t^(p+1) − t^(q+1) + t^(p+q)) / (1 − t²).
  const formula = (p: number, q: number): Laurent =>
    t([[0, 1], [p + 1, -1], [q + 1, -1], [p + q, 1]])
      .divExact(t([[0, 1], [2, -1]]))
      .shift(((p - 1) * (q - 1)) / 2);
  const pairs: [number, number][] = [];
  for (let p = 2; p <= 7; p++) for (let q = p + 1; q <= 15; q++) if (gcd(p, q) === 1) pairs.push([p, q]);
  for (const [p, q] of pairs) {
    it(`T(${p},${q}) as (σ1…σ${p - 1})^${q}, and T(${q},${p}) where small`, () => {
      expect(jonesPolynomial(closeBraid(torusBraid(p, q), p)).equals(formula(p, q))).toBe(true);
      if (q <= 9 && p * q <= 40) expect(jonesPolynomial(closeBraid(torusBraid(q, p), q)).equals(formula(p, q))).toBe(true);
    });
  }
  it('T(7,13) in the shuffled crossing order', () => {
    expect(jonesPolynomial(shuffleDiagram(closeBraid(torusBraid(7, 13), 7), rng(1))).equals(formula(7, 13))).toBe(true);
  });
});

describe('unlinks (Jones 1985): V = (−t^(1/2) − t^(−1/2))^(μ−1)', () => {
  const loop = t([[0.5, -1], [-0.5, -1]]);
  for (let mu = 1; mu <= 5; mu++) {
    it(`μ = ${mu}, crossingless and drawn with crossings (curled unknots side by side)`, () => {
      expect(jonesPolynomial(closeBraid([], mu)).equals(loop.pow(mu - 1))).toBe(true);
      let d = closeBraid([1], 2);
      for (let k = 1; k < mu; k++) d = disjointUnion(d, closeBraid(k % 2 ? [-1, 2] : [1, 2], 3));
      expect(jonesPolynomial(d).equals(loop.pow(mu - 1))).toBe(true);
    });
  }
});
