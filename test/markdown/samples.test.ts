/**
 * End to end on the two samples: the clean manuscript passes and builds to
 * the golden Markdown and HTML; the copy with planted slips fails with exactly
 * the planted errors, each at its line.
 */
import { mkdtempSync, readFileSync, rmSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { ROOT, skeinproof } from './cli.ts';
import { expectGolden } from './golden.ts';

const GOOD = 'samples/twists-and-weaves.md';
const SLIPS = 'samples/twists-and-weaves-slips.md';
const work = mkdtempSync(join(tmpdir(), 'skeinproof-samples-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

/** `line:column` of `token` on the first line of `file` that contains `lineNeedle`. */
function placeOf(file: string, lineNeedle: string, token: string): string {
  const lines = readFileSync(join(ROOT, file), 'utf8').split('\n');
  const i = lines.findIndex((l) => l.includes(lineNeedle));
  if (i < 0 || !lines[i]!.includes(token)) throw new Error(`${lineNeedle} / ${token} not in ${file}`);
  return `${i + 1}:${lines[i]!.indexOf(token) + 1}`;
}

describe('the clean sample', () => {
  it('passes check with no diagnostics at all', () => {
    const r = skeinproof(['check', GOOD]);
    // The sample has 14 skein blocks and 2 codes written in table rows, 9 prose and 7 header claims, 10 prose fill-ins,
    // and 60 table cells under claim columns (26 written, 34 empty): 16 + 26 = 42 claims, 10 + 34 = 44 values; 3 `::drawing` figures.
    expect(r.stdout).toBe('checked 16 diagrams: 42 claims agree, 44 values filled, 3 figures; table cells: 60 checked or filled\nno problems found\n');
    expect(r.status).toBe(0);
  });

  it('builds to the golden Markdown, changing only the substituted spans', () => {
    const out = join(work, 'good.md');
    const r = skeinproof(['build', GOOD, '-o', out]);
    expect(r.status).toBe(0);
    expect(r.stdout).toBe(`wrote ${out}\n`);
    expectGolden('twists-and-weaves.filled.md', readFileSync(out, 'utf8'));
  });

  it('builds to the golden HTML page', () => {
    const out = join(work, 'good.html');
    const r = skeinproof(['build', GOOD, '-o', out]);
    expect(r.status).toBe(0);
    expectGolden('twists-and-weaves.html', readFileSync(out, 'utf8'));
  });
});

describe('the sample with planted slips', () => {
  it('fails with exactly the planted errors, at their lines', () => {
    const r = skeinproof(['check', '--format', 'json', SLIPS]);
    // An invalid code is unusable input: exit status 2 (README `markdown`).
    expect(r.status).toBe(2);
    const report = JSON.parse(r.stdout) as { diagnostics: { severity: string; ruleId: string; location: { start: { line: number; column: number } } }[] };
    const errors = report.diagnostics.filter((d) => d.severity === 'error').map((d) => `${d.ruleId}@${d.location.start.line}:${d.location.start.column}`);
    expect(errors).toEqual([
      `claim-contradicted@${placeOf(SLIPS, 'id=twist-5 crossing-number=6', '6')}`, // above the diagram's own 5 crossings
      `claim-contradicted@${placeOf(SLIPS, 't^{-1} + t^{-3} - t^{-4}', '$t^{-1}')}`, // the mirror image's polynomial
      `claim-contradicted@${placeOf(SLIPS, 't^{3} + t^{5} - t^{6}', '$t^{3}')}`, // every exponent shifted by one
      `code-invalid@${placeOf(SLIPS, '(6,4,1,7)', '3,5)')}`, // label 3 left alone once 7 replaced it
      `id-duplicate@${placeOf(SLIPS, 'id=weave-2-pd notation=dt', 'weave-2-pd')}`, // the second use of the id
      `claim-contradicted@${placeOf(SLIPS, '1 + t + t^{2}', '$t^{-2}')}`, // the sign of t dropped
      `claim-unreadable@${placeOf(SLIPS, 't^{3$', '{3$')}`, // an unclosed brace
      `claim-contradicted@${placeOf(SLIPS, '| weave-4 | $8$', '$6$')}`, // crossing number 6 below span 8
    ]);
    expect(report.diagnostics.filter((d) => d.severity === 'warning')).toEqual([]);
  });

  it('reports them as text with carets (the README quotes this output)', () => {
    const r = skeinproof(['check', SLIPS]);
    expect(r.status).toBe(2);
    expectGolden('twists-and-weaves-slips.check.txt', r.stdout);
  });

  it('writes nothing unless --force-write asks', () => {
    const out = join(work, 'slips.md');
    const refused = skeinproof(['build', SLIPS, '-o', out]);
    expect(refused.status).toBe(2);
    expect(refused.stderr).toContain('nothing written because the check failed');
    expect(existsSync(out)).toBe(false);
    const forced = skeinproof(['build', SLIPS, '-o', out, '--force-write', '--format', 'json']);
    expect(forced.status).toBe(2);
    expect(forced.stdout).toBe(`wrote ${out}\n`);
    expectGolden('twists-and-weaves-slips.filled.md', readFileSync(out, 'utf8'));
  });
});

describe('the README', () => {
  it('quotes the failing check verbatim', () => {
    const readme = readFileSync(join(ROOT, 'README.md'), 'utf8');
    const golden = readFileSync(join(ROOT, 'test/golden/markdown/twists-and-weaves-slips.check.txt'), 'utf8');
    expect(readme).toContain('````text\n' + golden + '````');
  });
});
