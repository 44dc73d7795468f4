/**
 * The document's declared convention: how the author's polynomials are to be
 * read and how computed ones are typeset. Sources differ, so a document says
 * which one it follows (front matter, a LaTeX preamble command, or a
 * command-line flag); nothing is guessed.
 */

/**
 * How the Jones polynomial is written:
 * - `t`: V(t) as computed (positive trefoil t + t³ − t⁴);
 * - `t-inverse`: the mirror-reversed variable, t ↦ t⁻¹;
 * - `q`: t = q², so t^{1/2} = q;
 * - `q-graded`: t^{1/2} = −q, the substitution used with Khovanov-style gradings.
 */
export type JonesVariable = 't' | 't-inverse' | 'q' | 'q-graded';

/** ⟨O⟩ = 1 (`unit`), or ⟨O⟩ = −A² − A⁻² (`loop`, the bracket of a diagram counts every circle). */
export type BracketNormalization = 'unit' | 'loop';

export type TermOrder = 'ascending' | 'descending';

/** t^{1/2} written as a power (`power`) or as \sqrt{t} (`root`). */
export type HalfPowerStyle = 'power' | 'root';

/**
 * Which sign the signature of the positive (right-handed) trefoil gets:
 * `negative` gives σ = −2 (the sign of the Seifert-matrix form V + Vᵀ), `positive` gives +2.
 */
export type SignatureSign = 'negative' | 'positive';

/**
 * How Khovanov homology is graded (the right-handed trefoil in each):
 * - `standard`: cohomological degree t, quantum degree q, q + q³ + t²q⁵ + t³q⁹, ℤ/2 at (3, 7);
 * - `q-inverse`: the quantum grading negated, q⁻¹ + q⁻³ + t²q⁻⁵ + t³q⁻⁹;
 * - `homological`: homological indexing (t ↦ t⁻¹), q + q³ + t⁻²q⁵ + t⁻³q⁹;
 * - `mirror`: the groups of the mirror image, q⁻¹ + q⁻³ + t⁻²q⁻⁵ + t⁻³q⁻⁹, ℤ/2 at (−2, −7).
 */
export type KhovanovGrading = 'standard' | 'q-inverse' | 'homological' | 'mirror';

/**
 * How the HOMFLY-PT polynomial is written (P(unknot) = 1 in both):
 * - `vz`: v⁻¹P(L₊) − vP(L₋) = zP(L₀);
 * - `az`: aP(L₊) − a⁻¹P(L₋) = zP(L₀), that is a = v⁻¹.
 */
export type HomflyVariables = 'vz' | 'az';

/** Kauffman's F(a, z) (`kauffman`) or its Dubrovnik variant (`dubrovnik`). */
export type KauffmanVariant = 'kauffman' | 'dubrovnik';

export interface Convention {
  readonly jonesVariable: JonesVariable;
  readonly bracketNormalization: BracketNormalization;
  readonly termOrder: TermOrder;
  readonly halfPowers: HalfPowerStyle;
  readonly signatureSign: SignatureSign;
  readonly khovanovGrading: KhovanovGrading;
  readonly homflyVariables: HomflyVariables;
  readonly kauffmanVariant: KauffmanVariant;
}

export const DEFAULT_CONVENTION: Convention = {
  jonesVariable: 't',
  bracketNormalization: 'unit',
  termOrder: 'ascending',
  halfPowers: 'power',
  signatureSign: 'negative',
  khovanovGrading: 'standard',
  homflyVariables: 'vz',
  kauffmanVariant: 'kauffman',
};
