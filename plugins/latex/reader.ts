/**
 * Reads a LaTeX manuscript and the files it \input s or \include s into the
 * entries the manuscript pass checks (diagrams, claims, fill-ins), the
 * document's convention settings, located problems with the markup, and the
 * splices that turn each file into its flat copy.
 *
 * File access goes through `LatexFileSystem`, so the reader itself never
 * touches the disk and tests can hand it files from memory.
 */
import { basename, dirname, isAbsolute, join, relative, resolve, sep } from 'node:path';
import type { Notation } from '../../src/core/diagram/model.ts';
import type { Convention } from '../../src/core/convention/convention.ts';
import { CONVENTION_SETTINGS, readConventionSettings, type SettingSpans } from '../../src/core/convention/settings.ts';
import { DEFAULT_CONVENTION } from '../../src/core/convention/convention.ts';
import type { Diagnostic, SourceLocation, TextSpan } from '../../src/core/diagnostics/diagnostic.ts';
import type { ClaimEntry, DiagramEntry, FigureEntry, FillEntry, KhovanovGridEntry, Locator } from '../../src/core/manuscript/api.ts';
import { gridCellClaim, type GridValues } from '../../src/core/claims/khovanov-grid.ts';
import type { FigureSetting } from '../../src/core/manuscript/figure-settings.ts';
import { CLAIM_KEYS, FILL_KEYS, isClaimKey, isFillKey } from '../../src/core/claims/index.ts';
import type { ClaimKey, FillKey } from '../../src/core/claims/api.ts';
import { NOTATIONS } from '../../src/core/notation/index.ts';
import { readKeyValues, splitTopLevel, trim, slice } from './key-values.ts';
import { maskLatex } from './mask.ts';
import { FILL_SHORTCUTS, scanLatexItems, type Arg, type DefinitionItem, type ScanItem, type Span } from './scanner.ts';
import { SourceFile, type TextOrigin } from './source-file.ts';
import { expandUse, type Expansion, type MacroDefinition } from './expansion.ts';
import { killAt, splitTabular } from './tabular.ts';
import { gridLayout, type GridRows } from '../../src/core/manuscript/grid-layout.ts';

export interface LatexFileSystem {
  /**
   * The text of the file; undefined when there is none; `notRegular` (what the file is: "a named pipe") when
   * it exists but is no regular file, which skeinproof never reads (a pipe would block, a device never end).
   */
  read(absolutePath: string): string | { readonly notRegular: string } | undefined;
  /** The path with symbolic links resolved; identity when not given. */
  realpath?(absolutePath: string): string;
}

/** Where a fill-in's value goes: a macro of a named diagram, or an empty cell of a skein table. */
export type FillTarget =
  | {
      readonly kind: 'macro';
      readonly id: string;
      readonly key: FillKey;
      readonly math: boolean;
      readonly inTitle: boolean;
      /** Set in a macro's definition or use, where the mode it is typeset in is only known when TeX expands it. */
      readonly anyMode?: true;
    }
  | {
      readonly kind: 'cell';
      readonly table: number;
      readonly row: number;
      readonly column: number;
      /** The whole cell, and the offset in it where the value goes (after spaces, comments and \cellcolor). */
      readonly raw: Arg;
      readonly valueAt: number;
    };

export interface LatexFill {
  readonly entry: FillEntry;
  readonly target: FillTarget;
}

/** A `\skeindrawing[settings]{id}`: the package finds its picture in the sidecar by the id and the settings as written. */
export interface LatexFigure {
  readonly entry: FigureEntry;
  readonly id: string;
  readonly settingsText: string;
}

/** A replacement in one file for the flat copy. */
export type Splice =
  | { readonly kind: 'text'; readonly span: Span; readonly text: string }
  | { readonly kind: 'fill'; readonly span: Span; readonly fill: number }
  | { readonly kind: 'figure'; readonly span: Span; readonly figure: number }
  /** `\usepackage{skeinproof}`: the flat copy loads what the package provides instead; `kept` is the rest of the list. */
  | { readonly kind: 'package'; readonly span: Span; readonly kept: string }
  | { readonly kind: 'include'; readonly span: Span; readonly file: SourceFile; readonly command: 'input' | 'include' }
  /** A use of an author's macro whose definition holds skeinproof markup: replaced by its expansion, itself spliced. */
  | { readonly kind: 'expansion'; readonly span: Span; readonly text: string; readonly splices: readonly Splice[] };

export interface LatexDocument {
  readonly main: SourceFile;
  /** Every file read, the manuscript first. */
  readonly files: readonly SourceFile[];
  readonly diagrams: readonly DiagramEntry[];
  readonly claims: readonly ClaimEntry[];
  readonly fills: readonly LatexFill[];
  /** The skein grids, whose cells are among the claims and fills: the degrees each prints. */
  readonly khovanovGrids: readonly KhovanovGridEntry[];
  readonly figures: readonly LatexFigure[];
  /** Whether the manuscript loads tikz itself (then neither the sidecar nor the flat copy loads it for the figures). */
  readonly tikzLoaded: boolean;
  /** What \skeinconvention declares. */
  readonly convention: Partial<Convention>;
  /** Problems with the markup itself, located in the file where they are. */
  readonly diagnostics: readonly Diagnostic[];
  /** Ids of skeincode environments refused (never closed, or bad notation or strands), with the place of the environment. */
  readonly refusedIds: ReadonlyMap<string, SourceLocation>;
  readonly splices: ReadonlyMap<SourceFile, readonly Splice[]>;
  /** A package or class file of the author's that loads skeinproof (the flat copy still loads it), with the place of the load. */
  readonly packageLoadedBy: SourceLocation | undefined;
}

/** Keys of \begin{skeincode}{…} besides the claim keys. */
const CODE_KEYS = ['id', 'notation', 'strands', 'part-signs', 'for'] as const;
const ID_PATTERN = /^[A-Za-z0-9][A-Za-z0-9_.:+-]*$/;
/** A fill-in macro (\skeinvalue or a shortcut), \skeinclaim or \skeindrawing in a text. */
const SKEIN_MACRO = new RegExp(`\\\\(skeinvalue|skeinclaim|skeindrawing|${Object.keys(FILL_SHORTCUTS).join('|')})(?![A-Za-z])`);
/** What a macro's body may hold that makes skeinproof read it at each use: its markup, or an \input of a file named by a parameter. */
const MARKUP_OR_INPUT = new RegExp(`${SKEIN_MACRO.source}|\\\\(input|include)(?![A-Za-z])`);
/** How deep expansions of macros inside macros go before skeinproof stops (TeX would loop on a macro that uses itself). */
const MAX_EXPANSION_DEPTH = 32;
/** How much text all expansions of one manuscript may make: macros that use others twice over grow exponentially. */
const MAX_EXPANDED_CHARACTERS = 4_000_000;
/**
 * Characters a diagram code may contain that plain LaTeX would not print as typed: TeX's specials, and the minus
 * sign U+2212 and Unicode spaces the notations read (JavaScript's \s), which 8-bit LaTeX has no glyph for. The
 * package typesets the last two as - and a space, and so does the flat copy.
 */
const SPECIAL_IN_CODE = /[\^_&#$~]|(\u2212)|([\s\v])/gu;

export function readLatexManuscript(mainPath: string, fs: LatexFileSystem): LatexDocument {
  return new ManuscriptReader(mainPath, fs).read();
}

class ManuscriptReader {
  private readonly root: string;
  private readonly files: SourceFile[] = [];
  private readonly diagrams: DiagramEntry[] = [];
  private readonly refusedIds = new Map<string, SourceLocation>();
  private readonly claims: ClaimEntry[] = [];
  private readonly fills: LatexFill[] = [];
  private readonly figures: LatexFigure[] = [];
  private tikzLoaded = false;
  private readonly diagnostics: Diagnostic[] = [];
  private readonly splices = new Map<SourceFile, Splice[]>();
  /** The author's macros whose definitions hold skeinproof markup, by name: read at each use. */
  private readonly macros = new Map<string, MacroDefinition>();
  /** The definitions recorded in `macros`: the markup in their bodies is read at the uses, not where it is written. */
  private readonly recorded = new WeakSet<DefinitionItem>();
  private expandedCharacters = 0;
  /** Where \documentclass is, in the manuscript itself: a whole document, not a fragment. */
  private documentClass: Span | undefined;
  private packageLoadedBy: SourceLocation | undefined;
  private convention: Partial<Convention> = {};
  /** Where the convention was declared: the file and the command (\skeinconvention or the package options). */
  private conventionAt: { readonly file: SourceFile; readonly command: string } | undefined;
  private tables = 0;
  private readonly khovanovGrids: KhovanovGridEntry[] = [];
  /** Set at \begin{document}: the preamble is over. */
  private inBody = false;
  /** Set at \usepackage{skeinproof}. */
  private packageLoaded = false;
  /** A \skeinconvention met before the package was loaded: an error only if the package is loaded after it. */
  private conventionBeforePackage: { readonly file: SourceFile; readonly span: Span } | undefined;

  constructor(
    private readonly mainPath: string,
    private readonly fs: LatexFileSystem,
  ) {
    this.root = dirname(this.real(resolve(mainPath)));
  }

  read(): LatexDocument {
    const absolute = resolve(this.mainPath);
    const text = this.fs.read(absolute);
    const main = new SourceFile(this.mainPath, absolute, typeof text === 'string' ? text : '');
    if (text === undefined) {
      this.error(main, { start: 0, end: 0 }, 'file-unreadable', `cannot read ${this.mainPath}: there is no such file, or it cannot be opened; check the path`);
    } else if (typeof text !== 'string') {
      this.error(main, { start: 0, end: 0 }, 'file-unreadable', `cannot read ${this.mainPath}: it is ${text.notRegular}, not a regular file; skeinproof reads manuscripts from regular files only`);
    } else {
      this.visit(main, [absolute]);
      this.warnIfPackageUnseen(main);
    }
    const fileRank = new Map(this.files.map((f, i) => [f.displayPath, i]));
    const rank = (d: Diagnostic): number => fileRank.get(d.location!.file) ?? 0;
    return {
      main,
      files: this.files,
      diagrams: this.diagrams,
      claims: this.claims,
      fills: this.fills,
      khovanovGrids: this.khovanovGrids,
      figures: this.figures,
      tikzLoaded: this.tikzLoaded,
      convention: this.convention,
      diagnostics: [...this.diagnostics].sort((a, b) => rank(a) - rank(b) || a.location!.start.offset! - b.location!.start.offset!),
      refusedIds: this.refusedIds,
      splices: this.splices,
      packageLoadedBy: this.packageLoadedBy,
    };
  }

  private real(path: string): string {
    return this.fs.realpath ? this.fs.realpath(path) : path;
  }

  private visit(file: SourceFile, open: readonly string[]): void {
    this.files.push(file);
    const splices: Splice[] = [];
    this.splices.set(file, splices);
    const masked = maskLatex(file.text);
    const packageFile = isPackageFile(file);
    const scan = scanLatexItems(masked, { macros: this.macros, atLetter: packageFile });
    for (const item of scan.items) this.item(file, masked, item, splices, open, 0);
    // A package or class file is read for the convention and the macros it defines; its TeX is the package's own
    // business (catcode tricks the scanner does not follow), so only the markup found in it is judged.
    if (!packageFile) for (const p of scan.problems) this.error(file, p.span, p.ruleId, p.message);
  }

  /**
   * A package or class of the author's, in the paper's folder (`\usepackage{mymacros}` and mymacros.sty beside
   * the paper), is read like an included file: it may load skeinproof with the convention as options, or define
   * macros that hold markup. Packages from TeX's own tree are not looked for; LaTeX loads a package once.
   */
  private localPackage(name: Arg, extension: '.sty' | '.cls', open: readonly string[]): void {
    if (name.text === 'skeinproof' || !/^[A-Za-z0-9_.-]+$/.test(name.text)) return;
    const absolute = resolve(dirname(resolve(this.mainPath)), `${name.text}${extension}`);
    if (open.includes(absolute) || this.files.some((f) => f.absolutePath === absolute)) return;
    const text = this.fs.read(absolute);
    if (typeof text !== 'string' || isOutside(this.root, this.real(absolute))) return;
    this.visit(new SourceFile(join(dirname(this.mainPath), `${name.text}${extension}`), absolute, text), [...open, absolute]);
  }

  /**
   * A whole document (with \documentclass) that holds markup but loads skeinproof nowhere the reader looked (the
   * package may come from a package of the author's outside the paper's folder): its convention was not read, so
   * say which one was assumed.
   */
  private warnIfPackageUnseen(main: SourceFile): void {
    if (this.packageLoaded || this.conventionAt || !this.documentClass) return;
    if (this.diagrams.length + this.claims.length + this.fills.length === 0) return;
    const assumed = CONVENTION_SETTINGS.map((c) => `${c.key}=${DEFAULT_CONVENTION[c.field]}`).join(', ');
    this.diagnostics.push({
      severity: 'warning',
      ruleId: 'latex-package-unseen',
      message: `no \\usepackage{skeinproof} or \\RequirePackage{skeinproof} was found in ${main.displayPath}, the files it \\input s, or the package and class files in its folder, so its convention could not be read and the default one was assumed (${assumed}): if the package is loaded with options elsewhere, declare the convention in the document with \\skeinconvention{…} after it, or give --convention`,
      location: main.location(this.documentClass.start, this.documentClass.end),
    });
  }

  private item(file: SourceFile, masked: string, item: ScanItem, splices: Splice[], open: readonly string[], depth: number): void {
    switch (item.kind) {
      case 'definition':
        return this.definition(file, masked, item, isPackageFile(file));
      case 'use':
        return this.use(file, masked, item, splices, open, depth, false);
      case 'code':
      case 'unclosed-code':
        return this.code(file, item, splices);
      case 'fill':
        return this.fill(file, item, splices);
      case 'claim':
        return this.claim(file, item, splices);
      case 'drawing':
        return this.drawing(file, item, splices);
      case 'convention':
        return this.conventionSettings(file, item, splices);
      case 'input':
        return this.input(file, item, splices, open);
      case 'package':
        if (item.names.some((n) => n.text === 'tikz')) this.tikzLoaded = true;
        if (item.names.some((n) => n.text === 'skeinproof')) this.usePackage(file, item, splices);
        for (const name of item.names) this.localPackage(name, '.sty', open);
        return;
      case 'class':
        if (file === this.files[0]) this.documentClass ??= item.span;
        return this.localPackage(item.name, '.cls', open);
      case 'table':
        return this.table(file, item, splices);
      case 'document':
        this.inBody = true;
        return;
    }
  }

  private code(file: SourceFile, item: Extract<ScanItem, { kind: 'code' | 'unclosed-code' }>, splices: Splice[]): void {
    const options = this.keyValues(file, item.options, [...CODE_KEYS, ...CLAIM_KEYS], '\\begin{skeincode}');
    const id = this.validId(file, options.get('id'), item.beginSpan, '\\begin{skeincode}{…}', 'id=trefoil');
    const notation = this.validNotation(file, options.get('notation'), item.beginSpan);
    const strands = this.validStrands(file, options.get('strands'), notation);
    if (item.kind === 'unclosed-code') {
      if (id !== undefined) this.refuse(id, file, item.beginSpan);
      return;
    }
    splices.push({ kind: 'text', span: item.beginSpan, text: '\\begin{flushleft}\\ttfamily' });
    for (const m of item.body.text.matchAll(SPECIAL_IN_CODE)) {
      if (m[2] !== undefined && /[\t\n\r\f ]/.test(m[2])) continue; // spaces LaTeX reads as spaces
      const at = item.body.start + m.index;
      const text = m[1] !== undefined ? '-' : m[2] !== undefined ? ' ' : `\\string${m[0]}`;
      splices.push({ kind: 'text', span: { start: at, end: at + m[0].length }, text });
    }
    splices.push({ kind: 'text', span: item.endSpan, text: '\\end{flushleft}' });
    if (id === undefined) return;
    if (notation === undefined || strands === null) {
      this.refuse(id, file, item.beginSpan);
      return;
    }
    const code = trim(item.body);
    const idValue = options.get('id')!;
    const partSigns = options.get('part-signs');
    this.diagrams.push({
      id,
      notation,
      code: code.text,
      ...(strands !== undefined ? { strands } : {}),
      ...(partSigns !== undefined ? { partSigns: { text: partSigns.text, locate: locatorFor(file, partSigns) } } : {}),
      ...(options.has('for') ? { parameter: { text: options.get('for')!.text, locate: locatorFor(file, options.get('for')!) } } : {}),
      locateCode: locatorFor(file, code),
      locateHeader: locatorFor(file, idValue),
    });
    for (const [key, value] of options) if (isClaimKey(key)) this.addClaim(file, id, key, value, undefined);
  }

  /** Records that the skeincode `id` at `at` was refused, so references to it get a note, not an unknown-id error. */
  private refuse(id: string, file: SourceFile, at: Span): void {
    if (!this.refusedIds.has(id)) this.refusedIds.set(id, file.location(at.start, at.end));
  }

  /** `expandedInTitle`: undefined where the fill-in is written; in an expansion, whether the use is in a section title. */
  private fill(file: TextOrigin, item: Extract<ScanItem, { kind: 'fill' }>, splices: Splice[], expandedInTitle?: boolean): void {
    const expanded = expandedInTitle !== undefined;
    if (this.readAtUses(file, item.definition, item.span, `\\${item.macro}`, [item.id, item.key], ' (the flat copy keeps it as written, so it needs the package)')) return;
    const id = this.validId(file, trim(item.id), item.span, `\\${item.macro}`, `\\${item.macro}{trefoil}`);
    let key: FillKey | undefined;
    if (typeof item.key === 'string') key = item.key as FillKey;
    else {
      const written = trim(item.key);
      if (isFillKey(written.text)) key = written.text;
      else {
        this.error(
          file,
          written,
          'latex-key-unknown',
          `${written.text === '' ? 'no key is given' : `\`${written.text}\` is not a value skeinproof can fill in`}: write one of ${FILL_KEYS.join(', ')}`,
        );
      }
    }
    if (id === undefined || key === undefined) return;
    splices.push({ kind: 'fill', span: item.span, fill: this.fills.length });
    const anyMode = expanded || item.definition !== undefined ? { anyMode: true as const } : {};
    this.fills.push({
      entry: { target: id, key, locate: locatorFor(file, item.span) },
      target: { kind: 'macro', id, key, math: item.math, inTitle: expanded ? expandedInTitle : item.inTitle, ...anyMode },
    });
  }

  private claim(file: TextOrigin, item: Extract<ScanItem, { kind: 'claim' }>, splices: Splice[]): void {
    splices.push({ kind: 'text', span: item.span, text: file.text.slice(item.value.start, item.value.end) });
    if (this.readAtUses(file, item.definition, item.span, '\\skeinclaim', [item.id, item.key, item.value], '')) return;
    const id = this.validId(file, trim(item.id), item.span, '\\skeinclaim', '\\skeinclaim{trefoil}{jones}{…}');
    const key = trim(item.key);
    if (!isClaimKey(key.text)) {
      const what = key.text === '' ? 'no key is given' : `\`${key.text}\` is not a claim skeinproof can check`;
      this.error(file, key, 'latex-key-unknown', `${what}: write one of ${CLAIM_KEYS.join(', ')}`);
      return;
    }
    if (id !== undefined) this.addClaim(file, id, key.text, item.value, undefined);
  }

  private drawing(file: TextOrigin, item: Extract<ScanItem, { kind: 'drawing' }>, splices: Splice[]): void {
    const written = item.settings ? [item.id, item.settings] : [item.id];
    if (this.readAtUses(file, item.definition, item.span, '\\skeindrawing', written, ' (the flat copy keeps it as written, so it needs the package)')) return;
    const id = this.validId(file, trim(item.id), item.span, '\\skeindrawing', '\\skeindrawing[size=5cm]{trefoil}');
    if (id === undefined) return;
    const settings: FigureSetting[] = [];
    for (const kv of item.settings ? readKeyValues(item.settings) : []) {
      const locateKey = locatorFor(file, kv.keySpan);
      if (kv.value === undefined) {
        this.error(file, kv.keySpan, 'latex-option-invalid', `\`${kv.key}\` in \\skeindrawing has no value: write ${kv.key}=…, e.g. size=5cm`);
        continue;
      }
      settings.push({ key: kv.key, value: kv.value.text, locateKey, locateValue: locatorFor(file, kv.value) });
    }
    splices.push({ kind: 'figure', span: item.span, figure: this.figures.length });
    this.figures.push({
      entry: { target: id, settings, markup: '\\skeindrawing', locate: locatorFor(file, item.span) },
      id,
      settingsText: item.settings?.text ?? '',
    });
  }

  private addClaim(file: TextOrigin, target: string, key: ClaimKey, value: Arg, context: string | undefined, cell = false): void {
    const text = withoutMathDelimiters(value);
    this.claims.push({ target, key, text: text.text, locate: locatorFor(file, text), ...(context !== undefined ? { context } : {}), ...(cell ? { cell } : {}) });
  }

  private conventionSettings(file: SourceFile, item: Extract<ScanItem, { kind: 'convention' }>, splices: Splice[]): void {
    splices.push({ kind: 'text', span: item.span, text: '' });
    if (!this.packageLoaded) this.conventionBeforePackage ??= { file, span: item.span };
    this.declareConvention(file, item.settings, item.span, '\\skeinconvention');
  }

  /** The convention from \skeinconvention{…} or \usepackage[…]{skeinproof}: the same settings, declared once in the preamble. */
  private declareConvention(file: SourceFile, settings: Arg, span: Span, command: string): void {
    if (this.inBody) {
      this.error(
        file,
        span,
        'latex-convention-misplaced',
        `${command} comes after \\begin{document}, where LaTeX no longer allows it: move it into the preamble`,
      );
      return;
    }
    if (this.conventionAt) {
      this.error(
        file,
        span,
        'latex-convention-twice',
        `the convention is already declared by ${this.conventionAt.command} in ${this.conventionAt.file.displayPath}: declare it once, with every setting in one place`,
      );
      return;
    }
    this.conventionAt = { file, command };
    const record: Record<string, string> = {};
    const spans: Record<string, SettingSpans> = {};
    for (const kv of readKeyValues(settings)) {
      if (kv.value === undefined) {
        this.error(file, kv.keySpan, 'convention-invalid', `convention setting \`${kv.key}\` has no value: write it as key=value, e.g. jones=q`);
        continue;
      }
      // A key written twice could keep only one of its values, as on the command line (--convention).
      if (Object.hasOwn(record, kv.key)) {
        if (record[kv.key]!.trim().toLowerCase() !== kv.value.text.trim().toLowerCase()) {
          this.error(
            file,
            kv.keySpan,
            'convention-invalid',
            `convention setting \`${kv.key}\` is given twice with different values (${record[kv.key]}, then ${kv.value.text}) in ${command}; keep one`,
          );
        }
        continue;
      }
      record[kv.key] = kv.value.text;
      spans[kv.key] = { key: kv.keySpan, value: kv.value };
    }
    const read = readConventionSettings(record, spans);
    if (read.ok) this.convention = read.settings;
    else for (const e of read.errors) this.error(file, e.span ?? span, e.ruleId, e.message);
  }

  private input(file: TextOrigin, item: Extract<ScanItem, { kind: 'input' }>, splices: Splice[], open: readonly string[]): void {
    if (this.readAtUses(file, item.definition, item.span, `\\${item.command}`, [item.path], '')) return;
    const written = trim(item.path).text;
    const command = `\\${item.command}{${written}}`;
    if (written === '' || written.endsWith('/')) {
      this.error(file, item.path, 'latex-argument-missing', `${command} names no file: write the file's name, e.g. \\${item.command}{sections/examples}`);
      return;
    }
    // TeX tries name.tex first and then the name as written, unless it already ends in .tex; \include reads name.tex.
    const names = written.endsWith('.tex') ? [written] : item.command === 'include' ? [`${written}.tex`] : [`${written}.tex`, written];
    // TeX looks for the file from the directory it runs in (the manuscript's), not from the including file's.
    const base = dirname(resolve(this.mainPath));
    for (const name of names) {
      const absolute = resolve(base, name);
      const real = this.real(absolute);
      if (isAbsolute(written) || isOutside(this.root, real)) {
        const link = !isAbsolute(written) && !isOutside(this.root, absolute) ? ` (${name} is a symbolic link to ${real})` : '';
        this.error(
          file,
          item.path,
          'latex-input-outside',
          `${command} reads a file outside the paper's directory ${this.root}${link}: skeinproof only follows files inside it; move the file there and name it by a relative path`,
        );
        return;
      }
      if (open.includes(absolute)) {
        this.error(file, item.path, 'latex-input-cycle', `${command} includes a file that is already being read (${name}): remove the circular \\${item.command}`);
        return;
      }
      const text = this.fs.read(absolute);
      if (text === undefined) continue;
      if (typeof text !== 'string') {
        this.error(
          file,
          item.path,
          'file-unreadable',
          `${command}: ${name} is ${text.notRegular}, not a regular file; skeinproof reads only regular files (TeX would wait on a pipe or read a device without end): replace it by the file it stands for`,
        );
        return;
      }
      const included = new SourceFile(join(dirname(this.mainPath), name), absolute, text);
      splices.push({ kind: 'include', span: item.span, file: included, command: item.command });
      this.visit(included, [...open, absolute]);
      return;
    }
    const tried = names.map((n) => basename(n)).join(' or ');
    this.error(file, item.path, 'latex-input-missing', `${command}: there is no file ${tried} in ${dirname(resolve(base, names[0]!))}; correct the name or add the file`);
  }

  private usePackage(file: SourceFile, item: Extract<ScanItem, { kind: 'package' }>, splices: Splice[]): void {
    if (isPackageFile(file)) this.packageLoadedBy ??= file.location(item.span.start, item.span.end);
    const others = item.list.text
      .split(',')
      .map((p) => p.trim())
      .filter((p) => p !== '' && p !== 'skeinproof');
    const kept = others.length === 0 ? '' : `${file.text.slice(item.span.start, item.list.start)}${others.join(',')}}`;
    splices.push({ kind: 'package', span: item.span, kept });
    if (this.conventionBeforePackage && !this.packageLoaded) {
      const early = this.conventionBeforePackage;
      this.error(
        early.file,
        early.span,
        'latex-convention-misplaced',
        '\\skeinconvention comes before \\usepackage{skeinproof}, where LaTeX does not know it yet: move it after the \\usepackage',
      );
    }
    this.packageLoaded = true;
    if (item.options && item.options.text.trim() !== '') {
      this.declareConvention(file, item.options, item.options, '\\usepackage[…]{skeinproof}');
    }
  }

  private table(file: SourceFile, item: Extract<ScanItem, { kind: 'table' }>, splices: Splice[]): void {
    const table = ++this.tables;
    // The package's environment ignores the spaces after its \begin and \end (\ignorespaces, \ignorespacesafterend),
    // and a removed wrapper must not leave an empty line, which TeX reads as a paragraph break.
    splices.push({ kind: 'text', span: withSpacesAfter(file.text, item.beginSpan), text: '' });
    splices.push({ kind: 'text', span: withSpacesAfter(file.text, item.endSpan), text: '' });
    if (item.environment === 'skeingrid') return this.grid(file, item, splices, table);
    const head = this.tableHead(file, item.options);
    const columns = splitTopLevel(item.columns, ',').map(trim);
    const idColumns = columns.flatMap((c, i) => (c.text === 'id' ? [i + 1] : []));
    let valid = idColumns.length === 1;
    if (idColumns.length !== 1) {
      this.error(
        file,
        item.columns,
        'latex-table-malformed',
        `a skein table needs exactly one \`id\` column (it has ${idColumns.length}): name the column holding the diagram ids \`id\``,
      );
    }
    columns.forEach((c, i) => {
      if (c.text === 'id' || c.text === '-' || isClaimKey(c.text) || isFillKey(c.text)) return;
      valid = false;
      if (c.text === '' && columns.length === 1) return; // no columns at all: the missing id column says it
      const what = c.text === '' ? `column ${i + 1} has no key` : `\`${c.text}\` is not a column skeinproof knows`;
      this.error(
        file,
        c,
        'latex-key-unknown',
        `${what}: write \`id\`, \`-\` for a free column, or one of ${[...new Set([...CLAIM_KEYS, ...FILL_KEYS])].join(', ')}`,
      );
    });
    if (!valid) return;
    const idColumn = idColumns[0]!;
    if (this.killed(file, item, table)) return;
    for (const row of splitTabular(item.body)) {
      if (row.number <= head || row.headOrFoot) continue;
      if (row.cells.every((c) => c.content.text === '')) continue;
      const place = `skein table ${table}, row ${row.number}`;
      // A row that is one \multicolumn is a label inside the table (`\multicolumn{3}{l}{Torus knots}`), like a spacer;
      // so is a longtable's \caption row.
      if (row.cells.length === 1 && /^\\(multicolumn|caption)(?![A-Za-z])/.test(row.cells[0]!.content.text)) continue;
      const input = row.cells.find((c) => /\\(input|include)(?![A-Za-z])/.test(c.content.text));
      if (input) {
        this.error(
          file,
          input.content,
          'latex-table-malformed',
          `${place}: skeinproof reads a skein table's rows where the table is written, not from \\input or \\include files: move these rows into the table (or \\input the whole skeintable)`,
        );
        continue;
      }
      const multi = row.cells.find((c) => c.content.text.includes('\\multicolumn'));
      if (multi) {
        this.error(file, multi.content, 'latex-table-malformed', `${place}: a skein table cannot hold \\multicolumn; give every column its own cell`);
        continue;
      }
      if (row.cells.length < columns.length) {
        const last = row.cells[row.cells.length - 1]!;
        this.error(
          file,
          last.raw,
          'latex-table-malformed',
          `${place} has ${row.cells.length} cell${row.cells.length === 1 ? '' : 's'} but the table names ${columns.length} columns: add the missing \`&\` separators (an empty cell is filled in)`,
        );
        continue;
      }
      const idCell = plainId(row.cells[idColumn - 1]!.content);
      if (idCell.text === '') {
        this.error(file, row.cells[idColumn - 1]!.raw, 'latex-id-missing', `${place} names no diagram: write its id in column ${idColumn}`);
        continue;
      }
      const id = this.validId(file, idCell, idCell, place, 'trefoil');
      if (id === undefined) continue;
      columns.forEach((column, i) => {
        const key = column.text;
        if (key === 'id' || key === '-') return;
        const cell = row.cells[i]!;
        const context = `${place} (${id}), column ${i + 1} (${key})`;
        if (cell.content.text === '') {
          if (!isFillKey(key)) {
            this.error(file, cell.raw, 'latex-cell-empty', `${context} is empty, but skeinproof does not typeset \`${key}\`: write the value to have it checked`);
            return;
          }
          this.fills.push({
            entry: { target: id, key, locate: locatorFor(file, cell.raw), context, cell: true },
            target: { kind: 'cell', table, row: row.number, column: i + 1, raw: cell.raw, valueAt: cell.content.start },
          });
          splices.push({ kind: 'fill', span: cell.raw, fill: this.fills.length - 1 });
          return;
        }
        // A fill-in or claim macro written in the cell is read where it stands, not as the cell's claimed value.
        if (this.holdsMarkup(cell.content.text)) return;
        if (!isClaimKey(key)) {
          this.error(file, cell.content, 'latex-cell-filled', `${context}: the \`${key}\` column is filled in by skeinproof; leave its cells empty`);
          return;
        }
        this.addClaim(file, id, key, cell.content, context, true);
      });
    }
  }

  /** A longtable row ending in \kill is measured and thrown away: an error, since its cells could be neither filled nor checked. */
  private killed(file: SourceFile, item: Extract<ScanItem, { kind: 'table' }>, table: number): boolean {
    const kill = killAt(item.body);
    if (!kill) return false;
    this.error(
      file,
      kill,
      'latex-table-malformed',
      `skein table ${table}: longtable measures a row that ends with \\kill and throws it away, so skeinproof can neither fill nor check it: set the column widths with p{…} columns instead`,
    );
    return true;
  }

  /**
   * A skein grid: one diagram's Khovanov homology by bidegree. Each empty cell is filled with the group there, each
   * written cell is a `khovanov-rank` or `khovanov-group` claim, and the grid as a whole claims that every bidegree
   * it does not print carries zero homology (checked when its layout is sound).
   */
  private grid(file: SourceFile, item: Extract<ScanItem, { kind: 'table' }>, splices: Splice[], table: number): void {
    const options = this.gridOptions(file, item.options);
    const idArg = plainId(trim(item.columns));
    const id = this.validId(file, idArg, item.beginSpan, `skein grid (table ${table})`, '\\begin{skeingrid}{trefoil}');
    if (id === undefined || options === undefined || this.killed(file, item, table)) return;
    const place = `skein table ${table} (grid of ${id})`;
    const rows = splitTabular(item.body);
    const header = rows.find((r) => r.number === options.head);
    if (!header) {
      this.error(file, item.beginSpan, 'latex-table-malformed', `${place}: the grid has no row ${options.head} to hold the column degrees; write them in the last header row (head=N says which)`);
      return;
    }
    // Rows after the header hold values, except spacers (every cell empty) and labels (one \multicolumn or \caption).
    const valueRows = rows.filter(
      (r) =>
        r.number > options.head &&
        !r.headOrFoot &&
        !r.cells.every((c) => c.content.text === '') &&
        !(r.cells.length === 1 && /^\\(multicolumn|caption)(?![A-Za-z])/.test(r.cells[0]!.content.text)),
    );
    const layout = gridLayout(header, valueRows, (c) => c.content.text, options.rows, place);
    for (const p of layout.problems) this.error(file, p.at.content.text === '' ? p.at.raw : p.at.content, 'latex-table-malformed', p.message);
    for (const { i, j, row, cell } of layout.cells) {
      const context = `${place}, row ${row}, column ${cell.column} (i = ${i}, j = ${j})`;
      const gridCell = { i, j, values: options.values };
      if (cell.content.text === '') {
        this.fills.push({
          entry: { target: id, key: 'khovanov', locate: locatorFor(file, cell.raw), context, cell: true, khovanovCell: gridCell },
          target: { kind: 'cell', table, row, column: cell.column, raw: cell.raw, valueAt: cell.content.start },
        });
        splices.push({ kind: 'fill', span: cell.raw, fill: this.fills.length - 1 });
        continue;
      }
      if (this.holdsMarkup(cell.content.text)) continue;
      const claim = gridCellClaim(gridCell, cell.content.text);
      const at = file.location(cell.content.start, cell.content.end);
      this.claims.push({ target: id, key: claim.key, text: claim.text, locate: () => at, context, cell: true, inGrid: true });
    }
    if (layout.problems.length > 0) return;
    this.khovanovGrids.push({
      target: id,
      range: { homological: layout.homological, quantum: layout.quantum, values: options.values },
      locate: locatorFor(file, item.beginSpan),
      context: place,
    });
  }

  /** `head=N`, `rows=quantum|homological`, `values=ranks|groups`; undefined after an error. */
  private gridOptions(file: SourceFile, list: Arg | undefined): { head: number; rows: GridRows; values: GridValues } | undefined {
    const result = { head: 1, rows: 'quantum' as GridRows, values: 'ranks' as GridValues };
    let valid = true;
    const choices: Record<string, readonly string[]> = { rows: ['quantum', 'homological'], values: ['ranks', 'groups'] };
    for (const kv of list ? readKeyValues(list) : []) {
      if (kv.key !== 'head' && !Object.hasOwn(choices, kv.key)) {
        this.error(file, kv.keySpan, 'latex-key-unknown', `\`${kv.key}\` is not an option of skeingrid: the options are head=N, rows=quantum|homological and values=ranks|groups`);
        valid = false;
        continue;
      }
      const value = kv.value?.text;
      if (kv.key === 'head' ? value === undefined || !/^[1-9]\d*$/.test(value) : !choices[kv.key]!.includes(value ?? '')) {
        const allowed = kv.key === 'head' ? 'a whole number of header rows, at least 1 (the last holds the column degrees)' : choices[kv.key]!.join(' or ');
        this.error(file, kv.value ?? kv.keySpan, 'latex-option-invalid', `${kv.key} must be ${allowed}`);
        valid = false;
        continue;
      }
      if (kv.key === 'head') result.head = Number(value);
      else if (kv.key === 'rows') result.rows = value as GridRows;
      else result.values = value as GridValues;
    }
    return valid ? result : undefined;
  }

  /** Whether a text holds skeinproof markup, written or through one of the author's recorded macros. */
  private holdsMarkup(text: string): boolean {
    return SKEIN_MACRO.test(text) || [...text.matchAll(/\\([A-Za-z@]+)/g)].some((m) => this.macros.has(m[1]!));
  }

  private tableHead(file: SourceFile, options: Arg | undefined): number {
    if (!options) return 1;
    let head = 1;
    for (const kv of readKeyValues(options)) {
      if (kv.key !== 'head') {
        this.error(file, kv.keySpan, 'latex-key-unknown', `\`${kv.key}\` is not an option of skeintable: the only option is head=N, the number of header rows`);
        continue;
      }
      if (kv.value === undefined || !/^\d+$/.test(kv.value.text)) {
        this.error(file, kv.value ?? kv.keySpan, 'latex-option-invalid', 'head must be a whole number of header rows, e.g. head=1');
        continue;
      }
      head = Number(kv.value.text);
    }
    return head;
  }

  /** Reads key=value options, reporting unknown and repeated keys. */
  private keyValues(file: SourceFile, list: Arg, known: readonly string[], where: string): Map<string, Arg> {
    const result = new Map<string, Arg>();
    for (const kv of readKeyValues(list)) {
      if (!known.includes(kv.key)) {
        this.error(file, kv.keySpan, 'latex-key-unknown', `\`${kv.key}\` is not a key of ${where}: the keys are ${known.join(', ')}`);
        continue;
      }
      if (result.has(kv.key)) {
        this.error(file, kv.keySpan, 'latex-key-repeated', `\`${kv.key}\` is given twice in ${where}: keep one`);
        continue;
      }
      if (kv.value === undefined || kv.value.text === '') {
        this.error(file, kv.keySpan, 'latex-option-invalid', `\`${kv.key}\` in ${where} has no value: write ${kv.key}=…`);
        continue;
      }
      result.set(kv.key, kv.value);
    }
    return result;
  }

  private validId(file: TextOrigin, id: Arg | undefined, at: Span, where: string, example: string): string | undefined {
    if (id === undefined || id.text === '') {
      this.error(file, at, 'latex-id-missing', `${where} names no diagram: give it an id, e.g. ${example}`);
      return undefined;
    }
    if (!ID_PATTERN.test(id.text)) {
      this.error(
        file,
        id,
        'latex-id-invalid',
        `\`${id.text}\` cannot be a diagram id: ids are letters, digits and the characters _ . : + - (starting with a letter or digit)`,
      );
      return undefined;
    }
    return id.text;
  }

  private validNotation(file: SourceFile, value: Arg | undefined, at: Span): Notation | undefined {
    if (value === undefined) {
      this.error(file, at, 'latex-notation-missing', `\\begin{skeincode}{…} does not say how the code is written: add notation=${NOTATIONS.join('|')}`);
      return undefined;
    }
    const notation = NOTATIONS.find((n) => n === value.text.toLowerCase());
    if (!notation) this.error(file, value, 'latex-notation-unknown', `\`${value.text}\` is not a notation: write one of ${NOTATIONS.join(', ')}`);
    return notation;
  }

  /** The strand count, undefined when absent, null when invalid (already reported). */
  private validStrands(file: SourceFile, value: Arg | undefined, notation: Notation | undefined): number | undefined | null {
    if (value === undefined) return undefined;
    if (notation !== undefined && notation !== 'braid') {
      this.error(file, value, 'latex-option-invalid', `strands applies to braid words only; a ${notation} code fixes its own strands: remove strands=${value.text}`);
      return null;
    }
    if (/^\d+$/.test(value.text) && Number(value.text) >= 1) return Number(value.text);
    this.error(file, value, 'latex-option-invalid', `strands must be a positive whole number (the braid's strand count), not \`${value.text}\``);
    return null;
  }

  /**
   * Whether markup in a macro's definition is left to the uses of the macro: always in a definition recorded for
   * expansion; and in any other whose parameters fill its arguments (delimited \def parameters, argument types
   * other than mandatory and one optional first), which skeinproof cannot expand: that is a warning, and the
   * markup is left alone.
   */
  private readAtUses(file: TextOrigin, definition: DefinitionItem | undefined, span: Span, macro: string, args: readonly (Arg | string)[], flat: string): boolean {
    if (definition === undefined) return false;
    if (this.recorded.has(definition)) return true;
    if (!args.some((a) => typeof a !== 'string' && a.text.includes('#'))) return false;
    this.diagnostics.push({
      severity: 'warning',
      ruleId: 'latex-macro-parameter',
      message: `this ${macro} takes its arguments from the parameters of \\${definition.name}, which skeinproof cannot expand (it expands parameters #1…#9 read one after another, and an optional first one), so it neither checks nor fills it at the uses of \\${definition.name}${flat}: define \\${definition.name} with \\newcommand, or write the markup itself where the values appear`,
      location: file.location(span.start, span.end),
    });
    return true;
  }

  /** A definition whose body holds skeinproof markup (or a use of a macro that does) is recorded, to be read at each use. */
  private definition(file: TextOrigin, masked: string, item: DefinitionItem, atLetter: boolean): void {
    const body = item.body.text;
    const holds = MARKUP_OR_INPUT.test(body) || this.holdsMarkup(body);
    if (item.params === 0 || !item.expandable || !holds) {
      this.macros.delete(item.name); // a redefinition without markup
      return;
    }
    const two = (a: Arg) => ({ raw: file.text.slice(a.start, a.end), masked: masked.slice(a.start, a.end) });
    this.recorded.add(item);
    this.macros.set(item.name, {
      params: item.params,
      optional: item.optionalDefault !== undefined,
      body: two(item.body),
      optionalDefault: item.optionalDefault && two(item.optionalDefault),
      atLetter,
    });
  }

  /** A use of a recorded macro: its expansion is read like the text around it (fill-ins, claims, \input, nested uses). */
  private use(file: TextOrigin, masked: string, item: Extract<ScanItem, { kind: 'use' }>, splices: Splice[], open: readonly string[], depth: number, inTitle: boolean): void {
    const title = inTitle || item.inTitle;
    const macro = this.macros.get(item.name)!;
    const args = item.args.filter((a) => a !== undefined);
    if (this.readAtUses(file, item.definition, item.span, `\\${item.name}`, args, '')) return;
    if (depth >= MAX_EXPANSION_DEPTH || this.expandedCharacters > MAX_EXPANDED_CHARACTERS) {
      const why = depth >= MAX_EXPANSION_DEPTH ? `goes ${MAX_EXPANSION_DEPTH} macros deep (does a macro use itself?)` : `has made over ${MAX_EXPANDED_CHARACTERS} characters of expansions`;
      this.error(file, item.span, 'latex-macro-loop', `expanding \\${item.name} here ${why}, so skeinproof stops: a macro that TeX could never finish expanding holds no value to check; write the markup itself here`);
      return;
    }
    const expansion = expandUse(macro, file, masked, item.span, item.args);
    this.expandedCharacters += expansion.text.length;
    const inner: Splice[] = [];
    const scan = scanLatexItems(expansion.masked, { macros: this.macros, atLetter: macro.atLetter });
    for (const found of scan.items) this.expandedItem(expansion, found, inner, open, depth + 1, title);
    for (const p of scan.problems) this.error(expansion, p.span, p.ruleId, p.message);
    splices.push({ kind: 'expansion', span: item.span, text: expansion.text, splices: inner });
  }

  /** What an expansion may hold: fill-ins, claims, figures, inputs and further uses (diagrams, tables and conventions belong in the document). */
  private expandedItem(expansion: Expansion, item: ScanItem, splices: Splice[], open: readonly string[], depth: number, inTitle: boolean): void {
    switch (item.kind) {
      case 'fill':
        return this.fill(expansion, item, splices, inTitle || item.inTitle);
      case 'claim':
        return this.claim(expansion, item, splices);
      case 'drawing':
        return this.drawing(expansion, item, splices);
      case 'input':
        return this.input(expansion, item, splices, open);
      case 'use':
        return this.use(expansion, expansion.masked, item, splices, open, depth, inTitle);
    }
  }

  private error(file: TextOrigin, span: Span, ruleId: string, message: string): void {
    this.diagnostics.push({ severity: 'error', ruleId, message, location: file.location(span.start, span.end) });
  }
}

function isPackageFile(file: SourceFile): boolean {
  return /\.(sty|cls)$/i.test(file.absolutePath);
}

function isOutside(root: string, path: string): boolean {
  const inside = relative(root, path);
  return inside === '..' || inside.startsWith(`..${sep}`) || isAbsolute(inside);
}

/** The span and the spaces after it up to and including the end of its line, as TeX's \ignorespaces skips them. */
function withSpacesAfter(text: string, span: Span): Span {
  const m = /^[ \t]*(\r?\n)?/.exec(text.slice(span.end, span.end + 200))!;
  return { start: span.start, end: span.end + m[0].length };
}

/** A locator for spans of `arg`'s text, in its file. */
function locatorFor(file: TextOrigin, arg: Span): Locator {
  return (span?: TextSpan) => (span ? file.location(arg.start + span.start, arg.start + span.end) : file.location(arg.start, arg.end));
}

/**
 * An id cell may set the id in a font (`\texttt{trefoil}`); the id is what the command holds. Text mode
 * needs `\_` for an underscore (`knot\_3.1` prints knot_3.1), so it stands for `_` (the span stays as written).
 */
function plainId(cell: Arg): Arg {
  const m = /^\\(texttt|textbf|textit|textsf|textrm|textsc|emph)\s*\{([^{}]*)\}$/.exec(cell.text);
  const id = m ? trim(slice(cell, cell.text.indexOf('{') + 1, cell.text.length - 1)) : cell;
  return { ...id, text: id.text.replace(/\\_/g, '_') };
}

/** `$…$` or `\(…\)` around a claimed value are typesetting, not part of the value. */
function withoutMathDelimiters(value: Arg): Arg {
  const v = trim(value);
  if (/^\$[^$]/.test(v.text) && /[^$]\$$/.test(v.text)) return trim(slice(v, 1, v.text.length - 1));
  if (v.text.startsWith('\\(') && v.text.endsWith('\\)')) return trim(slice(v, 2, v.text.length - 2));
  return v;
}
