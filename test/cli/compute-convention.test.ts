import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const root = fileURLToPath(new URL('../..', import.meta.url));
const run = (...args: string[]) => spawnSync(process.execPath, ['bin/skeinproof.js', ...args], { cwd: root, encoding: 'utf8', timeout: 30_000 });

describe('compute prints the declared convention beside the reference values', () => {
  it('positive Hopf link with t^(1/2) = −q: V = q + q^5 (from −t^(1/2) − t^(5/2), Jones 1985; the substitution is common practice with Khovanov gradings)', () => {
    const result = run('compute', '-n', 'braid', '1 1', '--convention', 'jones=q-graded');
    expect(result.status).toBe(0);
    expect(result.stdout).toContain('V(t) = -t^(1/2) - t^(5/2)');
    expect(result.stdout).toContain('V(q) = q + q^5');
  });
  it('positive trefoil with ⟨O⟩ = −A² − A⁻²: the unit bracket times the loop value (Kauffman 1987)', () => {
    const result = run('compute', '-n', 'braid', '1 1 1', '--convention', 'bracket=loop');
    expect(result.status).toBe(0);
    // (A^-7 − A^-3 − A^5)·(−A^2 − A^-2) = −A^-5 − A^-9 + A^-1 + A^-5 + A^7 + A^3 = −A^-9 + A^-1 + A^3 + A^7.
    expect(result.stdout).toContain('<D> = -A^(-9) + A^(-1) + A^3 + A^7');
  });
  it('prints no extra lines in the default convention', () => {
    expect(run('compute', '-n', 'braid', '1 1 1').stdout).not.toContain('declared');
  });
});

describe('compute honours the declared term order in its declared lines', () => {
  it('positive trefoil, order=descending: V = −t^4 + t^3 + t (the terms of t + t³ − t⁴, Jones 1985, highest power first)', () => {
    const result = run('compute', '-n', 'braid', '1 1 1', '--convention', 'order=descending');
    expect(result.status).toBe(0);
    expect(result.stdout).toContain('declared (jones=t, order=descending)  V(t) = -t^4 + t^3 + t');
    expect(result.stdout).toContain('declared (bracket=unit, order=descending)  <D> = -A^5 - A^(-3) + A^(-7)');
  });
});
