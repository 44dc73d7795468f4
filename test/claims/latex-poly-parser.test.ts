import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readInteger, readNumber, readPolynomial } from '../../src/core/claims/latex-poly-parser.ts';
import { InputError } from '../../src/core/errors.ts';
import { Laurent } from '../../src/core/poly/laurent.ts';

const inT = { variables: ['t'], what: 'the Jones polynomial' };
const read = (text: string, variables: readonly string[] = ['t']) => readPolynomial(text, { variables });
const poly = (...terms: [number, number][]) => Laurent.fromTerms(terms);

/** The InputError thrown for `text`, or a failure when none is thrown. */
function refusal(text: string, options = inT): InputError {
  try {
    readPolynomial(text, options);
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error(`expected \`${text}\` to be refused`);
}

describe('reading polynomials as authors type them in LaTeX math (forms: common practice of the trade)', () => {
  const cases: [string, Laurent, string?][] = [
    // V(left trefoil), from memory.
    ['-t^{-4}+t^{-3}+t^{-1}', poly([-4, -1], [-3, 1], [-1, 1])],
    // V(figure-eight), from memory.
    ['t^{-2} - t^{-1} + 1 - t + t^2', poly([-2, 1], [-1, -1], [0, 1], [1, -1], [2, 1])],
    // V(positive Hopf link), from memory.
    ['-t^{1/2}-t^{5/2}', poly([0.5, -1], [2.5, -1])],
    ['-\\sqrt{t} - t^{\\frac{5}{2}}', poly([0.5, -1], [2.5, -1])],
    ['t^{\\frac52}', poly([2.5, 1])],
    ['t^\\frac52', poly([2.5, 1])],
    ['2t^3', poly([3, 2])],
    ['-(t^{1/2}+t^{-1/2})', poly([-0.5, -1], [0.5, -1])],
    ['(1-t)^2 t^{-1}', poly([-1, 1], [0, -2], [1, 1])],
    ['\\left( 1 - t \\right)^{2} \\cdot t^{-1}', poly([-1, 1], [0, -2], [1, 1])],
    ['t^{-1/2}', poly([-0.5, 1])],
    ['t^{-\\frac{1}{2}}', poly([-0.5, 1])],
    ['\\sqrt{t}^{3}', poly([1.5, 1])],
    ['\\frac{1}{\\sqrt{t}}', poly([-0.5, 1])],
    ['\\sqrt[2]{t}', poly([0.5, 1])],
    ['t^2', poly([2, 1])],
    ['t^{23}', poly([23, 1])],
    ['\\, t \\; + \\! {} 1 \\quad', poly([0, 1], [1, 1])],
    ['t\\cdot t \\times 3', poly([2, 3])],
    ['{t}^{2}+{}t', poly([1, 1], [2, 1])],
    ['\\frac{t^3 - 1}{t}', poly([-1, -1], [2, 1])],
    ['t − t^{2}', poly([1, 1], [2, -1])], // U+2212 minus sign
    ['0', Laurent.zero],
    ['t + t^3 - t^4.', poly([1, 1], [3, 1], [4, -1])], // sentence punctuation closing the formula
    ['V(t) = t + t^3 - t^4', poly([1, 1], [3, 1], [4, -1])], // a left-hand side is skipped
    ['V_{K}(t) = \\Delta = -t^{-1}', poly([-1, -1])],
    // A left-hand side may hold characters no value has (a prime, a semicolon) and may define with :=.
    ["V_{K'}(t) = t + t^3 - t^4", poly([1, 1], [3, 1], [4, -1])],
    ['V(K; t) := t', poly([1, 1])],
    ['V(t) \\coloneqq t^{2}', poly([2, 1])],
    // Every size of delimiter, and the invisible delimiters \left. and \right.
    ['\\Biggl( 1 - t \\Biggr)^2 \\bigg/ t', poly([-1, 1], [0, -2], [1, 1])],
    ['\\left. t + t^3 - t^4 \\right.', poly([1, 1], [3, 1], [4, -1])],
    // Values copied with their math delimiters, e.g. onto a command line.
    ['$t + t^3 - t^4$', poly([1, 1], [3, 1], [4, -1])],
    ['  $$-t^{1/2} - t^{5/2}$$ ', poly([0.5, -1], [2.5, -1])],
    ['\\(V(t) = t\\)', poly([1, 1])],
    ['$t + t^3 - t^4$.', poly([1, 1], [3, 1], [4, -1])],
    ['$t + t^3 - t^4.$', poly([1, 1], [3, 1], [4, -1])],
    // Unicode superscripts, as in prose: V(positive trefoil) = t + t³ − t⁴, from memory.
    ['t + t³ − t⁴', poly([1, 1], [3, 1], [4, -1])],
    ['−t⁻⁴ + t⁻³ + t⁻¹', poly([-4, -1], [-3, 1], [-1, 1])],
    ['t¹²', poly([12, 1])],
  ];
  for (const [text, expected] of cases) {
    it(`reads ${text}`, () => {
      expect(read(text).value.equals(expected)).toBe(true);
    });
  }
  it('reads brackets in A: -A^{-5} - A^{3}+A^{7}', () => {
    const r = read('-A^{-5} - A^{3}+A^{7}', ['A']);
    expect(r.variable).toBe('A');
    expect(r.value.equals(poly([-5, -1], [3, -1], [7, 1]))).toBe(true);
  });
  it('reads q-polynomials: q^{-1}+q^{-3}+q^{-5}-q^{-9}', () => {
    const r = read('q^{-1}+q^{-3}+q^{-5}-q^{-9}', ['q']);
    expect(r.variable).toBe('q');
    expect(r.value.equals(poly([-9, -1], [-5, 1], [-3, 1], [-1, 1]))).toBe(true);
  });
  it('reports no variable for a constant', () => {
    expect(read('1').variable).toBeUndefined();
  });
  it('reads numbers for degrees and spans', () => {
    expect(readNumber('-\\frac{5}{2}', 'the degree')).toEqual({ p: -5, q: 2 });
    expect(readNumber('7', 'the span')).toEqual({ p: 7, q: 1 });
    expect(readNumber('5/2', 'the degree')).toEqual({ p: 5, q: 2 });
    // Stated numbers may be large (a determinant); only exponents are capped.
    expect(readNumber('123456789', 'the determinant')).toEqual({ p: 123456789, q: 1 });
    expect(() => readNumber('99999999999999999999', 'the determinant')).toThrow(/too large to be read exactly/);
    expect(() => readPolynomial('t^{123456}', inT)).toThrow(/too large to be meant/);
    expect(() => readNumber('7x', 'the writhe')).toThrow(/unexpected `x`: the writhe is a number/);
  });
  it('says what a number is written with, and names a digit of another script, rather than describing a polynomial (a full-width ３ is U+FF13: Unicode, common practice)', () => {
    expect(() => readInteger('３', 'the determinant')).toThrow(/unexpected character `３` \(a digit of another script\): the determinant is written with the digits 0–9$/);
    expect(() => readNumber('½', 'the degree')).toThrow(/unexpected character `½`: the degree is written with the digits 0–9, a sign and a fraction such as `5\/2`$/);
    expect(() => readNumber('½', 'the degree')).not.toThrow(/polynomial/);
    expect(() => readPolynomial('t + ３', inT)).toThrow(/unexpected character `３` \(a digit of another script: write the digits 0–9\): a polynomial is made of integers/);
  });
});

describe('refusing unreadable claims with a located, compiler-style message', () => {
  const cases: [string, string, number, number, RegExp][] = [
    ['unbalanced brace', 't^{2', 2, 3, /unbalanced braces.*never closed/],
    ['unbalanced group', '{t + 1', 0, 1, /unbalanced braces/],
    ['extra closing brace', 't + 1}', 5, 6, /closes no/],
    // An unclosed exponent brace is reported as such, not as whatever the exponent swallowed (common practice: TeX braces must balance).
    ['an unclosed exponent brace before more terms', 't + t^{3 - t^4', 6, 7, /unbalanced braces: this `\{` is never closed/],
    ['an unclosed group brace inside the value', '-t^{1/2} - {t^{5/2}', 11, 12, /unbalanced braces: this `\{` is never closed/],
    ['stray \\frac', 't + \\frac', 4, 9, /stray `\\frac`/],
    ['non-integer coefficient', '1.5t + 1', 0, 3, /decimal `1.5`/],
    ['unknown variable', 'x^2 + 1', 0, 1, /unknown variable `x`.*written in t/],
    ['division by a non-monomial', '\\frac{1}{1+t}', 8, 13, /division by a non-monomial/],
    ['negative power of a sum', '(1+t)^{-1}', 0, 10, /negative power of a sum/],
    ['a third-power exponent', 't^{1/3}', 0, 7, /not a multiple of 1\/2/],
    ['a digit after an exponent', 't^23', 3, 4, /put a multi-digit exponent in braces/],
    ['an unbraced negative exponent', 't^-1', 1, 3, /must be braced/],
    ['an unknown command', 't + \\alpha', 4, 10, /unknown command `\\alpha`/],
    ['a fractional coefficient', '\\frac{t}{2}', 8, 11, /leaves a fraction/],
    ['a double superscript', 't^2^3', 3, 4, /double superscript/],
    ['an empty value', '   ', 0, 3, /empty/],
    ['two variables', 't + A', 4, 5, /unknown variable `A`/],
    ['a full stop inside the value', 't. + 1', 1, 2, /unexpected character `.`/],
    ['nothing after the equals sign', 'V(t) = ', 5, 6, /nothing follows `=`/],
    ['an error after a left-hand side, located in the whole text', 'V(t) = t + x', 11, 12, /unknown variable `x`/],
    ['a stray character after a left-hand side', "V_{K'}(t) = t'", 13, 14, /unexpected character `'`/],
    ['a value ending on a sign', 't + ', 4, 4, /ends too early after `\+`.*remove the last sign/],
    ['a caret without exponent', 't^', 1, 2, /missing: write it after the `\^`, e.g. `t\^\{2\}`/],
    ['a division by zero', '\\frac{t}{0}', 8, 11, /division by zero: .*correct the denominator/],
    ['a square root without radicand', 't + \\sqrt', 4, 9, /stray `\\sqrt`: it needs a radicand, e.g. `\\sqrt\{t\}`/],
    ['a cube root', '\\sqrt[3]{t}', 5, 8, /only square roots are read/],
    ['a variable in the wrong case', 'T + T^3', 0, 1, /variables are case-sensitive, and the Jones polynomial is written in t; write `t`/],
    ['a superscript sign without digits', 't⁻ + 1', 1, 2, /superscript `⁻` is not a whole exponent/],
    ['a superscript after an exponent', 't^2²', 3, 4, /double superscript/],
    ['an unmatched dollar', '$t + 1', 0, 1, /unexpected character `\$`/],
    ['two formulas', '$t$ + $t$', 0, 1, /unexpected character `\$`/],
  ];
  for (const [name, text, start, end, message] of cases) {
    it(`refuses ${name}: ${text}`, () => {
      const e = refusal(text);
      expect(e.ruleId).toBe('claim-unreadable');
      expect(e.span).toEqual({ start, end });
      expect(e.message).toMatch(message);
    });
  }
  it('refuses mixing two admitted variables', () => {
    const e = refusal('t + A', { variables: ['t', 'A'], what: 'the Jones polynomial' });
    expect(e.message).toMatch(/mixes the variables `t` and `A`/);
    expect(e.span).toEqual({ start: 4, end: 5 });
  });
  it('refuses half powers of A, whose exponents are integers (Kauffman 1987, from memory)', () => {
    const e = refusal('A^{1/2}', { variables: ['A'], what: 'the Kauffman bracket' });
    expect(e.message).toMatch(/not an integer/);
  });
});

describe('robustness (fast-check): any text is either read or refused with an InputError inside the text', () => {
  const pieces = ['t', 'A', 'q', 'x', '$', '²', '⁻', '¹', '1', '2', '9', '0', '+', '-', '^', '{', '}', '(', ')', '/', '\\frac', '\\sqrt', '\\cdot', '\\left(', '\\right)', '\\,', ' ', '.', '5', '_', '[', ']', '\\alpha', '{}', '^{64}', '^{-1}', '^{1/2}'];
  it('never throws anything else, and spans stay within the text', () => {
    fc.assert(
      fc.property(fc.array(fc.constantFrom(...pieces), { maxLength: 24 }), (parts) => {
        const text = parts.join('');
        try {
          readPolynomial(text, { variables: ['t', 'A'] });
        } catch (e) {
          expect(e).toBeInstanceOf(InputError);
          const span = (e as InputError).span!;
          expect(span.start).toBeGreaterThanOrEqual(0);
          expect(span.end).toBeLessThanOrEqual(text.length);
          expect(span.start).toBeLessThanOrEqual(span.end);
        }
      }),
      { numRuns: 3000 },
    );
  });
});

describe('number claims', () => {
  it('refuse a decimal with a fix in the terms of a number, not of polynomial coefficients', () => {
    try {
      readNumber('2.5', 'the span of the Jones polynomial');
      throw new Error('not refused');
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).message).toBe('the decimal `2.5` cannot be read: write the span of the Jones polynomial as an integer or a fraction such as `5/2`');
      expect((e as InputError).span).toEqual({ start: 0, end: 3 });
    }
  });
  it('refuse a decimal in an integer claim without suggesting a fraction, which such a value cannot be (common practice: writhe, components and crossing number are whole)', () => {
    for (const [text, what] of [['2.5', 'the writhe'], ['1.5', 'the number of components']] as const) {
      try {
        readInteger(text, what);
        throw new Error('not refused');
      } catch (e) {
        expect(e).toBeInstanceOf(InputError);
        expect((e as InputError).message).toBe(`the decimal \`${text}\` cannot be read: write ${what} as an integer`);
        expect((e as InputError).span).toEqual({ start: 0, end: 3 });
      }
    }
  });
  it('skip a left-hand side holding a decimal, as it is not part of the value', () => {
    expect(read('V_{1.5}(t) = t').value.equals(poly([1, 1]))).toBe(true);
  });
});

describe('integer claims are exact at any size', () => {
  it('reads plain and braced integers as BigInt, beyond 2^53', () => {
    expect(readInteger('123456789012345678901234567890', 'the determinant')).toBe(123456789012345678901234567890n);
    expect(readInteger(' −{42} ', 'the writhe')).toBe(-42n);
    expect(readInteger('\\frac{8}{2}', 'the writhe')).toBe(4n);
    expect(() => readInteger('5/2', 'the writhe')).toThrow(/is an integer, but the claim is 5\/2/);
  });
});
