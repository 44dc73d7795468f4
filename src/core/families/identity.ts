/**
 * What a diagram is, when it was built from a family: the family and its
 * parameters, so that theorems about the family can decide its crossing
 * number. The identity is attached to the diagram object itself (a weak map),
 * never copied by spreading: any diagram derived from it by surgery is a new
 * object and carries no identity, so no theorem is applied to a diagram that
 * is no longer the family's.
 */
import type { LinkDiagram } from '../diagram/model.ts';

export type FamilyIdentity =
  /** The torus link T(p, q); `fromBraid` when read from a braid word that is literally a torus braid. */
  | { readonly kind: 'torus'; readonly p: number; readonly q: number; readonly fromBraid?: boolean }
  /**
   * The numerator closure of a sum of rational tangles, each given by its
   * continued fraction with all terms of one sign (the pretzel link
   * P(a₁, …, a_k) has the tangles 1/aᵢ, i.e. terms [0, aᵢ]).
   */
  | { readonly kind: 'montesinos'; readonly tangles: readonly Fraction[]; readonly pretzel?: readonly number[] }
  /** The two-bridge link of p/q, drawn from the continued fraction `terms` of p/q' (q' ≡ q mod p), all of one sign. */
  | { readonly kind: 'two-bridge'; readonly p: number; readonly q: number; readonly terms: readonly number[]; readonly twist?: number };

export interface Fraction {
  readonly p: number;
  readonly q: number;
}

const identities = new WeakMap<LinkDiagram, FamilyIdentity>();

export function markFamily<D extends LinkDiagram>(d: D, identity: FamilyIdentity): D {
  identities.set(d, identity);
  return d;
}

export function familyOf(d: LinkDiagram): FamilyIdentity | undefined {
  return identities.get(d);
}

/** The identity of the mirror image: every parameter negated. */
export function mirrorIdentity(identity: FamilyIdentity): FamilyIdentity {
  switch (identity.kind) {
    case 'torus':
      return { kind: 'torus', p: identity.p, q: -identity.q };
    case 'montesinos':
      return {
        kind: 'montesinos',
        tangles: identity.tangles.map((f) => ({ p: -f.p, q: f.q })),
        ...(identity.pretzel ? { pretzel: identity.pretzel.map((a) => -a) } : {}),
      };
    case 'two-bridge':
      return { kind: 'two-bridge', p: -identity.p, q: identity.q, terms: identity.terms.map((b) => -b), ...(identity.twist !== undefined ? { twist: -identity.twist } : {}) };
  }
}

/** How a report names the family member: "the torus knot T(3, 4)". */
export function describeFamily(identity: FamilyIdentity, components: number): string {
  const what = components === 1 ? 'knot' : 'link';
  switch (identity.kind) {
    case 'torus':
      return `the torus ${what} T(${identity.p}, ${identity.q})`;
    case 'montesinos':
      if (identity.pretzel) return `the pretzel ${what} P(${identity.pretzel.join(', ')})`;
      return `the Montesinos ${what} of the rational tangles ${identity.tangles.map((f) => (f.q === 1 ? `${f.p}` : `${f.p}/${f.q}`)).join(', ')}`;
    case 'two-bridge':
      if (identity.twist !== undefined) return `the twist knot with ${identity.twist} half twist${Math.abs(identity.twist) === 1 ? '' : 's'}`;
      return `the two-bridge ${what} of ${identity.p}/${identity.q}`;
  }
}
