/**
 * Benchmark of Khovanov homology: the local algorithm on the target
 * diagrams, a sample of 14-crossing knot diagrams, the full cube of
 * resolutions side by side with the local algorithm at 14 crossings, and a
 * diagram over the work budget. Every row checks its answer against something
 * independent: the Jones polynomial from the bracket engine (graded Euler
 * characteristic), s of torus knots and positive braids, s = −σ and Lee's
 * diagonals for alternating knots, or the cube. Run alone with
 * `node --import tsx bench/khovanov.ts`, or as part of `npm run bench`.
 * Times are the best of a few runs (the first run of a process also pays for
 * compiling the engine).
 */
import { pathToFileURL } from 'node:url';
import { closeBraid } from '../src/core/diagram/braid-closure.ts';
import { componentCount, type LinkDiagram } from '../src/core/diagram/model.ts';
import { pretzelLink } from '../src/core/families/build.ts';
import { classicalInvariants } from '../src/core/invariants/classical/index.ts';
import { jonesPolynomial } from '../src/core/invariants/jones.ts';
import { khovanovByCube } from '../src/core/invariants/khovanov/cube.ts';
import { eulerCharacteristic, type KhovanovHomology } from '../src/core/invariants/khovanov/homology.ts';
import { khovanovAndReduced, KhovanovBudgetError } from '../src/core/invariants/khovanov/local.ts';
import { rasmussenInvariant } from '../src/core/invariants/khovanov/rasmussen.ts';
import { randomAlternatingBraidWord, randomBraidWord, randomInt, rng, shuffleDiagram } from '../test/support/random-diagrams.ts';

interface Row {
  readonly diagram: string;
  readonly crossings: number;
  readonly rank: string;
  readonly khMs: string;
  readonly sMs: string;
  readonly target: string;
  readonly check: string;
}

function best<T>(runs: number, work: () => T): { value: T; ms: number } {
  let value: T;
  let ms = Infinity;
  for (let r = 0; r < runs; r++) {
    const start = performance.now();
    value = work();
    ms = Math.min(ms, performance.now() - start);
  }
  return { value: value!, ms };
}

const fmt = (ms: number): string => (ms >= 1000 ? `${(ms / 1000).toFixed(2)} s` : ms >= 10 ? `${ms.toFixed(0)} ms` : `${ms.toFixed(1)} ms`);
const totalRank = (h: KhovanovHomology): number => h.ranks.reduce((s, [, , r]) => s + r, 0);

/** χ(Kh) = (q + q⁻¹)·V at t^(1/2) = −q, against the bracket engine. */
function eulerMatchesJones(d: LinkDiagram, h: KhovanovHomology): boolean {
  const expected = new Map<number, number>();
  for (const [e, c] of jonesPolynomial(d).terms()) {
    const power = 2 * e;
    for (const s of [1, -1]) expected.set(power + s, (expected.get(power + s) ?? 0) + (power % 2 === 0 ? 1 : -1) * Number(c));
  }
  for (const [k, v] of expected) if (v === 0) expected.delete(k);
  const chi = eulerCharacteristic(h);
  return chi.size === expected.size && [...chi].every(([k, v]) => expected.get(k) === v);
}

function torusKnot(p: number, q: number): LinkDiagram {
  const word: number[] = [];
  for (let k = 0; k < q; k++) for (let i = 1; i < p; i++) word.push(i);
  return closeBraid(word, p);
}

export function runKhovanovBench(withCube = true): void {
  const rows: Row[] = [];

  // T(5,6): 24 crossings, s = (p − 1)(q − 1) = 20 (Rasmussen 2010), odd torsion (ℤ/5, Bar-Natan 2007; from memory).
  {
    const d = torusKnot(5, 6);
    const kh = best(3, () => khovanovAndReduced(d));
    const s = best(3, () => rasmussenInvariant(d));
    const fives = kh.value.unreduced.torsion.some(([, , order]) => order === 5);
    const ok = eulerMatchesJones(d, kh.value.unreduced) && s.value === 20 && fives;
    rows.push({
      diagram: 'torus knot T(5,6), braid',
      crossings: 24,
      rank: `${totalRank(kh.value.unreduced)} (+ torsion)`,
      khMs: fmt(kh.ms),
      sMs: fmt(s.ms),
      target: '10 s',
      check: ok ? 'χ = Jones, s = 20, ℤ/5 torsion ✓' : 'WRONG',
    });
  }

  // A 40-crossing alternating knot: the pretzel knot P(13, 13, 14), shuffled.
  {
    const random = rng(4001);
    const d = shuffleDiagram(pretzelLink([13, 13, 14]), random);
    const kh = best(3, () => khovanovAndReduced(d));
    const s = best(3, () => rasmussenInvariant(d));
    const sigma = classicalInvariants(d).signature;
    const onDiagonals = kh.value.unreduced.ranks.every(([i, j]) => Math.abs(j - 2 * i + sigma) === 1);
    const ok = eulerMatchesJones(d, kh.value.unreduced) && s.value === -sigma && onDiagonals;
    rows.push({
      diagram: 'alternating pretzel knot P(13,13,14), shuffled',
      crossings: 40,
      rank: String(totalRank(kh.value.unreduced)),
      khMs: fmt(kh.ms),
      sMs: fmt(s.ms),
      target: '10 s',
      check: ok ? 'χ = Jones, Lee diagonals, s = −σ ✓' : 'WRONG',
    });
  }

  // 14-crossing knot diagrams: random braid closures on up to 5 strands and reduced alternating ones, shuffled.
  {
    const random = rng(1401);
    const knots: LinkDiagram[] = [];
    while (knots.length < 120) {
      const strands = randomInt(random, 2, 5);
      const word = knots.length % 2 === 0 ? randomBraidWord(random, strands, 14) : randomAlternatingBraidWord(random, 3, 14);
      const d = shuffleDiagram(closeBraid(word, knots.length % 2 === 0 ? strands : 3), random);
      if (componentCount(d) === 1 && d.crossings.length === 14) knots.push(d);
    }
    khovanovAndReduced(knots[0]!); // compile the engine first
    let worst = 0;
    let worstRank = 0;
    let all = true;
    const times: number[] = [];
    for (const d of knots) {
      const kh = best(1, () => khovanovAndReduced(d));
      const s = best(1, () => rasmussenInvariant(d));
      times.push(kh.ms + s.ms);
      if (kh.ms + s.ms > worst) {
        worst = kh.ms + s.ms;
        worstRank = totalRank(kh.value.unreduced);
      }
      all &&= eulerMatchesJones(d, kh.value.unreduced);
    }
    times.sort((a, b) => a - b);
    rows.push({
      diagram: '120 random 14-crossing knot diagrams (half alternating), shuffled',
      crossings: 14,
      rank: `up to ${worstRank}`,
      khMs: `median ${fmt(times[times.length >> 1]!)}, slowest ${fmt(worst)} (Kh and s)`,
      sMs: 'included',
      target: '1 s each',
      check: all ? 'χ = Jones on all ✓' : 'WRONG',
    });
  }

  // Side by side at 14 crossings: the cube of resolutions against the local algorithm, one knot.
  if (withCube) {
    const random = rng(1402);
    let d: LinkDiagram;
    do d = shuffleDiagram(closeBraid(randomAlternatingBraidWord(random, 3, 14), 3), random);
    while (componentCount(d) !== 1);
    const local = best(3, () => khovanovAndReduced(d).unreduced);
    const cube = best(1, () => khovanovByCube(d));
    const same = JSON.stringify(local.value) === JSON.stringify(cube.value);
    rows.push({
      diagram: 'alternating 3-braid knot, shuffled: local algorithm',
      crossings: 14,
      rank: String(totalRank(local.value)),
      khMs: fmt(local.ms),
      sMs: '—',
      target: '',
      check: same ? 'equals the cube over ℤ ✓' : 'DIFFERS from the cube',
    });
    rows.push({
      diagram: 'same knot, full cube of 2^14 resolutions',
      crossings: 14,
      rank: String(totalRank(cube.value)),
      khMs: fmt(cube.ms),
      sMs: '—',
      target: '100× slower',
      check: `local algorithm ${Math.round(cube.ms / local.ms)}× faster`,
    });
  }

  // Over the budget: a 40-crossing alternating 3-braid knot whose homology has tens of thousands of generators.
  {
    const random = rng(40);
    let d: LinkDiagram;
    do d = shuffleDiagram(closeBraid(randomAlternatingBraidWord(random, 3, 40), 3), random);
    while (componentCount(d) !== 1);
    const start = performance.now();
    let outcome = 'computed (no refusal)';
    try {
      khovanovAndReduced(d);
    } catch (e) {
      if (!(e instanceof KhovanovBudgetError)) throw e;
      outcome = 'reported over the limit ✓';
    }
    rows.push({
      diagram: `alternating 3-braid knot, det ${classicalInvariants(d).determinant}, shuffled`,
      crossings: 40,
      rank: `≥ ${classicalInvariants(d).determinant}`,
      khMs: `${fmt(performance.now() - start)} to the refusal`,
      sMs: '—',
      target: 'no hang',
      check: outcome,
    });
  }

  const lines = [
    '| diagram | crossings | rational rank | Kh and reduced Kh | s | target | check |',
    '| --- | ---: | ---: | ---: | ---: | --- | --- |',
    ...rows.map((r) => `| ${r.diagram} | ${r.crossings} | ${r.rank} | ${r.khMs} | ${r.sMs} | ${r.target} | ${r.check} |`),
  ];
  console.log('\nKhovanov homology (local algorithm; best of 3 runs unless said otherwise)\n');
  console.log(lines.join('\n'));
  if (rows.some((r) => /WRONG|DIFFERS/.test(r.check))) process.exitCode = 1;
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) runKhovanovBench(!process.argv.includes('--without-cube'));
