/**
 * Figures in Markdown: `::drawing[title]{of=ID …}` places the figure of a named diagram. The settings are
 * read and located by the check; the geometry is computed only by a build, which writes the SVG as one
 * HTML block; the page keeps the figure through the sanitizer. The SVG is read back with a general-purpose
 * HTML parser (hast-util-from-html, parse5 underneath), not with skeinproof's own code.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Element, Root } from 'hast';
import { fromHtml } from 'hast-util-from-html';
import { visit } from 'unist-util-visit';
import { VFile } from 'vfile';
import { afterAll, describe, expect, it } from 'vitest';
import { markdownFormat } from '../../src/cli/formats/markdown.ts';
import { placed, positionOf, processMarkdown } from './helpers.ts';

const work = mkdtempSync(join(tmpdir(), 'skeinproof-figures-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

const TREFOIL = '```skein id=k notation=braid\n1 1 1\n```\n';
const HOPF = '```skein id=hopf notation=braid\n1 1\n```\n';

function elements(tree: Root, tagName: string): Element[] {
  const found: Element[] = [];
  visit(tree, 'element', (e: Element) => {
    if (e.tagName === tagName) found.push(e);
  });
  return found;
}

/** The drawn strokes of an SVG: paths (and any polylines) with a stroke, as a browser would draw them. */
function strokes(tree: Root): Element[] {
  return [...elements(tree, 'path'), ...elements(tree, 'polyline')].filter((e) => e.properties['stroke'] !== 'none');
}

describe('the settings', () => {
  it('are read without drawing when checking: nothing is spliced, no error', async () => {
    const text = `${TREFOIL}\n::drawing[The trefoil]{of=k size=5cm line-width=1.2pt gap=3mm arrows=yes colours=no labels=crossings outer-face=2}\n`;
    const r = await processMarkdown(text, { draw: false });
    expect(placed(r.diagnostics)).toEqual([]);
    expect(r.built).toBe(text);
    expect(r.file.data.skeinproof!.session.figures[0]?.options).toEqual({
      // 5cm = 5 · 72/2.54 bp, 1.2pt = 1.2 · 72/72.27 bp, 3mm = 3 · 72/25.4 bp (common practice: the TeX and PostScript units)
      size: 141.732,
      lineWidth: 1.196,
      gap: 8.504,
      arrows: true,
      colours: false,
      labels: 'crossings',
      outerFace: 2,
    });
  });

  it('report every bad one at its place, with a hint, and the run goes on', async () => {
    const line = '::drawing{of=k size=5 colors=yes labels=all arrows=maybe gap=3furlongs outer-face=0 size=4cm}';
    const text = `${TREFOIL}\n${line}\n\nAfter it :writhe[$3$]{of=k}.\n`;
    const r = await processMarkdown(text, { draw: false });
    expect(r.failed).toBe(true);
    const figureErrors = r.diagnostics.filter((d) => d.ruleId === 'figure-option-invalid');
    expect(figureErrors.map((d) => `${d.location?.start.line}:${d.location?.start.column}`)).toEqual([
      positionOf(text, '5 colors'),
      positionOf(text, 'colors'),
      positionOf(text, 'all'),
      positionOf(text, 'maybe'),
      positionOf(text, '3furlongs'),
      positionOf(text, '0 size'),
      positionOf(text, 'size=4cm'),
    ]);
    expect(figureErrors[0]!.message).toContain('has no unit');
    expect(figureErrors[1]!.hints).toEqual(['Did you mean `colours`?']);
    expect(figureErrors[4]!.message).toContain('`furlongs` is not a unit');
    expect(figureErrors[6]!.message).toContain('given twice');
    // The claim after the figure is still judged.
    expect(r.diagnostics.filter((d) => d.ruleId === 'claim-contradicted')).toEqual([]);
  });

  it('refuse an outer face beyond the diagram’s edges, counted as labels=edges numbers them', async () => {
    // The closed 3-braid word σ1³ on 2 strands has 3 crossings and so 6 edges (each crossing has 4 ends, each edge 2).
    const text = `${TREFOIL}\n::drawing{of=k outer-face=7}\n`;
    const r = await processMarkdown(text, { draw: false });
    expect(placed(r.diagnostics)).toEqual([`error figure-option-invalid ${positionOf(text, '7}')}`]);
    expect(r.diagnostics[0]!.message).toContain('the diagram has 6 edges');
  });

  it('take lengths in the units of TeX and CSS, and refuse sizes no page holds', async () => {
    const sizes = ['1in', '72bp', '72.27pt', '96px', '25.4mm', '2.54cm'];
    for (const size of sizes) {
      const r = await processMarkdown(`${TREFOIL}\n::drawing{of=k size=${size}}\n`, { draw: false });
      // One inch in each unit (common practice: 72 bp = 72.27 pt = 96 px = 25.4 mm to the inch).
      expect(r.file.data.skeinproof!.session.figures[0]?.options.size, size).toBe(72);
    }
    const tiny = await processMarkdown(`${TREFOIL}\n::drawing{of=k size=1mm}\n`, { draw: false });
    expect(tiny.diagnostics[0]!.message).toContain('out of range');
  });
});

describe('the markup', () => {
  it('names its diagram: an unknown id is the usual unknown target, with the nearest id', async () => {
    const text = '```skein id=trefoil notation=braid\n1 1 1\n```\n\n::drawing{of=trefoli}\n';
    const r = await processMarkdown(text, { draw: false });
    expect(placed(r.diagnostics)).toEqual([`error target-unknown ${positionOf(text, '::drawing')}`]);
    expect(r.diagnostics[0]!.hints?.[0]).toBe('Did you mean `trefoil`?');
  });

  it('refuses a drawing without a diagram, inline in a sentence, or as a container', async () => {
    const text = `${TREFOIL}\n::drawing[no id]\n\nInline :drawing{of=k} here.\n\n:::drawing{of=k}\n:::\n`;
    const r = await processMarkdown(text, { draw: false });
    expect(placed(r.diagnostics)).toEqual([
      `error markup-invalid ${positionOf(text, '::drawing[')}`,
      `error markup-invalid ${positionOf(text, ':drawing{')}`,
      `error markup-invalid ${positionOf(text, ':::drawing')}`,
    ]);
  });

  it('of an invalid code gets a note pointing at the code, not a second error', async () => {
    const text = '```skein id=bad notation=pd\n(1,2,3)\n```\n\n::drawing{of=bad}\n';
    const r = await processMarkdown(text, { draw: false });
    expect(r.diagnostics.map((d) => `${d.severity} ${d.ruleId}`)).toEqual(['error code-invalid', 'note target-invalid']);
  });

  it('of a family with a free parameter is refused: it is many diagrams', async () => {
    const text = '```skein id=tw notation=family for="n=3..7 step 2"\ntorus 2 n\n```\n\n::drawing{of=tw}\n';
    const r = await processMarkdown(text, { draw: false });
    expect(placed(r.diagnostics)).toEqual([`error figure-option-invalid ${positionOf(text, '::drawing')}`]);
  });
});

describe('the build', () => {
  it('writes each figure as one HTML block holding an SVG whose title is the author’s label', async () => {
    const text = `# Two figures\n\n${TREFOIL}\n${HOPF}\n::drawing[A trefoil, drawn]{of=k arrows=yes}\nThe next line is kept out of the figure.\n\n> ::drawing{of=hopf colours=yes}\n`;
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([]);
    const lines = r.built.split('\n');
    const figureLines = lines.filter((l) => l.includes('<figure'));
    expect(figureLines).toHaveLength(2);
    expect(figureLines[0]).toMatch(/^<figure class="skein-drawing"><svg[^\n]*<\/svg><\/figure>$/);
    expect(figureLines[1]).toMatch(/^> <figure class="skein-drawing"><svg/);
    // A blank line keeps the sentence after the figure out of its HTML block.
    expect(lines[lines.indexOf(figureLines[0]!) + 1]).toBe('');
    const tree = fromHtml(figureLines[0]!, { fragment: true });
    expect(elements(tree, 'title').map((t) => (t.children[0] as { value: string }).value)).toEqual(['A trefoil, drawn']);
    const description = elements(tree, 'desc').map((t) => (t.children[0] as { value: string }).value)[0];
    expect(description).toBe('Diagram k drawn from its braid word 1 1 1: 3 crossings, 1 component.');
    expect(strokes(tree).length).toBeGreaterThan(0);
  });

  it('keeps the manuscript’s line endings around a figure (CRLF here)', async () => {
    const text = `${TREFOIL}\n::drawing{of=k}\nText right after.\n`.replace(/\n/g, '\r\n');
    const r = await processMarkdown(text);
    expect(r.diagnostics).toEqual([]);
    expect(r.built).toMatch(/<\/figure>\r\n\r\nText right after\.\r\n$/);
    expect(r.built.replace(/\r\n/g, '')).not.toContain('\n');
  });

  it('fills a pipeline’s own tree with the figure as raw HTML, which remark-rehype with rehype-raw shows', async () => {
    const { unified } = await import('unified');
    const remarkParse = (await import('remark-parse')).default;
    const remarkDirective = (await import('remark-directive')).default;
    const remarkRehype = (await import('remark-rehype')).default;
    const rehypeRaw = (await import('rehype-raw')).default;
    const remarkSkeinproof = (await import('../../plugins/remark/index.ts')).default;
    const processor = unified().use(remarkParse).use(remarkDirective).use(remarkSkeinproof).use(remarkRehype, { allowDangerousHtml: true }).use(rehypeRaw);
    const file = new VFile({ value: `${TREFOIL}\n::drawing[Trefoil]{of=k}\n`, path: 'doc.md' });
    const tree = (await processor.run(processor.parse(file), file)) as Root;
    expect(elements(tree, 'svg')).toHaveLength(1);
    expect(strokes(tree).length).toBeGreaterThan(0);
  });

  it('keeps a hostile title as text: in the SVG, in the built Markdown and on the page', async () => {
    const path = join(work, 'hostile.md');
    writeFileSync(path, `${TREFOIL}\n::drawing[</title><script>alert(1)</script> & "q"]{of=k}\n`);
    const built = await markdownFormat.build(path, { output: join(work, 'hostile.filled.md') });
    const line = String(built.outputs[0]!.content).split('\n').find((l) => l.startsWith('<figure'))!;
    expect(elements(fromHtml(line, { fragment: true }), 'script')).toEqual([]);
    const page = await markdownFormat.build(path, { output: join(work, 'hostile.html') });
    const tree = fromHtml(String(page.outputs[0]!.content));
    expect(elements(tree, 'script')).toEqual([]);
    expect(elements(tree, 'title').map((t) => (t.children[0] as { value: string } | undefined)?.value)).toContain('</title><script>alert(1)</script> & "q"');
  });

  it('is not attempted by check, and the page keeps every element and attribute of the figure through the sanitizer', async () => {
    const path = join(work, 'figure.md');
    writeFileSync(path, `${TREFOIL}\n::drawing[Trefoil]{of=k arrows=yes colours=yes labels=both}\n`);
    const checked = await markdownFormat.check(path, {});
    expect(checked.diagnostics).toEqual([]);
    const built = await markdownFormat.build(path, { output: join(work, 'figure.filled.md') });
    const svg = /<svg[\s\S]*<\/svg>/.exec(String(built.outputs[0]!.content))![0];
    const page = await markdownFormat.build(path, { output: join(work, 'figure.html') });
    const html = String(page.outputs[0]!.content);
    const onPage = fromHtml(html);
    const figure = elements(onPage, 'figure').find((f) => (f.properties['className'] as string[] | undefined)?.includes('skein-drawing'));
    expect(figure).toBeDefined();
    // The same SVG, parsed on its own, and on the page after sanitizing: nothing of the picture was dropped.
    const alone = fromHtml(svg, { fragment: true });
    const shape = (tree: Root | Element) => {
      const out: string[] = [];
      visit(tree, 'element', (e: Element) => {
        if (tree.type === 'element' || e.tagName !== 'figure') out.push(`${e.tagName}(${Object.keys(e.properties).sort().join(',')})`);
      });
      return out;
    };
    expect(shape(figure!).filter((s) => !s.startsWith('figure('))).toEqual(shape(alone));
  });
});
