/**
 * A canonical text of a diagram up to relabelling: two diagrams get the same
 * text exactly when one is the other with its crossings renumbered, its edges
 * renamed and its components listed in another order (a PD code with its
 * tuples reordered, a braid word rotated by conjugation, the same drawing
 * written in another notation). It is the key under which computed values are
 * stored, so it keeps everything a value can depend on: the planar map with its
 * counterclockwise slot order, the over/under data and the crossing signs, which
 * fix the orientation. A mirror image, a reversed orientation or a switched
 * crossing changes the text (unless the result is the same diagram after all).
 *
 * How: a crossing's slots are intrinsic (slot 0 is the incoming under-edge), so
 * an isomorphism of a connected piece is fixed by where it sends one crossing.
 * From each crossing in turn, a breadth-first walk numbers the piece's crossings
 * as it meets them, visiting slots 0…3 in order; the piece is written as each
 * crossing's sign and, per slot, the number and slot at the other end of its
 * edge. The least of these words over all starting crossings is the piece's
 * text (n walks of O(n) each). Pieces are sorted; free loops are counted.
 */
import { indexDiagram, type LinkDiagram } from '../diagram/model.ts';
import { familyOf } from '../families/identity.ts';

const texts = new WeakMap<LinkDiagram, string>();

export function canonicalDiagramText(d: LinkDiagram): string {
  let text = texts.get(d);
  if (text === undefined) texts.set(d, (text = computeText(d)));
  return text;
}

function computeText(d: LinkDiagram): string {
  const opposite = indexDiagram(d).opposite;
  const n = d.crossings.length;
  const piece = new Int32Array(n).fill(-1);
  const pieces: number[][] = [];
  for (let start = 0; start < n; start++) {
    if (piece[start] !== -1) continue;
    const members = [start];
    piece[start] = pieces.length;
    for (let i = 0; i < members.length; i++) {
      for (let slot = 0; slot < 4; slot++) {
        const other = opposite[4 * members[i]! + slot]! >> 2;
        if (piece[other] === -1) {
          piece[other] = pieces.length;
          members.push(other);
        }
      }
    }
    pieces.push(members);
  }
  const words = pieces.map((members) => pieceWord(d, opposite, members)).sort();
  return `${words.join('|')}|loops ${d.freeLoops}`;
}

/** The least walk word of a connected piece over all its starting crossings. */
function pieceWord(d: LinkDiagram, opposite: Int32Array, members: readonly number[]): string {
  const size = members.length;
  const label = new Int32Array(d.crossings.length).fill(-1);
  let best: Int32Array | undefined;
  let word = new Int32Array(5 * size);
  for (const start of members) {
    if (walkBelow(d, opposite, start, label, word, best)) {
      best = word;
      word = new Int32Array(5 * size);
    }
    for (const c of members) label[c] = -1;
  }
  return Array.from(best!, String).join(' ');
}

/**
 * Writes the walk from `start` into `word`; returns true when it is less than `best` (or there is no best
 * yet). Stops early, returning false, as soon as the word is known to be greater.
 */
function walkBelow(d: LinkDiagram, opposite: Int32Array, start: number, label: Int32Array, word: Int32Array, best: Int32Array | undefined): boolean {
  const order = [start];
  label[start] = 0;
  let at = 0;
  let smaller = best === undefined;
  const emit = (value: number): boolean => {
    if (!smaller) {
      const other = best![at]!;
      if (value > other) return false;
      if (value < other) smaller = true;
    }
    word[at++] = value;
    return true;
  };
  for (let i = 0; i < order.length; i++) {
    const c = order[i]!;
    if (!emit(d.crossings[c]!.sign)) return false;
    for (let slot = 0; slot < 4; slot++) {
      const end = opposite[4 * c + slot]!;
      const other = end >> 2;
      if (label[other] === -1) {
        label[other] = order.length;
        order.push(other);
      }
      if (!emit(4 * label[other]! + (end & 3))) return false;
    }
  }
  return smaller;
}

/**
 * The diagram exactly as numbered: crossings in order with their signs and edge labels, the components'
 * edge lists, the free loops, the notation and the family marking (src/core/families/identity.ts). Keys
 * values that depend on the numbering itself or on what the diagram was built as.
 */
export function labelledDiagramText(d: LinkDiagram): string {
  const crossings = d.crossings.map((c) => `${c.sign} ${c.edges.join(' ')}`).join(',');
  const family = familyOf(d);
  return `labelled ${d.notation}|${crossings}|${d.components.map((k) => k.join(' ')).join(',')}|loops ${d.freeLoops}|family ${family ? JSON.stringify(family) : 'none'}`;
}
