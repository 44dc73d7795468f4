/**
 * Applies text edits to the manuscript by source offsets. Every byte outside
 * the edited ranges is copied as written, so a build's diff shows only the
 * substitutions; the document is never re-serialised.
 */
export interface Splice {
  readonly start: number;
  readonly end: number;
  readonly text: string;
}

export function applySplices(source: string, splices: readonly Splice[]): string {
  const sorted = [...splices].sort((a, b) => a.start - b.start || a.end - b.end);
  let out = '';
  let at = 0;
  for (const s of sorted) {
    if (s.start < at || s.end < s.start || s.end > source.length) {
      throw new RangeError(`overlapping or out-of-range splice ${s.start}..${s.end} (copied up to ${at})`);
    }
    out += source.slice(at, s.start) + s.text;
    at = s.end;
  }
  return out + source.slice(at);
}

/**
 * The offset in the source of an offset into the spliced text: text the splices
 * left alone maps back exactly, text they put in maps to the start of what it replaced.
 */
export function sourceOffsetOf(splices: readonly Splice[], splicedOffset: number): number {
  const sorted = [...splices].sort((a, b) => a.start - b.start || a.end - b.end);
  let shift = 0; // spliced offset minus source offset, before the next splice
  for (const s of sorted) {
    const splicedStart = s.start + shift;
    if (splicedOffset < splicedStart) break;
    if (splicedOffset < splicedStart + s.text.length) return s.start;
    shift += s.text.length - (s.end - s.start);
  }
  return splicedOffset - shift;
}
