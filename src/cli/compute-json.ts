/**
 * The JSON object `compute --json` prints for each code (one per line, JSON
 * Lines). Built here as plain data so other commands and options can add keys
 * to it; exact values stay exact: coefficients are decimal strings, exponents
 * JSON numbers (halves and quarters are exact in binary).
 */
import type { BoundReason, DiagramReport, LinkingNumber } from '../core/analyze/report.ts';
import { DEFAULT_CONVENTION, type Convention, type SignatureSign } from '../core/convention/convention.ts';
import { signatureInConvention } from '../core/invariants/classical/signature.ts';
import type { Notation } from '../core/diagram/model.ts';
import type { InputError } from '../core/errors.ts';
import type { TextSpan } from '../core/diagnostics/diagnostic.ts';
import type { Laurent } from '../core/poly/laurent.ts';

export interface PolynomialJson {
  readonly variable: 't' | 'A' | 'z';
  /** [exponent, coefficient] by ascending exponent, zero terms left out. */
  readonly terms: readonly (readonly [number, string])[];
}

export interface CrossingNumberJson {
  readonly lower: number;
  readonly upper: number;
  readonly exact: number | null;
  readonly reasons: readonly BoundReason[];
}

export interface ComputeJson {
  readonly code: string;
  readonly notation: Notation;
  readonly crossings: number;
  readonly components: number;
  readonly writhe: number;
  readonly positiveCrossings: number;
  readonly negativeCrossings: number;
  readonly jones: PolynomialJson;
  readonly bracket: PolynomialJson;
  readonly span: number;
  readonly minDegree: number;
  readonly maxDegree: number;
  readonly bracketSpan: number;
  readonly bracketMinDegree: number;
  readonly bracketMaxDegree: number;
  readonly connected: boolean;
  readonly reduced: boolean;
  readonly alternating: boolean;
  readonly adequate: boolean;
  readonly aAdequate: boolean;
  readonly bAdequate: boolean;
  readonly stateCircles: { readonly a: number; readonly b: number };
  readonly nugatory: readonly number[];
  readonly linking: readonly LinkingNumber[];
  readonly chiralityFixed: boolean;
  readonly crossingNumber: CrossingNumberJson;
  readonly boundaryWidth: number;
  /** Δ(t) in Conway's normalisation (half-integer exponents for an even number of components). */
  readonly alexander: PolynomialJson;
  /** ∇(z), with Δ(t) = ∇(t^{1/2} − t^{−1/2}). */
  readonly conway: PolynomialJson;
  /** det(L) = |Δ(−1)|, a decimal string (it can exceed 2^53). */
  readonly determinant: string;
  /** σ(L) in the sign of `signatureSign`, the one `--convention signature=…` declares. */
  readonly signature: number;
  /** The sign the positive (right-handed) trefoil's signature has in `signature`: negative gives −2. */
  readonly signatureSign: SignatureSign;
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

export function polynomialJson(p: Laurent, variable: PolynomialJson['variable']): PolynomialJson {
  return { variable, terms: p.terms().map(([e, c]) => [e, c.toString()] as const) };
}

export function computeJson(code: string, r: DiagramReport, convention: Convention = DEFAULT_CONVENTION): ComputeJson {
  return {
    code,
    notation: r.notation,
    crossings: r.crossings,
    components: r.components,
    writhe: r.writhe,
    positiveCrossings: r.positiveCrossings,
    negativeCrossings: r.negativeCrossings,
    jones: polynomialJson(r.jones, 't'),
    bracket: polynomialJson(r.bracket, 'A'),
    span: r.span,
    minDegree: r.jonesMinDegree,
    maxDegree: r.jonesMaxDegree,
    bracketSpan: r.bracketSpan,
    bracketMinDegree: r.bracketMinDegree,
    bracketMaxDegree: r.bracketMaxDegree,
    connected: r.connected,
    reduced: r.reduced,
    alternating: r.alternating,
    adequate: r.adequate,
    aAdequate: r.aAdequate,
    bAdequate: r.bAdequate,
    stateCircles: { a: r.stateCircles.a, b: r.stateCircles.b },
    nugatory: [...r.nugatory],
    linking: r.linking.map((l) => ({ components: [l.components[0], l.components[1]] as const, value: l.value })),
    chiralityFixed: r.chiralityFixed,
    crossingNumber: {
      lower: r.crossingNumber.lower,
      upper: r.crossingNumber.upper,
      exact: r.crossingNumber.exact,
      reasons: r.crossingNumber.reasons.map((x) => ({ bound: x.bound, value: x.value, theorem: x.theorem, text: x.text })),
    },
    boundaryWidth: r.boundaryWidth,
    alexander: polynomialJson(r.classical.alexander, 't'),
    conway: polynomialJson(r.classical.conway, 'z'),
    determinant: r.classical.determinant.toString(),
    signature: signatureInConvention(r.classical.signature, convention.signatureSign),
    signatureSign: convention.signatureSign,
  };
}

export function invalidCodeJson(code: string, notation: Notation, error: InputError): InvalidCodeJson {
  return {
    code,
    notation,
    error: {
      ruleId: error.ruleId,
      message: error.message,
      span: error.span ? { start: error.span.start, end: error.span.end } : null,
      hints: [...error.hints],
    },
  };
}
