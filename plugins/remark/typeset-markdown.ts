/**
 * Typeset values as Markdown: `$…$` inline math, or prose that already holds
 * its own `$…$` spans. In a GFM table cell a `|` would end the cell, so it is
 * escaped there.
 */
import type { Typeset } from '../../src/core/claims/api.ts';

export function typesetMarkdown(value: Typeset, inTableCell: boolean): string {
  const text = value.kind === 'math' ? `$${value.latex}$` : value.text;
  return inTableCell ? ` ${text.replace(/\|/g, '\\|')} ` : text;
}
