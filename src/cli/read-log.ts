/**
 * The files a run read, and what it found, so that a remembered outcome of the
 * run (./run-memo.ts) is replayed only while every one of them still holds the
 * same bytes, still is missing, or still resolves to the same real path.
 *
 * A format records each read as it happens, from the very bytes it used (not
 * a second read), so a file edited during the run leaves a log that does not
 * match the file afterwards. Anything the log cannot state exactly (a
 * directory, a named pipe, a file that could not be read for another reason
 * than its absence, one path read twice with different bytes) makes the log
 * unsound, and a run with an unsound log is not remembered.
 */
import { createHash } from 'node:crypto';
import { closeSync, constants, fstatSync, openSync, readFileSync, realpathSync } from 'node:fs';
import { resolve } from 'node:path';

/** A file's state: `sha256:<hex>` of its bytes, or `absent`. */
type FileState = string;

export interface ReadRecord {
  /** Absolute path → state, for every file read (or looked for). */
  readonly files: Readonly<Record<string, FileState>>;
  /** Path → its real path, for every real path asked for. */
  readonly realpaths: Readonly<Record<string, string>>;
}

const ABSENT = 'absent';
const stateOf = (bytes: Uint8Array): FileState => `sha256:${createHash('sha256').update(bytes).digest('hex')}`;
const isAbsence = (error: unknown): boolean => ['ENOENT', 'ENOTDIR'].includes((error as NodeJS.ErrnoException | undefined)?.code ?? '');

export class ReadLog {
  private readonly files = new Map<string, FileState>();
  private readonly realpaths = new Map<string, string>();
  private unsound = false;

  /** A file read whole: `bytes` are what the run used. */
  read(path: string, bytes: Uint8Array): void {
    this.note(path, stateOf(bytes));
  }

  /** A file that could not be opened or read: absence is recorded, any other failure makes the log unsound. */
  failed(path: string, error: unknown): void {
    if (isAbsence(error)) this.note(path, ABSENT);
    else this.unsound = true;
  }

  /** Something at `path` that is not a regular file (a directory, a pipe, a device): not recorded, so the log is unsound. */
  notAFile(): void {
    this.unsound = true;
  }

  realpath(path: string, real: string): void {
    const known = this.realpaths.get(path);
    if (known !== undefined && known !== real) this.unsound = true;
    this.realpaths.set(path, real);
  }

  /** The record, or undefined when the log cannot state exactly what the run read. */
  record(): ReadRecord | undefined {
    return this.unsound ? undefined : { files: Object.fromEntries(this.files), realpaths: Object.fromEntries(this.realpaths) };
  }

  private note(path: string, state: FileState): void {
    const absolute = resolve(path);
    const known = this.files.get(absolute);
    if (known !== undefined && known !== state) this.unsound = true;
    this.files.set(absolute, state);
  }
}

/** True when every file of the record still has its recorded state and every real path is unchanged. */
export function stillAsRead(record: ReadRecord): boolean {
  for (const [path, state] of Object.entries(record.files)) if (currentState(path) !== state) return false;
  for (const [path, real] of Object.entries(record.realpaths)) if (currentRealpath(path) !== real) return false;
  return true;
}

/**
 * The state of the file at `path` now, or undefined when it is neither a regular file nor absent. Opened without
 * blocking and checked on the descriptor, as the formats read: a named pipe put in a file's place must not hang the run.
 */
function currentState(path: string): FileState | undefined {
  let fd: number;
  try {
    fd = openSync(path, constants.O_RDONLY | constants.O_NONBLOCK);
  } catch (error) {
    return isAbsence(error) ? ABSENT : undefined;
  }
  try {
    return fstatSync(fd).isFile() ? stateOf(readFileSync(fd)) : undefined;
  } catch {
    return undefined;
  } finally {
    closeSync(fd);
  }
}

/** As the LaTeX reader resolves it (src/cli/formats/latex.ts): a path that cannot be resolved stands for itself. */
export function currentRealpath(path: string): string {
  try {
    return realpathSync(path);
  } catch {
    return path;
  }
}
