import { describe, expect, it } from 'vitest';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import type { DiagramReport } from '../../src/core/analyze/report.ts';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { parseDiagramCode } from '../../src/core/notation/index.ts';
import { mirrorDiagram } from '../../src/core/diagram/model.ts';
import { Laurent } from '../../src/core/poly/laurent.ts';
import { bracketByStateSum } from '../../src/core/invariants/state-sum.ts';
import { randomDiagram, randomReducedAlternating, rng } from '../support/random-diagrams.ts';

const braid = (word: string, strands: number): DiagramReport => analyzeDiagram(closeBraid(word.split(' ').map(Number), strands));
const theorems = (r: DiagramReport, bound: 'lower' | 'upper' | 'exact'): string[] =>
  r.crossingNumber.reasons.filter((x) => x.bound === bound).map((x) => x.theorem);

describe('Kauffman–Murasugi–Thistlethwaite on reduced alternating diagrams', () => {
  it('span V = n and the crossing number is reported exact = n, for random diagrams of 10 to 200 crossings (KMT 1987)', () => {
    const random = rng(2024);
    for (const n of [10, 17, 33, 64, 120, 200]) {
      const r = analyzeDiagram(randomReducedAlternating(random, n));
      expect(r.reduced && r.alternating && r.connected).toBe(true);
      expect(r.span).toBe(n);
      expect(r.bracketSpan).toBe(4 * n);
      expect(r.crossingNumber).toMatchObject({ lower: n, upper: n, exact: n });
      expect(theorems(r, 'exact')).toContain('kauffman-murasugi-thistlethwaite');
    }
  });
  it('span V ≤ n for every connected diagram (KMT 1987) on random diagrams', () => {
    const random = rng(31);
    for (let k = 0; k < 40; k++) {
      const r = analyzeDiagram(randomDiagram(random, 30, 5));
      if (r.connected) expect(r.span).toBeLessThanOrEqual(r.crossings);
      const { lower, upper, exact } = r.crossingNumber;
      expect(0 <= lower && lower <= upper && upper <= r.crossings).toBe(true);
      if (exact !== null) expect([lower, upper]).toEqual([exact, exact]);
    }
  });
});

describe('small knots and links (values from memory unless said otherwise)', () => {
  it('positive trefoil 1 1 1: V = t + t^3 − t^4, c = 3', () => {
    const r = braid('1 1 1', 2);
    expect(r.jones.equals(Laurent.fromTerms([[1, 1], [3, 1], [4, -1]]))).toBe(true);
    expect(r.bracket.equals(bracketByStateSum(r.diagram))).toBe(true);
    expect([r.writhe, r.span, r.crossingNumber.exact]).toEqual([3, 3, 3]);
    expect(theorems(r, 'lower')).toEqual(['kauffman-murasugi-thistlethwaite']);
  });
  it('figure-eight 1 -2 1 -2: V = t^-2 − t^-1 + 1 − t + t^2, c = 4', () => {
    const r = braid('1 -2 1 -2', 3);
    expect(r.jones.equals(Laurent.fromTerms([[-2, 1], [-1, -1], [0, 1], [1, -1], [2, 1]]))).toBe(true);
    expect(r.crossingNumber.exact).toBe(4);
  });
  it('positive Hopf link 1 1: V = −t^(1/2) − t^(5/2), lk = +1, c = 2', () => {
    const r = braid('1 1', 2);
    expect(r.jones.equals(Laurent.fromTerms([[0.5, -1], [2.5, -1]]))).toBe(true);
    expect(r.linking).toEqual([{ components: [0, 1], value: 1 }]);
    expect(r.crossingNumber.exact).toBe(2);
  });
  it('Whitehead-type link 1 -2 1 -2 -2: lk = 0 yet non-split by Menasco, so the lower bound is span V = 5 = c', () => {
    const r = braid('1 -2 1 -2 -2', 3);
    expect(r.linking[0]!.value).toBe(0);
    expect(theorems(r, 'lower')).toEqual(['menasco']);
    expect(r.crossingNumber.reasons.find((x) => x.bound === 'lower')!.value).toBe(5);
    expect(r.crossingNumber.exact).toBe(5);
  });
  it('mirror image: V(t) ↦ V(t^-1), same bounds (Jones 1985)', () => {
    const d = closeBraid([1, 1, 1, 2, -1, 2], 3);
    const r = analyzeDiagram(d);
    const m = analyzeDiagram(mirrorDiagram(d));
    expect(m.jones.equals(r.jones.substitutePower(-1))).toBe(true);
    expect(m.crossingNumber.lower).toBe(r.crossingNumber.lower);
    expect(m.crossingNumber.upper).toBe(r.crossingNumber.upper);
  });
});

describe('nugatory crossings and the upper bound', () => {
  it('1 1 1 2 on 3 strands: crossing 3 is a kink, so c ≤ 3; with span V = 3 the trefoil is exact 3', () => {
    const r = braid('1 1 1 2', 3);
    expect(r.nugatory).toEqual([3]);
    expect(r.reduced).toBe(false);
    expect(r.alternating).toBe(false);
    expect(theorems(r, 'upper')).toEqual(['nugatory-removal']);
    expect(theorems(r, 'lower')).toEqual(['kauffman-murasugi-thistlethwaite']);
    // Not alternating, so no exact-value theorem applies: the value comes from the bounds meeting.
    expect(theorems(r, 'exact')).toEqual(['nugatory-removal']);
    expect(r.crossingNumber).toMatchObject({ lower: 3, upper: 3, exact: 3 });
  });
  it('an all-nugatory diagram (1 2 3 on 4 strands) has crossing number 0 (an unknot)', () => {
    const r = braid('1 2 3', 4);
    expect(r.jones.equals(Laurent.one)).toBe(true);
    expect(r.crossingNumber).toMatchObject({ lower: 0, upper: 0, exact: 0 });
  });
  it('a crossingless diagram: three free loops, c = 0 for the trivial reason; V = (−t^(1/2) − t^(−1/2))^2 (common practice)', () => {
    const r = analyzeDiagram(closeBraid([], 3));
    expect(r.crossingNumber).toMatchObject({ lower: 0, upper: 0, exact: 0 });
    expect(theorems(r, 'exact')).toEqual(['trivial']);
    expect(r.jones.equals(Laurent.fromTerms([[-1, 1], [0, 2], [1, 1]]))).toBe(true);
  });
});

describe('split diagrams and the lower bound rule', () => {
  it('trefoil beside a free loop (1 1 1 on 3 strands): μ = 2, not connected, lower = span V − 1 = 4 − 1 = 3', () => {
    const r = braid('1 1 1', 3);
    expect([r.components, r.connected, r.span]).toEqual([2, false, 4]);
    expect(theorems(r, 'lower')).toEqual(['split-span-bound']);
    expect(r.crossingNumber).toMatchObject({ lower: 3, upper: 3, exact: 3 });
  });
  it('two Hopf links side by side (1 1 3 3): span V − 3 = 2 alone would leave 2..4, the pieces give exactly 4', () => {
    const r = braid('1 1 3 3', 4);
    // V = (−t^(1/2) − t^(−1/2)) · V(Hopf)^2 has span 1 + 2 + 2 = 5 (Jones 1985: V multiplies under split union with that factor).
    expect(r.span).toBe(5);
    // Each piece is a reduced alternating Hopf diagram (c = 2), and crossing numbers add under split union.
    expect(r.crossingNumber).toMatchObject({ lower: 4, upper: 4, exact: 4 });
    expect(theorems(r, 'exact')).toEqual(['split-union']);
  });
  it('a connected non-alternating diagram with connected linking graph: the lower bound is span V by the linking certificate', () => {
    // 1 1 2 2 -2 on 3 strands: a Hopf link whose second component is drawn with a non-alternating detour.
    const r = braid('1 1 2 2 -2', 3);
    expect(r.alternating).toBe(false);
    expect(r.components).toBe(2);
    expect(r.linking[0]!.value).toBe(1);
    expect(theorems(r, 'lower')).toEqual(['linking-graph']);
    expect(r.crossingNumber.reasons.find((x) => x.bound === 'lower')!.value).toBe(r.span);
  });
  it('never reports a negative lower bound', () => {
    const r = analyzeDiagram(closeBraid([1, -1], 5));
    expect(r.crossingNumber.lower).toBe(0);
  });
});

describe('adequate non-alternating diagrams (Thistlethwaite 1988)', () => {
  it('torus knot T(3,4) as (σ1σ2)^4 is A- but not B-adequate, so only the bounds remain: span V = 5 ≤ c ≤ 8', () => {
    const r = braid('1 2 1 2 1 2 1 2', 3);
    // V(T(3,4)) = t^3 (1 − t^4 − t^5 + t^7)/(1 − t^2) = t^3 + t^5 − t^8 (Jones 1987, from memory)
    expect(r.jones.equals(Laurent.fromTerms([[3, 1], [5, 1], [8, -1]]))).toBe(true);
    expect([r.aAdequate, r.bAdequate]).toEqual([true, false]);
    expect(r.crossingNumber).toMatchObject({ lower: 5, upper: 8, exact: null });
  });
  it('granny knot 1 1 1 2 2 2 on 3 strands: adequate, not alternating, c = 6', () => {
    const r = braid('1 1 1 2 2 2', 3);
    expect([r.alternating, r.adequate]).toEqual([false, true]);
    expect(r.crossingNumber.exact).toBe(6);
    expect(theorems(r, 'exact')).toEqual(['thistlethwaite-adequate']);
  });
  it('a positive braid with long syllables (1 1 2 2 1 1 3 3 2 2 on 4 strands) is adequate and gets c = n although span V < n', () => {
    const r = braid('1 1 2 2 1 1 3 3 2 2', 4);
    expect(r.adequate).toBe(true);
    expect(r.span).toBeLessThan(10);
    expect(r.crossingNumber).toMatchObject({ lower: 10, upper: 10, exact: 10 });
  });
});

describe('a non-alternating knot no theorem here decides', () => {
  it('8_19 from its DT code 4 8 -12 2 -14 -16 -6 -10 (code and V = t^3 + t^5 − t^8 from memory): bounds 5 to 8, not exact, although c(8_19) = 8', () => {
    const r = analyzeDiagram(parseDiagramCode('4 8 -12 2 -14 -16 -6 -10', 'dt'));
    expect(r.jones.equals(Laurent.fromTerms([[3, 1], [5, 1], [8, -1]])) || r.jones.equals(Laurent.fromTerms([[-3, 1], [-5, 1], [-8, -1]]))).toBe(true);
    // A positive diagram (all 8 crossings positive), non-alternating and adequate on one side only, so only span V and n bound it.
    expect(r.writhe).toBe(8);
    expect(r.alternating).toBe(false);
    expect([r.aAdequate, r.bAdequate]).toEqual([true, false]);
    expect(r.crossingNumber).toMatchObject({ lower: 5, upper: 8, exact: null });
  });
});
