/**
 * The formulas of a built Markdown text that KaTeX cannot typeset, remembered
 * in the disk cache from one run to the next. Finding them costs a second
 * Markdown parse (of the filled-in text: its math is not the manuscript's, as
 * fill-ins become formulas and removed markup joins text) and KaTeX over every
 * formula; a warm run of an unchanged manuscript pays neither.
 *
 * One entry per manuscript file and command kind (a check leaves figures out of
 * the filled-in text, a build puts them in), replaced whenever that text changes,
 * holds the SHA-256 of that text, the problems found in it and KaTeX's verdict
 * on each of its formulas. Its key names the versions of KaTeX and of the
 * packages that read the Markdown (`mathReaderVersion`), so an entry written
 * by another KaTeX or parser is never read. Unchanged text: the problems are
 * served as stored. Changed text (an edit): the text is parsed again, and only
 * formulas without a stored verdict go through KaTeX.
 */
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { storedJson, type ResultStore } from '../../core/cache/store.ts';
import type { MathProblem, MathVerdicts } from '../html/math-problems.ts';

declare const SKEINPROOF_MATH_READER: string | undefined;

/** The stored quantity's name; the number is its format's version. */
const QUANTITY = 'markdown-math 1';

interface StoredMath {
  /** SHA-256 of the filled-in text the problems were found in. */
  readonly filled: string;
  readonly problems: readonly MathProblem[];
  /** KaTeX's verdict on each formula of that text, by `formulaKey`. */
  readonly verdicts: Readonly<Record<string, string | null>>;
}

const sha256 = (text: string | Uint8Array): string => createHash('sha256').update(text).digest('hex');

/**
 * The versions that decide what `readMath` finds: KaTeX's, and a digest of the package lock (the Markdown
 * parser and its math extension are bundled from it). scripts/compile.mjs writes the same text into the
 * compiled command line, which then need not load KaTeX to know it; run from the sources, it is read here.
 */
export async function mathReaderVersion(): Promise<string> {
  if (typeof SKEINPROOF_MATH_READER === 'string') return SKEINPROOF_MATH_READER;
  const katex = (await import('katex')).default;
  const lock = readFileSync(fileURLToPath(new URL('../../../package-lock.json', import.meta.url)));
  return `katex ${katex.version}, packages ${sha256(lock).slice(0, 16)}`;
}

export interface RememberOptions {
  /** The disk cache; absent (--no-cache): every run finds the problems afresh. */
  readonly store?: ResultStore;
  /** The manuscript's path: its entry is replaced on every change. */
  readonly manuscript: string;
  /** True for a build, whose filled-in text holds the figures a check leaves out: each keeps an entry of its own. */
  readonly drawn: boolean;
  /** `mathReaderVersion()` (tests pass another to play an older KaTeX). */
  readonly readerVersion: string;
}

/** The problems of the filled-in text, from the cache when it holds them for exactly this text and these versions. */
export async function rememberedMathProblems(filled: string, options: RememberOptions): Promise<readonly MathProblem[]> {
  const key = `${QUANTITY}\n${options.readerVersion}\n${options.drawn ? 'build' : 'check'} ${resolve(options.manuscript)}`;
  const stored = options.store ? storedMath(options.store.get(key)) : undefined;
  const digest = sha256(filled);
  if (stored?.filled === digest) return stored.problems;
  const { readMath } = await import('../html/math-problems.ts');
  const known: MathVerdicts = new Map(stored ? Object.entries(stored.verdicts) : []);
  const reading = readMath(filled, known);
  const remembered: StoredMath = { filled: digest, problems: reading.problems, verdicts: Object.fromEntries(reading.verdicts) };
  options.store?.put(key, JSON.stringify(remembered));
  return reading.problems;
}

/** A stored entry, or undefined when there is none or it is not of the expected shape. */
function storedMath(text: string | undefined): StoredMath | undefined {
  const value = storedJson(text);
  if (typeof value !== 'object' || value === null) return undefined;
  const { filled, problems, verdicts } = value as Record<string, unknown>;
  if (typeof filled !== 'string' || !Array.isArray(problems) || !problems.every(isProblem)) return undefined;
  if (typeof verdicts !== 'object' || verdicts === null || Array.isArray(verdicts)) return undefined;
  if (!Object.values(verdicts).every((v) => v === null || typeof v === 'string')) return undefined;
  return { filled, problems, verdicts: verdicts as Record<string, string | null> };
}

function isProblem(p: unknown): p is MathProblem {
  if (typeof p !== 'object' || p === null) return false;
  const { message, offset, end } = p as Record<string, unknown>;
  return typeof message === 'string' && Number.isInteger(offset) && Number.isInteger(end);
}
