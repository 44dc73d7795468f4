/**
 * Every rule id the program can emit has an entry of its own in the rule
 * catalogue (src/report/rules.ts), so SARIF consumers get a real description
 * instead of the generic fallback. The ids are found by scanning the sources
 * for the ways a diagnostic or InputError is given its rule id; the scanner is
 * checked to see each of those ways, so it cannot silently find nothing.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { describe, expect, it } from 'vitest';
import { RULES, ruleDescription, sarifLog } from '../../src/report/index.ts';
import { CLAIM_RULES } from '../../src/core/claims/index.ts';

const ROOT = join(import.meta.dirname, '..', '..');
const RULE_ID = String.raw`[a-z]+(?:-[a-z]+)+`;

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return sourceFiles(path);
    return path.endsWith('.ts') ? [path] : [];
  });
}

/** Rule ids as given: `ruleId: 'x'`, `ruleId: CLAIM_RULES.k`, `new InputError('x'`, `InputError(NAME` or `ruleId: NAME` with `const NAME = 'x'`, `this.error(…, 'x'` / `this.problem('x'`. */
function emittedRuleIds(): Map<string, string> {
  const found = new Map<string, string>(); // id → first file using it
  const files = [...sourceFiles(join(ROOT, 'src')), ...sourceFiles(join(ROOT, 'plugins'))];
  const texts = new Map(files.map((f) => [f, readFileSync(f, 'utf8')]));
  const constants = new Map<string, string>();
  for (const text of texts.values()) {
    for (const m of text.matchAll(new RegExp(String.raw`\bconst\s+([A-Z_]+)\s*=\s*'(${RULE_ID})'`, 'g'))) constants.set(m[1]!, m[2]!);
  }
  const record = (id: string, file: string) => {
    if (!found.has(id)) found.set(id, relative(ROOT, file));
  };
  for (const [file, text] of texts) {
    for (const m of text.matchAll(new RegExp(String.raw`\bruleId\s*[:=]\s*'(${RULE_ID})'`, 'g'))) record(m[1]!, file);
    for (const m of text.matchAll(new RegExp(String.raw`\bInputError\(\s*'(${RULE_ID})'`, 'g'))) record(m[1]!, file);
    for (const m of text.matchAll(/\bruleId\s*:\s*CLAIM_RULES\.(\w+)/g)) record(CLAIM_RULES[m[1] as keyof typeof CLAIM_RULES], file);
    for (const m of text.matchAll(/(?:\bInputError\(\s*|\bruleId\s*:\s*)([A-Z_]+)\s*,/g)) {
      const id = constants.get(m[1]!);
      if (id !== undefined) record(id, file);
    }
    // The front ends' own helpers take the rule id among their first arguments, before the message.
    for (const m of text.matchAll(/\bthis\.(?:error|problem)\(/g)) {
      const rest = text.slice(m.index + m[0].length, m.index + m[0].length + 400);
      const firstString = /['`"]/.exec(rest);
      const literal = firstString && new RegExp(`^'(${RULE_ID})'`).exec(rest.slice(firstString.index));
      if (literal) record(literal[1]!, file);
    }
  }
  return found;
}

describe('rule catalogue', () => {
  const emitted = emittedRuleIds();
  const catalogued = new Set(RULES.map((r) => r.id));

  it('the scanner sees every way a rule id is given (one known id per way)', () => {
    expect(emitted.get('claim-malformed')).toBe('src/core/claims/assignment.ts'); // new InputError('…'
    expect(emitted.has('code-invalid')).toBe(true); // InputError(CODE_INVALID, …
    expect(emitted.has('claim-unreadable')).toBe(true); // InputError(UNREADABLE, …
    expect(emitted.has('diagram-too-wide')).toBe(true); // new InputError(\n '…'
    expect(emitted.has('file-unreadable')).toBe(true); // ruleId: '…'
    expect(emitted.has('latex-cell-empty')).toBe(true); // this.error(file, span, '…'
    expect(emitted.has('latex-table-malformed')).toBe(true); // this.problem('…'
    expect(emitted.has('markup-invalid')).toBe(true);
    expect(emitted.get('claim-undecided')).toBe('src/core/claims/diagnostics.ts'); // ruleId: CLAIM_RULES.…
  });

  it('describes every rule id emitted anywhere in src/ or plugins/', () => {
    const missing = [...emitted].filter(([id]) => !catalogued.has(id)).map(([id, file]) => `${id} (${file})`);
    expect(missing).toEqual([]);
  });

  it('describes the claims layer’s rule ids', () => {
    for (const id of Object.values(CLAIM_RULES)) expect(catalogued.has(id), id).toBe(true);
  });

  it('describes every LaTeX markup rule the README lists (README section on LaTeX)', () => {
    const readme = readFileSync(join(ROOT, 'README.md'), 'utf8');
    const listed = new Set([...readme.matchAll(/`(latex-[a-z-]+)`/g)].map((m) => m[1]!));
    expect(listed.size).toBeGreaterThan(10);
    for (const id of listed) expect(catalogued.has(id), id).toBe(true);
  });

  it('lists no rule twice and no rule nothing emits', () => {
    expect(new Set(RULES.map((r) => r.id)).size).toBe(RULES.length);
    const neverEmitted = RULES.map((r) => r.id).filter((id) => !emitted.has(id));
    expect(neverEmitted).toEqual([]);
  });

  it('gives each emitted rule its own SARIF description, not the generic one', () => {
    const generic = ruleDescription('no-such-rule').replace('no-such-rule', '');
    const log = sarifLog([]);
    const rules = log.runs[0]!.tool.driver.rules ?? [];
    for (const id of emitted.keys()) {
      const rule = rules.find((r) => r.id === id);
      expect(rule, id).toBeDefined();
      expect(rule!.shortDescription!.text.includes(generic), id).toBe(false);
    }
  });
});
