/**
 * The LaTeX format: reads the manuscript and what it \input s
 * (plugins/latex/reader.ts), runs the manuscript pass, and builds either the
 * sidecar `paper.skein.tex` that \usepackage{skeinproof} reads, or with -o a
 * flat copy that needs no package.
 */
import { closeSync, constants, fstatSync, openSync, readFileSync, type Stats } from 'node:fs';
import { basename, extname } from 'node:path';
import { DEFAULT_CONVENTION } from '../../core/convention/convention.ts';
import type { Diagnostic } from '../../core/diagnostics/diagnostic.ts';
import { runSession } from '../../core/manuscript/session.ts';
import { drawFigure } from '../../core/manuscript/figure-entries.ts';
import type { SessionInput, SessionResult } from '../../core/manuscript/api.ts';
import { readLatexManuscript, type LatexDocument, type LatexFileSystem } from '../../../plugins/latex/reader.ts';
import { flatText } from '../../../plugins/latex/flat.ts';
import { SIDECAR_MARK, sidecarPath, sidecarText } from '../../../plugins/latex/sidecar.ts';
import { decodeManuscript } from '../utf8.ts';
import { currentRealpath, type ReadLog } from '../read-log.ts';
import { FORMAT_EXTENSIONS, type FormatOptions, type FormatResult, type ManuscriptFormat } from './types.ts';

/**
 * Reads regular files only. The file is opened without blocking and checked on the open descriptor: opening a
 * named pipe for reading would wait for a writer forever, and a device file never ends.
 * A file that is not UTF-8 is read with replacement characters, so the reader still follows it, and its
 * first bad byte is recorded: the check then fails with that error and nothing is built.
 * Every read and real path goes into `log` (src/cli/read-log.ts) when one is given.
 */
const diskFiles = (encodingProblems: Map<string, Diagnostic>, log?: ReadLog): LatexFileSystem => ({
  read(path) {
    let fd: number;
    try {
      fd = openSync(path, constants.O_RDONLY | constants.O_NONBLOCK);
    } catch (e) {
      log?.failed(path, e);
      return undefined;
    }
    try {
      const stats = fstatSync(fd);
      if (!stats.isFile()) log?.notAFile();
      if (stats.isDirectory()) return undefined; // TeX does not read a directory either: try the next name
      if (!stats.isFile()) return { notRegular: specialFileKind(stats) };
      const bytes = readFileSync(fd);
      log?.read(path, bytes);
      const decoded = decodeManuscript(bytes, path);
      if (decoded.ok) return decoded.text;
      encodingProblems.set(path, decoded.problem);
      return bytes.toString('utf8');
    } catch (e) {
      log?.failed(path, e);
      return undefined;
    } finally {
      closeSync(fd);
    }
  },
  realpath(path) {
    const real = currentRealpath(path);
    log?.realpath(path, real);
    return real;
  },
});

function specialFileKind(stats: Stats): string {
  if (stats.isFIFO()) return 'a named pipe';
  if (stats.isSocket()) return 'a socket';
  if (stats.isCharacterDevice() || stats.isBlockDevice()) return 'a device file';
  return 'not a regular file';
}

interface Checked {
  readonly doc: LatexDocument;
  readonly session: SessionResult;
  readonly diagnostics: readonly Diagnostic[];
  readonly failed: boolean;
}

async function checkManuscript(path: string, options: FormatOptions): Promise<Checked> {
  const encodingProblems = new Map<string, Diagnostic>();
  const doc = readLatexManuscript(path, diskFiles(encodingProblems, options.readLog));
  // Named as the reader names the file (its display path); a file with such an error is not checked further.
  const undecodable = doc.files.flatMap((f) => {
    const problem = encodingProblems.get(f.absolutePath);
    return problem ? [{ ...problem, message: problem.message.replace(f.absolutePath, f.displayPath), location: { ...problem.location!, file: f.displayPath } }] : [];
  });
  if (undecodable.length > 0) {
    const session = runSession({ diagrams: [], claims: [], fills: [], convention: DEFAULT_CONVENTION });
    return { doc, session, diagnostics: undecodable, failed: true };
  }
  const input: SessionInput = {
    diagrams: doc.diagrams,
    claims: doc.claims,
    fills: doc.fills.map((f) => f.entry),
    khovanovGrids: doc.khovanovGrids,
    figures: doc.figures.map((f) => f.entry),
    convention: { ...DEFAULT_CONVENTION, ...doc.convention, ...options.convention },
    ...(options.strict ? { strict: true } : {}),
    refused: doc.refusedIds,
    ...(options.limits ? { limits: options.limits } : {}),
    ...(options.resultStore ? { resultStore: options.resultStore } : {}),
    documentStart: { file: doc.main.displayPath, start: { line: 1, column: 1 } },
    markupFound: doc.diagnostics.length > 0,
  };
  const session = runSession(options.precompute ? { ...input, ...(await options.precompute(input)) } : input);
  const diagnostics = inDocumentOrder([...doc.diagnostics, ...session.diagnostics], doc);
  const failed = session.failed || doc.diagnostics.some((d) => d.severity === 'error');
  return { doc, session, diagnostics, failed };
}

/** By file in the order the files were read, then line and column; unlocated ones first. */
function inDocumentOrder(diagnostics: Diagnostic[], doc: LatexDocument): Diagnostic[] {
  const fileRank = new Map(doc.files.map((f, i) => [f.displayPath, i]));
  const rank = (d: Diagnostic): [number, number, number] =>
    d.location ? [fileRank.get(d.location.file) ?? doc.files.length, d.location.start.line, d.location.start.column] : [-1, 0, 0];
  return diagnostics
    .map((d) => ({ d, r: rank(d) }))
    .sort((a, b) => a.r[0] - b.r[0] || a.r[1] - b.r[1] || a.r[2] - b.r[2])
    .map((x) => x.d);
}

/** The files read, named as in the diagnostics (so reporters can quote their lines). */
function inputsOf(doc: LatexDocument): string[] {
  return doc.files.map((f) => f.displayPath);
}

export const latexFormat: ManuscriptFormat = {
  name: 'latex',
  extensions: FORMAT_EXTENSIONS.latex,

  async check(path, options): Promise<FormatResult> {
    const { doc, session, diagnostics, failed } = await checkManuscript(path, options);
    return { diagnostics, outputs: [], inputs: inputsOf(doc), failed, counts: session.counts };
  },

  async build(path, options): Promise<FormatResult> {
    // Refused before any work: reading and checking a long paper only to refuse its output wastes the author's time.
    const refusal = outputRefusal(path, options);
    if (refusal) return { diagnostics: [refusal], outputs: [], inputs: [path], failed: true };
    const { doc, session, diagnostics, failed } = await checkManuscript(path, options);
    // The figures' geometry is computed only now, for the build.
    const notes: Diagnostic[] = [];
    const figures = doc.figures.map((figure, k) => {
      const placed = session.figures[k];
      if (placed === undefined) return undefined;
      const drawn = drawFigure(placed, figure.entry, 'tikz');
      if ('problem' in drawn) notes.push(drawn.problem);
      return 'text' in drawn ? drawn.text : undefined;
    });
    const output =
      options.output !== undefined
        ? { path: options.output, content: flatText(doc, session.fills, figures) }
        : { path: sidecarPath(path), content: sidecarText(doc, session.fills, figures), ownMark: SIDECAR_MARK };
    if (options.output !== undefined && doc.packageLoadedBy && figures.some((f) => f !== undefined) && !doc.tikzLoaded) {
      notes.push({
        severity: 'warning',
        ruleId: 'latex-flat-needs-package',
        message: `the flat copy draws its figures with TikZ, but the manuscript loads skeinproof from ${doc.packageLoadedBy.file}, where the flat copy cannot load tikz in its place: add \\usepackage{tikz} to the manuscript's preamble`,
        location: doc.packageLoadedBy,
      });
    }
    if (options.output !== undefined && doc.packageLoadedBy) {
      notes.push({
        severity: 'warning',
        ruleId: 'latex-flat-needs-package',
        message: `the flat copy still loads ${doc.packageLoadedBy.file}, which loads skeinproof, so it compiles only where skeinproof.sty is found: copy the package beside it, or load skeinproof from the manuscript itself`,
        location: doc.packageLoadedBy,
      });
    }
    const drawFailed = notes.some((d) => d.severity === 'error');
    return { diagnostics: [...diagnostics, ...notes], outputs: [output], inputs: inputsOf(doc), failed: failed || drawFailed };
  },
};

/** An output a LaTeX build cannot write: an HTML page, or a flat copy under a Markdown name. */
function outputRefusal(path: string, options: FormatOptions): Diagnostic | undefined {
  const ext = extname(options.output ?? '').toLowerCase();
  const message =
    options.html || ext === '.html' || ext === '.htm'
      ? `${path} is LaTeX, which has no HTML page: build it without --html (the sidecar, or -o for a flat copy) and run LaTeX`
      : (FORMAT_EXTENSIONS.markdown as readonly string[]).includes(ext)
        ? `${path} is LaTeX, and -o ${options.output} would put a LaTeX flat copy under a Markdown name: give the output a LaTeX name (e.g. -o ${basename(path, extname(path))}.flat.tex)`
        : undefined;
  return message === undefined ? undefined : { severity: 'error', ruleId: 'output-unsupported', message };
}
