/**
 * Reading large figures back (see read-back.test.ts for what is checked):
 * fewer samples, as each takes a fraction of a second to draw.
 */
import { describe, it } from 'vitest';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { randomBraidWord, randomInt, randomReducedAlternating, rng, shuffleDiagram } from '../support/random-diagrams.ts';
import { expectReadsBack } from '../support/read-back.ts';

describe('reading a large figure back', () => {
  it('gives back 6 random diagrams of 60 to 150 crossings', () => {
    const random = rng(77);
    for (let i = 0; i < 6; i++) {
      const size = randomInt(random, 60, 150);
      const d = i % 2 === 0 ? randomReducedAlternating(random, size, 7) : shuffleDiagram(closeBraid(randomBraidWord(random, 6, size), 6), random);
      expectReadsBack(d, `large sample ${i} (${d.crossings.length} crossings)`);
    }
  });

});
