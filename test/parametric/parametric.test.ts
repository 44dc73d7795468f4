/**
 * Closed formulas checked instance by instance: Jones' torus-knot formula
 * (Jones 1987, Annals of Mathematics 126) with its exact quotient, the
 * determinant of the twist knots (2n + 1, from memory) and of the pretzel knots
 * P(3, 3, n) (|pq + qr + rp|, common practice), and formulas with an error
 * planted at one value of the parameter.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import { judgeClaim } from '../../src/core/claims/index.ts';
import { DEFAULT_CONVENTION } from '../../src/core/convention/convention.ts';
import { isInputError } from '../../src/core/errors.ts';
import { parseDiagramCode } from '../../src/core/notation/index.ts';
import { buildInstances, claimAt, evaluateArithmetic, judgeInstances, readParameter } from '../../src/core/parametric/parametric.ts';
import { skeinproof } from '../markdown/cli.ts';

const family = (code: string, setting: string) =>
  buildInstances(code, readParameter(setting), (c) => analyzeDiagram(parseDiagramCode(c, 'family')));
const check = (code: string, setting: string, key: string, formula: string) =>
  judgeInstances(family(code, setting), formula, (text, report) => judgeClaim(key, text, report, { convention: DEFAULT_CONVENTION }));

describe('reading the parameter and the formula', () => {
  it('reads ranges, steps and the default dozen', () => {
    expect(readParameter('n=3..11 step 2')).toEqual({ name: 'n', values: [3, 5, 7, 9, 11] });
    expect(readParameter('k = 2, 4, 7..9')).toEqual({ name: 'k', values: [2, 4, 7, 8, 9] });
    expect(readParameter('m').values).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12]);
    for (const bad of ['t=1..3', 'n=5..3', 'n=1..x', '=3', 'nn=2']) {
      expect(() => readParameter(bad), bad).toThrow();
    }
  });
  it('evaluates exponents and exact quotients at a value', () => {
    const p = readParameter('n=5');
    expect(claimAt('t^{(n-1)/2}\\frac{1 - t^{3} - t^{n+1} + t^{n+2}}{1-t^2}', p, 5)).toBe('t^{2}(1 + t^2 - t^3 + t^4 - t^5)');
    expect(claimAt('\\det = |9 + 6n|', p, -3)).toBe('\\det =9');
    expect(evaluateArithmetic('2(3+1) - 7/2')).toEqual([9n, 2n]);
    expect(evaluateArithmetic('2t')).toBeUndefined();
  });
});

describe("Jones' torus-knot formula across a range", () => {
  it('T(3, n) for n = 4, 7, …, 22: V = t^{(n−1)} (1 − t⁴ − t^{n+1} + t^{n+3})/(1 − t²) at every value', () => {
    const outcome = check('torus 3 n', 'n=4..22 step 3', 'jones', 'V(T(3,n)) = t^{(3-1)(n-1)/2}\\frac{1 - t^{4} - t^{n+1} + t^{n+3}}{1 - t^2}');
    expect(outcome.failingValue).toBeUndefined();
    expect(outcome.checked).toEqual([4, 7, 10, 13, 16, 19, 22]);
  });
  it('a slip in the numerator is caught at the first value, as a quotient that does not divide', () => {
    const outcome = check('torus 2 n', 'n=3..9 step 2', 'jones', 't^{(n-1)/2}\\frac{1 - t^{3} - t^{n+1} + t^{n+3}}{1-t^2}');
    expect(outcome.failingValue).toBe(3);
    expect(outcome.judgement.verdict).toBe('contradicts');
    expect(outcome.judgement.reason).toContain('does not divide exactly at n = 3');
  });
});

describe('determinants across a range', () => {
  it('twist knots: det = 2n + 1 for n = 1 … 12 (from memory)', () => {
    expect(check('twist n', 'n', 'determinant', '2n+1').failingValue).toBeUndefined();
  });
  it('pretzel knots P(3, 3, n), n odd: det = |9 + 6n| (common practice)', () => {
    expect(check('pretzel 3 3 n', 'n=-9..11 step 2', 'determinant', '|9 + 6n|').failingValue).toBeUndefined();
  });
  it('an error planted at n = 9 is reported there, with the diagnosis of that value', () => {
    // det T(2, n) = n; the planted term vanishes at n = 3, 5 and 7.
    const outcome = check('torus 2 n', 'n=3..13 step 2', 'determinant', 'n + (n-3)(n-5)(n-7)');
    expect(outcome.failingValue).toBe(9);
    expect(outcome.checked).toEqual([3, 5, 7, 9]);
    expect(outcome.judgement.verdict).toBe('contradicts');
    expect(outcome.judgement.computed).toBe('9');
  });
  it('a Jones formula with one coefficient planted wrong at one value gets the one-coefficient diagnosis there', () => {
    // V(T(2, n)) = t^{(n−1)/2}(1 + t² − t³ + … − t^n); the slip adds (n−3)(n−5)(n−7)·t^{n+5}, zero at n = 3, 5, 7 and one new term from n = 9 on.
    const outcome = check('torus 2 n', 'n=3..11 step 2', 'jones', 't^{(n-1)/2}\\frac{1 - t^{3} - t^{n+1} + t^{n+2}}{1-t^2} + (n-3)(n-5)(n-7)t^{n+5}');
    expect(outcome.failingValue).toBe(9);
    expect(outcome.judgement.diagnosis?.kind).toBe('one-coefficient');
  });
});

describe('in a manuscript', () => {
  const dir = mkdtempSync(join(tmpdir(), 'skeinproof-parametric-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));
  const run = (text: string) => {
    const file = join(dir, 'note.md');
    writeFileSync(file, text);
    return skeinproof(['check', file]);
  };
  it('a true formula gets a note saying which instances were checked; a false one fails at its first wrong value', () => {
    const ok = run('```skein id=tn notation=family for="n=3..25 step 2"\ntorus 2 n\n```\n\nSo :determinant[$n$]{of=tn}.\n');
    expect(ok.status).toBe(0);
    expect(ok.stdout).toContain('the formula agrees at each of the 12 values n = 3, 5, 7, …, 25; this checks these instances, not the formula for every n [claim-instances]');
    const bad = run('```skein id=tn notation=family for="n=3..25 step 2"\ntorus 2 n\n```\n\nSo :determinant[$n + (n-3)(n-5)$]{of=tn}.\n');
    expect(bad.status).toBe(1);
    expect(bad.stdout).toContain('the determinant formula at n = 7 (after it agreed at n = 3, 5): wrong determinant');
  });
  it('refuses a fill-in of a family with a parameter, a setting without the parameter in the code, and a value whose code is refused', () => {
    const fill = run('```skein id=tn notation=family for=n\ntorus 2 n\n```\n\n:jones{of=tn}\n');
    expect(fill.stdout).toContain('[parameter-invalid]');
    const unused = run('```skein id=tn notation=family for=k\ntorus 2 n\n```\n');
    expect(unused.stdout).toContain('does not use the parameter k');
    const zero = run('```skein id=tw notation=family for="k=-1..1"\ntwist k\n```\n');
    expect(zero.stdout).toContain('at k = 0');
    expect(zero.status).toBe(2);
  });
});

describe('errors', () => {
  it('a parameter that is a polynomial variable is refused', () => {
    try {
      readParameter('t=1..3');
      expect.unreachable();
    } catch (e) {
      if (!isInputError(e)) throw e;
      expect(e.ruleId).toBe('parameter-invalid');
    }
  });
});
