/**
 * The second pass over one LaTeX file (after ./mask.ts blanked comments and
 * verbatim bodies): finds skeinproof's markup, \input/\include and
 * \usepackage{skeinproof}, with exact offsets, and knows at each fill-in
 * whether TeX is in math mode there (the flat copy needs it).
 *
 * Math mode is tracked the way TeX switches it: `$…$`, `$$…$$`, `\(…\)`,
 * `\[…\]`, the display environments, \ensuremath, and text inside math
 * through \text, \mbox and their relatives.
 */
import { splitTopLevel, trim } from './key-values.ts';
import { controlWord } from './mask.ts';

/** A braced or bracketed argument: `text` is its inside (masked), `start`/`end` the inside's offsets. */
export interface Arg {
  readonly text: string;
  readonly start: number;
  readonly end: number;
}

export interface Span {
  readonly start: number;
  readonly end: number;
}

/** Fill-in shortcuts and the key each one stands for. */
export const FILL_SHORTCUTS: Readonly<Record<string, string>> = {
  skeinjones: 'jones',
  skeinbracket: 'bracket',
  skeinspan: 'span',
  skeinwrithe: 'writhe',
  skeinstatement: 'statement',
};

/**
 * A macro definition (\newcommand and its relatives, \def and its relatives, \NewDocumentCommand): its
 * body is scanned as usual, and the items found in it point back at it.
 */
export interface DefinitionItem {
  readonly kind: 'definition';
  readonly span: Span;
  readonly name: string;
  /** The number of parameters (#1 … #n). */
  readonly params: number;
  /** The default of an optional first argument (\newcommand\x[2][default]{…}, O{default}). */
  readonly optionalDefault: Arg | undefined;
  readonly body: Arg;
  /** False when its parameters are written in a way skeinproof does not expand (delimited \def parameters, other argument types). */
  readonly expandable: boolean;
}

/** How a use of a macro reads its arguments. */
export interface MacroShape {
  readonly params: number;
  /** Whether the first parameter is an optional argument in brackets. */
  readonly optional: boolean;
}

export interface ScanOptions {
  /** Macros whose uses are reported as `use` items (read live: the caller may add to it while scanning). */
  readonly macros?: ReadonlyMap<string, MacroShape>;
  /** `@` is a letter (package files). */
  readonly atLetter?: boolean;
}

export type ScanItem =
  | { readonly kind: 'code'; readonly span: Span; readonly beginSpan: Span; readonly endSpan: Span; readonly options: Arg; readonly body: Arg }
  /** A skeincode that is never closed (reported here): its options are still read, and its id refused. */
  | { readonly kind: 'unclosed-code'; readonly beginSpan: Span; readonly options: Arg }
  | {
      readonly kind: 'fill';
      readonly span: Span;
      readonly macro: string;
      readonly id: Arg;
      readonly key: Arg | string;
      readonly math: boolean;
      /** In the title of a sectioning command, which hyperref also turns into a PDF bookmark. */
      readonly inTitle: boolean;
      /** The innermost macro definition whose body holds it. */
      readonly definition: DefinitionItem | undefined;
    }
  | { readonly kind: 'claim'; readonly span: Span; readonly id: Arg; readonly key: Arg; readonly value: Arg; readonly definition: DefinitionItem | undefined }
  /** `\skeindrawing[settings]{id}`: the figure of a diagram. */
  | { readonly kind: 'drawing'; readonly span: Span; readonly settings: Arg | undefined; readonly id: Arg; readonly definition: DefinitionItem | undefined }
  | { readonly kind: 'convention'; readonly span: Span; readonly settings: Arg }
  | { readonly kind: 'input'; readonly span: Span; readonly command: 'input' | 'include'; readonly path: Arg; readonly definition: DefinitionItem | undefined }
  | DefinitionItem
  /** A use of one of the macros in ScanOptions.macros, with its arguments (an optional one not given is undefined). */
  | {
      readonly kind: 'use';
      readonly span: Span;
      readonly name: string;
      readonly args: readonly (Arg | undefined)[];
      /** In the title of a sectioning command (a PDF bookmark under hyperref). */
      readonly inTitle: boolean;
      readonly definition: DefinitionItem | undefined;
    }
  /** `\usepackage[options]{list}` or `\RequirePackage`: `names` are the packages of the list. */
  | { readonly kind: 'package'; readonly span: Span; readonly options: Arg | undefined; readonly list: Arg; readonly names: readonly Arg[] }
  /** `\documentclass[options]{name}`. */
  | { readonly kind: 'class'; readonly span: Span; readonly name: Arg }
  /** `\begin{document}`: the preamble ends here. */
  | { readonly kind: 'document'; readonly span: Span }
  | {
      readonly kind: 'table';
      /** `skeintable` (one diagram per row), or `skeingrid` (one diagram's Khovanov homology by bidegree). */
      readonly environment: TableEnvironment;
      readonly beginSpan: Span;
      readonly endSpan: Span;
      readonly options: Arg | undefined;
      /** The mandatory argument: the column keys of a skeintable, the diagram id of a skeingrid. */
      readonly columns: Arg;
      /** Between `\begin{tabular}{…}` and `\end{tabular}`. */
      readonly body: Arg;
    };

export type TableEnvironment = 'skeintable' | 'skeingrid';

export interface ScanProblem {
  readonly ruleId: string;
  readonly message: string;
  readonly span: Span;
}

export interface ScanResult {
  readonly items: readonly ScanItem[];
  readonly problems: readonly ScanProblem[];
}

const MATH_ENVIRONMENTS: ReadonlySet<string> = new Set(
  ['equation', 'align', 'gather', 'multline', 'flalign', 'alignat', 'eqnarray', 'displaymath', 'math'].flatMap((n) => [n, `${n}*`]),
);

/** Commands whose braced argument is text even inside math. */
const TEXT_IN_MATH: ReadonlySet<string> = new Set([
  'text', 'mbox', 'hbox', 'fbox', 'textrm', 'textit', 'textbf', 'textsf', 'texttt', 'textup', 'textsl', 'textnormal', 'intertext', 'shortintertext',
]);

/** Commands whose title (and [short title]) hyperref also writes as a PDF bookmark. */
const SECTIONING: ReadonlySet<string> = new Set(['part', 'chapter', 'section', 'subsection', 'subsubsection', 'paragraph', 'subparagraph']);

/** What closes the innermost open group or mode. */
type Closer = '}' | '$' | '$$' | '\\)' | '\\]' | `env:${string}`;

interface Frame {
  readonly math: boolean;
  readonly closer: Closer;
}

/** Commands that define a macro, by the way they are written. */
const LATEX_DEFINERS: ReadonlySet<string> = new Set(['newcommand', 'renewcommand', 'providecommand', 'DeclareRobustCommand']);
const TEX_DEFINERS: ReadonlySet<string> = new Set(['def', 'gdef', 'edef', 'xdef']);
const DOCUMENT_DEFINERS: ReadonlySet<string> = new Set(['NewDocumentCommand', 'RenewDocumentCommand', 'ProvideDocumentCommand', 'DeclareDocumentCommand']);
/** Commands after which a macro's name is not a use of it (`\let\a\b`, `\show\b`). */
const NAMING_BEFORE = /(?:\\(?:let|futurelet)\s*\\[A-Za-z@]+\s*=?\s*|\\(?:let|futurelet|show|meaning|string|noexpand|ShowCommand)\s*)$/;

export function scanLatex(text: string, options: ScanOptions = {}): ScanResult {
  const scan = scanLatexItems(text, options);
  const items = [...scan.items];
  return { items, problems: scan.problems };
}

/**
 * The items one at a time, so that the caller can act on each (follow an \input, record a definition) before
 * the scan reads on; `problems` fills up as the items are read.
 */
export function scanLatexItems(text: string, options: ScanOptions = {}): { readonly items: Iterable<ScanItem>; readonly problems: readonly ScanProblem[] } {
  const scanner = new Scanner(text, options);
  return { items: scanner.run(), problems: scanner.problems };
}

class Scanner {
  private items: ScanItem[] = [];
  readonly problems: ScanProblem[] = [];
  private readonly stack: Frame[] = [];
  /** The mode the next `{` opens, after \text-like (text) or \ensuremath (math) commands. */
  private pendingMode: boolean | undefined;
  private pos = 0;
  /** Where the \end{skeintable} of each table already read starts: reaching it there is no stray \end. */
  private readonly tableEnds = new Set<number>();
  /** Set when an argument's `{` was reported unclosed, so the caller does not also call it missing. */
  private unclosedReported = false;
  /** The arguments of sectioning commands read so far (their insides are scanned as usual). */
  private readonly titles: Span[] = [];
  /** The macro definitions read so far (their bodies are scanned as usual). */
  private readonly definitions: DefinitionItem[] = [];

  constructor(
    private readonly text: string,
    private readonly options: ScanOptions,
  ) {}

  *run(): Generator<ScanItem> {
    const t = this.text;
    while (this.pos < t.length) {
      if (this.items.length > 0) {
        const ready = this.items;
        this.items = [];
        yield* ready;
      }
      const ch = t[this.pos]!;
      if (ch === '\\') this.command();
      else if (ch === '$') this.dollar();
      else if (ch === '{') {
        this.stack.push({ math: this.pendingMode ?? this.inMath(), closer: '}' });
        this.pendingMode = undefined;
        this.pos++;
      } else if (ch === '}') {
        if (this.top()?.closer === '}') this.stack.pop();
        this.pos++;
      } else {
        if (!/\s/.test(ch)) this.pendingMode = undefined;
        this.pos++;
      }
    }
    yield* this.items;
  }

  private inMath(): boolean {
    return this.top()?.math ?? false;
  }

  private top(): Frame | undefined {
    return this.stack[this.stack.length - 1];
  }

  private toggle(closer: Closer): void {
    if (this.top()?.closer === closer) this.stack.pop();
    else this.stack.push({ math: true, closer });
  }

  private dollar(): void {
    if (this.text[this.pos + 1] === '$') {
      this.toggle('$$');
      this.pos += 2;
    } else {
      this.toggle('$');
      this.pos++;
    }
  }

  private command(): void {
    const start = this.pos;
    this.unclosedReported = false;
    const name = controlWord(this.text, start + 1, this.options.atLetter);
    if (name === undefined) {
      const symbol = this.text[start + 1];
      if (symbol === '(' || symbol === '[') this.stack.push({ math: true, closer: symbol === '(' ? '\\)' : '\\]' });
      else if ((symbol === ')' || symbol === ']') && this.top()?.closer === `\\${symbol}`) this.stack.pop();
      this.pos = start + 2;
      return;
    }
    this.pos = start + 1 + name.length;
    if (this.inMath() && TEXT_IN_MATH.has(name)) {
      this.pendingMode = false;
      return;
    }
    if (name === 'ensuremath') {
      this.pendingMode = true;
      return;
    }
    this.pendingMode = undefined;
    if (SECTIONING.has(name)) return this.title();
    if (LATEX_DEFINERS.has(name)) return this.latexDefinition(start);
    if (TEX_DEFINERS.has(name)) return this.texDefinition(start);
    if (DOCUMENT_DEFINERS.has(name)) return this.documentDefinition(start);
    switch (name) {
      case 'begin':
        return this.begin(start);
      case 'end':
        return this.end(start);
      case 'input':
      case 'include':
        return this.input(start, name);
      case 'usepackage':
      case 'RequirePackage':
        return this.usePackage(start);
      case 'documentclass':
        return this.documentClass(start);
      case 'skeinconvention':
        return this.convention(start);
      case 'skeinvalue':
        return this.fill(start, name, undefined);
      case 'skeinclaim':
        return this.claim(start);
      case 'skeindrawing':
        return this.drawing(start);
      default:
        if (Object.hasOwn(FILL_SHORTCUTS, name)) return this.fill(start, name, FILL_SHORTCUTS[name]!);
        if (this.options.macros?.has(name) && !NAMING_BEFORE.test(this.text.slice(Math.max(0, start - 80), start))) this.use(start, name);
    }
  }

  /** `\newcommand*{\name}[n][default]{body}` (and \renewcommand, \providecommand, \DeclareRobustCommand). */
  private latexDefinition(start: number): void {
    const at = this.text[this.pos] === '*' ? this.pos + 1 : this.pos;
    const name = this.definedName(at);
    if (!name) return;
    const count = this.bracket(name.next);
    const written = count && /^\s*\d\s*$/.test(count.arg.text);
    const params = written ? Number(count.arg.text) : 0;
    const optional = count ? this.bracket(count.next) : undefined;
    const body = this.group(optional?.next ?? count?.next ?? name.next);
    if (!body) return;
    this.defined(start, name.name, params, optional?.arg, body, count === undefined || written === true);
  }

  /** `\def\name#1#2{body}` (and \gdef, \edef, \xdef): only undelimited parameters are expanded. */
  private texDefinition(start: number): void {
    const name = this.definedName(this.pos);
    if (!name) return;
    const open = this.text.indexOf('{', name.next);
    if (open < 0 || open - name.next > 200) return;
    const parameterText = this.text.slice(name.next, open);
    const body = this.group(open);
    if (!body) return;
    const simple = /^(?:#[1-9])*$/.test(parameterText) && [...parameterText.matchAll(/#(\d)/g)].every((m, i) => Number(m[1]) === i + 1);
    this.defined(start, name.name, (parameterText.match(/#/g) ?? []).length, undefined, body, simple);
  }

  /** `\NewDocumentCommand\name{O{default} m m}{body}`: mandatory arguments, and an optional first one with a default. */
  private documentDefinition(start: number): void {
    const name = this.definedName(this.pos);
    if (!name) return;
    const spec = this.group(name.next);
    if (!spec) return;
    const body = this.group(spec.next);
    if (!body) return;
    const form = /^\s*(?:O\s*\{([^{}]*)\})?((?:\s*m)*)\s*$/.exec(spec.arg.text);
    const mandatory = form ? (form[2]!.match(/m/g) ?? []).length : 0;
    let optional: Arg | undefined;
    if (form?.[1] !== undefined) {
      const at = spec.arg.start + spec.arg.text.indexOf('{') + 1;
      optional = { text: form[1], start: at, end: at + form[1].length };
    }
    const params = form ? mandatory + (optional ? 1 : 0) : (spec.arg.text.match(/[A-Za-z]/g) ?? []).length;
    this.defined(start, name.name, params, optional, body, form !== null);
  }

  /** The name a definition defines: `\name` or `{\name}`. */
  private definedName(at: number): { name: string; next: number } | undefined {
    const braced = this.delimited(at, '{', '}', false);
    const m = braced ? /^\s*\\([A-Za-z@]+)\s*$/.exec(braced.arg.text) : /^\s*\\/.exec(this.text.slice(at, at + 100));
    if (!m) return undefined;
    if (braced) return { name: m[1]!, next: braced.next };
    const nameStart = at + m[0].length;
    const name = controlWord(this.text, nameStart, this.options.atLetter);
    return name === undefined ? undefined : { name, next: nameStart + name.length };
  }

  private defined(start: number, name: string, params: number, optionalDefault: Arg | undefined, body: { arg: Arg; next: number }, expandable: boolean): void {
    const item: DefinitionItem = { kind: 'definition', span: { start, end: body.next }, name, params, optionalDefault, body: body.arg, expandable };
    this.items.push(item);
    this.definitions.push(item);
    this.pos = body.arg.start - 1; // the body is read on as usual, from its brace
  }

  /** The innermost definition whose body holds `at`. */
  private definitionAt(at: number): DefinitionItem | undefined {
    for (let k = this.definitions.length - 1; k >= 0; k--) {
      const d = this.definitions[k]!;
      if (d.body.start <= at && at < d.body.end) return d;
    }
    return undefined;
  }

  /** A use of a known macro: its arguments as TeX reads them, a braced group or else one token each. */
  private use(start: number, name: string): void {
    const shape = this.options.macros!.get(name)!;
    const args: (Arg | undefined)[] = [];
    let at = this.pos;
    if (shape.optional) {
      const optional = this.bracket(at);
      args.push(optional?.arg);
      if (optional) at = optional.next;
    }
    while (args.length < shape.params) {
      const arg = this.undelimited(at);
      if (!arg) {
        this.missing(
          `\\${name} takes ${shape.params} argument${shape.params > 1 ? 's' : ''}, and its definition holds skeinproof markup, but argument ${args.length + 1} is missing here: give each in braces`,
          { start, end: at },
        );
        this.pos = at;
        return;
      }
      args.push(arg.arg);
      at = arg.next;
    }
    const inTitle = this.titles.some((t) => t.start <= start && start < t.end);
    this.items.push({ kind: 'use', span: { start, end: at }, name, args, inTitle, definition: this.definitionAt(start) });
    this.pos = at; // the arguments are read with the expansion, not here
  }

  /** An undelimited macro argument as TeX reads it: after spaces (not a blank line), a braced group or one token. */
  private undelimited(at: number): { arg: Arg; next: number } | undefined {
    const braced = this.group(at);
    if (braced) return braced;
    if (this.unclosedReported) return undefined;
    const t = this.text;
    const m = /^[ \t]*(?:\r?\n[ \t]*)?/.exec(t.slice(at, at + 200))!;
    const k = at + m[0].length;
    const ch = t[k];
    if (ch === undefined || ch === '}' || ch === '\n' || ch === '\r' || ch === '{') return undefined;
    const word = ch === '\\' ? controlWord(t, k + 1, this.options.atLetter) : undefined;
    const end = ch === '\\' ? k + 1 + (word?.length ?? 1) : k + 1;
    return { arg: { text: t.slice(k, end), start: k, end }, next: end };
  }

  private begin(start: number): void {
    const env = this.group(this.pos);
    if (!env) return;
    this.pos = env.next;
    const name = env.arg.text.trim();
    if (name === 'skeincode') return this.codeEnvironment(start);
    if (name === 'skeintable' || name === 'skeingrid') return this.tableEnvironment(start, name);
    if (name === 'document') this.items.push({ kind: 'document', span: { start, end: env.next } });
    if (MATH_ENVIRONMENTS.has(name)) this.stack.push({ math: true, closer: `env:${name}` });
  }

  private end(start: number): void {
    const env = this.group(this.pos);
    if (!env) return;
    this.pos = env.next;
    const name = env.arg.text.trim();
    if (this.top()?.closer === `env:${name}`) this.stack.pop();
    else if ((name === 'skeintable' || name === 'skeingrid') && this.tableEnds.has(start)) return;
    else if (name === 'skeincode' || name === 'skeintable' || name === 'skeingrid') {
      this.problem('latex-environment-unopened', `\\end{${name}} closes no \\begin{${name}}: remove it, or add the \\begin{${name}}{…} it belongs to`, { start, end: env.next });
    }
  }

  private codeEnvironment(start: number): void {
    const options = this.group(this.pos);
    if (!options) {
      const bracketed = this.bracket(this.pos) !== undefined;
      this.missing(
        bracketed
          ? '\\begin{skeincode} takes its options in braces, not brackets (a PD code may itself start with a bracket): write \\begin{skeincode}{id=…, notation=…}'
          : '\\begin{skeincode} needs its options in braces right after it, e.g. \\begin{skeincode}{id=trefoil, notation=braid}',
        { start, end: this.pos },
      );
      const close = this.codeEnd(this.pos);
      if (close) this.pos = close.end; // its \end belongs to this environment, not a stray one
      return;
    }
    const endSpan = this.codeEnd(options.next);
    if (!endSpan) {
      this.problem('latex-environment-unclosed', '\\begin{skeincode} is never closed: add \\end{skeincode} after the code', { start, end: options.next });
      this.items.push({ kind: 'unclosed-code', beginSpan: { start, end: options.next }, options: options.arg });
      this.pos = options.next;
      return;
    }
    this.items.push({
      kind: 'code',
      span: { start, end: endSpan.end },
      beginSpan: { start, end: options.next },
      endSpan,
      options: options.arg,
      body: { text: this.text.slice(options.next, endSpan.start), start: options.next, end: endSpan.start },
    });
    this.pos = endSpan.end;
  }

  private tableEnvironment(start: number, environment: TableEnvironment): void {
    const options = this.bracket(this.pos);
    const after = options ? options.next : this.pos;
    const columns = this.group(after);
    if (!columns) {
      this.missing(
        environment === 'skeintable'
          ? '\\begin{skeintable} needs its column keys in braces, e.g. \\begin{skeintable}{id, jones, crossing-number}'
          : '\\begin{skeingrid} needs the id of its diagram in braces, e.g. \\begin{skeingrid}{trefoil}',
        { start, end: after },
      );
      this.pos = after;
      return;
    }
    const beginSpan = { start, end: columns.next };
    this.pos = columns.next;
    const inner = /^\s*\\begin\s*\{\s*([^{}]*?)\s*\}/.exec(this.text.slice(columns.next, columns.next + 400));
    const tabular = inner && /^(tabular\*?|longtable)$/.test(inner[1]!) ? inner : null;
    if (!tabular) {
      this.problem(
        'latex-table-malformed',
        inner
          ? `a skein table holds a tabular, tabular* or longtable, and skeinproof does not read the rows of \`${inner[1]}\`: use one of those (a longtable for a table that runs over pages; p{…} columns for set widths)`
          : `a skein table must hold a tabular: put \\begin{tabular}{…} (or tabular*, longtable) right after \\begin{${environment}}{…}`,
        beginSpan,
      );
      this.ownEnd(columns.next, environment); // one message: the table's own \end{skeintable} is no stray one
      return;
    }
    let at = columns.next + tabular[0].length;
    if (tabular[1] === 'tabular*') at = this.group(at)?.next ?? at;
    at = this.bracket(at)?.next ?? at;
    const spec = this.group(at);
    if (!spec) {
      this.problem('latex-table-malformed', `\\begin{${tabular[1]}} needs its column specification in braces`, { start: columns.next, end: at });
      this.ownEnd(columns.next, environment);
      return;
    }
    const bodyEnd = this.matchingEnd(spec.next, tabular[1]!);
    const closing = bodyEnd === undefined ? null : new RegExp(`^\\s*\\\\end\\s*\\{${environment}\\}`).exec(this.text.slice(bodyEnd.end, bodyEnd.end + 400));
    if (bodyEnd === undefined || !closing) {
      this.problem(
        'latex-environment-unclosed',
        bodyEnd === undefined
          ? `the tabular of this skein table is never closed: add \\end{${tabular[1]}} and then \\end{${environment}}`
          : `this skein table is never closed: put \\end{${environment}} right after \\end{${tabular[1]}}`,
        beginSpan,
      );
      this.ownEnd(columns.next, environment);
      return;
    }
    const endStart = bodyEnd.end + closing[0].indexOf('\\');
    this.tableEnds.add(endStart);
    this.items.push({
      kind: 'table',
      environment,
      beginSpan,
      endSpan: { start: endStart, end: bodyEnd.end + closing[0].length },
      options: options?.arg,
      columns: columns.arg,
      body: { text: this.text.slice(spec.next, bodyEnd.start), start: spec.next, end: bodyEnd.start },
    });
    // The cells are scanned as ordinary text too, so fill-ins in free columns are found.
    this.pos = spec.next;
  }

  /** Marks the \end{skeintable} that closes a table refused at its start, so that reaching it is not called stray. */
  private ownEnd(from: number, environment: TableEnvironment): void {
    const end = this.matchingEnd(from, environment);
    if (end) this.tableEnds.add(end.start);
  }

  /** The first `\end{skeincode}` from `from` on (LaTeX allows spaces before the brace, as in `\end {skeincode}`). */
  private codeEnd(from: number): Span | undefined {
    const pattern = /\\end\s*\{skeincode\}/g;
    pattern.lastIndex = from;
    const m = pattern.exec(this.text);
    return m ? { start: m.index, end: m.index + m[0].length } : undefined;
  }

  /** The `\end{name}` matching an already opened `\begin{name}`, counting nested ones. */
  private matchingEnd(from: number, name: string): Span | undefined {
    const pattern = /\\(begin|end)\s*\{([^}]*)\}/g;
    pattern.lastIndex = from;
    let depth = 1;
    for (let m = pattern.exec(this.text); m; m = pattern.exec(this.text)) {
      if (m[2]!.trim() !== name) continue;
      depth += m[1] === 'begin' ? 1 : -1;
      if (depth === 0) return { start: m.index, end: m.index + m[0].length };
    }
    return undefined;
  }

  private input(start: number, command: 'input' | 'include'): void {
    const braced = this.group(this.pos);
    if (braced) {
      this.items.push({ kind: 'input', span: { start, end: braced.next }, command, path: braced.arg, definition: this.definitionAt(start) });
      this.pos = braced.next;
      return;
    }
    // \input also takes a bare file name ending at a space or the end of the line.
    const bare = command === 'input' ? /^[ \t]*([^\s{}\\%]+)/.exec(this.text.slice(this.pos, this.pos + 1000)) : null;
    if (!bare) {
      this.missing(`\\${command} needs a file name, e.g. \\${command}{sections/examples}`, { start, end: this.pos });
      return;
    }
    const pathStart = this.pos + bare[0].length - bare[1]!.length;
    const end = this.pos + bare[0].length;
    this.items.push({ kind: 'input', span: { start, end }, command, path: { text: bare[1]!, start: pathStart, end }, definition: this.definitionAt(start) });
    this.pos = end;
  }

  private usePackage(start: number): void {
    const options = this.bracket(this.pos);
    const list = this.group(options ? options.next : this.pos);
    if (!list) return;
    this.pos = list.next;
    const names = splitTopLevel(list.arg, ',')
      .map(trim)
      .filter((n) => n.text !== '');
    this.items.push({ kind: 'package', span: { start, end: list.next }, options: options?.arg, list: list.arg, names });
  }

  private documentClass(start: number): void {
    const options = this.bracket(this.pos);
    const name = this.group(options ? options.next : this.pos);
    if (!name) return;
    this.pos = name.next;
    this.items.push({ kind: 'class', span: { start, end: name.next }, name: trim(name.arg) });
  }

  private convention(start: number): void {
    const settings = this.requiredGroups(start, '\\skeinconvention', ['settings'], 'e.g. \\skeinconvention{jones=q, order=descending}');
    if (settings) this.items.push({ kind: 'convention', span: { start, end: this.pos }, settings: settings[0]! });
  }

  /** Notes where the [short title] and {title} of a sectioning command lie; reading goes on inside them. */
  private title(): void {
    const at = this.text[this.pos] === '*' ? this.pos + 1 : this.pos;
    const short = this.bracket(at);
    const full = this.delimited(short ? short.next : at, '{', '}', false);
    if (short) this.titles.push({ start: short.arg.start, end: short.arg.end });
    if (full) this.titles.push({ start: full.arg.start, end: full.arg.end });
  }

  private fill(start: number, macro: string, fixedKey: string | undefined): void {
    const math = this.inMath();
    const inTitle = this.titles.some((t) => t.start <= start && start < t.end);
    if (fixedKey !== undefined) {
      const args = this.requiredGroups(start, `\\${macro}`, ['diagram id'], `e.g. \\${macro}{trefoil}`);
      if (args) this.items.push({ kind: 'fill', span: { start, end: this.pos }, macro, id: args[0]!, key: fixedKey, math, inTitle, definition: this.definitionAt(start) });
      return;
    }
    const args = this.requiredGroups(start, `\\${macro}`, ['diagram id', 'key'], `e.g. \\${macro}{trefoil}{jones}`);
    if (args) this.items.push({ kind: 'fill', span: { start, end: this.pos }, macro, id: args[0]!, key: args[1]!, math, inTitle, definition: this.definitionAt(start) });
  }

  private claim(start: number): void {
    const args = this.requiredGroups(start, '\\skeinclaim', ['diagram id', 'key', 'value'], 'e.g. \\skeinclaim{trefoil}{jones}{t + t^3 - t^4}');
    if (args) this.items.push({ kind: 'claim', span: { start, end: this.pos }, id: args[0]!, key: args[1]!, value: args[2]!, definition: this.definitionAt(start) });
  }

  private drawing(start: number): void {
    const settings = this.bracket(this.pos);
    if (settings) this.pos = settings.next;
    const args = this.requiredGroups(start, '\\skeindrawing', ['diagram id'], 'e.g. \\skeindrawing[size=5cm]{trefoil}');
    if (args) this.items.push({ kind: 'drawing', span: { start, end: this.pos }, settings: settings?.arg, id: args[0]!, definition: this.definitionAt(start) });
  }

  /** Reads the braced arguments a macro needs; reports the first one missing. */
  private requiredGroups(start: number, macro: string, names: readonly string[], example: string): Arg[] | undefined {
    const args: Arg[] = [];
    for (const name of names) {
      const g = this.group(this.pos);
      if (!g) {
        this.missing(
          `${macro} takes ${names.length} braced argument${names.length > 1 ? 's' : ''} (${names.join(', ')}), but the ${name} is missing here: ${example}`,
          { start, end: this.pos },
        );
        return undefined;
      }
      args.push(g.arg);
      this.pos = g.next;
    }
    return args;
  }

  /** A `{…}` group after optional white space, balanced and respecting escapes; undefined if none starts here. */
  private group(at: number): { arg: Arg; next: number } | undefined {
    return this.delimited(at, '{', '}');
  }

  private bracket(at: number): { arg: Arg; next: number } | undefined {
    return this.delimited(at, '[', ']');
  }

  /** `report`: whether a `{` never closed is reported (not for arguments only looked at, whose insides are read on anyway). */
  private delimited(at: number, open: string, close: string, report = true): { arg: Arg; next: number } | undefined {
    const t = this.text;
    let k = at;
    while (k < t.length && (t[k] === ' ' || t[k] === '\t' || t[k] === '\n' || t[k] === '\r')) {
      if (t[k] === '\n' && /^[ \t\r]*\n/.test(t.slice(k + 1, k + 200))) return undefined; // a blank line ends the command
      k++;
    }
    if (t[k] !== open) return undefined;
    let braces = 0;
    for (let j = k + 1; j < t.length; j++) {
      const c = t[j]!;
      if (c === '\\') j++;
      else if (c === '{') braces++;
      else if (c === '}') {
        if (braces === 0 && close === '}') return { arg: { text: t.slice(k + 1, j), start: k + 1, end: j }, next: j + 1 };
        braces--;
        if (braces < 0) break;
      } else if (c === close && braces === 0) return { arg: { text: t.slice(k + 1, j), start: k + 1, end: j }, next: j + 1 };
    }
    if (open === '{' && report) {
      this.problem('latex-brace-unbalanced', 'this `{` is never closed: add the matching `}`', { start: k, end: k + 1 });
      this.unclosedReported = true;
    }
    return undefined;
  }

  private problem(ruleId: string, message: string, span: Span): void {
    this.problems.push({ ruleId, message, span });
  }

  /** A missing argument, unless it is missing because its `{` was never closed (already reported). */
  private missing(message: string, span: Span): void {
    if (this.unclosedReported) this.unclosedReported = false;
    else this.problem('latex-argument-missing', message, span);
  }
}
