import { describe, expect, it } from 'vitest';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { faceStructure } from '../../src/core/diagram/faces.ts';
import { componentCount, mirrorDiagram, type LinkDiagram } from '../../src/core/diagram/model.ts';
import { connectedSum, disjointUnion, smoothCrossing, switchCrossing, withFreeLoops } from '../../src/core/diagram/operations.ts';
import { alexanderFromSeifertMatrix, conwayFromAlexander } from '../../src/core/invariants/classical/alexander.ts';
import { classicalInvariants } from '../../src/core/invariants/classical/index.ts';
import { seifertSurface } from '../../src/core/invariants/classical/seifert.ts';
import { toDense } from '../../src/core/invariants/classical/sparse-matrix.ts';
import { jonesPolynomial } from '../../src/core/invariants/jones.ts';
import { linkingNumbers } from '../../src/core/diagram/properties.ts';
import { Laurent } from '../../src/core/poly/laurent.ts';
import { randomDiagram, randomInt, rng } from '../support/random-diagrams.ts';
import { equalUpToUnit, foxAlexander, laurentDeterminant } from './support.ts';

const alexander = (d: LinkDiagram): Laurent => classicalInvariants(d).alexander;
const conway = (d: LinkDiagram): Laurent => classicalInvariants(d).conway;
const poly = (terms: [number, number][]): Laurent => Laurent.fromTerms(terms);
const z = Laurent.monomial(1);

/** The torus knot T(p, q) as the closure of (σ1 ⋯ σ_{p−1})^q. */
function torusKnot(p: number, q: number): LinkDiagram {
  const word: number[] = [];
  for (let k = 0; k < q; k++) for (let i = 1; i < p; i++) word.push(i);
  return closeBraid(word, p);
}

/** (t^{pq} − 1)(t − 1)/((t^p − 1)(t^q − 1)), shifted to be symmetric. */
function torusKnotAlexander(p: number, q: number): Laurent {
  const tPower = (k: number): Laurent => Laurent.monomial(k).sub(Laurent.one);
  const quotient = tPower(p * q).mul(tPower(1)).divExact(tPower(p).mul(tPower(q)));
  return quotient.shift(-((p - 1) * (q - 1)) / 2);
}

describe('Alexander and Conway polynomials: worked values', () => {
  it('trefoil Δ = t − 1 + t⁻¹ and ∇ = 1 + z² (from memory)', () => {
    const d = closeBraid([1, 1, 1], 2);
    expect(alexander(d).equals(poly([[-1, 1], [0, -1], [1, 1]]))).toBe(true);
    expect(conway(d).equals(poly([[0, 1], [2, 1]]))).toBe(true);
  });
  it('figure-eight Δ = −t + 3 − t⁻¹ and ∇ = 1 − z² (from memory)', () => {
    const d = closeBraid([1, -2, 1, -2], 3);
    expect(alexander(d).equals(poly([[-1, -1], [0, 3], [1, -1]]))).toBe(true);
    expect(conway(d).equals(poly([[0, 1], [2, -1]]))).toBe(true);
  });
  it('positive Hopf link ∇ = z, Δ = t^(1/2) − t^(−1/2); negative Hopf link ∇ = −z (from memory)', () => {
    const positive = closeBraid([1, 1], 2);
    expect(conway(positive).equals(z)).toBe(true);
    expect(alexander(positive).equals(poly([[0.5, 1], [-0.5, -1]]))).toBe(true);
    expect(conway(closeBraid([-1, -1], 2)).equals(z.neg())).toBe(true);
  });
  it('unknot Δ = 1; split links Δ = ∇ = 0 (from memory)', () => {
    expect(alexander(closeBraid([1], 2)).equals(Laurent.one)).toBe(true);
    expect(alexander(withFreeLoops(closeBraid([], 1), 0)).equals(Laurent.one)).toBe(true);
    expect(alexander(closeBraid([], 2)).isZero).toBe(true);
    expect(conway(disjointUnion(closeBraid([1, 1, 1], 2), closeBraid([1, 1, 1], 2))).isZero).toBe(true);
  });
  for (const [p, q] of [[2, 3], [2, 5], [2, 7], [3, 4], [3, 5], [2, 9], [3, 7], [4, 5]] as const) {
    it(`torus knot T(${p},${q}): Δ = (t^pq − 1)(t − 1)/((t^p − 1)(t^q − 1)), symmetrised (from memory: standard formula)`, () => {
      expect(alexander(torusKnot(p, q)).equals(torusKnotAlexander(p, q))).toBe(true);
    });
  }
});

describe('Alexander and Conway polynomials: identities on random diagrams', () => {
  it('Conway skein relation ∇(L₊) − ∇(L₋) = z·∇(L₀) at a random crossing (from memory: Conway)', () => {
    const random = rng(11);
    for (let trial = 0; trial < 60; trial++) {
      const d = randomDiagram(random, 9, 4);
      if (d.crossings.length === 0) continue;
      const k = randomInt(random, 0, d.crossings.length - 1);
      const [plus, minus] = d.crossings[k]!.sign === 1 ? [d, switchCrossing(d, k)] : [switchCrossing(d, k), d];
      const smoothed = smoothCrossing(d, k);
      expect(conway(plus).sub(conway(minus)).equals(z.mul(conway(smoothed)))).toBe(true);
    }
  });
  it('knots: Δ(t) = Δ(t⁻¹) and Δ(1) = 1; links: ∇ has only powers z^k with k ≡ μ − 1 (mod 2) (from memory)', () => {
    const random = rng(12);
    for (let trial = 0; trial < 60; trial++) {
      const d = randomDiagram(random, 12, 4);
      const { alexander: delta, conway: nabla } = classicalInvariants(d);
      const mu = componentCount(d);
      if (mu === 1) {
        expect(delta.substitutePower(-1).equals(delta)).toBe(true);
        expect(delta.valueAtOne()).toBe(1n);
      }
      for (const [e] of nabla.terms()) expect((e - (mu - 1)) % 2).toBe(0);
      expect(conwayFromAlexander(delta).equals(nabla)).toBe(true);
    }
  });
  it('agrees up to ±t^k with Fox calculus on the Wirtinger presentation of random knots (from memory: Fox)', () => {
    const random = rng(13);
    let checked = 0;
    while (checked < 25) {
      const d = randomDiagram(random, 11, 4);
      if (componentCount(d) !== 1 || d.crossings.length < 2) continue;
      expect(equalUpToUnit(foxAlexander(d), alexander(d))).toBe(true);
      checked++;
    }
  });
  it('links too: a minor of the one-variable Fox matrix is Δ up to ±t^(k/2) (from memory: Fox, with Torres: (t − 1)·Δ(t, …, t) of the multivariable polynomial)', () => {
    const random = rng(77);
    let checked = 0;
    while (checked < 25) {
      const d = randomDiagram(random, 10, 4);
      // The helper needs one Wirtinger arc per crossing: every component must pass under somewhere.
      const everyComponentPassesUnder = d.components.every((comp) => d.crossings.some((c) => comp.includes(c.edges[0])));
      if (componentCount(d) < 2 || d.freeLoops > 0 || d.crossings.length < 2 || !everyComponentPassesUnder) continue;
      expect(equalUpToUnit(foxAlexander(d), alexander(d))).toBe(true);
      checked++;
    }
  });
  it('does not depend on which face holds the point at infinity', () => {
    const random = rng(14);
    for (let trial = 0; trial < 15; trial++) {
      const d = randomDiagram(random, 8, 4);
      if (d.crossings.length === 0 || d.freeLoops > 0 || componentCount(d) > 3) continue;
      const reference = alexanderFromSeifertMatrix(seifertSurface(d).matrix).alexander;
      for (let outer = 0; outer < faceStructure(d).faceCount; outer++) {
        expect(alexanderFromSeifertMatrix(seifertSurface(d, outer).matrix).alexander.equals(reference)).toBe(true);
      }
    }
  });
  it('the modular determinant equals an exact elimination over ℤ[t^(±1/2)]', () => {
    const random = rng(15);
    for (let trial = 0; trial < 20; trial++) {
      const d = randomDiagram(random, 10, 4);
      if (d.crossings.length === 0 || d.freeLoops > 0) continue;
      const v = toDense(seifertSurface(d).matrix);
      const x = Laurent.monomial(0.5);
      const xInverse = Laurent.monomial(-0.5);
      const pencil = v.map((row, i) => row.map((vij, j) => xInverse.scale(vij).sub(x.scale(v[j]![i]!))));
      expect(alexanderFromSeifertMatrix(seifertSurface(d).matrix).alexander.equals(laurentDeterminant(pencil))).toBe(true);
    }
  });
  it('mirror image: ∇_{L*}(z) = ∇_L(−z), so Δ of a knot is unchanged (from memory)', () => {
    const random = rng(16);
    for (let trial = 0; trial < 30; trial++) {
      const d = randomDiagram(random, 10, 4);
      expect(conway(mirrorDiagram(d)).equals(conway(d).alternateSigns(1))).toBe(true);
    }
  });
  it('connected sum multiplies Δ (from memory)', () => {
    const random = rng(17);
    for (let trial = 0; trial < 15; trial++) {
      const a = randomDiagram(random, 7, 3);
      const b = randomDiagram(random, 7, 3);
      if (a.crossings.length === 0 || b.crossings.length === 0) continue;
      expect(alexander(connectedSum(a, b)).equals(alexander(a).mul(alexander(b)))).toBe(true);
    }
  });
  it('two-component links: the coefficient of z in ∇ is the linking number (from memory: Hosokawa)', () => {
    const random = rng(18);
    let links = 0;
    while (links < 25) {
      const d = randomDiagram(random, 10, 4);
      if (componentCount(d) !== 2) continue;
      links++;
      expect(conway(d).coefficient(1)).toBe(BigInt(linkingNumbers(d)[0]!.value));
    }
  });
  it('knots: the coefficient of z² in ∇ is −V″(1)/6 for the Jones polynomial V (from memory)', () => {
    const random = rng(19);
    let knots = 0;
    while (knots < 25) {
      const d = randomDiagram(random, 11, 4);
      if (componentCount(d) !== 1) continue;
      knots++;
      const secondDerivativeAtOne = jonesPolynomial(d)
        .terms()
        .reduce((sum, [e, c]) => sum + c * BigInt(e * (e - 1)), 0n);
      expect(-6n * conway(d).coefficient(2)).toBe(secondDerivativeAtOne);
    }
  });
});
