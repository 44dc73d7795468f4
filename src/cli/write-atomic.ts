/**
 * Writing an output file so that it is never seen half-written and never
 * replaces a file it must not: the content goes to a temporary file in the
 * same directory, is flushed to disk (fsync), and is renamed over the target
 * in one step. On any failure the temporary file is removed and the target is
 * left as it was.
 */
import { randomBytes } from 'node:crypto';
import { constants } from 'node:fs';
import { open, rename, stat, unlink, type FileHandle } from 'node:fs/promises';
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
  await refuseProtected(target, options.protect ?? []);
  const bytes = typeof content === 'string' ? Buffer.from(content, 'utf8') : content;
  const dir = dirname(resolve(target));
  const temporary = join(dir, `.${basename(target)}.${process.pid}.${randomBytes(6).toString('hex')}.tmp`);
  const writeChunk = options.writeChunk ?? (async (h: FileHandle, chunk: Uint8Array) => void (await h.write(chunk)));
  let handle: FileHandle | undefined;
  try {
    handle = await open(temporary, constants.O_WRONLY | constants.O_CREAT | constants.O_EXCL, 0o666);
    for (let at = 0; at < bytes.length; at += CHUNK_BYTES) await writeChunk(handle, bytes.subarray(at, at + CHUNK_BYTES));
    await handle.sync();
    await handle.close();
    handle = undefined;
    await rename(temporary, target);
  } catch (e) {
    await handle?.close().catch(() => undefined);
    await unlink(temporary).catch(() => undefined);
    throw e;
  }
  await syncDirectory(dir);
}

/**
 * Same path, or the same file reached another way (link, `./`), is refused; so is
 * a target that cannot be a file (a directory, or in a directory that does not exist).
 */
async function refuseProtected(target: string, protect: readonly string[]): Promise<void> {
  const targetStat = await stat(target).catch(() => undefined);
  if (targetStat?.isDirectory()) throw new OutputRefused(`cannot write ${target}: it is a directory; give a file name with -o`);
  const dir = dirname(target);
  const dirStat = await stat(dir).catch(() => undefined);
  if (!dirStat) throw new OutputRefused(`cannot write ${target}: the directory ${dir} does not exist; create it first or choose another path with -o`);
  if (!dirStat.isDirectory()) throw new OutputRefused(`cannot write ${target}: ${dir} is a file, not a directory; choose another path with -o`);
  for (const p of protect) {
    if (resolve(p) === resolve(target)) throw new OutputRefused(`refusing to write ${target}: it is the input file; choose another output path with -o`);
    if (targetStat) {
      const s = await stat(p).catch(() => undefined);
      if (s && s.dev === targetStat.dev && s.ino === targetStat.ino) {
        throw new OutputRefused(`refusing to write ${target}: it is the same file as the input ${p}; choose another output path with -o`);
      }
    }
  }
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
