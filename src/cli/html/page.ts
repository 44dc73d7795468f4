/**
 * The standalone HTML page of a built manuscript: the filled-in Markdown
 * through remark-rehype, rehype-katex and rehype-stringify, wrapped in a page
 * that carries KaTeX's CSS and fonts inline and forbids network loads.
 *
 * Everything the author wrote is escaped. Raw HTML in the Markdown is shown as
 * text unless `allowHtml` is set, when it is parsed into the page. Either way
 * the finished tree goes through rehype-sanitize (./sanitize-schema.ts), so no
 * script, event handler, script URL, form or refresh survives, whatever
 * policy a site that copies the page applies.
 */
import type { Element, ElementContent, Root as HastRoot } from 'hast';
import { fromHtml } from 'hast-util-from-html';
import type { Html, Nodes, Parent, Root, RootContent, Text } from 'mdast';
import rehypeKatex from 'rehype-katex';
import rehypeRaw from 'rehype-raw';
import rehypeSanitize from 'rehype-sanitize';
import rehypeStringify from 'rehype-stringify';
import remarkFrontmatter from 'remark-frontmatter';
import remarkGfm from 'remark-gfm';
import remarkMath from 'remark-math';
import remarkParse from 'remark-parse';
import { parseInSections } from '../../../plugins/remark/sections.ts';
import remarkRehype, { defaultHandlers } from 'remark-rehype';
import type { Code } from 'mdast';
import { DIAGRAM_FENCE_LANGUAGE, splitInfoSettings } from '../../../plugins/remark/syntax.ts';
import { unified } from 'unified';
import { visit } from 'unist-util-visit';
import { VFile } from 'vfile';
import { parse as parseYaml } from 'yaml';
import { inlinedKatexCss } from './katex-assets.ts';
import { KATEX_OPTIONS } from './math-problems.ts';
import { PAGE_SCHEMA } from './sanitize-schema.ts';
import { NOTATION_NOUNS } from '../../core/notation/nouns.ts';

export interface PageOptions {
  readonly title: string;
  readonly allowHtml?: boolean;
  /** The name used in messages about the page's math. */
  readonly path?: string;
  /** The notation of diagram blocks that name none (the front matter's), for their captions. */
  readonly defaultNotation?: string;
  /**
   * Stretches of the Markdown given (offsets) that hold a contradicted value, marked
   * on the page: a page is only written with them under --force-write.
   */
  readonly contradicted?: readonly ContradictedSpan[];
  /**
   * Where the build placed a drawn figure (offsets of its HTML block in the Markdown given): those blocks,
   * and no raw HTML the author wrote, are parsed into the page (and sanitized like everything else).
   */
  readonly figures?: readonly number[];
}

export interface ContradictedSpan {
  readonly start: number;
  readonly end: number;
  /** Shown when the reader points at the mark, e.g. "contradicted: computed t + t^3 - t^4". */
  readonly note: string;
}

export interface RenderedPage {
  readonly html: string;
}

const PAGE_STYLE = `body{margin:0;background:#fdfdfb;color:#1d1d1f;font:17px/1.55 Georgia,"Times New Roman",serif}
main{max-width:52rem;margin:2.5rem auto;padding:0 1.25rem}
table{border-collapse:collapse;margin:1rem 0}
th,td{border:1px solid #c8c8c0;padding:.3rem .6rem;text-align:left;vertical-align:top}
th{background:#f0efe8}
td .katex,td code{white-space:nowrap}
pre{background:#f4f3ee;padding:.6rem .8rem;overflow-x:auto}
.table-scroll{overflow-x:auto;max-width:100%}
.table-scroll>table{margin:0}
header.skein-front{margin-bottom:1.5rem}
header.skein-front p{margin:.2rem 0;color:#55554f}
mark.skein-contradicted{background:#fde2e0;color:inherit;outline:2px solid #b3261e;text-decoration:underline wavy #b3261e}
mark.skein-contradicted::after{content:" \\2717 contradicted";font-size:.75em;color:#b3261e;font-weight:bold}
div.skein-force-written{border:2px solid #b3261e;background:#fde2e0;padding:.5rem .8rem;margin-bottom:1rem}
figure.skein-diagram{margin:1rem 0}
figure.skein-diagram figcaption{font-size:.85em;color:#55554f}
figure.skein-diagram pre{margin:.2rem 0 0}
figure.skein-drawing{margin:1rem 0;text-align:center}
figure.skein-drawing svg{max-width:100%;height:auto}
code{font-size:.92em}`;

// form-action and base-uri are not covered by default-src: forms must not submit, and no <base> may redirect links.
const CONTENT_SECURITY_POLICY = "default-src 'none'; style-src 'unsafe-inline'; font-src data:; img-src 'self' data:; form-action 'none'; base-uri 'none'";

export async function renderHtmlPage(markdown: string, options: PageOptions): Promise<RenderedPage> {
  const file = new VFile({ value: markdown, ...(options.path ? { path: options.path } : {}) });
  const allow = options.allowHtml === true;
  let front: FrontMatter = {};
  const processor = unified()
    .use(remarkParse)
    .use(remarkFrontmatter)
    .use(remarkGfm)
    .use(remarkMath)
    .use(() => (tree: Root) => {
      // Front matter is settings, not content: only its title, author and date reach the page.
      const yamlNode = tree.children.find((n) => n.type === 'yaml');
      if (yamlNode) front = frontMatterOf(yamlNode.value);
      tree.children = tree.children.filter((n) => n.type !== 'yaml');
      if (options.figures && options.figures.length > 0) placeFigures(tree, new Set(options.figures));
      if (!allow) {
        visit(tree, 'html', (node: Html, index, parent) => {
          if (parent && index !== undefined) parent.children[index] = { type: 'text', value: node.value } satisfies Text as never;
        });
      }
      if (options.contradicted && options.contradicted.length > 0) markContradicted(tree, options.contradicted);
    })
    .use(remarkRehype, { allowDangerousHtml: allow, clobberPrefix: '', handlers: { code: diagramFigure(options.defaultNotation) } })
    .use(allow ? rehypeRaw : () => undefined)
    .use(rehypeKatex, KATEX_OPTIONS)
    .use(rehypeSanitize, PAGE_SCHEMA)
    .use(() => (tree: HastRoot) => {
      followClobberedFragments(tree);
      wrapTables(tree);
      placeFrontHeader(tree, front);
      tree.children.unshift(...forceWrittenBanner(options.contradicted?.length ?? 0));
    })
    .use(rehypeStringify);
  // Parsed in sections, the same tree with the parser's events for one group of sections alive at a time (plugins/remark/sections.ts).
  const tree = parseInSections(markdown, (section) => processor.parse(section));
  const body = processor.stringify(await processor.run(tree, file), file);
  const page = `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta http-equiv="Content-Security-Policy" content="${CONTENT_SECURITY_POLICY}">
<meta name="generator" content="skeinproof">
<title>${escapeHtml(options.title)}</title>
<style>${inlinedKatexCss()}</style>
<style>${PAGE_STYLE}</style>
</head>
<body>
<main>
${body}
</main>
</body>
</html>
`;
  return { html: page };
}

type CodeHandler = (typeof defaultHandlers)['code'];

/** A diagram block becomes a figure captioned with its id and notation, so readers can tell the codes apart. */
const diagramFigure = (defaultNotation: string | undefined): CodeHandler => (state, node: Code) => {
  const block = defaultHandlers.code(state, node);
  if (node.lang !== DIAGRAM_FENCE_LANGUAGE) return block;
  const settings = new Map(splitInfoSettings(node.meta ?? '').settings.map((s) => [s.key, s.value]));
  const id = settings.get('id');
  if (id === undefined) return block;
  const notation = settings.get('notation') ?? defaultNotation;
  const caption = notation ? `${id} (${NOTATION_CAPTIONS[notation] ?? notation})` : id;
  const figure: Element = {
    type: 'element',
    tagName: 'figure',
    properties: { className: ['skein-diagram'], id: `diagram-${id}` },
    children: [{ type: 'element', tagName: 'figcaption', properties: {}, children: [{ type: 'text', value: caption }] }, block],
  };
  return figure;
};

const NOTATION_CAPTIONS: Readonly<Record<string, string>> = { pd: NOTATION_NOUNS.pd, dt: NOTATION_NOUNS.dt, gauss: NOTATION_NOUNS.gauss, braid: NOTATION_NOUNS.braid };

/**
 * The HTML blocks the build wrote for figures become the figure's elements. Only blocks at the given offsets
 * are parsed: raw HTML of the author's is still shown as text unless --allow-html is given.
 */
function placeFigures(tree: Root, at: ReadonlySet<number>): void {
  visit(tree, 'html', (node: Html, index, parent) => {
    const start = node.position?.start.offset;
    if (!parent || index === undefined || start === undefined || !at.has(start)) return;
    const figure = fromHtml(node.value, { fragment: true }).children.find((c): c is Element => c.type === 'element' && c.tagName === 'figure');
    if (!figure) return;
    const drawn = { type: 'skeinFigure', data: { hName: 'figure', hProperties: figure.properties, hChildren: figure.children as ElementContent[] } };
    parent.children[index] = drawn as unknown as RootContent;
  });
}

/** The sanitizer prefixes every id (against DOM clobbering); links to a fragment on the page follow the prefix. */
const CLOBBER_PREFIX = 'user-content-';

function followClobberedFragments(tree: HastRoot): void {
  visit(tree, 'element', (node: Element) => {
    const href = node.properties['href'];
    if (node.tagName === 'a' && typeof href === 'string' && href.startsWith('#') && !href.startsWith(`#${CLOBBER_PREFIX}`)) {
      node.properties['href'] = `#${CLOBBER_PREFIX}${href.slice(1)}`;
    }
  });
}

/** A wide table scrolls inside its own box instead of pushing the whole page sideways. */
function wrapTables(tree: HastRoot): void {
  visit(tree, 'element', (node: Element, index, parent) => {
    if (node.tagName !== 'table' || !parent || index === undefined) return;
    if (parent.type === 'element' && parent.tagName === 'div') return;
    parent.children[index] = { type: 'element', tagName: 'div', properties: { className: ['table-scroll'] }, children: [node] };
    return 'skip';
  });
}

interface FrontMatter {
  readonly title?: string;
  readonly authors?: readonly string[];
  readonly date?: string;
}

/** The author's title, author(s) and date; anything unreadable is left out (the check reports bad YAML). */
function frontMatterOf(yamlText: string): FrontMatter {
  let data: unknown;
  try {
    data = parseYaml(yamlText);
  } catch {
    return {};
  }
  if (typeof data !== 'object' || data === null) return {};
  const record = data as Record<string, unknown>;
  const text = (v: unknown): string | undefined =>
    typeof v === 'string' || typeof v === 'number' ? String(v) : v instanceof Date ? v.toISOString().slice(0, 10) : undefined;
  const person = (v: unknown): string | undefined => text(v) ?? (typeof v === 'object' && v !== null ? text((v as Record<string, unknown>)['name']) : undefined);
  const authorValue = record['author'] ?? record['authors'];
  const authors = (Array.isArray(authorValue) ? authorValue : authorValue === undefined ? [] : [authorValue]).map(person).filter((a): a is string => !!a);
  const title = text(record['title']);
  const date = text(record['date']);
  return { ...(title ? { title } : {}), ...(authors.length > 0 ? { authors } : {}), ...(date ? { date } : {}) };
}

function paragraph(className: string, value: string): Element {
  return { type: 'element', tagName: 'p', properties: { className: [className] }, children: [{ type: 'text', value }] };
}

/**
 * The front matter's title, authors and date at the top of the page. A text that
 * opens with its own top-level heading keeps it as the title; authors and date go under it.
 */
function placeFrontHeader(tree: HastRoot, front: FrontMatter): void {
  const opening = tree.children.findIndex((n) => n.type === 'element' || (n.type === 'text' && n.value.trim() !== ''));
  const opensWithTitle = opening >= 0 && tree.children[opening]!.type === 'element' && (tree.children[opening] as Element).tagName === 'h1';
  const children: Element[] = [];
  if (front.title && !opensWithTitle) children.push({ type: 'element', tagName: 'h1', properties: {}, children: [{ type: 'text', value: front.title }] });
  if (front.authors) children.push(paragraph('skein-author', front.authors.join(', ')));
  if (front.date) children.push(paragraph('skein-date', front.date));
  if (children.length === 0) return;
  const header: Element = { type: 'element', tagName: 'header', properties: { className: ['skein-front'] }, children };
  tree.children.splice(opensWithTitle ? opening + 1 : 0, 0, header);
}

function forceWrittenBanner(count: number): Element[] {
  if (count === 0) return [];
  const what = count === 1 ? 'One stated value contradicts' : `${count} stated values contradict`;
  const text = `${what} the computation; this page was written anyway (--force-write), with each such value marked.`;
  return [{ type: 'element', tagName: 'div', properties: { className: ['skein-force-written'] }, children: [{ type: 'text', value: text }] }];
}

/**
 * Wraps each phrasing node (text, inline math, inline code) that overlaps a
 * contradicted stretch in a mark; the mark's title says what was computed.
 */
function markContradicted(tree: Root, spans: readonly ContradictedSpan[]): void {
  const sorted = [...spans].sort((a, b) => a.start - b.start);
  const overlapping = (node: Nodes): ContradictedSpan | undefined => {
    const start = node.position?.start.offset;
    const end = node.position?.end.offset;
    if (start === undefined || end === undefined) return undefined;
    // Spans are few per page; a linear scan keeps this simple.
    return sorted.find((s) => s.start < end && start < s.end);
  };
  const walk = (parent: Parent): void => {
    parent.children = parent.children.map((child) => {
      if (child.type === 'text' || child.type === 'inlineMath' || child.type === 'inlineCode') {
        const span = overlapping(child);
        if (!span) return child;
        return { type: 'skeinContradicted', children: [child], data: { hName: 'mark', hProperties: { className: ['skein-contradicted'], title: span.note } } } as unknown as RootContent;
      }
      if ('children' in child) walk(child);
      return child;
    }) as typeof parent.children;
  };
  walk(tree);
}

function escapeHtml(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}
