import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

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
  it('checks classical claims from the command line, in the declared signature sign', () => {
    const agrees = skeinproof('compute', '--notation', 'braid', '1 1 1', '--claim', 'signature=2', '--claim', 'determinant=3', '--convention', 'signature=positive');
    expect(agrees.status).toBe(0);
    const wrong = skeinproof('compute', '--notation', 'braid', '1 1 1', '--claim', 'alexander=t^2-t+1');
    expect(wrong.status).toBe(1);
    expect(wrong.stdout + wrong.stderr).toMatch(/wrong Alexander polynomial/);
  });
});
