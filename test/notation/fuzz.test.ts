/**
 * Property-based fuzzing (fast-check): random strings and random token
 * mutations of valid codes either parse into a well-formed planar diagram or
 * are refused with a located InputError, never any other exception.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { nonPlanarPieces } from '../../src/core/diagram/faces.ts';
import { structuralProblem, type Notation } from '../../src/core/diagram/model.ts';
import { isInputError } from '../../src/core/errors.ts';
import { parseDiagramCode, printDtCode, printGaussCode, printPdCode } from '../../src/core/notation/index.ts';
import { randomBraidWord, randomDiagram, randomInt, rng } from '../support/random-diagrams.ts';

/** Parses and checks the outcome is one of the two allowed ones. */
function parseSafely(text: string, notation: Notation, strands?: number): void {
  try {
    const d = parseDiagramCode(text, notation, strands === undefined ? undefined : { strands });
    expect(structuralProblem(d)).toBeUndefined();
    expect(nonPlanarPieces(d)).toEqual([]);
  } catch (e) {
    if (!isInputError(e)) throw e;
    expect(e.ruleId).toBe('code-invalid');
    expect(e.span).toBeDefined();
    expect(e.span!.start).toBeGreaterThanOrEqual(0);
    expect(e.span!.end).toBeLessThanOrEqual(text.length);
    expect(e.span!.start).toBeLessThanOrEqual(e.span!.end);
  }
}

/** Valid codes of every notation, printed from random diagrams. */
function validCodes(notation: Notation, count: number): string[] {
  const random = rng(notation.length * 1000 + 17);
  const codes: string[] = [];
  while (codes.length < count) {
    if (notation === 'family') {
      const n = () => randomInt(random, -7, 7) || 1;
      const templates = [
        () => `torus ${n()} ${n()}`,
        () => `pretzel ${n()} ${n()} ${n()}`,
        () => `montesinos ${n()}/${randomInt(random, 1, 5)} ${n()}/3 ${n()}`,
        () => `two-bridge ${2 * randomInt(random, 1, 9) + 1}/2`,
        () => `twist ${n()}`,
        () => `sum (torus 2 ${n()}) (mirror (twist ${n()}))`,
        () => `split (pretzel ${n()} ${n()}) (two-bridge 5/${randomInt(random, 1, 4)})`,
      ];
      codes.push(templates[randomInt(random, 0, templates.length - 1)]!());
      continue;
    }
    if (notation === 'braid') {
      const strands = randomInt(random, 2, 5);
      codes.push(randomBraidWord(random, strands, randomInt(random, 1, 10)).join(' '));
      continue;
    }
    const d = randomDiagram(random, 10, 4);
    if (notation === 'gauss') codes.push(printGaussCode(d));
    else if (notation === 'pd' && d.freeLoops === 0) codes.push(printPdCode(d));
    else if (notation === 'dt' && d.components.length === 1 && d.freeLoops === 0) codes.push(printDtCode(d));
  }
  return codes;
}

/** Tokens of a code: numbers (with a sign), letters+digits, and single other characters. */
function tokenize(code: string): string[] {
  return code.match(/[+-]?\d+|[a-zA-Z]+\d*[+-]?|\s+|./g) ?? [];
}

type Mutation = { kind: 'delete' | 'duplicate' | 'swap' | 'replace'; at: number; other: number; replacement: string };

function mutate(tokens: string[], m: Mutation): string {
  const t = [...tokens];
  if (t.length === 0) return m.replacement;
  const i = m.at % t.length;
  const j = m.other % t.length;
  if (m.kind === 'delete') t.splice(i, 1);
  else if (m.kind === 'duplicate') t.splice(i, 0, t[i]!);
  else if (m.kind === 'swap') [t[i], t[j]] = [t[j]!, t[i]!];
  else t[i] = m.replacement;
  return t.join('');
}

const replacement = fc.constantFrom('0', '1', '-1', '2', '-2', '3', '7', '12', '-13', '99', '1e3', '2.5', 'o1', 'u2+', 'o3-', '(', ')', '[', ']', ',', ' ', '', 'x', '+', '-', '()', '00', '9007199254740993');
const mutation = fc.record({
  kind: fc.constantFrom<Mutation['kind']>('delete', 'duplicate', 'swap', 'replace'),
  at: fc.nat(200),
  other: fc.nat(200),
  replacement,
});
const NOTATION_LIST: Notation[] = ['pd', 'braid', 'gauss', 'dt', 'family'];
const ALPHABET: Record<Notation, string[]> = {
  pd: ['(', ')', '[', ']', ',', ' ', '\n', '1', '2', '3', '4', '5', '6', '-', '\u2212', '0', 'a'],
  braid: [' ', ',', '1', '2', '3', '-', '\u2212', '+', '0', '.', 'x', '\t', '[', ']', '('],
  gauss: ['o', 'u', 'O', 'U', '1', '2', '3', '4', '+', '-', '\u2212', '(', ')', ' ', ',', 'x'],
  dt: [' ', ',', '2', '4', '6', '8', '1', '0', '-', '\u2212', '+', 'a', '1', '2', '[', ']', '(', ')'],
  family: ['torus ', 'pretzel ', 'montesinos ', 'two-bridge ', 'twist ', 'mirror ', 'sum ', 'split ', '(', ')', ' ', ',', '/', '1', '2', '3', '-', '\u2212', '0', 'x'],
};

describe('fuzzing the parsers', () => {
  for (const notation of NOTATION_LIST) {
    it(`${notation}: arbitrary strings give a diagram or an InputError`, () => {
      fc.assert(
        fc.property(fc.oneof(fc.string({ maxLength: 40 }), fc.array(fc.constantFrom(...ALPHABET[notation]), { maxLength: 40 }).map((a) => a.join(''))), (text) => {
          parseSafely(text, notation);
        }),
        { numRuns: 400, seed: 42 },
      );
    });

    it(`${notation}: mutations of valid codes give a diagram or an InputError`, () => {
      const codes = validCodes(notation, 40).map(tokenize);
      fc.assert(
        fc.property(fc.nat(codes.length - 1), fc.array(mutation, { minLength: 1, maxLength: 3 }), fc.option(fc.integer({ min: -1, max: 8 })), (k, mutations, strands) => {
          let text = codes[k]!.join('');
          for (const m of mutations) text = mutate(tokenize(text), m);
          parseSafely(text, notation, notation === 'braid' && strands !== null ? strands : undefined);
        }),
        { numRuns: 400, seed: 7 },
      );
    });
  }

  it('accepts every unmutated valid code', () => {
    for (const notation of NOTATION_LIST) for (const code of validCodes(notation, 20)) expect(() => parseDiagramCode(code, notation)).not.toThrow();
  });
});
