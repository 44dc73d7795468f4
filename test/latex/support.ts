/**
 * Helpers for the LaTeX tests: an in-memory file system for the reader, and
 * real pdflatex / pdftotext runs in temporary directories.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { cpSync, existsSync, mkdtempSync, readFileSync, realpathSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import type { LatexFileSystem } from '../../plugins/latex/reader.ts';

export const REPO = resolve(import.meta.dirname, '../..');
export const PACKAGE_FILE = join(REPO, 'plugins/latex/skeinproof.sty');
export const SAMPLES = join(REPO, 'samples/latex');

/** Files by absolute path under /paper. */
export function memoryFiles(files: Record<string, string>): LatexFileSystem {
  const byPath = new Map(Object.entries(files).map(([name, text]) => [resolve('/paper', name), text]));
  return { read: (path) => byPath.get(path) };
}

/** Files on disk, read as the reader's contract asks: undefined for a file that does not exist. */
export const diskFiles: LatexFileSystem = {
  read: (path) => (existsSync(path) ? readFileSync(path, 'utf8') : undefined),
  realpath: (path) => realpathSync(path),
};

function available(command: string): boolean {
  return spawnSync(command, ['-v'], { stdio: 'ignore' }).error === undefined;
}

export const hasPdflatex = available('pdflatex') && available('pdftotext');
export const NO_TEX_REASON = 'pdflatex and pdftotext are not installed (Debian: texlive-latex-base texlive-latex-recommended poppler-utils)';

export function tempDir(prefix: string): string {
  return mkdtempSync(join(tmpdir(), `skeinproof-${prefix}-`));
}

export function copyInto(dir: string, from: string): void {
  cpSync(from, dir, { recursive: true });
}

export function removeDir(dir: string): void {
  rmSync(dir, { recursive: true, force: true });
}

export interface TexRun {
  readonly ok: boolean;
  readonly log: string;
  /** The PDF's text (pdftotext), empty when no PDF was made. */
  readonly text: string;
}

/** One pdflatex pass in `dir`, as a build would run it. */
export function pdflatex(dir: string, file: string): TexRun {
  const run = spawnSync('pdflatex', ['-interaction=nonstopmode', '-halt-on-error', file], { cwd: dir, encoding: 'utf8', timeout: 30_000 });
  const stem = file.replace(/\.tex$/, '');
  const log = readFileSync(join(dir, `${stem}.log`), 'latin1');
  if (run.status !== 0) return { ok: false, log, text: '' };
  const text = execFileSync('pdftotext', ['-enc', 'UTF-8', join(dir, `${stem}.pdf`), '-'], { encoding: 'utf8' });
  return { ok: true, log, text };
}

/** The log with TeX's wrapping at 79 characters undone, so each message is on one line. */
export function unwrapLog(log: string): string {
  return log.replace(/^(.{79})\r?\n/gm, '$1');
}

/** The warnings `\PackageWarning{pkg}` wrote, one string each. */
export function packageWarnings(log: string, pkg: string): string[] {
  const marker = `Package ${pkg} Warning: `;
  return unwrapLog(log)
    .split('\n')
    .filter((line) => line.startsWith(marker))
    .map((line) => line.slice(marker.length));
}

/**
 * Text as pdftotext renders math, without white space: superscripts lose
 * their `^` and braces and minus signs become U+2212, so `t^{-2} - t` reads
 * `t−2−t`. Lines broken with a hyphen are joined.
 */
export function asPdfText(latex: string): string {
  return squeeze(latex.replace(/\\left|\\right|[\^{}]/g, '').replace(/-/g, '−'));
}

export function squeeze(text: string): string {
  return text.replace(/-\n/g, '').replace(/\s+/g, '');
}
