/** Runs the remark plugin the way `check` and `build` do, on a string. */
import remarkDirective from 'remark-directive';
import remarkFrontmatter from 'remark-frontmatter';
import remarkGfm from 'remark-gfm';
import remarkMath from 'remark-math';
import remarkParse from 'remark-parse';
import { unified } from 'unified';
import { VFile } from 'vfile';
import remarkSkeinproof, { applySplices, type SkeinproofOptions } from '../../plugins/remark/index.ts';
import type { Diagnostic } from '../../src/core/diagnostics/diagnostic.ts';

export interface Processed {
  readonly diagnostics: readonly Diagnostic[];
  readonly failed: boolean;
  readonly built: string;
  readonly file: VFile;
}

export async function processMarkdown(text: string, options: SkeinproofOptions = {}): Promise<Processed> {
  const file = new VFile({ value: text, path: 'doc.md' });
  const processor = unified().use(remarkParse).use(remarkFrontmatter).use(remarkGfm).use(remarkMath).use(remarkDirective).use(remarkSkeinproof, { fill: false, ...options });
  await processor.run(processor.parse(file), file);
  const data = file.data.skeinproof!;
  return { diagnostics: data.diagnostics, failed: data.failed, built: applySplices(text, data.splices), file };
}

/** `line:column` of each diagnostic with its rule, for compact expectations. */
export function placed(diagnostics: readonly Diagnostic[]): string[] {
  return diagnostics.map((d) => `${d.severity} ${d.ruleId} ${d.location?.start.line}:${d.location?.start.column}`);
}

/** 1-based line and column of the first occurrence of `needle` (after `after`, if given) in `text`. */
export function positionOf(text: string, needle: string, after = ''): string {
  const from = after ? text.indexOf(after) : 0;
  const at = text.indexOf(needle, from);
  if (at < 0) throw new Error(`${needle} not found`);
  const before = text.slice(0, at).split('\n');
  return `${before.length}:${before[before.length - 1]!.length + 1}`;
}
