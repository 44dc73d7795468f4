/**
 * Each Markdown syntax form of skeinproof, its output and the position of each
 * error. Known values: the positive trefoil (closure of σ₁³) has
 * V = t + t³ − t⁴ and ⟨D⟩ = A⁻⁷ − A⁻³ − A⁵; the figure-eight (σ₁σ₂⁻¹)²
 * has V = t⁻² − t⁻¹ + 1 − t + t² (from memory, standard tables).
 */
import type { Table } from 'mdast';
import remarkGfm from 'remark-gfm';
import remarkMath from 'remark-math';
import type { InlineMath } from 'mdast-util-math';
import remarkParse from 'remark-parse';
import { unified } from 'unified';
import { visit } from 'unist-util-visit';
import { describe, expect, it } from 'vitest';
import { placed, positionOf, processMarkdown } from './helpers.ts';

const TREFOIL = '```skein id=tref notation=braid\n1 1 1\n```\n';
const FIGURE_EIGHT = '```skein id=fig8 notation=braid\n1 -2 1 -2\n```\n';

describe('diagram blocks', () => {
  it('accepts id, notation, strands and header claims', async () => {
    const r = await processMarkdown('```skein id=k notation=braid strands=3 crossing-number=3 writhe=3\n1 1 1\n```\n');
    expect(r.diagnostics).toEqual([]);
  });

  it('checks every setting of a header with an unknown notation, not only those before it', async () => {
    const text = '```skein id=k notation=morse colour=red writhe\n1 1 1\n```\n\n:writhe{of=k}\n';
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([
      `error markup-invalid ${positionOf(text, 'morse')}`,
      `error markup-invalid ${positionOf(text, 'colour')}`,
      `error markup-invalid ${positionOf(text, 'writhe\n')}`,
      `note target-invalid ${positionOf(text, ':writhe')}`,
    ]);
  });

  it('reads part-signs on a DT diagram: the square knot 10 12 8 4 6 2 with part-signs="+ -" has signature 0 and fills it (square knot 3₁ # 3₁*: σ additive, from memory)', async () => {
    const text = '```skein id=sq notation=dt part-signs="+ -"\n10 12 8 4 6 2\n```\n\n:signature{of=sq} and :writhe[$0$]{of=sq}\n';
    const r = await processMarkdown(text);
    expect(r.diagnostics).toEqual([]);
    expect(r.built.endsWith('$0$ and $0$\n')).toBe(true);
    const other = 'The writhe :writhe[$6$]{of=sq}.\n';
    const refused = await processMarkdown(`${text}${other}`);
    expect(placed(refused.diagnostics)).toEqual([`error claim-contradicted ${positionOf(`${text}${other}`, '$6$]')}`]);
    const bad = '```skein id=k notation=braid part-signs="+"\n1 1 1\n```\n';
    const badRun = await processMarkdown(bad);
    expect(placed(badRun.diagnostics)).toEqual([`error choice-invalid ${positionOf(bad, '+"')}`]);
  });

  it('refuses strands on a code that is not a braid word, at the setting', async () => {
    const text = '```skein id=k notation=pd strands=3\n(4,2,5,1) (2,6,3,5) (6,4,1,3)\n```\n\n:writhe{of=k}\n';
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([`error markup-invalid ${positionOf(text, 'strands')}`]);
    expect(r.diagnostics[0]!.message).toMatch(/braid words only/);
    // The code itself is still read: the positive trefoil's writhe is 3 (from memory).
    expect(r.built.endsWith('$3$\n')).toBe(true);
  });

  it('reports a diagram block never closed at its fence, instead of reading the rest of the document as code', async () => {
    for (const fence of ['```', '~~~~']) {
      const text = `Before.\n\n${fence}skein id=k notation=braid\n1 1 1\n\nThe writhe is :writhe[$2$]{of=k}.\n`;
      const r = await processMarkdown(text);
      expect(placed(r.diagnostics)).toEqual(['error markup-invalid 3:1']);
      expect(r.diagnostics[0]!.message).toBe(`diagram block \`k\` is never closed, so the rest of the document (line 4 on) is read as its code and nothing there is checked: add a line ${fence} after the code`);
    }
    // Closed by the end of its block quote, as CommonMark closes it, the block is fine.
    const quoted = '> ```skein id=k notation=braid\n> 1 1 1\n\nThe writhe is :writhe[$3$]{of=k}.\n';
    expect((await processMarkdown(quoted)).diagnostics).toEqual([]);
  });

  it('reports an info string that runs the settings into `skein`, and leaves other languages alone', async () => {
    const text = '```skein,id=k notation=braid\n1 1 1\n```\n\n```skeinid=m\n1\n```\n\n```skeleton\nx\n```\n';
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([`error markup-invalid ${positionOf(text, 'skein,id')}`, `error markup-invalid ${positionOf(text, 'skeinid')}`]);
    expect(r.diagnostics[0]!.message).toMatch(/must start with the word `skein` and a space/);
  });

  it('judges a header claim and points at its value', async () => {
    const text = '```skein id=k notation=braid writhe=2\n1 1 1\n```\n';
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([`error claim-contradicted ${positionOf(text, '2\n')}`]);
    expect(r.diagnostics[0]!.message).toContain('diagram k');
  });

  it('reports a missing id, an unknown setting and an unknown notation where they are written', async () => {
    const text = '```skein notation=braid\n1\n```\n\n```skein id=a colour=red notation=braid\n1 1 1\n```\n\n```skein id=b notation=morse\n1\n```\n';
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([
      'error markup-invalid 1:1',
      `error markup-invalid ${positionOf(text, 'colour')}`,
      `error markup-invalid ${positionOf(text, 'morse')}`,
    ]);
    expect(r.diagnostics[1]!.message).toMatch(/unknown setting `colour`/);
  });

  it('takes the default notation from the front matter', async () => {
    const r = await processMarkdown('---\nskeinproof:\n  notation: braid\n---\n\n```skein id=k\n1 1 1\n```\n\n:jones{of=k}\n');
    expect(r.diagnostics).toEqual([]);
    expect(r.built.endsWith('$t + t^3 - t^4$\n')).toBe(true);
  });

  it('locates an error inside the code, also in a block quote', async () => {
    const text = '> ```skein id=k notation=braid\n> 1 x 1\n> ```\n';
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([`error code-invalid ${positionOf(text, 'x')}`]);
  });

  it('reports a duplicated id at the second header, naming the first', async () => {
    const text = TREFOIL + '\n' + TREFOIL.replace('1 1 1', '1 1 1 1 1');
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual(['error id-duplicate 5:13']);
    expect(r.diagnostics[0]!.message).toContain('doc.md:1:13');
  });
});

describe('fill-ins', () => {
  it('replaces each fill-in by its typeset value and nothing else', async () => {
    const text = `${TREFOIL}\nV = :jones{of=tref}, bracket :bracket{of=tref}, span :span{of=tref}, writhe :writhe{of=tref}.\n`;
    const r = await processMarkdown(text);
    expect(r.diagnostics).toEqual([]);
    expect(r.built).toBe(`${TREFOIL}\nV = $t + t^3 - t^4$, bracket $A^{-7} - A^{-3} - A^5$, span $3$, writhe $3$.\n`);
  });

  it('keeps a filled-in value or a claim apart from math written right beside it ($$ would open display math)', async () => {
    const text = `${TREFOIL}\nA $V=$:jones{of=tref}, :writhe{of=tref}$+1$, $V=$:jones[$t + t^3 - t^4$]{of=tref}$.$\n`;
    const r = await processMarkdown(text);
    expect(r.diagnostics).toEqual([]);
    expect(r.built.endsWith('A $V=$ $t + t^3 - t^4$, $3$ $+1$, $V=$ $t + t^3 - t^4$ $.$\n')).toBe(true);
    // Read again, every value is its own inline math span and none is display math.
    const math: string[] = [];
    visit(unified().use(remarkParse).use(remarkMath).parse(r.built), (n) => {
      if (n.type === 'inlineMath' || n.type === 'math') math.push(`${n.type}:${(n as InlineMath).value}`);
    });
    expect(math.slice(-7)).toEqual(['inlineMath:V=', 'inlineMath:t + t^3 - t^4', 'inlineMath:3', 'inlineMath:+1', 'inlineMath:V=', 'inlineMath:t + t^3 - t^4', 'inlineMath:.']);
  });

  it('writes the crossing-number statement as prose naming the theorem', async () => {
    const r = await processMarkdown(`${FIGURE_EIGHT}\n:statement{of=fig8}\n`);
    expect(r.diagnostics).toEqual([]);
    expect(r.built).toMatch(/Kauffman–Murasugi–Thistlethwaite/);
    expect(r.built).toMatch(/crossing number is \$4\$/);
  });

  it('leaves directives that are not ours alone', async () => {
    const text = `${TREFOIL}\nA :note[word]{.wide} and :remark without target.\n`;
    const r = await processMarkdown(text);
    expect(r.diagnostics).toEqual([]);
    expect(r.built).toBe(text);
  });

  it('a directive named after a value is ours even without `of`: an error, not left alone', async () => {
    const text = `${TREFOIL}\nA :span[word]{.note} and :jones without target.\n`;
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([`error markup-invalid ${positionOf(text, '.note')}`, `error markup-invalid ${positionOf(text, ':jones')}`]);
  });

  it('reports an unknown target with a suggestion, at the directive', async () => {
    const text = `${TREFOIL}\nSee :jones{of=tre}.\n`;
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([`error target-unknown ${positionOf(text, ':jones')}`]);
    expect(r.diagnostics[0]!.hints?.[0]).toBe('Did you mean `tref`?');
    expect(r.built).toBe(text);
  });

  it('offers only ids the author wrote, and no far-fetched suggestion for a short id', async () => {
    const text = `${TREFOIL}\n:::invariants{notation=braid}\n| diagram | writhe |\n|---|---|\n| \`1 1\` | |\n:::\n\nSee :jones{of=zz} and :jones{of=trf}.\n`;
    const r = await processMarkdown(text);
    expect(r.diagnostics.map((d) => d.hints)).toEqual([
      ['The diagram ids are: tref.'],
      ['Did you mean `tref`?', 'The diagram ids are: tref.'],
    ]);
  });

  it('refuses attributes it would drop unread, on claims, fill-ins and tables, and still judges the claim', async () => {
    const text = `${TREFOIL}\n:jones{of=tref fo=1} :writhe[$2$]{of=tref #x .y}\n\n:::invariants{notaton=braid}\n| diagram | writhe |\n|---|---|\n| tref | |\n:::\n`;
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([
      // Each error points at the first attribute it refuses (common practice: a compiler points at the offending token).
      `error markup-invalid ${positionOf(text, 'fo=1')}`,
      `error claim-contradicted ${positionOf(text, '$2$')}`,
      `error markup-invalid ${positionOf(text, '#x')}`,
      `error markup-invalid ${positionOf(text, 'notaton')}`,
    ]);
    expect(r.diagnostics.map((d) => /unknown attributes? [^:]*|wrong writhe/.exec(d.message)?.[0])).toEqual([
      'unknown attribute `fo`',
      'wrong writhe',
      'unknown attributes `id`, `class`',
      'unknown attribute `notaton`',
    ]);
  });

  it('does not also call the id of a refused block or row unknown: a note points at the refusal', async () => {
    const text = '```skein id=b notation=knotty\n1 1\n```\n\n:::invariants\n| diagram | notation | writhe |\n|---|---|---|\n| r1 `1 1` | morse | |\n:::\n\n:jones{of=b} :writhe[$2$]{of=r1} :jones{of=zz}\n';
    const r = await processMarkdown(text);
    const last = text.split('\n').length - 1;
    expect(placed(r.diagnostics)).toEqual([
      `error markup-invalid ${positionOf(text, 'knotty')}`,
      `error markup-invalid ${positionOf(text, 'morse')}`,
      `note target-invalid ${last}:1`,
      `note target-invalid ${positionOf(text, '$2$')}`,
      `error target-unknown ${positionOf(text, ':jones{of=zz}')}`,
    ]);
    expect(r.diagnostics[2]!.message).toBe(`the jones fill-in for \`b\` is not filled in: the diagram \`b\` was refused (doc.md:${positionOf(text, 'knotty')})`);
  });

  it('refuses a fill-in of a value that is only checked', async () => {
    const text = `${TREFOIL}\n:alternating{of=tref}\n`;
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([`error markup-invalid ${positionOf(text, ':alternating')}`]);
  });
});

describe('prose claims', () => {
  it('keeps the author text and drops only the markup', async () => {
    const text = `${TREFOIL}\nWe find :jones[$t+t^3-t^4$]{of=tref} here.\n`;
    const r = await processMarkdown(text);
    expect(r.diagnostics).toEqual([]);
    expect(r.built).toBe(`${TREFOIL}\nWe find $t+t^3-t^4$ here.\n`);
  });

  it('points a contradicted claim at the math the author wrote', async () => {
    const text = `${TREFOIL}\nWe find :jones[$t^{-1}+t^{-3}-t^{-4}$]{of=tref} here.\n`;
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([`error claim-contradicted ${positionOf(text, '$t^{-1}')}`]);
    expect(r.diagnostics[0]!.message).toMatch(/mirror/);
    expect(r.failed).toBe(true);
  });

  it('points an unreadable claim inside its math', async () => {
    const text = `${TREFOIL}\nWe find :jones[$t + t^{3$]{of=tref}.\n`;
    const r = await processMarkdown(text);
    expect(r.diagnostics.map((d) => d.ruleId)).toEqual(['claim-unreadable']);
    const col = r.diagnostics[0]!.location!.start.column;
    const line = text.split('\n')[4]!;
    expect(line.slice(col - 1)).toMatch(/^\{3\$/);
  });

  it('reads a claim written without math', async () => {
    const r = await processMarkdown(`${TREFOIL}\nIt has :crossings[3]{of=tref} crossings and is :alternating[yes]{of=tref}.\n`);
    expect(r.diagnostics).toEqual([]);
    expect(r.built).toContain('It has 3 crossings and is yes.');
  });
});

describe('tables', () => {
  const table = (rows: string) => `${TREFOIL}${FIGURE_EIGHT}\n:::invariants{notation=braid}\n| diagram | jones | crossing number | remarks |\n|---|---|---|---|\n${rows}:::\n`;

  it('fills empty cells, checks filled ones and empties the fence lines', async () => {
    const text = table('| tref | | $3$ | ok |\n| fig8 | $t^{-2}-t^{-1}+1-t+t^2$ | | |\n');
    const r = await processMarkdown(text);
    expect(r.diagnostics).toEqual([]);
    expect(r.built).toBe(
      `${TREFOIL}${FIGURE_EIGHT}\n\n| diagram | jones | crossing number | remarks |\n|---|---|---|---|\n| tref | $t + t^3 - t^4$ | $3$ | ok |\n| fig8 | $t^{-2}-t^{-1}+1-t+t^2$ | $4$ | |\n\n`,
    );
  });

  it('keeps a line written right after the closing fence out of the table (GFM: a blank line ends a table)', async () => {
    for (const [prefix, nl] of [['', '\n'], ['> ', '\r\n']] as const) {
      const lines = [':::invariants{notation=braid}', '| diagram | writhe |', '|---|---|', '| `1 1 1` | |', ':::', 'Text after the table.'];
      const text = `Text before.${nl}` + lines.map((l) => prefix + l + nl).join('');
      const r = await processMarkdown(text);
      expect(r.diagnostics).toEqual([]);
      expect(r.built).toBe(`Text before.${nl}${prefix}${nl}${prefix}| diagram | writhe |${nl}${prefix}|---|---|${nl}${prefix}| \`1 1 1\` | $3$ |${nl}${prefix}${nl}${prefix}Text after the table.${nl}`);
      // The built text, read again, has a table of one body row: the text after the fence is not a second one.
      const rows: number[] = [];
      visit(unified().use(remarkParse).use(remarkGfm).parse(r.built), 'table', (t: Table) => void rows.push(t.children.length - 1));
      expect(rows).toEqual([1]);
      expect(r.built.split(nl).length).toBe(text.split(nl).length);
    }
  });

  it('points a wrong cell at the cell and names row and column', async () => {
    const text = table('| tref | | $3$ | |\n| fig8 | | $5$ | |\n');
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([`error claim-contradicted ${positionOf(text, '$5$')}`]);
    expect(r.diagnostics[0]!.message).toMatch(/^table row 2 \(fig8\), column crossing-number/);
  });

  it('defines diagrams by code in a row, named or not', async () => {
    const text = table('| `1 1 1 1 1` | | | |\n| cinq `1 1 1 1 1` | $t^2+t^4-t^5+t^6-t^8$ | | |\n');
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics.filter((d) => d.severity === 'error'))).toEqual([`error claim-contradicted ${positionOf(text, '$t^2+t^4')}`]);
    expect(r.diagnostics[0]!.message).toMatch(/^table row 2 \(cinq\), column jones/);
    // T(2,5): t² + t⁴ − t⁵ + t⁶ − t⁷ (Jones' formula for torus knots).
    expect(r.built).toContain('| `1 1 1 1 1` | $t^2 + t^4 - t^5 + t^6 - t^7$ | $5$ | |');
  });

  it('keeps a fill-in whose prose holds a `|` inside its table cell, in any table (GFM: `|` ends a cell)', async () => {
    // The genus paragraph writes the signature as $|\sigma| = 2$ (|σ| of the positive trefoil is 2, from memory).
    const text = `${TREFOIL}\n| knot | genus |\n|---|---|\n| tref | :genus{of=tref} |\n\n:::invariants\n| diagram | writhe | remarks |\n|---|---|---|\n| tref | | :genus{of=tref} |\n:::\n`;
    const r = await processMarkdown(text);
    expect(r.diagnostics).toEqual([]);
    const widths: number[][] = [];
    const math: string[] = [];
    const tree = unified().use(remarkParse).use(remarkGfm).use(remarkMath).parse(r.built);
    visit(tree, 'table', (t: Table) => void widths.push(t.children.map((row) => row.children.length)));
    visit(tree, 'inlineMath', (m: InlineMath) => void math.push(m.value));
    expect(widths).toEqual([[2, 2], [3, 3]]);
    expect(math.filter((m) => m.includes('sigma'))).toEqual(['\\vert\\sigma\\vert = 2', '\\vert\\sigma\\vert = 2']);
  });

  it('refuses an id in a row that no directive could name, at the id', async () => {
    const text = table('| my$knot `1 1 1` | | | |\n');
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([`error markup-invalid ${positionOf(text, 'my$knot')}`]);
    expect(r.diagnostics[0]!.message).toMatch(/^table row 1: diagram id `my\$knot` is not usable/);
  });

  it('reports an unknown column at its header and an invalid row code at the code', async () => {
    const text = `:::invariants{notation=braid}\n| diagram | colour |\n|---|---|\n| \`1 0 1\` | red |\n:::\n`;
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([`error markup-invalid ${positionOf(text, 'colour')}`, `error code-invalid ${positionOf(text, '0')}`]);
  });

  it('needs a diagram column', async () => {
    const text = `:::invariants\n| label | jones |\n|---|---|\n| a | |\n:::\n`;
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual(['error markup-invalid 2:1', 'error markup-invalid 2:3']);
  });
});

describe('front matter', () => {
  it('sets the convention: q and descending order', async () => {
    const text = `---\nskeinproof:\n  convention: { jones: q, order: descending }\n---\n\n${TREFOIL}\n:jones{of=tref}\n`;
    const r = await processMarkdown(text);
    expect(r.diagnostics).toEqual([]);
    // t = q²: t + t³ − t⁴ becomes q² + q⁶ − q⁸, written from the top degree.
    expect(r.built.endsWith('$-q^8 + q^6 + q^2$\n')).toBe(true);
  });

  it('accepts the one-line form of the convention', async () => {
    const r = await processMarkdown(`---\nskeinproof:\n  convention: "jones=t-inverse"\n---\n\n${TREFOIL}\n:jones{of=tref}\n`);
    expect(r.diagnostics).toEqual([]);
    expect(r.built).toContain('$-t^{-4} + t^{-3} + t^{-1}$');
  });

  it('still applies the right settings of a convention that has a wrong one, so claims in it are judged in it', async () => {
    // t = q² (the convention section): the positive trefoil's t + t³ − t⁴ is q² + q⁶ − q⁸.
    const text = `---\nskeinproof:\n  convention: { jones: q, colour: blue }\n---\n\n${TREFOIL}\n:jones[$q^2 + q^6 - q^8$]{of=tref} :jones{of=tref}\n`;
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([`error convention-invalid ${positionOf(text, 'colour')}`]);
    expect(r.built.endsWith('$q^2 + q^6 - q^8$ $q^2 + q^6 - q^8$\n')).toBe(true);
  });

  it('reports a wrong default notation once, at the front matter, not again at every diagram that relies on it', async () => {
    const text = '---\nskeinproof:\n  notation: braids\n---\n\n```skein id=k\n1 1 1\n```\n\n:::invariants\n| diagram | writhe |\n|---|---|\n| r `1 1` | |\n:::\n\n:writhe[$3$]{of=k}\n';
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([`error front-matter-invalid ${positionOf(text, 'braids')}`, `note target-invalid ${positionOf(text, '$3$')}`]);
    expect(r.diagnostics[1]!.message).toContain(`was refused (doc.md:${positionOf(text, 'braids')})`);
    expect(r.failed).toBe(true);
  });

  it('locates a bad convention value and an unknown setting', async () => {
    const text = `---\nskeinproof:\n  convention: { jones: x }\n  colour: blue\n---\n`;
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([`error convention-invalid ${positionOf(text, 'x }')}`, `error front-matter-invalid ${positionOf(text, 'colour')}`]);
  });

  it('makes warnings fail under strict', async () => {
    // A DT code fixes a knot only up to mirror image: the mirror value is accepted with a warning.
    const body = '```skein id=k notation=dt\n4 6 2\n```\n\n:jones[$t^{-1}+t^{-3}-t^{-4}$]{of=k}\n';
    const lax = await processMarkdown(body);
    expect(lax.diagnostics.map((d) => d.severity)).toEqual(['warning']);
    expect(lax.failed).toBe(false);
    const strict = await processMarkdown(`---\nskeinproof:\n  strict: true\n---\n${body}`);
    expect(strict.failed).toBe(true);
    expect((await processMarkdown(body, { strict: true })).failed).toBe(true);
  });
});

describe('file encodings', () => {
  it('keeps positions and bytes right with a byte order mark and CRLF line ends', async () => {
    const text = '\uFEFF```skein id=k notation=braid\r\n1 x 1\r\n```\r\n\r\nA :writhe{of=q} and :jones[$t$]{of=k}\r\n';
    const r = await processMarkdown(text);
    // Columns as an editor shows them: the mark is not a character of line 1.
    expect(placed(r.diagnostics)).toEqual(['error code-invalid 2:3', 'error target-unknown 5:3', 'note target-invalid 5:28']);
    const ok = '\uFEFF```skein id=k notation=braid\r\n1 1 1\r\n```\r\n\r\nA :writhe{of=k} and :jones[$t+t^3-t^4$]{of=k}\r\n';
    expect((await processMarkdown(ok)).built).toBe('\uFEFF```skein id=k notation=braid\r\n1 1 1\r\n```\r\n\r\nA $3$ and $t+t^3-t^4$\r\n');
  });
});

describe('more error positions', () => {
  it('info strings: a setting without value, an unclosed quote, a repeated setting, a bad strands count', async () => {
    const text = '```skein id=a notation=braid loose\n1 1 1\n```\n\n```skein id=b notation=braid jones="t + t^3\n1 1 1\n```\n\n```skein id=c notation=braid id=d strands=0\n1 1 1\n```\n';
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([
      `error markup-invalid ${positionOf(text, 'loose')}`,
      `error markup-invalid ${positionOf(text, 'jones=')}`,
      `error markup-invalid ${positionOf(text, 'id=d')}`,
      `error markup-invalid ${positionOf(text, '0\n')}`,
    ]);
  });

  it('front matter: invalid YAML, a non-boolean strict and an unknown notation', async () => {
    const broken = await processMarkdown('---\nskeinproof: [unclosed\n---\n');
    expect(broken.diagnostics.map((d) => [d.ruleId, d.location?.start.line])).toEqual([['front-matter-invalid', 2]]);
    const text = '---\nskeinproof:\n  strict: maybe\n  notation: morse\n---\n';
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([`error front-matter-invalid ${positionOf(text, 'maybe')}`, `error front-matter-invalid ${positionOf(text, 'morse')}`]);
  });

  it('tables: a notation column per row, and an unknown notation in it', async () => {
    // PD and DT codes of the trefoil: V = t + t^3 - t^4 for this PD code (common practice: the PD code (1,5,2,4)(3,1,4,6)(5,3,6,2)
    // is a trefoil); a DT code fixes it up to mirror image only.
    const text = ':::invariants\n| diagram | notation | crossings |\n|---|---|---|\n| `(1,5,2,4) (3,1,4,6) (5,3,6,2)` | pd | |\n| `4 6 2` | dt | $3$ |\n| `4 6 2` | morse | |\n:::\n';
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([`error markup-invalid ${positionOf(text, 'morse')}`]);
    expect(r.built).toContain('| `(1,5,2,4) (3,1,4,6) (5,3,6,2)` | pd | $3$ |');
  });

  it('a table row without a cell for a column', async () => {
    const text = '```skein id=k notation=braid\n1 1 1\n```\n\n:::invariants\n| diagram | writhe | span |\n|---|---|---|\n| k | $3$ |\n:::\n';
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([`error markup-invalid ${positionOf(text, '| k')}`]);
    expect(r.diagnostics[0]!.message).toMatch(/table row 1 \(k\), column span/);
  });
});

describe('broken directives', () => {
  it('is an error where a claim would otherwise go unchecked', async () => {
    // A line starting with "+ " inside the label starts a list, so the directive breaks.
    const text = `${TREFOIL}\nA :jones[$t + t^3\n+ t^4$]{of=tref}\n\nB :writhe[$3$]\n{of=tref}\n`;
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([`error markup-invalid ${positionOf(text, ':jones')}`, `error markup-invalid ${positionOf(text, ':writhe')}`]);
    expect(r.failed).toBe(true);
  });

  it('is an error for a claim inside a raw HTML block, which Markdown does not read', async () => {
    const text = `${TREFOIL}\n<div class="remark">\nThe writhe is :writhe[$4$]{of=tref}.\n</div>\n\n<span>:writhe[$3$]{of=tref}</span> is read.\n`;
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([`error markup-invalid ${positionOf(text, ':writhe')}`]);
    expect(r.diagnostics[0]!.hints?.[0]).toMatch(/raw HTML/);
    expect(r.built).toContain('<span>$3$</span> is read.');
  });

  it('reads a label that wraps onto a plain line, and locates inside it', async () => {
    const text = `${TREFOIL}\nA :jones[$t + t^3\n- t^4$]{of=tref} and :jones[$t + t^3\nt^{4}$]{of=tref}\n`;
    const r = await processMarkdown(text.replace('\n- t^4', ' - t^4'));
    expect(r.diagnostics.filter((d) => d.severity === 'error').map((d) => `${d.ruleId} ${d.location?.start.line}:${d.location?.start.column}`)).toEqual([
      `claim-contradicted ${positionOf(text.replace('\n- t^4', ' - t^4'), '$t + t^3\nt^{4}')}`,
    ]);
  });
});

describe('table rows in more detail', () => {
  it('reports a row naming an unknown diagram once, not once per column', async () => {
    const text = `${TREFOIL}\n:::invariants\n| diagram | jones | writhe | span |\n|---|---|---|---|\n| tre | | $3$ | |\n:::\n`;
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([`error target-unknown ${positionOf(text, '$3$')}`]);
  });

  it('reports every reference in prose to an unknown diagram, also two on one line (each is a place to fix)', async () => {
    const text = `${TREFOIL}\nSee :jones{of=tre} and :writhe[$3$]{of=tre}.\n`;
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([
      `error target-unknown ${positionOf(text, ':jones{of=tre}')}`,
      `error target-unknown ${positionOf(text, '$3$')}`,
    ]);
  });

  it('an unusable id is one error at the id; a reference to it gets a note pointing there, not a second error', async () => {
    const text = '```skein id="k<1" notation=braid\n1 1 1\n```\n\nSee :writhe[$3$]{of="k<1"}.\n';
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual([`error markup-invalid ${positionOf(text, 'k<1')}`, `note target-invalid ${positionOf(text, '$3$')}`]);
  });

  it('lets a directive in a cell speak for itself', async () => {
    const text = `${TREFOIL}${FIGURE_EIGHT}\n:::invariants\n| diagram | writhe |\n|---|---|\n| tref | :writhe{of=fig8} |\n:::\n`;
    const r = await processMarkdown(text);
    expect(r.diagnostics).toEqual([]);
    expect(r.built).toContain('| tref | $0$ |');
  });
});
