/**
 * Signed Gauss codes in skeinproof's own syntax (README `notations`): the
 * visits along each component, each naming over/under, the crossing and
 * (at least once per crossing) its sign; components in parentheses, `()` a
 * crossingless one.
 */
import { assembleDiagram, type RawCrossing } from '../diagram/assemble.ts';
import type { LinkDiagram, Sign } from '../diagram/model.ts';
import type { TextSpan } from '../diagnostics/diagnostic.ts';
import { codeError, plural, integerValue, isOversizedInteger, isSeparator, listNumbers, quote, spanBetween, wholeSpan } from './common.ts';
import { firstNonPlanarPiece } from './planarity.ts';

interface Visit {
  readonly crossing: number;
  readonly over: boolean;
  readonly sign: Sign | undefined;
  readonly span: TextSpan;
  /** Position along its component (0-based) and the component's index. */
  readonly component: number;
  readonly position: number;
}

// The sign may be the Unicode minus U+2212 of typeset text, read as "-" (like integers in common.ts).
const VISIT = /([oOuU])(\d+)([+\-\u2212]?)/y;
const EXAMPLE = 'e.g. o1+ u2+ o3+ u1+ o2+ u3+';

export function parseGaussCode(text: string): LinkDiagram {
  const components = readComponents(text);
  const visits = components.flat();
  const byCrossing = groupVisits(visits);
  // Edge labels: along a component with base b and m visits, visit j is entered on b + j and left on b + (j+1) mod m.
  const base: number[] = [];
  let next = 0;
  for (const c of components) {
    base.push(next);
    next += c.length;
  }
  const incoming = (v: Visit): number => base[v.component]! + v.position;
  const outgoing = (v: Visit): number => base[v.component]! + ((v.position + 1) % components[v.component]!.length);
  const labels = [...byCrossing.keys()].sort((a, b) => a - b);
  const raw: RawCrossing[] = labels.map((label) => {
    const { over, under, sign } = byCrossing.get(label)!;
    const edges: RawCrossing['edges'] =
      sign === 1
        ? [incoming(under), outgoing(over), outgoing(under), incoming(over)]
        : [incoming(under), incoming(over), outgoing(under), outgoing(over)];
    return { edges, sign };
  });
  const freeLoops = components.filter((c) => c.length === 0).length;
  const diagram = assembleDiagram(raw, { notation: 'gauss', freeLoops });
  const bad = firstNonPlanarPiece(diagram);
  if (bad) {
    const names = bad.crossings.map((c) => labels[c]!);
    const spans = bad.crossings.flatMap((c) => {
      const { over, under } = byCrossing.get(labels[c]!)!;
      return [over.span, under.span];
    });
    const span = spans.reduce(spanBetween);
    throw codeError(
      `The Gauss code is not planar (it describes a virtual diagram): the piece made of crossing${names.length > 1 ? 's' : ''} ${listNumbers(names)} has ${plural(bad.faces, 'face')}, but ${plural(names.length, 'crossing')} drawn in the plane bound ${bad.expected}. Check the signs of these crossings and the order of their visits.`,
      span,
    );
  }
  return diagram;
}

function readComponents(text: string): Visit[][] {
  const bare: Visit[] = [];
  const grouped: Visit[][] = [];
  let open: { start: number; visits: Visit[] } | undefined;
  let i = 0;
  while (i < text.length) {
    const ch = text[i]!;
    if (isSeparator(ch)) {
      i++;
      continue;
    }
    if (ch === '(') {
      if (open) throw codeError(`Unexpected "(" at offset ${i}: the component opened at offset ${open.start} is not closed yet, and components do not nest.`, { start: i, end: i + 1 });
      open = { start: i, visits: [] };
      i++;
      continue;
    }
    if (ch === ')') {
      if (!open) throw codeError(`Unexpected ")" at offset ${i}: no component is open here.`, { start: i, end: i + 1 });
      grouped.push(open.visits);
      open = undefined;
      i++;
      continue;
    }
    VISIT.lastIndex = i;
    const m = VISIT.exec(text);
    if (!m) {
      let end = i;
      while (end < text.length && !isSeparator(text[end]!) && text[end] !== '(' && text[end] !== ')') end++;
      const token = text.slice(i, Math.max(end, i + 1));
      // Codes that list crossings as signed numbers (over positive, under negative) say nothing of the crossings' signs.
      const bareNumber = integerValue(token) !== undefined || isOversizedInteger(token);
      throw codeError(
        bareNumber
          ? `Unexpected ${quote(token)} at offset ${i}: a bare number does not say whether the visit passes over or under, nor the crossing's sign. Write each visit as o (over) or u (under), the crossing's number and its sign + or -, ${EXAMPLE}.`
          : `Unexpected ${quote(token)} at offset ${i}: a visit is o (over) or u (under), the crossing's number and its sign, ${EXAMPLE}.`,
        { start: i, end: Math.max(end, i + 1) },
      );
    }
    const crossing = Number(m[2]);
    const span = { start: i, end: i + m[0].length };
    if (!Number.isSafeInteger(crossing)) throw codeError(`Visit ${quote(m[0])} at offset ${i}: the crossing number is too large.`, span);
    const target = open ? open.visits : bare;
    const component = open ? grouped.length : 0;
    target.push({
      crossing,
      over: m[1] === 'o' || m[1] === 'O',
      sign: m[3] === '+' ? 1 : m[3] ? -1 : undefined,
      span,
      component,
      position: target.length,
    });
    i += m[0].length;
  }
  if (open) throw codeError(`The component opened at offset ${open.start} is never closed: end it with ")".`, { start: open.start, end: text.length });
  if (bare.length > 0 && grouped.length > 0) {
    throw codeError(
      `Visit ${quote(text.slice(bare[0]!.span.start, bare[0]!.span.end))} at offset ${bare[0]!.span.start} is outside the parentheses: when a code has several components, write each one in parentheses, e.g. (o1- u2-) (u1- o2-).`,
      bare[0]!.span,
    );
  }
  if (bare.length === 0 && grouped.length === 0) {
    throw codeError(`The Gauss code is empty: write the visits along the knot, ${EXAMPLE}, or "()" for a crossingless circle.`, wholeSpan(text));
  }
  return bare.length > 0 ? [bare] : grouped;
}

function visitText(v: Visit): string {
  return `${v.over ? 'o' : 'u'}${v.crossing}${v.sign === undefined ? '' : v.sign === 1 ? '+' : '-'}`;
}

function groupVisits(visits: readonly Visit[]): Map<number, { over: Visit; under: Visit; sign: Sign }> {
  const lists = new Map<number, Visit[]>();
  for (const v of visits) {
    const list = lists.get(v.crossing) ?? [];
    list.push(v);
    lists.set(v.crossing, list);
    if (list.length === 3) {
      throw codeError(`Crossing ${v.crossing} is visited a third time at offset ${v.span.start} (${quote(visitText(v))}); every crossing is visited exactly twice, once over and once under.`, v.span);
    }
    if (list.length === 2 && list[0]!.over === v.over) {
      const kind = v.over ? 'over' : 'under';
      throw codeError(
        `Crossing ${v.crossing} is visited twice as ${kind} (offsets ${list[0]!.span.start} and ${v.span.start}); one visit must be o (over) and the other u (under).`,
        v.span,
      );
    }
    if (list.length === 2 && list[0]!.sign !== undefined && v.sign !== undefined && list[0]!.sign !== v.sign) {
      throw codeError(
        `Crossing ${v.crossing} has conflicting signs: ${quote(visitText(list[0]!))} at offset ${list[0]!.span.start} but ${quote(visitText(v))} at offset ${v.span.start}. A crossing has one sign; give the same one at both visits.`,
        v.span,
      );
    }
  }
  const result = new Map<number, { over: Visit; under: Visit; sign: Sign }>();
  for (const [crossing, list] of lists) {
    if (list.length === 1) {
      throw codeError(`Crossing ${crossing} is visited only once (${quote(visitText(list[0]!))} at offset ${list[0]!.span.start}); every crossing is visited twice, once over and once under.`, list[0]!.span);
    }
    const [a, b] = list as [Visit, Visit];
    const sign = a.sign ?? b.sign;
    if (sign === undefined) {
      throw codeError(`Crossing ${crossing} has no sign: add + or - to one of its visits, e.g. ${quote(visitText({ ...a, sign: 1 }))}.`, a.span);
    }
    result.set(crossing, a.over ? { over: a, under: b, sign } : { over: b, under: a, sign });
  }
  return result;
}
