/**
 * The family notation: a diagram given by what it is rather than by a code.
 *
 *   torus P Q              the torus link T(p, q)
 *   pretzel A1 A2 … Ak     the pretzel link P(a₁, …, a_k)
 *   montesinos F1 … Fr     the Montesinos link of rational tangles (fractions p/q or integers)
 *   two-bridge P/Q         the two-bridge link of p/q
 *   twist N                the twist knot with n half twists
 *   mirror X               the mirror image of X
 *   sum X Y …              the connected sum
 *   split X Y …            the split union
 *
 * X, Y are ids of diagrams defined earlier in the document, or a family in
 * parentheses: `sum (torus 2 3) (mirror (torus 2 3))`. Separators are
 * whitespace and commas; words are case-insensitive.
 */
import type { LinkDiagram } from '../diagram/model.ts';
import { codeError, integerValue, isOversizedInteger, isSeparator, quote, spanBetween, wholeSpan, type Token } from '../notation/common.ts';
import { connectedSumOf, gcd, mirrorOf, montesinosLink, pretzelLink, splitUnionOf, torusCrossings, torusLink, twistKnot, twoBridgeLink } from './build.ts';
import type { Fraction } from './identity.ts';

/** Families are built explicitly, so their size is capped where the invariants stay quick. */
export const MAX_FAMILY_CROSSINGS = 2000;

export const FAMILY_WORDS = ['torus', 'pretzel', 'montesinos', 'two-bridge', 'twist', 'mirror', 'sum', 'split'] as const;

export interface FamilyContext {
  /** The diagram an earlier id names, or undefined when there is none. */
  readonly named?: (id: string) => LinkDiagram | undefined;
}

const EXAMPLE = 'e.g. "torus 3 4", "pretzel -2 3 7", "two-bridge 7/3" or "sum trefoil (mirror trefoil)"';

function tokenize(text: string): Token[] {
  const tokens: Token[] = [];
  let i = 0;
  while (i < text.length) {
    const ch = text[i]!;
    if (isSeparator(ch)) {
      i++;
    } else if (ch === '(' || ch === ')') {
      tokens.push({ text: ch, start: i, end: i + 1 });
      i++;
    } else {
      const start = i;
      while (i < text.length && !isSeparator(text[i]!) && text[i] !== '(' && text[i] !== ')') i++;
      tokens.push({ text: text.slice(start, i), start, end: i });
    }
  }
  return tokens;
}

class FamilyParser {
  private at = 0;
  private crossings = 0;
  constructor(
    private readonly text: string,
    private readonly tokens: Token[],
    private readonly context: FamilyContext,
  ) {}

  parseAll(): LinkDiagram {
    if (this.tokens.length === 0) throw codeError(`The family is empty: name a family and its parameters, ${EXAMPLE}.`, wholeSpan(this.text));
    const d = this.expression();
    const extra = this.tokens[this.at];
    if (extra) {
      throw codeError(
        `Unexpected ${quote(extra.text)} after the complete family: ${extra.text === ')' ? 'this parenthesis closes nothing' : 'one code describes one diagram; put a family used as an operand in parentheses'}.`,
        extra,
      );
    }
    return d;
  }

  private expression(): LinkDiagram {
    const word = this.tokens[this.at];
    if (!word) throw codeError(`The code ends where a family was expected, ${EXAMPLE}.`, { start: this.text.length, end: this.text.length });
    const name = word.text.toLowerCase();
    if (!(FAMILY_WORDS as readonly string[]).includes(name)) {
      throw codeError(`${quote(word.text)} is not a family: start with one of ${FAMILY_WORDS.join(', ')}, ${EXAMPLE}.`, word);
    }
    this.at++;
    switch (name) {
      case 'torus': {
        const [p, q] = [this.integer(word, 'p of T(p, q)'), this.integer(word, 'q of T(p, q)')];
        if (p.value === 0 && q.value === 0) throw codeError('T(0, 0) is not a link: at least one of p and q must be non-zero.', spanBetween(p.token, q.token));
        return this.counted(torusCrossings(p.value, q.value), spanBetween(word, q.token), () => torusLink(p.value, q.value));
      }
      case 'pretzel': {
        const twists = this.integers(word, 'the number of half twists in a pretzel column');
        for (const t of twists) if (t.value === 0) throw codeError('A pretzel column needs at least one half twist: 0 is not allowed (leave the column out).', t.token);
        const total = twists.reduce((s, t) => s + Math.abs(t.value), 0);
        return this.counted(total, spanBetween(word, twists[twists.length - 1]!.token), () => pretzelLink(twists.map((t) => t.value)));
      }
      case 'montesinos': {
        const tangles = this.fractions(word);
        const total = tangles.reduce((s, f) => s + termSum(f.value), 0);
        return this.counted(total, spanBetween(word, tangles[tangles.length - 1]!.token), () => montesinosLink(tangles.map((f) => f.value)));
      }
      case 'two-bridge': {
        const f = this.fraction(word, 'the fraction p/q of the two-bridge link');
        if (gcd(f.value.p, f.value.q) !== 1) {
          throw codeError(`${quote(f.token.text)} is not in lowest terms: divide p and q by their common factor ${gcd(f.value.p, f.value.q)}.`, f.token);
        }
        const big = Math.abs(f.value.p);
        const total = big <= 1 ? 0 : termSum({ p: big, q: Math.abs(f.value.q) % big });
        return this.counted(total, spanBetween(word, f.token), () => twoBridgeLink(f.value.p, f.value.q));
      }
      case 'twist': {
        const n = this.integer(word, 'the number of half twists');
        if (n.value === 0) throw codeError('A twist knot needs at least one half twist (0 would leave the clasp alone, an unknot); negative numbers give the mirror image.', n.token);
        return this.counted(Math.abs(n.value) + 2, spanBetween(word, n.token), () => twistKnot(n.value));
      }
      case 'mirror':
        return mirrorOf(this.operand(word));
      case 'sum':
      case 'split': {
        const operands = [this.operand(word)];
        while (this.at < this.tokens.length && this.tokens[this.at]!.text !== ')') operands.push(this.operand(word));
        if (operands.length < 2) throw codeError(`"${name}" joins at least two diagrams: write "${name} first second".`, word);
        return name === 'sum' ? connectedSumOf(operands) : splitUnionOf(operands);
      }
    }
    throw new Error(`internal: family word ${name} has no builder`);
  }

  /** Builds only after checking the running total, so a huge family is refused before it is built. */
  private counted(crossings: number, span: Token | { start: number; end: number }, build: () => LinkDiagram): LinkDiagram {
    this.crossings += crossings;
    if (crossings > MAX_FAMILY_CROSSINGS || this.crossings > MAX_FAMILY_CROSSINGS) {
      throw codeError(`This family would have ${this.crossings} crossings; at most ${MAX_FAMILY_CROSSINGS} are supported. Check the parameters for a misprint.`, span);
    }
    return build();
  }

  private operand(keyword: Token): LinkDiagram {
    const token = this.tokens[this.at];
    if (!token || token.text === ')') {
      throw codeError(`"${keyword.text}" needs a diagram here: the id of a diagram defined earlier, or a family in parentheses such as "(torus 2 3)".`, token ?? { start: this.text.length, end: this.text.length });
    }
    this.at++;
    if (token.text === '(') {
      const d = this.expression();
      const close = this.tokens[this.at];
      if (!close || close.text !== ')') throw codeError('This parenthesis is never closed: add ")" after the family inside it.', token);
      this.at++;
      return d;
    }
    const named = this.context.named?.(token.text);
    if (!named) {
      const known = this.context.named ? 'no diagram with this id is defined before this one' : 'here no other diagram can be named';
      throw codeError(`${quote(token.text)} is not a diagram: ${known}. Write the id of an earlier diagram, or a family in parentheses such as "(torus 2 3)".`, token);
    }
    this.crossings += named.crossings.length;
    if (this.crossings > MAX_FAMILY_CROSSINGS) throw codeError(`This family would have ${this.crossings} crossings; at most ${MAX_FAMILY_CROSSINGS} are supported.`, token);
    return named;
  }

  private next(keyword: Token, what: string): Token {
    const token = this.tokens[this.at];
    if (!token || token.text === '(' || token.text === ')') {
      throw codeError(`"${keyword.text}" needs ${what} here, ${EXAMPLE}.`, token ?? { start: this.text.length, end: this.text.length });
    }
    this.at++;
    return token;
  }

  private integer(keyword: Token, what: string): { value: number; token: Token } {
    const token = this.next(keyword, what);
    return { value: this.integerOf(token, what), token };
  }

  private integerOf(token: Token, what: string): number {
    const value = integerValue(token.text);
    if (value === undefined || Math.abs(value) > MAX_FAMILY_CROSSINGS) {
      throw codeError(
        isOversizedInteger(token.text) || (value !== undefined && Math.abs(value) > MAX_FAMILY_CROSSINGS)
          ? `${quote(token.text)} is too large for ${what} (at most ${MAX_FAMILY_CROSSINGS} in absolute value).`
          : `${quote(token.text)} is not a whole number: ${what} is a signed integer.`,
        token,
      );
    }
    return value;
  }

  /** One or more integers, up to the end or a closing parenthesis. */
  private integers(keyword: Token, what: string): { value: number; token: Token }[] {
    const list = [this.integer(keyword, what)];
    while (this.at < this.tokens.length && !['(', ')'].includes(this.tokens[this.at]!.text)) list.push(this.integer(keyword, what));
    return list;
  }

  private fraction(keyword: Token, what: string): { value: Fraction; token: Token } {
    const token = this.next(keyword, what);
    const [top, bottom, ...rest] = token.text.split('/');
    if (rest.length > 0) throw codeError(`${quote(token.text)} has more than one "/": write a fraction as p/q.`, token);
    const p = this.integerOf({ ...token, text: top! }, 'the numerator');
    const q = bottom === undefined ? 1 : this.integerOf({ ...token, text: bottom }, 'the denominator');
    if (q === 0) throw codeError(`${quote(token.text)} has denominator 0: a rational tangle here needs a non-zero denominator.`, token);
    return { value: { p, q }, token };
  }

  private fractions(keyword: Token): { value: Fraction; token: Token }[] {
    const list = [this.fraction(keyword, 'a rational tangle p/q')];
    while (this.at < this.tokens.length && !['(', ')'].includes(this.tokens[this.at]!.text)) list.push(this.fraction(keyword, 'a rational tangle p/q'));
    return list;
  }
}

function termSum(f: Fraction): number {
  if (f.q === 0) return 0;
  let [a, b] = [Math.abs(f.p), Math.abs(f.q)];
  let total = 0;
  while (b !== 0) {
    total += Math.floor(a / b);
    [a, b] = [b, a % b];
  }
  return total;
}

export function parseFamily(text: string, context: FamilyContext = {}): LinkDiagram {
  return new FamilyParser(text, tokenize(text), context).parseAll();
}
