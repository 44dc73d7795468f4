/**
 * The command-line surface of check and build: several files in one run,
 * unreadable files, the convention flag, SARIF output (the SARIF 2.1.0
 * standard's result/region shape), the default output path.
 * Values from memory: positive trefoil V(t) = t + t³ − t⁴, so with t = q²
 * it is q² + q⁶ − q⁸.
 */
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { skeinproof } from './cli.ts';

const work = mkdtempSync(join(tmpdir(), 'skeinproof-commands-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

const TREFOIL = '```skein id=k notation=braid\n1 1 1\n```\n\nV = :jones{of=k}, writhe :writhe[$2$]{of=k}.\n';

describe('check', () => {
  it('reports every file in one run and exits 2 when one cannot be read', () => {
    const doc = join(work, 'a.md');
    writeFileSync(doc, TREFOIL);
    const missing = join(work, 'missing.md');
    const r = skeinproof(['check', '--format', 'json', doc, missing]);
    expect(r.status).toBe(2);
    const report = JSON.parse(r.stdout) as { diagnostics: { ruleId: string; location: { file: string; start: { line: number; column: number } } }[] };
    expect(report.diagnostics.map((d) => [d.ruleId, d.location.file])).toEqual([
      ['claim-contradicted', doc],
      ['file-unreadable', missing],
    ]);
    expect(report.diagnostics[0]!.location.start).toMatchObject({ line: 5, column: TREFOIL.split('\n')[4]!.indexOf('$2$') + 1 });
  });

  it('exits 1 when only a claim is contradicted, and writes SARIF with regions', () => {
    const doc = join(work, 'b.md');
    writeFileSync(doc, TREFOIL);
    const r = skeinproof(['check', '--format', 'sarif', doc]);
    expect(r.status).toBe(1);
    const sarif = JSON.parse(r.stdout) as { version: string; runs: { results: { ruleId: string; level: string; locations: { physicalLocation: { region: { startLine: number } } }[] }[] }[] };
    expect(sarif.version).toBe('2.1.0');
    const [result] = sarif.runs[0]!.results;
    expect(result).toMatchObject({ ruleId: 'claim-contradicted', level: 'error' });
    expect(result!.locations[0]!.physicalLocation.region.startLine).toBe(5);
  });

  it('reports a directory, a missing file without extension and an unknown extension, and still checks the other files', () => {
    const doc = join(work, 'f.md');
    writeFileSync(doc, TREFOIL);
    const txt = join(work, 'f.txt');
    writeFileSync(txt, TREFOIL);
    const missing = join(work, 'no-such-notes');
    const r = skeinproof(['check', '--format', 'json', work, doc, missing, txt]);
    expect(r.status).toBe(2);
    const report = JSON.parse(r.stdout) as { diagnostics: { ruleId: string; message: string; location: { file: string } }[] };
    expect(report.diagnostics.map((d) => [d.ruleId, d.location.file])).toEqual([
      ['file-unreadable', work],
      ['claim-contradicted', doc],
      ['file-unreadable', missing],
      ['file-unreadable', txt],
    ]);
    expect(report.diagnostics[0]!.message).toContain('is a directory');
    expect(report.diagnostics[2]!.message).toContain('no such file');
    expect(report.diagnostics[3]!.message).toContain('the known extensions are .md');
    const build = skeinproof(['build', work]);
    expect(build.status).toBe(2);
    expect(build.stderr).toContain('is a directory');
  });

  it('puts the caret under the span on a first line that starts with a byte order mark', () => {
    const doc = join(work, 'bom.md');
    const line = 'The writhe is :writhe[$2$]{of=k}.';
    writeFileSync(doc, `\uFEFF${line}\n\n\`\`\`skein id=k notation=braid\n1 1 1\n\`\`\`\n`);
    const r = skeinproof(['check', doc]);
    expect(r.status).toBe(1);
    const column = line.indexOf('$2$') + 1;
    expect(r.stdout).toContain(`${doc}:1:${column}: error: wrong writhe`);
    expect(r.stdout).toContain(` 1 | ${line}\n   | ${' '.repeat(column - 1)}^~~\n`);
  });

  it('counts columns in UTF-16 units (as the SARIF run declares) and puts the caret under the span after astral characters and tabs', () => {
    const doc = join(work, 'astral.md');
    const line = 'Été, 𝔸 and 😀:\t:writhe[$2$]{of=k}.';
    writeFileSync(doc, `\`\`\`skein id=k notation=braid\n1 1 1\n\`\`\`\n\n${line}\n`);
    const r = skeinproof(['check', doc]);
    const column = line.indexOf('$2$') + 1; // String indices are UTF-16 units.
    expect(r.stdout).toContain(`${doc}:5:${column}: error: wrong writhe`);
    // On screen each of 𝔸 and 😀 takes one place, so the caret line has one space per code point, and the tab itself.
    expect(r.stdout).toContain(` 5 | ${line}\n   | ${' '.repeat(13)}\t${' '.repeat(8)}^~~\n`);
  });

  it('refuses an unknown extension and a bad convention as usage errors', () => {
    const txt = join(work, 'c.txt');
    writeFileSync(txt, TREFOIL);
    expect(skeinproof(['check', txt]).status).toBe(2);
    const bad = skeinproof(['check', '--convention', 'jones=z', join(work, 'b.md')]);
    expect(bad.status).toBe(2);
    expect(bad.stderr).toContain('--convention');
  });
});

describe('build', () => {
  it('typesets in the convention given on the command line, beside the input by default', () => {
    const doc = join(work, 'd.md');
    writeFileSync(doc, TREFOIL.replace('$2$', '$3$'));
    const r = skeinproof(['build', '--convention', 'jones=q', doc]);
    expect(r.status).toBe(0);
    const out = join(work, 'd.filled.md');
    expect(r.stdout).toBe(`wrote ${out}\n`);
    expect(readFileSync(out, 'utf8')).toContain('V = $q^2 + q^6 - q^8$, writhe $3$.');
  });

  it('keeps a JSON or SARIF report on stderr one parseable document when nothing is written', () => {
    const doc = join(work, 'g.md');
    writeFileSync(doc, TREFOIL);
    for (const format of ['json', 'sarif']) {
      const r = skeinproof(['build', '--format', format, doc, '-o', join(work, `g-${format}.md`)]);
      expect(r.status).toBe(1);
      expect(r.stdout).toBe('');
      expect(() => JSON.parse(r.stderr)).not.toThrow();
    }
    expect(skeinproof(['build', doc, '-o', join(work, 'g-text.md')]).stderr).toContain('nothing written because the check failed');
  });

  it('gives in the JSON report the exit status the run ends with, also when the document itself is strict', () => {
    // A DT code fixes a knot only up to mirror image, so the mirror's value is a warning, which `strict: true` fails.
    const doc = join(work, 'h.md');
    writeFileSync(doc, '---\nskeinproof:\n  strict: true\n---\n\n```skein id=k notation=dt\n4 6 2\n```\n\n:jones[$t^{-1}+t^{-3}-t^{-4}$]{of=k}\n');
    const checked = skeinproof(['check', '--format', 'json', doc]);
    expect(checked.status).toBe(1);
    expect((JSON.parse(checked.stdout) as { exitStatus: number }).exitStatus).toBe(1);
    const built = skeinproof(['build', '--format', 'json', doc, '-o', join(work, 'h.out.md')]);
    expect(built.status).toBe(1);
    expect((JSON.parse(built.stderr) as { exitStatus: number }).exitStatus).toBe(1);
    // The text report says why "0 errors" fails.
    const text = skeinproof(['check', doc]);
    expect(text.stdout.endsWith('0 errors, 1 warning\nthe check fails on these warnings: strictness is on (--strict, or `strict: true` in the front matter)\n')).toBe(true);
    expect(skeinproof(['check', doc.replace('h.md', 'a.md')]).stdout).not.toContain('strictness is on');
  });

  it('writes nothing when a warning fails the check under --strict', () => {
    // A DT code fixes a knot only up to mirror image, so the mirror's value is only a warning.
    const doc = join(work, 'e.md');
    writeFileSync(doc, '```skein id=k notation=dt\n4 6 2\n```\n\n:jones[$t^{-1}+t^{-3}-t^{-4}$]{of=k}\n');
    const lax = skeinproof(['build', doc, '-o', join(work, 'e-lax.md')]);
    expect(lax.status).toBe(0);
    const strict = skeinproof(['build', '--strict', doc, '-o', join(work, 'e-strict.md')]);
    expect(strict.status).toBe(1);
    expect(existsSync(join(work, 'e-strict.md'))).toBe(false);
  });
});
