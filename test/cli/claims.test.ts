/**
 * `compute --claim`: claims about codes given on the command line. Values from
 * memory (Jones 1985): V(positive trefoil) = t + t³ − t⁴, V(4₁) = t⁻² − t⁻¹ + 1 − t + t²,
 * V(positive Hopf) = −t^{1/2} − t^{5/2}.
 */
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const root = fileURLToPath(new URL('../..', import.meta.url));

function skeinproof(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const result = spawnSync(process.execPath, ['bin/skeinproof.js', ...args], { cwd: root, encoding: 'utf8', timeout: 30_000 });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

const claimsOf = (stdout: string): Record<string, unknown>[][] =>
  stdout
    .trim()
    .split('\n')
    .map((line) => (JSON.parse(line) as { claims: Record<string, unknown>[] }).claims);

describe('skeinproof compute --claim', () => {
  it('adds the verdicts with their diagnoses to the JSON object and exits 1 on a contradiction', () => {
    const run = skeinproof(
      'compute', '--json', '-n', 'braid', '1 1 1',
      '--claim', 'jones=t + t^3 - t^4',
      '--claim', 'jones=-t^{-4}+t^{-3}+t^{-1}',
      '--claim', 'span=3',
      '--claim', 'alternating=yes',
      '--claim', 'crossing-number=\\le 3',
    );
    expect(run.stderr).toBe('');
    expect(run.status).toBe(1);
    const [claims] = claimsOf(run.stdout);
    expect(claims!.map((c) => [c['key'], c['verdict']])).toEqual([
      ['jones', 'agrees'],
      ['jones', 'contradicts'],
      ['span', 'agrees'],
      ['alternating', 'agrees'],
      ['crossing-number', 'agrees'],
    ]);
    expect(claims![0]).toMatchObject({ claimed: 't + t^3 - t^4', diagnosis: null });
    expect(claims![1]).toMatchObject({ diagnosis: { kind: 'mirror' } });
    expect(typeof claims![1]!['reason']).toBe('string');
  });
  it('exits 0 when every claim agrees', () => {
    const run = skeinproof('compute', '-n', 'braid', '1 -2 1 -2', '--claim', 'jones=t^{-2} - t^{-1} + 1 - t + t^2', '--claim', 'writhe=0');
    expect(run.status).toBe(0);
    expect(run.stdout).toContain('jones = t^{-2} - t^{-1} + 1 - t + t^2: agrees');
  });
  it('prints the human report with a caret under the wrong value in plain mode', () => {
    const run = skeinproof('compute', '-n', 'braid', '1 1 1', '--claim', 'jones=t+t^3+t^4');
    expect(run.status).toBe(1);
    const lines = run.stdout.split('\n');
    const head = lines.findIndex((l) => l.startsWith('<code 1 claim 1>:1:7: error: wrong Jones polynomial'));
    expect(head).toBeGreaterThan(0);
    expect(lines[head + 1]).toBe(' 1 | jones=t+t^3+t^4');
    expect(lines[head + 2]).toBe('   |       ^~~~~~~~~');
    expect(run.stdout).not.toContain('\u001b['); // not a terminal: no colour
  });
  it('reads claims in the convention given with --convention (t = q², so V(Hopf) = −q − q⁵)', () => {
    const run = skeinproof('compute', '--json', '-n', 'braid', '1 1', '--convention', 'jones=q', '--claim', 'jones=-q-q^5');
    expect(run.status).toBe(0);
    expect(claimsOf(run.stdout)[0]![0]).toMatchObject({ verdict: 'agrees', computed: '-q - q^5' });
  });
  it('warns on an undecided crossing number, and fails on it only with --strict', () => {
    const args = ['compute', '-n', 'braid', '1 1 1 -2 -1 -1 -1 -2', '--claim', 'crossing-number=7'];
    const plain = skeinproof(...args);
    expect(plain.status).toBe(0);
    expect(plain.stdout).toMatch(/warning: crossing number claim undecided: .*between 6 and 8/);
    expect(skeinproof(...args, '--strict').status).toBe(1);
  });
  it('lets the mirror value of a DT code agree with a warning, which fails only with --strict (DT codes fix a knot up to mirror image: common practice; V(left trefoil) = t⁻¹ + t⁻³ − t⁻⁴, from memory)', () => {
    const args = ['compute', '-n', 'dt', '4 6 2', '--claim', 'jones=t^{-1}+t^{-3}-t^{-4}'];
    const plain = skeinproof(...args);
    expect(plain.status).toBe(0);
    expect(plain.stdout).toMatch(/warning: .*\[claim-mirror-only\]/);
    expect(skeinproof(...args, '--strict').status).toBe(1);
    const json = skeinproof(...args, '--json');
    // The code is read as its mirror image for every claim about it, so the computed value is the mirror's.
    expect(claimsOf(json.stdout)[0]![0]).toMatchObject({ verdict: 'agrees', diagnosis: { kind: 'mirror' }, computed: '-t^{-4} + t^{-3} + t^{-1}' });
    expect(plain.stdout).toContain('part-signs="-"');
  });
  it('judges a DT code against every realisation it allows: the trefoil with a positive kink, 6 8 -4 2, has writhe 4 (the closure of σ₁³σ₂, common practice: a DT code does not say to which side a kink loops)', () => {
    const run = skeinproof('compute', '--json', '-n', 'dt', '--claim', 'writhe=4', '--', '6 8 -4 2');
    expect(run.status).toBe(0);
    const [object] = run.stdout.trim().split('\n').map((line) => JSON.parse(line) as Record<string, unknown>);
    expect((object!['claims'] as Record<string, unknown>[])[0]).toMatchObject({ verdict: 'agrees', computed: '4' });
    expect(String((object!['claims'] as Record<string, unknown>[])[0]!['warning'])).toContain('the kink at entry 3 positive');
    const open = object!['openChoices'] as { parts: unknown[]; dependentFields: string[] };
    expect(open.parts).toEqual([
      { entries: [1, 2, 4], kink: false, sign: 1 },
      { entries: [3], kink: true, sign: -1 },
    ]);
    expect(open.dependentFields).toEqual(expect.arrayContaining(['writhe', 'bracket', 'jones', 'signature']));
    expect(open.dependentFields).not.toContain('determinant');
    expect(open.dependentFields).not.toContain('crossingNumber');
    // Two values that need different kink signs cannot both hold for one code.
    const both = skeinproof('compute', '-n', 'dt', '--claim', 'writhe=4', '--claim', 'writhe=2', '--', '6 8 -4 2');
    expect(both.status).toBe(1);
    expect(both.stdout).toContain('[claim-choice-conflict]');
  });
  it('exits 2 for an unreadable claim and points at the bad character', () => {
    const run = skeinproof('compute', '-n', 'braid', '1 1 1', '--claim', 'jones=t + x');
    expect(run.status).toBe(2);
    expect(run.stdout).toContain('<code 1 claim 1>:1:11: error: unknown variable `x`');
  });
  it('exits 2 with a usage message for an unknown key or convention', () => {
    const badKey = skeinproof('compute', '-n', 'braid', '1 1 1', '--claim', 'colour=red');
    expect(badKey.status).toBe(2);
    expect(badKey.stderr).toMatch(/unknown claim key `colour`/);
    const badConvention = skeinproof('compute', '-n', 'braid', '1 1 1', '--convention', 'order=sideways');
    expect(badConvention.status).toBe(2);
    expect(badConvention.stderr).toMatch(/ascending, descending/);
  });
  it('says a claim that does not apply is not applicable, not unreadable, and exits 2', () => {
    const run = skeinproof('compute', '-n', 'braid', '1 1 1', '--claim', 'linking=1');
    expect(run.status).toBe(2);
    expect(run.stdout).toContain('    linking = 1: not applicable');
    expect(run.stdout).toContain('[claim-inapplicable]');
  });
  it('reads crossing-number claims as authors write them (c(3₁) = 3, from memory)', () => {
    const run = skeinproof('compute', '--json', '-n', 'braid', '1 1 1', '--claim', 'crossing-number=c(K) \\le 7', '--claim', 'crossing_number=3 \\le c(K) \\le 5');
    expect(run.status).toBe(0);
    const [claims] = claimsOf(run.stdout);
    expect(claims!.map((c) => [c['key'], c['verdict']])).toEqual([
      ['crossing-number', 'agrees'],
      ['crossing-number', 'agrees'],
    ]);
  });
  it('names another code of the same run as the source of a swapped value', () => {
    const run = skeinproof('compute', '--json', '-n', 'braid', '1 1 1', '1 -2 1 -2', '--claim', 'jones=t + t^3 - t^4');
    const [first, second] = claimsOf(run.stdout);
    expect(first![0]).toMatchObject({ verdict: 'agrees' });
    expect(second![0]).toMatchObject({ verdict: 'contradicts', diagnosis: { kind: 'swapped', otherDiagram: '<code 1>' } });
  });
});
