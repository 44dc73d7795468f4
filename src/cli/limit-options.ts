/** The options that bound each diagram's work (src/core/limits.ts), shared by compute, check, build, watch and batch. */
import type { Argv } from 'yargs';
import { DEFAULT_LIMITS, type ComputeLimits } from '../core/limits.ts';
import { repeatedOptionMessage } from './repeated-option.ts';

const MIB = 1024 * 1024;

export function limitOptions(y: Argv): Argv {
  return y
    .option('max-crossings', { type: 'number', default: DEFAULT_LIMITS.maxCrossings, describe: 'Refuse codes with more crossings than this (the rest is still checked)' })
    .option('time-budget', { type: 'number', default: DEFAULT_LIMITS.timeBudgetMs / 1000, describe: 'Seconds each computation of one diagram may take before it is stopped' })
    .option('max-state-memory', { type: 'number', default: DEFAULT_LIMITS.maxStateBytes / MIB, describe: 'MiB the bracket of one diagram may need; larger ones are refused before they start' }) as Argv;
}

/** The limits given, or a usage message. */
export function readLimits(args: Record<string, unknown>): ComputeLimits | string {
  const read = (name: string): number | string => {
    const repeated = repeatedOptionMessage(name, args[name]);
    if (repeated !== undefined) return repeated;
    const value = args[name] as number;
    return Number.isFinite(value) && value > 0 ? value : `--${name} needs a positive number${Number.isNaN(value) ? '' : `, not ${value}`}.`;
  };
  const crossings = read('max-crossings');
  const seconds = read('time-budget');
  const mib = read('max-state-memory');
  for (const value of [crossings, seconds, mib]) if (typeof value === 'string') return value;
  return { maxCrossings: Math.floor(crossings as number), timeBudgetMs: (seconds as number) * 1000, maxStateBytes: (mib as number) * MIB };
}
