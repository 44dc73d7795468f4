/**
 * Every value the clean sample's table ends up with (stated by hand or filled
 * in) checked against sources outside skeinproof:
 * - Jones' formula for torus knots, V(T(2,q)) = t^{(q−1)/2}(1 − t³ − t^{q+1} + t^{q+2})/(1 − t²)
 *   (Jones 1987, Hecke algebra representations of braid groups);
 * - the figure-eight, Borromean rings, 8₁₈ and positive Hopf link values (from memory, standard tables),
 *   with 8₁₈'s determinant |V(−1)| = 45 (from memory);
 * - a braid closure's writhe is the exponent sum of its word (common practice);
 * - the determinant is |V(−1)|, evaluated with t^{1/2} = i (common practice), and for the Borromean rings
 *   is 16 (from memory).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ROOT } from './cli.ts';
import { processMarkdown } from './helpers.ts';

/** A polynomial in t as exponent → coefficient, read from simple LaTeX (test-local, independent of the core). */
function poly(latex: string): Map<number, number> {
  const out = new Map<number, number>();
  const body = latex.replace(/\$/g, '').replace(/\s+/g, '');
  const term = /([+-]?)(\d*)(t(?:\^(?:\{(-?\d+(?:\/\d+)?)\}|(-?\d)))?)?/g;
  for (let m = term.exec(body); m !== null && m[0] !== ''; m = term.exec(body)) {
    const sign = m[1] === '-' ? -1 : 1;
    const coefficient = m[2] ? Number(m[2]) : 1;
    const raw = m[4] ?? m[5];
    const exponent = m[3] ? (raw ? (raw.includes('/') ? Number(raw.split('/')[0]) / Number(raw.split('/')[1]) : Number(raw)) : 1) : 0;
    out.set(exponent, (out.get(exponent) ?? 0) + sign * coefficient);
  }
  for (const [e, c] of out) if (c === 0) out.delete(e);
  return out;
}

function times(a: Map<number, number>, b: Map<number, number>): Map<number, number> {
  const out = new Map<number, number>();
  for (const [e1, c1] of a) for (const [e2, c2] of b) out.set(e1 + e2, (out.get(e1 + e2) ?? 0) + c1 * c2);
  for (const [e, c] of out) if (c === 0) out.delete(e);
  return out;
}

const sorted = (p: Map<number, number>) => [...p.entries()].sort((x, y) => x[0] - y[0]);

/** The table of the built sample: id → column → cell text. */
async function builtTable(): Promise<Map<string, Record<string, string>>> {
  const text = readFileSync(join(ROOT, 'samples/twists-and-weaves.md'), 'utf8');
  const built = (await processMarkdown(text)).built;
  const rows = built.split('\n').filter((l) => l.startsWith('|'));
  const header = rows[0]!.split('|').slice(1, -1).map((c) => c.trim());
  const table = new Map<string, Record<string, string>>();
  for (const row of rows.slice(2)) {
    const cells = row.split('|').slice(1, -1).map((c) => c.trim());
    table.set(cells[0]!, Object.fromEntries(header.map((h, i) => [h, cells[i]!])));
  }
  return table;
}

describe('the clean sample agrees with published values', async () => {
  const table = await builtTable();

  for (const q of [3, 5, 7]) {
    it(`twist-${q} is the torus knot T(2,${q}) of Jones' formula`, () => {
      const v = poly(table.get(`twist-${q}`)!['jones']!);
      const numerator = new Map([[(q - 1) / 2, 1], [(q - 1) / 2 + 3, -1], [(q - 1) / 2 + q + 1, -1], [(q - 1) / 2 + q + 2, 1]]);
      expect(sorted(times(v, new Map([[0, 1], [2, -1]])))).toEqual(sorted(numerator));
      expect(table.get(`twist-${q}`)!['crossing number']).toBe(`$${q}$`);
    });
  }

  it('twist-2 is the positive Hopf link', () => {
    expect(sorted(poly(table.get('twist-2')!['jones']!))).toEqual([[0.5, -1], [2.5, -1]]);
  });

  it('weave-2 is the figure-eight knot', () => {
    expect(sorted(poly(table.get('weave-2')!['jones']!))).toEqual(sorted(poly('t^{-2}-t^{-1}+1-t+t^2')));
  });

  it('weave-3 is the Borromean rings', () => {
    expect(sorted(poly(table.get('weave-3')!['jones']!))).toEqual(sorted(poly('-t^{3}+3t^{2}-2t+4-2t^{-1}+3t^{-2}-t^{-3}')));
  });

  it('weave-4 is 8_18, of determinant 45', () => {
    const v = poly(table.get('weave-4')!['jones']!);
    expect(sorted(v)).toEqual(sorted(poly('t^{-4}-4t^{-3}+6t^{-2}-7t^{-1}+9-7t+6t^2-4t^3+t^4')));
    expect(Math.abs([...v].reduce((s, [e, c]) => s + c * (-1) ** e, 0))).toBe(45);
  });

  it('kinked-3 keeps the trefoil polynomial; its writhe counts the kink', () => {
    expect(sorted(poly(table.get('kinked-3')!['jones']!))).toEqual(sorted(poly('t+t^3-t^4')));
    expect(table.get('kinked-3')!['writhe']).toBe('$4$');
  });

  it('every braid row has the exponent sum of its word as writhe', () => {
    const text = readFileSync(join(ROOT, 'samples/twists-and-weaves.md'), 'utf8');
    const words = new Map<string, string>();
    for (const m of text.matchAll(/```skein id=(\S+)[^\n]*\n([-\d ]+)\n```/g)) words.set(m[1]!, m[2]!);
    for (const m of text.matchAll(/^\| (?:(\S+) )?`([-\d ]+)` \|/gm)) words.set(m[1] ? `${m[1]} \`${m[2]}\`` : `\`${m[2]}\``, m[2]!);
    let checked = 0;
    for (const [id, row] of table) {
      const word = words.get(id);
      if (!word) continue;
      const sum = word.trim().split(/\s+/).reduce((s, g) => s + Math.sign(Number(g)), 0);
      expect(row['writhe'], id).toBe(`$${sum}$`);
      checked++;
    }
    expect(checked).toBe(10);
  });

  it('every determinant is |V(-1)| of the Jones polynomial in its row', () => {
    let checked = 0;
    for (const [id, row] of table) {
      const v = poly(row['jones']!);
      // t^e at t^{1/2} = i is i^{2e}.
      let re = 0;
      let im = 0;
      for (const [e, c] of v) {
        const k = (((2 * e) % 4) + 4) % 4;
        if (k === 0) re += c;
        else if (k === 1) im += c;
        else if (k === 2) re -= c;
        else im -= c;
      }
      expect(row['determinant'], id).toBe(`$${Math.hypot(re, im)}$`);
      checked++;
    }
    expect(checked).toBe(10);
    expect(table.get('weave-3')!['determinant']).toBe('$16$');
  });
});
