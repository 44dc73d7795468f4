/**
 * Crossing-number claims (`7`, `\le 7`, `≥ 5`, `at most 7`, `5 \le c(K) \le 7`) judged against the
 * proven bounds of the report, naming the theorem each verdict rests on; and
 * the short proof-style statement a document can ask to have typeset.
 */
import type { BoundReason, DiagramReport, TheoremId } from '../analyze/report.ts';
import type { Convention } from '../convention/convention.ts';
import { conventionJones, jonesLetter } from '../convention/convert.ts';
import type { Judgement } from './api.ts';
import { readCountClaim, refuseCount, type Count, type CountClaim } from './count-claim.ts';
import { numberLatex } from './typeset.ts';

const CROSSING_NUMBER: Count = { noun: 'crossing number', symbol: 'c(K)' };

/** A crossing-number claim as the interval of values it allows (see readCountClaim). */
export function readCrossingNumberClaim(text: string): CountClaim {
  return readCountClaim(text, CROSSING_NUMBER);
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
  if (found[1]!.trim() === '') refuseCount(CROSSING_NUMBER, 'the source is empty: name it, as in (source: Rolfsen 1976) or \\cite{rolfsen}', found.index, text.length);
  return { value: text.slice(0, found.index).trimEnd(), source: found[0].trim() };
}

export function judgeCrossingNumberClaim(text: string, report: DiagramReport): Judgement {
  const { value, source } = splitCitedSource(text);
  if (source === undefined) return judgeAgainstBounds(text, text, report);
  if (value.trim() === '') refuseCount(CROSSING_NUMBER, 'the claim has a source but no value: write the crossing number before it', 0, text.length);
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
