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

/** Claim keys whose values skeinproof does not compute yet: such claims are `undecided`, never silently passed. */
const NOT_COMPUTED: Readonly<Partial<Record<ClaimKey, string>>> = {
  alexander: 'the Alexander polynomial',
  conway: 'the Conway polynomial',
  determinant: 'the determinant',
  signature: 'the signature',
};

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
      return {
        key,
        claimed: text,
        verdict: 'undecided',
        computed: '',
        reason: `${NOT_COMPUTED[key]} is not computed by this version of skeinproof, so the claim is not checked`,
      };
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
