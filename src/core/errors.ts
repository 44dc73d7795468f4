/**
 * The error raised for bad user input anywhere in the core (a malformed
 * diagram code, an unreadable claim). It carries the place in the text the
 * user wrote, so front ends can turn it into a located diagnostic. Anything
 * else thrown from the core is a bug.
 */
import type { TextSpan } from './diagnostics/diagnostic.ts';

export class InputError extends Error {
  override readonly name = 'InputError';
  constructor(
    /** Stable rule id, e.g. `code-invalid`, `claim-unreadable`. */
    readonly ruleId: string,
    /** What is wrong, where (token or tuple number), and how to fix it. */
    message: string,
    /** Where in the code or claim text, 0-based offsets; absent when the whole text is at fault. */
    readonly span?: TextSpan,
    readonly hints: readonly string[] = [],
  ) {
    super(message);
  }
}

export function isInputError(e: unknown): e is InputError {
  return e instanceof InputError;
}
