/**
 * The claims layer: read an author's stated value, judge it against a
 * DiagramReport in the document's convention, diagnose the slip, and typeset
 * computed values. Types are in ./api.ts.
 */
import type { DiagramReport } from '../analyze/report.ts';
import type { Convention } from '../convention/convention.ts';
import type { FillKey, Typeset } from './api.ts';
import { bracketLatex, jonesLatex, numberLatex } from './typeset.ts';
import { conventionJones } from '../convention/convert.ts';
import { crossingNumberFill, crossingNumberStatement } from './crossing-number.ts';
import { classicalFill, genusStatement } from './classical-claims.ts';

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
} from './diagnostics.ts';
export { readPolynomial, readNumber, UNREADABLE } from './latex-poly-parser.ts';
export { polynomialLatex, jonesLatex, bracketLatex, numberLatex } from './typeset.ts';
export { crossingNumberStatement, readCrossingNumberClaim, THEOREM_NAMES } from './crossing-number.ts';

/** Every fill key, for front ends that map labels to keys. */
export const FILL_KEYS: readonly FillKey[] = [
  'jones', 'bracket', 'span', 'writhe', 'crossings', 'components', 'crossing-number', 'statement', 'alexander', 'conway', 'determinant', 'signature', 'genus',
];

export function isFillKey(word: string): word is FillKey {
  return (FILL_KEYS as readonly string[]).includes(word);
}

/** The typeset value of `key` for the report, in the convention. */
export function typesetValue(key: FillKey, report: DiagramReport, convention: Convention): Typeset {
  switch (key) {
    case 'jones':
      return { kind: 'math', latex: jonesLatex(report, convention) };
    case 'bracket':
      return { kind: 'math', latex: bracketLatex(report, convention) };
    case 'span':
      return { kind: 'math', latex: numberLatex(conventionJones(report.jones, convention).span) };
    case 'writhe':
      return { kind: 'math', latex: numberLatex(report.writhe) };
    case 'crossings':
      return { kind: 'math', latex: numberLatex(report.crossings) };
    case 'components':
      return { kind: 'math', latex: numberLatex(report.components) };
    case 'crossing-number':
      return crossingNumberFill(report);
    case 'statement':
      return { kind: 'text', text: crossingNumberStatement(report, convention) };
    case 'alexander':
    case 'conway':
    case 'determinant':
    case 'signature':
      return classicalFill(key, report, convention);
    case 'genus':
      return genusStatement(report);
  }
}
