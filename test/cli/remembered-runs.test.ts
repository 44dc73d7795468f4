/**
 * Remembered runs through the command line (src/cli/run-memo.ts): a warm check
 * or build of an unchanged manuscript replays the stored outcome, and its
 * report (text, JSON, SARIF) and output are byte for byte those of a run
 * without the cache; an edit to an included file forces a full run; two
 * processes filling one cache at once leave a cache that replays correctly;
 * --no-cache never reads or writes it; an unchanged output file is left as it
 * was. The reference is always the uncached run of the same command (the
 * project's own engines, checked against published values in their own tests).
 */
import { spawn, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { cpSync, readdirSync, readFileSync, statSync, unlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { temporaryDirs } from '../support/temporary-dirs.ts';

const root = fileURLToPath(new URL('../..', import.meta.url));
const BIN = join(root, 'bin/skeinproof.js');
const freshDir = temporaryDirs('skein-remembered-');

interface Run {
  status: number | null;
  stdout: string;
  stderr: string;
}

function skeinproof(cwd: string, ...args: string[]): Run {
  const r = spawnSync(process.execPath, [BIN, ...args], { cwd, encoding: 'utf8', timeout: 60_000 });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

function skeinproofAsync(cwd: string, ...args: string[]): Promise<Run> {
  return new Promise((done) => {
    const child = spawn(process.execPath, [BIN, ...args], { cwd });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (d: Buffer) => (stdout += d.toString()));
    child.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
    child.on('close', (status) => done({ status, stdout, stderr }));
  });
}

/** Every entry file of a cache, with its inode (a rewritten entry gets a new one). */
function entries(cache: string): Map<string, number> {
  const found = new Map<string, number>();
  const top = join(cache, 'entries');
  for (const shard of readdirSync(top)) for (const name of readdirSync(join(top, shard))) found.set(join(top, shard, name), statSync(join(top, shard, name)).ino);
  return found;
}

const isRunEntry = (path: string): boolean => readFileSync(path, 'utf8').includes('"run-memo 1"');

/** Removes every entry but the remembered runs: a run that is not a replay would have to compute (and write) values again. */
function keepOnlyRuns(cache: string): void {
  for (const path of entries(cache).keys()) if (!isRunEntry(path)) unlinkSync(path);
}

describe('remembered runs (command line)', () => {
  it('replays a check in every report format byte for byte as an uncached run, from the remembered run alone', () => {
    const dir = freshDir();
    cpSync(join(root, 'samples', 'twists-and-weaves-slips.md'), join(dir, 'paper.md'));
    const cache = join(dir, 'cache');
    const uncached = (format: string) => skeinproof(dir, 'check', 'paper.md', '--format', format, '--no-cache');
    const cold = skeinproof(dir, 'check', 'paper.md', '--format', 'json', '--cache-dir', cache);
    expect(cold).toEqual(uncached('json'));
    expect(cold.status).toBe(2); // the sample's slips (invalid codes among them) are found
    keepOnlyRuns(cache);
    const kept = entries(cache);
    expect(kept.size).toBe(1);
    for (const format of ['text', 'json', 'sarif']) expect(skeinproof(dir, 'check', 'paper.md', '--format', format, '--cache-dir', cache), format).toEqual(uncached(format));
    expect(entries(cache)).toEqual(kept); // nothing computed, nothing written
  });

  it('replays a Markdown build and a LaTeX build, and runs afresh after an edit to an included file', () => {
    const dir = freshDir();
    cpSync(join(root, 'samples', 'twists-and-weaves.md'), join(dir, 'paper.md'));
    cpSync(join(root, 'samples', 'latex'), join(dir, 'latex'), { recursive: true });
    const cache = join(dir, 'cache');
    const sidecar = join(dir, 'latex', 'rope-atlas.skein.tex');
    const builds: [string[], string][] = [
      [['build', 'paper.md', '-o', 'out.md'], join(dir, 'out.md')],
      [['build', join('latex', 'rope-atlas.tex')], sidecar],
      [['build', 'paper.md', '-o', 'page.html'], join(dir, 'page.html')],
    ];
    for (const [args, output] of builds) {
      const uncached = skeinproof(dir, ...args, '--no-cache');
      const expected = readFileSync(output);
      expect(skeinproof(dir, ...args, '--cache-dir', cache)).toEqual(uncached);
      expect(readFileSync(output).equals(expected)).toBe(true);
      unlinkSync(output);
      keepOnlyRuns(cache);
      expect(skeinproof(dir, ...args, '--cache-dir', cache), args.join(' ')).toEqual(uncached);
      expect(readFileSync(output).equals(expected), args.join(' ')).toBe(true);
    }
    // An edit to the \input file only: the span of the cinquefoil's row is left empty, to be filled in.
    const table = join(dir, 'latex', 'sections', 'atlas-table.tex');
    const before = readFileSync(sidecar, 'utf8');
    writeFileSync(table, readFileSync(table, 'utf8').replace(/^(coil\b.*?)& 5 & 5 /m, '$1&   & 5 '));
    expect(readFileSync(table, 'utf8')).not.toBe(readFileSync(join(root, 'samples', 'latex', 'sections', 'atlas-table.tex'), 'utf8'));
    const args = ['build', join('latex', 'rope-atlas.tex'), '--force-write'];
    const uncached = skeinproof(dir, ...args, '--no-cache');
    const expected = readFileSync(sidecar, 'utf8');
    expect(expected).not.toBe(before);
    writeFileSync(sidecar, before);
    expect(skeinproof(dir, ...args, '--cache-dir', cache)).toEqual(uncached);
    expect(readFileSync(sidecar, 'utf8')).toBe(expected);
  });

  it('two processes filling one cache at once: both give the uncached output, and the cache they leave replays it', async () => {
    const dir = freshDir();
    cpSync(join(root, 'samples', 'torus-and-pretzel.md'), join(dir, 'paper.md'));
    const cache = join(dir, 'cache');
    const uncached = skeinproof(dir, 'check', 'paper.md', '--no-cache');
    const both = await Promise.all([skeinproofAsync(dir, 'check', 'paper.md', '--cache-dir', cache), skeinproofAsync(dir, 'check', 'paper.md', '--cache-dir', cache)]);
    expect(both).toEqual([uncached, uncached]);
    keepOnlyRuns(cache);
    expect(skeinproof(dir, 'check', 'paper.md', '--cache-dir', cache)).toEqual(uncached);
  });

  it('--no-cache neither reads nor writes the remembered run (a forged one is believed only with the cache)', () => {
    const dir = freshDir();
    cpSync(join(root, 'samples', 'twists-and-weaves.md'), join(dir, 'paper.md'));
    const cache = join(dir, 'cache');
    const truth = skeinproof(dir, 'check', 'paper.md', '--format', 'json', '--cache-dir', cache);
    const [memo] = [...entries(cache).keys()].filter(isRunEntry);
    // Forged with a valid checksum: no diagnostics and other counts. Only whoever can write the cache can do this.
    const text = readFileSync(memo!, 'utf8');
    const values = JSON.parse(text.slice(text.indexOf('\n') + 1)) as Record<string, string>;
    const run = JSON.parse(values['run-memo 1']!) as Record<string, unknown>;
    values['run-memo 1'] = JSON.stringify({ ...run, diagnostics: [], counts: { ...(run['counts'] as object), diagrams: 999 } });
    const body = JSON.stringify(values);
    const header = text.slice(0, text.indexOf('\n')).split(' ');
    writeFileSync(memo!, `${header[0]} ${header[1]} ${header[2]} ${createHash('sha256').update(body).digest('hex')} ${Buffer.byteLength(body)}\n${body}`);
    const forged = readFileSync(memo!);
    const listing = entries(cache);
    expect(JSON.parse(skeinproof(dir, 'check', 'paper.md', '--format', 'json', '--cache-dir', cache).stdout).checked.diagrams).toBe(999);
    expect(skeinproof(dir, 'check', 'paper.md', '--format', 'json', '--no-cache', '--cache-dir', cache)).toEqual(truth);
    expect(entries(cache)).toEqual(listing);
    expect(readFileSync(memo!).equals(forged)).toBe(true);
  });

  it('leaves an output that already holds the built bytes as it was (same inode and time), and writes one that differs', async () => {
    const dir = freshDir();
    cpSync(join(root, 'samples', 'twists-and-weaves.md'), join(dir, 'paper.md'));
    const cache = join(dir, 'cache');
    const out = join(dir, 'out.md');
    expect(skeinproof(dir, 'build', 'paper.md', '-o', 'out.md', '--cache-dir', cache).status).toBe(0);
    const first = statSync(out);
    await new Promise((done) => setTimeout(done, 20));
    const again = skeinproof(dir, 'build', 'paper.md', '-o', 'out.md', '--cache-dir', cache);
    expect(again.stdout).toBe(`wrote out.md\n`);
    expect(statSync(out).ino).toBe(first.ino);
    expect(statSync(out).mtimeMs).toBe(first.mtimeMs);
    const built = readFileSync(out, 'utf8');
    writeFileSync(out, built.replace(/.$/s, '?'));
    skeinproof(dir, 'build', 'paper.md', '-o', 'out.md', '--cache-dir', cache);
    expect(readFileSync(out, 'utf8')).toBe(built);
  });
});
