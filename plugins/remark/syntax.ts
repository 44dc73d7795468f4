/**
 * The Markdown carriers of skeinproof, in one place (documented in the README
 * section `markdown`):
 *
 * - a diagram is a fenced code block whose info string starts with `skein`,
 *   followed by `key=value` settings: `id`, `notation`, `strands` and claims
 *   such as `crossing-number=3`;
 * - a fill-in is a text directive named after the value, without a label:
 *   `:jones{of=trefoil}`;
 * - a claim is the same directive with the author's value as its label:
 *   `:jones[$t+t^3-t^4$]{of=trefoil}`;
 * - a table of invariants is a GFM table inside a container directive
 *   `:::invariants` … `:::`, one diagram per row, one invariant per column;
 * - a figure is a leaf directive on a line of its own, its title as the label:
 *   `::drawing[The trefoil]{of=trefoil size=5cm arrows=yes}`;
 * - a grid of Khovanov homology is a GFM table inside `:::khovanov-grid{of=…}`,
 *   degrees in its header row and first column, a group in every other cell.
 *
 * A directive is ours only when its name is one of the names below and it has
 * an `of` attribute (inline) or is the `invariants` container; every other
 * directive is left alone.
 */
import type { Notation } from '../../src/core/diagram/model.ts';

export const DIAGRAM_FENCE_LANGUAGE = 'skein';
export const TABLE_DIRECTIVE = 'invariants';
export const GRID_DIRECTIVE = 'khovanov-grid';
/** The settings of `:::khovanov-grid` besides `of`, with their values (the first is the default). */
export const GRID_SETTINGS = { rows: ['quantum', 'homological'], values: ['ranks', 'groups'] } as const;
export const TARGET_ATTRIBUTE = 'of';
/** The leaf directive that places the figure of a diagram (its settings: src/core/manuscript/figure-settings.ts). */
export const FIGURE_DIRECTIVE = 'drawing';

export { CLAIM_KEYS, FILL_KEYS, isClaimKey, isFillKey } from '../../src/core/claims/index.ts';

export { NOTATIONS as NOTATION_NAMES } from '../../src/core/notation/index.ts';
import { claimKeyForHeader, headerForm } from '../../src/core/invariants/registry/index.ts';
import { isClaimKey } from '../../src/core/claims/index.ts';
import { NOTATIONS } from '../../src/core/notation/index.ts';

/** Table columns that are not invariants: the row's diagram, its notation, and free remarks. */
export const ROW_DIAGRAM_COLUMN = 'diagram';
export const ROW_NOTATION_COLUMN = 'notation';
export const REMARKS_COLUMN = 'remarks';
/** `:::invariants{columns="diagram, -, jones"}`: what each column means, in order, whatever its header says. */
export const COLUMNS_ATTRIBUTE = 'columns';
/** The entry of `columns` (and a header) that marks a free-text column. */
export const FREE_TEXT_COLUMN = '-';

/** Headers of the column naming each row's diagram (documented in the README section `markdown`, tables). */
export const DIAGRAM_HEADERS: readonly string[] = [ROW_DIAGRAM_COLUMN, 'knot', 'link'];
/** Headers of free-text columns: any number of them, left alone (README section `markdown`, tables). */
export const FREE_TEXT_HEADERS: readonly string[] = [
  REMARKS_COLUMN, 'remark', 'notes', 'note', 'name', 'names', 'comment', 'comments', 'reference', 'references', 'source', 'description', FREE_TEXT_COLUMN,
];

/** What a table column holds, from its header or its entry in `columns`. */
export type ColumnMeaning = { readonly kind: 'diagram' | 'notation' | 'free' } | { readonly kind: 'key'; readonly key: string };

/**
 * The meaning of a header as written: the diagram column, the notation column, a free-text column, or a
 * claim key (the key itself, or an alias the invariant registers, such as `det`, `σ`, `c(K)`, `Jones polynomial`).
 * Compared without case, outer spaces and `$…$`; undefined when the header means nothing known.
 */
export function columnMeaning(header: string): ColumnMeaning | undefined {
  const form = headerForm(header);
  if (DIAGRAM_HEADERS.includes(form)) return { kind: 'diagram' };
  if (form === ROW_NOTATION_COLUMN) return { kind: 'notation' };
  if (FREE_TEXT_HEADERS.includes(form)) return { kind: 'free' };
  const key = claimKeyForHeader(header) ?? columnName(header);
  return isClaimKey(key) ? { kind: 'key', key } : undefined;
}

/** What a diagram id may look like: it must survive `{of=…}` and table cells unquoted. */
export function isUsableId(id: string): boolean {
  return /^[A-Za-z0-9][\w.-]*$/.test(id);
}

export const ID_RULE = "an id starts with a letter or digit and has only letters, digits, '.', '_' and '-'";

export function isNotation(name: string): name is Notation {
  return (NOTATIONS as readonly string[]).includes(name);
}

/** A table header as written ("Crossing number", "jones") to its column name. */
export function columnName(header: string): string {
  return header.trim().toLowerCase().replace(/[\s_]+/g, '-');
}

/** One `key=value` setting of an info string, with offsets into the info string. */
export interface InfoSetting {
  readonly key: string;
  readonly value: string;
  readonly keyStart: number;
  readonly valueStart: number;
  readonly valueEnd: number;
}

export interface InfoProblem {
  readonly message: string;
  readonly start: number;
  readonly end: number;
}

/**
 * Splits the settings after `skein` into `key=value` pairs; a value containing
 * spaces is written in double quotes. Offsets are into `info`.
 */
export function splitInfoSettings(info: string): { settings: InfoSetting[]; problems: InfoProblem[] } {
  const settings: InfoSetting[] = [];
  const problems: InfoProblem[] = [];
  const token = /([^\s=]+)(=("([^"]*)"?|\S*))?/g;
  for (let m = token.exec(info); m !== null; m = token.exec(info)) {
    const key = m[1]!;
    const keyStart = m.index;
    if (m[2] === undefined) {
      problems.push({
        message: `setting \`${key}\` has no value: write it as ${key}=VALUE (e.g. id=trefoil, notation=braid)`,
        start: keyStart,
        end: keyStart + key.length,
      });
      continue;
    }
    const raw = m[3]!;
    const quoted = raw.startsWith('"');
    if (quoted && !(raw.length >= 2 && raw.endsWith('"'))) {
      problems.push({ message: `the value of \`${key}\` opens a quote that is not closed: add the closing "`, start: keyStart, end: m.index + m[0].length });
      continue;
    }
    const valueStart = keyStart + key.length + 1 + (quoted ? 1 : 0);
    const value = quoted ? m[4]! : raw;
    settings.push({ key, value, keyStart, valueStart, valueEnd: valueStart + value.length });
  }
  return { settings, problems };
}
