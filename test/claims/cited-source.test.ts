/**
 * Crossing-number claims that carry the author's source. The diagrams: the
 * closure of σ₁³σ₂⁻¹σ₁⁻³σ₂⁻¹, a drawing of 8₂₀ that no theorem used here decides
 * (span V = 6, 8 crossings; c(8₂₀) = 8 from memory), and the trefoil (c = 3 by
 * Kauffman–Murasugi–Thistlethwaite).
 */
import { describe, expect, it } from 'vitest';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import { judgeClaim, judgementToDiagnostics } from '../../src/core/claims/index.ts';
import { DEFAULT_CONVENTION } from '../../src/core/convention/convention.ts';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { isInputError } from '../../src/core/errors.ts';
import { countDiagnostics, exitStatus } from '../../src/report/exit-status.ts';
import { summaryLine } from '../../src/report/human.ts';

const undecided = analyzeDiagram(closeBraid([1, 1, 1, -2, -1, -1, -1, -2], 3));
const trefoil = analyzeDiagram(closeBraid([1, 1, 1], 2));
const judge = (text: string, report = undecided) => judgeClaim('crossing-number', text, report, { convention: DEFAULT_CONVENTION });

describe('a cited source', () => {
  it('turns an undecided claim into one resting on the source, shown in the report, never "agrees"', () => {
    for (const text of ['8 (source: Table 3 of our appendix)', 'c(K) = 8 \\cite{appendix}', '$8$ \\cite[Table~3]{appendix}', '\\le 7 (Source: our table)']) {
      const j = judge(text);
      expect(j.verdict, text).toBe('cited');
      expect(j.source).toBeDefined();
      expect(j.reason).toContain(j.source!);
    }
  });
  it('never overrides a contradiction (c ≥ span V = 6, Kauffman–Murasugi–Thistlethwaite)', () => {
    const j = judge('5 \\cite{appendix}');
    expect(j.verdict).toBe('contradicts');
    expect(j.reason).toContain('does not change a proven bound');
    expect(judge('2 (source: a table)', trefoil).verdict).toBe('contradicts');
  });
  it('leaves a proven claim proven', () => {
    expect(judge('3 \\cite{tables}', trefoil).verdict).toBe('agrees');
  });
  it('passes --strict where the same claim without a source fails it, and is counted', () => {
    const cited = judgementToDiagnostics(judge('8 (source: our table)'));
    const bare = judgementToDiagnostics(judge('8'));
    expect(cited.map((d) => [d.severity, d.ruleId])).toEqual([['note', 'claim-cited']]);
    expect(bare.map((d) => [d.severity, d.ruleId])).toEqual([['warning', 'claim-undecided']]);
    expect(exitStatus(cited, { strict: true })).toBe(0);
    expect(exitStatus(bare, { strict: true })).toBe(1);
    expect(countDiagnostics([...cited, ...cited]).cited).toBe(2);
    expect(summaryLine(cited)).toBe('0 errors, 0 warnings, 1 note; 1 claim rests on a cited source');
  });
  it('an empty source or a source without a value is unreadable', () => {
    for (const text of ['8 (source: )', '\\cite{}', '(source: our table)']) {
      try {
        judge(text);
        expect.unreachable(text);
      } catch (e) {
        if (!isInputError(e)) throw e;
        expect(e.ruleId).toBe('claim-unreadable');
      }
    }
  });
});
