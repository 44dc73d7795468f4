/**
 * The compiled command line loads only what a command needs (issue: start-up).
 * Each run records the modules it loads (test/support/record-loads.mjs); the
 * build graph that scripts/compile.mjs writes says which packages each compiled
 * chunk holds.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { describe, expect, it } from 'vitest';

const ROOT = join(import.meta.dirname, '..', '..');
const DIST = pathToFileURL(join(ROOT, 'dist')).href + '/';

interface GraphEntry {
  readonly packages: readonly string[];
  readonly sources: readonly string[];
}

function loadedBy(args: readonly string[]): { status: number | null; packages: Set<string>; sources: Set<string> } {
  const work = mkdtempSync(join(tmpdir(), 'skeinproof-loads-'));
  const log = join(work, 'loads.txt');
  try {
    const hook = pathToFileURL(join(ROOT, 'test', 'support', 'record-loads.mjs')).href;
    const r = spawnSync(process.execPath, ['--import', hook, join(ROOT, 'bin', 'skeinproof.js'), ...args], {
      cwd: ROOT,
      encoding: 'utf8',
      env: { ...process.env, SKEINPROOF_LOAD_LOG: log, SKEINPROOF_FROM_SOURCE: '' },
      timeout: 30_000,
    });
    const graph = JSON.parse(readFileSync(join(ROOT, 'dist', 'build-graph.json'), 'utf8')) as Record<string, GraphEntry>;
    const packages = new Set<string>();
    const sources = new Set<string>();
    const urls = readFileSync(log, 'utf8').split('\n').filter(Boolean);
    for (const url of urls.filter((u) => u.startsWith(DIST))) {
      const entry = graph[url.slice(DIST.length)];
      if (!entry) throw new Error(`loaded ${url}, which the build graph does not list`);
      entry.packages.forEach((p) => packages.add(p));
      entry.sources.forEach((s) => sources.add(s));
    }
    // Everything the CLI runs comes out of dist: no package is read from node_modules at run time.
    expect(urls.filter((u) => u.includes('/node_modules/'))).toEqual([]);
    return { status: r.status, packages, sources };
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}

const MARKDOWN_STACK = /^(remark-|micromark|mdast-|unified$|yaml$)/;
const HTML_STACK = /^(katex$|rehype-|hast-)/;
const matching = (packages: Set<string>, pattern: RegExp) => [...packages].filter((p) => pattern.test(p));

describe('each command loads only what it needs', () => {
  it('--help loads no manuscript or page stack', () => {
    const { status, packages, sources } = loadedBy(['--help']);
    expect(status).toBe(0);
    expect(packages.has('yargs')).toBe(true); // the recorder sees the compiled chunks
    expect(matching(packages, MARKDOWN_STACK)).toEqual([]);
    expect(matching(packages, HTML_STACK)).toEqual([]);
    expect([...sources].filter((s) => s.startsWith('plugins/'))).toEqual([]);
  });

  it('compute loads neither the Markdown, the HTML nor the LaTeX stack', () => {
    const { status, packages, sources } = loadedBy(['compute', '-n', 'braid', '1 1 1']);
    expect(status).toBe(0);
    expect(matching(packages, MARKDOWN_STACK)).toEqual([]);
    expect(matching(packages, HTML_STACK)).toEqual([]);
    expect([...sources].filter((s) => s.startsWith('plugins/'))).toEqual([]);
  });

  it('check of a .tex file loads neither remark nor KaTeX', () => {
    const { status, packages, sources } = loadedBy(['check', 'samples/latex/rope-atlas.tex']);
    expect(status).toBe(0);
    expect(sources.has('plugins/latex/reader.ts')).toBe(true);
    expect(matching(packages, MARKDOWN_STACK)).toEqual([]);
    expect(matching(packages, HTML_STACK)).toEqual([]);
  });

  it('check of a .md file loads remark and KaTeX (to find math the page could not typeset) but not rehype; writing HTML loads rehype', () => {
    const checked = loadedBy(['check', 'samples/twists-and-weaves.md', '--no-cache']);
    expect(checked.status).toBe(0);
    expect(checked.packages.has('remark-parse')).toBe(true);
    expect(matching(checked.packages, HTML_STACK)).toEqual(['katex']);
    const out = mkdtempSync(join(tmpdir(), 'skeinproof-page-'));
    try {
      const built = loadedBy(['build', 'samples/twists-and-weaves.md', '-o', join(out, 'page.html')]);
      expect(built.status).toBe(0);
      expect(built.packages.has('katex')).toBe(true);
      expect(built.packages.has('rehype-sanitize')).toBe(true);
    } finally {
      rmSync(out, { recursive: true, force: true });
    }
  });

  it('a second check of an unchanged .md file with the disk cache does not load KaTeX (the cache remembers its verdicts)', () => {
    const cache = mkdtempSync(join(tmpdir(), 'skeinproof-loads-cache-'));
    try {
      const args = ['check', 'samples/twists-and-weaves.md', '--cache-dir', cache];
      expect(matching(loadedBy(args).packages, HTML_STACK)).toEqual(['katex']);
      // --strict is another remembered run (its outcome may differ), so the Markdown is read again, but its math is not.
      const warm = loadedBy([...args, '--strict']);
      expect(warm.status).toBe(0);
      expect(matching(warm.packages, MARKDOWN_STACK).length).toBeGreaterThan(0);
      expect(matching(warm.packages, HTML_STACK)).toEqual([]);
    } finally {
      rmSync(cache, { recursive: true, force: true });
    }
  });

  it('a check or build of an unchanged manuscript with the disk cache replays the remembered run: no parser loads', () => {
    const cache = mkdtempSync(join(tmpdir(), 'skeinproof-loads-cache-'));
    const out = mkdtempSync(join(tmpdir(), 'skeinproof-loads-out-'));
    try {
      for (const args of [
        ['check', 'samples/twists-and-weaves.md', '--cache-dir', cache],
        ['build', 'samples/twists-and-weaves.md', '-o', join(out, 'filled.md'), '--cache-dir', cache],
        ['check', 'samples/latex/rope-atlas.tex', '--cache-dir', cache],
      ]) {
        const cold = loadedBy(args);
        expect(cold.sources.has('src/cli/formats/registry.ts')).toBe(true);
        const warm = loadedBy(args);
        expect(warm.status).toBe(cold.status);
        expect(matching(warm.packages, MARKDOWN_STACK)).toEqual([]);
        expect(matching(warm.packages, HTML_STACK)).toEqual([]);
        // Neither format's module nor its reader is loaded, nor the manuscript pass, the notations or the engines.
        expect([...warm.sources].filter((s) => /formats\/(markdown|latex)\.ts$|^plugins\/|^src\/core\/(manuscript|notation|invariants|analyze)\//.test(s))).toEqual([]);
      }
    } finally {
      rmSync(cache, { recursive: true, force: true });
      rmSync(out, { recursive: true, force: true });
    }
  });
});
