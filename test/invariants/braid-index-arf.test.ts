import { describe, expect, it } from 'vitest';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import { judgeClaim } from '../../src/core/claims/index.ts';
import { braidIndexLatex } from '../../src/core/claims/skein-polynomial-claims.ts';
import { DEFAULT_CONVENTION } from '../../src/core/convention/convention.ts';
import { braidIndexOf } from '../../src/core/invariants/registered/skein-values.ts';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { componentCount, type LinkDiagram } from '../../src/core/diagram/model.ts';
import { connectedSum } from '../../src/core/diagram/operations.ts';
import { arfOfKnot } from '../../src/core/invariants/arf.ts';
import { braidIndexBounds } from '../../src/core/invariants/braid-index.ts';
import { classicalInvariants } from '../../src/core/invariants/classical/index.ts';
import { homflyPolynomial } from '../../src/core/invariants/homfly/homfly.ts';
import { parseDiagramCode } from '../../src/core/notation/index.ts';
import { randomDiagram, rng } from '../support/random-diagrams.ts';

function bounds(d: LinkDiagram) {
  return braidIndexBounds(homflyPolynomial(d).polynomial, classicalInvariants(d).seifertCircles, d.notation);
}

function torusBraid(p: number, q: number): number[] {
  const word: number[] = [];
  for (let k = 0; k < q; k++) for (let i = 1; i < p; i++) word.push(i);
  return word;
}

describe('braid index', () => {
  it('T(p, q) has braid index min(p, q) (Franks–Williams 1987), found exactly from its p-strand braid', () => {
    for (const [p, q] of [[2, 3], [2, 7], [3, 4], [3, 5], [4, 5], [5, 6]]) {
      const b = bounds(closeBraid(torusBraid(p, q), p));
      expect(b.exact).toBe(p);
      expect(b.reasons.map((r) => r.theorem)).toEqual(['morton-franks-williams', 'yamada-seifert-circles', 'bounds-meet']);
    }
  });
  it('the figure-eight knot has braid index 3 (from memory), also as a DT code', () => {
    expect(bounds(closeBraid([1, -2, 1, -2], 3)).exact).toBe(3);
    expect(bounds(parseDiagramCode('4 6 8 2', 'dt')).exact).toBe(3);
  });
  it('on random diagrams the Morton–Franks–Williams bound never exceeds the Seifert circles (Yamada), so the theorems agree', () => {
    const random = rng(921);
    for (let i = 0; i < 80; i++) {
      const d = randomDiagram(random, 14, 6);
      const b = bounds(d);
      expect(b.lower).toBeLessThanOrEqual(b.upper);
      expect(b.upper).toBe(classicalInvariants(d).seifertCircles);
    }
  });
  it('a braid closure with surplus strands still gets the Seifert bound, and the unknot on 3 strands gets 1..3', () => {
    const b = bounds(closeBraid([1, -2], 3));
    expect([b.lower, b.upper, b.exact]).toEqual([1, 3, null]);
  });
});

describe('braid-index claims: one number, one bound or a range, as crossing-number claims are written', () => {
  // 5₂ drawn from its DT code: MFW gives 3, the drawing's Seifert circles 4; its braid index is 3 (from memory).
  const fiveTwo = () => analyzeDiagram(parseDiagramCode('4 8 10 2 6', 'dt'));
  const verdict = (text: string, report = fiveTwo()) => judgeClaim('braid-index', text, report, { convention: DEFAULT_CONVENTION }).verdict;
  it('judges against the proven bounds 3 ≤ b ≤ 4 of this drawing of 5₂', () => {
    expect(braidIndexLatex(braidIndexOf(fiveTwo()))).toBe('3 \\le b \\le 4');
    expect(['3', '\\ge 3', '3 \\le b \\le 4', '3--4', 'between 2 and 5', 'b(K) \\le 4'].map((t) => verdict(t))).toEqual(['undecided', 'agrees', 'agrees', 'agrees', 'agrees', 'agrees']);
    expect(['2', '\\le 2', '\\ge 5', '5-6'].map((t) => verdict(t))).toEqual(['contradicts', 'contradicts', 'contradicts', 'contradicts']);
    expect(['\\le 3', '4', '2 \\le b \\le 3'].map((t) => verdict(t))).toEqual(['undecided', 'undecided', 'undecided']);
  });
  it('an exact braid index (the trefoil, 2: Franks–Williams 1987) agrees with itself and a range around it, and names the bounds when contradicted', () => {
    const trefoil = analyzeDiagram(closeBraid([1, 1, 1], 2));
    expect(['2', '1--3', '\\le 2'].map((t) => verdict(t, trefoil))).toEqual(['agrees', 'agrees', 'agrees']);
    expect(judgeClaim('braid-index', '3', trefoil, { convention: DEFAULT_CONVENTION }).reason).toMatch(/^the braid index is 2, so it is not 3: .*Morton–Franks–Williams/);
  });
  it('refuses what is not a count, naming the braid index', () => {
    expect(() => verdict('3 \\le b \\ge 2')).toThrow(/must point the same way, as in 5 \\le b \\le 7/);
    expect(() => verdict('two')).toThrow(/the braid index/);
  });
});

describe('Arf invariant of knots', () => {
  it('trefoil 1, figure-eight 1, unknot 0, 5₁ = T(2,5) 1, T(2,7) 0, 6₁ (from memory: a₂ of ∇)', () => {
    const arf = (d: LinkDiagram): number | null => {
      const c = classicalInvariants(d);
      return arfOfKnot(c.conway, c.alexander);
    };
    expect(arf(closeBraid([1, 1, 1], 2))).toBe(1);
    expect(arf(closeBraid([1, -2, 1, -2], 3))).toBe(1);
    expect(arf(closeBraid([1], 2))).toBe(0);
    expect(arf(closeBraid([1, 1, 1, 1, 1], 2))).toBe(1);
    expect(arf(closeBraid([1, 1, 1, 1, 1, 1, 1], 2))).toBe(0);
    // 6₁, the stevedore knot, is slice, so its Arf invariant vanishes (Robertello 1965: Arf is a concordance invariant).
    expect(arf(parseDiagramCode('4 8 12 10 2 6', 'dt'))).toBe(0);
    // The square knot T(2,3) # T(2,3)* is slice: Arf 0; additivity under connected sum (common practice).
    expect(arf(connectedSum(closeBraid([1, 1, 1], 2), closeBraid([-1, -1, -1], 2)))).toBe(0);
  });
  it('the two routes (a₂ mod 2 and Levine’s Δ(−1) mod 8) agree on 150 random knots (they throw otherwise)', () => {
    const random = rng(922);
    let knots = 0;
    for (let i = 0; i < 300 && knots < 150; i++) {
      const d = randomDiagram(random, 20, 5);
      if (componentCount(d) !== 1) continue;
      const c = classicalInvariants(d);
      expect([0, 1]).toContain(arfOfKnot(c.conway, c.alexander));
      knots++;
    }
    expect(knots).toBeGreaterThan(50);
  });
});
