/**
 * The sidecar `paper.skein.tex`: the computed values, as definitions the
 * package reads on the next LaTeX run (\skein@value for a fill-in macro of a
 * named diagram, \skein@cell for an empty cell of a skein table). The
 * author's source is never touched.
 */
import { basename, dirname, extname, join } from 'node:path';
import type { Typeset } from '../../src/core/claims/api.ts';
import type { LatexFill } from './reader.ts';

/** `paper.tex` → `paper.skein.tex` beside it: the package looks for \jobname.skein.tex. */
export function sidecarPath(manuscriptPath: string): string {
  const name = basename(manuscriptPath, extname(manuscriptPath));
  return join(dirname(manuscriptPath), `${name}.skein.tex`);
}

export function sidecarText(manuscriptName: string, fills: readonly LatexFill[], values: readonly (Typeset | undefined)[]): string {
  const lines = [
    `% Computed by skeinproof from ${manuscriptName}; \`skeinproof build\` rewrites this file.`,
    '% Read by \\usepackage{skeinproof}. Do not edit: change the manuscript and build again.',
  ];
  const seen = new Set<string>();
  fills.forEach((fill, k) => {
    const value = values[k];
    if (value === undefined) return;
    const [kind, content] = value.kind === 'math' ? ['m', value.latex] : ['t', value.text];
    const t = fill.target;
    const line =
      t.kind === 'macro' ? `\\skein@value{${t.id}}{${t.key}}{${kind}}{${content}}` : `\\skein@cell{${t.table}}{${t.row}}{${t.column}}{${kind}}{${content}}`;
    if (seen.has(line)) return;
    seen.add(line);
    lines.push(line);
  });
  return `${lines.join('\n')}\n`;
}
