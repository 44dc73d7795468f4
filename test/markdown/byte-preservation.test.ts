/**
 * The build changes only the substituted spans: every other byte of the
 * manuscript is copied as written (line endings, tabs, trailing spaces,
 * Unicode), on the samples and on generated documents (fast-check).
 * Values: the positive trefoil σ₁³ has V = t + t³ − t⁴, writhe 3 and span 3
 * (from memory, standard tables).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { processMarkdown } from './helpers.ts';
import { ROOT } from './cli.ts';

const TREFOIL_BLOCK = '```skein id=tref notation=braid\n1 1 1\n```';

const MARKUP = /:[a-z-]+(\[[^\]]*\])?\{of=|^:::|^\|/;

describe('on the samples', () => {
  for (const name of ['twists-and-weaves.md', 'twists-and-weaves-slips.md']) {
    it(`${name}: every line without skeinproof markup is copied unchanged and in order`, async () => {
      const text = readFileSync(join(ROOT, 'samples', name), 'utf8');
      const built = (await processMarkdown(text)).built.split('\n');
      const plain = text.split('\n').filter((line) => !MARKUP.test(line));
      let at = 0;
      for (const line of plain) {
        const found = built.indexOf(line, at);
        expect(found, `line ${JSON.stringify(line)} missing from the output`).toBeGreaterThanOrEqual(at);
        at = found + 1;
      }
      // Markup lines are the only ones that change, and the table fences become blank lines, so every line keeps its number.
      expect(built.length).toBe(text.split('\n').length);
    });
  }
});

/** Prose that CommonMark keeps as paragraph text: no syntax characters, no leading indentation. */
const word = fc.stringMatching(/^[A-Za-z0-9éßΣ∂😀.,;!?'"()*_-]{1,8}$/);
const gap = fc.constantFrom(' ', '  ', ' \t');
const piece = fc.oneof(
  { weight: 4, arbitrary: word.map((w) => ({ text: w, built: w })) },
  { weight: 1, arbitrary: fc.constant({ text: ':jones{of=tref}', built: '$t + t^3 - t^4$' }) },
  { weight: 1, arbitrary: fc.constant({ text: ':writhe{of=tref}', built: '$3$' }) },
  { weight: 1, arbitrary: fc.constant({ text: ':span[$3$]{of=tref}', built: '$3$' }) },
  { weight: 1, arbitrary: fc.constant({ text: ':jones[$t+t^3-t^4$]{of=tref}', built: '$t+t^3-t^4$' }) },
);
const line = fc.array(fc.tuple(piece, gap), { minLength: 1, maxLength: 8 }).map((parts) => {
  const text = parts.map(([p, g], i) => (i === parts.length - 1 ? p.text : p.text + g)).join('');
  const built = parts.map(([p, g], i) => (i === parts.length - 1 ? p.built : p.built + g)).join('');
  return { text, built };
});
const eol = fc.constantFrom('\n', '\r\n');
const trailing = fc.constantFrom('', ' ', '  ');
const paragraph = fc.array(fc.tuple(line, trailing, eol), { minLength: 1, maxLength: 4 });

describe('on generated documents', () => {
  it('replaces exactly the fill-ins and claim markup', async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(paragraph, { minLength: 1, maxLength: 5 }), eol, async (paragraphs, blank) => {
        let text = `${TREFOIL_BLOCK}\n`;
        let expected = text;
        for (const lines of paragraphs) {
          text += blank;
          expected += blank;
          for (const [l, space, end] of lines) {
            text += l.text + space + end;
            expected += l.built + space + end;
          }
        }
        const r = await processMarkdown(text);
        expect(r.diagnostics).toEqual([]);
        expect(r.built).toBe(expected);
      }),
      { numRuns: 150 },
    );
  });

  it('copies a document without skeinproof markup byte for byte', async () => {
    await fc.assert(
      fc.asyncProperty(fc.string({ unit: 'grapheme', maxLength: 300 }), async (text) => {
        fc.pre(!text.includes('{of=') && !text.includes('skein') && !text.includes(':::invariants'));
        const r = await processMarkdown(text);
        expect(r.built).toBe(text);
      }),
      { numRuns: 200 },
    );
  });
});
