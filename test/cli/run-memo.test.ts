/**
 * Remembered runs (src/cli/run-memo.ts), in process, with a stand-in format
 * that reads real files through the read log and counts how often it runs, and
 * the real disk store. The reference for every replay is a fresh run of the
 * same format: a replay must give exactly its result, and anything the key or
 * the read log covers must force a fresh run when it changes. A whole-run memo
 * keyed by the inputs it read is common practice in build tools; the
 * soundness conditions tested here are our own.
 */
import { createHash } from 'node:crypto';
import { mkdirSync, readdirSync, readFileSync, symlinkSync, unlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { checkTimeBudget, withTimeBudget } from '../../src/core/limits.ts';
import { FileResultStore } from '../../src/cli/result-store.ts';
import { runKey, throughRunMemo, type RunSetting } from '../../src/cli/run-memo.ts';
import { currentRealpath } from '../../src/cli/read-log.ts';
import type { FormatOptions, FormatResult, ManuscriptFormat } from '../../src/cli/formats/types.ts';
import type { Diagnostic } from '../../src/core/diagnostics/diagnostic.ts';
import { temporaryDirs } from '../support/temporary-dirs.ts';

const freshDir = temporaryDirs('skein-run-memo-');

const SETTING: RunSetting = { tool: '0.1.0+test', node: 'v20.0.0', cwd: '/somewhere' };

interface Stand {
  /** How often the format really ran. */
  runs: number;
  /** Extra behaviour of the next runs. */
  extra?: (options: FormatOptions) => Partial<FormatResult>;
}

/**
 * A format that reads `path` and the file it names on its first line (if any: an "include", which may be
 * missing), resolves the include's real path, and reports their texts in a diagnostic and an output.
 */
function standIn(stand: Stand): ManuscriptFormat {
  const run = async (path: string, options: FormatOptions): Promise<FormatResult> => {
    stand.runs++;
    const read = (p: string): string | undefined => {
      try {
        const bytes = readFileSync(p);
        options.readLog?.read(p, bytes);
        return bytes.toString('utf8');
      } catch (e) {
        options.readLog?.failed(p, e);
        return undefined;
      }
    };
    const text = read(path) ?? '';
    const include = text.split('\n')[0]!.startsWith('include ') ? join(path, '..', text.split('\n')[0]!.slice('include '.length)) : undefined;
    const included = include === undefined ? '' : (read(include) ?? '<missing>');
    const real = include === undefined ? '' : currentRealpath(include);
    if (include !== undefined) options.readLog?.realpath(include, real);
    const diagnostic: Diagnostic = { severity: 'warning', ruleId: 'stand-in', message: `${text}|${included}|${real}|${JSON.stringify(options.convention ?? {})}`, location: { file: path, start: { line: 1, column: 2, offset: 1 } }, hints: ['one'], data: { n: 3 } };
    return {
      diagnostics: [diagnostic],
      outputs: [
        { path: `${path}.out`, content: `${text}${included}`, ownMark: 'mark' },
        { path: `${path}.bin`, content: new Uint8Array([0, 255, 7]) },
      ],
      inputs: [path],
      counts: { diagrams: 1, claimsAgree: 2, claimsContradicted: 0, claimsUndecided: 0, valuesFilled: 4, tableCells: 0, notApplicable: 0, figures: 0 },
      ...stand.extra?.(options),
    };
  };
  return { name: 'stand-in', extensions: ['.x'], check: run, build: run };
}

function setUp() {
  const dir = freshDir();
  const store = () => new FileResultStore({ dir: join(dir, 'cache'), engine: 'engine-test', maxBytes: 64 * 1024 * 1024 });
  const stand: Stand = { runs: 0 };
  const format = standIn(stand);
  const paper = join(dir, 'paper.x');
  /** One command: a fresh store (as a new process has), flushed at the end. */
  const run = async (options: FormatOptions = {}, setting: RunSetting = SETTING, kind: 'check' | 'build' = 'build', path = paper): Promise<FormatResult> => {
    const resultStore = store();
    const result = await throughRunMemo(kind, format, path, { ...options, resultStore }, setting);
    resultStore.finish();
    return result;
  };
  return { dir, stand, format, paper, run, cacheFiles: () => entryFiles(join(dir, 'cache')) };
}

function entryFiles(cache: string): string[] {
  const top = join(cache, 'entries');
  return readdirSync(top).flatMap((shard) => readdirSync(join(top, shard)).map((name) => join(top, shard, name)));
}

describe('remembered runs', () => {
  it('replays an unchanged run without running the format, with exactly the fresh result', async () => {
    const { stand, paper, run } = setUp();
    writeFileSync(paper, 'a paper');
    const fresh = await run();
    expect(stand.runs).toBe(1);
    const replayed = await run();
    expect(stand.runs).toBe(1);
    expect(replayed).toEqual(fresh);
    expect(replayed.outputs[1]!.content).toEqual(new Uint8Array([0, 255, 7]));
    expect(replayed.failed).toBeUndefined();
    // Check and build are remembered apart.
    await run({}, SETTING, 'check');
    expect(stand.runs).toBe(2);
  });

  it('runs afresh when anything the key covers changes: tool, Node, directory, path, and every keyed option', async () => {
    const { dir, stand, paper, run } = setUp();
    writeFileSync(paper, 'a paper');
    const other = join(dir, 'other.x');
    writeFileSync(other, 'a paper');
    const base: FormatOptions = { strict: false, limits: { maxCrossings: 10, timeBudgetMs: 1000, maxStateBytes: 1 } };
    await run(base);
    const variants: [FormatOptions, RunSetting, string][] = [
      [base, { ...SETTING, tool: '0.1.0+other' }, paper],
      [base, { ...SETTING, node: 'v22.0.0' }, paper],
      [base, { ...SETTING, cwd: '/elsewhere' }, paper],
      [base, SETTING, other],
      [{ ...base, strict: true }, SETTING, paper],
      [{ ...base, convention: { jones: 'q' } as FormatOptions['convention'] }, SETTING, paper],
      [{ ...base, output: 'out.md' }, SETTING, paper],
      [{ ...base, html: true }, SETTING, paper],
      [{ ...base, allowHtml: true }, SETTING, paper],
      [{ ...base, limits: { ...base.limits, timeBudgetMs: 2000 } }, SETTING, paper],
    ];
    for (const [k, [options, setting, path]] of variants.entries()) {
      await run(options, setting, 'build', path);
      expect(stand.runs, `variant ${k}`).toBe(k + 2);
      await run(options, setting, 'build', path);
      expect(stand.runs, `variant ${k}, again`).toBe(k + 2);
    }
    // Every key differs from every other.
    const keys = new Set(variants.map(([options, setting, path]) => runKey('build', path, options, setting)));
    expect(keys.size).toBe(variants.length);
  });

  it('runs afresh when a file read changes, a missing file appears, a file read disappears or a real path moves', async () => {
    const { dir, stand, paper, run } = setUp();
    mkdirSync(join(dir, 'parts'));
    writeFileSync(paper, 'include parts/link.tex\nbody');
    symlinkSync('one.tex', join(dir, 'parts', 'link.tex'));
    // The include is missing (a dangling link): its absence is what the run read.
    const missing = await run();
    expect(missing.diagnostics[0]!.message).toContain('<missing>');
    await run();
    expect(stand.runs).toBe(1);
    writeFileSync(join(dir, 'parts', 'one.tex'), 'first');
    const appeared = await run();
    expect(stand.runs).toBe(2);
    expect(appeared.diagnostics[0]!.message).toContain('|first|');
    writeFileSync(join(dir, 'parts', 'one.tex'), 'second');
    expect((await run()).diagnostics[0]!.message).toContain('|second|');
    expect(stand.runs).toBe(3);
    // Another target with the same bytes: the bytes match, but the real path moved.
    writeFileSync(join(dir, 'parts', 'two.tex'), 'second');
    unlinkSync(join(dir, 'parts', 'link.tex'));
    symlinkSync('two.tex', join(dir, 'parts', 'link.tex'));
    expect((await run()).diagnostics[0]!.message).toContain('two.tex');
    expect(stand.runs).toBe(4);
    await run();
    expect(stand.runs).toBe(4);
    writeFileSync(paper, 'include parts/link.tex\nbody, edited');
    await run();
    expect(stand.runs).toBe(5);
    unlinkSync(paper);
    expect((await run()).diagnostics[0]!.message).toMatch(/^\|/);
    expect(stand.runs).toBe(6);
  });

  it('never remembers a run whose outcome may depend on the machine: a spent time budget, a limit, a read it cannot state, data JSON would change', async () => {
    const { stand, paper, run, cacheFiles } = setUp();
    writeFileSync(paper, 'a paper');
    const cases: ((options: FormatOptions) => Partial<FormatResult>)[] = [
      // A time budget that runs out and is caught inside the run (as a glance at another diagram does): no diagnostic says so.
      () => {
        try {
          withTimeBudget(1, 'a test', () => {
            const until = performance.now() + 5;
            while (performance.now() < until);
            checkTimeBudget();
          });
        } catch {
          // Swallowed, as withinLimitsOr does.
        }
        return {};
      },
      () => ({ diagnostics: [{ severity: 'error', ruleId: 'limit-exceeded', message: 'over a limit' }] }),
      (options) => {
        options.readLog?.notAFile();
        return {};
      },
      () => ({ diagnostics: [{ severity: 'note', ruleId: 'x', message: 'm', data: { when: new Map() } }] }),
      () => ({ diagnostics: [{ severity: 'note', ruleId: 'x', message: 'm', data: { n: Number.NaN } }] }),
    ];
    for (const [k, extra] of cases.entries()) {
      stand.extra = extra;
      await run();
      await run();
      expect(stand.runs, `case ${k}`).toBe(2 * k + 2);
    }
    expect(() => cacheFiles()).toThrow(); // nothing was ever written
    stand.extra = undefined;
    await run();
    await run();
    expect(stand.runs).toBe(2 * cases.length + 1);
  });

  it('never trusts a damaged, truncated or foreign entry, nor one of another shape: it runs afresh and rewrites it', async () => {
    const { dir, stand, paper, run, cacheFiles } = setUp();
    writeFileSync(paper, 'a paper');
    const other = join(dir, 'other.x');
    writeFileSync(other, 'another paper');
    await run();
    const [mine] = cacheFiles();
    await run({}, SETTING, 'build', other);
    const theirs = cacheFiles().find((f) => f !== mine)!;
    expect(stand.runs).toBe(2);
    const good = readFileSync(mine!, 'utf8');
    const damages: [string, string][] = [
      ['truncated', good.slice(0, -10)],
      ['a character changed', good.replace('a paper', 'a pAper')],
      ['foreign (another run’s whole entry)', readFileSync(theirs, 'utf8')],
      ['empty', ''],
    ];
    for (const [k, [what, text]] of damages.entries()) {
      writeFileSync(mine!, text);
      const result = await run();
      expect(stand.runs, what).toBe(3 + k);
      expect(result.diagnostics[0]!.message).toContain('a paper|');
      expect(readFileSync(mine!, 'utf8'), what).toBe(good);
    }
    // A whole, checksummed entry whose text is not a remembered run (a forged shape) is not trusted either.
    const body = JSON.stringify({ 'run-memo 1': JSON.stringify({ reads: { files: {}, realpaths: {} }, diagnostics: [{ severity: 'fatal' }], outputs: [], inputs: [], failed: null, counts: null }) });
    const header = good.slice(0, good.indexOf('\n')).split(' ');
    writeFileSync(mine!, `${header[0]} ${header[1]} ${header[2]} ${createHash('sha256').update(body).digest('hex')} ${Buffer.byteLength(body)}\n${body}`);
    await run();
    expect(stand.runs).toBe(3 + damages.length);
  });
});
