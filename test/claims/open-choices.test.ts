/**
 * What a DT code does not fix: each independent part's chirality and each kink's sign. Claims are judged
 * against every realisation the code allows, and one realisation is chosen per diagram for the document.
 *
 * Outside facts used (from memory unless said otherwise):
 * - "6 8 -4 2" is a DT code of the closure of the braid σ₁σ₁σ₁σ₂: a positive trefoil with one kink, so its
 *   writhe is +4 as the braid draws it (common practice: a DT code does not record which side a kink loops
 *   to, so writhe 2 is another realisation of the same code).
 * - "10 12 8 4 6 2" is a DT code of the alternating diagram of the closure of σ₁³σ₂⁻³, the square knot
 *   3₁ # 3₁*; the granny knot 3₁ # 3₁ has the same DT code up to the summands' relative chirality.
 * - The Jones polynomial is multiplicative under connected sum (common practice), so
 *   V(square) = (t + t³ − t⁴)(t⁻¹ + t⁻³ − t⁻⁴) = −t⁻³ + t⁻² − t⁻¹ + 3 − t + t² − t³,
 *   V(granny) = (t + t³ − t⁴)² = t² + 2t⁴ − 2t⁵ + t⁶ − 2t⁷ + t⁸; the signature is additive, so
 *   σ(square) = 0 and σ(granny) = −4 (σ(positive trefoil) = −2).
 */
import { describe, expect, it } from 'vitest';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import { DEFAULT_CONVENTION } from '../../src/core/convention/convention.ts';
import { judgeDiagramClaims, type DiagramClaim } from '../../src/core/claims/open-choices.ts';
import { judgeClaim } from '../../src/core/claims/index.ts';
import { parseDiagramCode, readPartSigns } from '../../src/core/notation/index.ts';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { InputError } from '../../src/core/errors.ts';

const ctx = { convention: DEFAULT_CONVENTION };
const dt = (code: string) => analyzeDiagram(parseDiagramCode(code, 'dt'));
const claims = (...pairs: [string, string][]): DiagramClaim[] => pairs.map(([key, text]) => ({ key, text }));
const SQUARE_V = '-t^{-3} + t^{-2} - t^{-1} + 3 - t + t^2 - t^3';
const GRANNY_V = 't^2 + 2t^4 - 2t^5 + t^6 - 2t^7 + t^8';

describe('the choices a DT code leaves open', () => {
  it('lists the independent parts: a kink is a part of one crossing', () => {
    expect(parseDiagramCode('6 8 -4 2', 'dt').openChoices!.parts).toEqual([
      { crossings: [0, 1, 3], kink: false },
      { crossings: [2], kink: true },
    ]);
    expect(parseDiagramCode('10 12 8 4 6 2', 'dt').openChoices!.parts.map((p) => p.crossings)).toEqual([
      [0, 1, 5],
      [2, 3, 4],
    ]);
    expect(parseDiagramCode('4 6 2', 'dt').openChoices!.parts).toHaveLength(1);
    expect(parseDiagramCode('1 1 1', 'braid').openChoices).toBeUndefined();
  });

  it('agrees with the writhe +4 of the trefoil with a positive kink, naming the kink, and fills in that realisation', () => {
    const braid = analyzeDiagram(closeBraid([1, 1, 1, 2], 3));
    expect(braid.writhe).toBe(4);
    const v = judgeDiagramClaims(dt('6 8 -4 2'), claims(['writhe', '4'], ['bracket', judgeClaim('bracket', '0', braid, ctx).computed]), ctx);
    expect(v.outcomes.map((o) => o.kind === 'judged' && o.judgement.verdict)).toEqual(['agrees', 'agrees']);
    const first = v.outcomes[0]!;
    expect(first.kind === 'judged' && first.judgement.warning).toMatch(/the kink at entry 3 positive.*part-signs="\+ \+"/);
    // One message for the diagram: the second claim needing the same choice carries no warning.
    expect(v.outcomes[1]!.kind === 'judged' && v.outcomes[1]!.judgement.warning).toBeUndefined();
    expect(v.report.writhe).toBe(4);
    expect(v.report.bracket.equals(braid.bracket)).toBe(true);
  });

  it('contradicts a writhe no realisation has, and needs no choice for the drawing\'s own value', () => {
    const wrong = judgeDiagramClaims(dt('6 8 -4 2'), claims(['writhe', '3']), ctx).outcomes[0]!;
    expect(wrong.kind === 'judged' && wrong.judgement.verdict).toBe('contradicts');
    const own = judgeDiagramClaims(dt('6 8 -4 2'), claims(['writhe', '2']), ctx);
    expect(own.choice).toBeUndefined();
    expect(own.outcomes[0]!.kind === 'judged' && own.outcomes[0]!.judgement).toMatchObject({ verdict: 'agrees' });
  });

  it('reads the square knot from its DT code: V, signature and writhe 0 agree together', () => {
    const v = judgeDiagramClaims(dt('10 12 8 4 6 2'), claims(['jones', SQUARE_V], ['signature', '0'], ['writhe', '0']), ctx);
    expect(v.outcomes.map((o) => o.kind === 'judged' && o.judgement.verdict)).toEqual(['agrees', 'agrees', 'agrees']);
    expect(v.choice).toMatch(/reflected/);
    // The granny's values are the code's own drawing: no choice.
    const granny = judgeDiagramClaims(dt('10 12 8 4 6 2'), claims(['jones', GRANNY_V], ['signature', '-4']), ctx);
    expect(granny.choice).toBeUndefined();
    expect(granny.outcomes.map((o) => o.kind === 'judged' && o.judgement.verdict)).toEqual(['agrees', 'agrees']);
  });

  it('calls claims that need incompatible choices a conflict, naming the other claim', () => {
    const v = judgeDiagramClaims(dt('10 12 8 4 6 2'), claims(['jones', SQUARE_V], ['signature', '-4']), ctx);
    expect(v.outcomes[0]!.kind).toBe('judged');
    expect(v.outcomes[1]).toMatchObject({ kind: 'conflict', other: 0 });
    const kinks = judgeDiagramClaims(dt('6 8 -4 2'), claims(['writhe', '4'], ['writhe', '2']), ctx);
    expect(kinks.outcomes.map((o) => o.kind)).toEqual(['judged', 'conflict']);
  });

  it('judges keys that no choice changes as before (determinant of the square knot is 9: det is multiplicative)', () => {
    const v = judgeDiagramClaims(dt('10 12 8 4 6 2'), claims(['determinant', '9'], ['crossing-number', '6'], ['alternating', 'yes']), ctx);
    expect(v.choice).toBeUndefined();
    expect(v.outcomes.map((o) => o.kind === 'judged' && o.judgement.verdict)).toEqual(['agrees', 'agrees', 'agrees']);
  });

  it('fixes every choice with part-signs, after which only that realisation counts', () => {
    const fixed = analyzeDiagram(parseDiagramCode('6 8 -4 2', 'dt', { partSigns: readPartSigns('+ +') }));
    expect(fixed.diagram.openChoices).toBeUndefined();
    expect(fixed.chiralityFixed).toBe(true);
    expect(fixed.writhe).toBe(4);
    const v = judgeDiagramClaims(fixed, claims(['writhe', '2']), ctx);
    expect(v.outcomes[0]!.kind === 'judged' && v.outcomes[0]!.judgement.verdict).toBe('contradicts');
    const square = analyzeDiagram(parseDiagramCode('10 12 8 4 6 2', 'dt', { partSigns: readPartSigns('+, -') }));
    expect(square.classical.signature).toBe(0);
  });

  it('refuses part-signs that do not fit the code, at the offending sign', () => {
    const error = (f: () => unknown): InputError => {
      try {
        f();
      } catch (e) {
        if (e instanceof InputError) return e;
      }
      throw new Error('no InputError');
    };
    expect(error(() => parseDiagramCode('6 8 -4 2', 'dt', { partSigns: [1] }))).toMatchObject({ ruleId: 'choice-invalid' });
    expect(error(() => parseDiagramCode('6 8 -4 2', 'dt', { partSigns: [1] })).message).toContain('2 independent parts (entries 1, 2, 4; entry 3 (a kink))');
    expect(error(() => readPartSigns('+ x'))).toMatchObject({ ruleId: 'choice-invalid', span: { start: 2, end: 3 } });
    expect(error(() => parseDiagramCode('1 1 1', 'braid', { partSigns: [1] })).message).toMatch(/DT codes only/);
  });
});
