/**
 * Output never destroys anything: only a regular file (or a new path) is
 * replaced; a symbolic link is written through to its target, atomically in
 * the target's directory; named pipes and device files are refused; a
 * replaced file keeps its permissions; an interrupted write leaves no
 * temporary file. LaTeX outputs of the wrong kind are refused before any work.
 * (POSIX rename(2) semantics and file types, common practice.)
 */
import { spawn, spawnSync } from 'node:child_process';
import { chmodSync, existsSync, lstatSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, readlinkSync, rmSync, statSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { OutputRefused, writeFileAtomic } from '../../src/cli/write-atomic.ts';
import { skeinproof } from '../markdown/cli.ts';

const ROOT = join(import.meta.dirname, '..', '..');
const work = mkdtempSync(join(tmpdir(), 'skeinproof-output-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

const temporaries = (dir: string) => readdirSync(dir).filter((f) => f.endsWith('.tmp'));

describe('writing through links and refusing special files', () => {
  it('writes a symbolic link’s target, atomically beside the target, and keeps the link', async () => {
    const targets = mkdtempSync(join(work, 'targets-'));
    const links = mkdtempSync(join(work, 'links-'));
    const target = join(targets, 'real.md');
    writeFileSync(target, 'stale');
    const link = join(links, 'out.md');
    symlinkSync(target, link);
    await writeFileAtomic(link, 'fresh');
    expect(lstatSync(link).isSymbolicLink()).toBe(true);
    expect(readlinkSync(link)).toBe(target);
    expect(readFileSync(target, 'utf8')).toBe('fresh');
    // A dangling link (relative, to a file not written yet) gets its target created.
    symlinkSync('../targets-new.md', join(links, 'new.md'));
    await writeFileAtomic(join(links, 'new.md'), 'created');
    expect(readFileSync(join(work, 'targets-new.md'), 'utf8')).toBe('created');
    expect(lstatSync(join(links, 'new.md')).isSymbolicLink()).toBe(true);
    expect([...temporaries(targets), ...temporaries(links)]).toEqual([]);
  });

  it('refuses a link whose target is the input', async () => {
    const input = join(work, 'input-through-link.md');
    writeFileSync(input, 'manuscript');
    const link = join(work, 'link-to-input.md');
    symlinkSync(input, link);
    await expect(writeFileAtomic(link, 'other', { protect: [input] })).rejects.toBeInstanceOf(OutputRefused);
    expect(readFileSync(input, 'utf8')).toBe('manuscript');
  });

  it('refuses a named pipe and device files, leaving them as they were', async () => {
    const fifo = join(work, 'pipe.md');
    expect(spawnSync('mkfifo', [fifo]).status).toBe(0);
    await expect(writeFileAtomic(fifo, 'x')).rejects.toThrow(/it is a named pipe, not a regular file.*-o -/);
    expect(lstatSync(fifo).isFIFO()).toBe(true);
    const stdoutLink = lstatSync('/dev/stdout');
    await expect(writeFileAtomic('/dev/stdout', 'x')).rejects.toThrow(/device or process file.*-o -/);
    await expect(writeFileAtomic('/dev/null', 'x')).rejects.toThrow(/device or process file/);
    expect(lstatSync('/dev/stdout').isSymbolicLink()).toBe(stdoutLink.isSymbolicLink());
    expect(lstatSync('/dev/null').isCharacterDevice()).toBe(true);
    // Through a link, too.
    const toNull = join(work, 'null-link.md');
    symlinkSync('/dev/null', toNull);
    await expect(writeFileAtomic(toNull, 'x')).rejects.toThrow(/leads to \/dev\/null/);
  });

  it('keeps a replaced file’s permission bits (a private 600 file stays private)', async () => {
    const target = join(work, 'private.md');
    writeFileSync(target, 'old');
    chmodSync(target, 0o600);
    await writeFileAtomic(target, 'new');
    expect(statSync(target).mode & 0o777).toBe(0o600);
    chmodSync(target, 0o640);
    await writeFileAtomic(target, 'newer');
    expect(statSync(target).mode & 0o777).toBe(0o640);
  });
});

describe('an interrupted write', () => {
  for (const signal of ['SIGTERM', 'SIGINT'] as const) {
    it(`removes its temporary file on ${signal}`, async () => {
      const dir = mkdtempSync(join(work, `signal-${signal}-`));
      const target = join(dir, 'out.md');
      const script = join(dir, 'stalled-writer.mts');
      writeFileSync(
        script,
        `import { writeFileAtomic } from ${JSON.stringify(join(ROOT, 'src/cli/write-atomic.ts'))};
await writeFileAtomic(${JSON.stringify(target)}, 'y'.repeat(1 << 20), {
  writeChunk: async (h, chunk) => { await h.write(chunk); process.stdout.write('chunk\\n'); await new Promise(() => setInterval(() => {}, 1000)); },
});`,
      );
      const child = spawn(process.execPath, ['--import', 'tsx', script], { cwd: ROOT, stdio: ['ignore', 'pipe', 'inherit'] });
      const exited = new Promise<NodeJS.Signals | null>((done) => child.on('exit', (_code, s) => done(s)));
      await new Promise<void>((done, fail) => {
        const timer = setTimeout(() => fail(new Error('the writer never started')), 15_000);
        child.stdout.once('data', () => {
          clearTimeout(timer);
          done();
        });
      });
      expect(temporaries(dir)).toHaveLength(1);
      child.kill(signal);
      expect(await exited).toBe(signal); // still ends the way the signal asks
      expect(temporaries(dir)).toEqual([]);
      expect(existsSync(target)).toBe(false);
    });
  }
});

describe('build', () => {
  it('writes through a symlinked -o and keeps mode 600 of the file it replaces', () => {
    const dir = mkdtempSync(join(work, 'build-'));
    const input = join(dir, 'note.md');
    writeFileSync(input, '```skein id=k notation=braid\n1 1 1\n```\n\nV = :jones{of=k}.\n');
    mkdirSync(join(dir, 'real'));
    const real = join(dir, 'real', 'out.md');
    writeFileSync(real, 'stale');
    chmodSync(real, 0o600);
    symlinkSync(real, join(dir, 'out.md'));
    const r = skeinproof(['build', input, '-o', join(dir, 'out.md')]);
    expect(r.status).toBe(0);
    expect(lstatSync(join(dir, 'out.md')).isSymbolicLink()).toBe(true);
    expect(readFileSync(real, 'utf8')).toContain('$t + t^3 - t^4$');
    expect(statSync(real).mode & 0o777).toBe(0o600);
  });

  it('refuses a LaTeX build into a Markdown name or an HTML page before any work', () => {
    const dir = mkdtempSync(join(work, 'tex-'));
    const paper = join(dir, 'paper.tex');
    // An invalid code: a refusal that comes before the work reports nothing about it.
    writeFileSync(paper, '\\documentclass{article}\n\\usepackage{skeinproof}\n\\begin{document}\n\\begin{skeincode}[id=k, notation=braid]\n1 x 1\n\\end{skeincode}\n\\end{document}\n');
    for (const args of [['-o', join(dir, 'out.md')], ['--html'], ['-o', join(dir, 'out.html')]]) {
      const r = skeinproof(['build', paper, ...args]);
      expect(r.status, args.join(' ')).toBe(2);
      expect(r.stderr).toContain('[output-unsupported]');
      expect(r.stderr).not.toContain('code-invalid');
      expect(readdirSync(dir)).toEqual(['paper.tex']);
    }
  });

  it('never replaces a file at a default output path that skeinproof did not write; replaces its own outputs and a named -o', () => {
    const dir = mkdtempSync(join(work, 'defaults-'));
    const note = join(dir, 'note.md');
    writeFileSync(note, '```skein id=k notation=braid\n1 1 1\n```\n\nV = :jones{of=k}.\n');
    const paper = join(dir, 'paper.tex');
    writeFileSync(paper, '\\documentclass{article}\n\\usepackage{skeinproof}\n\\begin{document}\n\\begin{skeincode}{id=k, notation=braid}\n1 1 1\n\\end{skeincode}\n$V = \\skeinjones{k}$\n\\end{document}\n');
    const cases: [string[], string][] = [
      [['build', note], join(dir, 'note.filled.md')],
      [['build', note, '--html'], join(dir, 'note.html')],
      [['build', paper], join(dir, 'paper.skein.tex')],
    ];
    for (const [args, output] of cases) {
      writeFileSync(output, 'the author’s own file');
      const refused = skeinproof(args);
      expect(refused.status, args.join(' ')).toBe(2);
      expect(refused.stderr).toContain('skeinproof did not write it');
      expect(readFileSync(output, 'utf8')).toBe('the author’s own file');
      rmSync(output);
      // Its own output is replaced on the next build.
      expect(skeinproof(args).status, args.join(' ')).toBe(0);
      expect(skeinproof(args).status, args.join(' ')).toBe(0);
    }
    expect(readFileSync(join(dir, 'note.filled.md'), 'utf8')).toMatch(/<!-- filled in by skeinproof from note\.md: edit that file and build again -->\n$/);
    // An output the author names is replaced: they asked for it.
    const named = join(dir, 'named.md');
    writeFileSync(named, 'old');
    expect(skeinproof(['build', note, '-o', named]).status).toBe(0);
    expect(readFileSync(named, 'utf8')).toContain('$t + t^3 - t^4$');
    expect(temporaries(dir)).toEqual([]);
  });

  it('refuses a Markdown build into a LaTeX name', () => {
    const input = join(work, 'md-to-tex.md');
    writeFileSync(input, 'Text.\n');
    const r = skeinproof(['build', input, '-o', join(work, 'md-to-tex.tex')]);
    expect(r.status).toBe(2);
    expect(r.stderr).toContain('would put Markdown under a LaTeX name');
    expect(existsSync(join(work, 'md-to-tex.tex'))).toBe(false);
  });
});
