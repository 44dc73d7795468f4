/**
 * The modular bracket engine with a helper thread lent by the command line
 * (src/cli/replay-helper.ts), and with helpers that fail or lie: the value is
 * the same as the single-threaded engines', a helper that dies costs time,
 * and wrong residues are caught by the check modulo a further number (an
 * internal error), never returned as a value. The values are also held to
 * published facts about alternating diagrams: V(1) = (−2)^(μ−1) (Jones 1985)
 * and span V = crossings for a reduced alternating diagram (Kauffman 1987,
 * Murasugi 1987, Thistlethwaite 1987).
 */
import { afterEach, describe, expect, it } from 'vitest';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { componentCount, writhe, type LinkDiagram } from '../../src/core/diagram/model.ts';
import { modulus, recordContraction, replayModulo, slabsFor } from '../../src/core/invariants/bracket-modular.ts';
import { lendReplayHelper, type ReplayHelper } from '../../src/core/helper-threads.ts';
import { kauffmanBracket, planSteps } from '../../src/core/invariants/bracket.ts';
import { planContraction } from '../../src/core/invariants/crossing-order.ts';
import { jonesFromBracket } from '../../src/core/invariants/jones.ts';
import { isLimitError, withTimeBudget } from '../../src/core/limits.ts';
import { threadReplayHelper } from '../../src/cli/replay-helper.ts';
import { randomAlternatingBraidWord, rng } from '../support/random-diagrams.ts';

/** A reduced alternating closure: every generator of the word occurs, and with one sign each. */
function alternatingClosure(seed: number, strands: number, crossings: number): LinkDiagram {
  return closeBraid(randomAlternatingBraidWord(rng(seed), strands, crossings), strands);
}

afterEach(() => lendReplayHelper(undefined));

describe('the bracket by moduli with a helper thread', () => {
  const d = alternatingClosure(31, 6, 240);
  const expected = kauffmanBracket(d, undefined, {}, 'digits').bracket;

  it('replays in its thread exactly what this thread would (every modulus left to it)', () => {
    const steps = planSteps(d, planContraction(d).order);
    const record = recordContraction(steps, 4, 2 ** 30);
    if (record === undefined || record === 'too-large') throw new Error('recording failed');
    const moduli = [modulus(0), modulus(1), modulus(2)];
    const share = threadReplayHelper().begin(record, moduli);
    const fromHelper = share.wait();
    const slabs = slabsFor(record);
    expect(fromHelper?.map((r) => (r ? Array.from(r) : undefined))).toEqual(moduli.map((m) => Array.from(replayModulo(record, m, slabs))));
  }, 60_000);

  it('gives the digit engine’s bracket when lent to the engine', () => {
    lendReplayHelper(threadReplayHelper());
    const bracket = kauffmanBracket(d, undefined, {}, 'moduli').bracket;
    expect(bracket.equals(expected)).toBe(true);
    const jones = jonesFromBracket(bracket, writhe(d));
    expect(jones.valueAtOne()).toBe((-2n) ** BigInt(componentCount(d) - 1));
    expect(jones.span).toBe(d.crossings.length);
  }, 60_000);

  it('redoes the share of a helper that fails, and of one that claims moduli and never delivers them', () => {
    const failing: ReplayHelper = {
      begin: (_record, moduli) => {
        let next = 0;
        return { claim: () => (next < moduli.length ? next++ : undefined), wait: () => undefined, abandon: () => undefined };
      },
    };
    lendReplayHelper(failing);
    expect(kauffmanBracket(d, undefined, {}, 'moduli').bracket.equals(expected)).toBe(true);
    const greedy: ReplayHelper = {
      begin: (_record, moduli) => ({ claim: () => undefined, wait: () => moduli.map(() => undefined), abandon: () => undefined }),
    };
    lendReplayHelper(greedy);
    expect(kauffmanBracket(d, undefined, {}, 'moduli').bracket.equals(expected)).toBe(true);
  });

  it('refuses to answer when a helper returns wrong residues (the check modulo a further number)', () => {
    const lying: ReplayHelper = {
      begin: (record, moduli) => {
        let next = 0;
        return {
          // This thread replays the first modulus; the helper "replays" the rest, all wrong.
          claim: () => (next === 0 ? next++ : undefined),
          wait: () => moduli.map((_, k) => (k === 0 ? undefined : new Int32Array(record.length).fill(1))),
          abandon: () => undefined,
        };
      },
    };
    lendReplayHelper(lying);
    expect(() => kauffmanBracket(d, undefined, {}, 'moduli')).toThrow(/internal: the bracket lifted from its residues failed the check/);
  });

  it('stops at the time budget while the helper works, and a later bracket starts a new helper', () => {
    lendReplayHelper(threadReplayHelper());
    const big = alternatingClosure(7, 8, 500);
    let error: unknown;
    try {
      withTimeBudget(200, 'its Kauffman bracket', () => kauffmanBracket(big, undefined, {}, 'moduli'));
    } catch (caught) {
      error = caught;
    }
    expect(isLimitError(error)).toBe(true);
    expect(kauffmanBracket(d, undefined, {}, 'moduli').bracket.equals(expected)).toBe(true);
  }, 60_000);
});
