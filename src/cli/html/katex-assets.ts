/**
 * KaTeX's stylesheet with its fonts inlined as data URLs, read from the
 * installed katex package, so the page needs no network. Only the WOFF2 face
 * of each font is kept: every browser that runs KaTeX's CSS reads WOFF2.
 */
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

let cached: string | undefined;

export function inlinedKatexCss(): string {
  if (cached !== undefined) return cached;
  const dist = dirname(fileURLToPath(import.meta.resolve('katex')));
  const css = readFileSync(join(dist, 'katex.min.css'), 'utf8');
  cached = css.replace(/src:url\((fonts\/[^)]+\.woff2)\) format\("woff2"\)(?:,url\([^)]+\) format\("[a-z]+"\))*/g, (_, font: string) => {
    const data = readFileSync(join(dist, font)).toString('base64');
    return `src:url(data:font/woff2;base64,${data}) format("woff2")`;
  });
  if (/url\((?!data:)/.test(cached)) throw new Error('katex.min.css has a font reference this inliner does not understand');
  return cached;
}
