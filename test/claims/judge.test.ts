/**
 * Verdicts and slip diagnoses. Values from memory (Jones 1985; Kauffman 1987):
 * V(positive trefoil) = t + t³ − t⁴, V(left trefoil) = −t⁻⁴ + t⁻³ + t⁻¹,
 * V(4₁) = t⁻² − t⁻¹ + 1 − t + t², V(positive Hopf) = −t^{1/2} − t^{5/2},
 * ⟨positive trefoil⟩ = A⁻⁷ − A⁻³ − A⁵ (⟨O⟩ = 1). Each slip value below is
 * worked by hand from those.
 */
import { describe, expect, it } from 'vitest';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import type { DiagramReport } from '../../src/core/analyze/report.ts';
import { parseDiagramCode } from '../../src/core/notation/index.ts';
import { DEFAULT_CONVENTION, type Convention } from '../../src/core/convention/convention.ts';
import { judgeClaim, type ClaimKey, type JudgeContext } from '../../src/core/claims/index.ts';
import { InputError } from '../../src/core/errors.ts';
import { Laurent } from '../../src/core/poly/laurent.ts';

const rightTrefoil = analyzeDiagram(closeBraid([1, 1, 1], 2));
const figureEight = analyzeDiagram(closeBraid([1, -2, 1, -2], 3));
const positiveHopf = analyzeDiagram(closeBraid([1, 1], 2));
const ctx: JudgeContext = { convention: DEFAULT_CONVENTION };
const judge = (key: ClaimKey, text: string, report: DiagramReport = rightTrefoil, context: JudgeContext = ctx) => judgeClaim(key, text, report, context);

describe('polynomial claims: exact equality', () => {
  it('agrees with the correct Jones polynomial and gives no diagnosis', () => {
    const j = judge('jones', 't + t^3 - t^4');
    expect(j.verdict).toBe('agrees');
    expect(j.diagnosis).toBeUndefined();
    expect(j.computed).toBe('t + t^3 - t^4');
  });
  it('agrees with the correct bracket in any layout (descending, \\cdot, braces)', () => {
    expect(judge('bracket', '-A^{5} - {A^{-3}} + 1\\cdot A^{-7}').verdict).toBe('agrees');
  });
});

describe('slip diagnoses, each on its slip and not on a correct claim', () => {
  const cases: { name: string; key: ClaimKey; claim: string; kind: string; report?: DiagramReport; check?: (d: NonNullable<ReturnType<typeof judge>['diagnosis']>) => void }[] = [
    { name: 'mirror: the left trefoil value for the right trefoil', key: 'jones', claim: '-t^{-4}+t^{-3}+t^{-1}', kind: 'mirror' },
    { name: 'mirror of the bracket (A ↔ A⁻¹)', key: 'bracket', claim: 'A^{7} - A^{3} - A^{-5}', kind: 'mirror' },
    { name: 'negated', key: 'jones', claim: '-t - t^3 + t^4', kind: 'negated' },
    {
      name: 'shifted by t',
      key: 'jones',
      claim: 't^2 + t^4 - t^5',
      kind: 'shifted',
      check: (d) => {
        expect(d.shift).toBe(1);
        expect(d.detail).not.toMatch(/writhe factor/);
      },
    },
    { name: 'shifted with a sign (−t^{-3/2})', key: 'jones', claim: '-t^{-1/2} - t^{3/2} + t^{5/2}', kind: 'shifted', check: (d) => expect(d.shift).toBe(-1.5) },
    // (−A³)^{−w}⟨D⟩ with w = 3 is the bracket times −A^{-9}: Jones at t = A^{-4} given for the bracket.
    {
      name: 'shifted: Jones at t = A^{-4} where the bracket was meant, named as the writhe factor',
      key: 'bracket',
      claim: '-A^{-16} + A^{-12} + A^{-4}',
      kind: 'shifted',
      check: (d) => {
        expect(d.shift).toBe(-9);
        expect(d.detail).toMatch(/writhe factor/);
      },
    },
    // ⟨4₁⟩ = A⁸ − A⁴ + 1 − A⁻⁴ + A⁻⁸ (from memory) has w = 0; for the trefoil, A = t^{-1/4} in ⟨D⟩ gives quarter powers.
    // The positive Hopf link (w = 2): ⟨D⟩ = −A⁴ − A⁻⁴ at A = t^{-1/4} is −t^{-1} − t, i.e. V times −t^{-3/2}.
    {
      name: 'shifted: the Hopf bracket at A = t^{-1/4} without the writhe factor',
      key: 'jones',
      claim: '-t^{-1} - t',
      report: positiveHopf,
      kind: 'shifted',
      check: (d) => {
        expect(d.shift).toBe(-1.5);
        expect(d.detail).toMatch(/without the writhe factor/);
      },
    },
    { name: 'normalization: the loop bracket where ⟨O⟩ = 1 is declared', key: 'bracket', claim: '-A^{-9} + A^{-1} + A^{3} + A^{7}', kind: 'normalization' },
    { name: 'normalization: V times −t^{1/2} − t^{−1/2}', key: 'jones', claim: '-t^{1/2} - t^{3/2} - t^{5/2} + t^{9/2}', kind: 'normalization' },
    { name: 'normalization: the bracket where Jones was meant', key: 'jones', claim: 'A^{-7} - A^{-3} - A^{5}', kind: 'normalization' },
    { name: 'normalization: Jones where the bracket was meant', key: 'bracket', claim: 't + t^3 - t^4', kind: 'normalization' },
    { name: 'normalization: q where the document declares t', key: 'jones', claim: 'q^2 + q^6 - q^8', kind: 'normalization' },
    {
      name: 'one-coefficient: one sign wrong',
      key: 'jones',
      claim: 't + t^3 + t^4',
      kind: 'one-coefficient',
      check: (d) => expect(d.term).toEqual({ exponent: 4, computed: '-1', claimed: '1' }),
    },
    {
      name: 'one-coefficient: a term left out',
      key: 'jones',
      claim: 't + t^3',
      kind: 'one-coefficient',
      check: (d) => expect(d.term).toEqual({ exponent: 4, computed: '-1', claimed: '0' }),
    },
    { name: 'none: nothing explains it', key: 'jones', claim: '1 + t^{10}', kind: 'none' },
  ];
  for (const c of cases) {
    it(c.name, () => {
      const j = judge(c.key, c.claim, c.report);
      expect(j.verdict).toBe('contradicts');
      expect(j.diagnosis?.kind).toBe(c.kind);
      c.check?.(j.diagnosis!);
    });
  }
  it('one-exponent: a single term at the wrong power (t + t^3 - t^5 for the trefoil t + t^3 - t^4, Jones 1985, from memory)', () => {
    const j = judge('jones', 't + t^3 - t^5', rightTrefoil);
    expect(j.diagnosis).toMatchObject({ kind: 'one-exponent', exponent: { computed: 4, claimed: 5, coefficient: '-1' } });
    expect(j.reason).toBe('the claim differs from the computed value t + t^3 - t^4; only one exponent differs: the term -t^4 is written -t^5');
    // A term moved onto a power the value already has is not one wrong exponent.
    expect(judge('jones', 't - t^3 + t^3', rightTrefoil).diagnosis?.kind).not.toBe('one-exponent');
  });
  it('swapped: the figure-eight value stated for the trefoil, when the document has both', () => {
    const others = new Map([
      ['tref', rightTrefoil],
      ['fig8', figureEight],
    ]);
    const claim = 't^{-2} - t^{-1} + 1 - t + t^2';
    const j = judge('jones', claim, rightTrefoil, { convention: DEFAULT_CONVENTION, others, selfId: 'tref' });
    expect(j.diagnosis).toMatchObject({ kind: 'swapped', otherDiagram: 'fig8' });
    // Without the other diagram in the document nothing explains it.
    expect(judge('jones', claim).diagnosis?.kind).toBe('none');
    // The diagram's own correct value is never "swapped" with itself.
    const self = judge('jones', claim, figureEight, { convention: DEFAULT_CONVENTION, others, selfId: 'fig8' });
    expect(self.verdict).toBe('agrees');
    expect(self.diagnosis).toBeUndefined();
  });
  it('accepts a mirror value with a warning for a DT code, whose chirality is not fixed', () => {
    const dt = analyzeDiagram(parseDiagramCode('4 6 2', 'dt'));
    expect(dt.chiralityFixed).toBe(false);
    const own = Laurent.fromTerms([[1, 1], [3, 1], [4, -1]]).equals(dt.jones) ? 't + t^3 - t^4' : '-t^{-4}+t^{-3}+t^{-1}';
    const mirror = own === 't + t^3 - t^4' ? '-t^{-4}+t^{-3}+t^{-1}' : 't + t^3 - t^4';
    const ownJudgement = judge('jones', own, dt);
    expect(ownJudgement.verdict).toBe('agrees');
    expect(ownJudgement.warning).toBeUndefined();
    const mirrorJudgement = judge('jones', mirror, dt);
    expect(mirrorJudgement.verdict).toBe('agrees');
    expect(mirrorJudgement.warning).toMatch(/mirror/);
    expect(mirrorJudgement.diagnosis?.kind).toBe('mirror');
  });
  it('for a DT code, diagnoses a slip from the mirror image’s value too (4 6 2: a trefoil, V = t + t³ − t⁴ or its mirror, from memory)', () => {
    const dt = analyzeDiagram(parseDiagramCode('4 6 2', 'dt'));
    expect(dt.chiralityFixed).toBe(false);
    const mirrorOf = (p: Laurent) => p.substitutePower(-1);
    const own = dt.jones;
    // One sign wrong in the mirror's value: −t⁻⁴ + t⁻³ + t⁻¹ with the last sign flipped.
    const claim = mirrorOf(own).sub(Laurent.monomial(-1, 2n * mirrorOf(own).coefficient(-1)));
    const j = judge('jones', claim.toPlainString('t').replace(/\(([^)]*)\)/g, '{$1}'), dt);
    expect(j.verdict).toBe('contradicts');
    expect(j.diagnosis?.kind).toBe('one-coefficient');
    expect(j.diagnosis?.detail).toMatch(/^compared with the mirror image's value .*, which a DT code allows as well: only the coefficient of t\^\{-1\} differs/);
    expect(j.diagnosis?.term).toEqual({ exponent: -1, computed: String(mirrorOf(own).coefficient(-1)), claimed: String(-mirrorOf(own).coefficient(-1)) });
    // The same value is two slips away from a braid's fixed chirality: no single slip explains it.
    expect(judge('jones', '-t^{-4}+t^{-3}-t^{-1}').diagnosis?.kind).toBe('none');
    const negatedMirror = judge('jones', mirrorOf(own).neg().toPlainString('t').replace(/\(([^)]*)\)/g, '{$1}'), dt);
    expect(negatedMirror.diagnosis?.kind).toBe('negated');
    expect(negatedMirror.diagnosis?.detail).toContain('that value with every sign reversed');
  });
  it('judges in the declared convention: the q-graded Hopf link value (t^{1/2} = −q)', () => {
    const convention: Convention = { ...DEFAULT_CONVENTION, jonesVariable: 'q-graded' };
    expect(judge('jones', 'q + q^5', positiveHopf, { convention }).verdict).toBe('agrees');
    // −q − q⁵ is the plain q form; in the q-graded document it is the negation.
    expect(judge('jones', '-q - q^5', positiveHopf, { convention }).diagnosis?.kind).toBe('negated');
    expect(judge('jones', '-q - q^5', positiveHopf, { convention }).diagnosis?.detail).toContain('also V written in the convention jones=q');
  });
  it('names the convention whose value a mirror claim is: t ↔ t⁻¹ is also jones=t-inverse', () => {
    const mirror = judge('jones', '-t^{-4}+t^{-3}+t^{-1}');
    expect(mirror.diagnosis?.kind).toBe('mirror');
    expect(mirror.diagnosis?.detail).toContain('also V written in the convention jones=t-inverse');
    // For the figure-eight knot (amphichiral) nothing is added to a negated value, which no convention gives.
    expect(judge('jones', '-t^{-2} + t^{-1} - 1 + t - t^2', figureEight).diagnosis?.detail).toBe('the claim is the computed value with every sign reversed');
  });
  it('diagnoses a value written in another declared convention as normalization', () => {
    const qDocument: Convention = { ...DEFAULT_CONVENTION, jonesVariable: 'q' };
    const inT = judge('jones', 't + t^3 - t^4', rightTrefoil, { convention: qDocument });
    expect(inT.verdict).toBe('contradicts');
    expect(inT.diagnosis?.kind).toBe('normalization');
    expect(inT.diagnosis?.detail).toMatch(/jones=t/);
    const loopDocument: Convention = { ...DEFAULT_CONVENTION, bracketNormalization: 'loop' };
    const unit = judge('bracket', 'A^{-7} - A^{-3} - A^{5}', rightTrefoil, { convention: loopDocument });
    expect(unit.diagnosis?.kind).toBe('normalization');
    expect(unit.diagnosis?.detail).toMatch(/bracket=unit/);
    // A value in a foreign variable that matches no form of the invariant is unexplained.
    expect(judge('jones', 't + t^5', rightTrefoil, { convention: qDocument }).diagnosis?.kind).toBe('none');
  });
  it('throws claim-unreadable for text it cannot read', () => {
    expect(() => judge('jones', 't^{2')).toThrow(InputError);
  });
});

describe('number and property claims', () => {
  it('span, degrees, writhe, counts of the positive trefoil (span 3, degrees 1..4, writhe 3)', () => {
    expect(judge('span', '3').verdict).toBe('agrees');
    expect(judge('span', '4').verdict).toBe('contradicts');
    expect(judge('min-degree', '1').verdict).toBe('agrees');
    expect(judge('max-degree', '4').verdict).toBe('agrees');
    expect(judge('writhe', '3').verdict).toBe('agrees');
    expect(judge('crossings', '3').verdict).toBe('agrees');
    expect(judge('components', '1').verdict).toBe('agrees');
    expect(judge('bracket-span', '12').verdict).toBe('agrees');
  });
  it('names the mirror for a writhe of the wrong sign and the bracket span for span V', () => {
    expect(judge('writhe', '-3').diagnosis?.kind).toBe('mirror');
    expect(judge('writhe', '2').diagnosis).toBeUndefined();
    expect(judge('span', '12').diagnosis?.kind).toBe('normalization');
  });
  it('reads half-integer degrees of the Hopf link: min degree 1/2, max 5/2', () => {
    expect(judge('min-degree', '\\frac{1}{2}', positiveHopf).verdict).toBe('agrees');
    expect(judge('max-degree', '5/2', positiveHopf).verdict).toBe('agrees');
  });
  it('bracket-span: 12 for the trefoil with ⟨O⟩ = 1, 16 with the loop normalisation; the other normalisation and span V are named (from memory, A⁻⁷ − A⁻³ − A⁵)', () => {
    const loop: JudgeContext = { convention: { ...DEFAULT_CONVENTION, bracketNormalization: 'loop' } };
    expect(judge('bracket-span', '12').verdict).toBe('agrees');
    expect(judge('bracket-span', '16', rightTrefoil, loop).verdict).toBe('agrees');
    const other = judge('bracket-span', '16');
    expect(other.diagnosis?.kind).toBe('normalization');
    expect(other.diagnosis?.detail).toMatch(/bracket=loop, but the document declares bracket=unit/);
    expect(judge('bracket-span', '12', rightTrefoil, loop).diagnosis?.detail).toMatch(/bracket=unit, but the document declares bracket=loop/);
    expect(judge('bracket-span', '3').diagnosis?.detail).toMatch(/span of the Jones polynomial in t/);
    expect(judge('bracket-span', '13').diagnosis).toBeUndefined();
  });
  it('an Alexander polynomial stated with ≐ agrees up to a unit ±t^k; with = it must be Conway-normalised (Δ(3₁) = t⁻¹ − 1 + t, from memory)', () => {
    const upToUnits = judge('alexander', '\\Delta(t) \\doteq t^2 - t + 1');
    expect(upToUnits.verdict).toBe('agrees');
    expect(upToUnits.reason).toContain('times t');
    expect(judge('alexander', '\\Delta_K \\doteq -1 + t - t^{2}').verdict).toBe('agrees');
    expect(judge('alexander', '\\Delta(t) ≐ t^{-1} - 1 + t').verdict).toBe('agrees');
    expect(judge('alexander', '\\Delta(t) = t^2 - t + 1').diagnosis?.kind).toBe('shifted');
    expect(judge('alexander', '\\Delta(t) \\doteq t^2 + t + 1').verdict).toBe('contradicts');
    // ≐ is no licence for a Jones polynomial, which has no unit ambiguity.
    expect(judge('jones', 'V \\doteq t^2 + t^4 - t^5').diagnosis?.kind).toBe('shifted');
  });
  it('linking number of the positive Hopf link is +1 (common practice); −1 is the other orientation', () => {
    expect(judge('linking', '1', positiveHopf).verdict).toBe('agrees');
    expect(judge('linking', '-1', positiveHopf).diagnosis?.kind).toBe('negated');
    expect(() => judge('linking', '1')).toThrow(/two or more components/);
  });
  it('reads a linking claim after a left-hand side whose comma is not a separator, and a list written as a tuple', () => {
    expect(judge('linking', 'lk(K_1, K_2) = 1', positiveHopf).verdict).toBe('agrees');
    expect(judge('linking', '\\operatorname{lk}(K_1,K_2)=1', positiveHopf).reason).toBe('the linking number is 1');
    // A chain of two Hopf links, closure of σ₁²σ₂²: lk = 1 for neighbours, 0 for the ends (common practice).
    const chain = analyzeDiagram(closeBraid([1, 1, 2, 2], 3));
    expect(judge('linking', '(1, 0, 1)', chain).verdict).toBe('agrees');
    expect(judge('linking', '[1; 0; 1]', chain).verdict).toBe('agrees');
    expect(judge('linking', '1, 0, -1', chain).reason).toContain('(pair (2,3) differs)');
    expect(() => judge('linking', '1, 1', chain)).toThrow(/lists 2 linking numbers, but this 3-component link has 3 pairs/);
    expect(() => judge('linking', '1, 1', positiveHopf)).toThrow(/has 1 pair of components/);
  });
  it('alternating / reduced / adequate as yes/no/true/false', () => {
    expect(judge('alternating', 'yes').verdict).toBe('agrees');
    expect(judge('reduced', 'True').verdict).toBe('agrees');
    expect(judge('adequate', '\\text{no}').verdict).toBe('contradicts');
    expect(judge('alternating', 'Yes.').verdict).toBe('agrees');
    expect(judge('alternating', '$\\text{yes}$').verdict).toBe('agrees');
    const nonReduced = analyzeDiagram(closeBraid([1, 1, 1, 2], 3));
    const j = judge('reduced', 'yes', nonReduced);
    expect(j.verdict).toBe('contradicts');
    expect(j.reason).toMatch(/nugatory/);
    expect(() => judge('alternating', 'maybe')).toThrow(/not a yes\/no answer/);
  });
  it('refuses a fractional writhe and a degree that is no multiple of 1/2', () => {
    expect(() => judge('writhe', '1/2')).toThrow(/integer/);
    expect(() => judge('min-degree', '1/3')).toThrow(/whole or half number/);
  });
});

describe('crossing-number claims against proven bounds', () => {
  it('reduced alternating (positive trefoil): exactly 3 by Kauffman–Murasugi–Thistlethwaite', () => {
    const j = judge('crossing-number', '3');
    expect(j.verdict).toBe('agrees');
    expect(['kauffman-murasugi-thistlethwaite', 'thistlethwaite-adequate']).toContain(j.theorem);
    expect(judge('crossing-number', '\\le 3').verdict).toBe('agrees');
    expect(judge('crossing-number', '≥ 3').verdict).toBe('agrees');
    expect(judge('crossing-number', '2').verdict).toBe('contradicts');
    expect(judge('crossing-number', '>= 4').verdict).toBe('contradicts');
    expect(judge('crossing-number', '< 3').verdict).toBe('contradicts');
  });
  it('non-reduced (trefoil with a nugatory kink): claiming 4 is refuted by removing the nugatory crossing', () => {
    const report = analyzeDiagram(closeBraid([1, 1, 1, 2], 3));
    const j = judge('crossing-number', '4', report);
    expect(j.verdict).toBe('contradicts');
    expect(j.theorem).toBe('nugatory-removal');
    // The reason reads as a sentence for a single nugatory crossing (common practice of English grammar).
    expect(j.reason).toContain('The nugatory crossing can be undone by turning over one side of the diagram, leaving 3 crossings.');
    expect(judge('crossing-number', '3', report).verdict).toBe('agrees');
  });
  it('non-alternating adequate: the crossing count is exact by Thistlethwaite', () => {
    const report = analyzeDiagram(closeBraid([-1, -1, -2, -2, -2, -1], 3));
    expect(report.alternating).toBe(false);
    expect(report.adequate && report.reduced).toBe(true);
    const j = judge('crossing-number', '6', report);
    expect(j.verdict).toBe('agrees');
    expect(j.theorem).toBe('thistlethwaite-adequate');
    const low = judge('crossing-number', '5', report);
    expect(low.verdict).toBe('contradicts');
  });
  it('split diagram (two trefoils side by side): the span bound for possibly split links meets the crossing count', () => {
    const report = analyzeDiagram(closeBraid([1, 1, 1, 3, 3, 3], 4));
    expect(report.connected).toBe(false);
    expect(judge('crossing-number', '6', report).verdict).toBe('agrees');
    expect(judge('crossing-number', '7', report).verdict).toBe('contradicts');
  });
  it('undecided when the bounds do not meet, giving both bounds and why', () => {
    const report = analyzeDiagram(closeBraid([1, 1, 1, -2, -1, -1, -1, -2], 3));
    const { lower, upper } = report.crossingNumber;
    expect(lower).toBeLessThan(upper);
    const j = judge('crossing-number', `${lower + 1}`, report);
    expect(j.verdict).toBe('undecided');
    expect(j.reason).toContain(`between ${lower} and ${upper}`);
    expect(j.reason).toMatch(/not alternating/);
    expect(judge('crossing-number', `\\le ${upper}`, report).verdict).toBe('agrees');
    expect(judge('crossing-number', `\\geq ${lower}`, report).verdict).toBe('agrees');
    expect(judge('crossing-number', `\\le ${upper - 1}`, report).verdict).toBe('undecided');
    expect(judge('crossing-number', `at least ${upper + 1}`, report).verdict).toBe('contradicts');
    expect(judge('crossing-number', `${lower - 1}`, report).verdict).toBe('contradicts');
  });
  it('reads the claim as authors write it: a left-hand side, turned round, words, \\text, dollars (c(3₁) = 3, from memory)', () => {
    for (const claim of ['c(K) \\le 7', 'c(K) \\leq 3', 'c \\geq 3', 'c(3_1) = 3', '3 \\le c(K)', '7 \\ge c(K)', 'At most 3', '\\text{at most } 3', '$\\le 3$', '\\(\\le 3\\)', '\\[ c(K) = 3 \\]', '\\leqq 4', 'no more than 3']) {
      expect(judge('crossing-number', claim).verdict, claim).toBe('agrees');
    }
    expect(judge('crossing-number', '5 \\le c(K)').verdict).toBe('contradicts');
    expect(judge('crossing-number', 'c(K) < 3').reason).toContain('not less than 3');
    expect(judge('crossing-number', 'c(K) > 3').reason).toContain('not more than 3');
  });
  it('judges a two-sided range: agrees only when both bounds confirm it, naming both theorems', () => {
    const report = analyzeDiagram(closeBraid([1, 1, 1, -2, -1, -1, -1, -2], 3));
    const { lower, upper } = report.crossingNumber;
    for (const claim of [`${lower} \\le c(K) \\le ${upper}`, `${lower - 1} < c < ${upper + 1}`, `${upper} \\ge c(K) \\ge ${lower}`, `between ${lower} and ${upper}`]) {
      const j = judge('crossing-number', claim, report);
      expect(j.verdict, claim).toBe('agrees');
      expect(j.reason).toContain(`between ${lower} and ${upper}`);
      expect(j.reason).toMatch(/lower bound comes from the Kauffman–Murasugi–Thistlethwaite theorem/);
      expect(j.reason).toMatch(/upper bound comes from counting the crossings/);
    }
    expect(judge('crossing-number', `${lower + 1} \\le c(K) \\le ${upper}`, report).verdict).toBe('undecided');
    expect(judge('crossing-number', `${upper + 1} \\le c(K) \\le ${upper + 3}`, report).verdict).toBe('contradicts');
    expect(judge('crossing-number', `Between ${lower + 1} and ${upper}`, report).verdict).toBe('undecided');
  });
  it('refuses crossing-number claims it cannot read, at the place of the fault', () => {
    const refused = (claim: string) => {
      try {
        judge('crossing-number', claim);
      } catch (e) {
        expect(e).toBeInstanceOf(InputError);
        return e as InputError;
      }
      throw new Error(`not refused: ${claim}`);
    };
    expect(refused('3 \\le').span).toEqual({ start: 2, end: 5 });
    expect(refused('3 \\le').message).toContain('nothing follows `\\le`');
    expect(refused('6 \\ge c \\le 3').span).toEqual({ start: 8, end: 11 });
    expect(refused('5 \\le c \\le 3').message).toContain('leaves no value');
    expect(refused('3 \\le 4').message).toContain('compares two numbers');
    const word = refused('three');
    expect(word.span).toEqual({ start: 0, end: 5 });
    expect(word.message).toContain('`three` is not a number');
    expect(word.message).not.toContain('exponent');
  });
  it('refuses a crossing-number claim it cannot read, pointing past the relation', () => {
    try {
      judge('crossing-number', '\\le x');
      throw new Error('not refused');
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).span).toEqual({ start: 4, end: 5 });
    }
  });
});
