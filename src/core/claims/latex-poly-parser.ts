/**
 * Reads a Laurent polynomial the way authors type it in LaTeX math:
 * `-t^{-4}+t^{-3}+t^{-1}`, `-\sqrt{t} - t^{\frac{5}{2}}`, `(1-t)^2 t^{-1}`,
 * `-A^{-5} - A^{3}+A^{7}`, with `\left( \right)`, `\cdot`, spacing commands,
 * `{}` groups and implicit multiplication. A recursive-descent parser of our
 * own; every refusal is an InputError `claim-unreadable` whose span points at
 * the offending characters.
 */
import { InputError } from '../errors.ts';
import { Laurent } from '../poly/laurent.ts';
import type { TextSpan } from '../diagnostics/diagnostic.ts';

export const UNREADABLE = 'claim-unreadable';

export interface PolynomialReadOptions {
  /** Letters the polynomial may be written in, the expected one first (e.g. ['t'] or ['t', 'A']). */
  readonly variables: readonly string[];
  /** What the value is, for messages: "a Jones polynomial". */
  readonly what?: string;
  /** A number claim that must be whole (a writhe, not a span): its messages suggest no fraction. */
  readonly whole?: boolean;
  /**
   * A second letter that may appear beside the first (`variables[0]`), for two-variable polynomials
   * such as P(v, z): it is read as the first letter to the power PAIRED_WEIGHT (see `splitPaired`).
   */
  readonly paired?: string;
}

/** The weight of the second letter of a two-variable reading: x^i y^j is read as x^(i + PAIRED_WEIGHT·j). */
export const PAIRED_WEIGHT = 1000;

/** Splits a value read with `paired` into its (first-letter, second-letter) exponents. */
export function splitPaired(exponent: number): [number, number] {
  const j = Math.round(exponent / PAIRED_WEIGHT);
  return [exponent - j * PAIRED_WEIGHT, j];
}

export interface ReadPolynomial {
  readonly value: Laurent;
  /** The letter used; undefined for a constant. */
  readonly variable: string | undefined;
  /** The value follows `\doteq` (≐), which states equality up to a unit ±x^k (as Alexander polynomials often are). */
  readonly upToUnits: boolean;
}

/** Exponents of t may be halves; A and q take integer exponents only. */
export function exponentDenominator(variable: string): number {
  return variable === 't' ? 2 : 1;
}

/** The largest natural power of a sum we expand; higher ones are surely typos. */
const MAX_EXPANDED_POWER = 64;
/** … and the widest expansion, in units of the variable's exponent. */
const MAX_EXPANDED_SPAN = 4096;
const MAX_EXPONENT = 100000;
/**
 * The deepest nesting of ( [ { read. The parser descends once per open bracket, so a bound keeps
 * the call stack small for any input; no value an author types comes near it.
 */
export const MAX_NESTING = 100;

/**
 * `stray`: a character no value contains; `decimal`: a number with a decimal point. Both are refused
 * unless they lie in a skipped left-hand side (`V_{K'}(t) =`).
 */
type TokenKind = 'number' | 'decimal' | 'letter' | 'op' | 'command' | 'stray' | 'end';

interface Token {
  readonly kind: TokenKind;
  /** The digits, the letter, the operator character, or the command name without `\`. */
  readonly text: string;
  readonly start: number;
  readonly end: number;
}

/** Commands that only space or size things: dropped. */
const IGNORED_COMMANDS = new Set([
  ',', ';', ':', '!', ' ', 'quad', 'qquad', 'left', 'right', 'middle',
  'big', 'Big', 'bigg', 'Bigg', 'bigl', 'bigr', 'Bigl', 'Bigr', 'biggl', 'biggr', 'Biggl', 'Biggr',
  'displaystyle', 'textstyle',
]);
const TIMES_COMMANDS = new Set(['cdot', 'times']);
/** `V(t) \coloneqq …` defines like `=`, and `\doteq` states equality up to a unit: what follows is the value. */
const DEFINITION_COMMANDS = new Set(['coloneqq', 'coloneq', 'eqqcolon', 'doteq']);
const FRACTION_COMMANDS = new Set(['frac', 'dfrac', 'tfrac']);
const UNICODE_OPERATORS: Readonly<Record<string, string>> = { '−': '-', '–': '-', '·': '*', '×': '*', '⋅': '*', '≐': '=' };

function fail(message: string, span: TextSpan): never {
  throw new InputError(UNREADABLE, message, { start: span.start, end: span.end });
}

/** Unicode superscripts as typed in prose (`t³`, `t⁻¹`): read as a braced exponent. */
const SUPERSCRIPTS: Readonly<Record<string, string>> = {
  '⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁵': '5', '⁶': '6', '⁷': '7', '⁸': '8', '⁹': '9', '⁻': '-', '⁺': '+',
};

/**
 * Offsets of math delimiters around the whole value (`$…$`, `$$…$$`, `\(…\)`,
 * `\[…\]`), as a value copied from a manuscript or a command line may carry them.
 */
function outerDelimiters(text: string): Set<number> {
  const start = text.length - text.trimStart().length;
  // Sentence punctuation may follow the closing delimiter (`$…$.`); the tokenizer drops it.
  const end = text.trimEnd().replace(/[.,;]$/, '').trimEnd().length;
  const inner = text.slice(start, end);
  for (const [open, close] of [['$$', '$$'], ['$', '$'], ['\\(', '\\)'], ['\\[', '\\]']] as const) {
    if (inner.length >= open.length + close.length && inner.startsWith(open) && inner.endsWith(close)) {
      const body = inner.slice(open.length, inner.length - close.length);
      if (open === '$' && body.includes('$')) continue;
      const skip = new Set<number>();
      for (let k = 0; k < open.length; k++) skip.add(start + k);
      for (let k = 1; k <= close.length; k++) skip.add(end - k);
      return skip;
    }
  }
  return new Set();
}

function tokenize(text: string): Token[] {
  const tokens: Token[] = [];
  const delimiters = outerDelimiters(text);
  let i = 0;
  while (i < text.length) {
    const ch = text[i]!;
    if (/\s/.test(ch) || ch === '~' || delimiters.has(i)) {
      i++;
    } else if (SUPERSCRIPTS[ch] !== undefined) {
      let j = i;
      while (j < text.length && SUPERSCRIPTS[text[j]!] !== undefined) j++;
      const exponent = [...text.slice(i, j)].map((c) => SUPERSCRIPTS[c]!).join('');
      const sign = /^[+-]/.test(exponent) ? 1 : 0;
      if (!/^[+-]?[0-9]+$/.test(exponent))
        fail(`the superscript \`${text.slice(i, j)}\` is not a whole exponent: write one sign at most and digits, e.g. \`t⁻¹\` or \`t^{-1}\``, { start: i, end: j });
      const whole = { start: i, end: j };
      tokens.push({ kind: 'op', text: '^', ...whole }, { kind: 'op', text: '{', ...whole });
      if (sign) tokens.push({ kind: 'op', text: exponent[0]!, start: i, end: i + 1 });
      tokens.push({ kind: 'number', text: exponent.slice(sign), start: i + sign, end: j }, { kind: 'op', text: '}', ...whole });
      i = j;
    } else if (/[0-9]/.test(ch)) {
      let j = i;
      while (j < text.length && /[0-9]/.test(text[j]!)) j++;
      if (text[j] === '.' && /[0-9]/.test(text[j + 1] ?? '')) {
        let k = j + 1;
        while (k < text.length && /[0-9]/.test(text[k]!)) k++;
        tokens.push({ kind: 'decimal', text: text.slice(i, k), start: i, end: k });
        i = k;
        continue;
      }
      tokens.push({ kind: 'number', text: text.slice(i, j), start: i, end: j });
      i = j;
    } else if (/[a-zA-Z]/.test(ch)) {
      tokens.push({ kind: 'letter', text: ch, start: i, end: i + 1 });
      i++;
    } else if (ch === '\\') {
      let j = i + 1;
      if (/[a-zA-Z]/.test(text[j] ?? '')) while (j < text.length && /[a-zA-Z]/.test(text[j]!)) j++;
      else if (j < text.length) j++;
      const name = text.slice(i + 1, j);
      if (name === '') fail('a lone `\\` ends the value: remove it', { start: i, end: j });
      // `\left.` and `\right.` are invisible delimiters: drop the dot with the command.
      if ((name === 'left' || name === 'right') && /^\s*\./.test(text.slice(j))) j = text.indexOf('.', j) + 1;
      if (DEFINITION_COMMANDS.has(name)) tokens.push({ kind: 'op', text: '=', start: i, end: j });
      else if (!IGNORED_COMMANDS.has(name)) {
        tokens.push(TIMES_COMMANDS.has(name) ? { kind: 'op', text: '*', start: i, end: j } : { kind: 'command', text: name, start: i, end: j });
      }
      i = j;
    } else if ('.,;'.includes(ch) && [...text.slice(i + 1)].every((c, k) => /\s/.test(c) || delimiters.has(i + 1 + k))) {
      // Sentence punctuation closing the formula (`… - t^4.`, `$… - t^4.$`) is not part of the value.
      break;
    } else if ('+-*/^_()[]{}='.includes(ch)) {
      tokens.push({ kind: 'op', text: ch, start: i, end: i + 1 });
      i++;
    } else if (UNICODE_OPERATORS[ch] !== undefined) {
      tokens.push({ kind: 'op', text: UNICODE_OPERATORS[ch]!, start: i, end: i + 1 });
      i++;
    } else {
      tokens.push({ kind: 'stray', text: ch, start: i, end: i + 1 });
      i++;
    }
  }
  // `{}` is an empty group that typesets as nothing: drop it.
  const kept: Token[] = [];
  for (const t of tokens) {
    const last = kept[kept.length - 1];
    if (t.kind === 'op' && t.text === '}' && last?.kind === 'op' && last.text === '{') kept.pop();
    else kept.push(t);
  }
  kept.push({ kind: 'end', text: '', start: text.length, end: text.length });
  return kept;
}

/** An exact rational p/q in lowest terms, q > 0 (exponents, degrees). */
export interface Rational {
  readonly p: number;
  readonly q: number;
}

function gcd(a: number, b: number): number {
  a = Math.abs(a);
  b = Math.abs(b);
  while (b) [a, b] = [b, a % b];
  return a;
}

function rational(p: number, q: number): Rational {
  if (q < 0) [p, q] = [-p, -q];
  const g = gcd(p, q) || 1;
  return { p: p / g, q: q / g };
}

function formatRational(r: Rational): string {
  return r.q === 1 ? `${r.p}` : `${r.p}/${r.q}`;
}

interface Spanned<T> {
  readonly value: T;
  readonly start: number;
  readonly end: number;
}

class PolynomialParser {
  private pos = 0;
  private variable: Token | undefined;
  /** True when the whole value is a number (`readNumber`), not an exponent. */
  private readingNumber = false;
  private upToUnits = false;
  private readonly tokens: Token[];

  constructor(
    private readonly text: string,
    private readonly options: PolynomialReadOptions,
  ) {
    this.tokens = tokenize(text);
  }

  read(): ReadPolynomial {
    this.skipLeftHandSide();
    const first = this.peek();
    if (first.kind === 'end') fail(`the value is empty: write ${this.what()}, e.g. ${this.example()}`, { start: 0, end: this.text.length });
    const sum = this.parseSum();
    const rest = this.peek();
    if (rest.kind !== 'end') this.unexpected(rest);
    return { value: sum.value, variable: this.variable?.text, upToUnits: this.upToUnits };
  }

  /** A number such as `7`, `-3`, `5/2` or `-\frac{5}{2}`, as an exact fraction. */
  readNumber(): Rational {
    this.readingNumber = true;
    this.skipLeftHandSide();
    const first = this.peek();
    if (first.kind === 'end') fail(`the value is empty: write ${this.what()}, e.g. 7`, { start: 0, end: this.text.length });
    const r = this.parseRationalSum();
    const rest = this.peek();
    if (rest.kind === 'letter') fail(`unexpected \`${rest.text}\`: ${this.what()} is a number`, rest);
    if (rest.kind !== 'end') this.unexpected(rest);
    return r.value;
  }

  /** `V(t) = t + t^3 - t^4`: the value is what follows the last `=` outside any group; stray characters after it are refused. */
  private skipLeftHandSide(): void {
    this.checkBraces();
    this.checkNesting();
    this.findLeftHandSide();
    const stray = this.tokens.slice(this.pos).find((t) => t.kind === 'stray' || t.kind === 'decimal');
    if (stray?.kind === 'decimal') {
      fail(
        this.readingNumber
          ? `the decimal \`${stray.text}\` cannot be read: write ${this.what()} as an integer${this.options.whole ? '' : ' or a fraction such as `5/2`'}`
          : `the decimal \`${stray.text}\` cannot be read: coefficients are integers, and exponents are written as fractions such as \`5/2\``,
        stray,
      );
    }
    if (stray) {
      // A digit of another script (a full-width ３ from an East Asian input method) looks right but is not read.
      const foreignDigit = /^\p{Nd}$/u.test(stray.text);
      if (this.readingNumber) {
        const how = this.options.whole ? 'the digits 0–9' : 'the digits 0–9, a sign and a fraction such as `5/2`';
        fail(`unexpected character \`${stray.text}\`${foreignDigit ? ' (a digit of another script)' : ''}: ${this.what()} is written with ${how}`, stray);
      }
      fail(`unexpected character \`${stray.text}\`${foreignDigit ? ' (a digit of another script: write the digits 0–9)' : ''}: a polynomial is made of integers, its variable, + − · ^ and brackets`, stray);
    }
  }

  /** TeX braces must balance; an unclosed `{` is the fault, not whatever its group swallowed. */
  private checkBraces(): void {
    const open: Token[] = [];
    for (const t of this.tokens) {
      if (this.isOp(t, '{')) open.push(t);
      else if (this.isOp(t, '}') && !open.pop()) this.unexpected(t);
    }
    const unclosed = open.pop();
    if (unclosed) fail('unbalanced braces: this `{` is never closed; add `}`', unclosed);
  }

  /** Refuses brackets nested deeper than MAX_NESTING, at the first bracket past the limit. */
  private checkNesting(): void {
    let depth = 0;
    for (const t of this.tokens) {
      if (t.kind !== 'op') continue;
      if ('([{'.includes(t.text) && ++depth > MAX_NESTING) {
        fail(`brackets nested more than ${MAX_NESTING} deep: this \`${t.text}\` opens level ${depth}; a value is not read past ${MAX_NESTING} levels of ( [ {, so write it with fewer brackets`, t);
      } else if (')]}'.includes(t.text)) depth = Math.max(0, depth - 1);
    }
  }

  private findLeftHandSide(): void {
    let depth = 0;
    let lastEquals = -1;
    this.tokens.forEach((t, i) => {
      if (t.kind !== 'op') return;
      if ('({['.includes(t.text)) depth++;
      else if (')}]'.includes(t.text)) depth--;
      else if (t.text === '=' && depth === 0) lastEquals = i;
    });
    if (lastEquals < 0) return;
    this.pos = lastEquals + 1;
    const relation = this.tokens[lastEquals]!;
    this.upToUnits = /^(?:\\doteq|≐)$/.test(this.text.slice(relation.start, relation.end));
    if (this.peek().kind === 'end') fail(`nothing follows \`=\`: write ${this.what()} after it`, this.tokens[lastEquals]!);
  }

  private what(): string {
    return this.options.what ?? 'a polynomial';
  }

  private example(): string {
    const v = this.options.variables[0] ?? 't';
    return `-${v}^{-2} + 1 - ${v}^{2}`;
  }

  private peek(offset = 0): Token {
    return this.tokens[Math.min(this.pos + offset, this.tokens.length - 1)]!;
  }

  private next(): Token {
    const t = this.peek();
    if (t.kind !== 'end') this.pos++;
    return t;
  }

  private isOp(t: Token, text: string): boolean {
    return t.kind === 'op' && t.text === text;
  }

  private unexpected(t: Token): never {
    if (t.kind === 'end') {
      const last = this.tokens[this.pos - 1];
      const after = last ? ` after \`${this.text.slice(last.start, last.end) || last.text}\`` : '';
      fail(`the value ends too early${after}: ${this.what()} is incomplete; add what is missing or remove the last sign or operator`, { start: t.start, end: t.end });
    }
    if (this.isOp(t, '}')) fail('unbalanced braces: this `}` closes no `{`; remove it or add the matching `{`', t);
    if (this.isOp(t, ')') || this.isOp(t, ']')) fail(`unbalanced brackets: this \`${t.text}\` closes nothing; remove it or add the opening bracket`, t);
    if (t.kind === 'number')
      fail(`the number \`${t.text}\` follows a factor: write coefficients first (e.g. \`3t^2\`), or put a multi-digit exponent in braces (\`t^{23}\`)`, t);
    const shown = t.kind === 'command' ? `\\${t.text}` : this.text.slice(t.start, t.end) || t.text;
    fail(`unexpected \`${shown}\` here: ${this.what()} cannot continue this way; remove it, or join it to what comes before with + , − or \\cdot`, t);
  }

  private parseSum(): Spanned<Laurent> {
    const start = this.peek().start;
    let total = Laurent.zero;
    let sign = 1n;
    let t = this.peek();
    if (this.isOp(t, '+') || this.isOp(t, '-')) {
      sign = t.text === '-' ? -1n : 1n;
      this.next();
    }
    for (;;) {
      const term = this.parseProduct();
      total = total.add(term.value.scale(sign));
      t = this.peek();
      if (this.isOp(t, '+') || this.isOp(t, '-')) {
        sign = t.text === '-' ? -1n : 1n;
        this.next();
        const after = this.peek();
        if (this.isOp(after, '+') || this.isOp(after, '-')) fail(`two signs in a row (\`${t.text}${after.text}\`): keep one`, { start: t.start, end: after.end });
      } else break;
    }
    return { value: total, start, end: this.tokens[this.pos - 1]?.end ?? start };
  }

  private startsFactor(t: Token): boolean {
    if (t.kind === 'letter' || t.kind === 'command') return true;
    return t.kind === 'op' && (t.text === '(' || t.text === '[' || t.text === '{');
  }

  private parseProduct(): Spanned<Laurent> {
    const first = this.parseFactor();
    let value = first.value;
    let end = first.end;
    for (;;) {
      const t = this.peek();
      if (this.isOp(t, '*')) {
        this.next();
        const f = this.parseFactor();
        value = value.mul(f.value);
        end = f.end;
      } else if (this.isOp(t, '/')) {
        this.next();
        const divisor = this.parseFactor();
        value = this.divide(value, divisor);
        end = divisor.end;
      } else if (this.startsFactor(t)) {
        const f = this.parseFactor();
        value = value.mul(f.value);
        end = f.end;
      } else if (t.kind === 'number') {
        this.unexpected(t);
      } else break;
    }
    return { value, start: first.start, end };
  }

  private divide(dividend: Laurent, divisor: Spanned<Laurent>): Laurent {
    const d = divisor.value;
    if (d.isZero) fail('division by zero: the value is undefined; correct the denominator', divisor);
    if (d.termCount !== 1)
      fail(
        `division by a non-monomial: a Laurent polynomial can be divided only by a single term such as \`t^2\`; multiply out and write the terms`,
        divisor,
      );
    const [e, c] = d.terms()[0]!;
    const quotient = dividend.terms().map(([de, dc]) => {
      if (dc % c !== 0n)
        fail(`dividing by ${c} leaves a fraction: invariant polynomials here have integer coefficients; write the terms out`, divisor);
      return [de - e, dc / c] as const;
    });
    return Laurent.fromTerms(quotient);
  }

  private parseFactor(): Spanned<Laurent> {
    const base = this.parsePrimary();
    const caret = this.peek();
    if (this.isOp(caret, '_')) fail('a subscript `_` has no meaning in a polynomial value: remove it', caret);
    if (!this.isOp(caret, '^')) return base;
    this.next();
    const exponent = this.parseExponent(caret);
    const again = this.peek();
    if (this.isOp(again, '^')) fail('double superscript: put the whole exponent in one pair of braces, e.g. `t^{-3}`', again);
    return { value: this.power(base, exponent), start: base.start, end: exponent.end };
  }

  private parsePrimary(): Spanned<Laurent> {
    const t = this.peek();
    if (t.kind === 'number') {
      this.next();
      return { value: Laurent.constant(BigInt(t.text)), start: t.start, end: t.end };
    }
    if (t.kind === 'letter') {
      this.next();
      this.useVariable(t);
      return { value: Laurent.monomial(t.text === this.options.paired ? PAIRED_WEIGHT : 1), start: t.start, end: t.end };
    }
    if (this.isOp(t, '(') || this.isOp(t, '[') || this.isOp(t, '{')) {
      this.next();
      const close = t.text === '(' ? ')' : t.text === '[' ? ']' : '}';
      const inner = this.parseSum();
      const end = this.peek();
      if (!this.isOp(end, close)) {
        if (end.kind === 'end') {
          const kind = close === '}' ? 'braces' : 'brackets';
          fail(`unbalanced ${kind}: this \`${t.text}\` is never closed; add \`${close}\``, t);
        }
        this.unexpected(end);
      }
      this.next();
      return { value: inner.value, start: t.start, end: end.end };
    }
    if (t.kind === 'command') {
      if (FRACTION_COMMANDS.has(t.text)) return this.parseFraction();
      if (t.text === 'sqrt') return this.parseSquareRoot();
      fail(`unknown command \`\\${t.text}\` in ${this.what()}: only \\frac, \\sqrt, \\cdot, \\left/\\right and spacing commands are read`, t);
    }
    if (this.isOp(t, '+') || this.isOp(t, '-'))
      fail(`a sign in the middle of a product: put the signed factor in parentheses, e.g. \`t\\cdot(-1)\``, t);
    this.unexpected(t);
  }

  private useVariable(t: Token): void {
    const allowed = this.options.paired ? [...this.options.variables, this.options.paired] : this.options.variables;
    if (t.text === this.options.paired) return;
    if (allowed.length === 0) fail(`unexpected \`${t.text}\`: ${this.what()} is a number`, t);
    if (!allowed.includes(t.text)) {
      const expected = allowed[0] ?? 't';
      if (expected.toLowerCase() === t.text.toLowerCase())
        fail(`unknown variable \`${t.text}\`: variables are case-sensitive, and ${this.what()} is written in ${expected}; write \`${expected}\``, t);
      fail(`unknown variable \`${t.text}\`: ${this.what()} in this document is written in ${expected}; write it in ${expected} or declare another convention`, t);
    }
    if (this.variable && this.variable.text !== t.text)
      fail(`the value mixes the variables \`${this.variable.text}\` and \`${t.text}\`: write it in one variable`, t);
    this.variable ??= t;
  }

  /** One argument of \frac or \sqrt: a braced group, or a single character as TeX reads it (`\frac52`). */
  private parseArgument(command: Token, what: string): Spanned<Laurent> {
    const t = this.peek();
    if (this.isOp(t, '{')) return this.parsePrimary();
    if (t.kind === 'number') return this.singleDigit(t);
    if (t.kind === 'letter') return this.parsePrimary();
    if (t.kind === 'end') fail(`stray \`\\${command.text}\`: it needs ${what}, e.g. \`${command.text === 'sqrt' ? '\\sqrt{t}' : '\\frac{1}{2}'}\``, command);
    fail(`\`\\${command.text}\` needs ${what} in braces here`, t);
  }

  private singleDigit(t: Token): Spanned<Laurent> {
    // TeX takes one character as an unbraced argument: split `52` into `5`, `2`.
    this.tokens[this.pos] = { kind: 'number', text: t.text[0]!, start: t.start, end: t.start + 1 };
    if (t.text.length > 1) this.tokens.splice(this.pos + 1, 0, { kind: 'number', text: t.text.slice(1), start: t.start + 1, end: t.end });
    const digit = this.next();
    return { value: Laurent.constant(BigInt(digit.text)), start: digit.start, end: digit.end };
  }

  private parseFraction(): Spanned<Laurent> {
    const command = this.next();
    const numerator = this.parseArgument(command, 'a numerator and a denominator');
    const denominator = this.parseArgument(command, 'a denominator');
    return { value: this.divide(numerator.value, denominator), start: command.start, end: denominator.end };
  }

  private parseSquareRoot(): Spanned<Laurent> {
    const command = this.next();
    const open = this.peek();
    if (this.isOp(open, '[')) {
      // `\sqrt[2]{t}` is a square root written out; any other index is not read.
      const index = this.peek(1);
      const close = this.peek(2);
      if (!(index.kind === 'number' && index.text === '2' && this.isOp(close, ']'))) {
        fail('only square roots are read: remove the root index `[…]`', { start: open.start, end: (this.isOp(close, ']') ? close : index).end });
      }
      this.pos += 3;
    }
    const radicand = this.parseArgument(command, 'a radicand');
    return { value: this.power(radicand, { value: rational(1, 2), start: command.start, end: radicand.end }), start: command.start, end: radicand.end };
  }

  /** The exponent after `^`: a braced rational, or a single digit as TeX reads it. */
  private parseExponent(caret: Token): Spanned<Rational> {
    const t = this.peek();
    if (t.kind === 'number') {
      const d = this.singleDigit(t);
      return { value: rational(Number(d.value.valueAtOne()), 1), start: d.start, end: d.end };
    }
    if (t.kind === 'command' && FRACTION_COMMANDS.has(t.text)) {
      return this.parseRationalAtom();
    }
    if (this.isOp(t, '{')) {
      this.next();
      const r = this.parseRationalSum();
      const close = this.peek();
      if (!this.isOp(close, '}')) {
        if (close.kind === 'end') fail('unbalanced braces: this `{` is never closed; add `}`', t);
        if (close.kind === 'letter') fail(`the exponent contains \`${close.text}\`: exponents must be numbers such as \`-3\` or \`5/2\``, close);
        this.unexpected(close);
      }
      this.next();
      return { value: r.value, start: t.start, end: close.end };
    }
    if (this.isOp(t, '-'))
      fail('a negative exponent must be braced: write `^{-…}` (TeX would raise only the sign)', { start: caret.start, end: t.end });
    if (t.kind === 'end') fail('the exponent after `^` is missing: write it after the `^`, e.g. `t^{2}`, or remove the `^`', caret);
    if (t.kind === 'letter') fail(`the exponent \`${t.text}\` is not a number: exponents must be numbers such as \`-3\` or \`5/2\``, t);
    fail('the exponent after `^` must be a digit or a braced number such as `{-3}` or `{5/2}`', t);
  }

  /** Signed sums of rationals, enough for `-1/2`, `-\frac{1}{2}`, `{-(5/2)}`. */
  private parseRationalSum(): Spanned<Rational> {
    const start = this.peek().start;
    let total = rational(0, 1);
    let sign = 1;
    let first = true;
    for (;;) {
      const t = this.peek();
      if (this.isOp(t, '+') || this.isOp(t, '-')) {
        this.next();
        sign = t.text === '-' ? -1 : 1;
      } else if (!first) break;
      const term = this.parseRationalProduct();
      total = rational(total.p * term.value.q + sign * term.value.p * total.q, total.q * term.value.q);
      first = false;
      sign = 1;
      const after = this.peek();
      if (!(this.isOp(after, '+') || this.isOp(after, '-'))) break;
    }
    return { value: total, start, end: this.tokens[this.pos - 1]?.end ?? start };
  }

  private parseRationalProduct(): Spanned<Rational> {
    const first = this.parseRationalAtom();
    let value = first.value;
    let end = first.end;
    while (this.isOp(this.peek(), '/')) {
      this.next();
      const d = this.parseRationalAtom();
      if (d.value.p === 0) fail('division by zero in the exponent: correct the denominator', d);
      value = rational(value.p * d.value.q, value.q * d.value.p);
      end = d.end;
    }
    return { value, start: first.start, end };
  }

  private parseRationalAtom(): Spanned<Rational> {
    const t = this.peek();
    if (t.kind === 'number') {
      this.next();
      const n = Number(t.text);
      // A stated number (a determinant) may be large; an exponent that large is a typo.
      if (this.readingNumber ? !Number.isSafeInteger(n) : n > MAX_EXPONENT) {
        fail(this.readingNumber ? `the number ${t.text} is too large to be read exactly` : `the exponent ${t.text} is too large to be meant`, t);
      }
      return { value: rational(n, 1), start: t.start, end: t.end };
    }
    if (t.kind === 'command' && FRACTION_COMMANDS.has(t.text)) {
      const command = this.next();
      const num = this.rationalArgument(command, 'a numerator and a denominator');
      const den = this.rationalArgument(command, 'a denominator');
      if (den.value.p === 0) fail('division by zero in the exponent: correct the denominator', den);
      return { value: rational(num.value.p * den.value.q, num.value.q * den.value.p), start: command.start, end: den.end };
    }
    if (this.isOp(t, '(') || this.isOp(t, '{')) {
      this.next();
      const inner = this.parseRationalSum();
      const close = this.peek();
      const want = t.text === '(' ? ')' : '}';
      if (!this.isOp(close, want)) {
        if (close.kind === 'end') fail(`unbalanced ${want === '}' ? 'braces' : 'brackets'}: this \`${t.text}\` is never closed; add \`${want}\``, t);
        this.unexpected(close);
      }
      this.next();
      return { value: inner.value, start: t.start, end: close.end };
    }
    if (t.kind === 'letter') {
      if (this.readingNumber) {
        const word = /^[a-zA-Z]+/.exec(this.text.slice(t.start))![0];
        fail(`\`${word}\` is not a number: write ${this.what()} in digits, e.g. \`3\``, { start: t.start, end: t.start + word.length });
      }
      fail(`the exponent contains \`${t.text}\`: exponents must be numbers such as \`-3\` or \`5/2\``, t);
    }
    if (t.kind === 'end') {
      fail(this.readingNumber ? `the value ends too early: ${this.what()} is incomplete; finish it, e.g. \`5/2\`` : 'the exponent is incomplete: finish it, e.g. `t^{-1/2}`', t);
    }
    this.unexpected(t);
  }

  private rationalArgument(command: Token, what: string): Spanned<Rational> {
    const t = this.peek();
    if (t.kind === 'number') {
      const d = this.singleDigit(t);
      return { value: rational(Number(d.value.valueAtOne()), 1), start: d.start, end: d.end };
    }
    if (this.isOp(t, '{')) return this.parseRationalAtom();
    if (t.kind === 'end') fail(`stray \`\\${command.text}\`: it needs ${what}, e.g. \`\\frac{1}{2}\``, command);
    fail(`\`\\${command.text}\` needs ${what} in braces here`, t);
  }

  private power(base: Spanned<Laurent>, exponent: Spanned<Rational>): Laurent {
    const r = exponent.value;
    const whole = { start: base.start, end: exponent.end };
    if (r.q === 1 && r.p >= 0) {
      const b = base.value;
      if (b.termCount > 1 && (r.p > MAX_EXPANDED_POWER || b.span * r.p > MAX_EXPANDED_SPAN))
        fail(`the power ${r.p} of a sum is too large to expand: write the polynomial out`, exponent);
      const reach = Math.max(Math.abs(b.minDegree ?? 0), Math.abs(b.maxDegree ?? 0)) * r.p;
      if (reach > MAX_EXPONENT) fail(`the exponent ${reach} is too large to be meant`, whole);
      return b.pow(r.p);
    }
    const b = base.value;
    if (b.isZero) fail(`zero cannot be raised to the power ${formatRational(r)}`, whole);
    if (b.termCount !== 1) {
      const kind = r.p < 0 ? 'negative' : 'fractional';
      fail(`${kind} power of a sum: only a single term can be raised to the power ${formatRational(r)}; multiply out and write the terms`, whole);
    }
    const [e, c] = b.terms()[0]!;
    if (r.q !== 1 && c !== 1n)
      fail(`the coefficient ${c} cannot be raised to the power ${formatRational(r)} exactly: write the coefficient outside`, base);
    if (r.q === 1 && c !== 1n && c !== -1n)
      fail(`${c} to the power ${formatRational(r)} is a fraction: invariant polynomials here have integer coefficients; write the terms out`, whole);
    const coefficient = r.q === 1 && c === -1n && r.p % 2 !== 0 ? -1n : 1n;
    if (e === 0) return Laurent.constant(coefficient);
    // e·r exactly, on the lattice of the variable's exponents.
    const variable = this.variable?.text ?? this.options.variables[0] ?? 't';
    const den = exponentDenominator(variable);
    const scaled = e * den; // an integer: e is on the lattice
    if ((scaled * r.p) % r.q !== 0) {
      const got = rational(scaled * r.p, r.q * den);
      fail(this.latticeMessage(variable, got), whole);
    }
    const product = (scaled * r.p) / r.q / den;
    if (Math.abs(product) > MAX_EXPONENT) fail(`the exponent ${product} is too large to be meant`, whole);
    return Laurent.monomial(product, coefficient);
  }

  private latticeMessage(variable: string, got: Rational): string {
    if (variable === 't')
      return `the exponent ${formatRational(got)} of t is not a multiple of 1/2: Jones polynomials have half-integer powers of t at most (a quarter power suggests A = t^{-1/4} was substituted into the bracket without the writhe factor)`;
    return `the exponent ${formatRational(got)} of ${variable} is not an integer: ${variable} takes integer powers only`;
  }
}

/** Reads a polynomial claim; throws InputError `claim-unreadable` with the offending span. */
export function readPolynomial(text: string, options: PolynomialReadOptions): ReadPolynomial {
  return new PolynomialParser(text, options).read();
}

/** Reads a number claim (`7`, `-3`, `5/2`, `\tfrac{5}{2}`); throws InputError `claim-unreadable`. */
export function readNumber(text: string, what: string, whole = false): Rational {
  return new PolynomialParser(text, { variables: [], what, whole }).readNumber();
}

const PLAIN_INTEGER = /^\s*([+\-−]?)\s*(\{?)\s*(\d+)\s*(\}?)\s*[.,;]?\s*$/;

/**
 * Reads an integer claim exactly, however large (a determinant): plain digits
 * with an optional sign become a BigInt directly; other forms go through
 * `readNumber` and must come out whole. Throws InputError `claim-unreadable`.
 */
export function readInteger(text: string, what: string): bigint {
  const plain = PLAIN_INTEGER.exec(text);
  if (plain && (plain[2] === '') === (plain[4] === '')) {
    const magnitude = BigInt(plain[3]!);
    return plain[1] === '' || plain[1] === '+' ? magnitude : -magnitude;
  }
  const r = readNumber(text, what, true);
  if (r.q !== 1) throw new InputError(UNREADABLE, `${what} is an integer, but the claim is ${r.p}/${r.q}`, { start: 0, end: text.length });
  return BigInt(r.p);
}
