/**
 * judgeClaim: one entry point from a claim key and the author's text to a
 * verdict, through the registered invariant that declares the key.
 * Unreadable text throws an InputError (`claim-unreadable`) whose span points
 * into the claim text.
 */
import type { DiagramReport } from '../analyze/report.ts';
import type { ClaimKey, JudgeContext, Judgement } from './api.ts';
import { CLAIM_KEYS, claimSpec } from '../invariants/registry/index.ts';

export function judgeClaim(key: ClaimKey, text: string, report: DiagramReport, ctx: JudgeContext): Judgement {
  const spec = claimSpec(key);
  if (!spec) throw new Error(`internal: no registered invariant declares the claim key \`${key}\``);
  return spec.judge(text, report, ctx);
}

/** Every claim key, for front ends that map labels to keys and for messages listing them. */
export { CLAIM_KEYS };

export function isClaimKey(word: string): boolean {
  return claimSpec(word) !== undefined;
}
