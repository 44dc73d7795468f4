import { describe, expect, it } from 'vitest';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { componentCount, mirrorDiagram, type LinkDiagram } from '../../src/core/diagram/model.ts';
import { addCurl, connectedSum, disjointUnion, withFreeLoops } from '../../src/core/diagram/operations.ts';
import { arfByFusion, arfFromJonesAtI, arfOfKnot, arfOfLink, oddLinkingComponents, type ArfResult } from '../../src/core/invariants/arf.ts';
import { linkingNumbers } from '../../src/core/diagram/properties.ts';
import { simplifyDiagram } from '../../src/core/simplify/simplify.ts';
import { arfOf } from '../../src/core/invariants/registered/skein-values.ts';
import { parseDiagramCode } from '../../src/core/notation/index.ts';
import { atImaginaryUnit, equals8, mul8, neg8, pow8, SQRT2, zetaPower } from '../../src/core/poly/cyclotomic8.ts';
import { Laurent } from '../../src/core/poly/laurent.ts';
import { randomDiagram, rng } from '../support/random-diagrams.ts';

const arf = (d: LinkDiagram): ArfResult => arfOf(analyzeDiagram(d));
const value = (d: LinkDiagram): 0 | 1 | null => arf(d).value;

describe('ℤ[ζ₈] arithmetic (common practice)', () => {
  it('ζ⁸ = 1, ζ⁴ = −1, (ζ − ζ³)² = 2', () => {
    expect(equals8(zetaPower(8), zetaPower(0))).toBe(true);
    expect(equals8(zetaPower(4), neg8(zetaPower(0)))).toBe(true);
    expect(equals8(mul8(SQRT2, SQRT2), zetaPower(0, 2n))).toBe(true);
    expect(equals8(pow8(SQRT2, 6), zetaPower(0, 8n))).toBe(true);
    expect(equals8(zetaPower(-1), neg8(zetaPower(3)))).toBe(true);
  });
});

describe("Murakami's theorem V(i) = (−√2)^(μ−1)(−1)^Arf, with t^(1/2) = e^(iπ/4) (Jones 1985, Bull. AMS 12, Theorem 15)", () => {
  it('the square-root choice: the 2-component unlink, V = −(t^(1/2) + t^(−1/2)), gives V(i) = −√2 and Arf 0', () => {
    const unlink = Laurent.fromTerms([[0.5, -1n], [-0.5, -1n]]);
    expect(equals8(atImaginaryUnit(unlink), neg8(SQRT2))).toBe(true);
    expect(arfFromJonesAtI(unlink, 2)).toBe(0);
  });
  it('the trefoil, V = t + t³ − t⁴ (from memory), gives V(i) = −1: Arf 1', () => {
    const trefoil = Laurent.fromTerms([[1, 1n], [3, 1n], [4, -1n]]);
    expect(equals8(atImaginaryUnit(trefoil), neg8(zetaPower(0)))).toBe(true);
    expect(arfFromJonesAtI(trefoil, 1)).toBe(1);
  });
  it('a value that is neither 0 nor ±(−√2)^(μ−1) is a bug, not an answer', () => {
    expect(() => arfFromJonesAtI(Laurent.fromTerms([[0, 2n]]), 1)).toThrow(/internal/);
  });
  it('for knots V(i) agrees with Levine and the z² coefficient of ∇ on 120 random knots', () => {
    const random = rng(5101);
    let knots = 0;
    for (let i = 0; i < 2000 && knots < 120; i++) {
      const d = randomDiagram(random, 16, 5);
      if (componentCount(d) !== 1) continue;
      const r = analyzeDiagram(d);
      expect(arfFromJonesAtI(r.jones, 1)).toBe(arfOfKnot(r.classical.conway, r.classical.alexander));
      knots++;
    }
    expect(knots).toBe(120);
  });
});

describe('Arf invariant of links', () => {
  it('the Hopf link (lk = ±1) is not proper, in both orientations: no value, and the reason names the odd component', () => {
    for (const word of [[1, 1], [-1, -1]]) {
      const result = arf(closeBraid(word, 2));
      expect(result.value).toBe(null);
      expect(result.value === null && result.notDefined).toMatch(/component 1 .*total linking number (1|-1) .*odd/);
    }
  });
  it('the 2- and 3-component unlinks are proper with Arf 0 (they bound disjoint disks: common practice)', () => {
    expect(value(withFreeLoops(closeBraid([], 1), 1))).toBe(0);
    expect(value(closeBraid([1, -1], 3))).toBe(0);
  });
  it('T(2, 2k): lk = k, proper exactly for even k; one fusion gives T(2, 2k−1), so Arf(T(2,4)) = Arf(T(2,3)) = 1 and Arf(T(2,8)) = Arf(T(2,7)) = 0 (Robertello 1965; knot values from memory: a₂ of T(2, 2m+1) is m(m+1)/2)', () => {
    const torus = (n: number) => closeBraid(new Array<number>(n).fill(1), 2);
    expect(value(torus(4))).toBe(1);
    expect(value(torus(8))).toBe(0);
    expect(value(torus(12))).toBe(1); // fuses to T(2,11): m = 5, a₂ = 15
    expect(value(torus(16))).toBe(0); // fuses to T(2,15): m = 7, a₂ = 28
    expect(value(torus(6))).toBe(null);
    expect(value(torus(10))).toBe(null);
  });
  it('the Whitehead link (two-bridge 8/3): lk = 0, so proper; V is the mirror of t^(−3/2)(−1 + t − 2t² + t³ − 2t⁴ + t⁵) (from memory), V(i) = √2, so Arf 1', () => {
    const d = parseDiagramCode('two-bridge 8/3', 'family');
    const r = analyzeDiagram(d);
    expect(r.linking.map((l) => l.value)).toEqual([0]);
    const recalled = Laurent.fromTerms([[-1.5, -1n], [-0.5, 1n], [0.5, -2n], [1.5, 1n], [2.5, -2n], [3.5, 1n]]);
    expect(r.jones.equals(recalled.substitutePower(-1))).toBe(true);
    expect(value(d)).toBe(1);
    expect(value(mirrorDiagram(d))).toBe(1);
  });
  it('the Borromean rings (closure of (σ₁σ₂⁻¹)³): all lk = 0, V = −t³ + 3t² − 2t + 4 − 2t⁻¹ + 3t⁻² − t⁻³ (from memory), V(i) = −2 = (−√2)²·(−1), so Arf 1', () => {
    const d = closeBraid([1, -2, 1, -2, 1, -2], 3);
    const r = analyzeDiagram(d);
    expect(r.linking.map((l) => l.value)).toEqual([0, 0, 0]);
    const recalled = Laurent.fromTerms([[3, -1n], [2, 3n], [1, -2n], [0, 4n], [-1, -2n], [-2, 3n], [-3, -1n]]);
    expect(r.jones.equals(recalled)).toBe(true);
    expect(value(d)).toBe(1);
  });
  it('σ₁²σ₂⁴ on 3 strands: lk(1,2) = 1, lk(2,3) = 2, lk(1,3) = 0 (half the signed crossings, common practice), so components 1 and 2 have odd totals 1 and 3', () => {
    const d = closeBraid([1, 1, 2, 2, 2, 2], 3);
    const r = analyzeDiagram(d);
    expect(oddLinkingComponents(r.linking, 3)).toEqual([
      { component: 0, total: 1 },
      { component: 1, total: 3 },
    ]);
    expect(arfFromJonesAtI(r.jones, 3)).toBe(null);
    const result = arf(d);
    expect(result.value === null && result.notDefined).toMatch(/component 1 \(counted from 1 in the code's order\) has total linking number 1 .* \(so does component 2\)/);
  });
  it('two T(2,4) links (σ₁⁴, σ₃⁴) joined by σ₂² (lk 1: not proper) or by σ₂⁴ (lk 2: proper; linking numbers decide, V(i) agrees)', () => {
    // Four strands: σ₁⁴ and σ₃⁴ make two T(2,4) links; σ₂² links their inner components once more (lk 1): not proper.
    expect(value(closeBraid([1, 1, 1, 1, 3, 3, 3, 3, 2, 2], 4))).toBe(null);
    // σ₂⁴ instead links them twice (lk 2): proper again.
    expect(value(closeBraid([1, 1, 1, 1, 3, 3, 3, 3, 2, 2, 2, 2], 4))).not.toBe(null);
  });
});

describe('Arf invariant of links: relations that any correct value satisfies', () => {
  const randomLinks = (seed: number, count: number): LinkDiagram[] => {
    const random = rng(seed);
    const links: LinkDiagram[] = [];
    for (let i = 0; i < 2000 && links.length < count; i++) {
      const d = randomDiagram(random, 14, 5);
      if (componentCount(d) > 1) links.push(d);
    }
    return links;
  };

  it('proper exactly when V(i) ≠ 0, on random links (linking numbers against Murakami); both routes agree where proper', () => {
    let proper = 0;
    let notProper = 0;
    for (const d of randomLinks(5102, 150)) {
      const r = analyzeDiagram(d);
      const odd = oddLinkingComponents(r.linking, r.components);
      const fromJones = arfFromJonesAtI(r.jones, r.components);
      expect(fromJones === null).toBe(odd.length > 0);
      if (fromJones === null) notProper++;
      else {
        expect(arfByFusion(d)).toBe(fromJones);
        proper++;
      }
    }
    expect(proper).toBeGreaterThan(20);
    expect(notProper).toBeGreaterThan(20);
  });

  it('additive under split union and connected sum, unchanged by a free loop, a Reidemeister I curl and the mirror image (Robertello 1965: Arf is defined through fusion; common practice)', () => {
    const proper = randomLinks(5103, 200).filter((d) => value(d) !== null).slice(0, 12);
    const knots = [closeBraid([1, 1, 1], 2), closeBraid([1, -2, 1, -2], 3), closeBraid([1, 1, 1, 1, 1, 1, 1], 2)];
    expect(proper.length).toBe(12);
    for (const [i, d] of proper.entries()) {
      const a = value(d)!;
      const k = knots[i % knots.length]!;
      const b = value(k)!;
      expect(value(disjointUnion(d, k))).toBe((a + b) % 2);
      expect(value(connectedSum(d, k))).toBe((a + b) % 2);
      expect(value(withFreeLoops(d, 1))).toBe(a);
      expect(value(addCurl(d, 0, 1, true))).toBe(a);
      expect(value(addCurl(d, 1, -1, false))).toBe(a);
      expect(value(mirrorDiagram(d))).toBe(a);
    }
  });

  it('unchanged by the Reidemeister moves (I, II, III) and flypes the simplifier makes, on random links that it shrinks (an invariant of the oriented link: common practice)', () => {
    let shrunk = 0;
    for (const d of randomLinks(5104, 120)) {
      const { diagram } = simplifyDiagram(d);
      if (diagram.crossings.length === d.crossings.length) continue;
      expect(value(diagram)).toBe(value(d));
      shrunk++;
    }
    expect(shrunk).toBeGreaterThan(20);
  });

  it('the routes really are compared: a wrong V stops the run with an internal error rather than giving a value', () => {
    const hopf = closeBraid([1, 1], 2);
    const unlink = withFreeLoops(closeBraid([], 1), 1);
    // V of the 2-component unlink handed to the Hopf link: V(i) ≠ 0, yet lk = 1.
    const unlinkV = Laurent.fromTerms([[0.5, -1n], [-0.5, -1n]]);
    expect(() => arfOfLink({ diagram: hopf, linking: linkingNumbers(hopf), jones: () => unlinkV })).toThrow(/internal: V\(i\) does not vanish/);
    // −V of the unlink: V(i) = +√2 says Arf 1, but fusing the unlink gives two unknots, Arf 0.
    expect(() => arfOfLink({ diagram: unlink, linking: linkingNumbers(unlink), jones: () => unlinkV.neg() })).toThrow(/internal: Arf invariant 1 from V\(i\) but 0 by fusion/);
  });

  it('a split union with a link that is not proper is not proper', () => {
    expect(value(disjointUnion(closeBraid([1, 1, 1], 2), closeBraid([1, 1], 2)))).toBe(null);
  });
});
