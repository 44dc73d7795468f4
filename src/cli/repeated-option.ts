/**
 * Options that yargs collects into an array when they are given more than
 * once. `--convention` may be repeated: its occurrences are read as one list
 * of pairs, so a key set to two values is refused just as within one list.
 * Options that take one value get a message naming the repetition.
 */

/** The text of every `--convention` given, as one list of pairs (undefined when none is given). */
export function conventionOptionText(value: unknown): string | undefined {
  return value === undefined ? undefined : ([] as unknown[]).concat(value).map(String).join(', ');
}

/** A usage message when a single-valued option was given more than once, else undefined. */
export function repeatedOptionMessage(name: string, value: unknown): string | undefined {
  if (!Array.isArray(value)) return undefined;
  return `--${name} is given ${value.length} times (${value.map(String).join(', ')}); give it once.`;
}
