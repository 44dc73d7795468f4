/**
 * The LaTeX reader on manuscripts held in memory: what it extracts, where it
 * says each problem is (line:column counted by hand in the test text), how it
 * follows \input and refuses paths leaving the paper's directory, and the
 * flat copy's bytes.
 */
import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { readLatexManuscript, type LatexDocument } from '../../plugins/latex/reader.ts';
import { flatText } from '../../plugins/latex/flat.ts';
import { sidecarText } from '../../plugins/latex/sidecar.ts';
import { runSession } from '../../src/core/manuscript/session.ts';
import { DEFAULT_CONVENTION } from '../../src/core/convention/convention.ts';
import { memoryFiles } from './support.ts';

function read(files: Record<string, string>, main = 'paper.tex'): LatexDocument {
  return readLatexManuscript(`/paper/${main}`, memoryFiles(files));
}

/** Each diagnostic as `rule@file:line:column`, file relative to /paper. */
function places(doc: LatexDocument): string[] {
  return doc.diagnostics.map((d) => `${d.ruleId}@${d.location!.file.replace('/paper/', '')}:${d.location!.start.line}:${d.location!.start.column}`);
}

const PREAMBLE = '\\documentclass{article}\n\\usepackage{skeinproof}\n\\begin{document}\n';

describe('what the reader extracts', () => {
  it('diagrams, option claims, prose claims, fill-ins and the convention', () => {
    const doc = read({
      'paper.tex':
        '\\documentclass{article}\n\\usepackage{skeinproof}\n\\skeinconvention{jones=q, order=descending}\n\\begin{document}\n' +
        '\\begin{skeincode}{id=tre, notation=braid, jones={t+t^3-t^4}, crossing-number=3}\n1 1 1\n\\end{skeincode}\n' +
        'V is \\skeinjones{tre}, claim \\skeinclaim{tre}{writhe}{$3$} and $\\skeinvalue{tre}{span}$.\n\\end{document}\n',
    });
    expect(doc.diagnostics).toEqual([]);
    expect(doc.convention).toEqual({ jonesVariable: 'q', termOrder: 'descending' });
    expect(doc.diagrams.map((d) => [d.id, d.notation, d.code])).toEqual([['tre', 'braid', '1 1 1']]);
    expect(doc.claims.map((c) => [c.target, c.key, c.text])).toEqual([
      ['tre', 'jones', 't+t^3-t^4'],
      ['tre', 'crossing-number', '3'],
      ['tre', 'writhe', '3'],
    ]);
    expect(doc.fills.map((f) => f.target)).toEqual([
      { kind: 'macro', id: 'tre', key: 'jones', math: false, inTitle: false },
      { kind: 'macro', id: 'tre', key: 'span', math: true, inTitle: false },
    ]);
    // Positions: the code starts on line 6, the writhe claim's `3` (inside $…$) on line 8.
    expect(doc.diagrams[0]!.locateCode().start).toMatchObject({ line: 6, column: 1 });
    expect(doc.claims[2]!.locate().start).toMatchObject({ line: 8, column: 56 });
  });

  it('a fill-in or claim macro written in a key column is read as itself, not as the cell\'s claimed value', () => {
    const doc = read({
      'paper.tex':
        PREAMBLE +
        '\\begin{skeintable}{id, jones, statement}\n\\begin{tabular}{lll}\nId & $V$ & \\\\\nk & $\\skeinjones{k}$ & \\skeinvalue{k}{statement} \\\\\nk & \\skeinclaim{k}{jones}{$t$} & \\\\\n\\end{tabular}\n\\end{skeintable}\n',
    });
    expect(doc.diagnostics).toEqual([]);
    expect(doc.claims.map((c) => [c.key, c.text])).toEqual([['jones', 't']]);
    // The table's own empty cell (row 3, statement) is read with the table, the macros where they stand.
    expect(doc.fills.map((f) => [f.target.kind, f.entry.key])).toEqual([['cell', 'statement'], ['macro', 'jones'], ['macro', 'statement']]);
  });

  it('an id cell may write an underscore as \\_, as text mode needs it (common practice)', () => {
    const doc = read({
      'paper.tex':
        PREAMBLE +
        '\\begin{skeintable}{id, jones}\n\\begin{tabular}{ll}\nId & $V$ \\\\\nknot\\_3.1 & \\\\\n\\texttt{knot\\_3.1} & $t$ \\\\\n\\end{tabular}\n\\end{skeintable}\n',
    });
    expect(doc.diagnostics).toEqual([]);
    expect(doc.fills.map((f) => f.entry.target)).toEqual(['knot_3.1']);
    expect(doc.claims.map((c) => c.target)).toEqual(['knot_3.1']);
  });

  // A message about a cell names the row's diagram and the column's key besides their numbers, as the
  // Markdown tables' messages do (common practice: a compiler names what it points at).
  it('reads skein tables: empty cells are fill-ins, filled cells claims, header rows skipped', () => {
    const doc = read({
      'paper.tex':
        PREAMBLE +
        '\\begin{skeintable}[head=2]{id, -, jones, crossing-number}\n\\begin{tabular}{llll}\n' +
        'Id & Name & $V$ & $c$ \\\\\n & & & \\\\\n\\hline\nk1 & trefoil & & 3 \\\\\n\\texttt{k2} & eight & $t^2$ & \\\\\n\\end{tabular}\n\\end{skeintable}\n',
    });
    expect(doc.diagnostics).toEqual([]);
    expect(doc.fills.map((f) => f.target.kind === 'cell' && [f.entry.target, f.entry.key, f.target.row, f.target.column])).toEqual([
      ['k1', 'jones', 3, 3],
      ['k2', 'crossing-number', 4, 4],
    ]);
    expect(doc.claims.map((c) => [c.target, c.key, c.text, c.context])).toEqual([
      ['k1', 'crossing-number', '3', 'skein table 1, row 3 (k1), column 4 (crossing-number)'],
      ['k2', 'jones', 't^2', 'skein table 1, row 4 (k2), column 3 (jones)'],
    ]);
    // The claim `3` of k1 is on line 9 (1-based), column 18.
    expect(doc.claims[0]!.locate().start).toMatchObject({ line: 9, column: 18 });
  });
});

describe('located errors in the markup', () => {
  it('reports every problem of a bad document in one pass, each where it is written', () => {
    const doc = read({
      'paper.tex': [
        '\\documentclass{article}', // 1
        '\\usepackage{skeinproof}', // 2
        '\\begin{document}', // 3
        '\\begin{skeincode}{notation=braid}', // 4: no id
        '1 1 1',
        '\\end{skeincode}',
        '\\begin{skeincode}{id=a, notation=knotty}', // 7: unknown notation at column 34
        '1',
        '\\end{skeincode}',
        '\\begin{skeincode}{id=b, notation=pd, colour=red, id=c}', // 10: unknown key col 38, repeated id col 50
        '(1,1,2,2)',
        '\\end{skeincode}',
        '\\begin{skeincode}{id=d}', // 13: no notation
        '1',
        '\\end{skeincode}',
        '\\begin{skeincode}{id=e f, notation=braid, strands=two}', // 16: bad id col 22, bad strands col 51
        '1',
        '\\end{skeincode}',
        'See \\skeinvalue{b}{colour} and \\skeinclaim{b}{knottedness}{3}.', // 19: fill key col 20, claim key col 47
        '\\skeinjones{}', // 20: fill without id
        '\\begin{skeincode}{id=z, notation=braid}', // 21: never closed
        '1 1',
      ].join('\n'),
    });
    expect(places(doc)).toEqual([
      'latex-id-missing@paper.tex:4:1',
      'latex-notation-unknown@paper.tex:7:34',
      'latex-key-unknown@paper.tex:10:38',
      'latex-key-repeated@paper.tex:10:50',
      'latex-notation-missing@paper.tex:13:1',
      'latex-id-invalid@paper.tex:16:22',
      'latex-option-invalid@paper.tex:16:51',
      'latex-key-unknown@paper.tex:19:20',
      'latex-key-unknown@paper.tex:19:47',
      'latex-id-missing@paper.tex:20:1',
      'latex-environment-unclosed@paper.tex:21:1',
    ]);
    for (const d of doc.diagnostics) expect(d.severity).toBe('error');
    expect(doc.diagnostics[2]!.message).toContain('the keys are id, notation, strands, part-signs, for, jones');
    expect(doc.diagrams.map((d) => d.id)).toEqual(['b']);
  });

  it('reports malformed skein tables where the fault is', () => {
    const doc = read({
      'paper.tex': [
        PREAMBLE + '\\begin{skeintable}{id, jonez}', // line 4: unknown column at col 24
        '\\begin{tabular}{ll}',
        'a & b \\\\',
        '\\end{tabular}',
        '\\end{skeintable}',
        '\\begin{skeintable}{id, statement, alternating, span}', // line 9
        '\\begin{tabular}{llll}',
        'Id & S & A & span \\\\', // header
        'k & says & & 3 \\\\', // line 12: filled statement at col 5, the empty alternating cell's space at col 11
        '\\multicolumn{2}{c}{x} & y \\\\', // line 13
        'k & \\\\', // line 14: too few cells
        ' & & yes & \\\\', // line 15: no id (the row's cells start after its leading space)
        '\\end{tabular}',
        '\\end{skeintable}',
        '\\begin{skeintable}{id}', // line 18: no tabular
        'text',
      ].join('\n'),
    });
    expect(places(doc)).toEqual([
      'latex-key-unknown@paper.tex:4:24',
      'latex-cell-filled@paper.tex:12:5',
      'latex-cell-empty@paper.tex:12:11',
      'latex-table-malformed@paper.tex:13:1',
      'latex-table-malformed@paper.tex:14:4',
      'latex-id-missing@paper.tex:15:2',
      'latex-table-malformed@paper.tex:18:1',
    ]);
  });

  it('a skein table around an environment it does not read (tabularx) is one error, its own \\end{skeintable} no second one', () => {
    const doc = read({
      'paper.tex':
        PREAMBLE +
        '\\begin{skeintable}{id, writhe}\n\\begin{tabularx}{\\linewidth}{lX}\nId & w \\\\\nk & \\\\\n\\end{tabularx}\n\\end{skeintable}\n' + // lines 4-9
        '\\begin{skeintable}{id, writhe}\n\\begin{tabular}{ll}\nk & \\\\\n\\end{tabular} text\n\\end{skeintable}\n', // lines 10-14: \end{skeintable} not right after
    });
    expect(places(doc)).toEqual(['latex-table-malformed@paper.tex:4:1', 'latex-environment-unclosed@paper.tex:10:1']);
    expect(doc.diagnostics[0]!.message).toContain('does not read the rows of `tabularx`');
    expect(doc.diagnostics[1]!.message).toContain('right after \\end{tabular}');
  });

  it('a longtable in a skein table: heads, feet and the caption are no data rows; a \\kill row is refused', () => {
    const body = '\\caption{Knots}\\\\\nId & $V$ \\\\\n\\endfirsthead\nId & $V$ \\\\\n\\endhead\nk & \\\\\n\\caption{not a row of data}\\\\\n';
    const doc = read({ 'paper.tex': PREAMBLE + `\\begin{skeintable}{id, jones}\n\\begin{longtable}[l]{ll}\n${body}\\end{longtable}\n\\end{skeintable}\n` });
    expect(doc.diagnostics).toEqual([]);
    expect(doc.fills.map((f) => (f.target.kind === 'cell' ? `${f.entry.target} row ${f.target.row}` : ''))).toEqual(['k row 4']);
    const killed = read({
      'paper.tex': PREAMBLE + '\\begin{skeintable}[head=0]{id, jones}\n\\begin{longtable}{ll}\nwidest & \\kill\nk & \\\\\n\\end{longtable}\n\\end{skeintable}\n',
    });
    expect(places(killed)).toEqual(['latex-table-malformed@paper.tex:6:10']);
  });

  it('\\skeinconvention after \\begin{document} is refused (LaTeX allows it only in the preamble)', () => {
    const doc = read({ 'paper.tex': '\\input{pre}\n\\begin{document}\n\\skeinconvention{order=ascending}\n', 'pre.tex': '\\skeinconvention{jones=q}\n' });
    expect(places(doc)).toEqual(['latex-convention-misplaced@paper.tex:3:1']);
    expect(doc.convention).toEqual({ jonesVariable: 'q' });
  });

  it('\\skeinconvention before \\usepackage{skeinproof} is refused (LaTeX does not know the command yet)', () => {
    const doc = read({ 'paper.tex': '\\documentclass{article}\n\\skeinconvention{jones=q}\n\\usepackage{skeinproof}\n\\begin{document}\n' });
    expect(places(doc)).toEqual(['latex-convention-misplaced@paper.tex:2:1']);
    expect(doc.diagnostics[0]!.message).toContain('before \\usepackage{skeinproof}');
    // A fragment that never loads the package is not judged.
    expect(places(read({ 'paper.tex': '\\skeinconvention{jones=q}\n' }))).toEqual([]);
  });

  it('an empty key or column says that no key is given', () => {
    const doc = read({
      'paper.tex':
        '\\skeinvalue{k}{ }\n\\skeinclaim{k}{}{3}\n\\begin{skeintable}{id,,jones}\n\\begin{tabular}{lll}\nx\\\\\n\\end{tabular}\n\\end{skeintable}\n' +
        '\\begin{skeintable}{}\n\\begin{tabular}{l}\nx\\\\\n\\end{tabular}\n\\end{skeintable}\n',
    });
    expect(places(doc)).toEqual(['latex-key-unknown@paper.tex:1:17', 'latex-key-unknown@paper.tex:2:16', 'latex-key-unknown@paper.tex:3:23', 'latex-table-malformed@paper.tex:8:20']);
    expect(doc.diagnostics.slice(0, 3).map((d) => d.message.split(':')[0])).toEqual(['no key is given', 'no key is given', 'column 2 has no key']);
  });

  it('strands belongs to braid words only', () => {
    const doc = read({ 'paper.tex': '\\begin{skeincode}{id=k, notation=dt, strands=3}\n4 6 2\n\\end{skeincode}\n' });
    expect(places(doc)).toEqual(['latex-option-invalid@paper.tex:1:46']);
    expect(doc.diagrams).toEqual([]);
  });

  it('package options declare the convention too, as the Conventions section says; once only', () => {
    const doc = read({ 'paper.tex': '\\documentclass{article}\n\\usepackage[jones=q, order = descending]{skeinproof}\n\\begin{document}\n' });
    expect(doc.diagnostics).toEqual([]);
    expect(doc.convention).toEqual({ jonesVariable: 'q', termOrder: 'descending' });
    const bad = read({ 'paper.tex': '\\RequirePackage[jones=w]{skeinproof}\n\\skeinconvention{order=ascending}\n' });
    expect(places(bad)).toEqual(['convention-invalid@paper.tex:1:23', 'latex-convention-twice@paper.tex:2:1']);
    expect(bad.diagnostics[1]!.message).toContain('\\usepackage[…]{skeinproof}');
    const twice = read({ 'paper.tex': '\\skeinconvention{order=ascending}\n\\usepackage[jones=q]{skeinproof}\n' });
    expect(places(twice)).toEqual(['latex-convention-misplaced@paper.tex:1:1', 'latex-convention-twice@paper.tex:2:13']);
    // Empty options declare nothing.
    expect(places(read({ 'paper.tex': '\\usepackage[]{skeinproof}\n\\skeinconvention{jones=q}\n' }))).toEqual([]);
  });

  it('finds input files as TeX does: name.tex first, then the name as written; a name starting with two dots stays inside', () => {
    // pdflatex (TeX Live 2022) run on these files read ch.v2.tex, ..notes.tex, other.v3 and x.tex.
    const doc = read({
      'paper.tex': '\\input{ch.v2}\n\\input{..notes}\n\\input{other.v3}\n\\include{x.tex}\n\\input{none.v4}\n',
      'ch.v2.tex': 'with tex\n',
      'ch.v2': 'bare\n',
      '..notes.tex': 'notes\n',
      'other.v3': 'only bare\n',
      'x.tex': 'x\n',
      'x.tex.tex': 'not this\n',
    });
    expect(places(doc)).toEqual(['latex-input-missing@paper.tex:5:8']);
    expect(doc.diagnostics[0]!.message).toBe('\\input{none.v4}: there is no file none.v4.tex or none.v4 in /paper; correct the name or add the file');
    expect(doc.files.map((f) => f.displayPath)).toEqual(['/paper/paper.tex', '/paper/ch.v2.tex', '/paper/..notes.tex', '/paper/other.v3', '/paper/x.tex']);
  });

  it('a convention setting given twice with different values is an error, in \\skeinconvention and in package options (as on the command line)', () => {
    const doc = read({ 'paper.tex': '\\usepackage{skeinproof}\n\\skeinconvention{jones=q, order=descending, jones = t}\n' });
    expect(places(doc)).toEqual(['convention-invalid@paper.tex:2:45']);
    expect(doc.diagnostics[0]!.message).toBe(
      'convention setting `jones` is given twice with different values (q, then t) in \\skeinconvention; keep one',
    );
    const options = read({ 'paper.tex': '\\usepackage[jones=q,jones=t]{skeinproof}\n' });
    expect(places(options)).toEqual(['convention-invalid@paper.tex:1:21']);
    // Names of the same setting in other cases or spellings are one setting too (README: conventions).
    expect(places(read({ 'paper.tex': '\\usepackage[jones=q,Jones=t]{skeinproof}\n' }))).toHaveLength(1);
    // The same value twice says the same thing twice, as on the command line.
    const same = read({ 'paper.tex': '\\usepackage[jones=q, jones=q]{skeinproof}\n' });
    expect(same.diagnostics).toEqual([]);
    expect(same.convention).toEqual({ jonesVariable: 'q' });
  });

  it('a bad convention setting is located at its key or value', () => {
    const doc = read({ 'paper.tex': '\\skeinconvention{jones=w, colour=blue}\n\\skeinconvention{order=ascending}\n' });
    expect(places(doc)).toEqual(['convention-invalid@paper.tex:1:24', 'convention-invalid@paper.tex:1:27', 'latex-convention-twice@paper.tex:2:1']);
  });
});

describe('\\input and \\include', () => {
  it('follows included files and locates their entries and errors in them', () => {
    const doc = read({
      'paper.tex': PREAMBLE + '\\input{sections/one}\n\\include{two}\n\\end{document}\n',
      'sections/one.tex': '% one\n\\begin{skeincode}{id=k, notation=dt}\n4 6 2\n\\end{skeincode}\n\\input{sections/deeper.tex}\n',
      'sections/deeper.tex': 'x\n  \\skeinclaim{k}{jones}{t}\n',
      'two.tex': '\\begin{skeincode}{id=m, notation=pd, wrong=1}\n(1,1,2,2)\n\\end{skeincode}\n',
    });
    expect(doc.files.map((f) => f.displayPath)).toEqual(['/paper/paper.tex', '/paper/sections/one.tex', '/paper/sections/deeper.tex', '/paper/two.tex']);
    expect(doc.diagrams[0]!.locateCode().start).toMatchObject({ line: 3, column: 1 });
    expect(doc.diagrams[0]!.locateCode().file).toBe('/paper/sections/one.tex');
    const claim = doc.claims[0]!.locate();
    expect([claim.file, claim.start.line, claim.start.column]).toEqual(['/paper/sections/deeper.tex', 2, 25]);
    expect(places(doc)).toEqual(['latex-key-unknown@two.tex:1:38']);
  });

  it('refuses paths that leave the paper directory, by .. or absolute path or link', () => {
    const files = memoryFiles({
      'paper.tex': PREAMBLE + '\\input{../secret}\n\\include{sub/../../x}\n\\input{/etc/passwd}\n\\input{link}\n',
      'link.tex': 'linked',
    });
    const doc = readLatexManuscript('/paper/paper.tex', {
      ...files,
      realpath: (p) => (p === '/paper/link.tex' ? '/elsewhere/link.tex' : p),
    });
    expect(places(doc)).toEqual([
      'latex-input-outside@paper.tex:4:8',
      'latex-input-outside@paper.tex:5:10',
      'latex-input-outside@paper.tex:6:8',
      'latex-input-outside@paper.tex:7:8',
    ]);
    expect(doc.diagnostics[0]!.message).toContain("outside the paper's directory");
    expect(doc.diagnostics[3]!.message).toContain('(link.tex is a symbolic link to /elsewhere/link.tex)');
    expect(doc.diagnostics[0]!.message).not.toContain('symbolic link');
    expect(doc.files).toHaveLength(1);
  });

  it('rows of a skein table read from an \\input file are refused with a reason', () => {
    const doc = read({
      'paper.tex': PREAMBLE + '\\begin{skeintable}{id, jones}\n\\begin{tabular}{ll}\nK & V \\\\\n\\input{rows}\n\\end{tabular}\n\\end{skeintable}\n',
      'rows.tex': 'k & \\\\\n',
    });
    expect(places(doc)).toEqual(['latex-table-malformed@paper.tex:7:1']);
    expect(doc.diagnostics[0]!.message).toContain('not from \\input or \\include files');
  });

  it('an \\input or \\include naming no file says so', () => {
    const doc = read({ 'paper.tex': '\\input{}\n\\include{ }\n\\input{sections/}\n' });
    expect(places(doc)).toEqual(['latex-argument-missing@paper.tex:1:8', 'latex-argument-missing@paper.tex:2:10', 'latex-argument-missing@paper.tex:3:8']);
    expect(doc.diagnostics[2]!.message).toBe('\\input{sections/} names no file: write the file\'s name, e.g. \\input{sections/examples}');
  });

  it('reports missing and circular includes without reading on', () => {
    const doc = read({
      'paper.tex': '\\input{none}\n\\input{a}\n',
      'a.tex': '\\input{paper}\n',
    });
    expect(places(doc)).toEqual(['latex-input-missing@paper.tex:1:8', 'latex-input-cycle@a.tex:1:8']);
  });
});

describe('building', () => {
  const PAPER =
    '\\documentclass{article}\n\\usepackage{amsmath,skeinproof}\n\\skeinconvention{order=descending}\n\\begin{document}\n' +
    '\\begin{skeincode}{id=h, notation=braid, writhe=2}\n1 1% Hopf\n\\end{skeincode}\n' +
    'Values: \\skeinjones{h}, $w = \\skeinwrithe{h}$, claimed \\skeinclaim{h}{crossing-number}{$2$}.\n' +
    '\\begin{skeintable}{id, span}\n\\begin{tabular}{ll}\nId & span\\\\\nh & \\\\\n\\end{tabular}\n\\end{skeintable}\n\\end{document}\n';

  function build() {
    const doc = read({ 'paper.tex': PAPER });
    const session = runSession({
      diagrams: doc.diagrams,
      claims: doc.claims,
      fills: doc.fills.map((f) => f.entry),
      convention: { ...DEFAULT_CONVENTION, ...doc.convention },
    });
    expect(doc.diagnostics).toEqual([]);
    expect(session.diagnostics).toEqual([]);
    return { doc, session };
  }

  it('the flat copy changes only the replaced spans', () => {
    const { doc, session } = build();
    // The positive Hopf link (closure of σ₁²): V = −t^{1/2} − t^{5/2} (from memory), span 2, writhe 2.
    expect(flatText(doc, session.fills)).toBe(
      '\\documentclass{article}\n\\usepackage{amsmath}\\RequirePackage{array}\\AtBeginDocument{\\providecommand\\operatorname[1]{\\mathop{\\mathrm{#1}}\\nolimits}\\providecommand\\mathbb[1]{\\mathbf{#1}}\\providecommand\\texorpdfstring[2]{#1}}\n\n\\begin{document}\n' +
        '\\begin{flushleft}\\ttfamily\n1 1% Hopf\n\\end{flushleft}\n' +
        'Values: $-t^{5/2} - t^{1/2}$, $w = 2$, claimed $2$.\n' +
        '\\begin{tabular}{ll}\nId & span\\\\\nh & \\ensuremath{2} \\\\\n\\end{tabular}\n\\end{document}\n',
    );
  });

  it('the flat copy splices included files in place, \\include between page breaks', () => {
    const doc = read({
      'paper.tex': 'A\\input{one}B\n\\include{two}\nC\n',
      'one.tex': 'one % no newline at the end',
      'two.tex': '\\begin{skeincode}{id=k, notation=braid}\n1 1 1\n\\end{skeincode}\n$\\skeinwrithe{k}$\n',
    });
    const session = runSession({ diagrams: doc.diagrams, claims: [], fills: doc.fills.map((f) => f.entry), convention: DEFAULT_CONVENTION });
    expect(flatText(doc, session.fills)).toBe(
      'Aone % no newline at the end\nB\n\\clearpage\n\\begin{flushleft}\\ttfamily\n1 1 1\n\\end{flushleft}\n$3$\n\\clearpage\n\nC\n',
    );
  });

  it('a fill-in in a document without diagrams is told how LaTeX declares one', () => {
    const doc = read({ 'paper.tex': PREAMBLE + '\\skeinjones{k}\n\\end{document}\n' });
    const session = runSession({ diagrams: doc.diagrams, claims: [], fills: doc.fills.map((f) => f.entry), convention: DEFAULT_CONVENTION });
    expect(session.diagnostics.map((d) => d.ruleId)).toEqual(['target-unknown']);
    expect(session.diagnostics[0]!.hints!.join(' ')).toContain('a `skeincode` environment (LaTeX)');
  });

  it('the sidecar holds one definition per value, named as the package reads them', () => {
    const { doc, session } = build();
    // MD5 of the manuscript as in RFC 1321, here computed by the md5sum tool of GNU coreutils for the same bytes.
    const md5 = execFileSync('md5sum', { input: PAPER, encoding: 'utf8' }).split(' ')[0]!.toUpperCase();
    expect(sidecarText(doc, session.fills).split('\n').slice(2)).toEqual([
      `\\skein@source{paper.tex}{${md5}}`,
      '\\skein@value{h}{jones}{m}{-t^{5/2} - t^{1/2}}',
      '\\skein@value{h}{writhe}{m}{2}',
      '\\skein@cell{1}{2}{2}{m}{2}',
      '',
    ]);
  });
});

// TeX expands a macro by putting its arguments in place of #1…#9 in its body (The TeXbook, ch. 20), dropping the
// braces of a braced argument; an undelimited argument without braces is one token. \newcommand's [n][default]
// gives the first of n parameters a default when no [optional] argument follows (LaTeX manual, common practice).
describe("the author's macros with parameters", () => {
  const MACROS =
    '\\newcommand\\jonesof[2]{\\skeinclaim{#1}{jones}{#2}}\n' + // 1
    '\\newcommand{\\J}[1]{$V(#1) = \\skeinjones{#1}$}\n' + // 2
    '\\newcommand\\val[2][jones]{\\skeinvalue{#2}{#1}}\n' + // 3
    '\\def\\writheof#1#2{\\skeinclaim{#1}{writhe}{#2}}\n' + // 4
    '\\NewDocumentCommand\\spanof{O{span} m}{\\skeinvalue{#2}{#1}}\n' + // 5
    '\\newcommand\\trefclaim[1]{\\jonesof{tref}{#1}}\n'; // 6: a macro using another

  it('reads the markup of a definition at each use, located at the arguments written there', () => {
    const doc = read({
      'paper.tex':
        MACROS +
        'A $V = \\jonesof{tref}{t + t^3 - t^4}$ and \\jonesof{eight}{1}.\n' + // 7
        '\\J{tref}, \\val{tref}, \\val[writhe]{tref}, \\writheof{tref}{3}, \\writheof k3, \\spanof{tref}, \\spanof[jones]{k}.\n' + // 8
        '\\trefclaim{t+t^3-t^4}\n', // 9
    });
    expect(doc.diagnostics).toEqual([]);
    expect(doc.claims.map((c) => `${c.target} ${c.key} ${c.text} ${c.locate().start.line}:${c.locate().start.column}`)).toEqual([
      'tref jones t + t^3 - t^4 7:23',
      'eight jones 1 7:59',
      'tref writhe 3 8:59',
      'k writhe 3 8:74', // \writheof k3: the tokens k and 3
      'tref jones t+t^3-t^4 9:12', // through \trefclaim and \jonesof, still at the argument written in line 9
    ]);
    expect(doc.fills.map((f) => `${f.entry.target} ${f.entry.key} ${f.entry.locate().start.line}:${f.entry.locate().start.column}`)).toEqual([
      'tref jones 8:1', // a fill-in from the body is located at the whole use
      'tref jones 8:11',
      'tref writhe 8:23',
      'tref span 8:77',
      'k jones 8:92',
    ]);
    // The definitions themselves hold no value to check: nothing is read, nothing is warned about there.
    expect(doc.fills.every((f) => f.target.kind === 'macro' && f.target.anyMode === true)).toBe(true);
  });

  it('a mistake in the body is reported at each use, one in an argument where it is written', () => {
    const doc = read({
      'paper.tex': '\\newcommand\\bad[1]{\\skeinclaim{#1}{jonse}{t}}\n\\newcommand\\C[2]{\\skeinclaim{#1}{jones}{#2}}\nx \\bad{k}\n\\C{no id}{t}\n',
    });
    expect(places(doc)).toEqual(['latex-key-unknown@paper.tex:3:3', 'latex-id-invalid@paper.tex:4:4']);
  });

  it('the flat copy puts each use\'s expansion in its place, with the values filled in a form for text and math', () => {
    const files = {
      'paper.tex':
        '\\usepackage{skeinproof}\n\\newcommand\\jonesof[2]{\\skeinclaim{#1}{jones}{#2}}\n\\newcommand\\J[1]{\\skeinjones{#1}}\n' +
        '\\newcommand\\Rel[1]{\\relax#1}\n\\begin{document}\n\\begin{skeincode}{id=tref, notation=braid}\n1 1 1\n\\end{skeincode}\n' +
        '$V = \\jonesof{tref}{t + t^3 - t^4}$, \\J{tref} and $\\J{tref}$.\n',
    };
    const doc = read(files);
    expect(doc.diagnostics).toEqual([]);
    const session = runSession({ diagrams: doc.diagrams, claims: doc.claims, fills: doc.fills.map((f) => f.entry), convention: DEFAULT_CONVENTION });
    const flat = flatText(doc, session.fills).split('\n');
    // The definitions stay (the claim's is reduced to its value); each use becomes its expansion.
    expect(flat[1]).toBe('\\newcommand\\jonesof[2]{#2}');
    expect(flat[2]).toBe('\\newcommand\\J[1]{\\skeinjones{#1}}');
    // The positive trefoil (from memory): V = t + t^3 - t^4.
    expect(flat[8]).toBe('$V = t + t^3 - t^4$, \\ensuremath{t + t^3 - t^4} and $\\ensuremath{t + t^3 - t^4}$.');
  });

  it('an expansion keeps control words apart from the letters around it, as TeX reads them', () => {
    const doc = read({
      'paper.tex': '\\newcommand\\C[2]{\\skeinclaim{#1}{writhe}{#2}\\relax}\n\\newcommand\\D[1]{\\relax#1\\skeinclaim{k}{span}{2}}\n\\C{k}{3}x \\C{k}{3} y\\D{z}\n',
    });
    expect(doc.diagnostics).toEqual([]);
    const flat = flatText(doc, []).split('\n');
    expect(flat[2]).toBe('3\\relax x 3\\relax{} y\\relax z2');
  });

  it('parameters written in ways skeinproof does not expand get a warning at the markup', () => {
    const doc = read({
      'paper.tex': '\\def\\D#1.{\\skeinjones{#1}}\n\\newcommand{\\W}{\\skeinvalue{k}{##1}}\n\\NewDocumentCommand\\E{s m}{\\skeinjones{#2}}\n\\D k. \\E{k}\n',
    });
    expect(places(doc)).toEqual(['latex-macro-parameter@paper.tex:1:11', 'latex-macro-parameter@paper.tex:2:17', 'latex-macro-parameter@paper.tex:3:28']);
    expect(doc.diagnostics[0]!.message).toContain('parameters of \\D');
    expect(doc.diagnostics.map((d) => d.severity)).toEqual(['warning', 'warning', 'warning']);
    expect(doc.fills).toEqual([]);
  });

  it('a use missing an argument, and a macro that uses itself, are errors at the use', () => {
    const missing = read({ 'paper.tex': '\\newcommand\\C[2]{\\skeinclaim{#1}{jones}{#2}}\nx \\C{k}\n\nnext paragraph\n' });
    expect(places(missing)).toEqual(['latex-argument-missing@paper.tex:2:3']);
    const loop = read({ 'paper.tex': '\\newcommand\\R[1]{\\skeinjones{#1}\\R{#1}}\n\\R{k}\n' });
    expect(places(loop)).toEqual(['latex-macro-loop@paper.tex:2:1']);
  });

  it('naming a macro (\\let, \\show) is not a use of it', () => {
    const doc = read({ 'paper.tex': '\\newcommand\\C[2]{\\skeinclaim{#1}{jones}{#2}}\n\\let\\Cold\\C\n{k}{t}\n\\show\\C\n' });
    expect(doc.diagnostics).toEqual([]);
    expect(doc.claims).toEqual([]);
  });

  it('macros defined in an \\input file are expanded after it, and a macro may \\input a file named by its argument', () => {
    const doc = read({
      'paper.tex': '\\input{macros}\n\\newcommand\\chapterfile[1]{\\input{parts/#1}}\n\\jonesof{k}{t}\n\\chapterfile{one}\n',
      'macros.tex': '\\newcommand\\jonesof[2]{\\skeinclaim{#1}{jones}{#2}}\n',
      'parts/one.tex': '\\jonesof{m}{1}\n',
    });
    expect(doc.diagnostics).toEqual([]);
    expect(doc.claims.map((c) => `${c.target} ${c.locate().file.replace('/paper/', '')}:${c.locate().start.line}:${c.locate().start.column}`)).toEqual([
      'k paper.tex:3:13',
      'm parts/one.tex:1:13',
    ]);
  });
});

// LaTeX finds a package or class first in the directory it runs in, the paper's (kpathsea searches `.` first:
// common practice), so an author's mymacros.sty beside the paper is what \usepackage{mymacros} loads.
describe("the author's own package and class files", () => {
  it('a convention given where an own package loads skeinproof is read, and its macros are expanded (@ is a letter there)', () => {
    const doc = read({
      'paper.tex': '\\documentclass{article}\n\\usepackage{amsmath,mymacros}\n\\begin{document}\n\\jonesof{k}{q^2}\n\\end{document}\n',
      'mymacros.sty':
        '\\ProvidesPackage{mymacros}\n\\RequirePackage[jones=q, order=descending]{skeinproof}\n' +
        '\\newcommand\\my@claim[3]{\\skeinclaim{#1}{#2}{#3}}\n\\newcommand\\jonesof[2]{\\my@claim{#1}{jones}{#2}}\n\\def\\x{\\iffalse{\\fi}\n',
      'skeinproof.sty': '\\skeinconvention{jones=t}\n', // the package itself, copied beside the paper, is not read
    });
    expect(doc.diagnostics).toEqual([]);
    expect(doc.convention).toEqual({ jonesVariable: 'q', termOrder: 'descending' });
    expect(doc.files.map((f) => f.displayPath)).toEqual(['/paper/paper.tex', '/paper/mymacros.sty']);
    expect(doc.claims.map((c) => `${c.target} ${c.text} ${c.locate().start.line}:${c.locate().start.column}`)).toEqual(['k q^2 4:13']);
    expect(doc.packageLoadedBy).toMatchObject({ file: '/paper/mymacros.sty', start: { line: 2 } });
  });

  it('a class file beside the paper is read too; each package once', () => {
    const doc = read({
      'paper.tex': '\\documentclass{knotpaper}\n\\usepackage{extra}\n\\usepackage{extra}\n\\begin{document}\n\\end{document}\n',
      'knotpaper.cls': '\\LoadClass{article}\n\\RequirePackage[signature=positive]{skeinproof}\n',
      'extra.sty': '\\newcommand\\E[1]{\\skeinjones{#1}}\n',
    });
    expect(doc.diagnostics).toEqual([]);
    expect(doc.convention).toEqual({ signatureSign: 'positive' });
    expect(doc.files.map((f) => f.displayPath)).toEqual(['/paper/paper.tex', '/paper/knotpaper.cls', '/paper/extra.sty']);
  });

  it('a document whose package load is nowhere to be read is warned about, naming the convention assumed', () => {
    const doc = read({
      'paper.tex':
        '\\documentclass{article}\n\\usepackage{elsewhere}\n\\begin{document}\n\\begin{skeincode}{id=k, notation=braid}\n1 1 1\n\\end{skeincode}\n\\end{document}\n',
    });
    expect(places(doc)).toEqual(['latex-package-unseen@paper.tex:1:1']);
    expect(doc.diagnostics[0]!.severity).toBe('warning');
    expect(doc.diagnostics[0]!.message).toContain('the default one was assumed (jones=t, bracket=unit, order=ascending, half-powers=power, signature=negative');
    // A fragment (no \documentclass), or a document that declares its convention itself, is not warned about.
    expect(read({ 'paper.tex': '\\begin{skeincode}{id=k, notation=braid}\n1 1 1\n\\end{skeincode}\n' }).diagnostics).toEqual([]);
  });
});


describe('part-signs on a DT skeincode (6 8 -4 2: the trefoil with a kink, the closure of σ₁³σ₂ with writhe +4; common practice)', () => {
  const paper = (signs: string) =>
    `${PREAMBLE}\\begin{skeincode}{id=kinked, notation=dt, part-signs={${signs}}, writhe=4}\n6 8 -4 2\n\\end{skeincode}\n\\end{document}\n`;
  const session = (doc: LatexDocument) => runSession({ diagrams: doc.diagrams, claims: doc.claims, fills: doc.fills.map((f) => f.entry), convention: DEFAULT_CONVENTION });
  it('fixes the kink as the author says, so the claim agrees without a warning', () => {
    const doc = read({ 'paper.tex': paper('+ +') });
    expect(doc.diagnostics).toEqual([]);
    expect(doc.diagrams[0]!.partSigns?.text).toBe('+ +');
    expect(session(doc).diagnostics).toEqual([]);
  });
  it('contradicts the claim when the author fixes the other kink sign, and points into the attribute when it is malformed', () => {
    expect(session(read({ 'paper.tex': paper('+ -') })).diagnostics.map((d) => d.ruleId)).toEqual(['claim-contradicted']);
    const bad = session(read({ 'paper.tex': paper('+') }));
    expect(bad.diagnostics.map((d) => `${d.ruleId}@${d.location!.start.line}`)).toEqual(['choice-invalid@4', 'target-invalid@4']);
    expect(bad.diagnostics[0]!.message).toContain('2 independent parts');
  });
});
