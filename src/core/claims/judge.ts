/**
 * judgeClaim: one entry point from a claim key and the author's text to a
 * verdict. Unreadable text throws an InputError (`claim-unreadable`) whose
 * span points into the claim text.
 */
import type { DiagramReport } from '../analyze/report.ts';
import type { ClaimKey, JudgeContext, Judgement } from './api.ts';
import { judgePolynomialClaim } from './polynomial-claims.ts';
import { judgeNumberClaim, judgePropertyClaim } from './scalar-claims.ts';
import { judgeCrossingNumberClaim } from './crossing-number.ts';
import { judgeClassicalClaim } from './classical-claims.ts';

export function judgeClaim(key: ClaimKey, text: string, report: DiagramReport, ctx: JudgeContext): Judgement {
  switch (key) {
    case 'jones':
    case 'bracket':
      return judgePolynomialClaim(key, text, report, ctx);
    case 'span':
    case 'bracket-span':
    case 'min-degree':
    case 'max-degree':
    case 'writhe':
    case 'crossings':
    case 'components':
    case 'linking':
      return judgeNumberClaim(key, text, report, ctx);
    case 'alternating':
    case 'reduced':
    case 'adequate':
      return judgePropertyClaim(key, text, report);
    case 'crossing-number':
      return judgeCrossingNumberClaim(text, report);
    case 'alexander':
    case 'conway':
    case 'determinant':
    case 'signature':
      return judgeClassicalClaim(key, text, report, ctx);
  }
}

/** Every claim key, for front ends that map labels to keys and for messages listing them. */
export const CLAIM_KEYS: readonly ClaimKey[] = [
  'jones', 'bracket', 'span', 'bracket-span', 'min-degree', 'max-degree', 'writhe', 'crossings', 'components', 'linking',
  'alternating', 'reduced', 'adequate', 'crossing-number', 'alexander', 'conway', 'determinant', 'signature',
];

export function isClaimKey(word: string): word is ClaimKey {
  return (CLAIM_KEYS as readonly string[]).includes(word);
}
