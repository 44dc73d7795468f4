/**
 * `watch` on a LaTeX paper rebuilds the sidecar when a file the paper
 * `\input`s changes, and names that file as the reports do (its path from
 * the paper's directory), not by its bare file name.
 * Values from memory: the positive trefoil σ₁³ has writhe 3, the
 * figure-eight σ₁σ₂⁻¹σ₁σ₂⁻¹ writhe 0.
 */
import { spawn } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, expect, it } from 'vitest';
import { ROOT } from '../markdown/cli.ts';

const work = mkdtempSync(join(tmpdir(), 'skeinproof-latex-watch-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

const PAPER = '\\documentclass{article}\n\\usepackage{skeinproof}\n\\begin{document}\n\\input{sec/part}\n\\end{document}\n';
const part = (word: string) => `\\begin{skeincode}{id=k, notation=braid}\n${word}\n\\end{skeincode}\nWrithe \\skeinwrithe{k}.\n`;

it('rebuilds the sidecar when an \\input file in a subdirectory changes, naming it by its path', async () => {
  mkdirSync(join(work, 'sec'));
  writeFileSync(join(work, 'paper.tex'), PAPER);
  writeFileSync(join(work, 'sec/part.tex'), part('1 1 1'));
  const child = spawn(process.execPath, [join(ROOT, 'bin/skeinproof.js'), 'watch', 'paper.tex'], { cwd: work, stdio: ['ignore', 'pipe', 'pipe'] });
  let seen = '';
  child.stdout.on('data', (d: Buffer) => (seen += String(d)));
  const waitFor = (count: number) =>
    new Promise<void>((done, fail) => {
      const timer = setTimeout(() => fail(new Error(`watch output so far:\n${seen}`)), 8_000);
      const poll = setInterval(() => {
        if (seen.split('--- watching').length - 1 >= count) {
          clearTimeout(timer);
          clearInterval(poll);
          done();
        }
      }, 50);
    });
  try {
    await waitFor(1);
    expect(readFileSync(join(work, 'paper.skein.tex'), 'utf8')).toContain('\\skein@value{k}{writhe}{m}{3}');
    writeFileSync(join(work, 'sec/part.tex'), part('1 -2 1 -2'));
    await waitFor(2);
    expect(seen).toContain(`${join('sec', 'part.tex')} changed, rebuilding`);
    expect(readFileSync(join(work, 'paper.skein.tex'), 'utf8')).toContain('\\skein@value{k}{writhe}{m}{0}');
  } finally {
    child.kill('SIGTERM');
    await new Promise((done) => child.on('exit', done));
  }
});
