/**
 * The HTML page as the build writes it: math KaTeX cannot typeset is reported
 * at the formula in the manuscript (not in the filled-in text the page is made
 * from) with KaTeX's reason, and everything the author wrote reaches the page
 * as text. Value from memory: the positive trefoil σ₁³ has V = t + t³ − t⁴.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Root } from 'hast';
import rehypeRaw from 'rehype-raw';
import rehypeStringify from 'rehype-stringify';
import { unified } from 'unified';
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

describe('the page trusts nothing', () => {
  // Vectors from the OWASP XSS filter evasion cheat sheet (common practice); none may survive as markup.
  const HOSTILE = [
    '[link](javascript:alert(1)) and [data](data:text/html,<script>x()</script>) and ![img](javascript:alert(2))',
    '',
    '<a href="javascript:alert(3)">a</a> <img src="x" onerror="alert(4)"> <svg onload="alert(5)"><script>alert(6)</script></svg>',
    '',
    '<iframe src="javascript:alert(7)"></iframe><object data="x"></object><embed src="x"><base href="https://example.invalid/">',
    '',
    '<meta http-equiv="refresh" content="0;url=https://example.invalid/">',
    '',
    '<form action="https://example.invalid/"><button>send</button></form>',
    '',
    '<math><mtext><a href="javascript:alert(8)">m</a></mtext></math> <div style="x" onclick="alert(9)">d</div> <style>body{}</style>',
    '',
  ].join('\n');

  for (const allowHtml of [false, true]) {
    it(`keeps no script URL, event handler, form, refresh or unknown element${allowHtml ? ' with --allow-html' : ''}`, async () => {
      const path = join(work, `hostile-${allowHtml}.md`);
      writeFileSync(path, `${TREFOIL}\n${HOSTILE}\nV = :jones{of=k}.\n`);
      const result = await markdownFormat.build(path, { output: join(work, `hostile-${allowHtml}.html`), html: true, allowHtml });
      const html = String(result.outputs[0]!.content);
      const body = html.slice(html.indexOf('<main>'));
      // Inside tags only: without --allow-html the same words appear escaped, as text.
      expect(body).not.toMatch(/<[a-z][^>]*\s(href|src)="\s*(javascript|data):/i);
      expect(body).not.toMatch(/<(script|iframe|object|embed|base|meta|form|style|button)\b/i);
      expect(body).not.toMatch(/<[a-z][^>]*\son[a-z]+=/i);
      // The KaTeX markup survives whole: MathML and the visible HTML of the trefoil's polynomial.
      expect(body).toContain('<annotation encoding="application/x-tex">t + t^3 - t^4</annotation>');
      expect(body).toMatch(/<span class="katex-html" aria-hidden="true">/);
      if (allowHtml) expect(body).toContain('<div>d</div>');
    });
  }

  it('keeps every piece of KaTeX markup: sanitized and unsanitized renderings agree', async () => {
    // Formulas that make KaTeX write MathML, inline styles and SVG (roots, arrows, braces, accents, arrays).
    const formulas = ['\\sqrt[3]{t}', '\\overrightarrow{AB}', '\\widehat{abc}', '\\underbrace{a+b}_{n}', '\\begin{pmatrix}1&2\\\\3&4\\end{pmatrix}', '\\frac{1}{2}', '\\not=', '\\xrightarrow{f}', '\\cancel{x}', '\\boxed{x}'];
    const text = formulas.map((f) => `$${f}$`).join('\n\n') + '\n';
    const path = join(work, 'katex.md');
    writeFileSync(path, text);
    const result = await markdownFormat.build(path, { output: join(work, 'katex.html'), html: true });
    const html = String(result.outputs[0]!.content);
    const katex = (await import('katex')).default;
    // KaTeX's own string, serialized the way the page is (rehype-raw and rehype-stringify), so only markup that the sanitizer dropped can differ.
    const serialize = async (raw: string): Promise<string> => {
      const processor = unified().use(rehypeRaw).use(rehypeStringify);
      return processor.stringify(await processor.run({ type: 'root', children: [{ type: 'raw', value: raw }] } as Root));
    };
    for (const f of formulas) expect(html).toContain(await serialize(katex.renderToString(f, { strict: 'ignore', trust: false })));
  });
});

describe('the page as authors lay it out', () => {
  it('gives a table its own scroll box, so a wide table does not widen the page', async () => {
    const { html } = await page('wide.md', `| a | b |\n|---|---|\n| ${'x'.repeat(500)} | y |\n`);
    expect(html).toMatch(/<div class="table-scroll"><table>/);
    expect(html).toContain('.table-scroll{overflow-x:auto');
  });

  it('puts the front matter’s title, authors and date at the top', async () => {
    const { html } = await page('front.md', '---\ntitle: Braids <and> bands\nauthor: [A. Writer, {name: B. Coauthor}]\ndate: 2026-12-04\n---\n\nText.\n');
    const body = html.slice(html.indexOf('<main>'));
    expect(body).toMatch(/^<main>\n<header class="skein-front"><h1>Braids &#x3C;and> bands<\/h1><p class="skein-author">A. Writer, B. Coauthor<\/p><p class="skein-date">2026-12-04<\/p><\/header>/);
  });

  it('keeps a text’s own opening heading as the title and puts the authors under it', async () => {
    const { html } = await page('front-h1.md', '---\ntitle: Short\nauthor: A. Writer\n---\n\n# The long title\n\nText.\n');
    expect(html).toContain('<h1>The long title</h1><header class="skein-front"><p class="skein-author">A. Writer</p></header>');
    expect(html).not.toContain('<h1>Short</h1>');
  });

  it('marks each contradicted value visibly (a page written with --force-write), in prose and in table cells', async () => {
    const text = `${TREFOIL}\nWrong: :jones[$t^{-1} + t^{-3} - t^{-4}$]{of=k} and :writhe[$3$]{of=k}.\n\n:::invariants\n| diagram | writhe |\n|---|---|\n| k | $2$ |\n:::\n`;
    const { result, html } = await page('contradicted.md', text);
    expect(result.failed).toBe(true);
    const marks = [...html.matchAll(/<mark class="skein-contradicted" title="([^"]*)">(.*?)<\/mark>/g)];
    expect(marks.map((m) => m[1])).toEqual(['contradicted: computed t + t^3 - t^4', 'contradicted: computed 3']);
    expect(marks[0]![2]).toContain('t^{-1} + t^{-3} - t^{-4}</annotation>');
    // The writhe claim in prose is right (σ₁³ has writhe 3): the table cell's 2 is the second mark.
    expect(marks[1]![2]).toContain('<annotation encoding="application/x-tex">2</annotation>');
    expect(html).toContain('<div class="skein-force-written">');
  });
});
