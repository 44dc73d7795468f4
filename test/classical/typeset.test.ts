/**
 * Typeset classical values are valid KaTeX in every declared convention
 * (term order, half powers as powers or roots) and read back to the computed
 * value, for knots and for links with half-integer exponents.
 */
import katex from 'katex';
import { describe, expect, it } from 'vitest';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import { DEFAULT_CONVENTION, type Convention } from '../../src/core/convention/convention.ts';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { judgeClaim, typesetValue } from '../../src/core/claims/index.ts';

const diagrams = {
  'positive trefoil': closeBraid([1, 1, 1], 2),
  'T(2,4) torus link': closeBraid([1, 1, 1, 1], 2),
  'Whitehead link': closeBraid([1, -2, 1, -2, -2], 3),
  'Borromean rings': closeBraid([1, -2, 1, -2, 1, -2], 3),
  'trefoil beside a circle': closeBraid([1, 1, 1], 3),
};

const conventions: Convention[] = [
  DEFAULT_CONVENTION,
  { ...DEFAULT_CONVENTION, termOrder: 'descending' },
  { ...DEFAULT_CONVENTION, halfPowers: 'root' },
  { ...DEFAULT_CONVENTION, signatureSign: 'positive' },
];

describe('typeset classical values', () => {
  for (const [name, diagram] of Object.entries(diagrams)) {
    it(`${name}: Δ, ∇, det and σ render in KaTeX (strict) and are accepted back as claims, in every convention (common practice: KaTeX as the renderer)`, () => {
      const report = analyzeDiagram(diagram);
      for (const convention of conventions) {
        for (const key of ['alexander', 'conway', 'determinant', 'signature'] as const) {
          const typeset = typesetValue(key, report, convention);
          expect(typeset.kind).toBe('math');
          if (typeset.kind !== 'math') continue;
          expect(() => katex.renderToString(typeset.latex, { throwOnError: true, strict: 'error' })).not.toThrow();
          expect(judgeClaim(key, typeset.latex, report, { convention, selfId: 'self' }).verdict).toBe('agrees');
        }
        const genus = typesetValue('genus', report, convention);
        if (genus.kind !== 'text') throw new Error('the genus statement is prose');
        for (const [, math] of genus.text.matchAll(/\$([^$]+)\$/g)) {
          expect(() => katex.renderToString(math!, { throwOnError: true, strict: 'error' })).not.toThrow();
        }
      }
    });
  }
});
