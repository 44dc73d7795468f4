/**
 * Tables as papers write them: knots and links in one table (a link-only column takes an empty cell or a
 * not-applicable mark in a knot row), linking numbers as fill-ins, and crossing-number ranges filled compactly
 * in cells. Values: the positive trefoil (closure of the braid 1 1 1) and the positive Hopf link (1 1), whose
 * linking number is +1 (from memory); the closure of 1 1 2 -1 -1 2 2, a 2-component link, is a diagram whose
 * crossing number the proven bounds leave open (the range is read from its report, so the test does not depend
 * on how tight the bounds are).
 */
import { describe, expect, it } from 'vitest';
import { readLatexManuscript } from '../../plugins/latex/reader.ts';
import { sidecarText } from '../../plugins/latex/sidecar.ts';
import { flatText } from '../../plugins/latex/flat.ts';
import { DEFAULT_CONVENTION } from '../../src/core/convention/convention.ts';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import { parseDiagramCode } from '../../src/core/notation/index.ts';
import { runSession } from '../../src/core/manuscript/session.ts';
import { copyFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { NO_TEX_REASON, PACKAGE_FILE, hasPdflatex, memoryFiles, pdflatex, removeDir, tempDir } from '../latex/support.ts';
import { placed, processMarkdown } from './helpers.ts';

const DIAGRAMS = [
  '```skein id=t3 notation=braid',
  '1 1 1',
  '```',
  '',
  '```skein id=hopf notation=braid',
  '1 1',
  '```',
  '',
  '```skein id=wide notation=braid',
  '1 1 2 -1 -1 2 2',
  '```',
  '',
].join('\n');

const WIDE = analyzeDiagram(parseDiagramCode('1 1 2 -1 -1 2 2', 'braid')).crossingNumber;
const RANGE = `${WIDE.lower}\\textrm{--}${WIDE.upper}`;

describe('Markdown: knots and links in one table', () => {
  it('a knot row takes an empty cell or any not-applicable mark in the linking column; a link row is filled', async () => {
    const rows = ['| t3 | |', '| t3 | — |', '| t3 | -- |', '| t3 | n/a |', '| t3 | $-$ |', '| t3 | – |', '| hopf | |', '| hopf | $1$ |'];
    const text = `${DIAGRAMS}:::invariants\n| diagram | linking |\n|---|---|\n${rows.join('\n')}\n:::\n`;
    const r = await processMarkdown(text);
    expect(r.diagnostics).toEqual([]);
    expect(r.built).toContain('| t3 | |\n| t3 | — |');
    expect(r.built).toContain('| hopf | $1$ |\n| hopf | $1$ |');
    expect(r.file.data.skeinproof!.session.counts.notApplicable).toBe(6);
  });

  it("knot-only Khovanov keys (Rasmussen's s, reduced homology) behave alike: a link row takes a mark or an empty cell, a knot row is filled, and a prose fill-in for a link is an error, not text in the paper", async () => {
    // s(right-handed trefoil) = 2 (Rasmussen 2010, from memory); s and reduced Kh are defined for knots only (common practice).
    const table = ':::invariants\n| diagram | s | reduced Kh |\n|---|---|---|\n| hopf | — | |\n| t3 | | |\n:::\n';
    const r = await processMarkdown(`${DIAGRAMS}${table}\nThen s is :rasmussen{of=hopf} and reduced Kh is :khovanov-reduced{of=hopf}.\n`);
    expect(placed(r.diagnostics)).toEqual(['error claim-inapplicable 19:11', 'error claim-inapplicable 19:49']);
    expect(r.diagnostics[0]!.message).toMatch(/Rasmussen's s is defined here for knots, but this diagram has 2 components/);
    expect(r.file.data.skeinproof!.session.counts.notApplicable).toBe(2);
    const built = (await processMarkdown(`${DIAGRAMS}${table}`)).built;
    expect(built).toContain('| hopf | — | |\n| t3 | $2$ | $q^{2} + t^{2}q^{6} + t^{3}q^{8}$ |');
    expect(built).not.toContain('knots only');
  });

  it('a value in a knot row, and a not-applicable mark in a link row, are errors', async () => {
    const text = `${DIAGRAMS}:::invariants\n| diagram | linking | writhe |\n|---|---|---|\n| t3 | $0$ | $3$ |\n| hopf | — | n/a |\n:::\n`;
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual(['error claim-inapplicable 15:8', 'error claim-contradicted 16:10', 'error claim-contradicted 16:14']);
    expect(r.diagnostics[0]!.message).toMatch(/column linking: a linking number needs a link of two or more components.*holds no value/);
    expect(r.diagnostics[0]!.hints).toEqual(['Leave the cell empty, or write a not-applicable mark such as — or n/a.']);
    expect(r.diagnostics[1]!.message).toMatch(/marks the linking number as not applicable, but `hopf` has one/);
    expect(r.diagnostics[1]!.computed).toBe('1');
    expect(r.diagnostics[2]!.computed).toBe('2');
  });

  it('linking is a fill-in in prose; of a knot it is claim-inapplicable', async () => {
    const text = `${DIAGRAMS}Here lk = :linking{of=hopf}, and :linking{of=t3}.\n`;
    const r = await processMarkdown(text);
    expect(r.built).toContain('Here lk = $1$, and :linking{of=t3}.');
    expect(placed(r.diagnostics)).toEqual(['error claim-inapplicable 12:34']);
  });

  it('a crossing-number range fills a cell as a compact range and prose as a phrase', async () => {
    expect(WIDE.exact).toBeNull();
    const text = `${DIAGRAMS}In prose :crossing-number{of=wide}.\n\n:::invariants\n| diagram | crossing number |\n|---|---|\n| wide | |\n| wide | $${RANGE}$ |\n| wide | ${WIDE.lower}–${WIDE.upper} |\n| wide | ${WIDE.lower}-${WIDE.upper} |\n:::\n`;
    const r = await processMarkdown(text);
    expect(r.diagnostics).toEqual([]);
    expect(r.built).toContain(`In prose between $${WIDE.lower}$ and $${WIDE.upper}$.`);
    expect(r.built).toContain(`| wide | $${RANGE}$ |`);
  });

  it('a hyphen between two counts is a range too (authors type 6-8 for 6–8), judged like one', async () => {
    const text = `${DIAGRAMS}:::invariants\n| diagram | crossing number |\n|---|---|\n| wide | ${WIDE.lower}-${WIDE.upper} |\n| wide | ${WIDE.upper + 1}-${WIDE.upper + 3} |\n:::\n`;
    const r = await processMarkdown(text);
    expect(r.diagnostics.map((d) => d.ruleId)).toEqual(['claim-contradicted']);
  });
});

describe('LaTeX: the same, through the shared session', () => {
  const paper = [
    '\\documentclass{article}',
    '\\usepackage{skeinproof}',
    '\\begin{document}',
    '\\begin{skeincode}{id=t3, notation=braid}',
    '1 1 1',
    '\\end{skeincode}',
    '\\begin{skeincode}{id=hopf, notation=braid}',
    '1 1',
    '\\end{skeincode}',
    '\\begin{skeincode}{id=wide, notation=braid}',
    '1 1 2 -1 -1 2 2',
    '\\end{skeincode}',
    'Linking number \\skeinvalue{hopf}{linking}.',
    '\\begin{skeintable}{id, linking, crossing-number}',
    '\\begin{tabular}{lll}',
    'Diagram & lk & $c$ \\\\',
    't3 & & \\\\',
    't3 & --- & \\\\',
    'hopf & & \\\\',
    'wide & & \\\\',
    '\\end{tabular}',
    '\\end{skeintable}',
    '\\end{document}',
    '',
  ].join('\n');

  it('fills the link row, leaves the knot rows, and writes the range compactly', () => {
    const doc = readLatexManuscript('/paper/paper.tex', memoryFiles({ 'paper.tex': paper }));
    expect(doc.diagnostics).toEqual([]);
    const session = runSession({ diagrams: doc.diagrams, claims: doc.claims, fills: doc.fills.map((f) => f.entry), convention: DEFAULT_CONVENTION });
    expect(session.diagnostics).toEqual([]);
    const sidecar = sidecarText(doc, session.fills);
    expect(sidecar).toContain('\\skein@value{hopf}{linking}{m}{1}');
    expect(sidecar).toContain('\\skein@cell{1}{2}{2}{t}{}'); // t3: not applicable, an empty cell
    expect(sidecar).toContain('\\skein@cell{1}{4}{2}{m}{1}');
    expect(sidecar).toContain(`\\skein@cell{1}{5}{3}{m}{${RANGE}}`);
    const flat = flatText(doc, session.fills);
    expect(flat).toContain('Linking number $1$.');
    expect(flat).toMatch(/\nwide & \\ensuremath\{-?\d+\} & \\ensuremath\{(.*)\} \\\\\n/);
    expect(flat).toContain(`\\ensuremath{${RANGE}} \\\\`);
  });

  it.skipIf(!hasPdflatex)(`pdflatex typesets the knot's cell empty (no ?? placeholder), the link's lk and the range with an en dash${hasPdflatex ? '' : ` (skipped: ${NO_TEX_REASON})`}`, () => {
    const dir = tempDir('mixed-table');
    try {
      copyFileSync(PACKAGE_FILE, join(dir, 'skeinproof.sty'));
      writeFileSync(join(dir, 'paper.tex'), paper);
      const doc = readLatexManuscript(join(dir, 'paper.tex'), { read: (path) => (path === join(dir, 'paper.tex') ? paper : undefined) });
      const session = runSession({ diagrams: doc.diagrams, claims: doc.claims, fills: doc.fills.map((f) => f.entry), convention: DEFAULT_CONVENTION });
      writeFileSync(join(dir, 'paper.skein.tex'), sidecarText(doc, session.fills));
      const run = pdflatex(dir, 'paper.tex');
      expect(run.ok).toBe(true);
      expect(run.text).not.toContain('??');
      expect(run.text).toContain('Linking number 1.');
      expect(run.text).toContain(`${WIDE.lower}\u2013${WIDE.upper}`); // \textrm{--} is an en dash in the PDF
      expect(run.log).not.toMatch(/Package skeinproof Warning/);
    } finally {
      removeDir(dir);
    }
  });
});

describe('Markdown: survey-table headers as papers print them', () => {
  // Determinants 3 (trefoil) and 2 (Hopf link), σ(right trefoil) = −2 in the default sign: from memory.
  const survey = [
    ':::invariants',
    '| Knot | Name | det | $\\sigma(K)$ | c(K) | Jones polynomial | lk | Notes | Source |',
    '|---|---|---|---|---|---|---|---|---|',
    '| t3 | trefoil | 3 | $-2$ | | | — | right-handed | from memory |',
    '| hopf | Hopf link | 2 | | | | | | |',
    ':::',
    '',
  ].join('\n');

  it('reads aliases of keys, of the diagram column and of free-text columns, any number of them', async () => {
    const r = await processMarkdown(`${DIAGRAMS}${survey}`);
    expect(r.diagnostics).toEqual([]);
    expect(r.file.data.skeinproof!.session.counts).toMatchObject({ claimsAgree: 3, valuesFilled: 6, notApplicable: 1 });
    expect(r.built).toContain('| t3 | trefoil | 3 | $-2$ | $3$ | $t + t^3 - t^4$ | — | right-handed | from memory |');
  });

  it('a wrong value under an alias is judged under its key', async () => {
    const r = await processMarkdown(`${DIAGRAMS}${survey.replace('| t3 | trefoil | 3 |', '| t3 | trefoil | 5 |')}`);
    expect(placed(r.diagnostics)).toEqual(['error claim-contradicted 15:18']);
    expect(r.diagnostics[0]!.message).toMatch(/^table row 1 \(t3\), column determinant: /);
  });

  it('columns="…" on the fence says what each column holds, whatever its header', async () => {
    const table = ':::invariants{columns="diagram, -, writhe, -"}\n| Diagramm | Nom | $w(D)$ signé | Bemerkung |\n|---|---|---|---|\n| t3 | trèfle | $3$ | x |\n| hopf | | | |\n:::\n';
    const r = await processMarkdown(`${DIAGRAMS}${table}`);
    expect(r.diagnostics).toEqual([]);
    expect(r.built).toContain('| hopf | | $2$ | |');
  });

  it('a columns list of the wrong length, an unknown entry and an unknown header are errors', async () => {
    const text = `${DIAGRAMS}:::invariants{columns="diagram, writhe"}\n| a | b | c |\n|---|---|---|\n| t3 | x | 3 |\n:::\n\n:::invariants{columns="diagram, wrythe"}\n| a | b |\n|---|---|\n| t3 | 3 |\n:::\n\n:::invariants\n| diagram | Mystery |\n|---|---|\n| t3 | 3 |\n:::\n`;
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual(['error markup-invalid 12:15', 'error markup-invalid 18:15', 'error markup-invalid 25:13']);
    expect(r.diagnostics[0]!.message).toMatch(/names 2 columns, but the table has 3/);
    expect(r.diagnostics[1]!.message).toMatch(/column 2 of columns="…" is `wrythe`, which means nothing here/);
    expect(r.diagnostics[2]!.hints![0]).toMatch(/\{columns="diagram, -, jones, …"\}/);
  });
});
