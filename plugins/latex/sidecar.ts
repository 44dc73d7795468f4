/**
 * The sidecar `paper.skein.tex`: the computed values, as definitions the
 * package reads on the next LaTeX run (\skein@value for a fill-in macro of a
 * named diagram, \skein@cell for an empty cell of a skein table,
 * \skein@drawing for the TikZ picture of a \skeindrawing). The author's
 * source is never touched.
 */
import { createHash } from 'node:crypto';
import { basename, dirname, extname, join, relative } from 'node:path';
import type { Typeset } from '../../src/core/claims/api.ts';
import { asciiLatex } from './ascii.ts';
import type { LatexDocument } from './reader.ts';

/** `paper.tex` → `paper.skein.tex` beside it: the package looks for \jobname.skein.tex. */
export function sidecarPath(manuscriptPath: string): string {
  const name = basename(manuscriptPath, extname(manuscriptPath));
  return join(dirname(manuscriptPath), `${name}.skein.tex`);
}

/**
 * The sidecar's text. It starts with the MD5 sum of every file the values
 * were computed from (named as TeX finds them, from the paper's directory),
 * so the package can warn when a file changed after the build and the values
 * may be stale, the way LaTeX warns that labels may have changed.
 */
/** The start of the sidecar's first line: a file without it was not written by skeinproof. */
export const SIDECAR_MARK = '% Computed by skeinproof from ';

export function sidecarText(doc: LatexDocument, values: readonly (Typeset | undefined)[], figures: readonly (string | undefined)[] = []): string {
  const lines = [
    `${SIDECAR_MARK}${basename(doc.main.displayPath)}; \`skeinproof build\` rewrites this file.`,
    '% Read by \\usepackage{skeinproof}. Do not edit: change the manuscript and build again.',
  ];
  const paperDir = dirname(doc.main.absolutePath);
  for (const file of doc.files) {
    const md5 = createHash('md5').update(file.text, 'utf8').digest('hex').toUpperCase();
    lines.push(`\\skein@source{${relative(paperDir, file.absolutePath).split('\\').join('/')}}{${md5}}`);
  }
  const seen = new Set<string>();
  doc.fills.forEach((fill, k) => {
    const value = values[k];
    if (value === undefined) return;
    const [kind, content] = value.kind === 'math' ? ['m', asciiLatex(value.latex)] : ['t', asciiLatex(value.text)];
    const t = fill.target;
    const line =
      t.kind === 'macro' ? `\\skein@value{${t.id}}{${t.key}}{${kind}}{${content}}` : `\\skein@cell{${t.table}}{${t.row}}{${t.column}}{${kind}}{${content}}`;
    if (seen.has(line)) return;
    seen.add(line);
    lines.push(line);
  });
  // The package reads the sidecar while it loads, in the preamble, where tikz can still be loaded.
  if (figures.some((f) => f !== undefined) && !doc.tikzLoaded) lines.push('\\RequirePackage{tikz}');
  doc.figures.forEach((figure, k) => {
    const picture = figures[k];
    if (picture === undefined) return;
    // A figure is found by its id and its settings as written: the package compares them token by token.
    const line = `\\skein@drawing{${figure.id}}{${figure.settingsText}}{%\n${asciiLatex(picture).trimEnd()}}`;
    if (seen.has(line)) return;
    seen.add(line);
    lines.push(line);
  });
  return `${lines.join('\n')}\n`;
}
