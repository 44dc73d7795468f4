/**
 * Grids of Khovanov homology in Markdown (`:::khovanov-grid{of=…}` around a GFM table): empty cells filled,
 * written cells judged at the cell, what the grid leaves out reported at its fence, layout mistakes located.
 * Homology from memory (Bar-Natan, AGT 2 (2002)): the right-handed trefoil (braid 1 1 1) has
 * q + q³ + t²q⁵ + t³q⁹ with ℤ/2 at (3, 7); the figure-eight knot (1 -2 1 -2) t⁻²q⁻⁵ + t⁻¹q⁻¹ + q⁻¹ + q + tq + t²q⁵
 * with ℤ/2 at (−1, −3) and (2, 3).
 */
import { describe, expect, it } from 'vitest';
import { placed, positionOf, processMarkdown } from './helpers.ts';

const DIAGRAMS = ['```skein id=t3 notation=braid', '1 1 1', '```', '', '```skein id=fig8 notation=braid', '1 -2 1 -2', '```', ''].join('\n');

const grid = (attributes: string, rows: string[]): string => `${DIAGRAMS}\n:::khovanov-grid{${attributes}}\n${rows.join('\n')}\n:::\n`;

describe('Markdown Khovanov grids', () => {
  it('fills the empty cells of a grid of ranks and leaves zero cells empty; the fences become blank lines', async () => {
    const text = grid('of=t3', ['| j \\ i | 0 | 1 | 2 | 3 |', '|---|---|---|---|---|', '| 9 | | | | 1 |', '| 7 | | | | |', '| 5 | | | | |', '| 3 | | | | |', '| 1 | | | | |']);
    const r = await processMarkdown(text);
    expect(r.diagnostics).toEqual([]);
    expect(r.built).toContain('\n\n| j \\ i | 0 | 1 | 2 | 3 |');
    expect(r.built).toContain('| 9 | | | | 1 |\n| 7 | | | | |\n| 5 | | | $1$ | |\n| 3 | $1$ | | | |\n| 1 | $1$ | | | |\n\n');
    expect(r.file.data.skeinproof!.session.counts).toMatchObject({ claimsAgree: 2, valuesFilled: 19 });
  });

  it('a wrong cell is an error at the cell naming the grid, row, column and bidegree; a zero mark is a claim of 0', async () => {
    const text = grid('of=fig8 rows=homological values=groups', [
      '| | -5 | -3 | -1 | 1 | 3 | 5 |',
      '|---|---|---|---|---|---|---|',
      '| -2 | $\\mathbb{Z}$ | | | | | |',
      '| -1 | | 1 | . | | | |',
      '| 0 | | | | | | |',
      '| 1 | | | | | | |',
      '| 2 | | | | | $\\mathbb{Z}/2$ | |',
    ]);
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([`error claim-contradicted ${positionOf(text, '1 | . |', '| -1 |')}`, `error claim-contradicted ${positionOf(text, '. |', '| -1 |')}`]);
    expect(r.diagnostics[0]!.message).toBe(
      'Khovanov grid of fig8 at line 9, row 2, column 3 (i = -1, j = -3): wrong integral Khovanov homology: the integral Khovanov homology at (-1, -3) is ℤ/2, not ℤ',
    );
    expect(r.diagnostics[1]!.message).toContain('the integral Khovanov homology at (-1, -1) is ℤ, not 0');
  });

  it('homological rows; a grid without the row i = 3 leaves out ℚ at (3, 9) and ℤ/2 at (3, 7), reported once at the fence', async () => {
    const text = grid('of=t3 rows=homological values=groups', ['| | 1 | 3 | 5 | 7 | 9 |', '|---|---|---|---|---|---|', '| 0 | | | | | |', '| 2 | | | | | |']);
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([`error claim-contradicted ${positionOf(text, ':::khovanov-grid')}`]);
    expect(r.diagnostics[0]!.message).toContain('leaves out 2 bidegrees where Khovanov homology is nonzero, (3, 7): ℤ/2, (3, 9): ℤ');
    expect(r.diagnostics[0]!.hints).toEqual(['Add homological degree i = 3 to the grid.']);
  });

  it('layout mistakes and bad attributes are located markup errors; an unknown diagram is one error', async () => {
    const bad = await processMarkdown(grid('of=t3 rows=sideways', ['| | 0 |', '|---|---|', '| 1 | |']));
    expect(bad.diagnostics.map((d) => [d.ruleId, d.message])).toEqual([['markup-invalid', '`:::khovanov-grid`: rows=sideways is not a choice: write rows=quantum or homological']]);
    const text = grid('of=t3', ['| | 0 | x |', '|---|---|---|', '| 1 | | |', '| one | | |']);
    const layout = await processMarkdown(text);
    expect(placed(layout.diagnostics)).toEqual([`error markup-invalid ${positionOf(text, 'x |')}`, `error markup-invalid ${positionOf(text, 'one')}`]);
    const unknown = await processMarkdown(grid('of=t4', ['| | 0 | 1 |', '|---|---|---|', '| 1 | 1 | |', '| 3 | 1 | |']));
    expect(unknown.diagnostics.map((d) => [d.ruleId, d.hints?.[0]])).toEqual([['target-unknown', 'Did you mean `t3`?']]);
  });
});
