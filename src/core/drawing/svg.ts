/**
 * A drawing as a standalone SVG document: a <title> and <desc> naming the
 * diagram and its code, one path per stroke, arrowheads and labels. SVG's y
 * axis points down, so every y is flipped against the height.
 */
import type { Cubic, Point } from './geometry.ts';
import type { Drawing } from './drawing.ts';
import type { Stroke } from './curves.ts';
import { fixed } from './number-format.ts';

export interface FigureMeta {
  /** A short name (the diagram's id, or the code itself). */
  readonly title: string;
  /** A sentence naming the diagram and its code, for screen readers and search. */
  readonly description: string;
}

export function escapeXml(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

export function figureSvg(drawing: Drawing, meta: FigureMeta): string {
  const h = drawing.height;
  const pt = (p: Point): string => `${fixed(p.x)} ${fixed(h - p.y)}`;
  const cubicText = (k: Cubic): string => `C${pt(k.c1)} ${pt(k.c2)} ${pt(k.to)}`;
  const strokePath = (s: Stroke): string => `M${pt(s.cubics[0]!.from)}${s.cubics.map(cubicText).join('')}${s.closed ? 'Z' : ''}`;
  const lines: string[] = [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${fixed(drawing.width)}" height="${fixed(h)}" viewBox="0 0 ${fixed(drawing.width)} ${fixed(h)}" role="img">`,
    `<title>${escapeXml(meta.title)}</title>`,
    `<desc>${escapeXml(meta.description)}</desc>`,
    `<g fill="none" stroke-width="${fixed(drawing.lineWidth)}" stroke-linecap="round" stroke-linejoin="round">`,
  ];
  for (const component of drawing.components) {
    for (const stroke of component.strokes) lines.push(`<path stroke="${component.colour}" d="${strokePath(stroke)}"/>`);
  }
  lines.push('</g>');
  for (const a of drawing.arrowheads) lines.push(`<path fill="${a.colour}" d="M${pt(a.tip)}L${pt(a.left)}L${pt(a.right)}Z"/>`);
  if (drawing.labels.length > 0) {
    lines.push(`<g font-family="sans-serif" font-size="${fixed(drawing.fontSize)}" text-anchor="middle" dominant-baseline="central">`);
    for (const label of drawing.labels) {
      const fill = label.kind === 'crossing' ? '#444444' : '#767676';
      lines.push(`<text x="${fixed(label.at.x)}" y="${fixed(h - label.at.y)}" fill="${fill}">${escapeXml(label.text)}</text>`);
    }
    lines.push('</g>');
  }
  lines.push('</svg>');
  return `${lines.join('\n')}\n`;
}
