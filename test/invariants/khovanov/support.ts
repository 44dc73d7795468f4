/** Shared helpers for the Khovanov tests: diagrams by braid word and homology in readable form. */
import { closeBraid } from '../../../src/core/diagram/braid-closure.ts';
import type { LinkDiagram } from '../../../src/core/diagram/model.ts';
import type { KhovanovHomology } from '../../../src/core/invariants/khovanov/homology.ts';
import { Laurent } from '../../../src/core/poly/laurent.ts';

export const braid = (word: number[]): LinkDiagram => closeBraid(word, Math.max(1, ...word.map(Math.abs)) + 1);

/** The torus link T(p, q) as the closure of (σ₁ … σ_{p−1})^q. */
export function torusLink(p: number, q: number): LinkDiagram {
  const word: number[] = [];
  for (let k = 0; k < q; k++) for (let i = 1; i < p; i++) word.push(i);
  return closeBraid(word, p);
}

/** "i,j:rank" entries, sorted, for compact comparisons. */
export const rankString = (h: KhovanovHomology): string => h.ranks.map(([i, j, r]) => `${i},${j}:${r}`).join(' ');

/** (q + q⁻¹)·V(t) at t^(1/2) = −q, as exponent → coefficient. */
export function unreducedJonesImage(jones: Laurent): Map<number, number> {
  return multiplyByLoop(reducedJonesImage(jones));
}

/** V(t) at t^(1/2) = −q. */
export function reducedJonesImage(jones: Laurent): Map<number, number> {
  const image = new Map<number, number>();
  for (const [e, c] of jones.terms()) {
    const power = 2 * e; // t^e = (t^(1/2))^(2e)
    const sign = power % 2 === 0 ? 1 : -1;
    image.set(power, (image.get(power) ?? 0) + sign * Number(c));
  }
  return image;
}

function multiplyByLoop(p: Map<number, number>): Map<number, number> {
  const result = new Map<number, number>();
  for (const [e, c] of p) for (const s of [1, -1]) result.set(e + s, (result.get(e + s) ?? 0) + c);
  for (const [e, c] of result) if (c === 0) result.delete(e);
  return result;
}

export const sortedMap = (m: Map<number, number>): [number, number][] => [...m].filter(([, c]) => c !== 0).sort((a, b) => a[0] - b[0]);
