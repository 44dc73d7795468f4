/**
 * A skeincode environment refused for its options (an unknown notation, a
 * bad strand count) is one error; a reference to its id is not a second
 * one ("no diagram has the id"), but a note pointing at the environment,
 * as for Markdown blocks (common practice: a compiler reports a mistake
 * once and does not cascade). Run through the CLI, as an author runs it.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, expect, it } from 'vitest';
import { skeinproof } from '../markdown/cli.ts';

const work = mkdtempSync(join(tmpdir(), 'skeinproof-latex-refused-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

it('a reference to a refused skeincode gets a note pointing at it, not an unknown-id error', () => {
  const paper = join(work, 'paper.tex');
  writeFileSync(
    paper,
    [
      '\\documentclass{article}', // 1
      '\\usepackage{skeinproof}', // 2
      '\\begin{document}', // 3
      '\\begin{skeincode}{id=k, notation=knotty}', // 4: `knotty` at column 34
      '1 1 1', // 5
      '\\end{skeincode}', // 6
      '\\begin{skeincode}{id=b, notation=pd, strands=2}', // 7: `2` at column 46
      '(1,4,2,5) (3,6,4,1) (5,2,6,3)', // 8
      '\\end{skeincode}', // 9
      'After \\skeinclaim{k}{writhe}{7} and \\skeinjones{b}.', // 10: `7` at 30, \skeinjones at 37
      '\\end{document}',
      '',
    ].join('\n'),
  );
  const r = skeinproof(['check', paper, '--format', 'json']);
  expect(r.status).toBe(2);
  const found = (JSON.parse(r.stdout) as { diagnostics: { severity: string; ruleId: string; message: string; location: { start: { line: number; column: number } } }[] }).diagnostics;
  expect(found.map((d) => `${d.severity} ${d.ruleId} ${d.location.start.line}:${d.location.start.column}`)).toEqual([
    'error latex-notation-unknown 4:34',
    'error latex-option-invalid 7:46',
    'note target-invalid 10:30',
    'note target-invalid 10:37',
  ]);
  expect(found[2]!.message).toBe(`the writhe claimed for \`k\` is not checked: the diagram \`k\` was refused (${paper}:4:1)`);
});

it('a skeincode never closed still has its options read, and a reference to it gets a note', () => {
  const paper = join(work, 'unclosed.tex');
  writeFileSync(
    paper,
    [
      '\\documentclass{article}', // 1
      '\\usepackage{skeinproof}', // 2
      '\\begin{document}', // 3
      'After \\skeinclaim{k}{writhe}{7}.', // 4: `7` at column 30
      '\\begin{skeincode}{id=k, notation=braid, bogus=1}', // 5: `bogus` at column 41
      '1 1 1', // 6
      '\\end{document}',
      '',
    ].join('\n'),
  );
  const r = skeinproof(['check', paper, '--format', 'json']);
  expect(r.status).toBe(2);
  const found = (JSON.parse(r.stdout) as { diagnostics: { severity: string; ruleId: string; location: { start: { line: number; column: number } } }[] }).diagnostics;
  expect(found.map((d) => `${d.severity} ${d.ruleId} ${d.location.start.line}:${d.location.start.column}`)).toEqual([
    'note target-invalid 4:30',
    'error latex-environment-unclosed 5:1',
    'error latex-key-unknown 5:41',
  ]);
});
