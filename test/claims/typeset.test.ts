/**
 * Every generated formula must be valid KaTeX (checked with katex itself,
 * throwOnError) and read back to the value typeset.
 */
import { describe, expect, it } from 'vitest';
import katex from 'katex';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import type { DiagramReport } from '../../src/core/analyze/report.ts';
import { DEFAULT_CONVENTION, type Convention, type JonesVariable } from '../../src/core/convention/convention.ts';
import { conventionBracket, conventionJones, jonesLetter } from '../../src/core/convention/convert.ts';
import { readPolynomial } from '../../src/core/claims/latex-poly-parser.ts';
import { FILL_KEYS, inapplicableBecause, typesetValue, type Typeset } from '../../src/core/claims/index.ts';
import { rng, randomDiagram } from '../support/random-diagrams.ts';

function renders(latex: string): void {
  expect(() => katex.renderToString(latex, { throwOnError: true })).not.toThrow();
}

/** Inline math of a text fill: the pieces between single dollars. */
function inlineMath(text: string): string[] {
  const pieces = text.split('$');
  expect(pieces.length % 2).toBe(1); // balanced dollars
  return pieces.filter((_, i) => i % 2 === 1);
}

function checkTypeset(t: Typeset): void {
  if (t.kind === 'math') renders(t.latex);
  else for (const m of inlineMath(t.text)) renders(m);
}

const named: [string, DiagramReport][] = [
  ['positive trefoil', analyzeDiagram(closeBraid([1, 1, 1], 2))],
  ['positive Hopf link', analyzeDiagram(closeBraid([1, 1], 2))],
  ['figure-eight', analyzeDiagram(closeBraid([1, -2, 1, -2], 3))],
  ['a 3-component link', analyzeDiagram(closeBraid([1, 1, 2, 2], 3))],
  ['a non-reduced trefoil', analyzeDiagram(closeBraid([1, 1, 1, 2], 3))],
  ['an undecided diagram', analyzeDiagram(closeBraid([1, 1, 1, -2, -1, -1, -1, -2], 3))],
  ['a split diagram', analyzeDiagram(closeBraid([1, 1, 1], 3))],
];
const random = rng(20261201);
for (let i = 0; i < 12; i++) named.push([`random diagram ${i}`, analyzeDiagram(randomDiagram(random, 9, 4))]);

const conventions: Convention[] = [];
for (const jonesVariable of ['t', 't-inverse', 'q', 'q-graded'] as JonesVariable[])
  for (const bracketNormalization of ['unit', 'loop'] as const)
    for (const termOrder of ['ascending', 'descending'] as const)
      for (const halfPowers of ['power', 'root'] as const)
        conventions.push({ ...DEFAULT_CONVENTION, jonesVariable, bracketNormalization, termOrder, halfPowers });

describe('typeset polynomials are valid KaTeX and read back to the same value', () => {
  for (const [name, report] of named) {
    it(name, () => {
      for (const convention of conventions) {
        const jones = typesetValue('jones', report, convention);
        const bracket = typesetValue('bracket', report, convention);
        if (jones.kind !== 'math' || bracket.kind !== 'math') throw new Error('polynomials typeset as math');
        renders(jones.latex);
        renders(bracket.latex);
        const letter = jonesLetter(convention.jonesVariable);
        expect(readPolynomial(jones.latex, { variables: [letter] }).value.equals(conventionJones(report.jones, convention))).toBe(true);
        expect(readPolynomial(bracket.latex, { variables: ['A'] }).value.equals(conventionBracket(report.bracket, convention))).toBe(true);
      }
    });
  }
});

describe('layout in the declared convention', () => {
  const hopf = named[1]![1];
  const tref = named[0]![1];
  it('ascending and descending term order (positive trefoil, t + t³ − t⁴, from memory)', () => {
    expect(typesetValue('jones', tref, DEFAULT_CONVENTION)).toEqual({ kind: 'math', latex: 't + t^3 - t^4' });
    expect(typesetValue('jones', tref, { ...DEFAULT_CONVENTION, termOrder: 'descending' })).toEqual({ kind: 'math', latex: '-t^4 + t^3 + t' });
  });
  it('half powers as powers or roots (positive Hopf link, −t^{1/2} − t^{5/2}, from memory)', () => {
    expect(typesetValue('jones', hopf, DEFAULT_CONVENTION)).toEqual({ kind: 'math', latex: '-t^{1/2} - t^{5/2}' });
    expect(typesetValue('jones', hopf, { ...DEFAULT_CONVENTION, halfPowers: 'root' })).toEqual({ kind: 'math', latex: '-\\sqrt{t} - t^2\\sqrt{t}' });
    expect(typesetValue('jones', hopf, { ...DEFAULT_CONVENTION, halfPowers: 'root', jonesVariable: 't-inverse' })).toEqual({
      kind: 'math',
      latex: '-\\frac{1}{t^2\\sqrt{t}} - \\frac{1}{\\sqrt{t}}',
    });
  });
});

describe('statements and every fill key', () => {
  for (const [name, report] of named.slice(0, 7)) {
    it(`${name}: every supported fill typesets to valid KaTeX`, () => {
      for (const convention of [DEFAULT_CONVENTION, { ...DEFAULT_CONVENTION, jonesVariable: 'q' as const }]) {
        for (const key of FILL_KEYS) {
          if (inapplicableBecause(key, report) !== undefined) continue; // a linking number of a knot
          checkTypeset(typesetValue(key, report, convention));
          checkTypeset(typesetValue(key, report, convention, { compact: true }));
        }
      }
    });
  }
  it('states the Kauffman–Murasugi–Thistlethwaite argument for the reduced alternating trefoil', () => {
    const s = typesetValue('statement', named[0]![1], DEFAULT_CONVENTION);
    expect(s.kind).toBe('text');
    if (s.kind !== 'text') return;
    expect(s.text).toContain('$\\operatorname{span} V = 3$');
    expect(s.text).toContain('reduced, alternating and connected');
    expect(s.text).toContain('Kauffman–Murasugi–Thistlethwaite');
    expect(s.text).toContain('crossing number is $3$');
  });
  it('states the split-link span bound as span V − (μ − 1), not as span V (the bound for possibly split links, from memory)', () => {
    const report = analyzeDiagram(closeBraid([-2, -1, 2, -1, 2, -1, -2, -2], 3));
    expect(report.crossingNumber.reasons.find((r) => r.bound === 'lower')?.theorem).toBe('split-span-bound');
    const s = typesetValue('statement', report, DEFAULT_CONVENTION);
    expect(s.kind === 'text' && s.text).toContain(
      `Here $\\operatorname{span} V = ${report.span}$ and the link has $3$ components, so by the span bound for possibly split links the crossing number is at least $\\operatorname{span} V - (3 - 1) = ${report.span - 2}$`,
    );
    checkTypeset(s);
    const inQ = typesetValue('statement', report, { ...DEFAULT_CONVENTION, jonesVariable: 'q' });
    checkTypeset(inQ);
    expect(inQ.kind === 'text' && inQ.text).toContain(`(that is, $${2 * report.span}$ in $q$)`);
    expect(inQ.kind === 'text' && inQ.text).toContain(`$\\operatorname{span}_t V - (3 - 1) = ${report.span - 2}$`);
  });
  it('is honest when only bounds are known', () => {
    const report = named[5]![1];
    const { lower, upper } = report.crossingNumber;
    const s = typesetValue('statement', report, DEFAULT_CONVENTION);
    expect(s.kind === 'text' && s.text).toMatch(new RegExp(`at least \\$${lower}\\$.*at most \\$${upper}\\$.*do not meet`));
    expect(typesetValue('crossing-number', report, DEFAULT_CONVENTION)).toEqual({ kind: 'text', text: `between $${lower}$ and $${upper}$` });
  });
});
