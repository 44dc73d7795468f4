import { describe, expect, it } from 'vitest';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { componentCount, mirrorDiagram, type LinkDiagram } from '../../src/core/diagram/model.ts';
import { connectedSum, disjointUnion } from '../../src/core/diagram/operations.ts';
import { goeritzInvariants } from '../../src/core/invariants/classical/goeritz.ts';
import { absoluteValueAtMinusOne, classicalInvariants } from '../../src/core/invariants/classical/index.ts';
import { diagramPieces } from '../../src/core/invariants/classical/pieces.ts';
import { seifertSurface } from '../../src/core/invariants/classical/seifert.ts';
import { signatureFromSeifertMatrix, signatureInConvention, symmetrisedSeifertInertia } from '../../src/core/invariants/classical/signature.ts';
import { traczykSignature } from '../../src/core/invariants/classical/traczyk.ts';
import { jonesPolynomial } from '../../src/core/invariants/jones.ts';
import type { Laurent } from '../../src/core/poly/laurent.ts';
import { randomDiagram, randomReducedAlternating, rng } from '../support/random-diagrams.ts';

const signature = (d: LinkDiagram): number => classicalInvariants(d).signature;

function torusKnot(p: number, q: number): LinkDiagram {
  const word: number[] = [];
  for (let k = 0; k < q; k++) for (let i = 1; i < p; i++) word.push(i);
  return closeBraid(word, p);
}

/**
 * σ(T(p,q)) for coprime p, q by counting lattice points (from memory: the
 * Gordon–Litherland–Murasugi counting formula): over 0 < i < p, 0 < j < q,
 * points with ½ < i/p + j/q < 3/2 count −1 and the others +1 (the positive torus
 * knot gets a negative signature). Written with integers: 2(iq + jp) against pq and 3pq.
 */
function torusKnotSignatureByCounting(p: number, q: number): number {
  let sigma = 0;
  for (let i = 1; i < p; i++) {
    for (let j = 1; j < q; j++) {
      const twice = 2 * (i * q + j * p);
      sigma += twice > p * q && twice < 3 * p * q ? -1 : 1;
    }
  }
  return sigma;
}

/** |V(−1)| for the Jones polynomial (t^(1/2) = i): the same evaluation as |Δ(−1)|. */
function absoluteJonesAtMinusOne(jones: Laurent): bigint {
  return absoluteValueAtMinusOne(jones);
}

function nonSplitPieces(d: LinkDiagram): LinkDiagram[] {
  return diagramPieces(d).filter((p) => p.crossings.length > 0);
}

describe('signature: worked values and the convention', () => {
  it('positive trefoil −2, negative trefoil +2, figure-eight 0 (from memory, σ = sign(V + Vᵀ))', () => {
    expect(signature(closeBraid([1, 1, 1], 2))).toBe(-2);
    expect(signature(closeBraid([-1, -1, -1], 2))).toBe(2);
    expect(signature(closeBraid([1, -2, 1, -2], 3))).toBe(0);
  });
  it('positive Hopf link −1 (from memory), the unknot and unlinks 0', () => {
    expect(signature(closeBraid([1, 1], 2))).toBe(-1);
    expect(signature(closeBraid([1], 2))).toBe(0);
    expect(signature(closeBraid([], 3))).toBe(0);
  });
  it('the document convention `positive` negates: the positive trefoil reads +2', () => {
    expect(signatureInConvention(-2, 'positive')).toBe(2);
    expect(signatureInConvention(-2, 'negative')).toBe(-2);
    expect(Object.is(signatureInConvention(0, 'positive'), 0)).toBe(true);
  });
  for (const [p, q] of [[2, 3], [2, 5], [2, 7], [3, 4], [3, 5], [3, 7], [4, 5], [3, 8], [5, 6]] as const) {
    it(`torus knot T(${p},${q}) matches the lattice-point count (from memory: Gordon–Litherland–Murasugi)`, () => {
      const d = torusKnot(p, q);
      expect(signature(d)).toBe(torusKnotSignatureByCounting(p, q));
    });
  }
});

describe('signature and determinant: independent routes agree on random diagrams', () => {
  it('Goeritz with Gordon–Litherland (both checkerboard surfaces) equals sign(V + Vᵀ); |det G| = |det(V + Vᵀ)| = |Δ(−1)|', () => {
    const random = rng(21);
    for (let trial = 0; trial < 80; trial++) {
      for (const piece of nonSplitPieces(randomDiagram(random, 14, 5))) {
        const v = seifertSurface(piece).matrix;
        const fromSeifert = signatureFromSeifertMatrix(v);
        const shaded0 = goeritzInvariants(piece, 0);
        const shaded1 = goeritzInvariants(piece, 1);
        expect(shaded0.signature).toBe(fromSeifert);
        expect(shaded1.signature).toBe(fromSeifert);
        expect(shaded1.determinant).toBe(shaded0.determinant);
        expect(symmetrisedSeifertInertia(v).absDeterminant).toBe(shaded0.determinant);
      }
    }
  });
  it('det = |Δ(−1)| = |V(−1)| with the Jones polynomial (from memory)', () => {
    const random = rng(22);
    for (let trial = 0; trial < 50; trial++) {
      const d = randomDiagram(random, 12, 4);
      const { determinant, alexander } = classicalInvariants(d);
      expect(absoluteValueAtMinusOne(alexander)).toBe(determinant);
      expect(absoluteJonesAtMinusOne(jonesPolynomial(d))).toBe(determinant);
    }
  });
  it('knots: σ is even, and Δ(−1) > 0 exactly when σ ≡ 0 (mod 4) (from memory: both from one Seifert matrix)', () => {
    const random = rng(23);
    let knots = 0;
    while (knots < 40) {
      const d = randomDiagram(random, 14, 5);
      if (componentCount(d) !== 1) continue;
      knots++;
      const { signature: sigma, alexander } = classicalInvariants(d);
      expect(Math.abs(sigma % 2)).toBe(0);
      let atMinusOne = 0n;
      for (const [e, c] of alexander.terms()) atMinusOne += e % 2 === 0 ? c : -c;
      expect(atMinusOne > 0n).toBe(sigma % 4 === 0);
    }
  });
  it('Traczyk: σ = s_A − n₊ − 1 on random reduced alternating diagrams equals sign(V + Vᵀ) (from memory: Traczyk)', () => {
    const random = rng(24);
    for (let trial = 0; trial < 40; trial++) {
      const d = randomReducedAlternating(random, 4 + (trial % 20), 5);
      const traczyk = traczykSignature(d);
      expect(traczyk).not.toBeNull();
      expect(traczyk).toBe(signatureFromSeifertMatrix(seifertSurface(d).matrix));
    }
  });
  it('Traczyk applies only to reduced alternating connected diagrams', () => {
    expect(traczykSignature(closeBraid([1, 2, 1, 2], 3))).toBeNull(); // not alternating
    expect(traczykSignature(closeBraid([1], 2))).toBeNull(); // nugatory
  });
});

describe('signature under diagram operations', () => {
  it('is additive under connected sum, also of braids placed side by side and joined by one generator (from memory)', () => {
    const random = rng(25);
    for (let trial = 0; trial < 20; trial++) {
      const a = randomDiagram(random, 8, 3);
      const b = randomDiagram(random, 8, 3);
      if (a.crossings.length === 0 || b.crossings.length === 0) continue;
      expect(signature(connectedSum(a, b))).toBe(signature(a) + signature(b));
    }
    // T(2,3) # T(2,3)* on strands 1–2 and 3–4, joined by σ2: signatures −2 + 2.
    expect(signature(closeBraid([1, 1, 1, -3, -3, -3, 2], 4))).toBe(0);
    expect(signature(closeBraid([1, 1, 1, 3, 3, 3, 3, 3, 2], 4))).toBe(-6);
  });
  it('changes sign under mirroring (from memory)', () => {
    const random = rng(26);
    for (let trial = 0; trial < 30; trial++) {
      const d = randomDiagram(random, 12, 4);
      expect(signature(mirrorDiagram(d)) + signature(d)).toBe(0);
    }
  });
  it('of a split union is the sum, and its determinant is 0 (from memory)', () => {
    const a = closeBraid([1, 1, 1], 2);
    const b = closeBraid([1, 1, 1, 1, 1], 2);
    const union = classicalInvariants(disjointUnion(a, b));
    expect(union.signature).toBe(-6);
    expect(union.determinant).toBe(0n);
  });
});
