/**
 * The document's skeinproof settings, read from the `skeinproof` key of its
 * YAML front matter:
 *
 *   skeinproof:
 *     convention: { jones: q, bracket: unit, order: descending }
 *     notation: braid      # default for blocks and table codes that name none
 *     strict: true         # warnings fail the check
 *
 * Other keys of the front matter belong to the author and are ignored.
 */
import type { Yaml } from 'mdast';
import { isMap, isScalar, parseDocument, type Node as YamlNode } from 'yaml';
import type { Convention } from '../../src/core/convention/convention.ts';
import { readConventionSettings, splitConventionText, type SettingSpans } from '../../src/core/convention/settings.ts';
import type { Diagnostic, SourceLocation, TextSpan } from '../../src/core/diagnostics/diagnostic.ts';
import type { Notation } from '../../src/core/diagram/model.ts';
import type { SourceText } from './source-text.ts';
import { NOTATION_NAMES, isNotation } from './syntax.ts';

export const FRONT_MATTER_KEY = 'skeinproof';

export interface ManuscriptSettings {
  readonly convention: Partial<Convention>;
  readonly notation?: Notation;
  readonly strict?: boolean;
  /** The front matter's `title`, used for the HTML page. */
  readonly title?: string;
  /** Where the front matter names a default notation that is not one (already an error there). */
  readonly notationRefused?: SourceLocation;
}

export function readFrontMatter(node: Yaml, source: SourceText): { settings: ManuscriptSettings; problems: Diagnostic[] } {
  const problems: Diagnostic[] = [];
  const nodeStart = node.position?.start.offset ?? 0;
  const valueStart = node.value === '' ? nodeStart : source.text.indexOf(node.value, nodeStart);
  const at = (range: readonly number[] | undefined | null): [number, number] =>
    range ? [valueStart + range[0]!, valueStart + range[1]!] : [nodeStart, nodeStart + 3];
  const problem = (message: string, range: readonly number[] | undefined | null, hints?: string[]): void => {
    const [s, e] = at(range);
    problems.push({ severity: 'error', ruleId: 'front-matter-invalid', message, location: source.location(s, e), ...(hints ? { hints } : {}) });
  };

  const doc = parseDocument(node.value, { prettyErrors: false });
  let convention: Partial<Convention> = {};
  let notation: Notation | undefined;
  let strict: boolean | undefined;
  let title: string | undefined;
  let notationRefused: SourceLocation | undefined;
  if (doc.errors.length > 0) {
    for (const e of doc.errors) problem(`the front matter is not valid YAML: ${e.message.split('\n')[0]}`, e.pos);
    return { settings: { convention }, problems };
  }
  if (!isMap(doc.contents)) return { settings: { convention }, problems };
  const titleNode = doc.contents.get('title', true);
  if (isScalar(titleNode) && typeof titleNode.value === 'string') title = titleNode.value;
  const ours = doc.contents.get(FRONT_MATTER_KEY, true) as YamlNode | undefined;
  if (ours === undefined || ours === null) return { settings: { convention, ...(title ? { title } : {}) }, problems };
  if (!isMap(ours)) {
    problem(`\`${FRONT_MATTER_KEY}\` in the front matter must be a mapping of settings (convention, notation, strict)`, ours.range);
    return { settings: { convention }, problems };
  }
  for (const pair of ours.items) {
    const keyNode = pair.key as YamlNode;
    const key = isScalar(keyNode) ? String(keyNode.value) : '';
    const value = pair.value as YamlNode | null;
    if (key === 'convention') {
      convention = readConvention(value, valueStart, problem, problems, source) ?? convention;
    } else if (key === 'notation') {
      const written = isScalar(value) ? String(value.value) : '';
      if (isNotation(written)) notation = written;
      else {
        problem(`front matter: unknown default notation \`${written}\`: write one of ${NOTATION_NAMES.join(', ')}`, value?.range);
        notationRefused = source.location(...at(value?.range));
      }
    } else if (key === 'strict') {
      if (isScalar(value) && typeof value.value === 'boolean') strict = value.value;
      else problem('front matter: `strict` must be true or false', value?.range);
    } else {
      problem(`front matter: unknown skeinproof setting \`${key}\`: the settings are convention, notation and strict`, keyNode.range);
    }
  }
  return {
    settings: {
      convention,
      ...(notation ? { notation } : {}),
      ...(strict !== undefined ? { strict } : {}),
      ...(title ? { title } : {}),
      ...(notationRefused ? { notationRefused } : {}),
    },
    problems,
  };
}

/** `convention:` as a mapping (jones: q) or as one line (jones=q, order=descending). */
function readConvention(
  value: YamlNode | null,
  valueStart: number,
  problem: (message: string, range: readonly number[] | undefined | null) => void,
  problems: Diagnostic[],
  source: SourceText,
): Partial<Convention> | undefined {
  let record: Record<string, string> = {};
  const spans: Record<string, SettingSpans> = {};
  let base = 0;
  if (isMap(value)) {
    base = valueStart;
    for (const pair of value.items) {
      const k = pair.key as YamlNode;
      const v = pair.value as YamlNode | null;
      const key = isScalar(k) ? String(k.value) : '';
      record[key] = isScalar(v) ? String(v.value) : '';
      spans[key] = { ...(k.range ? { key: span(k.range) } : {}), ...(v?.range ? { value: span(v.range) } : {}) };
    }
  } else if (isScalar(value) && typeof value.value === 'string' && value.range) {
    const split = splitConventionText(value.value);
    base = valueStart + value.range[0] + (source.text[valueStart + value.range[0]] === '"' || source.text[valueStart + value.range[0]] === "'" ? 1 : 0);
    record = split.record;
    Object.assign(spans, split.spans);
    for (const e of split.errors) problems.push(conventionProblem(e.message, e.span, base, source));
  } else {
    problem('front matter: `convention` must be a mapping such as { jones: t, order: ascending }', value?.range);
    return undefined;
  }
  const read = readConventionSettings(record, spans);
  if (read.ok) return read.settings;
  for (const e of read.errors) problems.push(conventionProblem(e.message, e.span, base, source));
  // The settings that are right still apply, so one bad setting does not make every claim written in the declared convention look wrong too.
  let usable: Partial<Convention> = {};
  for (const [key, value] of Object.entries(record)) {
    const one = readConventionSettings({ [key]: value });
    if (one.ok) usable = { ...usable, ...one.settings };
  }
  return usable;
}

function span(range: readonly number[]): TextSpan {
  return { start: range[0]!, end: range[1]! };
}

function conventionProblem(message: string, at: TextSpan | undefined, base: number, source: SourceText): Diagnostic {
  const start = base + (at?.start ?? 0);
  const end = base + (at?.end ?? 0);
  return { severity: 'error', ruleId: 'convention-invalid', message: `front matter: ${message}`, location: source.location(start, end) };
}
