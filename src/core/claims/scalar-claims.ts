/**
 * Judging claims whose value is a number or a yes/no: spans and degrees (in
 * the document's variable), writhe, counts, linking numbers, and the
 * alternating / reduced / adequate properties.
 */
import { InputError } from '../errors.ts';
import type { DiagramReport } from '../analyze/report.ts';
import type { Convention } from '../convention/convention.ts';
import { conventionBracket, conventionJones, jonesLetter } from '../convention/convert.ts';
import type { ClaimKey, Diagnosis, JudgeContext, Judgement } from './api.ts';
import { readInteger, readNumber, UNREADABLE, type Rational } from './latex-poly-parser.ts';
import { numberLatex } from './typeset.ts';

export type NumberKey = 'span' | 'bracket-span' | 'min-degree' | 'max-degree' | 'writhe' | 'crossings' | 'components' | 'linking';
export type PropertyKey = 'alternating' | 'reduced' | 'adequate';

const NUMBER_NOUNS: Readonly<Record<NumberKey, string>> = {
  span: 'span of the Jones polynomial',
  'bracket-span': 'span of the Kauffman bracket',
  'min-degree': 'lowest degree of the Jones polynomial',
  'max-degree': 'highest degree of the Jones polynomial',
  writhe: 'writhe',
  crossings: 'number of crossings',
  components: 'number of components',
  linking: 'linking number',
};

const INTEGER_KEYS: ReadonlySet<NumberKey> = new Set(['writhe', 'crossings', 'components', 'linking', 'bracket-span']);

/** Degrees and spans of V are multiples of 1/2 (halves for links with an even number of components). */
function readHalfInteger(text: string, noun: string): number {
  const r: Rational = readNumber(text, `the ${noun}`);
  if (r.q > 2) {
    throw new InputError(UNREADABLE, `the ${noun} is a whole or half number, but the claim is ${r.p}/${r.q}`, { start: 0, end: text.length });
  }
  return r.p / r.q;
}

function readSmallInteger(text: string, noun: string): number {
  const value = readInteger(text, `the ${noun}`);
  if (value > BigInt(Number.MAX_SAFE_INTEGER) || value < -BigInt(Number.MAX_SAFE_INTEGER)) {
    throw new InputError(UNREADABLE, `the ${noun} ${value} is too large to be meant`, { start: 0, end: text.length });
  }
  return Number(value);
}

interface NumberSubject {
  readonly value: number;
  /** Values a slip would produce, with the diagnosis naming it. */
  readonly slips: readonly { readonly value: number; readonly diagnosis: Diagnosis }[];
}

function numberSubject(key: Exclude<NumberKey, 'linking'>, report: DiagramReport, convention: Convention): NumberSubject {
  const jones = conventionJones(report.jones, convention);
  const letter = jonesLetter(convention.jonesVariable);
  const otherLetter = letter === 't' ? 'q' : 't';
  const otherScale = letter === 't' ? 2 : 1 / 2;
  const mirror = (value: number): Diagnosis => ({ kind: 'mirror', detail: `the claim is the value for the mirror image (${value})` });
  switch (key) {
    case 'span':
      return {
        value: jones.span,
        slips: [
          {
            value: jones.span * otherScale,
            diagnosis: { kind: 'normalization', detail: `the claim counts the span in ${otherLetter}, but the document writes V in ${letter}` },
          },
          {
            value: report.bracketSpan,
            diagnosis: { kind: 'normalization', detail: 'the claim is the span of the Kauffman bracket in A, which is four times the span of V' },
          },
        ],
      };
    case 'bracket-span': {
      const other = convention.bracketNormalization === 'unit' ? 'loop' : 'unit';
      return {
        value: conventionBracket(report.bracket, convention).span,
        slips: [
          {
            value: conventionBracket(report.bracket, { ...convention, bracketNormalization: other }).span,
            diagnosis: {
              kind: 'normalization',
              detail: `the claim is the span of the bracket normalised with bracket=${other}, but the document declares bracket=${convention.bracketNormalization} (the loop value −A² − A⁻² adds 4)`,
            },
          },
          {
            value: report.span,
            diagnosis: { kind: 'normalization', detail: 'the claim is the span of the Jones polynomial in t, which is a quarter of the span of the bracket in A' },
          },
        ],
      };
    }
    case 'min-degree':
      return { value: jones.minDegree ?? 0, slips: [{ value: -(jones.maxDegree ?? 0), diagnosis: mirror(-(jones.maxDegree ?? 0)) }] };
    case 'max-degree':
      return { value: jones.maxDegree ?? 0, slips: [{ value: -(jones.minDegree ?? 0), diagnosis: mirror(-(jones.minDegree ?? 0)) }] };
    case 'writhe':
      return { value: report.writhe, slips: [{ value: -report.writhe, diagnosis: mirror(-report.writhe) }] };
    case 'crossings':
      return { value: report.crossings, slips: [] };
    case 'components':
      return { value: report.components, slips: [] };
  }
}

export function judgeNumberClaim(key: NumberKey, text: string, report: DiagramReport, ctx: JudgeContext): Judgement {
  if (key === 'linking') return judgeLinkingClaim(text, report);
  const noun = NUMBER_NOUNS[key];
  const claimed = INTEGER_KEYS.has(key) ? readSmallInteger(text, noun) : readHalfInteger(text, noun);
  const subject = numberSubject(key, report, ctx.convention);
  const computed = numberLatex(subject.value);
  const base = { key, claimed: text, computed };
  if (claimed === subject.value) return { ...base, verdict: 'agrees', reason: `the ${noun} is ${computed}` };
  const slip = subject.slips.find((s) => s.value === claimed && s.value !== subject.value);
  if (slip?.diagnosis.kind === 'mirror' && !report.chiralityFixed) {
    return {
      ...base,
      verdict: 'agrees',
      diagnosis: slip.diagnosis,
      reason: `the claim is the ${noun} of the mirror image, which a DT code cannot tell apart from the diagram itself`,
      warning: `a DT code fixes the knot only up to mirror image; the claim ${numberLatex(claimed)} matches the mirror, the code's own ${noun} is ${computed}`,
    };
  }
  return {
    ...base,
    verdict: 'contradicts',
    ...(slip ? { diagnosis: slip.diagnosis } : {}),
    reason: `the ${noun} is ${computed}, not ${numberLatex(claimed)}${slip ? `: ${slip.diagnosis.detail}` : ''}`,
  };
}

/**
 * Linking numbers: one integer for a two-component link; for more components,
 * the values for the pairs (1,2), (1,3), …, (2,3), … separated by commas.
 */
function judgeLinkingClaim(text: string, report: DiagramReport): Judgement {
  const why = linkingInapplicable(report);
  if (why !== undefined) throw new InputError('claim-inapplicable', `${why}; remove the claim or attach it to a link`);
  const pairs = linkingPairs(report);
  const parts = linkingParts(text);
  if (parts.length !== pairs.length) {
    throw new InputError(
      UNREADABLE,
      `the claim lists ${parts.length} linking number${parts.length === 1 ? '' : 's'}, but this ${report.components}-component link has ${pairs.length} pair${pairs.length === 1 ? '' : 's'} of components; list one value per pair in the order ${pairs.map((p) => `(${p.components[0] + 1},${p.components[1] + 1})`).join(', ')}`,
      { start: 0, end: text.length },
    );
  }
  const claimed = parts.map((p) => readIntegerAt(p.text, p.start));
  const computedValues = pairs.map((p) => p.value);
  const computed = linkingLatex(report);
  const base = { key: 'linking' as const, claimed: text, computed };
  if (claimed.every((v, i) => v === computedValues[i])) {
    return { ...base, verdict: 'agrees', reason: `the linking number${pairs.length === 1 ? ' is' : 's are'} ${computed}` };
  }
  const negated = claimed.every((v, i) => v === -computedValues[i]!);
  const diagnosis: Diagnosis | undefined = negated
    ? { kind: 'negated', detail: 'the claim has the opposite sign: reversing the orientation of one component negates its linking numbers' }
    : undefined;
  const wrong = pairs.filter((_, i) => claimed[i] !== computedValues[i]).map((p) => `(${p.components[0] + 1},${p.components[1] + 1})`);
  return {
    ...base,
    verdict: 'contradicts',
    ...(diagnosis ? { diagnosis } : {}),
    reason: `the linking number${pairs.length === 1 ? ' is' : 's are'} ${computed}, not ${claimed.join(', ')}${pairs.length > 1 ? ` (${wrong.length === 1 ? `pair ${wrong[0]} differs` : `pairs ${wrong.join(', ')} differ`})` : ''}${diagnosis ? `: ${diagnosis.detail}` : ''}`,
  };
}

/** Why a diagram has no linking numbers (a knot), or undefined for a link. */
export function linkingInapplicable(report: DiagramReport): string | undefined {
  return report.components < 2 ? `a linking number needs a link of two or more components, but this diagram has ${report.components}` : undefined;
}

/** The linking numbers of the pairs (1,2), (1,3), …, (2,3), … in that order. */
function linkingPairs(report: DiagramReport): DiagramReport['linking'][number][] {
  return [...report.linking].sort((a, b) => a.components[0] - b.components[0] || a.components[1] - b.components[1]);
}

/** The linking numbers as typeset (and as a claim lists them): one per pair, in the order of `linkingPairs`. */
export function linkingLatex(report: DiagramReport): string {
  return linkingPairs(report).map((p) => p.value).join(', ');
}

/**
 * The values of a linking claim with their offsets: what follows the last `=`
 * outside brackets (`\operatorname{lk}(K_1, K_2) = 1`), without one pair of
 * brackets around the whole list (`(1, 0, 1)`), split at commas and semicolons
 * outside brackets.
 */
function linkingParts(text: string): { text: string; start: number }[] {
  const depths: number[] = [];
  let depth = 0;
  let valueStart = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text[i]!;
    if ('([{'.includes(c)) depth++;
    else if (')]}'.includes(c)) depth--;
    depths.push(depth);
    if (c === '=' && depth === 0) valueStart = i + 1;
  }
  let start = valueStart + (text.slice(valueStart).length - text.slice(valueStart).trimStart().length);
  let end = text.trimEnd().length;
  const open = text[start];
  const close = text[end - 1];
  // A list wrapped as a tuple: the opening bracket is closed only by the last character.
  if (((open === '(' && close === ')') || (open === '[' && close === ']')) && depths.slice(start, end - 1).every((d) => d >= depths[start]!)) {
    start++;
    end--;
  }
  const base = depths[start] ?? 0;
  const parts: { text: string; start: number }[] = [];
  let from = start;
  for (let i = start; i <= end; i++) {
    if (i === end || ((text[i] === ',' || text[i] === ';') && depths[i] === base)) {
      parts.push({ text: text.slice(from, i), start: from });
      from = i + 1;
    }
  }
  return parts;
}

function readIntegerAt(part: string, start: number): number {
  try {
    return readSmallInteger(part, 'linking number');
  } catch (e) {
    if (e instanceof InputError && e.span) throw new InputError(e.ruleId, e.message, { start: e.span.start + start, end: e.span.end + start }, e.hints);
    throw e;
  }
}

const YES = new Set(['yes', 'true', 'y']);
const NO = new Set(['no', 'false', 'n']);

/** Reads yes/no/true/false, also inside \text{…}. */
export function readYesNo(text: string, noun: string): boolean {
  const bare = text
    .trim()
    .replace(/^\$+([^$]*)\$+$/, '$1')
    .trim()
    .replace(/[.,;]$/, '')
    .replace(/^\\(?:text|mathrm|textrm)\{(.*)\}$/, '$1')
    .trim()
    .toLowerCase();
  if (YES.has(bare)) return true;
  if (NO.has(bare)) return false;
  throw new InputError(UNREADABLE, `\`${text.trim()}\` is not a yes/no answer: write yes, no, true or false for whether the diagram is ${noun}`, {
    start: 0,
    end: text.length,
  });
}

function propertyFact(key: PropertyKey, report: DiagramReport): { readonly holds: boolean; readonly why: string } {
  switch (key) {
    case 'alternating':
      return report.alternating
        ? { holds: true, why: 'along every component over- and under-crossings alternate' }
        : { holds: false, why: 'some strand passes over (or under) at two consecutive crossings' };
    case 'reduced': {
      const k = report.nugatory.length;
      if (k === 0) return { holds: true, why: 'no crossing is nugatory' };
      const list = report.nugatory.join(', ');
      return { holds: false, why: `crossing${k === 1 ? '' : 's'} ${list} (numbered from 0 in the order of the code) ${k === 1 ? 'is' : 'are'} nugatory` };
    }
    case 'adequate': {
      const { aAdequate, bAdequate } = report;
      if (aAdequate && bAdequate) return { holds: true, why: 'both the all-A and the all-B state are adequate' };
      if (aAdequate) return { holds: false, why: 'the all-A state is adequate but the all-B state is not' };
      if (bAdequate) return { holds: false, why: 'the all-B state is adequate but the all-A state is not' };
      return { holds: false, why: 'neither the all-A nor the all-B state is adequate' };
    }
  }
}

export function judgePropertyClaim(key: PropertyKey, text: string, report: DiagramReport): Judgement {
  const claimed = readYesNo(text, key);
  const fact = propertyFact(key, report);
  const computed = fact.holds ? 'yes' : 'no';
  const statement = `the diagram is ${fact.holds ? '' : 'not '}${key}: ${fact.why}`;
  return {
    key: key satisfies ClaimKey,
    claimed: text,
    computed,
    verdict: claimed === fact.holds ? 'agrees' : 'contradicts',
    reason: statement,
  };
}
