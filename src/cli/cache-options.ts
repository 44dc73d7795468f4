/** The disk-cache options shared by compute, check, build and watch, and opening the cache they ask for. */
import type { Argv } from 'yargs';
import { cacheCapBytes, cacheDirectory, FileResultStore, type FileStoreOptions } from './result-store.ts';
import { engineVersion } from './engine-version.ts';
import { repeatedOptionMessage } from './repeated-option.ts';

export function cacheOptions(y: Argv): Argv {
  return y
    .option('cache', {
      type: 'boolean',
      default: true,
      describe: 'Keep computed invariants on disk and reuse them on the next run (--no-cache: compute everything, read and write no cache)',
    })
    .option('cache-dir', { type: 'string', describe: 'Directory of the cache (default: $SKEINPROOF_CACHE_DIR, else the user cache directory)/skeinproof' }) as Argv;
}

/** Where the cache the options ask for lives (undefined with --no-cache), or a usage message. */
export function cacheSettings(args: Record<string, unknown>): FileStoreOptions | undefined | string {
  const repeated = repeatedOptionMessage('cache-dir', args['cache-dir']);
  if (repeated !== undefined) return repeated;
  if (args['cache'] === false) return undefined;
  const flag = args['cache-dir'];
  if (flag !== undefined && (typeof flag !== 'string' || flag === '')) return '--cache-dir needs a directory';
  return { dir: cacheDirectory(flag as string | undefined), engine: engineVersion(), maxBytes: cacheCapBytes() };
}

/** The cache the options ask for (undefined with --no-cache), or a usage message. */
export function openCache(args: Record<string, unknown>): FileResultStore | undefined | string {
  const settings = cacheSettings(args);
  return typeof settings === 'object' ? new FileResultStore(settings) : settings;
}
