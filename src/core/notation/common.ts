/**
 * Pieces shared by the notation parsers: tokens that remember where they are
 * in the code text, and the one way to report a mistake in a code.
 */
import { InputError } from '../errors.ts';
import type { TextSpan } from '../diagnostics/diagnostic.ts';

export const CODE_INVALID = 'code-invalid';

export interface Token {
  readonly text: string;
  readonly start: number;
  readonly end: number;
}

export function codeError(message: string, span: TextSpan, hints: readonly string[] = []): InputError {
  return new InputError(CODE_INVALID, message, { start: span.start, end: span.end }, hints);
}

/** The whole text (for mistakes with no narrower place, such as an empty code). */
export function wholeSpan(text: string): TextSpan {
  return { start: 0, end: text.length };
}

/** The span from the start of `first` to the end of `last`. */
export function spanBetween(first: TextSpan, last: TextSpan): TextSpan {
  return { start: Math.min(first.start, last.start), end: Math.max(first.end, last.end) };
}

export function isSeparator(ch: string): boolean {
  return ch === ',' || /\s/.test(ch);
}

/** Maximal runs of characters that are neither whitespace nor commas. */
export function splitTokens(text: string): Token[] {
  const tokens: Token[] = [];
  let i = 0;
  while (i < text.length) {
    if (isSeparator(text[i]!)) {
      i++;
      continue;
    }
    const start = i;
    while (i < text.length && !isSeparator(text[i]!)) i++;
    tokens.push({ text: text.slice(start, i), start, end: i });
  }
  return tokens;
}

const CLOSER: Readonly<Record<string, string>> = { '(': ')', '[': ']' };

/**
 * The tokens of a flat list code (a braid word, a DT code), with their offsets
 * in the text. One pair of brackets around the whole list, as in [4, 6, 2], is
 * allowed, since lists are often printed so; any other bracket is refused with
 * the message `strayBracket` gives.
 */
export function listTokens(text: string, strayBracket: (bracket: string, offset: number) => string): Token[] {
  let first = 0;
  while (first < text.length && isSeparator(text[first]!)) first++;
  let last = text.length - 1;
  while (last > first && isSeparator(text[last]!)) last--;
  // Blank out the outer pair rather than cut it off, so offsets stay those of the text.
  const body = last > first && CLOSER[text[first]!] === text[last] ? `${text.slice(0, first)} ${text.slice(first + 1, last)} ${text.slice(last + 1)}` : text;
  const bracket = /[()[\]{}]/.exec(body);
  if (bracket) throw codeError(strayBracket(bracket[0], bracket.index), { start: bracket.index, end: bracket.index + 1 });
  return splitTokens(body);
}

/** A token as quoted in a message; long tokens are shortened, and an invisible character in it is named. */
export function quote(text: string): string {
  const shown = text.length > 24 ? `${text.slice(0, 20)}…` : text;
  const invisible = [...new Set(Array.from(text).filter((ch) => INVISIBLE_NAMES[ch] !== undefined))];
  if (invisible.length === 0) return `"${shown}"`;
  const named = invisible.map((ch) => `U+${ch.codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')} ${INVISIBLE_NAMES[ch]}`);
  return `"${shown}" (it holds the invisible character${named.length > 1 ? 's' : ''} ${named.join(', ')}: delete ${named.length > 1 ? 'them' : 'it'})`;
}

/** Characters that print as nothing, which copied text brings along; their Unicode names (Unicode Character Database). */
const INVISIBLE_NAMES: Readonly<Record<string, string>> = {
  '\u00AD': 'SOFT HYPHEN',
  '\u180E': 'MONGOLIAN VOWEL SEPARATOR',
  '\u200B': 'ZERO WIDTH SPACE',
  '\u200C': 'ZERO WIDTH NON-JOINER',
  '\u200D': 'ZERO WIDTH JOINER',
  '\u200E': 'LEFT-TO-RIGHT MARK',
  '\u200F': 'RIGHT-TO-LEFT MARK',
  '\u202A': 'LEFT-TO-RIGHT EMBEDDING',
  '\u202B': 'RIGHT-TO-LEFT EMBEDDING',
  '\u202C': 'POP DIRECTIONAL FORMATTING',
  '\u202D': 'LEFT-TO-RIGHT OVERRIDE',
  '\u202E': 'RIGHT-TO-LEFT OVERRIDE',
  '\u2060': 'WORD JOINER',
  '\u2061': 'FUNCTION APPLICATION',
  '\u2062': 'INVISIBLE TIMES',
  '\u2063': 'INVISIBLE SEPARATOR',
  '\u2064': 'INVISIBLE PLUS',
  '\u2066': 'LEFT-TO-RIGHT ISOLATE',
  '\u2067': 'RIGHT-TO-LEFT ISOLATE',
  '\u2068': 'FIRST STRONG ISOLATE',
  '\u2069': 'POP DIRECTIONAL ISOLATE',
  '\uFEFF': 'ZERO WIDTH NO-BREAK SPACE',
};

/**
 * A signed whole number. The minus sign U+2212 counts as "-": typeset text,
 * word processors and copied PDFs write it instead, so "1 −2 1 −2" reads as typed.
 */
const INTEGER = /^[+\-\u2212]?\d+$/;

/** The integer a token spells, or undefined when it is not a (safe) integer. */
export function integerValue(text: string): number | undefined {
  if (!INTEGER.test(text)) return undefined;
  const value = Number(text.replace('\u2212', '-'));
  return Number.isSafeInteger(value) ? value : undefined;
}

/** True when the token spells a whole number too large for `integerValue`, so a message can say "too large" rather than "not a number". */
export function isOversizedInteger(text: string): boolean {
  return INTEGER.test(text) && integerValue(text) === undefined;
}

/** "1, 2 and 5" — for lists of tuple or crossing numbers in messages (long lists are cut). */
export function listNumbers(numbers: readonly number[], limit = 8): string {
  const shown = numbers.slice(0, limit).map(String);
  if (numbers.length > limit) return `${shown.join(', ')} and ${numbers.length - limit} more`;
  if (shown.length <= 1) return shown.join('');
  return `${shown.slice(0, -1).join(', ')} and ${shown[shown.length - 1]}`;
}

/** "1 face", "3 faces". */
export function plural(count: number, word: string): string {
  return `${count} ${word}${count === 1 ? '' : 's'}`;
}
