/**
 * Global setup: compile the command line into dist/ before any test spawns
 * bin/skeinproof.js, so the CLI tests run what `npm ci` ships, never a stale build.
 */
import { execFileSync } from 'node:child_process';
import { join } from 'node:path';

export default function compileCli(): void {
  execFileSync(process.execPath, [join(import.meta.dirname, '..', '..', 'scripts', 'compile.mjs')], { stdio: 'inherit' });
}
