/**
 * The Arf invariant of a knot, by two independent routes that must agree:
 * the z² coefficient of the Conway polynomial mod 2 (Arf(K) = a₂(K) mod 2; see Kauffman, On Knots, 1987),
 * and Levine's theorem (1966): Arf(K) = 0 when Δ(−1) ≡ ±1 (mod 8), 1 when Δ(−1) ≡ ±3 (mod 8).
 * For links skeinproof gives no value (null): the Arf invariant of a link needs
 * the link to be proper, and that case is not implemented.
 */
import type { Laurent } from '../poly/laurent.ts';

export function arfInvariant(conway: Laurent, alexander: Laurent, components: number): 0 | 1 | null {
  if (components !== 1) return null;
  const fromConway = ((conway.coefficient(2) % 2n) + 2n) % 2n === 0n ? 0 : 1;
  const atMinusOne = alexander.terms().reduce((sum, [e, c]) => sum + (Math.abs(e) % 2 === 0 ? c : -c), 0n);
  const residue = ((atMinusOne % 8n) + 8n) % 8n;
  if (residue !== 1n && residue !== 7n && residue !== 3n && residue !== 5n) throw new Error(`internal: Δ(−1) = ${atMinusOne} of a knot is even`);
  const fromLevine = residue === 1n || residue === 7n ? 0 : 1;
  if (fromConway !== fromLevine) throw new Error(`internal: Arf invariant ${fromConway} from ∇ but ${fromLevine} from Δ(−1) = ${atMinusOne}`);
  return fromConway;
}
