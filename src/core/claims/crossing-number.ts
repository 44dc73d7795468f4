/**
 * Crossing-number claims (`7`, `\le 7`, `≥ 5`, `at most 7`) judged against the
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

export type CrossingRelation = 'equal' | 'at-most' | 'at-least';

export interface CrossingNumberClaim {
  readonly relation: CrossingRelation;
  readonly value: number;
}

const RELATIONS: readonly { readonly pattern: RegExp; readonly relation: CrossingRelation; readonly strict: boolean }[] = [
  { pattern: /^(?:\\leq?slant|\\leq?|≤|⩽|<=|at\s+most)/, relation: 'at-most', strict: false },
  { pattern: /^(?:\\geq?slant|\\geq?|≥|⩾|>=|at\s+least)/, relation: 'at-least', strict: false },
  { pattern: /^(?:<|\\lt\b)/, relation: 'at-most', strict: true },
  { pattern: /^(?:>|\\gt\b)/, relation: 'at-least', strict: true },
  { pattern: /^=/, relation: 'equal', strict: false },
];

export const THEOREM_NAMES: Readonly<Record<TheoremId, string>> = {
  'nugatory-removal': 'the removal of nugatory crossings',
  'kauffman-murasugi-thistlethwaite': 'the Kauffman–Murasugi–Thistlethwaite theorem',
  menasco: "Menasco's theorem with the Kauffman–Murasugi–Thistlethwaite bound",
  'linking-graph': 'the linking-number certificate of non-splitness with the Kauffman–Murasugi–Thistlethwaite bound',
  'split-span-bound': 'the span bound for possibly split links',
  'split-union': 'the additivity of crossing numbers under split union',
  'thistlethwaite-adequate': "Thistlethwaite's theorem on adequate diagrams",
  trivial: 'counting the crossings of the diagram',
};

export function readCrossingNumberClaim(text: string): CrossingNumberClaim {
  const leading = text.length - text.trimStart().length;
  const body = text.trim();
  for (const { pattern, relation, strict } of RELATIONS) {
    const m = pattern.exec(body);
    if (!m) continue;
    const rest = body.slice(m[0].length);
    const offset = leading + m[0].length;
    const value = integerAt(rest, offset);
    if (!strict) return { relation, value };
    return relation === 'at-most' ? { relation, value: value - 1 } : { relation, value: value + 1 };
  }
  return { relation: 'equal', value: integerAt(body, leading) };
}

function integerAt(text: string, offset: number): number {
  try {
    const r = readNumber(text, 'the crossing number');
    if (r.q !== 1 || r.p < 0) throw new InputError(UNREADABLE, `a crossing number is a natural number, not ${r.q === 1 ? r.p : `${r.p}/${r.q}`}`, { start: 0, end: text.length });
    return r.p;
  } catch (e) {
    if (e instanceof InputError && e.span) {
      const hint = 'write a natural number, optionally after ≤ / \\le / <= or ≥ / \\ge / >=';
      throw new InputError(e.ruleId, `${e.message}; ${hint}`, { start: e.span.start + offset, end: e.span.end + offset }, e.hints);
    }
    throw e;
  }
}

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

function describeClaim(c: CrossingNumberClaim): string {
  return c.relation === 'equal' ? `${c.value}` : c.relation === 'at-most' ? `at most ${c.value}` : `at least ${c.value}`;
}

function boundsText(report: DiagramReport): string {
  const { lower, upper, exact } = report.crossingNumber;
  return exact !== null ? `${exact}` : `between ${lower} and ${upper}`;
}

export function judgeCrossingNumberClaim(text: string, report: DiagramReport): Judgement {
  const claim = readCrossingNumberClaim(text);
  const { lower, upper, exact } = report.crossingNumber;
  const lowerReason = reasonFor(report, 'lower');
  const upperReason = reasonFor(report, 'upper');
  const exactReason = reasonFor(report, 'exact');
  const base = { key: 'crossing-number' as const, claimed: text, computed: boundsText(report) };
  const said = describeClaim(claim);
  const because = (r: BoundReason | undefined): string => (r ? `, by ${THEOREM_NAMES[r.theorem]}. ${r.text}` : '');
  const withTheorem = (r: BoundReason | undefined) => (r ? { theorem: r.theorem } : {});

  const claimLow = claim.relation === 'at-most' ? -Infinity : claim.value;
  const claimHigh = claim.relation === 'at-least' ? Infinity : claim.value;
  // The claim is an interval [claimLow, claimHigh]; the truth lies in [lower, upper].
  if (claimHigh < lower) {
    // Cite the lower bound itself when it refutes the claim, else the theorem that made the value exact.
    const r = lowerReason && lowerReason.value > claimHigh ? lowerReason : exactReason;
    return { ...base, ...withTheorem(r), verdict: 'contradicts', reason: `the crossing number is ${exact !== null ? exact : `at least ${lower}`}, so it is not ${said}${because(r)}` };
  }
  if (claimLow > upper) {
    const r = upperReason && upperReason.value < claimLow ? upperReason : exactReason;
    return { ...base, ...withTheorem(r), verdict: 'contradicts', reason: `the crossing number is ${exact !== null ? exact : `at most ${upper}`}, so it is not ${said}${because(r)}` };
  }
  if (claimLow <= lower && upper <= claimHigh) {
    const r = exact !== null ? exactReason : claim.relation === 'at-least' ? lowerReason : upperReason;
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
export function crossingNumberFill(report: DiagramReport): { kind: 'math'; latex: string } | { kind: 'text'; text: string } {
  const { lower, upper, exact } = report.crossingNumber;
  if (exact !== null) return { kind: 'math', latex: `${exact}` };
  return { kind: 'text', text: `between $${lower}$ and $${upper}$` };
}

/** Proof-style prose for a `statement` fill, with inline math between single dollars. */
export function crossingNumberStatement(report: DiagramReport, convention: Convention): string {
  const { lower, upper, exact } = report.crossingNumber;
  const n = report.crossings;
  const k = report.nugatory.length;
  const letter = jonesLetter(convention.jonesVariable);
  const jones = conventionJones(report.jones, convention);
  // The span is stated in the document's variable; the theorem is about span in t.
  const spanPhrase =
    letter === 't'
      ? `$\\operatorname{span} V = ${numberLatex(jones.span)}$`
      : `$\\operatorname{span}_t V = ${numberLatex(report.span)}$ (that is, ${numberLatex(jones.span)} in $q$)`;
  const crossingsPhrase = `$${n}$ crossing${n === 1 ? '' : 's'}`;
  const exactReason = reasonFor(report, 'exact');
  if (n === 0) return `The diagram has no crossings, so it shows an unlink and its crossing number is $0$.`;
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
      default:
        return `Here ${spanPhrase}, which bounds the crossing number below by $${lower}$, and the diagram has ${crossingsPhrase}${
          k > 0 ? `, $${k}$ of them nugatory,` : ','
        } which bounds it above by $${upper}$; the bounds meet, so the crossing number is $${exact}$.`;
    }
  }
  const lowerReason = reasonFor(report, 'lower');
  const lowerSource = lowerReason ? THEOREM_NAMES[lowerReason.theorem] : 'the span of $V$';
  const upperSource = k > 0 ? `removing its $${k}$ nugatory crossing${k === 1 ? '' : 's'}` : `the diagram itself, with ${crossingsPhrase},`;
  return `Here ${spanPhrase}, so by ${lowerSource} the crossing number is at least $${lower}$, and ${upperSource} shows it is at most $${upper}$. The bounds do not meet: ${gapExplanation(report)}.`;
}
