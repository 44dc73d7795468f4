/**
 * One entry point from a diagram code's text to the diagram model. Each
 * notation has its own module; all report bad input as an InputError that
 * names the token or tuple at fault.
 */
import { componentCount, type LinkDiagram, type Notation } from '../diagram/model.ts';
import { codeError, wholeSpan } from './common.ts';
import { parseBraidWord } from './braid.ts';
import { parseDtCode } from './dt.ts';
import { parseGaussCode } from './gauss.ts';
import { parsePdCode } from './pd.ts';
import { parseFamily } from '../families/parse.ts';

export { printDtCode, printGaussCode, printPdCode } from './print.ts';

export interface ParseOptions {
  /** Braid words: the number of strands, when more than the largest index + 1. */
  readonly strands?: number;
  /** Family codes: the diagram an earlier id of the document names (for mirror, sum, split). */
  readonly named?: (id: string) => LinkDiagram | undefined;
}

export const NOTATIONS: readonly Notation[] = ['pd', 'braid', 'gauss', 'dt', 'family'];

/**
 * Every pair of components gets a linking number, so the report grows with the
 * square of the component count: 1000 components already make half a million
 * pairs, and 10 000 (one braid generator σ₉₉₉₉) ran out of memory.
 */
export const MAX_COMPONENTS = 1000;

export function parseDiagramCode(text: string, notation: Notation, options?: ParseOptions): LinkDiagram {
  const diagram = parseInNotation(text, notation, options);
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

function parseInNotation(text: string, notation: Notation, options?: ParseOptions): LinkDiagram {
  switch (notation) {
    case 'pd':
      return parsePdCode(text);
    case 'braid':
      return parseBraidWord(text, options);
    case 'gauss':
      return parseGaussCode(text);
    case 'dt':
      return parseDtCode(text);
    case 'family':
      return parseFamily(text, options?.named ? { named: options.named } : {});
  }
}
