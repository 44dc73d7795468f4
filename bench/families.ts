/** Diagram families and their independent checks, shared by the engine benchmarks. */
import { closeBraid } from '../src/core/diagram/braid-closure.ts';
import type { LinkDiagram } from '../src/core/diagram/model.ts';
import { Laurent } from '../src/core/poly/laurent.ts';
import { randomAlternatingBraidWord, rng, shuffleDiagram } from '../test/support/random-diagrams.ts';

/** The braid word (σ1…σ(p−1))^q, whose closure is the torus knot or link T(p,q). */
export function torusBraid(p: number, q: number): number[] {
  return Array.from({ length: q }, () => Array.from({ length: p - 1 }, (_, i) => i + 1)).flat();
}

/** V(T(p,q)) = t^((p−1)(q−1)/2)(1 − t^(p+1) − t^(q+1) + t^(p+q))/(1 − t²) (Jones 1987). */
export function torusKnotJones(p: number, q: number): Laurent {
  return Laurent.fromTerms([[0, 1], [p + 1, -1], [q + 1, -1], [p + q, 1]])
    .divExact(Laurent.fromTerms([[0, 1], [2, -1]]))
    .shift(((p - 1) * (q - 1)) / 2);
}

/** A random alternating braid closure on `strands` strands, crossings shuffled and edges relabelled. */
export function alternatingBraidClosure(seed: number, strands: number, crossings: number): LinkDiagram {
  const random = rng(seed);
  return shuffleDiagram(closeBraid(randomAlternatingBraidWord(random, strands, crossings), strands), random);
}
