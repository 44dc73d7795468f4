/**
 * One LaTeX file as read: its text, the name it is reported under, and the
 * mapping from 0-based offsets to 1-based line:column positions.
 */
import type { SourceLocation, SourcePoint } from '../../src/core/diagnostics/diagnostic.ts';

export class SourceFile {
  private readonly lineStarts: readonly number[];

  constructor(
    /** The path shown in diagnostics (as the user named it, or relative to it for included files). */
    readonly displayPath: string,
    /** The absolute path it was read from. */
    readonly absolutePath: string,
    readonly text: string,
  ) {
    const starts = [0];
    for (let i = 0; i < text.length; i++) if (text.charCodeAt(i) === 10) starts.push(i + 1);
    this.lineStarts = starts;
  }

  point(offset: number): SourcePoint {
    const at = Math.max(0, Math.min(offset, this.text.length));
    let lo = 0;
    let hi = this.lineStarts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (this.lineStarts[mid]! <= at) lo = mid;
      else hi = mid - 1;
    }
    return { line: lo + 1, column: at - this.lineStarts[lo]! + 1, offset: at };
  }

  location(start: number, end?: number): SourceLocation {
    return end === undefined || end <= start
      ? { file: this.displayPath, start: this.point(start) }
      : { file: this.displayPath, start: this.point(start), end: this.point(end) };
  }
}
