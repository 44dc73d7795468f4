/**
 * What check and build read and what they agree on: a manuscript that is not
 * UTF-8 is refused at its first bad byte (UTF-8 as RFC 3629 defines it), and
 * `check` reports the formulas KaTeX cannot typeset, as `build --html` does.
 * Value from memory: the positive trefoil σ₁³ has V = t + t³ − t⁴.
 */
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { latexFormat } from '../../src/cli/formats/latex.ts';
import { MAX_MARKDOWN_LINE, markdownFormat } from '../../src/cli/formats/markdown.ts';
import { firstInvalidUtf8Byte } from '../../src/cli/utf8.ts';
import { skeinproof } from '../markdown/cli.ts';

const work = mkdtempSync(join(tmpdir(), 'skeinproof-input-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

const TREFOIL = '```skein id=k notation=braid\n1 1 1\n```\n';

describe('UTF-8', () => {
  it('finds the first byte outside a well-formed sequence (RFC 3629)', () => {
    const bytes = (...b: number[]) => Uint8Array.from(b);
    expect(firstInvalidUtf8Byte(Buffer.from('knot ∞ 𝕂 é', 'utf8'))).toBeUndefined();
    expect(firstInvalidUtf8Byte(bytes(0x61, 0xe9, 0x62))).toBe(1); // Latin-1 é
    expect(firstInvalidUtf8Byte(bytes(0xc0, 0xaf))).toBe(0); // overlong '/'
    expect(firstInvalidUtf8Byte(bytes(0xed, 0xa0, 0x80))).toBe(0); // a UTF-16 surrogate
    expect(firstInvalidUtf8Byte(bytes(0xf4, 0x90, 0x80, 0x80))).toBe(0); // beyond U+10FFFF
    expect(firstInvalidUtf8Byte(bytes(0x61, 0xe2, 0x88))).toBe(1); // cut short at the end
    expect(firstInvalidUtf8Byte(bytes(0x80))).toBe(0); // a lone continuation byte
  });

  it('refuses a Latin-1 manuscript at the bad byte’s line and column, Markdown and LaTeX, and builds nothing', async () => {
    const latin1 = Buffer.concat([Buffer.from(`${TREFOIL}\nThe knot`), Buffer.from([0xe9]), Buffer.from(' is :jones{of=k}.\n')]);
    const md = join(work, 'latin1.md');
    writeFileSync(md, latin1);
    const checked = await markdownFormat.check(md, {});
    expect(checked.failed).toBe(true);
    expect(checked.diagnostics.map((d) => `${d.ruleId} ${d.location?.start.line}:${d.location?.start.column}`)).toEqual(['encoding-invalid 5:9']);
    expect(checked.diagnostics[0]!.message).toContain('0xE9');
    const built = await markdownFormat.build(md, { output: join(work, 'latin1.out.md') });
    expect(built.outputs).toEqual([]);

    const tex = join(work, 'latin1.tex');
    writeFileSync(tex, Buffer.concat([Buffer.from('\\documentclass{article}\n\\usepackage{skeinproof}\n\\begin{document}\nCaf'), Buffer.from([0xe9]), Buffer.from('\n\\end{document}\n')]));
    const texChecked = await latexFormat.check(tex, {});
    expect(texChecked.failed).toBe(true);
    expect(texChecked.diagnostics.map((d) => `${d.ruleId} ${d.location?.start.line}:${d.location?.start.column}`)).toEqual(['encoding-invalid 4:4']);
  });

  it('refuses a LaTeX file read through \\input that is not UTF-8, at its own line', async () => {
    const dir = mkdtempSync(join(work, 'paper-'));
    writeFileSync(join(dir, 'paper.tex'), '\\documentclass{article}\n\\usepackage{skeinproof}\n\\begin{document}\n\\input{part}\n\\end{document}\n');
    writeFileSync(join(dir, 'part.tex'), Buffer.concat([Buffer.from('Line one.\nNa'), Buffer.from([0xef, 0xbf]), Buffer.from('ve.\n')]));
    const checked = await latexFormat.check(join(dir, 'paper.tex'), {});
    expect(checked.failed).toBe(true);
    expect(checked.diagnostics.map((d) => `${d.ruleId} ${d.location?.file} ${d.location?.start.line}:${d.location?.start.column}`)).toEqual([
      `encoding-invalid ${join(dir, 'part.tex')} 2:3`,
    ]);
  });
});

describe('check and build agree on the page’s math', () => {
  const BROKEN = `${TREFOIL}\nV = :jones{of=k}, and $\\frac{1}{$ is broken.\n`;

  it('check reports a formula KaTeX cannot typeset, as build --html does, once', async () => {
    const path = join(work, 'broken-math.md');
    writeFileSync(path, BROKEN);
    const checked = await markdownFormat.check(path, {});
    const built = await markdownFormat.build(path, { html: true, output: join(work, 'broken-math.html') });
    const rules = (r: typeof checked) => r.diagnostics.map((d) => `${d.ruleId} ${d.location?.start.line}:${d.location?.start.column}`);
    expect(rules(checked)).toEqual(['math-untypeset 5:23']);
    expect(rules(built)).toEqual(rules(checked));
    expect((await markdownFormat.check(path, { strict: true })).failed).toBe(true);
  });

  it('build --strict --html writes nothing when only such a warning fails the check', () => {
    const path = join(work, 'broken-strict.md');
    writeFileSync(path, BROKEN);
    const out = join(work, 'broken-strict.html');
    const r = skeinproof(['build', '--strict', '--html', path, '-o', out]);
    expect(r.status).toBe(1);
    expect(r.stderr).toContain('nothing written because the check failed');
    expect(existsSync(out)).toBe(false);
  });
});

describe('hostile inputs stay cheap', () => {
  it('refuses a Markdown line over the documented length at the column where it goes over, before parsing', async () => {
    const path = join(work, 'long-line.md');
    // One line of backslashes: the Markdown parser's slowest input per character (3 MB took 50 s and 3.3 GB).
    writeFileSync(path, `${TREFOIL}\nShort line.\n${'\\'.repeat(MAX_MARKDOWN_LINE + 1)}\n`);
    const checked = await markdownFormat.check(path, {});
    expect(checked.failed).toBe(true);
    expect(checked.diagnostics.map((d) => `${d.ruleId} ${d.location?.start.line}:${d.location?.start.column}`)).toEqual([`line-too-long 6:${MAX_MARKDOWN_LINE + 1}`]);
    const limit = join(work, 'limit-line.md');
    writeFileSync(limit, `${TREFOIL}\r\n${'x'.repeat(MAX_MARKDOWN_LINE)}\r\n`);
    expect((await markdownFormat.check(limit, {})).diagnostics.filter((d) => d.ruleId === 'line-too-long')).toEqual([]);
  });
});
