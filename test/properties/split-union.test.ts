import { describe, expect, it } from 'vitest';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { disjointUnion, splitPieces, withFreeLoops } from '../../src/core/diagram/operations.ts';
import { componentCount } from '../../src/core/diagram/model.ts';
import { randomDiagram, rng } from '../support/random-diagrams.ts';

// Crossing numbers add under split union: the split diagram gives ≤, and deleting
// one part's components from any diagram of the union gives ≥ (common practice).
describe('crossing-number bounds of split diagrams, piece by piece', () => {
  it('a Hopf link beside a circle has crossing number exactly 2 (from memory: c(Hopf) = 2)', () => {
    const report = analyzeDiagram(closeBraid([1, 1], 3));
    expect(report.components).toBe(3);
    expect(report.crossingNumber.exact).toBe(2);
    expect(report.crossingNumber.reasons.some((r) => r.theorem === 'split-union' && r.bound === 'exact')).toBe(true);
  });

  it('two split trefoils have crossing number 3 + 3 (from memory: c(trefoil) = 3)', () => {
    const trefoil = closeBraid([1, 1, 1], 2);
    const report = analyzeDiagram(disjointUnion(trefoil, trefoil));
    expect(report.connected).toBe(false);
    expect(report.crossingNumber.exact).toBe(6);
  });

  it('a non-alternating piece keeps the sum of its own bounds (T(3,4) has span V = 5, from memory)', () => {
    const torus34 = closeBraid([1, 2, 1, 2, 1, 2, 1, 2], 3);
    const report = analyzeDiagram(withFreeLoops(torus34, 2));
    // Without pieces the span bound would be span V − (μ − 1) = 7 − 2 = 5; per piece it is 5 + 0 + 0.
    expect(report.crossingNumber.lower).toBe(5);
    expect(report.crossingNumber.upper).toBe(8);
    expect(report.crossingNumber.exact).toBeNull();
  });

  it('splits a diagram into pieces that keep every crossing and component', () => {
    const random = rng(2024);
    for (let trial = 0; trial < 40; trial++) {
      const d = disjointUnion(randomDiagram(random, 7), randomDiagram(random, 7));
      const pieces = splitPieces(d);
      expect(pieces.reduce((s, p) => s + p.crossings.length, 0)).toBe(d.crossings.length);
      expect(pieces.reduce((s, p) => s + componentCount(p), 0) + d.freeLoops).toBe(componentCount(d));
    }
  });

  it('is never weaker than span V − (μ − 1) on random split diagrams (Kauffman–Murasugi–Thistlethwaite, split form)', () => {
    const random = rng(77);
    for (let trial = 0; trial < 40; trial++) {
      const d = disjointUnion(randomDiagram(random, 8), randomDiagram(random, 8));
      const report = analyzeDiagram(d);
      const global = Math.max(0, report.span - (report.components - 1));
      expect(report.crossingNumber.lower).toBeGreaterThanOrEqual(global);
      expect(report.crossingNumber.lower).toBeLessThanOrEqual(report.crossingNumber.upper);
    }
  });
});
