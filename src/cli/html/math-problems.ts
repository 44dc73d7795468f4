/**
 * The formulas of a Markdown text that KaTeX cannot typeset, found the way the
 * page's rehype-katex typesets them (same KaTeX, same options, display math in
 * display mode), so that `check` reports exactly what `build --html` meets.
 */
import katex from 'katex';
import type { Literal } from 'mdast';
import remarkFrontmatter from 'remark-frontmatter';
import remarkGfm from 'remark-gfm';
import remarkMath from 'remark-math';
import remarkParse from 'remark-parse';
import { unified } from 'unified';
import { visit } from 'unist-util-visit';

/** The options the page passes to rehype-katex (see page.ts). */
export const KATEX_OPTIONS = { strict: 'ignore', trust: false } as const;

export interface MathProblem {
  /** KaTeX's own words ("Expected '}', got 'EOF'…"). */
  readonly message: string;
  /** Offsets of the formula (with its dollar signs) in the text given. */
  readonly offset: number;
  readonly end: number;
}

export function mathProblems(markdown: string): MathProblem[] {
  const tree = unified().use(remarkParse).use(remarkFrontmatter).use(remarkGfm).use(remarkMath).parse(markdown);
  const problems: MathProblem[] = [];
  visit(tree, (node) => {
    if (node.type !== 'math' && node.type !== 'inlineMath') return;
    const math = node as Literal; // remark-math's `math` and `inlineMath` nodes carry the TeX as their value
    const message = katexProblem(math.value, node.type === 'math');
    if (message !== undefined) problems.push({ message, offset: math.position?.start.offset ?? 0, end: math.position?.end.offset ?? 0 });
  });
  return problems;
}

/**
 * KaTeX's verdict on each formula already typeset by this process (`watch` checks the same manuscript
 * after every save, and a census repeats formulas): KaTeX is a pure function of the formula and the options.
 */
const verdicts = new Map<string, string | null>();
const MAX_REMEMBERED = 20_000;

function katexProblem(tex: string, displayMode: boolean): string | undefined {
  const key = `${displayMode ? 'd' : 'i'}${tex}`;
  let verdict = verdicts.get(key);
  if (verdict === undefined) {
    try {
      katex.renderToString(tex, { ...KATEX_OPTIONS, displayMode, throwOnError: true });
      verdict = null;
    } catch (e) {
      verdict = e instanceof Error ? e.message : String(e);
    }
    if (verdicts.size >= MAX_REMEMBERED) verdicts.clear();
    verdicts.set(key, verdict);
  }
  return verdict ?? undefined;
}
