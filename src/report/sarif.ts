/**
 * The SARIF 2.1.0 reporter, for code-scanning dashboards: one run, the rule
 * catalogue as the driver's rules, the files named as the run's artifacts, and
 * one result per diagnostic with its physical location (1-based lines and
 * columns, end column just after the span; the artifact by URI and index).
 */
import type * as Sarif from 'sarif';
import type { Diagnostic, Severity } from '../core/diagnostics/diagnostic.ts';
import { RULES, ruleDescription } from './rules.ts';

export const SARIF_SCHEMA = 'https://json.schemastore.org/sarif-2.1.0.json';

export interface SarifOptions {
  readonly toolVersion?: string;
  readonly informationUri?: string;
}

const LEVEL: Readonly<Record<Severity, Sarif.Result.level>> = { error: 'error', warning: 'warning', note: 'note' };

/** A file path as a relative or absolute URI reference (forward slashes, reserved characters escaped). */
export function pathToUri(path: string): string {
  return encodeURI(path.replace(/\\/g, '/')).replace(/[?#]/g, (c) => encodeURIComponent(c));
}

function resultMessage(d: Diagnostic): string {
  // A message may end without a full stop; the SARIF text joins whole sentences.
  const parts = [/[.!?]$/.test(d.message) ? d.message : `${d.message}.`];
  if (d.claimed !== undefined && d.severity !== 'note') parts.push(`Claimed: ${d.claimed}.`);
  if (d.computed !== undefined && d.computed !== '' && d.severity !== 'note') parts.push(`Computed: ${d.computed}.`);
  for (const hint of d.hints ?? []) parts.push(hint);
  return parts.join(' ');
}

function location(d: Diagnostic, files: readonly string[]): Sarif.Location[] {
  if (!d.location) return [];
  const { start, end } = d.location;
  const region: Sarif.Region = {
    startLine: start.line,
    startColumn: start.column,
    endLine: end?.line ?? start.line,
    endColumn: end?.column ?? start.column + 1,
  };
  const artifactLocation = { uri: pathToUri(d.location.file), index: files.indexOf(d.location.file) };
  return [{ physicalLocation: { artifactLocation, region } }];
}

export function sarifLog(diagnostics: readonly Diagnostic[], options: SarifOptions = {}): Sarif.Log {
  const ids = [...RULES.map((r) => r.id)];
  for (const d of diagnostics) if (!ids.includes(d.ruleId)) ids.push(d.ruleId);
  const rules: Sarif.ReportingDescriptor[] = ids.map((id) => ({ id, shortDescription: { text: ruleDescription(id) } }));
  // Each file named by a result, once, in order of first mention; results point at it by index.
  const files = [...new Set(diagnostics.flatMap((d) => (d.location ? [d.location.file] : [])))];
  const artifacts: Sarif.Artifact[] = files.map((file) => ({ location: { uri: pathToUri(file) } }));
  const results: Sarif.Result[] = diagnostics.map((d) => ({
    ruleId: d.ruleId,
    ruleIndex: ids.indexOf(d.ruleId),
    level: LEVEL[d.severity],
    message: { text: resultMessage(d) },
    locations: location(d, files),
    ...(d.data || d.claimed !== undefined
      ? { properties: { ...(d.claimed !== undefined ? { claimed: d.claimed } : {}), ...(d.computed !== undefined ? { computed: d.computed } : {}), ...(d.data ?? {}) } }
      : {}),
  }));
  const driver: Sarif.ToolComponent = {
    name: 'skeinproof',
    ...(options.toolVersion ? { version: options.toolVersion } : {}),
    ...(options.informationUri ? { informationUri: options.informationUri } : {}),
    rules,
  };
  // Our columns count UTF-16 code units, as the diagnostic model says.
  return { version: '2.1.0', $schema: SARIF_SCHEMA, runs: [{ tool: { driver }, artifacts, columnKind: 'utf16CodeUnits', results }] };
}

export function formatSarif(diagnostics: readonly Diagnostic[], options: SarifOptions = {}): string {
  return `${JSON.stringify(sarifLog(diagnostics, options), null, 2)}\n`;
}
