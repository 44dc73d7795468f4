import { describe, expect, it } from 'vitest';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import type { DiagramReport } from '../../src/core/analyze/report.ts';
import { DEFAULT_CONVENTION, type Convention } from '../../src/core/convention/convention.ts';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { connectedSum } from '../../src/core/diagram/operations.ts';
import { judgeClaim, readPolynomial, typesetValue, type ClaimKey } from '../../src/core/claims/index.ts';

const trefoil = analyzeDiagram(closeBraid([1, 1, 1], 2));
const figureEight = analyzeDiagram(closeBraid([1, -2, 1, -2], 3));
const hopf = analyzeDiagram(closeBraid([1, 1], 2));
const dtTrefoil: DiagramReport = analyzeDiagram({ ...closeBraid([1, 1, 1], 2), chiralityFixed: false });

function judge(key: ClaimKey, text: string, report: DiagramReport, convention: Convention = DEFAULT_CONVENTION, others?: Map<string, DiagramReport>) {
  return judgeClaim(key, text, report, { convention, others, selfId: 'self' });
}

describe('claims about the classical invariants', () => {
  it('accept the worked values: trefoil Δ = t − 1 + t⁻¹, ∇ = 1 + z², det 3, σ = −2 (from memory)', () => {
    expect(judge('alexander', 't^{-1} - 1 + t', trefoil).verdict).toBe('agrees');
    expect(judge('conway', '1 + z^2', trefoil).verdict).toBe('agrees');
    expect(judge('determinant', '3', trefoil).verdict).toBe('agrees');
    expect(judge('signature', '-2', trefoil).verdict).toBe('agrees');
    expect(judge('alexander', '-t^{-1} + 3 - t', figureEight).verdict).toBe('agrees');
    expect(judge('alexander', 't^{1/2} - t^{-1/2}', hopf).verdict).toBe('agrees');
  });
  it('read the signature in the document convention: signature=positive gives the positive trefoil +2', () => {
    const positive = { ...DEFAULT_CONVENTION, signatureSign: 'positive' as const };
    expect(judge('signature', '2', trefoil, positive).verdict).toBe('agrees');
    const slip = judge('signature', '-2', trefoil, positive);
    expect(slip.verdict).toBe('contradicts');
    expect(slip.diagnosis?.kind).toBe('mirror');
  });
  it('name an unnormalised Alexander polynomial as shifted (t² − t + 1 for the trefoil)', () => {
    const j = judge('alexander', 't^2 - t + 1', trefoil);
    expect(j.verdict).toBe('contradicts');
    expect(j.diagnosis).toMatchObject({ kind: 'shifted', shift: 1 });
  });
  it('explains the normalisation without saying Δ(1) = 1 of a link, whose Δ(1) is 0 (Hopf link: Δ = t^(1/2) − t^(−1/2), written t − 1; from memory)', () => {
    const j = judge('alexander', 't - 1', hopf);
    expect(j.diagnosis).toMatchObject({ kind: 'shifted', shift: 0.5 });
    expect(j.diagnosis!.detail).toMatch(/normalised as Δ\(t\) = ∇\(t\^\{1\/2\} − t\^\{−1\/2\}\)/);
    expect(j.diagnosis!.detail).not.toMatch(/with Δ\(1\) = 1/);
  });
  it('name a negated Δ, the Conway polynomial given for Δ, and one wrong coefficient', () => {
    expect(judge('alexander', '-t^{-1} + 1 - t', trefoil).diagnosis?.kind).toBe('negated');
    expect(judge('alexander', '1 + z^2', trefoil).diagnosis?.kind).toBe('normalization');
    expect(judge('conway', 't^{-1} - 1 + t', trefoil).diagnosis?.kind).toBe('normalization');
    const one = judge('alexander', '-t^{-1} + 5 - t', figureEight);
    expect(one.diagnosis).toMatchObject({ kind: 'one-coefficient', term: { exponent: 0, computed: '3', claimed: '5' } });
  });
  it('state no span bound when Δ = 0: the 2-component unlink drawn with two crossings bounds an annulus, genus 0 (from memory)', () => {
    const unlinkWithCrossings = analyzeDiagram(closeBraid([1, -1], 2));
    expect(unlinkWithCrossings.classical.alexander.isZero).toBe(true);
    const spanBound = unlinkWithCrossings.classical.genusBounds.find((b) => b.reason === 'alexander-span')!;
    expect(spanBound.text).toBe('Δ = 0 has no span, so it gives no lower bound.');
    const statement = typesetValue('genus', unlinkWithCrossings, DEFAULT_CONVENTION);
    expect(statement.kind === 'text' && statement.text).toMatch(/^The Alexander polynomial is \$0\$, which bounds nothing, .* so the genus is \$0\$\.$/);
  });
  it('explain a non-zero Δ, ∇ or det claimed for a split diagram: split links have Δ = ∇ = det = 0 (from memory: Conway skein relation)', () => {
    const trefoilBesideCircle = analyzeDiagram(closeBraid([1, 1, 1], 3));
    const one = judge('alexander', '1', trefoilBesideCircle);
    expect(one.verdict).toBe('contradicts');
    expect(one.diagnosis?.kind).toBe('none');
    expect(one.diagnosis?.detail).toMatch(/2 separate pieces, so the link is split and its Alexander polynomial is 0$/);
    // Multiplying the pieces' values gives the connected sum's (trefoil · unknot), not the split union's.
    for (const [key, text] of [['alexander', 't - 1 + t^{-1}'], ['conway', '1 + z^2'], ['determinant', '3']] as const) {
      const product = judge(key, text, trefoilBesideCircle);
      expect(product.verdict).toBe('contradicts');
      expect(product.diagnosis?.detail).toMatch(/product of the pieces' values, which is the .* of their connected sum, not of the split union/);
    }
    expect(judge('alexander', '0', trefoilBesideCircle).verdict).toBe('agrees');
  });
  it('name ∇ written in t instead of z (trefoil ∇ = 1 + z², from memory)', () => {
    const j = judge('conway', '1 + t^2', trefoil);
    expect(j.verdict).toBe('contradicts');
    expect(j.diagnosis).toMatchObject({ kind: 'normalization', detail: 'the claim has the coefficients of the computed Conway polynomial but is written in t; the Conway polynomial is a polynomial in z' });
  });
  it('name the polynomial of another diagram of the document as swapped, but not an integer that merely coincides', () => {
    const others = new Map([['eight', figureEight]]);
    expect(judge('alexander', '-t^{-1} + 3 - t', trefoil, DEFAULT_CONVENTION, others).diagnosis).toMatchObject({ kind: 'swapped', otherDiagram: 'eight' });
    // det(4₁) = 5 (from memory) stated for the trefoil (det 3): many knots share a small determinant, so no swap is claimed.
    const det = judge('determinant', '5', trefoil, DEFAULT_CONVENTION, others);
    expect(det.verdict).toBe('contradicts');
    expect(det.diagnosis).toBeUndefined();
    expect(det.reason).toBe('the determinant is 3, not 5');
    expect(judge('signature', '0', trefoil, DEFAULT_CONVENTION, others).diagnosis).toBeUndefined(); // σ(4₁) = 0, from memory
  });
  it('name one term written at the wrong power (Δ(3₁) = t⁻¹ − 1 + t, from memory)', () => {
    const j = judge('alexander', 't^{-1} - 1 + t^2', trefoil);
    expect(j.diagnosis).toMatchObject({ kind: 'one-exponent', exponent: { computed: 1, claimed: 2, coefficient: '1' } });
    expect(j.reason).toContain('only one exponent differs: the term t is written t^2');
  });
  it('name a signature read off a Goeritz matrix without the Gordon–Litherland correction', () => {
    const uncorrected = trefoil.classical.goeritzUncorrected.find((g) => g !== trefoil.classical.signature)!;
    const j = judge('signature', String(uncorrected), trefoil);
    expect(j.verdict).toBe('contradicts');
    expect(j.diagnosis?.kind).toBe('normalization');
    expect(j.reason).toMatch(/Gordon–Litherland/);
  });
  it('accept the mirror signature of a DT code with a warning', () => {
    const j = judge('signature', '2', dtTrefoil);
    expect(j.verdict).toBe('agrees');
    expect(j.warning).toMatch(/mirror/);
  });
  it('judge determinants beyond 2^53 exactly: 34 trefoils summed have det 3^34 (from memory: det is multiplicative)', () => {
    let sum = closeBraid([1, 1, 1], 2);
    for (let k = 1; k < 34; k++) sum = connectedSum(sum, closeBraid([1, 1, 1], 2));
    const report = analyzeDiagram(sum);
    expect(report.classical.determinant).toBe(3n ** 34n);
    expect(judge('determinant', (3n ** 34n).toString(), report).verdict).toBe('agrees');
    expect(judge('determinant', (3n ** 34n + 1n).toString(), report).verdict).toBe('contradicts');
  });
  it('refuse a fractional determinant as unreadable', () => {
    expect(() => judge('determinant', '3/2', trefoil)).toThrow(/integer/);
  });
  it('typeset values that read back to the same polynomial, and the signature in the convention', () => {
    const alexander = typesetValue('alexander', hopf, DEFAULT_CONVENTION);
    expect(alexander).toEqual({ kind: 'math', latex: '-t^{-1/2} + t^{1/2}' });
    if (alexander.kind === 'math') expect(readPolynomial(alexander.latex, { variables: ['t'] }).value.equals(hopf.classical.alexander)).toBe(true);
    expect(typesetValue('conway', trefoil, DEFAULT_CONVENTION)).toEqual({ kind: 'math', latex: '1 + z^2' });
    expect(typesetValue('determinant', figureEight, DEFAULT_CONVENTION)).toEqual({ kind: 'math', latex: '5' });
    expect(typesetValue('signature', trefoil, { ...DEFAULT_CONVENTION, signatureSign: 'positive' })).toEqual({ kind: 'math', latex: '2' });
  });
  it('state the genus bounds as prose: the trefoil has genus 1, the split union none (from memory: g(3₁) = 1)', () => {
    const statement = typesetValue('genus', trefoil, DEFAULT_CONVENTION);
    expect(statement.kind).toBe('text');
    if (statement.kind !== 'text') return;
    expect(statement.text).toContain('$\\operatorname{span} \\Delta = 2$');
    expect(statement.text).toContain('so the genus is $1$');
    const split = typesetValue('genus', analyzeDiagram(closeBraid([], 2)), DEFAULT_CONVENTION);
    expect(split.kind === 'text' && split.text).toMatch(/split/);
    const wide = typesetValue('genus', analyzeDiagram(closeBraid([1, 2, -1, 2, 1, 2, -1, 2], 3)), DEFAULT_CONVENTION);
    expect(wide.kind === 'text' && wide.text).toMatch(/genus (is|lies between) \$\d+\$/);
  });
});
