/**
 * Turning verdicts and input errors into located diagnostics.
 *
 * Rule ids (our own):
 *   claim-contradicted  error    the stated value is refuted by the computation
 *   claim-undecided     warning  the proven bounds do not settle a crossing-number claim
 *   claim-cited         note     no theorem settles it, and the claim rests on the source the author cites
 *   claim-mirror-only   warning  the claim holds for the mirror image only, and the code (DT) cannot tell them apart
 *   claim-choice-open   warning  the claim holds only for a realisation of a DT code with another kink sign or part chirality
 *   claim-choice-conflict error  two claims about one DT diagram need different realisations (see ./open-choices.ts)
 *   claim-unreadable    error    the claimed value cannot be read
 *   claim-inapplicable  error    the claim makes no sense for this diagram (a linking number of a knot)
 *   claim-malformed     error    a command-line claim is not KEY=VALUE with a known key (see ./assignment.ts)
 *   code-invalid        error    a diagram code cannot be parsed (raised by the notation parsers)
 */
import type { InputError } from '../errors.ts';
import type { Diagnostic, SourceLocation, TextSpan } from '../diagnostics/diagnostic.ts';
import type { ClaimKey, DiagnosisKind, Judgement } from './api.ts';
import { CLAIM_KEYS, claimSpec } from '../invariants/registry/index.ts';

export const CLAIM_RULES = {
  contradicted: 'claim-contradicted',
  undecided: 'claim-undecided',
  cited: 'claim-cited',
  mirrorOnly: 'claim-mirror-only',
  choiceOpen: 'claim-choice-open',
  choiceConflict: 'claim-choice-conflict',
  unreadable: 'claim-unreadable',
  inapplicable: 'claim-inapplicable',
  codeInvalid: 'code-invalid',
} as const;

/** The invariant of each claim key in words, from the registry. */
export const CLAIM_NOUNS: Readonly<Record<ClaimKey, string>> = Object.fromEntries(CLAIM_KEYS.map((key) => [key, claimSpec(key)!.noun]));

/** What to do about each slip, one sentence; the slip itself is named in the message. */
const FIX_HINTS: Readonly<Record<DiagnosisKind, (j: Judgement) => string | undefined>> = {
  mirror: () => 'Check the handedness: either the code or the value belongs to the mirror image.',
  negated: () => 'Check the overall sign of the value.',
  shifted: (j) =>
    j.key === 'alexander'
      ? 'Multiply by the power of t that makes Δ symmetric, Δ(t) = Δ(t⁻¹) (Conway’s normalisation).'
      : 'Recheck the writhe factor (−A³)^{−w} and the normalisation of the unknot.',
  normalization: () => 'Rewrite the value in the convention the document declares, or declare the convention it is written in.',
  'one-coefficient': (j) => (j.diagnosis?.term ? `Correct that one coefficient to ${j.diagnosis.term.computed}.` : undefined),
  'one-exponent': (j) => (j.diagnosis?.exponent ? `Correct that exponent to ${j.diagnosis.exponent.computed}.` : undefined),
  swapped: (j) => `The value belongs to \`${j.diagnosis?.otherDiagram}\`: check which diagram the claim is attached to.`,
  none: () => 'No common slip explains the difference: recheck the whole value rather than one term or sign.',
};

function claimData(j: Judgement): Record<string, unknown> {
  return {
    key: j.key,
    verdict: j.verdict,
    ...(j.diagnosis ? { diagnosis: { ...j.diagnosis } } : {}),
    ...(j.theorem ? { theorem: j.theorem } : {}),
    ...(j.source !== undefined ? { source: j.source } : {}),
  };
}

function where(location: SourceLocation | undefined) {
  return location ? { location } : {};
}

/**
 * The diagnostics for one judgement: none when it agrees plainly; one error
 * when contradicted (its hint says what to recheck, also when no slip explains
 * it); a warning when undecided or agreeing only up to mirror image.
 * `context` (e.g. "row 3, column V") prefixes the message.
 */
export function judgementToDiagnostics(j: Judgement, location?: SourceLocation, context?: string): Diagnostic[] {
  const noun = CLAIM_NOUNS[j.key];
  const prefix = context ? `${context}: ` : '';
  const shared = { ...where(location), claimed: j.claimed, computed: j.computed, data: claimData(j) };
  if (j.verdict === 'agrees') {
    if (!j.warning) return [];
    if (j.diagnosis?.kind === 'mirror') {
      return [{ severity: 'warning', ruleId: CLAIM_RULES.mirrorOnly, message: `${prefix}${noun} holds only up to mirror image: ${j.warning}`, ...shared }];
    }
    return [{ severity: 'warning', ruleId: CLAIM_RULES.choiceOpen, message: `${prefix}${noun} holds only for one realisation of the DT code: ${j.warning}`, ...shared }];
  }
  if (j.verdict === 'cited') {
    return [{ severity: 'note', ruleId: CLAIM_RULES.cited, message: `${prefix}${noun} claim rests on a cited source: ${j.reason}`, ...shared }];
  }
  if (j.verdict === 'undecided') {
    return [{ severity: 'warning', ruleId: CLAIM_RULES.undecided, message: `${prefix}${noun} claim undecided: ${j.reason}`, ...shared }];
  }
  const hint = j.diagnosis ? FIX_HINTS[j.diagnosis.kind](j) : undefined;
  const hints = hint ? [hint] : [];
  const error: Diagnostic = {
    severity: 'error',
    ruleId: CLAIM_RULES.contradicted,
    message: `${prefix}wrong ${noun}: ${j.reason}`,
    ...shared,
    hints,
  };
  return [error];
}

/** A diagnostic for bad input (unreadable claim, invalid code), located through the caller's locator. */
export function inputErrorDiagnostic(err: InputError, locate?: (span?: TextSpan) => SourceLocation, context?: string): Diagnostic {
  const location = locate?.(err.span);
  return {
    severity: 'error',
    ruleId: err.ruleId,
    message: context ? `${context}: ${err.message}` : err.message,
    ...where(location),
    ...(err.hints.length > 0 ? { hints: [...err.hints] } : {}),
  };
}

/** An invalid diagram code; `diagramId` names the diagram in the message. */
export function invalidCodeDiagnostic(err: InputError, locateCode?: (span?: TextSpan) => SourceLocation, diagramId?: string): Diagnostic {
  return inputErrorDiagnostic(err, locateCode, diagramId !== undefined ? `diagram \`${diagramId}\`` : undefined);
}

/** An unreadable claim; `context` (e.g. "row 3, column V") prefixes the message. */
export function unreadableClaimDiagnostic(err: InputError, locate?: (span?: TextSpan) => SourceLocation, context?: string): Diagnostic {
  return inputErrorDiagnostic(err, locate, context);
}

/**
 * A claim about a DT diagram that holds only in another realisation of its code than one the document's
 * other claims need. `subject` names the claim, `otherPlace` where the other claim is.
 */
export function choiceConflictDiagnostic(
  conflict: { readonly judgement: Judgement; readonly detail: string },
  subject: string,
  other: { readonly key: ClaimKey; readonly place: string },
  diagramName: string,
  location?: SourceLocation,
): Diagnostic {
  return {
    severity: 'error',
    ruleId: CLAIM_RULES.choiceConflict,
    message: `${subject}: this value and the ${CLAIM_NOUNS[other.key]} claimed at ${other.place} need different realisations of the DT code of ${diagramName}: ${conflict.detail}, where the other claim fails. A DT code leaves each part's chirality and each kink's sign open, but one document reads each diagram one way`,
    ...where(location),
    claimed: conflict.judgement.claimed,
    computed: conflict.judgement.computed,
    hints: ['Check which value belongs to the knot as drawn; to state values of two chiralities, give each its own diagram (with part-signs="…" to fix each).'],
    data: { key: conflict.judgement.key, verdict: 'contradicts', conflictsWith: other.place },
  };
}
