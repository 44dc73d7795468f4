/**
 * The claims layer: read an author's stated value, judge it against a
 * DiagramReport in the document's convention, diagnose the slip, and typeset
 * computed values. Types are in ./api.ts.
 */
import type { DiagramReport } from '../analyze/report.ts';
import type { Convention } from '../convention/convention.ts';
import type { FillKey, Typeset } from './api.ts';
import { FILL_KEYS, fillSpec } from '../invariants/registry/index.ts';
import type { TypesetOptions } from '../invariants/registry/types.ts';
import { requireApplicable } from './applicability.ts';

export type * from './api.ts';
export { judgeClaim, CLAIM_KEYS, isClaimKey } from './judge.ts';
export { parseClaimAssignment, type ClaimAssignment } from './assignment.ts';
export {
  judgementToDiagnostics,
  inputErrorDiagnostic,
  invalidCodeDiagnostic,
  unreadableClaimDiagnostic,
  CLAIM_RULES,
  CLAIM_NOUNS,
  choiceConflictDiagnostic,
} from './diagnostics.ts';
export { judgeDiagramClaims, type DiagramVerdicts, type ClaimOutcome } from './open-choices.ts';
export { readPolynomial, readNumber, UNREADABLE } from './latex-poly-parser.ts';
export { inapplicableBecause, isNotApplicableMark, NOT_APPLICABLE_MARKS } from './applicability.ts';
export { polynomialLatex, jonesLatex, bracketLatex, numberLatex } from './typeset.ts';
export { crossingNumberStatement, readCrossingNumberClaim, THEOREM_NAMES } from './crossing-number.ts';
export { claimKeyForHeader } from '../invariants/registry/index.ts';

/** Every fill key, for front ends that map labels to keys. */
export { FILL_KEYS };

export function isFillKey(word: string): boolean {
  return fillSpec(word) !== undefined;
}

/** The typeset value of `key` for the report, in the convention. Throws `claim-inapplicable` for a key the diagram has no value of. */
export function typesetValue(key: FillKey, report: DiagramReport, convention: Convention, options: TypesetOptions = {}): Typeset {
  const spec = fillSpec(key);
  if (!spec) throw new Error(`internal: no registered invariant declares the fill key \`${key}\``);
  requireApplicable(key, report);
  return spec.typeset(report, convention, options);
}
