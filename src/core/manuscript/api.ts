/**
 * The format-independent pass over one manuscript. A front end (Markdown,
 * LaTeX) finds the diagrams, claims and fill-ins in its own syntax, hands them
 * here with a way to locate spans of their text in the file, and gets back the
 * diagnostics and the typeset replacement for every fill-in. Implemented in
 * ./session.ts; it holds no format knowledge.
 */
import type { Notation } from '../diagram/model.ts';
import type { Convention } from '../convention/convention.ts';
import type { Diagnostic, SourceLocation, TextSpan } from '../diagnostics/diagnostic.ts';
import type { ClaimKey, FillKey, Typeset } from '../claims/api.ts';
import type { DiagramReport } from '../analyze/report.ts';
import type { ComputeLimits } from '../limits.ts';
import type { ResultStore } from '../cache/store.ts';
import type { InputError } from '../errors.ts';
import type { GridCell, GridRange } from '../claims/khovanov-grid.ts';
import type { LinkDiagram } from '../diagram/model.ts';
import type { FigureOptions } from '../drawing/index.ts';
import type { FigureSetting } from './figure-settings.ts';

/** Maps a span inside an entry's text (or the whole entry, when absent) to the file. */
export type Locator = (span?: TextSpan) => SourceLocation;

export interface DiagramEntry {
  /** Unique in the document; a duplicate is an error at the second one. */
  readonly id: string;
  readonly notation: Notation;
  /** The code as written. */
  readonly code: string;
  readonly strands?: number;
  /** The `part-signs` attribute as written (DT codes: fixes every choice the code leaves open), and where it is. */
  readonly partSigns?: { readonly text: string; readonly locate: Locator };
  /**
   * A free parameter of a family code (`for="n=3..25 step 2"`), as written, with its place: the diagram
   * is built at each value, and claims about it are formulas in the parameter, checked at each value.
   */
  readonly parameter?: { readonly text: string; readonly locate: Locator };
  /** Locates spans of `code`. */
  readonly locateCode: Locator;
  /** Locates the entry's header (where the id is written), for duplicate-id errors. */
  readonly locateHeader: Locator;
  /** True when the author gave no id (a code written in place, e.g. in a table row): `id` is made up and never suggested. */
  readonly unnamed?: boolean;
}

export interface ClaimEntry {
  /** The id of the diagram the claim is about. */
  readonly target: string;
  readonly key: ClaimKey;
  /** The value as the author wrote it (LaTeX math for polynomials). */
  readonly text: string;
  /** Locates spans of `text`. */
  readonly locate: Locator;
  /** For table cells: "row R, column C" naming, used in messages. */
  readonly context?: string;
  /**
   * True for a table cell: where the column's key does not apply to the row's diagram (a linking number of a
   * knot), a not-applicable mark (`—`, `n/a`, …) agrees instead of being an error.
   */
  readonly cell?: boolean;
  /** A cell of a Khovanov grid: a missing or invalid diagram is reported once at the grid, not at each cell. */
  readonly inGrid?: boolean;
}

export interface FillEntry {
  readonly target: string;
  readonly key: FillKey;
  readonly locate: Locator;
  readonly context?: string;
  /**
   * True for an empty table cell: it is typeset compactly (a crossing-number range as `6–8`), and where the
   * column's key does not apply to the row's diagram it stays empty (an empty text) instead of being an error.
   */
  readonly cell?: boolean;
  /**
   * An empty cell of a Khovanov grid (`key` is `khovanov`): filled with the group at this bidegree, and a missing
   * or invalid diagram is reported once at the grid, not at each cell.
   */
  readonly khovanovCell?: GridCell;
}

/**
 * A grid of Khovanov homology (its cells are claims and fill-ins of their own): the degrees it prints, so that a
 * nonzero group it leaves out is reported at the grid.
 */
export interface KhovanovGridEntry {
  readonly target: string;
  readonly range: GridRange;
  /** Locates the grid, where an omission or a missing diagram is reported. */
  readonly locate: Locator;
  /** Names the grid in messages, e.g. "skein grid 2 (trefoil)". */
  readonly context: string;
}

/** A figure of a named diagram, drawn from its code where the manuscript places it. */
export interface FigureEntry {
  readonly target: string;
  /** The figure's settings as written (size, line-width, …), each with its place. */
  readonly settings: readonly FigureSetting[];
  /** The markup's name in messages (`::drawing`, `\skeindrawing`). */
  readonly markup: string;
  /** The figure's title as the author wrote it (the Markdown label), if any. */
  readonly title?: string;
  readonly locate: Locator;
}

/**
 * What a front end needs to draw a figure when it builds: the diagram and the options read from the
 * settings. The geometry itself is computed only then (`drawDiagram`), never by a check.
 */
export interface PlacedFigure {
  readonly diagram: LinkDiagram;
  readonly options: FigureOptions;
  /** For the picture's title and description (accessibility, the TikZ comment). */
  readonly title: string;
  readonly description: string;
}

export interface SessionInput {
  readonly diagrams: readonly DiagramEntry[];
  readonly claims: readonly ClaimEntry[];
  readonly fills: readonly FillEntry[];
  readonly khovanovGrids?: readonly KhovanovGridEntry[];
  /** Figures placed in the manuscript (none when absent). */
  readonly figures?: readonly FigureEntry[];
  readonly convention: Convention;
  /** Warnings count as failures. */
  readonly strict?: boolean;
  /**
   * Ids of diagrams the front end refused before their code was read (bad markup), with the place of
   * the refusal: a reference to one is not a second mistake, so it gets a note pointing there.
   */
  readonly refused?: ReadonlyMap<string, SourceLocation>;
  /** Limits on each diagram's size, memory and time (none when absent); a diagram over one is reported and skipped. */
  readonly limits?: ComputeLimits;
  /** Where computed values are kept between runs (none when absent): see src/core/cache/store.ts. */
  readonly resultStore?: ResultStore;
  /**
   * Diagrams the front end tried to compute elsewhere and could not (the worker thread computing one
   * died), with the error that says so: each is reported at its code like a code over a limit, and not
   * computed again here.
   */
  readonly uncomputed?: ReadonlyMap<string, InputError>;
  /**
   * Diagrams read by earlier sessions of the same front end (`watch`: one per save), by what their
   * reading depends on: a code read before is not read again, and its diagram keeps every value already
   * computed for it. The session adds what it reads. Family codes, which may name other diagrams, are
   * always read afresh.
   */
  readonly readBefore?: ReadDiagrams;
  /**
   * Where the manuscript starts: a manuscript with no diagram, claim or fill-in gets a `manuscript-unmarked`
   * warning there, unless `markupFound` says the front end met skeinproof markup it refused.
   */
  readonly documentStart?: SourceLocation;
  readonly markupFound?: boolean;
}

/** What a session checked, for the line a passing run prints instead of a bare "no problems found". */
export interface SessionCounts {
  /** Diagrams whose code was read and analysed. */
  readonly diagrams: number;
  readonly claimsAgree: number;
  readonly claimsContradicted: number;
  readonly claimsUndecided: number;
  /** Values typeset into the document (fill-ins and empty cells). */
  readonly valuesFilled: number;
  /** Of the claims and values above, those in table cells. */
  readonly tableCells: number;
  /** Table cells whose key does not apply to the row's diagram, left empty or marked so. */
  readonly notApplicable: number;
  /** Figures whose diagram and settings were read without fault (a build draws them). */
  readonly figures: number;
}

export interface SessionResult {
  readonly diagnostics: readonly Diagnostic[];
  /** The typeset value for each fill-in, in the order given (undefined where it could not be computed). */
  readonly fills: readonly (Typeset | undefined)[];
  /** For each figure entry, in the order given, what to draw (undefined where its diagram or settings are at fault). */
  readonly figures: readonly (PlacedFigure | undefined)[];
  /** The analysed diagrams by id (invalid codes are absent). */
  readonly reports: ReadonlyMap<string, DiagramReport>;
  /** True when an error (or, under strict, a warning) was reported. */
  readonly failed: boolean;
  readonly counts: SessionCounts;
}

/**
 * Lets a front end compute the diagrams' values elsewhere (worker threads, an earlier run kept in memory)
 * before the session reads them. It gets the session's input and returns what to add to it: a store that
 * serves the values it computed, the diagrams it could not compute, and the diagrams read by earlier sessions. The session itself stays
 * synchronous and pure; the front end awaits this hook, then calls `runSession` with the additions.
 */
export type PrecomputeHook = (input: SessionInput) => Promise<Pick<SessionInput, 'resultStore' | 'uncomputed' | 'readBefore'>>;

/** Diagrams by what their reading depends on (see `SessionInput.readBefore`); a front end decides how long it keeps them. */
export interface ReadDiagrams {
  get(key: string): LinkDiagram | undefined;
  set(key: string, diagram: LinkDiagram): void;
}
