/**
 * Start-up and batch throughput of the command line, run as a user runs it
 * (`npm run bench` prints these tables after the engine's). Start-up compares
 * the compiled entry (dist/, what `npm ci` builds) with the old way of running
 * the TypeScript through tsx (SKEINPROOF_FROM_SOURCE=1), side by side in one run.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { spawn, spawnSync } from 'node:child_process';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { randomBraidWord, rng } from '../test/support/random-diagrams.ts';
import { childCpuMs, diagrams, format as formatTiming, LIGHT, markdown, type Timing } from './cache.ts';

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

export async function runSpeedBench(): Promise<void> {
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
  const count = Number(process.env['SKEINPROOF_BENCH_BATCH'] ?? 10_000);
  const random = rng(10_000);
  const work = mkdtempSync(join(tmpdir(), 'skeinproof-bench-'));
  try {
    const input = join(work, 'census.jsonl');
    const rows = Array.from({ length: count }, (_, k) =>
      JSON.stringify({ id: `d${k}`, notation: 'braid', code: randomBraidWord(random, 2 + (k % 3), 10 + (k % 7)).join(' '), keys: 'jones,crossingNumber,determinant,signature' }),
    );
    writeFileSync(input, `${rows.join('\n')}\n`);
    // What the machine can give two threads right now: two separate one-thread runs over the two halves
    // at once. On an idle 2-core machine this is about half the one-thread time; under load, less gain.
    const halves = [rows.slice(0, count / 2), rows.slice(count / 2)].map((half, k) => {
      const path = join(work, `half-${k}.jsonl`);
      writeFileSync(path, `${half.join('\n')}\n`);
      return path;
    });
    // --jobs 1, 2 and the two halves alternately, three times each, so all see the same load; medians compared.
    const runs: Record<'1' | '2' | 'halves', Timing[]> = { '1': [], '2': [], halves: [] };
    for (let k = 0; k < 3; k++) {
      for (const jobs of ['1', '2'] as const) runs[jobs].push(timed(['batch', input, '--jobs', jobs, '--no-cache']));
      runs.halves.push(await concurrently(halves.map((half) => ['batch', half, '--jobs', '1', '--no-cache'])));
    }
    const [one, two, apart] = [medianTiming(runs['1']), medianTiming(runs['2']), medianTiming(runs.halves)];
    console.log(
      [
        '',
        `| batch of ${count} random 10–16-crossing braid closures (jones, crossing number, det, σ), median of 3 | wall (CPU) | diagrams/s |`,
        '| --- | ---: | ---: |',
        `| --jobs 1 | ${formatTiming(one)} | ${Math.round((count / one.wallMs) * 1000)} |`,
        `| --jobs 2 | ${formatTiming(two)} | ${Math.round((count / two.wallMs) * 1000)} (${(one.wallMs / two.wallMs).toFixed(2)}× --jobs 1) |`,
        `| the machine's capacity: two --jobs 1 processes on the halves at once | ${formatTiming(apart)} | ${Math.round((count / apart.wallMs) * 1000)} (${(one.wallMs / apart.wallMs).toFixed(2)}× --jobs 1) |`,
      ].join('\n'),
    );
    await runManuscriptBench(work);
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}

/** Wall and CPU time (this process's children, worker threads included) of one command. */
function timed(args: readonly string[]): Timing {
  const cpu = childCpuMs();
  const wall = wallMs(args);
  return { wallMs: wall, cpuMs: childCpuMs() - cpu };
}

/** Wall time until every command has ended, run at the same time, and their CPU time together. */
async function concurrently(commands: readonly (readonly string[])[]): Promise<Timing> {
  const cpu = childCpuMs();
  const start = performance.now();
  await Promise.all(
    commands.map(
      (args) =>
        new Promise<void>((resolve, reject) =>
          spawn(process.execPath, [BIN, ...args], { cwd: ROOT, stdio: 'ignore' }).on('exit', (code) => (code === 0 || code === 2 ? resolve() : reject(new Error(`skeinproof ${args.join(' ')} failed with status ${code}`)))),
        ),
    ),
  );
  return { wallMs: performance.now() - start, cpuMs: childCpuMs() - cpu };
}

function medianTiming(runs: readonly Timing[]): Timing {
  return [...runs].sort((a, b) => a.wallMs - b.wallMs)[Math.floor(runs.length / 2)]!;
}

/**
 * The generated 200-diagram manuscript of the cache bench (V, Δ, det, σ filled in for each), built
 * without the cache with --jobs 1 and 2 side by side; then `watch` (no cache, default jobs): the time
 * from saving a one-claim edit to the end of the new build, as the watch prints it.
 */
async function runManuscriptBench(work: string): Promise<void> {
  const path = join(work, 'census.md');
  const text = markdown(diagrams(), LIGHT);
  writeFileSync(path, text);
  const runs: Record<'1' | '2', Timing[]> = { '1': [], '2': [] };
  for (let k = 0; k < 3; k++) {
    for (const jobs of ['1', '2'] as const) runs[jobs].push(timed(['build', path, '-o', join(work, `census-${jobs}.md`), '--no-cache', '--jobs', jobs]));
  }
  const [one, two] = [medianTiming(runs['1']), medianTiming(runs['2'])];
  console.log(
    [
      '',
      '| build of the 200-diagram Markdown manuscript, no cache, median of 3 | wall (CPU) |',
      '| --- | ---: |',
      `| --jobs 1 | ${formatTiming(one)} |`,
      `| --jobs 2 | ${formatTiming(two)} (${(one.wallMs / two.wallMs).toFixed(2)}× --jobs 1) |`,
    ].join('\n'),
  );
  const times = (await watchAfterEdits(path, text)).sort((a, b) => a - b);
  console.log(
    [
      '',
      `| watch of the same manuscript (no cache): a one-claim edit saved → new report printed and build written | median of ${times.length} | fastest | slowest |`,
      '| --- | ---: | ---: | ---: |',
      `| default --jobs | ${format(times[Math.floor(times.length / 2)]!)} | ${format(times[0]!)} | ${format(times[times.length - 1]!)} |`,
    ].join('\n'),
  );
}

/**
 * Starts `watch`, waits for its first build, then saves edits of one claim (a determinant claimed for the
 * first diagram, 1 then 2 then 1 …) and measures each from the write to the watch's "--- watching" line.
 */
async function watchAfterEdits(path: string, text: string, edits = 7): Promise<number[]> {
  const withClaim = (value: number): string => `${text}\nThe determinant of d0 is :determinant[$${value}$]{of=d0}.\n`;
  writeFileSync(path, withClaim(0));
  const child = spawn(process.execPath, [BIN, 'watch', path, '-o', `${path}.out.md`, '--no-cache', '--force-write'], { stdio: ['ignore', 'pipe', 'ignore'] });
  let pending: (() => void) | undefined;
  let buffered = '';
  child.stdout.setEncoding('utf8');
  child.stdout.on('data', (data: string) => {
    buffered += data;
    if (buffered.includes('--- watching')) {
      buffered = '';
      pending?.();
    }
  });
  const nextBuild = (): Promise<void> => new Promise((resolve) => (pending = resolve));
  try {
    await nextBuild();
    const times: number[] = [];
    for (let k = 1; k <= edits; k++) {
      await new Promise((resolve) => setTimeout(resolve, 300)); // a pause between saves, as an author makes
      const built = nextBuild();
      const start = performance.now();
      writeFileSync(path, withClaim(k));
      await built;
      times.push(performance.now() - start);
    }
    return times;
  } finally {
    child.kill('SIGINT');
  }
}
