/**
 * Offsets into a source text ↔ 1-based line:column points. Every front end
 * reports positions through this one table, so line counting is the same for
 * Markdown and LaTeX: `\r\n`, `\n` and a lone `\r` each end a line, and columns
 * count UTF-16 code units from 1.
 */
import type { SourceLocation, SourcePoint } from './diagnostic.ts';

export class LineIndex {
  private readonly lineStarts: number[] = [0];

  constructor(readonly text: string) {
    for (let i = 0; i < text.length; i++) {
      const ch = text.charCodeAt(i);
      if (ch === 10 || (ch === 13 && text.charCodeAt(i + 1) !== 10)) this.lineStarts.push(i + 1);
    }
  }

  /** The point at `offset`, clamped into the text. */
  point(offset: number): SourcePoint {
    const clamped = Math.max(0, Math.min(offset, this.text.length));
    let lo = 0;
    let hi = this.lineStarts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (this.lineStarts[mid]! <= clamped) lo = mid;
      else hi = mid - 1;
    }
    return { line: lo + 1, column: clamped - this.lineStarts[lo]! + 1, offset: clamped };
  }

  /** A location in `file` from `start` to `end` (a point alone when the span is empty). */
  location(file: string, start: number, end?: number): SourceLocation {
    const loc: SourceLocation = { file, start: this.point(start) };
    return end === undefined || end <= start ? loc : { ...loc, end: this.point(end) };
  }
}
