#!/usr/bin/env node
// Compiles the command line ahead of time (run by `npm ci` through the `prepare` script, and by the
// test suite's global setup), so `bin/skeinproof.js` starts without transpiling anything.
// Everything is bundled, packages too (one file read instead of hundreds of module resolutions, and
// the installed tool needs no runtime packages). Dynamic imports become chunks of their own, so a
// command loads only the stacks it uses.
import { build } from 'esbuild';
import { createHash } from 'node:crypto';
import { cpSync, mkdirSync, readdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { basename, dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const finalDir = join(root, 'dist');
// Built beside dist/ and swapped in, so a command started meanwhile finds the old build or the new one, never half of one.
const outdir = join(root, `dist.building-${process.pid}`);
rmSync(outdir, { recursive: true, force: true });
const result = await build({
  absWorkingDir: root,
  entryPoints: { main: 'src/cli/main.ts', 'pool-worker': 'src/cli/pool/worker.ts', 'replay-worker': 'src/cli/replay-worker.ts' },
  outdir,
  bundle: true,
  splitting: true,
  format: 'esm',
  platform: 'node',
  target: 'node20',
  chunkNames: 'chunks/[name]-[hash]',
  // Bundled CommonJS packages call require(); an ES module has none of its own.
  banner: { js: "import { createRequire as skeinCreateRequire } from 'node:module'; const require = skeinCreateRequire(import.meta.url);" },
  logLevel: 'warning',
  metafile: true,
  // The disk cache keys values by the engine's version (src/cli/engine-version.ts): a digest of the core's sources.
  // A Markdown build remembers KaTeX's verdicts by the versions of KaTeX and the packages (src/cli/formats/remembered-math.ts).
  // A remembered run is keyed by the tool's version: a digest of every source and the package lock (src/cli/run-memo.ts).
  define: {
    SKEINPROOF_ENGINE_DIGEST: JSON.stringify(digestOfSources([join(root, 'src', 'core')])),
    SKEINPROOF_TOOL_DIGEST: JSON.stringify(digestOfSources(['src', 'plugins', 'scripts', 'package.json', 'package-lock.json'].map((p) => join(root, p)))),
    SKEINPROOF_MATH_READER: JSON.stringify(mathReaderVersion()),
  },
});
writeFileSync(join(outdir, 'build-graph.json'), `${JSON.stringify(buildGraph(result.metafile), null, 1)}\n`);

// The HTML page inlines KaTeX's stylesheet and fonts; the installed tool reads them from dist/katex.
const katexDist = dirname(createRequire(import.meta.url).resolve('katex/dist/katex.min.css'));
mkdirSync(join(outdir, 'katex'));
cpSync(join(katexDist, 'katex.min.css'), join(outdir, 'katex', 'katex.min.css'));
cpSync(join(katexDist, 'fonts'), join(outdir, 'katex', 'fonts'), { recursive: true, filter: (path) => !/\.(woff|ttf)$/.test(path) });

const previous = `${finalDir}.old-${process.pid}`;
try {
  renameSync(finalDir, previous);
} catch (error) {
  if (error.code !== 'ENOENT') throw error;
}
renameSync(outdir, finalDir);
rmSync(previous, { recursive: true, force: true });

/**
 * Which sources and packages each output file holds and which outputs it imports statically:
 * the lazy-loading test reads it to name the packages behind the chunks a command loaded.
 */
function buildGraph(metafile) {
  const graph = {};
  for (const [path, output] of Object.entries(metafile.outputs)) {
    const packages = new Set();
    const sources = [];
    for (const input of Object.keys(output.inputs)) {
      const inPackage = /^(?:.*\/)?node_modules\/((?:@[^/]+\/)?[^/]+)/.exec(input);
      if (inPackage) packages.add(inPackage[1]);
      else sources.push(input);
    }
    graph[path.replace(/^dist\.building-\d+\//, '')] = {
      entryPoint: output.entryPoint ?? null,
      staticImports: output.imports.filter((i) => i.kind === 'import-statement' && !i.external).map((i) => i.path.replace(/^dist\.building-\d+\//, '')),
      packages: [...packages].sort(),
      sources,
    };
  }
  return graph;
}

/** As src/cli/formats/remembered-math.ts computes it from the sources: KaTeX's version and a digest of the package lock. */
function mathReaderVersion() {
  const katex = JSON.parse(readFileSync(join(root, 'node_modules', 'katex', 'package.json'), 'utf8'));
  const lock = createHash('sha256').update(readFileSync(join(root, 'package-lock.json'))).digest('hex');
  return `katex ${katex.version}, packages ${lock.slice(0, 16)}`;
}

/**
 * SHA-256 over the path (relative to its root; a root that is a file: its name) and text of every file under
 * each root, in sorted order (as src/cli/engine-version.ts computes it).
 */
function digestOfSources(roots) {
  const hash = createHash('sha256');
  for (const dir of roots) {
    if (statSync(dir).isFile()) {
      hash.update(`${basename(dir)}\u0000`).update(readFileSync(dir)).update('\u0000');
      continue;
    }
    const paths = readdirSync(dir, { recursive: true, withFileTypes: true })
      .filter((entry) => entry.isFile())
      .map((entry) => join(entry.parentPath, entry.name))
      .sort();
    for (const path of paths) hash.update(`${path.slice(dir.length)}\u0000`).update(readFileSync(path)).update('\u0000');
  }
  return hash.digest('hex').slice(0, 16);
}
