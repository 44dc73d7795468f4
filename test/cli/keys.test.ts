/** `compute --json --keys`: only the fields asked for are computed and printed. */
import { describe, expect, it } from 'vitest';
import { skeinproof } from '../markdown/cli.ts';
import { JSON_FIELDS } from '../../src/cli/compute-json.ts';
import { randomAlternatingBraidWord, rng } from '../support/random-diagrams.ts';

const json = (stdout: string) => stdout.trim().split('\n').map((line) => JSON.parse(line) as Record<string, unknown>);

describe('compute --keys', () => {
  it('prints only the fields asked for, beside the code, notation, chirality and family', () => {
    const r = skeinproof(['compute', '-n', 'braid', '--json', '--keys', 'jones,determinant', '1 1 1']);
    expect(r.status).toBe(0);
    const [trefoil] = json(r.stdout);
    expect(Object.keys(trefoil!).filter((key) => JSON_FIELDS.includes(key)).sort()).toEqual(['determinant', 'jones']);
    expect(trefoil).toHaveProperty('code', '1 1 1');
    // Positive trefoil: V = t + t³ − t⁴, det = 3 (from memory).
    expect(trefoil!['jones']).toEqual({ variable: 't', terms: [[1, '1'], [3, '1'], [4, '-1']] });
    expect(trefoil!['determinant']).toBe('3');
  });

  it('computes only those fields: a determinant is given for a diagram whose bracket is over the memory limit', () => {
    // A 10-strand alternating closure: its bracket needs more than 1 MiB of states, det only a Goeritz matrix.
    const wide = randomAlternatingBraidWord(rng(16), 10, 200).join(' ');
    const limit = ['--max-state-memory', '1'];
    const all = skeinproof(['compute', '-n', 'braid', '--json', ...limit, wide]);
    expect(all.status).toBe(2);
    expect(json(all.stdout)[0]!['notComputed']).toHaveProperty('jones');
    const r = skeinproof(['compute', '-n', 'braid', '--json', ...limit, '--keys', 'determinant,crossings', wide]);
    expect(r.status).toBe(0);
    const [row] = json(r.stdout);
    expect(row!['crossings']).toBe(200);
    expect(row!['determinant']).toMatch(/^\d+$/);
    expect(row).not.toHaveProperty('notComputed');
  });

  it('refuses an unknown field, naming the known ones, and --keys without --json', () => {
    const unknown = skeinproof(['compute', '-n', 'braid', '--json', '--keys', 'jonez', '1 1 1']);
    expect(unknown.status).toBe(2);
    expect(unknown.stderr).toContain('unknown field jonez');
    expect(unknown.stderr).toContain('determinant');
    expect(skeinproof(['compute', '-n', 'braid', '--keys', 'jones', '1 1 1']).stderr).toContain('add --json');
  });
});
