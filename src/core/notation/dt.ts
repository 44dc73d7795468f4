/**
 * DT codes of knots, realised as planar diagrams.
 *
 * Walking along the knot, visits are labelled 1 … 2n; entry k is the even
 * label met at the same crossing as the odd label 2k−1, negative when that
 * even visit passes over. The code gives the crossings' order along the knot
 * but not how the plane curve turns at each one; that is recovered here.
 *
 * The turn of crossing c is ε_c = +1 when its even-labelled pass crosses its
 * odd-labelled pass from right to left, −1 otherwise. Call crossings a and b
 * interlaced when exactly one visit of b lies strictly between the two visits
 * of a. A curve in the plane satisfies (Rosenstiehl's characterisation of
 * planar Gauss words, from memory):
 *   – every crossing is interlaced with an even number of crossings (Gauss's
 *     evenness condition; automatic for DT codes, since pairing each odd label
 *     with an even one leaves an even number of visits between them);
 *   – for two non-interlaced crossings, the number of crossings interlaced
 *     with both is even;
 *   – for two interlaced crossings a, b: ε_a = ε_b exactly when the number of
 *     crossings interlaced with both is odd.
 * The last rule fixes every turn from one free choice per connected part of
 * the interlacement graph, by a breadth-first walk; a contradiction means no
 * planar curve has this code. The result is checked once more by Euler's
 * formula, so an accepted code always has a genuine planar realisation.
 */
import { assembleDiagram, type RawCrossing } from '../diagram/assemble.ts';
import type { LinkDiagram, Sign } from '../diagram/model.ts';
import { InputError } from '../errors.ts';
import { codeError, integerValue, isOversizedInteger, listTokens, quote, wholeSpan, type Token } from './common.ts';
import { firstNonPlanarPiece } from './planarity.ts';

/** The interlacement test is cubic (over 32-bit words): 1500 entries take about half a second. */
export const MAX_DT_ENTRIES = 2000;

type PassEnd = 'oddIn' | 'oddOut' | 'evenIn' | 'evenOut';

const EXAMPLE = 'e.g. 4 6 2 for a trefoil, 4 6 8 2 for the figure-eight knot';

/**
 * Reads a DT code. Without `partSigns` every choice the code leaves open is made by a rule (the first entry
 * of each independent part turns +1) and the diagram lists the choices as `openChoices`; with `partSigns`
 * (one sign per part, for its first crossing) the diagram is that realisation, with every choice fixed.
 */
export function parseDtCode(text: string, partSigns?: readonly Sign[]): LinkDiagram {
  const tokens = listTokens(
    text,
    (bracket, offset) =>
      `Unexpected "${bracket}" at offset ${offset}: a DT code is one knot's list of signed even numbers, at most wrapped in one pair of brackets, ${EXAMPLE}. DT codes of links are not read: write a link as a PD or Gauss code.`,
  );
  if (tokens.length === 0) throw codeError(`The DT code is empty: write the even labels paired with 1, 3, 5, …, ${EXAMPLE}.`, wholeSpan(text));
  if (tokens.length > MAX_DT_ENTRIES) throw codeError(`The DT code has ${tokens.length} entries; at most ${MAX_DT_ENTRIES} are supported.`, wholeSpan(text));
  const entries = readEntries(tokens);
  const { turns, partOf, roots } = realiseTurns(entries, tokens);
  const build = (turnOf: readonly Sign[], chiralityFixed: boolean): LinkDiagram => buildDtDiagram(text, entries, turnOf, chiralityFixed);
  const drawn = build(turns, false);
  const drawnSigns = roots.map((root) => drawn.crossings[root]!.sign);
  // Reflecting a part flips the turn of each of its crossings, and with it the sign of each.
  const realise = (signs: readonly Sign[]): LinkDiagram =>
    build(
      turns.map((turn, k) => (signs[partOf[k]!] === drawnSigns[partOf[k]!] ? turn : (-turn as Sign))),
      true,
    );
  if (partSigns !== undefined) {
    if (partSigns.length !== roots.length) {
      throw new InputError(
        'choice-invalid',
        `part-signs lists ${partSigns.length} sign${partSigns.length === 1 ? '' : 's'}, but this DT code has ${roots.length} independent part${roots.length === 1 ? '' : 's'} (${describeParts(roots, partOf)}): give one sign, + or -, per part, the sign of its first crossing`,
      );
    }
    return realise(partSigns);
  }
  const parts = roots.map((_, p) => {
    const crossings = entries.map((_, k) => k).filter((k) => partOf[k] === p);
    return { crossings, kink: crossings.length === 1 };
  });
  return { ...drawn, openChoices: { parts, realise } };
}

/** "entries 1–3; entry 4 (a kink)": the parts of a code by their entries, counted from 1. */
export function describeParts(roots: readonly number[], partOf: ArrayLike<number>): string {
  return roots
    .map((_, p) => {
      const members: number[] = [];
      for (let k = 0; k < partOf.length; k++) if (partOf[k] === p) members.push(k + 1);
      return describeEntries(members);
    })
    .join('; ');
}

/** "entry 4 (a kink)", "entries 1–3", "entries 1, 2, 5". */
export function describeEntries(entries: readonly number[]): string {
  if (entries.length === 1) return `entry ${entries[0]} (a kink)`;
  const consecutive = entries.every((e, i) => i === 0 || e === entries[i - 1]! + 1);
  return consecutive ? `entries ${entries[0]}–${entries[entries.length - 1]}` : `entries ${entries.join(', ')}`;
}

function buildDtDiagram(text: string, entries: readonly number[], turns: readonly Sign[], chiralityFixed: boolean): LinkDiagram {
  const n = entries.length;
  // Edge p runs into visit p (edge 1 from visit 2n), so the assembled knot starts on the edge entering visit 1.
  const enter = (visit: number): number => visit;
  const leave = (visit: number): number => (visit === 2 * n ? 1 : visit + 1);
  const raw: RawCrossing[] = entries.map((entry, k) => {
    const odd = 2 * k + 1;
    const even = Math.abs(entry);
    const edgeOf: Record<PassEnd, number> = { oddIn: enter(odd), oddOut: leave(odd), evenIn: enter(even), evenOut: leave(even) };
    // Counterclockwise around the crossing, starting with the odd pass coming in. Roles, not labels: a kink repeats a label.
    const around: PassEnd[] = turns[k] === 1 ? ['oddIn', 'evenIn', 'oddOut', 'evenOut'] : ['oddIn', 'evenOut', 'oddOut', 'evenIn'];
    const evenUnder = entry > 0;
    const shift = around.indexOf(evenUnder ? 'evenIn' : 'oddIn');
    const slots = [0, 1, 2, 3].map((s) => around[(s + shift) % 4]!);
    // The over strand comes in at slot 3 at a positive crossing, at slot 1 at a negative one.
    const sign: Sign = slots[3] === (evenUnder ? 'oddIn' : 'evenIn') ? 1 : -1;
    return { edges: slots.map((role) => edgeOf[role]) as unknown as RawCrossing['edges'], sign };
  });
  const diagram = assembleDiagram(raw, { notation: 'dt', chiralityFixed });
  if (firstNonPlanarPiece(diagram)) {
    throw codeError('No planar knot diagram has this DT code (the curve it describes cannot be drawn in the plane without extra crossings). Check the entries for a misprint.', wholeSpan(text));
  }
  return diagram;
}

/** "2", "2 and 4", "2, 4, …, 2n": the labels a code of n entries uses. */
function evenLabels(n: number): string {
  if (n === 1) return '2';
  if (n === 2) return '2 and 4';
  return `2, 4, …, ${2 * n}`;
}

function readEntries(tokens: readonly Token[]): number[] {
  const n = tokens.length;
  const seen = new Map<number, number>();
  return tokens.map((token, k) => {
    const value = integerValue(token.text);
    const name = `Entry ${k + 1}`;
    if (value === undefined && isOversizedInteger(token.text)) {
      throw codeError(`${name} ${quote(token.text)} is out of range: a code with ${n} entr${n === 1 ? 'y' : 'ies'} uses the even labels ${evenLabels(n)} (with signs), each once.`, token);
    }
    if (value === undefined) throw codeError(`${name} ${quote(token.text)} is not a number: a DT code lists signed even numbers, ${EXAMPLE}.`, token);
    if (value === 0) throw codeError(`${name} is 0: DT entries are nonzero even numbers (here ${evenLabels(n)}, with signs).`, token);
    if (value % 2 !== 0) {
      throw codeError(`${name} is ${value}, which is odd: entry k is the even label that shares a crossing with the odd label 2k−1, so every entry is even.`, token);
    }
    if (Math.abs(value) > 2 * n) {
      throw codeError(`${name} is ${value}, out of range: a code with ${n} entr${n === 1 ? 'y' : 'ies'} uses the even labels ${evenLabels(n)} (with signs), each once.`, token);
    }
    const earlier = seen.get(Math.abs(value));
    if (earlier !== undefined) {
      throw codeError(`${name} repeats the label ${Math.abs(value)} already used by entry ${earlier + 1}: each of the even labels ${evenLabels(n)} belongs to exactly one crossing.`, token);
    }
    seen.set(Math.abs(value), k);
    return value;
  });
}

/** The turn ε of every crossing (indexed like the entries), or an error naming the entries that cannot be drawn. */
function realiseTurns(entries: readonly number[], tokens: readonly Token[]): { turns: Sign[]; partOf: Int32Array; roots: number[] } {
  const n = entries.length;
  const words = (n + 31) >>> 5;
  const first = entries.map((e, k) => Math.min(2 * k + 1, Math.abs(e)));
  const last = entries.map((e, k) => Math.max(2 * k + 1, Math.abs(e)));
  const crossingAt = new Int32Array(2 * n + 1);
  entries.forEach((e, k) => {
    crossingAt[2 * k + 1] = k;
    crossingAt[Math.abs(e)] = k;
  });
  // interlaced[a] as a bitset over crossings.
  const interlaced = Array.from({ length: n }, () => new Uint32Array(words));
  const neighbours: number[][] = Array.from({ length: n }, () => []);
  for (let a = 0; a < n; a++) {
    // A crossing with exactly one visit strictly inside a's interval occurs there exactly once.
    const count = new Uint8Array(n);
    for (let p = first[a]! + 1; p < last[a]!; p++) count[crossingAt[p]!]!++;
    for (let b = 0; b < n; b++) {
      if (count[b] === 1) {
        interlaced[a]![b >>> 5]! |= 1 << (b & 31);
        neighbours[a]!.push(b);
      }
    }
  }
  const describe = (k: number): string => `entry ${k + 1} (${quote(tokens[k]!.text)}: labels ${2 * k + 1} and ${Math.abs(entries[k]!)})`;
  const commonIsOdd = (a: number, b: number): boolean => {
    let parity = 0;
    const x = interlaced[a]!;
    const y = interlaced[b]!;
    for (let w = 0; w < words; w++) parity ^= popcount(x[w]! & y[w]!) & 1;
    return parity === 1;
  };
  for (let a = 0; a < n; a++) {
    for (let b = a + 1; b < n; b++) {
      if (!((interlaced[a]![b >>> 5]! >>> (b & 31)) & 1) && commonIsOdd(a, b)) {
        throw codeError(
          `No planar knot diagram has this DT code: the crossings of ${describe(a)} and ${describe(b)} are not interlaced, yet an odd number of other crossings are interlaced with both (one crossing is interlaced with another when exactly one of its visits lies between the other's two labels); no plane curve does that. Check these entries for a misprint.`,
          tokens[b]!,
        );
      }
    }
  }
  const turn = new Array<Sign | 0>(n).fill(0);
  const partOf = new Int32Array(n);
  const roots: number[] = [];
  for (let root = 0; root < n; root++) {
    if (turn[root] !== 0) continue;
    // The free choice of each independent part: its first entry turns +1.
    turn[root] = 1;
    partOf[root] = roots.length;
    roots.push(root);
    const queue = [root];
    for (let head = 0; head < queue.length; head++) {
      const a = queue[head]!;
      for (const b of neighbours[a]!) {
        const wanted = (commonIsOdd(a, b) ? turn[a] : -turn[a]!) as Sign;
        if (turn[b] === 0) {
          turn[b] = wanted;
          partOf[b] = partOf[a]!;
          queue.push(b);
        } else if (turn[b] !== wanted) {
          const [x, y] = a < b ? [a, b] : [b, a];
          throw codeError(
            `No planar knot diagram has this DT code: at the crossings of ${describe(x)} and ${describe(y)} the crossings interlaced with them force the curve to cross itself both ways round at once (one crossing is interlaced with another when exactly one of its visits lies between the other's two labels). Check the entries for a misprint.`,
            tokens[y]!,
          );
        }
      }
    }
  }
  return { turns: turn as Sign[], partOf, roots };
}

function popcount(x: number): number {
  x -= (x >>> 1) & 0x55555555;
  x = (x & 0x33333333) + ((x >>> 2) & 0x33333333);
  x = (x + (x >>> 4)) & 0x0f0f0f0f;
  return Math.imul(x, 0x01010101) >>> 24;
}
