/**
 * Every class of bad input gets a code-invalid InputError that names the
 * token or tuple at fault and spans it (0-based offsets into the code text).
 */
import { describe, expect, it } from 'vitest';
import { MAX_COMPONENTS, parseDiagramCode } from '../../src/core/notation/index.ts';
import { expectCodeError, jonesByStateSum, parseError, poly } from './helpers.ts';

describe('PD code errors', () => {
  it('refuses an empty code, spanning the whole text', () => {
    for (const text of ['', '  \n ', ' , ']) expectCodeError(parseError(text, 'pd'), text, text, ['PD code is empty', 'crossingless', 'Gauss code "()"']);
  });
  it('names a label that is not a number, by tuple and entry', () => {
    const text = '(4,2,5,1) (2,x,3,5) (6,4,1,3)';
    expectCodeError(parseError(text, 'pd'), text, 'x', ['Tuple 2, entry 2', '"x"', 'whole numbers']);
    const frac = '(4,2.5,5,1)';
    expectCodeError(parseError(frac, 'pd'), frac, '2.5', ['Tuple 1, entry 2', '"2.5"']);
  });
  it('names a tuple of the wrong length and spans it', () => {
    const short = '(4,2,5,1) (2,6,3,5) (6,4,1)';
    expectCodeError(parseError(short, 'pd'), short, '(6,4,1)', ['Tuple 3 has 3 labels', 'exactly 4']);
    const long = '(4,2,5,1,7) (2,6,3,5) (6,4,1,3)';
    expectCodeError(parseError(long, 'pd'), long, '(4,2,5,1,7)', ['Tuple 1 has 5 labels']);
  });
  it('names a label used once, at its occurrence', () => {
    const text = '(4,2,5,1) (2,6,3,5) (6,4,1,7)';
    expectCodeError(parseError(text, 'pd'), text, '3', ['Edge label 3 appears only once', 'tuple 2', 'exactly twice']);
  });
  it('names a label used three times, at its third occurrence', () => {
    const text = '(1,1,2,2) (1,3,4,3)';
    expectCodeError(parseError(text, 'pd'), text, '1', ['Edge label 1 appears 3 times', 'tuples 1 and 2'], 10);
  });
  it('names the tuple whose under-edges run against the rest of the strand', () => {
    // Tuple 1 of the trefoil with its under-edges 4 → 5 swapped.
    const text = '(5,2,4,1) (2,6,3,5) (6,4,1,3)';
    expectCodeError(parseError(text, 'pd'), text, '(5,2,4,1)', ['Inconsistent orientation at tuple 1', 'tuple 2']);
  });
  it('names the tuple where labels stop being consecutive along a component', () => {
    const text = '(4,2,5,1) (2,3,6,5) (6,4,1,3)';
    expectCodeError(parseError(text, 'pd'), text, '(2,3,6,5)', ['Labels are not consecutive along a component at tuple 2', 'arrives on edge 2 and leaves on edge 6']);
    // Over-only components must be consecutive one way round, too.
    const over = '(1,3,2,5) (2,5,1,3)';
    expect(parseError(over, 'pd').message).toContain('not consecutive');
  });
  it('says when labels run backwards along the direction the under-passes give, and how to rotate the tuple', () => {
    // The positive trefoil (4,2,5,1) (2,6,3,5) (6,4,1,3) with every tuple started at its outgoing under-edge instead.
    const text = '(5,1,4,2) (3,5,2,6) (1,3,6,4)';
    expectCodeError(parseError(text, 'pd'), text, '(5,1,4,2)', ['Labels run backwards along a component at tuple 1', 'from edge 5 to edge 4', 'tuple 1 as (4,2,5,1)']);
  });
  it('refuses a virtual (non-planar) code, naming and spanning the tuples of the bad piece', () => {
    // The virtual trefoil o1 o2 u1 u2, written as a PD code.
    const text = '(3,2,4,1) (4,3,1,2)';
    expectCodeError(parseError(text, 'pd'), text, text, ['not planar', 'virtual', 'tuples 1 and 2']);
    const mixed = '(4,2,5,1) (2,6,3,5) (6,4,1,3) (9,8,10,7) (10,9,7,8)';
    expectCodeError(parseError(mixed, 'pd'), mixed, '(9,8,10,7) (10,9,7,8)', ['tuples 4 and 5']);
  });
  it('names stray characters and unclosed tuples by offset', () => {
    const stray = '(4,2,5,1) x (2,6,3,5) (6,4,1,3)';
    expectCodeError(parseError(stray, 'pd'), stray, 'x', ['Unexpected "x" at offset 10', 'after tuple 1']);
    const open = '(4,2,5,1) (2,6,3,5';
    expectCodeError(parseError(open, 'pd'), open, '(2,6,3,5', ['Tuple 2', 'never closed']);
    const wrapper = '[(4,2,5,1) (2,6,3,5) (6,4,1,3)';
    expectCodeError(parseError(wrapper, 'pd'), wrapper, '[', ['never closed']);
  });
});

describe('braid word errors', () => {
  it('refuses an empty word', () => {
    for (const text of ['', ' , ']) expectCodeError(parseError(text, 'braid'), text, text, ['braid word is empty']);
  });
  it('names a token that is not a signed integer', () => {
    const text = '1 a -2';
    expectCodeError(parseError(text, 'braid'), text, 'a', ['Token 2 "a"', 'signed index']);
    const frac = '1.5 2';
    expectCodeError(parseError(frac, 'braid'), frac, '1.5', ['Token 1 "1.5"']);
  });
  it('names generator 0', () => {
    const text = '1 -0 2';
    expectCodeError(parseError(text, 'braid'), text, '-0', ['Token 2 "-0"', 'numbered from 1']);
  });
  it('names the generator that needs more strands than were asked for', () => {
    const text = '1 3 -2';
    expectCodeError(parseError(text, 'braid', { strands: 3 }), text, '3', ['Token 2 "3" needs 4 strands', 'strand count is 3']);
  });
  it('refuses absurd indices and strand counts', () => {
    const text = '1 20000';
    expectCodeError(parseError(text, 'braid'), text, '20000', ['Token 2', 'too large']);
    expectCodeError(parseError('1 1', 'braid', { strands: 2.5 }), '1 1', '1 1', ['strand count 2.5']);
  });
  it('reads +i as σ_i and accepts extra strands', () => {
    const d = parseDiagramCode('+1, +1 +1', 'braid', { strands: 3 });
    expect(d.crossings.map((c) => c.sign)).toEqual([1, 1, 1]);
    expect(d.freeLoops).toBe(1);
  });
  it('reads a word wrapped in one pair of brackets, as lists are often printed ([1, -2, 1, -2]: figure-eight, V from memory)', () => {
    const figureEight = poly([[-2, 1], [-1, -1], [0, 1], [1, -1], [2, 1]]);
    for (const text of ['[1, -2, 1, -2]', ' (1 -2 1 -2) ']) expect(jonesByStateSum(parseDiagramCode(text, 'braid')).equals(figureEight)).toBe(true);
  });
  it('names any other bracket by offset', () => {
    expectCodeError(parseError('1 (2) 1', 'braid'), '1 (2) 1', '(', ['Unexpected "(" at offset 2', 'flat list']);
    expectCodeError(parseError('[1 1 1', 'braid'), '[1 1 1', '[', ['Unexpected "[" at offset 0']);
  });
});

describe('Gauss code errors', () => {
  it('refuses an empty code', () => {
    for (const text of ['', '  ']) expectCodeError(parseError(text, 'gauss'), text, text, ['Gauss code is empty', '"()"']);
  });
  it('names a bad token by offset', () => {
    const text = 'o1+ x2 u1+';
    expectCodeError(parseError(text, 'gauss'), text, 'x2', ['Unexpected "x2" at offset 4', 'o (over) or u (under)']);
    const bare = 'o1+ u1+ o';
    expectCodeError(parseError(bare, 'gauss'), bare, 'o', ['Unexpected "o" at offset 8'], 8);
  });
  it('explains that a code of signed crossing numbers (over positive, under negative: common practice) lacks the signs', () => {
    const text = '1 -2 3 -1 2 -3';
    expectCodeError(parseError(text, 'gauss'), text, '1', ['Unexpected "1" at offset 0', 'bare number', 'over or under', "crossing's sign"]);
  });
  it('names a crossing visited once', () => {
    const text = 'o1+ u2+ o3+ u1+ o2+';
    expectCodeError(parseError(text, 'gauss'), text, 'o3+', ['Crossing 3 is visited only once', 'offset 8']);
  });
  it('names a crossing visited a third time', () => {
    const text = 'o1+ u1+ o1+';
    expectCodeError(parseError(text, 'gauss'), text, 'o1+', ['Crossing 1 is visited a third time at offset 8'], 1);
  });
  it('names a crossing visited twice as over, or twice as under', () => {
    const over = 'o1+ o1+';
    expectCodeError(parseError(over, 'gauss'), over, 'o1+', ['Crossing 1 is visited twice as over'], 1);
    const under = 'u7+ o8- u7 u8';
    expectCodeError(parseError(under, 'gauss'), under, 'u7', ['Crossing 7 is visited twice as under', 'offsets 0 and 8'], 8);
  });
  it('names a crossing without a sign, and conflicting signs', () => {
    const none = 'o1 u1';
    expectCodeError(parseError(none, 'gauss'), none, 'o1', ['Crossing 1 has no sign', '"o1+"']);
    const conflict = 'o1+ u1-';
    expectCodeError(parseError(conflict, 'gauss'), conflict, 'u1-', ['Crossing 1 has conflicting signs', '"o1+" at offset 0']);
  });
  it('refuses a virtual code, spanning the visits of its crossings', () => {
    const text = 'o1+ o2+ u1+ u2+';
    expectCodeError(parseError(text, 'gauss'), text, text, ['not planar', 'virtual', 'crossings 1 and 2']);
    const mixed = '(o1- u1-) (o2+ o3+ u2+ u3+)';
    expectCodeError(parseError(mixed, 'gauss'), mixed, 'o2+ o3+ u2+ u3+', ['crossings 2 and 3']);
  });
  it('names misplaced parentheses and visits outside them', () => {
    const open = '(o1+ u1+';
    expectCodeError(parseError(open, 'gauss'), open, open, ['opened at offset 0 is never closed']);
    const nested = '((o1+ u1+))';
    expectCodeError(parseError(nested, 'gauss'), nested, '(', ['Unexpected "(" at offset 1', 'do not nest'], 1);
    const stray = 'o1+ u1+)';
    expectCodeError(parseError(stray, 'gauss'), stray, ')', ['Unexpected ")" at offset 7']);
    const outside = '(o1- u2-) u1- o2-';
    expectCodeError(parseError(outside, 'gauss'), outside, 'u1-', ['"u1-" at offset 10 is outside the parentheses'], 9);
  });
});

describe('DT code errors', () => {
  it('refuses an empty code', () => {
    for (const text of ['', ' ,, ']) expectCodeError(parseError(text, 'dt'), text, text, ['DT code is empty', '4 6 2']);
  });
  it('names entries that are not numbers, zero, odd, out of range or repeated', () => {
    const cases: [string, string, string[], number?][] = [
      ['4 x 2', 'x', ['Entry 2 "x" is not a number']],
      ['4 0 2', '0', ['Entry 2 is 0', 'nonzero even']],
      ['4 5 2', '5', ['Entry 2 is 5, which is odd']],
      ['4 -8 2', '-8', ['Entry 2 is -8, out of range', '2, 4, …, 6']],
      // Beyond 2^53: before, this was called "not a number".
      ['4 200000000000000000000 2', '200000000000000000000', ['Entry 2 "200000000000000000000" is out of range', '2, 4, …, 6']],
      ['0', '0', ['Entry 1 is 0', 'here 2, with signs']],
      ['4 -4 2', '-4', ['Entry 2 repeats the label 4 already used by entry 1']],
    ];
    for (const [text, spanned, phrases] of cases) expectCodeError(parseError(text, 'dt'), text, spanned, phrases);
  });
  it('reads a code wrapped in one pair of brackets, as codes are often printed ([4, 6, 2]: the positive trefoil, V = t + t^3 − t^4 from memory)', () => {
    const trefoil = poly([[1, 1], [3, 1], [4, -1]]);
    for (const text of ['[4, 6, 2]', ' (4 6 2) ', '[4,6,2],']) expect(jonesByStateSum(parseDiagramCode(text, 'dt')).equals(trefoil)).toBe(true);
  });
  it('refuses grouped entries (a link code) and unmatched brackets, naming the bracket', () => {
    expectCodeError(parseError('(6 8) (2 4)', 'dt'), '(6 8) (2 4)', ')', ['Unexpected ")" at offset 4', 'DT codes of links are not read', 'PD or Gauss']);
    expectCodeError(parseError('[4 6 2)', 'dt'), '[4 6 2)', '[', ['Unexpected "[" at offset 0']);
    expectCodeError(parseError('4 6 2]', 'dt'), '4 6 2]', ']', ['Unexpected "]" at offset 5']);
  });
  it('refuses codes no planar knot diagram has, naming the entries', () => {
    // Found by enumerating all codes with at most 7 entries (no planar curve has them).
    const interlacing = '4 6 8 10 2';
    const e1 = parseError(interlacing, 'dt');
    expect(e1.ruleId).toBe('code-invalid');
    expect(e1.message).toMatch(/No planar knot diagram has this DT code: the crossings of entry \d .* and entry \d .* are not interlaced/);
    const token = e1.message.match(/and entry (\d)/)![1]!;
    const start = [0, 2, 4, 6, 9][Number(token) - 1]!;
    expect(e1.span).toEqual({ start, end: start + interlacing.split(' ')[Number(token) - 1]!.length });
    const turning = '6 8 10 12 2 4';
    const e2 = parseError(turning, 'dt');
    expect(e2.message).toMatch(/cross itself both ways round/);
    expect(e2.message).toMatch(/entry \d+ \("\d+": labels \d+ and \d+\)/);
  });
  it('refuses more entries than the realisation supports, as a located error', () => {
    const text = Array.from({ length: 2001 }, (_, k) => 2 * k + 2).join(' ');
    expectCodeError(parseError(text, 'dt'), text, text, ['2001 entries', 'at most 2000']);
  });
});

describe('numbers too large to be labels', () => {
  // Before, a whole number beyond 2^53 was reported as "not an edge label / not a braid generator", which misleads.
  it('says a PD label is too large rather than not a number', () => {
    const text = '(100000000000000000004,2,5,1) (2,6,3,5) (6,4,1,3)';
    expectCodeError(parseError(text, 'pd'), text, '100000000000000000004', ['Tuple 1, entry 1', 'too large']);
  });
  it('says a braid generator index is too large rather than not a generator', () => {
    const text = '1 99999999999999999999';
    expectCodeError(parseError(text, 'braid'), text, '99999999999999999999', ['Token 2', 'too large', 'at most 9999']);
  });
});

describe('the Unicode minus sign U+2212 of typeset text', () => {
  // Decision: "−" (as copied from a typeset paper) reads as "-" in every signed number and Gauss sign.
  it('reads "1 −2 1 −2" as the figure-eight braid, and "−4 −6 −2" / "o1− u2− …" as the left-handed trefoil (values from memory)', () => {
    expect(parseDiagramCode('1 −2 1 −2', 'braid').crossings.map((c) => c.sign)).toEqual([1, -1, 1, -1]);
    const figureEight = jonesByStateSum(parseDiagramCode('1 −2 1 −2', 'braid'));
    expect(figureEight.equals(poly([[-2, 1], [-1, -1], [0, 1], [1, -1], [2, 1]]))).toBe(true);
    const leftTrefoil = poly([[-4, -1], [-3, 1], [-1, 1]]);
    expect(jonesByStateSum(parseDiagramCode('−4 −6 −2', 'dt')).equals(leftTrefoil)).toBe(true);
    expect(jonesByStateSum(parseDiagramCode('o1− u2− o3− u1− o2− u3−', 'gauss')).equals(leftTrefoil)).toBe(true);
  });
  it('still refuses other dashes, naming the token', () => {
    expectCodeError(parseError('1 –2', 'braid'), '1 –2', '–2', ['Token 2', 'not a braid generator']);
  });
});

describe('links of too many components', () => {
  // Every pair of components gets a linking number; before the cap, the braid word "9999" (10 000 strands) ran out of memory.
  it('refuses a braid whose strands make more than MAX_COMPONENTS components, spanning the word', () => {
    const error = parseError('9999', 'braid');
    expectCodeError(error, '9999', '9999', ['9999 components', `at most ${MAX_COMPONENTS}`, 'linking number']);
  });
  it('counts crossingless components too, and accepts exactly MAX_COMPONENTS', () => {
    const circles = (k: number): string => Array.from({ length: k }, () => '()').join(' ');
    expect(parseDiagramCode(circles(MAX_COMPONENTS), 'gauss').freeLoops).toBe(MAX_COMPONENTS);
    const text = circles(MAX_COMPONENTS + 1);
    expectCodeError(parseError(text, 'gauss'), text, text, [`${MAX_COMPONENTS + 1} components`]);
  });
});

describe('the dispatcher', () => {
  it('throws InputError with rule code-invalid for every notation', () => {
    for (const notation of ['pd', 'braid', 'gauss', 'dt'] as const) expect(parseError('?', notation).ruleId).toBe('code-invalid');
  });
});
