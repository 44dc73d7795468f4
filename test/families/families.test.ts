/**
 * Family-built diagrams against published formulas and values recalled from
 * memory: Jones' torus-knot formula, Murasugi's torus-knot crossing numbers,
 * Schubert's determinant of two-bridge links, the pretzel determinant, and the
 * crossing numbers of small non-alternating knots.
 */
import { describe, expect, it } from 'vitest';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import { nonPlanarPieces } from '../../src/core/diagram/faces.ts';
import { structuralProblem } from '../../src/core/diagram/model.ts';
import { continuedFraction, gcd } from '../../src/core/families/build.ts';
import { isInputError } from '../../src/core/errors.ts';
import { jonesPolynomial } from '../../src/core/invariants/jones.ts';
import { parseDiagramCode } from '../../src/core/notation/index.ts';
import { printPdCode } from '../../src/core/notation/print.ts';
import { Laurent } from '../../src/core/poly/laurent.ts';

const family = (code: string, named?: Record<string, string>) =>
  parseDiagramCode(code, 'family', named ? { named: (id) => (named[id] ? parseDiagramCode(named[id]!, 'family') : undefined) } : {});
const t = (terms: [number, number][]) => Laurent.fromTerms(terms);

/** Jones 1987 (Annals of Mathematics 126): V(T(p,q)) = t^((p−1)(q−1)/2)(1 − t^(p+1) − t^(q+1) + t^(p+q))/(1 − t²). */
const jonesTorus = (p: number, q: number): Laurent =>
  t([[0, 1], [p + 1, -1], [q + 1, -1], [p + q, 1]])
    .divExact(t([[0, 1], [2, -1]]))
    .shift(((p - 1) * (q - 1)) / 2);

describe('torus links T(p, q)', () => {
  const pairs: [number, number][] = [];
  for (let p = 2; p <= 6; p++) for (let q = 2; q <= 11; q++) if (gcd(p, q) === 1) pairs.push([p, q]);
  for (const [p, q] of pairs) {
    it(`T(${p},${q}): Jones 1987 formula, its mirror T(${p},${-q}), and Murasugi's c = min(p(q−1), q(p−1)) (Trans. AMS 326)`, () => {
      const r = analyzeDiagram(family(`torus ${p} ${q}`));
      expect(r.jones.equals(jonesTorus(p, q))).toBe(true);
      expect(analyzeDiagram(family(`torus ${p} ${-q}`)).jones.equals(jonesTorus(p, q).substitutePower(-1))).toBe(true);
      expect(r.crossingNumber.exact).toBe(Math.min(p * (q - 1), q * (p - 1)));
      expect(r.crossingNumber.reasons.some((x) => x.theorem === 'murasugi-torus' && x.text.includes('Murasugi 1991'))).toBe(true);
    });
  }
  it('T(p, q) = T(q, p) = T(−p, −q) (common practice): same Jones polynomial', () => {
    const v = jonesPolynomial(family('torus 3 5'));
    expect(jonesPolynomial(family('torus 5 3')).equals(v)).toBe(true);
    expect(jonesPolynomial(family('torus -3 -5')).equals(v)).toBe(true);
  });
  it('torus links (gcd > 1) get no Murasugi reason: the published statement is about knots', () => {
    const r = analyzeDiagram(family('torus 3 6'));
    expect(r.components).toBe(3);
    expect(r.crossingNumber.reasons.some((x) => x.theorem === 'murasugi-torus')).toBe(false);
  });
  it('T(p, 0) is the unlink of |p| circles, T(1, q) the unknot (common practice)', () => {
    expect(analyzeDiagram(family('torus 4 0')).components).toBe(4);
    const unknot = analyzeDiagram(family('torus 1 7'));
    expect([unknot.components, unknot.crossings, unknot.crossingNumber.exact]).toEqual([1, 0, 0]);
  });
  it('a braid word that is literally a torus braid (rotated, inverted) gets Murasugi\'s value; others do not', () => {
    for (const word of ['1 2 1 2 1 2 1 2', '2 1 2 1 2 1 2 1', '-2 -1 -2 -1 -2 -1 -2 -1', '2 3 1 2 3 1 2 3 1 2 3 1 2 3 1']) {
      const r = analyzeDiagram(parseDiagramCode(word, 'braid'));
      expect(r.crossingNumber.reasons.some((x) => x.theorem === 'murasugi-torus')).toBe(true);
      expect(r.crossingNumber.exact).toBe(r.crossings);
    }
    // T(4, 5): min(4·4, 5·3) = 15 crossings.
    expect(analyzeDiagram(parseDiagramCode('2 3 1 2 3 1 2 3 1 2 3 1 2 3 1', 'braid')).crossingNumber.exact).toBe(15);
    for (const word of ['1 2 1 2 1 2 1 -2', '1 1 2 2 1 2 1 2', '1 2 1 2 1 2 1 2']) {
      const strands = word === '1 2 1 2 1 2 1 2' ? 4 : undefined;
      const r = analyzeDiagram(parseDiagramCode(word, 'braid', strands ? { strands } : {}));
      expect(r.crossingNumber.reasons.some((x) => x.theorem === 'murasugi-torus')).toBe(false);
    }
  });
});

describe('two-bridge links (Schubert: det b(p, q) = p)', () => {
  for (let p = 2; p <= 23; p++) {
    for (let q = 1; q < 2 * p; q++) {
      if (gcd(p, q) !== 1) continue;
      it(`${p}/${q}: det ${p}, reduced alternating, c = sum of the continued fraction of p/(q mod p) (KMT)`, () => {
        const r = analyzeDiagram(family(`two-bridge ${p}/${q}`));
        expect(structuralProblem(r.diagram)).toBeUndefined();
        expect(nonPlanarPieces(r.diagram)).toEqual([]);
        expect(r.classical.determinant).toBe(BigInt(p));
        expect(r.alternating && r.reduced).toBe(true);
        const terms = continuedFraction(p, q % p);
        expect(r.crossingNumber.exact).toBe(terms.reduce((s, b) => s + b, 0));
        // The mirror image (−p/q) has V(t⁻¹); for links the builder's orientations may differ, so knots only.
        if (r.components === 1) expect(analyzeDiagram(family(`two-bridge -${p}/${q}`)).jones.equals(r.jones.substitutePower(-1))).toBe(true);
      });
    }
  }
  it('b(p, q) and b(p, q′) with q q′ ≡ 1 mod p are the same link (Schubert): same Jones polynomial', () => {
    // 13/5 and 13/8 (5·8 = 40 ≡ 1 mod 13).
    expect(jonesPolynomial(family('two-bridge 13/5')).equals(jonesPolynomial(family('two-bridge 13/8')))).toBe(true);
  });
});

describe('twist knots', () => {
  it('twist 1 is the positive trefoil and twist 2 the figure-eight knot (from memory)', () => {
    const trefoil = jonesPolynomial(family('twist 1'));
    expect([t([[1, 1], [3, 1], [4, -1]]), t([[-1, 1], [-3, 1], [-4, -1]])].some((v) => v.equals(trefoil))).toBe(true);
    expect(jonesPolynomial(family('twist 2')).equals(t([[-2, 1], [-1, -1], [0, 1], [1, -1], [2, 1]]))).toBe(true);
  });
  for (let n = 1; n <= 8; n++) {
    it(`twist ${n}: det 2n + 1 = ${2 * n + 1} and c = n + 2 (from memory: twist knots are two-bridge (2n+1)/2)`, () => {
      const r = analyzeDiagram(family(`twist ${n}`));
      expect(r.classical.determinant).toBe(BigInt(2 * n + 1));
      expect(r.crossingNumber.exact).toBe(n + 2);
      expect(analyzeDiagram(family(`twist ${-n}`)).jones.equals(r.jones.substitutePower(-1))).toBe(true);
    });
  }
});

describe('pretzel and Montesinos links', () => {
  const triples: [number, number, number][] = [[1, 1, 1], [3, 3, 3], [-3, 5, 7], [3, -3, 2], [-2, 3, 3], [-2, 3, 5], [-2, 3, 7], [2, 2, 2], [4, -2, 6], [5, -3, -3], [-1, 3, 4]];
  for (const [p, q, r] of triples) {
    it(`P(${p}, ${q}, ${r}): det |pq + qr + rp| = ${Math.abs(p * q + q * r + r * p)} (common practice)`, () => {
      const report = analyzeDiagram(family(`pretzel ${p} ${q} ${r}`));
      expect(report.classical.determinant).toBe(BigInt(Math.abs(p * q + q * r + r * p)));
      expect(report.crossings).toBe(Math.abs(p) + Math.abs(q) + Math.abs(r));
    });
  }
  it('P(−2, 3, 3) is T(3, 4) = 8₁₉ and P(−2, 3, 5) is T(3, 5) = 10₁₂₄, up to mirror image (from memory)', () => {
    for (const [pretzel, torus] of [['pretzel -2 3 3', 'torus 3 4'], ['pretzel -2 3 5', 'torus 3 5']] as const) {
      const v = jonesPolynomial(family(pretzel));
      const w = jonesPolynomial(family(torus));
      expect(v.equals(w) || v.equals(w.substitutePower(-1))).toBe(true);
    }
  });
  it('crossing numbers of non-alternating pretzel knots (from memory: 8₁₉ = P(−2,3,3) 8, 8₂₀ = P(3,−3,2) 8, P(−2,3,7) 12)', () => {
    for (const [code, c] of [['pretzel -2 3 3', 8], ['pretzel 3 -3 2', 8], ['pretzel -2 3 7', 12]] as const) {
      const r = analyzeDiagram(family(code));
      expect(r.alternating).toBe(false);
      expect(r.crossingNumber.exact).toBe(c);
      expect(r.crossingNumber.reasons.find((x) => x.bound === 'exact')?.text).toContain('Lickorish–Thistlethwaite 1988');
    }
  });
  it('the Lickorish–Thistlethwaite reason is withheld outside the case it is applied to: two columns, a column of one crossing', () => {
    for (const code of ['pretzel -1 3 3', 'pretzel 3 -2', 'montesinos 2/5 -1/3 1/3']) {
      const r = analyzeDiagram(family(code));
      expect(r.crossingNumber.reasons.some((x) => x.theorem === 'lickorish-thistlethwaite')).toBe(false);
    }
  });
  it('montesinos 1/a₁ … 1/a_k is the pretzel link (same Jones polynomial)', () => {
    expect(jonesPolynomial(family('montesinos 1/3 -1/2 1/5')).equals(jonesPolynomial(family('pretzel 3 -2 5')))).toBe(true);
  });
  it('montesinos 1/a₁ … 1/a_k with every |aᵢ| ≥ 2 is drawn as the pretzel diagram and gets its Lickorish–Thistlethwaite value (P(−2, 3, 5) = T(3, 5) = 10₁₂₄: 10, from memory)', () => {
    const r = analyzeDiagram(family('montesinos 1/3 -1/2 1/5'));
    expect(printPdCode(r.diagram)).toBe(printPdCode(family('pretzel 3 -2 5')));
    expect(r.alternating).toBe(false);
    expect(r.crossingNumber.exact).toBe(10);
    expect(r.crossingNumber.reasons.find((x) => x.bound === 'exact')?.theorem).toBe('lickorish-thistlethwaite');
    // A tangle 1/1 is drawn as one horizontal crossing, not as a pretzel column: no pretzel identity.
    expect(analyzeDiagram(family('montesinos 1/3 1 1/3')).family?.description).toMatch(/Montesinos/);
  });
  it('a Montesinos knot of two tangles is two-bridge (common practice): det of M(1/3, 2/5) equals that of its fraction sum 11/15, i.e. 11', () => {
    expect(analyzeDiagram(family('montesinos 1/3 2/5')).classical.determinant).toBe(11n);
  });
});

describe('operations on named diagrams', () => {
  const named = { tref: 'torus 2 3', fig8: 'twist 2' };
  it('mirror, connected sum and split union (Jones 1985: V multiplies under sum; split union adds the factor −t^½ − t^−½)', () => {
    const v = jonesPolynomial(family('torus 2 3'));
    const f = jonesPolynomial(family('twist 2'));
    expect(jonesPolynomial(family('mirror tref', named)).equals(v.substitutePower(-1))).toBe(true);
    expect(jonesPolynomial(family('sum tref fig8', named)).equals(v.mul(f))).toBe(true);
    expect(jonesPolynomial(family('sum (torus 2 3) (mirror (torus 2 3))')).equals(v.mul(v.substitutePower(-1)))).toBe(true);
    expect(jonesPolynomial(family('split tref fig8', named)).equals(v.mul(f).mul(t([[0.5, -1], [-0.5, -1]])))).toBe(true);
    // The mirror keeps what it is: Murasugi's value still applies.
    expect(analyzeDiagram(family('mirror (torus 3 4)')).crossingNumber.reasons.some((x) => x.theorem === 'murasugi-torus')).toBe(true);
  });
});

describe('errors are located', () => {
  const cases: [string, string, string][] = [
    ['', 'empty', ''],
    ['toros 3 4', 'not a family', 'toros'],
    ['torus 3', 'needs', ''],
    ['torus 3 x', 'not a whole number', 'x'],
    ['torus 0 0', 'T(0, 0)', '0 0'],
    ['pretzel 3 0 2', 'at least one half twist', '0'],
    ['two-bridge 6/4', 'lowest terms', '6/4'],
    ['two-bridge 5/0', 'denominator 0', '5/0'],
    ['montesinos 1/2/3', 'more than one', '1/2/3'],
    ['mirror knot', 'not a diagram', 'knot'],
    ['sum (torus 2 3', 'never closed', '('],
    ['torus 2 3 4', 'after the complete family', '4'],
    ['torus 100 100', 'at most 2000', 'torus 100 100'],
    ['twist 0', 'at least one half twist', '0'],
  ];
  for (const [code, words, spanText] of cases) {
    it(`${JSON.stringify(code)}: ${words}`, () => {
      try {
        family(code);
        expect.unreachable();
      } catch (e) {
        if (!isInputError(e)) throw e;
        expect(e.ruleId).toBe('code-invalid');
        expect(e.message).toContain(words);
        expect(code.slice(e.span!.start, e.span!.end)).toBe(spanText);
      }
    });
  }
});
