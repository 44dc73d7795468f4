/**
 * The README's recipes for a final PDF, run as written on a copy of the
 * sample paper: the PDF they leave has every cross-reference resolved. LaTeX
 * resolves \ref from the .aux file of the previous pass and says "Rerun to
 * get cross-references right" while labels change (latex.ltx, common
 * practice), so one pass after the build is not enough.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { chmodSync, copyFileSync, existsSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { NO_TEX_REASON, PACKAGE_FILE, REPO, SAMPLES, copyInto, hasPdflatex, removeDir, squeeze, tempDir, unwrapLog } from './support.ts';

const README = readFileSync(join(REPO, 'README.md'), 'utf8');
const hasMake = spawnSync('make', ['--version'], { stdio: 'ignore' }).error === undefined;
const hasLatexmk = spawnSync('latexmk', ['-v'], { stdio: 'ignore' }).error === undefined;
if (!hasPdflatex || !hasMake) console.warn(`test/latex/recipes.test.ts skipped: ${hasPdflatex ? 'make is not installed' : NO_TEX_REASON}`);
if (hasPdflatex && !hasLatexmk) console.warn('test/latex/recipes.test.ts: the latexmk recipe is skipped: latexmk is not installed (Debian: latexmk)');

/** The first fenced block of `language` in the README's LaTeX section. */
function readmeBlock(language: string): string {
  const section = /<!-- section: latex -->([\s\S]*?)<!-- end: latex -->/.exec(README)![1]!;
  return new RegExp('```' + language + '\\n([\\s\\S]*?)```').exec(section)![1]!;
}

const dirs: string[] = [];
afterAll(() => dirs.forEach(removeDir));

/** A copy of the sample paper with the package beside it, and the installed command standing for `skeinproof`. */
function paperCopy(): string {
  const dir = tempDir('recipe');
  dirs.push(dir);
  copyInto(dir, SAMPLES);
  rmSync(join(dir, 'slips'), { recursive: true });
  copyFileSync(PACKAGE_FILE, join(dir, 'skeinproof.sty'));
  return dir;
}

function withSampleNames(recipe: string): string {
  return recipe.replaceAll('paper', 'rope-atlas').replaceAll('skeinproof build', `${process.execPath} ${join(REPO, 'bin/skeinproof.js')} build`);
}

describe.skipIf(!hasPdflatex || !hasMake)('the README recipes for a final PDF', () => {
  it('make: the recipe builds, reruns LaTeX until the references settle, and leaves a PDF with \\ref resolved', () => {
    const dir = paperCopy();
    writeFileSync(join(dir, 'Makefile'), withSampleNames(readmeBlock('make')));
    const run = spawnSync('make', [], { cwd: dir, encoding: 'utf8', timeout: 120_000 });
    expect(run.status, run.stdout + run.stderr).toBe(0);
    const log = unwrapLog(readFileSync(join(dir, 'rope-atlas.log'), 'latin1'));
    expect(log).not.toMatch(/undefined references|Rerun to get|Reference `[^']*' on page \d+ undefined/);
    expect(log).not.toMatch(/^Package skeinproof Warning/m);
    const text = execFileSync('pdftotext', ['-enc', 'UTF-8', join(dir, 'rope-atlas.pdf'), '-'], { encoding: 'utf8' });
    // The sample's `Table~\ref{tab:atlas}` names its only table.
    expect(squeeze(text)).toContain('Table1lists');
    expect(existsSync(join(dir, 'rope-atlas.skein.tex'))).toBe(true);
  });
});

/**
 * A directory holding `skeinproof`: a script that appends its arguments to `log` and runs the real
 * command line, so a test counts how often a recipe ran it.
 */
function countingSkeinproof(log: string): string {
  const bin = tempDir('recipe-bin');
  dirs.push(bin);
  const script = join(bin, 'skeinproof');
  writeFileSync(script, `#!/bin/sh\necho "$*" >> '${log}'\nexec '${process.execPath}' '${join(REPO, 'bin/skeinproof.js')}' "$@"\n`);
  chmodSync(script, 0o755);
  return bin;
}

describe.skipIf(!hasPdflatex || !hasLatexmk)('the README latexmk recipe', () => {
  it('runs skeinproof once per build (not per LaTeX pass), never on an unchanged rebuild, once after an edit', () => {
    const dir = paperCopy();
    writeFileSync(join(dir, '.latexmkrc'), readmeBlock('perl'));
    const log = join(dir, 'skeinproof-runs.log');
    const env = { ...process.env, PATH: `${countingSkeinproof(log)}:${process.env['PATH']}` };
    const runs = () => (existsSync(log) ? readFileSync(log, 'utf8').split('\n').filter(Boolean).length : 0);
    const latexmk = () => spawnSync('latexmk', ['-interaction=nonstopmode', 'rope-atlas.tex'], { cwd: dir, env, encoding: 'utf8', timeout: 120_000 });

    const clean = latexmk();
    expect(clean.status, clean.stdout + clean.stderr).toBe(0);
    expect(runs()).toBe(1);
    // The sample's \ref needs a second LaTeX pass (latexmk numbers its runs of a rule).
    expect(clean.stdout + clean.stderr).toMatch(/Run number 2 of rule 'pdflatex'/);
    const text = execFileSync('pdftotext', ['-enc', 'UTF-8', join(dir, 'rope-atlas.pdf'), '-'], { encoding: 'utf8' });
    expect(squeeze(text)).toContain('Table1lists');

    const unchanged = latexmk();
    expect(unchanged.status, unchanged.stdout + unchanged.stderr).toBe(0);
    expect(runs()).toBe(1);

    // The same claimed Jones polynomial with its terms in another order: a changed source, the same values.
    const paper = join(dir, 'rope-atlas.tex');
    const source = readFileSync(paper, 'utf8');
    const reordered = source.replace('{t^{-1} + t^{-3} - t^{-4}}', '{-t^{-4} + t^{-3} + t^{-1}}');
    expect(reordered).not.toBe(source);
    writeFileSync(paper, reordered);
    const edited = latexmk();
    expect(edited.status, edited.stdout + edited.stderr).toBe(0);
    expect(runs()).toBe(2);
    const logText = unwrapLog(readFileSync(join(dir, 'rope-atlas.log'), 'latin1'));
    expect(logText).not.toMatch(/^Package skeinproof Warning/m);

    // A contradicted claim stops the build before LaTeX, with skeinproof's report.
    writeFileSync(paper, reordered.replace('{heaving}{span}{4}', '{heaving}{span}{5}'));
    const failing = latexmk();
    expect(failing.status).not.toBe(0);
    expect(failing.stderr + failing.stdout).toContain('claim-contradicted');
    expect(runs()).toBe(3);
  });
});
