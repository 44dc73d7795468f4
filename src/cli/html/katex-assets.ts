/**
 * KaTeX's stylesheet with its fonts inlined as data URLs, read from the
 * installed katex package, so the page needs no network. Only the WOFF2 face
 * of each font is kept: every browser that runs KaTeX's CSS reads WOFF2.
 */
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

let cached: string | undefined;

/** The compiled tool carries KaTeX's stylesheet and fonts in dist/katex (scripts/compile.mjs); the sources read the installed package. */
function katexFolder(): string {
  const shipped = fileURLToPath(new URL('../katex/', import.meta.url));
  return existsSync(join(shipped, 'katex.min.css')) ? shipped : dirname(fileURLToPath(import.meta.resolve('katex')));
}

export function inlinedKatexCss(): string {
  if (cached !== undefined) return cached;
  const dist = katexFolder();
  const css = readFileSync(join(dist, 'katex.min.css'), 'utf8');
  cached = css.replace(/src:url\((fonts\/[^)]+\.woff2)\) format\("woff2"\)(?:,url\([^)]+\) format\("[a-z]+"\))*/g, (_, font: string) => {
    const data = readFileSync(join(dist, font)).toString('base64');
    return `src:url(data:font/woff2;base64,${data}) format("woff2")`;
  });
  if (/url\((?!data:)/.test(cached)) throw new Error('katex.min.css has a font reference this inliner does not understand');
  return cached;
}
