/**
 * The first pass over a LaTeX file: blanks out what TeX never reads as
 * commands, keeping every offset and line break where it was.
 *
 * - A comment runs from an unescaped `%` to the end of its line (`\%` is a
 *   percent sign, `\\%` a line break followed by a comment).
 * - The bodies of verbatim environments and of `\verb` / `\lstinline` are
 *   printed as typed, so nothing inside them is markup.
 * - `\iffalse … \fi` (up to a matching `\else` or `\fi`) is skipped by TeX,
 *   the usual way to switch off a passage.
 *
 * Later passes scan the masked text, so a `\skeinjones` inside a comment or a
 * verbatim listing is never mistaken for a fill-in.
 */

/** Environments whose bodies TeX reads verbatim. */
export const VERBATIM_ENVIRONMENTS: ReadonlySet<string> = new Set([
  'verbatim',
  'verbatim*',
  'Verbatim',
  'Verbatim*',
  'BVerbatim',
  'LVerbatim',
  'lstlisting',
  'minted',
  'comment',
]);

/** Inline verbatim commands: the argument is delimited by a repeated character (or braces for \lstinline). */
const INLINE_VERBATIM: ReadonlySet<string> = new Set(['verb', 'lstinline']);

/** Returns a text of the same length: comments and verbatim bodies replaced by spaces, line breaks kept. */
export function maskLatex(source: string): string {
  const out = source.split('');
  const blank = (from: number, to: number): void => {
    for (let k = from; k < to; k++) if (out[k] !== '\n' && out[k] !== '\r') out[k] = ' ';
  };
  let i = 0;
  while (i < source.length) {
    const ch = source[i]!;
    if (ch === '%') {
      const end = lineEnd(source, i);
      blank(i, end);
      i = end;
      continue;
    }
    if (ch !== '\\') {
      i++;
      continue;
    }
    const name = controlWord(source, i + 1);
    if (name === undefined) {
      i += 2; // a control symbol such as \% or \\ : its character is not markup
      continue;
    }
    const afterName = i + 1 + name.length;
    if (name === 'iffalse') {
      i = skipFalseBranch(source, afterName, blank);
      continue;
    }
    if (name === 'iftrue') {
      skipElseBranch(source, afterName, blank);
      i = afterName;
      continue;
    }
    if (INLINE_VERBATIM.has(name)) {
      i = skipInlineVerbatim(source, name, afterName, blank);
      continue;
    }
    if (name === 'begin') {
      const env = /^\s*\{([A-Za-z*]+)\}/.exec(source.slice(afterName, afterName + 64));
      if (env && VERBATIM_ENVIRONMENTS.has(env[1]!)) {
        const bodyStart = afterName + env[0].length;
        const closing = `\\end{${env[1]}}`;
        const close = source.indexOf(closing, bodyStart);
        const bodyEnd = close < 0 ? source.length : close;
        blank(bodyStart, bodyEnd);
        i = close < 0 ? source.length : close + closing.length;
        continue;
      }
    }
    i = afterName;
  }
  return out.join('');
}

/**
 * The letters of a control word starting at `at`, or undefined for a control symbol. `atLetter`: `@` is a
 * letter too, as in package files (and after \makeatletter).
 */
export function controlWord(text: string, at: number, atLetter = false): string | undefined {
  let k = at;
  while (k < text.length && isLetter(text.charCodeAt(k), atLetter)) k++;
  return k === at ? undefined : text.slice(at, k);
}

function isLetter(code: number, atLetter = false): boolean {
  return (code >= 65 && code <= 90) || (code >= 97 && code <= 122) || (atLetter && code === 64);
}

function lineEnd(text: string, from: number): number {
  const nl = text.indexOf('\n', from);
  const end = nl < 0 ? text.length : nl;
  return end > from && text[end - 1] === '\r' ? end - 1 : end;
}

/**
 * Blanks the argument of \\verb or \\lstinline starting at `at` (after the command name). As in LaTeX, spaces
 * before the delimiter are skipped (\\@sverb in latex.ltx), \\lstinline may take [options] first, and only
 * \\lstinline pairs `{` with `}`; \\verb ends at the next copy of its delimiter.
 */
function skipInlineVerbatim(text: string, name: string, at: number, blank: (from: number, to: number) => void): number {
  let k = at;
  if (text[k] === '*') k++;
  while (text[k] === ' ' || text[k] === '\t') k++;
  if (name === 'lstinline' && text[k] === '[') {
    const options = text.indexOf(']', k);
    if (options < 0 || options > lineEnd(text, k)) return k;
    k = options + 1;
    while (text[k] === ' ' || text[k] === '\t') k++;
  }
  const open = text[k];
  if (open === undefined || open === '\n' || open === '\r') return k;
  const close = open === '{' && name === 'lstinline' ? '}' : open;
  const end = text.indexOf(close, k + 1);
  const line = lineEnd(text, k + 1);
  // TeX stops \\verb at the end of the line; an unterminated one is TeX's error to report.
  const stop = end < 0 || end > line ? line : end + 1;
  blank(k, stop);
  return stop;
}

/** TeX's own conditionals: skipping a false branch, TeX counts these to find the matching \\fi. */
const CONDITIONALS: ReadonlySet<string> = new Set([
  'if', 'ifcat', 'ifnum', 'ifdim', 'ifodd', 'ifvmode', 'ifhmode', 'ifmmode', 'ifinner', 'ifvoid', 'ifhbox', 'ifvbox',
  'ifx', 'ifeof', 'iftrue', 'iffalse', 'ifcase', 'ifdefined', 'ifcsname', 'iffontchar', 'ifincsname',
]);

/**
 * Blanks what follows \\iffalse up to the \\else or \\fi that matches it (comments
 * inside count as comments). Returns where reading goes on: the \\else branch is
 * read, and an unmatched \\iffalse hides the rest of the file, as in TeX.
 */
function skipFalseBranch(text: string, from: number, blank: (from: number, to: number) => void): number {
  const end = branchEnd(text, from, true);
  if (end === undefined) {
    blank(from, text.length);
    return text.length;
  }
  blank(from, end.start);
  return end.end;
}

/** Blanks the \\else branch of an \\iftrue (up to its matching \\fi), which TeX skips; the first branch is read as usual. */
function skipElseBranch(text: string, from: number, blank: (from: number, to: number) => void): void {
  const elseAt = branchEnd(text, from, true);
  if (elseAt?.name !== 'else') return;
  const fi = branchEnd(text, elseAt.end, false);
  blank(elseAt.end, fi === undefined ? text.length : fi.start);
}

/**
 * The \\fi (or, when `stopAtElse`, the \\else) that belongs to the conditional
 * whose branch starts at `from`: TeX counts the conditionals nested in it to find
 * it, and skips comments.
 */
function branchEnd(text: string, from: number, stopAtElse: boolean): { name: 'else' | 'fi'; start: number; end: number } | undefined {
  let depth = 0;
  let k = from;
  while (k < text.length) {
    const ch = text[k]!;
    if (ch === '%') {
      k = lineEnd(text, k);
      continue;
    }
    if (ch !== '\\') {
      k++;
      continue;
    }
    const name = controlWord(text, k + 1);
    if (name === undefined) {
      k += 2;
      continue;
    }
    const end = k + 1 + name.length;
    if (CONDITIONALS.has(name)) depth++;
    else if (depth === 0 && (name === 'fi' || (name === 'else' && stopAtElse))) return { name, start: k, end };
    else if (name === 'fi') depth--;
    k = end;
  }
  return undefined;
}
