/**
 * The shape of one registered invariant. Each module in
 * `src/core/invariants/registered/` exports one `Invariant`; the list in
 * ./index.ts is the only other place that names it. Claim keys, fill keys,
 * table-header aliases, the JSON fields of `compute --json`, the README key
 * table and the limits all come from these declarations.
 */
import type { DiagramReport } from '../../analyze/report.ts';
import type { Convention } from '../../convention/convention.ts';
import type { JudgeContext, Judgement, Typeset } from '../../claims/api.ts';

/**
 * How expensive the invariant is in the crossing number n, for limits and for
 * deciding what a summary computes unasked:
 * - `instant`: read off the diagram (linear or near it);
 * - `polynomial`: a matrix or bound computation, polynomial in n (Δ costs about n³);
 * - `contraction`: the bracket engine's tangle contraction, exponential in the
 *   diagram's width but not in n;
 * - `exponential`: exponential in n (a state sum or a skein tree), with its own crossing limit.
 */
export type CostClass = 'instant' | 'polynomial' | 'contraction' | 'exponential';

/**
 * The choices a diagram code may leave open, and so the values they can change:
 * - `chirality`: the mirror image (a DT code of a prime knot fixes it only up to mirror);
 * - `kink-sign`: the sign of a nugatory crossing (a DT code does not say to which side a kink loops);
 * - `summand-chirality`: the relative chirality of the summands of a composite diagram.
 * A claim key lists the choices that can change its value; a key listing none is fixed by every
 * notation that fixes the diagram's projection and crossing data up to these choices.
 */
export type OpenChoice = 'chirality' | 'kink-sign' | 'summand-chirality';

/** One key an author can state a value for. */
export interface ClaimSpec {
  /** The key as written after `:` (Markdown), in `\skeinclaim` (LaTeX) and in `compute --claim`. */
  readonly key: string;
  /** The invariant in words, for messages ("Jones polynomial", "span of V"). */
  readonly noun: string;
  /** Table headers that mean this key (`det`, `σ`, `c(K)`), compared without case and outer spaces. */
  readonly aliases?: readonly string[];
  /** How the value is written, one sentence for the README key table. */
  readonly valueDoc: string;
  /** A claimed value as an author writes it (for the documentation and the registry test). */
  readonly example: string;
  /** Choices a code may leave open that change this value (empty: no choice changes it). */
  readonly changedBy: readonly OpenChoice[];
  /** Reads the author's text (an unreadable one throws `claim-unreadable`) and judges it. */
  judge(text: string, report: DiagramReport, ctx: JudgeContext): Judgement;
}

/** How a fill is typeset beyond the convention. */
export interface TypesetOptions {
  /** For a table cell: as short as the value allows (a crossing-number range as `6–8`, not a phrase). */
  readonly compact?: boolean;
}

/** One value a document can ask to have typeset. */
export interface FillSpec {
  readonly key: string;
  /** What is filled in, one sentence for the README key table. */
  readonly valueDoc: string;
  typeset(report: DiagramReport, convention: Convention, options?: TypesetOptions): Typeset;
}

/** One field of the `compute --json` object. */
export interface JsonField {
  readonly field: string;
  /** Its value for the positive trefoil (closure of the braid σ₁³) in the default convention. */
  readonly example: unknown;
  value(report: DiagramReport, convention: Convention): unknown;
}

export interface Invariant {
  /** A short name of our own, unique in the registry (for messages and tests). */
  readonly id: string;
  /** What it is, in one sentence, for the README. */
  readonly doc: string;
  readonly cost: CostClass;
  /**
   * The convention settings (`jones`, `bracket`, `terms`, `half-powers`, `signature`) that change how the
   * value is read or typeset; empty when the value is written the same way in every document.
   */
  readonly conventions: readonly string[];
  /**
   * Why the invariant's key `key` does not apply to this diagram (a linking number of a knot, Rasmussen's s of a
   * link), or undefined when it does. A prose claim or fill-in of an inapplicable key is `claim-inapplicable`; a
   * table cell may be empty or hold a not-applicable mark instead. Absent: the keys apply to every diagram.
   */
  readonly inapplicable?: (report: DiagramReport, key: string) => string | undefined;
  readonly claims: readonly ClaimSpec[];
  readonly fills: readonly FillSpec[];
  readonly json: readonly JsonField[];
  /** Why `json` is empty, when it is (the value is prose, or its ingredients are other fields). */
  readonly withoutJson?: string;
  /** Test files (from the repository root) that check this invariant against a named outside source. */
  readonly tests: readonly string[];
}
