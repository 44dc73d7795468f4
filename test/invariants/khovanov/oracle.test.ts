import { describe, expect, it } from 'vitest';
import { componentCount, type LinkDiagram } from '../../../src/core/diagram/model.ts';
import { jonesPolynomial } from '../../../src/core/invariants/jones.ts';
import { khovanovByCube } from '../../../src/core/invariants/khovanov/cube.ts';
import { eulerCharacteristic } from '../../../src/core/invariants/khovanov/homology.ts';
import { khovanovAndReduced } from '../../../src/core/invariants/khovanov/local.ts';
import { randomDiagram, rng } from '../../support/random-diagrams.ts';
import { reducedJonesImage, sortedMap, unreducedJonesImage } from './support.ts';

function randomDiagrams(seed: number, count: number, maxCrossings: number, maxStrands: number): LinkDiagram[] {
  const random = rng(seed);
  return Array.from({ length: count }, () => randomDiagram(random, maxCrossings, maxStrands));
}

describe('the local algorithm against the full cube of resolutions, over ℤ', () => {
  it('agrees in ranks and torsion on 150 random shuffled diagrams up to 7 crossings', () => {
    for (const d of randomDiagrams(1201, 150, 7, 4)) {
      expect(khovanovAndReduced(d).unreduced).toEqual(khovanovByCube(d));
    }
  });
  it('agrees on 2 random diagrams with 10 crossings', { timeout: 20000 }, () => {
    const random = rng(1202);
    let done = 0;
    while (done < 2) {
      const d = randomDiagram(random, 10, 4);
      if (d.crossings.length !== 10) continue;
      expect(khovanovAndReduced(d).unreduced).toEqual(khovanovByCube(d));
      done++;
    }
  });
});

describe('graded Euler characteristic = (q + q⁻¹)·V(t) at t^(1/2) = −q (Khovanov, Duke Math. J. 101 (2000))', () => {
  it('holds for the local algorithm on 300 random diagrams up to 14 crossings, against the bracket engine', () => {
    for (const d of randomDiagrams(1203, 300, 14, 5)) {
      const { unreduced, reduced } = khovanovAndReduced(d);
      const jones = jonesPolynomial(d);
      expect(sortedMap(eulerCharacteristic(unreduced))).toEqual(sortedMap(unreducedJonesImage(jones)));
      // Reduced homology of a knot categorifies V itself (Khovanov, Patterns in knot cohomology I, 2003).
      if (componentCount(d) === 1) expect(sortedMap(eulerCharacteristic(reduced))).toEqual(sortedMap(reducedJonesImage(jones)));
    }
  });
  it('holds for the cube on 100 random diagrams up to 7 crossings', () => {
    for (const d of randomDiagrams(1204, 100, 7, 4)) {
      expect(sortedMap(eulerCharacteristic(khovanovByCube(d)))).toEqual(sortedMap(unreducedJonesImage(jonesPolynomial(d))));
    }
  });
});
