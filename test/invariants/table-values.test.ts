/**
 * Knots up to eight crossings and four links, each written from memory as a
 * code, against values from memory of the knot tables: the Conway polynomial
 * (Δ(t) = ∇(t^(1/2) − t^(−1/2)), Conway normalisation), the determinant, |σ|
 * (DT codes fix a prime knot only up to mirror), the Arf invariant, the
 * crossing number (which the tool must prove exact: every diagram here is
 * reduced alternating or a torus knot) and the braid index where recalled (which must lie
 * within the tool's bounds).
 * Every recalled value is also checked by an independent route inside this
 * file: det = |∇(2i)| (Δ(−1) = ∇(2i)), and for knots Arf = 0 exactly when
 * det ≡ ±1 (mod 8) (Levine 1966; Murasugi) and Arf = a₂ mod 2 (the z²
 * coefficient of ∇; common practice), so a slip of memory shows as a failure
 * of the table itself rather than passing silently.
 */
import { describe, expect, it } from 'vitest';
import { parseDiagramCode } from '../../src/core/notation/index.ts';
import type { Notation } from '../../src/core/diagram/model.ts';
import { randomDiagram, rng } from '../support/random-diagrams.ts';
import { registryFields } from '../support/registry-fields.ts';

interface Row {
  readonly name: string;
  readonly notation: Notation;
  readonly code: string;
  /** ∇(z) as [exponent, coefficient]; up to sign for a link with an even number of components given without its chirality. */
  readonly conway: readonly (readonly [number, number])[];
  readonly determinant: number;
  readonly absSignature?: number;
  readonly arf: 0 | 1 | null;
  readonly crossingNumber: number;
  readonly braidIndex?: number;
  /** Sorted linking numbers, for links. */
  readonly linking?: readonly number[];
}

// Codes and values from memory (knot tables); DT codes in the common table form, all entries positive for alternating knots.
const ROWS: readonly Row[] = [
  { name: '3_1', notation: 'dt', code: '4 6 2', conway: [[0, 1], [2, 1]], determinant: 3, absSignature: 2, arf: 1, crossingNumber: 3, braidIndex: 2 },
  { name: '4_1', notation: 'dt', code: '4 6 8 2', conway: [[0, 1], [2, -1]], determinant: 5, absSignature: 0, arf: 1, crossingNumber: 4, braidIndex: 3 },
  { name: '5_1', notation: 'dt', code: '6 8 10 2 4', conway: [[0, 1], [2, 3], [4, 1]], determinant: 5, absSignature: 4, arf: 1, crossingNumber: 5, braidIndex: 2 },
  { name: '5_2', notation: 'dt', code: '4 8 10 2 6', conway: [[0, 1], [2, 2]], determinant: 7, absSignature: 2, arf: 0, crossingNumber: 5, braidIndex: 3 },
  { name: '6_1', notation: 'dt', code: '4 8 12 10 2 6', conway: [[0, 1], [2, -2]], determinant: 9, absSignature: 0, arf: 0, crossingNumber: 6, braidIndex: 4 },
  { name: '6_2', notation: 'dt', code: '4 8 10 12 2 6', conway: [[0, 1], [2, -1], [4, -1]], determinant: 11, absSignature: 2, arf: 1, crossingNumber: 6, braidIndex: 3 },
  { name: '6_3', notation: 'dt', code: '4 8 10 2 12 6', conway: [[0, 1], [2, 1], [4, 1]], determinant: 13, absSignature: 0, arf: 1, crossingNumber: 6, braidIndex: 3 },
  { name: '7_1', notation: 'dt', code: '8 10 12 14 2 4 6', conway: [[0, 1], [2, 6], [4, 5], [6, 1]], determinant: 7, absSignature: 6, arf: 0, crossingNumber: 7, braidIndex: 2 },
  { name: '7_2', notation: 'dt', code: '4 10 14 12 2 8 6', conway: [[0, 1], [2, 3]], determinant: 11, absSignature: 2, arf: 1, crossingNumber: 7 },
  { name: '7_3', notation: 'dt', code: '6 10 12 14 2 4 8', conway: [[0, 1], [2, 5], [4, 2]], determinant: 13, absSignature: 4, arf: 1, crossingNumber: 7 },
  { name: '7_4', notation: 'dt', code: '6 10 12 14 4 2 8', conway: [[0, 1], [2, 4]], determinant: 15, absSignature: 2, arf: 0, crossingNumber: 7 },
  { name: '7_5', notation: 'dt', code: '4 10 12 14 2 8 6', conway: [[0, 1], [2, 4], [4, 2]], determinant: 17, absSignature: 4, arf: 0, crossingNumber: 7 },
  { name: '7_6', notation: 'dt', code: '4 8 12 2 14 6 10', conway: [[0, 1], [2, 1], [4, -1]], determinant: 19, absSignature: 2, arf: 1, crossingNumber: 7 },
  { name: '7_7', notation: 'dt', code: '4 8 10 12 2 14 6', conway: [[0, 1], [2, -1], [4, 1]], determinant: 21, absSignature: 0, arf: 1, crossingNumber: 7 },
  // 8_18 = closure of (σ1σ2⁻¹)⁴, 8_19 = T(3, 4) = closure of (σ1σ2)⁴ (from memory).
  { name: '8_18', notation: 'braid', code: '1 -2 1 -2 1 -2 1 -2', conway: [[0, 1], [2, 1], [4, -1], [6, -1]], determinant: 45, absSignature: 0, arf: 1, crossingNumber: 8, braidIndex: 3 },
  { name: '8_19 = T(3,4)', notation: 'braid', code: '1 2 1 2 1 2 1 2', conway: [[0, 1], [2, 5], [4, 5], [6, 1]], determinant: 3, absSignature: 6, arf: 1, crossingNumber: 8, braidIndex: 3 },
  // Links (from memory). T(2, 4) has lk 2, so it is proper, and fusing its components by the oriented smoothing of
  // one crossing (a band sum) gives the trefoil: Arf 1 (Robertello 1965). The Hopf link (lk 1) is not proper.
  // Links (from memory): positive Hopf link, Whitehead link (the two-bridge link 8/3; lk 0, ∇ = ±z³), Borromean rings (∇ = z⁴), positive T(2, 4).
  { name: 'Hopf link', notation: 'braid', code: '1 1', conway: [[1, 1]], determinant: 2, absSignature: 1, arf: null, crossingNumber: 2, braidIndex: 2, linking: [1] },
  { name: 'Whitehead link = two-bridge 8/3', notation: 'family', code: 'two-bridge 8/3', conway: [[3, 1]], determinant: 8, arf: 1, crossingNumber: 5, linking: [0] },
  { name: 'Borromean rings', notation: 'braid', code: '1 -2 1 -2 1 -2', conway: [[4, 1]], determinant: 16, absSignature: 0, arf: 1, crossingNumber: 6, braidIndex: 3, linking: [0, 0, 0] },
  { name: 'T(2,4)', notation: 'braid', code: '1 1 1 1', conway: [[1, 2], [3, 1]], determinant: 4, absSignature: 3, arf: 1, crossingNumber: 4, braidIndex: 2, linking: [2] },
];

/** ∇(2i) as a Gaussian integer [re, im]: Δ(−1) = ∇(2i), since t^(1/2) − t^(−1/2) = 2i at t^(1/2) = i. */
function conwayAtTwoI(conway: readonly (readonly [number, number])[]): [number, number] {
  let [re, im] = [0, 0];
  for (const [e, c] of conway) {
    const size = c * 2 ** e;
    // i^e cycles 1, i, −1, −i.
    const unit = [[1, 0], [0, 1], [-1, 0], [0, -1]][e % 4]!;
    re += size * unit[0]!;
    im += size * unit[1]!;
  }
  return [re, im];
}

describe('the table rows are consistent in themselves (independent routes to the recalled values)', () => {
  for (const row of ROWS) {
    it(`${row.name}: det = |∇(2i)|${row.linking ? '' : ', Arf from det mod 8 (Levine 1966) and from a₂'}`, () => {
      const [re, im] = conwayAtTwoI(row.conway);
      expect(Math.hypot(re, im)).toBe(row.determinant);
      if (!row.linking) {
        expect(row.arf).toBe([1, 7].includes(row.determinant % 8) ? 0 : 1);
        expect(row.arf).toBe(Math.abs(row.conway.find(([e]) => e === 2)?.[1] ?? 0) % 2);
      }
    });
  }
});

describe('values from memory of the knot tables against the computation', () => {
  for (const row of ROWS) {
    it(`${row.name} from its ${row.notation} code ${row.code}`, () => {
      const f = registryFields(parseDiagramCode(row.code, row.notation));
      const conway = (f.get('conway') as { terms: [number, string][] }).terms.map(([e, c]) => [e, Number(c)]);
      const evenLink = (f.get('components') as number) % 2 === 0;
      // A link with an even number of components has ∇ of odd degree, which the mirror negates.
      if (evenLink && row.notation === 'family') expect(conway.map(([e, c]) => [e, Math.abs(c!)])).toEqual(row.conway.map(([e, c]) => [e, Math.abs(c)]));
      else expect(conway).toEqual(row.conway);
      expect(f.get('determinant')).toBe(String(row.determinant));
      if (row.absSignature !== undefined) expect(Math.abs(f.get('signature') as number)).toBe(row.absSignature);
      expect(f.get('arf')).toBe(row.arf);
      expect(f.get('crossingNumber')).toMatchObject({ exact: row.crossingNumber });
      // The tool may leave the braid index a range (its upper bound is this diagram's Seifert circles), never exclude the value.
      if (row.braidIndex !== undefined) {
        const b = f.get('braidIndex') as { lower: number; upper: number; exact: number | null };
        expect(row.braidIndex).toBeGreaterThanOrEqual(b.lower);
        expect(row.braidIndex).toBeLessThanOrEqual(b.upper);
      }
      if (row.linking) expect((f.get('linking') as { value: number }[]).map((l) => l.value).sort((a, b) => a - b)).toEqual(row.linking);
    });
  }
});

describe('Jones polynomials of two links (from memory; V(1) = (−2)^(μ−1) and |V(−1)| = det checked alongside, Jones 1985)', () => {
  const jonesOf = (code: string, notation: Notation) => (registryFields(parseDiagramCode(code, notation)).get('jones') as { terms: [number, string][] }).terms.map(([e, c]) => [e, Number(c)] as const);
  const atOne = (terms: readonly (readonly [number, number])[]) => terms.reduce((s, [, c]) => s + c, 0);
  it('Borromean rings: −t³ + 3t² − 2t + 4 − 2t⁻¹ + 3t⁻² − t⁻³ (amphichiral, so no mirror question)', () => {
    const recalled = [[-3, -1], [-2, 3], [-1, -2], [0, 4], [1, -2], [2, 3], [3, -1]] as const;
    expect(atOne(recalled)).toBe(4);
    expect(recalled.reduce((s, [e, c]) => s + (e % 2 === 0 ? c : -c), 0)).toBe(16);
    expect(jonesOf('1 -2 1 -2 1 -2', 'braid')).toEqual(recalled);
  });
  it('Whitehead link: t^(−7/2) − 2t^(−5/2) + t^(−3/2) − 2t^(−1/2) + t^(1/2) − t^(3/2), up to mirror (lk = 0, so orientation does not matter)', () => {
    const recalled = [[-3.5, 1], [-2.5, -2], [-1.5, 1], [-0.5, -2], [0.5, 1], [1.5, -1]] as const;
    expect(atOne(recalled)).toBe(-2);
    const mirrored = recalled.map(([e, c]) => [0 - e, c] as const).reverse();
    expect([recalled, mirrored]).toContainEqual(jonesOf('two-bridge 8/3', 'family'));
  });
});

describe('signature against determinant on random knots (Murasugi 1965, from memory: (−1)^(σ/2) = sign Δ(−1) in the Conway normalisation)', () => {
  it('σ ≡ 0 (mod 4) exactly when Δ(−1) = ∇(2i) is positive, and |Δ(−1)| = det', () => {
    const random = rng(1965);
    let knots = 0;
    for (let k = 0; k < 200 && knots < 60; k++) {
      const d = randomDiagram(random, 12, 5);
      if (d.components.length !== 1 || d.freeLoops > 0) continue;
      knots++;
      const f = registryFields(d);
      const conway = (f.get('conway') as { terms: [number, string][] }).terms.map(([e, c]) => [e, Number(c)] as const);
      const [re, im] = conwayAtTwoI(conway);
      expect(im).toBe(0);
      expect(Math.abs(re)).toBe(Number(f.get('determinant')));
      expect((f.get('signature') as number) % 4 === 0).toBe(re > 0);
    }
    expect(knots).toBeGreaterThan(30);
  });
});
