/**
 * The signature from a Seifert matrix: σ(L) = sign(V + Vᵀ), which gives the
 * positive (right-handed) trefoil σ = −2. A document whose convention gives it
 * +2 reads every signature negated (`signatureInConvention`).
 */
import type { SignatureSign } from '../../convention/convention.ts';
import { symmetricInertia, type Inertia } from './inertia.ts';
import { combine, transpose, type SparseMatrix } from './sparse-matrix.ts';

export function symmetrisedSeifertInertia(seifert: SparseMatrix): Inertia {
  return symmetricInertia(combine(1n, seifert, 1n, transpose(seifert)));
}

export function signatureFromSeifertMatrix(seifert: SparseMatrix): number {
  const inertia = symmetrisedSeifertInertia(seifert);
  return inertia.positive - inertia.negative;
}

/** The computed signature (σ(positive trefoil) = −2) as the document's convention writes it. */
export function signatureInConvention(signature: number, sign: SignatureSign): number {
  return sign === 'negative' || signature === 0 ? signature : -signature;
}
