/**
 * Output is never partial and never replaces the input: a writer failing
 * half-way or a process killed mid-write leaves the target as it was.
 */
import { spawn } from 'node:child_process';
import { existsSync, linkSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { describeWriteFailure, OutputRefused, writeFileAtomic } from '../../src/cli/write-atomic.ts';
import { ROOT, skeinproof } from './cli.ts';

const work = mkdtempSync(join(tmpdir(), 'skeinproof-atomic-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

const BIG = 'x'.repeat(1 << 20);

describe('writeFileAtomic', () => {
  it('writes the whole content', async () => {
    const target = join(work, 'whole.txt');
    await writeFileAtomic(target, BIG);
    expect(readFileSync(target, 'utf8')).toBe(BIG);
  });

  it('leaves neither a partial target nor a temporary file when the writer fails half-way', async () => {
    const target = join(work, 'failing.txt');
    writeFileSync(target, 'previous content');
    let chunks = 0;
    const failing = writeFileAtomic(target, BIG, {
      writeChunk: async (h, chunk) => {
        if (++chunks === 3) throw new Error('disk full (injected)');
        await h.write(chunk);
      },
    });
    await expect(failing).rejects.toThrow('disk full (injected)');
    expect(readFileSync(target, 'utf8')).toBe('previous content');
    expect(readdirSync(work).filter((f) => f.includes('failing.txt'))).toEqual(['failing.txt']);
  });

  it('describes a failed write in plain words, without the temporary file it used', async () => {
    const target = join(work, 'full.txt');
    const full = writeFileAtomic(target, BIG, {
      writeChunk: async () => {
        throw Object.assign(new Error(`ENOSPC: no space left on device, write '${join(work, '.full.txt.1.tmp')}'`), { code: 'ENOSPC' });
      },
    });
    const error = await full.catch((e: unknown) => e);
    expect(describeWriteFailure(target, error)).toBe(`cannot write ${target}: the disk is full; nothing was written there`);
    expect(existsSync(target)).toBe(false);
  });

  it('refuses to replace a protected file, also through a hard link', async () => {
    const input = join(work, 'input.md');
    writeFileSync(input, 'manuscript');
    await expect(writeFileAtomic(input, 'other', { protect: [input] })).rejects.toBeInstanceOf(OutputRefused);
    const link = join(work, 'link.md');
    linkSync(input, link);
    await expect(writeFileAtomic(link, 'other', { protect: [input] })).rejects.toBeInstanceOf(OutputRefused);
    expect(readFileSync(input, 'utf8')).toBe('manuscript');
  });

  it('never shows a partial target when the writing process is killed', async () => {
    const target = join(work, 'killed.txt');
    const script = join(work, 'slow-writer.mts');
    // Writes one chunk, reports it, then stalls: the parent kills it mid-write.
    writeFileSync(
      script,
      `import { writeFileAtomic } from ${JSON.stringify(join(ROOT, 'src/cli/write-atomic.ts'))};
await writeFileAtomic(${JSON.stringify(target)}, 'y'.repeat(1 << 20), {
  writeChunk: async (h, chunk) => { await h.write(chunk); process.stdout.write('chunk\\n'); await new Promise(() => {}); },
});`,
    );
    const child = spawn(process.execPath, ['--import', 'tsx', script], { cwd: ROOT, stdio: ['ignore', 'pipe', 'inherit'] });
    const exited = new Promise((done) => child.on('exit', done));
    try {
      await new Promise<void>((done, fail) => {
        const timer = setTimeout(() => fail(new Error('the writer never started')), 15_000);
        child.stdout.on('data', () => {
          clearTimeout(timer);
          done();
        });
      });
      // The temporary file holds the first chunk now; the target must not exist yet.
      expect(readdirSync(work).some((f) => f.startsWith('.killed.txt.') && f.endsWith('.tmp'))).toBe(true);
    } finally {
      child.kill('SIGKILL');
      await exited;
    }
    expect(existsSync(target)).toBe(false);
  });
});

describe('build', () => {
  it('refuses to overwrite its input and leaves it intact', () => {
    const input = join(work, 'note.md');
    const text = '```skein id=k notation=braid\n1 1 1\n```\n\n:jones{of=k}\n';
    writeFileSync(input, text);
    const r = skeinproof(['build', input, '-o', input]);
    expect(r.status).toBe(2);
    expect(r.stderr).toContain('refusing to write');
    expect(readFileSync(input, 'utf8')).toBe(text);
    const relative = skeinproof(['build', 'note.md', '-o', './note.md'], work);
    expect(relative.status).toBe(2);
    expect(readFileSync(input, 'utf8')).toBe(text);
  });

  it('says plainly why an output path cannot be written: a missing directory, a directory, a file used as a directory', () => {
    const input = join(work, 'paths.md');
    writeFileSync(input, '```skein id=k notation=braid\n1 1 1\n```\n\n:jones{of=k}\n');
    const cases: [string, string][] = [
      [join(work, 'no-such-dir', 'out.md'), `the directory ${join(work, 'no-such-dir')} does not exist`],
      [work, 'it is a directory'],
      [join(input, 'out.md'), `${input} is a file, not a directory`],
    ];
    for (const [output, reason] of cases) {
      const r = skeinproof(['build', input, '-o', output]);
      expect(r.status).toBe(2);
      expect(r.stderr).toBe(`skeinproof: cannot write ${output}: ${reason}; ${reason.includes('exist') ? 'create it first or choose another path with -o' : reason.includes('is a directory') ? 'give a file name with -o' : 'choose another path with -o'}\n`);
      expect(r.stdout).toBe('');
    }
  });
});
