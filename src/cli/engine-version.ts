/**
 * The engine's version, part of every disk-cache key: the package version and
 * a digest of the core's sources, so a build whose mathematics changed never
 * reads values an older one stored. scripts/compile.mjs writes the digest into
 * the compiled command line; run from the sources, it is computed from them.
 */
import { createHash } from 'node:crypto';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { SKEINPROOF_VERSION } from './version.ts';

declare const SKEINPROOF_ENGINE_DIGEST: string | undefined;

export function engineVersion(): string {
  const digest = typeof SKEINPROOF_ENGINE_DIGEST === 'string' ? SKEINPROOF_ENGINE_DIGEST : digestOfSources(fileURLToPath(new URL('../core', import.meta.url)));
  return `${SKEINPROOF_VERSION}+${digest}`;
}

/** SHA-256 over the relative path and text of every file under `root`, in sorted order. */
function digestOfSources(root: string): string {
  const hash = createHash('sha256');
  const paths = (readdirSync(root, { recursive: true, withFileTypes: true }) as import('node:fs').Dirent[])
    .filter((entry) => entry.isFile())
    .map((entry) => join(entry.parentPath, entry.name))
    .sort();
  for (const path of paths) hash.update(`${path.slice(root.length)}\u0000`).update(readFileSync(path)).update('\u0000');
  return hash.digest('hex').slice(0, 16);
}
