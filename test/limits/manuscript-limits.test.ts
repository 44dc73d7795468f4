/**
 * A diagram over a limit is reported with its id, its size and the option that
 * raises the limit, and the rest of the manuscript is still checked.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { skeinproof } from '../markdown/cli.ts';

const work = mkdtempSync(join(tmpdir(), 'skeinproof-limits-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

const giant = Array.from({ length: 1200 }, (_, i) => (i % 2 === 0 ? '1' : '-2')).join(' ');
const paper = join(work, 'paper.md');
writeFileSync(
  paper,
  [
    '```skein id=giant notation=braid',
    giant,
    '```',
    '',
    '```skein id=tref notation=braid',
    '1 1 1',
    '```',
    '',
    // Positive trefoil: V = t + t³ − t⁴ (Jones 1985; from memory), so this claim is wrong.
    'The trefoil has $V =$ :jones[$t + t^3 + t^4$]{of=tref} and the giant :writhe[$0$]{of=giant}.',
    '',
  ].join('\n'),
);

describe('limits in a manuscript', () => {
  it('reports the giant diagram and still checks the rest', () => {
    const r = skeinproof(['check', paper]);
    expect(r.status).toBe(2);
    expect(r.stdout).toContain('diagram `giant`: the code has 1,200 crossings, more than the limit of 1,000');
    expect(r.stdout).toContain('--max-crossings 1200');
    expect(r.stdout).toContain('[limit-exceeded]');
    expect(r.stdout).toContain('wrong Jones polynomial'); // the trefoil's claim is judged
    expect(r.stdout).toMatch(/is not checked: `giant` is over a limit and was not computed/);
  });

  it('computes the diagram once the limit is raised', () => {
    const r = skeinproof(['check', paper, '--max-crossings', '1200']);
    expect(r.stdout).not.toContain('[limit-exceeded]');
    expect(r.stdout).toContain('wrong Jones polynomial');
    expect(r.status).toBe(1);
  });

  it('compute reports a code over the limit and computes the others', () => {
    const r = skeinproof(['compute', '-n', 'braid', '--json', giant, '1 1 1']);
    expect(r.status).toBe(2);
    const [first, second] = r.stdout.trim().split('\n').map((line) => JSON.parse(line));
    expect(first.error.ruleId).toBe('limit-exceeded');
    expect(second.crossings).toBe(3);
    expect(r.stderr).toContain('--max-crossings 1200');
  });

  it('refuses a limit that is not a positive number', () => {
    const r = skeinproof(['compute', '-n', 'braid', '--time-budget', '0', '1 1 1']);
    expect(r.status).toBe(2);
    expect(r.stderr).toContain('--time-budget needs a positive number');
  });
});
