/**
 * The Jones polynomial from the Kauffman bracket: V(t) = (−A³)^(−w) ⟨D⟩ at
 * A = t^(−1/4), where w is the writhe. Knots get integer powers of t, links
 * with an even number of components half-integer ones.
 */
import type { Laurent } from '../poly/laurent.ts';
import { writhe, type LinkDiagram } from '../diagram/model.ts';
import { kauffmanBracket } from './bracket.ts';

export function jonesFromBracket(bracket: Laurent, writheValue: number): Laurent {
  if (!Number.isInteger(writheValue)) throw new RangeError(`writhe ${writheValue} must be an integer`);
  const normalised = bracket.shift(-3 * writheValue);
  const signed = writheValue % 2 === 0 ? normalised : normalised.neg();
  return signed.substitutePower(-1 / 4);
}

export function jonesPolynomial(d: LinkDiagram): Laurent {
  return jonesFromBracket(kauffmanBracket(d).bracket, writhe(d));
}
