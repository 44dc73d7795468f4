/**
 * Limits, never a hang: codes over the crossing limit are refused before they
 * are parsed, a bracket whose tangle states would not fit is refused before it
 * starts, and a computation over its time budget stops between steps. Each is
 * a `limit-exceeded` input error that names the size and the option raising it.
 */
import { describe, expect, it } from 'vitest';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { kauffmanBracket } from '../../src/core/invariants/bracket.ts';
import { classicalInvariantsWithin } from '../../src/core/invariants/classical/index.ts';
import { isLimitError, withTimeBudget } from '../../src/core/limits.ts';
import { parseDiagramCode } from '../../src/core/notation/index.ts';
import { printGaussCode, printPdCode } from '../../src/core/notation/print.ts';
import { randomAlternatingBraidWord, randomBraidWord, rng } from '../support/random-diagrams.ts';

function thrown(work: () => unknown): Error {
  try {
    work();
  } catch (error) {
    return error as Error;
  }
  throw new Error('expected a limit error, but the work finished');
}

describe('the crossing limit caps the length of every notation', () => {
  const braid = Array.from({ length: 30_000 }, (_, i) => (i % 2 === 0 ? '1' : '-2')).join(' ');

  it('refuses a 30,000-letter braid word at once, naming its size and the option', () => {
    const error = thrown(() => parseDiagramCode(braid, 'braid', { maxCrossings: 1000 }));
    expect(isLimitError(error)).toBe(true);
    expect(error.message).toContain('30,000 crossings');
    expect(error.message).toContain('--max-crossings 30000');
  });

  it('counts PD tuples and Gauss visits as the crossings they write', () => {
    const d = closeBraid(randomBraidWord(rng(5), 4, 40), 4);
    expect(isLimitError(thrown(() => parseDiagramCode(printPdCode(d), 'pd', { maxCrossings: 39 })))).toBe(true);
    expect(isLimitError(thrown(() => parseDiagramCode(printGaussCode(d), 'gauss', { maxCrossings: 39 })))).toBe(true);
    // At the limit the code is read as usual.
    expect(parseDiagramCode(printPdCode(d), 'pd', { maxCrossings: 40 }).crossings).toHaveLength(40);
    expect(parseDiagramCode(printGaussCode(d), 'gauss', { maxCrossings: 40 }).crossings).toHaveLength(40);
  });
});

describe('the state-memory estimate', () => {
  it('refuses a width-26 braid of 1,000 letters before contracting (it once reached 9.1 GB)', () => {
    const d = closeBraid(randomBraidWord(rng(3), 14, 1000), 14);
    const error = thrown(() => kauffmanBracket(d, undefined, { maxStateBytes: 1024 ** 3 }));
    expect(isLimitError(error)).toBe(true);
    expect(error.message).toMatch(/keeps up to \d+ edge ends open/);
    expect(error.message).toMatch(/about [\d.]+ GiB/);
    expect(error.message).toContain('--max-state-memory');
  });

  it('lets thin diagrams through: the bracket is the same with and without the limit', () => {
    const d = closeBraid(randomAlternatingBraidWord(rng(8), 4, 120), 4);
    expect(kauffmanBracket(d, undefined, { maxStateBytes: 64 * 1024 ** 2 }).bracket.equals(kauffmanBracket(d).bracket)).toBe(true);
  });
});

describe('the time budget', () => {
  const d = closeBraid(randomAlternatingBraidWord(rng(11), 5, 200), 5);

  it('stops the bracket between steps and names the option', () => {
    // Reports are lazy: the bracket is computed (and stopped) when it is first read, and a second read gets the same error.
    const report = analyzeDiagram(closeBraid(randomAlternatingBraidWord(rng(12), 5, 200), 5), { timeBudgetMs: 0 });
    const error = thrown(() => report.bracket);
    expect(isLimitError(error)).toBe(true);
    expect(error.message).toContain('its Kauffman bracket');
    expect(error.message).toContain('--time-budget');
    expect(thrown(() => report.jones)).toBe(error);
  });

  it('stops each classical invariant on its own, and a second read gives the same error at once', () => {
    const classical = classicalInvariantsWithin(d, 0);
    const error = thrown(() => classical.alexander);
    expect(isLimitError(error)).toBe(true);
    expect(error.message).toContain('its Alexander polynomial');
    expect(thrown(() => classical.alexander)).toBe(error);
    expect(thrown(() => classical.determinant).message).toContain('its determinant');
  });

  it('does not touch a computation that finishes in time', () => {
    expect(withTimeBudget(60_000, 'x', () => analyzeDiagram(d).bracket.equals(kauffmanBracket(d).bracket))).toBe(true);
  });
});
