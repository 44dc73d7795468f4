/**
 * The registry of invariants: every registered invariant is documented,
 * declares its conventions, gives a JSON example that is its real value for
 * the positive trefoil, is typeset as valid KaTeX in every declared
 * convention, and names test files that check it against an outside source.
 * Values of the positive trefoil (closure of the braid σ₁³), from memory:
 * V = t + t³ − t⁴ (Jones 1985), ⟨D⟩ = A⁻⁷ − A⁻³ − A⁵ (Kauffman 1987), Δ = t⁻¹ − 1 + t,
 * ∇ = 1 + z², det = 3, σ = −2 in the sign of V + Vᵀ (common practice), crossing number 3.
 * The positive Hopf link (closure of σ₁²) has linking number +1 (common practice).
 */
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import katex from 'katex';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { DEFAULT_CONVENTION, type Convention } from '../../src/core/convention/convention.ts';
import { CONVENTION_SETTINGS } from '../../src/core/convention/settings.ts';
import { CLAIM_KEYS, FILL_KEYS, INVARIANTS, claimKeyForHeader } from '../../src/core/invariants/registry/index.ts';
import { keyTableMarkdown } from '../../src/core/invariants/registry/key-table.ts';
import { quantity, valueOf } from '../../src/core/invariants/registry/lazy.ts';
import { judgeClaim } from '../../src/core/claims/index.ts';
import { isInputError } from '../../src/core/errors.ts';
import type { Typeset } from '../../src/core/claims/api.ts';

const ROOT = join(import.meta.dirname, '..', '..');
const trefoil = () => analyzeDiagram(closeBraid([1, 1, 1], 2));
const hopf = () => analyzeDiagram(closeBraid([1, 1], 2));

/** Every convention that differs from the default only in the settings named. */
function conventionsVarying(settings: readonly string[]): Convention[] {
  let all: Convention[] = [DEFAULT_CONVENTION];
  for (const key of settings) {
    const spec = CONVENTION_SETTINGS.find((s) => s.key === key)!;
    all = all.flatMap((c) => spec.values.map((v) => ({ ...c, [spec.field]: v })));
  }
  return all;
}

function rendersInKatex(t: Typeset): void {
  const pieces = t.kind === 'math' ? [t.latex] : t.text.split('$').filter((_, i) => i % 2 === 1);
  for (const latex of pieces) expect(() => katex.renderToString(latex, { throwOnError: true }), latex).not.toThrow();
}

describe('every registered invariant', () => {
  for (const invariant of INVARIANTS) {
    describe(invariant.id, () => {
      it('is documented, with its keys, conventions and cost', () => {
        expect(invariant.doc.length).toBeGreaterThan(20);
        expect(invariant.claims.length + invariant.fills.length).toBeGreaterThan(0);
        for (const c of invariant.claims) {
          expect(c.noun).not.toBe('');
          expect(c.valueDoc).not.toBe('');
          expect(c.example).not.toBe('');
        }
        for (const f of invariant.fills) expect(f.valueDoc).not.toBe('');
        const known = CONVENTION_SETTINGS.map((s) => s.key);
        for (const setting of invariant.conventions) expect(known).toContain(setting);
        expect(['instant', 'polynomial', 'contraction', 'exponential']).toContain(invariant.cost);
      });

      it('gives JSON examples that are its values for the positive trefoil (from memory, see above)', () => {
        if (invariant.json.length === 0) expect(invariant.withoutJson ?? '').not.toBe('');
        for (const field of invariant.json) expect(field.value(trefoil(), DEFAULT_CONVENTION), field.field).toMatchObject(field.example as object);
      });

      it('agrees with its own claim examples (the positive trefoil; the positive Hopf link for link-only keys)', () => {
        for (const c of invariant.claims) {
          let judgement;
          try {
            judgement = judgeClaim(c.key, c.example, trefoil(), { convention: DEFAULT_CONVENTION });
          } catch (e) {
            if (!isInputError(e) || e.ruleId !== 'claim-inapplicable') throw e;
            judgement = judgeClaim(c.key, c.example, hopf(), { convention: DEFAULT_CONVENTION });
          }
          expect(judgement.verdict, `${c.key}=${c.example}: ${judgement.reason}`).toBe('agrees');
        }
      });

      it('typesets valid KaTeX in every declared convention (KaTeX, throwOnError)', () => {
        for (const convention of conventionsVarying(invariant.conventions)) {
          // typesetValue asks `inapplicable` first and never typesets a key for a diagram it does not apply to.
          for (const f of invariant.fills) {
            for (const r of [trefoil(), hopf()]) if (invariant.inapplicable?.(r, f.key) === undefined) rendersInKatex(f.typeset(r, convention));
          }
        }
      });

      it('names test files that check it against an outside source', () => {
        expect(invariant.tests.length).toBeGreaterThan(0);
        for (const file of invariant.tests) {
          expect(existsSync(join(ROOT, file)), file).toBe(true);
          const text = readFileSync(join(ROOT, file), 'utf8');
          expect(/from memory|common practice|\b(1[89]|20)\d\d\b/.test(text), `${file} names no source`).toBe(true);
        }
      });
    });
  }
});

describe('the registry as a whole', () => {
  it('gives the keys in the order messages list them', () => {
    expect(CLAIM_KEYS.slice(0, 3)).toEqual(['jones', 'bracket', 'span']);
    expect(FILL_KEYS).toContain('statement');
    expect(FILL_KEYS).toContain('genus');
    expect(CLAIM_KEYS).not.toContain('genus');
  });

  it('reads the table headers survey papers print (det, σ, c(K), Jones polynomial: common practice)', () => {
    expect(claimKeyForHeader('det')).toBe('determinant');
    expect(claimKeyForHeader(' σ ')).toBe('signature');
    expect(claimKeyForHeader('$\\sigma$')).toBe('signature');
    expect(claimKeyForHeader('c(K)')).toBe('crossing-number');
    expect(claimKeyForHeader('Jones polynomial')).toBe('jones');
    expect(claimKeyForHeader('JONES')).toBe('jones');
    expect(claimKeyForHeader('name')).toBeUndefined();
  });

  it('computes a report field only when it is read, and once', () => {
    const report = analyzeDiagram(closeBraid([1, -2, 1, -2], 3));
    expect(Object.getOwnPropertyDescriptor(report, 'classical')!.get).toBeDefined();
    expect(Object.getOwnPropertyDescriptor(report, 'jones')!.get).toBeDefined();
    expect(report.classical.determinant).toBe(5n); // det(4₁) = 5, from memory
    expect(Object.getOwnPropertyDescriptor(report, 'classical')!.value).toBe(report.classical);
    expect(Object.getOwnPropertyDescriptor(report, 'jones')!.get).toBeDefined();
    let runs = 0;
    const counted = quantity('counted', (r) => (runs++, r.crossings));
    expect([valueOf(report, counted), valueOf(report, counted), valueOf(analyzeDiagram(report.diagram), counted)]).toEqual([4, 4, 4]);
    expect(runs).toBe(1);
  });

  it('is the README key table', () => {
    const path = join(ROOT, 'README.md');
    const readme = readFileSync(path, 'utf8');
    const begin = readme.indexOf('-->', readme.indexOf('<!-- key-table:')) + 4;
    const end = readme.indexOf('<!-- end: key-table -->');
    if (process.env['SKEINPROOF_UPDATE_README'] === '1') writeFileSync(path, `${readme.slice(0, begin)}${keyTableMarkdown()}\n${readme.slice(end)}`);
    else expect(readme.slice(begin, end)).toBe(`${keyTableMarkdown()}\n`);
  });
});
