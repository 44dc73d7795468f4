/**
 * skeinproof reads manuscripts from regular files only: a named pipe in the
 * paper's folder would block a read forever (POSIX: opening a FIFO for reading
 * waits for a writer), so an \input of one, or a manuscript that is one, is a
 * located error at once. Run through the command line, as an author runs it.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, expect, it } from 'vitest';
import { skeinproof } from '../markdown/cli.ts';

const work = mkdtempSync(join(tmpdir(), 'skeinproof-latex-special-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

interface Found {
  diagnostics: { severity: string; ruleId: string; message: string; location: { file: string; start: { line: number; column: number } } }[];
}

it('an \\input of a named pipe is an error at the \\input, and the check ends', () => {
  execFileSync('mkfifo', [join(work, 'fifo.tex')]);
  const paper = join(work, 'paper.tex');
  writeFileSync(paper, '\\documentclass{article}\n\\usepackage{skeinproof}\n\\begin{document}\n\\input{fifo}\n\\end{document}\n');
  const r = skeinproof(['check', paper, '--format', 'json']);
  expect(r.status).toBe(2);
  const found = (JSON.parse(r.stdout) as Found).diagnostics;
  expect(found.map((d) => `${d.severity} ${d.ruleId} ${d.location.start.line}:${d.location.start.column}`)).toEqual(['error file-unreadable 4:8']);
  expect(found[0]!.message).toContain('fifo.tex is a named pipe, not a regular file');
});

it('a manuscript that is a named pipe is refused, not waited on', () => {
  const pipe = join(work, 'piped.tex');
  execFileSync('mkfifo', [pipe]);
  const r = skeinproof(['check', pipe, '--format', 'json']);
  expect(r.status).toBe(2);
  const found = (JSON.parse(r.stdout) as Found).diagnostics;
  expect(found.map((d) => d.ruleId)).toEqual(['file-unreadable']);
  expect(found[0]!.message).toContain('it is a named pipe, not a regular file');
});
