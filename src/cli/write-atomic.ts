/**
 * Writing an output file so that it is never seen half-written and never
 * replaces a file it must not: the content goes to a temporary file in the
 * same directory, is flushed to disk (fsync), and is renamed over the target
 * in one step. On any failure, and on SIGINT or SIGTERM during the write, the
 * temporary file is removed and the target is left as it was.
 *
 * Only a regular file (or a path where nothing is yet) is ever replaced. A
 * symbolic link is followed: its target is written, atomically in the target's
 * own directory, and the link stays a link. Named pipes, sockets, devices and
 * the descriptor files under /dev and /proc are refused (`-o -` writes to
 * standard output). A file that is replaced keeps its permission bits. A file
 * that already holds exactly the bytes to write is left alone (a warm build
 * changes neither its time nor its inode, so nothing downstream re-runs for it).
 */
import { randomBytes } from 'node:crypto';
import { constants, unlinkSync } from 'node:fs';
import { chown, lstat, open, readlink, realpath, rename, stat, unlink, type FileHandle } from 'node:fs/promises';
import { basename, dirname, join, resolve } from 'node:path';

export class OutputRefused extends Error {
  override readonly name = 'OutputRefused';
}

export interface AtomicWriteOptions {
  /** Files the output must never replace (the manuscript and what it reads). */
  readonly protect?: readonly string[];
  /** Writes one chunk; replaceable so tests can make the write fail half-way. */
  readonly writeChunk?: (handle: FileHandle, chunk: Uint8Array) => Promise<void>;
}

const CHUNK_BYTES = 64 * 1024;

export async function writeFileAtomic(target: string, content: string | Uint8Array, options: AtomicWriteOptions = {}): Promise<void> {
  const destination = await writtenPath(target);
  await refuseProtected(target, destination, options.protect ?? []);
  const previous = await stat(destination).catch(() => undefined);
  const bytes = typeof content === 'string' ? Buffer.from(content, 'utf8') : content;
  if (previous?.isFile() && previous.size === bytes.length && (await holdsExactly(destination, bytes))) return;
  const dir = dirname(destination);
  const temporary = join(dir, `.${basename(destination)}.${process.pid}.${randomBytes(6).toString('hex')}.tmp`);
  const writeChunk = options.writeChunk ?? (async (h: FileHandle, chunk: Uint8Array) => void (await h.write(chunk)));
  let handle: FileHandle | undefined;
  removeOnSignal(temporary);
  try {
    handle = await open(temporary, constants.O_WRONLY | constants.O_CREAT | constants.O_EXCL, 0o666);
    if (previous) {
      // The replacement keeps the file's permissions (a private 600 file stays private) and, where allowed, its owner.
      await handle.chmod(previous.mode & 0o7777);
      await chown(temporary, previous.uid, previous.gid).catch(() => undefined);
    }
    for (let at = 0; at < bytes.length; at += CHUNK_BYTES) await writeChunk(handle, bytes.subarray(at, at + CHUNK_BYTES));
    await handle.sync();
    await handle.close();
    handle = undefined;
    await rename(temporary, destination);
  } catch (e) {
    await handle?.close().catch(() => undefined);
    await unlink(temporary).catch(() => undefined);
    throw e;
  } finally {
    forgetOnSignal(temporary);
  }
  await syncDirectory(dir);
}

/** True when `path` is a regular file whose bytes are `bytes` (opened without blocking: it may have become a pipe meanwhile). */
async function holdsExactly(path: string, bytes: Uint8Array): Promise<boolean> {
  let handle: FileHandle | undefined;
  try {
    handle = await open(path, constants.O_RDONLY | constants.O_NONBLOCK);
    const entry = await handle.stat();
    return entry.isFile() && entry.size === bytes.length && Buffer.from(await handle.readFile()).equals(bytes);
  } catch {
    return false;
  } finally {
    await handle?.close().catch(() => undefined);
  }
}

/**
 * The path whose directory entry the write replaces: the target itself, or the
 * end of its chain of symbolic links (which may not exist yet). Anything that
 * is not a regular file is refused here, before any work.
 */
async function writtenPath(target: string): Promise<string> {
  let path = resolve(target);
  for (let hops = 0; ; hops++) {
    if (/^\/(dev|proc)(\/|$)/.test(path)) {
      throw new OutputRefused(`cannot write ${target}: ${path === resolve(target) ? 'it' : `it leads to ${path}, which`} is a device or process file, not a file to replace; use -o - to write to standard output`);
    }
    const entry = await lstat(path).catch(() => undefined);
    if (!entry || !entry.isSymbolicLink()) {
      if (entry && !entry.isFile() && !entry.isDirectory()) {
        throw new OutputRefused(`cannot write ${target}: it is ${specialKind(entry)}, not a regular file; skeinproof replaces only regular files (use -o - to write to standard output)`);
      }
      return path;
    }
    if (hops >= 40) throw new OutputRefused(`cannot write ${target}: its symbolic links form a loop; choose another path with -o`);
    // The directory's own links are resolved too, so the temporary file lands beside the real target.
    const link = await readlink(path);
    const base = await realpath(dirname(path)).catch(() => dirname(path));
    path = resolve(base, link);
  }
}

function specialKind(entry: { isFIFO(): boolean; isSocket(): boolean; isCharacterDevice(): boolean; isBlockDevice(): boolean }): string {
  if (entry.isFIFO()) return 'a named pipe';
  if (entry.isSocket()) return 'a socket';
  if (entry.isCharacterDevice() || entry.isBlockDevice()) return 'a device file';
  return 'a special file';
}

/**
 * Same path, or the same file reached another way (link, `./`), is refused; so is
 * a target that cannot be a file (a directory, or in a directory that does not exist).
 */
async function refuseProtected(target: string, destination: string, protect: readonly string[]): Promise<void> {
  const targetStat = await stat(destination).catch(() => undefined);
  if (targetStat?.isDirectory()) throw new OutputRefused(`cannot write ${target}: it is a directory; give a file name with -o`);
  const dir = destination === resolve(target) ? dirname(target) : dirname(destination);
  const dirStat = await stat(dir).catch(() => undefined);
  if (!dirStat) throw new OutputRefused(`cannot write ${target}: the directory ${dir} does not exist; create it first or choose another path with -o`);
  if (!dirStat.isDirectory()) throw new OutputRefused(`cannot write ${target}: ${dir} is a file, not a directory; choose another path with -o`);
  for (const p of protect) {
    if (resolve(p) === resolve(target) || resolve(p) === destination) throw new OutputRefused(`refusing to write ${target}: it is the input file; choose another output path with -o`);
    if (targetStat) {
      const s = await stat(p).catch(() => undefined);
      if (s && s.dev === targetStat.dev && s.ino === targetStat.ino) {
        throw new OutputRefused(`refusing to write ${target}: it is the same file as the input ${p}; choose another output path with -o`);
      }
    }
  }
}

/** Temporary files being written now; removed if the process is interrupted. */
const pending = new Set<string>();
const SIGNALS = ['SIGINT', 'SIGTERM'] as const;

function onSignal(signal: NodeJS.Signals): void {
  for (const temporary of pending) {
    try {
      unlinkSync(temporary);
    } catch {
      // Already renamed or removed.
    }
  }
  pending.clear();
  // Another handler (watch) decides what the signal means; alone, we end the way the signal would have.
  if (process.listenerCount(signal) === 1) {
    for (const s of SIGNALS) process.removeListener(s, onSignal);
    process.kill(process.pid, signal);
  }
}

function removeOnSignal(temporary: string): void {
  if (pending.size === 0) for (const s of SIGNALS) process.on(s, onSignal);
  pending.add(temporary);
}

function forgetOnSignal(temporary: string): void {
  pending.delete(temporary);
  if (pending.size === 0) for (const s of SIGNALS) process.removeListener(s, onSignal);
}

const WRITE_FAILURES: Readonly<Record<string, string>> = {
  EACCES: 'permission denied: the directory is not writable for you',
  EPERM: 'the operation is not permitted there',
  ENOSPC: 'the disk is full',
  EDQUOT: 'the disk quota is used up',
  EROFS: 'the file system is read-only',
  ENAMETOOLONG: 'the file name is too long',
};

/** Why writing `target` failed, in the user's terms (the temporary file's name means nothing to them). */
export function describeWriteFailure(target: string, e: unknown): string {
  if (e instanceof OutputRefused) return e.message;
  const code = (e as NodeJS.ErrnoException).code;
  const reason = (code && WRITE_FAILURES[code]) ?? (e as Error).message;
  return `cannot write ${target}: ${reason}; nothing was written there`;
}

/** Makes the rename itself durable; some file systems do not allow it, which is harmless. */
async function syncDirectory(dir: string): Promise<void> {
  let h: FileHandle | undefined;
  try {
    h = await open(dir, constants.O_RDONLY);
    await h.sync();
  } catch {
    // Directory fsync is unsupported on some platforms; the rename has still happened.
  } finally {
    await h?.close().catch(() => undefined);
  }
}

/** Writes to standard output and waits until it is flushed, so the exit status follows the whole output. */
export async function writeStandardOutput(content: string | Uint8Array): Promise<void> {
  await new Promise<void>((done, fail) => process.stdout.write(content, (e) => (e ? fail(e) : done())));
}
