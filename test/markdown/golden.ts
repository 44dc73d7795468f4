/**
 * Golden files under test/golden/markdown, compared byte for byte. Run with
 * SKEINPROOF_UPDATE_GOLDEN=1 to rewrite them from the current output (then
 * review the diff before committing).
 */
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { expect } from 'vitest';

export const GOLDEN_DIR = join(import.meta.dirname, '..', 'golden', 'markdown');

export function expectGolden(name: string, actual: string): void {
  const path = join(GOLDEN_DIR, name);
  if (process.env['SKEINPROOF_UPDATE_GOLDEN'] === '1' || !existsSync(path)) {
    if (process.env['SKEINPROOF_UPDATE_GOLDEN'] !== '1') throw new Error(`golden file ${path} is missing; run with SKEINPROOF_UPDATE_GOLDEN=1 to create it`);
    writeFileSync(path, actual);
    return;
  }
  const expected = readFileSync(path, 'utf8');
  // Compared as strings so a failure shows the differing lines; equal strings are equal bytes.
  expect(actual).toBe(expected);
}
