/**
 * The disk cache: the command line's ResultStore (src/core/cache/store.ts).
 * The values of one diagram (the part of a key after the quantity) are one file, named by the SHA-256 of the
 * engine's version and the key, under DIR/entries/xy/. A file holds a header line
 *
 *     skeinproof-result 2 <SHA-256 of engine and key> <SHA-256 of the body> <body length>
 *
 * and a body: a JSON object from quantity names to their texts. A file whose
 * header, key digest, length or checksum is wrong (truncated, corrupted,
 * written by something else) is ignored, and its values are computed and
 * written again. New values are kept in memory and written when the command
 * calls `flush` (at the end of a run, after each batch line): one file per
 * diagram rather than per value, since creating files is what a cold run pays
 * most for. A file is written under a temporary name and renamed into place,
 * so two processes writing one entry at once leave one whole entry, never a
 * mix (values only the other one had are computed again next time). Reading
 * an entry touches its time, and after a run that wrote, the least recently
 * used entries are removed until the cache is under its size cap. A cache that
 * cannot be written is skipped with one warning: it only saves time.
 */
import { createHash, randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, readFileSync, renameSync, statSync, unlinkSync, utimesSync, writeFileSync } from 'node:fs';
import { homedir } from 'node:os';
import { join } from 'node:path';
import { splitResultKey, type ResultStore } from '../core/cache/store.ts';

const MAGIC = 'skeinproof-result 2';
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
  /** Values found, and values asked for but not found. */
  hits: number;
  misses: number;
  /** Entry files found but not trusted (bad header, digest, length or checksum). */
  rejected: number;
  /** Entry files written. */
  writes: number;
}

const sha256 = (text: string): string => createHash('sha256').update(text).digest('hex');

/** One diagram key's entry file: where it is, and its values as read and as added since. */
interface Entry {
  readonly path: string;
  readonly shard: string;
  readonly digest: string;
  readonly values: Record<string, string>;
  dirty: boolean;
}

export class FileResultStore implements ResultStore {
  readonly counts: StoreCounts = { hits: 0, misses: 0, rejected: 0, writes: 0 };
  private readonly entries: string;
  private writable = true;
  private writtenSinceEviction = 0;
  /**
   * The entry names of each shard directory, listed when the shard is first used: a key whose entry is not
   * listed is a miss without trying to open it. An entry another process writes meanwhile is missed and
   * written again, which is harmless.
   */
  private readonly shards = new Map<string, Set<string> | undefined>();
  /** The entries read or added since the last flush, by diagram key. */
  private readonly open = new Map<string, Entry>();

  constructor(readonly options: FileStoreOptions) {
    this.entries = join(options.dir, 'entries');
  }

  /** The names in a shard directory (undefined when it does not exist), listed once. */
  private listing(shard: string): Set<string> | undefined {
    if (!this.shards.has(shard)) this.shards.set(shard, existsSync(shard) ? new Set(listDir(shard)) : undefined);
    return this.shards.get(shard);
  }

  /** The entry of a diagram key, read from its file the first time (empty when there is none or it is not trusted). */
  private entry(diagram: string): Entry {
    const known = this.open.get(diagram);
    if (known) return known;
    const digest = sha256(`${this.options.engine}\u0000${diagram}`);
    const shard = join(this.entries, digest.slice(0, 2));
    const path = join(shard, digest);
    const entry: Entry = { path, shard, digest, values: {}, dirty: false };
    this.open.set(diagram, entry);
    if (!this.listing(shard)?.has(digest)) return entry;
    let text: string;
    try {
      text = readFileSync(path, 'utf8');
    } catch {
      return entry; // evicted by another process meanwhile
    }
    const values = entryValues(text, digest);
    if (!values) {
      this.counts.rejected++;
      return entry;
    }
    Object.assign(entry.values, values);
    const now = new Date();
    try {
      utimesSync(path, now, now);
    } catch {
      // Evicted meanwhile: the values read are still whole.
    }
    return entry;
  }

  get(key: string): string | undefined {
    const { quantity, diagram } = splitResultKey(key);
    const value = this.entry(diagram).values[quantity];
    if (value === undefined) this.counts.misses++;
    else this.counts.hits++;
    return value;
  }

  put(key: string, text: string): void {
    const { quantity, diagram } = splitResultKey(key);
    const entry = this.entry(diagram);
    entry.values[quantity] = text;
    entry.dirty = true;
  }

  /** Writes every entry that gained values since the last flush, and forgets the entries read (memory stays small). */
  flush(): void {
    for (const entry of this.open.values()) if (entry.dirty) this.write(entry);
    this.open.clear();
  }

  /** Flushes, then keeps the cache under its cap: what a command does when it is done. */
  finish(): void {
    this.flush();
    this.evict();
  }

  private write(entry: Entry): void {
    if (!this.writable) return;
    const body = JSON.stringify(entry.values);
    const text = `${MAGIC} ${entry.digest} ${sha256(body)} ${Buffer.byteLength(body, 'utf8')}\n${body}`;
    const temporary = `${entry.path}.${process.pid}.${randomBytes(6).toString('hex')}.tmp`;
    try {
      let names = this.listing(entry.shard);
      if (!names) {
        // Private to the user: a checksum detects a damaged entry, not one forged by someone who can write here.
        mkdirSync(entry.shard, { recursive: true, mode: 0o700 });
        this.shards.set(entry.shard, (names = new Set()));
      }
      writeFileSync(temporary, text, { flag: 'wx' });
      renameSync(temporary, entry.path);
      names.add(entry.digest);
      entry.dirty = false;
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

/** The values of an entry file, or undefined when the file is not a whole entry for `digest`. */
function entryValues(text: string, digest: string): Record<string, string> | undefined {
  const newline = text.indexOf('\n');
  if (newline < 0) return undefined;
  const header = text.slice(0, newline).split(' ');
  if (header.length !== 5 || `${header[0]} ${header[1]}` !== MAGIC || header[2] !== digest) return undefined;
  const body = text.slice(newline + 1);
  if (String(Buffer.byteLength(body, 'utf8')) !== header[4] || sha256(body) !== header[3]) return undefined;
  let values: unknown;
  try {
    values = JSON.parse(body);
  } catch {
    return undefined;
  }
  if (typeof values !== 'object' || values === null || Array.isArray(values)) return undefined;
  return Object.values(values).every((v) => typeof v === 'string') ? (values as Record<string, string>) : undefined;
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
