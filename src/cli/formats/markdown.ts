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
import remarkSkeinproof, { applySplices, mayHoldCarriers, sourceOffsetOf, SourceText, type SkeinproofData } from '../../../plugins/remark/index.ts';
import { parseInSections } from '../../../plugins/remark/sections.ts';
import type { Splice } from '../../../plugins/remark/splice.ts';
import type { ContradictedSpan } from '../html/page.ts';
import { decodeManuscript } from '../utf8.ts';
import type { ResultStore } from '../../core/cache/store.ts';
import { mathReaderVersion, rememberedMathProblems } from './remembered-math.ts';
import { FORMAT_EXTENSIONS, type FormatOptions, type FormatResult, type ManuscriptFormat, type OutputFile } from './types.ts';

const HTML_EXTENSIONS = ['.html', '.htm'];

interface CheckedText {
  readonly ok: true;
  readonly text: string;
  readonly data: SkeinproofData;
  /** The filled-in Markdown the build writes (and the page is made from). */
  readonly filled: string;
  /** The plugin's diagnostics and the formulas of the filled-in text KaTeX cannot typeset. */
  readonly diagnostics: readonly Diagnostic[];
  readonly failed: boolean;
}

type Checked = CheckedText | { readonly ok: false; readonly unreadable: Diagnostic };

/** `draw`: compute the figures' geometry (a build); a check only checks their settings and diagrams. */
async function checkManuscript(path: string, options: FormatOptions, draw: boolean): Promise<Checked> {
  let bytes: Uint8Array;
  try {
    bytes = await readFile(path);
  } catch (e) {
    options.readLog?.failed(path, e);
    return { ok: false, unreadable: unreadable(path, e) };
  }
  options.readLog?.read(path, bytes);
  const decoded = decodeManuscript(bytes, path);
  if (!decoded.ok) return { ok: false, unreadable: decoded.problem };
  const text = decoded.text;
  const overlong = overlongLine(text, path);
  if (overlong) return { ok: false, unreadable: overlong };
  const file = new VFile({ value: text, path });
  const processor = unified()
    .use(remarkParse)
    .use(remarkFrontmatter)
    .use(remarkGfm)
    .use(remarkMath)
    .use(remarkDirective)
    .use(remarkSkeinproof, {
      fill: false,
      draw,
      ...(options.convention ? { convention: options.convention } : {}),
      ...(options.strict ? { strict: true } : {}),
      ...(options.limits ? { limits: options.limits } : {}),
      ...(options.resultStore ? { resultStore: options.resultStore } : {}),
      ...(options.precompute ? { precompute: options.precompute } : {}),
    });
  // Read in sections, so that the parser's events for only one group of sections are alive at a time, and only
  // the sections that can hold skeinproof's markup: nothing here reads the tree but the extraction (plugins/remark/sections.ts).
  const tree = parseInSections(text, (section) => processor.parse(section), (section, from) => from === 0 || mayHoldCarriers(section), 'carriers');
  await processor.run(tree, file);
  const data = file.data.skeinproof!;
  const filled = applySplices(text, data.splices);
  const untypeset = await untypesetMath(text, filled, data.splices, path, data.diagnostics, draw, options.resultStore);
  // The same strictness the plugin applied: the command line's, else the front matter's.
  const strict = options.strict ?? data.settings.strict ?? false;
  const failed = data.failed || (strict && untypeset.length > 0);
  return { ok: true, text, data, filled, diagnostics: [...data.diagnostics, ...untypeset], failed };
}

/**
 * Formulas of the filled-in text that KaTeX cannot typeset, located in the manuscript.
 * `check` reports them too, so that check and `build --html` agree.
 */
async function untypesetMath(text: string, filled: string, splices: readonly Splice[], path: string, reported: readonly Diagnostic[], drawn: boolean, store?: ResultStore): Promise<Diagnostic[]> {
  // KaTeX loads only for a text that can hold math, and only when the disk cache does not remember this text's problems.
  if (!filled.includes('$')) return [];
  const problems = await rememberedMathProblems(filled, { manuscript: path, drawn, readerVersion: await mathReaderVersion(), ...(store ? { store } : {}) });
  // The parser's offsets count from after a byte order mark, the splices' from the start of the text.
  const bom = text.startsWith('\uFEFF') ? 1 : 0;
  if (problems.length === 0) return [];
  const source = new SourceText(text.slice(bom), path);
  // A formula that already has an error inside it (an unreadable claim) gets no second message.
  const errorsAt = reported.flatMap((d) => (d.severity === 'error' && d.location?.start.offset !== undefined ? [d.location.start.offset] : []));
  const fresh = problems.filter((p) => {
    const start = sourceOffsetOf(splices, p.offset + bom) - bom;
    const end = sourceOffsetOf(splices, p.end + bom) - bom;
    return !errorsAt.some((at) => at >= start && at <= end);
  });
  return fresh.map((p) => ({
    severity: 'warning',
    ruleId: 'math-untypeset',
    message: `KaTeX cannot typeset this formula, so the HTML page would show it in red: ${p.message}`,
    location: source.location(sourceOffsetOf(splices, p.offset + bom) - bom),
    hints: ['Correct the LaTeX of this formula in the manuscript (KaTeX supports most, not all, of LaTeX math).'],
  }));
}

/** Where a stretch of the manuscript (offsets into the file text) lies in the filled-in text; a stretch inside a replaced part covers all of its replacement. */
function filledRange(splices: readonly Splice[], start: number, end: number): { start: number; end: number } {
  const sorted = [...splices].sort((a, b) => a.start - b.start || a.end - b.end);
  const map = (at: number, side: 'start' | 'end'): number => {
    let shift = 0;
    for (const s of sorted) {
      if (at < s.start || (side === 'end' && at === s.start)) break;
      if (at < s.end || (side === 'end' && at === s.end)) return side === 'start' ? s.start + shift : s.start + shift + s.text.length;
      shift += s.text.length - (s.end - s.start);
    }
    return at + shift;
  };
  return { start: map(start, 'start'), end: Math.max(map(end, 'end'), map(start, 'start') + 1) };
}

/** The contradicted values of a build written anyway, located in the filled-in text the page is made from. */
function contradictedSpans(checked: CheckedText): ContradictedSpan[] {
  const bom = checked.text.startsWith('\uFEFF') ? 1 : 0;
  return checked.data.diagnostics.flatMap((d) => {
    const start = d.location?.start.offset;
    if (d.ruleId !== 'claim-contradicted' || start === undefined) return [];
    const end = d.location?.end?.offset ?? start + 1;
    const range = filledRange(checked.data.splices, start + bom, end + bom);
    const note = d.computed ? `contradicted: computed ${d.computed}` : 'contradicted by the computation';
    return [{ start: range.start - bom, end: range.end - bom, note }];
  });
}

/** Where each drawn figure's block starts in the filled-in text the page is made from. */
function figureOffsets(checked: CheckedText): number[] {
  const bom = checked.text.startsWith('\uFEFF') ? 1 : 0;
  return checked.data.figureStarts.map((start) => filledRange(checked.data.splices, start, start + 1).start - bom);
}

/**
 * The longest line a Markdown manuscript may have. The Markdown parser
 * (micromark) is linear but slow and memory-hungry on some long lines: one
 * line of 3 million backslashes took 50 s and 3.3 GB to read. No manuscript
 * needs such lines (a 2,000-crossing PD code on one line is about 40,000 characters).
 */
export const MAX_MARKDOWN_LINE = 100_000;

/** The first line longer than the limit, as an error at the column where it goes over; found in one pass. */
function overlongLine(text: string, path: string): Diagnostic | undefined {
  let line = 1;
  let start = 0;
  for (let at = 0; at <= text.length; at++) {
    const c = text.charCodeAt(at);
    const end = at === text.length || c === 10 || c === 13;
    if (!end) continue;
    if (at - start > MAX_MARKDOWN_LINE) {
      const bom = line === 1 && text.startsWith('\uFEFF') ? 1 : 0;
      return {
        severity: 'error',
        ruleId: 'line-too-long',
        message: `line ${line} is ${(at - start - bom).toLocaleString('en')} characters long, and skeinproof reads Markdown lines of at most ${MAX_MARKDOWN_LINE.toLocaleString('en')} characters, so nothing in ${path} was checked`,
        location: { file: path, start: { line, column: MAX_MARKDOWN_LINE + 1, offset: start + MAX_MARKDOWN_LINE } },
        hints: ['Break the line: Markdown joins the lines of a paragraph, and a diagram code may span lines.'],
      };
    }
    if (c === 13 && text.charCodeAt(at + 1) === 10) at++;
    line++;
    start = at + 1;
  }
  return undefined;
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
/** The last line of every filled-in Markdown file (not of `-o -`, which pipes the text on): an HTML comment, so no renderer shows it. */
const FILLED_MARKDOWN_MARK = '<!-- filled in by skeinproof';

function withFilledMark(filled: string, input: string): string {
  return `${filled}${filled.endsWith('\n') ? '' : '\n'}\n${FILLED_MARKDOWN_MARK} from ${basename(input)}: edit that file and build again -->\n`;
}

export function defaultOutputPath(input: string, html: boolean): string {
  const stem = basename(input, extname(input));
  return join(dirname(input), html ? `${stem}.html` : `${stem}.filled.md`);
}

export const markdownFormat: ManuscriptFormat = {
  name: 'markdown',
  extensions: FORMAT_EXTENSIONS.markdown,

  async check(path, options): Promise<FormatResult> {
    const checked = await checkManuscript(path, options, false);
    if (!checked.ok) return { diagnostics: [checked.unreadable], outputs: [], inputs: [path], failed: true };
    return { diagnostics: checked.diagnostics, outputs: [], inputs: [path], failed: checked.failed, counts: checked.data.session.counts };
  },

  async build(path, options): Promise<FormatResult> {
    if ((FORMAT_EXTENSIONS.latex as readonly string[]).includes(extname(options.output ?? '').toLowerCase())) {
      const message = `${path} is Markdown, and -o ${options.output} would put Markdown under a LaTeX name: give the output a Markdown name (.md) or an HTML one (.html)`;
      return { diagnostics: [{ severity: 'error', ruleId: 'output-unsupported', message }], outputs: [], inputs: [path], failed: true };
    }
    const checked = await checkManuscript(path, options, true);
    if (!checked.ok) return { diagnostics: [checked.unreadable], outputs: [], inputs: [path], failed: true };
    const { data, filled, diagnostics, failed } = checked;
    const output = options.output ?? defaultOutputPath(path, isHtmlBuild(options));
    if (!isHtmlBuild(options)) {
      const written: OutputFile = { path: output, content: output === '-' ? filled : withFilledMark(filled, path), ...(options.output === undefined ? { ownMark: FILLED_MARKDOWN_MARK } : {}) };
      return { diagnostics, outputs: [written], inputs: [path], failed };
    }
    // The HTML stack (rehype, KaTeX) loads only when a page is written.
    const { renderHtmlPage } = await import('../html/page.ts');
    const page = await renderHtmlPage(filled, {
      title: data.settings.title ?? basename(path, extname(path)),
      allowHtml: options.allowHtml === true,
      path: output,
      ...(data.settings.notation ? { defaultNotation: data.settings.notation } : {}),
      // Only a build written despite a failed check has contradicted values to mark.
      contradicted: contradictedSpans(checked),
      figures: figureOffsets(checked),
    });
    const outputs: OutputFile[] = [{ path: output, content: page.html, ...(options.output === undefined ? { ownMark: '<meta name="generator" content="skeinproof">' } : {}) }];
    return { diagnostics, outputs, inputs: [path], failed };
  },
};

/** An HTML page is asked for by --html or by an output name ending in .html or .htm. */
export function isHtmlBuild(options: FormatOptions): boolean {
  return options.html === true || HTML_EXTENSIONS.includes(extname(options.output ?? '').toLowerCase());
}
