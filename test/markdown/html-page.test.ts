/**
 * The HTML page as the build writes it: math KaTeX cannot typeset is reported
 * at the formula in the manuscript (not in the filled-in text the page is made
 * from) with KaTeX's reason, and everything the author wrote reaches the page
 * as text. Value from memory: the positive trefoil σ₁³ has V = t + t³ − t⁴.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { markdownFormat } from '../../src/cli/formats/markdown.ts';
import { positionOf } from './helpers.ts';

const work = mkdtempSync(join(tmpdir(), 'skeinproof-page-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

const TREFOIL = '```skein id=k notation=braid\n1 1 1\n```\n';

async function page(name: string, text: string) {
  const path = join(work, name);
  writeFileSync(path, text);
  const result = await markdownFormat.build(path, { output: join(work, `${name}.html`), html: true });
  return { result, html: String(result.outputs[0]!.content) };
}

describe('math KaTeX cannot typeset', () => {
  it('is reported at the formula in the manuscript, with KaTeX’s reason', async () => {
    for (const bom of ['', '\uFEFF']) {
      // The fill-in before the formula and the emptied fence lines make the filled-in text differ from the manuscript.
      const body = `${TREFOIL}\n:::invariants\n| diagram | jones |\n|---|---|\n| k | |\n:::\nHere :jones{of=k} and :writhe[$3$]{of=k} then $\\frac{1}{$ ends.\n`;
      const { result } = await page(`broken${bom ? '-bom' : ''}.md`, bom + body);
      const problems = result.diagnostics.filter((d) => d.ruleId === 'math-untypeset');
      expect(problems.map((d) => `${d.location?.start.line}:${d.location?.start.column}`)).toEqual([positionOf(body, '$\\frac')]);
      expect(problems[0]!.message).toContain("expected '}'");
    }
  });
});

describe('what the author wrote', () => {
  it('reaches the page as text: prose, code, diagram codes, claim labels, table cells, the title', async () => {
    const text = [
      '---',
      'title: "</title><script>t()</script>"',
      '---',
      TREFOIL,
      'Prose <script>p()</script> and `<script>c()</script>`.',
      '',
      'A claim :crossings[<script>l()</script> 3]{of=k} and :writhe[$3$]{of=k}.',
      '',
      ':::invariants',
      '| diagram | writhe | remarks |',
      '|---|---|---|',
      '| k | | <script>r()</script> |',
      ':::',
      '',
    ].join('\n');
    const { html } = await page('escape.md', text);
    expect(html).not.toMatch(/<script/i);
    for (const call of ['p()', 'c()', 'l()', 'r()']) expect(html).toContain(`&#x3C;script>${call}&#x3C;/script>`);
    expect(html).toContain('<title>&lt;/title&gt;&lt;script&gt;t()&lt;/script&gt;</title>');
  });
});
