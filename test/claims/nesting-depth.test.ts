/**
 * A claim with brackets nested some 1,800 deep used to overflow the claim parser's recursion (an internal error,
 * exit 3, losing every other report). The depth is bounded with a located `claim-unreadable` error, on every path
 * a claim text takes: prose, fence attributes and table cells (Markdown), \skeinclaim, skeincode options and skein
 * table cells (LaTeX), and compute --claim.
 */
import { describe, expect, it } from 'vitest';
import { MAX_NESTING, readNumber, readPolynomial } from '../../src/core/claims/latex-poly-parser.ts';
import { readCrossingNumberClaim } from '../../src/core/claims/crossing-number.ts';
import { InputError } from '../../src/core/errors.ts';
import { DEFAULT_CONVENTION } from '../../src/core/convention/convention.ts';
import { runSession } from '../../src/core/manuscript/session.ts';
import { readLatexManuscript } from '../../plugins/latex/reader.ts';
import { memoryFiles } from '../latex/support.ts';
import { processMarkdown } from '../markdown/helpers.ts';
import { skeinproof } from '../markdown/cli.ts';

const DEEP = 1800;
const nested = (open: string, close: string, inner: string, depth = DEEP) => `${open.repeat(depth)}${inner}${close.repeat(depth)}`;

function refusal(read: () => unknown): InputError {
  try {
    read();
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error('expected a refusal');
}

describe('the claim parser bounds its nesting depth', () => {
  it('refuses the first bracket past the limit, for every kind of bracket and reader', () => {
    for (const [open, close] of [['(', ')'], ['{', '}'], ['[', ']']] as const) {
      const text = nested(open, close, 't');
      const e = refusal(() => readPolynomial(text, { variables: ['t'] }));
      expect(e.ruleId).toBe('claim-unreadable');
      expect(e.span).toEqual({ start: MAX_NESTING, end: MAX_NESTING + 1 });
      expect(e.message).toMatch(/nested more than 100 deep/);
    }
    expect(refusal(() => readPolynomial(`t^${nested('{', '}', '2')}`, { variables: ['t'] })).span).toEqual({ start: 2 + MAX_NESTING, end: 3 + MAX_NESTING });
    expect(refusal(() => readNumber(nested('(', ')', '7'), 'the writhe')).message).toMatch(/nested more than/);
    expect(refusal(() => readCrossingNumberClaim(`\\le ${nested('{', '}', '7')}`)).message).toMatch(/nested more than/);
    // \frac inside \frac nests through the braces of its arguments.
    expect(refusal(() => readPolynomial(nested('\\frac{1}{', '}', 't', 200), { variables: ['t'] })).message).toMatch(/nested more than/);
  });

  it('still reads values nested up to the limit', () => {
    expect(readPolynomial(nested('(', ')', 't', MAX_NESTING), { variables: ['t'] }).value.toString()).toBe(readPolynomial('t', { variables: ['t'] }).value.toString());
  });
});

describe('every front end reports a deep claim where it is written and goes on', () => {
  const deepJones = nested('(', ')', 't');

  it('Markdown: prose, a fence attribute and a table cell', async () => {
    const text = [
      '```skein id=k notation=braid jones=' + deepJones,
      '1 1 1',
      '```',
      '',
      `Prose :jones[$${deepJones}$]{of=k} and :writhe[$4$]{of=k}.`,
      '',
      ':::invariants',
      '| diagram | jones |',
      '|---|---|',
      `| k | $${deepJones}$ |`,
      ':::',
      '',
    ].join('\n');
    const r = await processMarkdown(text);
    const unreadable = r.diagnostics.filter((d) => d.ruleId === 'claim-unreadable');
    expect(unreadable.map((d) => d.location?.start.line)).toEqual([1, 5, 10]);
    for (const d of unreadable) expect(d.message).toMatch(/nested more than 100 deep/);
    // The other claim on line 5 is still judged (writhe 3, not 4).
    expect(r.diagnostics.some((d) => d.ruleId === 'claim-contradicted' && d.location?.start.line === 5)).toBe(true);
  });

  it('LaTeX: \\skeinclaim, a skeincode option and a skein table cell', () => {
    const doc = readLatexManuscript(
      '/paper/paper.tex',
      memoryFiles({
        'paper.tex': [
          '\\documentclass{article}',
          '\\usepackage{skeinproof}',
          '\\begin{document}',
          `\\begin{skeincode}{id=k, notation=braid, jones={${deepJones}}}`,
          '1 1 1',
          '\\end{skeincode}',
          `We claim $\\skeinclaim{k}{jones}{${deepJones}}$.`,
          '\\begin{skeintable}{id, jones}',
          '\\begin{tabular}{ll}',
          'Diagram & $V$ \\\\',
          `k & $${deepJones}$ \\\\`,
          '\\end{tabular}',
          '\\end{skeintable}',
          '\\end{document}',
          '',
        ].join('\n'),
      }),
    );
    const session = runSession({ diagrams: doc.diagrams, claims: doc.claims, fills: doc.fills.map((f) => f.entry), convention: DEFAULT_CONVENTION });
    const unreadable = session.diagnostics.filter((d) => d.ruleId === 'claim-unreadable');
    expect(unreadable.map((d) => d.location?.start.line)).toEqual([4, 7, 11]);
    for (const d of unreadable) expect(d.message).toMatch(/nested more than 100 deep/);
  });

  it('compute --claim: a located error and exit status 2, not an internal error', () => {
    const r = skeinproof(['compute', '-n', 'braid', '1 1 1', '--claim', `jones=${deepJones}`, '--claim', 'writhe=3']);
    expect(r.status).toBe(2);
    expect(r.stdout + r.stderr).toMatch(/<code 1 claim 1>:1:\d+: error: brackets nested more than 100 deep/);
    expect(r.stderr + r.stdout).not.toMatch(/internal error/);
  });
});
