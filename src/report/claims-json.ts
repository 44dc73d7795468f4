/**
 * Claims as JSON data for tools (`compute --json`): the verdict words and the
 * diagnosis exactly as the claims layer names them.
 */
import type { Diagnosis, Judgement } from '../core/claims/api.ts';
import type { InputError } from '../core/errors.ts';
import type { TextSpan } from '../core/diagnostics/diagnostic.ts';

export interface JudgementJson {
  readonly key: string;
  readonly claimed: string;
  readonly verdict: Judgement['verdict'];
  readonly diagnosis: Diagnosis | null;
  readonly reason: string;
  readonly computed: string;
  readonly theorem: string | null;
  readonly warning: string | null;
}

export function judgementJson(j: Judgement): JudgementJson {
  return {
    key: j.key,
    claimed: j.claimed,
    verdict: j.verdict,
    diagnosis: j.diagnosis ?? null,
    reason: j.reason,
    computed: j.computed,
    theorem: j.theorem ?? null,
    warning: j.warning ?? null,
  };
}

export interface UnreadableClaimJson {
  readonly key: string;
  readonly claimed: string;
  readonly error: { readonly ruleId: string; readonly message: string; readonly span: TextSpan | null; readonly hints: readonly string[] };
}

export function unreadableClaimJson(key: string, claimed: string, error: InputError): UnreadableClaimJson {
  return { key, claimed, error: { ruleId: error.ruleId, message: error.message, span: error.span ?? null, hints: error.hints } };
}
