/**
 * Skein grids read from LaTeX held in memory: which cells become claims and fill-ins at which bidegree, what the
 * check says about them (located at the cell, or at the grid for what it leaves out), and the layout mistakes.
 * Homology from memory (Bar-Natan, AGT 2 (2002)): the right-handed trefoil (braid 1 1 1) has
 * q + q³ + t²q⁵ + t³q⁹ with ℤ/2 at (3, 7).
 */
import { describe, expect, it } from 'vitest';
import { readLatexManuscript, type LatexDocument } from '../../plugins/latex/reader.ts';
import { sidecarText } from '../../plugins/latex/sidecar.ts';
import { flatText } from '../../plugins/latex/flat.ts';
import { runSession } from '../../src/core/manuscript/session.ts';
import { DEFAULT_CONVENTION } from '../../src/core/convention/convention.ts';
import { memoryFiles } from './support.ts';

const TREFOIL = '\\begin{skeincode}{id=trefoil, notation=braid}\n1 1 1\n\\end{skeincode}\n';

function paper(body: string, preamble = ''): LatexDocument {
  const text = `\\documentclass{article}\n\\usepackage{skeinproof}\n${preamble}\\begin{document}\n${TREFOIL}${body}\\end{document}\n`;
  return readLatexManuscript('/paper/paper.tex', memoryFiles({ 'paper.tex': text }));
}

function check(doc: LatexDocument) {
  return runSession({
    diagrams: doc.diagrams,
    claims: doc.claims,
    fills: doc.fills.map((f) => f.entry),
    khovanovGrids: doc.khovanovGrids,
    convention: { ...DEFAULT_CONVENTION, ...doc.convention },
  });
}

const where = (d: { ruleId: string; location?: { start: { line: number; column: number } } }): string => `${d.ruleId}@${d.location!.start.line}:${d.location!.start.column}`;

/** Lines 1–6 are the preamble and the trefoil; the grid starts on line 7. */
const RANK_GRID = [
  '\\begin{skeingrid}{trefoil}',
  '\\begin{tabular}{r|cccc}',
  '$j \\backslash i$ & 0 & 1 & 2 & 3 \\\\ \\hline',
  '9 & & & & 1 \\\\',
  '7 & & & & \\\\',
  '5 & & & 2 & \\\\',
  '3 & & $\\cdot$ & & \\\\',
  '1 & & & & \\\\',
  '\\end{tabular}',
  '\\end{skeingrid}',
  '',
].join('\n');

describe('a grid of ranks (rows are quantum degrees j, columns homological degrees i)', () => {
  const doc = paper(RANK_GRID);
  it('empty cells are fills at their bidegree, written cells rank claims; the grid records what it prints', () => {
    expect(doc.diagnostics).toEqual([]);
    expect(doc.claims.map((c) => [c.key, c.text])).toEqual([
      ['khovanov-rank', '3, 9: 1'],
      ['khovanov-rank', '2, 5: 2'],
      ['khovanov-rank', '1, 3: 0'],
    ]);
    expect(doc.fills).toHaveLength(20 - 3);
    expect(doc.fills[0]!.entry.khovanovCell).toEqual({ i: 0, j: 9, values: 'ranks' });
    expect(doc.fills[0]!.target).toMatchObject({ kind: 'cell', table: 1, row: 2, column: 2 });
    expect(doc.khovanovGrids.map((g) => g.range)).toEqual([{ homological: [0, 1, 2, 3], quantum: [9, 7, 5, 3, 1], values: 'ranks' }]);
  });
  it('a wrong cell is reported at the cell, naming the table, row, column and bidegree', () => {
    const result = check(doc);
    expect(result.diagnostics.map(where)).toEqual(['claim-contradicted@12:9']);
    expect(result.diagnostics[0]!.message).toBe(
      'skein table 1 (grid of trefoil), row 4, column 4 (i = 2, j = 5): wrong rank of Khovanov homology: the rank of Khovanov homology at (2, 5) is 1, not 2',
    );
  });
  it('the sidecar fills the nonzero cells with the rank and the zero ones with nothing', () => {
    const result = check(doc);
    const sidecar = sidecarText(doc, result.fills);
    expect(sidecar).toContain('\\skein@cell{1}{5}{2}{m}{1}'); // (0, 3): ℚ
    expect(sidecar).toContain('\\skein@cell{1}{6}{2}{m}{1}'); // (0, 1): ℚ
    expect(sidecar).toContain('\\skein@cell{1}{3}{5}{t}{}'); // (3, 7): torsion only, rank 0
    // The flat copy writes the values into the cells.
    const flat = flatText(doc, result.fills);
    expect(flat).toContain('3 & \\ensuremath{1} & $\\cdot$ &  &  \\\\\n1 & \\ensuremath{1} &  &  &  \\\\');
  });
});

describe('a grid of groups with homological rows', () => {
  const grid = (rows: string[]) =>
    paper(['\\begin{skeingrid}[rows=homological, values=groups]{trefoil}', '\\begin{tabular}{c|cccccc}', ' & 1 & 3 & 5 & 7 & 9 & 11 \\\\', ...rows, '\\end{tabular}', '\\end{skeingrid}', ''].join('\n'));
  it('cells are group claims at (row, column) = (i, j); the torsion the grid prints is judged', () => {
    const doc = grid(['0 & \\mathbb{Z} & 1 & & & & \\\\', '2 & & & & & & \\\\', '3 & & & & $\\mathbb{Z}/2$ & 1, \\mathbb{Z}/2 & \\\\']);
    expect(doc.claims.map((c) => [c.key, c.text])).toEqual([
      ['khovanov-group', '0, 1: \\mathbb{Z}'],
      ['khovanov-group', '0, 3: 1'],
      ['khovanov-group', '3, 7: \\mathbb{Z}/2'],
      ['khovanov-group', '3, 9: 1, \\mathbb{Z}/2'],
    ]);
    const result = check(doc);
    expect(result.diagnostics.map(where)).toEqual(['claim-contradicted@12:28']);
    expect(result.diagnostics[0]!.message).toContain('integral Khovanov homology at (3, 9) is ℤ, not ℤ ⊕ ℤ/2');
  });
  it('a grid without the row i = 3 leaves out ℚ at (3, 9) and ℤ/2 at (3, 7): one error at the grid', () => {
    const result = check(grid(['0 & & & & & & \\\\', '2 & & & & & & \\\\']));
    expect(result.diagnostics.map(where)).toEqual(['claim-contradicted@7:1']);
    expect(result.diagnostics[0]!.message).toBe(
      'skein table 1 (grid of trefoil): the grid leaves out 2 bidegrees where Khovanov homology is nonzero, (3, 7): ℤ/2, (3, 9): ℤ; a grid says that every group it does not print is zero',
    );
    expect(result.diagnostics[0]!.hints).toEqual(['Add homological degree i = 3 to the grid.']);
  });
  it('in the declared grading: with khovanov=homological the trefoil lives in i = 0, −2, −3', () => {
    const doc = paper(
      ['\\begin{skeingrid}[rows=homological, values=groups]{trefoil}', '\\begin{tabular}{c|cccc}', ' & 1 & 5 & 7 & 9 \\\\', '0 & & & & \\\\', '-2 & & & & \\\\', '$-3$ & & & $\\mathbb{Z}/2$ & \\\\', '\\end{tabular}', '\\end{skeingrid}', ''].join('\n'),
      '\\skeinconvention{khovanov=homological}\n',
    );
    const result = check(doc);
    // (0, 3) is nonzero and the grid has no column j = 3.
    expect(result.diagnostics.map((d) => d.message)).toEqual([expect.stringContaining('(0, 3): ℤ;')]);
  });
});

describe('mistakes in a grid', () => {
  const grid = (options: string, lines: string[], id = 'trefoil') =>
    paper([`\\begin{skeingrid}${options}{${id}}`, '\\begin{tabular}{cccc}', ...lines, '\\end{tabular}', '\\end{skeingrid}', ''].join('\n'));
  it('headers that are no degrees, a degree twice, a short row: located errors, and no range check', () => {
    const doc = grid('', [' & 0 & x & 0 \\\\', '1 & & & \\\\', '1 & & & \\\\', 'three & & & \\\\', '3 & & \\\\']);
    expect(doc.diagnostics.map((d) => `${d.ruleId}@${d.location!.start.line}:${d.location!.start.column}`)).toEqual([
      'latex-table-malformed@9:8',
      'latex-table-malformed@9:12',
      'latex-table-malformed@11:1',
      'latex-table-malformed@12:1',
      'latex-table-malformed@13:6',
    ]);
    expect(doc.diagnostics.map((d) => d.message)).toEqual([
      'skein table 1 (grid of trefoil), column 3: the header must hold the column\'s homological degree i, an integer such as 0 or -2, not `x`',
      'skein table 1 (grid of trefoil), column 4: the homological degree i 0 heads column 2 already; every degree has one column',
      'skein table 1 (grid of trefoil), row 3: the quantum degree j 1 heads row 2 already; every degree has one row',
      'skein table 1 (grid of trefoil), row 4: the first cell must hold the row\'s quantum degree j, an integer such as 5 or -3, not `three`',
      'skein table 1 (grid of trefoil), row 5 has 3 cells, but a row holds its degree and one cell for each of the 3 column degrees: add the missing cells (an empty cell is filled in)',
    ]);
    expect(doc.khovanovGrids).toEqual([]);
  });
  it('unknown options and values are refused with the list of what is allowed', () => {
    const doc = grid('[values=torsion, colums=2]', [' & 0 \\\\', '1 & \\\\']);
    expect(doc.diagnostics.map((d) => [d.ruleId, d.message])).toEqual([
      ['latex-option-invalid', 'values must be ranks or groups'],
      ['latex-key-unknown', '`colums` is not an option of skeingrid: the options are head=N, rows=quantum|homological and values=ranks|groups'],
    ]);
  });
  it('a grid of an unknown diagram is one error at the grid, whatever the number of cells', () => {
    const result = check(grid('', [' & 0 & 1 & 2 \\\\', '1 & 1 & & \\\\', '3 & 1 & & \\\\'], 'trefoi'));
    expect(result.diagnostics.map(where)).toEqual(['target-unknown@7:1']);
    expect(result.diagnostics[0]!.hints).toContain('Did you mean `trefoil`?');
  });
  it('head=N puts the column degrees in row N; the rows above are free', () => {
    const doc = grid('[head=2]', ['\\multicolumn{4}{c}{Trefoil} \\\\', ' & 0 & 2 & 3 \\\\', '9 & & & \\\\']);
    expect(doc.diagnostics).toEqual([]);
    expect(doc.khovanovGrids[0]!.range).toEqual({ homological: [0, 2, 3], quantum: [9], values: 'ranks' });
  });
});
