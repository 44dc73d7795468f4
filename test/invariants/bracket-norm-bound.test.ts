/**
 * The coefficient bound of the modular bracket engine, τ(G) for a checkerboard
 * graph G, against things computed here independently: the faces of the
 * projection traced and coloured in this file, spanning trees counted by brute
 * force (every (V−1)-subset of edges, union–find), and the bracket from the
 * plain state sum.
 */
import { describe, expect, it } from 'vitest';
import { assembleDiagram } from '../../src/core/diagram/assemble.ts';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { structuralProblem, type LinkDiagram } from '../../src/core/diagram/model.ts';
import { addCurl, connectedSum, disjointUnion, withFreeLoops } from '../../src/core/diagram/operations.ts';
import { bracketNormBound } from '../../src/core/invariants/bracket-norm-bound.ts';
import { bracketByStateSum } from '../../src/core/invariants/state-sum.ts';
import type { Laurent } from '../../src/core/poly/laurent.ts';
import { randomAlternatingBraidWord, randomBraidWord, randomDiagram, randomInt, randomReducedAlternating, rewired, rng, shuffleDiagram } from '../support/random-diagrams.ts';

/** For each slot 4c + q, the slot at the other end of its edge. */
function otherEnds(d: LinkDiagram): Int32Array {
  const firstSlot = new Map<number, number>();
  const other = new Int32Array(4 * d.crossings.length);
  d.crossings.forEach((c, ci) =>
    c.edges.forEach((e, q) => {
      const s = 4 * ci + q;
      const t = firstSlot.get(e);
      if (t === undefined) firstSlot.set(e, s);
      else [other[s], other[t]] = [t, s];
    }),
  );
  return other;
}

function unionFind(size: number): { find: (x: number) => number; union: (a: number, b: number) => boolean } {
  const parent = Array.from({ length: size }, (_, i) => i);
  const find = (x: number): number => (parent[x] === x ? x : (parent[x] = find(parent[x]!)));
  const union = (a: number, b: number): boolean => {
    const [ra, rb] = [find(a), find(b)];
    if (ra === rb) return false;
    parent[ra] = rb;
    return true;
  };
  return { find, union };
}

/**
 * The faces of the projection, traced here: corner (c, q) is the angle between
 * slots q and q+1 (counterclockwise). Going around a face, one leaves c along
 * slot q, arrives at the other end (c', p), and the face continues in the
 * corner clockwise of p, i.e. (c', p − 1).
 */
function faceOfCorners(d: LinkDiagram): { face: Int32Array; count: number } {
  const other = otherEnds(d);
  const face = new Int32Array(4 * d.crossings.length).fill(-1);
  let count = 0;
  for (let start = 0; start < face.length; start++) {
    if (face[start]! >= 0) continue;
    for (let corner = start; face[corner]! < 0; ) {
      face[corner] = count;
      const arrival = other[corner]!;
      corner = (arrival & ~3) | ((arrival + 3) & 3);
    }
    count++;
  }
  return { face, count };
}

/** Whether the projection (crossings joined by edges) is connected: union–find over crossings. */
function projectionConnected(d: LinkDiagram): boolean {
  const other = otherEnds(d);
  const { find, union } = unionFind(d.crossings.length);
  for (let s = 0; s < other.length; s++) union(s >> 2, other[s]! >> 2);
  return d.crossings.every((_, c) => find(c) === find(0));
}

/** Euler's formula for a connected 4-valent plane graph: V − 2V + F = 2 (common practice). */
function isPlanar(d: LinkDiagram): boolean {
  return faceOfCorners(d).count === d.crossings.length + 2;
}

interface Graph {
  readonly vertices: number;
  readonly edges: readonly (readonly [number, number])[];
}

/**
 * Both checkerboard graphs: faces 2-coloured so that corners q and q+1 of a
 * crossing (which share a slot's edge) differ; the graph of a colour has its
 * faces as vertices and, at each crossing, an edge between the two opposite
 * corners of that colour.
 */
function taitGraphs(d: LinkDiagram): [Graph, Graph] {
  const { face, count } = faceOfCorners(d);
  // Breadth first over faces: the faces on the two sides of an edge get different colours.
  const across: number[][] = Array.from({ length: count }, () => []);
  for (let corner = 0; corner < face.length; corner++) {
    const [f, g] = [face[corner]!, face[(corner & ~3) | ((corner + 1) & 3)]!];
    across[f]!.push(g);
    across[g]!.push(f);
  }
  const colour = new Int8Array(count).fill(-1);
  colour[0] = 0;
  const queue = [0];
  for (const f of queue) {
    for (const g of across[f]!) {
      if (colour[g] === colour[f]) throw new Error('test: faces admit no checkerboard colouring');
      if (colour[g]! < 0) {
        colour[g] = 1 - colour[f]!;
        queue.push(g);
      }
    }
  }
  const graphOf = (wanted: number): Graph => {
    const index = new Map<number, number>();
    for (let f = 0; f < count; f++) if (colour[f] === wanted) index.set(f, index.size);
    const edges = d.crossings.map((_, c): [number, number] => {
      const pair = colour[face[4 * c]!] === wanted ? [0, 2] : [1, 3];
      return [index.get(face[4 * c + pair[0]!]!)!, index.get(face[4 * c + pair[1]!]!)!];
    });
    return { vertices: index.size, edges };
  };
  return [graphOf(0), graphOf(1)];
}

/** Spanning trees by brute force: every set of V − 1 edges that closes no cycle (loops never fit). */
function spanningTreesByBruteForce(g: Graph): bigint {
  const need = g.vertices - 1;
  let trees = 0n;
  const chosen: number[] = [];
  const extend = (from: number): void => {
    if (chosen.length === need) {
      const { union } = unionFind(g.vertices);
      if (chosen.every((e) => union(g.edges[e]![0], g.edges[e]![1]))) trees++;
      return;
    }
    for (let e = from; e <= g.edges.length - (need - chosen.length); e++) {
      chosen.push(e);
      extend(e + 1);
      chosen.pop();
    }
  };
  extend(0);
  return trees;
}

/** τ(G) by Kirchhoff's theorem, computed here exactly: the reduced Laplacian's determinant by fraction-free (Bareiss) elimination. */
function spanningTreesByDeterminant(g: Graph): bigint {
  const n = g.vertices - 1;
  const a = Array.from({ length: n }, () => new Array<bigint>(n).fill(0n));
  for (const [u, v] of g.edges) {
    if (u === v) continue;
    if (u > 0) a[u - 1]![u - 1]! += 1n;
    if (v > 0) a[v - 1]![v - 1]! += 1n;
    if (u > 0 && v > 0) {
      a[u - 1]![v - 1]! -= 1n;
      a[v - 1]![u - 1]! -= 1n;
    }
  }
  let previous = 1n;
  let sign = 1n;
  for (let k = 0; k < n; k++) {
    const pivot = a.findIndex((row, i) => i >= k && row[k] !== 0n);
    if (pivot < 0) return 0n;
    if (pivot !== k) [a[k], a[pivot], sign] = [a[pivot]!, a[k]!, -sign];
    for (let i = k + 1; i < n; i++) {
      for (let j = k + 1; j < n; j++) a[i]![j] = (a[i]![j]! * a[k]![k]! - a[i]![k]! * a[k]![j]!) / previous;
    }
    previous = a[k]![k]!;
  }
  return n === 0 ? 1n : sign * previous;
}

function absoluteSum(p: Laurent): bigint {
  return p.terms().reduce((sum, [, c]) => sum + (c < 0n ? -c : c), 0n);
}

/** Random connected planar diagrams: braid closures, some with curls (nugatory crossings) or a connected sum. */
function randomConnectedDiagrams(seed: number, count: number, maxCrossings: number): LinkDiagram[] {
  const random = rng(seed);
  const result: LinkDiagram[] = [];
  while (result.length < count) {
    let d = randomDiagram(random, maxCrossings, 4);
    if (d.crossings.length === 0) continue;
    const extras = randomInt(random, 0, 2);
    for (let k = 0; k < extras && d.crossings.length < maxCrossings; k++) {
      d = addCurl(d, randomInt(random, 0, d.edgeCount - 1), random() < 0.5 ? 1 : -1, random() < 0.5);
    }
    if (random() < 0.2) d = connectedSum(d, closeBraid([1, -2, 1, -2], 3), randomInt(random, 0, d.edgeCount - 1));
    if (d.crossings.length <= maxCrossings + 4 && projectionConnected(d)) result.push(d);
  }
  return result;
}

describe('τ(G) of a checkerboard graph (Kirchhoff matrix-tree theorem, 1847)', () => {
  it('equals a brute-force spanning-tree count, for the graphs of both colours (planar duality), on random diagrams up to 13 crossings', () => {
    // τ(G) = τ(G*) for a connected plane graph and its dual (common practice): the other colour's graph is the dual.
    const diagrams = randomConnectedDiagrams(501, 150, 9);
    let withLoopEdges = 0;
    for (const d of diagrams) {
      const [g0, g1] = taitGraphs(d);
      expect(g0.vertices + g1.vertices).toBe(d.crossings.length + 2);
      if ([...g0.edges, ...g1.edges].some(([u, v]) => u === v)) withLoopEdges++;
      const trees = spanningTreesByBruteForce(g0);
      expect(spanningTreesByBruteForce(g1)).toBe(trees);
      expect(bracketNormBound(d)).toBe(trees);
      expect(bracketNormBound(shuffleDiagram(d, rng(d.crossings.length)))).toBe(trees);
    }
    expect(withLoopEdges).toBeGreaterThan(20); // nugatory crossings: a loop in one graph, a bridge in the other
  });

  it('equals an exact determinant (Bareiss elimination in this test) for both colours on closures of 40–160 crossings, τ past 2^60', () => {
    const random = rng(504);
    let largest = 0n;
    for (let i = 0; i < 12; i++) {
      const strands = randomInt(random, 3, 7);
      let d =
        i % 2 === 0
          ? randomReducedAlternating(random, randomInt(random, 40, 160), 7)
          : shuffleDiagram(closeBraid(randomBraidWord(random, strands, randomInt(random, 40, 160)), strands), random);
      d = addCurl(d, randomInt(random, 0, d.edgeCount - 1), 1, random() < 0.5);
      if (!projectionConnected(d)) continue;
      const [g0, g1] = taitGraphs(d);
      const trees = spanningTreesByDeterminant(g0);
      expect(spanningTreesByDeterminant(g1)).toBe(trees);
      expect(bracketNormBound(d)).toBe(trees);
      if (trees > largest) largest = trees;
    }
    expect(largest).toBeGreaterThan(2n ** 60n); // past what one or two word-sized primes could hold
    // The brute force and the determinant of this test agree with each other on small graphs.
    for (const d of randomConnectedDiagrams(505, 30, 9)) expect(spanningTreesByDeterminant(taitGraphs(d)[0])).toBe(spanningTreesByBruteForce(taitGraphs(d)[0]));
  });

  it('is 3 for a trefoil, 5 for a figure-eight knot, n for the (2, n) torus closure (determinants 3, 5, n: from memory; a cycle of n edges has n trees)', () => {
    expect(bracketNormBound(closeBraid([1, 1, 1], 2))).toBe(3n);
    expect(bracketNormBound(closeBraid([1, -2, 1, -2], 3))).toBe(5n);
    for (const n of [2, 7, 30]) expect(bracketNormBound(closeBraid(new Array(n).fill(1), 2))).toBe(BigInt(n));
  });

  it('is undefined with no crossings, for split projections and for non-planar (virtual) codes', () => {
    expect(bracketNormBound(closeBraid([], 2))).toBeUndefined();
    const trefoil = closeBraid([1, 1, 1], 2);
    expect(bracketNormBound(disjointUnion(trefoil, trefoil))).toBeUndefined();
    expect(bracketNormBound(closeBraid([1, 1, 3, 3, 3], 4))).toBeUndefined(); // σ2 absent: two pieces
    expect(bracketNormBound(withFreeLoops(trefoil, 2))).toBe(3n); // free loops aside
    // The virtual trefoil: Gauss code o1 o2 u1 u2 (common practice), here as PD tuples with both signs positive.
    const virtualTrefoil = assembleDiagram(
      [
        { edges: [3, 2, 4, 1], sign: 1 },
        { edges: [4, 3, 1, 2], sign: 1 },
      ],
      { notation: 'pd' },
    );
    expect(structuralProblem(virtualTrefoil)).toBeUndefined();
    expect(isPlanar(virtualTrefoil)).toBe(false);
    expect(bracketNormBound(virtualTrefoil)).toBeUndefined();
    const random = rng(77);
    let nonPlanarSeen = 0;
    for (let i = 0; i < 150; i++) {
      const d = rewired(randomDiagram(random, 9, 4), random);
      if (!d || d.crossings.length === 0 || !projectionConnected(d) || isPlanar(d)) continue;
      nonPlanarSeen++;
      expect(bracketNormBound(d)).toBeUndefined();
    }
    expect(nonPlanarSeen).toBeGreaterThan(20);
  });
});

describe('the lemma: sum of |coefficients| of ⟨D⟩ ≤ τ(G) (Thistlethwaite, Topology 26 (1987); proved in bracket-norm-bound.ts)', () => {
  it('holds against the state sum (Kauffman 1987) on 300 random connected diagrams, non-alternating, with curls and free loops', () => {
    const diagrams = randomConnectedDiagrams(502, 300, 10);
    let strict = 0;
    expect(diagrams.filter((d) => d.freeLoops > 0).length).toBeGreaterThan(10);
    for (const d of diagrams) {
      const bound = bracketNormBound(d);
      expect(bound).toBeDefined();
      // Free loops multiply ⟨D⟩ by d^k; the bound is stated for the diagram's crossings alone.
      const norm = absoluteSum(bracketByStateSum({ ...d, freeLoops: 0 }));
      expect(norm).toBeLessThanOrEqual(bound!);
      if (norm < bound!) strict++;
    }
    expect(strict).toBeGreaterThan(100); // cancellation in non-alternating diagrams: the test sees the bound is not an identity
  });

  it('is an equality on reduced alternating diagrams', () => {
    // V of a non-split alternating link alternates in sign (Thistlethwaite, Topology 26 (1987)), so the sum of its
    // |coefficients| is |V(−1)| = det (Jones 1985), and det = τ of a Tait graph of a connected alternating diagram
    // (common practice). ⟨D⟩ has the coefficients of V up to sign. Connected reduced alternating diagrams are non-split
    // (Menasco 1984).
    const random = rng(503);
    for (let i = 0; i < 60; i++) {
      const d = randomReducedAlternating(random, randomInt(random, 3, 13), 5);
      expect(absoluteSum(bracketByStateSum(d))).toBe(bracketNormBound(d));
    }
    // The trefoil and the figure-eight knot: determinants 3 and 5 (from memory).
    expect(absoluteSum(bracketByStateSum(closeBraid([1, 1, 1], 2)))).toBe(3n);
    expect(absoluteSum(bracketByStateSum(closeBraid([1, -2, 1, -2], 3)))).toBe(5n);
    const alternating = closeBraid(randomAlternatingBraidWord(random, 4, 12), 4);
    expect(absoluteSum(bracketByStateSum(alternating))).toBe(spanningTreesByBruteForce(taitGraphs(alternating)[1]));
  });
});
