/**
 * The plugin inside a plain unified pipeline next to remark-gfm, remark-math,
 * remark-frontmatter and remark-directive: vfile messages carry positions and
 * rule ids, and the filled tree renders through remark-rehype and rehype-katex
 * (KaTeX is the outside reference for the typeset math) to the same HTML as
 * the byte-preserving splice does.
 */
import rehypeKatex from 'rehype-katex';
import rehypeStringify from 'rehype-stringify';
import remarkDirective from 'remark-directive';
import remarkFrontmatter from 'remark-frontmatter';
import remarkGfm from 'remark-gfm';
import remarkMath from 'remark-math';
import remarkParse from 'remark-parse';
import remarkRehype from 'remark-rehype';
import remarkStringify from 'remark-stringify';
import type { Root } from 'mdast';
import { unified } from 'unified';
import { VFile } from 'vfile';
import { describe, expect, it } from 'vitest';
import remarkSkeinproof, { applySplices } from '../../plugins/remark/index.ts';

const DOC = `---
skeinproof:
  notation: braid
---

\`\`\`skein id=fig8
1 -2 1 -2
\`\`\`

The figure-eight has $V =$ :jones{of=fig8} and writhe :writhe[$0$]{of=fig8}; ~~struck~~ text stays.

:::invariants
| diagram | span | crossing number |
|---|---|---|
| fig8 | | $4$ |
:::
`;

function base() {
  return unified().use(remarkParse).use(remarkFrontmatter).use(remarkGfm).use(remarkMath).use(remarkDirective);
}

async function html(markdown: string, skein: boolean): Promise<string> {
  const p = skein ? base().use(remarkSkeinproof) : base();
  const file = new VFile({ value: markdown, path: 'doc.md' });
  const tree = (await p.run(p.parse(file), file)) as Root;
  tree.children = tree.children.filter((n) => n.type !== 'yaml');
  const hast = await unified().use(remarkRehype).use(rehypeKatex).run(tree, file);
  return unified().use(rehypeStringify).stringify(hast);
}

describe('in a unified pipeline', () => {
  it('renders the filled tree with KaTeX, as the splice path does', async () => {
    const viaTree = await html(DOC, true);
    expect(viaTree).toContain('class="katex"');
    expect(viaTree).not.toContain('katex-error');
    expect(viaTree).toContain('<del>struck</del>');
    expect(viaTree).not.toContain('invariants');

    const file = new VFile({ value: DOC, path: 'doc.md' });
    const p = base().use(remarkSkeinproof, { fill: false });
    await p.run(p.parse(file), file);
    const spliced = applySplices(DOC, file.data.skeinproof!.splices);
    expect(await html(spliced, false)).toBe(viaTree);
  });

  it('reports problems as vfile messages with positions, rule ids and fatality', async () => {
    const text = DOC.replace(':writhe[$0$]', ':writhe[$2$]').replace(':jones{of=fig8}', ':jones{of=fig9}');
    const file = new VFile({ value: text, path: 'doc.md' });
    const line = text.split('\n')[9]!;
    const p = base().use(remarkSkeinproof);
    await p.run(p.parse(file), file);
    expect(file.messages.map((m) => [m.ruleId, m.source, m.line, m.column, m.fatal])).toEqual([
      ['target-unknown', 'skeinproof', 10, line.indexOf(':jones') + 1, true],
      ['claim-contradicted', 'skeinproof', 10, line.indexOf('$2$') + 1, true],
    ]);
    expect(file.messages[1]!.expected).toEqual(['0']);
  });

  it('leaves the rest of the tree to remark-stringify untouched by the check', async () => {
    const file = new VFile({ value: DOC, path: 'doc.md' });
    const p = base().use(remarkSkeinproof).use(remarkStringify);
    const out = String(await p.process(file));
    expect(out).toContain('$t^{-2} - t^{-1} + 1 - t + t^2$');
    expect(out).toContain('| fig8    | $4$  | $4$');
  });
});
