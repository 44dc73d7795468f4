/**
 * The disk cache's file store: values are written per diagram key when the
 * store is flushed, entries are checked before they are trusted (a truncated,
 * corrupted or foreign file is a miss and is rewritten), several
 * processes writing one entry at once leave a whole entry (temporary file and
 * rename: the POSIX rename replaces the target in one step, common practice),
 * and the least recently used entries go first when the cache is over its cap.
 */
import { spawn } from 'node:child_process';
import { readdirSync, readFileSync, statSync, utimesSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cacheDirectory, FileResultStore } from '../../src/cli/result-store.ts';
import { temporaryDirs } from '../support/temporary-dirs.ts';

const freshDir = temporaryDirs('skein-store-');

/** A key of the core's form: quantity, line break, diagram. */
const k = (diagram: string, quantity: string): string => `${quantity}\n${diagram}`;
const open = (dir: string, engine = 'engine-a', maxBytes = 1 << 30, warn?: (m: string) => void) => new FileResultStore({ dir, engine, maxBytes, ...(warn ? { warn } : {}) });

/** Every entry file under the store (temporary files included). */
function entryFiles(dir: string): string[] {
  const root = join(dir, 'entries');
  return readdirSync(root).flatMap((shard) => readdirSync(join(root, shard)).map((name) => join(root, shard, name)));
}

describe('file result store', () => {
  it('gives back what was stored, after a flush to other processes too, and nothing for another key or engine version', () => {
    const dir = freshDir();
    const store = open(dir);
    store.put(k('key one', 'bracket/1'), '[[1,"2"]]');
    store.put(k('key one', 'determinant/1'), '"3"');
    expect(store.get(k('key one', 'bracket/1'))).toBe('[[1,"2"]]');
    expect(open(dir).get(k('key one', 'bracket/1'))).toBeUndefined(); // not written before the flush
    store.flush();
    expect(entryFiles(dir)).toHaveLength(1); // one file per diagram key
    const reader = open(dir);
    expect(reader.get(k('key one', 'bracket/1'))).toBe('[[1,"2"]]');
    expect(reader.get(k('key one', 'determinant/1'))).toBe('"3"');
    expect(reader.get(k('key one', 'signature/1'))).toBeUndefined();
    expect(reader.get(k('key two', 'bracket/1'))).toBeUndefined();
    expect(open(dir, 'engine-b').get(k('key one', 'bracket/1'))).toBeUndefined();
    expect(reader.counts).toMatchObject({ hits: 2, misses: 2, writes: 0 });
    // A later run adds a value to the entry and keeps the others.
    reader.put(k('key one', 'signature/1'), '-2');
    reader.flush();
    const third = open(dir);
    expect(['bracket/1', 'determinant/1', 'signature/1'].map((q) => third.get(k('key one', q)))).toEqual(['[[1,"2"]]', '"3"', '-2']);
  });

  it('ignores a truncated, corrupted or emptied entry and takes the rewritten one', () => {
    const dir = freshDir();
    const store = open(dir);
    const value = JSON.stringify(Array.from({ length: 50 }, (_, i) => [i, String(i * 7919)]));
    store.put(k('k', 'q'), value);
    store.flush();
    const [file] = entryFiles(dir);
    const whole = readFileSync(file!, 'utf8');
    const damaged = [
      whole.slice(0, whole.length - 5), // truncated value
      whole.slice(0, 30), // truncated header
      whole.replace('7919', '7918'), // one digit changed
      '',
      'not an entry at all\n[]',
    ];
    let rejected = 0;
    for (const text of damaged) {
      writeFileSync(file!, text);
      const reader = open(dir);
      expect(reader.get(k('k', 'q'))).toBeUndefined();
      rejected += reader.counts.rejected;
    }
    expect(rejected).toBe(damaged.length);
    const writer = open(dir);
    writer.put(k('k', 'q'), value);
    writer.flush();
    expect(open(dir).get(k('k', 'q'))).toBe(value);
  });

  it('does not trust an entry that belongs to another key (a file copied or renamed into place)', () => {
    const dir = freshDir();
    const store = open(dir);
    store.put(k('first', 'q'), '"1"');
    store.put(k('second', 'q'), '"2"');
    store.flush();
    const files = entryFiles(dir);
    const first = files.find((f) => readFileSync(f, 'utf8').endsWith(JSON.stringify({ q: '"1"' })))!;
    const second = files.find((f) => f !== first)!;
    writeFileSync(second, readFileSync(first));
    expect(open(dir).get(k('second', 'q'))).toBeUndefined();
    expect(open(dir).get(k('first', 'q'))).toBe('"1"');
  });

  it('leaves one whole entry when several processes write the same entry at once', async () => {
    const dir = freshDir();
    const module = new URL('../../src/cli/result-store.ts', import.meta.url).href;
    // Each writer stores its own large value under one key, over and over.
    const writer = (id: number) =>
      new Promise<number>((done, fail) => {
        const script = `import { FileResultStore } from ${JSON.stringify(module)};
          const store = new FileResultStore({ dir: ${JSON.stringify(dir)}, engine: 'e', maxBytes: 1 << 30 });
          const value = JSON.stringify('${id}'.repeat(200000));
          for (let i = 0; i < 40; i++) { store.put('q\\nshared', value); store.flush(); }`;
        const child = spawn(process.execPath, ['--import', 'tsx', '--input-type=module', '-e', script], { stdio: 'inherit' });
        child.on('error', fail);
        child.on('exit', (code) => done(code ?? -1));
      });
    expect(await Promise.all([1, 2, 3, 4].map(writer))).toEqual([0, 0, 0, 0]);
    const value = open(dir, 'e').get(k('shared', 'q'));
    expect(value).toBeDefined();
    expect(['1', '2', '3', '4'].map((id) => JSON.stringify(id.repeat(200000)))).toContain(value);
    expect(entryFiles(dir).filter((f) => f.endsWith('.tmp'))).toEqual([]);
    expect(entryFiles(dir)).toHaveLength(1);
  });

  it('evicts the least recently used entries once the cache is over its cap, keeping one read recently', () => {
    const dir = freshDir();
    const valueOf = (k: string) => `${k}:${'x'.repeat(1000)}`;
    const writer = open(dir);
    for (let i = 0; i < 10; i++) writer.put(k(`k${i}`, 'q'), valueOf(`k${i}`));
    writer.flush();
    // Last used: k0 longest ago … k9 most recently.
    const now = Date.now() / 1000;
    for (const file of entryFiles(dir)) {
      const i = Number(/"k(\d+):/.exec(readFileSync(file, 'utf8'))![1]);
      utimesSync(file, now - 1000 + i, now - 1000 + i);
    }
    const store = open(dir, 'engine-a', 6 * 1100);
    expect(store.get(k('k0', 'q'))).toBe(valueOf('k0')); // now the most recently used
    store.put(k('new', 'q'), valueOf('new'));
    store.finish();
    const left = ['k0', 'k1', 'k2', 'k3', 'k4', 'k5', 'k6', 'k7', 'k8', 'k9', 'new'].filter((name) => open(dir).get(k(name, 'q')) !== undefined);
    // Cap 6600 bytes, evicted down to 90 % of it: five entries of about 1.1 kB stay, the most recently used ones.
    expect(left).toEqual(['k0', 'k7', 'k8', 'k9', 'new']);
  });

  it('creates its directories for the owner only (a checksum does not stop someone else writing a forged entry)', () => {
    const dir = join(freshDir(), 'cache');
    const store = open(dir);
    store.put(k('a', 'q'), '1');
    store.flush();
    for (const path of [dir, join(dir, 'entries'), join(dir, 'entries', readdirSync(join(dir, 'entries'))[0]!)]) expect(statSync(path).mode & 0o777).toBe(0o700);
  });

  it('goes on without storing, with one warning, when the cache cannot be written', () => {
    const dir = freshDir();
    const blocked = join(dir, 'a-file');
    writeFileSync(blocked, '');
    const warnings: string[] = [];
    const store = open(blocked, 'e', 1 << 30, (m) => warnings.push(m));
    store.put(k('a', 'q'), '1');
    store.flush();
    store.put(k('b', 'q'), '2');
    store.flush();
    expect(open(blocked).get(k('a', 'q'))).toBeUndefined();
    expect(warnings).toHaveLength(1);
    expect(warnings[0]).toContain('cannot write the cache');
  });

  it('lives under SKEINPROOF_CACHE_DIR, else XDG_CACHE_HOME/skeinproof, else ~/.cache/skeinproof (XDG base directory specification)', () => {
    expect(cacheDirectory('/flag', { SKEINPROOF_CACHE_DIR: '/env' }, 'linux')).toBe('/flag');
    expect(cacheDirectory(undefined, { SKEINPROOF_CACHE_DIR: '/env', XDG_CACHE_HOME: '/xdg' }, 'linux')).toBe('/env');
    expect(cacheDirectory(undefined, { XDG_CACHE_HOME: '/xdg' }, 'linux')).toBe(join('/xdg', 'skeinproof'));
    // A relative XDG_CACHE_HOME is invalid under the specification and is ignored.
    expect(cacheDirectory(undefined, { XDG_CACHE_HOME: 'relative' }, 'linux')).toMatch(/\.cache\/skeinproof$/);
  });
});
