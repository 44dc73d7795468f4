/**
 * remark-skeinproof: checks and fills in a knot-theory manuscript inside a
 * unified pipeline. Use it after remark-parse with remark-directive,
 * remark-math, remark-gfm (tables) and remark-frontmatter (settings):
 *
 *   unified().use(remarkParse).use(remarkFrontmatter).use(remarkGfm).use(remarkMath)
 *     .use(remarkDirective).use(remarkSkeinproof, { strict: true })
 *
 * Every problem becomes a vfile message with its position and rule id (fatal
 * for errors); `file.data.skeinproof` holds the diagnostics, the computed
 * reports and the text splices a byte-preserving build applies. With
 * `fill: true` (the default) the tree itself is filled in for HTML output.
 */
import type { Root } from 'mdast';
import type { VFile } from 'vfile';
import type { Convention } from '../../src/core/convention/convention.ts';
import { DEFAULT_CONVENTION } from '../../src/core/convention/convention.ts';
import type { Diagnostic } from '../../src/core/diagnostics/diagnostic.ts';
import type { Notation } from '../../src/core/diagram/model.ts';
import type { SessionResult } from '../../src/core/manuscript/api.ts';
import { runSession } from '../../src/core/manuscript/session.ts';
import { extractManuscript, type ExtractedManuscript } from './extract.ts';
import { fillTree } from './fill-tree.ts';
import type { ManuscriptSettings } from './front-matter.ts';
import { SourceText } from './source-text.ts';
import { keepMathApart, type Splice } from './splice.ts';
import { figureMarkdown, typesetMarkdown } from './typeset-markdown.ts';
import { drawFigure } from '../../src/core/manuscript/figure-entries.ts';
import type { ComputeLimits } from '../../src/core/limits.ts';
import type { ResultStore } from '../../src/core/cache/store.ts';
import type { PrecomputeHook, SessionInput } from '../../src/core/manuscript/api.ts';

export interface SkeinproofOptions {
  /** Overrides the convention the front matter declares, setting by setting. */
  readonly convention?: Partial<Convention>;
  /** Warnings fail the check; overrides the front matter's `strict`. */
  readonly strict?: boolean;
  /** Default notation for diagrams that name none; overrides the front matter. */
  readonly notation?: Notation;
  /** Replace fill-ins and claim markup in the tree (default true). */
  readonly fill?: boolean;
  /** Limits on each diagram's work (none by default): a diagram over one is reported, the rest still checked. */
  readonly limits?: ComputeLimits;
  /** Where computed values are kept between runs (none by default). */
  readonly resultStore?: ResultStore;
  /** Computes the diagrams' values elsewhere (worker threads) before the session; its store replaces `resultStore`. */
  readonly precompute?: PrecomputeHook;
  /**
   * Draw the figures (default true). A check sets it false: a figure's settings and diagram are still
   * checked, but its geometry is computed only for a build.
   */
  readonly draw?: boolean;
}

export interface SkeinproofData {
  readonly settings: ManuscriptSettings;
  readonly convention: Convention;
  readonly diagnostics: readonly Diagnostic[];
  readonly failed: boolean;
  readonly session: SessionResult;
  readonly manuscript: ExtractedManuscript;
  /** The build's text edits, by offsets into the file text as given (fill-ins that could not be computed stay as written). */
  readonly splices: readonly Splice[];
  /** Where the splices that place a drawn figure start (offsets into the file text as given). */
  readonly figureStarts: readonly number[];
}

declare module 'vfile' {
  interface DataMap {
    skeinproof: SkeinproofData;
  }
}

const DEFAULT_FILE_NAME = '<input>';

export default function remarkSkeinproof(options: SkeinproofOptions = {}) {
  return async function transformer(tree: Root, file: VFile): Promise<void> {
    const raw = typeof file.value === 'string' ? file.value : new TextDecoder().decode(file.value ?? new Uint8Array());
    // micromark skips a leading byte order mark, so node offsets count from after it.
    const bom = raw.startsWith('\uFEFF') ? 1 : 0;
    const source = new SourceText(raw.slice(bom), file.path || DEFAULT_FILE_NAME);
    const manuscript = extractManuscript(tree, source, options.notation ? { notation: options.notation } : {});
    const convention: Convention = { ...DEFAULT_CONVENTION, ...manuscript.settings.convention, ...options.convention };
    const strict = options.strict ?? manuscript.settings.strict ?? false;
    const input: SessionInput = {
      diagrams: manuscript.diagrams,
      claims: manuscript.claims,
      fills: manuscript.fills,
      figures: manuscript.figures,
      khovanovGrids: manuscript.khovanovGrids,
      convention,
      strict,
      refused: manuscript.refusedIds,
      documentStart: source.location(0),
      markupFound: manuscript.problems.length > 0,
      ...(options.limits ? { limits: options.limits } : {}),
      ...(options.resultStore ? { resultStore: options.resultStore } : {}),
    };
    const session = runSession(options.precompute ? { ...input, ...(await options.precompute(input)) } : input);
    const drawProblems: Diagnostic[] = [];
    const figures = manuscript.figures.map((entry, k) => {
      const placed = session.figures[k];
      if (placed === undefined || options.draw === false) return undefined;
      const drawn = drawFigure(placed, entry, 'svg');
      if ('problem' in drawn) drawProblems.push(drawn.problem);
      return 'text' in drawn ? figureMarkdown(drawn.text) : undefined;
    });
    const own = [...manuscript.problems, ...drawProblems];
    const diagnostics = [...own, ...session.diagnostics].sort(byPosition);
    const failed = session.failed || own.some((d) => d.severity === 'error' || (strict && d.severity === 'warning'));
    for (const d of diagnostics) reportOnFile(file, d);
    const splices: Splice[] = [];
    const figureStarts: number[] = [];
    for (const edit of manuscript.edits) {
      const r = edit.replacement;
      const start = edit.start + bom;
      const end = edit.end + bom;
      if ('text' in r) splices.push({ start, end, text: r.text });
      else if ('figure' in r) {
        const figure = figures[r.figure];
        if (figure === undefined) continue;
        const lineBreak = /^[ \t]*(\r\n|\r|\n)/.exec(raw.slice(end))?.[1] ?? '\n';
        splices.push({ start, end, text: r.blankAfter ? `${figure}${lineBreak}` : figure });
        figureStarts.push(start);
      } else {
        const value = session.fills[r.fill];
        // An empty text is a table cell whose key does not apply to the row's diagram: it stays as written.
        if (value !== undefined && !(value.kind === 'text' && value.text === '')) splices.push({ start, end, text: typesetMarkdown(value, r.place) });
      }
    }
    file.data.skeinproof = { settings: manuscript.settings, convention, diagnostics, failed, session, manuscript, splices: keepMathApart(raw, splices), figureStarts };
    if (options.fill !== false) fillTree(tree, manuscript.actions, session.fills, figures);
  };
}

function reportOnFile(file: VFile, d: Diagnostic): void {
  const loc = d.location;
  const message = file.message(d.message, {
    ruleId: d.ruleId,
    source: 'skeinproof',
    ...(loc ? { place: loc.end ? { start: loc.start, end: loc.end } : loc.start } : {}),
  });
  message.fatal = d.severity === 'error' ? true : d.severity === 'warning' ? false : undefined;
  if (d.claimed !== undefined) message.actual = d.claimed;
  if (d.computed !== undefined) message.expected = [d.computed];
  if (d.hints && d.hints.length > 0) message.note = d.hints.join('\n');
}

function byPosition(a: Diagnostic, b: Diagnostic): number {
  const pa = a.location?.start;
  const pb = b.location?.start;
  if (!pa || !pb) return pa ? -1 : pb ? 1 : 0;
  return pa.line - pb.line || pa.column - pb.column;
}

export { extractManuscript, mayHoldCarriers } from './extract.ts';
export { applySplices, sourceOffsetOf } from './splice.ts';
export { SourceText } from './source-text.ts';
