/**
 * Properties and crossing-number bounds under the standard diagram moves:
 * a Reidemeister I curl, the split union and the connected sum. Each check
 * names the fact it rests on.
 */
import { describe, expect, it } from 'vitest';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import { addCurl, connectedSum, disjointUnion } from '../../src/core/diagram/operations.ts';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { mirrorDiagram } from '../../src/core/diagram/model.ts';
import { diagramProperties } from '../../src/core/diagram/properties.ts';
import { randomDiagram, randomInt, randomReducedAlternating, rng, shuffleDiagram } from '../support/random-diagrams.ts';

describe('a Reidemeister I curl', () => {
  it('adds exactly one nugatory crossing (the curl) and leaves the crossing-number bounds of a knot unchanged (common practice; KMT)', () => {
    const random = rng(41);
    let knots = 0;
    for (let k = 0; k < 30; k++) {
      const d = randomReducedAlternating(random, 6 + k);
      const curled = addCurl(d, randomInt(random, 0, d.edgeCount - 1), random() < 0.5 ? 1 : -1, random() < 0.5);
      const before = analyzeDiagram(d);
      const after = analyzeDiagram(curled);
      expect(after.nugatory).toEqual([d.crossings.length]);
      expect(after.span).toBe(before.span);
      expect(after.crossingNumber.upper).toBe(before.crossingNumber.upper);
      if (before.components === 1) {
        knots++;
        expect(after.crossingNumber.exact).toBe(d.crossings.length);
      }
    }
    expect(knots).toBeGreaterThan(3);
  });
  it('keeps the nugatory set stable: crossings nugatory before stay nugatory, none becomes so (common practice)', () => {
    const random = rng(42);
    for (let k = 0; k < 40; k++) {
      const d = randomDiagram(random, 14, 4);
      if (d.edgeCount === 0) continue;
      const curled = addCurl(d, randomInt(random, 0, d.edgeCount - 1), 1, true);
      expect(diagramProperties(curled).nugatory).toEqual([...diagramProperties(d).nugatory, d.crossings.length]);
    }
  });
});

describe('split unions', () => {
  it('two reduced alternating knots side by side: μ = 2, split, lower bound span V − 1 meets n (Jones 1985: V gains the factor −t^(1/2) − t^(−1/2))', () => {
    const random = rng(43);
    let checked = 0;
    for (let k = 0; k < 400 && checked < 6; k++) {
      const a = randomReducedAlternating(random, 5 + (k % 15));
      const b = randomReducedAlternating(random, 4 + (k % 11));
      if (diagramProperties(a).components !== 1 || diagramProperties(b).components !== 1) continue;
      checked++;
      const r = analyzeDiagram(shuffleDiagram(disjointUnion(a, b), random));
      const n = a.crossings.length + b.crossings.length;
      expect([r.components, r.connected]).toEqual([2, false]);
      expect(r.span).toBe(n + 1);
      expect(r.crossingNumber.reasons.find((x) => x.bound === 'lower')!.theorem).toBe('split-span-bound');
      expect(r.crossingNumber).toMatchObject({ lower: n, upper: n, exact: n });
    }
    expect(checked).toBe(6);
  });
});

describe('connected sums', () => {
  it('of two reduced alternating diagrams: reduced, |s_A| = |s_A(D1)| + |s_A(D2)| − 1 (and B alike), adequate, c = n1 + n2 (common practice; Thistlethwaite 1988 or KMT)', () => {
    const random = rng(44);
    for (let k = 0; k < 12; k++) {
      const a = randomReducedAlternating(random, 4 + k);
      const b = k % 2 === 0 ? mirrorDiagram(randomReducedAlternating(random, 3 + k)) : randomReducedAlternating(random, 3 + k);
      const sum = connectedSum(a, b, randomInt(random, 0, a.edgeCount - 1), randomInt(random, 0, b.edgeCount - 1));
      const pa = diagramProperties(a);
      const pb = diagramProperties(b);
      const r = analyzeDiagram(sum);
      const n = a.crossings.length + b.crossings.length;
      expect(r.reduced && r.connected && r.adequate).toBe(true);
      expect(r.stateCircles).toEqual({ a: pa.stateCircles.a + pb.stateCircles.a - 1, b: pa.stateCircles.b + pb.stateCircles.b - 1 });
      expect(r.crossingNumber.exact).toBe(n);
    }
  });
  it('the square knot (trefoil # mirror trefoil) drawn non-alternating: adequate, c = 6 by Thistlethwaite (from memory: c(3_1 # 3_1*) = 6)', () => {
    const trefoil = closeBraid([1, 1, 1], 2);
    const square = analyzeDiagram(connectedSum(trefoil, mirrorDiagram(trefoil)));
    expect(square.alternating).toBe(false);
    expect(square.adequate).toBe(true);
    expect(square.crossingNumber.exact).toBe(6);
    expect(square.crossingNumber.reasons.filter((x) => x.bound === 'exact').map((x) => x.theorem)).toEqual(['thistlethwaite-adequate']);
    // V(square) = V(3_1) · V(3_1)(t^-1) is symmetric under t ↔ t^-1 (Jones 1985: V is multiplicative under #, and amphichirality).
    expect(square.jones.equals(square.jones.substitutePower(-1))).toBe(true);
  });
});
