/**
 * Benchmark of the simplifier: the same diagrams searched with and without
 * flypes, side by side in one run, so the price and the gain of flypes show as
 * ratios. Each row reports the mean processor time per diagram (user + system,
 * which other work on a shared machine disturbs less than wall time), the crossings left, and
 * checks that the Jones polynomial did not change (Jones 1985: an isotopy
 * invariant); the rows of hidden bigons also check that the crossing number of
 * the alternating diagram they came from (Kauffman–Murasugi–Thistlethwaite) was
 * reached.
 * Run alone with `node --import tsx bench/simplify.ts`, or as part of `npm run bench`.
 */
import { pathToFileURL } from 'node:url';
import { closeBraid } from '../src/core/diagram/braid-closure.ts';
import type { LinkDiagram } from '../src/core/diagram/model.ts';
import { diagramProperties } from '../src/core/diagram/properties.ts';
import { jonesPolynomial } from '../src/core/invariants/jones.ts';
import { parseDiagramCode } from '../src/core/notation/index.ts';
import { flype, flypeSites } from '../src/core/simplify/flype.ts';
import { overBigons } from '../src/core/simplify/moves.ts';
import { DEFAULT_BUDGET, simplifyDiagram } from '../src/core/simplify/simplify.ts';
import { randomAlternatingBraidWord, randomBraidWord, randomInt, rng, shuffleDiagram } from '../test/support/random-diagrams.ts';

interface Case {
  readonly diagram: LinkDiagram;
  /** The crossing number, when known independently of the simplifier. */
  readonly crossingNumber?: number;
}

const fmt = (ms: number): string => (ms >= 1000 ? `${(ms / 1000).toFixed(2)} s` : ms >= 10 ? `${ms.toFixed(0)} ms` : `${ms.toFixed(2)} ms`);

/**
 * A reduced alternating braid closure of about `n` crossings with a bigon σσ⁻¹ pushed in and one of its
 * crossings flyped across a tangle, so that no bigon or nugatory crossing is left for the greedy moves.
 */
function hiddenBigon(random: () => number, n: number): Case | undefined {
  const strands = randomInt(random, 3, 6);
  const word = randomAlternatingBraidWord(random, strands, n);
  const at = randomInt(random, 0, n);
  const g = randomInt(random, 1, strands - 1);
  const padded = closeBraid([...word.slice(0, at), g, -g, ...word.slice(at)], strands);
  for (const site of flypeSites(padded)) {
    if (site.crossing !== at && site.crossing !== at + 1) continue;
    const hidden = flype(padded, site);
    if (hidden && overBigons(hidden).length === 0 && diagramProperties(hidden).reduced) return { diagram: shuffleDiagram(hidden, random), crossingNumber: n };
  }
  return undefined;
}

/** Up to `count` such diagrams, from at most 50·count attempts (larger diagrams rarely leave the bigon hidden). */
function hiddenBigons(seed: number, count: number, n: number): Case[] {
  const random = rng(seed);
  const cases: Case[] = [];
  for (let attempt = 0; attempt < 50 * count && cases.length < count; attempt++) {
    const c = hiddenBigon(random, n);
    if (c) cases.push(c);
  }
  return cases;
}

function randomClosures(seed: number, count: number, strands: number, n: number): Case[] {
  const random = rng(seed);
  return Array.from({ length: count }, () => ({ diagram: shuffleDiagram(closeBraid(randomBraidWord(random, strands, n), strands), random) }));
}

interface Outcome {
  readonly ms: number;
  readonly crossingsLeft: number;
  readonly reachedMinimum: number;
  readonly jonesKept: boolean;
}

function run(cases: readonly Case[], flypes: boolean, checkJones: boolean): Outcome {
  let ms = 0;
  let left = 0;
  let reached = 0;
  let jonesKept = true;
  for (const { diagram, crossingNumber } of cases) {
    const start = process.cpuUsage();
    const result = simplifyDiagram(diagram, { ...DEFAULT_BUDGET, flypeWork: flypes ? DEFAULT_BUDGET.flypeWork : 0 });
    const used = process.cpuUsage(start);
    ms += (used.user + used.system) / 1000;
    left += result.diagram.crossings.length;
    if (result.diagram.crossings.length === crossingNumber) reached++;
    if (checkJones && !jonesPolynomial(result.diagram).equals(jonesPolynomial(diagram))) jonesKept = false;
  }
  return { ms: ms / cases.length, crossingsLeft: left / cases.length, reachedMinimum: reached, jonesKept };
}

export function runSimplifyBench(): void {
  const rows: [string, () => readonly Case[], boolean][] = [
    ['alternating, a bigon hidden by a flype, 20 crossings (+2)', () => hiddenBigons(31, 20, 20), true],
    ['alternating, a bigon hidden by a flype, 30 crossings (+2)', () => hiddenBigons(32, 10, 30), true],
    ['P(1, 3, 3, 3, −1, 3, 3, 3)', () => [{ diagram: parseDiagramCode('pretzel 1 3 3 3 -1 3 3 3', 'family'), crossingNumber: 18 }], true],
    ['P(1, 5 ×6, −1, 5 ×6)', () => [{ diagram: parseDiagramCode(`pretzel 1 ${'5 '.repeat(6)}-1 ${'5 '.repeat(6)}`.trim(), 'family'), crossingNumber: 60 }], false],
    ['random 4-strand braid closure, 40 crossings, shuffled', () => randomClosures(41, 20, 4, 40), true],
    ['random 6-strand braid closure, 120 crossings, shuffled', () => randomClosures(42, 10, 6, 120), false],
    ['random 8-strand braid closure, 250 crossings, shuffled', () => randomClosures(43, 5, 8, 250), false],
  ];
  console.log('\nSimplifier with and without flypes (same diagrams, one run; mean processor time per diagram)\n');
  console.log('| diagrams | count | crossings | without flypes: time | left | with flypes: time | left | reached c | check |');
  console.log('| --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: | --- |');
  for (const [name, build, checkJones] of rows) {
    const cases = build();
    if (cases.length === 0) {
      console.log(`| ${name} | 0 | — | — | — | — | — | — | none built |`);
      continue;
    }
    const without = run(cases, false, checkJones);
    const withFlypes = run(cases, true, checkJones);
    const known = cases.every((c) => c.crossingNumber !== undefined);
    const reached = known ? `${without.reachedMinimum} → ${withFlypes.reachedMinimum} of ${cases.length}` : '—';
    const check = checkJones ? (without.jonesKept && withFlypes.jonesKept ? 'V unchanged ✓' : 'V CHANGED ✗ FAILED') : '—';
    const crossings = cases.reduce((s, c) => s + c.diagram.crossings.length, 0) / cases.length;
    console.log(
      `| ${name} | ${cases.length} | ${crossings.toFixed(0)} | ${fmt(without.ms)} | ${without.crossingsLeft.toFixed(1)} | ${fmt(withFlypes.ms)} | ${withFlypes.crossingsLeft.toFixed(1)} | ${reached} | ${check} |`,
    );
    if (/FAILED/.test(check)) process.exitCode = 1;
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) runSimplifyBench();
