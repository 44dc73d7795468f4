/**
 * Classical invariants of whole families against formulas and table values
 * recalled from memory: odd pretzel knots, the knots of seven crossings from
 * their DT codes, (2, n) torus links by the skein relation, and the
 * Whitehead link and Borromean rings.
 */
import { describe, expect, it } from 'vitest';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { classicalInvariants } from '../../src/core/invariants/classical/index.ts';
import { parseDiagramCode } from '../../src/core/notation/index.ts';
import { Laurent } from '../../src/core/poly/laurent.ts';

/**
 * The pretzel link P(a₁, a₂, a₃) with odd entries, as a signed Gauss code:
 * three vertical twist columns side by side, column i with |aᵢ| crossings,
 * joined at the top and bottom (column 3 back to column 1 around the
 * outside). The knot runs down column 1, up column 2, down column 3, up
 * column 1, down column 2 and up column 3; in each column the two strands are
 * antiparallel, so every crossing of column i has the sign of aᵢ, and the
 * strand entering a column at its top left passes over at the odd crossings
 * (counted from the top) when aᵢ > 0 and at the even ones when aᵢ < 0.
 */
function oddPretzelGauss(columns: readonly number[]): string {
  const first: number[] = [];
  let next = 1;
  for (const a of columns) {
    first.push(next);
    next += Math.abs(a);
  }
  const visit = (column: number, k: number, fromTopLeft: boolean): string => {
    const a = columns[column]!;
    const topLeftOver = (k % 2 === 1) === (a > 0);
    return `${topLeftOver === fromTopLeft ? 'o' : 'u'}${first[column]! + k - 1}${a > 0 ? '+' : '-'}`;
  };
  const crossings = (column: number): number[] => Array.from({ length: Math.abs(columns[column]!) }, (_, j) => j + 1);
  const down = (column: number): string[] => crossings(column).map((k) => visit(column, k, true));
  const up = (column: number): string[] => crossings(column).reverse().map((k) => visit(column, k, false));
  return [...down(0), ...up(1), ...down(2), ...up(0), ...down(1), ...up(2)].join(' ');
}

describe('odd pretzel knots P(p, q, r)', () => {
  // From memory: det P(p,q,r) = |pq + qr + rp|; the genus-one Seifert matrix ½[[p+q, q+1], [q−1, q+r]] has
  // determinant m = (pq + qr + rp + 1)/4, so Δ = m·t − (2m − 1) + m·t⁻¹. P(−3, 5, 7) has Δ = 1.
  for (const columns of [[1, 1, 1], [3, 3, 3], [-3, 5, 7], [3, 5, 7], [-1, -1, -1], [1, 1, -1], [-3, 3, 3], [5, -3, -3], [1, 3, 5], [-5, 3, 7]]) {
    it(`P(${columns.join(', ')}): det |pq + qr + rp| and the genus-one Alexander polynomial (from memory)`, () => {
      const [p, q, r] = columns as [number, number, number];
      const sum = p * q + q * r + r * p;
      const m = (sum + 1) / 4;
      const c = classicalInvariants(parseDiagramCode(oddPretzelGauss(columns), 'gauss'));
      expect(c.determinant).toBe(BigInt(Math.abs(sum)));
      expect(c.alexander.equals(Laurent.fromTerms([[-1, m], [0, 1 - 2 * m], [1, m]]))).toBe(true);
      // Genus one: |σ| ≤ 2 (from memory: |σ| ≤ 2g).
      expect(Math.abs(c.signature)).toBeLessThanOrEqual(2);
    });
  }
  it('P(3, 5, 7), all columns of one sign, is alternating: Traczyk agrees, and its mirror has the opposite σ (from memory)', () => {
    const c = classicalInvariants(parseDiagramCode(oddPretzelGauss([3, 5, 7]), 'gauss'));
    const mirror = classicalInvariants(parseDiagramCode(oddPretzelGauss([-3, -5, -7]), 'gauss'));
    expect(c.traczykSignature).toBe(c.signature);
    expect(Math.abs(c.signature)).toBe(2);
    expect(mirror.signature).toBe(-c.signature);
    expect(mirror.alexander.equals(c.alexander)).toBe(true);
  });
});

describe('knots of seven crossings from their DT codes (from memory: knot tables)', () => {
  for (const [name, code, alexander, determinant, absSignature] of [
    ['7₁', '8 10 12 14 2 4 6', [[-3, 1], [-2, -1], [-1, 1], [0, -1], [1, 1], [2, -1], [3, 1]], 7n, 6],
    ['7₂', '4 10 14 12 2 8 6', [[-1, 3], [0, -5], [1, 3]], 11n, 2],
    ['7₃', '6 10 12 14 2 4 8', [[-2, 2], [-1, -3], [0, 3], [1, -3], [2, 2]], 13n, 4],
    ['7₄', '6 10 12 14 4 2 8', [[-1, 4], [0, -7], [1, 4]], 15n, 2],
    ['7₅', '4 10 12 14 2 8 6', [[-2, 2], [-1, -4], [0, 5], [1, -4], [2, 2]], 17n, 4],
    ['7₆', '4 8 12 2 14 6 10', [[-2, -1], [-1, 5], [0, -7], [1, 5], [2, -1]], 19n, 2],
    ['7₇', '4 8 10 12 2 14 6', [[-2, 1], [-1, -5], [0, 9], [1, -5], [2, 1]], 21n, 0],
  ] as const) {
    it(`${name} (${code}): Δ, det ${determinant}, |σ| = ${absSignature}`, () => {
      const c = classicalInvariants(parseDiagramCode(code, 'dt'));
      expect(c.alexander.equals(Laurent.fromTerms(alexander.map(([e, k]) => [e, k])))).toBe(true);
      expect(c.determinant).toBe(determinant);
      expect(Math.abs(c.signature)).toBe(absSignature);
    });
  }
});

describe('non-alternating knots, where Traczyk does not apply and the Goeritz route is the only second opinion (from memory: knot tables)', () => {
  it('8₁₉ = T(3,4): Δ = t³ − t² + 1 − t⁻² + t⁻³, det 3, σ = −6 for the positive braid', () => {
    const c = classicalInvariants(closeBraid([1, 2, 1, 2, 1, 2, 1, 2], 3));
    expect(c.alexander.equals(Laurent.fromTerms([[-3, 1], [-2, -1], [0, 1], [2, -1], [3, 1]]))).toBe(true);
    expect(c.determinant).toBe(3n);
    expect(c.signature).toBe(-6);
    expect(c.traczykSignature).toBeNull();
  });
  it('10₁₂₄ = T(3,5): det 1, σ = −8 for the positive braid', () => {
    const c = classicalInvariants(closeBraid([1, 2, 1, 2, 1, 2, 1, 2, 1, 2], 3));
    expect(c.determinant).toBe(1n);
    expect(c.signature).toBe(-8);
  });
  it('8₂₀ (braid σ₁³σ₂⁻¹σ₁⁻³σ₂⁻¹): Δ = t² − 2t + 3 − 2t⁻¹ + t⁻², det 9, σ = 0', () => {
    const c = classicalInvariants(closeBraid([1, 1, 1, -2, -1, -1, -1, -2], 3));
    expect(c.alexander.equals(Laurent.fromTerms([[-2, 1], [-1, -2], [0, 3], [1, -2], [2, 1]]))).toBe(true);
    expect(c.determinant).toBe(9n);
    expect(c.signature).toBe(0);
  });
  it('8₂₁ (DT 4 8 −12 2 14 −6 16 10): Δ = −t² + 4t − 5 + 4t⁻¹ − t⁻², det 15, |σ| = 2', () => {
    const c = classicalInvariants(parseDiagramCode('4 8 -12 2 14 -6 16 10', 'dt'));
    expect(c.alexander.equals(Laurent.fromTerms([[-2, -1], [-1, 4], [0, -5], [1, 4], [2, -1]]))).toBe(true);
    expect(c.determinant).toBe(15n);
    expect(Math.abs(c.signature)).toBe(2);
  });
});

describe('links', () => {
  it('(2, n) torus links and knots: ∇ by the skein recursion ∇ₙ = z·∇ₙ₋₁ + ∇ₙ₋₂, det n, σ = −(n − 1) (from memory)', () => {
    const z = Laurent.monomial(1);
    let [previous, current] = [Laurent.zero, Laurent.one]; // ∇ of the 2-component unlink and of the unknot (n = 0, 1)
    for (let n = 2; n <= 12; n++) {
      [previous, current] = [current, z.mul(current).add(previous)];
      const c = classicalInvariants(closeBraid(Array.from({ length: n }, () => 1), 2));
      expect(c.conway.equals(current)).toBe(true);
      expect(c.determinant).toBe(BigInt(n));
      expect(c.signature).toBe(-(n - 1));
    }
  });
  it('Whitehead link: ∇ = ±z³ and det 8; Borromean rings: ∇ = z⁴, det 16, σ = 0 (from memory)', () => {
    const whitehead = classicalInvariants(closeBraid([1, -2, 1, -2, -2], 3));
    expect(whitehead.conway.equals(Laurent.monomial(3)) || whitehead.conway.equals(Laurent.monomial(3, -1))).toBe(true);
    expect(whitehead.determinant).toBe(8n);
    expect(Math.abs(whitehead.signature)).toBe(1); // σ ≡ μ − 1 (mod 2) when det ≠ 0 (from memory)
    const borromean = classicalInvariants(closeBraid([1, -2, 1, -2, 1, -2], 3));
    expect(borromean.conway.equals(Laurent.monomial(4))).toBe(true);
    expect(borromean.determinant).toBe(16n);
    expect(borromean.signature).toBe(0);
  });
});
