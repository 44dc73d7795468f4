/**
 * Positions in the manuscript text: offsets ↔ 1-based line/column points, and
 * the mapping from a node's parsed value back to the bytes it came from (a
 * parser strips fence indentation, block-quote markers and math delimiters, so
 * an offset into the value is not an offset into the file).
 */
import type { SourceLocation, SourcePoint, TextSpan } from '../../src/core/diagnostics/diagnostic.ts';
import { LineIndex } from '../../src/core/diagnostics/line-index.ts';

export class SourceText {
  private readonly lines: LineIndex;

  constructor(
    readonly text: string,
    readonly file: string,
  ) {
    this.lines = new LineIndex(text);
  }

  point(offset: number): SourcePoint {
    return this.lines.point(offset);
  }

  location(start: number, end?: number): SourceLocation {
    return this.lines.location(this.file, start, end);
  }
}

/** Maps offsets into a parsed value to offsets into the file. */
export type OffsetMap = (valueOffset: number) => number;

/**
 * Aligns `value` with the file slice `[from, to)` it was parsed from, assuming
 * the parser only deleted characters (prefixes, delimiters) and turned line
 * endings into a space or kept them (a code block keeps `\r\n` as written).
 * Each value line is matched to a source line as its suffix, which is exact for
 * stripped indentation and quote markers; where that fails the characters are
 * matched greedily.
 */
export function alignValue(source: string, from: number, to: number, value: string): OffsetMap {
  const valueLines = linesOf(value, 0, value.length);
  const sourceLines = linesOf(source, from, to);
  const starts: number[] = [];
  if (valueLines.length === sourceLines.length) {
    valueLines.forEach((v, k) => {
      const line = value.slice(v.start, v.end);
      const s = sourceLines[k]!;
      starts.push(source.slice(s.start, s.end).endsWith(line) ? s.end - line.length : -1);
    });
  }
  if (starts.length === valueLines.length && starts.every((s) => s >= 0)) {
    return (offset) => {
      let k = valueLines.length - 1;
      while (k > 0 && valueLines[k]!.start > offset) k--;
      const line = valueLines[k]!;
      return starts[k]! + Math.min(offset - line.start, line.end - line.start);
    };
  }
  return greedyAlignment(source, from, to, value);
}

/** The lines of `text[from, to)` as [start, end) without their line endings (\r\n, \n or \r). */
function linesOf(text: string, from: number, to: number): { start: number; end: number }[] {
  const lines: { start: number; end: number }[] = [];
  let start = from;
  for (let i = from; i < to; i++) {
    const ch = text[i];
    if (ch === '\n' || ch === '\r') {
      lines.push({ start, end: i });
      if (ch === '\r' && text[i + 1] === '\n' && i + 1 < to) i++;
      start = i + 1;
    }
  }
  lines.push({ start, end: to });
  return lines;
}

function greedyAlignment(source: string, from: number, to: number, value: string): OffsetMap {
  const isBreak = (ch: string | undefined) => ch === '\n' || ch === '\r';
  const positions: number[] = [];
  let j = from;
  for (let k = 0; k < value.length; k++) {
    const v = value[k]!;
    // The \n of a \r\n in the value is the same line ending as its \r.
    if (v === '\n' && value[k - 1] === '\r') {
      positions.push(positions[positions.length - 1]! + (source[positions[positions.length - 1]! + 1] === '\n' ? 1 : 0));
      continue;
    }
    let found = j;
    while (found < to) {
      const s = source[found]!;
      if (s === v || ((v === ' ' || isBreak(v)) && isBreak(s))) break;
      found++;
    }
    if (found >= to) found = j;
    positions.push(found);
    j = Math.min(found + 1, to);
    if (source[found] === '\r' && source[found + 1] === '\n') j = found + 2;
  }
  return (offset) => (offset < positions.length ? positions[offset]! : offset === 0 ? from : positions[positions.length - 1]! + 1);
}

/** A span of a value, mapped to the file. */
export function mapSpan(map: OffsetMap, span: TextSpan): { start: number; end: number } {
  const start = map(span.start);
  const end = span.end > span.start ? map(span.end - 1) + 1 : start;
  return { start, end };
}
