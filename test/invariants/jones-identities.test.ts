import { describe, expect, it } from 'vitest';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { faceStructure } from '../../src/core/diagram/faces.ts';
import { componentCount, mirrorDiagram, writhe, type LinkDiagram } from '../../src/core/diagram/model.ts';
import { addCurl, connectedSum, disjointUnion, smoothCrossing, switchCrossing, withFreeLoops } from '../../src/core/diagram/operations.ts';
import { kauffmanBracket } from '../../src/core/invariants/bracket.ts';
import { planContraction } from '../../src/core/invariants/crossing-order.ts';
import { jonesFromBracket, jonesPolynomial } from '../../src/core/invariants/jones.ts';
import { Laurent } from '../../src/core/poly/laurent.ts';
import { randomAlternatingBraidWord, randomDiagram, randomInt, rng, shuffleDiagram } from '../support/random-diagrams.ts';
import { derivativeAtOne, largestCoefficient, valueAtCubeRootOfUnity, valueAtMinusOne } from './evaluation.ts';

const isKnot = (d: LinkDiagram): boolean => componentCount(d) === 1;
const sqrtDifference = Laurent.fromTerms([[0.5, 1n], [-0.5, -1n]]); // t^(1/2) − t^(−1/2)
const splitUnknotFactor = Laurent.fromTerms([[0.5, -1n], [-0.5, -1n]]); // −(t^(1/2) + t^(−1/2))

function randomDiagrams(seed: number, count: number, maxCrossings: number, maxStrands: number): LinkDiagram[] {
  const random = rng(seed);
  return Array.from({ length: count }, () => randomDiagram(random, maxCrossings, maxStrands));
}

describe('evaluations of V (Jones 1985, Bull. AMS 12)', () => {
  it('V(1) = (−2)^(μ−1) on 200 random diagrams up to 40 crossings', () => {
    for (const d of randomDiagrams(101, 200, 40, 6)) {
      expect(jonesPolynomial(d).valueAtOne()).toBe((-2n) ** BigInt(componentCount(d) - 1));
    }
  });
  it("for knots V′(1) = 0 and V(e^(2πi/3)) = 1, evaluated exactly in ℤ[ω]", () => {
    const knots = randomDiagrams(102, 400, 40, 6).filter(isKnot);
    expect(knots.length).toBeGreaterThan(50);
    for (const d of knots) {
      const v = jonesPolynomial(d);
      expect(derivativeAtOne(v)).toBe(0n);
      expect(valueAtCubeRootOfUnity(v)).toEqual([1n, 0n]);
    }
  });
});

describe('symmetries and relations (Jones 1985; Kauffman 1987, Topology 26)', () => {
  it('V(mirror) = V(t⁻¹) on 100 random diagrams', () => {
    for (const d of randomDiagrams(103, 100, 30, 5)) {
      expect(jonesPolynomial(mirrorDiagram(d)).equals(jonesPolynomial(d).substitutePower(-1))).toBe(true);
    }
  });
  it('skein relation t⁻¹V₊ − tV₋ = (t^(1/2) − t^(−1/2))V₀ at a random crossing of 150 random diagrams', () => {
    const random = rng(104);
    for (const d of randomDiagrams(105, 150, 24, 5)) {
      const k = randomInt(random, 0, d.crossings.length - 1);
      const here = jonesPolynomial(d);
      const switched = jonesPolynomial(switchCrossing(d, k));
      const [positive, negative] = d.crossings[k]!.sign === 1 ? [here, switched] : [switched, here];
      const smoothed = jonesPolynomial(smoothCrossing(d, k));
      expect(positive.shift(-1).sub(negative.shift(1)).equals(sqrtDifference.mul(smoothed))).toBe(true);
    }
  });
  it('V(K₁ # K₂) = V(K₁)V(K₂) for 60 random pairs summed along random edges', () => {
    const random = rng(106);
    const left = randomDiagrams(107, 60, 14, 4);
    const right = randomDiagrams(108, 60, 14, 4);
    left.forEach((d1, i) => {
      const d2 = right[i]!;
      const sum = connectedSum(d1, d2, randomInt(random, 0, d1.edgeCount - 1), randomInt(random, 0, d2.edgeCount - 1));
      expect(jonesPolynomial(sum).equals(jonesPolynomial(d1).mul(jonesPolynomial(d2)))).toBe(true);
    });
  });
  it('a split unknot multiplies V by −(t^(1/2) + t^(−1/2)), as a free loop or as a curled circle', () => {
    const random = rng(109);
    for (const d of randomDiagrams(110, 60, 16, 4)) {
      const expected = jonesPolynomial(d).mul(splitUnknotFactor);
      expect(jonesPolynomial(withFreeLoops(d)).equals(expected)).toBe(true);
      const curledCircle = addCurl(closeBraid([1], 2), 0, random() < 0.5 ? 1 : -1, true);
      expect(jonesPolynomial(disjointUnion(d, curledCircle)).equals(expected)).toBe(true);
    }
  });
  it('a curl multiplies ⟨D⟩ by −A^(±3) and leaves V unchanged', () => {
    const random = rng(111);
    for (const d of randomDiagrams(112, 60, 16, 4)) {
      const sign = random() < 0.5 ? 1 : -1;
      const curled = addCurl(d, randomInt(random, 0, d.edgeCount - 1), sign, random() < 0.5);
      expect(kauffmanBracket(curled).bracket.equals(kauffmanBracket(d).bracket.shift(3 * sign).neg())).toBe(true);
      expect(jonesPolynomial(curled).equals(jonesPolynomial(d))).toBe(true);
    }
  });
});

describe('exactness past 2^53: a 300-crossing reduced alternating knot', () => {
  // A 5-strand alternating braid whose closure is a knot (the first seed that gives one).
  const d = (() => {
    for (let seed = 1; ; seed++) {
      const random = rng(seed);
      const knot = closeBraid(randomAlternatingBraidWord(random, 5, 300), 5);
      if (isKnot(knot)) return shuffleDiagram(knot, random);
    }
  })();
  const { bracket } = kauffmanBracket(d);
  const v = jonesFromBracket(bracket, writhe(d));

  it('has bracket coefficients far beyond 2^53 (so the exact path is exercised)', () => {
    expect(largestCoefficient(bracket)).toBeGreaterThan(2n ** 100n);
  });
  it('contracting in the reverse order (same widths, different sums) gives the same bracket', () => {
    const reversed = [...planContraction(d).order].reverse();
    expect(kauffmanBracket(d, reversed).bracket.equals(bracket)).toBe(true);
  });
  it('V(1) = 1, V′(1) = 0, V(e^(2πi/3)) = 1 (Jones 1985)', () => {
    expect(v.valueAtOne()).toBe(1n);
    expect(derivativeAtOne(v)).toBe(0n);
    expect(valueAtCubeRootOfUnity(v)).toEqual([1n, 0n]);
  });
  it('the mirror, computed separately, gives V(t⁻¹) (Jones 1985)', () => {
    expect(jonesPolynomial(mirrorDiagram(d)).equals(v.substitutePower(-1))).toBe(true);
  });
  it('span V = 300 (Kauffman 1987, Murasugi 1987, Thistlethwaite 1987: reduced alternating diagrams)', () => {
    expect(v.span).toBe(300);
  });
  it('the spanning-tree count gives the determinants 3, 5, 5, 11 of the knots 3_1, 4_1, 5_1 and 6_2 = closure of σ1³σ2⁻¹σ1σ2⁻¹ (from memory)', () => {
    expect(taitSpanningTrees(closeBraid([1, 1, 1], 2))).toBe(3n);
    expect(taitSpanningTrees(closeBraid([1, -2, 1, -2], 3))).toBe(5n);
    expect(taitSpanningTrees(closeBraid([1, 1, 1, 1, 1], 2))).toBe(5n);
    expect(taitSpanningTrees(closeBraid([1, 1, 1, -2, 1, -2], 3))).toBe(11n);
  });
  it('|V(−1)| = number of spanning trees of the Tait graph (Thistlethwaite 1987; Kirchhoff matrix-tree theorem)', () => {
    const determinant = valueAtMinusOne(v);
    expect(determinant < 0n ? -determinant : determinant).toBe(taitSpanningTrees(d));
  });
  it('the coefficients of V alternate in sign, so Σ|coefficients| = |V(−1)| (Thistlethwaite 1987)', () => {
    const absoluteSum = v.coefficients.reduce((s, c) => s + (c < 0n ? -c : c), 0n);
    const determinant = valueAtMinusOne(v);
    expect(absoluteSum).toBe(determinant < 0n ? -determinant : determinant);
  });
});

describe('exactness past 2^53, coefficient by coefficient', () => {
  // ⟨D₁ # D₂⟩ = ⟨D₁⟩⟨D₂⟩ and ⟨D₁ ⊔ D₂⟩ = d⟨D₁⟩⟨D₂⟩ (Kauffman 1987): the engine's limb arithmetic on
  // the big diagram is checked against BigInt products of the two smaller brackets.
  const random = rng(113);
  const d1 = shuffleDiagram(closeBraid(randomAlternatingBraidWord(random, 5, 160), 5), random);
  const d2 = shuffleDiagram(closeBraid(randomAlternatingBraidWord(random, 4, 140), 4), random);
  const product = kauffmanBracket(d1).bracket.mul(kauffmanBracket(d2).bracket);

  it('connected sum of a 160- and a 140-crossing alternating diagram', () => {
    const sum = shuffleDiagram(connectedSum(d1, d2, randomInt(random, 0, d1.edgeCount - 1), randomInt(random, 0, d2.edgeCount - 1)), random);
    const { bracket } = kauffmanBracket(sum);
    expect(largestCoefficient(bracket)).toBeGreaterThan(2n ** 120n);
    expect(bracket.equals(product)).toBe(true);
  });
  it('split union of the same two diagrams', () => {
    const loop = Laurent.fromTerms([[2, -1n], [-2, -1n]]);
    expect(kauffmanBracket(shuffleDiagram(disjointUnion(d1, d2), random)).bracket.equals(product.mul(loop))).toBe(true);
  });
});

/**
 * Spanning trees of the Tait graph of a connected diagram: the faces of one
 * checkerboard colour, joined through each crossing. Counted by Kirchhoff's
 * theorem as a cofactor of the Laplacian, with fraction-free (Bareiss)
 * elimination in BigInt.
 */
function taitSpanningTrees(d: LinkDiagram): bigint {
  const { faceOfCorner, faceCount } = faceStructure(d);
  const colour = new Int8Array(faceCount).fill(-1);
  // Corners (c, q) and (c, q+1) lie across an edge from each other, so their faces differ in colour.
  colour[faceOfCorner[0]!] = 0;
  for (let changed = true; changed; ) {
    changed = false;
    for (let corner = 0; corner < faceOfCorner.length; corner++) {
      const f = faceOfCorner[corner]!;
      const g = faceOfCorner[(corner & ~3) | ((corner + 1) & 3)]!;
      if (colour[f]! >= 0 && colour[g]! < 0) (colour[g] = 1 - colour[f]!), (changed = true);
      if (colour[g]! >= 0 && colour[f]! < 0) (colour[f] = 1 - colour[g]!), (changed = true);
    }
  }
  const vertexOf = new Map<number, number>();
  for (let f = 0; f < faceCount; f++) if (colour[f] === 0) vertexOf.set(f, vertexOf.size);
  const size = vertexOf.size - 1; // the cofactor drops the last vertex
  const m: bigint[][] = Array.from({ length: size }, () => new Array<bigint>(size).fill(0n));
  d.crossings.forEach((_, c) => {
    const q = colour[faceOfCorner[4 * c]!] === 0 ? 0 : 1;
    const a = vertexOf.get(faceOfCorner[4 * c + q]!)!;
    const b = vertexOf.get(faceOfCorner[4 * c + q + 2]!)!;
    if (a === b) return;
    if (a < size) m[a]![a]! += 1n;
    if (b < size) m[b]![b]! += 1n;
    if (a < size && b < size) (m[a]![b]! -= 1n), (m[b]![a]! -= 1n);
  });
  let previousPivot = 1n;
  let sign = 1n;
  for (let k = 0; k < size; k++) {
    if (m[k]![k] === 0n) {
      const swap = m.findIndex((row, i) => i > k && row[k] !== 0n);
      if (swap < 0) return 0n;
      [m[k], m[swap]] = [m[swap]!, m[k]!];
      sign = -sign;
    }
    for (let i = k + 1; i < size; i++) {
      for (let j = k + 1; j < size; j++) m[i]![j] = (m[i]![j]! * m[k]![k]! - m[i]![k]! * m[k]![j]!) / previousPivot;
    }
    previousPivot = m[k]![k]!;
  }
  return sign * (size === 0 ? 1n : m[size - 1]![size - 1]!);
}
