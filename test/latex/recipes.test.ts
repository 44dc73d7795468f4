/**
 * The README's recipes for a final PDF, run as written on a copy of the
 * sample paper: the PDF they leave has every cross-reference resolved. LaTeX
 * resolves \ref from the .aux file of the previous pass and says "Rerun to
 * get cross-references right" while labels change (latex.ltx, common
 * practice), so one pass after the build is not enough.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { copyFileSync, existsSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { NO_TEX_REASON, PACKAGE_FILE, REPO, SAMPLES, copyInto, hasPdflatex, removeDir, squeeze, tempDir, unwrapLog } from './support.ts';

const README = readFileSync(join(REPO, 'README.md'), 'utf8');
const hasMake = spawnSync('make', ['--version'], { stdio: 'ignore' }).error === undefined;
if (!hasPdflatex || !hasMake) console.warn(`test/latex/recipes.test.ts skipped: ${hasPdflatex ? 'make is not installed' : NO_TEX_REASON}`);

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
