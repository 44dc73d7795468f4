/**
 * Braid words made longer by moves that keep the closure's link type:
 * inserting σᵢσᵢ⁻¹ (Reidemeister II), the braid relation
 * σᵢσᵢ₊₁σᵢ = σᵢ₊₁σᵢσᵢ₊₁ with one sign (Reidemeister III), commuting far
 * generators, and Markov stabilisation (a new strand with σₙ^±1, Reidemeister I).
 */
import { randomInt } from './random-diagrams.ts';

export function scrambleBraid(random: () => number, word: readonly number[], strands: number, steps: number): { word: number[]; strands: number } {
  const w = [...word];
  let n = strands;
  for (let s = 0; s < steps; s++) {
    const kind = randomInt(random, 0, 9);
    if (kind <= 3 || w.length < 3) {
      const i = randomInt(random, 1, n - 1) * (random() < 0.5 ? 1 : -1);
      w.splice(randomInt(random, 0, w.length), 0, i, -i);
    } else if (kind <= 6) {
      const k = randomInt(random, 0, w.length - 3);
      const [a, b, c] = [w[k]!, w[k + 1]!, w[k + 2]!];
      if (a === c && Math.sign(a) === Math.sign(b) && Math.abs(Math.abs(a) - Math.abs(b)) === 1) w.splice(k, 3, b, a, b);
    } else if (kind <= 8) {
      const k = randomInt(random, 0, w.length - 2);
      if (Math.abs(Math.abs(w[k]!) - Math.abs(w[k + 1]!)) >= 2) [w[k], w[k + 1]] = [w[k + 1]!, w[k]!];
    } else {
      w.splice(randomInt(random, 0, w.length), 0, n * (random() < 0.5 ? 1 : -1));
      n++;
    }
  }
  return { word: w, strands: n };
}
