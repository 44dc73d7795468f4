/**
 * `skeinproof compute CODE…`: parse each diagram code, analyse it once, and
 * print a summary (or one JSON object per code with --json). Invalid codes
 * are reported on stderr and do not stop the others; the exit status is 2
 * when any code was invalid.
 *
 * The per-code pipeline (`computeCode`) and the renderers are exported so
 * options such as claims can hook into the same steps.
 */
import type { Argv } from 'yargs';
import { analyzeDiagram } from '../../core/analyze/analyze.ts';
import type { DiagramReport } from '../../core/analyze/report.ts';
import type { Notation } from '../../core/diagram/model.ts';
import { isInputError, type InputError } from '../../core/errors.ts';
import { NOTATIONS, parseDiagramCode, type ParseOptions } from '../../core/notation/index.ts';
import { computeJson, invalidCodeJson } from '../compute-json.ts';
import type { CliCommand } from './index.ts';

export const DEFAULT_NOTATION: Notation = 'pd';

// The exit statuses of main.ts (not imported from there: main.ts imports the command list).
const EXIT_ALL_VALID = 0;
const EXIT_INVALID_INPUT = 2;

export type CodeOutcome =
  | { readonly ok: true; readonly code: string; readonly notation: Notation; readonly report: DiagramReport }
  | { readonly ok: false; readonly code: string; readonly notation: Notation; readonly error: InputError };

/** Parses and analyses one code; bad input comes back as an outcome, anything else thrown is a bug. */
export function computeCode(code: string, notation: Notation, options: ParseOptions = {}): CodeOutcome {
  try {
    const diagram = parseDiagramCode(code, notation, options);
    return { ok: true, code, notation, report: analyzeDiagram(diagram) };
  } catch (error) {
    if (isInputError(error)) return { ok: false, code, notation, error };
    throw error;
  }
}

const yesNo = (flag: boolean, yes: string, no: string): string => (flag ? yes : no);
const signed = (k: number): string => (k > 0 ? `+${k}` : `${k}`);
const count = (k: number, noun: string): string => `${k} ${noun}${k === 1 ? '' : 's'}`;

/** The human summary of one analysed code: a heading line and indented facts. */
export function plainSummary(position: number, code: string, r: DiagramReport): string {
  const lines: string[] = [];
  lines.push(`#${position} ${r.notation} ${JSON.stringify(code)}`);
  lines.push(`  ${count(r.crossings, 'crossing')}, ${count(r.components, 'component')}, writhe ${signed(r.writhe)} (${r.positiveCrossings} positive, ${r.negativeCrossings} negative)`);
  lines.push(`  Jones    V(t) = ${r.jones.toPlainString('t')}`);
  lines.push(`           span ${r.span}, degrees ${r.jonesMinDegree} to ${r.jonesMaxDegree}`);
  lines.push(`  bracket  <D> = ${r.bracket.toPlainString('A')}`);
  lines.push(`           span ${r.bracketSpan}, degrees ${r.bracketMinDegree} to ${r.bracketMaxDegree}  (unit normalisation <O> = 1)`);
  const adequacy = r.adequate ? 'adequate' : r.aAdequate ? 'A-adequate only' : r.bAdequate ? 'B-adequate only' : 'neither A- nor B-adequate';
  lines.push(`  diagram  ${yesNo(r.connected, 'connected', 'split into several pieces')}, ${yesNo(r.reduced, 'reduced', 'not reduced')}, ${yesNo(r.alternating, 'alternating', 'not alternating')}, ${adequacy}`);
  lines.push(`           all-A state ${count(r.stateCircles.a, 'circle')}, all-B state ${count(r.stateCircles.b, 'circle')}`);
  if (r.nugatory.length > 0) lines.push(`  nugatory crossing${r.nugatory.length === 1 ? '' : 's'} (from 0): ${r.nugatory.join(', ')}`);
  if (r.linking.length > 0) {
    lines.push(`  linking  ${r.linking.map((l) => `lk(${l.components[0]},${l.components[1]}) = ${signed(l.value)}`).join(', ')}`);
  }
  const c = r.crossingNumber;
  const verdict = c.exact !== null ? `exactly ${c.exact}` : `between ${c.lower} and ${c.upper}`;
  lines.push(`  crossing number ${verdict}`);
  // Once a theorem fixes the value, the separate bounds add nothing for a reader; JSON keeps them all.
  const shown = c.exact !== null ? c.reasons.filter((x) => x.bound === 'exact') : c.reasons;
  for (const reason of shown) lines.push(`    ${reason.bound} ${reason.value} [${reason.theorem}]: ${reason.text}`);
  if (!r.chiralityFixed) lines.push('  note: this notation fixes the link only up to mirror image');
  return lines.join('\n');
}

/** A compiler-style message for an invalid code: what, where (with a caret), and the hints. */
export function invalidCodeMessage(position: number, code: string, notation: Notation, error: InputError): string {
  const lines = [`skeinproof: error[${error.ruleId}] in code #${position} (${notation}): ${error.message}`];
  if (error.span) {
    const lineStart = code.lastIndexOf('\n', error.span.start - 1) + 1;
    const lineEndAt = code.indexOf('\n', error.span.start);
    const line = code.slice(lineStart, lineEndAt < 0 ? code.length : lineEndAt);
    const column = error.span.start - lineStart;
    const width = Math.max(1, Math.min(error.span.end, lineStart + line.length) - error.span.start);
    lines.push(`  | ${line}`, `  | ${' '.repeat(column)}${'^'.repeat(width)}`);
  }
  for (const hint of error.hints) lines.push(`  hint: ${hint}`);
  return lines.join('\n');
}

interface ComputeArgs {
  readonly codes: readonly string[];
  readonly notation: Notation;
  readonly strands?: number;
  readonly json: boolean;
}

/** An argument that looks like a long or lettered option; codes such as `-1 2 -1` do not. */
const OPTION_LIKE = /^--?[A-Za-z]/;

function readArgs(args: Record<string, unknown>): ComputeArgs | string {
  const codes = ((args['codes'] as unknown[] | undefined) ?? []).map(String);
  const unknownOption = codes.find((code) => OPTION_LIKE.test(code));
  if (unknownOption !== undefined) {
    return `unknown option ${unknownOption}; the options of compute are --notation, --strands and --json.`;
  }
  const strands = args['strands'] as number | undefined;
  if (strands !== undefined && !(Number.isInteger(strands) && strands >= 1)) {
    return `--strands needs a positive whole number of strands${Number.isNaN(strands) ? '' : `, not ${strands}`}.`;
  }
  const notation = args['notation'] as Notation;
  if (strands !== undefined && notation !== 'braid') {
    return `--strands applies to braid words only; add --notation braid or leave --strands out.`;
  }
  return {
    codes,
    notation,
    strands,
    json: args['json'] === true,
  };
}

export const computeCommand: CliCommand = {
  command: 'compute <codes..>',
  describe: 'Compute the invariants and diagram properties of each diagram code given',
  builder: (y: Argv) =>
    y
      // Codes may begin with a minus sign (braid words, Gauss codes): let them through as positionals.
      .parserConfiguration({ 'unknown-options-as-args': true })
      .positional('codes', { type: 'string', array: true, describe: 'One diagram code per argument (quote codes that contain spaces)' })
      .option('notation', { alias: 'n', choices: NOTATIONS, default: DEFAULT_NOTATION, describe: 'How the codes are written' })
      .option('strands', { type: 'number', describe: 'Braid words: the number of strands, when more than the largest generator + 1' })
      .option('json', { type: 'boolean', default: false, describe: 'One JSON object per code per line (JSON Lines)' }) as Argv,
  run: async (raw) => {
    const args = readArgs(raw);
    if (typeof args === 'string') {
      process.stderr.write(`skeinproof: ${args}\n`);
      return EXIT_INVALID_INPUT;
    }
    const parseOptions: ParseOptions = args.strands === undefined ? {} : { strands: args.strands };
    let anyInvalid = false;
    args.codes.forEach((code, i) => {
      const position = i + 1;
      const outcome = computeCode(code, args.notation, parseOptions);
      if (outcome.ok) {
        process.stdout.write(args.json ? `${JSON.stringify(computeJson(code, outcome.report))}\n` : `${plainSummary(position, code, outcome.report)}\n\n`);
        return;
      }
      anyInvalid = true;
      process.stderr.write(`${invalidCodeMessage(position, code, outcome.notation, outcome.error)}\n`);
      if (args.json) process.stdout.write(`${JSON.stringify(invalidCodeJson(code, outcome.notation, outcome.error))}\n`);
    });
    return anyInvalid ? EXIT_INVALID_INPUT : EXIT_ALL_VALID;
  },
};
