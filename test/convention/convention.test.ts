/**
 * Each convention against values written out by hand in that convention.
 * Sources: V(positive trefoil) = t + t³ − t⁴, V(left trefoil) = −t⁻⁴ + t⁻³ + t⁻¹,
 * V(positive Hopf) = −t^{1/2} − t^{5/2}, V(4₁) = t⁻² − t⁻¹ + 1 − t + t², and
 * ⟨positive trefoil⟩ = A⁻⁷ − A⁻³ − A⁵ with ⟨O⟩ = 1 — all from memory (Jones 1985,
 * Kauffman 1987). The other conventions' values are those worked by hand from
 * the substitutions (t = q², t^{1/2} = −q, t ↦ t⁻¹, ⟨O⟩ = −A² − A⁻²).
 */
import { describe, expect, it } from 'vitest';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { DEFAULT_CONVENTION, type Convention, type JonesVariable } from '../../src/core/convention/convention.ts';
import {
  bracketFromConvention,
  conventionBracket,
  conventionJones,
  jonesFromConvention,
  jonesLetter,
} from '../../src/core/convention/convert.ts';
import { parseConventionSettings, parseConventionText } from '../../src/core/convention/settings.ts';
import { readPolynomial } from '../../src/core/claims/latex-poly-parser.ts';
import { judgeClaim } from '../../src/core/claims/index.ts';

const diagrams = {
  rightTrefoil: analyzeDiagram(closeBraid([1, 1, 1], 2)),
  leftTrefoil: analyzeDiagram(closeBraid([-1, -1, -1], 2)),
  positiveHopf: analyzeDiagram(closeBraid([1, 1], 2)),
  negativeHopf: analyzeDiagram(closeBraid([-1, -1], 2)),
  figureEight: analyzeDiagram(closeBraid([1, -2, 1, -2], 3)),
};
type Name = keyof typeof diagrams;

const jonesByHand: Record<JonesVariable, Record<Name, string>> = {
  t: {
    rightTrefoil: 't + t^3 - t^4',
    leftTrefoil: '-t^{-4} + t^{-3} + t^{-1}',
    positiveHopf: '-t^{1/2} - t^{5/2}',
    negativeHopf: '-t^{-1/2} - t^{-5/2}',
    figureEight: 't^{-2} - t^{-1} + 1 - t + t^2',
  },
  't-inverse': {
    rightTrefoil: 't^{-1} + t^{-3} - t^{-4}',
    leftTrefoil: '-t^{4} + t^{3} + t',
    positiveHopf: '-t^{-1/2} - t^{-5/2}',
    negativeHopf: '-t^{1/2} - t^{5/2}',
    figureEight: 't^{2} - t + 1 - t^{-1} + t^{-2}',
  },
  q: {
    rightTrefoil: 'q^2 + q^6 - q^8',
    leftTrefoil: '-q^{-8} + q^{-6} + q^{-2}',
    positiveHopf: '-q - q^5',
    negativeHopf: '-q^{-1} - q^{-5}',
    figureEight: 'q^{-4} - q^{-2} + 1 - q^2 + q^4',
  },
  'q-graded': {
    rightTrefoil: 'q^2 + q^6 - q^8',
    leftTrefoil: '-q^{-8} + q^{-6} + q^{-2}',
    positiveHopf: 'q + q^5',
    negativeHopf: 'q^{-1} + q^{-5}',
    figureEight: 'q^{-4} - q^{-2} + 1 - q^2 + q^4',
  },
};

const bracketByHand: Record<'unit' | 'loop', Record<Name, string>> = {
  unit: {
    rightTrefoil: 'A^{-7} - A^{-3} - A^{5}',
    leftTrefoil: 'A^{7} - A^{3} - A^{-5}',
    positiveHopf: '-A^{4} - A^{-4}',
    negativeHopf: '-A^{4} - A^{-4}',
    figureEight: 'A^{8} - A^{4} + 1 - A^{-4} + A^{-8}',
  },
  loop: {
    rightTrefoil: '-A^{-9} + A^{-1} + A^{3} + A^{7}',
    leftTrefoil: '-A^{9} + A + A^{-3} + A^{-7}',
    positiveHopf: 'A^{6} + A^{2} + A^{-2} + A^{-6}',
    negativeHopf: 'A^{6} + A^{2} + A^{-2} + A^{-6}',
    figureEight: '-A^{10} - A^{-10}',
  },
};

describe('Jones conventions round-trip hand-worked values', () => {
  for (const variable of Object.keys(jonesByHand) as JonesVariable[]) {
    const convention: Convention = { ...DEFAULT_CONVENTION, jonesVariable: variable };
    for (const name of Object.keys(diagrams) as Name[]) {
      const report = diagrams[name];
      const text = jonesByHand[variable][name];
      it(`jones=${variable}: ${name} is ${text}`, () => {
        const written = readPolynomial(text, { variables: [jonesLetter(variable)] }).value;
        expect(conventionJones(report.jones, convention).equals(written)).toBe(true);
        expect(jonesFromConvention(written, variable).equals(report.jones)).toBe(true);
        expect(judgeClaim('jones', text, report, { convention }).verdict).toBe('agrees');
      });
    }
  }
});

describe('bracket normalisations round-trip hand-worked values', () => {
  for (const normalization of ['unit', 'loop'] as const) {
    const convention: Convention = { ...DEFAULT_CONVENTION, bracketNormalization: normalization };
    for (const name of Object.keys(diagrams) as Name[]) {
      const report = diagrams[name];
      const text = bracketByHand[normalization][name];
      it(`bracket=${normalization}: ${name} is ${text}`, () => {
        const written = readPolynomial(text, { variables: ['A'] }).value;
        expect(conventionBracket(report.bracket, convention).equals(written)).toBe(true);
        expect(bracketFromConvention(written, normalization)?.equals(report.bracket)).toBe(true);
        expect(judgeClaim('bracket', text, report, { convention }).verdict).toBe('agrees');
      });
    }
  }
  it('refuses to undo the loop normalisation of a value that is no multiple of −A² − A⁻²', () => {
    expect(bracketFromConvention(readPolynomial('A^{2}', { variables: ['A'] }).value, 'loop')).toBeUndefined();
  });
});

describe('convention settings from key/value strings', () => {
  it('reads every key, case-insensitively, onto the default', () => {
    const r = parseConventionSettings({ jones: 'q', Bracket: 'LOOP', order: 'descending', 'half-powers': 'root', signature: 'positive', Khovanov: 'Q-Inverse', HOMFLY: 'AZ', kauffman: 'dubrovnik' });
    expect(r).toEqual({
      ok: true,
      convention: { jonesVariable: 'q', bracketNormalization: 'loop', termOrder: 'descending', halfPowers: 'root', signatureSign: 'positive', khovanovGrading: 'q-inverse', homflyVariables: 'az', kauffmanVariant: 'dubrovnik' },
    });
  });
  it('accepts the field names as keys', () => {
    const r = parseConventionSettings({ jonesVariable: 't-inverse' });
    expect(r.ok && r.convention.jonesVariable).toBe('t-inverse');
  });
  it('names a bad value and lists the allowed ones', () => {
    const r = parseConventionSettings({ jones: 'x' });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors[0]!.ruleId).toBe('convention-invalid');
    expect(r.errors[0]!.message).toMatch(/`jones`.*cannot be `x`.*t, t-inverse, q, q-graded/);
  });
  it('names an unknown key and lists the keys', () => {
    const r = parseConventionSettings({ variable: 't' });
    expect(!r.ok && r.errors[0]!.message).toMatch(/unknown convention setting `variable`.*jones, bracket, order, half-powers, signature/);
  });
  it('reads the one-line flag form with spans into the text', () => {
    expect(parseConventionText('jones=q, bracket=loop,order=descending')).toEqual({
      ok: true,
      settings: { jonesVariable: 'q', bracketNormalization: 'loop', termOrder: 'descending' },
    });
    const bad = parseConventionText('jones=q,bracket=round');
    expect(bad.ok).toBe(false);
    if (bad.ok) return;
    expect(bad.errors[0]!.span).toEqual({ start: 16, end: 21 });
    const noValue = parseConventionText('jones');
    expect(!noValue.ok && noValue.errors[0]!.message).toMatch(/has no value/);
    const emptyValue = parseConventionText('jones=');
    expect(!emptyValue.ok && emptyValue.errors[0]!.message).toMatch(/`jones` .* has no value: write one of t, t-inverse, q, q-graded/);
  });
  it('separates settings by whitespace too, and allows spaces around = and :', () => {
    const settings = { jonesVariable: 'q', bracketNormalization: 'loop' };
    expect(parseConventionText('jones=q bracket=loop')).toEqual({ ok: true, settings });
    expect(parseConventionText(' jones = q ;  bracket : loop ')).toEqual({ ok: true, settings });
    const bad = parseConventionText('jones = q bracket = round');
    expect(!bad.ok && bad.errors[0]!.span).toEqual({ start: 20, end: 25 });
  });
  it('refuses a key given twice with different values instead of keeping the last', () => {
    const twice = parseConventionText('jones=q,order=descending,jones=t');
    expect(twice.ok).toBe(false);
    if (twice.ok) return;
    expect(twice.errors[0]!.message).toMatch(/`jones` is given twice with different values/);
    expect(twice.errors[0]!.span).toEqual({ start: 25, end: 30 });
    expect(parseConventionText('jones=q;jones=q')).toEqual({ ok: true, settings: { jonesVariable: 'q' } });
    const missingKey = parseConventionText('=q');
    expect(!missingKey.ok && missingKey.errors[0]!.message).toMatch(/has no key/);
  });
});
