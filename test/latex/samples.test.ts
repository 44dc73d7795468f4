/**
 * Both LaTeX samples end to end: the clean atlas passes, the planted-slips
 * copy fails with exactly its six slips at their lines, the built sidecar and
 * flat copy match golden files byte for byte (SKEINPROOF_UPDATE_GOLDEN=1
 * rewrites them; review the diff), and the sample's values are the published
 * ones for these knots.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { latexFormat } from '../../src/cli/formats/latex.ts';
import { readLatexManuscript } from '../../plugins/latex/reader.ts';
import { runSession } from '../../src/core/manuscript/session.ts';
import { DEFAULT_CONVENTION } from '../../src/core/convention/convention.ts';
import { Laurent } from '../../src/core/poly/laurent.ts';
import { REPO, SAMPLES, copyInto, diskFiles, removeDir, tempDir } from './support.ts';

const CLEAN = join(SAMPLES, 'rope-atlas.tex');
const SLIPS = join(SAMPLES, 'slips/rope-atlas.tex');
const GOLDEN = join(import.meta.dirname, 'golden');

function expectGolden(name: string, actual: string): void {
  const path = join(GOLDEN, name);
  if (process.env['SKEINPROOF_UPDATE_GOLDEN'] === '1') {
    writeFileSync(path, actual);
    return;
  }
  if (!existsSync(path)) throw new Error(`golden file ${path} is missing; run with SKEINPROOF_UPDATE_GOLDEN=1 to create it`);
  expect(actual).toBe(readFileSync(path, 'utf8'));
}

const dirs: string[] = [];
afterAll(() => dirs.forEach(removeDir));

describe('the clean sample', () => {
  it('passes check with nothing to report', async () => {
    const result = await latexFormat.check(CLEAN, {});
    expect(result.diagnostics).toEqual([]);
    expect(result.failed).toBe(false);
    expect(result.inputs).toEqual([CLEAN, join(SAMPLES, 'sections/atlas-table.tex')]);
  });

  it('builds the golden sidecar and the golden flat copy', async () => {
    const sidecar = await latexFormat.build(CLEAN, {});
    expect(sidecar.outputs.map((o) => o.path)).toEqual([join(SAMPLES, 'rope-atlas.skein.tex')]);
    expectGolden('rope-atlas.skein.tex', String(sidecar.outputs[0]!.content));
    const flat = await latexFormat.build(CLEAN, { output: join(SAMPLES, 'flat.tex') });
    expectGolden('rope-atlas.flat.tex', String(flat.outputs[0]!.content));
  });

  it('uses the values published for these knots', () => {
    const doc = readLatexManuscript(CLEAN, diskFiles);
    const { reports } = runSession({ diagrams: doc.diagrams, claims: [], fills: [], convention: DEFAULT_CONVENTION });
    const poly = (terms: [number, number][]) => Laurent.fromTerms(terms);
    // Jones polynomials from memory (standard knot tables; the table's chirality may be the mirror, t ↔ 1/t).
    const known: [string, Laurent, 'exact' | 'up to mirror'][] = [
      ['lanyard', poly([[1, 1], [3, 1], [4, -1]]), 'exact'], // right-handed trefoil
      ['lanyard-mirror', poly([[-1, 1], [-3, 1], [-4, -1]]), 'exact'], // left-handed trefoil
      ['heaving', poly([[-2, 1], [-1, -1], [0, 1], [1, -1], [2, 1]]), 'exact'], // figure-eight
      ['heaving-pd', poly([[-2, 1], [-1, -1], [0, 1], [1, -1], [2, 1]]), 'exact'],
      ['coil', poly([[2, 1], [4, 1], [5, -1], [6, 1], [7, -1]]), 'exact'], // 5_1, closure of σ₁⁵
      ['netmaker', poly([[-1, 1], [-2, -1], [-3, 2], [-4, -1], [-5, 1], [-6, -1]]), 'up to mirror'], // 5_2
      ['stevedore', poly([[-4, 1], [-3, -1], [-2, 1], [-1, -2], [0, 2], [1, -1], [2, 1]]), 'up to mirror'], // 6_1
      ['hitch-a', poly([[-5, 1], [-4, -2], [-3, 2], [-2, -2], [-1, 2], [0, -1], [1, 1]]), 'up to mirror'], // 6_2
      ['hitch-b', poly([[-3, -1], [-2, 2], [-1, -2], [0, 3], [1, -2], [2, 2], [3, -1]]), 'exact'], // 6_3, amphichiral
      ['grommets', poly([[0.5, -1], [2.5, -1]]), 'exact'], // positive Hopf link
      ['loop', Laurent.one, 'exact'], // the unknot
    ];
    expect(doc.diagrams).toHaveLength(known.length);
    for (const [id, jones, how] of known) {
      const computed = reports.get(id)!.jones;
      const matches = computed.equals(jones) || (how === 'up to mirror' && computed.equals(jones.substitutePower(-1)));
      expect(matches, `${id}: ${computed.toPlainString('t')}`).toBe(true);
    }
    // Crossing numbers from the knot tables (from memory): 3_1, 4_1, 5_1, 5_2, 6_1, 6_2, 6_3, the Hopf link, the unknot.
    const crossingNumbers: Record<string, number> = {
      lanyard: 3, 'lanyard-mirror': 3, heaving: 4, 'heaving-pd': 4, coil: 5, netmaker: 5, stevedore: 6, 'hitch-a': 6, 'hitch-b': 6, grommets: 2, loop: 0,
    };
    for (const [id, c] of Object.entries(crossingNumbers)) expect(reports.get(id)!.crossingNumber.exact, id).toBe(c);
    // Kauffman bracket of the left-handed trefoil with <O> = 1: A^7 - A^3 - A^{-5} (from memory; the mirror of A^{-7} - A^{-3} - A^5).
    expect(reports.get('lanyard-mirror')!.bracket.equals(poly([[7, 1], [3, -1], [-5, -1]]))).toBe(true);
  });
});

describe('the planted-slips sample', () => {
  it('fails with exactly its six slips, at the lines where they are', async () => {
    const result = await latexFormat.check(SLIPS, {});
    expect(result.failed).toBe(true);
    const at = (d: (typeof result.diagnostics)[number]) =>
      `${d.severity} ${d.ruleId} ${relative(SAMPLES, d.location!.file)}:${d.location!.start.line}:${d.location!.start.column}`;
    // Each points at the value or token at fault (the column of its first character).
    expect(result.diagnostics.filter((d) => d.severity !== 'note').map(at)).toEqual([
      'error claim-contradicted slips/rope-atlas.tex:54:51', // the mirror image's Jones polynomial
      'error claim-contradicted slips/rope-atlas.tex:61:62', // crossing number at most 4 against span 5
      'error code-invalid slips/rope-atlas.tex:78:7', // PD label 2 used once
      'error claim-unreadable slips/sections/atlas-table.tex:13:35', // the unbalanced bracket
      'error claim-contradicted slips/sections/atlas-table.tex:16:56', // crossing number 7 for a 6-crossing diagram
      'error claim-contradicted slips/sections/atlas-table.tex:17:35', // the wrong sign of one coefficient
    ]);
    const [mirror, span, , , count, sign] = result.diagnostics.filter((d) => d.severity === 'error');
    expect(mirror!.message).toContain('mirror image');
    expect(span!.message).toContain('span V is 5');
    expect(count!.message).toContain('6 crossings');
    expect(sign!.message).toContain('only the coefficient of t^2 differs');
    // What depends on the invalid code is noted, not judged.
    expect(result.diagnostics.filter((d) => d.severity === 'note').every((d) => d.ruleId === 'target-invalid')).toBe(true);
  });
});

describe('the command line on the samples', () => {
  it('`build` writes the golden sidecar beside the paper and `build -o` the flat copy; the slips fail check', () => {
    const dir = tempDir('cli');
    dirs.push(dir);
    copyInto(dir, SAMPLES);
    const cli = (...args: string[]) => spawnSync(process.execPath, [join(REPO, 'bin/skeinproof.js'), ...args], { cwd: dir, encoding: 'utf8' });
    const sidecar = cli('build', 'rope-atlas.tex');
    expect(sidecar.status).toBe(0);
    expectGolden('rope-atlas.skein.tex', readFileSync(join(dir, 'rope-atlas.skein.tex'), 'utf8'));
    const flat = cli('build', 'rope-atlas.tex', '-o', 'flat.tex');
    expect(flat.status).toBe(0);
    expectGolden('rope-atlas.flat.tex', readFileSync(join(dir, 'flat.tex'), 'utf8'));
    expect(readFileSync(join(dir, 'rope-atlas.tex'), 'utf8')).toBe(readFileSync(CLEAN, 'utf8'));
    const html = cli('build', 'rope-atlas.tex', '-o', 'page.html');
    expect(html.status).toBe(2);
    expect(html.stderr).toContain('no HTML page');
    expect(existsSync(join(dir, 'page.html'))).toBe(false);
    rmSync(join(dir, 'slips/rope-atlas.skein.tex'), { force: true });
    const slips = cli('check', 'slips/rope-atlas.tex');
    expect(slips.status).toBe(2); // an invalid code is among the slips
    expect(slips.stdout).toContain('slips/sections/atlas-table.tex:16:56: error');
    expect(slips.stdout).toContain('6 errors');
  });
});
