/**
 * The options of a figure, checked: a bad value is an InputError with rule
 * `figure-option-invalid` that names the option, the value and what it takes.
 */
import { InputError } from '../errors.ts';
import type { LinkDiagram } from '../diagram/model.ts';

export type LabelChoice = 'none' | 'crossings' | 'edges' | 'both';
export const LABEL_CHOICES: readonly LabelChoice[] = ['none', 'crossings', 'edges', 'both'];

export interface FigureOptions {
  /** The longer side of the figure, in px for SVG and pt for TikZ (default 240). */
  size?: number;
  /** Stroke width in the same units (default: scaled to the crossing size, at most 2.5). */
  lineWidth?: number;
  /** The length of the break in the under-strand at each crossing, same units (default: scaled to the crossing size). */
  gap?: number;
  /** An arrowhead on every edge, in the direction of travel (default false). */
  arrows?: boolean;
  /** One colour per component (default false: all black). */
  colours?: boolean;
  /** Number the crossings (from 1, in the code's order) and/or the edges (from 1, in order of travel). */
  labels?: LabelChoice;
  /** The face to draw outside: the face on the left of this edge, numbered as the edge labels (from 1). Default: the largest face. */
  outerFace?: number;
}

export interface ResolvedOptions {
  readonly size: number;
  readonly lineWidth: number | undefined;
  readonly gap: number | undefined;
  readonly arrows: boolean;
  readonly colours: boolean;
  readonly labels: LabelChoice;
  /** 0-based edge whose left face goes outside, or undefined for the largest face. */
  readonly outerEdge: number | undefined;
}

export const SIZE_RANGE = { min: 20, max: 10_000 } as const;

function invalid(message: string): InputError {
  return new InputError('figure-option-invalid', message);
}

/** The bad value as the user should read it: a word given where a number belongs arrives as NaN, which JSON prints as "null". */
function shown(value: unknown): string {
  if (typeof value === 'number') return Number.isNaN(value) ? 'not a number' : String(value);
  return JSON.stringify(value);
}

function positiveNumber(name: string, value: unknown, max: number, allowZero = false): number | undefined {
  if (value === undefined) return undefined;
  const ok = typeof value === 'number' && Number.isFinite(value) && (allowZero ? value >= 0 : value > 0) && value <= max;
  if (!ok) throw invalid(`figure option ${name} is ${shown(value)}; it takes a ${allowZero ? 'non-negative' : 'positive'} number of at most ${max} (in the figure's units, px in SVG and pt in TikZ)`);
  return value as number;
}

function flag(name: string, value: unknown): boolean {
  if (value === undefined) return false;
  if (typeof value !== 'boolean') throw invalid(`figure option ${name} is ${shown(value)}; it takes true or false`);
  return value;
}

export function resolveOptions(d: LinkDiagram, options: FigureOptions): ResolvedOptions {
  const sizeValue = options.size ?? 240;
  if (typeof sizeValue !== 'number' || !Number.isFinite(sizeValue) || sizeValue < SIZE_RANGE.min || sizeValue > SIZE_RANGE.max) {
    throw invalid(`figure option size is ${shown(options.size)}; it takes a number from ${SIZE_RANGE.min} to ${SIZE_RANGE.max} (the longer side, px in SVG and pt in TikZ)`);
  }
  const labels = options.labels ?? 'none';
  if (!LABEL_CHOICES.includes(labels)) throw invalid(`figure option labels is ${shown(labels)}; it takes one of ${LABEL_CHOICES.join(', ')}`);
  let outerEdge: number | undefined;
  if (options.outerFace !== undefined) {
    const edge = options.outerFace;
    if (typeof edge !== 'number' || !Number.isInteger(edge) || edge < 1 || edge > d.edgeCount) {
      const range = d.edgeCount === 0 ? 'this diagram has no edges, so leave it out' : `it takes an edge number from 1 to ${d.edgeCount} (show them with labels: edges), whose left side is drawn outside`;
      throw invalid(`figure option outer-face is ${shown(edge)}; ${range}`);
    }
    outerEdge = edge - 1;
  }
  return {
    size: sizeValue,
    lineWidth: positiveNumber('line-width', options.lineWidth, sizeValue / 10),
    gap: positiveNumber('gap', options.gap, sizeValue / 5, true),
    arrows: flag('arrows', options.arrows),
    colours: flag('colours', options.colours),
    labels,
    outerEdge,
  };
}
