/**
 * The engine's version, part of every disk-cache key: the package version and
 * a digest of the core's sources, so a build whose mathematics changed never
 * reads values an older one stored. The tool's version, part of every key of a
 * remembered run (./run-memo.ts), digests everything that shapes a run's
 * outcome besides its input: all sources (front ends and reporters too) and the
 * package lock (the bundled parsers). scripts/compile.mjs writes both digests
 * into the compiled command line; run from the sources, they are computed from them.
 */
import { createHash } from 'node:crypto';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { basename, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { SKEINPROOF_VERSION } from './version.ts';

declare const SKEINPROOF_ENGINE_DIGEST: string | undefined;
declare const SKEINPROOF_TOOL_DIGEST: string | undefined;

const ROOT = fileURLToPath(new URL('../..', import.meta.url));

export function engineVersion(): string {
  const digest = typeof SKEINPROOF_ENGINE_DIGEST === 'string' ? SKEINPROOF_ENGINE_DIGEST : digestOfSources([join(ROOT, 'src', 'core')]);
  return `${SKEINPROOF_VERSION}+${digest}`;
}

/** The version of the whole tool: the package version and a digest of src/, plugins/, scripts/ (the bundler's settings), package.json and package-lock.json. */
export function toolVersion(): string {
  const digest = typeof SKEINPROOF_TOOL_DIGEST === 'string' ? SKEINPROOF_TOOL_DIGEST : digestOfSources(TOOL_SOURCES.map((p) => join(ROOT, p)));
  return `${SKEINPROOF_VERSION}+${digest}`;
}

/** What the tool's digest covers, relative to the package root (scripts/compile.mjs digests the same). */
export const TOOL_SOURCES = ['src', 'plugins', 'scripts', 'package.json', 'package-lock.json'];

/**
 * SHA-256 over the path (relative to its root; a root that is a file: its name) and text of every file under
 * each root, in sorted order.
 */
function digestOfSources(roots: readonly string[]): string {
  const hash = createHash('sha256');
  for (const root of roots) {
    if (statSync(root).isFile()) {
      hash.update(`${basename(root)}\u0000`).update(readFileSync(root)).update('\u0000');
      continue;
    }
    const paths = (readdirSync(root, { recursive: true, withFileTypes: true }) as import('node:fs').Dirent[])
      .filter((entry) => entry.isFile())
      .map((entry) => join(entry.parentPath, entry.name))
      .sort();
    for (const path of paths) hash.update(`${path.slice(root.length)}\u0000`).update(readFileSync(path)).update('\u0000');
  }
  return hash.digest('hex').slice(0, 16);
}
