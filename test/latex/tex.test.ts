/**
 * Real TeX: the package and the sample are compiled with pdflatex (the
 * reference for what LaTeX accepts and typesets) before preprocessing and
 * after each way of building, and the PDF is read back with pdftotext.
 * Every run happens in a temporary copy.
 */
import { execFileSync } from 'node:child_process';
import { copyFileSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import fc from 'fast-check';
import { afterAll, describe, expect, it } from 'vitest';
import { latexFormat } from '../../src/cli/formats/latex.ts';
import { readLatexManuscript } from '../../plugins/latex/reader.ts';
import { runSession } from '../../src/core/manuscript/session.ts';
import { DEFAULT_CONVENTION } from '../../src/core/convention/convention.ts';
import {
  NO_TEX_REASON,
  PACKAGE_FILE,
  SAMPLES,
  asPdfText,
  copyInto,
  diskFiles,
  hasPdflatex,
  packageWarnings,
  pdflatex,
  removeDir,
  squeeze,
  tempDir,
  unwrapLog,
  type TexRun,
} from './support.ts';

if (!hasPdflatex) console.warn(`test/latex/tex.test.ts skipped: ${NO_TEX_REASON}`);

const dirs: string[] = [];
function workDir(prefix: string, withPackage: boolean): string {
  const dir = tempDir(prefix);
  dirs.push(dir);
  if (withPackage) copyFileSync(PACKAGE_FILE, join(dir, 'skeinproof.sty'));
  return dir;
}
afterAll(() => dirs.forEach(removeDir));

/** The values a build fills in, as computed by the pipeline, for looking them up in the PDF. */
function computedValues(path: string) {
  const doc = readLatexManuscript(path, diskFiles);
  const session = runSession({
    diagrams: doc.diagrams,
    claims: doc.claims,
    fills: doc.fills.map((f) => f.entry),
    convention: { ...DEFAULT_CONVENTION, ...doc.convention },
  });
  return { doc, values: session.fills };
}

/** A typeset statement as pdftotext shows it: math delimiters and \operatorname gone. */
function statementAsPdfText(text: string): string {
  return asPdfText(text.replace(/\\operatorname\{([^}]*)\}/g, '$1').replace(/\$/g, ''));
}

function expectEveryValueIn(pdfText: string, path: string): void {
  const { values } = computedValues(path);
  const found = squeeze(pdfText);
  for (const v of values) {
    expect(v).toBeDefined();
    const shown = v!.kind === 'math' ? asPdfText(v!.latex) : statementAsPdfText(v!.text);
    expect(found, `PDF text should contain ${shown}`).toContain(shown);
  }
}

/**
 * The bookmark titles hyperref wrote to its .out file: PDF strings in UTF-16BE
 * after a byte-order mark, every byte an octal escape or a printable character.
 */
function bookmarks(outFile: string): string[] {
  return [...readFileSync(outFile, 'latin1').matchAll(/^\\BOOKMARK \[\d+\]\[[^\]]*\]\{[^}]*\}\{(.*)\}\{[^}]*\}%/gm)].map((m) => {
    const bytes = [...m[1]!.matchAll(/\\([0-7]{3})|\\(.)|(.)/g)].map((b) => (b[1] ? parseInt(b[1], 8) : (b[2] ?? b[3])!.charCodeAt(0)));
    return Buffer.from(bytes.slice(2)).swap16().toString('utf16le');
  });
}

async function build(dir: string, output?: string): Promise<void> {
  const result = await latexFormat.build(join(dir, 'rope-atlas.tex'), output ? { output: join(dir, output) } : {});
  expect(result.failed).toBe(false);
  for (const o of result.outputs) writeFileSync(o.path, o.content);
}

/**
 * A sidecar that fills each cell at `places` ("table row column", the last three words of each place) with a
 * \typeout of the place, so the log shows which cells TeX filled, in its order.
 */
function loggingSidecar(places: readonly string[]): string {
  const cells = places.map((p) => {
    const [t, r, c] = p.split(' ').slice(-3);
    return `\\skein@cell{${t}}{${r}}{${c}}{t}{\\typeout{FILLED ${p}}}`;
  });
  return `${cells.join('\n')}\n`;
}

/** TeX's error lines of a run, for the assertion message. */
function texErrors(run: TexRun): string {
  return run.log
    .split('\n')
    .filter((l) => l.startsWith('!'))
    .join('\n');
}

/**
 * Builds `paper` (as `stem.tex`) the one way or the other (the sidecar with the package, or the flat copy
 * without it), expecting no diagnostics, and compiles the result (`passes` times): the last pass must compile without warnings.
 */
async function buildAndCompile(paper: string, stem: string, flat: boolean, passes = 1): Promise<TexRun & { readonly pdf: string }> {
  const dir = workDir(stem, !flat);
  writeFileSync(join(dir, `${stem}.tex`), paper);
  const result = await latexFormat.build(join(dir, `${stem}.tex`), flat ? { output: join(dir, `${stem}-flat.tex`) } : {});
  expect(result.diagnostics).toEqual([]);
  for (const o of result.outputs) writeFileSync(o.path, o.content);
  for (let pass = 1; pass < passes; pass++) pdflatex(dir, flat ? `${stem}-flat.tex` : `${stem}.tex`);
  const run = pdflatex(dir, flat ? `${stem}-flat.tex` : `${stem}.tex`);
  expect(run.ok, texErrors(run)).toBe(true);
  expect(unwrapLog(run.log)).not.toMatch(/Warning|^!/m);
  return { ...run, pdf: join(dir, flat ? `${stem}-flat.pdf` : `${stem}.pdf`) };
}

describe.skipIf(!hasPdflatex)('the package under pdflatex', () => {
  it('loads cleanly in a minimal document', () => {
    const dir = workDir('minimal', true);
    writeFileSync(join(dir, 'min.tex'), '\\documentclass{article}\n\\usepackage{skeinproof}\n\\begin{document}\nPlain text.\n\\end{document}\n');
    const run = pdflatex(dir, 'min.tex');
    expect(run.ok).toBe(true);
    expect(unwrapLog(run.log)).not.toMatch(/Warning|^!/m);
    expect(run.text).toContain('Plain text.');
  });

  it('compiles the sample before preprocessing: placeholders and one warning per missing value', () => {
    const dir = workDir('raw', true);
    copyInto(dir, SAMPLES);
    rmSync(join(dir, 'slips'), { recursive: true });
    const run = pdflatex(dir, 'rope-atlas.tex');
    expect(run.ok).toBe(true);
    const { doc } = computedValues(join(dir, 'rope-atlas.tex'));
    const values = doc.fills.map((f) => ({
      at: f.entry.locate(),
      warning:
        f.target.kind === 'macro'
          ? `Value \`${f.target.key}' of \`${f.target.id}' is not computed yet`
          : f.entry.khovanovCell
          ? `Value \`khovanov' of row ${f.target.row}, column ${f.target.column} of skein grid ${f.target.table} is not computed yet`
          : `Value \`${f.entry.key}' of row ${f.target.row} of skein table ${f.target.table} is not computed yet`,
    }));
    const figures = doc.figures.map((f) => ({ at: f.entry.locate(), warning: `Value \`figure' of \`${f.id}' is not computed yet` }));
    // In the order TeX meets them: what an included file holds comes where the paper \input s it.
    const inMain = (at: { file: string; start: { offset?: number } }): [number, number] => {
      if (at.file === doc.main.displayPath) return [at.start.offset!, 0];
      const stem = at.file.slice(at.file.indexOf('sections/')).replace(/\.tex$/, '');
      return [doc.main.text.indexOf(`\\input{${stem}}`), at.start.offset!];
    };
    const expected = [...values, ...figures]
      .map((x) => ({ ...x, rank: inMain(x.at) }))
      .sort((a, b) => a.rank[0] - b.rank[0] || a.rank[1] - b.rank[1])
      .map((x) => x.warning);
    const warnings = packageWarnings(run.log, 'skeinproof');
    const perValue = warnings.filter((w) => w.startsWith('Value'));
    expect(perValue.map((w) => w.replace(/ on input line \d+\.$/, ''))).toEqual(expected);
    expect(warnings.some((w) => w.startsWith('Some computed values are missing'))).toBe(true);
    expect(squeeze(run.text)).toContain('??lanyard:jones');
    expect(squeeze(run.text)).toContain('??coil:statement');
  });

  it('after `build` the sidecar fills every value: no warnings, the computed values in the PDF', async () => {
    const dir = workDir('sidecar', true);
    copyInto(dir, SAMPLES);
    await build(dir);
    pdflatex(dir, 'rope-atlas.tex'); // a first pass writes the .aux for \ref
    const run = pdflatex(dir, 'rope-atlas.tex');
    expect(run.ok).toBe(true);
    expect(unwrapLog(run.log)).not.toMatch(/Warning|^!/m);
    // Published values (from memory): the positive trefoil t + t³ − t⁴, here in descending order.
    expect(squeeze(run.text)).toContain(asPdfText('-t^4 + t^3 + t'));
    expect(squeeze(run.text)).toContain(squeeze('crossing number is 5.'));
    expectEveryValueIn(run.text, join(dir, 'rope-atlas.tex'));
  });

  it('warns when a file changed after the build, naming it (the values may be stale)', async () => {
    const dir = workDir('stale', true);
    copyInto(dir, SAMPLES);
    await build(dir);
    const table = join(dir, 'sections/atlas-table.tex');
    writeFileSync(table, `${readFileSync(table, 'utf8')}% edited after the build\n`);
    const run = pdflatex(dir, 'rope-atlas.tex');
    expect(run.ok).toBe(true);
    expect(packageWarnings(run.log, 'skeinproof')).toEqual([
      "sections/atlas-table.tex has changed since `skeinproof build' wrote rope-atlas.skein.tex, so its values may be stale. Run `skeinproof build rope-atlas.tex' and then LaTeX again.",
    ]);
  });

  it('the flat copy compiles without the package and shows the same values', async () => {
    const dir = workDir('flat', false);
    copyInto(dir, SAMPLES);
    await build(dir, 'flat.tex');
    const run = pdflatex(dir, 'flat.tex');
    expect(run.ok).toBe(true);
    expect(run.log).not.toContain('skeinproof.sty');
    expect(squeeze(run.text)).toContain(asPdfText('-t^4 + t^3 + t'));
    expect(squeeze(run.text)).toContain(squeeze('crossing number is 5.'));
    expectEveryValueIn(run.text, join(dir, 'rope-atlas.tex'));
  });

  it('TeX and the reader see the same fill-ins: comments, verbatim and switched-off passages hide them from both', () => {
    const paper = [
      '\\documentclass{article}',
      '\\usepackage{skeinproof}',
      '\\begin{document}',
      'a \\skeinjones{k1} % \\skeinjones{hidden1}',
      '50\\% \\skeinjones{k2} \\\\% \\skeinjones{hidden2}',
      '\\verb|\\skeinjones{hidden3}| \\verb*+\\skeinspan{hidden4}+ \\skeinspan{k3}',
      '\\begin{verbatim}',
      '\\skeinjones{hidden5}',
      '\\end{verbatim}',
      '\\iffalse \\skeinjones{hidden6} \\ifnum1=1 \\skeinjones{hidden7}\\fi \\skeinjones{hidden8} \\fi',
      '\\iffalse \\skeinjones{hidden9} \\else $\\skeinwrithe{k4}$ \\fi',
      '\\iffalse % \\fi',
      '\\skeinjones{hidden10} \\fi \\skeinvalue{k5}{statement}',
      '\\iftrue \\skeinjones{k6} \\ifnum1=1 \\else\\fi \\else \\skeinjones{hidden11} \\fi',
      '\\end{document}',
    ].join('\n');
    const dir = workDir('hidden', true);
    writeFileSync(join(dir, 'hidden.tex'), paper);
    const doc = readLatexManuscript(join(dir, 'hidden.tex'), diskFiles);
    const read = doc.fills.map((f) => (f.target.kind === 'macro' ? `${f.target.key} of \`${f.target.id}'` : ''));
    expect(read).toEqual(['jones of `k1\'', 'jones of `k2\'', 'span of `k3\'', 'writhe of `k4\'', 'statement of `k5\'', 'jones of `k6\'']);
    const run = pdflatex(dir, 'hidden.tex');
    expect(run.ok).toBe(true);
    const warned = packageWarnings(run.log, 'skeinproof')
      .filter((w) => w.startsWith('Value'))
      .map((w) => w.replace(/^Value `([a-z-]+)' of (`[^']*') is not computed yet on input line \d+\.$/, '$1 of $2'));
    expect(warned).toEqual(read);
  });

  it('TeX and the reader count the rows and cells of a skein table alike', async () => {
    // Header rows, \\[skip], rules before and after rows, a comment in a cell, a last row without \\.
    const paper = [
      '\\documentclass{article}',
      '\\usepackage{skeinproof}',
      '\\begin{document}',
      '\\begin{skeincode}{id=a, notation=braid}\n1 1 1\n\\end{skeincode}',
      '\\begin{skeincode}{id=b, notation=braid}\n1 -2 1 -2\n\\end{skeincode}',
      '\\begin{skeincode}{id=c, notation=braid}\n1 1 1 1 1\n\\end{skeincode}',
      '\\begin{skeintable}[head=2]{id, jones, crossings}',
      '\\begin{tabular}{|l|p{6cm}|c|}\\hline',
      'Id & $V$ & $n$ \\\\ \\hline',
      '(first) & & (third) \\\\[3pt]\\hline\\hline',
      'a & % the computed value goes here',
      ' & \\\\ \\cline{1-2}',
      'b & & 4\\\\',
      'c & & ',
      '\\end{tabular}',
      '\\end{skeintable}',
      'A second table is counted on its own:',
      '\\begin{skeintable}{id, bracket}',
      '\\begin{tabular}{ll}',
      'Id & $\\langle D \\rangle$ \\\\',
      'a & \\\\',
      '\\end{tabular}',
      '\\end{skeintable}',
      '\\end{document}',
    ].join('\n');
    for (const flat of [false, true]) {
      const dir = workDir('rows', !flat);
      writeFileSync(join(dir, 'rows.tex'), paper);
      const result = await latexFormat.build(join(dir, 'rows.tex'), flat ? { output: join(dir, 'rows-flat.tex') } : {});
      expect(result.diagnostics).toEqual([]);
      for (const o of result.outputs) writeFileSync(o.path, o.content);
      const run = pdflatex(dir, flat ? 'rows-flat.tex' : 'rows.tex');
      expect(run.ok).toBe(true);
      expect(packageWarnings(run.log, 'skeinproof')).toEqual([]);
      const text = squeeze(run.text);
      // Jones polynomials from memory: trefoil, figure-eight, cinquefoil; crossings of the braids 3 and 5.
      for (const v of ['t + t^3 - t^4', 't^{-2} - t^{-1} + 1 - t + t^2', 't^2 + t^4 - t^5 + t^6 - t^7']) expect(text).toContain(asPdfText(v));
      // The bracket of the positive trefoil with <O> = 1 (from memory): A^{-7} - A^{-3} - A^5.
      expect(text).toContain(asPdfText('A^{-7} - A^{-3} - A^5'));
      expect(text).not.toContain('??');
    }
  });

  it('fill-ins find their values with spaces around the id and key, underscores in it, in text and in math', async () => {
    const dir = workDir('ids', true);
    writeFileSync(
      join(dir, 'ids.tex'),
      '\\documentclass{article}\n\\usepackage{skeinproof}\n\\begin{document}\n\\begin{skeincode}{id=knot_3.1, notation=braid}\n1 1 1\n\\end{skeincode}\n' +
        'A \\skeinjones{ knot_3.1 } B \\skeinvalue{knot_3.1}{ span } C $x = \\skeinwrithe{knot_3.1}$ D\n\\end{document}\n',
    );
    const result = await latexFormat.build(join(dir, 'ids.tex'), {});
    expect(result.diagnostics).toEqual([]);
    for (const o of result.outputs) writeFileSync(o.path, o.content);
    const run = pdflatex(dir, 'ids.tex');
    expect(run.ok).toBe(true);
    expect(packageWarnings(run.log, 'skeinproof')).toEqual([]);
    // The positive trefoil (from memory): V = t + t^3 - t^4, span 3, writhe 3.
    expect(squeeze(run.text)).toContain(asPdfText('A t + t^3 - t^4 B 3 C x = 3 D'));
  });

  it('a fill-in LaTeX typesets twice (a measuring pass of align, gather, multline; a long caption) warns once', () => {
    // amsmath measures align, gather and multline before typesetting them, and \@makecaption sets a caption
    // once to measure it and again as a paragraph when it is wider than a line (LaTeX source, common practice).
    const paper = [
      '\\documentclass{article}',
      '\\usepackage{amsmath}',
      '\\usepackage{skeinproof}',
      '\\begin{document}',
      '\\begin{figure}[h]\\centering x \\caption{A caption long enough to run over the width of one line of text, with \\skeinwrithe{a} in it and more words.}\\end{figure}',
      '\\begin{align} x &= \\skeinspan{a} \\\\ y &= \\skeinjones{a} \\end{align}',
      '\\begin{gather*} x = \\skeinbracket{a} \\end{gather*}',
      '\\begin{multline} x = \\skeinvalue{a}{crossings} \\end{multline}',
      'Twice on one line: \\skeinjones{b} and \\skeinjones{b}.',
      '\\end{document}',
    ].join('\n');
    const dir = workDir('twice', true);
    writeFileSync(join(dir, 'twice.tex'), paper);
    const doc = readLatexManuscript(join(dir, 'twice.tex'), diskFiles);
    const run = pdflatex(dir, 'twice.tex');
    expect(run.ok).toBe(true);
    const warned = packageWarnings(run.log, 'skeinproof').filter((w) => w.startsWith('Value'));
    expect(warned.map((w) => w.replace(/^Value `([a-z-]+)' of (`[^']*') is not computed yet on input line (\d+)\.$/, '$1 of $2 line $3'))).toEqual([
      'writhe of `a\' line 5',
      'span of `a\' line 6',
      'jones of `a\' line 6',
      'bracket of `a\' line 7',
      'crossings of `a\' line 8',
      'jones of `b\' line 9',
    ]);
    // The reader sees each written fill-in once, the two on line 9 too.
    expect(doc.fills).toHaveLength(7);
  });

  it('fill-ins in section titles under hyperref: no error before or after the build, the value in the bookmark, in the flat copy too', async () => {
    // hyperref expands section titles into PDF bookmark strings, where a robust command is not allowed (hyperref manual).
    const paper = [
      '\\documentclass{article}',
      '\\usepackage{skeinproof}',
      '\\usepackage{hyperref}',
      '\\begin{document}',
      '\\begin{skeincode}{id=tref, notation=braid}\n1 1 1\n\\end{skeincode}',
      '\\section{The polynomial \\skeinjones{tref} of writhe \\skeinvalue{ tref }{writhe}}',
      'Text.',
      '\\end{document}',
    ].join('\n');
    const dir = workDir('hyperref', true);
    writeFileSync(join(dir, 'titles.tex'), paper);
    const before = pdflatex(dir, 'titles.tex');
    expect(before.ok).toBe(true);
    expect(packageWarnings(before.log, 'hyperref')).toEqual([]);
    expect(packageWarnings(before.log, 'skeinproof').filter((w) => w.startsWith('Value'))).toHaveLength(2);
    expect(bookmarks(join(dir, 'titles.out'))).toEqual(['The polynomial ?? of writhe ??']);
    const result = await latexFormat.build(join(dir, 'titles.tex'), {});
    expect(result.failed).toBe(false);
    for (const o of result.outputs) writeFileSync(o.path, o.content);
    pdflatex(dir, 'titles.tex'); // the bookmarks changed, so hyperref asks for one more pass
    const after = pdflatex(dir, 'titles.tex');
    expect(after.ok).toBe(true);
    expect(unwrapLog(after.log)).not.toMatch(/Warning|^!/m);
    // The positive trefoil (from memory): V = t + t^3 - t^4, writhe 3.
    expect(squeeze(after.text)).toContain(asPdfText('The polynomial t + t^3 - t^4 of writhe 3'));
    expect(bookmarks(join(dir, 'titles.out'))).toEqual(['The polynomial t + t^3 - t^4 of writhe 3']);

    // The flat copy, compiled without the package, gives hyperref the same bookmark.
    const flatDir = workDir('hyperref-flat', false);
    writeFileSync(join(flatDir, 'titles.tex'), paper);
    const flat = await latexFormat.build(join(flatDir, 'titles.tex'), { output: join(flatDir, 'flat.tex') });
    expect(flat.failed).toBe(false);
    for (const o of flat.outputs) writeFileSync(o.path, o.content);
    pdflatex(flatDir, 'flat.tex');
    const flatRun = pdflatex(flatDir, 'flat.tex');
    expect(flatRun.ok).toBe(true);
    expect(unwrapLog(flatRun.log)).not.toMatch(/Warning|^!/m);
    expect(squeeze(flatRun.text)).toContain(asPdfText('The polynomial t + t^3 - t^4 of writhe 3'));
    expect(bookmarks(join(flatDir, 'flat.out'))).toEqual(['The polynomial t + t^3 - t^4 of writhe 3']);
  });

  it('the convention given as package options: LaTeX accepts them, and both builds typeset in it', async () => {
    const paper = [
      '\\documentclass{article}',
      '\\usepackage[jones=q, order=descending]{skeinproof}',
      '\\begin{document}',
      '\\begin{skeincode}{id=tref, notation=braid, jones={q^2 + q^6 - q^8}}\n1 1 1\n\\end{skeincode}',
      'V is \\skeinjones{tref}.',
      '\\end{document}',
    ].join('\n');
    for (const flat of [false, true]) {
      const dir = workDir('options', !flat);
      writeFileSync(join(dir, 'options.tex'), paper);
      if (!flat) {
        const before = pdflatex(dir, 'options.tex');
        expect(before.ok).toBe(true);
        expect(packageWarnings(before.log, 'skeinproof')[0]).toMatch(/^Value `jones' of `tref' is not computed yet/);
      }
      const result = await latexFormat.build(join(dir, 'options.tex'), flat ? { output: join(dir, 'options-flat.tex') } : {});
      expect(result.diagnostics).toEqual([]);
      for (const o of result.outputs) writeFileSync(o.path, o.content);
      const run = pdflatex(dir, flat ? 'options-flat.tex' : 'options.tex');
      expect(run.ok).toBe(true);
      expect(unwrapLog(run.log)).not.toMatch(/Warning|^!/m);
      // The positive trefoil with t = q^2 (README's convention table): q^2 + q^6 - q^8, here in descending order.
      expect(squeeze(run.text)).toContain(asPdfText('V is -q^8 + q^6 + q^2.'));
    }
  });

  it('fills math columns (>{$}c<{$}, which needs the array package the package loads) in both builds', async () => {
    const paper = [
      '\\documentclass{article}',
      '\\usepackage{skeinproof}',
      '\\begin{document}',
      '\\begin{skeincode}{id=tref, notation=braid}\n1 1 1\n\\end{skeincode}',
      '\\begin{skeintable}{id, jones, writhe}',
      '\\begin{tabular}{l>{$}l<{$}>{$}c<{$}}',
      'Id & V & w \\\\',
      'tref & & \\\\',
      'tref & t + t^3 - t^4 & 3 \\\\',
      '\\end{tabular}',
      '\\end{skeintable}',
      '\\end{document}',
    ].join('\n');
    for (const flat of [false, true]) {
      const dir = workDir('math-columns', !flat);
      writeFileSync(join(dir, 'columns.tex'), paper);
      const result = await latexFormat.build(join(dir, 'columns.tex'), flat ? { output: join(dir, 'columns-flat.tex') } : {});
      expect(result.diagnostics).toEqual([]);
      for (const o of result.outputs) writeFileSync(o.path, o.content);
      const run = pdflatex(dir, flat ? 'columns-flat.tex' : 'columns.tex');
      expect(run.ok).toBe(true);
      expect(unwrapLog(run.log)).not.toMatch(/Warning|^!/m);
      // The positive trefoil (from memory): V = t + t^3 - t^4 and writhe 3, filled in row 2 and written in row 3.
      expect(squeeze(run.text).split(asPdfText('t + t^3 - t^4'))).toHaveLength(3);
      expect(run.text).not.toContain('??');
    }
  });

  it('header and label rows with \\multicolumn, \\tabularnewline and a nested tabular do not shift the rows TeX counts', async () => {
    // \\multicolumn builds its own column template (array package); a nested tabular has rows of its own.
    const paper = [
      '\\documentclass{article}',
      '\\usepackage{skeinproof}',
      '\\begin{document}',
      '\\begin{skeincode}{id=tref, notation=braid}\n1 1 1\n\\end{skeincode}',
      '\\begin{skeincode}{id=eight, notation=braid}\n1 -2 1 -2\n\\end{skeincode}',
      '\\begin{skeintable}[head=2]{id, -, jones}',
      '\\begin{tabular}{lll}',
      '\\multicolumn{3}{c}{Two knots} \\\\',
      '\\multicolumn{2}{c}{Diagram} & $V$ \\tabularnewline',
      'tref & \\begin{tabular}{@{}l@{}}right\\\\trefoil\\end{tabular} & \\\\',
      '\\multicolumn{3}{l}{\\emph{Amphichiral}} \\\\ % a label row inside the body',
      'eight & figure eight & \\\\',
      '\\end{tabular}',
      '\\end{skeintable}',
      '\\end{document}',
    ].join('\n');
    const dir = workDir('multicolumn-head', true);
    writeFileSync(join(dir, 'head.tex'), paper);
    const doc = readLatexManuscript(join(dir, 'head.tex'), diskFiles);
    const places = doc.fills.map((f) => (f.target.kind === 'cell' ? `${f.entry.target} ${f.target.table} ${f.target.row} ${f.target.column}` : ''));
    expect(doc.diagnostics).toEqual([]);
    expect(places).toEqual(['tref 1 3 3', 'eight 1 5 3']);
    // TeX fills exactly the cells the reader found, row for row.
    writeFileSync(join(dir, 'head.skein.tex'), loggingSidecar(places));
    const run = pdflatex(dir, 'head.tex');
    expect(run.ok).toBe(true);
    expect([...run.log.matchAll(/^FILLED (.*)$/gm)].map((m) => m[1])).toEqual(places);
    expect(packageWarnings(run.log, 'skeinproof')).toEqual([]);
  });

  it('titles set in capitals (\\MakeUppercase, running heads) keep the case of ids and find their values', async () => {
    // LaTeX's \\MakeUppercase leaves the argument of a command on its no-case-change list alone, as it leaves
    // the label of \\ref (latex.ltx of TeX Live 2022, \\AddToNoCaseChangeList); the page style `headings` sets
    // section titles in capitals in the running head.
    const paper = [
      '\\documentclass{article}',
      '\\usepackage{skeinproof}',
      '\\pagestyle{headings}',
      '\\begin{document}',
      '\\begin{skeincode}{id=Tref, notation=braid}\n1 1 1\n\\end{skeincode}',
      '\\MakeUppercase{Writhe \\skeinwrithe{Tref}, span \\skeinvalue{Tref}{span}}',
      '\\section{Span \\skeinspan{Tref}}',
      'Text.\\newpage Page two.',
      '\\end{document}',
    ].join('\n');
    const dir = workDir('uppercase', true);
    writeFileSync(join(dir, 'caps.tex'), paper);
    const result = await latexFormat.build(join(dir, 'caps.tex'), {});
    expect(result.diagnostics).toEqual([]);
    for (const o of result.outputs) writeFileSync(o.path, o.content);
    const run = pdflatex(dir, 'caps.tex');
    expect(run.ok).toBe(true);
    expect(packageWarnings(run.log, 'skeinproof')).toEqual([]);
    // The positive trefoil (from memory): writhe 3, span of V 3.
    expect(squeeze(run.text)).toContain(squeeze('WRITHE 3, SPAN 3'));
    expect(squeeze(run.text)).toContain(squeeze('1 SPAN 3'));
  });

  it('amsart sets its title in capitals with \\uppercase: a fill-in there still finds its value, unless two ids differ only in case', async () => {
    // amsart.cls (\\uppercasenonmath) upper-cases the text of \\title, math excepted.
    const paper = [
      '\\documentclass{amsart}',
      '\\usepackage{skeinproof}',
      '\\title{Writhe \\skeinwrithe{tref} and \\skeinwrithe{ab}}',
      '\\begin{document}',
      '\\maketitle',
      '\\begin{skeincode}{id=tref, notation=braid}\n1 1 1\n\\end{skeincode}',
      '\\begin{skeincode}{id=ab, notation=braid}\n1 1\n\\end{skeincode}',
      '\\begin{skeincode}{id=aB, notation=braid}\n1 1 1 1\n\\end{skeincode}',
      'Writhes \\skeinwrithe{ab} and \\skeinwrithe{aB}.',
      '\\end{document}',
    ].join('\n');
    const dir = workDir('amsart', true);
    writeFileSync(join(dir, 'title.tex'), paper);
    const result = await latexFormat.build(join(dir, 'title.tex'), {});
    expect(result.diagnostics).toEqual([]);
    for (const o of result.outputs) writeFileSync(o.path, o.content);
    const run = pdflatex(dir, 'title.tex');
    expect(run.ok).toBe(true);
    // Writhes of the braids 1 1 1, 1 1 and 1 1 1 1: 3, 2 and 4. The capitals AB of the title are ambiguous.
    expect(squeeze(run.text)).toContain(squeeze('WRITHE 3 AND ?? AB:writhe'));
    expect(squeeze(run.text)).toContain(squeeze('Writhes 2 and 4.'));
    expect(packageWarnings(run.log, 'skeinproof').filter((w) => w.startsWith('Value'))).toEqual([
      "Value `writhe' of `AB' is not computed yet on input line 5.",
    ]);
  });

  it('the flat copy lays out a skein table inside a paragraph as the package does (the wrapper leaves no space)', async () => {
    // The package's environment ignores the spaces after \\begin{skeintable}{…} and \\end{skeintable}, as LaTeX's
    // \\ignorespaces and \\ignorespacesafterend do; the same line must come out of both, read with pdftotext -layout.
    const paper = [
      '\\documentclass{article}',
      '\\usepackage{skeinproof}',
      '\\begin{document}',
      '\\begin{skeincode}{id=a, notation=braid}\n1 1 1\n\\end{skeincode}',
      'Before the table:',
      '\\begin{skeintable}[head=0]{id, writhe}',
      '\\begin{tabular}{ll}',
      'a & \\\\',
      '\\end{tabular}',
      '\\end{skeintable}',
      'after the table.',
      '\\end{document}',
    ].join('\n');
    const layouts: string[] = [];
    for (const flat of [false, true]) {
      const dir = workDir('inline-table', !flat);
      writeFileSync(join(dir, 'inline.tex'), paper);
      const result = await latexFormat.build(join(dir, 'inline.tex'), flat ? { output: join(dir, 'inline-flat.tex') } : {});
      expect(result.diagnostics).toEqual([]);
      for (const o of result.outputs) writeFileSync(o.path, o.content);
      const stem = flat ? 'inline-flat' : 'inline';
      expect(pdflatex(dir, `${stem}.tex`).ok).toBe(true);
      layouts.push(execFileSync('pdftotext', ['-layout', '-enc', 'UTF-8', join(dir, `${stem}.pdf`), '-'], { encoding: 'utf8' }));
    }
    // The writhe of the positive trefoil (from memory): 3.
    expect(layouts[0]).toMatch(/Before the table:\s+a\s+3\s+after the table\./);
    expect(layouts[1]).toBe(layouts[0]);
  });

  it('computed sentences compile in a document read as latin1 (inputenc), in both builds', async () => {
    // inputenc with latin1 reads each byte as one character, so the UTF-8 bytes of a dash are errors (inputenc
    // manual); LaTeX writes the en dash `--` in every encoding (common practice).
    const paper = [
      '\\documentclass{article}',
      '\\usepackage[latin1]{inputenc}',
      '\\usepackage{skeinproof}',
      '\\begin{document}',
      '\\begin{skeincode}{id=a, notation=braid}\n1 1 1\n\\end{skeincode}',
      '\\skeinstatement{a}',
      '\\end{document}',
    ].join('\n');
    for (const flat of [false, true]) {
      const dir = workDir('latin1', !flat);
      writeFileSync(join(dir, 'latin.tex'), paper);
      const result = await latexFormat.build(join(dir, 'latin.tex'), flat ? { output: join(dir, 'latin-flat.tex') } : {});
      expect(result.diagnostics).toEqual([]);
      for (const o of result.outputs) {
        expect(o.content).toMatch(/^[\x00-\x7F]*$/);
        writeFileSync(o.path, o.content);
      }
      const run = pdflatex(dir, flat ? 'latin-flat.tex' : 'latin.tex');
      expect(run.ok).toBe(true);
      expect(unwrapLog(run.log)).not.toMatch(/Warning|^!/m);
      expect(squeeze(run.text)).toContain('Kauffman\u2013Murasugi\u2013Thistlethwaite');
    }
  });

  it('TeX and the reader agree on which cells are empty, over random tables', () => {
    // Every cell the reader would fill gets a sidecar value that logs its place; TeX must log exactly those,
    // and must find no other empty cell to warn about.
    const cell = fc.constantFrom('', ' ', 'x', '$x^2$', '% note\n', ' \\cellcolor{red!10} ', '\\cellcolor{red!10}3', 'a\\&b', '{p}', '\\textbf{y}');
    const row = fc.record({ id: fc.constantFrom('k', 'k', ''), cells: fc.array(cell, { minLength: 3, maxLength: 3 }) });
    const separator = fc.constantFrom('\\\\', '\\\\[2pt]', '\\\\*', '\\tabularnewline');
    const rule = fc.constantFrom('', '', '\\hline', '\\cline{1-2}', '\\hline\\hline', '% rule\n');
    const table = fc.record({
      head: fc.integer({ min: 0, max: 2 }),
      rows: fc.array(fc.record({ row, separator, rule }), { minLength: 1, maxLength: 6 }),
      closed: fc.boolean(),
    });
    for (const seed of [20261201, 7, 4242]) {
      const tables = fc.sample(table, { seed, numRuns: 12 });
      const body = tables.map((t) => {
        const lines = t.rows.map((r, i) => {
          const last = i === t.rows.length - 1;
          return `${r.rule} ${r.row.id} & ${r.row.cells.join(' & ')}${last && !t.closed ? '' : ` ${r.separator}`}\n`;
        });
        return `\\begin{skeintable}[head=${t.head}]{id, jones, -, crossings}\n\\begin{tabular}{llll}\n${lines.join('')}\\end{tabular}\n\\end{skeintable}\n\n`;
      });
      const paper = `\\documentclass{article}\n\\usepackage[table]{xcolor}\n\\usepackage{skeinproof}\n\\begin{document}\n${body.join('')}\\end{document}\n`;
      const dir = workDir(`random-tables-${seed}`, true);
      writeFileSync(join(dir, 'tables.tex'), paper);
      const doc = readLatexManuscript(join(dir, 'tables.tex'), diskFiles);
      const places = doc.fills.flatMap((f) => (f.target.kind === 'cell' ? [`${f.target.table} ${f.target.row} ${f.target.column}`] : []));
      expect(places.length).toBeGreaterThan(5);
      writeFileSync(join(dir, 'tables.skein.tex'), loggingSidecar(places));
      const run = pdflatex(dir, 'tables.tex');
      expect(run.ok).toBe(true);
      const filled = [...run.log.matchAll(/^FILLED (\d+ \d+ \d+)$/gm)].map((m) => m[1]);
      expect(filled).toEqual(places);
      expect(packageWarnings(run.log, 'skeinproof')).toEqual([]);
    }
  });

  it('fills tables coloured with colortbl and tables of a set width (tabular*)', async () => {
    const paper = [
      '\\documentclass{article}',
      '\\usepackage[table]{xcolor}',
      '\\usepackage{skeinproof}',
      '\\begin{document}',
      '\\begin{skeincode}{id=a, notation=braid}\n1 1 1\n\\end{skeincode}',
      '\\begin{skeincode}{id=b, notation=braid}\n1 -2 1 -2\n\\end{skeincode}',
      '\\begin{skeintable}{id, jones, crossings}',
      '\\begin{tabular*}{0.9\\linewidth}{@{\\extracolsep{\\fill}}l>{\\bfseries}cr}',
      'Id & $V$ & $n$ \\\\',
      '\\rowcolor{gray!20} a & & 3 \\\\',
      'b & \\cellcolor{red!10} & \\cellcolor{blue!10}4 \\\\',
      '\\end{tabular*}',
      '\\end{skeintable}',
      '\\end{document}',
    ].join('\n');
    for (const flat of [false, true]) {
      const dir = workDir('colour', !flat);
      writeFileSync(join(dir, 'colour.tex'), paper);
      const result = await latexFormat.build(join(dir, 'colour.tex'), flat ? { output: join(dir, 'colour-flat.tex') } : {});
      expect(result.diagnostics).toEqual([]);
      for (const o of result.outputs) writeFileSync(o.path, o.content);
      const run = pdflatex(dir, flat ? 'colour-flat.tex' : 'colour.tex');
      expect(run.ok).toBe(true);
      expect(packageWarnings(run.log, 'skeinproof')).toEqual([]);
      // Trefoil and figure-eight knot (from memory).
      for (const v of ['t + t^3 - t^4', 't^{-2} - t^{-1} + 1 - t + t^2']) expect(squeeze(run.text)).toContain(asPdfText(v));
    }
  });

  it('a code with the minus sign U+2212 and Unicode spaces, which the reader accepts, typesets under pdflatex before and after both builds', async () => {
    // pdflatex's utf8 inputenc stops on a character it has no definition for ("Unicode character … not set up",
    // utf8.def); U+2212 is what text copied from a typeset paper carries (README: notations).
    const paper = [
      '\\documentclass{article}',
      '\\usepackage{skeinproof}',
      '\\begin{document}',
      '\\begin{skeincode}{id=eight, notation=braid}',
      '1 \u22122 1\u2009\u22122\u00a0\u3000',
      '\\end{skeincode}',
      'V is \\skeinjones{eight}.',
      '\\end{document}',
    ].join('\n');
    const before = workDir('unicode-code', true);
    writeFileSync(join(before, 'code.tex'), paper);
    const raw = pdflatex(before, 'code.tex');
    expect(raw.ok, texErrors(raw)).toBe(true);
    expect(squeeze(raw.text)).toContain('1-21-2');
    for (const flat of [false, true]) {
      const run = await buildAndCompile(paper, 'code', flat);
      // The figure-eight knot (from memory): V = t^{-2} - t^{-1} + 1 - t + t^2.
      expect(squeeze(run.text)).toContain('1-21-2');
      expect(squeeze(run.text)).toContain(asPdfText('V is t^{-2} - t^{-1} + 1 - t + t^2.'));
    }
  });

  it('a skeincode never closed stops LaTeX with an error that names skeincode, not the package internals', () => {
    // LaTeX reports an environment ended by the wrong \\end as "\\begin{X} on input line N ended by \\end{Y}"
    // (latex.ltx, \\@badend), naming the environment the author opened.
    const dir = workDir('unclosed-code', true);
    writeFileSync(
      join(dir, 'open.tex'),
      '\\documentclass{article}\n\\usepackage{skeinproof}\n\\begin{document}\n\\begin{skeincode}{id=a, notation=braid}\n1 1 1\n\n\\end{document}\n',
    );
    const run = pdflatex(dir, 'open.tex');
    expect(run.ok).toBe(false);
    const errors = unwrapLog(run.log).split('\n').filter((l) => l.startsWith('! '));
    expect(errors[0]).toBe('! LaTeX Error: \\begin{skeincode} on input line 4 ended by \\end{document}.');
    expect(run.log).not.toContain('flushleft');
  });

  it("the author's macros: claims and fill-ins through macros with parameters are checked at each use, and typeset in text and math in both builds", async () => {
    // TeX puts a macro's arguments in place of #1…#9 (The TeXbook, ch. 20); \ensuremath typesets in text and math
    // alike (LaTeX manual). The claims are true, so the build passes; a wrong one fails it at the use (second part).
    const paper = [
      '\\documentclass{article}',
      '\\usepackage{skeinproof}',
      '\\newcommand\\jonesof[2]{\\skeinclaim{#1}{jones}{#2}}',
      '\\newcommand\\Vof[2][jones]{\\skeinvalue{#2}{#1}}',
      '\\def\\trefJ{\\skeinjones{tref}}',
      '\\begin{document}',
      '\\begin{skeincode}{id=tref, notation=braid}\n1 1 1\n\\end{skeincode}',
      'A: $V = \\jonesof{tref}{t + t^3 - t^4}$. B: \\Vof{tref}. C: $w = \\Vof[writhe]{tref}$. D: \\trefJ. E: $\\trefJ$.',
      '\\end{document}',
    ].join('\n');
    const before = workDir('macros', true);
    writeFileSync(join(before, 'macros.tex'), paper);
    const raw = pdflatex(before, 'macros.tex');
    expect(raw.ok).toBe(true);
    // Once per value and line: jones and writhe of tref.
    expect(packageWarnings(raw.log, 'skeinproof').filter((w) => w.startsWith('Value'))).toHaveLength(2);
    for (const flat of [false, true]) {
      const run = await buildAndCompile(paper, 'macros', flat);
      // The positive trefoil (from memory): V = t + t^3 - t^4, writhe 3.
      const v = asPdfText('t + t^3 - t^4');
      expect(squeeze(run.text)).toContain(`A:V=${v}.B:${v}.C:w=3.D:${v}.E:${v}.`);
    }
    const wrong = workDir('macros-wrong', false);
    writeFileSync(join(wrong, 'macros.tex'), paper.replace('{t + t^3 - t^4}$', '{t + t^3 - t^5}$'));
    const failed = await latexFormat.check(join(wrong, 'macros.tex'), {});
    expect(failed.failed).toBe(true);
    const contradiction = failed.diagnostics.find((d) => d.ruleId === 'claim-contradicted')!;
    // Line 10, at the value written in the use: `A: $V = \jonesof{tref}{` is 23 characters.
    expect(`${contradiction.location!.start.line}:${contradiction.location!.start.column}`).toBe('10:24');
  });

  it("a convention given where the author's own package loads skeinproof is read: values typeset in it; the flat copy says it still needs the package", async () => {
    // LaTeX finds mymacros.sty in the directory it runs in (kpathsea searches `.` first: common practice).
    const paper = [
      '\\documentclass{article}',
      '\\usepackage{mymacros}',
      '\\begin{document}',
      '\\begin{skeincode}{id=tref, notation=braid}\n1 1 1\n\\end{skeincode}',
      'V is \\skeinjones{tref}; claimed $\\jonesof{tref}{q^2 + q^6 - q^8}$.',
      '\\end{document}',
    ].join('\n');
    const sty = '\\ProvidesPackage{mymacros}\n\\RequirePackage[jones=q, order=descending]{skeinproof}\n\\newcommand\\jonesof[2]{\\skeinclaim{#1}{jones}{#2}}\n';
    const dir = workDir('own-package', true);
    writeFileSync(join(dir, 'own.tex'), paper);
    writeFileSync(join(dir, 'mymacros.sty'), sty);
    const result = await latexFormat.build(join(dir, 'own.tex'), {});
    expect(result.diagnostics).toEqual([]);
    for (const o of result.outputs) writeFileSync(o.path, o.content);
    const run = pdflatex(dir, 'own.tex');
    expect(run.ok, texErrors(run)).toBe(true);
    expect(unwrapLog(run.log)).not.toMatch(/Warning|^!/m);
    // The positive trefoil with t = q^2 (README's convention table): q^2 + q^6 - q^8, here in descending order.
    expect(squeeze(run.text)).toContain(asPdfText('V is -q^8 + q^6 + q^2; claimed q^2 + q^6 - q^8.'));
    const flat = await latexFormat.build(join(dir, 'own.tex'), { output: join(dir, 'own-flat.tex') });
    expect(flat.failed).toBe(false);
    expect(flat.diagnostics.map((d) => `${d.ruleId} ${d.location?.file}:${d.location?.start.line}`)).toEqual([
      `latex-flat-needs-package ${join(dir, 'mymacros.sty')}:2`,
    ]);
  });

  it('a skein table in a longtable (caption, heads, feet, more rows than one chunk): TeX and the reader count rows alike, and both builds fill it', async () => {
    // longtable sets its rows in chunks of \LTchunksize (20) rows, and the rows before \endfirsthead, \endhead,
    // \endfoot and \endlastfoot are its heads and feet (longtable manual).
    const rows = Array.from({ length: 25 }, (_, k) => (k % 2 === 0 ? 'a & & 3 \\\\' : 'b & & \\\\'));
    const paper = [
      '\\documentclass{article}',
      '\\usepackage{longtable,booktabs}',
      '\\usepackage{skeinproof}',
      '\\begin{document}',
      '\\begin{skeincode}{id=a, notation=braid}\n1 1 1\n\\end{skeincode}',
      '\\begin{skeincode}{id=b, notation=braid}\n1 -2 1 -2\n\\end{skeincode}',
      '\\begin{skeintable}[head=2]{id, jones, crossings}',
      '\\begin{longtable}{lll}',
      '\\caption{Knots}\\\\',
      'Id & $V$ & $n$ \\\\ \\midrule',
      '\\endfirsthead',
      'Id (continued) & $V$ & $n$ \\\\ \\midrule',
      '\\endhead',
      '\\multicolumn{3}{r}{continued overleaf} \\\\',
      '\\endfoot',
      '\\bottomrule',
      '\\endlastfoot',
      ...rows,
      '\\end{longtable}',
      '\\end{skeintable}',
      '\\end{document}',
    ].join('\n');
    const dir = workDir('longtable-rows', true);
    writeFileSync(join(dir, 'long.tex'), paper);
    const doc = readLatexManuscript(join(dir, 'long.tex'), diskFiles);
    expect(doc.diagnostics).toEqual([]);
    const places = doc.fills.map((f) => (f.target.kind === 'cell' ? `${f.target.table} ${f.target.row} ${f.target.column}` : ''));
    // Rows 1-4 are the caption, the two heads and the foot; the 25 data rows follow, b's crossings empty too.
    expect(places).toHaveLength(25 + 12);
    expect(places[0]).toBe('1 5 2');
    writeFileSync(join(dir, 'long.skein.tex'), loggingSidecar(places));
    const run = pdflatex(dir, 'long.tex');
    expect(run.ok, texErrors(run)).toBe(true);
    expect([...run.log.matchAll(/^FILLED (.*)$/gm)].map((m) => m[1])).toEqual(places);
    expect(packageWarnings(run.log, 'skeinproof')).toEqual([]);
    for (const flat of [false, true]) {
      const built = await buildAndCompile(paper, 'long', flat, 2); // longtable settles its column widths on a second pass
      // Trefoil and figure-eight knot (from memory), and the figure-eight's 4 crossings.
      for (const v of ['t + t^3 - t^4', 't^{-2} - t^{-1} + 1 - t + t^2']) expect(squeeze(built.text)).toContain(asPdfText(v));
      expect(built.text).not.toContain('??');
    }
  });

  it("a fill-in through the author's macro in a section title under hyperref: the flat copy gives the bookmark the value as typed", async () => {
    // hyperref removes tokens such as \ensuremath from a PDF string with a warning; \texorpdfstring gives it text (hyperref manual).
    const paper = [
      '\\documentclass{article}',
      '\\usepackage{skeinproof}',
      '\\usepackage{hyperref}',
      '\\newcommand\\J[1]{\\skeinjones{#1}}',
      '\\begin{document}',
      '\\begin{skeincode}{id=tref, notation=braid}\n1 1 1\n\\end{skeincode}',
      '\\section{Value \\J{tref}}',
      'Text.',
      '\\end{document}',
    ].join('\n');
    const dir = workDir('macro-title', false);
    writeFileSync(join(dir, 'title.tex'), paper);
    const flat = await latexFormat.build(join(dir, 'title.tex'), { output: join(dir, 'flat.tex') });
    expect(flat.diagnostics).toEqual([]);
    for (const o of flat.outputs) writeFileSync(o.path, o.content);
    pdflatex(dir, 'flat.tex');
    const run = pdflatex(dir, 'flat.tex');
    expect(run.ok, texErrors(run)).toBe(true);
    expect(unwrapLog(run.log)).not.toMatch(/Warning|^!/m);
    // The positive trefoil (from memory): V = t + t^3 - t^4.
    expect(bookmarks(join(dir, 'flat.out'))).toEqual(['Value t + t^3 - t^4']);
  });
  it('a skein grid of Khovanov homology: placeholders before the build, TeX and the reader count its rows alike after a table, both builds fill it', async () => {
    // The right-handed trefoil (from memory, Bar-Natan, AGT 2 (2002)): ℚ at (0, 1), (0, 3), (2, 5), (3, 9) and ℤ/2 at (3, 7).
    const paper = [
      '\\documentclass{article}',
      '\\usepackage{amssymb}',
      '\\usepackage{skeinproof}',
      '\\begin{document}',
      '\\begin{skeincode}{id=tref, notation=braid}\n1 1 1\n\\end{skeincode}',
      '\\begin{skeintable}{id, crossings}',
      '\\begin{tabular}{ll}',
      'Id & $n$ \\\\',
      'tref & \\\\',
      '\\end{tabular}',
      '\\end{skeintable}',
      '\\begin{skeingrid}[head=2, values=groups]{tref}',
      '\\begin{tabular}{r|cccc}',
      '\\multicolumn{5}{c}{GRIDTITLE} \\\\',
      '$j \\backslash i$ & 0 & 1 & 2 & 3 \\\\ \\hline',
      '9 & & & & $\\mathbb{Z}$ \\\\',
      '7 & & & & \\\\[2pt]',
      '\\multicolumn{5}{c}{} \\\\',
      '5 & & & & \\\\',
      '3 & & . & & \\\\',
      '1 & & & & \\tabularnewline',
      '\\end{tabular}',
      '\\end{skeingrid}',
      '\\end{document}',
    ].join('\n');
    const dir = workDir('grid', true);
    writeFileSync(join(dir, 'grid.tex'), paper);
    const doc = readLatexManuscript(join(dir, 'grid.tex'), diskFiles);
    expect(doc.diagnostics).toEqual([]);
    const gridFills = doc.fills.filter((f) => f.entry.khovanovCell);
    expect(gridFills).toHaveLength(5 * 4 - 2);
    // Before the build: one placeholder warning per empty grid cell, naming its row, column and grid.
    const raw = pdflatex(dir, 'grid.tex');
    expect(raw.ok, texErrors(raw)).toBe(true);
    expect(squeeze(raw.text)).toContain('??');
    const expected = gridFills.map((f) =>
      f.target.kind === 'cell' ? `Value \`khovanov' of row ${f.target.row}, column ${f.target.column} of skein grid ${f.target.table} is not computed yet` : '',
    );
    const perValue = packageWarnings(raw.log, 'skeinproof').filter((w) => w.startsWith('Value') && w.includes('grid'));
    expect(perValue.map((w) => w.replace(/ on input line \d+\.$/, ''))).toEqual(expected);
    // TeX fills the cells the reader found, in its order.
    const places = doc.fills.map((f) => (f.target.kind === 'cell' ? `${f.target.table} ${f.target.row} ${f.target.column}` : ''));
    expect(places.slice(0, 2)).toEqual(['1 2 2', '2 3 2']);
    writeFileSync(join(dir, 'grid.skein.tex'), loggingSidecar(places));
    const logged = pdflatex(dir, 'grid.tex');
    expect(logged.ok, texErrors(logged)).toBe(true);
    expect([...logged.log.matchAll(/^FILLED (.*)$/gm)].map((m) => m[1])).toEqual(places);
    for (const flat of [false, true]) {
      const built = await buildAndCompile(paper, 'grid', flat);
      expect(built.text).not.toContain('??');
      // pdftotext -raw reads the rows in order: each its degree, then the groups of its nonzero cells (which column each
      // cell is in, the logging sidecar above shows): ℤ at (3, 9), ℤ/2 at (3, 7), ℤ at (2, 5), (0, 3), (0, 1), the author's dot.
      const raw = execFileSync('pdftotext', ['-raw', built.pdf, '-'], { encoding: 'utf8' }).split('\n');
      const title = raw.indexOf('GRIDTITLE');
      expect(raw.slice(title + 1, title + 7)).toEqual(['j\\i 0 1 2 3', '9 Z', '7 Z/2', '5 Z', '3 Z .', '1 Z']);
    }
  });
});

