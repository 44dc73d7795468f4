import { describe, expect, it } from 'vitest';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { nonPlanarPieces } from '../../src/core/diagram/faces.ts';
import type { LinkDiagram } from '../../src/core/diagram/model.ts';
import { addCurl, disjointUnion, withFreeLoops } from '../../src/core/diagram/operations.ts';
import { kauffmanBracket, LOOP_VALUE } from '../../src/core/invariants/bracket.ts';
import { planContraction } from '../../src/core/invariants/crossing-order.ts';
import { bracketByStateSum } from '../../src/core/invariants/state-sum.ts';
import { Laurent } from '../../src/core/poly/laurent.ts';
import { InputError } from '../../src/core/errors.ts';
import { randomDiagram, randomInt, randomReducedAlternating, rewired, rng } from '../support/random-diagrams.ts';

// The state sum over all 2^n states is the definition of the bracket
// (Kauffman 1987, Topology 26); the tangle engine must agree with it exactly.
function agrees(d: LinkDiagram, order?: readonly number[]): void {
  expect(kauffmanBracket(d, order).bracket.toPlainString('A')).toBe(bracketByStateSum(d).toPlainString('A'));
}

function randomOrder(n: number, random: () => number): number[] {
  const order = Array.from({ length: n }, (_, i) => i);
  for (let k = n - 1; k > 0; k--) {
    const j = randomInt(random, 0, k);
    [order[k], order[j]] = [order[j]!, order[k]!];
  }
  return order;
}

describe('tangle contraction against the state-sum definition (Kauffman 1987)', () => {
  it('agrees on 300 random braid closures up to 12 crossings, in random crossing order', () => {
    const random = rng(20261201);
    for (let i = 0; i < 300; i++) agrees(randomDiagram(random, 12, 5));
  });

  it('agrees on 60 random reduced alternating diagrams of 6 to 12 crossings', () => {
    const random = rng(77);
    for (let i = 0; i < 60; i++) agrees(randomReducedAlternating(random, randomInt(random, 6, 12)));
  });

  it('does not depend on the order the crossings are absorbed in (any order, including bad ones)', () => {
    const random = rng(5);
    for (let i = 0; i < 60; i++) {
      const d = randomDiagram(random, 11, 4);
      agrees(d, randomOrder(d.crossings.length, random));
    }
  });

  it('agrees on split diagrams: two random pieces side by side, plus free loops', () => {
    const random = rng(11);
    for (let i = 0; i < 60; i++) {
      const d = disjointUnion(randomDiagram(random, 6, 3), randomDiagram(random, 6, 4));
      agrees(d);
      agrees(withFreeLoops(d, randomInt(random, 0, 2)), randomOrder(d.crossings.length, random));
    }
  });

  it('agrees on diagrams with kinks (Reidemeister I curls on random edges)', () => {
    const random = rng(13);
    for (let i = 0; i < 80; i++) {
      let d = randomDiagram(random, 8, 4);
      const curls = randomInt(random, 1, 3);
      for (let k = 0; k < curls; k++) {
        d = addCurl(d, randomInt(random, 0, d.edgeCount - 1), random() < 0.5 ? 1 : -1, random() < 0.5);
      }
      agrees(d);
    }
  });

  it('agrees on braid closures that consist of kinks only: σ1 on 2 strands, σ1σ2 on 3 strands', () => {
    agrees(closeBraid([1], 2));
    agrees(closeBraid([-1], 2));
    agrees(closeBraid([1, 2], 3));
    agrees(closeBraid([1, -1], 2));
  });

  it('agrees on non-planar codes (virtual diagrams), where exponents leave one class mod 4', () => {
    const random = rng(17);
    let nonPlanarSeen = 0;
    for (let i = 0; i < 80; i++) {
      const d = rewired(randomDiagram(random, 9, 4), random);
      if (!d) continue;
      if (nonPlanarPieces(d).length > 0) nonPlanarSeen++;
      agrees(d);
    }
    expect(nonPlanarSeen).toBeGreaterThan(10);
  });

  it('gives ⟨O⟩ = 1 and ⟨O ⊔ … ⊔ O⟩ = d^(μ−1) for crossingless unlinks (Kauffman 1987)', () => {
    expect(kauffmanBracket(closeBraid([], 1)).bracket.equals(Laurent.one)).toBe(true);
    expect(kauffmanBracket(closeBraid([], 4)).bracket.equals(LOOP_VALUE.pow(3))).toBe(true);
  });

  it('refuses a crossing order that is not a permutation, and the empty diagram', () => {
    const d = closeBraid([1, 1, 1], 2);
    expect(() => kauffmanBracket(d, [0, 1])).toThrow(RangeError);
    expect(() => kauffmanBracket(d, [0, 1, 1])).toThrow(RangeError);
    expect(() => kauffmanBracket(d, [0, 1, 3])).toThrow(RangeError);
    expect(() => kauffmanBracket({ ...closeBraid([], 1), freeLoops: 0 })).toThrow(RangeError);
  });

  it('refuses, as an explained input error, an order whose boundary would outgrow memory', () => {
    const random = rng(19);
    const d = randomReducedAlternating(random, 300, 6);
    const attempt = (): unknown => kauffmanBracket(d, randomOrder(d.crossings.length, random));
    expect(attempt).toThrow(InputError);
    expect(attempt).toThrow(/edge ends open at once/);
  });

  it('reports the widest boundary the planned order reaches', () => {
    const d = randomReducedAlternating(rng(3), 12, 4);
    expect(kauffmanBracket(d).boundaryWidth).toBe(planContraction(d).maxWidth);
  });
});
