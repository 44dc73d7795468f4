/**
 * Benchmark of the HOMFLY-PT and Kauffman polynomials (contraction in the skein
 * module of a disk) on the issue's targets: a sample of knot diagrams up to 16
 * crossings, T(5,6), 30-crossing alternating knots, and a diagram over the work
 * budget. Every row checks its answer against something independent of the
 * engine: P(v = t, z = t^(1/2) − t^(−1/2)) and F(−t^(−3/4), t^(1/4) + t^(−1/4))
 * against the Jones polynomial of the bracket engine, P(1, z) against the
 * Conway polynomial of the Seifert matrix, and the braid index of T(p, q).
 * Run alone with `node --import tsx bench/skein-polynomials.ts`, or as part of `npm run bench`.
 */
import { pathToFileURL } from 'node:url';
import { closeBraid } from '../src/core/diagram/braid-closure.ts';
import { componentCount, type LinkDiagram } from '../src/core/diagram/model.ts';
import { braidIndexBounds } from '../src/core/invariants/braid-index.ts';
import { classicalInvariants } from '../src/core/invariants/classical/index.ts';
import { homflyPolynomial } from '../src/core/invariants/homfly/homfly.ts';
import { jonesPolynomial } from '../src/core/invariants/jones.ts';
import { kauffmanPolynomial } from '../src/core/invariants/kauffman-polynomial/kauffman.ts';
import { Laurent } from '../src/core/poly/laurent.ts';
import type { Laurent2 } from '../src/core/poly/laurent2.ts';
import { randomAlternatingBraidWord, randomBraidWord, randomInt, rng, shuffleDiagram } from '../test/support/random-diagrams.ts';

const sqrtDifference = Laurent.fromTerms([[0.5, 1n], [-0.5, -1n]]);
const quarterSum = Laurent.fromTerms([[0.25, 1n], [-0.25, 1n]]);

function homflyGivesJones(d: LinkDiagram, p: Laurent2): boolean {
  const mu = componentCount(d);
  return p.shift(0, mu - 1).evaluate(Laurent.monomial(1), sqrtDifference).equals(jonesPolynomial(d).mul(sqrtDifference.pow(mu - 1)));
}

function homflyGivesConway(d: LinkDiagram, p: Laurent2): boolean {
  return p.evaluate(Laurent.one, Laurent.monomial(1)).equals(classicalInvariants(d).conway);
}

function kauffmanGivesJones(d: LinkDiagram, f: Laurent2): boolean {
  const low = f.yRange()![0];
  return f.shift(0, -low).evaluate(Laurent.monomial(-0.75, -1), quarterSum).equals(jonesPolynomial(d).mul(quarterSum.pow(-low)));
}

/** Processor time (user + system) of the work: the machine is shared, so wall time would measure the load. */
function timed<T>(work: () => T): { value: T; ms: number } {
  const start = process.cpuUsage();
  const value = work();
  const used = process.cpuUsage(start);
  return { value, ms: (used.user + used.system) / 1000 };
}

const fmt = (ms: number): string => (ms >= 1000 ? `${(ms / 1000).toFixed(2)} s` : ms >= 10 ? `${ms.toFixed(0)} ms` : `${ms.toFixed(1)} ms`);
const tick = (ok: boolean): string => (ok ? '✓' : '✗ FAILED');

function torusKnot(p: number, q: number): LinkDiagram {
  const word: number[] = [];
  for (let k = 0; k < q; k++) for (let i = 1; i < p; i++) word.push(i);
  return closeBraid(word, p);
}

interface Row {
  readonly diagram: string;
  readonly crossings: string;
  readonly width: string;
  readonly homfly: string;
  readonly kauffman: string;
  readonly target: string;
  readonly check: string;
}

export function runSkeinPolynomialBench(): void {
  const rows: Row[] = [];
  const addRow = (row: Row): void => {
    rows.push(row);
    process.stderr.write(`  skein polynomials: ${row.diagram} done\n`);
  };

  // A sample of knot diagrams up to 16 crossings: random braid closures on 3–9 strands, shuffled.
  {
    const random = rng(1609);
    let count = 0;
    let worstP = 0;
    let worstF = 0;
    let totalP = 0;
    let widest = 0;
    let ok = true;
    while (count < 60) {
      const strands = randomInt(random, 3, 9);
      const length = randomInt(random, 8, 16);
      const d = shuffleDiagram(closeBraid(randomBraidWord(random, strands, length), strands), random);
      if (componentCount(d) !== 1) continue;
      count++;
      const p = timed(() => homflyPolynomial(d));
      const f = timed(() => kauffmanPolynomial(d));
      worstP = Math.max(worstP, p.ms);
      worstF = Math.max(worstF, f.ms);
      totalP += p.ms;
      widest = Math.max(widest, p.value.boundaryWidth);
      ok &&= homflyGivesJones(d, p.value.polynomial) && homflyGivesConway(d, p.value.polynomial) && kauffmanGivesJones(d, f.value.polynomial);
    }
    addRow({
      diagram: `${count} random knot diagrams, 8–16 crossings, 3–9 strands, shuffled`,
      crossings: '8–16',
      width: `≤ ${widest}`,
      homfly: `worst ${fmt(worstP)}, mean ${fmt(totalP / count)}`,
      kauffman: `worst ${fmt(worstF)}`,
      target: 'P < 1 s each',
      check: `P → V, P → ∇, F → V ${tick(ok)}`,
    });
  }

  // T(5,6): braid index 5 (Franks–Williams 1987).
  {
    const d = torusKnot(5, 6);
    const p = timed(() => homflyPolynomial(d));
    const f = timed(() => kauffmanPolynomial(d));
    const b = braidIndexBounds(p.value.polynomial, 5, 'braid');
    const ok = homflyGivesJones(d, p.value.polynomial) && kauffmanGivesJones(d, f.value.polynomial) && b.exact === 5;
    addRow({ diagram: 'torus knot T(5,6), braid order', crossings: '24', width: `${p.value.boundaryWidth}`, homfly: fmt(p.ms), kauffman: fmt(f.ms), target: 'P < 10 s', check: `P → V, F → V, braid index 5 ${tick(ok)}` });
  }

  // 30-crossing alternating knots drawn as shuffled braid closures of several widths. The
  // closure is a knot only when the word's permutation is an s-cycle, whose parity is that of
  // s − 1; 30 generators make an even permutation, so the strand counts are odd.
  for (const strands of [3, 5, 7, 9]) {
    const random = rng(3000 + strands);
    let d: LinkDiagram;
    do d = shuffleDiagram(closeBraid(randomAlternatingBraidWord(random, strands, 30), strands), random);
    while (componentCount(d) !== 1);
    const p = timed(() => homflyPolynomial(d));
    const f = timed(() => kauffmanPolynomial(d));
    const ok = homflyGivesJones(d, p.value.polynomial) && homflyGivesConway(d, p.value.polynomial) && kauffmanGivesJones(d, f.value.polynomial);
    addRow({
      diagram: `alternating knot, ${strands}-strand closure, shuffled`,
      crossings: '30',
      width: `${p.value.boundaryWidth}`,
      homfly: fmt(p.ms),
      kauffman: fmt(f.ms),
      target: 'P < 10 s',
      check: `P → V, P → ∇, F → V ${tick(ok)}`,
    });
  }

  // Over the budget: refused, not left running.
  {
    const word = Array.from({ length: 401 }, (_, k) => (k % 2 === 0 ? 1 : -2));
    const d = closeBraid(word, 3);
    const p = timed(() => homflyPolynomial(d));
    const f = timed(() => {
      try {
        kauffmanPolynomial(d);
        return 'computed';
      } catch (error) {
        return (error as { ruleId?: string }).ruleId ?? 'error';
      }
    });
    addRow({
      diagram: 'alternating 3-strand closure',
      crossings: '401',
      width: `${p.value.boundaryWidth}`,
      homfly: fmt(p.ms),
      kauffman: `${f.value === 'computed' ? 'computed' : `refused (${f.value})`} after ${fmt(f.ms)}`,
      target: 'no hang',
      check: `P → V ${tick(homflyGivesJones(d, p.value.polynomial))}`,
    });
  }

  console.log('\nHOMFLY-PT and Kauffman polynomials (contraction in the skein module of a disk; processor time)\n');
  console.log('| diagram | crossings | widest boundary | HOMFLY-PT P | Kauffman F | target | check |');
  console.log('| --- | ---: | ---: | ---: | ---: | --- | --- |');
  for (const r of rows) console.log(`| ${r.diagram} | ${r.crossings} | ${r.width} | ${r.homfly} | ${r.kauffman} | ${r.target} | ${r.check} |`);
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) runSkeinPolynomialBench();
