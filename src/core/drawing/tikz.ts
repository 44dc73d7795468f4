/**
 * A drawing as a tikzpicture that plain pdflatex compiles with the standard
 * tikz package: coordinates in pt, colours as xcolor's rgb,255 expressions
 * (xcolor comes with tikz), the title and description as comments.
 */
import type { Cubic, Point } from './geometry.ts';
import type { Drawing } from './drawing.ts';
import type { Stroke } from './curves.ts';
import type { FigureMeta } from './svg.ts';
import { fixed } from './number-format.ts';

/** `#rrggbb` as an xcolor colour expression. */
function colour(hex: string): string {
  const channel = (i: number): number => parseInt(hex.slice(1 + 2 * i, 3 + 2 * i), 16);
  return `{rgb,255:red,${channel(0)};green,${channel(1)};blue,${channel(2)}}`;
}

/** One line of comment text: line breaks and TeX's comment-ending characters are harmless in a comment, but a newline would end it. */
const commentLine = (text: string): string => `% ${text.replace(/[\r\n]+/g, ' ')}`;

/** Label text is digits today; anything else is escaped for TeX. */
function texText(text: string): string {
  return text.replace(/[\\{}$&#^_%~]/g, (c) => `\\char${c.charCodeAt(0)}{}`);
}

/** \footnotesize in the standard classes at 10pt, in pt. */
const FOOTNOTE_SIZE = 8;

export function figureTikz(drawing: Drawing, meta: FigureMeta): string {
  const pt = (p: Point): string => `(${fixed(p.x)},${fixed(p.y)})`;
  const cubicText = (k: Cubic): string => ` .. controls ${pt(k.c1)} and ${pt(k.c2)} .. ${pt(k.to)}`;
  const strokePath = (s: Stroke): string => `${pt(s.cubics[0]!.from)}${s.cubics.map(cubicText).join('')}${s.closed ? ' -- cycle' : ''}`;
  const lines: string[] = [
    commentLine(meta.title),
    commentLine(meta.description),
    `\\begin{tikzpicture}[x=1pt,y=1pt,line cap=round,line join=round,line width=${fixed(drawing.lineWidth)}pt]`,
    // A fixed bounding box, so the margins match the SVG.
    `\\useasboundingbox (0,0) rectangle ${pt({ x: drawing.width, y: drawing.height })};`,
  ];
  for (const component of drawing.components) {
    for (const stroke of component.strokes) lines.push(`\\draw[draw=${colour(component.colour)}] ${strokePath(stroke)};`);
  }
  for (const a of drawing.arrowheads) lines.push(`\\fill[fill=${colour(a.colour)}] ${pt(a.tip)} -- ${pt(a.left)} -- ${pt(a.right)} -- cycle;`);
  for (const label of drawing.labels) {
    const shade = label.kind === 'crossing' ? '#444444' : '#767676';
    // A standard size scaled, not \fontsize: odd sizes of the default bitmap-size fonts make LaTeX substitute fonts with a warning.
    lines.push(`\\node[text=${colour(shade)},font=\\footnotesize,scale=${fixed(drawing.fontSize / FOOTNOTE_SIZE, 3)},inner sep=0pt] at ${pt(label.at)} {${texText(label.text)}};`);
  }
  lines.push('\\end{tikzpicture}');
  return `${lines.join('\n')}\n`;
}
