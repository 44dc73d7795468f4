/**
 * Printers and parsers against each other on random diagrams (closures of
 * random braid words, crossings shuffled and edges renumbered), with the
 * state-sum bracket as the judge.
 */
import { describe, expect, it } from 'vitest';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { nonPlanarPieces } from '../../src/core/diagram/faces.ts';
import { structuralProblem, type LinkDiagram } from '../../src/core/diagram/model.ts';
import { bracketByStateSum } from '../../src/core/invariants/state-sum.ts';
import { parseDiagramCode, printDtCode, printGaussCode, printPdCode } from '../../src/core/notation/index.ts';
import { randomBraidWord, randomDiagram, randomInt, rng, shuffleDiagram } from '../support/random-diagrams.ts';
import { equalUpToMirror } from './helpers.ts';

/** A random knot diagram: a braid closure whose permutation is one cycle (one component), crossings shuffled. */
function randomKnot(random: () => number, maxCrossings: number, strands: number): LinkDiagram {
  for (;;) {
    const word = randomBraidWord(random, strands, randomInt(random, 1, maxCrossings));
    // The closure is a knot exactly when the braid's permutation is one cycle.
    const permutation = Array.from({ length: strands }, (_, p) => p);
    for (const g of word) {
      const i = Math.abs(g) - 1;
      [permutation[i], permutation[i + 1]] = [permutation[i + 1]!, permutation[i]!];
    }
    let length = 1;
    for (let p = permutation[0]!; p !== 0; p = permutation[p]!) length++;
    if (length === strands) return shuffleDiagram(closeBraid(word, strands), random);
  }
}

/**
 * Independent of the parser: whether the interlacement graph of a DT code is
 * connected (crossing b interlaces a when exactly one visit of b lies between
 * a's labels). Only then does a DT code fix the diagram up to mirror image;
 * otherwise the parts can be realised with independent chiralities (common
 * practice: DT codes of composite knots are ambiguous).
 */
function interlacementConnected(code: string): boolean {
  const entries = code.split(' ').map(Number);
  const ends = entries.map((e, k) => [Math.min(2 * k + 1, Math.abs(e)), Math.max(2 * k + 1, Math.abs(e))] as const);
  const between = (a: number, p: number): boolean => p > ends[a]![0] && p < ends[a]![1];
  const interlaced = (a: number, b: number): boolean => between(a, ends[b]![0]) !== between(a, ends[b]![1]);
  const reached = new Set([0]);
  const queue = [0];
  while (queue.length) {
    const a = queue.pop()!;
    for (let b = 0; b < entries.length; b++) if (!reached.has(b) && interlaced(a, b)) reached.add(b), queue.push(b);
  }
  return reached.size === entries.length;
}

describe('PD and Gauss round trips', () => {
  it('parse(print(d)) has the bracket of d, for 300 random diagrams up to 12 crossings', () => {
    const random = rng(2024);
    let pdChecked = 0;
    for (let trial = 0; trial < 300; trial++) {
      const d = randomDiagram(random, 12, 5);
      const bracket = bracketByStateSum(d);
      const gauss = parseDiagramCode(printGaussCode(d), 'gauss');
      expect(structuralProblem(gauss)).toBeUndefined();
      expect(gauss.freeLoops).toBe(d.freeLoops);
      expect(bracketByStateSum(gauss).equals(bracket)).toBe(true);
      if (d.freeLoops === 0) {
        const pd = parseDiagramCode(printPdCode(d), 'pd');
        expect(structuralProblem(pd)).toBeUndefined();
        expect(bracketByStateSum(pd).equals(bracket)).toBe(true);
        pdChecked++;
      }
    }
    expect(pdChecked).toBeGreaterThan(100);
  });

  it('keeps the crossing signs through the Gauss code exactly, and through the PD code except at over-only two-edge components', () => {
    const random = rng(99);
    for (let trial = 0; trial < 200; trial++) {
      const d = randomDiagram(random, 16, 5);
      const gauss = parseDiagramCode(printGaussCode(d), 'gauss');
      expect(gauss.crossings.map((c) => c.sign)).toEqual(d.crossings.map((c) => c.sign));
      if (d.freeLoops === 0 && d.components.every((c) => c.length > 2)) {
        const pd = parseDiagramCode(printPdCode(d), 'pd');
        expect(pd.crossings.map((c) => c.sign)).toEqual(d.crossings.map((c) => c.sign));
      }
    }
  });
});

describe('DT realisation', () => {
  it('realises the DT codes of 400 random knot diagrams (up to 14 crossings): same bracket up to mirror when prime, same code always', () => {
    const random = rng(7);
    let prime = 0;
    for (let trial = 0; trial < 400; trial++) {
      const d = randomKnot(random, 14, randomInt(random, 2, 5));
      const code = printDtCode(d);
      const r = parseDiagramCode(code, 'dt');
      expect(structuralProblem(r)).toBeUndefined();
      expect(nonPlanarPieces(r)).toEqual([]);
      expect(printDtCode(r)).toBe(code);
      if (interlacementConnected(code)) {
        prime++;
        expect(equalUpToMirror(bracketByStateSum(r), bracketByStateSum(d))).toBe(true);
      }
    }
    expect(prime).toBeGreaterThan(200);
  });

  it('realises large random knot diagrams (about 60, 200 and 600 crossings) and reproduces their codes', () => {
    const random = rng(31);
    for (const crossings of [60, 200, 600]) {
      const d = randomKnot(random, crossings, 7);
      const code = printDtCode(d);
      const r = parseDiagramCode(code, 'dt');
      expect(nonPlanarPieces(r)).toEqual([]);
      expect(printDtCode(r)).toBe(code);
    }
  });
});
