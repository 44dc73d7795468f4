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
