/**
 * The built HTML page in a real browser (Debian's chromium through
 * playwright-core): KaTeX has typeset the computed polynomials, no formula
 * failed, the fonts came from the page itself, and raw HTML stayed text.
 * Values from memory (standard tables): positive trefoil V = t + t³ − t⁴,
 * figure-eight V = t⁻² − t⁻¹ + 1 − t + t².
 */
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium, type Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { markdownFormat } from '../../src/cli/formats/markdown.ts';

const ROOT = join(import.meta.dirname, '..', '..');
const ARTIFACTS = join(ROOT, 'test-artifacts');
const CHROMIUM = '/usr/bin/chromium';
const available = existsSync(CHROMIUM);
if (!available) console.log(`browser tests skipped: ${CHROMIUM} is missing (CI installs it via .ci/run; locally: apt-get install chromium)`);

let browser: Browser | undefined;
beforeAll(async () => {
  if (!available) return;
  browser = await chromium.launch({ executablePath: CHROMIUM, args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking'] });
}, 30_000);
afterAll(async () => {
  await browser?.close();
});

async function buildPage(sample: string, name: string, allowHtml = false): Promise<string> {
  const out = join(ARTIFACTS, name);
  const result = await markdownFormat.build(sample, { output: out, html: true, allowHtml });
  expect(result.diagnostics.filter((d) => d.severity !== 'note')).toEqual([]);
  mkdirSync(ARTIFACTS, { recursive: true });
  writeFileSync(out, result.outputs[0]!.content);
  return out;
}

describe.skipIf(!available)('the HTML page in chromium', () => {
  it('shows the typeset polynomials with KaTeX and its inlined fonts, no errors, no network', async () => {
    const path = await buildPage(join(ROOT, 'samples/twists-and-weaves.md'), 'twists-and-weaves.html');
    const page = await browser!.newPage();
    const requests: string[] = [];
    page.on('request', (r) => requests.push(r.url()));
    await page.goto(pathToFileURL(path).href);
    const tex = await page.$$eval('.katex annotation[encoding="application/x-tex"]', (nodes) => nodes.map((n) => n.textContent ?? ''));
    expect(tex).toContain('t + t^3 - t^4');
    expect(tex).toContain('t^{-2} - t^{-1} + 1 - t + t^2');
    // The rendered glyphs, not only the annotation: KaTeX's visible HTML for the trefoil.
    const visible = await page.$$eval('.katex-html', (nodes) => nodes.map((n) => (n.textContent ?? '').replace(/\s+/g, '')));
    expect(visible).toContain('t+t3−t4');
    expect(await page.locator('.katex-error').count()).toBe(0);
    const loaded = await page.evaluate(async () => {
      await document.fonts.ready;
      return [...document.fonts].filter((f) => f.status === 'loaded').map((f) => f.family);
    });
    expect(loaded.some((f) => f.replace(/"/g, '') === 'KaTeX_Main')).toBe(true);
    expect(requests.filter((u) => !u.startsWith('file:') && !u.startsWith('data:'))).toEqual([]);
    const table = await page.$$eval('table tr', (rows) => rows.length);
    expect(table).toBe(11);
    const captions = await page.$$eval('figure.skein-diagram figcaption', (nodes) => nodes.map((n) => n.textContent));
    expect(captions).toHaveLength(14);
    expect(captions[0]).toBe('twist-2 (braid word)');
    expect(captions).toContain('weave-3-gauss (Gauss code)');
    await page.screenshot({ path: join(ARTIFACTS, 'twists-and-weaves.png'), fullPage: true });
    await page.close();
  }, 30_000);

  it('draws the figures the build placed: SVG that survived the sanitizer, laid out with strokes inside the picture', async () => {
    const path = await buildPage(join(ROOT, 'samples/twists-and-weaves.md'), 'twists-and-weaves.html');
    const page = await browser!.newPage();
    await page.goto(pathToFileURL(path).href);
    const figures = page.locator('figure.skein-drawing svg');
    expect(await figures.count()).toBe(3);
    // The browser's own geometry: each stroke lies inside its picture's box, and the picture has a size.
    const boxes = await page.$$eval('figure.skein-drawing svg', (svgs) =>
      svgs.map((svg) => {
        const frame = svg.getBoundingClientRect();
        const strokes = [...svg.querySelectorAll('path')].map((p) => p.getBoundingClientRect());
        const inside = strokes.every((r) => r.left >= frame.left - 1 && r.right <= frame.right + 1 && r.top >= frame.top - 1 && r.bottom <= frame.bottom + 1);
        return { width: frame.width, height: frame.height, strokes: strokes.length, inside, title: svg.querySelector('title')?.textContent ?? '' };
      }),
    );
    expect(boxes.map((b) => b.title)).toEqual(['The two-component twist T2, oriented, one colour per component', 'The twist T5 with numbered crossings', 'The weave W2']);
    for (const b of boxes) {
      expect(b.width).toBeGreaterThan(100);
      expect(b.height).toBeGreaterThan(100);
      expect(b.strokes).toBeGreaterThan(2);
      expect(b.inside).toBe(true);
    }
    // Labels=crossings on T5: one number per crossing of the braid word 1 1 1 1 1.
    expect(await page.$$eval('figure.skein-drawing svg text', (t) => t.map((n) => n.textContent))).toEqual(['1', '2', '3', '4', '5']);
    const section = await page.evaluate(() => {
      const h = [...document.querySelectorAll('h2')].find((e) => e.textContent === 'Pictures')!;
      const r = h.getBoundingClientRect();
      return { y: r.top + window.scrollY, bottom: document.documentElement.scrollHeight };
    });
    await page.screenshot({ path: join(ARTIFACTS, 'figures-page.png'), fullPage: true, clip: { x: 0, y: section.y, width: 1280, height: Math.min(900, section.bottom - section.y) } });
    await page.close();
  }, 30_000);

  it('shows raw HTML as text unless allowed', async () => {
    const sample = join(ARTIFACTS, 'raw-html.md');
    mkdirSync(ARTIFACTS, { recursive: true });
    writeFileSync(sample, '```skein id=k notation=braid\n1 1 1\n```\n\n<b id="raw">bold</b> and :jones{of=k}\n');
    for (const allowHtml of [false, true]) {
      const path = await buildPage(sample, `raw-html-${allowHtml}.html`, allowHtml);
      const page = await browser!.newPage();
      await page.goto(pathToFileURL(path).href);
      // The sanitizer prefixes the author's ids (against DOM clobbering), as GitHub does.
      expect(await page.locator('#user-content-raw').count()).toBe(allowHtml ? 1 : 0);
      if (!allowHtml) expect(await page.locator('main').textContent()).toContain('<b id="raw">bold</b>');
      expect(await page.locator('.katex').count()).toBe(1);
      await page.close();
    }
  }, 30_000);

  it('runs no script of the author’s, navigates nowhere and submits nothing, even without the page’s own policy', async () => {
    // Vectors from the OWASP XSS filter evasion cheat sheet (common practice). Each would set the marker if it ran.
    const hit = "document.documentElement.setAttribute('data-pwned','1')";
    const sample = join(ARTIFACTS, 'hostile.md');
    mkdirSync(ARTIFACTS, { recursive: true });
    writeFileSync(
      sample,
      [
        '```skein id=k notation=braid\n1 1 1\n```',
        '',
        `[script link](javascript:${hit}) and :jones{of=k}`,
        '',
        `<a id="raw-link" href="javascript:${hit}">raw link</a> <img src="nowhere.png" onerror="${hit}"> <svg><script>${hit}</script></svg>`,
        '',
        `<details open ontoggle="${hit}"><summary>s</summary>d</details> <div onmouseover="${hit}" style="width:100px;height:50px">hover</div>`,
        '',
        '<meta http-equiv="refresh" content="0;url=about:blank#navigated">',
        '',
        '<form action="about:blank#submitted"><button id="send">send</button></form>',
        '',
      ].join('\n'),
    );
    for (const allowHtml of [false, true]) {
      const path = await buildPage(sample, `hostile-${allowHtml}.html`, allowHtml);
      // A site that copies the page may have a laxer policy: take ours away, so only the sanitizer protects.
      const unprotected = join(ARTIFACTS, `hostile-${allowHtml}-no-policy.html`);
      writeFileSync(unprotected, readFileSync(path, 'utf8').replace(/<meta http-equiv="Content-Security-Policy"[^>]*>/, ''));
      const page = await browser!.newPage();
      const url = pathToFileURL(unprotected).href;
      await page.goto(url);
      // Follow every link, hover every element and press every button, as a reader might.
      await page.evaluate(() => {
        for (const element of document.querySelectorAll('main *')) {
          element.dispatchEvent(new MouseEvent('mouseover', { bubbles: true }));
          if (element instanceof HTMLAnchorElement || element instanceof HTMLButtonElement) element.click();
        }
      });
      await page.waitForTimeout(300);
      expect(page.url()).toBe(url);
      expect(await page.evaluate(() => document.documentElement.getAttribute('data-pwned'))).toBeNull();
      expect(await page.locator('.katex').count()).toBe(1);
      await page.close();
    }
  }, 30_000);
});
