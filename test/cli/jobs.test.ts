/**
 * --jobs: the diagrams of a manuscript are computed in a pool of threads, and
 * every output is the same byte for byte whatever the pool size (the report of
 * check, the built Markdown and the LaTeX flat copy, with their exit status).
 * SKEINPROOF_POOL_AFTER_MS=0 starts the pool at the first diagram, so these
 * small samples go through the workers rather than staying in one thread.
 * Also: no progress bar when stderr is not a terminal, under CI or with --quiet.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { wantsProgress } from '../../src/cli/progress.ts';
import { ROOT } from '../markdown/cli.ts';
import { randomBraidWord, rng } from '../support/random-diagrams.ts';

const work = mkdtempSync(join(tmpdir(), 'skeinproof-jobs-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

function run(args: readonly string[], environment: NodeJS.ProcessEnv = {}) {
  const env = { ...process.env, SKEINPROOF_POOL_AFTER_MS: '0', ...environment };
  return spawnSync(process.execPath, [join(ROOT, 'bin', 'skeinproof.js'), ...args, '--no-cache'], { cwd: ROOT, encoding: 'utf8', env, timeout: 60_000 });
}

const MANUSCRIPTS = ['samples/twists-and-weaves-slips.md', 'samples/torus-and-pretzel.md', 'samples/latex/slips/rope-atlas.tex', 'samples/latex/rope-atlas.tex'];

describe('--jobs on manuscripts', () => {
  for (const file of MANUSCRIPTS) {
    it(`check ${file}: the same report and status with one thread and with two or three`, () => {
      const one = run(['check', file, '--jobs', '1']);
      expect(one.stdout).toMatch(/checked \d+ diagrams/);
      for (const jobs of ['2', '3']) {
        const many = run(['check', file, '--jobs', jobs]);
        expect(many.status).toBe(one.status);
        expect(many.stdout).toBe(one.stdout);
      }
    });

    it(`build ${file}: the same output file byte for byte with one thread and with two`, () => {
      const extension = file.endsWith('.tex') ? 'tex' : 'md';
      const outputs = ['1', '2'].map((jobs) => {
        const output = join(work, `${file.replace(/\W/g, '-')}-${jobs}.${extension}`);
        const r = run(['build', file, '-o', output, '--force-write', '--jobs', jobs]);
        return { status: r.status, stderr: r.stderr, text: readFileSync(output, 'utf8') };
      });
      expect(outputs[1]!.status).toBe(outputs[0]!.status);
      expect(outputs[1]!.stderr).toBe(outputs[0]!.stderr);
      expect(outputs[1]!.text).toBe(outputs[0]!.text);
    });
  }

  it('refuses a --jobs that is not a positive whole number, naming the option', () => {
    const r = run(['check', MANUSCRIPTS[0]!, '--jobs', '0']);
    expect(r.status).toBe(2);
    expect(r.stderr).toContain('--jobs needs a positive whole number');
  });
});

describe('progress bar', () => {
  // About two seconds of work in one thread: the bar shows after one second on a terminal.
  const random = rng(7);
  const input = join(work, 'progress.jsonl');
  writeFileSync(
    input,
    Array.from({ length: 1500 }, (_, k) => JSON.stringify({ id: `t${k}`, notation: 'braid', code: randomBraidWord(random, 4, 14).join(' '), keys: 'jones,determinant' })).join('\n'),
  );
  const environment = { ...process.env };
  delete environment['CI'];
  const command = `${process.execPath} ${join(ROOT, 'bin', 'skeinproof.js')} batch ${input} --jobs 1`;

  it('prints nothing on stderr when it is not a terminal (a pipe here)', () => {
    const r = spawnSync('sh', ['-c', command], { cwd: work, encoding: 'utf8', env: environment, timeout: 60_000 });
    expect(r.stdout.trim().split('\n')).toHaveLength(1500);
    expect(r.stderr).toBe('');
  });

  it('is drawn on a terminal (script(1) gives the command a pseudo-terminal), and not with --quiet or under CI', () => {
    const onTerminal = (extra: string, env: NodeJS.ProcessEnv) =>
      spawnSync('script', ['-qec', `${command} ${extra} > ${join(work, 'progress.out')}`, '/dev/null'], { cwd: work, encoding: 'utf8', env, timeout: 60_000 }).stdout;
    expect(onTerminal('', environment)).toMatch(/\d+\/1500 lines/);
    expect(onTerminal('--quiet', environment)).not.toMatch(/lines/);
    expect(onTerminal('', { ...environment, CI: 'true' })).not.toMatch(/lines/);
  });

  it('is wanted only on a terminal, outside CI and without --quiet (CI=true is common practice for CI services)', () => {
    expect(wantsProgress(false, { isTTY: true }, {})).toBe(true);
    expect(wantsProgress(true, { isTTY: true }, {})).toBe(false);
    expect(wantsProgress(false, { isTTY: false }, {})).toBe(false);
    expect(wantsProgress(false, {}, {})).toBe(false);
    expect(wantsProgress(false, { isTTY: true }, { CI: 'true' })).toBe(false);
    expect(wantsProgress(false, { isTTY: true }, { CI: '1' })).toBe(false);
  });
});
