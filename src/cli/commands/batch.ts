/**
 * `skeinproof batch [FILE|-]`: JSON Lines in ({"id","notation","code"} per line,
 * optional "strands" and "keys"), one `compute --json` object per line out, in
 * input order, each led by its id; a line that cannot be read or computed is an
 * error object on its own line, never the end of the run. `--resume OUT` appends
 * to OUT, skipping the lines already written completely there.
 */
import { createReadStream, existsSync, openSync, readSync, closeSync, ftruncateSync, createWriteStream, fstatSync } from 'node:fs';
import { createInterface } from 'node:readline';
import type { Argv } from 'yargs';
import { DEFAULT_CONVENTION, type Convention } from '../../core/convention/convention.ts';
import { parseConventionText } from '../../core/convention/settings.ts';
import { computeBatch, type BatchTask } from '../batch-pool.ts';
import { limitOptions, readLimits } from '../limit-options.ts';
import { cacheOptions, cacheSettings } from '../cache-options.ts';
import { FileResultStore } from '../result-store.ts';
import { conventionOptionText, repeatedOptionMessage } from '../repeated-option.ts';
import { jobsOptions, readJobs } from '../jobs-option.ts';
import { lendHelperThreads } from '../replay-helper.ts';
import { progressDisplay } from '../progress.ts';
import type { CliCommand } from './index.ts';
import { STANDARD_INPUT_ARGUMENT } from '../standard-input.ts';

const EXIT_OK = 0;
const EXIT_BAD_INPUT = 2;

function usage(message: string): number {
  process.stderr.write(`skeinproof: ${message}\nRun 'skeinproof batch --help' for the options.\n`);
  return EXIT_BAD_INPUT;
}

/**
 * What OUT already holds completely: the ids (and, for error lines without one, the line numbers) of
 * its newline-terminated lines that parse as JSON, and the byte length of that complete part (a
 * truncated last line is cut off and redone).
 */
function completedPart(path: string): { ids: Set<string>; lines: Set<number>; bytes: number } {
  const ids = new Set<string>();
  const lines = new Set<number>();
  if (!existsSync(path)) return { ids, lines, bytes: 0 };
  const fd = openSync(path, 'r');
  const chunk = Buffer.alloc(1 << 16);
  let carry = Buffer.alloc(0);
  let offset = 0;
  let complete = 0;
  try {
    for (;;) {
      const read = readSync(fd, chunk, 0, chunk.length, offset);
      if (read === 0) break;
      offset += read;
      let data = Buffer.concat([carry, chunk.subarray(0, read)]);
      let newline: number;
      while ((newline = data.indexOf(10)) >= 0) {
        const line = data.subarray(0, newline).toString('utf8');
        data = data.subarray(newline + 1);
        let parsed: Record<string, unknown> | undefined;
        try {
          parsed = JSON.parse(line) as Record<string, unknown>;
        } catch {
          parsed = undefined;
        }
        if (!parsed) break; // a damaged line: everything from here on is redone
        if (typeof parsed['id'] === 'string') ids.add(parsed['id']);
        else if (typeof parsed['line'] === 'number') lines.add(parsed['line']);
        complete += Buffer.byteLength(line, 'utf8') + 1;
      }
      carry = Buffer.from(data);
    }
  } finally {
    closeSync(fd);
  }
  return { ids, lines, bytes: complete };
}

/** The input's lines as tasks (blank lines skipped), minus those `skip` says are done. */
async function* inputTasks(path: string, skip: (task: BatchTask) => boolean): AsyncGenerator<BatchTask> {
  const stream = path === '-' ? process.stdin : createReadStream(path);
  const lines = createInterface({ input: stream, crlfDelay: Infinity });
  let lineNumber = 0;
  for await (const text of lines) {
    lineNumber++;
    if (text.trim() === '') continue;
    const task = { text, lineNumber };
    if (!skip(task)) yield task;
  }
}

/** The non-blank lines of a file, for the progress bar and the pool (read in blocks; the file is read again to compute). */
function countLines(path: string): number {
  const fd = openSync(path, 'r');
  const block = Buffer.alloc(1 << 20);
  let count = 0;
  let inLine = false;
  try {
    for (let read; (read = readSync(fd, block, 0, block.length, null)) > 0; ) {
      for (let k = 0; k < read; k++) {
        const byte = block[k]!;
        if (byte === 10) {
          if (inLine) count++;
          inLine = false;
        } else if (byte !== 32 && byte !== 9 && byte !== 13) inLine = true;
      }
    }
  } finally {
    closeSync(fd);
  }
  return count + (inLine ? 1 : 0);
}

/** The id a line names, if it is an object with a string id (for --resume). */
function idOf(text: string): string | undefined {
  try {
    const value = JSON.parse(text) as { id?: unknown };
    return typeof value?.id === 'string' ? value.id : undefined;
  } catch {
    return undefined;
  }
}

export const batchCommand: CliCommand = {
  command: 'batch [input]',
  describe: 'Compute JSON Lines of diagram codes ({"id","notation","code"} per line) into JSON Lines of results, in input order',
  builder: (y: Argv) =>
    jobsOptions(cacheOptions(limitOptions(y)))
      .positional('input', { type: 'string', default: '-', describe: 'The JSON Lines file, or - for standard input' })
      .option('resume', { type: 'string', describe: 'Append to this output file, skipping the lines it already holds completely' })
      .option('convention', { type: 'string', describe: 'How values are written, e.g. "signature=positive"' }) as Argv,
  run: async (args) => {
    // main.ts passes a bare `-` on as STANDARD_INPUT_ARGUMENT.
    const given = String(args['input'] ?? '-');
    const input = given === STANDARD_INPUT_ARGUMENT ? '-' : given;
    const limits = readLimits(args);
    if (typeof limits === 'string') return usage(limits);
    const cache = cacheSettings(args);
    if (typeof cache === 'string') return usage(cache);
    const repeated = repeatedOptionMessage('resume', args['resume']);
    if (repeated !== undefined) return usage(repeated);
    const jobs = readJobs(args);
    if (typeof jobs === 'string') return usage(jobs);
    lendHelperThreads(jobs);
    let convention: Convention = DEFAULT_CONVENTION;
    const conventionText = conventionOptionText(args['convention']);
    if (conventionText !== undefined) {
      const read = parseConventionText(conventionText);
      if (!read.ok) return usage(`--convention: ${read.errors.map((e) => e.message).join('; ')}.`);
      convention = { ...DEFAULT_CONVENTION, ...read.settings };
    }
    if (input !== '-' && !existsSync(input)) return usage(`cannot read ${input}: no such file; check the path`);

    const resume = args['resume'] === undefined ? undefined : String(args['resume']);
    let out: NodeJS.WritableStream = process.stdout;
    let skip = (_task: BatchTask): boolean => false;
    if (resume !== undefined) {
      const done = completedPart(resume);
      const fd = openSync(resume, existsSync(resume) ? 'r+' : 'w');
      if (fstatSync(fd).size > done.bytes) ftruncateSync(fd, done.bytes);
      out = createWriteStream(resume, { fd, start: done.bytes });
      skip = (task) => {
        const id = idOf(task.text);
        return id !== undefined ? done.ids.has(id) : done.lines.has(task.lineNumber);
      };
    }
    let failed = false;
    const progress = progressDisplay('lines', args['quiet'] === true);
    // The total is known for a file read from its start; standard input and a resumed run count without one.
    const total = input !== '-' && resume === undefined ? countLines(input) : undefined;
    progress?.start(total);
    try {
      for await (const result of computeBatch(inputTasks(input, skip), jobs, { convention, limits, ...(cache ? { cache } : {}) }, total)) {
        failed ||= !result.ok;
        progress?.advance(result.label);
        if (!out.write(result.text)) await new Promise((resolve) => out.once('drain', resolve));
      }
    } finally {
      progress?.stop();
    }
    // The workers wrote to the cache, each with a store of its own: keep it under its cap.
    if (cache) new FileResultStore(cache).evict(true);
    if (out !== process.stdout) await new Promise<void>((resolve, reject) => out.end((error?: Error | null) => (error ? reject(error) : resolve())));
    return failed ? EXIT_BAD_INPUT : EXIT_OK;
  },
};
