/**
 * The session's side of figures: each figure's settings are read and checked against its diagram (the
 * outer face is named by one of its edges), and the diagram is handed back for the front end to draw when
 * it builds (drawFigure). Placing computes no geometry, so a check stays as fast with figures as without.
 */
import type { DiagramReport } from '../analyze/report.ts';
import type { LinkDiagram } from '../diagram/model.ts';
import type { Diagnostic } from '../diagnostics/diagnostic.ts';
import { drawDiagram, figureSvg, figureTikz, type FigureOptions } from '../drawing/index.ts';
import { isInputError } from '../errors.ts';
import { NOTATION_NOUNS } from '../notation/nouns.ts';
import { FIGURE_OPTION_INVALID, readFigureSettings } from './figure-settings.ts';
import type { DiagramEntry, FigureEntry, Locator, PlacedFigure } from './api.ts';

export interface FigureContext {
  readonly reports: ReadonlyMap<string, DiagramReport>;
  readonly diagrams: readonly DiagramEntry[];
  /** Ids of family codes with a free parameter: no single diagram to draw. */
  readonly parametric: ReadonlySet<string>;
  /** The diagnostics for a target that is not a usable diagram (unknown, invalid, refused). */
  readonly missing: (target: string, locate: Locator, subject: string) => Diagnostic[];
}

export function placeFigure(entry: FigureEntry, context: FigureContext, diagnostics: Diagnostic[]): PlacedFigure | undefined {
  const subject = `the figure of \`${entry.target}\``;
  const { options, diagnostics: problems } = readFigureSettings(entry.settings, `${entry.markup} of \`${entry.target}\``);
  diagnostics.push(...problems);
  if (context.parametric.has(entry.target)) {
    diagnostics.push({
      severity: 'error',
      ruleId: FIGURE_OPTION_INVALID,
      message: `${subject}: \`${entry.target}\` has a free parameter, so it is many diagrams, not one to draw`,
      location: entry.locate(),
      hints: ['Define the instance you want to show as a diagram of its own (the family code with the parameter written out), and draw that.'],
    });
    return undefined;
  }
  const report = context.reports.get(entry.target);
  if (!report) {
    diagnostics.push(...context.missing(entry.target, entry.locate, subject));
    return undefined;
  }
  const diagram = report.diagram;
  if (options.outerFace !== undefined && options.outerFace > diagram.edgeCount) {
    const setting = entry.settings.find((s) => s.key === 'outer-face')!;
    const edges = diagram.edgeCount;
    diagnostics.push({
      severity: 'error',
      ruleId: FIGURE_OPTION_INVALID,
      message: `${entry.markup} of \`${entry.target}\`: outer-face=${options.outerFace} names edge ${options.outerFace}, but the diagram has ${edges === 0 ? 'no edges' : `${edges} edge${edges === 1 ? '' : 's'}`}`,
      location: setting.locateValue(),
      hints: [edges === 0 ? 'Leave outer-face out: a diagram without crossings has only one way to be drawn.' : `Write an edge number from 1 to ${edges} (labels=edges shows them), or leave outer-face out to have the largest face outside.`],
    });
    return undefined;
  }
  if (problems.length > 0) return undefined;
  const source = context.diagrams.find((d) => d.id === entry.target);
  return { diagram, options, title: entry.title ?? `Diagram ${entry.target}`, description: describe(entry.target, diagram, source) };
}

/** One sentence for the picture's description: which diagram, from which code, how big. */
function describe(id: string, d: LinkDiagram, source: DiagramEntry | undefined): string {
  const code = source ? ` drawn from its ${NOTATION_NOUNS[source.notation]} ${oneLine(source.code)}` : '';
  const components = d.components.length + d.freeLoops;
  const n = d.crossings.length;
  return `Diagram ${id}${code}: ${n} crossing${n === 1 ? '' : 's'}, ${components} component${components === 1 ? '' : 's'}.`;
}

/** A code on one line, shortened when long (a description is read aloud). */
function oneLine(code: string): string {
  const flat = code.replace(/\s+/g, ' ').trim();
  return flat.length <= 200 ? flat : `${flat.slice(0, 197)}…`;
}

/**
 * The figure as SVG or TikZ text: the geometry is computed here, when a front end builds. A diagram the
 * drawing refuses (over a limit, settings the drawing cannot honour) is a located error at the figure.
 */
export function drawFigure(placed: PlacedFigure, entry: FigureEntry, format: 'svg' | 'tikz'): { readonly text: string } | { readonly problem: Diagnostic } {
  try {
    const drawing = drawDiagram(placed.diagram, inOutputUnits(placed.options, format));
    // A picture with coordinates that are not numbers would be written silently broken: that is a bug, not the author's.
    if (![drawing.width, drawing.height, drawing.lineWidth].every(Number.isFinite)) {
      throw new Error(`the drawing of \`${entry.target}\` has coordinates that are not finite numbers`);
    }
    const meta = { title: placed.title, description: placed.description };
    return { text: format === 'svg' ? figureSvg(drawing, meta) : figureTikz(drawing, meta) };
  } catch (e) {
    if (!isInputError(e)) throw e;
    const problem: Diagnostic = {
      severity: 'error',
      ruleId: e.ruleId,
      message: `the figure of \`${entry.target}\` cannot be drawn: ${e.message}`,
      location: entry.locate(),
      ...(e.hints.length > 0 ? { hints: [...e.hints] } : {}),
    };
    return { problem };
  }
}

/** The drawing's lengths are in px for SVG (96 to the inch) and in TeX points for TikZ (72.27 to the inch); settings are read in bp (72 to the inch). */
const UNITS_PER_BP = { svg: 96 / 72, tikz: 72.27 / 72 } as const;

function inOutputUnits(options: FigureOptions, format: 'svg' | 'tikz'): FigureOptions {
  const scale = (x: number | undefined): number | undefined => (x === undefined ? undefined : Math.round(x * UNITS_PER_BP[format] * 1000) / 1000);
  const scaled = { size: scale(options.size), lineWidth: scale(options.lineWidth), gap: scale(options.gap) };
  const lengths = Object.fromEntries(Object.entries(scaled).filter(([, v]) => v !== undefined));
  return { ...options, ...lengths };
}
