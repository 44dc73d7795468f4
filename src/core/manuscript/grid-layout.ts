/**
 * The layout of a grid of Khovanov homology, whatever its markup (a LaTeX
 * skeingrid, a Markdown `:::khovanov-grid`): a header row whose first cell is
 * a free corner and whose other cells hold the column degrees, then rows that
 * each start with their degree. Front ends hand the cells over with their
 * texts; this module reads the degrees and pairs every other cell with its
 * bidegree (homological i, quantum j), and says what is wrong with the layout
 * at the cell at fault.
 */

/** Which degree the rows carry: quantum (j, the default: columns are homological degrees i) or homological. */
export type GridRows = 'quantum' | 'homological';

export interface GridSourceRow<C> {
  /** The row's number in the front end's messages (1-based, header rows counted). */
  readonly number: number;
  readonly cells: readonly C[];
}

export interface GridCellAt<C> {
  readonly i: number;
  readonly j: number;
  readonly row: number;
  /** 1-based, the degree column counted. */
  readonly column: number;
  readonly cell: C;
}

export interface GridLayout<C> {
  readonly cells: readonly GridCellAt<C>[];
  /** The degrees printed, in the order written. */
  readonly homological: readonly number[];
  readonly quantum: readonly number[];
  /** Each problem at the cell at fault. */
  readonly problems: readonly { readonly at: C; readonly message: string }[];
}

/** An integer degree as a table prints it: `3`, `-2`, `−2`, `$-2$`, `{-2}`, `\textbf{3}`, `**3**`; undefined otherwise. */
export function readDegree(text: string): number | undefined {
  let bare = text.trim();
  for (let previous = ''; previous !== bare; ) {
    previous = bare;
    bare = bare
      .replace(/^\$([^$]*)\$$/, '$1')
      .replace(/^\*\*(.*)\*\*$/, '$1')
      .replace(/^\\(?:textbf|textit|textrm|mathbf|mathrm|text)?\s*\{(.*)\}$/, '$1')
      .trim();
  }
  const m = /^([+\-−]?)\s*(\d{1,6})$/.exec(bare);
  if (!m) return undefined;
  return (m[1] === '-' || m[1] === '−' ? -1 : 1) * Number(m[2]);
}

/**
 * Pairs the cells of `rows` with their bidegrees. `header` is the row of column degrees (its first cell the
 * corner); `rows` are the rows that hold values (spacers and labels already left out). `place` names the grid
 * in messages ("skein table 2 (grid of trefoil)").
 */
export function gridLayout<C>(header: GridSourceRow<C>, rows: readonly GridSourceRow<C>[], textOf: (cell: C) => string, orientation: GridRows, place: string): GridLayout<C> {
  const problems: { at: C; message: string }[] = [];
  const rowWord = orientation === 'quantum' ? 'quantum degree j' : 'homological degree i';
  const columnWord = orientation === 'quantum' ? 'homological degree i' : 'quantum degree j';
  const columnDegrees: (number | undefined)[] = [];
  const columnOf = new Map<number, number>();
  header.cells.slice(1).forEach((cell, k) => {
    const d = readDegree(textOf(cell));
    columnDegrees.push(d);
    if (d === undefined) {
      problems.push({ at: cell, message: `${place}, column ${k + 2}: the header must hold the column's ${columnWord}, an integer such as 0 or -2, not \`${textOf(cell)}\`` });
    } else if (columnOf.has(d)) {
      problems.push({ at: cell, message: `${place}, column ${k + 2}: the ${columnWord} ${d} heads column ${columnOf.get(d)} already; every degree has one column` });
    } else columnOf.set(d, k + 2);
  });
  if (columnDegrees.length === 0 && header.cells[0] !== undefined) {
    problems.push({ at: header.cells[0], message: `${place}: the header row holds no column degrees; after the corner cell, write one ${columnWord} per column` });
  }
  const rowDegrees: number[] = [];
  const rowOf = new Map<number, number>();
  const cells: GridCellAt<C>[] = [];
  for (const row of rows) {
    const rowPlace = `${place}, row ${row.number}`;
    const first = row.cells[0]!;
    const degree = readDegree(textOf(first));
    if (degree === undefined) {
      problems.push({ at: first, message: `${rowPlace}: the first cell must hold the row's ${rowWord}, an integer such as 5 or -3, not \`${textOf(first)}\`` });
      continue;
    }
    if (rowOf.has(degree)) {
      problems.push({ at: first, message: `${rowPlace}: the ${rowWord} ${degree} heads row ${rowOf.get(degree)} already; every degree has one row` });
      continue;
    }
    if (row.cells.length !== columnDegrees.length + 1) {
      const fix = row.cells.length > columnDegrees.length + 1 ? 'remove the extra cells, or add their degrees to the header' : 'add the missing cells (an empty cell is filled in)';
      problems.push({
        at: row.cells[row.cells.length - 1]!,
        message: `${rowPlace} has ${row.cells.length} cells, but a row holds its degree and one cell for each of the ${columnDegrees.length} column degrees: ${fix}`,
      });
      continue;
    }
    rowOf.set(degree, row.number);
    rowDegrees.push(degree);
    row.cells.slice(1).forEach((cell, k) => {
      const other = columnDegrees[k];
      if (other === undefined || columnOf.get(other) !== k + 2) return;
      const [i, j] = orientation === 'quantum' ? [other, degree] : [degree, other];
      cells.push({ i, j, row: row.number, column: k + 2, cell });
    });
  }
  const printedColumns = [...columnOf.keys()];
  return orientation === 'quantum'
    ? { cells, homological: printedColumns, quantum: rowDegrees, problems }
    : { cells, homological: rowDegrees, quantum: printedColumns, problems };
}
