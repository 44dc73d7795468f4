/**
 * `skeinproof build FILE -o OUT`: check the manuscript and write it with every
 * fill-in typeset (Markdown spliced byte for byte, or a standalone HTML page).
 * Nothing is written when the check fails unless --force-write asks; the input
 * is never overwritten; each output appears whole or not at all.
 */
import { readFile, stat } from 'node:fs/promises';
import { wantsColor } from '../terminal.ts';
import type { Argv } from 'yargs';
import { describeWriteFailure, writeFileAtomic, writeStandardOutput } from '../write-atomic.ts';
import type { FormatOptions, OutputFile } from '../formats/types.ts';
import { EXIT_USAGE, exitStatusFor, formatOf, manuscriptOptions, readManuscriptArgs, reportDiagnostics, resultFailed, usage, type ManuscriptArgs } from './check.ts';
import type { CliCommand } from './index.ts';
import { throughRunMemo } from '../run-memo.ts';

/** `-o -` writes the output to standard output (the report stays on stderr). */
export const STANDARD_OUTPUT = '-';

export interface BuildArgs extends ManuscriptArgs {
  readonly forceWrite: boolean;
}

export function buildOptions(y: Argv): Argv {
  return manuscriptOptions(y)
    .option('output', {
      alias: 'o',
      type: 'string',
      describe:
        'Where to write; - is standard output. Markdown: default NAME.filled.md, or NAME.html with --html, beside the input. LaTeX: default the sidecar NAME.skein.tex that \\usepackage{skeinproof} reads; -o FILE.tex writes a flat copy that needs no package',
    })
    .option('html', { type: 'boolean', default: false, describe: 'Markdown only: write a standalone HTML page (implied by an -o ending in .html)' })
    .option('allow-html', { type: 'boolean', default: false, describe: 'Markdown only: keep raw HTML of the manuscript on the page, sanitized (otherwise it is shown as text)' })
    .option('force-write', { type: 'boolean', default: false, describe: 'Write the output even when the check fails' }) as Argv;
}

/** `keepValues`: keep the computed values in memory for the next build (watch). */
export function readBuildArgs(raw: Record<string, unknown>, keepValues = false): BuildArgs | string {
  const args = readManuscriptArgs(raw, keepValues);
  if (typeof args === 'string') return args;
  const output = raw['output'];
  if (output !== undefined && (typeof output !== 'string' || output === '')) return '-o needs a file name';
  const options: FormatOptions = {
    ...args.options,
    ...(typeof output === 'string' ? { output } : {}),
    html: raw['html'] === true,
    allowHtml: raw['allow-html'] === true,
  };
  return { ...args, options, forceWrite: raw['force-write'] === true };
}

export interface BuildOutcome {
  readonly status: number;
  /** The files the build read (for watch). */
  readonly inputs: readonly string[];
}

/** One build of one manuscript: report on stderr, say on stdout what was written. */
export async function buildOnce(path: string, args: BuildArgs): Promise<BuildOutcome> {
  const format = formatOf(path);
  if (typeof format === 'string') return { status: usage(format), inputs: [path] };
  const result = await throughRunMemo('build', format, path, args.options);
  args.options.resultStore?.finish();
  const strict = args.options.strict === true;
  const failed = resultFailed(result, strict);
  if (result.diagnostics.length > 0) process.stderr.write(reportDiagnostics(result.diagnostics, args.report, result.inputs, strict || failed, wantsColor(process.stderr)));
  const status = exitStatusFor(result.diagnostics, failed, strict);
  const inputs = result.inputs;
  if (failed && !args.forceWrite) {
    // A JSON or SARIF report on stderr must stay one document that tools can parse; the exit status says the same.
    if (result.outputs.length > 0 && args.report === 'text') process.stderr.write('skeinproof: nothing written because the check failed; fix the errors above, or pass --force-write\n');
    return { status, inputs };
  }
  const unowned = await firstUnownedOutput(result.outputs);
  if (unowned) {
    process.stderr.write(
      `skeinproof: nothing written: ${unowned} already exists and skeinproof did not write it (it lacks the mark every build leaves in its output), so the build will not replace it unasked; move or rename that file, or name the output with -o (an output named there is replaced)\n`,
    );
    return { status: EXIT_USAGE, inputs };
  }
  for (const output of result.outputs) {
    if (output.path === STANDARD_OUTPUT) {
      await writeStandardOutput(output.content);
      continue;
    }
    try {
      await writeFileAtomic(output.path, output.content, { protect: result.inputs });
    } catch (e) {
      process.stderr.write(`skeinproof: ${describeWriteFailure(output.path, e)}\n`);
      return { status: EXIT_USAGE, inputs };
    }
    process.stdout.write(`wrote ${output.path}\n`);
  }
  return { status, inputs };
}

/** The first output at a default path whose existing file skeinproof did not write. */
async function firstUnownedOutput(outputs: readonly OutputFile[]): Promise<string | undefined> {
  for (const output of outputs) {
    if (output.ownMark === undefined) continue;
    // Only a regular file is read (a named pipe would block); anything else is refused by the write itself.
    const entry = await stat(output.path).catch(() => undefined);
    if (!entry?.isFile()) continue;
    const existing = await readFile(output.path, 'utf8').catch(() => undefined);
    if (existing !== undefined && !existing.includes(output.ownMark)) return output.path;
  }
  return undefined;
}

export const buildCommand: CliCommand = {
  command: 'build <file>',
  describe: 'Check a manuscript and write it with every fill-in typeset: Markdown (or an HTML page with --html), or for LaTeX the sidecar the package reads (or a flat copy with -o)',
  builder: (y: Argv) => buildOptions(y.positional('file', { type: 'string', describe: 'The manuscript: Markdown (.md, .markdown) or LaTeX (.tex, .ltx)' })),
  run: async (raw) => {
    const args = readBuildArgs(raw);
    if (typeof args === 'string') return usage(args);
    return (await buildOnce(String(raw['file']), args)).status;
  },
};
