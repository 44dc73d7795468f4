/**
 * The bracket engine's constants (issue: fast on every save, and at census
 * scale), measured side by side with the engine as it was before that work, in
 * the same run: the old engine's sources are taken from git at
 * BASELINE_REVISION into a temporary directory and loaded from there. Set
 * SKEINPROOF_BENCH_BASELINE to another revision, or to `none` to skip the old
 * engine (it needs minutes for the largest row). Every row checks the new value
 * against an independent formula and against the old engine.
 */
import os from 'node:os';
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { closeBraid } from '../src/core/diagram/braid-closure.ts';
import { writhe, type LinkDiagram } from '../src/core/diagram/model.ts';
import { kauffmanBracket } from '../src/core/invariants/bracket.ts';
import { lendReplayHelper } from '../src/core/helper-threads.ts';
import { threadReplayHelper } from '../src/cli/replay-helper.ts';
import { planContraction } from '../src/core/invariants/crossing-order.ts';
import { jonesFromBracket } from '../src/core/invariants/jones.ts';
import type { Laurent } from '../src/core/poly/laurent.ts';
import { randomBraidWord, randomInt, rng, shuffleDiagram } from '../test/support/random-diagrams.ts';
import { alternatingBraidClosure, torusBraid, torusKnotJones } from './families.ts';

/** The last commit before the engine-constants work. */
const BASELINE_REVISION = '52862c7';

interface Engine {
  kauffmanBracket(d: LinkDiagram, order?: readonly number[]): { bracket: Laurent; boundaryWidth: number };
  planContraction(d: LinkDiagram): { order: readonly number[] };
}

const ROOT = join(import.meta.dirname, '..');

/** The engine at `revision`, or undefined (with the reason) when git or the revision is not available. */
async function baselineEngine(revision: string, scratch: string): Promise<Engine | string> {
  try {
    const archive = execFileSync('git', ['-C', ROOT, 'archive', revision, 'src'], { maxBuffer: 1 << 28 });
    execFileSync('tar', ['-x', '-C', scratch], { input: archive });
  } catch (error) {
    return `old engine (${revision}) not available: ${String(error).split('\n')[0]}`;
  }
  const dir = join(scratch, 'src/core/invariants');
  const bracket = (await import(pathToFileURL(join(dir, 'bracket.ts')).href)) as Pick<Engine, 'kauffmanBracket'>;
  const order = (await import(pathToFileURL(join(dir, 'crossing-order.ts')).href)) as Pick<Engine, 'planContraction'>;
  return { kauffmanBracket: bracket.kauffmanBracket, planContraction: order.planContraction };
}

function seconds(work: () => void): number {
  const start = performance.now();
  work();
  return (performance.now() - start) / 1000;
}

function formatSeconds(s: number): string {
  return s < 10 ? `${s.toFixed(2)} s` : `${s.toFixed(1)} s`;
}

interface Case {
  name: string;
  diagram: LinkDiagram;
  target: string;
  /** The independent check of the new engine's value. */
  check: (jones: Laurent) => string;
}

/** Reduced alternating, connected: span V = crossings (Kauffman, Murasugi, Thistlethwaite 1987). */
function spanCheck(n: number): (jones: Laurent) => string {
  return (jones) => (jones.span === n ? 'span V = n ✓' : 'span V WRONG');
}

function torusCheck(p: number, q: number): (jones: Laurent) => string {
  return (jones) => (jones.equals(torusKnotJones(p, q)) ? 'Jones 1987 formula ✓' : 'WRONG');
}

/** Planning time as a share of planning plus contraction, over `diagrams` (best of three passes, the first warms up). */
function planningShare(engine: Engine, diagrams: readonly LinkDiagram[]): number {
  let best = Infinity;
  let share = 0;
  for (let pass = 0; pass < 3; pass++) {
    let planning = 0;
    let contracting = 0;
    for (const d of diagrams) {
      let start = performance.now();
      const plan = engine.planContraction(d);
      planning += performance.now() - start;
      start = performance.now();
      engine.kauffmanBracket(d, plan.order);
      contracting += performance.now() - start;
    }
    if (planning + contracting < best) {
      best = planning + contracting;
      share = planning / best;
    }
  }
  return share;
}

export async function runEngineConstantsBench(): Promise<void> {
  const revision = process.env['SKEINPROOF_BENCH_BASELINE'] ?? BASELINE_REVISION;
  const scratch = mkdtempSync(join(os.tmpdir(), 'skeinproof-bench-engine-'));
  try {
    const old = revision === 'none' ? 'old engine skipped (SKEINPROOF_BENCH_BASELINE=none)' : await baselineEngine(revision, scratch);
    const cases: Case[] = [
      { name: 'alternating, 8-strand closure, shuffled', diagram: alternatingBraidClosure(600, 8, 600), target: '—', check: spanCheck(600) },
      { name: 'alternating, 8-strand closure, shuffled', diagram: alternatingBraidClosure(1600, 8, 1600), target: '15 s', check: spanCheck(1600) },
      { name: 'torus knot T(10,11)', diagram: closeBraid(torusBraid(10, 11), 10), target: '—', check: torusCheck(10, 11) },
      { name: 'torus knot T(12,13)', diagram: closeBraid(torusBraid(12, 13), 12), target: '10 s', check: torusCheck(12, 13) },
    ];
    const lines = [
      `| diagram | crossings | widest boundary | before (${revision}) | now, one thread | now, two threads | before / now | target | check |`,
      '| --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: | --- |',
    ];
    for (const c of cases) {
      let now: { bracket: Laurent; boundaryWidth: number } | undefined;
      const nowSeconds = seconds(() => (now = kauffmanBracket(c.diagram)));
      // The command line lends the modular engine a helper thread when it may use more than one (src/cli/replay-helper.ts).
      lendReplayHelper(threadReplayHelper());
      let withHelper: Laurent | undefined;
      const twoThreadSeconds = seconds(() => (withHelper = kauffmanBracket(c.diagram).bracket));
      lendReplayHelper(undefined);
      const jones = jonesFromBracket(now!.bracket, writhe(c.diagram));
      let before = '—';
      let ratio = '—';
      let check = c.check(jones) + (withHelper!.equals(now!.bracket) ? '' : ', two threads DIFFER');
      if (typeof old !== 'string') {
        let value: Laurent | undefined;
        const beforeSeconds = seconds(() => (value = old.kauffmanBracket(c.diagram).bracket));
        before = formatSeconds(beforeSeconds);
        ratio = `${(beforeSeconds / Math.min(nowSeconds, twoThreadSeconds)).toFixed(1)}×`;
        check += value!.equals(now!.bracket) ? ', same as before ✓' : ', DIFFERS from before';
      }
      const row = [c.name, c.diagram.crossings.length, now!.boundaryWidth, before, formatSeconds(nowSeconds), formatSeconds(twoThreadSeconds), ratio, c.target, check];
      lines.push(`| ${row.join(' | ')} |`);
    }
    const random = rng(400);
    const small = Array.from({ length: 400 }, () => {
      const strands = randomInt(random, 3, 6);
      return shuffleDiagram(closeBraid(randomBraidWord(random, strands, randomInt(random, 8, 40)), strands), random);
    });
    const shareNow = planningShare({ kauffmanBracket, planContraction }, small);
    const shareBefore = typeof old === 'string' ? '—' : `${(100 * planningShare(old, small)).toFixed(0)} %`;
    lines.push(`| choosing the crossing order, share of the time (400 random closures, 8–40 crossings) | 8–40 | — | ${shareBefore} | ${(100 * shareNow).toFixed(0)} % | — | — | 10 % | — |`);
    console.log('\nEngine constants, side by side with the engine before that work:\n');
    console.log(lines.join('\n'));
    if (typeof old === 'string') console.log(`\n(${old})`);
    console.log(`\n(load average ${os.loadavg().map((l) => l.toFixed(1)).join(', ')} at the end; ${os.cpus().length} cores)`);
    if (lines.some((l) => /WRONG|DIFFER/.test(l))) process.exitCode = 1;
  } finally {
    rmSync(scratch, { recursive: true, force: true });
  }
}

if (import.meta.url === `file://${process.argv[1]}`) await runEngineConstantsBench();
