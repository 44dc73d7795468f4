/**
 * The message model shared by every front end and reporter. A diagnostic is
 * data first: reporters (human text, JSON, SARIF) render it, front ends fill
 * in the location in the author's file.
 */

export type Severity = 'error' | 'warning' | 'note';

/** A position in a source file; lines and columns are 1-based, columns count UTF-16 code units. */
export interface SourcePoint {
  readonly line: number;
  readonly column: number;
  /** 0-based offset into the file text, when known. */
  readonly offset?: number;
}

export interface SourceLocation {
  readonly file: string;
  readonly start: SourcePoint;
  readonly end?: SourcePoint;
}

export interface Diagnostic {
  readonly severity: Severity;
  /** A stable rule id of our own naming, e.g. `claim-contradicted`, `code-invalid`. */
  readonly ruleId: string;
  readonly message: string;
  readonly location?: SourceLocation;
  /** The value the author wrote, as written. */
  readonly claimed?: string;
  /** The computed value, in the document's convention. */
  readonly computed?: string;
  /** Suggested fixes or explanations, one sentence each. */
  readonly hints?: readonly string[];
  /** Extra machine-readable detail (verdict, diagnosis, …) for the JSON and SARIF reporters. */
  readonly data?: Readonly<Record<string, unknown>>;
}

/** A problem located inside a code or claim text: offsets are 0-based into that text. */
export interface TextSpan {
  readonly start: number;
  readonly end: number;
}
