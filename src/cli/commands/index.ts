/**
 * The registered commands, in the order `--help` lists them. Each command's
 * module is imported only when it runs (or when the help lists them all), so
 * a command never loads what only another one needs: `build` of an unchanged
 * manuscript, replayed from the disk cache, loads none of the engines that
 * `compute` imports.
 */
import type { Argv } from 'yargs';

export interface CliCommand {
  readonly command: string;
  readonly describe: string;
  readonly builder: (y: Argv) => Argv;
  /** Runs the command and returns the exit status. */
  readonly run: (args: Record<string, unknown>) => Promise<number>;
}

export interface CommandEntry {
  /** The name typed on the command line (the first word of `command`). */
  readonly name: string;
  readonly load: () => Promise<CliCommand>;
}

export const commands: readonly CommandEntry[] = [
  { name: 'compute', load: async () => (await import('./compute.ts')).computeCommand },
  { name: 'check', load: async () => (await import('./check.ts')).checkCommand },
  { name: 'build', load: async () => (await import('./build.ts')).buildCommand },
  { name: 'watch', load: async () => (await import('./watch.ts')).watchCommand },
  { name: 'batch', load: async () => (await import('./batch.ts')).batchCommand },
];

/** The commands to register for `argv`: the one it names, or all of them (for the help, or to report a usage error). */
export async function commandsFor(argv: readonly string[]): Promise<CliCommand[]> {
  const named = commands.find((c) => c.name === argv[0]);
  return Promise.all((named ? [named] : commands).map((c) => c.load()));
}
