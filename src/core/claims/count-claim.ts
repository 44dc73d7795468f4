/**
 * Claims about a natural number known here by proven bounds (the crossing number, the braid index): one
 * number, one bound or a range, read as the interval of values the claim allows.
 */
import { InputError } from '../errors.ts';
import { readNumber, UNREADABLE } from './latex-poly-parser.ts';

/**
 * A claim as the interval of values it allows, [low, high]
 * (high is Infinity for a lower bound; low is 0 for an upper bound), and the
 * claim in words for messages ("7", "at most 7", "less than 3", "between 3 and 5").
 */
export interface CountClaim {
  readonly low: number;
  readonly high: number;
  readonly words: string;
}

type Direction = 'at-most' | 'at-least' | 'equal';

interface RelationSpec {
  readonly pattern: RegExp;
  readonly direction: Direction;
  readonly strict: boolean;
}

/** Tried in this order at each place, so `<=` is found before `<` and `\leq` before `\le`. */
const RELATIONS: readonly RelationSpec[] = [
  { pattern: /\\leq?slant(?![a-zA-Z])|\\leqq(?![a-zA-Z])|\\leq?(?![a-zA-Z])|≤|⩽|≦|<=|\bat\s+most\b|\bno\s+more\s+than\b/iy, direction: 'at-most', strict: false },
  { pattern: /\\geq?slant(?![a-zA-Z])|\\geqq(?![a-zA-Z])|\\geq?(?![a-zA-Z])|≥|⩾|≧|>=|\bat\s+least\b|\bno\s+less\s+than\b/iy, direction: 'at-least', strict: false },
  { pattern: /<|\\lt(?![a-zA-Z])|\bless\s+than\b/iy, direction: 'at-most', strict: true },
  { pattern: />|\\gt(?![a-zA-Z])|\bmore\s+than\b|\bgreater\s+than\b/iy, direction: 'at-least', strict: true },
  { pattern: /=/y, direction: 'equal', strict: false },
];

interface FoundRelation extends Omit<RelationSpec, 'pattern'> {
  readonly start: number;
  readonly end: number;
}

/** Math delimiters (`$…$`, `\(…\)`) and text wrappers (`\text{at most}`) blanked to spaces, so every offset still points into the claim. */
function blankMarkup(text: string): string {
  const blank = (s: string) => ' '.repeat(s.length);
  return text.replace(/\$|\\[()[\]]/g, blank).replace(/\\(?:text|textrm|mathrm|mbox)\s*\{([^{}]*)\}/g, (whole, inner: string) => {
    const open = whole.length - inner.length - 1;
    return `${blank(whole.slice(0, open))}${inner} `;
  });
}

function findRelations(text: string): FoundRelation[] {
  const found: FoundRelation[] = [];
  for (let i = 0; i < text.length; ) {
    let matched: FoundRelation | undefined;
    for (const { pattern, direction, strict } of RELATIONS) {
      pattern.lastIndex = i;
      const m = pattern.exec(text);
      if (m) {
        matched = { direction, strict, start: i, end: i + m[0].length };
        break;
      }
    }
    if (matched) {
      found.push(matched);
      i = matched.end;
    } else i++;
  }
  return found;
}

interface Segment {
  readonly text: string;
  readonly start: number;
}

function flip(direction: Direction): Direction {
  return direction === 'at-most' ? 'at-least' : direction === 'at-least' ? 'at-most' : 'equal';
}

/** The interval a relation to the value allows: `< 3` allows at most 2. */
function bound(direction: Direction, strict: boolean, value: number): CountClaim {
  switch (direction) {
    case 'equal':
      return { low: value, high: value, words: `${value}` };
    case 'at-most':
      return { low: 0, high: strict ? value - 1 : value, words: strict ? `less than ${value}` : `at most ${value}` };
    case 'at-least':
      return { low: strict ? value + 1 : value, high: Infinity, words: strict ? `more than ${value}` : `at least ${value}` };
  }
}

/** The natural number a claim is about, for messages: its noun and the symbol a formula writes for it. */
export interface Count {
  readonly noun: string;
  readonly symbol: string;
}

export function refuseCount(count: Count, message: string, start: number, end: number): never {
  const hint = `write a natural number, optionally after ≤ / \\le / <= or ≥ / \\ge / >=, or a range such as 5 \\le ${count.symbol} \\le 7`;
  throw new InputError(UNREADABLE, `${message}; ${hint}`, { start, end });
}

/**
 * Reads `7`, `\le 7`, `≥ 5`, `< 8`, `at most 7`, also after a left-hand side
 * (`c(K) \le 7`), turned round (`5 \le c(K)`), or two-sided (`5 \le c(K) \le 7`,
 * `between 5 and 7`, `5–7`, `5-7`, both ends included).
 */
export function readCountClaim(text: string, count: Count): CountClaim {
  const plain = blankMarkup(text);
  const between = /^(\s*between\s+)(.*?)(\s+and\s+)(.*)$/i.exec(plain);
  if (between) {
    const [, lead, low, joint, high] = between as unknown as [string, string, string, string, string];
    return range(count, integerAt(count, { text: low, start: lead.length }), integerAt(count, { text: high, start: lead.length + low.length + joint.length }), text);
  }
  // The compact range a table cell is filled with: `6–8`, `6--8`, `$6\textrm{--}8$`; and the
  // hyphen authors type for it (`6-8`): a count is never a difference, so it is a range.
  const dashed = /^(\s*\d+\s*)(–|--|-)(\s*\d+\s*[.,;]?\s*)$/.exec(plain);
  if (dashed) {
    const [, low, dash, high] = dashed as unknown as [string, string, string, string];
    return range(count, integerAt(count, { text: low, start: 0 }), integerAt(count, { text: high, start: low.length + dash.length }), text);
  }
  const relations = findRelations(plain);
  const segments: Segment[] = [];
  let from = 0;
  for (const r of relations) {
    segments.push({ text: plain.slice(from, r.start), start: from });
    from = r.end;
  }
  segments.push({ text: plain.slice(from), start: from });
  const isEmpty = (s: Segment) => s.text.trim() === '';
  const isName = (s: Segment) => /[a-zA-Z]/.test(s.text);
  const [first, second, third] = segments as [Segment, Segment | undefined, Segment | undefined];
  if (relations.length === 0) return bound('equal', false, integerAt(count, first));
  const dangling = relations.find((_, i) => isEmpty(segments[i + 1]!));
  if (dangling) refuseCount(count, `nothing follows \`${text.slice(dangling.start, dangling.end)}\`: write the bound after it`, dangling.start, dangling.end);
  if (relations.length === 1) {
    const r = relations[0]!;
    if (isEmpty(first) || isName(first)) return bound(r.direction, r.strict, integerAt(count, second!));
    if (isName(second!)) return bound(flip(r.direction), r.strict, integerAt(count, first));
    refuseCount(count, `the claim compares two numbers: say which side is the ${count.noun}, e.g. ${count.symbol} \\le 7`, 0, text.length);
  }
  if (relations.length === 2 && isName(second!) && !isEmpty(first)) {
    const [r1, r2] = relations as [FoundRelation, FoundRelation];
    if (r1.direction !== r2.direction || r1.direction === 'equal') {
      refuseCount(count, `the two relations of a range must point the same way, as in 5 \\le ${count.symbol} \\le 7 or 7 \\ge ${count.symbol} \\ge 5`, r2.start, r2.end);
    }
    const outer = integerAt(count, first);
    const inner = integerAt(count, third!);
    // a ≤ c ≤ b, or b ≥ c ≥ a: the first number bounds c from the side its relation points.
    const a = bound(flip(r1.direction), r1.strict, outer);
    const b = bound(r2.direction, r2.strict, inner);
    return range(count, Math.max(a.low, b.low), Math.min(a.high, b.high), text);
  }
  const extra = relations[Math.min(relations.length - 1, 2)]!;
  refuseCount(count, `the claim has more relations than one bound or a range of two (low \\le ${count.symbol} \\le high)`, extra.start, extra.end);
}

function range(count: Count, low: number, high: number, text: string): CountClaim {
  if (low > high) refuseCount(count, `the range leaves no value for the ${count.noun} (from ${low} to ${high})`, 0, text.length);
  return { low, high, words: low === high ? `${low}` : `between ${low} and ${high}` };
}

function integerAt(count: Count, segment: Segment): number {
  try {
    const r = readNumber(segment.text, `the ${count.noun}`, true);
    if (r.q !== 1 || r.p < 0) throw new InputError(UNREADABLE, `a ${count.noun} is a natural number, not ${r.q === 1 ? r.p : `${r.p}/${r.q}`}`, { start: 0, end: segment.text.length });
    return r.p;
  } catch (e) {
    if (e instanceof InputError && e.span) refuseCount(count, e.message, e.span.start + segment.start, e.span.end + segment.start);
    throw e;
  }
}
