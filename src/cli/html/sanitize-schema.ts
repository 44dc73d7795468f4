/**
 * What the page keeps of its HTML: rehype-sanitize's default (GitHub-style)
 * schema, which drops every script, event handler, script URL and unknown
 * element, plus exactly the markup KaTeX writes (MathML, its spans with inline
 * styles, and the SVG of stretchy accents and roots), the SVG of the
 * figures drawn from diagram codes, and our own figures, table containers and
 * contradiction marks.
 */
import { defaultSchema, type Options as Schema } from 'rehype-sanitize';

/** MathML elements and attributes KaTeX emits (its `htmlAndMathml` output), as hast names them. */
const MATHML: Readonly<Record<string, readonly string[]>> = {
  math: ['xmlns', 'display'],
  semantics: [],
  annotation: ['encoding'],
  mrow: [],
  mi: ['mathvariant'],
  mn: ['mathvariant'],
  mo: ['stretchy', 'fence', 'separator', 'minsize', 'maxsize', 'lspace', 'rspace', 'mathvariant', 'accent'],
  ms: [],
  mtext: ['mathvariant'],
  mspace: ['width', 'height', 'depth', 'mathbackground'],
  msup: [],
  msub: [],
  msubsup: [],
  mfrac: ['linethickness'],
  mroot: [],
  msqrt: [],
  mover: ['accent'],
  munder: ['accentunder'],
  munderover: [],
  mtable: ['rowspacing', 'columnalign', 'columnspacing', 'columnlines', 'rowlines', 'width', 'frame', 'framespacing'],
  mtr: [],
  mtd: ['width', 'columnalign'],
  mlabeledtr: [],
  mstyle: ['scriptlevel', 'displaystyle', 'mathcolor', 'mathbackground', 'mathsize'],
  menclose: ['notation', 'mathbackground'],
  mpadded: ['width', 'height', 'depth', 'lspace', 'voffset'],
  mphantom: [],
};

/** The SVG KaTeX draws for roots, arrows, braces and wide accents. */
const SVG: Readonly<Record<string, readonly string[]>> = {
  svg: ['xmlns', 'width', 'height', 'viewBox', 'preserveAspectRatio', 'style'],
  path: ['d'],
  line: ['x1', 'x2', 'y1', 'y2', 'strokeWidth'],
};

/**
 * The SVG of a figure drawn from a diagram code (src/core/drawing/svg.ts): paths with presentation attributes,
 * a title and description, and text labels. No style, id, link or script attribute is among them.
 */
const FIGURE_SVG: Readonly<Record<string, readonly (string | [string, ...string[]])[]>> = {
  svg: [['role', 'img']],
  title: [],
  desc: [],
  g: ['fill', 'strokeWidth', 'strokeLineCap', 'strokeLineJoin', 'fontFamily', 'fontSize', 'textAnchor', 'dominantBaseline'],
  path: ['stroke', 'fill'],
  text: ['x', 'y', 'fill'],
};

const defaults = defaultSchema.attributes ?? {};

export const PAGE_SCHEMA: Schema = {
  ...defaultSchema,
  tagNames: [...new Set([...(defaultSchema.tagNames ?? []), ...Object.keys(MATHML), ...Object.keys(SVG), ...Object.keys(FIGURE_SVG), 'figure', 'figcaption', 'header', 'mark'])],
  attributes: {
    ...defaults,
    ...Object.fromEntries(Object.entries({ ...MATHML, ...SVG }).map(([tag, names]) => [tag, [...names]])),
    ...Object.fromEntries(Object.entries(FIGURE_SVG).map(([tag, names]) => [tag, [...(SVG[tag] ?? []), ...names]])),
    // KaTeX positions every glyph with inline styles; a style attribute runs no script.
    span: [...(defaults['span'] ?? []), 'className', 'style', 'ariaHidden'],
    div: [...(defaults['div'] ?? []), ['className', 'table-scroll', 'skein-force-written']],
    figure: [['className', 'skein-diagram', 'skein-drawing']],
    header: [['className', 'skein-front']],
    p: [['className', 'skein-author', 'skein-date']],
    mark: [['className', 'skein-contradicted']],
    code: [...(defaults['code'] ?? []), ['className', 'math-inline', 'math-display']],
  },
};
