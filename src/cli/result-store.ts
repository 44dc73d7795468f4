/**
 * The disk cache: the command line's ResultStore (src/core/cache/store.ts).
 * Each value is one file, named by the SHA-256 of the engine's version and
 * the key, under DIR/entries/xy/. A file holds a header line
 *
 *     skeinproof-result 1 <SHA-256 of engine and key> <SHA-256 of the value> <value length>
 *
 * and the value's text. A file whose header, key digest, length or checksum is
 * wrong (truncated, corrupted, written by something else) is ignored, and the
 * value is computed and written again. A file is written under a temporary
 * name and renamed into place, so two processes writing one entry at once
 * leave one whole entry, never a mix. Reading an entry touches its time, and
 * after a run that wrote, the least recently used entries are removed until
 * the cache is under its size cap. A cache that cannot be written is skipped
 * with one warning: it only saves time.
 */
import { createHash, randomBytes } from 'node:crypto';
import { mkdirSync, readdirSync, readFileSync, renameSync, statSync, unlinkSync, utimesSync, writeFileSync } from 'node:fs';
import { homedir } from 'node:os';
import { join } from 'node:path';
import type { ResultStore } from '../core/cache/store.ts';

const MAGIC = 'skeinproof-result 1';
const MIB = 1024 * 1024;
/** A temporary file older than this belongs to a process that died before renaming it. */
const STALE_TEMPORARY_MS = 60 * 60 * 1000;

export interface FileStoreOptions {
  /** The directory of the cache (created when first written). */
  readonly dir: string;
  /** The engine's version: entries of another version are never read. */
  readonly engine: string;
  /** Size cap in bytes. */
  readonly maxBytes: number;
  /** Called once, the first time the cache cannot be written (default: a warning on standard error). */
  readonly warn?: (message: string) => void;
}

export interface StoreCounts {
  hits: number;
  misses: number;
  /** Entries found but not trusted (bad header, digest, length or checksum). */
  rejected: number;
  writes: number;
}

const sha256 = (text: string): string => createHash('sha256').update(text).digest('hex');

export class FileResultStore implements ResultStore {
  readonly counts: StoreCounts = { hits: 0, misses: 0, rejected: 0, writes: 0 };
  private readonly entries: string;
  private writable = true;
  private writtenSinceEviction = 0;

  constructor(readonly options: FileStoreOptions) {
    this.entries = join(options.dir, 'entries');
  }

  /** The entry file of `key` and the digest its header must carry. */
  private locate(key: string): { path: string; digest: string } {
    const digest = sha256(`${this.options.engine}\u0000${key}`);
    return { path: join(this.entries, digest.slice(0, 2), digest), digest };
  }

  get(key: string): string | undefined {
    const { path, digest } = this.locate(key);
    let text: string;
    try {
      text = readFileSync(path, 'utf8');
    } catch {
      this.counts.misses++;
      return undefined;
    }
    const value = entryValue(text, digest);
    if (value === undefined) {
      this.counts.rejected++;
      return undefined;
    }
    this.counts.hits++;
    const now = new Date();
    try {
      utimesSync(path, now, now);
    } catch {
      // Another process evicted it meanwhile: the value read is still whole.
    }
    return value;
  }

  put(key: string, value: string): void {
    if (!this.writable) return;
    const { path, digest } = this.locate(key);
    const text = `${MAGIC} ${digest} ${sha256(value)} ${Buffer.byteLength(value, 'utf8')}\n${value}`;
    const temporary = `${path}.${process.pid}.${randomBytes(6).toString('hex')}.tmp`;
    try {
      mkdirSync(join(path, '..'), { recursive: true });
      writeFileSync(temporary, text, { flag: 'wx' });
      renameSync(temporary, path);
      this.counts.writes++;
      this.writtenSinceEviction++;
    } catch (e) {
      try {
        unlinkSync(temporary);
      } catch {
        // Never created.
      }
      this.writable = false;
      (this.options.warn ?? warnOnStandardError)(`cannot write the cache in ${this.options.dir} (${(e as NodeJS.ErrnoException).code ?? (e as Error).message}); going on without storing results (--no-cache turns the cache off)`);
    }
  }

  /**
   * After a run that wrote (or, with `force`, after other processes wrote to it): removes the least recently used entries until the cache holds at most
   * 90 % of its cap (so the next runs do not evict again at once), and temporary files left by
   * processes that died.
   */
  evict(force = false): void {
    if (this.writtenSinceEviction === 0 && !force) return;
    this.writtenSinceEviction = 0;
    const files: { path: string; size: number; used: number }[] = [];
    let total = 0;
    const now = Date.now();
    for (const shard of listDir(this.entries)) {
      const dir = join(this.entries, shard);
      for (const name of listDir(dir)) {
        const path = join(dir, name);
        const stats = statSync(path, { throwIfNoEntry: false });
        if (!stats?.isFile()) continue;
        if (name.endsWith('.tmp')) {
          if (now - stats.mtimeMs > STALE_TEMPORARY_MS) removeQuietly(path);
          continue;
        }
        files.push({ path, size: stats.size, used: stats.mtimeMs });
        total += stats.size;
      }
    }
    if (total <= this.options.maxBytes) return;
    files.sort((a, b) => a.used - b.used);
    const goal = 0.9 * this.options.maxBytes;
    for (const file of files) {
      if (total <= goal) break;
      removeQuietly(file.path);
      total -= file.size;
    }
  }
}

function warnOnStandardError(message: string): void {
  process.stderr.write(`skeinproof: warning: ${message}\n`);
}

/** The value of an entry file, or undefined when the file is not a whole entry for `digest`. */
function entryValue(text: string, digest: string): string | undefined {
  const newline = text.indexOf('\n');
  if (newline < 0) return undefined;
  const header = text.slice(0, newline).split(' ');
  if (header.length !== 5 || `${header[0]} ${header[1]}` !== MAGIC || header[2] !== digest) return undefined;
  const value = text.slice(newline + 1);
  if (String(Buffer.byteLength(value, 'utf8')) !== header[4] || sha256(value) !== header[3]) return undefined;
  return value;
}

function listDir(dir: string): string[] {
  try {
    return readdirSync(dir);
  } catch {
    return [];
  }
}

function removeQuietly(path: string): void {
  try {
    unlinkSync(path);
  } catch {
    // Already gone (another process evicted it).
  }
}

/**
 * Where the cache lives: --cache-dir, else SKEINPROOF_CACHE_DIR, else the user's cache directory
 * (XDG_CACHE_HOME or ~/.cache on Linux and other Unix, ~/Library/Caches on macOS, LOCALAPPDATA on
 * Windows) with skeinproof under it.
 */
export function cacheDirectory(flag: string | undefined, env: NodeJS.ProcessEnv = process.env, platform: NodeJS.Platform = process.platform): string {
  if (flag) return flag;
  if (env['SKEINPROOF_CACHE_DIR']) return env['SKEINPROOF_CACHE_DIR'];
  if (platform === 'darwin') return join(homedir(), 'Library', 'Caches', 'skeinproof');
  if (platform === 'win32' && env['LOCALAPPDATA']) return join(env['LOCALAPPDATA'], 'skeinproof', 'Cache');
  const base = env['XDG_CACHE_HOME'] && env['XDG_CACHE_HOME'].startsWith('/') ? env['XDG_CACHE_HOME'] : join(homedir(), '.cache');
  return join(base, 'skeinproof');
}

/** The size cap: SKEINPROOF_CACHE_MAX_MIB, else 256 MiB. */
export function cacheCapBytes(env: NodeJS.ProcessEnv = process.env): number {
  const mib = Number(env['SKEINPROOF_CACHE_MAX_MIB']);
  return (Number.isFinite(mib) && mib > 0 ? mib : 256) * MIB;
}
