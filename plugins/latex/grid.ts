/**
 * The layout of a skein grid (`\begin{skeingrid}[rows=…, values=…]{id}`): the
 * last header row holds the degrees of the columns, the first column the
 * degree of each row, and every other cell the homology at its bidegree. This
 * module only reads degrees and pairs cells with bidegrees; the reader turns
 * the cells into claims and fill-ins.
 */
import type { Arg, Span } from './scanner.ts';
import type { TableCell, TableRow } from './tabular.ts';

/** Which degree the rows carry: quantum (j, the default: columns are homological degrees i) or homological. */
export type GridRows = 'quantum' | 'homological';

export interface GridCellAt {
  readonly i: number;
  readonly j: number;
  readonly row: number;
  readonly cell: TableCell;
}

export interface GridLayout {
  readonly cells: readonly GridCellAt[];
  readonly homological: readonly number[];
  readonly quantum: readonly number[];
  readonly problems: readonly { readonly span: Span; readonly message: string }[];
}

/** An integer degree as a table prints it: `3`, `-2`, `−2`, `$-2$`, `{-2}`, `\textbf{3}`; undefined otherwise. */
export function readDegree(text: string): number | undefined {
  let bare = text.trim();
  for (let previous = ''; previous !== bare; ) {
    previous = bare;
    bare = bare
      .replace(/^\$([^$]*)\$$/, '$1')
      .replace(/^\\(?:textbf|textit|textrm|mathbf|mathrm|text|bfseries)?\s*\{(.*)\}$/, '$1')
      .trim();
  }
  const m = /^([+\-−]?)\s*(\d{1,6})$/.exec(bare);
  if (!m) return undefined;
  return (m[1] === '-' || m[1] === '−' ? -1 : 1) * Number(m[2]);
}

/**
 * Pairs the cells of a grid with their bidegrees. `head` is the number of header rows, the last of which holds
 * the column degrees (its first cell is a free corner). Rows after it: a spacer (every cell empty) or a label
 * (one \multicolumn) is skipped, any other row must start with its degree and have one cell per column degree.
 */
export function gridLayout(rows: readonly TableRow[], head: number, orientation: GridRows, place: string, at: Span): GridLayout {
  const problems: { span: Span; message: string }[] = [];
  const rowWord = orientation === 'quantum' ? 'quantum degree j' : 'homological degree i';
  const columnWord = orientation === 'quantum' ? 'homological degree i' : 'quantum degree j';
  const degreeRow = rows.find((r) => r.number === head);
  if (!degreeRow || head < 1) {
    return { cells: [], homological: [], quantum: [], problems: [{ span: at, message: `${place}: the grid has no header row ${head} holding the column degrees; write the degrees in the first row (or set head=N to the row that holds them)` }] };
  }
  const columnDegrees: (number | undefined)[] = [];
  const seen = new Map<number, number>();
  degreeRow.cells.slice(1).forEach((cell, k) => {
    const d = readDegree(cell.content.text);
    columnDegrees.push(d);
    if (d === undefined) {
      problems.push({ span: spanOf(cell.content), message: `${place}, column ${k + 2}: the header must hold the column's ${columnWord}, an integer such as 0 or -2, not \`${cell.content.text}\`` });
    } else if (seen.has(d)) {
      problems.push({ span: spanOf(cell.content), message: `${place}, column ${k + 2}: the ${columnWord} ${d} heads column ${seen.get(d)} already; every degree has one column` });
    } else seen.set(d, k + 2);
  });
  if (columnDegrees.length === 0) {
    problems.push({ span: spanOf(degreeRow.cells[0]!.raw), message: `${place}: the header row holds no column degrees; after the corner cell, write one ${columnWord} per column` });
  }
  const rowDegrees: number[] = [];
  const rowOf = new Map<number, number>();
  const cells: GridCellAt[] = [];
  for (const row of rows) {
    if (row.number <= head || row.headOrFoot) continue;
    if (row.cells.every((c) => c.content.text === '')) continue;
    if (row.cells.length === 1 && /^\\(multicolumn|caption)(?![A-Za-z])/.test(row.cells[0]!.content.text)) continue;
    const rowPlace = `${place}, row ${row.number}`;
    const first = row.cells[0]!;
    const degree = readDegree(first.content.text);
    if (degree === undefined) {
      problems.push({ span: spanOf(first.content.text === '' ? first.raw : first.content), message: `${rowPlace}: the first cell must hold the row's ${rowWord}, an integer such as 5 or -3, not \`${first.content.text}\`` });
      continue;
    }
    if (rowOf.has(degree)) {
      problems.push({ span: spanOf(first.content), message: `${rowPlace}: the ${rowWord} ${degree} heads row ${rowOf.get(degree)} already; every degree has one row` });
      continue;
    }
    if (row.cells.length !== columnDegrees.length + 1) {
      const last = row.cells[row.cells.length - 1]!;
      problems.push({
        span: spanOf(last.raw),
        message: `${rowPlace} has ${row.cells.length} cells, but a row holds its degree and one cell for each of the ${columnDegrees.length} column degrees: ${row.cells.length > columnDegrees.length ? 'remove the extra cells, or add their degrees to the header' : 'add the missing `&` separators (an empty cell is filled in)'}`,
      });
      continue;
    }
    rowOf.set(degree, row.number);
    rowDegrees.push(degree);
    row.cells.slice(1).forEach((cell, k) => {
      const other = columnDegrees[k];
      if (other === undefined || seen.get(other) !== k + 2) return;
      const [i, j] = orientation === 'quantum' ? [other, degree] : [degree, other];
      cells.push({ i, j, row: row.number, cell });
    });
  }
  const printedColumns = [...seen.keys()];
  return orientation === 'quantum'
    ? { cells, homological: printedColumns, quantum: rowDegrees, problems }
    : { cells, homological: rowDegrees, quantum: printedColumns, problems };
}

function spanOf(arg: Arg): Span {
  return { start: arg.start, end: arg.end };
}
