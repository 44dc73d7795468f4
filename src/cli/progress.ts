/**
 * A progress bar on stderr for long runs: diagrams (or lines) done of the
 * total, the one just finished and an estimate of the time left. It appears
 * only after about a second, so quick runs print nothing, and never when
 * stderr is not a terminal, under CI, or with --quiet: logs and pipes get no
 * control characters. cli-progress draws it (bundled with the tool).
 */
import cliProgress from 'cli-progress';

/** Runs shorter than this show no bar at all (SKEINPROOF_PROGRESS_AFTER_MS sets it: tests draw one at once). */
function showAfterMs(): number {
  const given = Number(process.env['SKEINPROOF_PROGRESS_AFTER_MS']);
  return Number.isFinite(given) && given >= 0 ? given : 1000;
}

export interface ProgressDisplay {
  start(total: number | undefined): void;
  /** One more item done; `id` names it on the bar. */
  advance(id: string): void;
  stop(): void;
}

/** Whether a bar may be drawn: stderr is a terminal, CI is not set, and --quiet was not given. */
export function wantsProgress(quiet: boolean, stream: { isTTY?: boolean } = process.stderr, environment: NodeJS.ProcessEnv = process.env): boolean {
  const ci = environment['CI'];
  return !quiet && stream.isTTY === true && (ci === undefined || ci === '' || ci === 'false' || ci === '0');
}

/** A bar for `noun` ("diagrams", "lines"), or undefined when none may be drawn. */
export function progressDisplay(noun: string, quiet: boolean): ProgressDisplay | undefined {
  if (!wantsProgress(quiet)) return undefined;
  let bar: cliProgress.SingleBar | undefined;
  let total: number | undefined;
  let done = 0;
  let started = 0;
  const showAfter = showAfterMs();
  return {
    start(count) {
      total = count;
      started = performance.now();
    },
    advance(id) {
      done++;
      if (!bar && performance.now() - started >= showAfter) {
        // Without a total (standard input) the bar shows a count and the rate instead of an estimate.
        const format = total === undefined ? `{value} ${noun} done | {id}` : `[{bar}] {value}/{total} ${noun} | about {eta_formatted} left | {id}`;
        bar = new cliProgress.SingleBar({ format, stream: process.stderr, hideCursor: true, clearOnComplete: true, etaBuffer: 200, fps: 5 }, cliProgress.Presets.shades_classic);
        bar.start(total ?? 0, done, { id });
      }
      bar?.update(done, { id });
    },
    stop() {
      bar?.stop();
    },
  };
}
