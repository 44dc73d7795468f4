/**
 * Finds skeinproof's carriers in a parsed Markdown tree (see ./syntax.ts):
 * diagrams, claims, fill-ins and tables, each with locators into the file, and
 * the edits a build makes to the text. Syntax problems become diagnostics; no
 * value is computed here.
 */
import type { Code, Html, InlineCode, Nodes, PhrasingContent, Root, Table, TableCell, Text, Yaml } from 'mdast';
import type { ContainerDirective, LeafDirective, TextDirective } from 'mdast-util-directive';
import { visit, SKIP } from 'unist-util-visit';
import type { ClaimKey, FillKey } from '../../src/core/claims/api.ts';
import type { Diagnostic, SourceLocation, TextSpan } from '../../src/core/diagnostics/diagnostic.ts';
import type { Notation } from '../../src/core/diagram/model.ts';
import type { ClaimEntry, DiagramEntry, FigureEntry, FillEntry, KhovanovGridEntry, Locator } from '../../src/core/manuscript/api.ts';
import type { FigureSetting } from '../../src/core/manuscript/figure-settings.ts';
import { gridLayout, type GridRows } from '../../src/core/manuscript/grid-layout.ts';
import { gridCellClaim, type GridValues } from '../../src/core/claims/khovanov-grid.ts';
import { alignValue, mapSpan, SourceText, type OffsetMap } from './source-text.ts';
import {
  CLAIM_KEYS,
  COLUMNS_ATTRIBUTE,
  DIAGRAM_FENCE_LANGUAGE,
  DIAGRAM_HEADERS,
  FIGURE_DIRECTIVE,
  FREE_TEXT_COLUMN,
  FREE_TEXT_HEADERS,
  GRID_DIRECTIVE,
  GRID_SETTINGS,
  columnMeaning,
  FILL_KEYS,
  ID_RULE,
  NOTATION_NAMES,
  REMARKS_COLUMN,
  ROW_DIAGRAM_COLUMN,
  ROW_NOTATION_COLUMN,
  TABLE_DIRECTIVE,
  TARGET_ATTRIBUTE,
  columnName,
  isClaimKey,
  isFillKey,
  isNotation,
  isUsableId,
  splitInfoSettings,
} from './syntax.ts';
import { readFrontMatter, type ManuscriptSettings } from './front-matter.ts';
import type { FillPlace } from './typeset-markdown.ts';

/** A change the build makes to the text; `fill` refers to the fill-in whose typeset value goes there. */
export interface TextEdit {
  readonly start: number;
  readonly end: number;
  readonly replacement: { readonly text: string } | { readonly fill: number; readonly place: FillPlace } | { readonly figure: number; readonly blankAfter: boolean };
}

/** What the tree transformer does to a node (the same changes as the text edits, on the tree). */
export type NodeAction =
  | { readonly kind: 'fill'; readonly fill: number }
  | { readonly kind: 'figure'; readonly figure: number }
  | { readonly kind: 'unwrap' };

export interface ExtractedManuscript {
  readonly settings: ManuscriptSettings;
  readonly diagrams: readonly DiagramEntry[];
  readonly claims: readonly ClaimEntry[];
  readonly fills: readonly FillEntry[];
  readonly figures: readonly FigureEntry[];
  /** The `:::khovanov-grid` tables, whose cells are among the claims and fills: the degrees each prints. */
  readonly khovanovGrids: readonly KhovanovGridEntry[];
  readonly edits: readonly TextEdit[];
  readonly actions: ReadonlyMap<Nodes, NodeAction>;
  /** Problems in skeinproof's own markup (bad settings, unknown columns, …). */
  readonly problems: readonly Diagnostic[];
  /** Ids of diagrams whose block or row was refused before its code was read (e.g. an unknown notation), with the place of the refusal. */
  readonly refusedIds: ReadonlyMap<string, SourceLocation>;
}

export interface ExtractOptions {
  /** Overrides the front matter's default notation. */
  readonly notation?: Notation;
}

/**
 * Whether a stretch of Markdown can hold anything the extraction reads, so that a caller that only
 * checks may leave the rest unparsed (plugins/remark/sections.ts). The visitor below reacts to the
 * front matter (in a text's first section), fenced code (``` or ~~~), directives and text that looks
 * like one (all with a colon) and tables (GFM needs a pipe): a stretch with none of `:`, `|`, `` ` ``
 * and `~` gives it nothing.
 */
export function mayHoldCarriers(markdown: string): boolean {
  return /[:|`~]/.test(markdown);
}

export function extractManuscript(tree: Root, source: SourceText, options: ExtractOptions = {}): ExtractedManuscript {
  return new Extractor(tree, source, options).run();
}

class Extractor {
  private readonly diagrams: DiagramEntry[] = [];
  private readonly claims: ClaimEntry[] = [];
  private readonly fills: FillEntry[] = [];
  private readonly figures: FigureEntry[] = [];
  private readonly khovanovGrids: KhovanovGridEntry[] = [];
  private readonly edits: TextEdit[] = [];
  private readonly actions = new Map<Nodes, NodeAction>();
  private readonly problems: Diagnostic[] = [];
  private readonly refused = new Map<string, SourceLocation>();
  private settings: ManuscriptSettings = { convention: {} };
  /** Tables inside `:::invariants` or `:::khovanov-grid`, read as claims; any other table is prose. */
  private readonly fencedTables = new Set<Table>();
  /** The extent of the table cell visited last, to tell a fill-in written in a cell. */
  private cell: [number, number] = [-1, -1];
  private readonly text: string;

  constructor(
    private readonly tree: Root,
    private readonly source: SourceText,
    private readonly options: ExtractOptions,
  ) {
    this.text = source.text;
  }

  run(): ExtractedManuscript {
    const yaml = this.tree.children.find((n): n is Yaml => n.type === 'yaml');
    if (yaml) {
      const read = readFrontMatter(yaml, this.source);
      this.settings = read.settings;
      this.problems.push(...read.problems);
    }
    if (this.options.notation) this.settings = { ...this.settings, notation: this.options.notation };
    visit(this.tree, (node) => {
      if (node.type === 'tableCell') this.cell = offsets(node); // visited before the directives in it
      if (node.type === 'code' && node.lang === DIAGRAM_FENCE_LANGUAGE) this.diagramBlock(node);
      else if (node.type === 'code' && node.lang?.startsWith(DIAGRAM_FENCE_LANGUAGE)) this.misspelledFence(node);
      else if (node.type === 'leafDirective' && node.name === FIGURE_DIRECTIVE) this.figureDirective(node);
      else if ((node.type === 'textDirective' || node.type === 'containerDirective') && node.name === FIGURE_DIRECTIVE) this.misplacedFigure(node);
      else if (node.type === 'textDirective') return this.textDirective(node);
      else if (node.type === 'containerDirective' && (node.name === TABLE_DIRECTIVE || node.name === GRID_DIRECTIVE)) {
        for (const child of node.children) if (child.type === 'table') this.fencedTables.add(child);
        if (node.name === TABLE_DIRECTIVE) this.tableDirective(node);
        else this.gridDirective(node);
      } else if (node.type === 'table' && !this.fencedTables.has(node)) this.unfencedTable(node);
      else if ((node.type === 'leafDirective' || node.type === 'containerDirective') && (isClaimKey(node.name) || isFillKey(node.name))) this.misplacedDirective(node);
      // Markdown inside a raw HTML block (`<div>` up to the next blank line) is not parsed, so nor are claims there.
      else if (node.type === 'text' || node.type === 'html') this.strayMarkup(node);
      return undefined;
    });
    return {
      settings: this.settings,
      diagrams: this.diagrams,
      claims: this.claims,
      fills: this.fills,
      figures: this.figures,
      khovanovGrids: this.khovanovGrids,
      edits: [...this.edits].sort((a, b) => a.start - b.start || a.end - b.end),
      actions: this.actions,
      problems: this.problems,
      refusedIds: this.refused,
    };
  }

  /** Records that the diagram `id` (when the author wrote one) was refused at `at`, so references to it are not also unknown ids. */
  private refuse(id: string | undefined, at: number | SourceLocation): void {
    if (id && !this.refused.has(id)) this.refused.set(id, typeof at === 'number' ? this.source.location(at) : at);
  }

  private inCell(offset: number): boolean {
    return this.cell[0] <= offset && offset < this.cell[1];
  }

  /**
   * A GFM table outside `:::invariants` is prose and nothing in it is checked. When it looks like a table of
   * claims (a diagram column and a column headed by a claim key), the author most likely forgot the fence.
   */
  private unfencedTable(table: Table): void {
    const header = table.children[0];
    if (!header) return;
    const meanings = this.headers(header).map((h) => columnMeaning(h.written));
    const keys = meanings.flatMap((m) => (m?.kind === 'key' ? [m.key] : []));
    if (!meanings.some((m) => m?.kind === 'diagram') || keys.length === 0) return;
    const [start] = offsets(table);
    this.problems.push({
      severity: 'warning',
      ruleId: 'table-unfenced',
      message: `this table has a diagram column and claim columns (${keys.map((k) => `\`${k}\``).join(', ')}), but it is not inside \`:::${TABLE_DIRECTIVE}\`, so none of its values is checked`,
      location: this.source.location(start, lineEnd(this.text, start)),
      hints: [`Put a line \`:::${TABLE_DIRECTIVE}\` before the table and a line \`:::\` after it (blank lines around the table), or rename the diagram column if the table is not about the manuscript's diagrams.`],
    });
  }

  private error(ruleId: string, message: string, start: number, end: number, hints?: string[]): void {
    this.problems.push({ severity: 'error', ruleId, message, location: this.source.location(start, end), ...(hints ? { hints } : {}) });
  }

  private locator(map: OffsetMap, wholeStart: number, wholeEnd: number): Locator {
    return (span?: TextSpan) => {
      if (!span) return this.source.location(wholeStart, wholeEnd);
      const mapped = mapSpan(map, span);
      return this.source.location(mapped.start, mapped.end);
    };
  }

  private fixedLocator(start: number, end: number): Locator {
    return (span?: TextSpan) =>
      span ? this.source.location(start + span.start, start + Math.max(span.end, span.start)) : this.source.location(start, end);
  }

  // ```skein id=… notation=… strands=… part-signs=… crossing-number=…
  private diagramBlock(node: Code): void {
    const [start, end] = offsets(node);
    const firstLineEnd = lineEnd(this.text, start);
    const meta = node.meta ?? '';
    const metaStart = meta ? this.text.indexOf(meta, start) : firstLineEnd;
    const { settings, problems } = splitInfoSettings(meta);
    for (const p of problems) this.error('markup-invalid', `diagram block: ${p.message}`, metaStart + p.start, metaStart + p.end);

    let id: string | undefined;
    let idAt = start;
    let notation: Notation | undefined = this.settings.notation;
    let strands: number | undefined;
    let partSigns: { text: string; start: number; end: number } | undefined;
    let parameter: { text: string; at: number; end: number } | undefined;
    const seen = new Set<string>();
    let refusedAt: number | undefined;
    const headerClaims: { key: ClaimKey; value: string; at: number; end: number }[] = [];
    for (const s of settings) {
      const at = metaStart + s.keyStart;
      if (seen.has(s.key)) {
        this.error('markup-invalid', `diagram block: setting \`${s.key}\` is given twice; keep one`, at, metaStart + s.valueEnd);
        continue;
      }
      seen.add(s.key);
      if (s.key === 'id') {
        id = s.value;
        idAt = metaStart + s.valueStart;
        if (!isUsableId(id)) {
          this.error('markup-invalid', `diagram id \`${id}\` is not usable: ${ID_RULE}`, idAt, metaStart + s.valueEnd);
          this.refuse(id, idAt); // a reference to it gets a note pointing here, not an error of its own
          id = undefined;
        }
      } else if (s.key === 'notation') {
        if (isNotation(s.value)) notation = s.value;
        else {
          this.error('markup-invalid', `diagram block: unknown notation \`${s.value}\`: write one of ${NOTATION_NAMES.join(', ')}`, metaStart + s.valueStart, metaStart + s.valueEnd);
          refusedAt ??= metaStart + s.valueStart; // the other settings are still checked
        }
      } else if (s.key === 'strands') {
        const n = Number(s.value);
        if (!Number.isInteger(n) || n < 1) {
          this.error('markup-invalid', `diagram block: strands=${s.value} is not a positive whole number of strands`, metaStart + s.valueStart, metaStart + s.valueEnd);
        } else strands = n;
      } else if (s.key === 'part-signs') {
        partSigns = { text: s.value, start: metaStart + s.valueStart, end: metaStart + s.valueEnd };
      } else if (s.key === 'for') {
        parameter = { text: s.value, at: metaStart + s.valueStart, end: metaStart + s.valueEnd };
      } else if (isClaimKey(s.key)) {
        headerClaims.push({ key: s.key, value: s.value, at: metaStart + s.valueStart, end: metaStart + s.valueEnd });
      } else {
        this.error(
          'markup-invalid',
          `diagram block: unknown setting \`${s.key}\`: the settings are id, notation, strands, part-signs, for and the claims ${CLAIM_KEYS.join(', ')}`,
          at,
          at + s.key.length,
        );
      }
    }
    if (id === undefined) {
      if (!seen.has('id')) this.error('markup-invalid', 'diagram block has no id: add id=NAME after `skein` so the text can refer to it', start, firstLineEnd);
      return;
    }
    if (refusedAt !== undefined) {
      this.refuse(id, refusedAt);
      return;
    }
    if (notation === undefined) {
      // A default the front matter got wrong is one error there, not one more per diagram.
      if (!this.settings.notationRefused) {
        this.error('markup-invalid', `diagram \`${id}\` names no notation: add notation=pd|braid|gauss|dt, or set a default notation in the front matter`, start, firstLineEnd);
      }
      this.refuse(id, this.settings.notationRefused ?? start);
      return;
    }
    if (strands !== undefined && notation !== 'braid') {
      const at = settings.find((x) => x.key === 'strands')!;
      this.error('markup-invalid', `diagram \`${id}\`: strands=${strands} applies to braid words only; a ${notation} code counts its own strands, so remove it`, metaStart + at.keyStart, metaStart + at.valueEnd);
      strands = undefined;
    }
    const codeStart = firstLineEnd < end ? nextLineStart(this.text, firstLineEnd) : end;
    const codeEnd = Math.max(codeStart, closingFenceStart(this.text, codeStart, end));
    if (codeEnd === end && this.text.slice(end).trim() === '' && end > codeStart) {
      // CommonMark lets a fence run to the end of the document; here it is nearly always a forgotten closing fence.
      const fence = /^[ \t]*(`{3,}|~{3,})/.exec(this.text.slice(this.text.lastIndexOf('\n', start) + 1, firstLineEnd))?.[1] ?? '```';
      this.error(
        'markup-invalid',
        `diagram block \`${id}\` is never closed, so the rest of the document (line ${this.source.point(codeStart).line} on) is read as its code and nothing there is checked: add a line ${fence} after the code`,
        start,
        firstLineEnd,
      );
      this.refuse(id, start);
      return;
    }
    const map = alignValue(this.text, codeStart, codeEnd, node.value);
    const headerAt = idAt;
    this.diagrams.push({
      id,
      notation,
      code: node.value,
      ...(strands !== undefined ? { strands } : {}),
      ...(partSigns !== undefined ? { partSigns: { text: partSigns.text, locate: this.fixedLocator(partSigns.start, partSigns.end) } } : {}),
      ...(parameter ? { parameter: { text: parameter.text, locate: this.fixedLocator(parameter.at, parameter.end) } } : {}),
      locateCode: this.locator(map, codeStart, codeEnd),
      locateHeader: () => this.source.location(headerAt, headerAt + id!.length),
    });
    for (const c of headerClaims) {
      this.claims.push({ target: id, key: c.key, text: c.value, locate: this.fixedLocator(c.at, c.end), context: `the header of diagram ${id}` });
    }
  }

  // ::drawing[title]{of=K size=5cm arrows=yes …}
  private figureDirective(node: LeafDirective): void {
    const [start, end] = offsets(node);
    const nameEnd = start + 2 + node.name.length;
    const labelEnd = this.text[nameEnd] === '[' ? matchingBracket(this.text, nameEnd, end) + 1 : nameEnd;
    const title = labelEnd > nameEnd ? this.text.slice(nameEnd + 1, labelEnd - 1).replace(/\s+/g, ' ').trim() : '';
    const hasAttributes = this.text[labelEnd] === '{' && this.text[end - 1] === '}';
    const attributesStart = labelEnd + 1;
    const { settings, problems } = hasAttributes ? splitInfoSettings(this.text.slice(attributesStart, end - 1)) : { settings: [], problems: [] };
    for (const p of problems) this.error('markup-invalid', `\`::${FIGURE_DIRECTIVE}\`: ${p.message}`, attributesStart + p.start, attributesStart + p.end);
    const target = settings.find((s) => s.key === TARGET_ATTRIBUTE);
    if (!target || target.value.trim() === '') {
      this.error('markup-invalid', `\`::${FIGURE_DIRECTIVE}\` names no diagram, so nothing would be drawn: write ::${FIGURE_DIRECTIVE}{${TARGET_ATTRIBUTE}=ID} with the id of a \`${DIAGRAM_FENCE_LANGUAGE}\` block`, start, end);
      return;
    }
    const figureSettings: FigureSetting[] = settings
      .filter((s) => s !== target)
      .map((s) => ({
        key: s.key,
        value: s.value,
        locateKey: this.fixedLocator(attributesStart + s.keyStart, attributesStart + s.keyStart + s.key.length),
        locateValue: this.fixedLocator(attributesStart + s.valueStart, attributesStart + s.valueEnd),
      }));
    const figure = this.figures.length;
    this.figures.push({
      target: target.value,
      settings: figureSettings,
      markup: `::${FIGURE_DIRECTIVE}`,
      ...(title !== '' ? { title } : {}),
      locate: this.fixedLocator(start, end),
    });
    // The figure is an HTML block in the built text, which runs on to the next blank line: keep the next line out of it.
    const rest = this.text.slice(end, end + 2000);
    const blankAfter = !/^[ \t]*(?:\r\n|\r(?!\n)|\n|$)(?:[ \t]*(?:\r\n|\r(?!\n)|\n|$)|$)/.test(rest);
    this.edits.push({ start, end, replacement: { figure, blankAfter } });
    this.actions.set(node, { kind: 'figure', figure });
  }

  /** `:drawing{…}` in a line of text, or `:::drawing`: a figure is a block of its own. */
  private misplacedFigure(node: TextDirective | ContainerDirective): void {
    const [start, end] = offsets(node);
    const colons = node.type === 'textDirective' ? ':' : ':::';
    this.error(
      'markup-invalid',
      `\`${colons}${FIGURE_DIRECTIVE}\` is not read as a figure: a figure is a leaf directive on a line of its own, ::${FIGURE_DIRECTIVE}[TITLE]{${TARGET_ATTRIBUTE}=ID}`,
      start,
      Math.min(end, start + colons.length + node.name.length),
    );
  }

  /** ```skein,id=k or ```skeinid=k: meant as a diagram, but the info string's first word is not `skein`. */
  private misspelledFence(node: Code): void {
    const [start] = offsets(node);
    const at = this.text.indexOf(node.lang!, start);
    this.error(
      'markup-invalid',
      `\`${node.lang}\` is not read as a diagram: the info string must start with the word \`${DIAGRAM_FENCE_LANGUAGE}\` and a space, e.g. \`\`\`${DIAGRAM_FENCE_LANGUAGE} id=trefoil notation=braid`,
      at,
      at + node.lang!.length,
    );
  }

  // :jones{of=K} (fill-in) and :jones[$…$]{of=K} (claim)
  private textDirective(node: TextDirective): typeof SKIP | undefined {
    const target = node.attributes?.[TARGET_ATTRIBUTE];
    const [start, end] = offsets(node);
    const name = node.name;
    if (target === undefined || target === null) {
      if (!isClaimKey(name) && !isFillKey(name)) return undefined;
      this.missingTarget(node, start, end);
      return SKIP;
    }
    if (target.trim() === '') {
      this.error('markup-invalid', `\`:${name}\` has an empty \`${TARGET_ATTRIBUTE}\`: write the id of a diagram, e.g. {of=trefoil}`, start, end);
      return SKIP;
    }
    const extra = Object.keys(node.attributes ?? {}).filter((k) => k !== TARGET_ATTRIBUTE);
    if (extra.length > 0 && (isClaimKey(name) || isFillKey(name))) {
      const braces = this.text.lastIndexOf('{', end - 1);
      this.error(
        'markup-invalid',
        `\`:${name}\`: unknown attribute${extra.length > 1 ? 's' : ''} ${extra.map((k) => `\`${k}\``).join(', ')}: a claim or fill-in takes only ${TARGET_ATTRIBUTE}=ID; remove the rest`,
        ...this.attributeAt(extra[0]!, braces >= start ? braces : start, end),
      );
    }
    const hasLabel = this.text[start + 1 + name.length] === '[';
    if (!hasLabel) {
      if (!isFillKey(name)) {
        const why = isClaimKey(name)
          ? `\`${name}\` is checked but not filled in: write your value as the label, e.g. :${name}[VALUE]{of=${target}}`
          : `unknown value \`${name}\`: the values that can be filled in are ${FILL_KEYS.join(', ')}`;
        this.error('markup-invalid', `\`:${name}{of=${target}}\`: ${why}`, start, end);
        return SKIP;
      }
      this.addFill(target, name, this.fixedLocator(start, end), undefined, { start, end, replacement: { fill: this.fills.length, place: this.inCell(start) ? 'in-cell' : 'text' } }, node);
      return SKIP;
    }
    if (!isClaimKey(name)) {
      const why =
        name === 'statement'
          ? 'a statement is only filled in: drop the label, :statement{of=…}'
          : `unknown invariant \`${name}\`: the invariants a claim can be about are ${CLAIM_KEYS.join(', ')}`;
      this.error('markup-invalid', `\`:${name}[…]\`: ${why}`, start, end);
      return SKIP;
    }
    const labelStart = start + 1 + name.length + 1;
    const labelEnd = matchingBracket(this.text, labelStart - 1, end);
    const claim = this.readClaimText(node.children, labelStart, labelEnd);
    this.claims.push({ target, key: name, text: claim.text, locate: claim.locate });
    this.edits.push({ start, end: labelStart, replacement: { text: '' } }, { start: labelEnd, end, replacement: { text: '' } });
    this.actions.set(node, { kind: 'unwrap' });
    return SKIP;
  }

  /**
   * A directive named after a claim or fill key but without `of` (none at all, `{id=t3}`, `{#t3}`, a misspelt
   * `{fo=t3}`, or `{of=…}` split off by a space or line break) would go unchecked: an error saying how to write it.
   */
  private missingTarget(node: TextDirective, start: number, end: number): void {
    const name = node.name;
    const attributes = Object.entries(node.attributes ?? {}).filter((entry): entry is [string, string] => typeof entry[1] === 'string');
    const hasLabel = this.text[start + 1 + name.length] === '[';
    const label = hasLabel ? this.text.slice(start + 2 + name.length, matchingBracket(this.text, start + 1 + name.length, end)) : '';
    const shownLabel = label.length <= 30 ? label : '…';
    const id = attributes.find(([k]) => k !== 'class')?.[1] || 'ID';
    const written = hasLabel ? `:${name}[${shownLabel}]{${TARGET_ATTRIBUTE}=${id}}` : `:${name}{${TARGET_ATTRIBUTE}=${id}}`;
    const usage = hasLabel ? `a claim names its diagram in \`${TARGET_ATTRIBUTE}\`` : `a fill-in names its diagram in \`${TARGET_ATTRIBUTE}\` (a claim also has your value as its label)`;
    const after = /^([ \t]*(?:\r?\n|\r)?[ \t]*)\{/.exec(this.text.slice(end, end + 200));
    let problem: string;
    let at: readonly [number, number] = [start, end];
    if (attributes.length > 0) {
      const keys = attributes.map(([k]) => (k === 'id' && this.text.slice(start, end).includes('#') ? '#' : k));
      problem = `has no \`${TARGET_ATTRIBUTE}\` attribute (it has ${keys.map((k) => `\`${k}\``).join(', ')})`;
      const braces = this.text.lastIndexOf('{', end - 1);
      at = this.attributeAt(attributes[0]![0], braces >= start ? braces : start, end);
    } else if (after && after[1] !== '') {
      problem = after[1]!.includes('\n') || after[1]!.includes('\r') ? 'is cut off from its {…} by a line break' : 'is cut off from its {…} by a space';
      at = [start, end + after[0].length];
    } else problem = `names no diagram`;
    this.error('markup-invalid', `\`:${name}\` ${problem}, so nothing would be checked or filled in: ${usage}; write ${written}`, at[0], at[1], [
      `Write {${TARGET_ATTRIBUTE}=ID} right after the ${hasLabel ? 'label' : 'name'}, with no space, where ID is the id of a \`${DIAGRAM_FENCE_LANGUAGE}\` block.`,
    ]);
  }

  /** `::jones[…]{of=k}` or `:::jones`: a leaf or container directive named after a value is not read; it must be inline. */
  private misplacedDirective(node: Nodes & { name: string }): void {
    const [start, end] = offsets(node);
    const colons = node.type === 'leafDirective' ? '::' : ':::';
    this.error(
      'markup-invalid',
      `\`${colons}${node.name}\` is not read as a claim or fill-in: claims and fill-ins are text directives with one colon, e.g. :${node.name}[VALUE]{${TARGET_ATTRIBUTE}=ID}`,
      start,
      Math.min(end, start + colons.length + node.name.length),
    );
  }

  /**
   * Text that looks like one of our directives but was not parsed as one (a
   * label broken over lines, remark-directive missing, raw HTML around it)
   * would silently go unchecked; say so.
   */
  private strayMarkup(node: Text | Html): void {
    const [start, end] = offsets(node);
    // An HTML comment is the author's way of switching text off, like `%` in LaTeX: what it holds is not read.
    const slice = node.type === 'html' ? this.text.slice(start, end).replace(/<!--[\s\S]*?(?:-->|$)/g, (c) => c.replace(/[^\r\n]/g, ' ')) : this.text.slice(start, end);
    const pattern = /(?<![\w:\\]):([a-z][a-z-]*)(?=\[|\{of=)/g;
    for (let m = pattern.exec(slice); m !== null; m = pattern.exec(slice)) {
      const name = m[1]!;
      if (!isClaimKey(name) && !isFillKey(name)) continue;
      this.strayError(name, start + m.index, node.type === 'html' ? STRAY_IN_HTML_HINT : undefined);
    }
  }

  private strayError(name: string, at: number, hint = STRAY_HINT): void {
    this.problems.push({
      severity: 'error',
      ruleId: 'markup-invalid',
      message: `\`:${name}\` here is read as plain text, not as a claim or fill-in, so nothing is checked or filled in`,
      location: this.source.location(at, at + 1 + name.length),
      hints: [hint],
    });
  }

  /** The author's value: the inside of the math when the content is one math span, else the text as written. */
  private readClaimText(children: readonly PhrasingContent[], from: number, to: number): { text: string; locate: Locator } {
    const meaningful = children.filter((c) => !(c.type === 'text' && c.value.trim() === ''));
    const only = meaningful.length === 1 ? meaningful[0]! : undefined;
    if (only && only.type === 'inlineMath') {
      const [ms, me] = offsets(only);
      const fence = /^\$+/.exec(this.text.slice(ms, me))?.[0].length ?? 1;
      const map = alignValue(this.text, ms + fence, me - fence, only.value);
      return { text: only.value, locate: this.locator(map, ms, me) };
    }
    const raw = this.text.slice(from, to);
    const lead = raw.length - raw.trimStart().length;
    const trimmed = raw.trim();
    return { text: trimmed, locate: this.fixedLocator(from + lead, from + lead + trimmed.length) };
  }

  /**
   * Where the attribute `key` is written in the attribute list from `from` (its `{`) to `to`: its name,
   * or the `#`/`.` of the shorthands that stand for `id` and `class`; the whole list when it cannot be found.
   */
  private attributeAt(key: string, from: number, to: number): readonly [number, number] {
    const shorthand = key === 'id' ? '#' : key === 'class' ? '\\.' : undefined;
    const named = `${key.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}(?=[\\s=}])`;
    const pattern = shorthand ? `(?:${named}|${shorthand}[^\\s}.#]*)` : named;
    const m = new RegExp(`(?<=[{\\s])${pattern}`).exec(this.text.slice(from, to));
    return m ? [from + m.index, from + m.index + m[0].length] : [from, to];
  }

  private addFill(target: string, key: FillKey, locate: Locator, context: string | undefined, edit: TextEdit, node: Nodes, cell = false, more: Partial<FillEntry> = {}): void {
    this.actions.set(node, { kind: 'fill', fill: this.fills.length });
    this.fills.push({ target, key, locate, ...(context ? { context } : {}), ...(cell ? { cell } : {}), ...more });
    this.edits.push(edit);
  }

  /** Empties the fence lines of a container (blank lines keep the table apart and the line numbers), and unwraps it in the tree. */
  private unwrapFences(node: ContainerDirective): void {
    const [start, end] = offsets(node);
    this.edits.push({ start, end: lineEnd(this.text, start), replacement: { text: '' } });
    const last = node.children[node.children.length - 1];
    const closing = last ? /:{3,}[ \t]*$/.exec(this.text.slice(offsets(last)[1], end)) : null;
    if (closing) this.edits.push({ start: end - closing[0].length, end, replacement: { text: '' } });
    this.actions.set(node, { kind: 'unwrap' });
  }

  // :::khovanov-grid{of=… rows=quantum|homological values=ranks|groups} | j \ i | 0 | 1 | … | :::
  private gridDirective(node: ContainerDirective): void {
    const [start] = offsets(node);
    const fenceEnd = lineEnd(this.text, start);
    const braces = this.text.indexOf('{', start);
    const at = (key: string): readonly [number, number] => (braces >= 0 && braces < fenceEnd ? this.attributeAt(key, braces, fenceEnd) : [start, fenceEnd]);
    const attributes = node.attributes ?? {};
    const usage = `a grid takes of=ID, rows=${GRID_SETTINGS.rows.join('|')} and values=${GRID_SETTINGS.values.join('|')}`;
    let valid = true;
    for (const key of Object.keys(attributes)) {
      if (key === TARGET_ATTRIBUTE || Object.hasOwn(GRID_SETTINGS, key)) continue;
      this.error('markup-invalid', `\`:::${GRID_DIRECTIVE}\`: unknown attribute \`${key}\`: ${usage}`, ...at(key));
      valid = false;
    }
    const setting = <K extends keyof typeof GRID_SETTINGS>(key: K): (typeof GRID_SETTINGS)[K][number] | undefined => {
      const written = attributes[key];
      if (written == null) return GRID_SETTINGS[key][0];
      const allowed: readonly string[] = GRID_SETTINGS[key];
      if (allowed.includes(written)) return written as (typeof GRID_SETTINGS)[K][number];
      this.error('markup-invalid', `\`:::${GRID_DIRECTIVE}\`: ${key}=${written} is not a choice: write ${key}=${allowed.join(' or ')}`, ...at(key));
      return undefined;
    };
    const rows: GridRows | undefined = setting('rows');
    const values: GridValues | undefined = setting('values');
    const target = attributes[TARGET_ATTRIBUTE]?.trim();
    if (!target) this.error('markup-invalid', `\`:::${GRID_DIRECTIVE}\` names no diagram: write {of=ID}; ${usage}`, start, fenceEnd);
    const table = node.children.find((c): c is Table => c.type === 'table');
    if (!table) this.error('markup-invalid', `\`:::${GRID_DIRECTIVE}\` holds no table: put a GFM table between the fences`, start, fenceEnd);
    this.unwrapFences(node);
    if (!valid || !target || !table || rows === undefined || values === undefined) return;
    const place = `Khovanov grid of ${target} at line ${this.source.point(start).line}`;
    const [headerRow, ...bodyRows] = table.children;
    const cellOf = (cell: TableCell) => {
      const [s, e] = offsets(cell);
      return { node: cell, ...cellContent(this.text, s, e) };
    };
    type Cell = ReturnType<typeof cellOf>;
    const textOf = (c: Cell): string => this.text.slice(c.start, c.end);
    const header = { number: 0, cells: headerRow!.children.map(cellOf) };
    const valueRows = bodyRows.map((r, k) => ({ number: k + 1, cells: r.children.map(cellOf) })).filter((r) => r.cells.some((c) => c.start < c.end));
    const layout = gridLayout<Cell>(header, valueRows, textOf, rows, place);
    for (const p of layout.problems) this.error('markup-invalid', p.message, p.at.start < p.at.end ? p.at.start : p.at.innerStart, Math.max(p.at.end, p.at.innerEnd));
    for (const { i, j, row, column, cell } of layout.cells) {
      const context = `${place}, row ${row}, column ${column} (i = ${i}, j = ${j})`;
      // A fill-in or claim directive written in the cell speaks for itself.
      if (cell.node.children.some((c) => c.type === 'textDirective' && c.attributes?.[TARGET_ATTRIBUTE] != null)) continue;
      if (cell.start === cell.end) {
        const edit: TextEdit = { start: cell.innerStart, end: cell.innerEnd, replacement: { fill: this.fills.length, place: 'empty-cell' } };
        this.addFill(target, 'khovanov', this.fixedLocator(cell.innerStart, cell.innerEnd), context, edit, cell.node, true, { khovanovCell: { i, j, values } });
        continue;
      }
      const claim = gridCellClaim({ i, j, values }, textOf(cell));
      const location = this.source.location(cell.start, cell.end);
      this.claims.push({ target, key: claim.key, text: claim.text, locate: () => location, context, cell: true, inGrid: true });
    }
    if (layout.problems.length > 0) return;
    this.khovanovGrids.push({ target, range: { homological: layout.homological, quantum: layout.quantum, values }, locate: () => this.source.location(start, fenceEnd), context: place });
  }

  // :::invariants{notation=…} | diagram | jones | … | :::
  private tableDirective(node: ContainerDirective): void {
    const [start] = offsets(node);
    const tables = node.children.filter((c): c is Table => c.type === 'table');
    if (tables.length === 0) {
      this.error('markup-invalid', `\`:::${TABLE_DIRECTIVE}\` holds no table: put a GFM table between the fences`, start, lineEnd(this.text, start));
      return;
    }
    let notation = this.settings.notation;
    const extra = Object.keys(node.attributes ?? {}).filter((k) => k !== 'notation' && k !== COLUMNS_ATTRIBUTE);
    if (extra.length > 0) {
      const fenceEnd = lineEnd(this.text, start);
      const braces = this.text.indexOf('{', start);
      this.error(
        'markup-invalid',
        `\`:::${TABLE_DIRECTIVE}\`: unknown attribute${extra.length > 1 ? 's' : ''} ${extra.map((k) => `\`${k}\``).join(', ')}: a table takes only notation=pd|braid|gauss|dt and ${COLUMNS_ATTRIBUTE}="…"; remove the rest`,
        ...(braces >= 0 && braces < fenceEnd ? this.attributeAt(extra[0]!, braces, fenceEnd) : ([start, fenceEnd] as const)),
      );
    }
    const declared = node.attributes?.['notation'];
    if (declared) {
      if (isNotation(declared)) notation = declared;
      else this.error('markup-invalid', `\`:::${TABLE_DIRECTIVE}\`: unknown notation \`${declared}\`: write one of ${NOTATION_NAMES.join(', ')}`, start, lineEnd(this.text, start));
    }
    const mapping = node.attributes?.[COLUMNS_ATTRIBUTE];
    const mappingAt = (): readonly [number, number] => {
      const fenceEnd = lineEnd(this.text, start);
      const braces = this.text.indexOf('{', start);
      return braces >= 0 && braces < fenceEnd ? this.attributeAt(COLUMNS_ATTRIBUTE, braces, fenceEnd) : [start, fenceEnd];
    };
    for (const table of tables) this.table(table, notation, mapping ?? undefined, mappingAt);
    // Each fence line is emptied, not deleted: the blank line keeps the table apart from
    // the text around it (a line right after it would otherwise become a table row), and
    // the built file keeps the manuscript's line numbers.
    this.unwrapFences(node);
  }

  /** Each header cell's text as written, with its extent. */
  private headers(header: Table['children'][number]): { written: string; start: number; end: number }[] {
    return header.children.map((cell) => {
      const [s, e] = offsets(cell);
      const content = cellContent(this.text, s, e);
      return { written: this.text.slice(content.start, content.end), start: content.start, end: content.end };
    });
  }

  /**
   * The meaning of each column: from `columns="…"` on the fence when given (one entry per column, in order),
   * else from the header. Unknown headers and entries are errors; their columns are left alone. Undefined when
   * `columns` has the wrong number of entries.
   */
  private columnMeanings(header: Table['children'][number], mapping: string | undefined, mappingAt: () => readonly [number, number]) {
    const headers = this.headers(header);
    const known = `${DIAGRAM_HEADERS.join(', ')} (the row's diagram), ${ROW_NOTATION_COLUMN}, ${FREE_TEXT_HEADERS.join(', ')} (free text), or a claim key or one of its aliases (the README lists them)`;
    const entries = mapping?.split(',').map((x) => x.trim());
    if (entries && entries.length !== headers.length) {
      this.error(
        'markup-invalid',
        `\`:::${TABLE_DIRECTIVE}\`: ${COLUMNS_ATTRIBUTE}="${mapping}" names ${entries.length} column${entries.length === 1 ? '' : 's'}, but the table has ${headers.length}: give one entry per column, in order (\`${FREE_TEXT_COLUMN}\` for free text)`,
        ...mappingAt(),
      );
      return undefined; // which column is which is unclear, so the table is not read
    }
    return headers.map((h, k) => {
      const entry = entries?.[k];
      const meaning = columnMeaning(entry ?? h.written);
      if (!meaning) {
        if (entry !== undefined) this.error('markup-invalid', `\`:::${TABLE_DIRECTIVE}\`: column ${k + 1} of ${COLUMNS_ATTRIBUTE}="…" is \`${entry}\`, which means nothing here: write ${known}`, ...mappingAt());
        else {
          this.error('markup-invalid', `unknown table column \`${h.written}\`: a header is ${known}`, h.start, h.end, [
            `Rename the header, call it \`${REMARKS_COLUMN}\` to keep free text there, or say what every column holds with {${COLUMNS_ATTRIBUTE}="${ROW_DIAGRAM_COLUMN}, ${FREE_TEXT_COLUMN}, jones, …"} on \`:::${TABLE_DIRECTIVE}\`.`,
          ]);
        }
      }
      return { meaning: meaning ?? ({ kind: 'free' } as const), name: meaning?.kind === 'key' ? meaning.key : columnName(h.written), start: h.start, end: h.end };
    });
  }

  private table(table: Table, notation: Notation | undefined, mapping: string | undefined, mappingAt: () => readonly [number, number]): void {
    const [header, ...rows] = table.children;
    if (!header) return;
    const columns = this.columnMeanings(header, mapping, mappingAt);
    if (!columns) return;
    const diagramColumn = columns.findIndex((c) => c.meaning.kind === 'diagram');
    const notationColumn = columns.findIndex((c) => c.meaning.kind === 'notation');
    const [tableStart] = offsets(table);
    if (diagramColumn < 0) {
      this.error('markup-invalid', `this table has no \`${ROW_DIAGRAM_COLUMN}\` column: add one naming each row's diagram (an id, or a code in backticks)`, tableStart, lineEnd(this.text, tableStart));
      return;
    }
    rows.forEach((row, r) => {
      const rowNumber = r + 1;
      const cells = row.children;
      const rowStart = offsets(row)[0];
      const diagramCell = cells[diagramColumn];
      if (!diagramCell) {
        this.error('markup-invalid', `table row ${rowNumber} has no \`${ROW_DIAGRAM_COLUMN}\` cell`, rowStart, lineEnd(this.text, rowStart));
        return;
      }
      let rowNotation = notation;
      const notationCell = notationColumn >= 0 ? cells[notationColumn] : undefined;
      if (notationCell) {
        const [s, e] = offsets(notationCell);
        const c = cellContent(this.text, s, e);
        const written = this.text.slice(c.start, c.end).trim();
        if (written !== '') {
          if (isNotation(written)) rowNotation = written;
          else {
            this.error('markup-invalid', `table row ${rowNumber}: unknown notation \`${written}\`: write one of ${NOTATION_NAMES.join(', ')}`, c.start, c.end);
            this.refuse(rowIdWritten(this.text, diagramCell), c.start);
            return;
          }
        }
      }
      const rowDiagram = this.rowDiagram(diagramCell, rowNumber, rowNotation);
      if (rowDiagram === undefined) return;
      const { target, named } = rowDiagram;
      columns.forEach((column, k) => {
        if (column.meaning.kind !== 'key') return;
        const context = named ? `table row ${rowNumber} (${target}), column ${column.name}` : `table row ${rowNumber}, column ${column.name}`;
        const cell = cells[k];
        if (!cell) {
          this.error('markup-invalid', `${context}: the row has no cell here; add one (leave it empty to have it filled in)`, rowStart, lineEnd(this.text, rowStart));
          return;
        }
        // A fill-in or claim directive written in the cell speaks for itself.
        if (cell.children.some((c) => c.type === 'textDirective' && c.attributes?.[TARGET_ATTRIBUTE] != null)) return;
        const [s, e] = offsets(cell);
        const content = cellContent(this.text, s, e);
        if (content.start === content.end) {
          if (!isFillKey(column.name)) {
            this.error('markup-invalid', `${context}: \`${column.name}\` cannot be filled in; write the value to have it checked`, content.innerStart, Math.max(content.innerEnd, content.innerStart + 1));
            return;
          }
          const edit: TextEdit = { start: content.innerStart, end: content.innerEnd, replacement: { fill: this.fills.length, place: 'empty-cell' } };
          this.addFill(target, column.name, this.fixedLocator(content.innerStart, content.innerEnd), context, edit, cell, true);
          return;
        }
        const claim = this.readClaimText(cell.children, content.start, content.end);
        this.claims.push({ target, key: column.name, text: claim.text, locate: claim.locate, context, cell: true });
      });
    });
  }

  /** The row's diagram: an id, a code in backticks, or an id followed by a code (which defines it). */
  private rowDiagram(cell: TableCell, rowNumber: number, notation: Notation | undefined): { target: string; named: boolean } | undefined {
    const [s, e] = offsets(cell);
    const content = cellContent(this.text, s, e);
    const code = cell.children.find((c): c is InlineCode => c.type === 'inlineCode');
    if (!code) {
      const id = this.text.slice(content.start, content.end).trim();
      if (id === '') {
        this.error('markup-invalid', `table row ${rowNumber} names no diagram: write an id or a code in backticks`, content.innerStart, content.innerEnd);
        return undefined;
      }
      return { target: id, named: true };
    }
    const [cs, ce] = offsets(code);
    const before = this.text.slice(content.start, cs).trim();
    // An unnamed row's diagram gets an id no author can write (ids have no spaces).
    const id = before !== '' ? before : `table row ${rowNumber} at line ${this.source.point(s).line}`;
    if (notation === undefined) {
      if (!this.settings.notationRefused) {
        this.error('markup-invalid', `table row ${rowNumber}: the code's notation is not known: add a \`${ROW_NOTATION_COLUMN}\` column, {notation=…} on \`:::${TABLE_DIRECTIVE}\`, or a default in the front matter`, cs, ce);
      }
      this.refuse(before, this.settings.notationRefused ?? cs);
      return undefined;
    }
    if (before !== '' && !isUsableId(before)) {
      this.error('markup-invalid', `table row ${rowNumber}: diagram id \`${before}\` is not usable: ${ID_RULE}`, content.start, content.start + before.length);
      return undefined;
    }
    const fence = /^`+/.exec(this.text.slice(cs, ce))?.[0].length ?? 1;
    const map = alignValue(this.text, cs + fence, ce - fence, code.value);
    const headerStart = before !== '' ? content.start : cs;
    const headerEnd = before !== '' ? content.start + before.length : ce;
    this.diagrams.push({
      id,
      notation,
      code: code.value,
      locateCode: this.locator(map, cs, ce),
      locateHeader: () => this.source.location(headerStart, headerEnd),
      ...(before === '' ? { unnamed: true } : {}),
    });
    return { target: id, named: before !== '' };
  }
}

const STRAY_HINT = 'Keep the label [ … ] on one line and write {of=ID} right after it; in a pipeline of your own, add remark-directive.';
const STRAY_IN_HTML_HINT = 'Markdown is not read inside raw HTML up to the next blank line: put a blank line after the HTML tag, or move the claim out of the HTML.';

/** The id written before a row's code (`weave-4 \`1 -2\``), if any. */
function rowIdWritten(text: string, cell: TableCell): string | undefined {
  const [s] = offsets(cell);
  const code = cell.children.find((c): c is InlineCode => c.type === 'inlineCode');
  if (!code) return undefined;
  return text.slice(s, offsets(code)[0]).replace(/^\|/, '').trim() || undefined;
}

function offsets(node: Nodes): [number, number] {
  return [node.position?.start.offset ?? 0, node.position?.end.offset ?? 0];
}

function lineEnd(text: string, from: number): number {
  const m = /\r\n|\r|\n/.exec(text.slice(from));
  return m ? from + m.index : text.length;
}

function nextLineStart(text: string, eol: number): number {
  return text[eol] === '\r' && text[eol + 1] === '\n' ? eol + 2 : eol + 1;
}

/** The start of the closing fence line (or `end` when the block runs to the end of its container). */
function closingFenceStart(text: string, from: number, end: number): number {
  const body = text.slice(from, end);
  const m = /(?:^|\r\n|\r|\n)[^\r\n]*(?:`{3,}|~{3,})[ \t]*$/.exec(body);
  return m ? from + m.index : end;
}

/** The `]` closing the label opened at `open`, skipping escapes, nested brackets and math/code spans. */
function matchingBracket(text: string, open: number, limit: number): number {
  let depth = 0;
  for (let i = open; i < limit; i++) {
    const ch = text[i];
    if (ch === '\\') i++;
    else if (ch === '[') depth++;
    else if (ch === ']' && --depth === 0) return i;
  }
  return limit;
}

/**
 * A table cell's extent from mdast includes its pipes; `innerStart..innerEnd`
 * is between the pipes, `start..end` the trimmed content.
 */
function cellContent(text: string, s: number, e: number): { innerStart: number; innerEnd: number; start: number; end: number } {
  let innerStart = s;
  let innerEnd = e;
  if (text[innerStart] === '|') innerStart++;
  if (innerEnd > innerStart && text[innerEnd - 1] === '|' && text[innerEnd - 2] !== '\\') innerEnd--;
  let start = innerStart;
  let end = innerEnd;
  while (start < end && /\s/.test(text[start]!)) start++;
  while (end > start && /\s/.test(text[end - 1]!)) end--;
  return { innerStart, innerEnd, start, end };
}
