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

  it('a diagram that kills its worker (a 32 MiB heap here) costs that diagram only: limit-exceeded at its code, the rest checked', () => {
    const big = '1 -2 3 -4 '.repeat(7).trim(); // Khovanov homology of this 28-crossing closure needs far more than 32 MiB
    const path = join(work, 'worker-dies.md');
    writeFileSync(
      path,
      `\`\`\`skein id=trefoil notation=braid\n1 1 1\n\`\`\`\n\nIts determinant is :determinant[$3$]{of=trefoil}.\n\n` +
        `\`\`\`skein id=big notation=braid strands=5\n${big}\n\`\`\`\n\nIts Khovanov width: :khovanov-width{of=big}.\n`,
    );
    const r = run(['check', path, '--jobs', '2'], { SKEINPROOF_WORKER_HEAP_MIB: '32' });
    expect(r.status).toBe(2);
    expect(r.stdout).toMatch(/worker-dies\.md:8:1: error: diagram `big`: the worker thread computing it stopped \(.*\); each worker's heap is limited .* run with --jobs 1\. \[limit-exceeded\]/);
    expect(r.stdout).toContain('`big` is over a limit and was not computed');
    // The positive trefoil's determinant is 3 (from memory): its claim is still judged.
    expect(r.stdout).toContain('checked 1 diagram: 1 claim agrees');
    // The same in batch: the line that kills its worker is an error object, the others are computed.
    const lines = [{ id: 'trefoil', notation: 'braid', code: '1 1 1', keys: 'determinant' }, { id: 'big', notation: 'braid', code: big, keys: 'khovanov' }, { id: 'figure-eight', notation: 'braid', code: '1 -2 1 -2', keys: 'determinant' }];
    const batch = spawnSync(process.execPath, [join(ROOT, 'bin', 'skeinproof.js'), 'batch', '-', '--jobs', '2', '--no-cache'], {
      encoding: 'utf8',
      input: lines.map((l) => JSON.stringify(l)).join('\n'),
      env: { ...process.env, SKEINPROOF_POOL_AFTER_MS: '0', SKEINPROOF_WORKER_HEAP_MIB: '32' },
      timeout: 60_000,
    });
    const out = batch.stdout.trim().split('\n').map((l) => JSON.parse(l) as { id?: string; line?: number; determinant?: string; error?: { ruleId: string } });
    expect(out.map((o) => o.id ?? o.line)).toEqual(['trefoil', 2, 'figure-eight']);
    expect(out[1]!.error?.ruleId).toBe('batch-worker-failed');
    expect([out[0]!.determinant, out[2]!.determinant]).toEqual(['3', '5']); // det of the trefoil 3, of the figure-eight knot 5 (from memory)
  });

  it('refuses a --jobs that is not a positive whole number, naming the option', () => {
    const r = run(['check', MANUSCRIPTS[0]!, '--jobs', '0']);
    expect(r.status).toBe(2);
    expect(r.stderr).toContain('--jobs needs a positive whole number');
  });
});

describe('progress bar', () => {
  // SKEINPROOF_PROGRESS_AFTER_MS=0 draws the bar at once (normally after a second), so a short run shows it.
  const random = rng(7);
  const input = join(work, 'progress.jsonl');
  writeFileSync(
    input,
    Array.from({ length: 200 }, (_, k) => JSON.stringify({ id: `t${k}`, notation: 'braid', code: randomBraidWord(random, 4, 14).join(' '), keys: 'jones,determinant' })).join('\n'),
  );
  const environment: NodeJS.ProcessEnv = { ...process.env, SKEINPROOF_PROGRESS_AFTER_MS: '0' };
  delete environment['CI'];
  // Without the disk cache: a warm second run would finish before the bar is due.
  const command = `${process.execPath} ${join(ROOT, 'bin', 'skeinproof.js')} batch ${input} --jobs 1 --no-cache`;

  it('prints nothing on stderr when it is not a terminal (a pipe here)', () => {
    const r = spawnSync('sh', ['-c', command], { cwd: work, encoding: 'utf8', env: environment, timeout: 60_000 });
    expect(r.stdout.trim().split('\n')).toHaveLength(200);
    expect(r.stderr).toBe('');
  });

  it('is drawn on a terminal (script(1) gives the command a pseudo-terminal), and not with --quiet or under CI', () => {
    const onTerminal = (extra: string, env: NodeJS.ProcessEnv) =>
      spawnSync('script', ['-qec', `${command} ${extra} > ${join(work, 'progress.out')}`, '/dev/null'], { cwd: work, encoding: 'utf8', env, timeout: 60_000 }).stdout;
    expect(onTerminal('', environment)).toMatch(/\d+\/200 lines/);
    expect(onTerminal('--quiet', environment)).not.toMatch(/lines/);
    expect(onTerminal('', { ...environment, CI: 'true' })).not.toMatch(/lines/);
    // A manuscript's diagrams too (the Markdown sample has 10).
    const check = spawnSync('script', ['-qec', `${process.execPath} ${join(ROOT, 'bin', 'skeinproof.js')} check samples/torus-and-pretzel.md --no-cache > /dev/null`, '/dev/null'], { cwd: ROOT, encoding: 'utf8', env: environment, timeout: 60_000 });
    expect(check.stdout).toMatch(/\d+\/10 diagrams/);
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
