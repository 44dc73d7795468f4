import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { addCurl, connectedSum } from '../../src/core/diagram/operations.ts';
import { digitBoundCheck, kauffmanBracket, matchingNumber } from '../../src/core/invariants/bracket.ts';
import { bracketByStateSum } from '../../src/core/invariants/state-sum.ts';
import type { Laurent } from '../../src/core/poly/laurent.ts';
import { randomDiagram, randomInt, randomReducedAlternating, rng, shuffleDiagram } from '../support/random-diagrams.ts';

/** Every perfect matching of 0 … width−1, as partner arrays. */
function allMatchings(width: number): Uint8Array[] {
  if (width === 0) return [new Uint8Array(0)];
  const result: Uint8Array[] = [];
  const partner = new Uint8Array(width);
  const used = new Uint8Array(width);
  const extend = (): void => {
    const i = used.indexOf(0);
    if (i < 0) {
      result.push(partner.slice());
      return;
    }
    for (let p = i + 1; p < width; p++) {
      if (used[p]) continue;
      used[i] = used[p] = 1;
      partner[i] = p;
      partner[p] = i;
      extend();
      used[i] = used[p] = 0;
    }
  };
  extend();
  return result;
}

function largestCoefficient(p: Laurent): bigint {
  return p.terms().reduce((m, [, c]) => ((c < 0n ? -c : c) > m ? (c < 0n ? -c : c) : m), 0n);
}

function doubleFactorial(n: number): number {
  return n <= 1 ? 1 : n * doubleFactorial(n - 2);
}

describe('matching numbers (the keys of the tangle states)', () => {
  it('give the (w−1)!! perfect matchings of w ends distinct numbers below (w−1)!! (count: common practice)', () => {
    for (let width = 0; width <= 12; width += 2) {
      const matchings = allMatchings(width);
      expect(matchings.length).toBe(doubleFactorial(width - 1));
      const numbers = new Set(matchings.map((m) => matchingNumber(m, width)));
      expect(numbers.size).toBe(matchings.length);
      for (const k of numbers) expect(k >= 0 && k < doubleFactorial(width - 1)).toBe(true);
    }
  });

  it('stay exact at the widest boundary allowed (28 ends: 27!! < 2^53)', () => {
    const reversed = Uint8Array.from({ length: 28 }, (_, i) => 27 - i); // every end paired with its mirror
    const adjacent = Uint8Array.from({ length: 28 }, (_, i) => i ^ 1);
    const a = matchingNumber(reversed, 28);
    const b = matchingNumber(adjacent, 28);
    expect(Number.isSafeInteger(a) && Number.isSafeInteger(b)).toBe(true);
    expect(a).not.toBe(b);
    expect(a).toBeLessThan(doubleFactorial(27));
  });
});

describe('exact digits of the tangle contraction', () => {
  beforeEach(() => {
    digitBoundCheck.enabled = true;
  });
  afterEach(() => {
    digitBoundCheck.enabled = false;
  });

  it('keeps every digit within its proven bound on random diagrams with curls, and agrees with the state sum (Kauffman 1987)', () => {
    // Curls close a loop in one smoothing, so values are multiplied by d again and again:
    // the coefficients of d^l reach C(l, l/2), which a bound of 1 per loop would miss.
    const random = rng(4242);
    for (let i = 0; i < 60; i++) {
      let d = randomDiagram(random, 8, 4);
      const curls = randomInt(random, 2, 6);
      for (let k = 0; k < curls; k++) d = addCurl(d, randomInt(random, 0, d.edgeCount - 1), random() < 0.5 ? 1 : -1, random() < 0.5);
      expect(kauffmanBracket(d).bracket.equals(bracketByStateSum(d))).toBe(true);
    }
  });

  it('carries into several 32-bit digits exactly: 40 figure-eight knots summed give ⟨4₁⟩^40 (the bracket is multiplicative under connected sum, Kauffman 1987)', () => {
    const figureEight = closeBraid([1, -2, 1, -2], 3);
    let chain = figureEight;
    for (let k = 1; k < 40; k++) chain = connectedSum(chain, figureEight, 0, 0);
    const expected = bracketByStateSum(figureEight).pow(40);
    expect(largestCoefficient(expected) > 2n ** 64n).toBe(true); // so the check spans three digits
    expect(kauffmanBracket(shuffleDiagram(chain, rng(7))).bracket.equals(expected)).toBe(true);
  });

  it('equals the state sum on connected sums of 30 random alternating diagrams of 6–10 crossings, whose coefficients need four or more digits (multiplicative under connected sum, Kauffman 1987)', () => {
    const random = rng(9090);
    for (let trial = 0; trial < 4; trial++) {
      const pieces = Array.from({ length: 30 }, () => randomReducedAlternating(random, randomInt(random, 6, 10)));
      let sum = pieces[0]!;
      let expected = bracketByStateSum(sum);
      for (const piece of pieces.slice(1)) {
        sum = connectedSum(sum, piece, 0, 0);
        expected = expected.mul(bracketByStateSum(piece));
      }
      expect(largestCoefficient(expected) > 2n ** 96n).toBe(true);
      expect(kauffmanBracket(shuffleDiagram(sum, random)).bracket.equals(expected)).toBe(true);
    }
  });
});
