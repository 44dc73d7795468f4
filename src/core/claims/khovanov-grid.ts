/**
 * A grid of Khovanov homology: a table of one diagram with a row per quantum
 * degree and a column per homological degree (or the other way round), each
 * cell the homology at its bidegree in the document's grading. Front ends read
 * the layout; this module says what a written cell claims, what an empty cell
 * is filled with, and which nonzero groups a grid leaves out (a grid states
 * that every bidegree it does not print carries zero homology).
 */
import type { DiagramReport } from '../analyze/report.ts';
import type { Convention } from '../convention/convention.ts';
import type { Diagnostic, SourceLocation } from '../diagnostics/diagnostic.ts';
import type { ClaimKey, Typeset } from './api.ts';
import { groupAt, groupText, inGrading, integralGroupLatex, khovanovOf, type IntegralGroup } from './khovanov-claims.ts';

/** `ranks`: each cell is the rank of rational homology; `groups`: the integral group (free part and torsion). */
export type GridValues = 'ranks' | 'groups';

/** One cell of a grid: its bidegree (homological i, quantum j) in the document's grading. */
export interface GridCell {
  readonly i: number;
  readonly j: number;
  readonly values: GridValues;
}

/**
 * What a grid prints: the degrees of its rows and columns. Every bidegree (i, j) with i and j both printed has
 * a cell; any other bidegree is claimed to carry zero homology.
 */
export interface GridRange {
  readonly homological: readonly number[];
  readonly quantum: readonly number[];
  readonly values: GridValues;
}

/** Marks a grid cell may use for a zero group besides `0`: a centred dot, a full stop, or a dash. */
const ZERO_MARKS = new Set(['0', '.', '\\cdot', '·', '-', '--', '---', '–', '—', '−', '\\textendash', '\\textemdash']);

/** A cell's text without math delimiters and text wrappers (`$1$`, `\text{--}`). */
function bareCell(text: string): string {
  let bare = text.trim();
  for (let previous = ''; previous !== bare; ) {
    previous = bare;
    bare = bare
      .replace(/^\$+([^$]*)\$+$/, '$1')
      .replace(/^\\\(([\s\S]*)\\\)$/, '$1')
      .replace(/^\\(?:text|textrm|mathrm|mbox)\s*\{(.*)\}$/, '$1')
      .trim();
  }
  return bare;
}

/**
 * The claim a written cell makes, in the words of the bidegree claims: `khovanov-rank` (`3, 9: 1`) in a grid of
 * ranks, `khovanov-group` (`3, 7: \mathbb{Z}/2`) in a grid of groups; a zero mark claims the group is 0.
 */
export function gridCellClaim(cell: GridCell, text: string): { readonly key: ClaimKey; readonly text: string } {
  const bare = bareCell(text);
  const value = ZERO_MARKS.has(bare) ? '0' : bare;
  return { key: cell.values === 'ranks' ? 'khovanov-rank' : 'khovanov-group', text: `${cell.i}, ${cell.j}: ${value}` };
}

/** The value for an empty cell: the rank, or the group (ℤ^r ⊕ torsion); a zero group leaves the cell empty. */
export function gridCellFill(report: DiagramReport, cell: GridCell, convention: Convention): Typeset {
  const group = groupAt(inGrading(khovanovOf(report).homology, convention.khovanovGrading), cell.i, cell.j);
  if (isZero(group, cell.values)) return { kind: 'text', text: '' };
  return { kind: 'math', latex: cell.values === 'ranks' ? String(group.rank) : integralGroupLatex(group) };
}

function isZero(group: IntegralGroup, values: GridValues): boolean {
  return group.rank === 0 && (values === 'ranks' || group.torsion.length === 0);
}

/** The bidegrees with nonzero homology (rational ranks, or ranks and torsion) that the grid does not print. */
export function gridOmissions(report: DiagramReport, range: GridRange, convention: Convention): { readonly i: number; readonly j: number; readonly group: IntegralGroup }[] {
  const graded = inGrading(khovanovOf(report).homology, convention.khovanovGrading);
  const bidegrees = new Set([...graded.ranks.keys(), ...(range.values === 'groups' ? graded.torsion.keys() : [])]);
  const rows = new Set(range.quantum);
  const columns = new Set(range.homological);
  return [...bidegrees]
    .map((k) => k.split(',').map(Number) as [number, number])
    .filter(([i, j]) => !columns.has(i) || !rows.has(j))
    .sort((a, b) => a[0] - b[0] || a[1] - b[1])
    .map(([i, j]) => ({ i, j, group: groupAt(graded, i, j) }));
}

/**
 * A grid that leaves out nonzero groups is wrong by omission: one error at the grid listing them (the first
 * twelve), with the degrees to add. Undefined when the grid prints every nonzero group.
 */
export function gridOmissionDiagnostic(report: DiagramReport, range: GridRange, convention: Convention, context: string, location: SourceLocation): Diagnostic | undefined {
  const left = gridOmissions(report, range, convention);
  if (left.length === 0) return undefined;
  const value = (g: IntegralGroup): string => (range.values === 'ranks' ? `rank ${g.rank}` : groupText(integralGroupLatex(g)));
  const shown = left.slice(0, 12).map((o) => `(${o.i}, ${o.j}): ${value(o.group)}`);
  const more = left.length > shown.length ? `, and ${left.length - shown.length} more` : '';
  const newDegrees = (printed: readonly number[], degrees: number[]): number[] => [...new Set(degrees.filter((d) => !printed.includes(d)))].sort((a, b) => a - b);
  const addI = newDegrees(range.homological, left.map((o) => o.i));
  const addJ = newDegrees(range.quantum, left.map((o) => o.j));
  const adds = [
    ...(addI.length > 0 ? [`homological degree${addI.length === 1 ? '' : 's'} i = ${addI.join(', ')}`] : []),
    ...(addJ.length > 0 ? [`quantum degree${addJ.length === 1 ? '' : 's'} j = ${addJ.join(', ')}`] : []),
  ];
  const homology = range.values === 'ranks' ? 'rational Khovanov homology' : 'Khovanov homology';
  const count = left.length === 1 ? 'a bidegree' : `${left.length} bidegrees`;
  return {
    severity: 'error',
    ruleId: 'claim-contradicted',
    message: `${context}: the grid leaves out ${count} where ${homology} is nonzero, ${shown.join(', ')}${more}; a grid says that every group it does not print is zero`,
    location,
    claimed: 'zero outside the printed degrees',
    computed: shown.join(', ') + more,
    hints: [`Add ${adds.join(' and ')} to the grid.`],
  };
}
