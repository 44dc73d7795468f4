/**
 * The figure writers and options: byte-identical output for the same code,
 * standalone SVG with title and description, TikZ that pdflatex compiles with
 * the standard tikz package (pdflatex is the reference), an SVG that Chromium
 * renders, and bad options refused with rule figure-option-invalid. Renders go
 * to test-artifacts/figures for a look.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { disjointUnion, withFreeLoops } from '../../src/core/diagram/operations.ts';
import { COMPONENT_COLOURS, drawDiagram, figureSvg, figureTikz, type FigureOptions } from '../../src/core/drawing/index.ts';
import { flattenCubic } from '../../src/core/drawing/geometry.ts';
import { figureQuality } from '../../src/core/drawing/quality.ts';
import { isInputError } from '../../src/core/errors.ts';
import { parseDiagramCode } from '../../src/core/notation/index.ts';
import { randomBraidWord, rng } from '../support/random-diagrams.ts';
import { hasPdflatex, pdflatex, tempDir, removeDir } from '../latex/support.ts';

const ARTIFACTS = join(import.meta.dirname, '..', '..', 'test-artifacts', 'figures');
const TREFOIL = '(1,5,2,4) (3,1,4,6) (5,3,6,2)';
const META = { title: 'trefoil <right-handed> & co', description: `PD code ${TREFOIL}` };

describe('figure output', () => {
  it('is byte-identical on every run of the same code', () => {
    const once = () => figureSvg(drawDiagram(parseDiagramCode('1 -2 3 -2 1 3 2', 'braid'), { arrows: true, labels: 'both', colours: true }), META);
    expect(once()).toBe(once());
    const tikz = () => figureTikz(drawDiagram(parseDiagramCode(TREFOIL, 'pd')), META);
    expect(tikz()).toBe(tikz());
  });

  it('writes a standalone SVG with an escaped title and description, one path per stroke, no "-0" and at most two decimals', () => {
    const drawing = drawDiagram(parseDiagramCode(TREFOIL, 'pd'), { size: 300 });
    const svg = figureSvg(drawing, META);
    expect(svg).toMatch(/^<svg xmlns="http:\/\/www.w3.org\/2000\/svg" width="[\d.]+" height="[\d.]+" viewBox="0 0 [\d.]+ [\d.]+"/);
    expect(svg).toContain('<title>trefoil &lt;right-handed&gt; &amp; co</title>');
    expect(svg).toContain(`<desc>PD code ${TREFOIL}</desc>`);
    // A trefoil has three over-strands, each drawn as one unbroken stroke between two under-passes (common practice).
    expect(svg.match(/<path stroke=/g)?.length).toBe(3);
    expect(Math.max(drawing.width, drawing.height)).toBeCloseTo(300, 6);
    expect(svg).not.toMatch(/[ ,CML]-0[ ,"CMLZ]/);
    expect(svg).not.toMatch(/\d\.\d{3}/);
  });

  it('gives each component its own colour from the palette, and arrows and labels on request', () => {
    const link = withFreeLoops(closeBraid([1, 1, 1, 1], 2), 1);
    const drawing = drawDiagram(link, { colours: true, arrows: true, labels: 'both' });
    expect(drawing.components.map((c) => c.colour)).toEqual(COMPONENT_COLOURS.slice(0, 3));
    expect(drawing.arrowheads.length).toBe(link.edgeCount);
    expect(drawing.labels.filter((l) => l.kind === 'crossing').map((l) => l.text)).toEqual(['1', '2', '3', '4']);
    expect(drawing.labels.filter((l) => l.kind === 'edge').length).toBe(link.edgeCount);
    const plain = drawDiagram(link);
    expect(new Set(plain.components.map((c) => c.colour))).toEqual(new Set(['#000000']));
    expect(plain.arrowheads).toEqual([]);
    expect(plain.labels).toEqual([]);
  });

  it('draws the face left of the chosen edge outside: the bounding box changes, the diagram does not', () => {
    const d = parseDiagramCode('1 -2 1 -2', 'braid');
    const a = drawDiagram(d);
    const b = drawDiagram(d, { outerFace: 2 });
    expect(figureSvg(a, META)).not.toBe(figureSvg(b, META));
    expect(b.crossings.length).toBe(4);
  });

  it('crosses at angles of at least 60° and keeps strands apart on small classical diagrams', () => {
    for (const [code, notation] of [[TREFOIL, 'pd'], ['1 -2 1 -2', 'braid'], ['1 1 1 1 1 1 1', 'braid'], ['torus 3 4', 'family']] as const) {
      const q = figureQuality(drawDiagram(parseDiagramCode(code, notation)));
      expect(q.crossingAngles.min, code).toBeGreaterThan(60);
      expect(q.closestStrands, code).toBeGreaterThan(0.05);
    }
  });
});

describe('figure quality', () => {
  it('measures the bends of a round circle as its geometry gives them', () => {
    // A circle of radius r turns by s/r radians along an arc of length s (common practice). A lone free loop is
    // drawn as a circle and its typical edge length is its diameter 2r, so it turns 2 rad (360°/π) per edge
    // length and (2r/4)/r = 0.5 rad (28.6°) along a quarter of it; the flattened samples may add one sample's turn (7.5°).
    const { bends } = figureQuality(drawDiagram(closeBraid([], 1)));
    expect(bends.perEdge).toBeCloseTo(360 / Math.PI, 0);
    expect(bends.sharpest).toBeGreaterThan(28.6 - 7.5);
    expect(bends.sharpest).toBeLessThan(28.6 + 7.5);
  });
});

describe('layout quality', () => {
  // The layout's targets (README, figures): crossings within a factor 2 of each other in size, no kinks.
  // A packing alone misses the size target on these (a clasp and a twisted centre shrink), so they need the relaxation.
  it('draws the figure eight, T(3,4) and the pretzel (-2,3,7) with even crossings and no sharp kinks', () => {
    for (const [code, notation] of [['1 -2 1 -2', 'braid'], ['torus 3 4', 'family'], ['pretzel -2 3 7', 'family']] as const) {
      const q = figureQuality(drawDiagram(parseDiagramCode(code, notation)));
      expect(q.crossingSizeRatio, code).toBeLessThan(2);
      expect(q.bends.sharpest, code).toBeLessThan(120);
    }
  });
});

describe('crossing numbers', () => {
  // Legibility (common practice): a number must not sit on a strand or on another number.
  it('sit clear of the strands and of each other, on small and dense figures', () => {
    const random = rng(4242);
    const diagrams = [parseDiagramCode('pretzel -2 3 7', 'family'), parseDiagramCode('torus 3 4', 'family'), closeBraid(randomBraidWord(random, 5, 30), 5), closeBraid(randomBraidWord(random, 7, 80), 7)];
    for (const d of diagrams) {
      const drawing = drawDiagram(d, { labels: 'crossings', size: 600 });
      const ink = drawing.components.flatMap((c) => c.centreLine.flatMap((k) => flattenCubic(k, 40)));
      const numbers = drawing.labels.filter((l) => l.kind === 'crossing');
      expect(numbers.length).toBe(d.crossings.length);
      for (const label of numbers) {
        const nearest = Math.min(...ink.map((p) => Math.hypot(p.x - label.at.x, p.y - label.at.y)));
        // Half the text's height plus half the stroke: the digits' box does not reach the stroke's edge.
        expect(nearest, `crossing ${label.text}`).toBeGreaterThan(0.36 * drawing.fontSize + drawing.lineWidth / 2);
        for (const other of numbers) {
          if (other !== label) expect(Math.hypot(other.at.x - label.at.x, other.at.y - label.at.y), `${label.text} and ${other.text}`).toBeGreaterThan(drawing.fontSize);
        }
      }
    }
  });
});

describe('figure options', () => {
  const d = parseDiagramCode(TREFOIL, 'pd');
  const refused = (options: FigureOptions, pattern: RegExp) => {
    try {
      drawDiagram(d, options);
    } catch (error) {
      expect(isInputError(error) && error.ruleId).toBe('figure-option-invalid');
      expect((error as Error).message).toMatch(pattern);
      return;
    }
    throw new Error(`accepted ${JSON.stringify(options)}`);
  };
  it('refuses bad values, naming the option and what it takes', () => {
    refused({ size: 5 }, /size is 5; it takes a number from 20 to 10000/);
    refused({ size: Number.NaN }, /size is not a number/);
    refused({ lineWidth: -1 }, /line-width is -1; it takes a positive number/);
    refused({ gap: 1000 }, /gap is 1000; it takes a non-negative number of at most 48/);
    refused({ labels: 'all' as never }, /labels is "all"; it takes one of none, crossings, edges, both/);
    refused({ arrows: 'yes' as never }, /arrows is "yes"; it takes true or false/);
    refused({ outerFace: 7 }, /outer-face is 7; it takes an edge number from 1 to 6/);
    refused({ outerFace: 1.5 }, /outer-face is 1.5/);
  });
});

describe.skipIf(!hasPdflatex)('the TikZ under pdflatex', () => {
  it('compiles with the standard tikz package, for a knot, a coloured link with labels and arrows, and split pieces with a free loop', () => {
    const dir = tempDir('skeinproof-figure-');
    try {
      const pictures = [
        figureTikz(drawDiagram(parseDiagramCode(TREFOIL, 'pd')), META),
        figureTikz(drawDiagram(closeBraid([1, 2, 1, 2, 2, 1], 3), { colours: true, labels: 'both', arrows: true, size: 100 }), { title: 'a link', description: 'braid 1 2 1 2 2 1 % with a comment sign' }),
        figureTikz(drawDiagram(withFreeLoops(disjointUnion(closeBraid([1, 1, 1], 2), closeBraid([1, -2, 1, -2], 3)), 1)), { title: 'split', description: 'pieces' }),
      ];
      writeFileSync(join(dir, 'figure.tex'), `\\documentclass{article}\n\\usepackage{tikz}\n\\begin{document}\n${pictures.join('\n\\bigskip\n')}\n\\end{document}\n`);
      const run = pdflatex(dir, 'figure.tex');
      expect(run.ok, run.log.slice(-2000)).toBe(true);
      expect(run.log).not.toMatch(/Overfull|Undefined control sequence|Font shape|size substitutions/i);
      mkdirSync(ARTIFACTS, { recursive: true });
      execFileSync('pdftoppm', ['-png', '-r', '100', '-f', '1', '-l', '1', '-singlefile', join(dir, 'figure.pdf'), join(ARTIFACTS, 'tikz-page')]);
      expect(existsSync(join(ARTIFACTS, 'tikz-page.png'))).toBe(true);
    } finally {
      removeDir(dir);
    }
  });
});

const CHROMIUM = '/usr/bin/chromium';

describe.skipIf(!existsSync(CHROMIUM))('the SVG in Chromium', () => {
  it('renders the figure as drawn: ink on every stroke, none in the margin', async () => {
    const { chromium } = await import('playwright-core');
    const drawing = drawDiagram(parseDiagramCode(TREFOIL, 'pd'), { colours: true, labels: 'crossings', arrows: true });
    const svg = figureSvg(drawing, META);
    mkdirSync(ARTIFACTS, { recursive: true });
    writeFileSync(join(ARTIFACTS, 'trefoil.svg'), svg);
    const browser = await chromium.launch({ executablePath: CHROMIUM, args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking'] });
    try {
      const page = await browser.newPage();
      await page.setContent(`<html><body style="margin:0;background:#fff">${svg}</body></html>`);
      await page.locator('svg').screenshot({ path: join(ARTIFACTS, 'trefoil.png') });
      // Ink on the middle of every stroke, none in the margin (SVG's y axis points down).
      const onStrokes = drawing.components.flatMap((c) => c.strokes.map((stroke) => stroke.cubics[stroke.cubics.length >> 1]!.from)).map((p) => ({ x: p.x, y: drawing.height - p.y }));
      const alphas = await page.evaluate(
        async ({ source, points }) => {
          const image = new Image();
          image.src = `data:image/svg+xml;base64,${btoa(source)}`;
          await image.decode();
          const canvas = document.createElement('canvas');
          canvas.width = image.width;
          canvas.height = image.height;
          const context = canvas.getContext('2d')!;
          context.drawImage(image, 0, 0);
          return points.map((p) => context.getImageData(Math.floor(p.x), Math.floor(p.y), 1, 1).data[3]!);
        },
        { source: svg, points: [...onStrokes, { x: 1, y: 1 }] },
      );
      expect(alphas.slice(0, -1).every((a) => a > 0)).toBe(true);
      expect(alphas[alphas.length - 1]).toBe(0);
      const inked = await page.evaluate(() => document.querySelectorAll('svg path').length);
      expect(inked).toBe(3 + 6);
      expect(await page.evaluate(() => document.querySelector('svg title')?.textContent)).toBe(META.title);
    } finally {
      await browser.close();
    }
  });
});

