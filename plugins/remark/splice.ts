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

/**
 * Splices that would make two math spans touch (`$V =$` then a typeset `$t$`,
 * or claim markup removed between them) get a space there: `$$` would open
 * display math instead. Returns the splices sorted, with those spaces added.
 */
export function keepMathApart(source: string, splices: readonly Splice[]): Splice[] {
  const out = [...splices].sort((a, b) => a.start - b.start || a.end - b.end).map((s) => ({ ...s }));
  /** The output character just before splice i (earlier splices already adjusted). */
  const charBefore = (i: number): string | undefined => {
    let at = out[i]!.start;
    for (let j = i - 1; j >= 0 && out[j]!.end === at; j--) {
      if (out[j]!.text !== '') return out[j]!.text[out[j]!.text.length - 1];
      at = out[j]!.start;
    }
    return source[at - 1];
  };
  /** The output character just after splice i. */
  const charAfter = (i: number): string | undefined => {
    let at = out[i]!.end;
    for (let j = i + 1; j < out.length && out[j]!.start === at; j++) {
      if (out[j]!.text !== '') return out[j]!.text[0];
      at = out[j]!.end;
    }
    return source[at];
  };
  out.forEach((s, i) => {
    const before = charBefore(i);
    const after = charAfter(i);
    if (s.text === '') {
      if (before === '$' && after === '$') s.text = ' ';
      return;
    }
    if (before === '$' && s.text.startsWith('$')) s.text = ` ${s.text}`;
    if (after === '$' && s.text.endsWith('$')) s.text = `${s.text} `;
  });
  return out;
}
