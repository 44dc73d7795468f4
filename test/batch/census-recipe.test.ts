/**
 * The README's census recipe, run for real with GNU parallel (Debian's `parallel`):
 * shard the JSON Lines, run `batch` on each shard in parallel, merge in shard order.
 * The merged output must equal one `batch` run over the whole input.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { ROOT } from '../markdown/cli.ts';
import { randomBraidWord, rng } from '../support/random-diagrams.ts';

const hasParallel = spawnSync('parallel', ['--version'], { encoding: 'utf8' }).status === 0;
const work = mkdtempSync(join(tmpdir(), 'skeinproof-census-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

describe.skipIf(!hasParallel)('the census recipe with GNU parallel (skipped when `parallel` is not installed)', () => {
  it('shards, computes in parallel and merges to the same output as one run', () => {
    const random = rng(7);
    const census = Array.from({ length: 40 }, (_, k) => JSON.stringify({ id: `c${k}`, notation: 'braid', code: randomBraidWord(random, 3, 8 + (k % 5)).join(' '), keys: 'jones,determinant' }));
    writeFileSync(join(work, 'census.jsonl'), `${census.join('\n')}\n`);
    const bin = join(ROOT, 'bin', 'skeinproof.js');
    // The recipe, as the README gives it (with the clone's bin in place of the installed command).
    const recipe = [
      'split -n l/4 -d census.jsonl shard-',
      `parallel --will-cite -j 2 '${bin} batch {} --jobs 1 > {}.out' ::: shard-??`,
      'cat shard-??.out > census.out',
    ].join(' && ');
    execFileSync('bash', ['-c', recipe], { cwd: work, stdio: 'pipe' });
    const single = spawnSync(process.execPath, [bin, 'batch', 'census.jsonl', '--jobs', '1'], { cwd: work, encoding: 'utf8' });
    expect(single.status).toBe(0);
    expect(readFileSync(join(work, 'census.out'), 'utf8')).toBe(single.stdout);
    expect(single.stdout.trim().split('\n')).toHaveLength(40);
  });
});
