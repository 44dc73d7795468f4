/**
 * Start-up and batch throughput of the command line, run as a user runs it
 * (`npm run bench` prints these tables after the engine's). Start-up compares
 * the compiled entry (dist/, what `npm ci` builds) with the old way of running
 * the TypeScript through tsx (SKEINPROOF_FROM_SOURCE=1), side by side in one run.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { randomBraidWord, rng } from '../test/support/random-diagrams.ts';

const ROOT = join(import.meta.dirname, '..');
const BIN = join(ROOT, 'bin', 'skeinproof.js');

function wallMs(args: readonly string[], env: NodeJS.ProcessEnv = {}): number {
  const start = performance.now();
  const r = spawnSync(process.execPath, [BIN, ...args], { cwd: ROOT, env: { ...process.env, ...env }, stdio: 'ignore' });
  if (r.status !== 0 && r.status !== 2) throw new Error(`skeinproof ${args.join(' ')} failed with status ${r.status}`);
  return performance.now() - start;
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)]!;
}

const format = (ms: number): string => (ms < 1000 ? `${ms.toFixed(0)} ms` : `${(ms / 1000).toFixed(2)} s`);

export function runSpeedBench(): void {
  spawnSync(process.execPath, [join(ROOT, 'scripts', 'compile.mjs')], { stdio: 'inherit' });
  const startups: [string, string[], string][] = [
    ['`--help`', ['--help'], '0.25 s'],
    ['`compute -n braid "1 1 1"`', ['compute', '-n', 'braid', '1 1 1'], '0.25 s'],
    ['`check` of the Markdown sample', ['check', 'samples/twists-and-weaves.md'], '0.5 s'],
  ];
  const lines = ['| command (median of 5) | old: tsx over the sources | new: compiled dist/ | target |', '| --- | ---: | ---: | ---: |'];
  for (const [label, args, target] of startups) {
    const old: number[] = [];
    const compiled: number[] = [];
    for (let k = 0; k < 5; k++) {
      old.push(wallMs(args, { SKEINPROOF_FROM_SOURCE: '1' }));
      compiled.push(wallMs(args));
    }
    lines.push(`| ${label} | ${format(median(old))} | ${format(median(compiled))} | ${target} |`);
  }
  console.log(`\n${lines.join('\n')}`);

  // Batch throughput: random braid closures of 10–16 crossings on up to 4 strands.
  const count = Number(process.env['SKEINPROOF_BENCH_BATCH'] ?? 1000);
  const random = rng(10_000);
  const work = mkdtempSync(join(tmpdir(), 'skeinproof-bench-'));
  try {
    const input = join(work, 'census.jsonl');
    const rows = Array.from({ length: count }, (_, k) =>
      JSON.stringify({ id: `d${k}`, notation: 'braid', code: randomBraidWord(random, 2 + (k % 3), 10 + (k % 7)).join(' '), keys: 'jones,crossingNumber,determinant,signature' }),
    );
    writeFileSync(input, `${rows.join('\n')}\n`);
    const batchLines = ['| batch of random 10–16-crossing braid closures (jones, crossing number, det, σ) | diagrams | time | diagrams/s |', '| --- | ---: | ---: | ---: |'];
    let oneWorker = 0;
    for (const jobs of [1, 2]) {
      const ms = wallMs(['batch', input, '--jobs', String(jobs)]);
      if (jobs === 1) oneWorker = ms;
      batchLines.push(`| ${jobs} worker${jobs === 1 ? '' : 's'}${jobs === 2 ? ` (${(oneWorker / ms).toFixed(2)}× one worker)` : ''} | ${count} | ${format(ms)} | ${Math.round((count / ms) * 1000)} |`);
    }
    console.log(`\n${batchLines.join('\n')}`);
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}
