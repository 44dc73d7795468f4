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
 *   `:::invariants` … `:::`, one diagram per row, one invariant per column.
 *
 * A directive is ours only when its name is one of the names below and it has
 * an `of` attribute (inline) or is the `invariants` container; every other
 * directive is left alone.
 */
import type { Notation } from '../../src/core/diagram/model.ts';

export const DIAGRAM_FENCE_LANGUAGE = 'skein';
export const TABLE_DIRECTIVE = 'invariants';
export const TARGET_ATTRIBUTE = 'of';

export { CLAIM_KEYS, FILL_KEYS, isClaimKey, isFillKey } from '../../src/core/claims/index.ts';

export { NOTATIONS as NOTATION_NAMES } from '../../src/core/notation/index.ts';
import { NOTATIONS } from '../../src/core/notation/index.ts';

/** Table columns that are not invariants: the row's diagram, its notation, and free remarks. */
export const ROW_DIAGRAM_COLUMN = 'diagram';
export const ROW_NOTATION_COLUMN = 'notation';
export const REMARKS_COLUMN = 'remarks';

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
