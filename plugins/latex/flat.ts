/**
 * The flat copy: the manuscript with every \input and \include spliced in,
 * every fill-in replaced by its value and every piece of skeinproof markup
 * replaced by plain LaTeX, so it compiles without the package. Bytes outside
 * the replaced spans are copied as written.
 */
import type { Typeset } from '../../src/core/claims/api.ts';
import { asciiLatex } from './ascii.ts';
import { endsWithControlWord } from './expansion.ts';
import type { LatexDocument, LatexFill, Splice } from './reader.ts';
import type { SourceFile } from './source-file.ts';

/**
 * What the package provides, in plain LaTeX for the flat copy: the array
 * package it loads (tables keep its look, and column templates such as
 * >{$}c<{$} keep working), \operatorname for statements, which amsmath
 * defines properly when the document loads it, \mathbb (bold without amsfonts)
 * for Khovanov groups, and \texorpdfstring for values
 * in section titles, which hyperref defines when the document loads it.
 */
const VALUE_SUPPORT =
  '\\RequirePackage{array}\\AtBeginDocument{\\providecommand\\operatorname[1]{\\mathop{\\mathrm{#1}}\\nolimits}\\providecommand\\mathbb[1]{\\mathbf{#1}}\\providecommand\\texorpdfstring[2]{#1}}';

/** The values of the fill-ins and the TikZ pictures of the figures, in the reader's order (undefined where not computed). */
interface Built {
  readonly values: readonly (Typeset | undefined)[];
  readonly figures: readonly (string | undefined)[];
}

export function flatText(doc: LatexDocument, values: readonly (Typeset | undefined)[], figures: readonly (string | undefined)[] = []): string {
  return flatFile(doc, doc.main, { values, figures });
}

function flatFile(doc: LatexDocument, file: SourceFile, built: Built): string {
  return spliced(doc, file.text, doc.splices.get(file) ?? [], built);
}

function spliced(doc: LatexDocument, text: string, unordered: readonly Splice[], built: Built): string {
  const splices = [...unordered].sort((a, b) => a.span.start - b.span.start || a.span.end - b.span.end);
  let out = '';
  let at = 0;
  for (const s of splices) {
    if (s.span.start < at) continue; // inside a span already replaced
    out += text.slice(at, s.span.start);
    out += replacement(doc, text, s, built, out, text.slice(s.span.end, s.span.end + 1));
    at = s.span.end;
  }
  return out + text.slice(at);
}

/** `before`: the flat text so far; `after`: the character that follows the replaced span. */
function replacement(doc: LatexDocument, text: string, s: Splice, built: Built, before: string, after: string): string {
  switch (s.kind) {
    case 'text':
      return s.text;
    case 'package': {
      // The figures are TikZ pictures: loaded here unless the manuscript loads tikz itself (a second load with options would clash).
      const tikz = built.figures.some((f) => f !== undefined) && !doc.tikzLoaded ? '\\RequirePackage{tikz}' : '';
      return s.kept + VALUE_SUPPORT + tikz;
    }
    case 'figure': {
      const picture = built.figures[s.figure];
      return picture === undefined ? text.slice(s.span.start, s.span.end) : asciiLatex(picture).trimEnd();
    }
    case 'expansion': {
      let expanded = spliced(doc, s.text, s.splices, built);
      // TeX reads a control word up to the first non-letter: keep the tokens at both ends of the expansion apart from
      // their neighbours, as they were (`\foo\mymacro{…}`, an expansion ending in `\relax` before a letter or a space).
      if (endsWithControlWord(before) && /^[A-Za-z]/.test(expanded)) expanded = ` ${expanded}`;
      if (endsWithControlWord(expanded)) expanded += /^[A-Za-z]/.test(after) ? ' ' : /^\s/.test(after) ? '{}' : '';
      return expanded;
    }
    case 'include': {
      let body = flatFile(doc, s.file, built);
      // TeX ends every line, the last one too; without this a final comment would swallow what follows.
      if (!body.endsWith('\n')) body += '\n';
      return s.command === 'include' ? `\\clearpage\n${body}\\clearpage\n` : body;
    }
    case 'fill': {
      const value = built.values[s.fill];
      if (value === undefined) return text.slice(s.span.start, s.span.end);
      const ascii: Typeset = value.kind === 'math' ? { ...value, latex: asciiLatex(value.latex) } : { ...value, text: asciiLatex(value.text) };
      return fillText(doc.fills[s.fill]!, ascii, text.slice(s.span.start, s.span.end));
    }
  }
}

function fillText(fill: LatexFill, value: Typeset, written: string): string {
  const t = fill.target;
  if (t.kind === 'macro') {
    // hyperref makes a PDF bookmark of a section title, where math is not allowed: it shows the value as typed.
    if (value.kind === 'math' && t.inTitle && (!t.math || t.anyMode)) {
      const typed = /[\\^_{}]/.test(value.latex) ? `\\detokenize{${value.latex}}` : value.latex;
      return `\\texorpdfstring{${t.anyMode ? `\\ensuremath{${value.latex}}` : `$${value.latex}$`}}{${typed}}`;
    }
    // In a macro's definition or use the mode is TeX's to know when it expands the macro: a form for both, as the package's.
    if (t.anyMode) return value.kind === 'math' ? `\\ensuremath{${value.latex}}` : `\\ifmmode\\mbox{${value.text}}\\else ${value.text}\\fi`;
    if (value.kind === 'math') return t.math ? value.latex : `$${value.latex}$`;
    return t.math ? `\\mbox{${value.text}}` : value.text;
  }
  // An empty cell: a comment or \cellcolor it holds stays before the value; blank cells get it after their first space.
  // Its column template may already be math (>{$}c<{$}), so a math value switches to math only where needed, as the package does.
  const inCell = value.kind === 'math' ? `\\ensuremath{${value.latex}}` : value.text;
  const held = written.slice(0, t.valueAt - t.raw.start);
  const at = held.trim() === '' ? (written.startsWith(' ') ? 1 : 0) : held.length;
  return `${written.slice(0, at)}${inCell}${written.slice(at) || ' '}`;
}
