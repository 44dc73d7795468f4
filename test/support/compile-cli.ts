/**
 * Global setup: compile the command line into dist/ before any test spawns
 * bin/skeinproof.js, so the CLI tests run what `npm ci` ships, never a stale build.
 * It also points the disk cache at a temporary directory for the whole run
 * (the test processes and every CLI they spawn inherit the variable), so no
 * test ever reads or writes the user's own cache; the directory is removed after.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export default function compileCli(): () => void {
  execFileSync(process.execPath, [join(import.meta.dirname, '..', '..', 'scripts', 'compile.mjs')], { stdio: 'inherit' });
  const cache = mkdtempSync(join(tmpdir(), 'skeinproof-test-cache-'));
  process.env['SKEINPROOF_CACHE_DIR'] = cache;
  return () => rmSync(cache, { recursive: true, force: true });
}
