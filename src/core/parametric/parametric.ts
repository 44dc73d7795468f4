/**
 * Closed formulas with one free parameter: a family code written with a
 * parameter (`torus 2 n`), the values it runs over (`n=3..25 step 2`), and
 * claims written as the paper's formula in that parameter, checked instance by
 * instance. The parameter may stand in exponents (`t^{(n-1)/2}`), in
 * coefficients (`(n+1)t`) and in an exact quotient (`\frac{1 - t^{n+1}}{1 - t^2}`,
 * as in Jones' torus-knot formula). This checks the instances listed, never
 * the formula for every value.
 */
import { InputError } from '../errors.ts';
import { readPolynomial } from '../claims/latex-poly-parser.ts';
import { polynomialLatex } from '../claims/typeset.ts';
import type { Judgement } from '../claims/api.ts';
import type { DiagramReport } from '../analyze/report.ts';

export const PARAMETER_INVALID = 'parameter-invalid';

/** A formula whose quotient does not divide exactly at some value: the formula is wrong there. */
class InexactQuotient extends Error {}

/** Values tried when the setting names the parameter only. */
export const DEFAULT_VALUES = Array.from({ length: 12 }, (_, i) => i + 1);
const MAX_VALUES = 200;
/** Letters that are variables of the polynomials, never parameters. */
const RESERVED = new Set(['t', 'A', 'q', 'z', 'x', 'e', 'c', 'V']);

export interface Parameter {
  readonly name: string;
  readonly values: readonly number[];
}

function parameterError(message: string, text: string): InputError {
  return new InputError(PARAMETER_INVALID, message, { start: 0, end: text.length });
}

/**
 * The setting `NAME` (the values 1 … 12), or `NAME=LIST` where LIST holds
 * integers and ranges `a..b`, separated by commas, optionally followed by
 * `step s` (every s-th value of the ranges): `n=3..25 step 2`, `k=2,4,7..9`.
 */
export function readParameter(text: string): Parameter {
  const m = /^\s*([a-zA-Z])\s*(?:=\s*(.*?))?\s*$/.exec(text);
  if (!m) throw parameterError(`"${text}" does not name a parameter: write one letter and its values, e.g. for="n=3..25 step 2" (or just for=n for the values 1 to 12)`, text);
  const name = m[1]!;
  if (RESERVED.has(name)) throw parameterError(`"${name}" is a variable of the polynomials (or of the crossing number c), so it cannot be the parameter: use another letter such as n, k or m`, text);
  if (m[2] === undefined) return { name, values: DEFAULT_VALUES };
  const stepMatch = /^(.*?)\s+step\s+(\d+)$/.exec(m[2]);
  const list = stepMatch ? stepMatch[1]! : m[2];
  const step = stepMatch ? Number(stepMatch[2]) : 1;
  if (step < 1) throw parameterError('the step must be at least 1', text);
  const values: number[] = [];
  for (const item of list.split(',').map((x) => x.trim())) {
    const range = /^([+\-−]?\d+)\s*\.\.\s*([+\-−]?\d+)$/.exec(item);
    const single = /^[+\-−]?\d+$/.exec(item);
    const int = (s: string) => Number(s.replace('−', '-'));
    if (range) {
      const [a, b] = [int(range[1]!), int(range[2]!)];
      if (b < a) throw parameterError(`the range ${item} is empty: write the smaller end first`, text);
      if ((b - a) / step + 1 > MAX_VALUES) throw parameterError(`the range ${item} has more than ${MAX_VALUES} values`, text);
      for (let v = a; v <= b; v += step) values.push(v);
    } else if (single) values.push(int(item));
    else throw parameterError(`"${item}" is not a value or a range: write whole numbers and ranges such as 3..25, separated by commas`, text);
  }
  if (values.length > MAX_VALUES) throw parameterError(`more than ${MAX_VALUES} values`, text);
  return { name, values: [...new Set(values)] };
}

/** Exact rationals for the arithmetic of parameters. */
type Fraction = [bigint, bigint];

function normal([p, q]: Fraction): Fraction {
  if (q === 0n) throw new RangeError('division by zero');
  const g = gcd(p < 0n ? -p : p, q < 0n ? -q : q) || 1n;
  const s = q < 0n ? -1n : 1n;
  return [(s * p) / g, (s * q) / g];
}
function gcd(a: bigint, b: bigint): bigint {
  while (b !== 0n) [a, b] = [b, a % b];
  return a;
}

/**
 * Evaluates integer arithmetic: numbers, + − · * /, parentheses and braces,
 * |…| and implicit multiplication (`2(3+1)`). Returns undefined when the text
 * is not such an expression (it holds a variable, say).
 */
export function evaluateArithmetic(text: string): Fraction | undefined {
  const src = text.replace(/\\cdot|\\times/g, '*').replace(/\\left|\\right/g, '').replace(/−/g, '-').replace(/\s+/g, '');
  if (src === '' || !/^[\d+\-*/(){}|]+$/.test(src)) return undefined;
  let at = 0;
  const fail = (): never => {
    throw new Error('not arithmetic');
  };
  const sum = (): Fraction => {
    let v = product();
    while (src[at] === '+' || src[at] === '-') {
      const op = src[at++];
      const w = product();
      v = normal(op === '+' ? [v[0] * w[1] + w[0] * v[1], v[1] * w[1]] : [v[0] * w[1] - w[0] * v[1], v[1] * w[1]]);
    }
    return v;
  };
  const product = (): Fraction => {
    let v = unary();
    for (;;) {
      const ch = src[at];
      if (ch === '*' || ch === '/') {
        at++;
        const w = unary();
        v = normal(ch === '*' ? [v[0] * w[0], v[1] * w[1]] : [v[0] * w[1], v[1] * w[0]]);
      } else if (ch !== undefined && /[\d({]/.test(ch)) {
        const w = unary();
        v = normal([v[0] * w[0], v[1] * w[1]]);
      } else return v;
    }
  };
  const unary = (): Fraction => {
    if (src[at] === '-') {
      at++;
      const v = unary();
      return [-v[0], v[1]];
    }
    if (src[at] === '+') {
      at++;
      return unary();
    }
    return primary();
  };
  const primary = (): Fraction => {
    const ch = src[at];
    if (ch === '(' || ch === '{') {
      at++;
      const v = sum();
      if (src[at] !== (ch === '(' ? ')' : '}')) fail();
      at++;
      return v;
    }
    if (ch === '|') {
      at++;
      const v = sum();
      if (src[at] !== '|') fail();
      at++;
      return [v[0] < 0n ? -v[0] : v[0], v[1]];
    }
    const digits = /^\d+/.exec(src.slice(at));
    if (!digits) return fail();
    at += digits[0].length;
    return [BigInt(digits[0]), 1n];
  };
  try {
    const v = sum();
    return at === src.length ? v : undefined;
  } catch {
    return undefined;
  }
}

/** Replaces each standalone occurrence of the parameter (not part of a word or a command) by `{value}`. */
export function substituteParameter(text: string, name: string, value: number): string {
  return text.replace(/\\[a-zA-Z]+|[a-zA-Z]+/g, (word) => (word === name ? `{${value}}` : word));
}

/** The family code at one value: every token holding the parameter is evaluated to a whole number (fractions p/q side by side). */
export function codeAt(code: string, parameter: Parameter, value: number): string {
  return code.replace(/[^\s,()]+/g, (token) => {
    if (!new RegExp(`(^|[^a-zA-Z])${parameter.name}([^a-zA-Z]|$)`).test(token)) return token;
    return token
      .split('/')
      .map((part) => {
        const v = evaluateArithmetic(substituteParameter(part, parameter.name, value));
        if (!v || v[1] !== 1n) throw new InputError('code-invalid', `"${token}" is not a whole number at ${parameter.name} = ${value}: a parameter in a code must give whole numbers`, undefined);
        return v[0].toString();
      })
      .join('/');
  });
}

function formatFraction([p, q]: Fraction): string {
  return q === 1n ? `${p}` : `${p}/${q}`;
}

/** Index of the brace closing the one opened at `open`, or -1. */
function closingBrace(text: string, open: number): number {
  let depth = 0;
  for (let i = open; i < text.length; i++) {
    if (text[i] === '{') depth++;
    else if (text[i] === '}' && --depth === 0) return i;
  }
  return -1;
}

/**
 * The claim at one value of the parameter: the parameter substituted, every
 * exponent that became plain arithmetic evaluated, every quotient
 * `\frac{P}{Q}` of polynomials divided out exactly (an InputError when Q does
 * not divide P at this value), and a value that is plain arithmetic as a whole
 * evaluated. The result is an ordinary claim.
 */
export function claimAt(text: string, parameter: Parameter, value: number): string {
  let s = substituteParameter(text, parameter.name, value);
  // Exponents: ^{…} holding only arithmetic.
  for (let i = s.indexOf('^{'); i >= 0; i = s.indexOf('^{', i + 1)) {
    const end = closingBrace(s, i + 1);
    if (end < 0) break;
    const v = evaluateArithmetic(s.slice(i + 2, end));
    if (v) s = `${s.slice(0, i)}^{${formatFraction(v)}}${s.slice(end + 1)}`;
  }
  // Exact quotients of polynomials.
  const FRAC = /\\[dt]?frac\{/g;
  for (let m = FRAC.exec(s); m; m = FRAC.exec(s)) {
    const i = m.index;
    const open1 = i + m[0].length - 1;
    const close1 = closingBrace(s, open1);
    if (close1 < 0 || s[close1 + 1] !== '{') continue;
    const close2 = closingBrace(s, close1 + 1);
    if (close2 < 0) continue;
    const [top, bottom] = [s.slice(open1 + 1, close1), s.slice(close1 + 2, close2)];
    const options = { variables: ['t', 'A', 'q', 'z'], what: 'a formula' };
    let divisor;
    let dividend;
    try {
      divisor = readPolynomial(bottom, options);
      dividend = readPolynomial(top, options);
    } catch {
      continue; // not a quotient of polynomials: left to the claim's own reader
    }
    if (divisor.variable === undefined || divisor.value.termCount < 2) continue;
    let quotient;
    try {
      quotient = dividend.value.divExact(divisor.value);
    } catch {
      throw new InexactQuotient(`the quotient \\frac{${top}}{${bottom}} does not divide exactly at ${parameter.name} = ${value}, so the formula gives no Laurent polynomial there`);
    }
    s = `${s.slice(0, i)}(${polynomialLatex(quotient, divisor.variable, { order: 'ascending', halfPowers: 'power' })})${s.slice(close2 + 1)}`;
    FRAC.lastIndex = i + 1;
  }
  // A value that is arithmetic as a whole (a determinant |2n+1|): after a left-hand side, if any.
  const eq = s.lastIndexOf('=');
  const lhs = eq >= 0 ? s.slice(0, eq + 1) : '';
  const rhs = (eq >= 0 ? s.slice(eq + 1) : s).replace(/^\s*\$+|\$+\s*$/g, '');
  const whole = evaluateArithmetic(rhs);
  if (whole) return `${lhs.replace(/^\s*\$+/, '')}${formatFraction(whole)}`;
  return s;
}

/** Diagrams of a family code at each value of its parameter (built on demand by the session). */
export interface ParametricDiagram {
  readonly parameter: Parameter;
  /** One report per value, in the order of `parameter.values`. */
  readonly reports: readonly DiagramReport[];
}

/**
 * Builds the diagram at every value; the first value whose code is refused
 * makes the whole family refused (the error names the value).
 */
export function buildInstances(code: string, parameter: Parameter, build: (code: string) => DiagramReport): ParametricDiagram {
  const reports = parameter.values.map((v) => {
    try {
      return build(codeAt(code, parameter, v));
    } catch (e) {
      if (e instanceof InputError) throw new InputError(e.ruleId, `at ${parameter.name} = ${v}: ${e.message}`, undefined, e.hints);
      throw e;
    }
  });
  return { parameter, reports };
}

export interface InstanceVerdict {
  /** The judgement at the first value where the claim does not plainly agree, or at the last value when it agrees everywhere. */
  readonly judgement: Judgement;
  /** The value of that judgement; undefined when every value agreed. */
  readonly failingValue?: number;
  readonly checked: readonly number[];
}

/** Judges the formula at each value in turn and stops at the first value where it does not plainly agree. */
export function judgeInstances(family: ParametricDiagram, text: string, judge: (text: string, report: DiagramReport) => Judgement): InstanceVerdict {
  const { parameter, reports } = family;
  let last: Judgement | undefined;
  for (let i = 0; i < reports.length; i++) {
    const v = parameter.values[i]!;
    let judgement: Judgement;
    try {
      judgement = judge(claimAt(text, parameter, v), reports[i]!);
    } catch (e) {
      if (e instanceof InexactQuotient) {
        const failed: Judgement = { key: '', claimed: text, verdict: 'contradicts', reason: e.message, computed: '' };
        return { judgement: failed, failingValue: v, checked: parameter.values.slice(0, i + 1) };
      }
      if (e instanceof InputError && !e.message.startsWith(`at ${parameter.name} =`)) {
        throw new InputError(e.ruleId, `at ${parameter.name} = ${v}: ${e.message}`, undefined, e.hints);
      }
      throw e;
    }
    if (judgement.verdict !== 'agrees' || judgement.warning !== undefined) return { judgement, failingValue: v, checked: parameter.values.slice(0, i + 1) };
    last = judgement;
  }
  return { judgement: last!, checked: parameter.values };
}

/** "3, 5, …, 25" for the values checked. */
export function listValues(values: readonly number[]): string {
  if (values.length <= 6) return values.join(', ');
  return `${values.slice(0, 3).join(', ')}, …, ${values[values.length - 1]}`;
}
