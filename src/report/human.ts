/**
 * The human-readable reporter: `file:line:col: severity: message [rule]`,
 * then the source line with a caret under the span, then the claimed and
 * computed values and hints. Colour (ANSI) only when the caller asks for it,
 * e.g. because stdout is a terminal.
 */
import type { Diagnostic, Severity, SourceLocation } from '../core/diagnostics/diagnostic.ts';
import type { SessionCounts } from '../core/manuscript/api.ts';
import { countDiagnostics } from './exit-status.ts';

export interface HumanReportOptions {
  readonly color?: boolean;
  /** The text of each file, for the source excerpt; files absent here get no excerpt. */
  readonly sources?: ReadonlyMap<string, string>;
  /** What was checked, printed before the summary so that a pass says what it passed. */
  readonly checked?: SessionCounts;
}

const SEVERITY_COLOR: Readonly<Record<Severity, string>> = { error: '31', warning: '33', note: '36' };

function paint(text: string, code: string, color: boolean): string {
  return color ? `\u001b[${code}m${text}\u001b[0m` : text;
}

function place(location: SourceLocation): string {
  return `${location.file}:${location.start.line}:${location.start.column}`;
}

/**
 * Each source split into lines once per sources map, not once per message: a
 * report of many messages on one file stays linear in the file's size.
 */
const splitSources = new WeakMap<ReadonlyMap<string, string>, Map<string, readonly string[]>>();

function linesOf(sources: ReadonlyMap<string, string>, file: string): readonly string[] | undefined {
  let split = splitSources.get(sources);
  if (!split) splitSources.set(sources, (split = new Map()));
  let lines = split.get(file);
  if (lines === undefined) {
    const text = sources.get(file);
    if (text === undefined) return undefined;
    split.set(file, (lines = splitLines(text)));
  }
  return lines;
}

function splitLines(text: string): readonly string[] {
  return text.split(/\r\n|\n|\r/);
}

/**
 * The excerpt under a located diagnostic: the line, and a caret line that
 * keeps tabs so the caret stays under the span. Columns are 1-based UTF-16
 * units; the end point lies just after the span. A span running past its
 * first line is underlined to the end of that line; a bare point gets one caret.
 */
export function excerpt(location: SourceLocation, text: string | readonly string[], caretColor?: string): string[] {
  const whole = (typeof text === 'string' ? splitLines(text) : text)[location.start.line - 1];
  if (whole === undefined) return [];
  const wholeStart = Math.min(Math.max(location.start.column, 1), whole.length + 1);
  const wholeEnd = !location.end
    ? wholeStart + 1
    : location.end.line === location.start.line
      ? Math.min(location.end.column, whole.length + 1)
      : whole.length + 1;
  // A very long line is shown as a window around the span, so each excerpt costs the same however long the line.
  const { line, start, end } = excerptWindow(whole, wholeStart, wholeEnd);
  // A character outside the BMP is two UTF-16 units but one place on screen: pad and underline by code points.
  const width = Math.max(1, Array.from(line.slice(start - 1, end - 1)).length);
  const padding = Array.from(line.slice(0, start - 1), (ch) => (ch === '\t' ? '\t' : ' ')).join('');
  const gutter = String(location.start.line);
  const blank = ' '.repeat(gutter.length);
  const marker = `^${'~'.repeat(width - 1)}`;
  return [` ${gutter} | ${line}`, ` ${blank} | ${padding}${caretColor ? paint(marker, caretColor, true) : marker}`];
}

/** Lines longer than this are shown as a window of this many characters around the span, with … at the cut ends. */
export const EXCERPT_WIDTH = 200;
const CONTEXT_BEFORE = 60;

function excerptWindow(line: string, start: number, end: number): { line: string; start: number; end: number } {
  if (line.length <= EXCERPT_WIDTH) return { line, start, end };
  const from = Math.max(0, Math.min(start - 1 - CONTEXT_BEFORE, line.length - EXCERPT_WIDTH));
  const to = Math.min(line.length, from + EXCERPT_WIDTH);
  const lead = from > 0 ? '…' : '';
  const shown = `${lead}${line.slice(from, to)}${to < line.length ? '…' : ''}`;
  const shift = lead.length - from;
  return { line: shown, start: start + shift, end: Math.min(end, to + 1) + shift };
}

export function formatDiagnostic(d: Diagnostic, options: HumanReportOptions = {}): string {
  const color = options.color === true;
  const severityText = paint(d.severity, `1;${SEVERITY_COLOR[d.severity]}`, color);
  const head = d.location ? `${paint(place(d.location), '1', color)}: ` : 'skeinproof: ';
  const lines = [`${head}${severityText}: ${d.message} ${paint(`[${d.ruleId}]`, '2', color)}`];
  const source = d.location && options.sources ? linesOf(options.sources, d.location.file) : undefined;
  const gutterWidth = d.location ? String(d.location.start.line).length : 0;
  if (d.location && source !== undefined) lines.push(...excerpt(d.location, source, color ? `1;${SEVERITY_COLOR[d.severity]}` : undefined));
  const note = (label: string, value: string) => lines.push(` ${' '.repeat(gutterWidth)} = ${label}: ${value}`);
  if (d.claimed !== undefined && d.severity !== 'note') note('claimed', d.claimed);
  if (d.computed !== undefined && d.computed !== '' && d.severity !== 'note') note('computed', d.computed);
  for (const hint of d.hints ?? []) note('hint', hint);
  return lines.join('\n');
}

export function summaryLine(diagnostics: readonly Diagnostic[]): string {
  const { errors, warnings, notes, cited } = countDiagnostics(diagnostics);
  if (errors + warnings + notes === 0) return 'no problems found';
  const part = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;
  const restOnSources = cited === 0 ? '' : cited === 1 ? '; 1 claim rests on a cited source' : `; ${cited} claims rest on cited sources`;
  return [part(errors, 'error'), part(warnings, 'warning'), ...(notes > 0 ? [part(notes, 'note')] : [])].join(', ') + restOnSources;
}

const counted = (n: number, word: string, plural = `${word}s`) => `${n} ${n === 1 ? word : plural}`;

/** "checked 12 diagrams: 31 claims agree, 14 values filled, 3 figures; table cells: 20 checked or filled, 2 not applicable". */
export function checkedLine(c: SessionCounts): string {
  const parts = [`${counted(c.claimsAgree, 'claim')} ${c.claimsAgree === 1 ? 'agrees' : 'agree'}`];
  if (c.claimsContradicted > 0) parts.push(`${c.claimsContradicted} contradicted`);
  if (c.claimsUndecided > 0) parts.push(`${c.claimsUndecided} undecided`);
  parts.push(`${counted(c.valuesFilled, 'value')} filled`);
  if (c.figures > 0) parts.push(counted(c.figures, 'figure'));
  const cells = [...(c.tableCells > 0 ? [`${c.tableCells} checked or filled`] : []), ...(c.notApplicable > 0 ? [`${c.notApplicable} not applicable`] : [])];
  return `checked ${counted(c.diagrams, 'diagram')}: ${parts.join(', ')}${cells.length > 0 ? `; table cells: ${cells.join(', ')}` : ''}`;
}

/** All diagnostics, each followed by a blank line, then what was checked (when given) and the summary line. */
export function formatHumanReport(diagnostics: readonly Diagnostic[], options: HumanReportOptions = {}): string {
  const blocks = diagnostics.map((d) => formatDiagnostic(d, options));
  return [...blocks.map((b) => `${b}\n`), ...(options.checked ? [checkedLine(options.checked)] : []), summaryLine(diagnostics)].join('\n') + '\n';
}
