/**
 * A pass says what it checked: the human report prints the session's counts before the summary line, JSON
 * carries them as `checked`, and several files are summed. (Counts come from the session; see
 * test/markdown/unchecked-claims.test.ts for how they are counted.)
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { checkedLine, formatHumanReport, formatJsonReport } from '../../src/report/index.ts';
import { skeinproof } from '../markdown/cli.ts';

const counts = { diagrams: 2, claimsAgree: 1, claimsContradicted: 0, claimsUndecided: 0, valuesFilled: 3, tableCells: 2, notApplicable: 1, figures: 0 };

describe('the checked line', () => {
  it('names diagrams, claims by verdict, filled values and table cells', () => {
    expect(checkedLine(counts)).toBe('checked 2 diagrams: 1 claim agrees, 3 values filled; table cells: 2 checked or filled, 1 not applicable');
    expect(checkedLine({ ...counts, diagrams: 1, claimsAgree: 4, claimsContradicted: 2, claimsUndecided: 1, tableCells: 0, notApplicable: 0 })).toBe(
      'checked 1 diagram: 4 claims agree, 2 contradicted, 1 undecided, 3 values filled',
    );
    expect(checkedLine({ ...counts, figures: 1 })).toBe('checked 2 diagrams: 1 claim agrees, 3 values filled, 1 figure; table cells: 2 checked or filled, 1 not applicable');
  });

  it('comes before the summary in the human report and as `checked` in JSON', () => {
    expect(formatHumanReport([], { checked: counts })).toBe(`${checkedLine(counts)}\nno problems found\n`);
    expect(JSON.parse(formatJsonReport([], { checked: counts })).checked).toEqual(counts);
  });
});

describe('check on the command line', () => {
  const dir = mkdtempSync(join(tmpdir(), 'skeinproof-checked-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('sums the files, and an unmarked file is a warning, not a bare pass', () => {
    const marked = join(dir, 'marked.md');
    const plain = join(dir, 'plain.md');
    const paper = join(dir, 'paper.tex');
    writeFileSync(marked, '```skein id=k notation=braid\n1 1 1\n```\n\nIts writhe is :writhe[$3$]{of=k} and V is :jones{of=k}.\n');
    writeFileSync(plain, '# Notes\n\nNo markup here.\n');
    writeFileSync(paper, '\\documentclass{article}\n\\usepackage{skeinproof}\n\\begin{document}\nNothing marked.\n\\end{document}\n');
    const text = skeinproof(['check', marked, plain, paper]);
    expect(text.status).toBe(0);
    expect(text.stdout).toContain(`${plain}:1:1: warning: this manuscript has no skeinproof markup, so nothing in it was checked [manuscript-unmarked]`);
    expect(text.stdout).toContain(`${paper}:1:1: warning: this manuscript has no skeinproof markup`);
    expect(text.stdout.endsWith('checked 1 diagram: 1 claim agrees, 1 value filled\n0 errors, 2 warnings\n')).toBe(true);
    const json = JSON.parse(skeinproof(['check', '--format', 'json', marked, marked]).stdout);
    expect(json.checked).toEqual({ diagrams: 2, claimsAgree: 2, claimsContradicted: 0, claimsUndecided: 0, valuesFilled: 2, tableCells: 0, notApplicable: 0, figures: 0 });
    expect(skeinproof(['check', '--strict', plain]).status).toBe(1);
  });

  it('counts the figures of both formats, and not one whose diagram is missing', () => {
    const drawn = join(dir, 'drawn.md');
    const paper = join(dir, 'drawn.tex');
    writeFileSync(drawn, '```skein id=k notation=braid\n1 1 1\n```\n\n::drawing[Trefoil]{of=k}\n\n::drawing{of=k size=3cm}\n\n::drawing{of=nowhere}\n');
    writeFileSync(
      paper,
      '\\documentclass{article}\n\\usepackage{skeinproof}\n\\begin{document}\n\\begin{skeincode}{id=k, notation=braid}\n1 1 1\n\\end{skeincode}\n\\skeindrawing{k}\n\\end{document}\n',
    );
    const text = skeinproof(['check', drawn]);
    expect(text.stdout).toContain('checked 1 diagram: 0 claims agree, 0 values filled, 2 figures\n');
    const json = JSON.parse(skeinproof(['check', '--format', 'json', drawn, paper]).stdout);
    expect(json.checked).toMatchObject({ diagrams: 2, figures: 3 });
  });
});
