/**
 * `KEY=VALUE` claims as written on a command line (`jones=t+t^3-t^4`,
 * `crossing-number=<=7`): the key, the value, and where the value starts so
 * that errors inside it point at the right character.
 */
import { InputError } from '../errors.ts';
import type { ClaimKey } from './api.ts';
import { CLAIM_KEYS, isClaimKey } from './judge.ts';

export interface ClaimAssignment {
  readonly key: ClaimKey;
  readonly value: string;
  /** Offset of the value in the assignment text. */
  readonly valueOffset: number;
  /** The assignment as written. */
  readonly text: string;
}

export function parseClaimAssignment(text: string): ClaimAssignment {
  const eq = text.indexOf('=');
  if (eq < 0) {
    throw new InputError('claim-malformed', `the claim \`${text}\` has no \`=\`: write it as KEY=VALUE, e.g. jones=t+t^3-t^4`, { start: 0, end: text.length });
  }
  // Keys are case-insensitive, and `crossing_number` or `crossing number` mean `crossing-number`.
  const key = text.slice(0, eq).trim().toLowerCase().replace(/[\s_]+/g, '-');
  if (!isClaimKey(key)) {
    throw new InputError('claim-malformed', `unknown claim key \`${text.slice(0, eq)}\`: the keys are ${CLAIM_KEYS.join(', ')}`, { start: 0, end: eq });
  }
  return { key, value: text.slice(eq + 1), valueOffset: eq + 1, text };
}
