/**
 * A big Markdown manuscript (README "Big inputs"): a generated survey of about
 * 5 MB, 879 random braid closures of 8–30 crossings with two fill-ins each
 * (Jones polynomial, determinant) and 10,000 paragraphs of prose, some with
 * a formula of their own. `check --jobs 1 --no-cache` is timed as a user runs
 * it (start-up included), with the peak resident size of the process (from
 * /usr/bin/time), and so are checks of a survey half and twice its size, to
 * show how time and memory grow. `npm run bench` runs it; SKEINPROOF_BENCH_BIG=0
 * skips it (it takes about 40 s on the shared 2-core machine).
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { randomBraidWord, randomInt, rng } from '../test/support/random-diagrams.ts';

const ROOT = join(import.meta.dirname, '..');
const BIN = join(ROOT, 'bin', 'skeinproof.js');
const TIME = '/usr/bin/time';
export const CODES = 879;
export const PARAGRAPHS = 10_000;

const WORDS = ['the', 'strand', 'crosses', 'over', 'a', 'twist', 'region', 'and', 'then', 'under', 'its', 'neighbour', 'so', 'that', 'each', 'loop', 'of', 'rope', 'meets', 'another', 'in', 'turn', 'along', 'chart'];

/** The survey's text: codes with their fill-ins spread evenly among the paragraphs of prose. */
export function survey(codes = CODES, paragraphs = PARAGRAPHS): string {
  const random = rng(879);
  const sentence = (): string => Array.from({ length: randomInt(random, 8, 16) }, () => WORDS[randomInt(random, 0, WORDS.length - 1)]).join(' ');
  const parts: string[] = ['# A generated survey of braid closures\n'];
  const every = Math.floor(paragraphs / codes);
  let code = 0;
  for (let p = 0; p < paragraphs; p++) {
    if (p % every === 0 && code < codes) {
      const strands = randomInt(random, 2, 5);
      const word = randomBraidWord(random, strands, randomInt(random, 8, 30));
      const id = `s${code++}`;
      parts.push(`\`\`\`skein id=${id} notation=braid strands=${strands}\n${word.join(' ')}\n\`\`\`\n`, `Closure ${id} has V(t) = :jones{of=${id}} and determinant :determinant{of=${id}}.\n`);
    }
    const text = Array.from({ length: 7 }, () => `${sentence()}.`).join(' ');
    parts.push(p % 7 === 0 ? `${text} Its count is $n_{${p}} = ${p} + 1$.\n` : `${text}\n`);
  }
  return parts.join('\n');
}

interface Measured {
  readonly wallS: number;
  readonly cpuS: number;
  readonly peakMb: number;
}

function check(path: string): Measured {
  const r = spawnSync(TIME, ['-f', '%e %U %S %M', process.execPath, BIN, 'check', path, '--jobs', '1', '--no-cache'], { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`skeinproof check ${path} failed with status ${r.status}: ${r.stderr.slice(-2000)}`);
  const [wall, user, system, kib] = r.stderr.trim().split('\n').pop()!.split(' ').map(Number);
  return { wallS: wall!, cpuS: user! + system!, peakMb: kib! / 1024 };
}

export function runBigMarkdownBench(): void {
  if (process.env['SKEINPROOF_BENCH_BIG'] === '0') return console.log('\n(big Markdown survey skipped: SKEINPROOF_BENCH_BIG=0)');
  if (!existsSync(TIME)) return console.log(`\n(big Markdown survey skipped: ${TIME} is needed for the peak memory)`);
  const work = mkdtempSync(join(tmpdir(), 'skeinproof-big-'));
  try {
    const lines = ['| generated survey, `check --jobs 1 --no-cache` (median of 3) | size | wall | CPU | peak RSS |', '| --- | ---: | ---: | ---: | ---: |'];
    for (const [name, codes, paragraphs] of [
      ['half: 440 codes, 5,000 paragraphs', Math.ceil(CODES / 2), PARAGRAPHS / 2],
      [`${CODES} codes, two fill-ins each, ${PARAGRAPHS.toLocaleString('en')} paragraphs`, CODES, PARAGRAPHS],
      [`double: ${(2 * CODES).toLocaleString('en')} codes, ${(2 * PARAGRAPHS).toLocaleString('en')} paragraphs`, 2 * CODES, 2 * PARAGRAPHS],
    ] as const) {
      const path = join(work, `survey-${codes}.md`);
      writeFileSync(path, survey(codes, paragraphs));
      const runs = [0, 1, 2].map(() => check(path)).sort((a, b) => a.wallS - b.wallS);
      const m = runs[1]!;
      lines.push(`| ${name} | ${(statSync(path).size / 1e6).toFixed(1)} MB | ${m.wallS.toFixed(2)} s | ${m.cpuS.toFixed(2)} s | ${m.peakMb.toFixed(0)} MB |`);
    }
    console.log(`\n${lines.join('\n')}`);
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}

if (import.meta.url === `file://${process.argv[1]}`) runBigMarkdownBench();
