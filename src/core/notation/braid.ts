/**
 * Braid words: signed generator indices separated by spaces or commas.
 * `i` or `+i` is σ_i (a positive crossing of the strands at positions i and
 * i+1), `-i` its inverse. The closure is built by `closeBraid`.
 */
import { closeBraid } from '../diagram/braid-closure.ts';
import type { LinkDiagram } from '../diagram/model.ts';
import { markFamily } from '../families/identity.ts';
import { torusBraidParameters } from '../families/recognize.ts';
import { codeError, integerValue, isOversizedInteger, listTokens, quote, wholeSpan, type Token } from './common.ts';

/** Larger indices are refused: they would only add thousands of untouched strands. */
export const MAX_BRAID_STRANDS = 10_000;

export function parseBraidWord(text: string, options: { strands?: number } = {}): LinkDiagram {
  const tokens = listTokens(
    text,
    (bracket, offset) =>
      `Unexpected "${bracket}" at offset ${offset}: a braid word is a flat list of signed generator indices, at most wrapped in one pair of brackets, e.g. "1 -2 1 -2" or "[1, -2, 1, -2]".`,
  );
  if (tokens.length === 0) {
    throw codeError('The braid word is empty: write signed generator indices separated by spaces or commas, e.g. "1 -2 1 -2".', wholeSpan(text));
  }
  const word: number[] = [];
  let widest: { token: Token; index: number; position: number } | undefined;
  tokens.forEach((token, k) => {
    const g = integerValue(token.text);
    if (g === undefined && isOversizedInteger(token.text)) {
      throw codeError(`Token ${k + 1} ${quote(token.text)}: the generator index is too large (at most ${MAX_BRAID_STRANDS - 1} is supported).`, token);
    }
    if (g === undefined) {
      throw codeError(
        `Token ${k + 1} ${quote(token.text)} is not a braid generator: write a signed index such as 2 (σ₂) or -2 (its inverse), separated by spaces or commas.`,
        token,
      );
    }
    if (g === 0) {
      throw codeError(`Token ${k + 1} "${token.text}" is not a generator: generators are numbered from 1 (σ₁ crosses the strands at positions 1 and 2).`, token);
    }
    if (Math.abs(g) >= MAX_BRAID_STRANDS) {
      throw codeError(`Token ${k + 1} "${token.text}": generator index ${Math.abs(g)} is too large (at most ${MAX_BRAID_STRANDS - 1} is supported).`, token);
    }
    if (!widest || Math.abs(g) > widest.index) widest = { token, index: Math.abs(g), position: k + 1 };
    word.push(g);
  });
  const needed = widest!.index + 1;
  let strands = needed;
  if (options.strands !== undefined) {
    if (!Number.isInteger(options.strands) || options.strands < 1 || options.strands > MAX_BRAID_STRANDS) {
      throw codeError(`The strand count ${options.strands} is not a whole number between 1 and ${MAX_BRAID_STRANDS}.`, wholeSpan(text));
    }
    if (options.strands < needed) {
      throw codeError(
        `Token ${widest!.position} "${widest!.token.text}" needs ${needed} strands (σ${widest!.index} crosses strands ${widest!.index} and ${needed}), but the strand count is ${options.strands}: raise the strand count or remove the generator.`,
        widest!.token,
      );
    }
    strands = options.strands;
  }
  const closure = closeBraid(word, strands);
  // A literal torus braid is the torus link T(p, q), so theorems about torus links apply to its closure.
  const torus = torusBraidParameters(word, strands);
  return torus ? markFamily(closure, { kind: 'torus', ...torus, fromBraid: true }) : closure;
}
