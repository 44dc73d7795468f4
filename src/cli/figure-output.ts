/**
 * `skeinproof compute --figure svg|tikz CODE`: the picture of one diagram,
 * drawn from the parsed code, on standard output or into a file with -o (written
 * atomically, the way `build` writes). The drawing modules are loaded only here,
 * so the other uses of `compute` do not pay for them.
 */
import type { Argv } from 'yargs';
import type { Notation } from '../core/diagram/model.ts';
import { isInputError } from '../core/errors.ts';
import { withTimeBudget, type ComputeLimits } from '../core/limits.ts';
import { parseDiagramCode, type ParseOptions } from '../core/notation/index.ts';
import { describeWriteFailure, writeFileAtomic, writeStandardOutput } from './write-atomic.ts';
import { invalidCodeMessage } from './commands/compute.ts';

export const FIGURE_FORMATS = ['svg', 'tikz'] as const;
export type FigureFormat = (typeof FIGURE_FORMATS)[number];

const EXIT_OK = 0;
const EXIT_INVALID_INPUT = 2;

export function figureOptions(y: Argv): Argv {
  return y
    .option('figure', { choices: FIGURE_FORMATS, describe: 'Draw the one code given as a picture (svg or tikz) instead of computing its invariants' })
    .option('output', { alias: 'o', type: 'string', describe: 'With --figure: the file to write (default standard output)' })
    .option('figure-size', { type: 'number', describe: 'With --figure: the longer side, px for SVG, pt for TikZ (default 240)' })
    .option('line-width', { type: 'number', describe: 'With --figure: stroke width in the same units' })
    .option('gap', { type: 'number', describe: 'With --figure: length of the break in the under-strand at each crossing' })
    .option('arrows', { type: 'boolean', describe: 'With --figure: an arrowhead on every edge' })
    .option('colours', { type: 'boolean', describe: 'With --figure: one colour per component' })
    .option('labels', { choices: ['none', 'crossings', 'edges', 'both'], describe: 'With --figure: number the crossings and/or edges' })
    .option('outer-face', { type: 'number', describe: 'With --figure: draw the face left of this edge (numbered as the edge labels) outside' });
}

interface FigureRequest {
  readonly format: FigureFormat;
  readonly output: string | undefined;
  readonly options: Record<string, unknown>;
}

/** The figure request of a compute command line, a usage message, or undefined when --figure is absent. */
export function readFigureArgs(raw: Record<string, unknown>, codeCount: number): FigureRequest | string | undefined {
  const figureOnly = ['output', 'figure-size', 'line-width', 'gap', 'arrows', 'colours', 'labels', 'outer-face'].filter((k) => raw[k] !== undefined);
  if (raw['figure'] === undefined) return figureOnly.length > 0 ? `--${figureOnly[0]} applies to --figure only; add --figure svg or --figure tikz.` : undefined;
  if (Array.isArray(raw['figure'])) return '--figure is given more than once; give it once (svg or tikz).';
  if (codeCount !== 1) return `--figure draws one diagram, and ${codeCount} codes were given; draw them one at a time.`;
  if (raw['json'] === true || raw['claim'] !== undefined) return '--figure cannot be combined with --json or --claim; run them separately.';
  const output = raw['output'];
  if (output !== undefined && (typeof output !== 'string' || output === '')) return '-o needs a file name (or - for standard output).';
  const options: Record<string, unknown> = {};
  const take = (flag: string, key: string): void => {
    if (raw[flag] !== undefined) options[key] = raw[flag];
  };
  take('figure-size', 'size');
  take('line-width', 'lineWidth');
  take('gap', 'gap');
  take('arrows', 'arrows');
  take('colours', 'colours');
  take('labels', 'labels');
  take('outer-face', 'outerFace');
  return { format: raw['figure'] as FigureFormat, output: output === '-' ? undefined : (output as string | undefined), options };
}

/** Draws the code; a bad code or option is reported like an invalid code, with exit status 2. */
export async function runFigure(request: FigureRequest, code: string, notation: Notation, parseOptions: ParseOptions, limits: ComputeLimits): Promise<number> {
  const { drawDiagram, figureSvg, figureTikz } = await import('../core/drawing/index.ts');
  let text: string;
  try {
    const maxCrossings = limits.maxCrossings !== undefined ? { maxCrossings: limits.maxCrossings } : {};
    const diagram = parseDiagramCode(code, notation, { ...parseOptions, ...maxCrossings });
    const drawing = withTimeBudget(limits.timeBudgetMs, 'its figure', () => drawDiagram(diagram, request.options));
    const meta = { title: `${notation} ${code}`, description: `A diagram with ${diagram.crossings.length} crossing${diagram.crossings.length === 1 ? '' : 's'} drawn by skeinproof from the ${notation} code ${code}` };
    text = request.format === 'svg' ? figureSvg(drawing, meta) : figureTikz(drawing, meta);
  } catch (error) {
    if (!isInputError(error)) throw error;
    process.stderr.write(`${invalidCodeMessage(1, code, notation, error)}\n`);
    return EXIT_INVALID_INPUT;
  }
  if (request.output === undefined) {
    await writeStandardOutput(text);
    return EXIT_OK;
  }
  try {
    await writeFileAtomic(request.output, text);
  } catch (e) {
    process.stderr.write(`skeinproof: ${describeWriteFailure(request.output, e)}\n`);
    return EXIT_INVALID_INPUT;
  }
  process.stderr.write(`wrote ${request.output}\n`);
  return EXIT_OK;
}
