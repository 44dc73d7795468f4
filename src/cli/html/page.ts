/**
 * The standalone HTML page of a built manuscript: the filled-in Markdown
 * through remark-rehype, rehype-katex and rehype-stringify, wrapped in a page
 * that carries KaTeX's CSS and fonts inline and forbids network loads.
 *
 * Everything the author wrote is escaped. Raw HTML in the Markdown is shown as
 * text unless `allowHtml` is set, when it is passed through unchanged.
 */
import type { Html, Root, Text } from 'mdast';
import rehypeKatex from 'rehype-katex';
import rehypeStringify from 'rehype-stringify';
import remarkFrontmatter from 'remark-frontmatter';
import remarkGfm from 'remark-gfm';
import remarkMath from 'remark-math';
import remarkParse from 'remark-parse';
import remarkRehype, { defaultHandlers } from 'remark-rehype';
import type { Element } from 'hast';
import type { Code } from 'mdast';
import { DIAGRAM_FENCE_LANGUAGE, splitInfoSettings } from '../../../plugins/remark/syntax.ts';
import { unified } from 'unified';
import { visit } from 'unist-util-visit';
import { VFile } from 'vfile';
import { inlinedKatexCss } from './katex-assets.ts';

export interface PageOptions {
  readonly title: string;
  readonly allowHtml?: boolean;
  /** The name used in messages about the page's math. */
  readonly path?: string;
  /** The notation of diagram blocks that name none (the front matter's), for their captions. */
  readonly defaultNotation?: string;
}

export interface RenderedPage {
  readonly html: string;
  /** KaTeX's complaints about math it could not typeset, with the offset of the formula in the Markdown given. */
  readonly mathProblems: readonly { readonly message: string; readonly offset?: number }[];
}

const PAGE_STYLE = `body{margin:0;background:#fdfdfb;color:#1d1d1f;font:17px/1.55 Georgia,"Times New Roman",serif}
main{max-width:52rem;margin:2.5rem auto;padding:0 1.25rem}
table{border-collapse:collapse;margin:1rem 0}
th,td{border:1px solid #c8c8c0;padding:.3rem .6rem;text-align:left;vertical-align:top}
th{background:#f0efe8}
td .katex,td code{white-space:nowrap}
pre{background:#f4f3ee;padding:.6rem .8rem;overflow-x:auto}
figure.skein-diagram{margin:1rem 0}
figure.skein-diagram figcaption{font-size:.85em;color:#55554f}
figure.skein-diagram pre{margin:.2rem 0 0}
code{font-size:.92em}`;

const CONTENT_SECURITY_POLICY = "default-src 'none'; style-src 'unsafe-inline'; font-src data:; img-src 'self' data:";

export async function renderHtmlPage(markdown: string, options: PageOptions): Promise<RenderedPage> {
  const file = new VFile({ value: markdown, ...(options.path ? { path: options.path } : {}) });
  const allow = options.allowHtml === true;
  const processor = unified()
    .use(remarkParse)
    .use(remarkFrontmatter)
    .use(remarkGfm)
    .use(remarkMath)
    .use(() => (tree: Root) => {
      // Front matter is settings, not content.
      tree.children = tree.children.filter((n) => n.type !== 'yaml');
      if (!allow) {
        visit(tree, 'html', (node: Html, index, parent) => {
          if (parent && index !== undefined) parent.children[index] = { type: 'text', value: node.value } satisfies Text as never;
        });
      }
    })
    .use(remarkRehype, { allowDangerousHtml: allow, handlers: { code: diagramFigure(options.defaultNotation) } })
    .use(rehypeKatex, { strict: 'ignore', trust: false })
    .use(rehypeStringify, { allowDangerousHtml: allow });
  const body = String(await processor.process(file));
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
  return {
    html: page,
    mathProblems: file.messages.map((m) => {
      // KaTeX's own words ("Expected '}', got 'EOF'") say what is wrong; the plugin's reason only that something is.
      const cause = m.cause instanceof Error ? m.cause.message : undefined;
      const offset = m.place && 'start' in m.place ? m.place.start.offset : undefined;
      return { message: cause ?? m.reason, ...(offset !== undefined ? { offset } : {}) };
    }),
  };
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

const NOTATION_CAPTIONS: Readonly<Record<string, string>> = { pd: 'PD code', dt: 'DT code', gauss: 'Gauss code', braid: 'braid word' };

function escapeHtml(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}
