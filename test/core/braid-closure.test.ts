import { describe, expect, it } from 'vitest';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { componentCount, mirrorDiagram, structuralProblem, writhe } from '../../src/core/diagram/model.ts';
import { nonPlanarPieces } from '../../src/core/diagram/faces.ts';
import { bracketByStateSum } from '../../src/core/invariants/state-sum.ts';

describe('braid closures as diagrams', () => {
  it('closes 1 1 1 to a 3-crossing knot of writhe 3 (common practice)', () => {
    const d = closeBraid([1, 1, 1], 2);
    expect(d.crossings.length).toBe(3);
    expect(componentCount(d)).toBe(1);
    expect(writhe(d)).toBe(3);
    expect(structuralProblem(d)).toBeUndefined();
    expect(nonPlanarPieces(d)).toEqual([]);
  });
  it('counts strands that never cross as free loops', () => {
    const d = closeBraid([1], 4);
    expect(componentCount(d)).toBe(3);
    expect(d.freeLoops).toBe(2);
  });
  it('gives the bracket of the positive trefoil A^-7 - A^-3 - A^5 (from memory: Kauffman 1987, with <O> = 1)', () => {
    expect(bracketByStateSum(closeBraid([1, 1, 1], 2)).terms()).toEqual([[-7, 1n], [-3, -1n], [5, -1n]]);
  });
  it('mirrors by switching every crossing: bracket A ↦ A^-1 (Kauffman 1987)', () => {
    const d = closeBraid([1, 1, -2, 1, -2, 1], 3);
    const m = mirrorDiagram(d);
    expect(structuralProblem(m)).toBeUndefined();
    expect(writhe(m)).toBe(-writhe(d));
    expect(bracketByStateSum(m).equals(bracketByStateSum(d).substitutePower(-1))).toBe(true);
  });
});
