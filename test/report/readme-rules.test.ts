/**
 * The README's list of rule ids is the rule catalogue: every id skeinproof
 * reports is documented for authors, and the README names no id that does not exist.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { RULES } from '../../src/report/rules.ts';

const README = readFileSync(join(import.meta.dirname, '..', '..', 'README.md'), 'utf8');

function readmeRuleIds(): string[] {
  const section = /<!-- section: rules -->([\s\S]*?)<!-- end: rules -->/.exec(README);
  if (!section) throw new Error('README.md has no section `rules`');
  return [...section[1]!.matchAll(/^\| `([a-z-]+)` \|/gm)].map((m) => m[1]!);
}

describe('the README’s rule list', () => {
  it('lists exactly the rule ids of the catalogue, each once', () => {
    const listed = readmeRuleIds();
    expect(listed.length).toBeGreaterThan(30);
    expect(new Set(listed).size).toBe(listed.length);
    expect([...listed].sort()).toEqual(RULES.map((r) => r.id).sort());
  });
});
