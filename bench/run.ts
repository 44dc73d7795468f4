/**
 * `npm run bench`: how fast the tangle-contraction bracket engine is, family
 * by family, and how it compares with the 2^n state sum. Prints a Markdown
 * table (pasted into the README section `benchmarks`). Every row also checks
 * its answer against something independent, so a fast wrong engine shows up.
 */
import os from 'node:os';
import { mkdtempSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { closeBraid } from '../src/core/diagram/braid-closure.ts';
import { componentCount, writhe, type LinkDiagram, type Notation } from '../src/core/diagram/model.ts';
import { connectedSum } from '../src/core/diagram/operations.ts';
import { kauffmanBracket, type BracketResult } from '../src/core/invariants/bracket.ts';
import { jonesFromBracket } from '../src/core/invariants/jones.ts';
import { bracketByStateSum } from '../src/core/invariants/state-sum.ts';
import { printPdCode } from '../src/core/notation/print.ts';
import type { Laurent } from '../src/core/poly/laurent.ts';
import { randomBraidWord, rng, shuffleDiagram } from '../test/support/random-diagrams.ts';
import { alternatingBraidClosure, torusBraid, torusKnotJones } from './families.ts';

type Parser = (text: string, notation: Notation) => LinkDiagram;

// The command lines the benchmarks spawn keep their disk cache in a temporary directory, never the user's.
const benchCache = mkdtempSync(join(os.tmpdir(), 'skeinproof-bench-cache-'));
process.env['SKEINPROOF_CACHE_DIR'] = benchCache;
process.on('exit', () => rmSync(benchCache, { recursive: true, force: true }));

interface Row {
  family: string;
  input: string;
  crossings: number;
  width: number;
  milliseconds: number;
  check: string;
  /** Heap in use right after the computation, and the process's peak resident size so far, in MiB. */
  heapMb: number;
  peakRssMb: number;
}

const rows: Row[] = [];

/** The shared parser when the notation module provides it; otherwise undefined and diagrams are built directly. */
async function loadParser(): Promise<Parser | undefined> {
  try {
    const notation = (await import('../src/core/notation/index.ts')) as { parseDiagramCode?: Parser };
    return typeof notation.parseDiagramCode === 'function' ? notation.parseDiagramCode : undefined;
  } catch {
    return undefined;
  }
}

function timed<T>(work: () => T): { value: T; milliseconds: number } {
  const start = performance.now();
  const value = work();
  return { value, milliseconds: performance.now() - start };
}

/** Runs `work` until at least `minimumMs` has passed (at least once) and returns the mean time per run. */
function meanTime<T>(work: () => T, minimumMs: number): { value: T; milliseconds: number } {
  let runs = 0;
  let value: T;
  const start = performance.now();
  do {
    value = work();
    runs++;
  } while (performance.now() - start < minimumMs);
  return { value: value!, milliseconds: (performance.now() - start) / runs };
}

function jonesOf(d: LinkDiagram, result: BracketResult): Laurent {
  return jonesFromBracket(result.bracket, writhe(d));
}

/** V(1) = (−2)^(μ−1) (Jones 1985): a cheap exact sanity check for any size. */
function valueAtOneCheck(d: LinkDiagram, result: BracketResult): string {
  const ok = jonesOf(d, result).valueAtOne() === (-2n) ** BigInt(componentCount(d) - 1);
  return ok ? 'V(1) = (−2)^(μ−1) ✓' : 'V(1) WRONG';
}

function spanCheck(d: LinkDiagram, result: BracketResult): string {
  // Reduced alternating, connected: span V = crossings (Kauffman, Murasugi, Thistlethwaite 1987).
  const v = jonesOf(d, result);
  return v.span === d.crossings.length && valueAtOneCheck(d, result).endsWith('✓') ? 'span V = n, V(1) ✓' : 'span/V(1) WRONG';
}

function bench(family: string, input: string, d: LinkDiagram, check: (d: LinkDiagram, r: BracketResult) => string): void {
  const { value, milliseconds } = timed(() => kauffmanBracket(d));
  const memory = memoryNow();
  rows.push({ family, input, crossings: d.crossings.length, width: value.boundaryWidth, milliseconds, check: check(d, value), ...memory });
}

function memoryNow(): { heapMb: number; peakRssMb: number } {
  return { heapMb: process.memoryUsage().heapUsed / 2 ** 20, peakRssMb: process.resourceUsage().maxRSS / 1024 };
}

function formatMs(ms: number): string {
  return ms < 10 ? `${ms.toFixed(2)} ms` : ms < 10_000 ? `${ms.toFixed(0)} ms` : `${(ms / 1000).toFixed(1)} s`;
}

async function main(): Promise<void> {
  const parse = await loadParser();
  const viaParser = parse ? 'PD text, parsed' : 'built directly (PD parser not available)';

  // 300-crossing reduced alternating diagram, crossings shuffled, through PD text.
  for (const [strands, seed] of [[6, 300], [5, 301]] as const) {
    const built = alternatingBraidClosure(seed, strands, 300);
    const text = printPdCode(built);
    const parsed = timed(() => (parse ? parse(text, 'pd') : built));
    const input = parse ? `PD text, parsed in ${formatMs(parsed.milliseconds)}` : viaParser;
    bench(`alternating, ${strands}-strand closure, shuffled`, input, parsed.value, spanCheck);
  }

  // Torus knot T(7,13) as the braid (σ1…σ6)^13.
  const word = torusBraid(7, 13);
  const torus = parse ? parse(word.join(' '), 'braid') : closeBraid(word, 7);
  bench('torus knot T(7,13)', parse ? 'braid word, parsed' : 'braid word, built directly', torus, (d, r) =>
    jonesOf(d, r).equals(torusKnotJones(7, 13)) ? 'Jones 1987 formula ✓' : 'WRONG',
  );
  const torus2 = closeBraid(torusBraid(5, 31), 5);
  bench('torus knot T(5,31)', 'braid word, built directly', torus2, (d, r) =>
    jonesOf(d, r).equals(torusKnotJones(5, 31)) ? 'Jones 1987 formula ✓' : 'WRONG',
  );

  // Other families.
  for (const n of [100, 200, 1000]) bench(`alternating, 4-strand closure, shuffled`, 'built directly', alternatingBraidClosure(n, 4, n), spanCheck);
  bench('alternating, 8-strand closure, shuffled', 'built directly', alternatingBraidClosure(8, 8, 300), spanCheck);
  bench('alternating, 9-strand closure, shuffled', 'built directly', alternatingBraidClosure(9, 9, 300), spanCheck);
  const randomWord = randomBraidWord(rng(42), 6, 400);
  bench('random 6-strand braid closure, shuffled', 'built directly', shuffleDiagram(closeBraid(randomWord, 6), rng(43)), valueAtOneCheck);
  let chain = closeBraid([1, 1, 1], 2);
  for (let k = 1; k < 60; k++) chain = connectedSum(chain, closeBraid(k % 2 ? [1, -2, 1, -2] : [-1, -1, -1], k % 2 ? 3 : 2), 0, 0);
  bench('connected sum of 60 trefoils and figure-eights', 'built directly', shuffleDiagram(chain, rng(44)), valueAtOneCheck);

  // Side by side with the 2^n state sum at 22 crossings.
  const small = alternatingBraidClosure(22, 4, 22);
  const fast = meanTime(() => kauffmanBracket(small), 500);
  const slow = timed(() => bracketByStateSum(small));
  const same = fast.value.bracket.equals(slow.value);
  rows.push({
    family: 'alternating, 4-strand closure (tangle engine)',
    input: 'built directly',
    crossings: 22,
    width: fast.value.boundaryWidth,
    milliseconds: fast.milliseconds,
    check: same ? 'equals the state sum ✓' : 'DIFFERS from the state sum',
    ...memoryNow(),
  });
  rows.push({
    family: 'same diagram, 2^22-state sum',
    input: 'built directly',
    crossings: 22,
    width: 0,
    milliseconds: slow.milliseconds,
    check: `tangle engine ${Math.round(slow.milliseconds / fast.milliseconds)}× faster`,
    ...memoryNow(),
  });

  const lines = [
    '| family | input | crossings | widest boundary | time | heap after | peak RSS so far | check |',
    '| --- | --- | ---: | ---: | ---: | ---: | ---: | --- |',
    ...rows.map(
      (r) =>
        `| ${r.family} | ${r.input} | ${r.crossings} | ${r.width || '—'} | ${formatMs(r.milliseconds)} | ` +
        `${r.heapMb.toFixed(0)} MiB | ${r.peakRssMb.toFixed(0)} MiB | ${r.check} |`,
    ),
  ];
  console.log(lines.join('\n'));
  console.log(`\n(node ${process.version}, ${process.platform}/${process.arch}, ${os.cpus().length} cores)`);
  if (rows.some((r) => /WRONG|DIFFERS/.test(r.check))) process.exitCode = 1;
}

await main();
await import('./engine-constants.ts').then((engine) => engine.runEngineConstantsBench());
await import('./digit-kernels.ts').then((kernels) => kernels.runDigitKernelBench());
await import('./classical.ts').then((classical) => classical.runClassicalBench());
await import('./khovanov.ts').then((khovanov) => khovanov.runKhovanovBench());
await import('./speed.ts').then((speed) => speed.runSpeedBench());
await import('./cache.ts').then((cache) => cache.runCacheBench());
await import('./big-markdown.ts').then((big) => big.runBigMarkdownBench());
await import('./skein-polynomials.ts').then((skein) => skein.runSkeinPolynomialBench());
await import('./arf.ts').then((arf) => arf.runArfBench());
await import('./figures.ts').then((figures) => figures.runFigureBench());
await import('./figure-manuscripts.ts').then((figures) => figures.runFigureManuscriptBench());
await import('./simplify.ts').then((simplify) => simplify.runSimplifyBench());
