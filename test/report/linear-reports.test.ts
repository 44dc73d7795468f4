/**
 * Reports stay linear in the input: the human reporter splits each file into
 * lines once, not once per message, and the nearest-id hint for an unknown id
 * compares only ids within two edits (Levenshtein distance, common practice),
 * so a pasted paragraph as an id costs no more than its length.
 */
import { describe, expect, it, vi } from 'vitest';
import type { Diagnostic } from '../../src/core/diagnostics/diagnostic.ts';
import { excerpt, formatHumanReport } from '../../src/report/index.ts';
import { EXCERPT_WIDTH } from '../../src/report/human.ts';
import { processMarkdown } from '../markdown/helpers.ts';

describe('the human reporter', () => {
  it('splits a file into lines once for a report of many messages on it', () => {
    const lines = Array.from({ length: 2000 }, (_, i) => `line ${i} :writhe[$2$]{of=k}`);
    const text = lines.join('\n');
    const diagnostics: Diagnostic[] = lines.map((_, i) => ({
      severity: 'error',
      ruleId: 'claim-contradicted',
      message: 'wrong writhe',
      location: { file: 'doc.md', start: { line: i + 1, column: 8 }, end: { line: i + 1, column: 26 } },
    }));
    const split = vi.spyOn(String.prototype, 'split');
    try {
      const report = formatHumanReport(diagnostics, { sources: new Map([['doc.md', text]]) });
      expect(report).toContain(' 1234 | line 1233 :writhe[$2$]{of=k}\n      |        ^~~~~~~~~~~~~~~~~~');
      const splitsOfTheFile = split.mock.contexts.filter((context) => String(context).length === text.length);
      expect(splitsOfTheFile).toHaveLength(1);
    } finally {
      split.mockRestore();
    }
  });
});

describe('an excerpt of a very long line', () => {
  it('shows a window around the span, with the caret under it', () => {
    const line = `${'a'.repeat(50_000)}WRONG${'b'.repeat(50_000)}`;
    const [shown, caret] = excerpt({ file: 'doc.md', start: { line: 1, column: 50_001 }, end: { line: 1, column: 50_006 } }, line);
    expect(shown!.length).toBeLessThan(EXCERPT_WIDTH + 10);
    expect(shown).toMatch(/^ 1 \| …a+WRONGb+…$/);
    expect(shown!.indexOf('WRONG')).toBe(caret!.indexOf('^'));
    expect(caret).toMatch(/\^~~~~$/);
  });
});

describe('the nearest-id hint', () => {
  const diagram = (id: string) => `\`\`\`skein id=${id} notation=braid\n1 1 1\n\`\`\`\n`;

  it('suggests ids within two edits only (substitution, insertion, transposition as two)', async () => {
    const text = `${diagram('abcde')}\n:jones{of=abxde} :jones{of=bcdea} :jones{of=edcba} :jones{of=abcdexy} :jones{of=abcdexyz}\n`;
    const r = await processMarkdown(text);
    expect(r.diagnostics.map((d) => d.hints?.[0])).toEqual(['Did you mean `abcde`?', 'Did you mean `abcde`?', 'The diagram ids are: abcde.', 'Did you mean `abcde`?', 'The diagram ids are: abcde.']);
  });

  it('answers at once for an id as long as a pasted paragraph among long ids', async () => {
    // Before the banded distance this took |target| × |id| steps per id: 300,000 × 20,000 × 8, minutes.
    const ids = Array.from({ length: 8 }, (_, i) => `${'q'.repeat(20_000)}${i}`);
    const text = `${ids.map(diagram).join('\n')}\n:jones{of=${'q'.repeat(300_000)}}\n`;
    const r = await processMarkdown(text);
    expect(r.diagnostics.filter((d) => d.ruleId === 'target-unknown')).toHaveLength(1);
  }, 20_000);
});
