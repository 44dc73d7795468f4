import { describe, expect, it } from 'vitest';
import { mirrorDiagram } from '../../../src/core/diagram/model.ts';
import { withFreeLoops, addCurl } from '../../../src/core/diagram/operations.ts';
import { parseDiagramCode } from '../../../src/core/notation/index.ts';
import { khovanovByCube } from '../../../src/core/invariants/khovanov/cube.ts';
import { khovanovReport, homologicalWidth } from '../../../src/core/invariants/khovanov/index.ts';
import { khovanovAndReduced } from '../../../src/core/invariants/khovanov/local.ts';
import { braid, rankString, torusLink } from './support.ts';

const rightTrefoil = braid([1, 1, 1]);

describe('Khovanov homology: worked values', () => {
  it('right-handed trefoil: q + q³ + t²q⁵ + t³q⁹ with ℤ/2 at (3, 7) (Bar-Natan, AGT 2 (2002); from memory)', () => {
    for (const kh of [khovanovAndReduced(rightTrefoil).unreduced, khovanovByCube(rightTrefoil)]) {
      expect(kh.ranks).toEqual([[0, 1, 1], [0, 3, 1], [2, 5, 1], [3, 9, 1]]);
      expect(kh.torsion).toEqual([[3, 7, 2, 1]]);
    }
  });
  it('left-handed trefoil: the mirror grading, with ℤ/2 at (−2, −7) (Bar-Natan 2002; from memory)', () => {
    const kh = khovanovAndReduced(mirrorDiagram(rightTrefoil)).unreduced;
    expect(rankString(kh)).toBe('-3,-9:1 -2,-5:1 0,-3:1 0,-1:1');
    expect(kh.torsion).toEqual([[-2, -7, 2, 1]]);
  });
  it('figure-eight knot: t⁻²q⁻⁵ + t⁻¹q⁻¹ + q⁻¹ + q + tq + t²q⁵, ℤ/2 at (−1, −3) and (2, 3) (Bar-Natan 2002; from memory)', () => {
    const kh = khovanovAndReduced(braid([1, -2, 1, -2])).unreduced;
    expect(rankString(kh)).toBe('-2,-5:1 -1,-1:1 0,-1:1 0,1:1 1,1:1 2,5:1');
    expect(kh.torsion).toEqual([[-1, -3, 2, 1], [2, 3, 2, 1]]);
  });
  it('positive Hopf link: 1 + q² + t²q⁴ + t²q⁶, no torsion (Khovanov 2000; from memory)', () => {
    const kh = khovanovAndReduced(braid([1, 1])).unreduced;
    expect(rankString(kh)).toBe('0,0:1 0,2:1 2,4:1 2,6:1');
    expect(kh.torsion).toEqual([]);
  });
  it('unknot: q + q⁻¹, as a round circle, a PD curl and a twice-curled circle (Khovanov 2000)', () => {
    const curl = parseDiagramCode('(1,1,2,2)', 'pd');
    for (const d of [withFreeLoops(braid([1]), 0), curl, addCurl(curl, 0, -1, true)]) {
      const report = khovanovReport(d);
      expect(rankString(report.homology)).toBe('0,-1:1 0,1:1');
      expect(report.reduced).toEqual({ ranks: [[0, 0, 1]], torsion: [] });
      expect(report.rasmussen).toBe(0);
      expect(report.thin).toBe(true);
    }
  });
  it('T(3,4) = 8₁₉ is the first thick knot: q⁵ + q⁷ + t²q⁹ + t³q¹³ + t⁴q¹¹ + t⁴q¹³ + t⁵q¹⁵ + t⁵q¹⁷ (Bar-Natan 2002 table; from memory)', () => {
    const report = khovanovReport(torusLink(3, 4));
    expect(rankString(report.homology)).toBe('0,5:1 0,7:1 2,9:1 3,13:1 4,11:1 4,13:1 5,15:1 5,17:1');
    expect(report.width).toBe(3);
    expect(report.thin).toBe(false);
    expect(report.rasmussen).toBe(6);
  });
  it('reduced homology of the trefoils and the figure-eight knot (Khovanov, Patterns in knot cohomology I, 2003; from memory)', () => {
    expect(rankString(khovanovAndReduced(rightTrefoil).reduced)).toBe('0,2:1 2,6:1 3,8:1');
    expect(rankString(khovanovAndReduced(mirrorDiagram(rightTrefoil)).reduced)).toBe('-3,-8:1 -2,-6:1 0,-2:1');
    expect(rankString(khovanovAndReduced(braid([1, -2, 1, -2])).reduced)).toBe('-2,-4:1 -1,-2:1 0,0:1 1,2:1 2,4:1');
  });
  it('s of torus knots is (p − 1)(q − 1) (Rasmussen 2010, via the positive-braid formula; from memory)', () => {
    for (const [p, q] of [[2, 3], [2, 5], [2, 7], [3, 4], [3, 5]] as const) {
      expect(khovanovReport(torusLink(p, q)).rasmussen).toBe((p - 1) * (q - 1));
      expect(khovanovReport(mirrorDiagram(torusLink(p, q))).rasmussen).toBe(-(p - 1) * (q - 1));
    }
  });
  it('width counts the diagonals j − 2i from lowest to highest (common practice)', () => {
    expect(homologicalWidth([[0, 1, 1], [0, 3, 1]])).toBe(2);
    expect(homologicalWidth([[0, 5, 1], [3, 13, 1], [4, 11, 1]])).toBe(3);
    expect(homologicalWidth([])).toBe(0);
  });
});

describe('the work budget', () => {
  it('stops a computation past its budget with a KhovanovBudgetError instead of running on (common practice)', async () => {
    const { KhovanovBudgetError } = await import('../../../src/core/invariants/khovanov/local.ts');
    expect(() => khovanovAndReduced(torusLink(3, 5), { workBudget: 200 })).toThrow(KhovanovBudgetError);
    expect(khovanovAndReduced(torusLink(3, 5), { workBudget: 1e7 }).unreduced.ranks.length).toBeGreaterThan(0);
  });
});
