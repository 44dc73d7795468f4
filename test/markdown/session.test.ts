/**
 * runSession on its own, the way any front end calls it: entries with
 * locators, no file format. Values from memory: positive trefoil σ₁³ has
 * V = t + t³ − t⁴ and writhe 3; the figure-eight (σ₁σ₂⁻¹)² has writhe 0.
 */
import { describe, expect, it } from 'vitest';
import { DEFAULT_CONVENTION } from '../../src/core/convention/convention.ts';
import type { SourceLocation, TextSpan } from '../../src/core/diagnostics/diagnostic.ts';
import type { ClaimEntry, DiagramEntry, FillEntry, Locator } from '../../src/core/manuscript/api.ts';
import { runSession } from '../../src/core/manuscript/session.ts';

/** A locator for text that starts at `line`:`column` of file `f.txt` and stays on that line. */
const at =
  (line: number, column: number): Locator =>
  (span?: TextSpan): SourceLocation => ({ file: 'f.txt', start: { line, column: column + (span?.start ?? 0) } });

const diagram = (id: string, code: string, line: number): DiagramEntry => ({ id, notation: 'braid', code, locateCode: at(line, 5), locateHeader: at(line, 1) });
const claim = (target: string, key: ClaimEntry['key'], text: string, line: number): ClaimEntry => ({ target, key, text, locate: at(line, 10) });
const fill = (target: string, key: FillEntry['key'], line: number): FillEntry => ({ target, key, locate: at(line, 20) });

describe('runSession', () => {
  it('typesets fill-ins in order and accepts correct claims silently', () => {
    const r = runSession({
      diagrams: [diagram('a', '1 1 1', 1), diagram('b', '1 -2 1 -2', 2)],
      claims: [claim('a', 'jones', 't + t^3 - t^4', 3), claim('b', 'writhe', '0', 4)],
      fills: [fill('b', 'writhe', 5), fill('a', 'jones', 6)],
      convention: DEFAULT_CONVENTION,
    });
    expect(r.diagnostics).toEqual([]);
    expect(r.failed).toBe(false);
    expect(r.fills).toEqual([
      { kind: 'math', latex: '0' },
      { kind: 'math', latex: 't + t^3 - t^4' },
    ]);
    expect([...r.reports.keys()]).toEqual(['a', 'b']);
  });

  it('reports every problem once, in document order, with the places the locators give', () => {
    const r = runSession({
      diagrams: [diagram('a', '1 1 1', 1), diagram('bad', '1 x', 2), diagram('a', '1 1', 3)],
      claims: [claim('a', 'writhe', '2', 4), claim('bad', 'writhe', '0', 5), claim('zz', 'writhe', '0', 6), claim('a', 'jones', 't +', 7)],
      fills: [fill('nope', 'jones', 8), fill('bad', 'span', 9)],
      convention: DEFAULT_CONVENTION,
    });
    expect(r.diagnostics.map((d) => `${d.severity} ${d.ruleId} ${d.location?.start.line}:${d.location?.start.column}`)).toEqual([
      // Token 2 of "1 x" is at offset 2 of the code, which starts at column 5.
      'error code-invalid 2:7',
      'error id-duplicate 3:1',
      'error claim-contradicted 4:10',
      'note target-invalid 5:10',
      'error target-unknown 6:10',
      // The claims layer points at the end of "t +", where a term is missing: offset 3.
      'error claim-unreadable 7:13',
      'error target-unknown 8:20',
      'note target-invalid 9:20',
    ]);
    expect(r.diagnostics[1]!.message).toContain('f.txt:1:1');
    expect(r.fills).toEqual([undefined, undefined]);
    expect(r.failed).toBe(true);
    expect(r.reports.has('bad')).toBe(false);
  });

  it('fails on warnings only when strict', () => {
    // A DT code fixes a knot up to mirror image: the mirror trefoil's V is a warning, not an error.
    const input = {
      diagrams: [{ id: 'k', notation: 'dt' as const, code: '4 6 2', locateCode: at(1, 1), locateHeader: at(1, 1) }],
      claims: [claim('k', 'jones', 't^{-1} + t^{-3} - t^{-4}', 2)],
      fills: [],
      convention: DEFAULT_CONVENTION,
    };
    expect(runSession(input).diagnostics.map((d) => d.severity)).toEqual(['warning']);
    expect(runSession(input).failed).toBe(false);
    expect(runSession({ ...input, strict: true }).failed).toBe(true);
  });

  it('names two table cells under one key that hold each other\'s values as swapped, and a lone coincidence as nothing (det 3₁ = 3, det 4₁ = 5, det 5₁ = 5: from memory)', () => {
    const cell = (target: string, key: string, text: string, line: number): ClaimEntry => ({ ...claim(target, key, text, line), context: `row ${line}, column ${key}` });
    const exchanged = runSession({
      diagrams: [diagram('tref', '1 1 1', 1), diagram('fig8', '1 -2 1 -2', 2)],
      claims: [cell('tref', 'determinant', '5', 3), cell('fig8', 'determinant', '3', 4)],
      fills: [],
      convention: DEFAULT_CONVENTION,
    });
    expect(exchanged.diagnostics.map((d) => (d.data as { diagnosis?: { kind: string; otherDiagram?: string } }).diagnosis)).toMatchObject([
      { kind: 'swapped', otherDiagram: 'fig8' },
      { kind: 'swapped', otherDiagram: 'tref' },
    ]);
    expect(exchanged.diagnostics[0]!.message).toBe(
      "row 3, column determinant: wrong determinant: the determinant is 3, not 5: the claim is the determinant of diagram `fig8`, whose cell under the same key holds this diagram's value: the two cells are exchanged",
    );
    const coincidence = runSession({
      diagrams: [diagram('tref', '1 1 1', 1), diagram('cinq', '1 1 1 1 1', 2)],
      claims: [claim('tref', 'determinant', '5', 3), cell('cinq', 'determinant', '5', 4)],
      fills: [],
      convention: DEFAULT_CONVENTION,
    });
    expect(coincidence.diagnostics).toHaveLength(1);
    expect(coincidence.diagnostics[0]!.message).toBe('wrong determinant: the determinant is 3, not 5');
    expect(coincidence.diagnostics[0]!.hints).toEqual([]);
  });

  it('reads each DT diagram one way per document: fill-ins follow the claims\' realisation, said once; incompatible claims are an error naming both places (V(left trefoil) = t⁻¹ + t⁻³ − t⁻⁴, σ = +2 for it: from memory)', () => {
    const dt = (id: string, code: string, line: number): DiagramEntry => ({ ...diagram(id, code, line), notation: 'dt' });
    const mirrored = runSession({
      diagrams: [dt('k', '4 6 2', 1)],
      claims: [claim('k', 'jones', 't^{-1} + t^{-3} - t^{-4}', 2), claim('k', 'signature', '2', 3), claim('k', 'writhe', '-3', 4)],
      fills: [fill('k', 'jones', 5), fill('k', 'signature', 6)],
      convention: DEFAULT_CONVENTION,
    });
    expect(mirrored.diagnostics.map((d) => `${d.severity} ${d.ruleId} ${d.location?.start.line}`)).toEqual(['warning claim-mirror-only 2']);
    expect(mirrored.diagnostics[0]!.message).toContain('every value of this diagram in the document is judged and filled in for that realisation');
    expect(mirrored.fills).toEqual([
      { kind: 'math', latex: '-t^{-4} + t^{-3} + t^{-1}' },
      { kind: 'math', latex: '2' },
    ]);
    const conflicting = runSession({
      diagrams: [dt('k', '4 6 2', 1)],
      claims: [claim('k', 'jones', 't^{-1} + t^{-3} - t^{-4}', 2), claim('k', 'writhe', '3', 3)],
      fills: [],
      convention: DEFAULT_CONVENTION,
    });
    expect(conflicting.diagnostics.map((d) => `${d.severity} ${d.ruleId} ${d.location?.start.line}`)).toEqual(['warning claim-mirror-only 2', 'error claim-choice-conflict 3']);
    expect(conflicting.diagnostics[1]!.message).toContain('the Jones polynomial claimed at f.txt:2:10');
  });
});
