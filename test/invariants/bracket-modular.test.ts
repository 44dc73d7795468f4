/**
 * The modular bracket engine (a recorded contraction replayed modulo several
 * numbers, lifted by the Chinese remainder theorem) against the plain state
 * sum on small diagrams, against the digit engine on long ones, and against
 * Jones polynomial identities on a long alternating closure.
 */
import { describe, expect, it } from 'vitest';
import { alternatingBraidClosure, torusBraid } from '../../bench/families.ts';
import { assembleDiagram } from '../../src/core/diagram/assemble.ts';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { componentCount, writhe, type LinkDiagram } from '../../src/core/diagram/model.ts';
import { addCurl, connectedSum, disjointUnion, withFreeLoops } from '../../src/core/diagram/operations.ts';
import { bracketByModuli, modulus, recordContraction } from '../../src/core/invariants/bracket-modular.ts';
import { bracketNormBound } from '../../src/core/invariants/bracket-norm-bound.ts';
import { kauffmanBracket, moduliPay, planSteps, type BracketArithmetic } from '../../src/core/invariants/bracket.ts';
import { planContraction } from '../../src/core/invariants/crossing-order.ts';
import { jonesFromBracket } from '../../src/core/invariants/jones.ts';
import { bracketByStateSum } from '../../src/core/invariants/state-sum.ts';
import type { Laurent } from '../../src/core/poly/laurent.ts';
import { randomBraidWord, randomDiagram, randomInt, randomReducedAlternating, rng, shuffleDiagram } from '../support/random-diagrams.ts';

const bracketBy = (d: LinkDiagram, arithmetic: BracketArithmetic): Laurent => kauffmanBracket(d, undefined, {}, arithmetic).bracket;

function largestCoefficient(p: Laurent): bigint {
  return p.terms().reduce((m, [, c]) => ((c < 0n ? -c : c) > m ? (c < 0n ? -c : c) : m), 0n);
}

const hasNegativeCoefficient = (p: Laurent): boolean => p.terms().some(([, c]) => c < 0n);

function recordOf(d: LinkDiagram): NonNullable<Exclude<ReturnType<typeof recordContraction>, 'too-large'>> {
  const record = recordContraction(planSteps(d, planContraction(d).order), 4, 2 ** 28);
  if (record === undefined || record === 'too-large') throw new Error('test: the contraction could not be recorded');
  return record;
}

describe('the moduli chosen', () => {
  it('are odd, below 2^31 and pairwise coprime (what the lift needs: Chinese remainder theorem, common practice)', () => {
    const moduli = Array.from({ length: 40 }, (_, k) => modulus(k));
    const gcd = (a: bigint, b: bigint): bigint => (b === 0n ? a : gcd(b, a % b));
    for (const [i, m] of moduli.entries()) {
      expect(m % 2).toBe(1);
      expect(m).toBeLessThan(2 ** 31);
      for (const other of moduli.slice(0, i)) expect(gcd(BigInt(m), BigInt(other))).toBe(1n);
    }
  });
});

describe("kauffmanBracket(d, _, _, 'moduli') against the state sum (Kauffman 1987)", () => {
  it('agrees on 200 random diagrams up to 13 crossings: links, curls, connected sums, free loops', () => {
    const random = rng(601);
    let byModuli = 0;
    let withFreeLoopsSeen = 0;
    let links = 0;
    for (let i = 0; i < 200; i++) {
      let d = randomDiagram(random, 9, 4);
      if (d.crossings.length === 0) continue;
      if (random() < 0.4) d = addCurl(d, randomInt(random, 0, d.edgeCount - 1), random() < 0.5 ? 1 : -1, random() < 0.5);
      if (random() < 0.15) d = connectedSum(d, closeBraid([1, 1, 1], 2), randomInt(random, 0, d.edgeCount - 1));
      if (random() < 0.15) d = withFreeLoops(d, randomInt(random, 1, 2));
      if (bracketNormBound(d) !== undefined) byModuli++;
      if (d.freeLoops > 0) withFreeLoopsSeen++;
      if (componentCount(d) > 1) links++;
      expect(bracketBy(d, 'moduli').equals(bracketByStateSum(d))).toBe(true);
    }
    // The modular path is taken only on connected planar projections; most of these must be such.
    expect(byModuli).toBeGreaterThan(120);
    expect(withFreeLoopsSeen).toBeGreaterThan(20);
    expect(links).toBeGreaterThan(40);
  });

  it('falls back to the digit engine, without error, on split projections and non-planar (virtual) codes', () => {
    const trefoil = closeBraid([1, 1, 1], 2);
    const split = disjointUnion(trefoil, closeBraid([1, -2, 1, -2], 3));
    expect(bracketBy(split, 'moduli').equals(bracketByStateSum(split))).toBe(true);
    // The virtual trefoil (Gauss code o1 o2 u1 u2, common practice): its bracket has exponents outside one class mod 4.
    const virtualTrefoil = assembleDiagram(
      [
        { edges: [3, 2, 4, 1], sign: 1 },
        { edges: [4, 3, 1, 2], sign: 1 },
      ],
      { notation: 'pd' },
    );
    expect(bracketNormBound(virtualTrefoil)).toBeUndefined();
    expect(bracketBy(virtualTrefoil, 'moduli').equals(bracketByStateSum(virtualTrefoil))).toBe(true);
  });
});

describe("kauffmanBracket(d, _, _, 'moduli') against 'digits' on long diagrams", () => {
  it('agrees on random alternating closures of 60–200 crossings, whose coefficients pass 2^31 and change sign', () => {
    const random = rng(602);
    for (let i = 0; i < 6; i++) {
      const d = randomReducedAlternating(random, randomInt(random, 60, 200), 5);
      const moduli = bracketBy(d, 'moduli');
      expect(moduli.equals(bracketBy(d, 'digits'))).toBe(true);
      expect(hasNegativeCoefficient(moduli)).toBe(true);
      expect(largestCoefficient(moduli)).toBeGreaterThan(2n ** 31n); // so one modulus alone could not hold them
    }
  });

  it('agrees on random non-alternating closures of 100–300 crossings, with curls and a free loop', () => {
    const random = rng(603);
    for (let i = 0; i < 5; i++) {
      const strands = randomInt(random, 3, 6);
      let d = shuffleDiagram(closeBraid(randomBraidWord(random, strands, randomInt(random, 100, 300)), strands), random);
      if (i % 2 === 0) d = withFreeLoops(addCurl(d, 0, -1, true), 1);
      expect(bracketBy(d, 'moduli').equals(bracketBy(d, 'digits'))).toBe(true);
    }
  });

  it('agrees on the torus closure T(5, 41) (205 crossings) and its connected sum with an alternating closure', () => {
    const torus = closeBraid(torusBraid(5, 41), 5);
    expect(bracketBy(torus, 'moduli').equals(bracketBy(torus, 'digits'))).toBe(true);
    const sum = connectedSum(torus, alternatingBraidClosure(604, 4, 80), 3, 5);
    expect(bracketBy(sum, 'moduli').equals(bracketBy(sum, 'digits'))).toBe(true);
  });

  it("agrees with 'auto' below 300 crossings (where 'auto' contracts by digits)", () => {
    const random = rng(605);
    for (let i = 0; i < 4; i++) {
      const d = randomReducedAlternating(random, randomInt(random, 100, 290), 6);
      expect(bracketBy(d, 'auto').equals(bracketBy(d, 'moduli'))).toBe(true);
    }
  });
});

describe('the Chinese remainder lift (bracketByModuli)', () => {
  it('uses more than two moduli where the bound passes 2^62, and gives the digit engine’s bracket', () => {
    const d = alternatingBraidClosure(606, 5, 150);
    const bound = bracketNormBound(d)!;
    expect(bound).toBeGreaterThan(2n ** 62n);
    const { bracket, moduli } = bracketByModuli(recordOf(d), bound);
    expect(moduli).toBeGreaterThan(2);
    expect(bracket.equals(bracketBy(d, 'digits'))).toBe(true);
  });

  it('gives the same bracket from a bound far above the true one (more moduli, each below 2^31: at least 400/31 of them)', () => {
    const d = randomReducedAlternating(rng(607), 40, 4);
    const { bracket, moduli } = bracketByModuli(recordOf(d), 2n ** 400n);
    expect(moduli).toBeGreaterThanOrEqual(Math.ceil(401 / 31) + 1);
    expect(bracket.equals(bracketBy(d, 'digits'))).toBe(true);
  });

  it('refuses, as an internal error, a bound below the coefficients (the check modulo a further number catches the wrong lift)', () => {
    const d = alternatingBraidClosure(608, 5, 120);
    expect(largestCoefficient(bracketBy(d, 'digits'))).toBeGreaterThan(2n ** 40n);
    expect(() => bracketByModuli(recordOf(d), 1n)).toThrow(/internal/);
  });
});

describe("Jones identities on a 480-crossing alternating closure on 8 strands, through 'auto'", () => {
  it('V(1) = (−2)^(μ−1) (Jones 1985) and span V = crossings for a reduced alternating diagram (Kauffman, Murasugi, Thistlethwaite 1987)', () => {
    const d = alternatingBraidClosure(609, 8, 480);
    // Long and wide enough for 'auto' to pick moduli.
    expect(moduliPay(d, planSteps(d, planContraction(d).order))).toBe(true);
    const jones = jonesFromBracket(bracketBy(d, 'auto'), writhe(d));
    expect(jones.valueAtOne()).toBe((-2n) ** BigInt(componentCount(d) - 1));
    expect(jones.span).toBe(480);
  });
});
