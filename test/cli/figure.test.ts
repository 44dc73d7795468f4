/**
 * `skeinproof compute --figure svg|tikz CODE`: the picture on standard output
 * or written atomically with -o; bad requests are usage errors (exit 2) that
 * say what to do, and nothing is written then.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const root = fileURLToPath(new URL('../..', import.meta.url));
const TREFOIL = '(1,5,2,4) (3,1,4,6) (5,3,6,2)';

function skeinproof(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const result = spawnSync(process.execPath, ['bin/skeinproof.js', ...args], { cwd: root, encoding: 'utf8', timeout: 30_000 });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

describe('skeinproof compute --figure', () => {
  it('prints an SVG naming the code, the same bytes on every run', () => {
    const first = skeinproof('compute', '--figure', 'svg', TREFOIL);
    expect(first.stderr).toBe('');
    expect(first.status).toBe(0);
    expect(first.stdout).toMatch(/^<svg /);
    expect(first.stdout).toContain(`<title>pd ${TREFOIL}</title>`);
    expect(skeinproof('compute', '--figure', 'svg', TREFOIL).stdout).toBe(first.stdout);
  });

  it('writes TikZ with the figure options into a file given with -o, and replaces it on the next run', () => {
    const dir = mkdtempSync(join(tmpdir(), 'skeinproof-figure-'));
    try {
      const out = join(dir, 'hopf.tex');
      const run = skeinproof('compute', '--figure', 'tikz', '-n', 'braid', '--colours', '--labels', 'both', '--figure-size', '120', '1 1', '-o', out);
      expect(run.status).toBe(0);
      expect(run.stdout).toBe('');
      const tikz = readFileSync(out, 'utf8');
      expect(tikz).toContain('\\begin{tikzpicture}');
      expect(tikz).toContain('{rgb,255:red,230;green,159;blue,0}');
      expect(skeinproof('compute', '--figure', 'tikz', '-n', 'braid', '1 1', '-o', out).status).toBe(0);
      expect(readFileSync(out, 'utf8')).not.toBe(tikz);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('refuses unusable requests with exit status 2 and writes nothing', () => {
    const dir = mkdtempSync(join(tmpdir(), 'skeinproof-figure-'));
    try {
      const out = join(dir, 'never.svg');
      const two = skeinproof('compute', '--figure', 'svg', TREFOIL, TREFOIL, '-o', out);
      expect(two.status).toBe(2);
      expect(two.stderr).toMatch(/--figure draws one diagram, and 2 codes were given/);
      const badOption = skeinproof('compute', '--figure', 'svg', '--outer-face', '9', TREFOIL, '-o', out);
      expect(badOption.status).toBe(2);
      expect(badOption.stderr).toMatch(/error\[figure-option-invalid\].*outer-face is 9; it takes an edge number from 1 to 6/);
      // A word where a number belongs reaches the option check as NaN; the message must say so, not print "null".
      const notNumber = skeinproof('compute', '--figure', 'svg', '--figure-size', 'abc', TREFOIL, '-o', out);
      expect(notNumber.status).toBe(2);
      expect(notNumber.stderr).toMatch(/error\[figure-option-invalid\].*size is not a number; it takes a number from 20 to 10000/);
      expect(notNumber.stderr).not.toContain('null');
      const notWidth = skeinproof('compute', '--figure', 'svg', '--line-width', 'wide', TREFOIL, '-o', out);
      expect(notWidth.stderr).toMatch(/line-width is not a number; it takes a positive number/);
      const badCode = skeinproof('compute', '--figure', 'svg', '(1,2,3)', '-o', out);
      expect(badCode.status).toBe(2);
      expect(badCode.stderr).toMatch(/error\[code-invalid\]/);
      expect(existsSync(out)).toBe(false);
      mkdirSync(join(dir, 'adir'));
      const directory = skeinproof('compute', '--figure', 'svg', TREFOIL, '-o', join(dir, 'adir'));
      expect(directory.status).toBe(2);
      expect(directory.stderr).toMatch(/it is a directory/);
      const stray = skeinproof('compute', '--arrows', TREFOIL);
      expect(stray.status).toBe(2);
      expect(stray.stderr).toMatch(/--arrows applies to --figure only/);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('refuses a diagram over the crossing limit, or one whose layout outruns the time budget, as limit-exceeded', () => {
    const run = skeinproof('compute', '--figure', 'svg', '--max-crossings', '2', TREFOIL);
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/error\[limit-exceeded\]/);
    const word = Array.from({ length: 120 }, (_, i) => `${(i % 5) + 1}`).join(' ');
    const slow = skeinproof('compute', '--figure', 'svg', '-n', 'braid', '--time-budget', '0.001', word);
    expect(slow.status).toBe(2);
    expect(slow.stdout).toBe('');
    expect(slow.stderr).toMatch(/error\[limit-exceeded\].*computing its figure took longer than the time budget/);
  });
});
