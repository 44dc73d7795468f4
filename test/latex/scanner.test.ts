/**
 * Reading LaTeX the way TeX does: comments, verbatim, math modes, arguments,
 * key=value options and tabular cells. The rules checked are TeX's own
 * (category codes of %, $, &, \ and braces; \verb and verbatim bodies read
 * as typed; alignment cells ending at & and \\) — common practice, and
 * cross-checked against real pdflatex runs in tex.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { maskLatex } from '../../plugins/latex/mask.ts';
import { scanLatex, type ScanItem } from '../../plugins/latex/scanner.ts';
import { readKeyValues } from '../../plugins/latex/key-values.ts';
import { splitTabular } from '../../plugins/latex/tabular.ts';

function scan(text: string) {
  return scanLatex(maskLatex(text));
}

function fills(text: string): { id: string; math: boolean }[] {
  return scan(text)
    .items.filter((i): i is Extract<ScanItem, { kind: 'fill' }> => i.kind === 'fill')
    .map((f) => ({ id: f.id.text, math: f.math }));
}

describe('comments (TeX: % starts a comment unless escaped as \\%)', () => {
  it('ignores markup after an unescaped %', () => {
    expect(fills('a % \\skeinjones{x}\n\\skeinjones{y}')).toEqual([{ id: 'y', math: false }]);
  });
  it('only skeinproof\'s own macro names are fill-ins', () => {
    expect(fills('\\constructor{x} \\toString{y} \\skeinjonesx{z} \\Skeinjones{w}')).toEqual([]);
  });
  it('\\% is a percent sign, so what follows is read', () => {
    expect(fills('50\\% of \\skeinjones{x}')).toEqual([{ id: 'x', math: false }]);
  });
  it('\\\\% is a line break followed by a comment', () => {
    expect(fills('row \\\\% \\skeinjones{x}\n')).toEqual([]);
  });
  it('keeps offsets and line breaks when masking', () => {
    const text = 'a % c\n\\verb|x|\nZ';
    const masked = maskLatex(text);
    expect(masked.length).toBe(text.length);
    expect(masked.split('\n').length).toBe(3);
    expect(masked.indexOf('Z')).toBe(text.indexOf('Z'));
    expect(masked).not.toContain('c');
    expect(masked).not.toContain('x');
  });
  it('a comment inside an argument hides the rest of its line', () => {
    const claim = scan('\\skeinclaim{k}{jones}{t % not + 5\n - t^2}').items[0] as Extract<ScanItem, { kind: 'claim' }>;
    expect(claim.value.text.replace(/\s+/g, ' ')).toBe('t - t^2');
  });
});

describe('verbatim (TeX prints these bodies as typed)', () => {
  it('skips verbatim, lstlisting and comment environments and resumes after them', () => {
    for (const env of ['verbatim', 'verbatim*', 'lstlisting', 'comment']) {
      expect(fills(`\\begin{${env}}\n\\skeinjones{x}\n\\end{${env}} \\skeinjones{y}`)).toEqual([{ id: 'y', math: false }]);
    }
  });
  it('skips \\verb with any delimiter, starred or not', () => {
    expect(fills('\\verb|\\skeinjones{x}| \\verb*+\\skeinjones{z}+ \\skeinjones{y}')).toEqual([{ id: 'y', math: false }]);
  });
  it('skips spaces before the delimiter and the [options] of \\lstinline, as LaTeX and listings do', () => {
    // pdflatex (TeX Live 2022) hid h1 to h4 and warned about k1 to k4 for this line.
    const line = '\\verb |\\skeinjones{h1}| \\verb*  !\\skeinjones{h2}! \\lstinline[language=TeX]|\\skeinjones{h3}| \\skeinjones{k1} ' +
      '\\lstinline[basicstyle=\\ttfamily] !\\skeinjones{h4}! \\skeinjones{k2}';
    expect(fills(line)).toEqual([{ id: 'k1', math: false }, { id: 'k2', math: false }]);
  });
  it('a % inside \\verb is not a comment', () => {
    expect(fills('\\verb|%| \\skeinjones{y}')).toEqual([{ id: 'y', math: false }]);
  });
});

describe('switched-off passages (TeX skips \\iffalse … \\fi, counting nested conditionals)', () => {
  it('skips to the matching \\fi and reads on', () => {
    expect(fills('\\iffalse \\skeinjones{a} \\ifnum1=1 \\skeinjones{b}\\fi \\skeinjones{c} \\fi \\skeinjones{d}')).toEqual([{ id: 'd', math: false }]);
  });
  it('reads the \\else branch', () => {
    expect(fills('\\iffalse \\skeinjones{a} \\else \\skeinjones{b} \\fi')).toEqual([{ id: 'b', math: false }]);
  });
  it('\\iftrue … \\else … \\fi reads the first branch and skips the \\else branch, counting nested conditionals', () => {
    expect(fills('\\iftrue \\skeinjones{a} \\ifx\\x\\y \\else \\fi \\else \\skeinjones{b} \\iffalse\\fi \\skeinjones{c} \\fi \\skeinjones{d}')).toEqual([
      { id: 'a', math: false },
      { id: 'd', math: false },
    ]);
    expect(fills('\\iftrue \\skeinjones{a} \\fi \\skeinjones{b}')).toEqual([{ id: 'a', math: false }, { id: 'b', math: false }]);
  });
  it('a \\fi in a comment does not end the passage', () => {
    expect(fills('\\iffalse % \\fi\n \\skeinjones{a} \\fi \\skeinjones{b}')).toEqual([{ id: 'b', math: false }]);
  });
});

describe('math modes', () => {
  it('knows math from text at every fill-in', () => {
    const text = [
      '\\skeinjones{a}',
      '$\\skeinjones{b}$',
      '\\(\\skeinjones{c}\\)',
      '\\[\\skeinjones{d}\\]',
      '$$\\skeinjones{e}$$',
      '\\begin{equation}\\skeinjones{f}\\end{equation}',
      '\\begin{align*}x &= \\skeinjones{g}\\end{align*}',
      '$\\text{see \\skeinjones{h}}$',
      '\\$ \\skeinjones{i}',
      '$x$ \\skeinjones{j}',
      '\\ensuremath{\\skeinjones{k}}',
    ].join('\n');
    expect(fills(text)).toEqual([
      { id: 'a', math: false },
      { id: 'b', math: true },
      { id: 'c', math: true },
      { id: 'd', math: true },
      { id: 'e', math: true },
      { id: 'f', math: true },
      { id: 'g', math: true },
      { id: 'h', math: false },
      { id: 'i', math: false },
      { id: 'j', math: false },
      { id: 'k', math: true },
    ]);
  });
});

describe('arguments', () => {
  it('reads nested braces and arguments on the next line', () => {
    const [claim] = scan('\\skeinclaim{k}\n  {jones}{t^{-1} + {t}^{2}}').items as Extract<ScanItem, { kind: 'claim' }>[];
    expect(claim!.id.text).toBe('k');
    expect(claim!.key.text).toBe('jones');
    expect(claim!.value.text).toBe('t^{-1} + {t}^{2}');
  });
  it('a missing argument is a located problem, not a crash', () => {
    const text = 'x \\skeinclaim{k}{jones} y';
    const { problems } = scan(text);
    expect(problems).toHaveLength(1);
    expect(problems[0]!.ruleId).toBe('latex-argument-missing');
    expect(problems[0]!.span.start).toBe(text.indexOf('\\skeinclaim'));
    expect(problems[0]!.message).toContain('value is missing');
  });
  it('an argument whose brace never closes is one problem, at the brace', () => {
    const text = 'ok \\skeinclaim{a}{jones}{t + (t';
    expect(scan(text).problems.map((p) => [p.ruleId, p.span.start])).toEqual([['latex-brace-unbalanced', text.lastIndexOf('{')]]);
  });
  it('options in brackets get their own explanation, and the environment\'s \\end is not called stray', () => {
    const { problems } = scan('\\begin{skeincode}[id=a, notation=pd]\n[1,1,2,2]\n\\end{skeincode}');
    expect(problems.map((p) => p.ruleId)).toEqual(['latex-argument-missing']);
    expect(problems[0]!.message).toContain('in braces, not brackets');
  });
  it('an unclosed skeincode environment is located at its \\begin', () => {
    const text = 'intro\n\\begin{skeincode}{id=a, notation=braid}\n1 1 1\n';
    const { problems, items } = scan(text);
    // Its options are still handed on, to be checked and to name the diagram that is refused.
    expect(items.map((i) => i.kind === 'unclosed-code' && i.options.text)).toEqual(['id=a, notation=braid']);
    expect(problems.map((p) => [p.ruleId, p.span.start])).toEqual([['latex-environment-unclosed', text.indexOf('\\begin')]]);
  });
  it('reads a code environment with exact offsets of options and body', () => {
    const text = '\\begin{skeincode}{id=t, notation=braid}\n1 1 1\n\\end{skeincode}';
    const code = scan(text).items[0] as Extract<ScanItem, { kind: 'code' }>;
    expect(text.slice(code.options.start, code.options.end)).toBe('id=t, notation=braid');
    expect(text.slice(code.body.start, code.body.end)).toBe('\n1 1 1\n');
    expect(code.endSpan.end).toBe(text.length);
  });
  it('spaces before the braces of \\begin and \\end are allowed, as LaTeX allows them', () => {
    // pdflatex (TeX Live 2022) typesets `\begin {skeincode} {…} … \end {skeincode}` as one environment.
    const text = '\\begin {skeincode} {id=t, notation=braid}\n1 1 1\n\\end {skeincode} after';
    const { items, problems } = scan(text);
    expect(problems).toEqual([]);
    const code = items[0] as Extract<ScanItem, { kind: 'code' }>;
    expect(text.slice(code.body.start, code.body.end)).toBe('\n1 1 1\n');
    expect(text.slice(code.endSpan.start, code.endSpan.end)).toBe('\\end {skeincode}');
  });
  it('knows which fill-ins are in section titles (hyperref makes bookmarks of them), short titles too', () => {
    const text = '\\section*[Short \\skeinjones{a}]{Long \\skeinjones{b} $\\skeinspan{c}$} \\skeinjones{d} \\caption{\\skeinjones{e}} \\subsection {\\skeinwrithe{f}}';
    const inTitle = scan(text).items.flatMap((i) => (i.kind === 'fill' ? [[i.id.text, i.inTitle]] : []));
    expect(inTitle).toEqual([['a', true], ['b', true], ['c', true], ['d', false], ['e', false], ['f', true]]);
  });
  it('finds \\input with braces and in the bare form', () => {
    const paths = scan('\\input{a/b}\n\\input c.tex\n\\include{d}')
      .items.filter((i) => i.kind === 'input')
      .map((i) => (i.kind === 'input' ? [i.command, i.path.text] : []));
    expect(paths).toEqual([
      ['input', 'a/b'],
      ['input', 'c.tex'],
      ['include', 'd'],
    ]);
  });
});

describe('key=value options (keyval rules: commas outside braces, one brace pair stripped)', () => {
  it('splits at top-level commas and keeps exact offsets', () => {
    const text = 'id=k, jones={t + t^{3}, x}, crossing-number = {\\le 5} ,';
    const kvs = readKeyValues({ text, start: 10, end: 10 + text.length });
    expect(kvs.map((kv) => [kv.key, kv.value?.text])).toEqual([
      ['id', 'k'],
      ['jones', 't + t^{3}, x'],
      ['crossing-number', '\\le 5'],
    ]);
    const jones = kvs[1]!.value!;
    expect(text.slice(jones.start - 10, jones.end - 10)).toBe('t + t^{3}, x');
  });
});

describe('tabular cells (TeX alignment: & ends a cell, \\\\ a row)', () => {
  const body = (text: string) => splitTabular({ text: maskLatex(text), start: 0, end: text.length });
  const cells = (text: string) => body(text).map((r) => r.cells.map((c) => c.content.text));

  it('splits rows and cells, skipping rules and optional row skips', () => {
    const text = '\\hline A & B \\\\[2pt] \\cline{1-2}\n a & \\\\* \\toprule\n & c \\\\ \\hline';
    expect(cells(text)).toEqual([
      ['A', 'B'],
      ['a', ''],
      ['', 'c'],
    ]);
  });
  it('does not split at \\&, inside braces or inside nested environments', () => {
    const text = 'R\\&D & {x & y} & \\begin{tabular}{c} p & q \\\\ r \\end{tabular} \\\\';
    expect(cells(text)).toEqual([['R\\&D', '{x & y}', '\\begin{tabular}{c} p & q \\\\ r \\end{tabular}']]);
  });
  it('counts a last row without \\\\ and none after a final \\\\', () => {
    expect(body('a & b \\\\ c & d').map((r) => r.number)).toEqual([1, 2]);
    expect(body('a & b \\\\ c & d \\\\ \n').map((r) => r.number)).toEqual([1, 2]);
    expect(body('a \\\\ \\\\ b \\\\').map((r) => r.cells.length)).toEqual([1, 1, 1]);
  });
  it('colortbl: \\rowcolor opens a row like a rule, \\cellcolor typesets nothing in its cell', () => {
    expect(cells('\\rowcolor[gray]{0.9} a & \\cellcolor{red} \\\\ b & \\cellcolor[rgb]{1,0,0} 3 \\\\')).toEqual([
      ['a', ''],
      ['b', '3'],
    ]);
  });
  it('a comment in a cell is not part of it', () => {
    expect(cells('a & % b & c\n d \\\\')).toEqual([['a', 'd']]);
  });
});
