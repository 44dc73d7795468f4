/**
 * The manuscript formats, chosen by file extension. Each format's module (and the
 * parser stack behind it) is imported only when a file of that kind is read, so
 * `check paper.tex` never loads remark and `compute` loads neither.
 */
import { extname } from 'node:path';
import { FORMAT_EXTENSIONS, type ManuscriptFormat } from './types.ts';

interface FormatEntry {
  readonly name: string;
  readonly extensions: readonly string[];
  readonly load: () => Promise<ManuscriptFormat>;
}

const entries: readonly FormatEntry[] = [
  { name: 'markdown', extensions: FORMAT_EXTENSIONS.markdown, load: async () => (await import('./markdown.ts')).markdownFormat },
  { name: 'latex', extensions: FORMAT_EXTENSIONS.latex, load: async () => (await import('./latex.ts')).latexFormat },
];

/** A format whose module is imported on its first check or build. */
function lazyFormat(entry: FormatEntry): ManuscriptFormat {
  let loaded: Promise<ManuscriptFormat> | undefined;
  const format = () => (loaded ??= entry.load());
  return {
    name: entry.name,
    extensions: entry.extensions,
    check: async (path, options) => (await format()).check(path, options),
    build: async (path, options) => (await format()).build(path, options),
  };
}

export const formats: readonly ManuscriptFormat[] = entries.map(lazyFormat);

export function formatFor(path: string): ManuscriptFormat | undefined {
  const ext = extname(path).toLowerCase();
  return formats.find((f) => f.extensions.includes(ext));
}

export function knownExtensions(): string[] {
  return formats.flatMap((f) => [...f.extensions]);
}
