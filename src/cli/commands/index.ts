/** The registered commands, in the order `--help` lists them. */
import type { Argv } from 'yargs';
import { computeCommand } from './compute.ts';
import { checkCommand } from './check.ts';
import { buildCommand } from './build.ts';
import { watchCommand } from './watch.ts';
import { batchCommand } from './batch.ts';

export interface CliCommand {
  readonly command: string;
  readonly describe: string;
  readonly builder: (y: Argv) => Argv;
  /** Runs the command and returns the exit status. */
  readonly run: (args: Record<string, unknown>) => Promise<number>;
}

export const commands: readonly CliCommand[] = [computeCommand, checkCommand, buildCommand, watchCommand, batchCommand];
