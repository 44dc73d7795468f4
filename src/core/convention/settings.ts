/**
 * Reading a convention from key/value settings, the one format shared by
 * Markdown front matter, LaTeX package options and the `--convention` flag.
 *
 * Keys (case-insensitive; the Convention field names are accepted too):
 *   jones       t | t-inverse | q | q-graded
 *   bracket     unit | loop
 *   order       ascending | descending
 *   half-powers power | root
 *   signature   negative | positive
 *   homfly      vz | az
 *   kauffman    kauffman | dubrovnik
 */
import { InputError } from '../errors.ts';
import type { TextSpan } from '../diagnostics/diagnostic.ts';
import { DEFAULT_CONVENTION, type Convention } from './convention.ts';

interface SettingSpec {
  readonly key: string;
  readonly field: keyof Convention;
  readonly values: readonly string[];
  readonly meaning: string;
}

export const CONVENTION_SETTINGS: readonly SettingSpec[] = [
  { key: 'jones', field: 'jonesVariable', values: ['t', 't-inverse', 'q', 'q-graded'], meaning: 'the variable of the Jones polynomial' },
  { key: 'bracket', field: 'bracketNormalization', values: ['unit', 'loop'], meaning: 'the normalisation of the Kauffman bracket' },
  { key: 'order', field: 'termOrder', values: ['ascending', 'descending'], meaning: 'the order of terms in typeset polynomials' },
  { key: 'half-powers', field: 'halfPowers', values: ['power', 'root'], meaning: 'how t^{1/2} is typeset' },
  { key: 'signature', field: 'signatureSign', values: ['negative', 'positive'], meaning: 'the sign of the signature of the positive trefoil' },
  { key: 'khovanov', field: 'khovanovGrading', values: ['standard', 'q-inverse', 'homological', 'mirror'], meaning: 'the grading of Khovanov homology' },
  { key: 'homfly', field: 'homflyVariables', values: ['vz', 'az'], meaning: 'the variables and skein relation of the HOMFLY-PT polynomial' },
  { key: 'kauffman', field: 'kauffmanVariant', values: ['kauffman', 'dubrovnik'], meaning: 'Kauffman\'s F or its Dubrovnik variant' },
];

/** Where each key and value was written, for settings read from one string (the CLI flag). */
export interface SettingSpans {
  readonly key?: TextSpan;
  readonly value?: TextSpan;
}

export type ConventionSettingsResult =
  | { readonly ok: true; readonly settings: Partial<Convention> }
  | { readonly ok: false; readonly errors: readonly InputError[] };

function findSpec(key: string): SettingSpec | undefined {
  const k = key.trim().toLowerCase();
  return CONVENTION_SETTINGS.find((s) => s.key === k || s.field.toLowerCase() === k);
}

/**
 * Reads the settings that are present; absent keys stay absent, so a command
 * line can override only what it names. Every bad key or value is reported.
 */
export function readConventionSettings(
  record: Readonly<Record<string, string>>,
  spans?: Readonly<Record<string, SettingSpans>>,
): ConventionSettingsResult {
  const settings: Record<string, string> = {};
  const errors: InputError[] = [];
  for (const [rawKey, rawValue] of Object.entries(record)) {
    const spec = findSpec(rawKey);
    if (!spec) {
      const known = CONVENTION_SETTINGS.map((s) => s.key).join(', ');
      errors.push(
        new InputError(
          'convention-invalid',
          `unknown convention setting \`${rawKey}\`: the settings are ${known}; remove it or correct its name`,
          spans?.[rawKey]?.key,
        ),
      );
      continue;
    }
    const value = String(rawValue).trim().toLowerCase();
    if (value === '') {
      errors.push(
        new InputError('convention-invalid', `convention setting \`${spec.key}\` (${spec.meaning}) has no value: write one of ${spec.values.join(', ')}`, spans?.[rawKey]?.key),
      );
      continue;
    }
    if (!spec.values.includes(value)) {
      errors.push(
        new InputError(
          'convention-invalid',
          `convention setting \`${spec.key}\` (${spec.meaning}) cannot be \`${rawValue}\`: write one of ${spec.values.join(', ')}`,
          spans?.[rawKey]?.value,
        ),
      );
      continue;
    }
    if (settings[spec.field] !== undefined && settings[spec.field] !== value) {
      errors.push(
        new InputError('convention-invalid', `convention setting \`${spec.key}\` is given twice with different values; keep one`, spans?.[rawKey]?.key),
      );
      continue;
    }
    settings[spec.field] = value;
  }
  if (errors.length > 0) return { ok: false, errors };
  return { ok: true, settings: settings as Partial<Convention> };
}

export type ConventionResult =
  | { readonly ok: true; readonly convention: Convention }
  | { readonly ok: false; readonly errors: readonly InputError[] };

/** A full convention: the settings given, the rest from `base` (the default convention unless said otherwise). */
export function parseConventionSettings(
  record: Readonly<Record<string, string>>,
  base: Convention = DEFAULT_CONVENTION,
  spans?: Readonly<Record<string, SettingSpans>>,
): ConventionResult {
  const read = readConventionSettings(record, spans);
  if (!read.ok) return read;
  return { ok: true, convention: { ...base, ...read.settings } };
}

/**
 * Splits `jones=q,bracket=loop` into a record with the place of each part.
 * Settings are separated by commas, semicolons or whitespace (`jones=q bracket=loop`);
 * `=` or `:` joins key and value, with optional spaces (`jones = q`). A key
 * written twice is an error: the record could keep only one of the values.
 */
export function splitConventionText(text: string): {
  readonly record: Record<string, string>;
  readonly spans: Record<string, SettingSpans>;
  readonly errors: readonly InputError[];
} {
  const record: Record<string, string> = {};
  const spans: Record<string, SettingSpans> = {};
  const errors: InputError[] = [];
  const settingPattern = /([^,;\s=:]*)(?:\s*([=:])\s*([^,;\s]*))?/y;
  for (let at = 0; at < text.length; ) {
    if (/[,;\s]/.test(text[at]!)) {
      at++;
      continue;
    }
    settingPattern.lastIndex = at;
    const m = settingPattern.exec(text)!;
    const [whole, key = '', separator, value = ''] = m;
    const keySpan = { start: at, end: at + key.length };
    at += Math.max(whole.length, 1);
    if (separator === undefined) {
      errors.push(new InputError('convention-invalid', `convention setting \`${key}\` has no value: write it as key=value, e.g. jones=q`, keySpan));
      continue;
    }
    if (key === '') {
      errors.push(new InputError('convention-invalid', `the value \`${value}\` has no key: write it as key=value, e.g. jones=q`, { start: keySpan.start, end: at }));
      continue;
    }
    const valueStart = at - value.length;
    if (Object.hasOwn(record, key)) {
      if (record[key] !== value) {
        errors.push(new InputError('convention-invalid', `convention setting \`${key}\` is given twice with different values; keep one`, keySpan));
      }
      continue;
    }
    record[key] = value;
    spans[key] = { key: keySpan, value: { start: valueStart, end: valueStart + value.length } };
  }
  return { record, spans, errors };
}

/** The `--convention` flag and similar one-line forms: partial settings or the errors found. */
export function parseConventionText(text: string): ConventionSettingsResult {
  const split = splitConventionText(text);
  const read = readConventionSettings(split.record, split.spans);
  const errors = [...split.errors, ...(read.ok ? [] : read.errors)];
  if (errors.length > 0) return { ok: false, errors };
  return read;
}
