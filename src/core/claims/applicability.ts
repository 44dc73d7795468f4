/**
 * Which keys apply to which diagrams (each registered invariant may say why its keys do not apply, as linking
 * numbers do not to knots), and how a table says "does not apply". Tables that mix knots and links are the
 * norm: in a row whose diagram a column's key does not apply to, the cell may be empty or hold a
 * not-applicable mark. Prose claims and fill-ins of such a key stay errors (`claim-inapplicable`).
 */
import type { DiagramReport } from '../analyze/report.ts';
import { InputError } from '../errors.ts';
import { invariantOfKey } from '../invariants/registry/index.ts';

/** Why `key` does not apply to the diagram, or undefined when it does. */
export function inapplicableBecause(key: string, report: DiagramReport): string | undefined {
  return invariantOfKey(key)?.inapplicable?.(report, key);
}

/** Throws `claim-inapplicable` when `key` does not apply to the diagram. */
export function requireApplicable(key: string, report: DiagramReport): void {
  const why = inapplicableBecause(key, report);
  if (why !== undefined) throw new InputError('claim-inapplicable', `${why}; remove it, or name a diagram it applies to`);
}

/** The not-applicable marks a table cell may hold, as documented in the README (section `markdown`, tables). */
export const NOT_APPLICABLE_MARKS: readonly string[] = ['-', '--', '---', '–', '—', '−', 'n/a', 'N/A', 'n.a.', '\\textendash', '\\textemdash'];

/**
 * True when a cell's text is a not-applicable mark: one of NOT_APPLICABLE_MARKS, also in math
 * (`$-$`, `$—$`) or `\text{…}`, with the spaces and empty braces TeX ignores.
 */
export function isNotApplicableMark(text: string): boolean {
  let bare = text.trim();
  for (let previous = ''; previous !== bare; ) {
    previous = bare;
    bare = bare
      .replace(/^\$+([^$]*)\$+$/, '$1')
      .replace(/^\\(?:text|textrm|mathrm|mbox)\s*\{(.*)\}$/, '$1')
      .replace(/\{\}/g, '')
      .trim();
  }
  return NOT_APPLICABLE_MARKS.includes(bare);
}
