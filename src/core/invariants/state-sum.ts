/**
 * The Kauffman bracket by the plain sum over all 2^n states. Exponential:
 * kept only as an independent oracle for small diagrams in the tests and as
 * the baseline in the benchmark.
 *
 * Smoothing convention (shared with the tangle engine): at a crossing with
 * slots 0..3 counterclockwise from the incoming under-edge, the A-smoothing
 * joins slots 0–1 and 2–3, the B-smoothing joins 0–3 and 1–2.
 */
import { Laurent } from '../poly/laurent.ts';
import { indexDiagram, type LinkDiagram } from '../diagram/model.ts';

export const MAX_STATE_SUM_CROSSINGS = 26;

/** Counts the circles of the state given by `bChoices` (bit k set: B-smoothing at crossing k). */
export function stateCircleCount(d: LinkDiagram, isB: (k: number) => boolean): number {
  const n = d.crossings.length;
  const { opposite } = indexDiagram(d);
  const seen = new Uint8Array(4 * n);
  let circles = 0;
  for (let s = 0; s < 4 * n; s++) {
    if (seen[s]) continue;
    circles++;
    let slot = s;
    while (!seen[slot]) {
      seen[slot] = 1;
      const c = slot >> 2;
      const q = slot & 3;
      // Partner within the smoothing.
      const partner = isB(c) ? [3, 2, 1, 0][q]! : [1, 0, 3, 2][q]!;
      const p = 4 * c + partner;
      seen[p] = 1;
      slot = opposite[p]!;
    }
  }
  return circles + d.freeLoops;
}

export function bracketByStateSum(d: LinkDiagram): Laurent {
  const n = d.crossings.length;
  if (n > MAX_STATE_SUM_CROSSINGS) throw new RangeError(`state sum refused: ${n} crossings is more than ${MAX_STATE_SUM_CROSSINGS}`);
  // coefficient of A^a d^(k−1): accumulate counts by (a, k).
  const counts = new Map<string, bigint>();
  for (let mask = 0; mask < 2 ** n; mask++) {
    let bCount = 0;
    for (let k = 0; k < n; k++) if ((mask >> k) & 1) bCount++;
    const loops = stateCircleCount(d, (k) => ((mask >> k) & 1) === 1);
    const key = `${n - 2 * bCount},${loops}`;
    counts.set(key, (counts.get(key) ?? 0n) + 1n);
  }
  const loop = Laurent.fromTerms([[2, -1n], [-2, -1n]]);
  let total = Laurent.zero;
  for (const [key, count] of counts) {
    const [a, loops] = key.split(',').map(Number) as [number, number];
    total = total.add(loop.pow(loops - 1).shift(a).scale(count));
  }
  return total;
}
