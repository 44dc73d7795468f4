/**
 * Garner's incremental Chinese remainder lift, shared by the modular engines
 * (the bracket by moduli, the determinants of classical/modular.ts): values
 * known modulo a product of pairwise coprime moduli are extended one modulus
 * at a time, then read as the symmetric representatives.
 */

/**
 * The x with x ≡ lifted[i] (mod product), x ≡ residues[i] (mod m) and
 * 0 ≤ x < product·m, for each i (lifted[i] in [0, product), m coprime to product).
 */
export function liftOneModulus(lifted: readonly bigint[], product: bigint, residues: ArrayLike<number>, m: number): bigint[] {
  const mBig = BigInt(m);
  const inverse = inverseModulo(product % mBig, mBig);
  return lifted.map((x, i) => {
    let step = ((BigInt(residues[i]!) - (x % mBig)) * inverse) % mBig;
    if (step < 0n) step += mBig;
    return x + product * step;
  });
}

/** The representative in (−product/2, product/2] of each x in [0, product). */
export function symmetricResidues(lifted: readonly bigint[], product: bigint): bigint[] {
  const half = product / 2n;
  return lifted.map((x) => (x > half ? x - product : x));
}

/** 1/a modulo m for coprime a, m (extended Euclid). */
function inverseModulo(a: bigint, m: bigint): bigint {
  let [r0, r1] = [m, ((a % m) + m) % m];
  let [s0, s1] = [0n, 1n];
  while (r1 !== 0n) {
    const q = r0 / r1;
    [r0, r1] = [r1, r0 - q * r1];
    [s0, s1] = [s1, s0 - q * s1];
  }
  if (r0 !== 1n) throw new Error('internal: moduli of a Chinese remainder lift are not coprime');
  return ((s0 % m) + m) % m;
}
