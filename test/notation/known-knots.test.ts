import { describe, expect, it } from 'vitest';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { componentCount, structuralProblem, writhe } from '../../src/core/diagram/model.ts';
import { nonPlanarPieces } from '../../src/core/diagram/faces.ts';
import { bracketByStateSum } from '../../src/core/invariants/state-sum.ts';
import { parseDiagramCode, printDtCode, printGaussCode, printPdCode } from '../../src/core/notation/index.ts';
import { equalUpToMirror, jonesByStateSum, poly } from './helpers.ts';

interface KnownLink {
  readonly name: string;
  readonly braid: string;
  readonly strands: number;
  /** DT code as recalled from the usual tables (from memory); knots only. */
  readonly dt?: string;
  /** Jones polynomial in t (from memory), up to t ↦ t⁻¹ (the chirality of a table entry is not recalled reliably). */
  readonly jones: [number, number][];
  readonly components: number;
}

const KNOWN: KnownLink[] = [
  { name: 'trefoil 3_1', braid: '1 1 1', strands: 2, dt: '4 6 2', jones: [[1, 1], [3, 1], [4, -1]], components: 1 },
  { name: 'figure-eight 4_1', braid: '1 -2 1 -2', strands: 3, dt: '4 6 8 2', jones: [[-2, 1], [-1, -1], [0, 1], [1, -1], [2, 1]], components: 1 },
  { name: 'cinquefoil 5_1', braid: '1 1 1 1 1', strands: 2, dt: '6 8 10 2 4', jones: [[-7, -1], [-6, 1], [-5, -1], [-4, 1], [-2, 1]], components: 1 },
  { name: 'three-twist knot 5_2', braid: '1 1 1 2 -1 2', strands: 3, dt: '4 8 10 2 6', jones: [[-6, -1], [-5, 1], [-4, -1], [-3, 2], [-2, -1], [-1, 1]], components: 1 },
  { name: 'stevedore 6_1', braid: '1 1 2 -1 -3 2 -3', strands: 4, dt: '4 8 12 10 2 6', jones: [[2, 1], [1, -1], [0, 2], [-1, -2], [-2, 1], [-3, -1], [-4, 1]], components: 1 },
  { name: '6_2', braid: '1 1 1 -2 1 -2', strands: 3, dt: '4 8 10 12 2 6', jones: [[-1, 1], [0, -1], [1, 2], [2, -2], [3, 2], [4, -2], [5, 1]], components: 1 },
  { name: '6_3', braid: '1 1 -2 1 -2 -2', strands: 3, dt: '4 8 10 2 12 6', jones: [[-3, -1], [-2, 2], [-1, -2], [0, 3], [1, -2], [2, 2], [3, -1]], components: 1 },
  { name: 'Hopf link', braid: '1 1', strands: 2, jones: [[0.5, -1], [2.5, -1]], components: 2 },
  { name: 'Whitehead link', braid: '1 1 -2 1 -2', strands: 3, jones: [[-1.5, -1], [-0.5, 1], [0.5, -2], [1.5, 1], [2.5, -2], [3.5, 1]], components: 2 },
];

describe('the same link in all four notations', () => {
  for (const link of KNOWN) {
    it(`${link.name}: braid, PD, Gauss${link.dt ? ' and DT' : ''} codes agree, with the Jones polynomial from memory`, () => {
      const braid = parseDiagramCode(link.braid, 'braid', { strands: link.strands });
      expect(componentCount(braid)).toBe(link.components);
      const bracket = bracketByStateSum(braid);
      expect(equalUpToMirror(jonesByStateSum(braid), poly(link.jones))).toBe(true);
      // PD and Gauss codes derived from the braid closure by the printers, then read back.
      for (const [code, notation] of [[printPdCode(braid), 'pd'], [printGaussCode(braid), 'gauss']] as const) {
        const d = parseDiagramCode(code, notation);
        expect(structuralProblem(d)).toBeUndefined();
        expect(bracketByStateSum(d).equals(bracket)).toBe(true);
        expect(jonesByStateSum(d).equals(jonesByStateSum(braid))).toBe(true);
      }
      if (link.dt) {
        // The table's diagram may differ from the braid closure's, so compare the writhe-normalised bracket (Jones).
        const dt = parseDiagramCode(link.dt, 'dt');
        expect(dt.chiralityFixed).toBe(false);
        expect(dt.crossings.length).toBe(link.dt.split(' ').length);
        expect(equalUpToMirror(jonesByStateSum(dt), jonesByStateSum(braid))).toBe(true);
        // The DT code of the braid closure itself describes the same diagram: the same bracket up to A ↦ A⁻¹.
        const sameDiagram = parseDiagramCode(printDtCode(braid), 'dt');
        expect(equalUpToMirror(bracketByStateSum(sameDiagram), bracket)).toBe(true);
      }
    });
  }

  it('reads the PD code (4,2,5,1) (2,6,3,5) (6,4,1,3) as the positive trefoil: bracket A^-7 - A^-3 - A^5 (from memory: Kauffman 1987)', () => {
    const d = parseDiagramCode('(4,2,5,1) (2,6,3,5) (6,4,1,3)', 'pd');
    expect(writhe(d)).toBe(3);
    expect(d.crossings.every((c) => c.sign === 1)).toBe(true);
    expect(bracketByStateSum(d).terms()).toEqual([[-7, 1n], [-3, -1n], [5, -1n]]);
    expect(bracketByStateSum(d).equals(bracketByStateSum(closeBraid([1, 1, 1], 2)))).toBe(true);
  });

  it('reads the usual PD code of the figure-eight knot (from memory) with Jones t^-2 - t^-1 + 1 - t + t^2', () => {
    const d = parseDiagramCode('(4,2,5,1) (8,6,1,5) (6,3,7,4) (2,7,3,8)', 'pd');
    expect(writhe(d)).toBe(0);
    expect(jonesByStateSum(d).equals(poly([[-2, 1], [-1, -1], [0, 1], [1, -1], [2, 1]]))).toBe(true);
  });

  it('accepts PD labels starting at 0, at any offset, with gaps between components and free layout', () => {
    const reference = bracketByStateSum(parseDiagramCode('(4,2,5,1) (2,6,3,5) (6,4,1,3)', 'pd'));
    for (const code of ['(3,1,4,0) (1,5,2,4) (5,3,0,2)', '[(104, 102, 105, 101),\n (102,106,103,105), (106,104,101,103)]', '(4 2 5 1),(2 6 3 5)\n(6 4 1 3)', '[4,2,5,1] [2,6,3,5] [6,4,1,3]']) {
      expect(bracketByStateSum(parseDiagramCode(code, 'pd')).equals(reference)).toBe(true);
    }
    // The Hopf link with its second component numbered from 10.
    const hopf = parseDiagramCode('(1,10,2,11) (10,1,11,2)', 'pd');
    expect(componentCount(hopf)).toBe(2);
    expect(bracketByStateSum(hopf).equals(poly([[4, -1], [-4, -1]]))).toBe(true);
  });

  it('reads a hand-written Gauss code of the negative Hopf link: bracket -A^4 - A^-4 (from memory), writhe -2', () => {
    const d = parseDiagramCode('(o1- u2-) (u1- o2-)', 'gauss');
    expect(writhe(d)).toBe(-2);
    expect(bracketByStateSum(d).equals(poly([[4, -1], [-4, -1]]))).toBe(true);
  });

  it('reads compact and upper-case Gauss visits, with each sign given once', () => {
    const d = parseDiagramCode('O1+U2O3+U1O2+U3', 'gauss');
    expect(bracketByStateSum(d).equals(bracketByStateSum(closeBraid([1, 1, 1], 2)))).toBe(true);
  });

  it('expresses split links and crossingless components: braids with extra strands, Gauss "()"', () => {
    const loop = poly([[2, -1], [-2, -1]]); // <O O> = -A^2 - A^-2 (Kauffman 1987)
    const trefoil = bracketByStateSum(closeBraid([1, 1, 1], 2));
    const braid = parseDiagramCode('1 1 1', 'braid', { strands: 4 });
    expect(braid.freeLoops).toBe(2);
    expect(bracketByStateSum(braid).equals(trefoil.mul(loop).mul(loop))).toBe(true);
    const gauss = parseDiagramCode('(o1+ u2+ o3+ u1+ o2+ u3+) ()', 'gauss');
    expect(componentCount(gauss)).toBe(2);
    expect(bracketByStateSum(gauss).equals(trefoil.mul(loop))).toBe(true);
    const unlink = parseDiagramCode('() ()', 'gauss');
    expect([unlink.crossings.length, componentCount(unlink)]).toEqual([0, 2]);
    expect(bracketByStateSum(parseDiagramCode('()', 'gauss')).equals(poly([[0, 1]]))).toBe(true);
    // Two pieces with crossings: a trefoil and a Hopf link side by side.
    const split = parseDiagramCode('(o1+ u2+ o3+ u1+ o2+ u3+) (o4+ u5+) (u4+ o5+)', 'gauss');
    expect(nonPlanarPieces(split)).toEqual([]);
    expect(bracketByStateSum(split).equals(trefoil.mul(loop).mul(poly([[4, -1], [-4, -1]])))).toBe(true);
  });
});

describe('seven-crossing knots from their DT codes (codes and values from the knot tables, from memory)', () => {
  // V(-1) = ±det, and the determinants of 7_2, 7_3, 7_4, 7_5 are 11, 13, 15, 17 (from memory); V of 7_2 and 7_4 recalled up to mirror.
  const cases: [string, string, number, [number, number][] | undefined][] = [
    ['7_2', '4 10 14 12 2 8 6', 11, [[-8, -1], [-7, 1], [-6, -1], [-5, 2], [-4, -2], [-3, 2], [-2, -1], [-1, 1]]],
    ['7_3', '6 10 12 14 2 4 8', 13, undefined],
    ['7_4', '6 10 12 14 4 2 8', 15, [[1, 1], [2, -2], [3, 3], [4, -2], [5, 3], [6, -2], [7, 1], [8, -1]]],
    ['7_5', '4 10 12 14 2 8 6', 17, undefined],
  ];
  for (const [name, code, determinant, jones] of cases) {
    it(`${name} = ${code}: 7 crossings, |V(-1)| = ${determinant}${jones ? ', V as in the tables up to mirror' : ''}, span 7 (Kauffman–Murasugi–Thistlethwaite: reduced alternating)`, () => {
      const v = jonesByStateSum(parseDiagramCode(code, 'dt'));
      const atMinusOne = v.terms().reduce((sum, [e, c]) => sum + (e % 2 === 0 ? c : -c), 0n);
      expect(atMinusOne === BigInt(determinant) || atMinusOne === BigInt(-determinant)).toBe(true);
      expect(v.span).toBe(7);
      if (jones) expect(equalUpToMirror(v, poly(jones))).toBe(true);
    });
  }
});

describe('DT conventions and the chirality chosen', () => {
  const positiveTrefoil = bracketByStateSum(closeBraid([1, 1, 1], 2));
  it('realises the all-positive 4 6 2 as the positive (right-handed) trefoil, and -4 -6 -2 as its mirror', () => {
    const d = parseDiagramCode('4 6 2', 'dt');
    expect(d.crossings.every((c) => c.sign === 1)).toBe(true);
    expect(bracketByStateSum(d).equals(positiveTrefoil)).toBe(true);
    // Right-handed trefoil: Jones t + t^3 - t^4 (from memory).
    expect(jonesByStateSum(d).equals(poly([[1, 1], [3, 1], [4, -1]]))).toBe(true);
    const m = parseDiagramCode('-4 -6 -2', 'dt');
    expect(bracketByStateSum(m).equals(positiveTrefoil.substitutePower(-1))).toBe(true);
  });

  it('reads a negative entry as an even visit passing over: flipping one entry of 4 6 2 gives an unknot diagram', () => {
    // Switching one crossing of the trefoil's diagram unknots it (common practice): bracket (-A^3)^w.
    const d = parseDiagramCode('4 -6 2', 'dt');
    const w = writhe(d);
    expect(bracketByStateSum(d).equals(poly([[3 * w, w % 2 === 0 ? 1 : -1]]))).toBe(true);
  });

  it('realises each independent part of a composite code alike: 4 6 2 10 12 8 is the granny knot, not the square knot', () => {
    // The bracket is multiplicative under connected sum (Kauffman 1987).
    const d = parseDiagramCode('4 6 2 10 12 8', 'dt');
    expect(bracketByStateSum(d).equals(positiveTrefoil.mul(positiveTrefoil))).toBe(true);
  });

  it('gives the first entry\'s crossing the sign of that entry', () => {
    for (const code of ['4 8 10 2 6', '-4 8 -10 2 6', '6 -8 10 2 4', '-8 -14 -12 -4 2 -6 -10']) {
      const d = parseDiagramCode(code, 'dt');
      const first = Number(code.split(' ')[0]);
      // Crossing 0 of the model is entry 1 (crossings are kept in entry order).
      expect(d.crossings[0]!.sign).toBe(first > 0 ? 1 : -1);
    }
  });

  it('reads a one-entry code 2 as a one-crossing unknot diagram', () => {
    const d = parseDiagramCode('2', 'dt');
    expect(d.crossings.length).toBe(1);
    expect(bracketByStateSum(d).equals(poly([[3, -1]]))).toBe(true); // a positive curl: -A^3 (Kauffman 1987)
  });
});

describe('one-crossing PD codes (curls)', () => {
  it('reads a curl with writhe +1 as bracket -A^3 and one with writhe -1 as -A^-3 (from memory: Kauffman 1987)', () => {
    for (const [code, w] of [['(1,1,2,2)', 1], ['(2,2,1,1)', 1], ['(0,0,1,1)', 1], ['(1,2,2,1)', -1], ['(2,1,1,2)', -1]] as const) {
      const d = parseDiagramCode(code, 'pd');
      expect(writhe(d)).toBe(w);
      expect(bracketByStateSum(d).equals(poly([[3 * w, -1]]))).toBe(true);
    }
  });
});

describe('the three-twist knot 5_2 from its PD code as commonly published (code and V from memory)', () => {
  it('reads (1,4,2,5) (3,8,4,9) (5,10,6,1) (9,6,10,7) (7,2,8,3) as 5_2: V = −t^−6 + t^−5 − t^−4 + 2t^−3 − t^−2 + t^−1', () => {
    const d = parseDiagramCode('(1,4,2,5) (3,8,4,9) (5,10,6,1) (9,6,10,7) (7,2,8,3)', 'pd');
    expect(jonesByStateSum(d).equals(poly([[-6, -1], [-5, 1], [-4, -1], [-3, 2], [-2, -1], [-1, 1]]))).toBe(true);
  });
});

describe('two-crossing links as PD codes are commonly written', () => {
  // Worked by hand from the slot rule (over strand from entry 4 to entry 2 is positive): in (1,3,2,4) (3,1,4,2)
  // each component passes under once and its return runs entry 4 → 2 at the other crossing.
  it('reads (1,3,2,4) (3,1,4,2) as the positive Hopf link and (4,1,3,2) (2,3,1,4) as the negative one (V from memory)', () => {
    const positive = parseDiagramCode('(1,3,2,4) (3,1,4,2)', 'pd');
    expect(positive.crossings.map((c) => c.sign)).toEqual([1, 1]);
    expect(jonesByStateSum(positive).equals(poly([[0.5, -1], [2.5, -1]]))).toBe(true);
    const negative = parseDiagramCode('(4,1,3,2) (2,3,1,4)', 'pd');
    expect(negative.crossings.map((c) => c.sign)).toEqual([-1, -1]);
    expect(jonesByStateSum(negative).equals(poly([[-2.5, -1], [-0.5, -1]]))).toBe(true);
  });
  it('reads (1,3,2,4) (2,3,1,4), where the second circle passes over at both crossings, as the 2-component unlink: V = −t^(−1/2) − t^(1/2) (common practice)', () => {
    const d = parseDiagramCode('(1,3,2,4) (2,3,1,4)', 'pd');
    expect(writhe(d)).toBe(0);
    expect(jonesByStateSum(d).equals(poly([[-0.5, -1], [0.5, -1]]))).toBe(true);
  });
});

describe('crossing order', () => {
  it('keeps the crossings in the order the code gives them', () => {
    // Tuple order (PD), generator order (braid), ascending crossing number (Gauss), entry order (DT).
    expect(parseDiagramCode('(1,1,2,2) (3,4,4,3)', 'pd').crossings.map((c) => c.sign)).toEqual([1, -1]);
    expect(parseDiagramCode('1 -1', 'braid').crossings.map((c) => c.sign)).toEqual([1, -1]);
    expect(parseDiagramCode('(o9- u9-) (o2+ u2+)', 'gauss').crossings.map((c) => c.sign)).toEqual([1, -1]);
    expect(parseDiagramCode('-4 6 2', 'dt').crossings[0]!.sign).toBe(-1);
  });
});

describe('PD orientation of components that only pass over', () => {
  it('orients a two-edge over-only component so that its crossing in the earliest tuple is positive', () => {
    // The closure of σ1 σ1⁻¹: one circle lies over the other at both crossings.
    const d0 = closeBraid([1, -1], 2);
    const code = printPdCode(d0);
    const d = parseDiagramCode(code, 'pd');
    expect(d.crossings[0]!.sign).toBe(1);
    expect(d.crossings[1]!.sign).toBe(-1);
    expect(bracketByStateSum(d).equals(bracketByStateSum(d0))).toBe(true);
  });
});
