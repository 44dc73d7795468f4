import { describe, expect, it } from 'vitest';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { componentCount, mirrorDiagram, type LinkDiagram } from '../../src/core/diagram/model.ts';
import { connectedSum, disjointUnion, smoothCrossing, switchCrossing, withFreeLoops } from '../../src/core/diagram/operations.ts';
import { classicalInvariants } from '../../src/core/invariants/classical/index.ts';
import { HOMFLY_LOOP, homflyPolynomial } from '../../src/core/invariants/homfly/homfly.ts';
import { homflyBySkeinTree } from '../../src/core/invariants/homfly/skein-oracle.ts';
import { jonesPolynomial } from '../../src/core/invariants/jones.ts';
import { parseDiagramCode } from '../../src/core/notation/index.ts';
import { Laurent } from '../../src/core/poly/laurent.ts';
import { Laurent2 } from '../../src/core/poly/laurent2.ts';
import { randomDiagram, randomInt, randomReducedAlternating, rng } from '../support/random-diagrams.ts';

const P = (d: LinkDiagram): Laurent2 => homflyPolynomial(d).polynomial;
const poly = (terms: [number, number, number][]): Laurent2 => Laurent2.fromTerms(terms);
const sqrtDifference = Laurent.fromTerms([[0.5, 1n], [-0.5, -1n]]); // t^(1/2) − t^(−1/2)

function torusBraid(p: number, q: number): number[] {
  const word: number[] = [];
  for (let k = 0; k < q; k++) for (let i = 1; i < p; i++) word.push(i);
  return word;
}

function diagrams(seed: number, count: number, maxCrossings: number, maxStrands: number): LinkDiagram[] {
  const random = rng(seed);
  return Array.from({ length: count }, (_, i) => (i % 3 === 0 ? randomReducedAlternating(random, 4 + (i % 9), maxStrands) : randomDiagram(random, maxCrossings, maxStrands)));
}

describe('HOMFLY-PT worked values (from memory; convention v⁻¹P₊ − vP₋ = zP₀, P(unknot) = 1)', () => {
  it('unknot, unlink, trefoils, figure-eight, Hopf links and the (2,5) torus knot', () => {
    expect(P(closeBraid([], 1)).equals(Laurent2.one)).toBe(true);
    expect(P(closeBraid([], 2)).equals(HOMFLY_LOOP)).toBe(true);
    expect(P(closeBraid([1, 1, 1], 2)).equals(poly([[2, 0, 2], [4, 0, -1], [2, 2, 1]]))).toBe(true);
    expect(P(closeBraid([-1, -1, -1], 2)).equals(poly([[-2, 0, 2], [-4, 0, -1], [-2, 2, 1]]))).toBe(true);
    expect(P(closeBraid([1, -2, 1, -2], 3)).equals(poly([[-2, 0, 1], [0, 0, -1], [2, 0, 1], [0, 2, -1]]))).toBe(true);
    expect(P(closeBraid([1, 1], 2)).equals(poly([[1, -1, 1], [3, -1, -1], [1, 1, 1]]))).toBe(true);
    expect(P(closeBraid([-1, -1], 2)).equals(poly([[-1, -1, -1], [-3, -1, 1], [-1, 1, -1]]))).toBe(true);
    expect(P(closeBraid([1, 1, 1, 1, 1], 2)).equals(poly([[4, 0, 3], [6, 0, -2], [4, 2, 4], [6, 2, -1], [4, 4, 1]]))).toBe(true);
  });
  it('the same trefoil read from PD, Gauss and DT codes', () => {
    const trefoil = poly([[2, 0, 2], [4, 0, -1], [2, 2, 1]]);
    expect(P(parseDiagramCode('(4,2,5,1) (2,6,3,5) (6,4,1,3)', 'pd')).equals(trefoil)).toBe(true);
    expect(P(parseDiagramCode('o1+ u2+ o3+ u1+ o2+ u3+', 'gauss')).equals(trefoil)).toBe(true);
    expect(P(parseDiagramCode('4 6 2', 'dt')).equals(trefoil)).toBe(true);
  });
});

describe('the contraction against the skein recursion over descending diagrams (Lickorish–Millett 1987)', () => {
  it('agrees on 150 random shuffled diagrams up to 9 crossings, knots and links', () => {
    for (const d of diagrams(901, 150, 9, 5)) expect(P(d).equals(homflyBySkeinTree(d))).toBe(true);
  });
});

describe('specialisations (Freyd–Yetter–Hoste–Lickorish–Millett–Ocneanu 1985)', () => {
  it('P(v = t, z = t^(1/2) − t^(−1/2)) is the Jones polynomial from the bracket engine, on 120 random diagrams up to 30 crossings', () => {
    for (const d of diagrams(902, 120, 30, 6)) {
      const mu = componentCount(d);
      // P has z-degree at least 1 − μ, so multiply by z^(μ−1) before substituting.
      const specialised = P(d).shift(0, mu - 1).evaluate(Laurent.monomial(1), sqrtDifference);
      expect(specialised.equals(jonesPolynomial(d).mul(sqrtDifference.pow(mu - 1)))).toBe(true);
    }
  });
  it('P(v = 1, z) is the Conway polynomial from the Seifert matrix, on 120 random diagrams up to 30 crossings', () => {
    for (const d of diagrams(903, 120, 30, 6)) {
      expect(P(d).evaluate(Laurent.one, Laurent.monomial(1)).equals(classicalInvariants(d).conway)).toBe(true);
    }
  });
});

describe('relations on random diagrams', () => {
  it('the skein relation v⁻¹P(L₊) − vP(L₋) = zP(L₀) at random crossings', () => {
    const random = rng(904);
    for (const d of diagrams(905, 80, 14, 5)) {
      const k = randomInt(random, 0, d.crossings.length - 1);
      const [plus, minus] = d.crossings[k]!.sign === 1 ? [d, switchCrossing(d, k)] : [switchCrossing(d, k), d];
      const lhs = P(plus).shift(-1, 0).sub(P(minus).shift(1, 0));
      expect(lhs.equals(P(smoothCrossing(d, k)).shift(0, 1))).toBe(true);
    }
  });
  it('connected sums multiply, a split union gains the factor (v⁻¹ − v)/z, and free loops likewise', () => {
    const a = diagrams(906, 20, 10, 4);
    const b = diagrams(907, 20, 10, 4);
    for (let i = 0; i < a.length; i++) {
      if (a[i]!.crossings.length === 0 || b[i]!.crossings.length === 0) continue;
      expect(P(connectedSum(a[i]!, b[i]!)).equals(P(a[i]!).mul(P(b[i]!)))).toBe(true);
      expect(P(disjointUnion(a[i]!, b[i]!)).equals(P(a[i]!).mul(P(b[i]!)).mul(HOMFLY_LOOP))).toBe(true);
      expect(P(withFreeLoops(a[i]!, 2)).equals(P(a[i]!).mul(HOMFLY_LOOP.pow(2)))).toBe(true);
    }
  });
  it('the mirror image has P(−v⁻¹, z)', () => {
    for (const d of diagrams(908, 60, 16, 5)) {
      expect(P(mirrorDiagram(d)).equals(P(d).substituteMonomials(-1, 0, 0, 1).alternateSigns(1, 0))).toBe(true);
    }
  });
  it('knots have only even powers of v and of z, and P(v, z) = 1 at v = 1, z = 0 (common practice)', () => {
    for (const d of diagrams(909, 60, 20, 5).filter((x) => componentCount(x) === 1)) {
      for (const [i, j] of P(d).terms()) expect([Math.abs(i) % 2, Math.abs(j) % 2]).toEqual([0, 0]);
      expect(P(d).terms().filter(([, j]) => j === 0).reduce((s, [, , c]) => s + c, 0n)).toBe(1n);
    }
  });
});

/** Exact rationals for evaluating the torus-knot formula. */
class Q {
  constructor(readonly n: bigint, readonly d: bigint = 1n) {}
  static of(n: bigint, d: bigint): Q {
    const g = gcd(n < 0n ? -n : n, d < 0n ? -d : d) || 1n;
    const s = d < 0n ? -1n : 1n;
    return new Q((s * n) / g, (s * d) / g);
  }
  add(o: Q): Q { return Q.of(this.n * o.d + o.n * this.d, this.d * o.d); }
  sub(o: Q): Q { return Q.of(this.n * o.d - o.n * this.d, this.d * o.d); }
  mul(o: Q): Q { return Q.of(this.n * o.n, this.d * o.d); }
  div(o: Q): Q { return Q.of(this.n * o.d, this.d * o.n); }
  pow(e: number): Q { return e >= 0 ? Q.of(this.n ** BigInt(e), this.d ** BigInt(e)) : Q.of(this.d ** BigInt(-e), this.n ** BigInt(-e)); }
  equals(o: Q): boolean { return this.n === o.n && this.d === o.d; }
}
function gcd(a: bigint, b: bigint): bigint {
  return b === 0n ? a : gcd(b, a % b);
}

describe("Jones' torus-knot formula (Jones 1987, Annals of Mathematics 126; sum recalled from memory)", () => {
  // In Jones' variables t, λ with v² = λt and z = t^(1/2) − t^(−1/2), the sum
  //   S(t, λ) = (1 − t)/(1 − tⁿ) · Σ_{β=0}^{n−1} t^(kβ) Π_{i=−β, i≠0}^{n−1−β} (tⁱ − λt)/(tⁱ − 1)
  // gives P of the positive torus knot T(n, k) as λ^((n−1)(k+1)/2) t^((n−1)(k+1)/2 + (n−1)(k−1)/2) · S(1/t, 1/λ)
  // (the monomial prefactor and the inversion are the bookkeeping between Jones' convention and ours).
  function formula(n: number, k: number, t: Q, lambda: Q): Q {
    const ti = t.pow(-1);
    const li = lambda.pow(-1);
    let sum = new Q(0n);
    for (let b = 0; b < n; b++) {
      let product = new Q(1n);
      for (let i = -b; i <= n - 1 - b; i++) if (i !== 0) product = product.mul(ti.pow(i).sub(li.mul(ti)).div(ti.pow(i).sub(new Q(1n))));
      sum = sum.add(ti.pow(k * b).mul(product));
    }
    const s = new Q(1n).sub(ti).div(new Q(1n).sub(ti.pow(n))).mul(sum);
    const alpha = ((n - 1) * (k + 1)) / 2;
    return lambda.pow(alpha).mul(t.pow(alpha + ((n - 1) * (k - 1)) / 2)).mul(s);
  }
  it('holds exactly at a rational point for every coprime torus knot with n ≤ 5, k ≤ 11', () => {
    // t = s², λt = u², so v = u and z = s − 1/s are rational.
    const s = Q.of(3n, 2n);
    const u = Q.of(5n, 7n);
    const t = s.mul(s);
    const lambda = u.mul(u).div(t);
    const z = s.sub(s.pow(-1));
    let checked = 0;
    for (let n = 2; n <= 5; n++) {
      for (let k = n + 1; k <= 11; k++) {
        if (Number(gcd(BigInt(n), BigInt(k))) !== 1) continue;
        const value = P(closeBraid(torusBraid(n, k), n)).terms().reduce((sum, [i, j, c]) => sum.add(new Q(c).mul(u.pow(i)).mul(z.pow(j))), new Q(0n));
        expect(value.equals(formula(n, k, t, lambda))).toBe(true);
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(15);
  });
  it('T(n, k) and T(k, n) have the same polynomial (they are the same knot)', () => {
    for (const [n, k] of [[2, 5], [3, 4], [3, 5], [4, 5]]) {
      expect(P(closeBraid(torusBraid(n, k), n)).equals(P(closeBraid(torusBraid(k, n), k)))).toBe(true);
    }
  });
});

describe('limits', () => {
  it('a diagram over the work budget is refused as over the limit, not left running', () => {
    const d = closeBraid(torusBraid(5, 6), 5);
    expect(() => homflyPolynomial(d, { maxWidth: 22, maxWork: 1000 })).toThrow(/over the work limit/);
  });
  it('coefficients beyond 2^53 stay exact: the sum of 30 figure-eight knots has P(4₁)^30', () => {
    const figureEight = closeBraid([1, -2, 1, -2], 3);
    let d = figureEight;
    for (let i = 1; i < 30; i++) d = connectedSum(d, figureEight);
    const expected = P(figureEight).pow(30);
    expect(P(d).equals(expected)).toBe(true);
    expect(expected.terms().some(([, , c]) => (c < 0n ? -c : c) > 2n ** 53n)).toBe(true);
  });
});
