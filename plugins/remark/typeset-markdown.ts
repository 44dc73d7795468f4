/**
 * Typeset values as Markdown: `$…$` inline math, or prose that already holds
 * its own `$…$` spans. In a GFM table cell a `|` would end the cell. Outside
 * math it is escaped as `\|`; inside math that escape would reach KaTeX as
 * `\|` (a double bar), so the bar is written `\vert` there.
 */
import type { Typeset } from '../../src/core/claims/api.ts';

/** Where a fill-in goes: in running text, beside other text in a table cell, or as the whole of an empty cell (between its pipes). */
export type FillPlace = 'text' | 'in-cell' | 'empty-cell';

export function typesetMarkdown(value: Typeset, place: FillPlace): string {
  const text = value.kind === 'math' ? `$${value.latex}$` : value.text;
  if (place === 'text') return text;
  const safe = text
    .split(/(\$[^$]*\$)/)
    .map((part, i) => (i % 2 === 1 ? part.replace(/\|(?=[A-Za-z])/g, '\\vert ').replace(/\|/g, '\\vert') : part.replace(/\|/g, '\\|')))
    .join('');
  return place === 'empty-cell' ? ` ${safe} ` : safe;
}

/** The class of a figure's block, which the HTML page's sanitizer keeps. */
export const FIGURE_CLASS = 'skein-drawing';

/**
 * A figure's SVG as one line of Markdown: an HTML block (`<figure` starts one, which runs to the next blank
 * line), on one line so that it stays whole inside a list item or a block quote.
 */
export function figureMarkdown(svg: string): string {
  const inline = svg.replace(/^\s*<\?xml[^>]*\?>/, '').replace(/\s*[\r\n]+\s*/g, ' ').trim();
  return `<figure class="${FIGURE_CLASS}">${inline}</figure>`;
}
