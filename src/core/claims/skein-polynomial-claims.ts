/**
 * Claims and typesetting of the two-variable polynomials (HOMFLY-PT, Kauffman)
 * and of braid index and Arf invariant. A wrong polynomial is checked against
 * the value in the other declared convention, the mirror image's value and the
 * negated value, in that order.
 */
import type { DiagramReport } from '../analyze/report.ts';
import type { Convention } from '../convention/convention.ts';
import { InputError } from '../errors.ts';
import type { Arf, ArfResult } from '../invariants/arf.ts';
import type { BraidIndexBounds } from '../invariants/braid-index.ts';
import { Laurent2 } from '../poly/laurent2.ts';
import type { Judgement } from './api.ts';
import { readCountClaim, type Count } from './count-claim.ts';
import { readInteger, readPolynomial, splitPaired, UNREADABLE } from './latex-poly-parser.ts';

export type SkeinKey = 'homfly' | 'kauffman';

/** The values a claim may be compared with, in the document's variables. */
export interface SkeinValues {
  /** The value in the declared convention. */
  readonly declared: Laurent2;
  /** The value in the other convention, and that convention in words. */
  readonly other: Laurent2;
  readonly otherName: string;
  readonly declaredName: string;
  /** The mirror image's value in the declared convention. */
  readonly mirror: Laurent2;
  readonly letters: readonly [string, string];
}

/** HOMFLY-PT in the declared variables: (v, z) as computed, or (a, z) with a = v⁻¹. */
export function homflyValues(p: Laurent2, convention: Convention): SkeinValues {
  const mirrorVz = p.substituteMonomials(-1, 0, 0, 1).alternateSigns(1, 0);
  const toAz = (x: Laurent2): Laurent2 => x.substituteMonomials(-1, 0, 0, 1);
  const vz = { value: p, name: 'the (v, z) convention v^{-1}P_+ - vP_- = zP_0' };
  const az = { value: toAz(p), name: 'the (a, z) convention aP_+ - a^{-1}P_- = zP_0' };
  const [declared, other] = convention.homflyVariables === 'vz' ? [vz, az] : [az, vz];
  return {
    declared: declared.value,
    other: other.value,
    declaredName: declared.name,
    otherName: other.name,
    mirror: convention.homflyVariables === 'vz' ? mirrorVz : toAz(mirrorVz),
    letters: convention.homflyVariables === 'vz' ? ['v', 'z'] : ['a', 'z'],
  };
}

export function kauffmanValues(f: Laurent2, dubrovnik: Laurent2, convention: Convention): SkeinValues {
  const F = { value: f, name: "Kauffman's F(a, z)" };
  const D = { value: dubrovnik, name: 'the Dubrovnik polynomial' };
  const [declared, other] = convention.kauffmanVariant === 'kauffman' ? [F, D] : [D, F];
  return { declared: declared.value, other: other.value, declaredName: declared.name, otherName: other.name, mirror: declared.value.substituteMonomials(-1, 0, 0, 1), letters: ['a', 'z'] };
}

/** A two-variable polynomial as LaTeX, grouped by powers of the second letter. */
export function twoVariableLatex(p: Laurent2, letters: readonly [string, string], convention: Convention): string {
  if (p.isZero) return '0';
  const terms = p.terms().sort((a, b) => a[1] - b[1] || a[0] - b[0]);
  if (convention.termOrder === 'descending') terms.reverse();
  const power = (letter: string, e: number): string => (e === 0 ? '' : e === 1 ? letter : `${letter}^{${e}}`);
  return terms
    .map(([i, j, c], k) => {
      const negative = c < 0n;
      const abs = negative ? -c : c;
      const monomial = power(letters[0], i) + power(letters[1], j);
      const body = (abs === 1n && monomial !== '' ? '' : abs.toString()) + monomial;
      if (k === 0) return negative ? `-${body}` : body;
      return `${negative ? ' - ' : ' + '}${body}`;
    })
    .join('');
}

function readTwoVariable(text: string, letters: readonly [string, string], what: string): Laurent2 {
  const read = readPolynomial(text, { variables: [letters[0]], paired: letters[1], what });
  return Laurent2.fromTerms(read.value.terms().map(([e, c]) => [...splitPaired(e), c] as const));
}

export function judgeSkeinClaim(key: SkeinKey, noun: string, text: string, values: SkeinValues, report: DiagramReport, convention: Convention): Judgement {
  const latex = (p: Laurent2): string => twoVariableLatex(p, values.letters, convention);
  const computed = latex(values.declared);
  let claimed: Laurent2;
  try {
    claimed = readTwoVariable(text, values.letters, `a ${noun}`);
  } catch (error) {
    // Written in the other letters? Then it is the other convention's form; say so if it is that value.
    const otherLetters: readonly [string, string] = values.letters[0] === 'v' ? ['a', 'z'] : ['v', 'z'];
    if (key !== 'homfly' || !(error instanceof InputError)) throw error;
    let inOther: Laurent2;
    try {
      inOther = readTwoVariable(text, otherLetters, `a ${noun}`);
    } catch {
      throw error;
    }
    // Read as written in the other letters: the value in the other convention is in those letters.
    const otherInItsLetters = inOther;
    const matches = otherInItsLetters.equals(values.other);
    return {
      key,
      claimed: text,
      verdict: 'contradicts',
      computed,
      diagnosis: {
        kind: 'normalization',
        detail: matches
          ? `the claim is the ${noun} in ${values.otherName}, but the document declares ${values.declaredName}`
          : `the claim is written in ${otherLetters.join(', ')}, but the document declares ${values.declaredName}`,
      },
      reason: matches
        ? `the claim is the ${noun} in ${values.otherName}; this document declares ${values.declaredName} (set \`homfly=${values.letters[0] === 'v' ? 'az' : 'vz'}\` if the paper uses the other one)`
        : `the claim is written in ${otherLetters.join(', ')}, the letters of the other convention, and is not that convention's value either`,
    };
  }
  if (claimed.equals(values.declared)) return { key, claimed: text, verdict: 'agrees', computed, reason: `the ${noun} is ${computed}` };
  if (claimed.equals(values.mirror)) {
    if (!report.diagram.chiralityFixed) {
      return { key, claimed: text, verdict: 'agrees', computed, reason: `the claim is the ${noun} of the mirror image`, warning: `the claim is the ${noun} of the mirror image, which a DT code cannot tell apart` };
    }
    return { key, claimed: text, verdict: 'contradicts', computed, diagnosis: { kind: 'mirror', detail: `the claim is the ${noun} of the mirror image` }, reason: `the claim is the ${noun} of the mirror image; this diagram has ${computed}` };
  }
  if (claimed.equals(values.other)) {
    return {
      key,
      claimed: text,
      verdict: 'contradicts',
      computed,
      diagnosis: { kind: 'normalization', detail: `the claim is the ${noun} in ${values.otherName}, but the document declares ${values.declaredName}` },
      reason: `the claim is the value in ${values.otherName}; this document declares ${values.declaredName}, where the value is ${computed}`,
    };
  }
  if (claimed.equals(values.declared.neg())) {
    return { key, claimed: text, verdict: 'contradicts', computed, diagnosis: { kind: 'negated', detail: 'the claim is the computed value with every sign flipped' }, reason: `the claim has every sign flipped; the ${noun} is ${computed}` };
  }
  return { key, claimed: text, verdict: 'contradicts', computed, diagnosis: { kind: 'none', detail: 'no single common slip explains the difference' }, reason: `the ${noun} is ${computed}` };
}

const BRAID_INDEX: Count = { noun: 'braid index', symbol: 'b' };

/** One number, one bound or a range (as for crossing numbers), judged against the proven bounds. */
export function judgeBraidIndexClaim(text: string, bounds: BraidIndexBounds): Judgement {
  const claim = readCountClaim(text, BRAID_INDEX);
  const base = { key: 'braid-index', claimed: text, computed: braidIndexLatex(bounds) };
  const why = bounds.reasons.map((r) => r.text).join(' ');
  const known = bounds.exact !== null ? `${bounds.exact}` : `between ${bounds.lower} and ${bounds.upper}`;
  if (claim.high < bounds.lower || claim.low > bounds.upper) {
    const broken = bounds.exact !== null ? why : (claim.high < bounds.lower ? bounds.reasons[0]! : bounds.reasons[1]!).text;
    return { ...base, verdict: 'contradicts', reason: `the braid index is ${known}, so it is not ${claim.words}: ${broken}` };
  }
  if (claim.low <= bounds.lower && bounds.upper <= claim.high) return { ...base, verdict: 'agrees', reason: `the braid index is ${known}, so it is ${claim.words}: ${why}` };
  return { ...base, verdict: 'undecided', reason: `the proven bounds leave ${bounds.lower} to ${bounds.upper} open, so whether the braid index is ${claim.words} is open: ${why}` };
}

export function braidIndexLatex(bounds: BraidIndexBounds): string {
  return bounds.exact !== null ? `${bounds.exact}` : `${bounds.lower} \\le b \\le ${bounds.upper}`;
}

/** The Arf invariant, or `claim-inapplicable` with the reason when the link is not proper. */
export function definedArf(result: ArfResult): Arf {
  if (result.value === null) throw new InputError('claim-inapplicable', `${result.notDefined}; remove the claim or attach it to a knot or a proper link`);
  return result.value;
}

export function judgeArfClaim(text: string, result: ArfResult, components: number): Judgement {
  const arf = definedArf(result);
  const claimed = readInteger(text, 'an Arf invariant');
  if (claimed !== 0n && claimed !== 1n) throw new InputError(UNREADABLE, `the Arf invariant is 0 or 1, not ${claimed}: write 0 or 1`, { start: 0, end: text.length });
  const routes =
    components === 1
      ? "the z² coefficient of ∇ mod 2 and Levine's Δ(−1) mod 8"
      : "Murakami's formula V(i) = (−√2)^(μ−1)(−1)^Arf and Robertello's fusion of the components into a knot by band sums";
  return Number(claimed) === arf
    ? { key: 'arf', claimed: text, verdict: 'agrees', computed: `${arf}`, reason: `the Arf invariant is ${arf}: ${routes} both give it` }
    : { key: 'arf', claimed: text, verdict: 'contradicts', computed: `${arf}`, reason: `the Arf invariant is ${arf}, not ${claimed}: ${routes} both give ${arf}` };
}
