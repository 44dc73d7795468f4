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
import remarkRehype from 'remark-rehype';
import { unified } from 'unified';
import { visit } from 'unist-util-visit';
import { VFile } from 'vfile';
import { inlinedKatexCss } from './katex-assets.ts';

export interface PageOptions {
  readonly title: string;
  readonly allowHtml?: boolean;
  /** The name used in messages about the page's math. */
  readonly path?: string;
}

export interface RenderedPage {
  readonly html: string;
  /** KaTeX's complaints about math it could not typeset, with positions in the Markdown. */
  readonly mathProblems: readonly { readonly message: string; readonly line?: number; readonly column?: number }[];
}

const PAGE_STYLE = `body{margin:0;background:#fdfdfb;color:#1d1d1f;font:17px/1.55 Georgia,"Times New Roman",serif}
main{max-width:52rem;margin:2.5rem auto;padding:0 1.25rem}
table{border-collapse:collapse;margin:1rem 0}
th,td{border:1px solid #c8c8c0;padding:.3rem .6rem;text-align:left;vertical-align:top}
th{background:#f0efe8}
td .katex{white-space:nowrap}
pre{background:#f4f3ee;padding:.6rem .8rem;overflow-x:auto}
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
    .use(remarkRehype, { allowDangerousHtml: allow })
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
    mathProblems: file.messages.map((m) => ({ message: m.reason, ...(m.line ? { line: m.line } : {}), ...(m.column ? { column: m.column } : {}) })),
  };
}

function escapeHtml(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}
