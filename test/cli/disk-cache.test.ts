/**
 * The disk cache through the command line: output is the same byte for byte
 * with and without it (cold and warm, Markdown and LaTeX, clean manuscripts and
 * ones with slips), a warm run writes no entry (nothing is recomputed), the
 * same diagram written differently hits the stored values, a mirror image or a
 * switched crossing misses, and damaged entries are recomputed and rewritten.
 * The expected values are the uncached runs' (the project's own engines, whose
 * tests check them against published values); Jones of the positive trefoil,
 * t + t³ − t⁴, is from memory (Jones 1985).
 */
import { spawnSync } from 'node:child_process';
import { cpSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { temporaryDirs } from '../support/temporary-dirs.ts';

const root = fileURLToPath(new URL('../..', import.meta.url));
const freshDir = temporaryDirs('skein-cache-cli-');

function skeinproof(cwd: string, ...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const result = spawnSync(process.execPath, [join(root, 'bin/skeinproof.js'), ...args], { cwd, encoding: 'utf8', timeout: 60_000 });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

/** Each entry file of the cache with its inode: a rewritten entry gets a new inode (temporary file + rename). */
function entries(cache: string): Map<string, number> {
  const found = new Map<string, number>();
  const top = join(cache, 'entries');
  for (const shard of readdirSync(top, { withFileTypes: true }).filter((e) => e.isDirectory())) {
    for (const name of readdirSync(join(top, shard.name))) found.set(join(shard.name, name), statSync(join(top, shard.name, name)).ino);
  }
  return found;
}

/** Runs `args` without the cache, with an empty cache and with the filled cache; returns the three runs and the cache. */
function threeRuns(cwd: string, read: () => string, ...args: string[]) {
  const cache = join(freshDir(), 'cache');
  const uncached = skeinproof(cwd, ...args, '--no-cache');
  const uncachedOutput = read();
  const cold = skeinproof(cwd, ...args, '--cache-dir', cache);
  const coldOutput = read();
  const before = entries(cache);
  const warm = skeinproof(cwd, ...args, '--cache-dir', cache);
  return { uncached, cold, warm, outputs: [uncachedOutput, coldOutput, read()], before, after: entries(cache), cache };
}

describe('disk cache (command line)', () => {
  for (const sample of ['twists-and-weaves.md', 'twists-and-weaves-slips.md', 'torus-and-pretzel.md']) {
    it(`gives byte-identical check reports (and builds) with and without the cache, and recomputes nothing warm: ${sample}`, () => {
      const dir = freshDir();
      cpSync(join(root, 'samples', sample), join(dir, sample));
      const output = join(dir, 'out.md');
      const check = threeRuns(dir, () => '', 'check', sample, '--format', 'json');
      expect(check.cold).toEqual(check.uncached);
      expect(check.warm).toEqual(check.uncached);
      expect(check.before.size).toBeGreaterThan(0);
      expect(check.after).toEqual(check.before);
      if (sample !== 'twists-and-weaves.md') return;
      const build = threeRuns(dir, () => readFileSync(output, 'utf8'), 'build', sample, '-o', 'out.md', '--force-write');
      expect(build.cold.stderr).toBe(build.uncached.stderr);
      expect(build.warm.stderr).toBe(build.uncached.stderr);
      expect(build.outputs[1]).toBe(build.outputs[0]);
      expect(build.outputs[2]).toBe(build.outputs[0]);
      expect(build.after).toEqual(build.before);
    });
  }

  it('gives the same LaTeX sidecar and report with and without the cache, and recomputes nothing warm', () => {
    const dir = freshDir();
    cpSync(join(root, 'samples', 'latex'), dir, { recursive: true });
    for (const paper of ['rope-atlas.tex', join('slips', 'rope-atlas.tex')]) {
      const sidecar = join(dir, paper.replace(/\.tex$/, '.skein.tex'));
      const run = threeRuns(dir, () => readFileSync(sidecar, 'utf8'), 'build', paper, '--force-write');
      expect(run.cold.stderr).toBe(run.uncached.stderr);
      expect(run.warm.stderr).toBe(run.uncached.stderr);
      expect(run.outputs[1]).toBe(run.outputs[0]);
      expect(run.outputs[2]).toBe(run.outputs[0]);
      expect(run.before.size).toBeGreaterThan(0);
      expect(run.after).toEqual(run.before);
    }
  });

  it('hits for the same diagram written differently and misses for the mirror image and a switched crossing', () => {
    const dir = freshDir();
    const cache = join(dir, 'cache');
    const json = (code: string, notation = 'braid') => {
      const run = skeinproof(dir, 'compute', '--json', '--keys', 'jones,alexander,determinant,signature', '-n', notation, code, '--cache-dir', cache);
      expect(run.stderr).toBe('');
      const { jones, alexander, determinant, signature } = JSON.parse(run.stdout) as Record<string, unknown>;
      return JSON.stringify({ jones, alexander, determinant, signature });
    };
    const word = '1 2 -1 2 2 -3 2 1';
    const values = json(word);
    const filled = entries(cache);
    expect(filled.size).toBe(1); // one entry for the diagram: its bracket, Δ, det and σ
    // Rotations of the word (conjugates) close up to the same diagram; so does its PD code, with the tuples in reverse order.
    expect(json('2 -1 2 2 -3 2 1 1')).toBe(values);
    expect(json('-3 2 1 1 2 -1 2 2')).toBe(values);
    expect(entries(cache)).toEqual(filled);
    // The mirror image (every generator inverted) and one switched crossing are other diagrams.
    json('-1 -2 1 -2 -2 3 -2 -1');
    expect(entries(cache).size).toBe(2);
    json('1 2 1 2 2 -3 2 1');
    expect(entries(cache).size).toBe(3);
    // The positive trefoil from memory (Jones 1985), then its PD code with relabelled edges hits its entries.
    expect(JSON.parse(json('1 1 1')).jones).toEqual({ variable: 't', terms: [[1, '1'], [3, '1'], [4, '-1']] });
    const size = entries(cache).size;
    expect(JSON.parse(json('(12,16,13,15) (16,14,11,13) (14,12,15,11)', 'pd')).jones).toEqual({ variable: 't', terms: [[1, '1'], [3, '1'], [4, '-1']] });
    expect(entries(cache).size).toBe(size);
  });

  it('recomputes and rewrites damaged entries, with the same output', () => {
    const dir = freshDir();
    cpSync(join(root, 'samples', 'twists-and-weaves.md'), join(dir, 'paper.md'));
    const cache = join(dir, 'cache');
    const first = skeinproof(dir, 'check', 'paper.md', '--cache-dir', cache);
    const filled = entries(cache);
    let k = 0;
    for (const name of filled.keys()) {
      const path = join(cache, 'entries', name);
      const text = readFileSync(path, 'utf8');
      // Truncate one, change a character in the next, swap in a neighbour's entry in the third.
      writeFileSync(path, k % 3 === 0 ? text.slice(0, text.length - 1) : k % 3 === 1 ? text.replace(/\d(?=[^\d]*$)/, (d) => String((Number(d) + 1) % 10)) : readFileSync(join(cache, 'entries', [...filled.keys()][0]!)));
      k++;
    }
    const damaged = entries(cache);
    const second = skeinproof(dir, 'check', 'paper.md', '--cache-dir', cache);
    expect(second).toEqual(first);
    const rewritten = entries(cache);
    for (const [name, inode] of damaged) expect(rewritten.get(name)).not.toBe(inode);
    const third = skeinproof(dir, 'check', 'paper.md', '--cache-dir', cache);
    expect(third).toEqual(first);
    expect(entries(cache)).toEqual(rewritten);
  });

  it('gives the same compute --json objects and batch output with and without the cache, boundary width included', () => {
    const dir = freshDir();
    const cache = join(dir, 'cache');
    // A braid closure, its PD code with the tuples reversed (numbered differently, so its own boundary width), a link.
    const codes = [['braid', '1 2 -1 2 2 -3 2 1 -3'], ['braid', '1 -2 1 -2'], ['pd', '(1,5,2,4) (3,1,4,6) (5,3,6,2)'], ['pd', '(5,3,6,2) (3,1,4,6) (1,5,2,4)'], ['braid', '1 1 1 1']];
    for (const [notation, code] of codes) {
      const args = ['compute', '--json', '-n', notation!, code!];
      const uncached = skeinproof(dir, ...args, '--no-cache');
      expect(uncached.status).toBe(0);
      expect(skeinproof(dir, ...args, '--cache-dir', cache)).toEqual(uncached);
      expect(skeinproof(dir, ...args, '--cache-dir', cache)).toEqual(uncached);
    }
    const input = join(dir, 'census.jsonl');
    writeFileSync(input, codes.map(([notation, code], k) => JSON.stringify({ id: `k${k}`, notation, code })).join('\n') + '\n');
    const batchCache = join(dir, 'batch-cache');
    const uncached = skeinproof(dir, 'batch', 'census.jsonl', '--jobs', '2', '--no-cache');
    expect(uncached.status).toBe(0);
    expect(skeinproof(dir, 'batch', 'census.jsonl', '--jobs', '2', '--cache-dir', batchCache)).toEqual(uncached);
    const filled = entries(batchCache);
    expect(filled.size).toBeGreaterThan(0);
    expect(skeinproof(dir, 'batch', 'census.jsonl', '--jobs', '1', '--cache-dir', batchCache)).toEqual(uncached);
    expect(entries(batchCache)).toEqual(filled);
  });

  it('reads and writes no cache with --no-cache, and refuses --cache-dir given twice', () => {
    const dir = freshDir();
    const cache = join(dir, 'cache');
    skeinproof(dir, 'compute', '-n', 'braid', '1 1 1', '--no-cache', '--cache-dir', cache);
    expect(readdirSync(dir)).toEqual([]);
    const twice = skeinproof(dir, 'compute', '-n', 'braid', '1 1 1', '--cache-dir', cache, '--cache-dir', cache);
    expect(twice.status).toBe(2);
    expect(twice.stderr).toContain('--cache-dir is given 2 times');
  });
});
