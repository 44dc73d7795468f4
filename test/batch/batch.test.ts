/**
 * `skeinproof batch`: JSON Lines in, one result per line out in input order,
 * byte-identical for any pool size; bad lines become error objects; `--resume`
 * redoes a truncated last line and skips the lines already written.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { ROOT } from '../markdown/cli.ts';
import { randomBraidWord, rng } from '../support/random-diagrams.ts';

const work = mkdtempSync(join(tmpdir(), 'skeinproof-batch-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

/** `poolAtOnce` starts the worker pool at the first line (normally small runs stay in one thread), so the pool is what is tested. */
function batch(args: readonly string[], input?: string, poolAtOnce = false) {
  const env = { ...process.env, ...(poolAtOnce ? { SKEINPROOF_POOL_AFTER_MS: '0' } : {}) };
  return spawnSync(process.execPath, [join(ROOT, 'bin', 'skeinproof.js'), 'batch', ...args], { cwd: work, encoding: 'utf8', input, env, timeout: 60_000 });
}

const random = rng(2024);
const lines = [
  JSON.stringify({ id: 'trefoil', notation: 'braid', code: '1 1 1', keys: 'jones,determinant,signature' }),
  'this is not JSON',
  JSON.stringify({ id: 'broken', notation: 'pd', code: '(1,2,3)' }),
  JSON.stringify({ id: 'no-notation', code: '1 1 1' }),
  ...Array.from({ length: 30 }, (_, k) => JSON.stringify({ id: `r${k}`, notation: 'braid', code: randomBraidWord(random, 4, 10 + (k % 7)).join(' '), keys: ['jones', 'determinant', 'alexander'] })),
];
const inputPath = join(work, 'census.jsonl');
writeFileSync(inputPath, `${lines.join('\n')}\n`);

describe('batch', () => {
  const one = batch([inputPath, '--jobs', '1']);
  const two = batch([inputPath, '--jobs', '2'], undefined, true);
  const three = batch([inputPath, '--jobs', '3'], undefined, true);

  it('prints one line per input line, in input order, each led by its id', () => {
    const out = one.stdout.trim().split('\n').map((l) => JSON.parse(l) as Record<string, unknown>);
    expect(out).toHaveLength(lines.length);
    expect(out[0]).toMatchObject({ id: 'trefoil', determinant: '3', signature: -2 }); // positive trefoil: det 3, σ = −2 (from memory)
    expect(Object.keys(out[0]!)[0]).toBe('id');
    expect(out.slice(4).map((o) => o['id'])).toEqual(Array.from({ length: 30 }, (_, k) => `r${k}`));
  });

  it('turns a bad line into an error object on its own line and goes on (exit status 2)', () => {
    const out = one.stdout.trim().split('\n').map((l) => JSON.parse(l) as { id?: string; line?: number; error?: { ruleId: string } });
    expect(out[1]).toMatchObject({ line: 2, error: { ruleId: 'batch-line-invalid' } });
    expect(out[2]).toMatchObject({ id: 'broken', error: { ruleId: 'code-invalid' } });
    expect(out[3]).toMatchObject({ id: 'no-notation', error: { ruleId: 'batch-line-invalid' } });
    expect(one.status).toBe(2);
  });

  it('is byte-identical with one thread and with a pool of one or two workers', () => {
    expect(two.status).toBe(one.status);
    expect(two.stdout).toBe(one.stdout);
    expect(three.stdout).toBe(one.stdout);
  });

  it('reads standard input', () => {
    expect(batch(['-', '--jobs', '1'], readFileSync(inputPath, 'utf8')).stdout).toBe(one.stdout);
  });

  it('--resume redoes a truncated last line and skips what is written, ending with the same output', () => {
    const partial = join(work, 'partial.jsonl');
    const full = one.stdout;
    const cut = full.indexOf('\n', Math.floor(full.length / 2)) + 25; // a complete half and a torn line
    writeFileSync(partial, full.slice(0, cut));
    const resumed = batch([inputPath, '--jobs', '2', '--resume', partial], undefined, true);
    expect(resumed.stdout).toBe('');
    expect(readFileSync(partial, 'utf8')).toBe(full);
    // Resuming a finished output computes nothing and changes nothing.
    batch([inputPath, '--resume', partial]);
    expect(readFileSync(partial, 'utf8')).toBe(full);
  });
});
