/** Terminal facts the commands need, in one place. */

/** Colour only on a terminal, and never when the user set NO_COLOR (a widely followed convention). */
export function wantsColor(stream: { isTTY?: boolean }): boolean {
  const noColor = process.env.NO_COLOR;
  return stream.isTTY === true && (noColor === undefined || noColor === '');
}
