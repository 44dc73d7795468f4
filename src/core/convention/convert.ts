/**
 * Conversions between the values the core computes (Jones polynomial in t,
 * Kauffman bracket in A with ⟨O⟩ = 1) and the way a document writes them.
 * Claims are compared, and values typeset, in the document's convention.
 */
import { Laurent } from '../poly/laurent.ts';
import type { BracketNormalization, Convention, JonesVariable } from './convention.ts';

/** The letter a convention writes the Jones polynomial in. */
export type JonesLetter = 't' | 'q';

export function jonesLetter(variable: JonesVariable): JonesLetter {
  return variable === 'q' || variable === 'q-graded' ? 'q' : 't';
}

/** The loop value d = −A² − A⁻²: the `loop` bracket is the `unit` bracket times d. */
export const LOOP_VALUE = Laurent.fromTerms([
  [-2, -1n],
  [2, -1n],
]);

/** V(t) written in the given Jones variable. */
export function jonesToConvention(jonesInT: Laurent, variable: JonesVariable): Laurent {
  switch (variable) {
    case 't':
      return jonesInT;
    case 't-inverse':
      return jonesInT.substitutePower(-1);
    case 'q':
      return jonesInT.substitutePower(2);
    case 'q-graded':
      // t^e = (t^{1/2})^{2e} = (−q)^{2e} = (−1)^{2e} q^{2e}.
      return jonesInT.substitutePower(2).alternateSigns(1);
  }
}

/** The inverse of `jonesToConvention`: a polynomial in the document's variable back to V(t). */
export function jonesFromConvention(written: Laurent, variable: JonesVariable): Laurent {
  switch (variable) {
    case 't':
      return written;
    case 't-inverse':
      return written.substitutePower(-1);
    case 'q':
      return written.substitutePower(1 / 2);
    case 'q-graded':
      // q^n = (−1)^n t^{n/2}.
      return written.alternateSigns(1).substitutePower(1 / 2);
  }
}

/** The bracket (computed with ⟨O⟩ = 1) in the given normalisation. */
export function bracketToConvention(unitBracket: Laurent, normalization: BracketNormalization): Laurent {
  return normalization === 'unit' ? unitBracket : unitBracket.mul(LOOP_VALUE);
}

/**
 * The inverse of `bracketToConvention`; undefined when a `loop` value is not a
 * multiple of the loop value (then it is no bracket in that normalisation).
 */
export function bracketFromConvention(written: Laurent, normalization: BracketNormalization): Laurent | undefined {
  if (normalization === 'unit') return written;
  try {
    return written.divExact(LOOP_VALUE);
  } catch (error) {
    if (error instanceof RangeError) return undefined; // not divisible
    throw error;
  }
}

/** The report's Jones polynomial in the document's convention. */
export function conventionJones(jonesInT: Laurent, convention: Convention): Laurent {
  return jonesToConvention(jonesInT, convention.jonesVariable);
}

export function conventionBracket(unitBracket: Laurent, convention: Convention): Laurent {
  return bracketToConvention(unitBracket, convention.bracketNormalization);
}
