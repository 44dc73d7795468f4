/**
 * The closure of a braid as a planar diagram. Generator +i (σ_i) is a
 * positive crossing between the strands at positions i and i+1, the strand
 * from position i passing over; −i is its inverse. Strands run upward and the
 * closure joins each top end to the bottom end at the same position.
 */
import { assembleDiagram, type RawCrossing } from './assemble.ts';
import type { LinkDiagram } from './model.ts';

export function closeBraid(word: readonly number[], strands: number): LinkDiagram {
  if (!Number.isInteger(strands) || strands < 1) throw new RangeError(`strand count ${strands} must be a positive integer`);
  // current[p] is the label of the edge now at position p (1-based positions, stored 0-based).
  let nextLabel = strands;
  const bottom = Array.from({ length: strands }, (_, p) => p);
  const current = [...bottom];
  const raw: RawCrossing[] = [];
  for (const g of word) {
    const i = Math.abs(g) - 1;
    if (!Number.isInteger(g) || g === 0 || i + 1 >= strands) throw new RangeError(`generator ${g} does not fit ${strands} strands`);
    const left = current[i]!; // enters at SW
    const right = current[i + 1]!; // enters at SE
    const outLeft = nextLabel++; // leaves at NW
    const outRight = nextLabel++; // leaves at NE
    if (g > 0) {
      // Over: SW → NE; under: SE → NW. Counterclockwise from SE: SE, NE, NW, SW.
      raw.push({ edges: [right, outRight, outLeft, left], sign: 1 });
    } else {
      // Over: SE → NW; under: SW → NE. Counterclockwise from SW: SW, SE, NE, NW.
      raw.push({ edges: [left, right, outRight, outLeft], sign: -1 });
    }
    current[i] = outLeft;
    current[i + 1] = outRight;
  }
  // Closing: the top edge at position p is the bottom edge at position p.
  const alias = new Map<number, number>();
  current.forEach((top, p) => alias.set(top, bottom[p]!));
  const resolve = (label: number): number => alias.get(label) ?? label;
  let freeLoops = 0;
  const closed = raw.map((c) => ({ ...c, edges: c.edges.map(resolve) as unknown as RawCrossing['edges'] }));
  // Strands whose whole closed component meets no crossing are free loops.
  const used = new Set(closed.flatMap((c) => c.edges));
  for (let p = 0; p < strands; p++) {
    // Follow the permutation cycle of position p; it is a free loop when none of its bottom labels is used.
    if (!used.has(bottom[p]!) && current[p] === bottom[p]) freeLoops++;
  }
  return assembleDiagram(closed, { notation: 'braid', freeLoops });
}
