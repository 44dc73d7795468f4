/**
 * Splits the body of a tabular into rows and cells the way TeX's alignment
 * does: rows end at `\\` (with its optional `*` and `[skip]`) or
 * \tabularnewline, cells at `&`, both only outside braces and nested
 * environments. Rules between rows (\hline, \cline{…}, booktabs rules) belong
 * to no cell. A last row holding nothing, after the final `\\`, is no row:
 * TeX starts none there either.
 */
import { controlWord } from './mask.ts';
import { slice, trim } from './key-values.ts';
import type { Arg } from './scanner.ts';

export interface TableCell {
  /** 1-based column. */
  readonly column: number;
  /** The cell between its separators, spaces included. */
  readonly raw: Arg;
  /** The cell without surrounding spaces and leading \cellcolor (which typesets nothing); empty cells are filled here. */
  readonly content: Arg;
}

export interface TableRow {
  /** 1-based, counting every row TeX typesets (header rows included). */
  readonly number: number;
  readonly cells: readonly TableCell[];
  /** A longtable's head or foot: a row before its last \endfirsthead, \endhead, \endfoot or \endlastfoot. */
  readonly headOrFoot: boolean;
}

/** longtable's markers that end the rows of its heads and feet; they stand after a row's `\\`, like a rule. */
const HEAD_FOOT_ENDS = ['endfirsthead', 'endhead', 'endfoot', 'endlastfoot'];

/** Commands that act between rows (TeX reads them as \noalign) and take these arguments: `[` optional, `(` trim, `{` required. */
const RULES: Readonly<Record<string, string>> = {
  hline: '',
  cline: '{',
  hhline: '{',
  toprule: '[',
  midrule: '[',
  bottomrule: '[',
  cmidrule: '[({',
  addlinespace: '[',
  noalign: '{',
  rowcolor: '[{', // colortbl: a \noalign before the row
  ...Object.fromEntries(HEAD_FOOT_ENDS.map((name) => [name, ''])),
};

export function splitTabular(body: Arg): TableRow[] {
  const segments = splitRows(body);
  const marker = new RegExp(`\\\\(${HEAD_FOOT_ENDS.join('|')})(?![A-Za-z])`, 'g');
  const lastMarker = Math.max(-1, ...[...body.text.matchAll(marker)].map((m) => body.start + m.index));
  const rows: TableRow[] = [];
  segments.forEach((segment, k) => {
    const content = skipRules(segment.arg);
    const isLast = k === segments.length - 1;
    if (isLast && !segment.terminated && content.text.trim() === '') return;
    const cells = splitCells(content).map((raw, i) => ({ column: i + 1, raw, content: withoutDecorations(trim(raw)) }));
    rows.push({ number: rows.length + 1, cells, headOrFoot: content.start < lastMarker });
  });
  return rows;
}

/** Where a longtable's \kill stands (a row measured and thrown away), if anywhere outside braces. */
export function killAt(body: Arg): Arg | undefined {
  let depth = 0;
  const t = body.text;
  for (let i = 0; i < t.length; i++) {
    const c = t[i]!;
    if (c === '{') depth++;
    else if (c === '}') depth--;
    else if (c === '\\') {
      const name = controlWord(t, i + 1);
      if (name === 'kill' && depth === 0) return slice(body, i, i + 5);
      i += name ? name.length : 1;
    }
  }
  return undefined;
}

interface Segment {
  readonly arg: Arg;
  /** Ended by a row separator (rather than by the end of the tabular). */
  readonly terminated: boolean;
}

function splitRows(body: Arg): Segment[] {
  const t = body.text;
  const segments: Segment[] = [];
  let from = 0;
  let depth = 0;
  for (let i = 0; i < t.length; i++) {
    const c = t[i]!;
    if (c === '{') depth++;
    else if (c === '}') depth--;
    if (c !== '\\') continue;
    const name = controlWord(t, i + 1);
    if (name === 'begin') depth++;
    else if (name === 'end') depth--;
    const isBreak = depth === 0 && (t[i + 1] === '\\' || name === 'tabularnewline');
    if (!isBreak) {
      i += name ? name.length : 1;
      continue;
    }
    segments.push({ arg: slice(body, from, i), terminated: true });
    let k = i + (name ? 1 + name.length : 2);
    if (t[k] === '*') k++;
    const skip = /^\s*\[[^\]]*\]/.exec(t.slice(k));
    if (skip) k += skip[0].length;
    from = k;
    i = k - 1;
  }
  segments.push({ arg: slice(body, from, t.length), terminated: false });
  return segments;
}

/** Drops the rules and white space that open a row. */
function skipRules(segment: Arg): Arg {
  const t = segment.text;
  let k = 0;
  for (;;) {
    while (k < t.length && /\s/.test(t[k]!)) k++;
    if (t[k] !== '\\') break;
    const name = controlWord(t, k + 1);
    if (name === undefined || !Object.hasOwn(RULES, name)) break;
    k += 1 + name.length;
    for (const open of RULES[name]!) {
      const close = open === '[' ? ']' : open === '(' ? ')' : '}';
      const m = new RegExp(`^\\s*\\${open}[^\\${close}]*\\${close}`).exec(t.slice(k));
      if (m) k += m[0].length;
    }
  }
  return slice(segment, k, t.length);
}

/** colortbl's \cellcolor[model]{colour} paints the cell but typesets nothing in it. */
function withoutDecorations(cell: Arg): Arg {
  const m = /^\\cellcolor\s*(\[[^\]]*\])?\s*\{[^}]*\}/.exec(cell.text);
  return m ? withoutDecorations(trim(slice(cell, m[0].length, cell.text.length))) : cell;
}

function splitCells(row: Arg): Arg[] {
  const t = row.text;
  const cells: Arg[] = [];
  let from = 0;
  let depth = 0;
  for (let i = 0; i < t.length; i++) {
    const c = t[i]!;
    if (c === '\\') {
      const name = controlWord(t, i + 1);
      if (name === 'begin') depth++;
      else if (name === 'end') depth--;
      i += name ? name.length : 1;
    } else if (c === '{') depth++;
    else if (c === '}') depth--;
    else if (c === '&' && depth === 0) {
      cells.push(slice(row, from, i));
      from = i + 1;
    }
  }
  cells.push(slice(row, from, t.length));
  return cells;
}
