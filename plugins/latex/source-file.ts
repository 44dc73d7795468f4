/**
 * One LaTeX file as read: its text, the name it is reported under, and the
 * mapping from 0-based offsets to 1-based line:column positions (shared with
 * the Markdown front end through LineIndex).
 */
import type { SourceLocation, SourcePoint } from '../../src/core/diagnostics/diagnostic.ts';
import { LineIndex } from '../../src/core/diagnostics/line-index.ts';

/** A text whose offsets can be located in the author's files: a file, or the expansion of a macro's use. */
export interface TextOrigin {
  readonly text: string;
  location(start: number, end?: number): SourceLocation;
}

export class SourceFile implements TextOrigin {
  private readonly lines: LineIndex;

  constructor(
    /** The path shown in diagnostics (as the user named it, or relative to it for included files). */
    readonly displayPath: string,
    /** The absolute path it was read from. */
    readonly absolutePath: string,
    readonly text: string,
  ) {
    this.lines = new LineIndex(text);
  }

  point(offset: number): SourcePoint {
    return this.lines.point(offset);
  }

  location(start: number, end?: number): SourceLocation {
    return this.lines.location(this.displayPath, start, end);
  }
}
