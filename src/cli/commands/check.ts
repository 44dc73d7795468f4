/**
 * `skeinproof check FILE…`: read each manuscript, compute every diagram once,
 * judge every claim, and report all problems of all files in one run.
 *
 * Also holds what `build` and `watch` share with it: the manuscript options,
 * reading them from the command line, and reporting diagnostics.
 */
import { wantsColor } from '../terminal.ts';
import { readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import type { Argv } from 'yargs';
import type { Convention } from '../../core/convention/convention.ts';
import { parseConventionText } from '../../core/convention/settings.ts';
import type { Diagnostic } from '../../core/diagnostics/diagnostic.ts';
import type { PrecomputeHook, SessionCounts } from '../../core/manuscript/api.ts';
import { EXIT_BAD_INPUT, EXIT_FAILED_CHECK, countDiagnostics, exitStatus, formatHumanReport, formatJsonReport, formatSarif } from '../../report/index.ts';
import { formatFor, knownExtensions } from '../formats/registry.ts';
import type { FormatOptions, FormatResult, ManuscriptFormat } from '../formats/types.ts';
import type { CliCommand } from './index.ts';
import { conventionOptionText } from '../repeated-option.ts';
import { limitOptions, readLimits } from '../limit-options.ts';
import { jobsOptions, readJobs } from '../jobs-option.ts';
import { lendHelperThreads } from '../replay-helper.ts';
import type { ManuscriptValuesOptions } from '../manuscript-pool.ts';
import { progressDisplay, wantsProgress } from '../progress.ts';
import { cacheOptions, openCache } from '../cache-options.ts';
import { throughRunMemo } from '../run-memo.ts';
import { STANDARD_INPUT_ARGUMENT } from '../standard-input.ts';

export const EXIT_USAGE = EXIT_BAD_INPUT;

export const REPORT_FORMATS = ['text', 'json', 'sarif'] as const;
export type ReportFormat = (typeof REPORT_FORMATS)[number];

export interface ManuscriptArgs {
  readonly report: ReportFormat;
  readonly options: FormatOptions;
}

/** The options every manuscript command takes. */
export function manuscriptOptions(y: Argv): Argv {
  return jobsOptions(cacheOptions(limitOptions(y)))
    .option('format', { choices: REPORT_FORMATS, default: 'text', describe: 'How problems are reported: text for people, json or sarif for tools' })
    .option('strict', { type: 'boolean', default: false, describe: 'Warnings (undecided or mirror-only claims) fail too' })
    .option('convention', {
      type: 'string',
      describe: 'Override the document\'s convention, e.g. "jones=q,order=descending" (keys: jones, bracket, order, half-powers, signature, homfly, kauffman)',
    }) as Argv;
}

/**
 * The shared options, or a usage message. The diagrams are computed in a pool of threads
 * (src/cli/manuscript-pool.ts) when --jobs allows more than one, when a progress bar may be shown, or
 * when `keepValues` asks (watch keeps them in memory from one save to the next).
 */
export function readManuscriptArgs(args: Record<string, unknown>, keepValues = false): ManuscriptArgs | string {
  let convention: Partial<Convention> | undefined;
  const conventionText = conventionOptionText(args['convention']);
  if (conventionText !== undefined) {
    const read = parseConventionText(conventionText);
    if (!read.ok) return `--convention: ${read.errors.map((e) => e.message).join('; ')}`;
    convention = read.settings;
  }
  const limits = readLimits(args);
  if (typeof limits === 'string') return limits;
  const resultStore = openCache(args);
  if (typeof resultStore === 'string') return resultStore;
  const jobs = readJobs(args);
  if (typeof jobs === 'string') return jobs;
  lendHelperThreads(jobs);
  const quiet = args['quiet'] === true;
  const pooled = jobs > 1 || keepValues || wantsProgress(quiet);
  const values = pooled ? lazyValues({ jobs, ...(resultStore ? { disk: resultStore } : {}), progress: () => progressDisplay('diagrams', quiet) }) : undefined;
  return {
    report: args['format'] as ReportFormat,
    options: {
      ...(convention ? { convention } : {}),
      strict: args['strict'] === true,
      limits,
      ...(resultStore ? { resultStore } : {}),
      ...(values ? { precompute: values.precompute } : {}),
    },
  };
}

/**
 * The pool's values, with the pool and the engines behind it loaded on the first session that needs them: a
 * replayed run (../run-memo.ts) needs none. One instance for the life of the hook, as watch keeps it.
 */
function lazyValues(options: ManuscriptValuesOptions): { readonly precompute: PrecomputeHook } {
  let values: Promise<import('../manuscript-pool.ts').ManuscriptValues> | undefined;
  return {
    precompute: async (input) => {
      values ??= import('../manuscript-pool.ts').then(({ ManuscriptValues }) => new ManuscriptValues(options));
      return (await values).precompute(input);
    },
  };
}


/** The format that reads `path`, or a message saying why no format can (standard input, a directory, a missing file, an unknown extension). */
export function formatOf(path: string): ManuscriptFormat | string {
  if (path === STANDARD_INPUT_ARGUMENT) {
    return 'a manuscript cannot be read from standard input (`-`): its extension says whether it is Markdown or LaTeX, and a LaTeX paper\'s folder holds what it \\inputs; save it to a file (NAME.md or NAME.tex) and name that file';
  }
  const kind = statSync(path, { throwIfNoEntry: false });
  if (kind?.isDirectory()) return `${path} is a directory, not a manuscript: name the files in it, e.g. ${join(path, '*.md')}`;
  const format = formatFor(path);
  if (format) return format;
  if (!kind) return `cannot read ${path}: no such file; check the path`;
  return `cannot tell what kind of manuscript ${path} is from its extension; the known extensions are ${knownExtensions().join(', ')}`;
}

/** A FILE argument no format can read, as a problem of that file, so the other files are still checked. */
function unusableFile(path: string, reason: string): Diagnostic {
  return { severity: 'error', ruleId: 'file-unreadable', message: reason, location: { file: path, start: { line: 1, column: 1 } } };
}

/** True when the result fails the check (the format decides, knowing the document's own strictness). */
export function resultFailed(result: FormatResult, strict: boolean): boolean {
  return result.failed ?? result.diagnostics.some((d) => d.severity === 'error' || (strict && d.severity === 'warning'));
}

/** The exit status: the reporters' rule, and 1 at least when the document's own strictness fails it. */
export function exitStatusFor(diagnostics: readonly Diagnostic[], failed: boolean, strict: boolean): number {
  const status = exitStatus(diagnostics, { strict });
  return failed && status === 0 ? EXIT_FAILED_CHECK : status;
}

/**
 * The report of all diagnostics; the human one quotes the file texts under each message.
 * `strict` is the strictness that decided the run: the command line's, or true when the
 * check failed (a document's own `strict` may fail it on warnings), so the JSON report's
 * exit status is the one the process ends with.
 */
export function reportDiagnostics(
  diagnostics: readonly Diagnostic[],
  format: ReportFormat,
  files: readonly string[],
  strict: boolean,
  color: boolean,
  checked?: SessionCounts,
): string {
  if (format === 'json') return formatJsonReport(diagnostics, { strict, ...(checked ? { checked } : {}) });
  if (format === 'sarif') return formatSarif(diagnostics);
  const sources = new Map<string, string>();
  for (const f of files) {
    try {
      // Columns count from after a byte order mark, as editors do, so the excerpt leaves it out too.
      sources.set(f, readFileSync(f, 'utf8').replace(/^\uFEFF/, ''));
    } catch {
      // An unreadable file is already a diagnostic of its own.
    }
  }
  const report = formatHumanReport(diagnostics, { sources, color, ...(checked ? { checked } : {}) });
  const { errors, warnings } = countDiagnostics(diagnostics);
  // "0 errors" and a failing status would puzzle a reader who did not ask for --strict (the front matter did).
  const why = strict && errors === 0 && warnings > 0 ? 'the check fails on these warnings: strictness is on (--strict, or `strict: true` in the front matter)\n' : '';
  return report + why;
}

/** The counts of several manuscripts, summed. */
function addCounts(total: SessionCounts | undefined, more: SessionCounts): SessionCounts {
  if (!total) return more;
  const sum = { ...total };
  for (const key of Object.keys(sum) as (keyof SessionCounts)[]) sum[key] += more[key];
  return sum;
}

export function usage(message: string): number {
  process.stderr.write(`skeinproof: ${message}\nRun 'skeinproof --help' for the commands and options.\n`);
  return EXIT_USAGE;
}

export const checkCommand: CliCommand = {
  command: 'check <files..>',
  describe: 'Check every value stated in the manuscripts against the diagram codes, reporting every problem',
  builder: (y: Argv) =>
    manuscriptOptions(y.positional('files', { type: 'string', array: true, describe: 'Markdown (or LaTeX) manuscripts' })),
  run: async (raw) => {
    const args = readManuscriptArgs(raw);
    if (typeof args === 'string') return usage(args);
    const files = ((raw['files'] as unknown[] | undefined) ?? []).map(String);
    const diagnostics: Diagnostic[] = [];
    const read = new Set(files);
    let failed = false;
    let checked: SessionCounts | undefined;
    for (const path of files) {
      const format = formatOf(path);
      if (typeof format === 'string') {
        diagnostics.push(unusableFile(path, format));
        failed = true;
        continue;
      }
      const result = await throughRunMemo('check', format, path, args.options);
      diagnostics.push(...result.diagnostics);
      for (const input of result.inputs) read.add(input); // included files, so their lines can be quoted
      failed ||= resultFailed(result, args.options.strict === true);
      if (result.counts) checked = addCounts(checked, result.counts);
    }
    args.options.resultStore?.finish();
    const strict = args.options.strict === true;
    process.stdout.write(reportDiagnostics(diagnostics, args.report, [...read], strict || failed, wantsColor(process.stdout), checked));
    return exitStatusFor(diagnostics, failed, strict);
  },
};
