/**
 * Khovanov homology over ℤ from the full cube of resolutions: every one of the
 * 2^n states, every labelling of its circles by 1 and X, the merge and split
 * maps of the Frobenius algebra ℤ[X]/(X²), and Smith normal form. Exponential
 * in the crossing count; kept as the independent oracle for the local engine
 * (local.ts) in the tests and as the baseline in the benchmark.
 *
 * Conventions: the 0-resolution of a crossing is the A-smoothing (slots 0–1
 * and 2–3), the oriented one at a positive crossing. A state with r
 * 1-resolutions sits in homological degree r − n₋; a generator with p labels 1
 * and m labels X in quantum degree p − m + r + n₊ − 2n₋. The edge changing
 * crossing k carries the sign (−1)^(number of 1-resolutions at crossings < k).
 */
import { indexDiagram, type LinkDiagram } from '../../diagram/model.ts';
import { GradedComplex, unlinkHomology, withUnknottedCircles, type KhovanovHomology } from './homology.ts';

export const MAX_CUBE_CROSSINGS = 16;

const A_PARTNER = [1, 0, 3, 2];
const B_PARTNER = [3, 2, 1, 0];

/** Circle id of every slot in the state `state` (bit k set: crossing k takes its 1-resolution). */
function stateCircles(opposite: Int32Array, n: number, state: number): { circleOf: Int32Array; count: number } {
  const circleOf = new Int32Array(4 * n).fill(-1);
  let count = 0;
  for (let s = 0; s < 4 * n; s++) {
    if (circleOf[s]! >= 0) continue;
    let slot = s;
    while (circleOf[slot]! < 0) {
      circleOf[slot] = count;
      const c = slot >> 2;
      const partner = 4 * c + ((state >> c) & 1 ? B_PARTNER : A_PARTNER)[slot & 3]!;
      circleOf[partner] = count;
      slot = opposite[partner]!;
    }
    count++;
  }
  return { circleOf, count };
}

const popcount = (x: number): number => {
  let c = 0;
  for (; x; x &= x - 1) c++;
  return c;
};

export function khovanovByCube(d: LinkDiagram): KhovanovHomology {
  const n = d.crossings.length;
  if (n > MAX_CUBE_CROSSINGS) throw new RangeError(`cube of resolutions refused: ${n} crossings is more than ${MAX_CUBE_CROSSINGS}`);
  if (n === 0) {
    return unlinkHomology(d.freeLoops);
  }
  const { opposite } = indexDiagram(d);
  const nMinus = d.crossings.filter((c) => c.sign === -1).length;
  const nPlus = n - nMinus;
  const states = 1 << n;
  const circles = Array.from({ length: states }, (_, v) => stateCircles(opposite, n, v));
  const complex = new GradedComplex();
  // index[v][labels] = generator number within its bidegree; labels bit c set means circle c is labelled X.
  const degreeOf = (v: number, labels: number): [number, number] => {
    const r = popcount(v);
    const m = popcount(labels);
    return [r, circles[v]!.count - 2 * m + r];
  };
  const index: Int32Array[] = circles.map((state, v) => {
    const ids = new Int32Array(1 << state.count);
    for (let labels = 0; labels < ids.length; labels++) {
      const [h, q] = degreeOf(v, labels);
      ids[labels] = complex.addGenerator(h, q);
    }
    return ids;
  });
  for (let v = 0; v < states; v++) {
    const source = circles[v]!;
    for (let k = 0; k < n; k++) {
      if ((v >> k) & 1) continue;
      const w = v | (1 << k);
      const target = circles[w]!;
      const sign = popcount(v & ((1 << k) - 1)) % 2 === 0 ? 1 : -1;
      // Circles away from crossing k keep their slots; map them by any slot.
      const touched = new Set([source.circleOf[4 * k]!, source.circleOf[4 * k + 2]!]);
      const born = new Set([target.circleOf[4 * k]!, target.circleOf[4 * k + 1]!]);
      const carried: [number, number][] = [];
      const seen = new Set<number>();
      for (let s = 0; s < 4 * n; s++) {
        const c = source.circleOf[s]!;
        if (touched.has(c) || seen.has(c)) continue;
        seen.add(c);
        carried.push([c, target.circleOf[s]!]);
      }
      const [t1, t2] = [...born];
      const [s1, s2] = [...touched];
      for (let labels = 0; labels < 1 << source.count; labels++) {
        let base = 0;
        for (const [c, c2] of carried) if ((labels >> c) & 1) base |= 1 << c2;
        const [h, q] = degreeOf(v, labels);
        const from = index[v]![labels]!;
        const to = (targetLabels: number): void => {
          complex.addEntry(h, q, from, index[w]![targetLabels]!, sign);
        };
        if (s2 !== undefined) {
          // Merge: 1·1 = 1, 1·X = X·1 = X, X·X = 0.
          const xs = ((labels >> s1!) & 1) + ((labels >> s2) & 1);
          if (xs === 0) to(base);
          else if (xs === 1) to(base | (1 << t1!));
        } else {
          // Split: Δ(1) = 1⊗X + X⊗1, Δ(X) = X⊗X.
          if ((labels >> s1!) & 1) to(base | (1 << t1!) | (1 << t2!));
          else {
            to(base | (1 << t1!));
            to(base | (1 << t2!));
          }
        }
      }
    }
  }
  const raw = complex.homology();
  const shifted: KhovanovHomology = {
    ranks: raw.ranks.map(([h, q, r]) => [h - nMinus, q + nPlus - 2 * nMinus, r] as const),
    torsion: raw.torsion.map(([h, q, o, m]) => [h - nMinus, q + nPlus - 2 * nMinus, o, m] as const),
  };
  return withUnknottedCircles(shifted, d.freeLoops);
}
