/**
 * Benchmark of the Arf invariant of links: each row times the two routes apart — V(i) from the bracket
 * engine's Jones polynomial (Murakami's theorem) and fusion of the components into knots by oriented
 * smoothings, with Levine's criterion on each knot's determinant (Robertello) — and checks that they agree
 * and that properness from V(i) matches the linking numbers. The torus-link rows are also checked against
 * a closed form: fusing T(2, 2k) once gives the knot T(2, 2k − 1), whose determinant is 2k − 1, so for even k
 * Arf = 0 exactly when 2k − 1 ≡ ±1 (mod 8) (Levine 1966).
 * Run alone with `node --import tsx bench/arf.ts`, or as part of `npm run bench`.
 */
import { pathToFileURL } from 'node:url';
import { linkingNumbers } from '../src/core/diagram/properties.ts';
import { closeBraid } from '../src/core/diagram/braid-closure.ts';
import { componentCount, type LinkDiagram } from '../src/core/diagram/model.ts';
import { arfByFusion, arfFromJonesAtI, oddLinkingComponents } from '../src/core/invariants/arf.ts';
import { jonesPolynomial } from '../src/core/invariants/jones.ts';
import { randomBraidWord, rng, shuffleDiagram } from '../test/support/random-diagrams.ts';

function timed<T>(work: () => T): { value: T; ms: number } {
  const start = performance.now();
  const value = work();
  return { value, ms: performance.now() - start };
}

const fmt = (ms: number): string => (ms >= 1000 ? `${(ms / 1000).toFixed(2)} s` : ms >= 10 ? `${ms.toFixed(0)} ms` : `${ms.toFixed(1)} ms`);

/** A pure braid on `strands` strands: σᵢ^power for each i, so neighbouring components link power/2 times. */
function chain(strands: number, power: number): LinkDiagram {
  const word: number[] = [];
  for (let i = 1; i < strands; i++) for (let k = 0; k < power; k++) word.push(i);
  return closeBraid(word, strands);
}

interface Case {
  readonly name: string;
  readonly diagram: LinkDiagram;
  /** The Arf invariant by a closed form, when one is known. */
  readonly expected?: 0 | 1 | null;
}

export function runArfBench(): void {
  const random = rng(6061);
  const cases: Case[] = [
    { name: 'T(2, 200) (lk 100)', diagram: closeBraid(new Array<number>(200).fill(1), 2), expected: [1n, 7n].includes(199n % 8n) ? 0 : 1 },
    { name: 'T(2, 202) (lk 101, not proper)', diagram: closeBraid(new Array<number>(202).fill(1), 2), expected: null },
    { name: 'chain of 40 components, σᵢ⁴ (lk 2 between neighbours)', diagram: chain(40, 4) },
    { name: 'chain of 100 components, σᵢ⁴', diagram: chain(100, 4) },
    { name: 'random 6-strand braid closure, shuffled', diagram: shuffleDiagram(closeBraid(randomBraidWord(random, 6, 300), 6), random) },
    { name: 'random 8-strand braid closure, shuffled', diagram: shuffleDiagram(closeBraid(randomBraidWord(random, 8, 300), 8), random) },
  ];
  console.log('\nArf invariant of links (two routes, timed apart)\n');
  console.log('| link | crossings | components | proper | V(i) route | fusion route | Arf | check |');
  console.log('| --- | ---: | ---: | --- | ---: | ---: | ---: | --- |');
  for (const { name, diagram, expected } of cases) {
    const mu = componentCount(diagram);
    const odd = oddLinkingComponents(linkingNumbers(diagram), mu);
    const jones = timed(() => arfFromJonesAtI(jonesPolynomial(diagram), mu));
    const proper = odd.length === 0;
    const fusion = proper ? timed(() => arfByFusion(diagram)) : undefined;
    const agree = (jones.value === null) === !proper && (fusion === undefined || fusion.value === jones.value);
    const closed = expected === undefined ? '' : jones.value === expected ? ', closed form ✓' : ', closed form ✗ FAILED';
    console.log(
      `| ${name} | ${diagram.crossings.length} | ${mu} | ${proper ? 'yes' : 'no'} | ${fmt(jones.ms)} | ${fusion ? fmt(fusion.ms) : '—'} | ${jones.value ?? '—'} | ${agree ? 'routes agree ✓' : '✗ FAILED'}${closed} |`,
    );
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) runArfBench();
