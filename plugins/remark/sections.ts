/**
 * Reading a big Markdown text in sections. micromark keeps the events of the
 * whole document until it builds the tree, which is most of the peak memory
 * of a 5 MB manuscript; parsed section by section, only one section's events
 * are alive at a time. And a reader that wants only the math (the formulas
 * KaTeX must typeset) can skip every section without a `$`.
 *
 * A section starts at a line where the parser is provably back at the top
 * level with nothing open: a line beginning with an ASCII letter in column 1,
 * right after a blank line, outside any fenced code, math or directive
 * container and outside the front matter. By CommonMark's block rules
 * (micromark, with the GFM, math, front-matter and directive extensions):
 * - a blank line closes paragraphs, block quotes, tables and HTML blocks of
 *   kinds 6 and 7, and only a paragraph takes lazy continuation lines;
 * - a line in column 1 is not indented enough to continue a list item, a
 *   footnote definition or indented code, and a letter starts no block
 *   marker, so every container that could hold that line has closed;
 * - what survives a blank line is fenced code (``` or ~~~), math (`$$`),
 *   a directive container (`:::name`), the front matter and HTML blocks of
 *   kinds 1–5 (`<script`, `<pre`, `<style`, `<textarea`, `<!--`, `<?`,
 *   `<!X`, `<![CDATA[`, each up to the line with its end marker): all are
 *   tracked line by line below, with the parser's exact rules. Any other
 *   line starting with `<` is an HTML block of kind 6 or 7 or a paragraph,
 *   which both end at the next blank line; in between, only a line that
 *   would open something after a paragraph (a fence, `$$`, `:::`, `<`)
 *   reads differently in the two, and ends the sectioning.
 * The rest of the text parses as a document of its own from there, but for
 * the definitions a reference needs (see parseInSections).
 *
 * The tracking is conservative: wherever the fence rules leave a doubt (a
 * fence or container line indented by one to three columns, which may sit in
 * a list item or at the top level; a tab before a fence; nested containers;
 * a container closed while a fence inside it is open), no later line starts
 * a section. test/markdown/sections.test.ts checks on generated documents
 * that the sections' trees, put together, are the whole text's tree.
 */
import type { Nodes, Root, RootContent } from 'mdast';

/** Above this size, sections are read in groups of about this many characters (fewer parser runs, bounded events). */
const GROUP_SIZE = 1 << 16;

/** An open fenced code or math block: its character and how many of them opened it. */
type Open = { readonly marker: string; readonly size: number } | undefined;

const LINE_END = /\r\n|\r|\n/g;
const BACKTICK_OPEN = /^(`{3,})[^`]*$/;
const TILDE_OPEN = /^(~{3,})/;
const MATH_OPEN = /^(\${2,})[^$]*$/;
const CONTAINER_OPEN = /^(:{3,})[A-Za-z]/;
/** HTML blocks of kinds 1–5 (CommonMark; micromark's html-flow): the opener at the line start, and what ends them. */
const HTML_RAW: readonly { readonly open: RegExp; readonly end: RegExp }[] = [
  { open: /^<(?:script|pre|style|textarea)(?=[ \t>]|$)/i, end: /<\/(?:script|pre|style|textarea)>/i },
  { open: /^<!--/, end: /-->/ },
  { open: /^<\?/, end: /\?>/ },
  { open: /^<![A-Za-z]/, end: />/ },
  { open: /^<!\[CDATA\[/, end: /\]\]>/ },
];
/** A line that would open a block after a paragraph line but is raw text inside an HTML block of kind 6 or 7. */
const OPENS_AFTER_PARAGRAPH = /^[ \t]*(?:```|~~~|\$\$|:::|<)/;
/** A line that may open or close something tracked here or HTML, after 1–3 spaces or any tab: its level is in doubt. */
const DOUBTFUL = /^(?: {1,3}|[ \t]*\t[ \t]*)(?:```|~~~|\$\$|:::|<)/;
const FRONT_MATTER_FENCE = /^---[ \t]*$/;

/** A closing fence of `size` or more `marker` characters (CommonMark's closer: at most three spaces before it). */
function closes(line: string, marker: string, size: number): boolean {
  let at = 0;
  while (at < 3 && line.charCodeAt(at) === 32) at++;
  let run = 0;
  while (line[at + run] === marker) run++;
  if (run < size) return false;
  for (let i = at + run; i < line.length; i++) if (line[i] !== ' ' && line[i] !== '\t') return false;
  return true;
}

function isBlank(line: string): boolean {
  for (let i = 0; i < line.length; i++) if (line[i] !== ' ' && line[i] !== '\t') return false;
  return true;
}

function isLetter(c: number): boolean {
  return (c >= 65 && c <= 90) || (c >= 97 && c <= 122);
}

/**
 * The offsets where sections of `text` start (0 first). One offset: the text is read in one piece.
 * A byte order mark at the start is part of the first section.
 */
export function sectionStarts(text: string): number[] {
  const starts = [0];
  let open: Open;
  /** The colons of the open directive container (0: none). */
  let container = 0;
  let blankBefore = false;
  let at = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  let first = true;
  let frontMatter = false;
  /** An open HTML block: of kinds 1–5, what ends it; 'blank': of kind 6 or 7, or a paragraph begun with `<`. */
  let html: RegExp | 'blank' | undefined;
  LINE_END.lastIndex = at;
  while (at <= text.length) {
    const m = LINE_END.exec(text);
    const end = m ? m.index : text.length;
    const line = text.slice(at, end);
    if (first && FRONT_MATTER_FENCE.test(line)) frontMatter = true;
    else if (frontMatter) {
      if (FRONT_MATTER_FENCE.test(line)) frontMatter = false;
    } else if (open) {
      if (DOUBTFUL.test(line) && line.includes('\t')) return starts;
      if (container > 0 && closes(line, ':', container)) return starts; // the container closes, and the fence in it with it
      if (closes(line, open.marker, open.size)) open = undefined;
    } else if (html instanceof RegExp) {
      if (container > 0 && closes(line, ':', container)) return starts;
      if (html.test(line)) html = undefined;
    } else if (html === 'blank') {
      if (isBlank(line)) html = undefined;
      else if (OPENS_AFTER_PARAGRAPH.test(line)) return starts;
    } else {
      const c = line.charCodeAt(0);
      if (DOUBTFUL.test(line)) return starts;
      if (c === 60) {
        const raw = HTML_RAW.find((kind) => kind.open.test(line));
        if (!raw) html = 'blank';
        else {
          const opener = raw.open.exec(line)![0].length;
          // An end marker that overlaps the opener (`<!-->`, `<?>`): whether it ends the block is left in doubt.
          if (raw.end.test(line) && !raw.end.test(line.slice(opener))) return starts;
          if (!raw.end.test(line.slice(opener))) html = raw.end;
        }
      }
      if (blankBefore && isLetter(c) && container === 0 && at > starts[starts.length - 1]!) starts.push(at);
      const fence = BACKTICK_OPEN.exec(line) ?? TILDE_OPEN.exec(line) ?? MATH_OPEN.exec(line);
      const colons = CONTAINER_OPEN.exec(line)?.[1]?.length ?? 0;
      if (fence) open = { marker: fence[1]![0]!, size: fence[1]!.length };
      else if (colons > 0) {
        if (container > 0) return starts; // nested containers: the closing rules of nesting are not tracked
        container = colons;
      } else if (container > 0 && closes(line, ':', container)) container = 0;
    }
    first = false;
    blankBefore = open === undefined && html === undefined && isBlank(line);
    if (!m) break;
    at = m.index + m[0].length;
  }
  return starts;
}

/** A section to parse: where it starts in the text, its text, and the line it starts on (0-based). */
interface Section {
  readonly from: number;
  readonly text: string;
  readonly line: number;
}

/**
 * Parses `text` section by section with `parse` (a whole-document Markdown parser) and joins the trees,
 * positions counted in the whole text, as `parse(text)` would have made it. Sections for which `wanted`
 * is false (given their text and start) are not parsed at all, so their blocks are missing from the tree.
 *
 * Sections are parsed in groups of about GROUP_SIZE characters, a group being its sections' texts one
 * after the other, whether or not they were neighbours: a section starts where the parser is back at the
 * top level with nothing open, and every section but the last ends with a blank line, so what comes
 * before a section never changes how it is read. Each block of a group's tree belongs to the section it
 * starts in, and is moved to that section's place in the whole text.
 *
 * The one thing read across sections is a definition: `[label]` (or a footnote call `[^label]`) is a
 * reference only if the label is defined anywhere, by a line with `[label]:`. When the text has `]:`, every
 * section with a `[` goes into one group (whatever its size), together with every section that has a `]:`
 * (wanted or not), so that each reference meets all the definitions; a section without `[` has neither.
 */
export function parseInSections(
  text: string,
  parse: (markdown: string) => Root,
  wanted: (section: string, from: number) => boolean = () => true,
  reader?: string,
): Root {
  const kept = reader === undefined ? undefined : keptTreesOf(reader);
  if (kept) parse = kept.parse(parse);
  const starts = sectionStarts(text);
  const bom = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  const defines = text.includes(']:');
  const root: Root = { type: 'root', children: [] };
  const read = (group: readonly Section[]): void => {
    if (group.length === 0) return;
    const tree = parse(group.map((s) => s.text).join(''));
    // Where each section starts in the group's text (offsets after a byte order mark, as the parser counts them) and on which line.
    let k = 0;
    let groupOffset = -(group[0]!.from === 0 ? bom : 0);
    let groupLine = 0;
    const bounds = group.map((s) => {
      const here = { offset: groupOffset, line: groupLine, section: s };
      groupOffset += s.text.length;
      groupLine += lineEndings(s.text, 0, s.text.length);
      return here;
    });
    for (const child of tree.children) {
      const at = child.position?.start.offset ?? 0;
      while (k + 1 < bounds.length && bounds[k + 1]!.offset <= at) k++;
      const b = bounds[k]!;
      shiftPositions(child, { lines: b.section.line - b.line, offset: b.section.from - bom - b.offset });
      root.children.push(child);
    }
  };
  let group: Section[] = [];
  let size = 0;
  const linked: Section[] = [];
  let line = 0;
  starts.forEach((from, k) => {
    const to = starts[k + 1] ?? text.length;
    const section = text.slice(from, to);
    const refers = defines && section.includes('[');
    if (refers && (section.includes(']:') || wanted(section, from))) linked.push({ from, text: section, line });
    else if (wanted(section, from)) {
      // Kept trees are looked up section by section: a group's text would change with any section in it.
      if (size + section.length > (kept ? 0 : GROUP_SIZE)) {
        read(group);
        group = [];
        size = 0;
      }
      group.push({ from, text: section, line });
      size += section.length;
    }
    line += lineEndings(text, from, to);
  });
  read(group);
  if (linked.length > 0) {
    read(linked);
    root.children.sort((a, b) => a.position!.start.offset! - b.position!.start.offset!);
  }
  root.position = { start: { line: 1, column: 1, offset: 0 }, end: endPoint(text, bom) };
  return root;
}

/**
 * Section trees kept from one run to the next, for `watch`: after a save most sections are the same text,
 * and a tree read before is copied instead of parsed again (copying is several times cheaper than parsing).
 * Off unless keepSectionTrees was called; then parseInSections keeps the trees of a named `reader` (one
 * per parser configuration: the same text parses differently with other extensions), each section's
 * own tree by its text, the least recently used dropped beyond the limit.
 */
class KeptTrees {
  private readonly trees = new Map<string, Root>();
  private characters = 0;
  constructor(private readonly limit: number) {}

  /** `parse`, answered from the kept trees when it can; the caller gets a copy it may change. */
  parse(parse: (markdown: string) => Root): (markdown: string) => Root {
    return (markdown) => {
      let tree = this.trees.get(markdown);
      if (tree) this.trees.delete(markdown);
      else {
        tree = parse(markdown);
        this.characters += markdown.length;
      }
      this.trees.set(markdown, tree);
      for (const oldest of this.trees.keys()) {
        if (this.characters <= this.limit) break;
        this.trees.delete(oldest);
        this.characters -= oldest.length;
      }
      return structuredClone(tree);
    };
  }
}

let keptLimit = 0;
const keptByReader = new Map<string, KeptTrees>();

/** Keeps up to `characters` of section text per reader, with their trees, from run to run (0: none, the default). */
export function keepSectionTrees(characters: number): void {
  keptLimit = characters;
  keptByReader.clear();
}

function keptTreesOf(reader: string): KeptTrees | undefined {
  if (keptLimit === 0) return undefined;
  let kept = keptByReader.get(reader);
  if (!kept) keptByReader.set(reader, (kept = new KeptTrees(keptLimit)));
  return kept;
}

/** The point after the last character, as micromark counts it (offsets after a byte order mark). */
function endPoint(text: string, bom: number): { line: number; column: number; offset: number } {
  const lastBreak = Math.max(text.lastIndexOf('\n'), text.lastIndexOf('\r'));
  return { line: lineEndings(text, 0, text.length) + 1, column: text.length - Math.max(lastBreak + 1, bom) + 1, offset: text.length - bom };
}

function lineEndings(text: string, from: number, to: number): number {
  let n = 0;
  for (let i = from; i < to; i++) {
    const c = text.charCodeAt(i);
    if (c === 10 || (c === 13 && text.charCodeAt(i + 1) !== 10)) n++;
  }
  return n;
}

function shiftPositions(node: Nodes | RootContent, shift: { readonly lines: number; readonly offset: number }): void {
  if (shift.lines === 0 && shift.offset === 0) return;
  const p = node.position;
  if (p) {
    p.start = { line: p.start.line + shift.lines, column: p.start.column, offset: (p.start.offset ?? 0) + shift.offset };
    p.end = { line: p.end.line + shift.lines, column: p.end.column, offset: (p.end.offset ?? 0) + shift.offset };
  }
  if ('children' in node) for (const child of node.children) shiftPositions(child, shift);
}
