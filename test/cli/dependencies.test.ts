/**
 * The installed packages (all development dependencies: the command line is
 * compiled with them into dist/): one KaTeX for the page's stylesheet and for
 * rehype-katex (two versions would typeset with one and style with the other),
 * every package runs on the Node version we support, and every declared
 * package is used. Version ranges read as npm documents them (common practice).
 */
import { readFileSync, readdirSync, statSync } from 'node:fs';
import { createRequire } from 'node:module';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOT = join(import.meta.dirname, '..', '..');
const manifest = JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8')) as { devDependencies: Record<string, string> };
const lock = JSON.parse(readFileSync(join(ROOT, 'package-lock.json'), 'utf8')) as {
  packages: Record<string, { version?: string; dev?: boolean; engines?: { node?: string } }>;
};

function versionOf(from: string, name: string): string {
  const require = createRequire(join(from, 'package.json'));
  return (JSON.parse(readFileSync(require.resolve(`${name}/package.json`), 'utf8')) as { version: string }).version;
}

/** `>=a.b.c`, `^a.b.c`, `a.*` and `||` alternatives: the forms the runtime tree uses. */
function nodeSatisfies(range: string, version: string): boolean {
  const have = version.split('.').map(Number);
  return range.split('||').some((alternative) => {
    const text = alternative.trim();
    const wildcard = /^(\d+)\.\*$/.exec(text);
    if (wildcard) return Number(wildcard[1]) === have[0];
    const bound = /^(>=|\^)\s*(\d+)(?:\.(\d+|x|\*))?(?:\.(\d+|x|\*))?$/.exec(text);
    if (!bound) throw new Error(`engine range ${text} is not understood by this test`);
    const want = [Number(bound[2]), Number(bound[3]) || 0, Number(bound[4]) || 0];
    if (bound[1] === '^' && have[0] !== want[0]) return false;
    for (let i = 0; i < 3; i++) if (have[i] !== want[i]) return have[i]! > want[i]!;
    return true;
  });
}

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? sourceFiles(path) : /\.(ts|m?js)$/.test(name) ? [path] : [];
  });
}

describe('dependencies', () => {
  it('rehype-katex typesets with the KaTeX whose stylesheet the page inlines', () => {
    const rehypeKatexDir = join(ROOT, 'node_modules', 'rehype-katex');
    expect(versionOf(rehypeKatexDir, 'katex')).toBe(versionOf(ROOT, 'katex'));
    expect(manifest.devDependencies['katex']).toBe(versionOf(ROOT, 'katex'));
  });

  it('every installed package accepts the Node version we run on', () => {
    const refusing = Object.entries(lock.packages)
      .filter(([path, p]) => path !== '' && p.engines?.node !== undefined && !nodeSatisfies(p.engines.node, process.versions.node))
      .map(([path, p]) => `${path} wants node ${p.engines!.node}`);
    expect(refusing).toEqual([]);
  });

  it('every declared package is imported somewhere, or is a tool run by name', () => {
    // cli-progress is kept for the batch progress bar being written (issue 10).
    const TOOLS = new Set(['typescript', 'vitest', 'vite', 'tsx', 'cli-progress']);
    const code = ['src', 'plugins', 'bin', 'scripts', 'test', 'bench'].flatMap((d) => sourceFiles(join(ROOT, d))).map((f) => readFileSync(f, 'utf8')).join('\n');
    const unused = Object.keys(manifest.devDependencies).filter((name) => !name.startsWith('@types/') && !TOOLS.has(name) && !code.includes(`'${name}`));
    expect(unused).toEqual([]);
  });
});
