/**
 * The Markdown format: the remark pipeline with the skeinproof plugin for
 * `check`, plus the byte-preserving splice (and the HTML page) for `build`.
 */
import { readFile } from 'node:fs/promises';
import { basename, dirname, extname, join } from 'node:path';
import remarkDirective from 'remark-directive';
import remarkFrontmatter from 'remark-frontmatter';
import remarkGfm from 'remark-gfm';
import remarkMath from 'remark-math';
import remarkParse from 'remark-parse';
import { unified } from 'unified';
import { VFile } from 'vfile';
import type { Diagnostic } from '../../core/diagnostics/diagnostic.ts';
import remarkSkeinproof, { applySplices, sourceOffsetOf, SourceText, type SkeinproofData } from '../../../plugins/remark/index.ts';
import { FORMAT_EXTENSIONS, type FormatOptions, type FormatResult, type ManuscriptFormat, type OutputFile } from './types.ts';

const HTML_EXTENSIONS = ['.html', '.htm'];

type Checked = { readonly ok: true; readonly text: string; readonly data: SkeinproofData } | { readonly ok: false; readonly unreadable: Diagnostic };

async function checkManuscript(path: string, options: FormatOptions): Promise<Checked> {
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch (e) {
    return { ok: false, unreadable: unreadable(path, e) };
  }
  const file = new VFile({ value: text, path });
  const processor = unified()
    .use(remarkParse)
    .use(remarkFrontmatter)
    .use(remarkGfm)
    .use(remarkMath)
    .use(remarkDirective)
    .use(remarkSkeinproof, {
      fill: false,
      ...(options.convention ? { convention: options.convention } : {}),
      ...(options.strict ? { strict: true } : {}),
    });
  await processor.run(processor.parse(file), file);
  return { ok: true, text, data: file.data.skeinproof! };
}

function unreadable(path: string, e: unknown): Diagnostic {
  const code = (e as NodeJS.ErrnoException).code;
  const reason = code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'it is a directory' : code === 'EACCES' ? 'permission denied' : String((e as Error).message);
  return {
    severity: 'error',
    ruleId: 'file-unreadable',
    message: `cannot read ${path}: ${reason}; check the path`,
    location: { file: path, start: { line: 1, column: 1 } },
  };
}

/** Where the build writes when no -o is given: beside the input, never over it. */
export function defaultOutputPath(input: string, html: boolean): string {
  const stem = basename(input, extname(input));
  return join(dirname(input), html ? `${stem}.html` : `${stem}.filled.md`);
}

export const markdownFormat: ManuscriptFormat = {
  name: 'markdown',
  extensions: FORMAT_EXTENSIONS.markdown,

  async check(path, options): Promise<FormatResult> {
    const checked = await checkManuscript(path, options);
    if (!checked.ok) return { diagnostics: [checked.unreadable], outputs: [], inputs: [path], failed: true };
    return { diagnostics: checked.data.diagnostics, outputs: [], inputs: [path], failed: checked.data.failed };
  },

  async build(path, options): Promise<FormatResult> {
    const checked = await checkManuscript(path, options);
    if (!checked.ok) return { diagnostics: [checked.unreadable], outputs: [], inputs: [path], failed: true };
    const { text, data } = checked;
    const html = options.html === true || HTML_EXTENSIONS.includes(extname(options.output ?? '').toLowerCase());
    const output = options.output ?? defaultOutputPath(path, html);
    const filled = applySplices(text, data.splices);
    const outputs: OutputFile[] = [];
    const diagnostics = [...data.diagnostics];
    if (!html) outputs.push({ path: output, content: filled });
    else {
      // The HTML stack (rehype, KaTeX) loads only when a page is written.
      const { renderHtmlPage } = await import('../html/page.ts');
      const page = await renderHtmlPage(filled, {
        title: data.settings.title ?? basename(path, extname(path)),
        allowHtml: options.allowHtml === true,
        path: output,
        ...(data.settings.notation ? { defaultNotation: data.settings.notation } : {}),
      });
      outputs.push({ path: output, content: page.html });
      // The page's offsets count from after a byte order mark, the splices' from the start of the text.
      const bom = text.startsWith('\uFEFF') ? 1 : 0;
      const source = new SourceText(text.slice(bom), path);
      for (const p of page.mathProblems) {
        diagnostics.push({
          severity: 'warning',
          ruleId: 'math-untypeset',
          message: `KaTeX cannot typeset this formula, so the page shows it in red: ${p.message}`,
          location: source.location(p.offset === undefined ? 0 : sourceOffsetOf(data.splices, p.offset + bom) - bom),
          hints: ['Correct the LaTeX of this formula in the manuscript (KaTeX supports most, not all, of LaTeX math).'],
        });
      }
    }
    return { diagnostics, outputs, inputs: [path], failed: data.failed };
  },
};
