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
import { parseInSections } from '../../../plugins/remark/sections.ts';

/** The options the page passes to rehype-katex (see page.ts). */
export const KATEX_OPTIONS = { strict: 'ignore', trust: false } as const;

export interface MathProblem {
  /** KaTeX's own words ("Expected '}', got 'EOF'…"). */
  readonly message: string;
  /** Offsets of the formula (with its dollar signs) in the text given. */
  readonly offset: number;
  readonly end: number;
}

/** KaTeX's verdict on one formula, by `formulaKey`: null when it typesets, else KaTeX's message. */
export type MathVerdicts = ReadonlyMap<string, string | null>;

export interface MathReading {
  readonly problems: readonly MathProblem[];
  /** The verdict on every formula of the text (to be remembered for the next run). */
  readonly verdicts: MathVerdicts;
}

/** A formula's key among verdicts: display and inline math typeset differently. */
export function formulaKey(tex: string, displayMode: boolean): string {
  return `${displayMode ? 'd' : 'i'}${tex}`;
}

/** The formulas of `markdown` KaTeX cannot typeset; a formula with a verdict in `known` is not typeset again. */
export function readMath(markdown: string, known: MathVerdicts = new Map()): MathReading {
  const parser = unified().use(remarkParse).use(remarkFrontmatter).use(remarkGfm).use(remarkMath);
  // Only sections with a dollar sign can hold math; the rest is not parsed at all (plugins/remark/sections.ts).
  const tree = parseInSections(markdown, (section) => parser.parse(section), (section) => section.includes('$'), 'math');
  const problems: MathProblem[] = [];
  const verdicts = new Map<string, string | null>();
  visit(tree, (node) => {
    if (node.type !== 'math' && node.type !== 'inlineMath') return;
    const math = node as Literal; // remark-math's `math` and `inlineMath` nodes carry the TeX as their value
    const key = formulaKey(math.value, node.type === 'math');
    const verdict = known.has(key) ? known.get(key)! : katexVerdict(key, math.value, node.type === 'math');
    verdicts.set(key, verdict);
    if (verdict !== null) problems.push({ message: verdict, offset: math.position?.start.offset ?? 0, end: math.position?.end.offset ?? 0 });
  });
  return { problems, verdicts };
}

/**
 * KaTeX's verdict on each formula already typeset by this process (`watch` checks the same manuscript
 * after every save, and a census repeats formulas): KaTeX is a pure function of the formula and the options.
 */
const verdicts = new Map<string, string | null>();
const MAX_REMEMBERED = 20_000;

function katexVerdict(key: string, tex: string, displayMode: boolean): string | null {
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
  return verdict;
}
