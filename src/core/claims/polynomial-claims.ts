/**
 * Judging a claimed Jones polynomial or Kauffman bracket: exact equality in
 * the document's convention, and on a mismatch the first common slip that
 * explains it, tried in a fixed order: mirror, negated, shifted,
 * normalization, one-coefficient, one-exponent, swapped, none.
 */
import { Laurent } from '../poly/laurent.ts';
import type { DiagramReport } from '../analyze/report.ts';
import type { Convention, JonesVariable } from '../convention/convention.ts';
import { bracketToConvention, conventionBracket, conventionJones, jonesLetter, jonesToConvention } from '../convention/convert.ts';
import type { Diagnosis, JudgeContext, Judgement } from './api.ts';
import { readPolynomial } from './latex-poly-parser.ts';
import { polynomialLatex, styleOf } from './typeset.ts';
import { oneCoefficientSlip, oneExponentSlip } from './polynomial-slips.ts';
import { withinLimitsOr } from '../limits.ts';

export type PolynomialKey = 'jones' | 'bracket';

const JONES_VARIABLES: readonly JonesVariable[] = ['t', 't-inverse', 'q', 'q-graded'];

/** −t^{1/2} − t^{−1/2}: V of the unknot when every circle is counted, the Jones form of the loop value. */
const JONES_LOOP_VALUE = Laurent.fromTerms([
  [-0.5, -1n],
  [0.5, -1n],
]);

/** A value the author may have written instead, in a given letter, with the sentence naming that slip. */
interface Alternative {
  readonly letter: string;
  readonly value: Laurent;
  readonly detail: string;
}

interface Subject {
  readonly key: PolynomialKey;
  readonly noun: string;
  readonly letter: string;
  readonly computed: Laurent;
  readonly mirror: Laurent;
  readonly mirrorSwap: string;
  /** Slips of normalisation or convention, in any letter. */
  readonly alternatives: readonly Alternative[];
  /**
   * V in the other conventions written with the document's letter (t ↔ t-inverse, q ↔ q-graded). They
   * equal the mirror's or the negated value, which are named first; the sentence then adds the convention.
   */
  readonly sameLetterForms: readonly { readonly variable: JonesVariable; readonly value: Laurent }[];
  /** Values off by exactly the writhe factor (−A³)^{±w}: a `shifted` claim equal to one gets its sentence. */
  readonly writheSlips: readonly Alternative[];
  readonly valueOf: (report: DiagramReport) => Laurent;
}

function jonesSubject(report: DiagramReport, convention: Convention): Subject {
  const letter = jonesLetter(convention.jonesVariable);
  const valueOf = (r: DiagramReport) => conventionJones(r.jones, convention);
  const alternatives: Alternative[] = [];
  // Variables written with the document's own letter differ from it by the mirror (t ↔ t⁻¹) or, for
  // q ↔ q-graded, by a global sign: those slips are named earlier, so only the other letter is listed.
  for (const variable of JONES_VARIABLES) {
    if (jonesLetter(variable) === letter) continue;
    alternatives.push({
      letter: jonesLetter(variable),
      value: jonesToConvention(report.jones, variable),
      detail: `the claim is V written in the convention jones=${variable}, but the document declares jones=${convention.jonesVariable}`,
    });
  }
  alternatives.push({
    letter,
    value: jonesToConvention(report.jones.mul(JONES_LOOP_VALUE), convention.jonesVariable),
    detail: 'the claim is V times −t^{1/2} − t^{−1/2}, the normalisation in which the unknot has that value instead of 1',
  });
  // With ⟨O⟩ = 1 the bracket at A = t^{−1/4} differs from V by ±t^{−3w/4}, which `shifted` names (see
  // writheSlips); with the loop normalisation it carries the extra factor −t^{1/2} − t^{−1/2}.
  const writheSlips: Alternative[] = [];
  const unitAtT = report.bracket.substitutePower(-1 / 4);
  if (unitAtT.exponents.every((e) => Number.isInteger(2 * e))) {
    writheSlips.push({
      letter,
      value: jonesToConvention(unitAtT, convention.jonesVariable),
      detail: `the claim is the Kauffman bracket at A = t^{−1/4} without the writhe factor (−A³)^{−w}, w = ${report.writhe}`,
    });
  }
  const loopAtT = bracketToConvention(report.bracket, 'loop').substitutePower(-1 / 4);
  if (loopAtT.exponents.every((e) => Number.isInteger(2 * e))) {
    alternatives.push({
      letter,
      value: jonesToConvention(loopAtT, convention.jonesVariable),
      detail: `the claim is the Kauffman bracket with ⟨O⟩ = −A² − A⁻² at A = t^{−1/4}, without the writhe factor (−A³)^{−w}, w = ${report.writhe}`,
    });
  }
  for (const normalization of ['unit', 'loop'] as const) {
    alternatives.push({
      letter: 'A',
      value: bracketToConvention(report.bracket, normalization),
      detail: `the claim is the Kauffman bracket in A (bracket=${normalization}), not the Jones polynomial; V(t) = (−A³)^{−w}⟨D⟩ at A = t^{−1/4}`,
    });
  }
  alternatives.push({
    letter: 'A',
    value: report.jones.substitutePower(-4),
    detail: `the claim is V with t = A^{−4}; the document writes the Jones polynomial in ${letter}`,
  });
  return {
    key: 'jones',
    noun: 'Jones polynomial',
    letter,
    computed: valueOf(report),
    mirror: conventionJones(report.jones.substitutePower(-1), convention),
    mirrorSwap: `${letter} ↔ ${letter}⁻¹`,
    alternatives,
    sameLetterForms: JONES_VARIABLES.filter((v) => v !== convention.jonesVariable && jonesLetter(v) === letter).map((variable) => ({
      variable,
      value: jonesToConvention(report.jones, variable),
    })),
    writheSlips,
    valueOf,
  };
}

function bracketSubject(report: DiagramReport, convention: Convention): Subject {
  const normalization = convention.bracketNormalization;
  const other = normalization === 'unit' ? 'loop' : 'unit';
  const valueOf = (r: DiagramReport) => conventionBracket(r.bracket, convention);
  // The Jones polynomial at t = A^{−4} is the bracket times (−A³)^{−w}: `shifted` names that slip (writheSlips).
  const alternatives: Alternative[] = [
    {
      letter: 'A',
      value: bracketToConvention(report.bracket, other),
      detail:
        other === 'loop'
          ? 'the claim is the bracket normalised with ⟨O⟩ = −A² − A⁻² (bracket=loop), but the document declares ⟨O⟩ = 1 (bracket=unit)'
          : 'the claim is the bracket normalised with ⟨O⟩ = 1 (bracket=unit), but the document declares ⟨O⟩ = −A² − A⁻² (bracket=loop)',
    },
  ];
  for (const variable of JONES_VARIABLES) {
    alternatives.push({
      letter: jonesLetter(variable),
      value: jonesToConvention(report.jones, variable),
      detail: `the claim is the Jones polynomial (jones=${variable}), not the Kauffman bracket`,
    });
  }
  return {
    key: 'bracket',
    noun: 'Kauffman bracket',
    letter: 'A',
    computed: valueOf(report),
    mirror: conventionBracket(report.bracket.substitutePower(-1), convention),
    mirrorSwap: 'A ↔ A⁻¹',
    alternatives,
    sameLetterForms: [],
    writheSlips: [
      {
        letter: 'A',
        value: bracketToConvention(report.jones.substitutePower(-4), normalization),
        detail: `the claim is the Jones polynomial at t = A^{−4}, i.e. the bracket times the writhe factor (−A³)^{−w}, w = ${report.writhe}`,
      },
    ],
    valueOf,
  };
}

/** The letters a claim may be written in: the expected one first; the others are read to diagnose a mix-up. */
function readableLetters(subject: Subject): string[] {
  const letters = [subject.letter];
  for (const l of ['t', 'q', 'A']) if (!letters.includes(l)) letters.push(l);
  return letters;
}

function monomialLatex(letter: string, k: number, negative: boolean): string {
  return polynomialLatex(Laurent.monomial(k, negative ? -1n : 1n), letter, { order: 'ascending', halfPowers: 'power' });
}

function diagnose(claim: Laurent, claimLetter: string, subject: Subject, ctx: JudgeContext): Diagnosis {
  const { computed, letter } = subject;
  if (claimLetter !== letter) {
    const hit = subject.alternatives.find((a) => a.letter === claimLetter && a.value.equals(claim));
    if (hit) return { kind: 'normalization', detail: hit.detail };
    return {
      kind: 'none',
      detail: `the claim is written in ${claimLetter}, but this document writes the ${subject.noun} in ${letter}, and it matches no other form of the value`,
    };
  }
  const form = subject.sameLetterForms.find((f) => f.value.equals(claim));
  const alsoForm = form ? `, which is also V written in the convention jones=${form.variable}` : '';
  if (claim.equals(subject.mirror)) return { kind: 'mirror', detail: `the claim is the value of the mirror image (${subject.mirrorSwap})${alsoForm}` };
  if (claim.equals(computed.neg())) return { kind: 'negated', detail: `the claim is the computed value with every sign reversed${alsoForm}` };
  if (claim.termCount === computed.termCount && !claim.isZero) {
    const k = claim.minDegree! - computed.minDegree!;
    const shifted = computed.shift(k);
    const sign = claim.equals(shifted) ? 1 : claim.equals(shifted.neg()) ? -1 : 0;
    if (k !== 0 && sign !== 0) {
      const factor = monomialLatex(letter, k, sign < 0);
      const writheSlip = subject.writheSlips.find((a) => a.value.equals(claim));
      return {
        kind: 'shifted',
        shift: k,
        detail: writheSlip
          ? `${writheSlip.detail} (the computed value times ${factor})`
          : `the claim is the computed value times ${factor}, the kind of factor a writhe or normalisation slip leaves`,
      };
    }
  }
  const normal = subject.alternatives.find((a) => a.letter === letter && a.value.equals(claim));
  if (normal) return { kind: 'normalization', detail: normal.detail };
  const termSlip = oneCoefficientSlip(claim, computed, letter) ?? oneExponentSlip(claim, computed, letter);
  if (termSlip) return termSlip;
  for (const [id, other] of ctx.others ?? []) {
    if (id === ctx.selfId) continue;
    if (withinLimitsOr(() => subject.valueOf(other).equals(claim), false)) {
      return { kind: 'swapped', otherDiagram: id, detail: `the claim is the ${subject.noun} of diagram \`${id}\` of this document` };
    }
  }
  return { kind: 'none', detail: 'no common slip (mirror image, sign, power shift, normalisation, one coefficient or exponent, another diagram) explains the difference' };
}

function subjectOf(key: PolynomialKey, report: DiagramReport, convention: Convention): Subject {
  return key === 'jones' ? jonesSubject(report, convention) : bracketSubject(report, convention);
}

/**
 * What the subjects read of the mirror image's report: V(t⁻¹), ⟨D⟩(A⁻¹) and −w.
 * (Subjects read only these three fields.)
 */
function mirrorReport(report: DiagramReport): DiagramReport {
  // Not a spread: that would compute every lazy field of the report.
  return Object.create(report, {
    jones: { value: report.jones.substitutePower(-1) },
    bracket: { value: report.bracket.substitutePower(-1) },
    writhe: { value: -report.writhe },
  }) as DiagramReport;
}

export function judgePolynomialClaim(key: PolynomialKey, text: string, report: DiagramReport, ctx: JudgeContext): Judgement {
  const subject = subjectOf(key, report, ctx.convention);
  const read = readPolynomial(text, { variables: readableLetters(subject), what: `the ${subject.noun}` });
  const claimLetter = read.variable ?? subject.letter;
  const computedLatex = polynomialLatex(subject.computed, subject.letter, styleOf(ctx.convention));
  const base = { key, claimed: text, computed: computedLatex };
  if (claimLetter === subject.letter && read.value.equals(subject.computed)) {
    return { ...base, verdict: 'agrees', reason: `the claim equals the computed ${subject.noun}` };
  }
  let diagnosis = diagnose(read.value, claimLetter, subject, ctx);
  if (diagnosis.kind === 'none' && !report.chiralityFixed) {
    // A DT code allows either chirality, so the author may have started from the mirror's value.
    const mirrorSubject = subjectOf(key, mirrorReport(report), ctx.convention);
    const againstMirror = diagnose(read.value, claimLetter, mirrorSubject, ctx);
    if (againstMirror.kind !== 'none') {
      const mirrorLatex = polynomialLatex(mirrorSubject.computed, subject.letter, styleOf(ctx.convention));
      const slip = againstMirror.detail.replace('the computed value', 'that value');
      diagnosis = { ...againstMirror, detail: `compared with the mirror image's value ${mirrorLatex}, which a DT code allows as well: ${slip}` };
    }
  }
  if (diagnosis.kind === 'mirror' && !report.chiralityFixed) {
    return {
      ...base,
      verdict: 'agrees',
      diagnosis,
      reason: `the claim is the ${subject.noun} of the mirror image, which a DT code cannot tell apart from the diagram itself`,
      warning: `a DT code fixes the knot only up to mirror image; the claim matches the mirror (${subject.mirrorSwap}), the code's own value is ${computedLatex}`,
    };
  }
  return {
    ...base,
    verdict: 'contradicts',
    diagnosis,
    reason: `the claim differs from the computed value ${computedLatex}; ${diagnosis.detail}`,
  };
}
