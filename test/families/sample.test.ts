/**
 * The sample note on torus and pretzel knots: with true claims `check --strict`
 * passes (the crossing numbers proven by Murasugi's and Lickorish–
 * Thistlethwaite's theorems, one resting on a cited source), and a wrong
 * crossing number for T(3, 4) fails the build. c(T(3, 4)) = 8 is from Murasugi
 * 1991 (min(3·3, 4·2)); c(P(−2, 3, 7)) = 12 from memory (the knot 12n242).
 */
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { ROOT, skeinproof } from '../markdown/cli.ts';

const SAMPLE = join(ROOT, 'samples', 'torus-and-pretzel.md');
const dir = mkdtempSync(join(tmpdir(), 'skeinproof-families-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('samples/torus-and-pretzel.md', () => {
  it('passes check --strict, with the cited claim counted in the summary', () => {
    const run = skeinproof(['check', '--strict', SAMPLE]);
    expect(run.status).toBe(0);
    expect(run.stdout).toContain('[claim-cited]');
    expect(run.stdout).toContain('1 claim rests on a cited source');
  });
  it('fails the build when the crossing number of T(3, 4) is claimed to be 7, naming Murasugi', () => {
    const text = readFileSync(SAMPLE, 'utf8');
    const wrong = join(dir, 'wrong.md');
    writeFileSync(wrong, text.replace('```skein id=t34 notation=family crossing-number=8', '```skein id=t34 notation=family crossing-number=7'));
    const run = skeinproof(['check', wrong]);
    expect(run.status).toBe(1);
    expect(run.stdout).toMatch(/wrong crossing number: the crossing number is 8, so it is not 7, by Murasugi's theorem on torus knots/);
    const build = skeinproof(['build', wrong, '-o', join(dir, 'out.md')]);
    expect(build.status).toBe(1);
  });
  it('without its source the undecided claim fails under --strict', () => {
    const text = readFileSync(SAMPLE, 'utf8');
    const unsourced = join(dir, 'unsourced.md');
    writeFileSync(unsourced, text.replace(' (source: the table in our appendix)', ''));
    const run = skeinproof(['check', '--strict', unsourced]);
    expect(run.status).toBe(1);
    expect(run.stdout).toContain('[claim-undecided]');
  });
});
