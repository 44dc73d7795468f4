/**
 * One entry point from a diagram code's text to the diagram model. Each
 * notation has its own module; all report bad input as an InputError that
 * names the token or tuple at fault.
 */
import { componentCount, type LinkDiagram, type Notation, type Sign } from '../diagram/model.ts';
import { InputError } from '../errors.ts';
import { codeError, wholeSpan } from './common.ts';
import { parseBraidWord } from './braid.ts';
import { parseDtCode } from './dt.ts';
import { parseGaussCode } from './gauss.ts';
import { parsePdCode } from './pd.ts';
import { parseFamily } from '../families/parse.ts';
import { crossingLimitError } from '../limits.ts';

export { printDtCode, printGaussCode, printPdCode } from './print.ts';

export interface ParseOptions {
  /** Braid words: the number of strands, when more than the largest index + 1. */
  readonly strands?: number;
  /** Family codes: the diagram an earlier id of the document names (for mirror, sum, split). */
  readonly named?: (id: string) => LinkDiagram | undefined;
  /** Codes with more crossings are refused (a `limit-exceeded` error) before they are parsed. */
  readonly maxCrossings?: number;
  /** DT codes: the sign of the first crossing of each independent part, fixing every choice the code leaves open. */
  readonly partSigns?: readonly Sign[];
}

/**
 * Reads the value of a diagram's `part-signs` attribute: one `+` or `-` per independent part of a DT code,
 * separated by spaces or commas. Errors are `choice-invalid` with a span into the text.
 */
export function readPartSigns(text: string): Sign[] {
  const signs: Sign[] = [];
  for (const m of text.matchAll(/[^\s,]+/g)) {
    const token = m[0];
    if (token === '+') signs.push(1);
    else if (token === '-' || token === '\u2212') signs.push(-1);
    else {
      throw new InputError('choice-invalid', `part-signs: \`${token}\` is not a sign: write one + or - per independent part of the DT code, separated by spaces (e.g. part-signs="+ -")`, {
        start: m.index,
        end: m.index + token.length,
      });
    }
  }
  if (signs.length === 0) {
    throw new InputError('choice-invalid', 'part-signs is empty: write one + or - per independent part of the DT code, separated by spaces (e.g. part-signs="+ -")', { start: 0, end: text.length });
  }
  return signs;
}

export const NOTATIONS: readonly Notation[] = ['pd', 'braid', 'gauss', 'dt', 'family'];

/**
 * Every pair of components gets a linking number, so the report grows with the
 * square of the component count: 1000 components already make half a million
 * pairs, and 10 000 (one braid generator σ₉₉₉₉) ran out of memory.
 */
export const MAX_COMPONENTS = 1000;

export function parseDiagramCode(text: string, notation: Notation, options?: ParseOptions): LinkDiagram {
  // A code is counted before it is read; a family (`torus 3 100`) writes its size as parameters, so its diagram is counted once built.
  if (options?.maxCrossings !== undefined && notation !== 'family') {
    const crossings = crossingsWritten(text, notation);
    if (crossings > options.maxCrossings) throw crossingLimitError(crossings, options.maxCrossings);
  }
  const diagram = parseInNotation(text, notation, options);
  if (options?.maxCrossings !== undefined && diagram.crossings.length > options.maxCrossings) {
    throw crossingLimitError(diagram.crossings.length, options.maxCrossings);
  }
  const components = componentCount(diagram);
  if (components > MAX_COMPONENTS) {
    const extraStrands = notation === 'braid' ? ' (each strand of a braid that no generator joins to another is a component of its own)' : '';
    throw codeError(
      `The code describes a link of ${components} components${extraStrands}; at most ${MAX_COMPONENTS} are supported, because every pair of components gets a linking number. Check the code for a misprint, such as a generator index or strand count that is far too large.`,
      wholeSpan(text),
    );
  }
  return diagram;
}

/** Numbers per crossing in each notation: a braid generator or DT entry is one, a Gauss code visits each crossing twice, a PD tuple has four labels. */
const NUMBERS_PER_CROSSING: Record<Exclude<Notation, 'family'>, number> = { braid: 1, dt: 1, gauss: 2, pd: 4 };

/** The crossings a code writes, counted from its numbers in one linear pass, before anything is parsed. */
function crossingsWritten(text: string, notation: Exclude<Notation, 'family'>): number {
  let numbers = 0;
  let inNumber = false;
  for (let i = 0; i < text.length; i++) {
    const digit = text.charCodeAt(i) >= 48 && text.charCodeAt(i) <= 57;
    if (digit && !inNumber) numbers++;
    inNumber = digit;
  }
  return Math.ceil(numbers / NUMBERS_PER_CROSSING[notation]);
}

function parseInNotation(text: string, notation: Notation, options?: ParseOptions): LinkDiagram {
  if (options?.partSigns !== undefined && notation !== 'dt') {
    throw new InputError('choice-invalid', `part-signs applies to DT codes only: ${notation === 'braid' ? 'a braid word' : notation === 'family' ? 'a family' : `a ${notation.toUpperCase()} code`} fixes every crossing's sign already; remove the attribute`);
  }
  switch (notation) {
    case 'pd':
      return parsePdCode(text);
    case 'braid':
      return parseBraidWord(text, options);
    case 'gauss':
      return parseGaussCode(text);
    case 'dt':
      return parseDtCode(text, options?.partSigns);
    case 'family':
      return parseFamily(text, options?.named ? { named: options.named } : {});
  }
}
