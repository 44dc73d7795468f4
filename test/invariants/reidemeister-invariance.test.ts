/**
 * Every registered invariant that is an invariant of the oriented link is
 * unchanged by Reidemeister moves (Reidemeister 1927; Alexander–Briggs 1926:
 * two diagrams of the same link are joined by moves I, II and III), checked as
 * an outside fact on random knots and links moved at random (fast-check, fixed
 * seeds; every diagram on the way is printed as a PD code and read back). The
 * values come from the registry's `compute --json` fields, so an invariant added
 * later is compared too once it is listed below. Bounds (crossing number, braid
 * index) are not invariants themselves, but the bounds of two diagrams of one
 * link must overlap, and exact values must agree. The bracket is a regular
 * isotopy invariant: moves II and III keep it, and move I multiplies it by
 * −A^(±3) (Kauffman, Topology 26 (1987)). The mirror image turns V(t) into
 * V(t⁻¹), σ into −σ, P(v, z) into P(−v⁻¹, z), F(a, z) into F(a⁻¹, z), the
 * linking numbers into their negatives, Kh^{i,j} into Kh^{−i,−j} over ℚ and s
 * into −s, multiplies Δ and ∇ by (−1)^(μ−1) and keeps det and Arf (common practice; Khovanov 2000, Prop. 35).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { mirrorDiagram, writhe, type LinkDiagram } from '../../src/core/diagram/model.ts';
import { parseDiagramCode, printPdCode } from '../../src/core/notation/index.ts';
import { Laurent } from '../../src/core/poly/laurent.ts';
import { simplifyDiagram } from '../../src/core/simplify/simplify.ts';
import { registryFields } from '../support/registry-fields.ts';
import { randomBraidWord, rng, shuffleDiagram } from '../support/random-diagrams.ts';
import { reverseComponent } from '../support/reverse-component.ts';
import { pushFinger, randomMove, randomMoves, type MoveKind } from '../support/reidemeister.ts';

/** JSON fields whose value is an invariant of the oriented link, compared exactly. */
const LINK_INVARIANT_FIELDS = [
  'jones',
  'span',
  'minDegree',
  'maxDegree',
  'bracketSpan',
  'components',
  'alexander',
  'conway',
  'determinant',
  'signature',
  'homfly',
  'kauffman',
  'khovanov',
  'khovanovReduced',
  'khovanovWidth',
  'thin',
  'rasmussen',
  'arf',
] as const;

/** JSON fields that are bounds: two diagrams of one link must give overlapping ranges and equal exact values. */
const BOUND_FIELDS = ['crossingNumber', 'braidIndex'] as const;

interface Bounds {
  readonly lower: number;
  readonly upper: number;
  readonly exact: number | null;
}

/** The link's values: exact fields, the linking numbers as a sorted list (components may be renumbered), bounds. */
function linkValues(d: LinkDiagram): { exact: Record<string, unknown>; bounds: Record<string, Bounds> } {
  const fields = registryFields(d);
  const exact: Record<string, unknown> = {};
  for (const f of LINK_INVARIANT_FIELDS) {
    if (!fields.has(f)) throw new Error(`the registry has no JSON field ${f}: update this test`);
    exact[f] = fields.get(f);
  }
  exact.linking = (fields.get('linking') as { value: number }[]).map((l) => l.value).sort((a, b) => a - b);
  const bounds: Record<string, Bounds> = {};
  for (const f of BOUND_FIELDS) bounds[f] = fields.get(f) as Bounds;
  return { exact, bounds };
}

function expectSameLink(before: LinkDiagram, after: LinkDiagram, note: string): void {
  const [a, b] = [linkValues(before), linkValues(after)];
  expect(b.exact, note).toEqual(a.exact);
  for (const f of BOUND_FIELDS) {
    const [x, y] = [a.bounds[f]!, b.bounds[f]!];
    expect(Math.max(x.lower, y.lower), `${note}: ${f} ranges ${x.lower}–${x.upper} and ${y.lower}–${y.upper} overlap`).toBeLessThanOrEqual(Math.min(x.upper, y.upper));
    if (x.exact !== null && y.exact !== null) expect(y.exact, `${note}: exact ${f}`).toBe(x.exact);
  }
}

/** A random knot or link on 2–4 strands with 1–8 crossings, crossings shuffled, as a PD code read back. */
const diagramArbitrary = fc
  .record({ strands: fc.integer({ min: 2, max: 4 }), length: fc.integer({ min: 1, max: 8 }), seed: fc.integer() })
  .map(({ strands, length, seed }) => {
    const random = rng(seed);
    const d = shuffleDiagram(closeBraid(randomBraidWord(random, strands, length), strands), random);
    return d.freeLoops === 0 ? parseDiagramCode(printPdCode(d), 'pd') : d;
  });

const describeDiagram = (d: LinkDiagram) => (d.freeLoops === 0 && d.crossings.length > 0 ? printPdCode(d) : `${d.crossings.length} crossings, ${d.freeLoops} free loops`);

describe('registered link invariants are unchanged by random Reidemeister moves (Reidemeister 1927)', () => {
  it('on random knots and links, six random moves each (fast-check, seed 20261205)', () => {
    fc.assert(
      fc.property(diagramArbitrary, fc.integer(), (d, seed) => {
        const { diagram, moves } = randomMoves(d, 6, rng(seed));
        expectSameLink(d, diagram, `${describeDiagram(d)} after ${moves.join(', ')}: ${describeDiagram(diagram)}`);
      }),
      { seed: 20261205, numRuns: 100 },
    );
  });

  it('each kind of move is met, so none is silently skipped (the walk above is not vacuous)', () => {
    const seen = new Set<MoveKind>();
    const random = rng(77);
    for (let k = 0; k < 40; k++) {
      const d = shuffleDiagram(closeBraid(randomBraidWord(random, 3, 6), 3), random);
      for (const kind of ['R1+', 'R1-', 'R2+', 'R2-', 'R3'] as const) {
        const moved = randomMove(kind === 'R1-' ? randomMove(d, 'R1+', random)! : d, kind, random);
        if (moved) seen.add(kind);
      }
    }
    expect([...seen].sort()).toEqual(['R1+', 'R1-', 'R2+', 'R2-', 'R3']);
  });
});

describe('the simplifier keeps the link (its moves are Reidemeister moves and flypes; common practice)', () => {
  it('the smaller diagram it finds has every link invariant of the diagram it started from (fast-check, seed 1926)', () => {
    fc.assert(
      fc.property(diagramArbitrary, fc.integer(), (d, seed) => {
        const { diagram } = randomMoves(d, 6, rng(seed));
        const smaller = simplifyDiagram(diagram).diagram;
        expectSameLink(diagram, smaller, `${describeDiagram(diagram)} simplified to ${describeDiagram(smaller)}`);
      }),
      { seed: 1926, numRuns: 60 },
    );
  });
});

describe('the Kauffman bracket under the moves (Kauffman, Topology 26 (1987))', () => {
  it('II and III keep ⟨D⟩; I multiplies it by −A^(3·sign of the new crossing), so (−A³)^(−w)⟨D⟩ is kept', () => {
    fc.assert(
      fc.property(diagramArbitrary, fc.integer(), (d, seed) => {
        const random = rng(seed);
        for (const kind of ['R2+', 'R3', 'R1+', 'R2-', 'R1-'] as const) {
          const moved = randomMove(d, kind, random);
          if (!moved) continue;
          const [before, after] = [analyzeDiagram(d).bracket, analyzeDiagram(moved).bracket];
          const dw = writhe(moved) - writhe(d);
          // (−A³)^dw: dw is ±1 for move I and 0 for II and III.
          const factor = Laurent.fromTerms([[3 * dw, dw % 2 === 0 ? 1n : -1n]]);
          expect(Math.abs(dw), kind).toBe(kind.startsWith('R1') ? 1 : 0);
          expect(after.equals(before.mul(factor)), `${kind} on ${describeDiagram(d)}`).toBe(true);
        }
      }),
      { seed: 1987, numRuns: 60 },
    );
  });
});

describe('mirror images (common practice; Khovanov, Duke Math. J. 101 (2000), Prop. 35 for Kh)', () => {
  it('V(t) → V(t⁻¹), σ → −σ, lk → −lk, P(v, z) → P(−v⁻¹, z), F(a, z) → F(a⁻¹, z), s → −s, Δ and ∇ times (−1)^(μ−1); det, Arf, span kept', () => {
    fc.assert(
      fc.property(diagramArbitrary, (d) => {
        const [a, m] = [registryFields(d), registryFields(mirrorDiagram(d))];
        const terms = (f: string, from: Map<string, unknown>) => (from.get(f) as { terms: (readonly (number | string)[])[] }).terms;
        // Terms are listed by ascending exponents (the first, then the second): sort the flipped ones alike.
        const flipped = (ts: (readonly (number | string)[])[], flip: (t: readonly (number | string)[]) => (number | string)[]) =>
          ts.map(flip).sort((x, y) => (x[0] as number) - (y[0] as number) || (x.length === 3 ? (x[1] as number) - (y[1] as number) : 0));
        expect(terms('jones', m)).toEqual(flipped(terms('jones', a), ([e, c]) => [0 - (e as number), c!]));
        expect(m.get('signature')).toBe(0 - (a.get('signature') as number));
        expect((m.get('linking') as { value: number }[]).map((l) => l.value)).toEqual((a.get('linking') as { value: number }[]).map((l) => 0 - l.value));
        // P(−v⁻¹, z): the term v^i z^j goes to (−1)^i v^(−i) z^j.
        expect(terms('homfly', m)).toEqual(
          flipped(terms('homfly', a), ([i, j, c]) => [0 - (i as number), j!, ((i as number) % 2 === 0 ? BigInt(c!) : -BigInt(c!)).toString()]),
        );
        expect(terms('kauffman', m)).toEqual(flipped(terms('kauffman', a), ([i, j, c]) => [0 - (i as number), j!, c!]));
        const s = a.get('rasmussen');
        expect(m.get('rasmussen')).toBe(s === null ? null : 0 - (s as number));
        // ∇ of the mirror is (−1)^(μ−1)∇(z): by the skein relation ∇(L₊) − ∇(L₋) = z∇(L₀), whose L₀ has μ ± 1 components.
        const linkSign = (a.get('components') as number) % 2 === 0 ? -1n : 1n;
        for (const f of ['alexander', 'conway']) expect(terms(f, m), f).toEqual(terms(f, a).map(([e, c]) => [e, (linkSign * BigInt(c!)).toString()]));
        for (const f of ['determinant', 'arf', 'span', 'components', 'khovanovWidth']) expect(m.get(f), f).toEqual(a.get(f));
      }),
      { seed: 318, numRuns: 50 },
    );
  });
});

describe('reversing one component K of a link, with λ = lk(K, L − K)', () => {
  it('V becomes t^(−3λ)V (Lickorish, An Introduction to Knot Theory, Prop. 3.7, from memory), F becomes a^(4λ)F (F = a^(−w)Λ with Λ unoriented: w drops by 4λ), lk(K, ·) changes sign, det is kept and |Δσ| = 2|λ| (Murasugi 1965, sign left open)', () => {
    let linked = 0;
    fc.assert(
      fc.property(diagramArbitrary, fc.nat(), (d, pick) => {
        if (d.components.length < 2) return;
        const k = pick % d.components.length;
        const turned = reverseComponent(d, k);
        const [a, b] = [registryFields(d), registryFields(turned)];
        const lambda = analyzeDiagram(d).linking.filter((l) => l.components.includes(k)).reduce((s, l) => s + l.value, 0);
        if (lambda !== 0) linked++;
        const jones = (f: Map<string, unknown>) => (f.get('jones') as { terms: [number, string][] }).terms;
        expect(jones(b)).toEqual(jones(a).map(([e, c]) => [e - 3 * lambda, c]));
        const kauffman = (f: Map<string, unknown>) => (f.get('kauffman') as { terms: [number, number, string][] }).terms;
        expect(kauffman(b)).toEqual(kauffman(a).map(([i, j, c]) => [i + 4 * lambda, j, c]));
        expect(b.get('determinant')).toBe(a.get('determinant'));
        expect(Math.abs((b.get('signature') as number) - (a.get('signature') as number))).toBe(2 * Math.abs(lambda));
        const lkSum = (f: Map<string, unknown>) => (f.get('linking') as { value: number }[]).reduce((s, l) => s + l.value, 0);
        expect(lkSum(b)).toBe(lkSum(a) - 2 * lambda);
      }),
      { seed: 1965, numRuns: 80 },
    );
    expect(linked, 'links with λ ≠ 0 among the random ones').toBeGreaterThan(15);
  });
});

describe('the finger move itself', () => {
  it('adds exactly two crossings of opposite signs and keeps the components (common practice: Reidemeister II)', () => {
    const d = parseDiagramCode('(4,2,5,1) (8,6,1,5) (6,3,7,4) (2,7,3,8)', 'pd'); // figure-eight knot (from memory)
    const random = rng(9);
    let made = 0;
    for (let k = 0; k < 30; k++) {
      const moved = randomMove(d, 'R2+', random);
      if (!moved) continue;
      made++;
      expect(moved.crossings.length).toBe(d.crossings.length + 2);
      expect(writhe(moved)).toBe(writhe(d));
      expect(moved.components.length).toBe(1);
    }
    expect(made).toBeGreaterThan(10);
    expect(pushFinger(d, 0, 0, true)).toBeUndefined();
  });
});
