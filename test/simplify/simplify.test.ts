/**
 * The simplifier on diagrams of known knots made bigger by Reidemeister moves
 * (braid words scrambled by σᵢσᵢ⁻¹ insertions, braid relations, far
 * commutations and stabilisations, then shuffled): the Jones polynomial never
 * changes (it is a link invariant, Jones 1985), the count never grows, and most
 * diagrams return to the knot's crossing number (the knot tables, from memory).
 */
import { describe, expect, it } from 'vitest';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { nonPlanarPieces } from '../../src/core/diagram/faces.ts';
import { structuralProblem } from '../../src/core/diagram/model.ts';
import { addCurl } from '../../src/core/diagram/operations.ts';
import { jonesPolynomial } from '../../src/core/invariants/jones.ts';
import { parseDiagramCode } from '../../src/core/notation/index.ts';
import { printGaussCode, printPdCode } from '../../src/core/notation/print.ts';
import { describeMoves, simplifyDiagram } from '../../src/core/simplify/simplify.ts';
import { rng, shuffleDiagram } from '../support/random-diagrams.ts';
import { scrambleBraid } from '../support/scramble.ts';

// Braid words of knots and their crossing numbers (from memory: the knot tables; 8₁₉ = T(3, 4)).
const KNOTS: [string, number[], number, number][] = [
  ['3₁', [1, 1, 1], 2, 3],
  ['4₁', [1, -2, 1, -2], 3, 4],
  ['5₁', [1, 1, 1, 1, 1], 2, 5],
  ['5₂', [1, 1, 1, 2, -1, 2], 3, 5],
  ['6₂', [1, 1, 1, -2, 1, -2], 3, 6],
  ['8₁₉', [1, 2, 1, 2, 1, 2, 1, 2], 3, 8],
];

describe('scrambled diagrams of known knots', () => {
  let returned = 0;
  let total = 0;
  for (const [name, word, strands, crossingNumber] of KNOTS) {
    it(`${name}: 8 scrambles keep V, never grow, and come back to ${crossingNumber} crossings`, () => {
      for (let seed = 1; seed <= 8; seed++) {
        const random = rng(seed * 97 + crossingNumber);
        const scrambled = scrambleBraid(random, word, strands, 12);
        const d = shuffleDiagram(closeBraid(scrambled.word, scrambled.strands), random);
        const { diagram, moves } = simplifyDiagram(d);
        expect(structuralProblem(diagram)).toBeUndefined();
        expect(nonPlanarPieces(diagram)).toEqual([]);
        expect(jonesPolynomial(diagram).equals(jonesPolynomial(d))).toBe(true);
        expect(diagram.crossings.length).toBeLessThanOrEqual(d.crossings.length);
        expect(diagram.crossings.length).toBeGreaterThanOrEqual(crossingNumber);
        expect(describeMoves(moves)).toMatch(/^\d+ moves? \(/);
        total++;
        if (diagram.crossings.length === crossingNumber) returned++;
      }
    });
  }
  it('most return to the minimum', () => {
    expect(total).toBe(8 * KNOTS.length);
    expect(returned / total).toBeGreaterThan(0.8);
  });
});

describe('crossing numbers through simplification', () => {
  it('a figure-eight knot with an R2 bigon pushed in is reduced and then exact by KMT, and the report says how', () => {
    const r = analyzeDiagram(closeBraid([1, -2, 2, -2, 1, -2], 3));
    expect(r.crossings).toBe(6);
    expect(r.crossingNumber.exact).toBe(4);
    const exact = r.crossingNumber.reasons.find((x) => x.bound === 'exact')!;
    expect(exact.theorem).toBe('kauffman-murasugi-thistlethwaite');
    expect(exact.text).toMatch(/Reidemeister II/);
    expect(r.simplified?.diagram.crossings.length).toBe(4);
  });
  it('the simplified diagram prints in PD and Gauss notation and parses back to the same knot', () => {
    const r = analyzeDiagram(closeBraid([1, 1, 2, -1, -2, 1, -2, 2], 3));
    const s = r.simplified!.diagram;
    for (const [code, notation] of [[printPdCode(s), 'pd'], [printGaussCode(s), 'gauss']] as const) {
      expect(jonesPolynomial(parseDiagramCode(code, notation)).equals(r.jones)).toBe(true);
    }
  });
  it('a diagram already minimal is left alone (no simplified diagram)', () => {
    expect(analyzeDiagram(closeBraid([1, 2, 1, 2, 1, 2, 1, 2], 3)).simplified).toBeUndefined();
  });
  it('a trefoil with curls of both kinds returns to 3 crossings', () => {
    let d = closeBraid([1, 1, 1], 2);
    d = addCurl(addCurl(d, 0, 1, true), 2, -1, false);
    const { diagram } = simplifyDiagram(d);
    expect(diagram.crossings.length).toBe(3);
  });
});
