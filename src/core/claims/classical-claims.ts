/**
 * Claims about the classical invariants: the Alexander polynomial (Conway's
 * symmetric normalisation), the Conway polynomial, the determinant and the
 * signature, and their typeset values.
 *
 * Diagnoses, tried in this order:
 * - alexander, conway: negated (for an even number of components this is also
 *   the mirror image's value), shifted (times ±t^k: an unnormalised Δ),
 *   normalization (Δ written for ∇ or ∇ for Δ), one-coefficient, one-exponent, swapped, none.
 *   `mirror` does not apply on its own: the mirror image has the same Δ for a knot
 *   and −Δ (already `negated`) for an even number of components.
 * - determinant: negated (the sign of Δ(−1) kept), none.
 * - signature: mirror (−σ: the mirror image, or the other sign convention),
 *   normalization (sign(G) of a Goeritz matrix without the Gordon–Litherland
 *   correction), none.
 *   (A swap of integers between two table cells is named by the session.)
 */
import type { DiagramReport } from '../analyze/report.ts';
import type { Convention } from '../convention/convention.ts';
import { signatureInConvention } from '../invariants/classical/signature.ts';
import { Laurent } from '../poly/laurent.ts';
import type { Diagnosis, JudgeContext, Judgement, Typeset } from './api.ts';
import { readInteger, readPolynomial } from './latex-poly-parser.ts';
import { numberLatex, polynomialLatex, styleOf } from './typeset.ts';
import { oneCoefficientSlip, oneExponentSlip } from './polynomial-slips.ts';
import { withinLimitsOr } from '../limits.ts';

export type ClassicalKey = 'alexander' | 'conway' | 'determinant' | 'signature';

const NOUNS: Readonly<Record<ClassicalKey, string>> = {
  alexander: 'Alexander polynomial',
  conway: 'Conway polynomial',
  determinant: 'determinant',
  signature: 'signature',
};

type PolynomialKey = 'alexander' | 'conway';

const LETTER: Readonly<Record<PolynomialKey, string>> = { alexander: 't', conway: 'z' };

function polynomialOf(key: PolynomialKey, report: DiagramReport): Laurent {
  return key === 'alexander' ? report.classical.alexander : report.classical.conway;
}

export function classicalLatex(key: ClassicalKey, report: DiagramReport, convention: Convention): string {
  switch (key) {
    case 'alexander':
    case 'conway':
      return polynomialLatex(polynomialOf(key, report), LETTER[key], styleOf(convention));
    case 'determinant':
      return report.classical.determinant.toString();
    case 'signature':
      return numberLatex(signatureInConvention(report.classical.signature, convention.signatureSign));
  }
}

export function classicalFill(key: ClassicalKey, report: DiagramReport, convention: Convention): Typeset {
  return { kind: 'math', latex: classicalLatex(key, report, convention) };
}

/**
 * The genus bounds as one paragraph of prose with inline math: the lower
 * bounds from span Δ and |σ|, the upper bound from Seifert's algorithm on the
 * diagram, and the genus itself when they meet.
 */
export function genusStatement(report: DiagramReport): Typeset {
  const { classical } = report;
  if (classical.split) {
    return { kind: 'text', text: 'The diagram falls into separate pieces, so the link is split and $\\Delta = 0$; no genus bound is stated.' };
  }
  const bound = (reason: string): number => classical.genusBounds.find((b) => b.reason === reason)!.value;
  const lower = Math.max(bound('alexander-span'), bound('signature'));
  const upper = bound('seifert-algorithm');
  const mu = report.components;
  const inequality = mu === 1 ? '2g' : `2g + ${mu - 1}`;
  const surface = mu === 1 ? 'every Seifert surface of genus $g$' : `every connected Seifert surface of genus $g$ of this ${mu}-component link`;
  const conclusion = lower === upper ? `so the genus is $${upper}$` : `so the genus lies between $${lower}$ and $${upper}$`;
  return {
    kind: 'text',
    text:
      (classical.alexander.isZero
        ? `The Alexander polynomial is $0$, which bounds nothing, and the signature has $|\\sigma| = ${Math.abs(classical.signature)}$, ` +
          `at most $${inequality}$ for ${surface}, so $g \\ge ${lower}$. `
        : `The Alexander polynomial has $\\operatorname{span} \\Delta = ${classical.alexander.span}$ and the signature has $|\\sigma| = ${Math.abs(classical.signature)}$; ` +
          `both are at most $${inequality}$ for ${surface}, so $g \\ge ${lower}$. `) +
      `Seifert's algorithm on this diagram (${plural(report.crossings, 'crossing')}, ${plural(classical.seifertCircles, 'Seifert circle')}) builds such a surface of genus $${upper}$, ${conclusion}.`,
  };
}

function plural(n: number, noun: string): string {
  return `${n} ${noun}${n === 1 ? '' : 's'}`;
}

export function judgeClassicalClaim(key: ClassicalKey, text: string, report: DiagramReport, ctx: JudgeContext): Judgement {
  return key === 'alexander' || key === 'conway' ? judgePolynomial(key, text, report, ctx) : judgeInteger(key, text, report, ctx);
}

function swappedWith(
  ctx: JudgeContext,
  matches: (other: DiagramReport) => boolean,
  noun: string,
): Diagnosis | undefined {
  for (const [id, other] of ctx.others ?? []) {
    if (id !== ctx.selfId && withinLimitsOr(() => matches(other), false)) {
      return { kind: 'swapped', otherDiagram: id, detail: `the claim is the ${noun} of diagram \`${id}\` of this document` };
    }
  }
  return undefined;
}

function judgePolynomial(key: PolynomialKey, text: string, report: DiagramReport, ctx: JudgeContext): Judgement {
  const letter = LETTER[key];
  const otherKey: PolynomialKey = key === 'alexander' ? 'conway' : 'alexander';
  const noun = NOUNS[key];
  const read = readPolynomial(text, { variables: [letter, LETTER[otherKey]], what: `the ${noun}` });
  const claim = read.value;
  const computed = polynomialOf(key, report);
  const computedLatex = polynomialLatex(computed, letter, styleOf(ctx.convention));
  const base = { key, claimed: text, computed: computedLatex };
  const claimLetter = read.variable ?? letter;
  if (claimLetter === letter && claim.equals(computed)) return { ...base, verdict: 'agrees', reason: `the claim equals the computed ${noun}` };
  const unit = key === 'alexander' && read.upToUnits && claimLetter === letter ? unitFactor(claim, computed) : undefined;
  if (unit !== undefined) {
    return { ...base, verdict: 'agrees', reason: `the claim equals the computed ${noun} times ${unit}, and ≐ states equality up to such a unit ±t^k` };
  }
  const diagnosis = diagnosePolynomial(key, claim, claimLetter, report, ctx);
  return { ...base, verdict: 'contradicts', diagnosis, reason: `the claim differs from the computed value ${computedLatex}; ${diagnosis.detail}` };
}

/** The unit ±t^k with claim = unit · computed, as LaTeX, if there is one. */
function unitFactor(claim: Laurent, computed: Laurent): string | undefined {
  if (computed.isZero || claim.termCount !== computed.termCount) return undefined;
  const k = claim.minDegree! - computed.minDegree!;
  const shifted = computed.shift(k);
  const sign = claim.equals(shifted) ? 1 : claim.equals(shifted.neg()) ? -1 : 0;
  if (sign === 0) return undefined;
  return polynomialLatex(Laurent.monomial(k, BigInt(sign)), 't', { order: 'ascending', halfPowers: 'power' });
}

function diagnosePolynomial(key: PolynomialKey, claim: Laurent, claimLetter: string, report: DiagramReport, ctx: JudgeContext): Diagnosis {
  const letter = LETTER[key];
  const computed = polynomialOf(key, report);
  if (claimLetter !== letter) {
    const otherKey: PolynomialKey = key === 'alexander' ? 'conway' : 'alexander';
    if (claim.equals(polynomialOf(otherKey, report))) {
      return {
        kind: 'normalization',
        detail:
          key === 'alexander'
            ? 'the claim is the Conway polynomial ∇(z); the Alexander polynomial is Δ(t) = ∇(t^{1/2} − t^{−1/2})'
            : 'the claim is the Alexander polynomial Δ(t); the Conway polynomial ∇(z) satisfies Δ(t) = ∇(t^{1/2} − t^{−1/2})',
      };
    }
    if (claim.equals(computed)) {
      return {
        kind: 'normalization',
        detail: `the claim has the coefficients of the computed ${NOUNS[key]} but is written in ${claimLetter}; the ${NOUNS[key]} is a polynomial in ${letter}`,
      };
    }
    return { kind: 'none', detail: `the claim is written in ${claimLetter}, but the ${NOUNS[key]} is written in ${letter}, and it matches no other form of the value` };
  }
  if (!computed.isZero && claim.equals(computed.neg())) {
    const evenLink = report.components % 2 === 0;
    return {
      kind: 'negated',
      detail: evenLink
        ? 'the claim is the computed value with every sign reversed, which is also the value of the mirror image (a link with an even number of components)'
        : 'the claim is the computed value with every sign reversed',
    };
  }
  if (!computed.isZero && claim.termCount === computed.termCount && !claim.isZero) {
    const k = claim.minDegree! - computed.minDegree!;
    const shifted = computed.shift(k);
    const sign = claim.equals(shifted) ? 1 : claim.equals(shifted.neg()) ? -1 : 0;
    if (k !== 0 && sign !== 0) {
      const factor = polynomialLatex(Laurent.monomial(k, sign), letter, { order: 'ascending', halfPowers: 'power' });
      return {
        kind: 'shifted',
        shift: k,
        detail:
          key === 'alexander'
            ? `the claim is the computed value times ${factor}: Δ is fixed only up to ±t^k until it is normalised as Δ(t) = ∇(t^{1/2} − t^{−1/2}) (Conway's normalisation: symmetric, and Δ(1) = 1 for a knot), which this document uses`
            : `the claim is the computed value times ${factor}`,
      };
    }
  }
  if (report.classical.split) return swappedWith(ctx, (other) => polynomialOf(key, other).equals(claim), NOUNS[key]) ?? splitDiagnosis(key, claim, report);
  const termSlip = oneCoefficientSlip(claim, computed, letter) ?? oneExponentSlip(claim, computed, letter);
  if (termSlip) return termSlip;
  return (
    swappedWith(ctx, (other) => polynomialOf(key, other).equals(claim), NOUNS[key]) ?? {
      kind: 'none',
      detail: 'no common slip (sign, power of the variable, Alexander for Conway, one coefficient or exponent, another diagram) explains the difference',
    }
  );
}

/**
 * A non-zero value claimed for a split diagram: Δ, ∇ and det of a split link are 0 (the
 * skein relation gives ∇ = 0), and the likeliest slip is the product of the pieces' values,
 * which belongs to their connected sum.
 */
function splitDiagnosis(key: ClassicalKey, claim: Laurent | bigint, report: DiagramReport): Diagnosis {
  const { pieces } = report.classical;
  const product =
    typeof claim === 'bigint'
      ? pieces.reduce((x, p) => x * p.determinant, 1n) === claim
      : pieces.reduce((x, p) => x.mul(key === 'alexander' ? p.alexander : p.conway), Laurent.one).equals(claim);
  const noun = key === 'determinant' ? 'determinant' : NOUNS[key];
  return {
    kind: 'none',
    detail:
      `the diagram falls into ${pieces.length} separate pieces, so the link is split and its ${noun} is 0` +
      (product ? `; the claim is the product of the pieces' values, which is the ${noun} of their connected sum, not of the split union` : ''),
  };
}

function judgeInteger(key: 'determinant' | 'signature', text: string, report: DiagramReport, ctx: JudgeContext): Judgement {
  const noun = NOUNS[key];
  const claimed = readInteger(text, `the ${noun}`);
  const valueOf = (r: DiagramReport): bigint =>
    key === 'determinant' ? r.classical.determinant : BigInt(signatureInConvention(r.classical.signature, ctx.convention.signatureSign));
  const value = valueOf(report);
  const computed = value.toString();
  const base = { key, claimed: text, computed };
  if (claimed === value) return { ...base, verdict: 'agrees', reason: `the ${noun} is ${computed}` };
  let diagnosis: Diagnosis | undefined;
  if (claimed === -value) {
    diagnosis =
      key === 'determinant'
        ? { kind: 'negated', detail: 'the claim is the negative of the determinant, which is |Δ(−1)| and never negative' }
        : {
            kind: 'mirror',
            detail: `the claim is −σ: the signature of the mirror image, or the signature in the other sign convention (this document gives the positive trefoil σ = ${ctx.convention.signatureSign === 'negative' ? '−2' : '+2'})`,
          };
  }
  if (!diagnosis && key === 'signature') {
    const uncorrected = report.classical.goeritzUncorrected.find(
      (g) => BigInt(signatureInConvention(g, ctx.convention.signatureSign)) === claimed,
    );
    if (uncorrected !== undefined) {
      diagnosis = {
        kind: 'normalization',
        detail: 'the claim is the signature of a Goeritz matrix without the Gordon–Litherland correction, which subtracts ½·Σ(ε + η) over the crossings',
      };
    }
  }
  // A small integer shared with another diagram is a coincidence, not evidence of a swap: swaps of
  // integers are named only for two table cells of one column holding each other's values (the session).
  if (!diagnosis && key === 'determinant' && report.classical.split) diagnosis = splitDiagnosis(key, claimed, report);
  if (diagnosis?.kind === 'mirror' && !report.chiralityFixed) {
    return {
      ...base,
      verdict: 'agrees',
      diagnosis,
      reason: `the claim is the ${noun} of the mirror image, which a DT code cannot tell apart from the diagram itself`,
      warning: `a DT code fixes the knot only up to mirror image; the claim ${claimed} matches the mirror, the code's own ${noun} is ${computed}`,
    };
  }
  return {
    ...base,
    verdict: 'contradicts',
    ...(diagnosis ? { diagnosis } : {}),
    reason: `the ${noun} is ${computed}, not ${claimed}${diagnosis ? `: ${diagnosis.detail}` : ''}`,
  };
}
