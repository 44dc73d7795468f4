/**
 * The contract of the claims layer: what an author can claim about a diagram,
 * the verdict on a claim, and what can be typeset. Implemented in
 * ./index.ts; front ends (compute --claim, Markdown, LaTeX) use only these.
 */
import type { DiagramReport, TheoremId } from '../analyze/report.ts';
import type { Convention } from '../convention/convention.ts';

/**
 * A key an author can state a value for: one of the claim keys of the
 * registered invariants (`CLAIM_KEYS`, src/core/invariants/registry).
 */
export type ClaimKey = string;

/** `cited`: no theorem here decides the claim, and the author names a source for it (crossing numbers). */
export type Verdict = 'agrees' | 'contradicts' | 'undecided' | 'cited';

export type DiagnosisKind = 'mirror' | 'negated' | 'shifted' | 'normalization' | 'one-coefficient' | 'one-exponent' | 'swapped' | 'none';

export interface Diagnosis {
  readonly kind: DiagnosisKind;
  /** One sentence naming the slip, e.g. "the claim is the value of the mirror image (t ↔ t⁻¹)". */
  readonly detail: string;
  /** `shifted`: the claim is the value times variable^shift. */
  readonly shift?: number;
  /** `one-coefficient`: the term that differs. */
  readonly term?: { readonly exponent: number; readonly computed: string; readonly claimed: string };
  /** `one-exponent`: the one term whose exponent differs, as computed and as claimed. */
  readonly exponent?: { readonly computed: number; readonly claimed: number; readonly coefficient: string };
  /** `swapped`: the id of the diagram whose value the claim is. */
  readonly otherDiagram?: string;
}

export interface Judgement {
  readonly key: ClaimKey;
  /** The claim as the author wrote it. */
  readonly claimed: string;
  readonly verdict: Verdict;
  readonly diagnosis?: Diagnosis;
  /** The reason as one sentence (names the theorem for crossing-number verdicts). */
  readonly reason: string;
  readonly theorem?: TheoremId;
  /** The computed value in the document's convention (LaTeX for polynomials). */
  readonly computed: string;
  /** Set when the verdict is `agrees` only up to mirror image (DT codes) or otherwise needs a warning. */
  readonly warning?: string;
  /** The source the author cites for the claim, as written (`\cite{key}` or `(source: …)`). */
  readonly source?: string;
}

export interface JudgeContext {
  readonly convention: Convention;
  /** Other diagrams of the same document by id, for the `swapped` diagnosis. */
  readonly others?: ReadonlyMap<string, DiagramReport>;
  /** The id of the diagram being judged, so it is not compared with itself. */
  readonly selfId?: string;
}

/** A value a document can ask to have typeset: one of the fill keys of the registered invariants (`FILL_KEYS`). */
export type FillKey = string;

/**
 * A typeset value: `math` is LaTeX for inline math (without delimiters);
 * `text` is prose that may contain inline math between single dollars.
 */
export type Typeset = { readonly kind: 'math'; readonly latex: string } | { readonly kind: 'text'; readonly text: string };
