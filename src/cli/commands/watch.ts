/**
 * `skeinproof watch FILE`: build once, then again whenever the manuscript (or
 * a file it reads, as the last build reported) changes, until interrupted.
 * Editors often save by writing a new file and renaming it, so the
 * directories are watched, not the files.
 */
import { existsSync, watch, type FSWatcher } from 'node:fs';
import { basename, dirname, join, relative, resolve } from 'node:path';
import type { Argv } from 'yargs';
import { buildOnce, buildOptions, readBuildArgs } from './build.ts';
import { formatOf, usage } from './check.ts';
import type { CliCommand } from './index.ts';

/** Section text (with its trees) kept per Markdown reader between builds: a manuscript of several megabytes keeps its most recent sections only. */
const KEPT_SECTION_CHARACTERS = 2_000_000;

/** Saves arrive as bursts of events (a write and a rename within a few milliseconds); one rebuild per burst. */
const DEBOUNCE_MS = 50;

export const watchCommand: CliCommand = {
  command: 'watch <file>',
  describe: 'Check and build a manuscript, then again on every change (Ctrl-C stops)',
  builder: (y: Argv) => buildOptions(y.positional('file', { type: 'string', describe: 'The manuscript' })),
  run: async (raw) => {
    // One set of computed values for the whole session: after a save only changed diagrams are computed.
    const args = readBuildArgs(raw, true);
    if (typeof args === 'string') return usage(args);
    const path = String(raw['file']);
    const format = formatOf(path);
    if (typeof format === 'string') return usage(format);
    // After a save most sections of a Markdown text are unchanged: their parsed trees are kept for the next build.
    if (format.name === 'markdown') (await import('../../../plugins/remark/sections.ts')).keepSectionTrees(KEPT_SECTION_CHARACTERS);

    if (!existsSync(dirname(resolve(path)))) return usage(`cannot watch ${path}: the directory ${dirname(path)} does not exist; check the path`);
    const watched = new Set<string>([resolve(path)]);
    const watchers = new Map<string, FSWatcher>();
    let timer: NodeJS.Timeout | undefined;
    let running: Promise<void> = Promise.resolve();

    const onEvent = (dir: string) => (_event: string, name: string | Buffer | null) => {
      if (name !== null && !watched.has(resolve(dir, String(name)))) return;
      clearTimeout(timer);
      // The changed file is named as the reports name it: relative to the manuscript as it was given.
      const changed = name === null ? path : join(dirname(path), relative(dirname(resolve(path)), resolve(dir, String(name))));
      timer = setTimeout(() => rebuild(`${changed} changed, rebuilding`), DEBOUNCE_MS);
    };
    const watchDirectoriesOf = (files: readonly string[]): void => {
      for (const f of files) watched.add(resolve(f));
      for (const dir of new Set([...watched].map((f) => dirname(f)))) {
        if (watchers.has(dir) || !existsSync(dir)) continue; // a missing directory is the build's error to report
        watchers.set(dir, watch(dir, onEvent(dir)));
      }
    };
    const rebuild = (why: string): void => {
      running = running.then(async () => {
        process.stdout.write(`--- ${new Date().toISOString().slice(11, 19)} ${why}\n`);
        const outcome = await buildOnce(path, args);
        watchDirectoriesOf(outcome.inputs);
        process.stdout.write(`--- watching ${path} (Ctrl-C stops)\n`);
      });
    };
    watchDirectoriesOf([path]);
    rebuild(`building ${basename(path)}`);

    await new Promise<void>((done) => {
      const stop = (): void => {
        clearTimeout(timer);
        for (const w of watchers.values()) w.close();
        void running.then(done);
      };
      process.once('SIGINT', stop);
      process.once('SIGTERM', stop);
    });
    return 0;
  },
};
