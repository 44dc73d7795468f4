/**
 * Figures in LaTeX: `\skeindrawing[settings]{id}` places the TikZ picture drawn from a diagram's code.
 * The reader and the session are checked on papers held in memory; the two builds are compiled with real
 * pdflatex (the reference for what LaTeX accepts), and a page of each PDF is rendered with pdftoppm into
 * test-artifacts/ for a look.
 */
import { execFileSync } from 'node:child_process';
import { copyFileSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { readLatexManuscript, type LatexDocument } from '../../plugins/latex/reader.ts';
import { latexFormat } from '../../src/cli/formats/latex.ts';
import { runSession } from '../../src/core/manuscript/session.ts';
import { DEFAULT_CONVENTION } from '../../src/core/convention/convention.ts';
import { NO_TEX_REASON, PACKAGE_FILE, REPO, hasPdflatex, memoryFiles, packageWarnings, pdflatex, removeDir, tempDir } from './support.ts';

const ARTIFACTS = join(REPO, 'test-artifacts');
const dirs: string[] = [];
afterAll(() => dirs.forEach(removeDir));

function read(text: string): LatexDocument {
  return readLatexManuscript('/paper/paper.tex', memoryFiles({ 'paper.tex': text }));
}

function session(doc: LatexDocument) {
  return runSession({
    diagrams: doc.diagrams,
    claims: doc.claims,
    fills: doc.fills.map((f) => f.entry),
    figures: doc.figures.map((f) => f.entry),
    convention: { ...DEFAULT_CONVENTION, ...doc.convention },
  });
}

const TREFOIL = '\\begin{skeincode}{id=trefoil, notation=braid}\n1 1 1\n\\end{skeincode}\n';
const CINQUEFOIL = '\\begin{skeincode}{id=cinquefoil, notation=family}\ntorus 2 5\n\\end{skeincode}\n';

function paper(body: string, preamble = ''): string {
  return `\\documentclass{article}\n\\usepackage{skeinproof}\n${preamble}\\begin{document}\n${TREFOIL}${CINQUEFOIL}${body}\\end{document}\n`;
}

const line = (text: string, needle: string): string => {
  const at = text.indexOf(needle);
  const before = text.slice(0, at).split('\n');
  return `${before.length}:${before[before.length - 1]!.length + 1}`;
};

describe('the reader and the session', () => {
  it('find each figure with its settings as written, and read them', () => {
    const doc = read(paper('\\begin{figure}\\centering\n\\skeindrawing[size=4cm, arrows=yes]{trefoil}\n\\caption{The trefoil.}\n\\end{figure}\n\\skeindrawing{cinquefoil}\n'));
    expect(doc.diagnostics).toEqual([]);
    expect(doc.figures.map((f) => [f.id, f.settingsText])).toEqual([
      ['trefoil', 'size=4cm, arrows=yes'],
      ['cinquefoil', ''],
    ]);
    const s = session(doc);
    expect(s.diagnostics).toEqual([]);
    // 4 cm = 4 · 72/2.54 bp (common practice).
    expect(s.figures.map((f) => f?.options)).toEqual([{ size: 113.386, arrows: true }, {}]);
  });

  it('report bad settings and unknown ids where they are written', () => {
    const text = paper('\\skeindrawing[size=4, labels=none, colours]{trefoil}\n\\skeindrawing[gap=2pt]{trefoyl}\n\\skeindrawing[size=4cm]\n');
    const doc = read(text);
    const s = session(doc);
    const all = [...doc.diagnostics, ...s.diagnostics].map((d) => `${d.ruleId}@${d.location!.start.line}:${d.location!.start.column}`);
    expect(all.sort()).toEqual(
      [
        `latex-option-invalid@${line(text, 'colours]')}`,
        `figure-option-invalid@${line(text, '4, labels')}`,
        `target-unknown@${line(text, '\\skeindrawing[gap')}`,
        `latex-argument-missing@${line(text, '\\skeindrawing[size=4cm]\n')}`,
      ].sort(),
    );
    expect(s.diagnostics.find((d) => d.ruleId === 'target-unknown')!.hints?.[0]).toBe('Did you mean `trefoil`?');
  });
});

const MACRO = '\\newcommand\\knotfig[2][size=3cm]{\\skeindrawing[#1]{#2}}\n';
const MACRO_USES = 'A figure in a macro: \\knotfig{trefoil} and \\knotfig[size=2cm, arrows=yes]{cinquefoil}.\n';

describe('figures in macros and tables', () => {
  it('a macro of the author’s that draws is read at each use, with the arguments in place', () => {
    const doc = read(paper(MACRO_USES, MACRO));
    expect(doc.diagnostics).toEqual([]);
    expect(doc.figures.map((f) => [f.id, f.settingsText])).toEqual([
      ['trefoil', 'size=3cm'],
      ['cinquefoil', 'size=2cm, arrows=yes'],
    ]);
    expect(session(doc).diagnostics).toEqual([]);
  });

  it('a figure in a skein table cell is a figure, not the cell’s claimed value', () => {
    const table = '\\begin{skeintable}{id, -, crossings}\n\\begin{tabular}{lll}\nid & picture & $n$ \\\\\ntrefoil & \\skeindrawing[size=1cm]{trefoil} & \\\\\n\\end{tabular}\n\\end{skeintable}\n';
    const doc = read(paper(table));
    expect(doc.diagnostics).toEqual([]);
    expect(doc.figures.map((f) => f.id)).toEqual(['trefoil']);
    expect(session(doc).diagnostics).toEqual([]);
  });
});

describe.skipIf(!hasPdflatex)('the builds under pdflatex', () => {
  if (!hasPdflatex) console.warn(`test/latex/figures.test.ts skipped: ${NO_TEX_REASON}`);

  const BODY =
    'Two figures drawn from the codes above.\n' +
    '\\begin{figure}[h]\\centering\n\\skeindrawing[size=4cm, arrows=yes, colours=yes]{trefoil}\\qquad\n' +
    '\\skeindrawing[size=4cm, labels=crossings]{cinquefoil}\n\\caption{A trefoil and a cinquefoil.}\n\\end{figure}\n';

  function workDir(name: string): string {
    const dir = tempDir(name);
    dirs.push(dir);
    return dir;
  }

  function render(dir: string, pdf: string, name: string): string {
    mkdirSync(ARTIFACTS, { recursive: true });
    const png = join(ARTIFACTS, name);
    execFileSync('pdftoppm', ['-png', '-r', '80', '-f', '1', '-l', '1', '-singlefile', join(dir, pdf), png.replace(/\.png$/, '')]);
    return png;
  }

  it('the sidecar route: a placeholder and a warning before the build, the pictures after it', async () => {
    const dir = workDir('figure-sidecar');
    copyFileSync(PACKAGE_FILE, join(dir, 'skeinproof.sty'));
    writeFileSync(join(dir, 'paper.tex'), paper(BODY));
    const before = pdflatex(dir, 'paper.tex');
    expect(before.ok).toBe(true);
    expect(packageWarnings(before.log, 'skeinproof')).toContain("Value `figure' of `trefoil' is not computed yet on input line 12.");
    const built = await latexFormat.build(join(dir, 'paper.tex'), {});
    expect(built.diagnostics).toEqual([]);
    const sidecar = String(built.outputs[0]!.content);
    expect(sidecar).toContain('\\RequirePackage{tikz}');
    expect(sidecar).toContain('\\skein@drawing{trefoil}{size=4cm, arrows=yes, colours=yes}{');
    writeFileSync(built.outputs[0]!.path, sidecar);
    const after = pdflatex(dir, 'paper.tex');
    expect(after.ok, after.log.slice(-2000)).toBe(true);
    expect(packageWarnings(after.log, 'skeinproof')).toEqual([]);
    expect(after.text).not.toContain('??');
    expect(after.text).toContain('A trefoil and a cinquefoil.');
    render(dir, 'paper.pdf', 'figures-sidecar.png');
  });

  it('the flat copy compiles without the package, loading tikz in its place', async () => {
    const dir = workDir('figure-flat');
    writeFileSync(join(dir, 'paper.tex'), paper(BODY));
    const built = await latexFormat.build(join(dir, 'paper.tex'), { output: join(dir, 'flat.tex') });
    expect(built.diagnostics).toEqual([]);
    const flat = String(built.outputs[0]!.content);
    expect(flat).not.toContain('skeindrawing');
    expect(flat).toContain('\\RequirePackage{tikz}');
    expect(flat.match(/\\begin\{tikzpicture\}/g)).toHaveLength(2);
    writeFileSync(join(dir, 'flat.tex'), flat);
    const run = pdflatex(dir, 'flat.tex');
    expect(run.ok, run.log.slice(-2000)).toBe(true);
    expect(run.text).toContain('A trefoil and a cinquefoil.');
    render(dir, 'flat.pdf', 'figures-flat.png');
  });

  it('a macro that draws finds its pictures in the sidecar: TeX reads the settings as the reader wrote them', async () => {
    const dir = workDir('figure-macro');
    copyFileSync(PACKAGE_FILE, join(dir, 'skeinproof.sty'));
    writeFileSync(join(dir, 'paper.tex'), paper(MACRO_USES, MACRO));
    const built = await latexFormat.build(join(dir, 'paper.tex'), {});
    expect(built.diagnostics).toEqual([]);
    writeFileSync(built.outputs[0]!.path, built.outputs[0]!.content);
    const run = pdflatex(dir, 'paper.tex');
    expect(run.ok, run.log.slice(-2000)).toBe(true);
    expect(packageWarnings(run.log, 'skeinproof')).toEqual([]);
    const flat = await latexFormat.build(join(dir, 'paper.tex'), { output: join(dir, 'flat.tex') });
    expect(String(flat.outputs[0]!.content).match(/\\begin\{tikzpicture\}/g)).toHaveLength(2);
    writeFileSync(join(dir, 'flat.tex'), flat.outputs[0]!.content);
    rmSync(join(dir, 'skeinproof.sty'));
    expect(pdflatex(dir, 'flat.tex').ok).toBe(true);
  });

  it('a paper that loads tikz itself (with options) gets no second load that would clash', async () => {
    const dir = workDir('figure-own-tikz');
    copyFileSync(PACKAGE_FILE, join(dir, 'skeinproof.sty'));
    writeFileSync(join(dir, 'paper.tex'), paper('\\skeindrawing{trefoil}\n', '\\usepackage[]{tikz}\n'));
    const sidecar = await latexFormat.build(join(dir, 'paper.tex'), {});
    expect(String(sidecar.outputs[0]!.content)).not.toContain('RequirePackage{tikz}');
    writeFileSync(sidecar.outputs[0]!.path, sidecar.outputs[0]!.content);
    expect(pdflatex(dir, 'paper.tex').ok).toBe(true);
    const flat = await latexFormat.build(join(dir, 'paper.tex'), { output: join(dir, 'flat.tex') });
    expect(String(flat.outputs[0]!.content)).not.toContain('RequirePackage{tikz}');
    writeFileSync(join(dir, 'flat.tex'), flat.outputs[0]!.content);
    expect(pdflatex(dir, 'flat.tex').ok).toBe(true);
  });

  it('a flat copy that loads skeinproof through a package of the author’s is told to load tikz', async () => {
    const dir = workDir('figure-own-package');
    writeFileSync(join(dir, 'mymacros.sty'), '\\RequirePackage{skeinproof}\n');
    writeFileSync(join(dir, 'paper.tex'), paper('\\skeindrawing{trefoil}\n').replace('\\usepackage{skeinproof}', '\\usepackage{mymacros}'));
    const flat = await latexFormat.build(join(dir, 'paper.tex'), { output: join(dir, 'flat.tex') });
    const warnings = flat.diagnostics.filter((d) => d.ruleId === 'latex-flat-needs-package');
    expect(warnings.map((d) => d.message.includes('TikZ'))).toEqual([true, false]);
  });
});
