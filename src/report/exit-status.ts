/**
 * The exit status every command shares: 0 when nothing fails; 1 when a claim
 * is contradicted, or a warning is reported under --strict; 2 for input that
 * cannot be used at all (usage errors, unreadable files and claims, invalid
 * codes). The larger status wins.
 */
import type { Diagnostic } from '../core/diagnostics/diagnostic.ts';

export const EXIT_OK = 0;
export const EXIT_FAILED_CHECK = 1;
export const EXIT_BAD_INPUT = 2;

export type ExitStatus = typeof EXIT_OK | typeof EXIT_FAILED_CHECK | typeof EXIT_BAD_INPUT;

/** Errors that are verdicts on the mathematics rather than on the input. */
const VERDICT_ERRORS: ReadonlySet<string> = new Set(['claim-contradicted', 'claim-choice-conflict']);

export function exitStatus(diagnostics: readonly Diagnostic[], options: { readonly strict?: boolean } = {}): ExitStatus {
  let status: ExitStatus = EXIT_OK;
  for (const d of diagnostics) {
    if (d.severity === 'error') {
      if (!VERDICT_ERRORS.has(d.ruleId)) return EXIT_BAD_INPUT;
      status = EXIT_FAILED_CHECK;
    } else if (d.severity === 'warning' && options.strict) {
      status = EXIT_FAILED_CHECK;
    }
  }
  return status;
}

export interface DiagnosticCounts {
  readonly errors: number;
  readonly warnings: number;
  readonly notes: number;
  /** Crossing-number claims that rest on a source the author cites (notes of rule claim-cited). */
  readonly cited: number;
}

export function countDiagnostics(diagnostics: readonly Diagnostic[]): DiagnosticCounts {
  const count = (s: Diagnostic['severity']) => diagnostics.filter((d) => d.severity === s).length;
  return { errors: count('error'), warnings: count('warning'), notes: count('note'), cited: diagnostics.filter((d) => d.ruleId === 'claim-cited').length };
}
