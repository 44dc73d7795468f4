/**
 * The JSON object `compute --json` prints for each code (one per line, JSON
 * Lines). Built here as plain data so other commands and options can add keys
 * to it; exact values stay exact: coefficients are decimal strings, exponents
 * JSON numbers (halves and quarters are exact in binary).
 */
import type { DiagramReport } from '../core/analyze/report.ts';
import { DEFAULT_CONVENTION, type Convention } from '../core/convention/convention.ts';
import type { Notation } from '../core/diagram/model.ts';
import { isInputError, type InputError } from '../core/errors.ts';
import type { TextSpan } from '../core/diagnostics/diagnostic.ts';
import { INVARIANTS, type OpenChoice } from '../core/invariants/registry/index.ts';
import { printDtCode, printGaussCode, printPdCode } from '../core/notation/print.ts';
import type { LinkDiagram } from '../core/diagram/model.ts';

/** A diagram in each notation that can write it: PD (no free loops), Gauss (always), DT (knots). */
export function simplifiedCodes(d: LinkDiagram): Record<string, string> {
  const codes: Record<string, string> = {};
  if (d.freeLoops === 0 && d.crossings.length > 0) codes.pd = printPdCode(d);
  codes.gauss = printGaussCode(d);
  if (d.components.length === 1 && d.freeLoops === 0) codes.dt = printDtCode(d);
  return codes;
}

/**
 * The code, its notation, whether the notation fixes chirality, and one field per JSON field of each
 * registered invariant, in registry order (see each module in src/core/invariants/registered).
 */
export interface ComputeJson {
  readonly code: string;
  readonly notation: Notation;
  readonly chiralityFixed: boolean;
  /** What the diagram is when built from a family (or a literal torus braid), e.g. "the torus knot T(3, 4)"; else null. */
  readonly family: string | null;
  readonly [field: string]: unknown;
}

export interface InvalidCodeJson {
  readonly code: string;
  readonly notation: Notation;
  readonly error: {
    readonly ruleId: string;
    readonly message: string;
    /** 0-based offsets into `code`; null when the whole code is at fault. */
    readonly span: TextSpan | null;
    readonly hints: readonly string[];
  };
}

/**
 * A field whose computation ran into a limit (src/core/limits.ts) or was refused (a diagram too wide) is left out and listed under
 * `notComputed` (field → error), so the fields that were computed still reach the reader.
 */
/** Every field a registered invariant adds to the JSON object, in registry order: what `--keys` may name. */
export const JSON_FIELDS: readonly string[] = [...INVARIANTS.flatMap((invariant) => invariant.json.map((field) => field.field)), 'simplified'];

/** `keys`: only these fields are computed and written (the code, notation, chirality and family always are). */
export function computeJson(code: string, r: DiagramReport, convention: Convention = DEFAULT_CONVENTION, keys?: ReadonlySet<string>): ComputeJson {
  const json: Record<string, unknown> = { code, notation: r.notation, chiralityFixed: r.chiralityFixed, family: r.family?.description ?? null };
  const notComputed: Record<string, InvalidCodeJson['error']> = {};
  for (const invariant of INVARIANTS) {
    for (const field of invariant.json) {
      if (keys && !keys.has(field.field)) continue;
      try {
        json[field.field] = field.value(r, convention);
      } catch (error) {
        if (!isInputError(error)) throw error;
        notComputed[field.field] = errorJson(error);
      }
    }
  }
  if (!keys || keys.has('simplified')) {
    try {
      json.simplified = r.simplified ? { crossings: r.simplified.diagram.crossings.length, moves: { ...r.simplified.moves }, codes: simplifiedCodes(r.simplified.diagram) } : null;
    } catch (error) {
      if (!isInputError(error)) throw error;
      notComputed.simplified = errorJson(error);
    }
  }
  json['openChoices'] = openChoicesJson(r);
  if (Object.keys(notComputed).length > 0) json['notComputed'] = notComputed;
  return json as ComputeJson;
}

/** The limit errors of the fields `computeJson` left out. */
export function notComputedErrors(json: ComputeJson): InvalidCodeJson['error'][] {
  return Object.values((json['notComputed'] ?? {}) as Record<string, InvalidCodeJson['error']>);
}

/**
 * What the code leaves open (DT codes; null otherwise): its independent parts by entry (counted from 1),
 * which are kinks, and the JSON fields whose value can change with those choices. The fields are given for
 * the code's own drawing.
 */
export function openChoicesJson(r: DiagramReport): OpenChoicesJson | null {
  const open = r.diagram.openChoices;
  if (!open) return null;
  const present = new Set<OpenChoice>(['chirality']);
  if (open.parts.some((p) => p.kink)) present.add('kink-sign');
  if (open.parts.filter((p) => !p.kink).length > 1) present.add('summand-chirality');
  const dependentFields = INVARIANTS.filter((inv) => inv.claims.some((c) => c.changedBy.some((choice) => present.has(choice)))).flatMap((inv) => inv.json.map((f) => f.field));
  return {
    parts: open.parts.map((p) => ({ entries: p.crossings.map((c) => c + 1), kink: p.kink, sign: r.diagram.crossings[p.crossings[0]!]!.sign })),
    dependentFields,
  };
}

export interface OpenChoicesJson {
  /** `sign`: the sign of the part's first crossing in the code's own drawing (what `part-signs` states). */
  readonly parts: readonly { readonly entries: readonly number[]; readonly kink: boolean; readonly sign: number }[];
  readonly dependentFields: readonly string[];
}

export function invalidCodeJson(code: string, notation: Notation, error: InputError): InvalidCodeJson {
  return { code, notation, error: errorJson(error) };
}

function errorJson(error: InputError): InvalidCodeJson['error'] {
  return {
    ruleId: error.ruleId,
    message: error.message,
    span: error.span ? { start: error.span.start, end: error.span.end } : null,
    hints: [...error.hints],
  };
}
