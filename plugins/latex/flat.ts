/**
 * The flat copy: the manuscript with every \input and \include spliced in,
 * every fill-in replaced by its value and every piece of skeinproof markup
 * replaced by plain LaTeX, so it compiles without the package. Bytes outside
 * the replaced spans are copied as written.
 */
import type { Typeset } from '../../src/core/claims/api.ts';
import { asciiLatex } from './ascii.ts';
import type { LatexDocument, LatexFill, Splice } from './reader.ts';
import type { SourceFile } from './source-file.ts';

export function flatText(doc: LatexDocument, values: readonly (Typeset | undefined)[]): string {
  return flatFile(doc, doc.main, values);
}

function flatFile(doc: LatexDocument, file: SourceFile, values: readonly (Typeset | undefined)[]): string {
  const splices = [...(doc.splices.get(file) ?? [])].sort((a, b) => a.span.start - b.span.start || a.span.end - b.span.end);
  let out = '';
  let at = 0;
  for (const s of splices) {
    if (s.span.start < at) continue; // inside a span already replaced
    out += file.text.slice(at, s.span.start) + replacement(doc, file, s, values);
    at = s.span.end;
  }
  return out + file.text.slice(at);
}

function replacement(doc: LatexDocument, file: SourceFile, s: Splice, values: readonly (Typeset | undefined)[]): string {
  switch (s.kind) {
    case 'text':
      return s.text;
    case 'include': {
      let body = flatFile(doc, s.file, values);
      // TeX ends every line, the last one too; without this a final comment would swallow what follows.
      if (!body.endsWith('\n')) body += '\n';
      return s.command === 'include' ? `\\clearpage\n${body}\\clearpage\n` : body;
    }
    case 'fill': {
      const value = values[s.fill];
      if (value === undefined) return file.text.slice(s.span.start, s.span.end);
      const ascii: Typeset = value.kind === 'math' ? { ...value, latex: asciiLatex(value.latex) } : { ...value, text: asciiLatex(value.text) };
      return fillText(doc.fills[s.fill]!, ascii, file.text.slice(s.span.start, s.span.end));
    }
  }
}

function fillText(fill: LatexFill, value: Typeset, written: string): string {
  const t = fill.target;
  if (t.kind === 'macro') {
    // hyperref makes a PDF bookmark of a section title, where math is not allowed: it shows the value as typed.
    if (value.kind === 'math' && t.inTitle && !t.math) {
      const typed = /[\\^_{}]/.test(value.latex) ? `\\detokenize{${value.latex}}` : value.latex;
      return `\\texorpdfstring{$${value.latex}$}{${typed}}`;
    }
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
