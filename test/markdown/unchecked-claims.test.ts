/**
 * Nothing an author meant as a claim goes unchecked without a word: a directive named after a claim or fill key
 * without its `of` is an error saying how to write it; HTML comments switch text off silently; a pass counts what
 * was checked, and a manuscript without any markup is said to be one.
 */
import { describe, expect, it } from 'vitest';
import { processMarkdown, placed, positionOf } from './helpers.ts';

const TREFOIL = '```skein id=t3 notation=braid\n1 1 1\n```\n\n';

describe('a claim-shaped directive without its target is an error', () => {
  const cases: [string, string, string, RegExp][] = [
    ['no attribute at all', 'V is :jones[$t + t^3 - t^4$].', ':jones', /names no diagram.*write :jones\[\$t \+ t\^3 - t\^4\$\]\{of=ID\}/],
    ['`id` instead of `of`', 'V is :jones[$t + t^3 - t^4$]{id=t3}.', 'id=t3', /has no `of` attribute \(it has `id`\).*write :jones\[\$t \+ t\^3 - t\^4\$\]\{of=t3\}/],
    ['the `#` shorthand', 'V is :jones[$t + t^3 - t^4$]{#t3}.', '#t3', /has no `of` attribute \(it has `#`\).*\{of=t3\}/],
    ['a misspelt `of`', 'V is :jones[$t + t^3 - t^4$]{fo=t3}.', 'fo', /has no `of` attribute \(it has `fo`\)/],
    ['a space before {of=…}', 'V is :jones[$t + t^3 - t^4$] {of=t3}.', ':jones', /cut off from its \{…\} by a space/],
    ['{of=…} on the next line', 'V is :jones[$t + t^3 - t^4$]\n{of=t3}.', ':jones', /cut off from its \{…\} by a line break/],
    ['a fill-in with no target', 'V is :jones.', ':jones', /names no diagram.*a fill-in names its diagram in `of`.*write :jones\{of=ID\}/],
    ['a class only', 'V is :span[$3$]{.wide}.', '.wide', /:span` has no `of` attribute \(it has `class`\)/],
  ];
  for (const [name, line, at, message] of cases) {
    it(name, async () => {
      const text = `${TREFOIL}${line}\n`;
      const r = await processMarkdown(text);
      const problems = r.diagnostics.filter((d) => d.ruleId === 'markup-invalid');
      expect(placed(problems)).toEqual([`error markup-invalid ${positionOf(text, at, line.slice(0, 4))}`]);
      expect(problems[0]!.message).toMatch(message);
      expect(r.failed).toBe(true);
    });
  }

  it('a leaf directive named after a value is an error too', async () => {
    const text = `${TREFOIL}::jones[$t + t^3 - t^4$]{of=t3}\n`;
    const r = await processMarkdown(text);
    expect(placed(r.diagnostics)).toEqual(['error markup-invalid 5:1']);
    expect(r.diagnostics[0]!.message).toMatch(/text directives with one colon/);
  });

  it('directives with other names are still left alone', async () => {
    const r = await processMarkdown(`${TREFOIL}A :note[aside]{.wide} and :jones[$t + t^3 - t^4$]{of=t3}.\n`);
    expect(r.diagnostics).toEqual([]);
  });
});

describe('HTML comments switch text off silently', () => {
  it('a claim in an inline comment, in a block comment, and a whole diagram in a comment', async () => {
    const text = [
      TREFOIL,
      'Kept <!-- :jones[$t^2$]{of=t3} --> and :writhe[$3$]{of=t3}.',
      '',
      '<!--',
      ':jones[$t^2$]{of=nothing}',
      '```skein id=old notation=braid',
      '1 1',
      '```',
      '-->',
      '',
    ].join('\n');
    const strict = await processMarkdown(text, { strict: true });
    expect(strict.diagnostics).toEqual([]);
    expect(strict.failed).toBe(false);
    expect(strict.file.data.skeinproof!.session.counts).toMatchObject({ diagrams: 1, claimsAgree: 1 });
  });

  it('markup in raw HTML outside a comment is still reported', async () => {
    const r = await processMarkdown(`${TREFOIL}<div>\n<!-- a note -->\n:jones[$t^2$]{of=t3}\n</div>\n`);
    expect(placed(r.diagnostics)).toEqual(['error markup-invalid 7:1']);
  });
});

describe('what a pass checked', () => {
  it('counts diagrams, claims by verdict, filled values and table cells', async () => {
    const text = [
      TREFOIL,
      '```skein id=hopf notation=braid',
      '1 1',
      '```',
      '',
      'V is :jones{of=t3}, :writhe[$3$]{of=t3}, :writhe[$2$]{of=hopf}, :crossing-number[$\\le 3$]{of=t3}, :crossings[$5$]{of=t3}.',
      '',
      ':::invariants',
      '| diagram | writhe | jones | linking |',
      '|---|---|---|---|',
      '| t3 | $3$ | | — |',
      '| hopf | | | $1$ |',
      ':::',
      '',
    ].join('\n');
    const r = await processMarkdown(text);
    // Writhe of the positive trefoil 3 and of the positive Hopf link 2, lk = 1 (from memory).
    expect(r.file.data.skeinproof!.session.counts).toEqual({
      diagrams: 2,
      claimsAgree: 5,
      claimsContradicted: 1,
      claimsUndecided: 0,
      valuesFilled: 4,
      tableCells: 5,
      notApplicable: 1,
      figures: 0,
    });
  });

  it('counts a family code with a free parameter as one diagram, and one whose instance is refused as none', async () => {
    const text = [
      '```skein id=tn notation=family for="n=3..7 step 2"',
      'torus 2 n',
      '```',
      '',
      '```skein id=tw notation=family for="k=-1..1"',
      'twist k',
      '```',
      '',
      // det T(2, n) = n (from memory: |Δ(−1)| of the (2, n) torus knot).
      'Its determinant is :determinant[$n$]{of=tn}.',
      '',
    ].join('\n');
    const r = await processMarkdown(text);
    expect(r.file.data.skeinproof!.session.counts).toMatchObject({ diagrams: 1, claimsAgree: 1 });
  });

  it('a manuscript without skeinproof markup gets a warning at its start', async () => {
    for (const text of ['', '# A paper\n\nIt has $V(t) = t + t^3 - t^4$ but no markup.\n']) {
      const r = await processMarkdown(text);
      expect(placed(r.diagnostics)).toEqual(['warning manuscript-unmarked 1:1']);
      expect(r.diagnostics[0]!.message).toMatch(/no skeinproof markup, so nothing in it was checked/);
      expect((await processMarkdown(text, { strict: true })).failed).toBe(true);
    }
  });

  it('a table of claims written without its :::invariants fence is a warning; an ordinary table is not (the fence is what makes a table checked, README "Tables")', async () => {
    const claims = `${TREFOIL}| Knot | Jones polynomial | det |\n| --- | --- | --- |\n| t3 | $t + t^3 - t^4$ | 5 |\n`;
    const r = await processMarkdown(claims);
    expect(placed(r.diagnostics)).toEqual([`warning table-unfenced ${positionOf(claims, '| Knot')}`]);
    expect(r.diagnostics[0]!.message).toMatch(/claim columns \(`jones`, `determinant`\), but it is not inside `:::invariants`/);
    for (const prose of [
      `${TREFOIL}| Knot | Author | Year |\n| --- | --- | --- |\n| t3 | Someone | 1900 |\n`,
      `${TREFOIL}| Invariant | Value |\n| --- | --- |\n| det | 3 |\n`,
      `${TREFOIL}:::invariants\n\n| diagram | det |\n| --- | --- |\n| t3 | 3 |\n\n:::\n`,
    ]) {
      expect((await processMarkdown(prose)).diagnostics.filter((d) => d.ruleId === 'table-unfenced')).toEqual([]);
    }
  });

  it('markup that was refused is markup: no second warning', async () => {
    const r = await processMarkdown('```skein notation=braid\n1 1 1\n```\n');
    expect(r.diagnostics.map((d) => d.ruleId)).toEqual(['markup-invalid']);
  });
});
