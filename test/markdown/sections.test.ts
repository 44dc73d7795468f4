/**
 * Reading Markdown in sections (plugins/remark/sections.ts) gives exactly the
 * tree of reading the whole text: checked against the parser itself (micromark
 * with the extensions `check` uses, and with those the math reader uses) on
 * generated documents full of constructs that span blank lines or depend on
 * what came before: fenced code and math with blank lines and prose-like lines
 * inside, directive containers, lists and block quotes holding fences, HTML,
 * definitions, front matter, tables, indentation by tabs and 1–4 spaces, CRLF
 * and CR line endings, a byte order mark. The reference is the whole-text parse,
 * an independent computation; the sectioning must match it or not cut.
 */
import fc from 'fast-check';
import type { Root } from 'mdast';
import remarkDirective from 'remark-directive';
import remarkFrontmatter from 'remark-frontmatter';
import remarkGfm from 'remark-gfm';
import remarkMath from 'remark-math';
import remarkParse from 'remark-parse';
import { unified } from 'unified';
import { visit } from 'unist-util-visit';
import { describe, expect, it } from 'vitest';
import { VFile } from 'vfile';
import remarkSkeinproof, { mayHoldCarriers } from '../../plugins/remark/index.ts';
import { keepSectionTrees, parseInSections, sectionStarts } from '../../plugins/remark/sections.ts';

const withDirectives = unified().use(remarkParse).use(remarkFrontmatter).use(remarkGfm).use(remarkMath).use(remarkDirective);
const mathReader = unified().use(remarkParse).use(remarkFrontmatter).use(remarkGfm).use(remarkMath);
const parsers = { 'check (with directives)': (t: string) => withDirectives.parse(t), 'math reader': (t: string) => mathReader.parse(t) } as const;

const bom = (text: string) => (text.startsWith('\uFEFF') ? 1 : 0);

/** Every formula of a tree: its kind, TeX and offsets. */
function formulas(tree: Root): string[] {
  const out: string[] = [];
  visit(tree, (node) => {
    if (node.type === 'math' || node.type === 'inlineMath') out.push(`${node.type} ${node.position?.start.offset}-${node.position?.end.offset} ${node.value}`);
  });
  return out;
}

const word = fc.constantFrom('strand', 'twist', 'Loop', 'a', 'Z9', 'über', 'x_1');
const inline = fc.constantFrom(
  '$x^2$', '$$y$$', '$ a $', '$', '\\$', '`co$de`', '``a ` $b``', '[link $t$](u "t$")', '[ref]', '[^1]', '*em $e$*', ':jones{of=k1}',
  ':span[$3$]{of=k1}', ':name{k="$v$"}', '<span>$s$</span>', 'www.knots.example', 'a@b.example', '~~$w$~~', '&amp;', '|', '1.', '-',
);
const prose = fc.tuple(fc.oneof({ weight: 4, arbitrary: word }, inline), fc.array(fc.oneof({ weight: 3, arbitrary: word }, { weight: 2, arbitrary: inline }), { maxLength: 5 })).map(([w, ws]) => [w, ...ws].join(' '));
const indent = fc.oneof({ weight: 12, arbitrary: fc.constant('') }, fc.constantFrom(' ', '  ', '   ', '    ', '\t', ' \t'));
const lines = (n: number) => fc.array(fc.oneof(prose, fc.constant(''), fc.tuple(indent, prose).map(([i, p]) => i + p)), { minLength: 0, maxLength: n });

const fenceChar = fc.constantFrom('`', '~', '$');
/** Blocks after which no section can start (nested containers): rarer, so that most documents are cut. */
const rare = (a: fc.Arbitrary<string>) => ({ weight: 1, arbitrary: a });
const common = (a: fc.Arbitrary<string>) => ({ weight: 6, arbitrary: a });
/** Paragraphs: most of a manuscript, and where sections start. */
const often = (a: fc.Arbitrary<string>) => ({ weight: 40, arbitrary: a });
const block = fc.oneof(
  often(prose),
  often(fc.tuple(prose, prose).map(([a, b]) => `${a}\n${b}`)),
  common(word.map((w) => `# ${w} $h$`)),
  common(fc.tuple(word, prose).map(([a, b]) => `${a}\n===\n${b}`)),
  // Fenced code and math: openers of 2–4 characters with or without info, content with blank and prose lines, closers of any length and indent (or none).
  common(
    fc.tuple(fenceChar, fc.integer({ min: 2, max: 4 }), fc.constantFrom('', 'skein id=k1', 'x`y', 'a$b'), lines(5), indent, fc.integer({ min: 0, max: 5 }), fc.boolean()).map(
      ([c, n, info, body, ind, m, closed]) => `${c.repeat(n)}${info}\n${body.join('\n')}${closed ? `\n${ind}${c.repeat(m)}` : ''}`,
    ),
  ),
  // A fence indented by 1–3 columns (top level, or in a list item) around a blank line and prose.
  common(fc.tuple(fc.constantFrom(' ', '  ', '   ', '\t', ' \t'), fenceChar, prose).map(([ind, c, p]) => `${ind}${c.repeat(3)}\n\n${p}\n${ind}${c.repeat(3)}`)),
  common(fc.tuple(indent, fenceChar, lines(3)).map(([ind, c, body]) => `${ind}${c.repeat(3)}\n${body.join('\n')}\n${ind}${c.repeat(3)}`)),
  // Directive containers, nested or not, closed or not.
  common(
    fc.tuple(fc.integer({ min: 3, max: 4 }), fc.constantFrom('invariants{notation=braid}', 'khovanov-grid', 'x[$l$]', 'bad{', ''), lines(4), fc.integer({ min: 0, max: 4 })).map(
      ([n, name, body, m]) => `${':'.repeat(n)}${name}\n${body.join('\n')}\n${':'.repeat(m)}`,
    ),
  ),
  rare(fc.tuple(lines(2), lines(2)).map(([a, b]) => `::::outer\n${a.join('\n')}\n:::inner\n${b.join('\n')}\n:::\n::::`)),
  common(fc.constant('::drawing{of=k1}')),
  // Lists and block quotes, holding fences, blank lines and continuation lines.
  common(
    fc.tuple(fc.constantFrom('- ', '* ', '1. ', '2) ', '-\t'), prose, lines(3), fc.constantFrom('  ', '   ', '    ', '')).map(
      ([marker, first, rest, cont]) => `${marker}${first}\n${rest.map((l) => (l ? cont + l : l)).join('\n')}`,
    ),
  ),
  common(fc.tuple(fc.constantFrom('- ', '1. '), fenceChar, lines(3)).map(([marker, c, body]) => `${marker}${c.repeat(3)}\n${body.map((l) => `  ${l}`).join('\n')}\n\n${c.repeat(3)}`)),
  common(fc.tuple(fenceChar, lines(3)).map(([c, body]) => `> ${c.repeat(3)}\n${body.map((l) => `> ${l}`).join('\n')}`)),
  common(fc.tuple(prose, lines(2)).map(([a, b]) => `> ${a}\n${b.join('\n')}`)),
  // Tables, HTML, definitions, indented code, breaks.
  common(fc.tuple(word, prose, prose).map(([h, a, b]) => `${h} | b\n--- | ---\n${a} | $c$\n${b}`)),
  // HTML blocks of every kind, ended on their first line or later or never, with fences, blank lines and prose inside or after.
  common(
    fc.tuple(
      fc.constantFrom('<div>', '<DIV class="x">', '<span>$s$</span> text', '<!--', '<!-- c -->', '<!-->', '<!--->', '<?x', '<?>', '<!DOCTYPE x', '<![CDATA[', '<script>', '<SCRIPT type="t">', '<pre>', '<style>a</style>', '<textarea', '<a href="u">', '</p>', '<x-y>', '<'),
      lines(4),
      fc.constantFrom('</div>', '-->', '?>', '>', ']]>', '</script>', '</PRE>', '', '```', '$$'),
    ).map(([open, body, end]) => `${open}\n${body.join('\n')}\n${end}`),
  ),
  common(fc.tuple(fc.constantFrom('<div>', '<span>x</span>', '<!-- a -->'), fenceChar, prose).map(([h, c, p]) => `${h}\n${c.repeat(3)}\n\n${p}\n${c.repeat(3)}`)),
  common(fc.constantFrom('[ref]: https://knots.example "t$"', '[^1]: a note $n$\n\n    more $m$', '[ref $x]: /u')),
  common(fc.tuple(indent, prose).map(([i, p]) => `    ${i}${p}`)),
  common(fc.constantFrom('***', '---', '- - -', '')),
);
const separator = fc.constantFrom('\n\n', '\n\n', '\n', '\n \n', '\n\t\n\n');
const document = fc
  .tuple(fc.constantFrom('', '', '', '', '---\ntitle: a\n\nstrict: true\n---\n', '---\nunclosed $x$\n\nprose\n', '\uFEFF'), fc.array(fc.tuple(block, separator), { minLength: 1, maxLength: 16 }), fc.constantFrom('\n', '\r\n', '\r'))
  .map(([head, blocks, eol]) => (head + blocks.map(([b, s]) => b + s).join('')).replace(/\n/g, eol));

describe('parsing in sections', () => {
  for (const [name, parse] of Object.entries(parsers)) {
    it(`${name}: the sections' trees put together are the whole text's tree, and the math of the sections with a $ is all its math`, () => {
      let cut = 0;
      fc.assert(
        fc.property(document, (text) => {
          const whole = parse(text);
          expect(parseInSections(text, parse)).toEqual(whole);
          expect(formulas(parseInSections(text, parse, (s) => s.includes('$')))).toEqual(formulas(whole));
          // Any choice of sections, read together though they were not neighbours, gives exactly their blocks (and those of the definitions they may need).
          const chosen = (s: string) => s.length % 3 !== 0;
          const starts = sectionStarts(text);
          const kept = starts.filter((from, k) => {
            const section = text.slice(from, starts[k + 1] ?? text.length);
            return chosen(section) || section.includes(']:');
          });
          const inKept = (offset: number) => kept.some((from) => from - bom(text) <= offset && offset < (starts[starts.indexOf(from) + 1] ?? Infinity) - bom(text));
          expect(parseInSections(text, parse, chosen).children).toEqual(whole.children.filter((c) => inKept(c.position!.start.offset!)));
          if (sectionStarts(text).length > 2) cut++;
        }),
        { numRuns: 1000 },
      );
      // Not vacuous: a good share of the generated documents were cut at least twice.
      expect(cut).toBeGreaterThan(120);
    });
  }

  for (const [name, parse] of Object.entries(parsers)) {
    it(`${name}: with section trees kept from run to run (watch), every read is still the whole text's tree, after any edit`, () => {
      keepSectionTrees(4096);
      try {
        fc.assert(
          fc.property(document, document, (before, after) => {
            // The second read meets kept trees for the sections the two texts share, at other offsets and lines.
            const edited = before + after;
            for (const text of [before, edited, before]) {
              const read = parseInSections(text, parse, () => true, name);
              expect(read).toEqual(parse(text));
              // The caller owns what it gets: changing it changes no later read.
              visit(read, (node) => {
                if (node.position) node.position.start.line += 1000;
              });
              read.children.length = 0;
            }
            expect(formulas(parseInSections(edited, parse, (s) => s.includes('$'), name))).toEqual(formulas(parse(edited)));
          }),
          { numRuns: 300 },
        );
      } finally {
        keepSectionTrees(0);
      }
    });
  }

  it('cuts a survey-like text at its paragraphs and code blocks, and reads references with the definitions of other sections', () => {
    const text = 'Intro with $x$.\n\n```skein id=a\n1 1 1\n\nnot a section\n```\n\nProse $y$\nmore.\n\n- item\n\nAfter the list.\n';
    expect(sectionStarts(text).map((at) => text.slice(at, at + 8))).toEqual(['Intro wi', 'Prose $y', 'After th']);
    const referred = `See [the table] for $x$.\n\n${text}\n[the table]: https://knots.example\n`;
    expect(sectionStarts(referred).length).toBe(4);
    const whole = mathReader.parse(referred);
    expect(whole.children[0]).toMatchObject({ type: 'paragraph', children: [{ type: 'text' }, { type: 'linkReference' }, { type: 'text' }, { type: 'inlineMath' }, { type: 'text' }] });
    expect(parseInSections(referred, parsers['math reader'])).toEqual(whole);
    // Only the first section is wanted: the last, which holds the definition, is read with it all the same.
    const partial = parseInSections(referred, parsers['math reader'], (_, from) => from === 0);
    expect(partial.children.map((c) => c.type)).toEqual(['paragraph', 'paragraph', 'definition']);
    expect(partial.children[0]).toEqual(whole.children[0]);
    const front = `---\na: 1\n\nb: 2\n---\n\n${text}`;
    expect(sectionStarts(front).map((at) => front.slice(at, at + 8))).toEqual(['---\na: 1', 'Intro wi', 'Prose $y', 'After th']);
  });
});

/**
 * `check` parses only the sections that can hold skeinproof's markup (mayHoldCarriers): the check must
 * come out the same as with the whole tree. Values: the positive trefoil σ₁³ has V = t + t³ − t⁴
 * (from memory, standard tables); the other stated values are slips on purpose.
 */
describe('checking only the sections that can hold markup', () => {
  const checker = unified().use(remarkParse).use(remarkFrontmatter).use(remarkGfm).use(remarkMath).use(remarkDirective).use(remarkSkeinproof, { fill: false, draw: false });
  async function checked(text: string, tree: Root): Promise<unknown> {
    const file = new VFile({ value: text, path: 'doc.md' });
    await checker.run(tree, file);
    const data = file.data.skeinproof!;
    return JSON.parse(JSON.stringify({ diagnostics: data.diagnostics, splices: data.splices, counts: data.session.counts, settings: data.settings }));
  }
  const carrier = fc.constantFrom(
    '```skein id=t3 notation=braid\n1 1 1\n```',
    '~~~skein id=u notation=braid\n1 1\n\nV\n~~~',
    '```skien id=x\n1\n```',
    'V is :jones{of=t3} and :jones[$t + t^3 - t^4$]{of=t3}.',
    'Then :jones[$t + t^3$]{of=t3} and :determinant[4]{of=t3}.',
    'A slip :jones[$t$]\n{of=t3} and :writhe{of=nobody}.',
    ':::invariants{notation=braid}\n| diagram | jones |\n| --- | --- |\n| t3 | $t + t^3 - t^4$ |\n:::',
    'knot | jones\n--- | ---\nt3 | $t$',
    '<div>:jones{of=t3}</div>',
    '::drawing{of=t3}',
    '::jones{of=t3}',
    'Time 10:30 in text, and a:b.',
  );
  const checkedDocument = fc
    .tuple(
      fc.constantFrom('', '---\nskeinproof:\n  strict: true\n---\n', '---\ntitle: x\n\nskeinproof:\n  notation: braid\n---\n'),
      fc.array(fc.tuple(fc.oneof({ weight: 2, arbitrary: carrier }, block), separator), { minLength: 1, maxLength: 10 }),
      fc.constantFrom('\n', '\r\n'),
    )
    .map(([head, blocks, eol]) => (head + blocks.map(([b, s]) => b + s).join('')).replace(/\n/g, eol));

  it('finds the same diagrams, claims, fill-ins, problems and splices as with the whole tree', async () => {
    await fc.assert(
      fc.asyncProperty(checkedDocument, async (text) => {
        const parse = (t: string) => checker.parse(t);
        const partial = parseInSections(text, parse, (section, from) => from === 0 || mayHoldCarriers(section));
        expect(await checked(text, partial)).toEqual(await checked(text, parse(text)));
      }),
      { numRuns: 300 },
    );
  });
});
