/**
 * Benchmark of the classical invariants: Alexander polynomial (modular
 * determinants of the Seifert pencil), signature from V + Vᵀ and from the
 * Goeritz matrix, Traczyk's count and the determinant, on reduced alternating
 * braid closures with shuffled crossings and on torus knots. Every row checks
 * its answer against something independent. Run alone with
 * `node --import tsx bench/classical.ts`, or as part of `npm run bench`.
 */
import { pathToFileURL } from 'node:url';
import { closeBraid } from '../src/core/diagram/braid-closure.ts';
import { componentCount, type LinkDiagram } from '../src/core/diagram/model.ts';
import { alexanderFromSeifertMatrix } from '../src/core/invariants/classical/alexander.ts';
import { goeritzInvariants } from '../src/core/invariants/classical/goeritz.ts';
import { absoluteValueAtMinusOne } from '../src/core/invariants/classical/index.ts';
import { seifertSurface } from '../src/core/invariants/classical/seifert.ts';
import { signatureFromSeifertMatrix } from '../src/core/invariants/classical/signature.ts';
import { traczykSignature } from '../src/core/invariants/classical/traczyk.ts';
import { Laurent } from '../src/core/poly/laurent.ts';
import { randomAlternatingBraidWord, rng, shuffleDiagram } from '../test/support/random-diagrams.ts';

interface Row {
  readonly family: string;
  readonly crossings: number;
  readonly size: number;
  readonly primes: number;
  readonly alexanderMs: number;
  readonly signatureMs: number;
  readonly goeritzMs: number;
  readonly check: string;
}

function timed<T>(work: () => T): { value: T; ms: number } {
  const start = performance.now();
  const value = work();
  return { value, ms: performance.now() - start };
}

/** A knot: the first seed from `seed` on whose alternating braid closure has one component. */
function alternatingKnot(seed: number, strands: number, crossings: number): LinkDiagram {
  for (let s = seed; ; s++) {
    const random = rng(s);
    const d = shuffleDiagram(closeBraid(randomAlternatingBraidWord(random, strands, crossings), strands), random);
    if (componentCount(d) === 1) return d;
  }
}

function torusKnot(p: number, q: number): LinkDiagram {
  const word: number[] = [];
  for (let k = 0; k < q; k++) for (let i = 1; i < p; i++) word.push(i);
  return closeBraid(word, p);
}

function torusAlexander(p: number, q: number): Laurent {
  const minusOne = (k: number): Laurent => Laurent.monomial(k).sub(Laurent.one);
  return minusOne(p * q).mul(minusOne(1)).divExact(minusOne(p).mul(minusOne(q))).shift(-((p - 1) * (q - 1)) / 2);
}

/** σ(T(p,q)) by counting lattice points (Gordon–Litherland–Murasugi). */
function torusSignature(p: number, q: number): number {
  let sigma = 0;
  for (let i = 1; i < p; i++) for (let j = 1; j < q; j++) sigma += 2 * (i * q + j * p) > p * q && 2 * (i * q + j * p) < 3 * p * q ? -1 : 1;
  return sigma;
}

const digits = (n: bigint): string => {
  const count = n.toString().length;
  return `${count} digit${count === 1 ? '' : 's'}`;
};

function measure(family: string, d: LinkDiagram, expected?: { alexander: Laurent; signature: number }): Row {
  const surface = seifertSurface(d);
  const alexander = timed(() => alexanderFromSeifertMatrix(surface.matrix));
  const signature = timed(() => signatureFromSeifertMatrix(surface.matrix));
  const goeritz = timed(() => goeritzInvariants(d));
  const traczyk = traczykSignature(d);
  const delta = alexander.value.alexander;
  const checks: string[] = [];
  checks.push(delta.valueAtOne() === 1n && delta.substitutePower(-1).equals(delta) ? 'Δ(1) = 1, symmetric ✓' : 'Δ WRONG');
  checks.push(absoluteValueAtMinusOne(delta) === goeritz.value.determinant ? '|Δ(−1)| = |det G| ✓' : 'det WRONG');
  checks.push(goeritz.value.signature === signature.value ? 'Goeritz σ ✓' : 'Goeritz σ WRONG');
  if (traczyk !== null) checks.push(traczyk === signature.value ? 'Traczyk ✓' : 'Traczyk WRONG');
  if (expected) {
    checks.push(delta.equals(expected.alexander) ? 'torus Δ formula ✓' : 'torus Δ WRONG');
    checks.push(signature.value === expected.signature ? 'lattice-count σ ✓' : 'torus σ WRONG');
  }
  return {
    family: `${family} (σ = ${signature.value}, det has ${digits(goeritz.value.determinant)})`,
    crossings: d.crossings.length,
    size: surface.matrix.size,
    primes: alexander.value.primes,
    alexanderMs: alexander.ms,
    signatureMs: signature.ms,
    goeritzMs: goeritz.ms,
    check: checks.join(', '),
  };
}

export function runClassicalBench(): void {
  const rows: Row[] = [];
  for (const n of [50, 100, 200, 300]) rows.push(measure(`alternating 5-braid knot, shuffled`, alternatingKnot(n, 5, n)));
  // A long thin diagram, as `compute --json` meets them: the bracket engine handles such diagrams in milliseconds.
  // (An odd crossing count: a knot closing a 4-braid needs a 4-cycle, an odd permutation.)
  rows.push(measure('alternating 4-braid knot, shuffled', alternatingKnot(601, 4, 601)));
  rows.push(measure('torus knot T(5,61)', torusKnot(5, 61), { alexander: torusAlexander(5, 61), signature: torusSignature(5, 61) }));
  const seconds = (ms: number): string => (ms >= 1000 ? `${(ms / 1000).toFixed(2)} s` : `${ms.toFixed(0)} ms`);
  const lines = [
    '| diagram | crossings | Seifert matrix | primes | Δ | σ from V + Vᵀ | Goeritz det + σ | checks |',
    '| --- | ---: | ---: | ---: | ---: | ---: | ---: | --- |',
    ...rows.map(
      (r) =>
        `| ${r.family} | ${r.crossings} | ${r.size}×${r.size} | ${r.primes} | ${seconds(r.alexanderMs)} | ${seconds(r.signatureMs)} | ${seconds(r.goeritzMs)} | ${r.check} |`,
    ),
  ];
  console.log(`\n${lines.join('\n')}`);
  if (rows.some((r) => /WRONG/.test(r.check))) process.exitCode = 1;
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) runClassicalBench();
