/**
 * The README's Markdown section as a user reads it: its examples, put
 * together into one manuscript, pass the check and build to what the section
 * shows after each `→`, and its lists of fill-ins and claims are the ones the
 * plugin knows. Values shown there: the positive trefoil (closure of σ₁³) has
 * V = t + t³ − t⁴, the figure-eight V = t⁻² − t⁻¹ + 1 − t + t² (from memory).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { CLAIM_KEYS, FILL_KEYS } from '../../plugins/remark/syntax.ts';
import { ROOT } from './cli.ts';
import { processMarkdown } from './helpers.ts';

const readme = readFileSync(join(ROOT, 'README.md'), 'utf8');
const section = readme.slice(readme.indexOf('<!-- section: markdown -->'), readme.indexOf('<!-- end: markdown -->'));

/** The bodies of the fenced blocks of one language, in order. */
function blocks(language: string): string[] {
  const fence = new RegExp(`^(\`{3,})${language}\\n([\\s\\S]*?)^\\1$`, 'gm');
  return [...section.matchAll(fence)].map((m) => m[2]!);
}

/** The names in backticks of the sentence that starts with `lead`. */
function namesIn(lead: string): string[] {
  const start = section.indexOf(lead);
  expect(start, lead).toBeGreaterThanOrEqual(0);
  const sentence = section.slice(start, section.indexOf('\n', start));
  return [...sentence.matchAll(/`:?([a-z-]+)`/g)].map((m) => m[1]!);
}

describe('the README section on Markdown manuscripts', () => {
  it('has examples that pass together and build to what the arrows show', async () => {
    const examples = blocks('markdown');
    const diagram = examples.find((e) => e.startsWith('```skein'));
    const [frontMatter] = blocks('yaml');
    const arrows = examples.filter((e) => e.includes('→')).map((e) => e.trim().split(/\s+→\s+/) as [string, string]);
    const table = examples.find((e) => e.startsWith(':::invariants'))!;
    expect(diagram).toContain('```skein id=twist-3');
    expect(arrows).toHaveLength(2);
    const text = [frontMatter!, diagram!, ...arrows.map(([source]) => source), table].join('\n');
    const r = await processMarkdown(text);
    expect(r.diagnostics).toEqual([]);
    for (const [, shown] of arrows) expect(r.built).toContain(shown);
    expect(r.built).toContain('| fig8 `1 -2 1 -2` | $4$ | $0$ | $t^{-2} - t^{-1} + 1 - t + t^2$ | $4$ | named here |');
  });

  it('lists every fill-in and every claim the plugin knows, and no other', () => {
    expect(new Set(namesIn('Fill-ins: '))).toEqual(new Set(FILL_KEYS));
    expect(new Set(namesIn('Claims can be made about '))).toEqual(new Set(CLAIM_KEYS));
    // The table columns said to need a value in every cell are the claims that are not fill-ins.
    const needValue = namesIn('- An **empty cell**');
    expect(new Set(needValue)).toEqual(new Set(CLAIM_KEYS.filter((k) => !(FILL_KEYS as readonly string[]).includes(k))));
  });
});
