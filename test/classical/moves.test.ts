import { describe, expect, it } from 'vitest';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import type { LinkDiagram } from '../../src/core/diagram/model.ts';
import { addCurl, connectedSum } from '../../src/core/diagram/operations.ts';
import { classicalInvariants } from '../../src/core/invariants/classical/index.ts';
import { Laurent } from '../../src/core/poly/laurent.ts';
import { parseDiagramCode } from '../../src/core/notation/index.ts';
import { randomDiagram, randomInt, rng } from '../support/random-diagrams.ts';

function summary(d: LinkDiagram): string {
  const c = classicalInvariants(d);
  return `${c.alexander.toPlainString('t')} | ${c.conway.toPlainString('z')} | ${c.determinant} | ${c.signature}`;
}

describe('classical invariants are invariants of the link, not the diagram', () => {
  it('are unchanged by Reidemeister I curls of every kind on random diagrams (common practice)', () => {
    const random = rng(41);
    for (let trial = 0; trial < 40; trial++) {
      const d = randomDiagram(random, 9, 4);
      if (d.edgeCount === 0) continue;
      const edge = randomInt(random, 0, d.edgeCount - 1);
      const curled = addCurl(d, edge, random() < 0.5 ? 1 : -1, random() < 0.5);
      expect(summary(curled)).toBe(summary(d));
    }
  });
  it('agree for the figure-eight knot given as a braid word, a PD code and a DT code (from memory: 4₁ codes)', () => {
    const braid = closeBraid([1, -2, 1, -2], 3);
    const pd = parseDiagramCode('(4,2,5,1) (8,6,1,5) (6,3,7,4) (2,7,3,8)', 'pd');
    const dt = parseDiagramCode('4 6 8 2', 'dt');
    expect(summary(pd)).toBe(summary(braid));
    expect(summary(dt)).toBe(summary(braid));
  });
  it('agree for conjugate braids and under the Markov stabilisation (from memory: Markov)', () => {
    const random = rng(42);
    for (let trial = 0; trial < 20; trial++) {
      const strands = randomInt(random, 2, 4);
      const word = Array.from({ length: randomInt(random, 1, 8) }, () => randomInt(random, 1, strands - 1) * (random() < 0.5 ? 1 : -1));
      const rotated = [...word.slice(1), word[0]!];
      expect(summary(closeBraid(rotated, strands))).toBe(summary(closeBraid(word, strands)));
      const stabilised = [...word, random() < 0.5 ? strands : -strands];
      expect(summary(closeBraid(stabilised, strands + 1))).toBe(summary(closeBraid(word, strands)));
    }
  });
  for (const [name, code, alexander, determinant, absSignature] of [
    ['5₂', '4 8 10 2 6', [[-1, 2], [0, -3], [1, 2]], 7n, 2],
    ['6₁', '4 8 12 10 2 6', [[-1, -2], [0, 5], [1, -2]], 9n, 0],
    ['6₂', '4 8 10 12 2 6', [[-2, -1], [-1, 3], [0, -3], [1, 3], [2, -1]], 11n, 2],
    ['6₃', '4 8 10 2 12 6', [[-2, 1], [-1, -3], [0, 5], [1, -3], [2, 1]], 13n, 0],
  ] as const) {
    it(`${name} from its DT code ${code}: Δ, det ${determinant}, |σ| = ${absSignature} (from memory: knot tables)`, () => {
      const c = classicalInvariants(parseDiagramCode(code, 'dt'));
      expect(c.alexander.equals(Laurent.fromTerms(alexander))).toBe(true);
      expect(c.determinant).toBe(determinant);
      expect(Math.abs(c.signature)).toBe(absSignature);
    });
  }
  it('survive connected sums at random edges with curls added (internal cross-checks run on every diagram; Δ multiplies, σ adds)', () => {
    const random = rng(43);
    for (let trial = 0; trial < 25; trial++) {
      let a = randomDiagram(random, 7, 4);
      const b = randomDiagram(random, 7, 4);
      if (a.crossings.length === 0 || b.crossings.length === 0) continue;
      a = addCurl(a, randomInt(random, 0, a.edgeCount - 1), random() < 0.5 ? 1 : -1, random() < 0.5);
      const sum = connectedSum(a, b, randomInt(random, 0, a.edgeCount - 1), randomInt(random, 0, b.edgeCount - 1));
      const [ca, cb, cs] = [a, b, sum].map(classicalInvariants);
      expect(cs!.signature).toBe(ca!.signature + cb!.signature);
      expect(cs!.alexander.equals(ca!.alexander.mul(cb!.alexander))).toBe(true);
      expect(cs!.determinant).toBe(ca!.determinant * cb!.determinant);
    }
  });
});
