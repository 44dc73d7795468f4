/**
 * The figure is drawn from the code, and reading the picture back gives the
 * code's diagram: every intersection of the drawn centre lines is a crossing of
 * the code (and there is no other), the strand broken there is the code's
 * under-strand, and walking the curves rebuilds the same oriented diagram on the
 * sphere up to relabelling (same crossings, signs, slots and edge joins).
 * The reference is the geometry alone: segment intersections of the flattened
 * Béziers and ink probes on the drawn strokes (common practice in computational geometry).
 */
import { describe, expect, it } from 'vitest';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { mirrorDiagram, type LinkDiagram } from '../../src/core/diagram/model.ts';
import { addCurl, disjointUnion, switchCrossing, withFreeLoops } from '../../src/core/diagram/operations.ts';
import { drawDiagram, type Drawing } from '../../src/core/drawing/index.ts';
import { readBackDrawing, sameDiagram } from '../../src/core/drawing/read-back.ts';
import { expectReadsBack } from '../support/read-back.ts';
import { parseDiagramCode } from '../../src/core/notation/index.ts';
import { randomDiagram, randomInt, randomReducedAlternating, rng, shuffleDiagram } from '../support/random-diagrams.ts';

const TREFOIL = '(1,5,2,4) (3,1,4,6) (5,3,6,2)';

describe('sameDiagram, the comparison the read-back relies on', () => {
  it('finds a diagram equal to itself with crossings and edges renumbered at random', () => {
    const random = rng(5);
    for (let i = 0; i < 20; i++) {
      const d = randomDiagram(random, 20, 4);
      expect(sameDiagram(d, shuffleDiagram(d, random))).toBe(true);
    }
  });

  it('tells the trefoil from its mirror image and from a diagram with one crossing switched (they differ in signs: common practice)', () => {
    const d = parseDiagramCode(TREFOIL, 'pd');
    expect(sameDiagram(d, mirrorDiagram(d))).toBe(false);
    expect(sameDiagram(d, switchCrossing(d, 1))).toBe(false);
  });
});

describe('reading a figure back', () => {
  it('gives back the small and awkward diagrams: a curl, a 2-crossing Hopf link, free loops, split pieces, a crossing touching a face twice', () => {
    const hopf = closeBraid([1, 1], 2);
    const trefoil = parseDiagramCode(TREFOIL, 'pd');
    const cases: [string, LinkDiagram][] = [
      ['one curl (unknot with one crossing)', closeBraid([1], 2)],
      ['two curls on one unknot', closeBraid([1, -1], 2)],
      ['Hopf link', hopf],
      ['trefoil', trefoil],
      ['trefoil with a curl', addCurl(trefoil, 0, -1, true)],
      ['trefoil and a free loop', withFreeLoops(trefoil, 1)],
      ['split: trefoil beside a Hopf link', disjointUnion(trefoil, hopf)],
      ['three pieces and two free loops', withFreeLoops(disjointUnion(disjointUnion(trefoil, hopf), closeBraid([1], 2)), 2)],
      ['figure eight', closeBraid([1, -2, 1, -2], 3)],
    ];
    for (const [label, d] of cases) expectReadsBack(d, label);
  });

  it('draws a diagram without crossings as its circles', () => {
    const unlink = withFreeLoops(closeBraid([], 1), 0);
    const drawing = drawDiagram(unlink);
    expect(drawing.components.length).toBe(1);
    expect(readBackDrawing(drawing).diagram?.freeLoops).toBe(1);
  });

  it('gives back 200 random diagrams of 3 to 30 crossings: knots and links, alternating and not, split and not', () => {
    const random = rng(2026);
    for (let i = 0; i < 200; i++) {
      const size = randomInt(random, 3, 30);
      let d = i % 2 === 0 ? randomReducedAlternating(random, size) : randomDiagram(random, size, 5);
      if (i % 7 === 0) d = shuffleDiagram(disjointUnion(d, randomDiagram(random, 8, 3)), random);
      expectReadsBack(d, `sample ${i} (${d.crossings.length} crossings)`);
    }
  });

  it('notices a figure whose under-strands are not broken, and one showing another diagram', () => {
    const d = parseDiagramCode(TREFOIL, 'pd');
    const drawing = drawDiagram(d);
    const unbroken: Drawing = { ...drawing, components: drawing.components.map((c) => ({ ...c, strokes: [{ cubics: c.centreLine, closed: true }] })) };
    const back = readBackDrawing(unbroken);
    expect(back.diagram).toBeUndefined();
    expect(back.problems.length).toBe(3);
    expect(back.problems[0]).toMatch(/neither strand is broken/);
    const mirror = readBackDrawing(drawDiagram(mirrorDiagram(d))).diagram!;
    expect(sameDiagram(d, mirror)).toBe(false);
  });
});

