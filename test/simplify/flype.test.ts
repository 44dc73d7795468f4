/**
 * Flypes on the diagram model and in the simplifier. A flype is an isotopy, so
 * every link invariant survives it: the Jones polynomial (Jones 1985), the
 * Alexander polynomial from a Seifert matrix (Seifert 1935) and the HOMFLY-PT
 * polynomial (Freyd–Yetter–Hoste–Lickorish–Millett–Ocneanu 1985) are checked on
 * random shuffled diagrams. Polynomials do not tell a flype from a mutation, so
 * the strands are checked too: the writhe stays (common practice: the moved
 * crossing keeps its sign), and a reduced alternating diagram stays reduced alternating
 * (common practice: flypes are the moves of Tait's flyping conjecture,
 * Menasco–Thistlethwaite 1993, which act within reduced alternating diagrams).
 */
import { describe, expect, it } from 'vitest';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import { computeJson } from '../../src/cli/compute-json.ts';
import { crossingNumberStatement } from '../../src/core/claims/crossing-number.ts';
import { DEFAULT_CONVENTION } from '../../src/core/convention/convention.ts';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { nonPlanarPieces } from '../../src/core/diagram/faces.ts';
import { componentCount, structuralProblem, writhe, type LinkDiagram } from '../../src/core/diagram/model.ts';
import { diagramProperties } from '../../src/core/diagram/properties.ts';
import { classicalInvariants } from '../../src/core/invariants/classical/index.ts';
import { homflyPolynomial } from '../../src/core/invariants/homfly/homfly.ts';
import { jonesPolynomial } from '../../src/core/invariants/jones.ts';
import { parseDiagramCode } from '../../src/core/notation/index.ts';
import { flype, flypeSites } from '../../src/core/simplify/flype.ts';
import { overBigons } from '../../src/core/simplify/moves.ts';
import { DEFAULT_BUDGET, describeMoves, simplifyDiagram } from '../../src/core/simplify/simplify.ts';
import { randomAlternatingBraidWord, randomDiagram, randomInt, randomReducedAlternating, rng } from '../support/random-diagrams.ts';

const family = (code: string): LinkDiagram => parseDiagramCode(code, 'family');

/** Every diagram one flype away. */
function flyped(d: LinkDiagram): LinkDiagram[] {
  return flypeSites(d).flatMap((site) => flype(d, site) ?? []);
}

function expectSound(result: LinkDiagram, from: LinkDiagram): void {
  expect(structuralProblem(result)).toBeUndefined();
  expect(nonPlanarPieces(result)).toEqual([]);
  expect(result.crossings.length).toBe(from.crossings.length);
  expect(componentCount(result)).toBe(componentCount(from));
  expect(writhe(result)).toBe(writhe(from));
}

describe('a flype keeps the link', () => {
  it('Jones polynomial and writhe after every flype of 80 random shuffled diagrams (up to 14 crossings, 5 strands)', () => {
    const random = rng(2026);
    let made = 0;
    for (let i = 0; i < 80; i++) {
      const d = randomDiagram(random, 14, 5);
      const v = jonesPolynomial(d);
      for (const result of flyped(d)) {
        expectSound(result, d);
        expect(jonesPolynomial(result).equals(v)).toBe(true);
        made++;
      }
    }
    // Enough flypes were made for the check to mean something.
    expect(made).toBeGreaterThan(600);
  });
  it('Alexander polynomial (Seifert matrix) and HOMFLY-PT after one random flype each of 60 random diagrams', () => {
    const random = rng(77);
    let made = 0;
    for (let i = 0; i < 60; i++) {
      const d = randomDiagram(random, 12, 4);
      const results = flyped(d);
      if (results.length === 0) continue;
      const result = results[randomInt(random, 0, results.length - 1)]!;
      expect(classicalInvariants(result).alexander.equals(classicalInvariants(d).alexander)).toBe(true);
      expect(homflyPolynomial(result).polynomial.equals(homflyPolynomial(d).polynomial)).toBe(true);
      made++;
    }
    expect(made).toBeGreaterThan(30);
  });
  it('a flype keeps alternation, adequacy and the circle counts of the all-A and all-B states (the tangle\'s part of each state is only reflected), so on its own it never decides a crossing number', () => {
    const random = rng(31);
    let made = 0;
    for (let i = 0; i < 60; i++) {
      const d = randomDiagram(random, 12, 5);
      const before = diagramProperties(d);
      for (const result of flyped(d)) {
        const after = diagramProperties(result);
        expect([after.alternating, after.aAdequate, after.bAdequate]).toEqual([before.alternating, before.aAdequate, before.bAdequate]);
        expect(after.stateCircles).toEqual(before.stateCircles);
        made++;
      }
    }
    expect(made).toBeGreaterThan(300);
  });
  it('a reduced alternating diagram stays reduced alternating, with the same count, under every flype', () => {
    const random = rng(9);
    let made = 0;
    for (let i = 0; i < 40; i++) {
      const d = randomReducedAlternating(random, randomInt(random, 6, 14));
      for (const result of flyped(d)) {
        const p = diagramProperties(result);
        expect(p.alternating && p.reduced).toBe(true);
        made++;
      }
    }
    expect(made).toBeGreaterThan(200);
  });
});

describe('flypes in the simplifier', () => {
  it('P(1, 3, −1, 3, 3) reduces to 9 crossings by one flype and one Reidemeister II, and then KMT makes 9 exact (P(3, 3, 3) = 9₃₅, from memory)', () => {
    const d = family('pretzel 1 3 -1 3 3');
    // Without flypes the search finds nothing: the columns 1 and −1 are not beside each other.
    expect(simplifyDiagram(d, { ...DEFAULT_BUDGET, flypeWork: 0 }).diagram.crossings.length).toBe(11);
    const { diagram, moves } = simplifyDiagram(d);
    expect(diagram.crossings.length).toBe(9);
    expect(moves).toEqual({ nugatory: 0, bigons: 1, slides: 0, flypes: 1 });
    expect(describeMoves(moves)).toBe('2 moves (1 Reidemeister II, 1 flype)');
    expect(jonesPolynomial(diagram).equals(jonesPolynomial(family('pretzel 3 3 3')))).toBe(true);
    const r = analyzeDiagram(d);
    expect(r.crossingNumber.exact).toBe(9);
    const exact = r.crossingNumber.reasons.find((x) => x.bound === 'exact' && x.theorem === 'kauffman-murasugi-thistlethwaite')!;
    expect(exact.text).toMatch(/1 flype/);
    expect(r.crossingNumber.reasons.find((x) => x.bound === 'upper')?.text).toMatch(/^Reidemeister moves and flypes reduce the diagram to 9 crossings/);
    expect(crossingNumberStatement(r, DEFAULT_CONVENTION)).toMatch(/^Moves that keep the link \(1 Reidemeister II, 1 flype\) reduce the diagram to \$9\$ crossings/);
    const json = computeJson('pretzel 1 3 -1 3 3', r, undefined, new Set(['simplified', 'crossingNumber'])) as Record<string, any>;
    expect(json.simplified.moves).toEqual({ nugatory: 0, bigons: 1, slides: 0, flypes: 1 });
    expect(json.simplified.crossings).toBe(9);
  });
  it('reduced alternating diagrams with an R2 bigon split by a flype come back to their crossing number (KMT); slides alone mostly do not', () => {
    const random = rng(11);
    let built = 0;
    let slidesAlone = 0;
    for (let i = 0; built < 12 && i < 200; i++) {
      const strands = randomInt(random, 3, 5);
      const n = randomInt(random, 2 * (strands - 1), 12);
      const word = randomAlternatingBraidWord(random, strands, n);
      const at = randomInt(random, 0, n);
      const g = randomInt(random, 1, strands - 1);
      // σ_g σ_g⁻¹ is a bigon (Reidemeister II); crossings of a braid closure follow the word.
      const padded = closeBraid([...word.slice(0, at), g, -g, ...word.slice(at)], strands);
      const site = flypeSites(padded).find((s) => (s.crossing === at || s.crossing === at + 1) && isHidden(flype(padded, s)));
      if (!site) continue;
      const hidden = flype(padded, site)!;
      built++;
      expect(jonesPolynomial(hidden).equals(jonesPolynomial(closeBraid(word, strands)))).toBe(true);
      const { diagram } = simplifyDiagram(hidden);
      expect(diagram.crossings.length).toBe(n);
      expect(analyzeDiagram(hidden).crossingNumber.exact).toBe(n);
      if (simplifyDiagram(hidden, { ...DEFAULT_BUDGET, flypeWork: 0 }).diagram.crossings.length === n) slidesAlone++;
    }
    expect(built).toBe(12);
    expect(slidesAlone).toBeLessThan(built / 2);
  });
  it('the count never grows, and the link stays, on 150 random shuffled diagrams', () => {
    const random = rng(404);
    for (let i = 0; i < 150; i++) {
      const d = randomDiagram(random, 16, 5);
      const { diagram, moves } = simplifyDiagram(d);
      expect(diagram.crossings.length).toBeLessThanOrEqual(d.crossings.length);
      expect(structuralProblem(diagram)).toBeUndefined();
      if (moves.flypes > 0) expect(jonesPolynomial(diagram).equals(jonesPolynomial(d))).toBe(true);
    }
  });
});

/** A flype result that the greedy moves cannot touch: no bigon to remove and no nugatory crossing. */
function isHidden(d: LinkDiagram | undefined): boolean {
  return d !== undefined && overBigons(d).length === 0 && diagramProperties(d).reduced;
}
