/**
 * Knot diagrams that are not braid closures. In a braid closure the Seifert
 * circles are nested one inside the next, so the regions between them form a
 * path; a general diagram has circles side by side, and the Seifert matrix then
 * links loops of sibling regions through a common parent circle. Random DT
 * codes (the realisable ones, with random over/under choices) give such
 * diagrams; the Seifert-matrix route is checked against Fox calculus and the
 * Conway skein relation on them (the run-time cross-checks — Goeritz σ and
 * det, the symmetry of Δ — run on every one as well).
 */
import { describe, expect, it } from 'vitest';
import { componentCount, type LinkDiagram } from '../../src/core/diagram/model.ts';
import { smoothCrossing, switchCrossing } from '../../src/core/diagram/operations.ts';
import { isInputError } from '../../src/core/errors.ts';
import { classicalInvariants } from '../../src/core/invariants/classical/index.ts';
import { parseDiagramCode } from '../../src/core/notation/index.ts';
import { Laurent } from '../../src/core/poly/laurent.ts';
import { randomInt, rng } from '../support/random-diagrams.ts';
import { equalUpToUnit, foxAlexander } from './support.ts';

/** Random realisable DT codes of 3 to `maxCrossings` crossings with random signs. */
function randomDtDiagrams(seed: number, count: number, maxCrossings: number): LinkDiagram[] {
  const random = rng(seed);
  const diagrams: LinkDiagram[] = [];
  while (diagrams.length < count) {
    const n = randomInt(random, 3, maxCrossings);
    const evens = Array.from({ length: n }, (_, k) => 2 * k + 2);
    for (let k = n - 1; k > 0; k--) {
      const j = randomInt(random, 0, k);
      [evens[k], evens[j]] = [evens[j]!, evens[k]!];
    }
    const code = evens.map((e) => (random() < 0.5 ? -e : e)).join(' ');
    try {
      diagrams.push(parseDiagramCode(code, 'dt'));
    } catch (error) {
      if (!isInputError(error)) throw error;
    }
  }
  return diagrams;
}

const z = Laurent.monomial(1);

describe('classical invariants of random DT diagrams (Seifert circles side by side)', () => {
  const diagrams = randomDtDiagrams(41, 60, 10);
  it('Δ agrees up to ±t^k with Fox calculus on the Wirtinger presentation (from memory: Fox)', () => {
    for (const d of diagrams) {
      if (d.crossings.length < 2) continue;
      expect(equalUpToUnit(foxAlexander(d), classicalInvariants(d).alexander)).toBe(true);
    }
  });
  it('the Conway skein relation ∇(L₊) − ∇(L₋) = z·∇(L₀) holds at every crossing (from memory: Conway)', () => {
    for (const d of diagrams.slice(0, 15)) {
      for (let k = 0; k < d.crossings.length; k++) {
        const [plus, minus] = d.crossings[k]!.sign === 1 ? [d, switchCrossing(d, k)] : [switchCrossing(d, k), d];
        const smoothed = smoothCrossing(d, k);
        expect(componentCount(smoothed)).toBe(2);
        const nabla = (x: LinkDiagram): Laurent => classicalInvariants(x).conway;
        expect(nabla(plus).sub(nabla(minus)).equals(z.mul(nabla(smoothed)))).toBe(true);
      }
    }
  });
});
