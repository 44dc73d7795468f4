/**
 * KaTeX's verdicts on a built Markdown text, remembered in the disk cache
 * (src/cli/formats/remembered-math.ts). The reference is KaTeX itself: a
 * formula it refuses (`\frac{1}{` lacks a closing brace) stays a problem and
 * one it typesets does not, with or without the cache; an entry written under
 * another KaTeX version, or one that is not of the expected shape, is never
 * trusted. Value from memory: the positive trefoil σ₁³ has V = t + t³ − t⁴.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import type { ResultStore } from '../../src/core/cache/store.ts';
import { mathReaderVersion, rememberedMathProblems } from '../../src/cli/formats/remembered-math.ts';
import { formulaKey } from '../../src/cli/html/math-problems.ts';
import { skeinproof } from '../markdown/cli.ts';

const work = mkdtempSync(join(tmpdir(), 'skeinproof-remembered-math-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

/** A store in memory that counts what it was asked. */
function memoryStore(): ResultStore & { readonly entries: Map<string, string> } {
  const entries = new Map<string, string>();
  return { entries, get: (key) => entries.get(key), put: (key, text) => void entries.set(key, text) };
}

const BROKEN = 'Good $t + t^3 - t^4$, broken $\\frac{1}{$.\n';
const manuscript = join(work, 'paper.md');

describe('remembered math problems', () => {
  it('finds what KaTeX refuses, stores it, and serves it for the same text', async () => {
    const version = await mathReaderVersion();
    const store = memoryStore();
    const first = await rememberedMathProblems(BROKEN, { store, manuscript, drawn: false, readerVersion: version });
    expect(first.map((p) => BROKEN.slice(p.offset, p.end))).toEqual(['$\\frac{1}{$']);
    expect(first[0]!.message).toMatch(/expected '}'/i); // KaTeX's own words
    expect(store.entries.size).toBe(1);
    // The stored entry is what a second run serves: a forged one under the same versions is believed, which shows it is read.
    const [key, text] = [...store.entries][0]!;
    const forged = { ...JSON.parse(text), problems: [{ message: 'forged', offset: 0, end: 4 }] };
    store.put(key, JSON.stringify(forged));
    expect((await rememberedMathProblems(BROKEN, { store, manuscript, drawn: false, readerVersion: version })).map((p) => p.message)).toEqual(['forged']);
    // A build (figures in its text) keeps an entry of its own beside the check's.
    await rememberedMathProblems(BROKEN, { store, manuscript, drawn: true, readerVersion: version });
    expect(store.entries.size).toBe(2);
    // Without a store every run asks KaTeX.
    expect(await rememberedMathProblems(BROKEN, { manuscript, drawn: false, readerVersion: version })).toEqual(first);
  });

  it('never trusts an entry written under another KaTeX version', async () => {
    const version = await mathReaderVersion();
    const older = version.replace(/^katex [^,]+/, 'katex 0.0.1');
    expect(older).not.toBe(version);
    const store = memoryStore();
    // Under the older version the broken formula was (falsely) recorded as typesetting, for this very text.
    await rememberedMathProblems(BROKEN, { store, manuscript, drawn: false, readerVersion: older });
    const [key, text] = [...store.entries][0]!;
    store.put(key, JSON.stringify({ ...JSON.parse(text), problems: [], verdicts: { [formulaKey('\\frac{1}{', false)]: null } }));
    expect(await rememberedMathProblems(BROKEN, { store, manuscript, drawn: false, readerVersion: older })).toEqual([]);
    // The current version finds the problem again.
    const now = await rememberedMathProblems(BROKEN, { store, manuscript, drawn: false, readerVersion: version });
    expect(now.map((p) => BROKEN.slice(p.offset, p.end))).toEqual(['$\\frac{1}{$']);
  });

  it('reuses the verdicts of formulas that did not change when the text did, and ignores a damaged entry', async () => {
    const version = await mathReaderVersion();
    const store = memoryStore();
    await rememberedMathProblems(BROKEN, { store, manuscript, drawn: false, readerVersion: version });
    const [key, text] = [...store.entries][0]!;
    // A verdict the cache holds is not asked of KaTeX again: a forged "typesets" for the broken formula is believed in an edited text.
    store.put(key, JSON.stringify({ ...JSON.parse(text), verdicts: { [formulaKey('\\frac{1}{', false)]: null } }));
    const edited = `${BROKEN}One more line with $x$.\n`;
    expect(await rememberedMathProblems(edited, { store, manuscript, drawn: false, readerVersion: version })).toEqual([]);
    for (const damaged of ['not json', '[]', '{"filled":1}', JSON.stringify({ filled: 'x', problems: [{ message: 3 }], verdicts: {} })]) {
      store.put(key, damaged);
      const found = await rememberedMathProblems(edited, { store, manuscript, drawn: false, readerVersion: version });
      expect(found.map((p) => edited.slice(p.offset, p.end))).toEqual(['$\\frac{1}{$']);
    }
  });
});

describe('check with the disk cache', () => {
  it('reports the same untypeset formula on a cold and a warm run, and again after an edit', () => {
    const path = join(work, 'census.md');
    const cache = ['--cache-dir', join(work, 'cache')];
    writeFileSync(path, '```skein id=k notation=braid\n1 1 1\n```\n\nV = :jones{of=k}, and $\\frac{1}{$ is broken.\n');
    const cold = skeinproof(['check', path, ...cache]);
    expect(cold.stdout).toContain(`${path}:5:23: warning: KaTeX cannot typeset this formula`);
    expect(skeinproof(['check', path, ...cache]).stdout).toBe(cold.stdout);
    writeFileSync(path, '```skein id=k notation=braid\n1 1 1\n```\n\nV = :jones{of=k}.\n\nNow $\\frac{1}{$ is broken here.\n');
    expect(skeinproof(['check', path, ...cache]).stdout).toContain(`${path}:7:5: warning: KaTeX cannot typeset this formula`);
    expect(skeinproof(['check', path, '--no-cache']).stdout).toBe(skeinproof(['check', path, ...cache]).stdout);
  });
});
