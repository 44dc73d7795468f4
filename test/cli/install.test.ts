/**
 * skeinproof installs as a tool: `npm pack` gives a tarball that
 * `npm install -g` puts into a clean prefix, and its `skeinproof` runs there,
 * outside the clone, with no package fetched (everything it runs is compiled
 * into dist/, KaTeX's stylesheet and fonts included).
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, rmSync, copyFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';

const ROOT = join(import.meta.dirname, '..', '..');
const work = mkdtempSync(join(tmpdir(), 'skeinproof-install-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

describe('the packed tarball', () => {
  it('has no runtime dependencies to fetch: packages are bundled into dist/', () => {
    const pkg = JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8')) as { private?: boolean; dependencies?: Record<string, string> };
    expect(pkg.private, 'the package must not be private').toBeFalsy();
    // A runtime package belongs in devDependencies: scripts/compile.mjs bundles it.
    expect(Object.keys(pkg.dependencies ?? {})).toEqual([]);
  });

  it('installs into a clean prefix and its skeinproof runs', () => {
    const npm = (args: string[], cwd: string) => execFileSync('npm', args, { cwd, encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
    // The suite's global setup has just compiled dist/; packing must not rebuild it under the other tests.
    npm(['pack', '--ignore-scripts', '--pack-destination', work], ROOT);
    const tarball = readdirSync(work).find((f) => /^skeinproof-.*\.tgz$/.test(f));
    expect(tarball).toBeDefined();
    const prefix = join(work, 'prefix');
    npm(['install', '-g', `./${tarball}`, '--prefix', prefix, '--offline', '--no-audit', '--no-fund'], work);
    const bin = join(prefix, 'bin', 'skeinproof');
    expect(existsSync(bin)).toBe(true);
    const run = (args: string[]) => spawnSync(bin, args, { cwd: work, encoding: 'utf8', timeout: 30_000, env: { ...process.env, PATH: `${join(prefix, 'bin')}:${process.env.PATH}` } });

    const help = run(['--help']);
    expect(help.status).toBe(0);
    expect(help.stdout).toContain('compute');

    // Positive trefoil, V = t + t³ − t⁴ (Jones 1985; from memory).
    const computed = run(['compute', '-n', 'braid', '1 1 1']);
    expect(computed.status).toBe(0);
    expect(computed.stdout).toContain('t + t^3 - t^4');

    copyFileSync(join(ROOT, 'samples', 'twists-and-weaves.md'), join(work, 'note.md'));
    const page = run(['build', 'note.md', '-o', 'note.html']);
    expect(page.status).toBe(0);
    const html = readFileSync(join(work, 'note.html'), 'utf8');
    expect(html).toContain('class="katex"');
    expect(html).toMatch(/src:url\(data:font\/woff2;base64,/);
    // The LaTeX package ships with the tool.
    expect(existsSync(join(prefix, 'lib', 'node_modules', 'skeinproof', 'plugins', 'latex', 'skeinproof.sty'))).toBe(true);
  });
});
