/**
 * The README's key table, rendered from the registry so that it lists exactly
 * the registered keys (test/invariants/registry.test.ts keeps the README equal
 * to this).
 */
import { INVARIANTS } from './index.ts';
import type { OpenChoice } from './types.ts';

const CHOICE_WORDS: Readonly<Record<OpenChoice, string>> = {
  chirality: 'mirror image',
  'kink-sign': 'kink signs',
  'summand-chirality': 'summand chirality',
};

function cell(text: string): string {
  return text.replace(/\|/g, '\\|');
}

function codeList(words: readonly string[]): string {
  return words.length === 0 ? '—' : words.map((w) => `\`${w}\``).join(', ');
}

export function keyTableMarkdown(): string {
  const rows = ['| key | value as written | fill-in | also a table header as | convention settings | changed by |', '|---|---|---|---|---|---|'];
  for (const invariant of INVARIANTS) {
    const fills = new Map(invariant.fills.map((f) => [f.key, f]));
    for (const claim of invariant.claims) {
      const fill = fills.get(claim.key);
      fills.delete(claim.key);
      rows.push(
        `| \`${claim.key}\` | ${cell(claim.valueDoc)} | ${fill ? cell(fill.valueDoc) : '—'} | ${codeList(claim.aliases ?? [])} | ${codeList(invariant.conventions)} | ${
          claim.changedBy.length === 0 ? '—' : claim.changedBy.map((c) => CHOICE_WORDS[c]).join(', ')
        } |`,
      );
    }
    for (const fill of fills.values()) {
      rows.push(`| \`${fill.key}\` | (fill-in only) | ${cell(fill.valueDoc)} | — | ${codeList(invariant.conventions)} | — |`);
    }
  }
  return rows.join('\n');
}
