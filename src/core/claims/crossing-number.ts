/**
 * Crossing-number claims (`7`, `\le 7`, `≥ 5`, `at most 7`, `5 \le c(K) \le 7`) judged against the
 * proven bounds of the report, naming the theorem each verdict rests on; and
 * the short proof-style statement a document can ask to have typeset.
 */
import { InputError } from '../errors.ts';
import type { BoundReason, DiagramReport, TheoremId } from '../analyze/report.ts';
import type { Convention } from '../convention/convention.ts';
import { conventionJones, jonesLetter } from '../convention/convert.ts';
import type { Judgement } from './api.ts';
import { readNumber, UNREADABLE } from './latex-poly-parser.ts';
import { numberLatex } from './typeset.ts';

/**
 * A crossing-number claim as the interval of values it allows, [low, high]
 * (high is Infinity for a lower bound; low is 0 for an upper bound), and the
 * claim in words for messages ("7", "at most 7", "less than 3", "between 3 and 5").
 */
export interface CrossingNumberClaim {
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
function bound(direction: Direction, strict: boolean, value: number): CrossingNumberClaim {
  switch (direction) {
    case 'equal':
      return { low: value, high: value, words: `${value}` };
    case 'at-most':
      return { low: 0, high: strict ? value - 1 : value, words: strict ? `less than ${value}` : `at most ${value}` };
    case 'at-least':
      return { low: strict ? value + 1 : value, high: Infinity, words: strict ? `more than ${value}` : `at least ${value}` };
  }
}

const RELATION_HINT = 'write a natural number, optionally after ≤ / \\le / <= or ≥ / \\ge / >=, or a range such as 5 \\le c(K) \\le 7';

function refuse(message: string, start: number, end: number): never {
  throw new InputError(UNREADABLE, `${message}; ${RELATION_HINT}`, { start, end });
}

/**
 * Reads `7`, `\le 7`, `≥ 5`, `< 8`, `at most 7`, also after a left-hand side
 * (`c(K) \le 7`), turned round (`5 \le c(K)`), or two-sided (`5 \le c(K) \le 7`,
 * `between 5 and 7`, `5–7`, `5-7`, both ends included).
 */
export function readCrossingNumberClaim(text: string): CrossingNumberClaim {
  const plain = blankMarkup(text);
  const between = /^(\s*between\s+)(.*?)(\s+and\s+)(.*)$/i.exec(plain);
  if (between) {
    const [, lead, low, joint, high] = between as unknown as [string, string, string, string, string];
    return range(integerAt({ text: low, start: lead.length }), integerAt({ text: high, start: lead.length + low.length + joint.length }), text);
  }
  // The compact range a table cell is filled with: `6–8`, `6--8`, `$6\textrm{--}8$`; and the
  // hyphen authors type for it (`6-8`): a crossing number is never a difference, so it is a range.
  const dashed = /^(\s*\d+\s*)(–|--|-)(\s*\d+\s*[.,;]?\s*)$/.exec(plain);
  if (dashed) {
    const [, low, dash, high] = dashed as unknown as [string, string, string, string];
    return range(integerAt({ text: low, start: 0 }), integerAt({ text: high, start: low.length + dash.length }), text);
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
  if (relations.length === 0) return bound('equal', false, integerAt(first));
  const dangling = relations.find((_, i) => isEmpty(segments[i + 1]!));
  if (dangling) refuse(`nothing follows \`${text.slice(dangling.start, dangling.end)}\`: write the bound after it`, dangling.start, dangling.end);
  if (relations.length === 1) {
    const r = relations[0]!;
    if (isEmpty(first) || isName(first)) return bound(r.direction, r.strict, integerAt(second!));
    if (isName(second!)) return bound(flip(r.direction), r.strict, integerAt(first));
    refuse('the claim compares two numbers: say which side is the crossing number, e.g. c(K) \\le 7', 0, text.length);
  }
  if (relations.length === 2 && isName(second!) && !isEmpty(first)) {
    const [r1, r2] = relations as [FoundRelation, FoundRelation];
    if (r1.direction !== r2.direction || r1.direction === 'equal') {
      refuse('the two relations of a range must point the same way, as in 5 \\le c(K) \\le 7 or 7 \\ge c(K) \\ge 5', r2.start, r2.end);
    }
    const outer = integerAt(first);
    const inner = integerAt(third!);
    // a ≤ c ≤ b, or b ≥ c ≥ a: the first number bounds c from the side its relation points.
    const a = bound(flip(r1.direction), r1.strict, outer);
    const b = bound(r2.direction, r2.strict, inner);
    return range(Math.max(a.low, b.low), Math.min(a.high, b.high), text);
  }
  const extra = relations[Math.min(relations.length - 1, 2)]!;
  refuse('the claim has more relations than one bound or a range of two (low \\le c(K) \\le high)', extra.start, extra.end);
}

function range(low: number, high: number, text: string): CrossingNumberClaim {
  if (low > high) refuse(`the range leaves no value for the crossing number (from ${low} to ${high})`, 0, text.length);
  return { low, high, words: low === high ? `${low}` : `between ${low} and ${high}` };
}

function integerAt(segment: Segment): number {
  try {
    const r = readNumber(segment.text, 'the crossing number', true);
    if (r.q !== 1 || r.p < 0) throw new InputError(UNREADABLE, `a crossing number is a natural number, not ${r.q === 1 ? r.p : `${r.p}/${r.q}`}`, { start: 0, end: segment.text.length });
    return r.p;
  } catch (e) {
    if (e instanceof InputError && e.span) refuse(e.message, e.span.start + segment.start, e.span.end + segment.start);
    throw e;
  }
}

export const THEOREM_NAMES: Readonly<Record<TheoremId, string>> = {
  'nugatory-removal': 'the removal of nugatory crossings',
  'kauffman-murasugi-thistlethwaite': 'the Kauffman–Murasugi–Thistlethwaite theorem',
  menasco: "Menasco's theorem with the Kauffman–Murasugi–Thistlethwaite bound",
  'linking-graph': 'the linking-number certificate of non-splitness with the Kauffman–Murasugi–Thistlethwaite bound',
  'split-span-bound': 'the span bound for possibly split links',
  'split-union': 'the additivity of crossing numbers under split union',
  'thistlethwaite-adequate': "Thistlethwaite's theorem on adequate diagrams",
  trivial: 'counting the crossings of the diagram',
  'murasugi-torus': "Murasugi's theorem on torus knots",
  'lickorish-thistlethwaite': 'the Lickorish–Thistlethwaite theorem on reduced Montesinos diagrams',
  'two-bridge-alternating': 'the Kauffman–Murasugi–Thistlethwaite theorem for the alternating diagram of a two-bridge link',
  'reidemeister-moves': 'the moves that reduce the diagram (Reidemeister moves and flypes, which keep the link)',
};

function reasonFor(report: DiagramReport, bound: BoundReason['bound']): BoundReason | undefined {
  return report.crossingNumber.reasons.find((r) => r.bound === bound);
}

/** Why no theorem used here closes the gap between the bounds. */
export function gapExplanation(report: DiagramReport): string {
  const missing: string[] = [];
  if (!report.connected) missing.push('not connected');
  if (!report.alternating) missing.push('not alternating');
  if (!report.adequate) missing.push('not adequate');
  else if (!report.reduced) missing.push('adequate but not reduced');
  const list = missing.length === 0 ? 'outside the reach of these theorems' : joinWords(missing);
  return `the exact value would follow from a reduced alternating connected diagram (Kauffman–Murasugi–Thistlethwaite) or a reduced adequate connected one (Thistlethwaite), and this diagram is ${list}`;
}

function joinWords(words: readonly string[]): string {
  if (words.length <= 1) return words.join('');
  return `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;
}

function boundsText(report: DiagramReport): string {
  const { lower, upper, exact } = report.crossingNumber;
  return exact !== null ? `${exact}` : `between ${lower} and ${upper}`;
}

/**
 * The author's source at the end of a crossing-number claim: `\cite{key}`
 * (with an optional `[note]`, also `\citep`/`\citet`) or `(source: text)`.
 * Returns the claim without it, and the source as written.
 */
export function splitCitedSource(text: string): { value: string; source?: string } {
  const cite = /\\cite[pt]?\s*(?:\[[^\]]*\]\s*)?\{([^{}]*)\}\s*$/.exec(text);
  const plain = /\(\s*source\s*:([^()]*)\)\s*$/i.exec(text);
  const found = cite ?? plain;
  if (!found) return { value: text };
  if (found[1]!.trim() === '') refuse('the source is empty: name it, as in (source: Rolfsen 1976) or \\cite{rolfsen}', found.index, text.length);
  return { value: text.slice(0, found.index).trimEnd(), source: found[0].trim() };
}

export function judgeCrossingNumberClaim(text: string, report: DiagramReport): Judgement {
  const { value, source } = splitCitedSource(text);
  if (source === undefined) return judgeAgainstBounds(text, text, report);
  if (value.trim() === '') refuse('the claim has a source but no value: write the crossing number before it', 0, text.length);
  const judgement = judgeAgainstBounds(value, text, report);
  // A source settles only what no theorem here decides; a contradiction stands whatever is cited.
  if (judgement.verdict === 'undecided') {
    return { ...judgement, verdict: 'cited', source, reason: `no theorem used here decides it, so the claim rests on the cited source ${source}: ${judgement.reason.replace(/^the crossing number is only known/, 'the crossing number is known here only')}` };
  }
  if (judgement.verdict === 'contradicts') return { ...judgement, source, reason: `${judgement.reason} The cited source ${source} does not change a proven bound.` };
  return { ...judgement, source };
}

function judgeAgainstBounds(text: string, written: string, report: DiagramReport): Judgement {
  const claim = readCrossingNumberClaim(text);
  const { lower, upper, exact } = report.crossingNumber;
  const lowerReason = reasonFor(report, 'lower');
  const upperReason = reasonFor(report, 'upper');
  const exactReason = reasonFor(report, 'exact');
  const base = { key: 'crossing-number' as const, claimed: written, computed: boundsText(report) };
  const said = claim.words;
  const because = (r: BoundReason | undefined): string => (r ? `, by ${THEOREM_NAMES[r.theorem]}. ${r.text}` : '');
  const withTheorem = (r: BoundReason | undefined) => (r ? { theorem: r.theorem } : {});

  // The claim is the interval [claim.low, claim.high]; the truth lies in [lower, upper].
  if (claim.high < lower) {
    // Cite the lower bound itself when it refutes the claim, else the theorem that made the value exact.
    const r = lowerReason && lowerReason.value > claim.high ? lowerReason : exactReason;
    return { ...base, ...withTheorem(r), verdict: 'contradicts', reason: `the crossing number is ${exact !== null ? exact : `at least ${lower}`}, so it is not ${said}${because(r)}` };
  }
  if (claim.low > upper) {
    const r = upperReason && upperReason.value < claim.low ? upperReason : exactReason;
    return { ...base, ...withTheorem(r), verdict: 'contradicts', reason: `the crossing number is ${exact !== null ? exact : `at most ${upper}`}, so it is not ${said}${because(r)}` };
  }
  if (claim.low <= lower && upper <= claim.high) {
    if (exact === null && claim.low > 0 && claim.high < Infinity) {
      // A range confirmed by both bounds rests on both theorems.
      const side = (which: string, r: BoundReason | undefined) => (r ? ` The ${which} bound comes from ${THEOREM_NAMES[r.theorem]}: ${r.text}` : '');
      return {
        ...base,
        ...withTheorem(lowerReason),
        verdict: 'agrees',
        reason: `the crossing number is ${boundsText(report)}, so it is ${said}.${side('lower', lowerReason)}${side('upper', upperReason)}`,
      };
    }
    const r = exact !== null ? exactReason : claim.high === Infinity ? lowerReason : upperReason;
    return { ...base, ...withTheorem(r), verdict: 'agrees', reason: `the crossing number is ${boundsText(report)}, so it is ${said}${because(r)}` };
  }
  return {
    ...base,
    ...withTheorem(lowerReason),
    verdict: 'undecided',
    reason: `the crossing number is only known to lie between ${lower} and ${upper}, so whether it is ${said} is open: the lower bound ${lower} comes from ${
      lowerReason ? THEOREM_NAMES[lowerReason.theorem] : 'the span'
    } and the upper bound ${upper} from ${upperReason ? THEOREM_NAMES[upperReason.theorem] : 'the diagram'}; ${gapExplanation(report)}`,
  };
}

/** The value for a `crossing-number` fill: the number when exact, honest bounds in prose otherwise. */
/** The exact crossing number, or the range: "between $6$ and $8$" in prose, `6–8` (an en dash) where space is short, as in table cells. */
export function crossingNumberFill(report: DiagramReport, compact = false): { kind: 'math'; latex: string } | { kind: 'text'; text: string } {
  const { lower, upper, exact } = report.crossingNumber;
  if (exact !== null) return { kind: 'math', latex: `${exact}` };
  if (compact) return { kind: 'math', latex: `${lower}\\textrm{--}${upper}` };
  return { kind: 'text', text: `between $${lower}$ and $${upper}$` };
}

/** Proof-style prose for a `statement` fill, with inline math between single dollars. */
export function crossingNumberStatement(report: DiagramReport, convention: Convention): string {
  const { upper, exact } = report.crossingNumber;
  const n = report.crossings;
  const k = report.nugatory.length;
  const letter = jonesLetter(convention.jonesVariable);
  const jones = conventionJones(report.jones, convention);
  // The span is stated in the document's variable; the theorem is about span in t.
  const spanSymbol = letter === 't' ? '\\operatorname{span} V' : '\\operatorname{span}_t V';
  const spanPhrase =
    letter === 't'
      ? `$${spanSymbol} = ${numberLatex(jones.span)}$`
      : `$${spanSymbol} = ${numberLatex(report.span)}$ (that is, $${numberLatex(jones.span)}$ in $q$)`;
  const crossingsPhrase = `$${n}$ crossing${n === 1 ? '' : 's'}`;
  const exactReason = reasonFor(report, 'exact');
  if (n === 0) return `The diagram has no crossings, so it shows an unlink and its crossing number is $0$.`;
  if (exact !== null && exactReason?.afterMoves !== undefined) {
    return `Moves that keep the link (${exactReason.afterMoves.replace(/^\d+ moves? \((.*)\)$/, '$1')}) reduce the diagram to $${exact}$ crossings, and by ${THEOREM_NAMES[exactReason.theorem]} that diagram has the fewest crossings of its link, so the crossing number is $${exact}$.`;
  }
  if (exact !== null && exactReason) {
    switch (exactReason.theorem) {
      case 'kauffman-murasugi-thistlethwaite':
        if (k === 0) {
          return `Here ${spanPhrase}, and the diagram has ${crossingsPhrase} and is reduced, alternating and connected, so by the Kauffman–Murasugi–Thistlethwaite theorem its crossing number is $${exact}$.`;
        }
        return `The diagram has ${crossingsPhrase}, $${k}$ of them nugatory; removing those leaves a reduced alternating connected diagram with $${n - k}$ crossings, so by the Kauffman–Murasugi–Thistlethwaite theorem the crossing number is $${exact}$ (and ${spanPhrase}).`;
      case 'thistlethwaite-adequate':
        return `The diagram has ${crossingsPhrase} and is reduced, adequate and connected, so by Thistlethwaite's theorem on adequate diagrams its crossing number is $${exact}$.`;
      case 'split-union':
        return `The diagram falls apart into separate pieces whose crossing numbers are known, and crossing numbers add under split union, so the crossing number is $${exact}$.`;
      case 'murasugi-torus':
      case 'lickorish-thistlethwaite':
      case 'two-bridge-alternating':
        return familyStatement(report, exactReason.theorem, exact);
      default:
        return `${lowerBoundClause(report, spanPhrase, spanSymbol)}, and the diagram has ${crossingsPhrase}${
          k > 0 ? `, $${k}$ of them nugatory,` : ','
        } which bounds it above by $${upper}$; the bounds meet, so the crossing number is $${exact}$.`;
    }
  }
  const upperSource = k > 0 ? `removing its $${k}$ nugatory crossing${k === 1 ? '' : 's'}` : `the diagram itself, with ${crossingsPhrase},`;
  return `${lowerBoundClause(report, spanPhrase, spanSymbol)}, and ${upperSource} shows it is at most $${upper}$. The bounds do not meet: ${gapExplanation(report)}.`;
}

/** The statement for a crossing number decided by a theorem about the diagram's family. */
function familyStatement(report: DiagramReport, theorem: 'murasugi-torus' | 'lickorish-thistlethwaite' | 'two-bridge-alternating', exact: number): string {
  const name = report.family?.description ?? 'the link';
  switch (theorem) {
    case 'murasugi-torus':
      return `The diagram is ${name}, so by Murasugi's theorem on torus knots, $c(T(p,q)) = \\min(|p|(|q|-1), |q|(|p|-1))$, its crossing number is $${exact}$.`;
    case 'lickorish-thistlethwaite':
      return `The diagram is the standard diagram of ${name}, a reduced Montesinos diagram with at least three rational tangles, so by the Lickorish–Thistlethwaite theorem its $${exact}$ crossings are the fewest possible and the crossing number is $${exact}$.`;
    case 'two-bridge-alternating':
      return `The diagram is ${name}, drawn reduced and alternating from a continued fraction whose terms all have one sign, so by the Kauffman–Murasugi–Thistlethwaite theorem its crossing number is the sum of the terms, $${exact}$.`;
  }
}

/** "Here span V = 3, so by … the crossing number is at least $3$", in the terms of the theorem behind the lower bound. */
function lowerBoundClause(report: DiagramReport, spanPhrase: string, spanSymbol: string): string {
  const { lower } = report.crossingNumber;
  const reason = reasonFor(report, 'lower');
  if (!reason) return `Here ${spanPhrase}, so the crossing number is at least $${lower}$`;
  switch (reason.theorem) {
    case 'split-span-bound': {
      // The bound is span V − (μ − 1), never below 0, not span V itself: say where the difference comes from.
      const mu = report.components;
      const raw = report.span - (mu - 1);
      const formula = raw === lower ? `${spanSymbol} - (${mu} - 1) = ` : raw < 0 && lower === 0 ? `\\max(0, ${spanSymbol} - (${mu} - 1)) = ` : '';
      return `Here ${spanPhrase} and the link has $${mu}$ components, so by the span bound for possibly split links the crossing number is at least $${formula}${lower}$`;
    }
    case 'split-union':
      return `The diagram falls apart into separate pieces, and crossing numbers add under split union, so the pieces' own lower bounds show the crossing number is at least $${lower}$`;
    default:
      return `Here ${spanPhrase}, so by ${THEOREM_NAMES[reason.theorem]} the crossing number is at least $${lower}$`;
  }
}
