/**
 * A use of an author's macro expanded as TeX expands it, so that the
 * skeinproof markup in its definition is read where it is used: the body with
 * each `#k` replaced by the use's argument k (TeX drops the braces of a braced
 * argument) and `##` by `#`. The expansion is a text of its own; its
 * `location` maps offsets back to where the author wrote them: a span inside
 * one argument to that argument, anything else (text from the body) to the
 * whole use.
 */
import type { SourceLocation } from '../../src/core/diagnostics/diagnostic.ts';
import type { Arg, MacroShape, Span } from './scanner.ts';
import type { TextOrigin } from './source-file.ts';

/** A text as written and as masked (comments and verbatim blanked, offsets kept). */
export interface TwoTexts {
  readonly raw: string;
  readonly masked: string;
}

/** A macro whose body holds skeinproof markup, recorded where it is defined. */
export interface MacroDefinition extends MacroShape {
  readonly body: TwoTexts;
  readonly optionalDefault: TwoTexts | undefined;
  /** Defined in a package file, where `@` is a letter. */
  readonly atLetter: boolean;
}

interface Segment {
  /** Offsets in the expansion. */
  readonly start: number;
  readonly end: number;
  /** Where the segment starts in the text the use is written in. */
  readonly parentStart: number;
}

export class Expansion implements TextOrigin {
  constructor(
    private readonly parent: TextOrigin,
    private readonly use: Span,
    /** The expansion as written (for the flat copy). */
    readonly text: string,
    /** The expansion as masked (for the scanner). */
    readonly masked: string,
    private readonly segments: readonly Segment[],
  ) {}

  location(start: number, end = start): SourceLocation {
    for (const s of this.segments) {
      if (s.start <= start && end <= s.end) return this.parent.location(s.parentStart + start - s.start, s.parentStart + end - s.start);
    }
    return this.parent.location(this.use.start, this.use.end);
  }
}

/** The expansion of a use of `macro` written at `use` in `parent`, with the arguments the scanner read there. */
export function expandUse(macro: MacroDefinition, parent: TextOrigin, parentMasked: string, use: Span, args: readonly (Arg | undefined)[]): Expansion {
  let raw = '';
  let masked = '';
  const segments: Segment[] = [];
  const append = (piece: TwoTexts, parentStart?: number): void => {
    if (piece.raw === '') return;
    // A control word at the end of one piece would take up the letters the next one starts with (`\relax` and `a`).
    if (endsWithControlWord(raw, macro.atLetter) && /^[A-Za-z@]/.test(piece.raw)) {
      raw += ' ';
      masked += ' ';
    }
    if (parentStart !== undefined) segments.push({ start: raw.length, end: raw.length + piece.raw.length, parentStart });
    raw += piece.raw;
    masked += piece.masked;
  };
  const body = macro.body;
  const bodyPart = (from: number, to: number): TwoTexts => ({ raw: body.raw.slice(from, to), masked: body.masked.slice(from, to) });
  let run = 0;
  for (let i = 0; i < body.masked.length; i++) {
    if (body.masked[i] !== '#') continue;
    const next = body.masked[i + 1] ?? '';
    if (next === '#') {
      append(bodyPart(run, i + 1));
      run = i + 2;
      i++;
    } else if (next >= '1' && next <= '9') {
      append(bodyPart(run, i));
      const k = Number(next);
      const arg = args[k - 1];
      if (arg) append({ raw: parent.text.slice(arg.start, arg.end), masked: parentMasked.slice(arg.start, arg.end) }, arg.start);
      else if (k === 1 && macro.optionalDefault) append(macro.optionalDefault);
      run = i + 2;
      i++;
    }
  }
  append(bodyPart(run, body.masked.length));
  return new Expansion(parent, use, raw, masked, segments);
}

/** Whether `text` ends with a control word (`\relax`, not the `\\` of a line break followed by letters). */
export function endsWithControlWord(text: string, atLetter = false): boolean {
  const tail = text.slice(-80);
  return (atLetter ? /(?:^|[^\\])(?:\\\\)*\\[A-Za-z@]+$/ : /(?:^|[^\\])(?:\\\\)*\\[A-Za-z]+$/).test(tail);
}
