/** `--jobs N` and `--quiet`, shared by batch and the manuscript commands. */
import { availableParallelism } from 'node:os';
import type { Argv } from 'yargs';
import { repeatedOptionMessage } from './repeated-option.ts';

export function jobsOptions(y: Argv): Argv {
  return jobsOption(y)
    .option('quiet', { alias: 'q', type: 'boolean', default: false, describe: 'No progress bar (it is shown only on a terminal, for runs longer than a second, and never under CI)' }) as Argv;
}

/** `--jobs N` alone (compute has no progress bar to quiet). */
export function jobsOption(y: Argv): Argv {
  return y.option('jobs', { alias: 'j', type: 'number', describe: 'Threads computing, this one included (default: the machine\'s cores)' });
}

/** The number of threads, or a usage message. */
export function readJobs(args: Record<string, unknown>): number | string {
  const repeated = repeatedOptionMessage('jobs', args['jobs']);
  if (repeated !== undefined) return repeated;
  const jobs = args['jobs'] === undefined ? availableParallelism() : (args['jobs'] as number);
  return Number.isInteger(jobs) && jobs >= 1 ? jobs : `--jobs needs a positive whole number of threads, not ${String(args['jobs'])}.`;
}
