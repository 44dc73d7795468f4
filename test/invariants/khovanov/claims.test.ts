import { describe, expect, it } from 'vitest';
import { analyzeDiagram } from '../../../src/core/analyze/analyze.ts';
import { judgeClaim, typesetValue } from '../../../src/core/claims/index.ts';
import { readPoincarePolynomial, readTorsionGroup } from '../../../src/core/claims/khovanov-claims.ts';
import { DEFAULT_CONVENTION, type Convention, type KhovanovGrading } from '../../../src/core/convention/convention.ts';
import { parseDiagramCode } from '../../../src/core/notation/index.ts';
import { braid } from './support.ts';
import { closeBraid } from '../../../src/core/diagram/braid-closure.ts';
import { DEFAULT_WORK_BUDGET, workBudgetFor } from '../../../src/core/invariants/khovanov/local.ts';

const trefoil = analyzeDiagram(braid([1, 1, 1]));
const convention = (khovanovGrading: KhovanovGrading): Convention => ({ ...DEFAULT_CONVENTION, khovanovGrading });
const judge = (key: string, text: string, grading: KhovanovGrading = 'standard', report = trefoil) =>
  judgeClaim(key, text, report, { convention: convention(grading) });

describe('Khovanov claims on the right-handed trefoil (values from Bar-Natan, AGT 2 (2002); from memory)', () => {
  it('the Poincaré polynomial agrees in each declared grading', () => {
    expect(judge('khovanov', 'q + q^3 + t^2 q^5 + t^3 q^9').verdict).toBe('agrees');
    expect(judge('khovanov', 'q^{-1} + q^{-3} + t^{2}q^{-5} + t^3q^{-9}', 'q-inverse').verdict).toBe('agrees');
    expect(judge('khovanov', 'q + q^3 + t^{-2} q^5 + t^{-3} q^9', 'homological').verdict).toBe('agrees');
    expect(judge('khovanov', 'q^{-1} + q^{-3} + t^{-2} q^{-5} + t^{-3} q^{-9}', 'mirror').verdict).toBe('agrees');
  });
  it('names the slips: mirror, the other grading, reduced for unreduced, a shifted grading', () => {
    const mirror = judge('khovanov', 'q^{-1} + q^{-3} + t^{-2} q^{-5} + t^{-3} q^{-9}');
    expect([mirror.verdict, mirror.diagnosis?.kind]).toEqual(['contradicts', 'mirror']);
    const qInverse = judge('khovanov', 'q^{-1} + q^{-3} + t^{2}q^{-5} + t^3q^{-9}');
    expect(qInverse.diagnosis?.detail).toContain('quantum grading negated');
    const reduced = judge('khovanov', 'q^2 + t^2 q^6 + t^3 q^8');
    expect(reduced.diagnosis?.detail).toContain('reduced Poincaré polynomial');
    const shifted = judge('khovanov', 'q^2 + q^4 + t^2 q^6 + t^3 q^{10}');
    expect([shifted.diagnosis?.kind, shifted.diagnosis?.detail]).toEqual(['shifted', expect.stringContaining('times q')]);
    const unreduced = judge('khovanov-reduced', 'q + q^3 + t^2 q^5 + t^3 q^9');
    expect(unreduced.diagnosis?.detail).toContain('unreduced');
  });
  it('ranks and torsion at a bidegree, with the torsion shifted under the mirror convention (universal coefficients)', () => {
    expect(judge('khovanov-rank', '3, 9: 1').verdict).toBe('agrees');
    expect(judge('khovanov-rank', '(3, 7) = 0').verdict).toBe('agrees');
    expect(judge('khovanov-torsion', '3, 7: \\mathbb{Z}/2').verdict).toBe('agrees');
    expect(judge('khovanov-torsion', '(0, 1) = 0').verdict).toBe('agrees');
    expect(judge('khovanov-torsion', '-2, -7: \\mathbb{Z}_2', 'mirror').verdict).toBe('agrees');
    const wrong = judge('khovanov-torsion', '3, 7: \\mathbb{Z}/3');
    expect(wrong.verdict).toBe('contradicts');
    expect(wrong.reason).toContain('is ℤ/2, not ℤ/3');
  });
  it('width, thinness and s (s = 2 for the right-handed trefoil, Rasmussen 2010)', () => {
    expect(judge('khovanov-width', '2').verdict).toBe('agrees');
    expect(judge('thin', 'yes').verdict).toBe('agrees');
    expect(judge('rasmussen', '2').verdict).toBe('agrees');
    const negated = judge('rasmussen', '-2');
    expect([negated.verdict, negated.diagnosis?.kind]).toEqual(['contradicts', 'mirror']);
    expect(judge('rasmussen', '2').reason).toContain('slice genus is at least 1');
  });
  it('a DT code fixes the knot up to mirror only: the mirror value agrees with a warning (common practice)', () => {
    const dt = analyzeDiagram(parseDiagramCode('4 6 2', 'dt'));
    const computed = typesetValue('khovanov', dt, DEFAULT_CONVENTION);
    expect(computed.kind).toBe('math');
    const other = judge('khovanov', 'q + q^3 + t^2 q^5 + t^3 q^9', 'standard', dt);
    const alsoOther = judge('khovanov', 'q^{-1} + q^{-3} + t^{-2} q^{-5} + t^{-3} q^{-9}', 'standard', dt);
    expect([other.verdict, alsoOther.verdict]).toEqual(['agrees', 'agrees']);
    expect([other.warning, alsoOther.warning].filter(Boolean)).toHaveLength(1);
  });
  it('fill-ins typeset the Poincaré polynomial in the declared grading and term order', () => {
    expect(typesetValue('khovanov', trefoil, DEFAULT_CONVENTION)).toEqual({ kind: 'math', latex: 'q + q^{3} + t^{2}q^{5} + t^{3}q^{9}' });
    expect(typesetValue('khovanov', trefoil, { ...convention('homological'), termOrder: 'descending' })).toEqual({ kind: 'math', latex: 'q^{3} + q + t^{-2}q^{5} + t^{-3}q^{9}' });
    expect(typesetValue('khovanov-reduced', trefoil, DEFAULT_CONVENTION)).toEqual({ kind: 'math', latex: 'q^{2} + t^{2}q^{6} + t^{3}q^{8}' });
    expect(typesetValue('rasmussen', trefoil, DEFAULT_CONVENTION)).toEqual({ kind: 'math', latex: '2' });
  });
});

describe('reading Khovanov claims', () => {
  it('reads Poincaré polynomials with coefficients, braces, \\cdot and an optional left side', () => {
    expect(readPoincarePolynomial('Kh(K) = 2t^{-1}q^{-3} + q\\cdot t + 1')).toEqual(new Map([['-1,-3', 2], ['1,1', 1], ['0,0', 1]]));
  });
  it('refuses a signed polynomial at the minus sign, and a stray letter at the letter', () => {
    expect(() => readPoincarePolynomial('q - q^3')).toThrow(/no negative coefficients/);
    let error: unknown;
    try {
      readPoincarePolynomial('q + x^3');
    } catch (e) {
      error = e;
    }
    expect((error as { span?: unknown } | undefined)?.span).toEqual({ start: 4, end: 5 });
  });
  it('refuses a trailing + at the +, inside the text (a fuzz case once pointed past its end)', () => {
    let error: unknown;
    try {
      readPoincarePolynomial('t + ');
    } catch (e) {
      error = e;
    }
    expect((error as Error).message).toMatch(/ends after `\+`/);
    expect((error as { span?: unknown }).span).toEqual({ start: 2, end: 3 });
  });
  it('reads torsion groups: 0, ℤ/n sums, powers, subscripts; ℤ/6 as ℤ/2 ⊕ ℤ/3', () => {
    expect(readTorsionGroup('0')).toEqual([]);
    expect(readTorsionGroup('\\mathbb{Z}/2 \\oplus \\mathbb{Z}_{4}')).toEqual([2, 4]);
    expect(readTorsionGroup('(\\mathbb{Z}/2)^2')).toEqual([2, 2]);
    expect(readTorsionGroup('ℤ/6')).toEqual([2, 3]);
    expect(() => readTorsionGroup('Q/2')).toThrow(/not a cyclic group/);
  });
});

describe('the work budget follows the time budget (--time-budget)', () => {
  // T(4,5), 15 crossings, s = (p − 1)(q − 1) = 12 (Rasmussen 2010): its computation counts about 2·10⁵ work units.
  const word = Array.from({ length: 5 }, () => [1, 2, 3]).flat();
  const torus45 = (timeBudgetMs: number) => analyzeDiagram(closeBraid(word, 4), { timeBudgetMs });
  it('scales 2·10⁶ units per second: 10 s gives the default budget, 1 s computes T(4,5), 50 ms stops it', () => {
    expect(workBudgetFor(10_000)).toBe(DEFAULT_WORK_BUDGET);
    expect(workBudgetFor(undefined)).toBe(DEFAULT_WORK_BUDGET);
    expect(judgeClaim('rasmussen', '12', torus45(1000), { convention: DEFAULT_CONVENTION }).verdict).toBe('agrees');
    let error: unknown;
    try {
      judgeClaim('rasmussen', '12', torus45(50), { convention: DEFAULT_CONVENTION });
    } catch (e) {
      error = e;
    }
    expect(error).toMatchObject({ ruleId: 'khovanov-over-limit' });
    expect((error as Error).message).toContain('more than 100000 elementary steps');
    expect((error as Error).message).toContain('raise the time budget (--time-budget 0.1 doubles the 1·10^5 steps it allows)');
  });
});
