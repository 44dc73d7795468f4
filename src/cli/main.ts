/**
 * The `skeinproof` command line: yargs wiring only. Each command lives in
 * ./commands and returns its exit status; nothing here computes.
 *
 * Exit status: 0 nothing fails; 1 a claim is contradicted (or a warning under
 * --strict); 2 usage errors, unreadable files and invalid codes; 3 an internal
 * error (a bug, e.g. two independent computations of an invariant disagree).
 */
import yargs from 'yargs';
import type { Argv } from 'yargs';
import { commands, commandsFor } from './commands/index.ts';
import { STANDARD_INPUT_ARGUMENT } from './standard-input.ts';
import { SKEINPROOF_VERSION } from './version.ts';

export const EXIT_OK = 0;
export const EXIT_CONTRADICTED = 1;
export const EXIT_USAGE = 2;
export const EXIT_INTERNAL = 3;

/** A bug is reported as one, in words, without a stack trace: the user's input was accepted. */
function internalErrorMessage(error: unknown): string {
  const detail = (error instanceof Error ? error.message : String(error)).replace(/^internal:\s*/, '');
  return (
    `skeinproof: internal error: ${detail}\n` +
    'This is a bug in skeinproof, not a mistake in your input; the computation stopped rather than print a possibly wrong value. ' +
    'Please report it with the command line and the input that caused it.\n'
  );
}

export async function main(argv: readonly string[]): Promise<number> {
  let status = EXIT_OK;
  let usageError: string | undefined;
  const named = argv[0];
  const names = commands.map((c) => c.name);
  if (named !== undefined && !named.startsWith('-') && !names.includes(named)) {
    process.stderr.write(`skeinproof: unknown command \`${named}\`; the commands are ${names.join(', ')}\nRun 'skeinproof --help' for the commands and options.\n`);
    return EXIT_USAGE;
  }
  const args = markStandardInput(argv);
  let parser: Argv = yargs(args)
    .scriptName('skeinproof')
    .usage('$0 <command> [options]')
    .strict()
    .demandCommand(1, 'Name a command: compute, check, build or watch.')
    .help()
    .alias('h', 'help')
    .version(SKEINPROOF_VERSION)
    .alias('V', 'version')
    .wrap(asksForHelp(argv) ? Math.min(100, process.stdout.columns || 100) : null)
    .fail((message, error) => {
      if (error && !(error as { isUsage?: boolean }).isUsage) throw error;
      usageError = message ?? error?.message ?? 'invalid usage';
    });
  skipHelpCache(parser);
  for (const command of await commandsFor(argv)) {
    parser = parser.command(command.command, command.describe, command.builder, async (args) => {
      // yargs still calls the handler after .fail() has reported a usage error (e.g. a value not among the choices): do not run then.
      if (usageError !== undefined) return;
      status = await command.run(args as Record<string, unknown>);
    });
  }
  try {
    // With a callback yargs hands over its help and version text instead of printing it (and does not exit), so it can be tidied.
    let shown = '';
    await parser.parseAsync(args, {}, (_error, _argv, output) => {
      shown = output;
    });
    if (shown !== '' && usageError === undefined) process.stdout.write(`${tidyHelp(shown)}\n`);
  } catch (error) {
    process.stderr.write(internalErrorMessage(error));
    return EXIT_INTERNAL;
  }
  if (usageError !== undefined) {
    process.stderr.write(`skeinproof: ${usageError}\nRun 'skeinproof --help' for the commands and options.\n`);
    return EXIT_USAGE;
  }
  return status;
}

/**
 * yargs lays out the whole help text before running any command, in case the
 * command fails later and the help is wanted then (about 18 ms of every run's
 * start-up, a tenth of it). This tool prints its own usage errors and never
 * that cached text, so the layout is skipped; `--help` lays its text out when
 * it is asked for, as before. If a yargs release moves the method, nothing
 * changes but the time.
 */
function skipHelpCache(parser: Argv): void {
  const usage = (parser as unknown as { getInternalMethods?: () => { getUsageInstance?: () => { cacheHelpMessage?: () => void } } }).getInternalMethods?.().getUsageInstance?.();
  if (usage && typeof usage.cacheHelpMessage === 'function') usage.cacheHelpMessage = () => undefined;
}

/** yargs drops a bare `-`; a manuscript named `-` (standard input) is kept so the command can answer it. */
function markStandardInput(argv: readonly string[]): string[] {
  return argv.map((a, i) => (a === '-' && i > 0 && argv[i - 1] !== '-o' && argv[i - 1] !== '--output' && argv[0] !== 'compute' ? STANDARD_INPUT_ARGUMENT : a));
}

/**
 * Two flaws of yargs' help layout: when an option's description exactly fills
 * its column the type hints are glued to it ("written[choices: …]"), and a
 * required list of files is also shown with the empty default yargs gives it.
 */
export function tidyHelp(text: string): string {
  return text
    .replace(/([^\s[])\[(choices|default|boolean|string|number|array|required|count|deprecated)\b/g, '$1 [$2')
    .replace(/ \[required\] \[default: \[\]\]/g, ' [required]');
}

/**
 * Whether the help text will be shown. yargs lays out a command's help on every run (to have it ready), which
 * with line wrapping is a good part of a short run's time; without a help request it is laid out unwrapped.
 */
function asksForHelp(argv: readonly string[]): boolean {
  return argv.some((a) => a === '--help' || a.startsWith('--help=') || /^-[A-Za-z]*h/.test(a));
}
