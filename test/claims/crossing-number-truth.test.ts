/**
 * Crossing-number verdicts on diagrams of links whose crossing number is known
 * from the tables (from memory), drawn badly on purpose: random Reidemeister
 * moves (kinks, bigons, triangle slides), mirror images, connected sums, split
 * unions with an extra circle, and every notation the diagram can be written in
 * (PD, Gauss, and DT for knots; a DT code fixes a knot only up to mirror, which
 * keeps the crossing number). Whatever the diagram, the true crossing number
 * must lie within the bounds, and an exact value must be the true one: a false
 * "proven" is the worst defect. Truths: c(K₁ # K₂) = c(K₁) + c(K₂) for
 * alternating knots (Kauffman–Murasugi–Thistlethwaite 1987, the sum of reduced
 * alternating diagrams drawn alternating), c(L ⊔ O) = c(L) (common practice).
 */
import { describe, expect, it } from 'vitest';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import { componentCount, mirrorDiagram, type LinkDiagram, type Notation } from '../../src/core/diagram/model.ts';
import { connectedSum, withFreeLoops } from '../../src/core/diagram/operations.ts';
import { parseDiagramCode, printDtCode, printGaussCode, printPdCode } from '../../src/core/notation/index.ts';
import { randomInt, rng } from '../support/random-diagrams.ts';
import { randomMoves } from '../support/reidemeister.ts';

interface Known {
  readonly name: string;
  readonly notation: Notation;
  readonly code: string;
  readonly crossingNumber: number;
  readonly alternatingKnot: boolean;
}

// Codes and crossing numbers from memory (knot tables); 8_19 = T(3, 4) and 8_20 = P(2, 3, −3) are not alternating.
const KNOWN: readonly Known[] = [
  { name: '3_1', notation: 'dt', code: '4 6 2', crossingNumber: 3, alternatingKnot: true },
  { name: '4_1', notation: 'dt', code: '4 6 8 2', crossingNumber: 4, alternatingKnot: true },
  { name: '5_2', notation: 'dt', code: '4 8 10 2 6', crossingNumber: 5, alternatingKnot: true },
  { name: '6_2', notation: 'dt', code: '4 8 10 12 2 6', crossingNumber: 6, alternatingKnot: true },
  { name: '7_5', notation: 'dt', code: '4 10 12 14 2 8 6', crossingNumber: 7, alternatingKnot: true },
  { name: '8_19', notation: 'braid', code: '1 2 1 2 1 2 1 2', crossingNumber: 8, alternatingKnot: false },
  { name: '8_20', notation: 'family', code: 'pretzel 2 3 -3', crossingNumber: 8, alternatingKnot: false },
  { name: 'Hopf link', notation: 'braid', code: '1 1', crossingNumber: 2, alternatingKnot: false },
  { name: 'T(2,4)', notation: 'braid', code: '1 1 1 1', crossingNumber: 4, alternatingKnot: false },
  { name: 'Whitehead link', notation: 'family', code: 'two-bridge 8/3', crossingNumber: 5, alternatingKnot: false },
  { name: 'Borromean rings', notation: 'braid', code: '1 -2 1 -2 1 -2', crossingNumber: 6, alternatingKnot: false },
];

/** The same diagram in every notation that can write it, each read back. */
function inEveryNotation(d: LinkDiagram): LinkDiagram[] {
  if (d.freeLoops > 0) return [d, parseDiagramCode(printGaussCode(d), 'gauss')];
  const forms = [parseDiagramCode(printPdCode(d), 'pd'), parseDiagramCode(printGaussCode(d), 'gauss')];
  if (componentCount(d) === 1) forms.push(parseDiagramCode(printDtCode(d), 'dt'));
  return forms;
}

function expectTruthWithinBounds(d: LinkDiagram, truth: number, note: string): void {
  for (const form of inEveryNotation(d)) {
    const { lower, upper, exact, reasons } = analyzeDiagram(form).crossingNumber;
    const why = `${note} as ${form.notation}: ${lower}–${upper}, exact ${exact} (${reasons.map((r) => `${r.bound} ${r.value} ${r.theorem}`).join('; ')})`;
    expect(lower, why).toBeLessThanOrEqual(truth);
    expect(upper, why).toBeGreaterThanOrEqual(truth);
    if (exact !== null) expect(exact, why).toBe(truth);
  }
}

const read = (k: Known) => parseDiagramCode(k.code, k.notation);

describe('the true crossing number always lies within the bounds, and an exact value is the true one', () => {
  for (const known of KNOWN) {
    it(`${known.name} (c = ${known.crossingNumber}): as written, mirrored, with a circle beside it, and after random moves`, () => {
      const d = read(known);
      expectTruthWithinBounds(d, known.crossingNumber, 'as written');
      expectTruthWithinBounds(mirrorDiagram(d), known.crossingNumber, 'mirrored');
      expectTruthWithinBounds(withFreeLoops(d, 1), known.crossingNumber, 'beside a circle');
      const random = rng(known.crossingNumber * 101 + known.code.length);
      for (let k = 0; k < 6; k++) {
        const { diagram, moves } = randomMoves(d, randomInt(random, 1, 5), random);
        expectTruthWithinBounds(diagram, known.crossingNumber, `after ${moves.join(', ')}`);
      }
    });
  }

  it('connected sums of two alternating knots (c adds), made worse by random moves', () => {
    const knots = KNOWN.filter((k) => k.alternatingKnot);
    const random = rng(1987);
    for (let k = 0; k < 12; k++) {
      const [a, b] = [knots[randomInt(random, 0, knots.length - 1)]!, knots[randomInt(random, 0, knots.length - 1)]!];
      const [da, db] = [read(a), random() < 0.5 ? mirrorDiagram(read(b)) : read(b)];
      const sum = connectedSum(da, db, randomInt(random, 0, da.edgeCount - 1), randomInt(random, 0, db.edgeCount - 1));
      const truth = a.crossingNumber + b.crossingNumber;
      expectTruthWithinBounds(sum, truth, `${a.name} # ${b.name}`);
      const { diagram, moves } = randomMoves(sum, 3, random);
      expectTruthWithinBounds(diagram, truth, `${a.name} # ${b.name} after ${moves.join(', ')}`);
    }
  });
});
