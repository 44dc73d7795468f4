/**
 * Coordinates as text: a fixed number of decimals, trailing zeros dropped, and
 * never "-0", so the same geometry always prints the same bytes.
 */
export function fixed(value: number, decimals = 2): string {
  const text = value.toFixed(decimals).replace(/\.?0+$/, '');
  return text === '-0' ? '0' : text;
}
