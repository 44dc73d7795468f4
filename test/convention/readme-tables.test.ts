/**
 * The README's convention tables show the positive Hopf link (closure of σ₁²)
 * and the positive trefoil (σ₁³) as skeinproof typesets them under each
 * setting. This keeps the documentation and the program in step; the values
 * themselves are checked against hand-worked ones in convention.test.ts
 * (V(positive trefoil) = t + t³ − t⁴, V(positive Hopf) = −t^{1/2} − t^{5/2},
 * ⟨positive trefoil⟩ = A⁻⁷ − A⁻³ − A⁵, from memory).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyzeDiagram } from '../../src/core/analyze/analyze.ts';
import { closeBraid } from '../../src/core/diagram/braid-closure.ts';
import { parseConventionSettings } from '../../src/core/convention/settings.ts';
import { typesetValue, type FillKey } from '../../src/core/claims/index.ts';
import type { DiagramReport } from '../../src/core/analyze/report.ts';

const readme = readFileSync(join(import.meta.dirname, '..', '..', 'README.md'), 'utf8');
const section = readme.slice(readme.indexOf('<!-- section: conventions -->'), readme.indexOf('<!-- end: conventions -->'));
const hopf = analyzeDiagram(closeBraid([1, 1], 2));
const trefoil = analyzeDiagram(closeBraid([1, 1, 1], 2));

/** The table rows under the heading **`key`**: the setting value and the backticked formulas of each later cell. */
function tableRows(key: string): { value: string; cells: string[][] }[] {
  const start = section.indexOf(`**\`${key}\`**`);
  expect(start, `README documents ${key}`).toBeGreaterThanOrEqual(0);
  const next = section.indexOf('\n**`', start + 1);
  const block = section.slice(start, next < 0 ? undefined : next);
  return block
    .split('\n')
    .filter((line) => /^\| `/.test(line))
    .map((line) => {
      const cells = line.split('|').slice(1, -1).map((c) => [...c.matchAll(/`([^`]+)`/g)].map((m) => m[1]!));
      return { value: cells[0]![0]!, cells: cells.slice(1) };
    });
}

function typeset(key: FillKey, report: DiagramReport, setting: string, value: string): string {
  const read = parseConventionSettings({ [setting]: value });
  if (!read.ok) throw new Error(read.errors[0]!.message);
  const t = typesetValue(key, report, read.convention);
  if (t.kind !== 'math') throw new Error('a polynomial typesets as math');
  return t.latex;
}

describe('README convention tables match the typeset values', () => {
  for (const setting of ['jones', 'bracket', 'half-powers']) {
    const key: FillKey = setting === 'bracket' ? 'bracket' : 'jones';
    it(`${setting}: every row, Hopf link and trefoil`, () => {
      const rows = tableRows(setting);
      expect(rows.length).toBeGreaterThanOrEqual(2);
      for (const { value, cells } of rows) {
        // cells: meaning (jones, bracket only), Hopf link, trefoil; the first formula in a cell is the value.
        const [hopfCell, trefoilCell] = cells.slice(-2);
        expect(hopfCell![0], `${setting}=${value}, Hopf link`).toBe(typeset(key, hopf, setting, value));
        expect(trefoilCell![0], `${setting}=${value}, trefoil`).toBe(typeset(key, trefoil, setting, value));
      }
    });
  }
  it('order: V and the bracket of each row', () => {
    const rows = tableRows('order');
    expect(rows.map((r) => r.value)).toEqual(['ascending', 'descending']);
    for (const { value, cells } of rows) {
      const [hopfCell, trefoilCell] = cells as [string[], string[]];
      expect(hopfCell).toEqual([typeset('jones', hopf, 'order', value), typeset('bracket', hopf, 'order', value)]);
      expect(trefoilCell).toEqual([typeset('jones', trefoil, 'order', value), typeset('bracket', trefoil, 'order', value)]);
    }
  });
});
