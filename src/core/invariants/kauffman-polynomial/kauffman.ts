/**
 * Kauffman's two-variable polynomials, by contraction in the unoriented skein
 * module of a disk (layered-skein/engine.ts).
 *
 * F(a, z) = a^(−w(D)) Λ(D), where Λ is the regular-isotopy invariant with
 * Λ(L₊) + Λ(L₋) = z(Λ(L₀) + Λ(L∞)), Λ(positive curl) = aΛ, Λ(unknot) = 1
 * (Kauffman, Trans. AMS 318, 1990). The Dubrovnik variant Y(a, z) = a^(−w(D)) D(D)
 * has D(L₊) − D(L₋) = z(D(L₀) − D(L∞)) with the same curl and unknot values.
 * Both are computed by the same engine with their own rules, so the relation
 * between them (Lickorish) is a genuine check.
 */
import { writhe, type LinkDiagram, type Sign } from '../../diagram/model.ts';
import { Laurent2 } from '../../poly/laurent2.ts';
import type { ContractionLimits, SkeinRules } from '../layered-skein/engine.ts';
import { skeinPolynomial } from '../layered-skein/polynomial.ts';

const Z = Laurent2.monomial(0, 1);
const MINUS_ONE = Laurent2.monomial(0, 0, -1);
const CURL: Record<Sign, Laurent2> = { 1: Laurent2.monomial(1, 0), [-1]: Laurent2.monomial(-1, 0) };

/** Λ: X = −X̄ + z(X_A + X_B), loop (a + a⁻¹)/z − 1. */
export const KAUFFMAN_RULES: SkeinRules = {
  oriented: false,
  loop: Laurent2.fromTerms([
    [1, -1, 1],
    [-1, -1, 1],
    [0, 0, -1],
  ]),
  curl: (sign) => CURL[sign],
  crossing: () => ({ switched: MINUS_ONE, smoothA: Z, smoothB: Z }),
};

/** Dubrovnik: X = X̄ + z(X_A − X_B), loop (a − a⁻¹)/z + 1. */
export const DUBROVNIK_RULES: SkeinRules = {
  oriented: false,
  loop: Laurent2.fromTerms([
    [1, -1, 1],
    [-1, -1, -1],
    [0, 0, 1],
  ]),
  curl: (sign) => CURL[sign],
  crossing: () => ({ switched: Laurent2.one, smoothA: Z, smoothB: Z.neg() }),
};

/**
 * Unoriented arcs make (2m − 1)!! states on 2m ends, a tighter width than HOMFLY-PT's m!.
 * Work budget about ten seconds (F has many more terms than P, so its units are cheaper).
 */
export const KAUFFMAN_LIMITS: ContractionLimits = { maxWidth: 18, maxWork: 4e6 };

export type KauffmanVariant = 'kauffman' | 'dubrovnik';

export interface KauffmanResult {
  /** F(a, z) (or Y(a, z) for the Dubrovnik variant): x is a, y is z. */
  readonly polynomial: Laurent2;
  readonly boundaryWidth: number;
}

export function kauffmanPolynomial(d: LinkDiagram, variant: KauffmanVariant = 'kauffman', limits: ContractionLimits = KAUFFMAN_LIMITS): KauffmanResult {
  const rules = variant === 'kauffman' ? KAUFFMAN_RULES : DUBROVNIK_RULES;
  const name = variant === 'kauffman' ? 'Kauffman polynomial' : 'Dubrovnik polynomial';
  const { value, width } = skeinPolynomial(d, rules, limits, name);
  return { polynomial: value.shift(-writhe(d), 0), boundaryWidth: width };
}
