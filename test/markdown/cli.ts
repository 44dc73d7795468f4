/** Runs the command line as a user would: `node bin/skeinproof.js …`. */
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';

export const ROOT = join(import.meta.dirname, '..', '..');

export function skeinproof(args: readonly string[], cwd = ROOT): { status: number | null; stdout: string; stderr: string } {
  const r = spawnSync(process.execPath, [join(ROOT, 'bin', 'skeinproof.js'), ...args], { cwd, encoding: 'utf8', timeout: 30_000 });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}
