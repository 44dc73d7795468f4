import { describe, expect, it } from 'vitest';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { connectedPieces } from '../../src/core/diagram/faces.ts';
import { componentCount, indexDiagram, isOverSlot, mirrorDiagram, type LinkDiagram } from '../../src/core/diagram/model.ts';
import {
  diagramProperties,
  isAlternatingDiagram,
  linkingNumbers,
  nugatoryCrossings,
  uniformStateCircles,
} from '../../src/core/diagram/properties.ts';
import { bracketByStateSum } from '../../src/core/invariants/state-sum.ts';
import { randomDiagram, randomReducedAlternating, rng, shuffleDiagram } from '../support/random-diagrams.ts';

const braid = (word: string, strands: number): LinkDiagram => closeBraid(word.split(' ').map(Number), strands);

/** Independent nugatory test: c is a cut vertex of the projection graph (common practice). */
function isCutVertex(d: LinkDiagram, c: number): boolean {
  const n = d.crossings.length;
  // Nodes: crossings 0..n−1, then one node per edge joined to the crossings at its two ends.
  const parent = Array.from({ length: n + d.edgeCount }, (_, i) => i);
  const find = (x: number): number => (parent[x] === x ? x : (parent[x] = find(parent[x]!)));
  d.crossings.forEach((crossing, ci) => {
    if (ci === c) return;
    for (const e of crossing.edges) parent[find(ci)] = find(n + e);
  });
  const roots = new Set<number>();
  const piece = connectedPieces(d).pieceOfCrossing;
  for (let ci = 0; ci < n; ci++) if (ci !== c && piece[ci] === piece[c]) roots.add(find(ci));
  for (const e of d.crossings[c]!.edges) roots.add(find(n + e));
  return roots.size > 1;
}

/** Independent alternation test: walk each component and read over/under in travel order. */
function alternatesAlongTravel(d: LinkDiagram): boolean {
  const { head } = indexDiagram(d);
  for (const edges of d.components) {
    const passes: boolean[] = [];
    for (const e of edges) {
      const at = head[e]!;
      passes.push(isOverSlot(at.slot));
    }
    for (let i = 0; i < passes.length; i++) if (passes[i] === passes[(i + 1) % passes.length]) return false;
  }
  return true;
}

/** Independent linking number: the signed count of crossings where i passes over j (common practice). */
function linkingByOverpasses(d: LinkDiagram, i: number, j: number): number {
  const { componentOf } = indexDiagram(d);
  let sum = 0;
  for (const c of d.crossings) {
    if (componentOf[c.edges[1]] === i && componentOf[c.edges[0]] === j) sum += c.sign;
  }
  return sum;
}

describe('signs, writhe and linking numbers', () => {
  it('positive Hopf link 1 1 on 2 strands has lk = +1, negative Hopf −1 (from memory)', () => {
    expect(linkingNumbers(braid('1 1', 2))).toEqual([{ components: [0, 1], value: 1 }]);
    expect(linkingNumbers(braid('-1 -1', 2))).toEqual([{ components: [0, 1], value: -1 }]);
  });
  it('the Whitehead-type link 1 -2 1 -2 -2 has two components with lk = 0 (from memory: the Whitehead link is a 5-crossing alternating link with lk 0)', () => {
    const p = diagramProperties(braid('1 -2 1 -2 -2', 3));
    expect(p.components).toBe(2);
    expect(p.linking).toEqual([{ components: [0, 1], value: 0 }]);
    expect(p.alternating && p.reduced && p.connected).toBe(true);
  });
  it('the chain 1 1 2 2 of three circles links neighbours once and the ends not at all (common practice)', () => {
    expect(linkingNumbers(braid('1 1 2 2', 3)).map((l) => l.value)).toEqual([1, 0, 1]);
  });
  it('agrees with counting only the crossings where one component passes over the other (common practice) on random links', () => {
    const random = rng(11);
    for (let k = 0; k < 60; k++) {
      const d = randomDiagram(random, 24, 5);
      for (const { components: [i, j], value } of linkingNumbers(d)) {
        expect(value).toBe(linkingByOverpasses(d, i, j));
        expect(value).toBe(linkingByOverpasses(d, j, i));
      }
    }
  });
  it('writhe is the signed crossing count and positive + negative = n (definition)', () => {
    const p = diagramProperties(braid('1 -2 1 1 -2', 3));
    expect([p.signs.positive, p.signs.negative, p.writhe]).toEqual([3, 2, 1]);
  });
});

describe('connectedness and split diagrams', () => {
  it('a trefoil braid on 3 strands is split: trefoil plus a free loop, 2 components, not connected', () => {
    const p = diagramProperties(braid('1 1 1', 3));
    expect(p.components).toBe(2);
    expect(p.pieces).toBe(2);
    expect(p.connected).toBe(false);
  });
  it('two Hopf links side by side (1 1 3 3 on 4 strands) form two pieces', () => {
    const p = diagramProperties(braid('1 1 3 3', 4));
    expect([p.components, p.pieces, p.connected]).toEqual([4, 2, false]);
  });
  it('one free loop alone is connected; the closure of the empty braid on 2 strands is not', () => {
    expect(diagramProperties(closeBraid([], 1)).connected).toBe(true);
    expect(diagramProperties(closeBraid([], 2)).connected).toBe(false);
  });
});

describe('nugatory crossings', () => {
  it('1 1 1 2 on 3 strands: the lone σ2 is a kink, hence nugatory (checked by hand)', () => {
    expect(nugatoryCrossings(braid('1 1 1 2', 3))).toEqual([3]);
  });
  it('1 -1 on 2 strands: the two crossings bound a bigon and neither is nugatory (checked by hand)', () => {
    expect(nugatoryCrossings(braid('1 -1', 2))).toEqual([]);
  });
  it('1 2 3 on 4 strands: every crossing is nugatory, the closure is an unknot drawn with three kinks (checked by hand)', () => {
    expect(nugatoryCrossings(braid('1 2 3', 4))).toEqual([0, 1, 2]);
  });
  it('matches the cut-vertex characterisation (common practice) on random diagrams', () => {
    const random = rng(5);
    for (let k = 0; k < 80; k++) {
      const d = randomDiagram(random, 20, 5);
      const expected = d.crossings.map((_, c) => c).filter((c) => isCutVertex(d, c));
      expect(nugatoryCrossings(d)).toEqual(expected);
    }
  });
});

describe('alternating diagrams', () => {
  it('matches reading over/under along each component on random diagrams (definition)', () => {
    const random = rng(7);
    for (let k = 0; k < 80; k++) {
      const d = randomDiagram(random, 16, 4);
      expect(isAlternatingDiagram(d)).toBe(alternatesAlongTravel(d));
    }
  });
  it('recognises the alternating braid words of the test generator', () => {
    const random = rng(8);
    for (let k = 0; k < 20; k++) expect(isAlternatingDiagram(randomReducedAlternating(random, 12))).toBe(true);
  });
  it('the figure-eight braid 1 -2 1 -2 is alternating, the positive braid 1 2 1 2 is not (common practice)', () => {
    expect(isAlternatingDiagram(braid('1 -2 1 -2', 3))).toBe(true);
    expect(isAlternatingDiagram(braid('1 2 1 2', 3))).toBe(false);
  });
});

describe('state circles and adequacy', () => {
  it('counts the same circles as the state-sum oracle', () => {
    const random = rng(9);
    for (let k = 0; k < 40; k++) {
      const d = randomDiagram(random, 20, 5);
      const p = diagramProperties(d);
      expect(p.stateCircles.a).toBe(uniformStateCircles(d, 'A').count);
      expect(p.stateCircles.b).toBe(uniformStateCircles(d, 'B').count);
    }
  });
  it('|s_A| + |s_B| ≤ n + 2 for connected diagrams, with equality when alternating (Kauffman; Lickorish\'s textbook, from memory)', () => {
    const random = rng(10);
    let alternatingSeen = 0;
    for (let k = 0; k < 120; k++) {
      const d = k % 3 === 0 ? randomReducedAlternating(random, 6 + (k % 20)) : randomDiagram(random, 18, 4);
      const p = diagramProperties(d);
      if (!p.connected) continue;
      const total = p.stateCircles.a + p.stateCircles.b;
      expect(total).toBeLessThanOrEqual(p.crossings + 2);
      if (p.alternating) {
        alternatingSeen++;
        expect(total).toBe(p.crossings + 2);
      }
    }
    expect(alternatingSeen).toBeGreaterThan(30);
  });
  it('reduced alternating diagrams are adequate (Lickorish; common practice)', () => {
    const random = rng(12);
    for (let k = 0; k < 30; k++) expect(diagramProperties(randomReducedAlternating(random, 10 + k)).adequate).toBe(true);
  });
  it('a nugatory crossing spoils adequacy on one side (Lickorish; common practice)', () => {
    const random = rng(13);
    for (let k = 0; k < 80; k++) {
      const p = diagramProperties(randomDiagram(random, 16, 5));
      if (!p.reduced) expect(p.adequate).toBe(false);
    }
  });
  it('positive braid closures are A-adequate: the A-smoothing of a positive crossing is the oriented one, so the all-A state is the strands, and every crossing joins two different strands (derived)', () => {
    const random = rng(14);
    for (let k = 0; k < 30; k++) {
      const strands = 2 + (k % 4);
      const word = Array.from({ length: 3 + (k % 9) }, () => 1 + Math.floor(random() * (strands - 1)));
      const d = closeBraid(word, strands);
      const p = diagramProperties(d);
      expect(p.aAdequate).toBe(true);
      expect(p.stateCircles.a).toBe(strands);
    }
  });
  it('a positive braid whose syllables σ_i^k all have k ≥ 2 is also B-adequate: consecutive crossings of a syllable cut off a small all-B circle that touches each of them once (derived)', () => {
    for (const [word, strands] of [['1 1 1 2 2 2', 3], ['1 1 2 2', 3], ['1 1 2 2 1 1 3 3 2 2', 4]] as const) {
      const p = diagramProperties(braid(word, strands));
      expect(p.alternating).toBe(false);
      expect(p.adequate).toBe(true);
    }
    // (σ1σ2)^2 has syllables of length one, and indeed fails B-adequacy.
    expect(diagramProperties(braid('1 2 1 2', 3)).bAdequate).toBe(false);
  });
  it('an adequate state gives the extreme bracket coefficient ±1 at A^(n+2|s_A|−2) and A^(−n−2|s_B|+2) (Lickorish, Lemma 5.4, from memory)', () => {
    const random = rng(15);
    let checked = 0;
    for (let k = 0; k < 80; k++) {
      const d = k % 2 === 0 ? randomReducedAlternating(random, 4 + (k % 9)) : shuffleDiagram(randomDiagram(random, 12, 4), random);
      const p = diagramProperties(d);
      const bracket = bracketByStateSum(d);
      const n = p.crossings;
      const sign = (s: number): bigint => (s % 2 === 1 ? 1n : -1n); // (−1)^(s−1)
      if (p.aAdequate) {
        expect(bracket.maxDegree).toBe(n + 2 * p.stateCircles.a - 2);
        expect(bracket.coefficient(n + 2 * p.stateCircles.a - 2)).toBe(sign(p.stateCircles.a));
        checked++;
      }
      if (p.bAdequate) {
        expect(bracket.minDegree).toBe(-n - 2 * p.stateCircles.b + 2);
        expect(bracket.coefficient(-n - 2 * p.stateCircles.b + 2)).toBe(sign(p.stateCircles.b));
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(80);
  });
});

describe('mirror images', () => {
  it('switching every crossing swaps the all-A and all-B states and A-/B-adequacy, negates linking numbers, keeps nugatory crossings and alternation (common practice)', () => {
    const random = rng(16);
    for (let k = 0; k < 60; k++) {
      const d = k % 2 === 0 ? randomReducedAlternating(random, 5 + (k % 17)) : randomDiagram(random, 20, 5);
      const p = diagramProperties(d);
      const m = diagramProperties(mirrorDiagram(d));
      expect(m.stateCircles).toEqual({ a: p.stateCircles.b, b: p.stateCircles.a });
      expect([m.aAdequate, m.bAdequate]).toEqual([p.bAdequate, p.aAdequate]);
      expect(m.linking.map((l) => l.value)).toEqual(p.linking.map((l) => -l.value || 0));
      expect(m.nugatory).toEqual(p.nugatory);
      expect(m.alternating).toBe(p.alternating);
      expect(m.writhe + p.writhe).toBe(0);
    }
  });
});

describe('component bookkeeping', () => {
  it('counts components including free loops (model definition)', () => {
    const d = braid('1 1', 4);
    expect(diagramProperties(d).components).toBe(componentCount(d));
    expect(diagramProperties(d).components).toBe(4);
  });
});
