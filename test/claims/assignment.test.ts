/**
 * `KEY=VALUE` claims as typed on a command line (the form is common practice
 * for command-line settings): the key, the value and where the value starts.
 */
import { describe, expect, it } from 'vitest';
import { parseClaimAssignment } from '../../src/core/claims/index.ts';
import { InputError } from '../../src/core/errors.ts';

function refused(text: string): InputError {
  try {
    parseClaimAssignment(text);
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return e as InputError;
  }
  throw new Error(`expected \`${text}\` to be refused`);
}

describe('parseClaimAssignment', () => {
  it('splits at the first =, so the value may hold a left-hand side of its own', () => {
    expect(parseClaimAssignment('jones=V(t) = t + t^3 - t^4')).toEqual({
      key: 'jones',
      value: 'V(t) = t + t^3 - t^4',
      valueOffset: 6,
      text: 'jones=V(t) = t + t^3 - t^4',
    });
  });
  it('reads keys case-insensitively, with spaces around them, and with _ or a space for -', () => {
    expect(parseClaimAssignment(' Jones = t').key).toBe('jones');
    expect(parseClaimAssignment('crossing_number=3').key).toBe('crossing-number');
    expect(parseClaimAssignment('Crossing Number=\\le 3').key).toBe('crossing-number');
    expect(parseClaimAssignment('min_degree=1').valueOffset).toBe(11);
  });
  it('refuses a claim without = and an unknown key, naming the keys', () => {
    const noEquals = refused('jones t+t^3');
    expect(noEquals.ruleId).toBe('claim-malformed');
    expect(noEquals.message).toMatch(/has no `=`/);
    const unknown = refused('colour=3');
    expect(unknown.ruleId).toBe('claim-malformed');
    expect(unknown.message).toMatch(/unknown claim key `colour`: the keys are jones, bracket/);
    expect(unknown.span).toEqual({ start: 0, end: 6 });
  });
});
