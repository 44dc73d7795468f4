/**
 * Grids of Khovanov homology: the integral group at a bidegree (`khovanov-group`), what a grid cell claims, what
 * an empty cell is filled with, and the nonzero groups a grid leaves out. Values from memory, as in values.test.ts:
 * the right-handed trefoil has q + q³ + t²q⁵ + t³q⁹ with ℤ/2 at (3, 7), the figure-eight knot
 * t⁻²q⁻⁵ + t⁻¹q⁻¹ + q⁻¹ + q + tq + t²q⁵ with ℤ/2 at (−1, −3) and (2, 3) (Bar-Natan, AGT 2 (2002), table of
 * small knots).
 */
import { describe, expect, it } from 'vitest';
import { analyzeDiagram } from '../../../src/core/analyze/analyze.ts';
import { judgeClaim } from '../../../src/core/claims/index.ts';
import { readIntegralGroup } from '../../../src/core/claims/khovanov-claims.ts';
import { gridCellClaim, gridCellFill, gridOmissionDiagnostic, gridOmissions, type GridRange } from '../../../src/core/claims/khovanov-grid.ts';
import { DEFAULT_CONVENTION, type Convention, type KhovanovGrading } from '../../../src/core/convention/convention.ts';
import { runSession } from '../../../src/core/manuscript/session.ts';
import type { ClaimEntry, FillEntry, KhovanovGridEntry } from '../../../src/core/manuscript/api.ts';
import { parseDiagramCode } from '../../../src/core/notation/index.ts';
import { braid } from './support.ts';
import { closeBraid } from '../../../src/core/diagram/braid-closure.ts';

const trefoil = analyzeDiagram(braid([1, 1, 1]));
const figureEight = analyzeDiagram(braid([1, -2, 1, -2]));
const convention = (khovanovGrading: KhovanovGrading): Convention => ({ ...DEFAULT_CONVENTION, khovanovGrading });
const judge = (text: string, report = trefoil, grading: KhovanovGrading = 'standard') =>
  judgeClaim('khovanov-group', text, report, { convention: convention(grading) });
const range = (homological: number[], quantum: number[], values: 'ranks' | 'groups'): GridRange => ({ homological, quantum, values });
const span = (from: number, to: number): number[] => Array.from({ length: to - from + 1 }, (_, k) => from + k);

describe('the integral group at a bidegree (khovanov-group)', () => {
  it('reads ℤ, powers of ℤ, bare counts, torsion and their sums alike', () => {
    expect(readIntegralGroup('0')).toEqual({ rank: 0, torsion: [] });
    expect(readIntegralGroup('\\mathbb{Z}')).toEqual({ rank: 1, torsion: [] });
    expect(readIntegralGroup('\\mathbb{Z}^{2} \\oplus \\mathbb{Z}/2')).toEqual({ rank: 2, torsion: [2] });
    expect(readIntegralGroup('1, \\mathbb{Z}/2')).toEqual({ rank: 1, torsion: [2] });
    expect(readIntegralGroup('ℤ/6 ⊕ ℤ')).toEqual({ rank: 1, torsion: [2, 3] });
    expect(() => readIntegralGroup('\\mathbb{Q}')).toThrow(/not a cyclic group/);
    // TeX takes a single-token argument without braces, so \mathbb Z is \mathbb{Z}; plain TeX and amsfonts users write \Bbb Z (common practice).
    expect(readIntegralGroup('\\mathbb Z \\oplus \\mathbb Z/2')).toEqual({ rank: 1, torsion: [2] });
    expect(readIntegralGroup('\\mathbb{ Z }^2 \\oplus \\Bbb Z_{4} \\oplus \\mathbf Z/3')).toEqual({ rank: 2, torsion: [3, 4] });
    expect(() => readIntegralGroup('1 \\oplus \\oplus 2')).toThrow(/empty summand/);
  });
  it('judges the trefoil: ℤ at (0, 1), ℤ/2 at (3, 7), ℤ at (3, 9), 0 elsewhere', () => {
    expect(judge('0, 1: \\mathbb{Z}').verdict).toBe('agrees');
    expect(judge('(3, 7) = \\mathbb{Z}/2').verdict).toBe('agrees');
    expect(judge('3, 9: 1').verdict).toBe('agrees');
    expect(judge('1, 3: 0').verdict).toBe('agrees');
    const extra = judge('3, 9: \\mathbb{Z} \\oplus \\mathbb{Z}/2');
    expect([extra.verdict, extra.computed]).toEqual(['contradicts', '\\mathbb{Z}']);
    expect(extra.reason).toContain('integral Khovanov homology at (3, 9) is ℤ, not ℤ ⊕ ℤ/2');
  });
  it('diagnoses the mirror and the other grading, with the torsion moved by universal coefficients under mirror', () => {
    // The left-handed trefoil has ℤ/2 at (−2, −7): (1 − i, −j) of (3, 7).
    const mirror = judge('-2, -7: \\mathbb{Z}/2');
    expect([mirror.verdict, mirror.diagnosis?.kind]).toEqual(['contradicts', 'mirror']);
    expect(judge('-2, -7: \\mathbb{Z}/2', trefoil, 'mirror').verdict).toBe('agrees');
    const qInverse = judge('3, -7: \\mathbb{Z}/2');
    expect([qInverse.verdict, qInverse.diagnosis?.kind]).toEqual(['contradicts', 'normalization']);
    expect(qInverse.diagnosis?.detail).toContain('quantum grading negated');
  });
  it("judges the figure-eight knot's torsion at (−1, −3) and (2, 3)", () => {
    expect(judge('-1, -3: \\mathbb{Z}/2', figureEight).verdict).toBe('agrees');
    expect(judge('2, 3: \\mathbb{Z}/2', figureEight).verdict).toBe('agrees');
    expect(judge('0, 1: \\mathbb{Z}', figureEight).verdict).toBe('agrees');
    expect(judge('0, -1: \\mathbb{Z}', figureEight).verdict).toBe('agrees');
  });
});

describe('grid cells', () => {
  it('a written cell is a rank claim in a grid of ranks and a group claim in a grid of groups; zero marks claim 0', () => {
    expect(gridCellClaim({ i: 3, j: 9, values: 'ranks' }, '$1$')).toEqual({ key: 'khovanov-rank', text: '3, 9: 1' });
    expect(gridCellClaim({ i: 3, j: 7, values: 'groups' }, '$\\mathbb{Z}/2$')).toEqual({ key: 'khovanov-group', text: '3, 7: \\mathbb{Z}/2' });
    for (const mark of ['.', '$\\cdot$', '--', '\\textendash', '0']) expect(gridCellClaim({ i: 1, j: 3, values: 'ranks' }, mark).text).toBe('1, 3: 0');
  });
  it('a group written where a rank is asked is refused with the key that states groups', () => {
    const cell = gridCellClaim({ i: 3, j: 7, values: 'ranks' }, '$\\mathbb{Z}/2$');
    expect(() => judgeClaim(cell.key, cell.text, trefoil, { convention: DEFAULT_CONVENTION })).toThrow(
      '`\\mathbb{Z}/2` is a group, and a rank is a number: write the rank of the free part, or state the whole group with the key khovanov-group (in a grid: values=groups)',
    );
    for (const group of ['\\Bbb Z', '\\mathbf Z']) {
      expect(() => judgeClaim('khovanov-rank', `3, 9: ${group}`, trefoil, { convention: DEFAULT_CONVENTION }), group).toThrow(/is a group, and a rank is a number/);
    }
  });
  it('an empty cell is filled with the rank or the group in the declared grading, and stays empty for zero', () => {
    const fill = (i: number, j: number, values: 'ranks' | 'groups', grading: KhovanovGrading = 'standard') =>
      gridCellFill(trefoil, { i, j, values }, convention(grading));
    expect(fill(0, 1, 'ranks')).toEqual({ kind: 'math', latex: '1' });
    expect(fill(3, 7, 'ranks')).toEqual({ kind: 'text', text: '' });
    expect(fill(3, 7, 'groups')).toEqual({ kind: 'math', latex: '\\mathbb{Z}/2' });
    expect(fill(2, 5, 'groups')).toEqual({ kind: 'math', latex: '\\mathbb{Z}' });
    expect(fill(-3, 9, 'ranks', 'homological')).toEqual({ kind: 'math', latex: '1' });
    expect(fill(3, 9, 'ranks', 'homological')).toEqual({ kind: 'text', text: '' });
    // Trefoil beside an unknotted circle: Kh(D ⊔ O) = Kh(D) ⊗ (ℤ at q^{±1}) (Künneth), so q·q + q³·q⁻¹ gives ℤ² at (0, 2).
    const split = analyzeDiagram(closeBraid([1, 1, 1], 3));
    expect(gridCellFill(split, { i: 0, j: 2, values: 'ranks' }, DEFAULT_CONVENTION)).toEqual({ kind: 'math', latex: '2' });
    // At (3, 8) the free part comes from ℤ at (3, 9) times q⁻¹, the torsion from ℤ/2 at (3, 7) times q.
    expect(gridCellFill(split, { i: 3, j: 8, values: 'groups' }, DEFAULT_CONVENTION)).toEqual({ kind: 'math', latex: '\\mathbb{Z} \\oplus \\mathbb{Z}/2' });
  });
});

describe('what a grid leaves out', () => {
  it('a grid printing every nonzero bidegree leaves nothing out; one row short leaves out its groups', () => {
    expect(gridOmissions(trefoil, range(span(0, 3), span(1, 9), 'ranks'), DEFAULT_CONVENTION)).toEqual([]);
    const short = gridOmissions(trefoil, range(span(0, 3), span(1, 7), 'ranks'), DEFAULT_CONVENTION);
    expect(short.map((o) => [o.i, o.j, o.group.rank])).toEqual([[3, 9, 1]]);
  });
  it('torsion counts only in a grid of groups: the trefoil without the row j = 7', () => {
    const rows = [1, 3, 5, 9];
    expect(gridOmissions(trefoil, range(span(0, 3), rows, 'ranks'), DEFAULT_CONVENTION)).toEqual([]);
    const left = gridOmissions(trefoil, range(span(0, 3), rows, 'groups'), DEFAULT_CONVENTION);
    expect(left.map((o) => [o.i, o.j, o.group.torsion])).toEqual([[3, 7, [2]]]);
  });
  it('the omission is one error at the grid that names the bidegrees and the degrees to add', () => {
    const location = { file: 'paper.tex', start: { line: 4, column: 1 } };
    const d = gridOmissionDiagnostic(figureEight, range([0, 1, 2], [-1, 1, 5], 'groups'), DEFAULT_CONVENTION, 'skein table 1 (grid of eight)', location);
    expect(d?.ruleId).toBe('claim-contradicted');
    expect(d?.location).toEqual(location);
    expect(d?.message).toContain('(-2, -5): ℤ, (-1, -3): ℤ/2, (-1, -1): ℤ, (2, 3): ℤ/2');
    expect(d?.hints).toEqual(['Add homological degrees i = -2, -1 and quantum degrees j = -5, -3, 3 to the grid.']);
    expect(gridOmissionDiagnostic(figureEight, range(span(-2, 2), span(-5, 5), 'groups'), DEFAULT_CONVENTION, 'x', location)).toBeUndefined();
  });
});

describe('grids in a session', () => {
  const at = (line: number) => () => ({ file: 'paper.tex', start: { line, column: 1 } });
  const grid = (target: string): KhovanovGridEntry => ({ target, range: range(span(0, 3), span(1, 9), 'ranks'), locate: at(1), context: `grid of ${target}` });
  const cellClaim = (target: string, i: number, j: number, text: string, line: number): ClaimEntry => ({
    target,
    ...gridCellClaim({ i, j, values: 'ranks' }, text),
    locate: at(line),
    context: `grid of ${target}, (${i}, ${j})`,
    cell: true,
    inGrid: true,
  });
  const cellFill = (target: string, i: number, j: number, line: number): FillEntry => ({
    target,
    key: 'khovanov',
    locate: at(line),
    context: `grid of ${target}, (${i}, ${j})`,
    cell: true,
    khovanovCell: { i, j, values: 'ranks' },
  });
  const diagrams = [{ id: 'trefoil', notation: 'braid' as const, code: '1 1 1', locateCode: at(20), locateHeader: at(20) }];

  it('judges written cells, fills empty ones and checks the range; the counts say what was checked', () => {
    const result = runSession({
      diagrams,
      claims: [cellClaim('trefoil', 2, 5, '2', 3), cellClaim('trefoil', 3, 9, '1', 4)],
      fills: [cellFill('trefoil', 0, 1, 5), cellFill('trefoil', 1, 3, 6)],
      khovanovGrids: [grid('trefoil')],
      convention: DEFAULT_CONVENTION,
    });
    expect(result.diagnostics.map((d) => [d.ruleId, d.location?.start.line])).toEqual([['claim-contradicted', 3]]);
    expect(result.diagnostics[0]!.message).toContain('the rank of Khovanov homology at (2, 5) is 1, not 2');
    expect(result.fills).toEqual([{ kind: 'math', latex: '1' }, { kind: 'text', text: '' }]);
    expect(result.counts).toMatchObject({ claimsAgree: 2, claimsContradicted: 1, valuesFilled: 2 });
  });
  it('a grid of an unknown diagram is one error at the grid, not one per cell', () => {
    const result = runSession({
      diagrams,
      claims: [cellClaim('trefoi', 2, 5, '1', 3), cellClaim('trefoi', 3, 9, '1', 4)],
      fills: [cellFill('trefoi', 0, 1, 5)],
      khovanovGrids: [grid('trefoi')],
      convention: DEFAULT_CONVENTION,
    });
    expect(result.diagnostics.map((d) => [d.ruleId, d.location?.start.line])).toEqual([['target-unknown', 1]]);
    expect(result.diagnostics[0]!.hints).toContain('Did you mean `trefoil`?');
  });
  it('a DT code fixes the knot up to mirror: a grid of either trefoil agrees, cells and range alike (common practice)', () => {
    const dt = [{ id: 'k', notation: 'dt' as const, code: '4 6 2', locateCode: at(20), locateHeader: at(20) }];
    expect(analyzeDiagram(parseDiagramCode('4 6 2', 'dt')).chiralityFixed).toBe(false);
    // Right-handed: ℚ at (3, 9) in a grid of i = 0…3, j = 1…9; left-handed: ℚ at (−3, −9) in i = −3…0, j = −9…−1.
    for (const sign of [1, -1]) {
      const result = runSession({
        diagrams: dt,
        claims: [cellClaim('k', 3 * sign, 9 * sign, '1', 3)],
        fills: [],
        khovanovGrids: [{ target: 'k', range: range(span(0, 3).map((d) => d * sign), span(1, 9).map((d) => d * sign), 'ranks'), locate: at(1), context: 'grid of k' }],
        convention: DEFAULT_CONVENTION,
      });
      expect(result.diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
      expect(result.counts).toMatchObject({ claimsAgree: 2 });
    }
  });
});
