/**
 * LaTeX for computed values in the document's convention: term order, half
 * powers as t^{1/2} or \sqrt{t}, the Jones variable and the bracket
 * normalisation. Every formula is valid KaTeX and reads back through
 * `readPolynomial` to the same polynomial.
 */
import { toFraction, type Laurent } from '../poly/laurent.ts';
import type { Convention, HalfPowerStyle, TermOrder } from '../convention/convention.ts';
import { conventionBracket, conventionJones, jonesLetter } from '../convention/convert.ts';
import type { DiagramReport } from '../analyze/report.ts';

export interface PolynomialStyle {
  readonly order: TermOrder;
  readonly halfPowers: HalfPowerStyle;
}

export function styleOf(convention: Convention): PolynomialStyle {
  return { order: convention.termOrder, halfPowers: convention.halfPowers };
}

/** `x^{e}` as LaTeX, for an exponent e ≠ 0 (power style). */
function powerLatex(variable: string, e: number): string {
  if (e === 1) return variable;
  if (Number.isInteger(e)) return e >= 0 && e < 10 ? `${variable}^${e}` : `${variable}^{${e}}`;
  const [p, q] = toFraction(e);
  return `${variable}^{${p}/${q}}`;
}

/** One term without its sign: |c|·x^e. */
function termLatex(variable: string, e: number, abs: bigint, halfPowers: HalfPowerStyle): string {
  const coefficient = abs === 1n ? '' : abs.toString();
  if (e === 0) return abs.toString();
  const isHalf = !Number.isInteger(e) && Number.isInteger(2 * e);
  if (halfPowers === 'root' && isHalf) {
    const whole = Math.floor(Math.abs(e));
    const root = `\\sqrt{${variable}}`;
    const prefix = whole === 0 ? '' : powerLatex(variable, whole);
    if (e > 0) return `${coefficient}${prefix}${root}`;
    return `\\frac{${abs}}{${prefix}${root}}`;
  }
  return `${coefficient}${powerLatex(variable, e)}`;
}

export function polynomialLatex(p: Laurent, variable: string, style: PolynomialStyle): string {
  if (p.isZero) return '0';
  const terms = p.terms();
  if (style.order === 'descending') terms.reverse();
  return terms
    .map(([e, c], i) => {
      const negative = c < 0n;
      const body = termLatex(variable, e, negative ? -c : c, style.halfPowers);
      if (i === 0) return negative ? `-${body}` : body;
      return `${negative ? ' - ' : ' + '}${body}`;
    })
    .join('');
}

/** The Jones polynomial of the report, in the convention. */
export function jonesLatex(report: DiagramReport, convention: Convention): string {
  return polynomialLatex(conventionJones(report.jones, convention), jonesLetter(convention.jonesVariable), styleOf(convention));
}

export function bracketLatex(report: DiagramReport, convention: Convention): string {
  return polynomialLatex(conventionBracket(report.bracket, convention), 'A', styleOf(convention));
}

/** A number as LaTeX: integers plain, halves as \tfrac. */
export function numberLatex(n: number): string {
  if (Number.isInteger(n)) return `${n}`;
  const [p, q] = toFraction(n);
  return `${p < 0 ? '-' : ''}\\tfrac{${Math.abs(p)}}{${q}}`;
}
