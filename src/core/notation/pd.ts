/**
 * PD codes: one 4-tuple of edge labels per crossing, listed counterclockwise
 * from the incoming under-edge; edges numbered consecutively along each
 * component. The tuples fix the under strands' direction only; the over
 * strands' direction, and with it each crossing's sign, is recovered by
 * tracing the components (README `notations`).
 */
import { assembleDiagram, type RawCrossing } from '../diagram/assemble.ts';
import type { LinkDiagram, Sign } from '../diagram/model.ts';
import type { TextSpan } from '../diagnostics/diagnostic.ts';
import { codeError, plural, integerValue, isOversizedInteger, isSeparator, listNumbers, quote, spanBetween, wholeSpan, type Token } from './common.ts';
import { firstNonPlanarPiece } from './planarity.ts';

interface PdTuple {
  readonly labels: number[];
  readonly tokens: Token[];
  readonly span: TextSpan;
}

const CLOSER: Readonly<Record<string, string>> = { '(': ')', '[': ']' };
const EXAMPLE = 'e.g. (4,2,5,1) (2,6,3,5) (6,4,1,3)';

export function parsePdCode(text: string): LinkDiagram {
  const tuples = readTuples(text);
  checkLabelCounts(tuples);
  const signs = orient(tuples);
  const raw: RawCrossing[] = tuples.map((t, k) => ({ edges: t.labels as unknown as RawCrossing['edges'], sign: signs[k]! }));
  const diagram = assembleDiagram(raw, { notation: 'pd' });
  const bad = firstNonPlanarPiece(diagram);
  if (bad) {
    const numbers = bad.crossings.map((c) => c + 1);
    throw codeError(
      `The PD code is not planar (it describes a virtual diagram): the piece made of tuple${numbers.length > 1 ? 's' : ''} ${listNumbers(numbers)} has ${plural(bad.faces, 'face')}, but ${plural(bad.crossings.length, 'crossing')} drawn in the plane bound ${bad.expected}. Check that each of these tuples lists its labels counterclockwise, starting from the incoming under-edge.`,
      spanBetween(tuples[bad.crossings[0]!]!.span, tuples[bad.crossings[bad.crossings.length - 1]!]!.span),
    );
  }
  return diagram;
}

/** Tuples in ( ) or [ ], separated by whitespace or commas, optionally inside one outer pair of brackets. */
function readTuples(text: string): PdTuple[] {
  let from = 0;
  let to = text.length;
  const first = firstNonSeparator(text, 0);
  if (first < text.length && CLOSER[text[first]!] && CLOSER[text[firstNonSeparator(text, first + 1)] ?? '']) {
    // An outer pair around the tuples, as in [(4,2,5,1), (2,6,3,5), …].
    const last = lastNonSeparator(text);
    if (text[last] !== CLOSER[text[first]!]) {
      throw codeError(`The opening "${text[first]}" at offset ${first} that encloses the tuples is never closed: end the code with "${CLOSER[text[first]!]}".`, { start: first, end: first + 1 });
    }
    from = first + 1;
    to = last;
  }
  const tuples: PdTuple[] = [];
  let i = from;
  while (i < to) {
    const ch = text[i]!;
    if (isSeparator(ch)) {
      i++;
      continue;
    }
    const closer = CLOSER[ch];
    if (!closer) {
      let end = i;
      while (end < to && !isSeparator(text[end]!) && !CLOSER[text[end]!]) end++;
      end = Math.max(end, i + 1);
      throw codeError(
        `Unexpected ${quote(text.slice(i, end))} at offset ${i}${tuples.length ? `, after tuple ${tuples.length}` : ''}: a PD code is a list of 4-tuples of edge labels in parentheses, ${EXAMPLE}.`,
        { start: i, end },
      );
    }
    const number = tuples.length + 1;
    let j = i + 1;
    const tokens: Token[] = [];
    while (j < to && text[j] !== closer) {
      const c = text[j]!;
      if (isSeparator(c)) {
        j++;
        continue;
      }
      if (CLOSER[c] || c === ')' || c === ']') {
        throw codeError(`Tuple ${number}, opened at offset ${i}, is not closed before the "${c}" at offset ${j}: close it with "${closer}".`, { start: i, end: j + 1 });
      }
      const start = j;
      while (j < to && !isSeparator(text[j]!) && text[j] !== closer && !CLOSER[text[j]!] && text[j] !== ')' && text[j] !== ']') j++;
      tokens.push({ text: text.slice(start, j), start, end: j });
    }
    if (j >= to) {
      throw codeError(`Tuple ${number}, opened at offset ${i}, is never closed: end it with "${closer}".`, { start: i, end: to });
    }
    const span = { start: i, end: j + 1 };
    const labels = tokens.map((token, k) => {
      const value = integerValue(token.text);
      if (value === undefined && isOversizedInteger(token.text)) {
        throw codeError(`Tuple ${number}, entry ${k + 1}: the label ${quote(token.text)} is too large; labels must lie between −(2^53 − 1) and 2^53 − 1. Renumber the edges from 1.`, token);
      }
      if (value === undefined) {
        throw codeError(`Tuple ${number}, entry ${k + 1}: ${quote(token.text)} is not an edge label; labels are whole numbers, ${EXAMPLE}.`, token);
      }
      return value;
    });
    if (labels.length !== 4) {
      throw codeError(
        `Tuple ${number} has ${labels.length} label${labels.length === 1 ? '' : 's'}, but a crossing has exactly 4 edge ends: list them counterclockwise from the incoming under-edge.`,
        span,
      );
    }
    tuples.push({ labels, tokens, span });
    i = j + 1;
  }
  if (tuples.length === 0) {
    throw codeError(`The PD code is empty: write one 4-tuple of edge labels per crossing, ${EXAMPLE}. (A PD code cannot express a crossingless circle; write the unknot as the Gauss code "()".)`, wholeSpan(text));
  }
  return tuples;
}

function firstNonSeparator(text: string, from: number): number {
  let i = from;
  while (i < text.length && isSeparator(text[i]!)) i++;
  return i;
}

function lastNonSeparator(text: string): number {
  let i = text.length - 1;
  while (i >= 0 && isSeparator(text[i]!)) i--;
  return i;
}

/** Every label must occur exactly twice: once at each end of its edge. */
function checkLabelCounts(tuples: readonly PdTuple[]): void {
  const places = new Map<number, { tuple: number; token: Token }[]>();
  tuples.forEach((t, k) =>
    t.labels.forEach((label, slot) => {
      const list = places.get(label) ?? [];
      list.push({ tuple: k + 1, token: t.tokens[slot]! });
      places.set(label, list);
    }),
  );
  // Report the label whose offending occurrence comes first in the text.
  let worst: { at: Token; message: string } | undefined;
  for (const [label, list] of places) {
    if (list.length === 2) continue;
    const at = list.length === 1 ? list[0]!.token : list[2]!.token;
    const where = listNumbers([...new Set(list.map((p) => p.tuple))]);
    const message =
      list.length === 1
        ? `Edge label ${label} appears only once (tuple ${where}); every edge joins two crossing ends, so each label must appear exactly twice. Check for a typo in this tuple or a missing tuple.`
        : `Edge label ${label} appears ${list.length} times (tuple${where.includes(' ') ? 's' : ''} ${where}); every edge joins exactly two crossing ends, so each label must appear exactly twice.`;
    if (!worst || at.start < worst.at.start) worst = { at, message };
  }
  if (worst) throw codeError(worst.message, worst.at);
}

/**
 * Direction of travel of every component, hence the sign of every crossing.
 * A slot id is 4·tuple + slot; `through` goes straight across a crossing and
 * `partner` along an edge to its other end.
 */
function orient(tuples: readonly PdTuple[]): Sign[] {
  const slotCount = 4 * tuples.length;
  const labelAt = (x: number): number => tuples[x >> 2]!.labels[x & 3]!;
  const partner = new Int32Array(slotCount);
  const firstPlace = new Map<number, number>();
  for (let x = 0; x < slotCount; x++) {
    const other = firstPlace.get(labelAt(x));
    if (other === undefined) firstPlace.set(labelAt(x), x);
    else {
      partner[x] = other;
      partner[other] = x;
    }
  }
  const through = (x: number): number => (x & ~3) | ((x + 2) & 3);
  // entered[x] is set for the slots where the chosen direction enters a crossing.
  const entered = new Uint8Array(slotCount);
  const passageSeen = new Uint8Array(2 * tuples.length);
  for (let start = 0; start < slotCount; start++) {
    if ((start & 3) > 1 || passageSeen[2 * (start >> 2) + (start & 1)]) continue;
    // One direction of the component: its entry slots in order of travel.
    let entries: number[] = [];
    let x = start;
    do {
      entries.push(x);
      passageSeen[2 * (x >> 2) + (x & 1)] = 1;
      x = partner[through(x)]!;
    } while (x !== start);
    const unders = entries.filter((e) => (e & 1) === 0);
    if (unders.length > 0) {
      // The direction most under-passes agree on is taken as meant (ties: the earliest tuple's); the first other one is at fault.
      const forward = unders.filter((e) => (e & 3) === 0);
      const backward = unders.filter((e) => (e & 3) === 2);
      const earliest = unders.reduce((a, b) => (b < a ? b : a));
      const majority = forward.length !== backward.length ? (forward.length > backward.length ? 0 : 2) : earliest & 3;
      const reference = unders.filter((e) => (e & 3) === majority).reduce((a, b) => (b < a ? b : a));
      const conflict = unders.filter((e) => (e & 3) !== majority).reduce<number | undefined>((a, b) => (a === undefined || b < a ? b : a), undefined);
      if (conflict !== undefined) {
        const [k, j] = [conflict >> 2, reference >> 2];
        throw codeError(
          `Inconsistent orientation at tuple ${k + 1}: read from its first entry (incoming under-edge) to its third (outgoing), it sends the strand the opposite way to tuple ${j + 1}${forward.length + backward.length > 2 ? ' and most of the strand\'s other under-passes' : ''}. Check the order of the labels in tuple ${k + 1}: the incoming under-edge comes first, then the others counterclockwise.`,
          tuples[k]!.span,
          ['Every component passes under each of its crossings in its direction of travel: in on the first entry of the tuple, out on the third.'],
        );
      }
      if ((reference & 3) === 2) entries = reverse(entries, through);
      const broken = firstNonConsecutiveStep(entries, labelAt, through);
      if (broken !== undefined && entries.length > 2 && firstNonConsecutiveStep(reverse(entries, through), labelAt, through) === undefined) {
        throw descendingLabels(tuples, entries, labelAt, through);
      }
      if (broken !== undefined) throw notConsecutive(tuples, entries, broken, labelAt, through);
    } else {
      const backward = reverse(entries, through);
      const forwardBreak = firstNonConsecutiveStep(entries, labelAt, through);
      const backwardBreak = firstNonConsecutiveStep(backward, labelAt, through);
      if (forwardBreak !== undefined && backwardBreak !== undefined) throw notConsecutive(tuples, entries, forwardBreak, labelAt, through);
      if (forwardBreak === undefined && backwardBreak === undefined) {
        // Only 1- or 2-edge components read consecutively both ways: the crossing in the earliest tuple is made positive (entered at slot 3).
        const earliest = entries.reduce((a, b) => (b < a ? b : a));
        if ((earliest & 3) !== 3) entries = backward;
      } else if (forwardBreak !== undefined) entries = backward;
    }
    for (const e of entries) entered[e] = 1;
  }
  return tuples.map((_, k) => (entered[4 * k + 3] ? 1 : -1));
}

function reverse(entries: readonly number[], through: (x: number) => number): number[] {
  return entries.map(through).reverse();
}

/** Index in `entries` of the first step (in travel order from the smallest label) that does not go e → e+1 or wrap once. */
function firstNonConsecutiveStep(entries: readonly number[], labelAt: (x: number) => number, through: (x: number) => number): number | undefined {
  const m = entries.length;
  let from = 0;
  for (let i = 1; i < m; i++) if (labelAt(entries[i]!) < labelAt(entries[from]!)) from = i;
  for (let step = 0; step < m; step++) {
    const i = (from + step) % m;
    const here = labelAt(entries[i]!);
    const next = labelAt(through(entries[i]!));
    if (next !== here + 1 && next !== here - (m - 1)) return i;
  }
  return undefined;
}

/** A component whose labels run e, e−1, … in the direction its under-passes give: numbered against its orientation. */
function descendingLabels(tuples: readonly PdTuple[], entries: readonly number[], labelAt: (x: number) => number, through: (x: number) => number): Error {
  const under = entries.find((x) => (x & 3) === 0)!;
  const k = under >> 2;
  const [a, b, c, d] = tuples[k]!.labels;
  return codeError(
    `Labels run backwards along a component at tuple ${k + 1}: its under-passes send the strand from edge ${labelAt(under)} to edge ${labelAt(through(under))}, so the labels decrease in the direction of travel, but they must increase (e, e+1, …). If the labels are right, start each of this component's tuples at its other under-edge, e.g. tuple ${k + 1} as (${c},${d},${a},${b}); otherwise number the edges the other way round.`,
    tuples[k]!.span,
  );
}

function notConsecutive(
  tuples: readonly PdTuple[],
  entries: readonly number[],
  broken: number,
  labelAt: (x: number) => number,
  through: (x: number) => number,
): Error {
  const x = entries[broken]!;
  const k = x >> 2;
  const here = labelAt(x);
  const next = labelAt(through(x));
  return codeError(
    `Labels are not consecutive along a component at tuple ${k + 1}: the strand arrives on edge ${here} and leaves on edge ${next}, but edges must be numbered consecutively in the direction of travel (${here} is followed by ${here + 1}, wrapping around once per component). Check the labels of tuple ${k + 1} and their order (counterclockwise from the incoming under-edge).`,
    tuples[k]!.span,
  );
}
