import { afterEach, describe, expect, it } from 'vitest';
import { wantsColor } from '../../src/cli/terminal.ts';

// The NO_COLOR convention: a non-empty NO_COLOR turns colour off (common practice among command-line tools).
describe('colour in reports', () => {
  const saved = process.env.NO_COLOR;
  afterEach(() => {
    if (saved === undefined) delete process.env.NO_COLOR;
    else process.env.NO_COLOR = saved;
  });
  it('is used on a terminal only', () => {
    delete process.env.NO_COLOR;
    expect(wantsColor({ isTTY: true })).toBe(true);
    expect(wantsColor({ isTTY: false })).toBe(false);
    expect(wantsColor({})).toBe(false);
  });
  it('is off when NO_COLOR is set to anything non-empty', () => {
    process.env.NO_COLOR = '1';
    expect(wantsColor({ isTTY: true })).toBe(false);
    process.env.NO_COLOR = '';
    expect(wantsColor({ isTTY: true })).toBe(true);
  });
});
