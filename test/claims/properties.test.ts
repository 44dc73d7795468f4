/**
 * Properties over random diagrams (closures of random braid words): a value
 * typeset in any convention is judged to agree; a claim built by one slip is
 * contradicted and diagnosed as that slip or as one tried before it (the order
 * is mirror, negated, shifted, normalization, one-coefficient, one-exponent, swapped), never
 * as `none`; a correct claim never carries a diagnosis.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import { DEFAULT_CONVENTION, type Convention } from '../../src/core/convention/convention.ts';
import { conventionBracket, conventionJones, jonesLetter } from '../../src/core/convention/convert.ts';
import { CLAIM_KEYS, FILL_KEYS, inapplicableBecause, isClaimKey, judgeClaim, polynomialLatex, typesetValue, type ClaimKey, type DiagnosisKind } from '../../src/core/claims/index.ts';
import { InputError } from '../../src/core/errors.ts';
import { rng, randomDiagram } from '../support/random-diagrams.ts';
import { Laurent } from '../../src/core/poly/laurent.ts';

const ORDER: readonly DiagnosisKind[] = ['mirror', 'negated', 'shifted', 'normalization', 'one-coefficient', 'one-exponent', 'swapped'];

const conventionArb: fc.Arbitrary<Convention> = fc.record({
  jonesVariable: fc.constantFrom('t', 't-inverse', 'q', 'q-graded'),
  bracketNormalization: fc.constantFrom('unit', 'loop'),
  termOrder: fc.constantFrom('ascending', 'descending'),
  halfPowers: fc.constantFrom('power', 'root'),
  signatureSign: fc.constant(DEFAULT_CONVENTION.signatureSign),
}) as fc.Arbitrary<Convention>;

const reportArb = fc.integer({ min: 1, max: 2 ** 31 - 1 }).map((seed) => analyzeDiagram(randomDiagram(rng(seed), 8, 4)));

type Slip = 'mirror' | 'negated' | 'shifted' | 'one-coefficient';
const slipArb = fc.constantFrom<Slip>('mirror', 'negated', 'shifted', 'one-coefficient');

function slipped(value: Laurent, mirror: Laurent, slip: Slip, k: number): Laurent {
  switch (slip) {
    case 'mirror':
      return mirror;
    case 'negated':
      return value.neg();
    case 'shifted':
      return value.shift(k);
    case 'one-coefficient':
      return value.add(Laurent.monomial(value.maxDegree ?? 0, k));
  }
}

describe('judging properties on random diagrams', () => {
  it('a typeset value agrees, without a diagnosis, in every convention', () => {
    fc.assert(
      fc.property(reportArb, conventionArb, (report, convention) => {
        for (const key of ['jones', 'bracket'] as const) {
          const t = typesetValue(key, report, convention);
          if (t.kind !== 'math') return false;
          const j = judgeClaim(key, t.latex, report, { convention });
          expect(j.verdict).toBe('agrees');
          expect(j.diagnosis).toBeUndefined();
        }
        return true;
      }),
      { numRuns: 60 },
    );
  });
  it('a single slip is contradicted and diagnosed as that slip or an earlier one, never none', () => {
    fc.assert(
      fc.property(reportArb, conventionArb, slipArb, fc.integer({ min: 1, max: 3 }), (report, convention, slip, k) => {
        const letter = jonesLetter(convention.jonesVariable);
        const value = conventionJones(report.jones, convention);
        const mirror = conventionJones(report.jones.substitutePower(-1), convention);
        const claim = slipped(value, mirror, slip, k);
        fc.pre(!claim.equals(value));
        const j = judgeClaim('jones', polynomialLatex(claim, letter, { order: 'ascending', halfPowers: 'power' }), report, { convention });
        if (slip === 'mirror' && !report.chiralityFixed) return j.verdict === 'agrees' && j.warning !== undefined;
        expect(j.verdict).toBe('contradicts');
        const kind = j.diagnosis!.kind;
        expect(kind).not.toBe('none');
        expect(ORDER.indexOf(kind)).toBeLessThanOrEqual(ORDER.indexOf(slip));
        return true;
      }),
      { numRuns: 120 },
    );
  });
  it('the bracket: a slip of normalisation is diagnosed as such (or as an earlier slip)', () => {
    fc.assert(
      fc.property(reportArb, (report) => {
        const loop = conventionBracket(report.bracket, { ...DEFAULT_CONVENTION, bracketNormalization: 'loop' });
        const j = judgeClaim('bracket', polynomialLatex(loop, 'A', { order: 'ascending', halfPowers: 'power' }), report, { convention: DEFAULT_CONVENTION });
        expect(j.verdict).toBe('contradicts');
        expect(ORDER.indexOf(j.diagnosis!.kind)).toBeLessThanOrEqual(ORDER.indexOf('normalization'));
        expect(j.diagnosis!.kind).not.toBe('none');
        return true;
      }),
      { numRuns: 40 },
    );
  });
});

describe('every key the tool fills in reads back as agreeing (a value it writes is a value it accepts; common practice)', () => {
  // Every setting of every convention key, not only those of the Jones polynomial and the bracket.
  const fullConventionArb: fc.Arbitrary<Convention> = fc.record({
    jonesVariable: fc.constantFrom('t', 't-inverse', 'q', 'q-graded'),
    bracketNormalization: fc.constantFrom('unit', 'loop'),
    termOrder: fc.constantFrom('ascending', 'descending'),
    halfPowers: fc.constantFrom('power', 'root'),
    signatureSign: fc.constantFrom('negative', 'positive'),
    khovanovGrading: fc.constantFrom('standard', 'q-inverse', 'homological', 'mirror'),
    homflyVariables: fc.constantFrom('vz', 'az'),
    kauffmanVariant: fc.constantFrom('kauffman', 'dubrovnik'),
  }) as fc.Arbitrary<Convention>;
  const keys = FILL_KEYS.filter((key) => isClaimKey(key));

  it(`for ${keys.length} keys, in prose and in a table cell, on random diagrams (fast-check, seed 4242)`, () => {
    expect(keys).toEqual(expect.arrayContaining(['jones', 'signature', 'homfly', 'kauffman', 'khovanov', 'crossing-number', 'arf', 'linking']));
    fc.assert(
      fc.property(reportArb, fullConventionArb, fc.boolean(), (report, convention, compact) => {
        for (const key of keys) {
          if (inapplicableBecause(key, report) !== undefined) continue;
          const t = typesetValue(key, report, convention, { compact });
          const text = t.kind === 'math' ? t.latex : t.text;
          const j = judgeClaim(key as ClaimKey, text, report, { convention });
          expect(j.verdict, `${key} = ${text} in ${JSON.stringify(convention)}: ${j.reason ?? ''}`).toBe('agrees');
        }
      }),
      { seed: 4242, numRuns: 40 },
    );
  });
});

describe('judgeClaim on arbitrary text', () => {
  const pieces = ['t', 'q', 'A', 'z', '1', '3', '-', '+', '^', '{', '}', '\\le', '≥', 'yes', 'no', ',', '/', '2', '\\frac', ' ', 'at most', '<', '>=',
    'c', '(', ')', '=', '$', '\\text{at least}', '²', '⁻', '.', ';', '[', ']', "'", '1.5', 'lk'];
  it('returns a verdict or throws a located InputError, for every key', () => {
    fc.assert(
      fc.property(reportArb, fc.constantFrom(...CLAIM_KEYS), fc.array(fc.constantFrom(...pieces), { maxLength: 10 }), (report, key, parts) => {
        const text = parts.join('');
        try {
          const j = judgeClaim(key, text, report, { convention: DEFAULT_CONVENTION });
          expect(['agrees', 'contradicts', 'undecided']).toContain(j.verdict);
        } catch (e) {
          expect(e).toBeInstanceOf(InputError);
          const span = (e as InputError).span;
          if (span) {
            expect(span.start).toBeGreaterThanOrEqual(0);
            expect(span.start).toBeLessThanOrEqual(span.end);
            expect(span.end).toBeLessThanOrEqual(text.length);
          }
        }
      }),
      { numRuns: 600 },
    );
  });
});
