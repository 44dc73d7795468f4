/** `watch` rebuilds after the manuscript changes (a temporary file, a bounded wait). */
import { spawn } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, expect, it } from 'vitest';
import { ROOT, skeinproof } from './cli.ts';

const work = mkdtempSync(join(tmpdir(), 'skeinproof-watch-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

it('builds at start and again when the file changes', async () => {
  const input = join(work, 'note.md');
  const output = join(work, 'note.out.md');
  writeFileSync(input, '```skein id=k notation=braid\n1 1 1\n```\n\nV = :jones{of=k}\n');
  const child = spawn(process.execPath, [join(ROOT, 'bin/skeinproof.js'), 'watch', input, '-o', output], { cwd: ROOT, stdio: ['ignore', 'pipe', 'pipe'] });
  let seen = '';
  const waitFor = (count: number) =>
    new Promise<void>((done, fail) => {
      const timer = setTimeout(() => fail(new Error(`watch output so far:\n${seen}`)), 15_000);
      const check = () => {
        if (seen.split(`wrote ${output}`).length - 1 >= count) {
          clearTimeout(timer);
          child.stdout.off('data', onData);
          done();
        }
      };
      const onData = (d: Buffer) => {
        seen += String(d);
        check();
      };
      child.stdout.on('data', onData);
      check();
    });
  try {
    await waitFor(1);
    // Positive trefoil σ₁³: t + t³ − t⁴ (from memory).
    expect(readFileSync(output, 'utf8')).toContain('V = $t + t^3 - t^4$');
    writeFileSync(input, '```skein id=k notation=braid\n1 -2 1 -2\n```\n\nV = :jones{of=k}\n');
    await waitFor(2);
    // Figure-eight: t⁻² − t⁻¹ + 1 − t + t² (from memory).
    expect(readFileSync(output, 'utf8')).toContain('V = $t^{-2} - t^{-1} + 1 - t + t^2$');
  } finally {
    child.kill('SIGTERM');
    await new Promise((done) => child.on('exit', done));
  }
});

it('refuses a manuscript in a directory that does not exist, with a message and no stack trace', () => {
  const input = join(work, 'no-such-dir', 'note.md');
  const r = skeinproof(['watch', input]);
  expect(r.status).toBe(2);
  expect(r.stderr).toContain(`cannot watch ${input}: the directory ${join(work, 'no-such-dir')} does not exist`);
  expect(r.stderr).not.toContain(' at ');
});
