import { describe, expect, it } from 'vitest';
import { closeBraid } from '../../../src/core/diagram/braid-closure.ts';
import { componentCount, mirrorDiagram, type LinkDiagram } from '../../../src/core/diagram/model.ts';
import { addCurl, connectedSum, disjointUnion } from '../../../src/core/diagram/operations.ts';
import { classicalInvariants } from '../../../src/core/invariants/classical/index.ts';
import type { KhovanovHomology } from '../../../src/core/invariants/khovanov/homology.ts';
import { khovanovReport } from '../../../src/core/invariants/khovanov/index.ts';
import { khovanovAndReduced } from '../../../src/core/invariants/khovanov/local.ts';
import { rasmussenInvariant } from '../../../src/core/invariants/khovanov/rasmussen.ts';
import { randomAlternatingBraidWord, randomBraidWord, randomDiagram, randomInt, rng, shuffleDiagram } from '../../support/random-diagrams.ts';

const kh = (d: LinkDiagram): KhovanovHomology => khovanovAndReduced(d).unreduced;

/** Rational ranks as a map "i,j" → rank. */
const rankMap = (h: KhovanovHomology): Map<string, number> => new Map(h.ranks.map(([i, j, r]) => [`${i},${j}`, r]));

/** The rational Poincaré polynomial of a tensor product of two bigraded spaces. */
function tensorRanks(a: KhovanovHomology['ranks'], b: KhovanovHomology['ranks']): Map<string, number> {
  const result = new Map<string, number>();
  for (const [i1, j1, r1] of a) for (const [i2, j2, r2] of b) result.set(`${i1 + i2},${j1 + j2}`, (result.get(`${i1 + i2},${j1 + j2}`) ?? 0) + r1 * r2);
  return result;
}

function randomKnots(seed: number, count: number, make: (random: () => number) => LinkDiagram): LinkDiagram[] {
  const random = rng(seed);
  const knots: LinkDiagram[] = [];
  for (let tries = 0; knots.length < count && tries < 50 * count; tries++) {
    const d = make(random);
    if (componentCount(d) === 1 && d.crossings.length > 0) knots.push(d);
  }
  return knots;
}

describe('mirror duality: Kh^{i,j}(m L) free ≅ Kh^{−i,−j}(L) free, torsion ≅ torsion at (1 − i, −j) (Khovanov, Duke Math. J. 101 (2000), Prop. 35, with the universal coefficient theorem)', () => {
  it('holds over ℤ on 60 random diagrams up to 12 crossings', () => {
    const random = rng(1301);
    for (let k = 0; k < 60; k++) {
      const d = randomDiagram(random, 12, 4);
      const a = kh(d);
      const b = kh(mirrorDiagram(d));
      expect(rankMap(b)).toEqual(new Map(a.ranks.map(([i, j, r]) => [`${0 - i},${0 - j}`, r])));
      const shifted = a.torsion.map(([i, j, o, m]) => [1 - i, 0 - j, o, m]).sort((x, y) => x[0]! - y[0]! || x[1]! - y[1]! || x[2]! - y[2]!);
      expect(b.torsion).toEqual(shifted);
    }
  });
});

describe('Künneth over ℚ', () => {
  it('split union: Kh(L₁ ⊔ L₂) = Kh(L₁) ⊗ Kh(L₂) on 30 random pairs (Khovanov 2000, Prop. 33)', () => {
    const random = rng(1302);
    for (let k = 0; k < 30; k++) {
      const a = randomDiagram(random, 6, 3);
      const b = randomDiagram(random, 6, 3);
      expect(rankMap(kh(shuffleDiagram(disjointUnion(a, b), random)))).toEqual(tensorRanks(kh(a).ranks, kh(b).ranks));
    }
  });
  it('connected sum of knots: reduced Kh̃(K₁ # K₂) = Kh̃(K₁) ⊗ Kh̃(K₂) on 20 random pairs (Khovanov, Patterns in knot cohomology I, Exp. Math. 12 (2003))', () => {
    const knots = randomKnots(1303, 40, (random) => randomDiagram(random, 7, 3));
    for (let k = 0; k < 20; k++) {
      const [a, b] = [knots[2 * k]!, knots[2 * k + 1]!];
      const sum = khovanovAndReduced(connectedSum(a, b)).reduced;
      expect(rankMap(sum)).toEqual(tensorRanks(khovanovAndReduced(a).reduced.ranks, khovanovAndReduced(b).reduced.ranks));
    }
  });
});

describe('invariance under Reidemeister moves (Khovanov 2000; Bar-Natan, Geom. Topol. 9 (2005))', () => {
  it('integral homology is unchanged by random curls (R I), braid relations (R II, R III), conjugation and stabilisation', () => {
    const random = rng(1304);
    for (let k = 0; k < 40; k++) {
      const strands = randomInt(random, 2, 4);
      const word = randomBraidWord(random, strands, randomInt(random, 1, 8));
      const base = kh(closeBraid(word, strands));
      // R II: insert σᵢσᵢ⁻¹; R III: σ₁σ₂σ₁ → σ₂σ₁σ₂ inserted as a cancelling pair of both sides.
      const g = randomInt(random, 1, strands - 1);
      const at = randomInt(random, 0, word.length);
      const moved = [...word.slice(0, at), g, -g, ...word.slice(at)];
      if (strands >= 3) moved.push(1, 2, 1, -2, -1, -2);
      // Conjugation and a stabilisation on a new strand.
      const rotated = [...moved.slice(1), moved[0]!, random() < 0.5 ? strands : -strands];
      let d = closeBraid(rotated, strands + 1);
      d = addCurl(d, randomInt(random, 0, d.edgeCount - 1), random() < 0.5 ? 1 : -1, random() < 0.5);
      expect(kh(shuffleDiagram(d, random))).toEqual(base);
    }
  });
});

describe("alternating knots (Lee, Endomorphisms of Khovanov homology, 2005; Rasmussen 2010)", () => {
  const knots = randomKnots(1305, 25, (random) => {
    const strands = randomInt(random, 2, 5);
    return shuffleDiagram(closeBraid(randomAlternatingBraidWord(random, strands, randomInt(random, 2 * (strands - 1), 13)), strands), random);
  });
  it('rational Kh lies on the diagonals j − 2i = −σ ± 1 (σ(right-handed trefoil) = −2), hence thin, and s = −σ', () => {
    expect(knots.length).toBe(25);
    for (const d of knots) {
      const sigma = classicalInvariants(d).signature;
      const report = khovanovReport(d);
      for (const [i, j] of report.homology.ranks) expect([-sigma - 1, -sigma + 1]).toContain(j - 2 * i);
      expect(report.thin).toBe(true);
      expect(report.rasmussen).toBe(0 - sigma);
      // Reduced homology of an alternating knot sits on the single diagonal j − 2i = −σ.
      for (const [i, j] of report.reduced!.ranks) expect(j - 2 * i).toBe(0 - sigma);
    }
  });
});

describe('positive braids: s = n − k + 1 for n crossings on k strands (Rasmussen, Invent. Math. 182 (2010))', () => {
  it('holds on 25 random positive braid closures that are knots, and |s|/2 is then the genus (slice-genus bound)', () => {
    const knots = randomKnots(1306, 25, (random) => {
      const k = randomInt(random, 2, 4);
      const word: number[] = [];
      for (let g = 1; g < k; g++) word.push(g);
      while (word.length < randomInt(random, k, 12)) word.push(randomInt(random, 1, k - 1));
      for (let i = word.length - 1; i > 0; i--) {
        const j = randomInt(random, 0, i);
        [word[i], word[j]] = [word[j]!, word[i]!];
      }
      return closeBraid(word, k);
    });
    expect(knots.length).toBe(25);
    for (const d of knots) {
      const n = d.crossings.length;
      const k = classicalInvariants(d).seifertCircles; // a braid closure's Seifert circles are its strands
      expect(rasmussenInvariant(d)).toBe(n - k + 1);
    }
  });
});
