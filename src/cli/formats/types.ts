/**
 * A manuscript format (Markdown, LaTeX) as the `check`, `build` and `watch`
 * commands see it. Each format lives in its own module and is registered in
 * ./registry.ts; the commands pick one by file extension.
 */
import type { Diagnostic } from '../../core/diagnostics/diagnostic.ts';
import type { Convention } from '../../core/convention/convention.ts';
import type { PrecomputeHook, SessionCounts } from '../../core/manuscript/api.ts';
import type { ComputeLimits } from '../../core/limits.ts';
import type { FileResultStore } from '../result-store.ts';
import type { ReadLog } from '../read-log.ts';

export interface FormatOptions {
  /** Convention given on the command line; overrides what the document declares. */
  readonly convention?: Partial<Convention>;
  readonly strict?: boolean;
  /** Output path asked for with -o, if any. */
  readonly output?: string;
  readonly html?: boolean;
  readonly allowHtml?: boolean;
  /** Limits on each diagram's work (none when absent). */
  readonly limits?: ComputeLimits;
  /** Where computed values are kept between runs (none when absent: --no-cache). */
  readonly resultStore?: FileResultStore;
  /** Computes the diagrams' values in a pool of threads before the session (src/cli/manuscript-pool.ts); absent: the session computes them. */
  readonly precompute?: PrecomputeHook;
  /** Where the format records every file it reads (src/cli/read-log.ts), so a remembered run knows what it depends on. */
  readonly readLog?: ReadLog;
}

export interface OutputFile {
  readonly path: string;
  readonly content: string | Uint8Array;
  /**
   * Set when the path is the build's default, not one the author named: a file
   * already there is replaced only if it holds this mark (skeinproof wrote it),
   * so a file of the author's that happens to have the name is never overwritten unasked.
   */
  readonly ownMark?: string;
}

export interface FormatResult {
  readonly diagnostics: readonly Diagnostic[];
  /** Files the build would write (check leaves this empty). Written atomically by the command. */
  readonly outputs: readonly OutputFile[];
  /** Every file read, for watch mode (the manuscript and what it includes). */
  readonly inputs: readonly string[];
  /**
   * True when the check fails: an error, or a warning under strictness set on
   * the command line or by the document itself. When absent, commands derive
   * it from the diagnostics and the command-line --strict.
   */
  readonly failed?: boolean;
  /** What the manuscript pass checked (absent when the file could not be read at all). */
  readonly counts?: SessionCounts;
}

export interface ManuscriptFormat {
  readonly name: string;
  readonly extensions: readonly string[];
  check(path: string, options: FormatOptions): Promise<FormatResult>;
  build(path: string, options: FormatOptions): Promise<FormatResult>;
}

/** File extensions of each format; the registry picks a format by these without loading its module. */
export const FORMAT_EXTENSIONS = { markdown: ['.md', '.markdown'], latex: ['.tex', '.ltx'] } as const;
