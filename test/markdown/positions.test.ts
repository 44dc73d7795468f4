/**
 * Error positions on generated documents (fast-check): a wrong claim, a
 * wrong table cell and a bad code token placed anywhere — after any prose,
 * on any line of a multi-line code, after indentation,
 * inside block quotes and list items, with LF or CRLF line ends — are
 * reported at the line and column where they were written.
 * Value from memory: the positive trefoil σ₁³ has writhe 3, so 2 is wrong.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { processMarkdown } from './helpers.ts';

const word = fc.stringMatching(/^[A-Za-z0-9éΣ.,;!?()_-]{1,7}$/);
const prose = fc.array(word, { minLength: 0, maxLength: 6 }).map((ws) => ws.join(' '));
/** The prefix of a container's first line and of its continuation lines. */
const container = fc.constantFrom(['', ''], ['> ', '> '], ['- ', '  '], ['1. ', '   ']);
const eol = fc.constantFrom('\n', '\r\n');

interface Placed {
  readonly text: string;
  readonly expected: string[];
}

/** Line and column (1-based) of offset `at` in `text`, counting \r\n as one line end. */
function pointOf(text: string, at: number): string {
  const before = text.slice(0, at).split(/\r\n|\n/);
  return `${before.length}:${before[before.length - 1]!.length + 1}`;
}

/** Indentation inside a code block, kept in its value. */
const indent = fc.constantFrom('', '  ', '\t');

const documents = fc
  .tuple(prose, prose, prose, container, container, eol, fc.integer({ min: 0, max: 3 }), fc.array(indent, { maxLength: 3 }), indent)
  .map(([p1, p2, p3, c1, c2, nl, blankLines, goodLines, badIndent]): Placed => {
    const blank = nl.repeat(blankLines + 1);
    let text = '';
    const expected: string[] = [];
    const add = (s: string) => (text += s);
    // A diagram in a container, with an invalid token: its position is that of the token.
    const [first, rest] = c1;
    add(`${first}\`\`\`skein id=k notation=braid${nl}${rest}1 1 1${nl}${rest}\`\`\`${nl}${blank}`);
    // The bad token may sit on a later line of the code, after indented lines of good generators.
    add(`${first}\`\`\`skein id=bad notation=braid${nl}`);
    for (const lead of goodLines) add(`${rest}${lead}1 -1${nl}`);
    add(`${rest}${badIndent}1 `);
    expected.push(`code-invalid ${pointOf(text, text.length)}`);
    add(`q 1${nl}${rest}\`\`\`${nl}${blank}`);
    // A wrong prose claim after some prose: its position is that of its math.
    add(`${c2[0]}${p1} :writhe[`);
    expected.push(`claim-contradicted ${pointOf(text, text.length)}`);
    add(`$2$]{of=k} ${p2}${nl}${blank}`);
    // A wrong table cell.
    add(`:::invariants${nl}| diagram | writhe | remarks |${nl}|---|---|---|${nl}| k | `);
    expected.push(`claim-contradicted ${pointOf(text, text.length)}`);
    add(`$2$ | ${p3} |${nl}:::${nl}`);
    return { text, expected };
  });

describe('error positions on generated documents', () => {
  it('match where each error was written', async () => {
    await fc.assert(
      fc.asyncProperty(documents, async ({ text, expected }) => {
        const r = await processMarkdown(text);
        const errors = r.diagnostics.filter((d) => d.severity === 'error').map((d) => `${d.ruleId} ${d.location?.start.line}:${d.location?.start.column}`);
        expect(errors).toEqual(expected);
      }),
      { numRuns: 150 },
    );
  });
});
