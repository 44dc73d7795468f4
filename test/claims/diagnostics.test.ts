/**
 * From verdicts to diagnostics: severities and rule ids as documented in the
 * README section `claims`. Values from memory (Jones 1985): V(positive trefoil)
 * = t + t³ − t⁴, V(left trefoil) = −t⁻⁴ + t⁻³ + t⁻¹.
 */
import { describe, expect, it } from 'vitest';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { parseDiagramCode } from '../../src/core/notation/index.ts';
import { DEFAULT_CONVENTION } from '../../src/core/convention/convention.ts';
import { invalidCodeDiagnostic, judgeClaim, judgementToDiagnostics, type ClaimKey } from '../../src/core/claims/index.ts';
import type { DiagramReport } from '../../src/core/analyze/report.ts';
import { InputError } from '../../src/core/errors.ts';
import type { SourceLocation, TextSpan } from '../../src/core/diagnostics/diagnostic.ts';

const trefoil = analyzeDiagram(closeBraid([1, 1, 1], 2));
const at: SourceLocation = { file: 'paper.md', start: { line: 7, column: 3 }, end: { line: 7, column: 12 } };
const diagnose = (key: ClaimKey, text: string, report: DiagramReport = trefoil, context?: string) =>
  judgementToDiagnostics(judgeClaim(key, text, report, { convention: DEFAULT_CONVENTION }), at, context);

describe('judgementToDiagnostics', () => {
  it('reports nothing for a plain agreement', () => {
    expect(diagnose('jones', 't + t^3 - t^4')).toEqual([]);
  });
  it('reports a contradiction as an error with the values, the slip and a fix', () => {
    const [d, ...rest] = diagnose('jones', '-t - t^3 + t^4', trefoil, 'row 2, column V');
    expect(rest).toEqual([]);
    expect(d).toMatchObject({
      severity: 'error',
      ruleId: 'claim-contradicted',
      location: at,
      claimed: '-t - t^3 + t^4',
      computed: 't + t^3 - t^4',
      data: { key: 'jones', verdict: 'contradicts', diagnosis: { kind: 'negated' } },
    });
    expect(d!.message).toMatch(/^row 2, column V: wrong Jones polynomial: .*every sign reversed/);
    expect(d!.hints).toEqual(['Check the overall sign of the value.']);
  });
  it('gives one message for one problem: a contradiction no slip explains is one error whose hint says to recheck the whole value', () => {
    const ds = diagnose('jones', '1 + t^{9}');
    expect(ds.map((d) => [d.severity, d.ruleId])).toEqual([['error', 'claim-contradicted']]);
    expect(ds[0]!.hints).toEqual(['No common slip explains the difference: recheck the whole value rather than one term or sign.']);
  });
  it('warns on an undecided crossing number and names the theorem in the data', () => {
    const report = analyzeDiagram(closeBraid([1, 1, 1, -2, -1, -1, -1, -2], 3));
    const [d] = diagnose('crossing-number', `${report.crossingNumber.lower + 1}`, report);
    expect(d).toMatchObject({ severity: 'warning', ruleId: 'claim-undecided', data: { verdict: 'undecided', theorem: 'kauffman-murasugi-thistlethwaite' } });
  });
  it('warns when a DT code matches the claim only up to mirror image', () => {
    const dt = analyzeDiagram(parseDiagramCode('4 6 2', 'dt'));
    const ds = [...diagnose('jones', 't + t^3 - t^4', dt), ...diagnose('jones', '-t^{-4}+t^{-3}+t^{-1}', dt)];
    expect(ds.map((d) => [d.severity, d.ruleId])).toEqual([['warning', 'claim-mirror-only']]);
  });
  it('locates an invalid code through the locator, naming the diagram', () => {
    const locate = (span?: TextSpan): SourceLocation => ({ file: 'paper.md', start: { line: 3, column: 1 + (span?.start ?? 0) } });
    let error: InputError | undefined;
    try {
      parseDiagramCode('(1,2,3)', 'pd');
    } catch (e) {
      error = e as InputError;
    }
    expect(error).toBeInstanceOf(InputError);
    const d = invalidCodeDiagnostic(error!, locate, 'K1');
    expect(d).toMatchObject({ severity: 'error', ruleId: error!.ruleId });
    expect(d.message).toMatch(/^diagram `K1`: /);
    expect(d.location?.start.column).toBe(1 + (error!.span?.start ?? 0));
  });
});
