/**
 * key=value lists as LaTeX packages read them (`id=trefoil, jones={t+t^3-t^4}`):
 * items split at commas outside braces, spaces around keys and values
 * dropped, one pair of braces around a value removed. Offsets stay exact so
 * a bad key or value is reported where it is written.
 */
import type { Arg, Span } from './scanner.ts';

export interface KeyValue {
  readonly key: string;
  readonly keySpan: Span;
  /** Undefined when the item has no `=`. */
  readonly value: Arg | undefined;
}

export function readKeyValues(list: Arg): KeyValue[] {
  const result: KeyValue[] = [];
  for (const item of splitTopLevel(list, ',')) {
    const eq = topLevelIndex(item.text, '=');
    const keyPart = eq < 0 ? item : slice(item, 0, eq);
    const key = trim(keyPart);
    if (key.text === '' && eq < 0) continue; // empty items, e.g. a trailing comma
    result.push({ key: key.text, keySpan: { start: key.start, end: key.end }, value: eq < 0 ? undefined : unbrace(trim(slice(item, eq + 1, item.text.length))) });
  }
  return result;
}

/** Splits at `separator` where no brace is open (and not after a backslash). */
export function splitTopLevel(arg: Arg, separator: string): Arg[] {
  const parts: Arg[] = [];
  let depth = 0;
  let from = 0;
  for (let i = 0; i < arg.text.length; i++) {
    const c = arg.text[i]!;
    if (c === '\\') i++;
    else if (c === '{') depth++;
    else if (c === '}') depth--;
    else if (c === separator && depth === 0) {
      parts.push(slice(arg, from, i));
      from = i + 1;
    }
  }
  parts.push(slice(arg, from, arg.text.length));
  return parts;
}

function topLevelIndex(text: string, ch: string): number {
  let depth = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text[i]!;
    if (c === '\\') i++;
    else if (c === '{') depth++;
    else if (c === '}') depth--;
    else if (c === ch && depth === 0) return i;
  }
  return -1;
}

export function slice(arg: Arg, from: number, to: number): Arg {
  return { text: arg.text.slice(from, to), start: arg.start + from, end: arg.start + to };
}

export function trim(arg: Arg): Arg {
  const lead = arg.text.length - arg.text.trimStart().length;
  const body = arg.text.trim();
  return slice(arg, lead, lead + body.length);
}

/** Removes one pair of braces enclosing the whole value, as keyval does. */
export function unbrace(arg: Arg): Arg {
  const t = arg.text;
  if (!t.startsWith('{') || !t.endsWith('}')) return arg;
  let depth = 0;
  for (let i = 0; i < t.length; i++) {
    const c = t[i]!;
    if (c === '\\') i++;
    else if (c === '{') depth++;
    else if (c === '}' && --depth === 0 && i < t.length - 1) return arg; // `{a}{b}`: not one enclosing pair
  }
  return trim(slice(arg, 1, t.length - 1));
}
