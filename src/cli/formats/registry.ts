/** The manuscript formats, chosen by file extension. */
import { extname } from 'node:path';
import { markdownFormat } from './markdown.ts';
import { latexFormat } from './latex.ts';
import type { ManuscriptFormat } from './types.ts';

export const formats: readonly ManuscriptFormat[] = [markdownFormat, latexFormat];

export function formatFor(path: string): ManuscriptFormat | undefined {
  const ext = extname(path).toLowerCase();
  return formats.find((f) => f.extensions.includes(ext));
}

export function knownExtensions(): string[] {
  return formats.flatMap((f) => [...f.extensions]);
}
