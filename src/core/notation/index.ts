/**
 * One entry point from a diagram code's text to the diagram model. Each
 * notation has its own module; all report bad input as an InputError that
 * names the token or tuple at fault.
 */
import type { LinkDiagram, Notation } from '../diagram/model.ts';
import { parseBraidWord } from './braid.ts';
import { parseDtCode } from './dt.ts';
import { parseGaussCode } from './gauss.ts';
import { parsePdCode } from './pd.ts';

export { printDtCode, printGaussCode, printPdCode } from './print.ts';

export interface ParseOptions {
  /** Braid words: the number of strands, when more than the largest index + 1. */
  readonly strands?: number;
}

export const NOTATIONS: readonly Notation[] = ['pd', 'braid', 'gauss', 'dt'];

export function parseDiagramCode(text: string, notation: Notation, options?: ParseOptions): LinkDiagram {
  switch (notation) {
    case 'pd':
      return parsePdCode(text);
    case 'braid':
      return parseBraidWord(text, options);
    case 'gauss':
      return parseGaussCode(text);
    case 'dt':
      return parseDtCode(text);
  }
}
