/**
 * The disk cache on a generated manuscript of 200 diagrams of 8–40 crossings
 * (random braid closures on 3–6 strands), each with its Jones polynomial,
 * Alexander polynomial, determinant, signature and crossing number filled in (and once more
 * with the HOMFLY-PT and Kauffman polynomials too), in Markdown and in LaTeX: `build` with an empty cache (cold), with the cache the cold run
 * filled (warm, median of 3: a replay of the remembered run, src/cli/run-memo.ts), and after one
 * diagram's code is edited (a full run that reads the unchanged diagrams' values from the cache). Each run
 * is the command line as a user runs it, start-up included. The outputs of
 * the three runs are compared with an uncached build byte for byte. Each time
 * is given as wall time and, in brackets, CPU time of the process (user +
 * system), which other work on the machine does not inflate.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { randomBraidWord, randomInt, rng } from '../test/support/random-diagrams.ts';

const ROOT = join(import.meta.dirname, '..');
const BIN = join(ROOT, 'bin', 'skeinproof.js');
export const DIAGRAMS = 200;
/** What each diagram fills in: the classical set, and the same with the two-variable polynomials (dearer to compute). */
export const LIGHT = ['jones', 'alexander', 'determinant', 'signature', 'crossing-number'];
const HEAVY = [...LIGHT, 'homfly', 'kauffman'];

interface Diagram {
  readonly id: string;
  readonly strands: number;
  readonly word: number[];
}

export function diagrams(): Diagram[] {
  const random = rng(2026);
  return Array.from({ length: DIAGRAMS }, (_, k) => {
    const strands = randomInt(random, 3, 6);
    return { id: `d${k}`, strands, word: randomBraidWord(random, strands, randomInt(random, 8, 40)) };
  });
}

export function markdown(list: readonly Diagram[], keys: readonly string[]): string {
  const body = list.map(
    (d) =>
      `\`\`\`skein id=${d.id} notation=braid strands=${d.strands}\n${d.word.join(' ')}\n\`\`\`\n\n` +
      `Diagram ${d.id}: ${keys.map((key) => `${key} :${key}{of=${d.id}}`).join(', ')}.\n`,
  );
  return `# A generated census\n\n${body.join('\n')}`;
}

export function latex(list: readonly Diagram[], keys: readonly string[]): string {
  const body = list.map(
    (d) =>
      `\\begin{skeincode}{id=${d.id}, notation=braid, strands=${d.strands}}\n${d.word.join(' ')}\n\\end{skeincode}\n` +
      `Diagram ${d.id}: ${keys.map((key) => `${key} $\\skeinvalue{${d.id}}{${key}}$`).join(', ')}.\n`,
  );
  return `\\documentclass{article}\n\\usepackage{skeinproof}\n\\begin{document}\n${body.join('\n')}\\end{document}\n`;
}

/**
 * CPU seconds (user + system) of the children this process has waited for, from /proc/self/stat
 * (cutime and cstime, in clock ticks of 1/100 s on Linux): unlike wall time, it does not grow when other
 * work shares the machine's cores.
 */
export function childCpuMs(): number {
  const fields = readFileSync('/proc/self/stat', 'utf8').replace(/^.*\) /, '').split(' ');
  // Fields 16 and 17 of stat(5); the text after "(comm) " starts at field 3.
  return (Number(fields[13]) + Number(fields[14])) * 10;
}

export interface Timing {
  readonly wallMs: number;
  readonly cpuMs: number;
}

/** Wall and CPU time of one `build`. */
export function build(cwd: string, file: string, output: string, cache: string[]): Timing {
  const start = performance.now();
  const cpu = childCpuMs();
  const r = spawnSync(process.execPath, [BIN, 'build', file, ...(output ? ['-o', output] : []), ...cache], { cwd, stdio: ['ignore', 'ignore', 'pipe'], encoding: 'utf8' });
  const timing = { wallMs: performance.now() - start, cpuMs: childCpuMs() - cpu };
  if (r.status !== 0) throw new Error(`skeinproof build ${file} failed with status ${r.status}: ${r.stderr}`);
  return timing;
}

const seconds = (ms: number): string => (ms / 1000).toFixed(2);
export const format = (t: Timing): string => `${seconds(t.wallMs)} s (${seconds(t.cpuMs)} s)`;

export function runCacheBench(): void {
  const work = mkdtempSync(join(tmpdir(), 'skeinproof-cache-bench-'));
  const lines = [
    `| manuscript of ${DIAGRAMS} diagrams (8–40 crossings), wall (CPU) | no cache | cold (empty cache) | warm (median of 3) | warm, --jobs 1 | after one edit | cold / warm | same output |`,
    '| --- | ---: | ---: | ---: | ---: | ---: | ---: | --- |',
  ];
  try {
    const list = diagrams();
    // One diagram's code edited: its first generator inverted (another diagram, so it must miss).
    const edited = list.map((d, k) => (k === DIAGRAMS / 2 ? { ...d, word: [-d.word[0]!, ...d.word.slice(1)] } : d));
    for (const [name, file, output, write, result, keys] of [
      ['Markdown; V, Δ, det, σ, c', 'census.md', 'census.filled.md', markdown, 'census.filled.md', LIGHT],
      ['LaTeX; V, Δ, det, σ, c', 'census.tex', '', latex, 'census.skein.tex', LIGHT],
      ['Markdown; also HOMFLY-PT and Kauffman F', 'census.md', 'census.filled.md', markdown, 'census.filled.md', HEAVY],
      ['LaTeX; also HOMFLY-PT and Kauffman F', 'census.tex', '', latex, 'census.skein.tex', HEAVY],
    ] as const) {
      const path = join(work, file);
      const cacheDir = mkdtempSync(join(work, 'cache-'));
      const cache = ['--cache-dir', cacheDir];
      writeFileSync(path, write(list, keys));
      const outputs: string[] = [];
      const none = build(work, file, output, ['--no-cache']);
      outputs.push(readFileSync(join(work, result), 'utf8'));
      const cold = build(work, file, output, cache);
      outputs.push(readFileSync(join(work, result), 'utf8'));
      const warms = [0, 1, 2].map(() => build(work, file, output, cache));
      outputs.push(readFileSync(join(work, result), 'utf8'));
      const warm = [...warms].sort((a, b) => a.wallMs - b.wallMs)[1]!;
      // The same warm run in one thread: the manuscript pool's start-up is then not part of it.
      const oneThread = [0, 1, 2].map(() => build(work, file, output, [...cache, '--jobs', '1'])).sort((a, b) => a.wallMs - b.wallMs)[1]!;
      writeFileSync(path, write(edited, keys));
      const afterEdit = build(work, file, output, cache);
      const editedOutput = readFileSync(join(work, result), 'utf8');
      build(work, file, output, ['--no-cache']);
      const same = outputs.every((o) => o === outputs[0]) && editedOutput === readFileSync(join(work, result), 'utf8');
      lines.push(`| ${name} | ${format(none)} | ${format(cold)} | ${format(warm)} | ${format(oneThread)} | ${format(afterEdit)} | ${(cold.wallMs / warm.wallMs).toFixed(1)}× (${(cold.cpuMs / warm.cpuMs).toFixed(1)}×) | ${same ? 'yes ✓' : 'NO'} |`);
    }
    console.log(`\n${lines.join('\n')}`);
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}

if (import.meta.url === `file://${process.argv[1]}`) runCacheBench();
