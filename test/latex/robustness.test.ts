/**
 * The reader never crashes on malformed LaTeX: every problem becomes a
 * located diagnostic inside the file (property test with fast-check over
 * random mixes of markup fragments), and the package file and the reader
 * agree on the names of keys and macros.
 */
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { readLatexManuscript } from '../../plugins/latex/reader.ts';
import { FILL_SHORTCUTS } from '../../plugins/latex/scanner.ts';
import { CLAIM_KEYS } from '../../src/core/claims/index.ts';
import { memoryFiles, PACKAGE_FILE } from './support.ts';

const FRAGMENTS = [
  '\\begin{skeincode}{id=a, notation=braid}', '\\begin{skeincode}{', '\\end{skeincode}', '1 1 1', '(1,1,2,2)', '4 6 2',
  '\\skeinjones{a}', '\\skeinjones{', '\\skeinvalue{a}{span}', '\\skeinclaim{a}{jones}{t+t^3-t^4}', '\\skeinclaim{a}',
  '\\begin{skeintable}{id, jones}', '\\begin{tabular}{ll}', '\\end{tabular}', '\\end{skeintable}', ' & ', '\\\\', '\\hline',
  '\\begin{skeingrid}{a}', '\\begin{skeingrid}[rows=homological, values=groups]{', '\\end{skeingrid}', '-3', '$\\mathbb{Z}/2$', '.',
  '\\input{x}', '\\input{../y}', '\\include{', '\\skeinconvention{jones=q}', '\\verb|', '\\begin{verbatim}', '\\end{verbatim}',
  '%', '\\%', '$', '$$', '\\(', '\\]', '{', '}', '[', ']', '=', ',', '\n', ' ', 'text', '\\', '\\begin{equation}', '\\end{equation}',
];

describe('malformed input', () => {
  it('is reported, never thrown, and every location lies inside its file', () => {
    fc.assert(
      fc.property(fc.array(fc.constantFrom(...FRAGMENTS), { maxLength: 40 }), fc.array(fc.constantFrom(...FRAGMENTS), { maxLength: 10 }), (main, included) => {
        const files = { 'paper.tex': main.join(''), 'x.tex': included.join('') };
        const doc = readLatexManuscript('/paper/paper.tex', memoryFiles(files));
        for (const d of doc.diagnostics) {
          const file = d.location!.file === '/paper/paper.tex' ? files['paper.tex'] : files['x.tex'];
          expect(d.location!.start.offset!).toBeGreaterThanOrEqual(0);
          expect(d.location!.start.offset!).toBeLessThanOrEqual(file.length);
          expect(d.message.length).toBeGreaterThan(10);
        }
        for (const d of doc.diagrams) expect(() => d.locateCode({ start: 0, end: 1 })).not.toThrow();
      }),
      { numRuns: 300 },
    );
  });
});

describe('the package file and the reader', () => {
  const sty = readFileSync(PACKAGE_FILE, 'utf8');

  it('accept the same keys in \\begin{skeincode}{…}', () => {
    const list = /\\def\\skein@claimkeys\{([^}]*)\}/.exec(sty.replace(/%\n\s*/g, ''))![1]!.split(',');
    expect(list).toEqual(['id', 'notation', 'strands', 'part-signs', 'for', ...CLAIM_KEYS]);
  });

  it('accept the same options of \\begin{skeingrid}[…]', () => {
    const keys = [...sty.matchAll(/\\define@key\{skein@grid\}\{([a-z-]+)\}/g)].map((m) => m[1]);
    expect(keys).toEqual(['head', 'rows', 'values']);
    const grid = `\\begin{skeingrid}[${keys.map((k) => `${k}=${k === 'head' ? 1 : k === 'rows' ? 'quantum' : 'ranks'}`).join(', ')}]{a}\\begin{tabular}{ll} & 0 \\\\ 1 & \\end{tabular}\\end{skeingrid}`;
    const doc = readLatexManuscript('/paper/paper.tex', memoryFiles({ 'paper.tex': grid }));
    expect(doc.diagnostics).toEqual([]);
  });

  it('define the same fill-in shortcuts', () => {
    const defined = [...sty.matchAll(/\\DeclareRobustCommand\*\\(skein[a-z]+)\[1\]\{\\skein@fill\{#1\}\{([a-z-]+)\}\}/g)].map((m) => [m[1], m[2]]);
    expect(Object.fromEntries(defined)).toEqual(FILL_SHORTCUTS);
  });

  it('give every fill-in shortcut a PDF-string version (hyperref bookmarks)', () => {
    const bookmarked = [...sty.matchAll(/\\def\\(skein[a-z]+)#1\{\\skein@pdfvalue\{#1\}\{([a-z-]+)\}\}/g)].map((m) => [m[1], m[2]]);
    expect(Object.fromEntries(bookmarked)).toEqual(FILL_SHORTCUTS);
  });
});
