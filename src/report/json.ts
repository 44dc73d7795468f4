/**
 * The JSON reporter: one object with the diagnostics as data, their counts
 * and the exit status the run ends with.
 */
import type { Diagnostic } from '../core/diagnostics/diagnostic.ts';
import type { SessionCounts } from '../core/manuscript/api.ts';
import { countDiagnostics, exitStatus, type DiagnosticCounts, type ExitStatus } from './exit-status.ts';

export interface JsonReport {
  readonly diagnostics: readonly Diagnostic[];
  readonly counts: DiagnosticCounts;
  readonly exitStatus: ExitStatus;
  /** What was checked (diagrams, claims by verdict, filled values, table cells), when the command checked manuscripts. */
  readonly checked?: SessionCounts;
}

export function jsonReport(diagnostics: readonly Diagnostic[], options: { readonly strict?: boolean; readonly checked?: SessionCounts } = {}): JsonReport {
  return { diagnostics, counts: countDiagnostics(diagnostics), exitStatus: exitStatus(diagnostics, options), ...(options.checked ? { checked: options.checked } : {}) };
}

/** Bigints (never expected in diagnostics, but cheap to guard) become decimal strings. */
function replacer(_key: string, value: unknown): unknown {
  return typeof value === 'bigint' ? value.toString() : value;
}

export function formatJsonReport(
  diagnostics: readonly Diagnostic[],
  options: { readonly strict?: boolean; readonly indent?: number; readonly checked?: SessionCounts } = {},
): string {
  return `${JSON.stringify(jsonReport(diagnostics, options), replacer, options.indent ?? 2)}\n`;
}
