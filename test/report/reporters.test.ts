/**
 * Reporters. SARIF shape per the OASIS SARIF 2.1.0 standard (field names as
 * typed by @types/sarif); exit statuses as documented in src/cli/main.ts.
 */
import { describe, expect, it } from 'vitest';
import type * as Sarif from 'sarif';
import type { Diagnostic } from '../../src/core/diagnostics/diagnostic.ts';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { DEFAULT_CONVENTION } from '../../src/core/convention/convention.ts';
import { judgeClaim, judgementToDiagnostics, unreadableClaimDiagnostic } from '../../src/core/claims/index.ts';
import { InputError } from '../../src/core/errors.ts';
import {
  EXIT_BAD_INPUT,
  EXIT_FAILED_CHECK,
  EXIT_OK,
  exitStatus,
  formatDiagnostic,
  formatHumanReport,
  formatJsonReport,
  formatSarif,
  sarifLog,
} from '../../src/report/index.ts';

const source = ['# Notes', '', 'The right trefoil has $V = t + t^3 + t^4$ here.', '\tTab: $x$'].join('\n');
const line3 = source.split('\n')[2]!;
const claimStart = line3.indexOf('t + t^3');
const claimText = 't + t^3 + t^4';
const locate = (span?: { start: number; end: number }) => ({
  file: 'notes.md',
  start: { line: 3, column: claimStart + 1 + (span?.start ?? 0) },
  end: { line: 3, column: claimStart + 1 + (span?.end ?? claimText.length) },
});
const trefoil = analyzeDiagram(closeBraid([1, 1, 1], 2));
const contradicted = judgementToDiagnostics(judgeClaim('jones', claimText, trefoil, { convention: DEFAULT_CONVENTION }), locate());

describe('human reporter', () => {
  it('prints file:line:col: severity: message, the source line and a caret under the span', () => {
    const text = formatDiagnostic(contradicted[0]!, { sources: new Map([['notes.md', source]]) });
    const lines = text.split('\n');
    expect(lines[0]).toBe(`notes.md:3:${claimStart + 1}: error: ${contradicted[0]!.message} [claim-contradicted]`);
    expect(lines[1]).toBe(` 3 | ${line3}`);
    const caretLine = lines[2]!;
    const caretAt = caretLine.indexOf('^');
    // The caret sits under the first character of the claim, and the tildes run to its last.
    expect(caretAt - ' 3 | '.length).toBe(claimStart);
    expect(caretLine.slice(caretAt)).toBe(`^${'~'.repeat(claimText.length - 1)}`);
    expect(text).toContain('= claimed: t + t^3 + t^4');
    expect(text).toContain('= computed: t + t^3 - t^4');
    expect(text).toContain('= hint: Correct that one coefficient to -1.');
  });
  it('keeps tabs in the caret padding and underlines one character for a point location', () => {
    const d: Diagnostic = { severity: 'warning', ruleId: 'claim-undecided', message: 'm', location: { file: 'notes.md', start: { line: 4, column: 8 } } };
    const lines = formatDiagnostic(d, { sources: new Map([['notes.md', source]]) }).split('\n');
    expect(lines[2]).toBe('   | \t      ^');
  });
  it('points a claim-unreadable error at the offending character', () => {
    let error: InputError | undefined;
    try {
      judgeClaim('jones', 't + t^3 + 1.5t^4', trefoil, { convention: DEFAULT_CONVENTION });
    } catch (e) {
      error = e as InputError;
    }
    const d = unreadableClaimDiagnostic(error!, locate);
    expect(d.location?.start.column).toBe(claimStart + 1 + 10);
    expect(d.location?.end?.column).toBe(claimStart + 1 + 13);
  });
  it('uses colour only when asked', () => {
    expect(formatDiagnostic(contradicted[0]!)).not.toContain('\u001b[');
    expect(formatDiagnostic(contradicted[0]!, { color: true })).toContain('\u001b[1;31merror\u001b[0m');
  });
  it('ends with a summary line', () => {
    const report = formatHumanReport(contradicted);
    expect(report.trimEnd().split('\n').pop()).toBe('1 error, 0 warnings');
    expect(formatHumanReport([])).toBe('no problems found\n');
  });
});

describe('JSON reporter', () => {
  it('carries the diagnostics with verdict data, counts and the exit status', () => {
    const parsed = JSON.parse(formatJsonReport(contradicted));
    expect(parsed.counts).toEqual({ errors: 1, warnings: 0, notes: 0, cited: 0 });
    expect(parsed.exitStatus).toBe(1);
    expect(parsed.diagnostics[0].data).toMatchObject({ key: 'jones', verdict: 'contradicts', diagnosis: { kind: 'one-coefficient' } });
  });
});

describe('SARIF 2.1.0 reporter', () => {
  const unexplained = judgementToDiagnostics(judgeClaim('jones', '1 + t^{9}', trefoil, { convention: DEFAULT_CONVENTION }), locate());
  const all = [...contradicted, ...unexplained, { severity: 'error', ruleId: 'code-invalid', message: 'bad code' } as Diagnostic];
  const log: Sarif.Log = sarifLog(all, { toolVersion: '0.1.0', informationUri: 'https://example.invalid/skeinproof' });
  it('has the version, the schema and one run with the tool and its rules', () => {
    expect(log.version).toBe('2.1.0');
    expect(log.$schema).toMatch(/sarif-2\.1\.0/);
    expect(log.runs).toHaveLength(1);
    expect(log.runs[0]!.columnKind).toBe('utf16CodeUnits');
    const driver = log.runs[0]!.tool.driver;
    expect(driver.name).toBe('skeinproof');
    expect(driver.informationUri).toBe('https://example.invalid/skeinproof');
    for (const d of all) {
      const rule = driver.rules!.find((r) => r.id === d.ruleId);
      expect(rule?.shortDescription?.text.length).toBeGreaterThan(0);
    }
  });
  it('has one result per diagnostic with rule id, level, message and a physical location', () => {
    const results = log.runs[0]!.results!;
    expect(results.map((r) => [r.ruleId, r.level])).toEqual([
      ['claim-contradicted', 'error'],
      ['claim-contradicted', 'error'],
      ['code-invalid', 'error'],
    ]);
    const first = results[0]!;
    expect(first.message.text).toContain('Computed: t + t^3 - t^4.');
    // The plain-text message is sentences joined by spaces, each closed by a full stop (SARIF 2.1.0 §3.11.8 asks for complete sentences).
    expect(first.message.text).toMatch(/[.!?] Claimed: t \+ t\^3 \+ t\^4\. /);
    expect(log.runs[0]!.tool.driver.rules![first.ruleIndex!]!.id).toBe(first.ruleId);
    const physical = first.locations![0]!.physicalLocation!;
    expect(physical.artifactLocation).toEqual({ uri: 'notes.md', index: 0 });
    expect(physical.region).toEqual({ startLine: 3, startColumn: claimStart + 1, endLine: 3, endColumn: claimStart + 1 + claimText.length });
    expect(results[2]!.locations).toEqual([]);
  });
  it('lists the files of several manuscripts once each as artifacts, and results point at theirs (SARIF 2.1.0 §3.24, §3.4.5)', () => {
    const elsewhere = (file: string, line: number): Diagnostic => ({
      severity: 'error',
      ruleId: 'claim-unreadable',
      message: 'm',
      location: { file, start: { line, column: 1 }, end: { line, column: 4 } },
    });
    const several = sarifLog([elsewhere('a.md', 1), elsewhere('chapters/b c.tex', 2), elsewhere('a.md', 3), { severity: 'error', ruleId: 'code-invalid', message: 'x' }]);
    const run = several.runs[0]!;
    expect(run.artifacts).toEqual([{ location: { uri: 'a.md' } }, { location: { uri: 'chapters/b%20c.tex' } }]);
    const pointed = run.results!.flatMap((r) => r.locations!.map((l) => l.physicalLocation!.artifactLocation!));
    expect(pointed).toEqual([
      { uri: 'a.md', index: 0 },
      { uri: 'chapters/b%20c.tex', index: 1 },
      { uri: 'a.md', index: 0 },
    ]);
    for (const a of pointed) expect(run.artifacts![a.index!]!.location!.uri).toBe(a.uri);
  });
  it('serialises to JSON that parses back to the same log', () => {
    expect(JSON.parse(formatSarif(all, { toolVersion: '0.1.0', informationUri: 'https://example.invalid/skeinproof' }))).toEqual(log);
  });
});

describe('exit status', () => {
  const warning: Diagnostic = { severity: 'warning', ruleId: 'claim-undecided', message: 'w' };
  const note: Diagnostic = { severity: 'note', ruleId: 'target-invalid', message: 'n' };
  const invalid: Diagnostic = { severity: 'error', ruleId: 'code-invalid', message: 'e' };
  it('0 when nothing fails, notes and warnings included', () => {
    expect(exitStatus([])).toBe(EXIT_OK);
    expect(exitStatus([warning, note])).toBe(EXIT_OK);
  });
  it('1 for a contradicted claim, or a warning under strict', () => {
    expect(exitStatus(contradicted)).toBe(EXIT_FAILED_CHECK);
    expect(exitStatus([warning], { strict: true })).toBe(EXIT_FAILED_CHECK);
    expect(exitStatus([note], { strict: true })).toBe(EXIT_OK);
  });
  it('2 for invalid codes and other unusable input, which wins over 1', () => {
    expect(exitStatus([...contradicted, invalid])).toBe(EXIT_BAD_INPUT);
    expect(exitStatus([{ severity: 'error', ruleId: 'claim-unreadable', message: 'u' }])).toBe(EXIT_BAD_INPUT);
  });
});
