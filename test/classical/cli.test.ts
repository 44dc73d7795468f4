import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { PLAIN_CLASSICAL_LIMIT } from '../../src/cli/commands/compute.ts';

const root = fileURLToPath(new URL('../..', import.meta.url));

function skeinproof(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const result = spawnSync(process.execPath, ['bin/skeinproof.js', ...args], { cwd: root, encoding: 'utf8', timeout: 30_000 });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

describe('compute --json: the classical keys', () => {
  it('gives trefoil, Hopf link and figure-eight values in the same term format as jones (values from memory)', () => {
    const { status, stdout, stderr } = skeinproof('compute', '--json', '--notation', 'braid', '1 1 1', '1 1', '1 -2 1 -2');
    expect(stderr).toBe('');
    expect(status).toBe(0);
    const [trefoil, hopf, figureEight] = stdout.trim().split('\n').map((line) => JSON.parse(line) as Record<string, unknown>);
    expect(trefoil).toMatchObject({
      alexander: { variable: 't', terms: [[-1, '1'], [0, '-1'], [1, '1']] },
      conway: { variable: 'z', terms: [[0, '1'], [2, '1']] },
      determinant: '3',
      signature: -2,
    });
    expect(hopf).toMatchObject({
      alexander: { variable: 't', terms: [[-0.5, '-1'], [0.5, '1']] },
      conway: { variable: 'z', terms: [[1, '1']] },
      determinant: '2',
      signature: -1,
    });
    expect(figureEight).toMatchObject({ determinant: '5', signature: 0, conway: { variable: 'z', terms: [[0, '1'], [2, '-1']] } });
  });
  it('follow the declared signature sign in JSON and name it in signatureSign (σ(positive trefoil) = −2 in the default sign, from memory)', () => {
    const byDefault = skeinproof('compute', '--json', '--notation', 'braid', '1 1 1');
    expect(JSON.parse(byDefault.stdout)).toMatchObject({ signature: -2, signatureSign: 'negative' });
    const positive = skeinproof('compute', '--json', '--notation', 'braid', '1 1 1', '--convention', 'signature=positive');
    expect(positive.status).toBe(0);
    expect(JSON.parse(positive.stdout)).toMatchObject({ signature: 2, signatureSign: 'positive', determinant: '3' });
  });
  it('are shown in the plain output, the signature in the declared sign (trefoil values from memory; g(3₁) = 1)', () => {
    const { status, stdout } = skeinproof('compute', '--notation', 'braid', '1 1 1', '1 -2 1 -2');
    expect(status).toBe(0);
    expect(stdout).toContain('  Alexander Δ(t) = t^(-1) - 1 + t  (Conway normalisation)\n  Conway   ∇(z) = 1 + z^2\n  det      3, signature -2  (sign convention: positive trefoil -2)\n');
    expect(stdout).toMatch(/genus {4}1: span Δ and \|σ\| give at least 1, Seifert's algorithm on this diagram a surface of genus 1/);
    expect(stdout).toContain('Alexander Δ(t) = -t^(-1) + 3 - t'); // figure-eight
    const positive = skeinproof('compute', '--notation', 'braid', '1 1 1', '--convention', 'signature=positive');
    expect(positive.stdout).toContain('det      3, signature +2  (sign convention: positive trefoil +2)');
  });
  it('show a split diagram as Δ = ∇ = 0 and det 0 with no genus line (from memory: split links have Δ = 0)', () => {
    const { stdout } = skeinproof('compute', '--notation', 'braid', '--strands', '3', '1 1 1');
    expect(stdout).toContain('Alexander Δ(t) = 0  (Conway normalisation; 0 for a split link)');
    expect(stdout).toContain('det      0, signature -2');
    expect(stdout).not.toContain('genus');
  });
  it('leave them out of the plain summary of a diagram above the size limit, saying how to get them', () => {
    const word = Array.from({ length: PLAIN_CLASSICAL_LIMIT + 1 }, (_, k) => (k % 2 === 0 ? 1 : -2)).join(' ');
    const { status, stdout } = skeinproof('compute', '--notation', 'braid', word);
    expect(status).toBe(0);
    expect(stdout).toContain(`classical not shown above ${PLAIN_CLASSICAL_LIMIT} crossings`);
    expect(stdout).not.toContain('Alexander Δ(t)');
  });
  it('checks classical claims from the command line, in the declared signature sign', () => {
    const agrees = skeinproof('compute', '--notation', 'braid', '1 1 1', '--claim', 'signature=2', '--claim', 'determinant=3', '--convention', 'signature=positive');
    expect(agrees.status).toBe(0);
    const wrong = skeinproof('compute', '--notation', 'braid', '1 1 1', '--claim', 'alexander=t^2-t+1');
    expect(wrong.status).toBe(1);
    expect(wrong.stdout + wrong.stderr).toMatch(/wrong Alexander polynomial/);
  });
});
