/**
 * A character that prints as nothing (copied text brings zero-width spaces,
 * joiners, soft hyphens and direction marks along) is named in the error with
 * its code point and Unicode name (Unicode Character Database), in every notation.
 */
import { describe, expect, it } from 'vitest';
import type { Notation } from '../../src/core/diagram/model.ts';
import { parseError } from './helpers.ts';

describe('invisible characters in a code', () => {
  const cases: [Notation, string][] = [
    ['braid', '1 1\u200B 1'],
    ['pd', '(4,2\u200B,5,1) (2,6,3,5) (6,4,1,3)'],
    ['dt', '4 6\u200B 2'],
    ['gauss', 'o1+ u2+\u200B o3+ u1+ o2+ u3+'],
  ];
  for (const [notation, code] of cases) {
    it(`names a zero-width space in a ${notation} code`, () => {
      expect(parseError(code, notation).message).toContain('U+200B ZERO WIDTH SPACE');
    });
  }

  it('names each invisible character of a token once', () => {
    const message = parseError('1 \u2060\u00AD1\u2060 1', 'braid').message;
    expect(message).toContain('invisible characters U+2060 WORD JOINER, U+00AD SOFT HYPHEN: delete them');
  });
});
