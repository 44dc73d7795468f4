import { describe, expect, it } from 'vitest';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { nonPlanarPieces } from '../../src/core/diagram/faces.ts';
import { componentCount, mirrorDiagram, structuralProblem, writhe, type LinkDiagram } from '../../src/core/diagram/model.ts';
import { addCurl, connectedSum, disjointUnion, smoothCrossing, switchCrossing, withFreeLoops } from '../../src/core/diagram/operations.ts';
import { boundaryWidths, planContraction } from '../../src/core/invariants/crossing-order.ts';
import { jonesPolynomial } from '../../src/core/invariants/jones.ts';
import { parseDiagramCode } from '../../src/core/notation/index.ts';
import { printPdCode } from '../../src/core/notation/print.ts';
import { randomDiagram, randomInt, randomReducedAlternating, rng } from '../support/random-diagrams.ts';

function wellFormed(d: LinkDiagram): void {
  expect(structuralProblem(d)).toBeUndefined();
  // Euler's formula V − E + F = 2 per piece (common practice): surgery must keep planar diagrams planar.
  expect(nonPlanarPieces(d)).toEqual([]);
}

describe('diagram surgery keeps diagrams valid and planar', () => {
  it('switching a crossing flips its sign, keeps the components, and switching twice restores it', () => {
    const random = rng(201);
    for (let i = 0; i < 80; i++) {
      const d = randomDiagram(random, 14, 5);
      const k = randomInt(random, 0, d.crossings.length - 1);
      const s = switchCrossing(d, k);
      wellFormed(s);
      expect(writhe(s)).toBe(writhe(d) - 2 * d.crossings[k]!.sign);
      expect(switchCrossing(s, k).crossings).toEqual(d.crossings);
    }
  });
  it('switching every crossing is the mirror image', () => {
    const d = randomDiagram(rng(202), 12, 4);
    let all = d;
    for (let k = 0; k < d.crossings.length; k++) all = switchCrossing(all, k);
    expect(all.crossings).toEqual(mirrorDiagram(d).crossings);
  });
  it('the oriented smoothing removes one crossing and changes the component count by exactly one (common practice)', () => {
    const random = rng(203);
    for (let i = 0; i < 120; i++) {
      const d = randomDiagram(random, 14, 5);
      const k = randomInt(random, 0, d.crossings.length - 1);
      const s = smoothCrossing(d, k);
      wellFormed(s);
      expect(s.crossings.length).toBe(d.crossings.length - 1);
      expect(Math.abs(componentCount(s) - componentCount(d))).toBe(1);
    }
  });
  it('smoothing the single crossing of a curl splits off a free loop', () => {
    const s = smoothCrossing(closeBraid([1], 2), 0);
    expect(s.crossings.length).toBe(0);
    expect(s.freeLoops).toBe(2);
  });
  it('connected sums are planar and have μ₁ + μ₂ − 1 components', () => {
    const random = rng(204);
    for (let i = 0; i < 60; i++) {
      const d1 = randomDiagram(random, 10, 4);
      const d2 = randomDiagram(random, 10, 4);
      const sum = connectedSum(d1, d2, randomInt(random, 0, d1.edgeCount - 1), randomInt(random, 0, d2.edgeCount - 1));
      wellFormed(sum);
      expect(sum.crossings.length).toBe(d1.crossings.length + d2.crossings.length);
      expect(componentCount(sum)).toBe(componentCount(d1) + componentCount(d2) - 1);
    }
  });
  it('connected sum with a crossingless unknot returns the other diagram', () => {
    const d = closeBraid([1, 1, 1], 2);
    expect(jonesPolynomial(connectedSum(d, closeBraid([], 1))).equals(jonesPolynomial(d))).toBe(true);
    expect(componentCount(connectedSum(closeBraid([], 2), d))).toBe(2);
  });
  it('disjoint unions, free loops and curls keep the structure', () => {
    const random = rng(205);
    for (let i = 0; i < 40; i++) {
      const d = randomDiagram(random, 10, 4);
      const u = disjointUnion(d, randomDiagram(random, 10, 4));
      expect(structuralProblem(u)).toBeUndefined();
      expect(componentCount(withFreeLoops(d, 2))).toBe(componentCount(d) + 2);
      const c = addCurl(d, randomInt(random, 0, d.edgeCount - 1), random() < 0.5 ? 1 : -1, random() < 0.5);
      wellFormed(c);
      expect(componentCount(c)).toBe(componentCount(d));
    }
  });
  it('refuses crossings and edges that do not exist', () => {
    const d = closeBraid([1, 1, 1], 2);
    expect(() => switchCrossing(d, 3)).toThrow(RangeError);
    expect(() => smoothCrossing(d, -1)).toThrow(RangeError);
    expect(() => addCurl(d, 6, 1, true)).toThrow(RangeError);
    expect(() => connectedSum(d, d, 0, 9)).toThrow(RangeError);
  });
});

describe('printPdCode', () => {
  it('prints the closure of σ1³ with labels consecutive along the knot', () => {
    expect(printPdCode(closeBraid([1, 1, 1], 2))).toBe('(4,2,5,1) (2,6,3,5) (6,4,1,3)');
  });
  it('labels 1 … E consecutively along each component: the under strand runs from slot 0 to slot 2 (common practice)', () => {
    const random = rng(206);
    for (let i = 0; i < 40; i++) {
      const d = randomDiagram(random, 14, 5);
      if (d.freeLoops > 0) continue;
      const tuples = [...printPdCode(d).matchAll(/\(([^)]*)\)/g)].map((m) => m[1]!.split(',').map(Number));
      expect(tuples.length).toBe(d.crossings.length);
      const labels = tuples.flat().sort((a, b) => a - b);
      expect(labels).toEqual(Array.from({ length: 2 * d.edgeCount }, (_, j) => Math.floor(j / 2) + 1));
      const starts: number[] = [];
      let next = 1;
      for (const comp of d.components) (starts.push(next), (next += comp.length));
      const successor = (label: number): number => {
        const c = starts.filter((s) => s <= label).length - 1;
        return label + 1 < starts[c]! + d.components[c]!.length ? label + 1 : starts[c]!;
      };
      for (const [a, , c] of tuples) expect(c).toBe(successor(a!));
    }
  });
  it('round-trips through the PD parser with the same Jones polynomial (alternating and random diagrams, knots and links)', () => {
    const random = rng(207);
    for (let i = 0; i < 80; i++) {
      const d = i % 2 ? randomReducedAlternating(random, randomInt(random, 4, 14)) : randomDiagram(random, 14, 5);
      if (d.freeLoops > 0) continue;
      const back = parseDiagramCode(printPdCode(d), 'pd');
      expect(jonesPolynomial(back).equals(jonesPolynomial(d))).toBe(true);
    }
  });
  it('round-trips the Hopf links, whose 2-edge components leave the least room for orientation', () => {
    for (const word of [[1, 1], [-1, -1]]) {
      const d = closeBraid(word, 2);
      expect(jonesPolynomial(parseDiagramCode(printPdCode(d), 'pd')).equals(jonesPolynomial(d))).toBe(true);
    }
  });
  it('refuses diagrams with crossingless components, which a PD code cannot write', () => {
    expect(() => printPdCode(closeBraid([1, 1], 3))).toThrow(RangeError);
  });
});

describe('crossing order', () => {
  it('plans a permutation of the crossings whose reported widths are the simulated ones', () => {
    const random = rng(208);
    for (let i = 0; i < 30; i++) {
      const d = randomDiagram(random, 30, 6);
      const plan = planContraction(d);
      expect([...plan.order].sort((a, b) => a - b)).toEqual(d.crossings.map((_, k) => k));
      expect(plan.widths).toEqual(boundaryWidths(d, plan.order));
      expect(plan.maxWidth).toBe(Math.max(...plan.widths));
      expect(plan.widths[plan.widths.length - 1]).toBe(0);
    }
  });
  it('plans split diagrams region by region, and gives the same plan whatever was planned before', () => {
    // A split union empties the walk's frontier once per piece; the planner's arrays are kept from plan to plan.
    const random = rng(210);
    const small = randomDiagram(random, 12, 4);
    const first = planContraction(small);
    for (let i = 0; i < 20; i++) {
      const d = disjointUnion(disjointUnion(randomDiagram(random, 25, 5), randomDiagram(random, 40, 6)), randomDiagram(random, 8, 3));
      const plan = planContraction(d);
      expect([...plan.order].sort((a, b) => a - b)).toEqual(d.crossings.map((_, k) => k));
      expect(plan.widths).toEqual(boundaryWidths(d, plan.order));
      expect(plan.maxWidth).toBe(Math.max(...plan.widths));
    }
    expect(planContraction(small)).toEqual(first);
  });
  it('packs walk keys coarser past 8,192 crossings and still plans a narrow order', () => {
    // Above 2^13 crossings a walk's contact times share their key bits with the crossing index (see KeyLayout).
    const d = randomReducedAlternating(rng(211), 9000, 4);
    const plan = planContraction(d);
    expect([...plan.order].sort((a, b) => a - b)).toEqual(d.crossings.map((_, k) => k));
    expect(plan.widths).toEqual(boundaryWidths(d, plan.order));
    expect(plan.maxWidth).toBeLessThanOrEqual(2 * 4 + 2);
  });
  it('keeps a shuffled braid closure within 2·strands + 2 open ends (a sweep along the braid needs 2·strands)', () => {
    const random = rng(209);
    for (const strands of [3, 4, 5, 6]) {
      const d = randomReducedAlternating(random, 120, strands); // at most `strands` strands
      expect(planContraction(d).maxWidth).toBeLessThanOrEqual(2 * strands + 2);
    }
  });
});
