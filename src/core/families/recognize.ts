/**
 * Braid words that are literally torus braids: (σ₁σ₂…σ_{m−1})^k or
 * (σ_{m−1}…σ₂σ₁)^k on exactly m strands, all generators of one sign, up to
 * cyclic rotation of the word (a conjugation). The second form is the first
 * turned upside down, and also covers the inverse word; both close to the torus
 * link T(m, ±k). Nothing else is recognised: a word that is a torus braid only
 * after braid relations is left alone.
 */
export function torusBraidParameters(word: readonly number[], strands: number): { p: number; q: number } | undefined {
  const m = strands;
  const period = m - 1;
  if (m < 2 || word.length === 0 || word.length % period !== 0) return undefined;
  const sign = Math.sign(word[0]!);
  if (word.some((g) => Math.sign(g) !== sign)) return undefined;
  const indices = word.map(Math.abs);
  const matches = (expected: (i: number) => number): boolean => {
    for (let shift = 0; shift < period; shift++) {
      if (indices.every((g, i) => g === expected((i + shift) % period))) return true;
    }
    return false;
  };
  if (!matches((i) => i + 1) && !matches((i) => period - i)) return undefined;
  return { p: m, q: (sign * word.length) / period };
}
