/**
 * runSession: the format-independent pass over one manuscript (contract in
 * ./api.ts). Markdown and LaTeX front ends both call it:
 *
 * 1. every diagram is parsed once (its invariants are computed when first
 *    needed); a duplicate id is an error at the second header, a bad code an
 *    error inside the code;
 * 2. every claim is judged against its diagram's report (unknown targets and
 *    unreadable values are located errors);
 * 3. every fill-in is typeset in the document's convention, and every figure's settings are read and its
 *    diagram handed back for the build to draw (./figure-entries.ts);
 * 4. what was checked is counted, and a manuscript without any markup gets a warning.
 *
 * It only sees entries, locators and a convention, never a file format, and
 * reports everything it finds in one pass, in document order.
 */
import { analyzeDiagram } from '../analyze/analyze.ts';
import type { DiagramReport } from '../analyze/report.ts';
import {
  CLAIM_NOUNS,
  choiceConflictDiagnostic,
  inapplicableBecause,
  invalidCodeDiagnostic,
  isFillKey,
  isNotApplicableMark,
  judgeClaim,
  judgementToDiagnostics,
  typesetValue,
  unreadableClaimDiagnostic,
} from '../claims/index.ts';
import { judgeDiagramClaims, type DiagramVerdicts } from '../claims/open-choices.ts';
import type { Judgement, Typeset } from '../claims/api.ts';
import type { LinkDiagram } from '../diagram/model.ts';
import type { Convention } from '../convention/convention.ts';
import type { Diagnostic, SourceLocation } from '../diagnostics/diagnostic.ts';
import { isInputError, type InputError } from '../errors.ts';
import { isLimitError } from '../limits.ts';
import { parseDiagramCode, readPartSigns, type ParseOptions } from '../notation/index.ts';
import { gridCellFill, gridOmissionDiagnostic } from '../claims/khovanov-grid.ts';
import { buildParametric, judgeParametricClaim, parametricFill } from './parametric-entries.ts';
import type { ParametricDiagram } from '../parametric/parametric.ts';
import { placeFigure } from './figure-entries.ts';
import type { ClaimEntry, DiagramEntry, Locator, PlacedFigure, ReadDiagrams, SessionCounts, SessionInput, SessionResult } from './api.ts';

export function runSession(input: SessionInput): SessionResult {
  const diagnostics: Diagnostic[] = [];
  const reports = new Map<string, DiagramReport>();
  /** Ids whose code is invalid: claims about them are not judged (the code's error says why). */
  const invalid = new Map<string, DiagramEntry>();
  const firstHeader = new Map<string, SourceLocation>();
  /** Ids of valid codes that were not computed because they are over a limit. */
  const overLimit = new Set<string>();
  /** Family codes with a free parameter, built at each of its values. */
  const parametric = new Map<string, ParametricDiagram>();

  for (const entry of input.diagrams) {
    const header = entry.locateHeader();
    const earlier = firstHeader.get(entry.id);
    if (earlier) {
      diagnostics.push({
        severity: 'error',
        ruleId: 'id-duplicate',
        message: `diagram id \`${entry.id}\` is already used at ${place(earlier)}; every diagram needs its own id, so rename this one`,
        location: header,
      });
      continue;
    }
    firstHeader.set(entry.id, header);
    if (entry.parameter) {
      const refusal = buildParametric(entry, reports, input.limits ?? {}, parametric, input.resultStore);
      if (refusal) {
        invalid.set(entry.id, entry);
        diagnostics.push(refusal);
      }
      continue;
    }
    try {
      const uncomputed = input.uncomputed?.get(entry.id);
      if (uncomputed) throw uncomputed;
      // A family may name diagrams defined before it (mirror, sum, split).
      const named = (id: string) => reports.get(id)?.diagram;
      const limits = input.limits ?? {};
      const partSigns = entry.partSigns ? readPartSigns(entry.partSigns.text) : undefined;
      const parseOptions = {
        named,
        ...(entry.strands !== undefined ? { strands: entry.strands } : {}),
        ...(limits.maxCrossings !== undefined ? { maxCrossings: limits.maxCrossings } : {}),
        ...(partSigns ? { partSigns } : {}),
      };
      reports.set(entry.id, analyzeDiagram(readCode(entry, parseOptions, input.readBefore), limits, input.resultStore));
    } catch (e) {
      if (!isInputError(e)) throw e;
      invalid.set(entry.id, entry);
      if (isLimitError(e)) overLimit.add(entry.id);
      // A part-signs problem is located in the attribute, anything else in the code.
      const locate = e.ruleId === 'choice-invalid' && entry.partSigns ? entry.partSigns.locate : entry.locateCode;
      diagnostics.push(invalidCodeDiagnostic(e, locate, entry.id));
    }
  }

  const knownIds = [...new Set(input.diagrams.filter((d) => d.unnamed !== true).map((d) => d.id))];
  // A table row naming a missing diagram is one mistake, not one per column: one error per unknown id per
  // line among table cells (entries with a context). Each reference in prose is its own error, even on one line.
  const reportedUnknown = new Set<string>();
  /** `subject` names the claim or fill-in ("the Jones polynomial claimed for `k`", or a table cell). */
  const unknownTarget = (target: string, locate: Locator, subject: string, inTable: boolean): Diagnostic[] => {
    const location = locate();
    const key = `${target}\u0000${location.file}\u0000${location.start.line}${inTable ? '' : `:${location.start.column}`}`;
    if (reportedUnknown.has(key)) return [];
    reportedUnknown.add(key);
    const message = `${subject}: no diagram has the id \`${target}\``;
    return [{ severity: 'error', ruleId: 'target-unknown', message, location, hints: hintsForUnknown(target, knownIds), data: { target } }];
  };
  const skippedBecauseInvalid = (target: string, locate: Locator, subject: string, verb: string): Diagnostic => ({
    severity: 'note',
    ruleId: 'target-invalid',
    message: `${subject} is not ${verb}: ${overLimit.has(target) ? `\`${target}\` is over a limit and was not computed` : `the code of \`${target}\` is invalid`} (${place(invalid.get(target)!.locateCode())})`,
    location: locate(),
  });
  const skippedBecauseRefused = (target: string, at: SourceLocation, locate: Locator, subject: string, verb: string): Diagnostic => ({
    severity: 'note',
    ruleId: 'target-invalid',
    message: `${subject} is not ${verb}: the diagram \`${target}\` was refused (${place(at)})`,
    location: locate(),
  });
  const missing = (target: string, locate: Locator, subject: string, verb: string, inTable: boolean): Diagnostic[] => {
    if (invalid.has(target)) return [skippedBecauseInvalid(target, locate, subject, verb)];
    const refusedAt = input.refused?.get(target);
    return refusedAt ? [skippedBecauseRefused(target, refusedAt, locate, subject, verb)] : unknownTarget(target, locate, subject, inTable);
  };

  /**
   * Invariants are computed on first use, so a diagram can turn out too large for an engine only when a
   * claim or fill-in asks for it. That is the code's problem, reported once at the code like an invalid
   * one; the claims and fill-ins of that diagram then get the same note as those of an invalid code.
   */
  const diagramLevel = (e: InputError, target: string): void => {
    const entry = input.diagrams.find((d) => d.id === target)!;
    reports.delete(target);
    invalid.set(target, entry);
    if (isLimitError(e)) overLimit.add(target);
    diagnostics.push(invalidCodeDiagnostic(e, entry.locateCode, target));
  };
  const isDiagramLevel = (e: InputError): boolean => !e.ruleId.startsWith('claim-');

  const counts: { -readonly [K in keyof SessionCounts]: number } = { diagrams: 0, claimsAgree: 0, claimsContradicted: 0, claimsUndecided: 0, valuesFilled: 0, tableCells: 0, notApplicable: 0, figures: 0 };
  // Cells that hold no value (a not-applicable mark, or a key that does not apply) are settled first.
  const settled = new Set<ClaimEntry>();
  for (const claim of input.claims) {
    const report = reports.get(claim.target);
    if (!report || !claim.cell) continue;
    const subject = claim.context ?? `the ${CLAIM_NOUNS[claim.key]} claimed for \`${claim.target}\``;
    const cellProblem = notApplicableCell(claim, report, subject, input);
    if (cellProblem === 'not-applicable') counts.notApplicable++;
    else if (cellProblem) {
      diagnostics.push(cellProblem);
      if (cellProblem.ruleId === 'claim-contradicted') counts.claimsContradicted++;
    }
    if (cellProblem) settled.add(claim);
  }
  const toJudge = input.claims.filter((c) => !settled.has(c));
  // The claims of each diagram are judged together: a DT code's open choices are made once per document.
  const verdicts = new Map<string, DiagramVerdicts>();
  for (const [target, claims] of groupBy(toJudge, (c) => c.target)) {
    const report = reports.get(target);
    if (!report) continue;
    try {
      const v = judgeDiagramClaims(report, claims, { convention: input.convention, others: reports, selfId: target });
      const computeError = v.outcomes.find((o) => o.kind === 'unreadable' && isDiagramLevel(o.error));
      if (computeError?.kind === 'unreadable') throw computeError.error;
      verdicts.set(target, v);
      reports.set(target, v.report);
    } catch (e) {
      if (!isInputError(e) || !isDiagramLevel(e)) throw e;
      diagramLevel(e, target);
    }
  }
  const judged: JudgedClaim[] = [];
  const claimIndex = new Map<string, number>();
  for (const claim of toJudge) {
    const subject = claim.context ?? `the ${CLAIM_NOUNS[claim.key]} claimed for \`${claim.target}\``;
    const family = parametric.get(claim.target);
    if (family && claim.inGrid) continue; // the grid says once that it needs a diagram without a parameter
    if (family) {
      const { diagnostics: found, verdict } = judgeParametricClaim(claim, family, subject, input.convention);
      diagnostics.push(...found);
      if (verdict === 'agrees') counts.claimsAgree++;
      else if (verdict === 'contradicts') counts.claimsContradicted++;
      else if (verdict !== undefined) counts.claimsUndecided++;
      continue;
    }
    const v = verdicts.get(claim.target);
    if (!v) {
      if (!claim.inGrid) diagnostics.push(...missing(claim.target, claim.locate, subject, 'checked', claim.context !== undefined));
      continue;
    }
    const k = claimIndex.get(claim.target) ?? 0;
    claimIndex.set(claim.target, k + 1);
    const outcome = v.outcomes[k]!;
    if (outcome.kind === 'unreadable') diagnostics.push(unreadableClaimDiagnostic(outcome.error, claim.locate, subject));
    else if (outcome.kind === 'judged') judged.push({ claim, judgement: outcome.judgement });
    else {
      const other = toJudge.filter((c) => c.target === claim.target)[outcome.other]!;
      diagnostics.push(choiceConflictDiagnostic(outcome, subject, { key: other.key, place: place(other.locate()) }, `\`${claim.target}\``, claim.locate()));
      counts.claimsContradicted++;
    }
  }

  for (const { claim, judgement } of withCellSwaps(judged, reports, input.convention)) {
    diagnostics.push(...judgementToDiagnostics(judgement, claim.locate(), claim.context));
    if (judgement.verdict === 'agrees') counts.claimsAgree++;
    else if (judgement.verdict === 'contradicts') counts.claimsContradicted++;
    else counts.claimsUndecided++;
    if (claim.cell) counts.tableCells++;
  }

  for (const grid of input.khovanovGrids ?? []) {
    if (parametric.has(grid.target)) {
      diagnostics.push({
        severity: 'error',
        ruleId: 'claim-unreadable',
        message: `${grid.context}: \`${grid.target}\` has a free parameter, and a grid shows the homology of one diagram: give the grid a diagram without \`for\``,
        location: grid.locate(),
      });
      continue;
    }
    const report = reports.get(grid.target);
    if (!report) {
      diagnostics.push(...missing(grid.target, grid.locate, grid.context, 'checked', false));
      continue;
    }
    try {
      const omission = gridOmissionDiagnostic(report, grid.range, input.convention, grid.context, grid.locate());
      if (omission) diagnostics.push(omission);
      if (omission) counts.claimsContradicted++;
      else counts.claimsAgree++;
    } catch (e) {
      if (!isInputError(e) || !isDiagramLevel(e)) throw e;
      diagramLevel(e, grid.target);
      diagnostics.push(...missing(grid.target, grid.locate, grid.context, 'checked', false));
    }
  }

  const fills: (Typeset | undefined)[] = input.fills.map((fill) => {
    const subject = fill.context ?? `the ${fill.key} fill-in for \`${fill.target}\``;
    const family = parametric.get(fill.target);
    if (family) {
      if (!fill.khovanovCell) diagnostics.push(parametricFill(fill.target, family, subject, fill.locate));
      return undefined;
    }
    const report = reports.get(fill.target);
    if (!report) {
      if (!fill.khovanovCell) diagnostics.push(...missing(fill.target, fill.locate, subject, 'filled in', fill.context !== undefined));
      return undefined;
    }
    if (fill.cell && inapplicableBecause(fill.key, report) !== undefined) {
      counts.notApplicable++;
      return { kind: 'text', text: '' };
    }
    try {
      const value = fill.khovanovCell
        ? gridCellFill(report, fill.khovanovCell, input.convention)
        : typesetValue(fill.key, report, input.convention, { compact: fill.cell === true });
      counts.valuesFilled++;
      if (fill.cell) counts.tableCells++;
      return value;
    } catch (e) {
      if (!isInputError(e)) throw e;
      if (isDiagramLevel(e)) {
        diagramLevel(e, fill.target);
        if (!fill.khovanovCell) diagnostics.push(...missing(fill.target, fill.locate, subject, 'filled in', fill.context !== undefined));
      } else diagnostics.push(unreadableClaimDiagnostic(e, fill.locate, subject));
      return undefined;
    }
  });

  const figureContext = {
    reports,
    diagrams: input.diagrams,
    parametric: new Set(parametric.keys()),
    missing: (target: string, locate: Locator, subject: string) => missing(target, locate, subject, 'drawn', false),
  };
  const figures: (PlacedFigure | undefined)[] = (input.figures ?? []).map((entry) => placeFigure(entry, figureContext, diagnostics));
  counts.figures = figures.filter((placed) => placed !== undefined).length;

  const unmarked = input.diagrams.length + input.claims.length + input.fills.length + (input.figures?.length ?? 0) === 0 && !input.markupFound && (input.refused?.size ?? 0) === 0;
  if (unmarked) {
    diagnostics.push({
      severity: 'warning',
      ruleId: 'manuscript-unmarked',
      message: 'this manuscript has no skeinproof markup, so nothing in it was checked',
      ...(input.documentStart ? { location: input.documentStart } : {}),
      hints: ['Mark each diagram (a `skein` block in Markdown, a `skeincode` environment in LaTeX) and state values as claims or fill-ins; see the README.'],
    });
  }

  const ordered = diagnostics.map((d, i) => ({ d, i })).sort((a, b) => compareLocations(a.d.location, b.d.location) || a.i - b.i).map((x) => x.d);
  const failed = ordered.some((d) => d.severity === 'error' || (input.strict === true && d.severity === 'warning'));
  // Diagrams an engine refused on first use are no longer among the reports; a family code with a free parameter is one diagram.
  counts.diagrams = reports.size + parametric.size;
  return { diagnostics: ordered, fills, figures, reports, failed, counts };
}

/** The entry's diagram, read once per `readBefore` (a family code, which may name other diagrams, is read every time). */
function readCode(entry: DiagramEntry, options: ParseOptions, readBefore: ReadDiagrams | undefined): LinkDiagram {
  if (!readBefore || entry.notation === 'family') return parseDiagramCode(entry.code, entry.notation, options);
  const key = JSON.stringify([entry.notation, entry.code, options.strands ?? null, entry.partSigns?.text ?? null, options.maxCrossings ?? null]);
  let diagram = readBefore.get(key);
  if (!diagram) readBefore.set(key, (diagram = parseDiagramCode(entry.code, entry.notation, options)));
  return diagram;
}

/**
 * A table cell whose key does not apply to its row's diagram may hold a not-applicable mark ('not-applicable');
 * a value there is `claim-inapplicable`, and a mark where the key does apply states something false.
 * Undefined when the cell is an ordinary claim.
 */
function notApplicableCell(claim: ClaimEntry, report: DiagramReport, subject: string, input: SessionInput): Diagnostic | 'not-applicable' | undefined {
  const why = inapplicableBecause(claim.key, report);
  const marked = isNotApplicableMark(claim.text);
  const noun = CLAIM_NOUNS[claim.key];
  if (why !== undefined) {
    if (marked) return 'not-applicable';
    return {
      severity: 'error',
      ruleId: 'claim-inapplicable',
      message: `${subject}: ${why}, so this cell holds no value`,
      location: claim.locate(),
      hints: ['Leave the cell empty, or write a not-applicable mark such as — or n/a.'],
    };
  }
  if (!marked) return undefined;
  let computed: Typeset | undefined;
  try {
    computed = isFillKey(claim.key) ? typesetValue(claim.key, report, input.convention, { compact: true }) : undefined;
  } catch (e) {
    if (!isInputError(e)) throw e; // a diagram too large for an engine: the message goes without the value
  }
  return {
    severity: 'error',
    ruleId: 'claim-contradicted',
    message: `${subject}: the cell marks the ${noun} as not applicable, but \`${claim.target}\` has one`,
    location: claim.locate(),
    claimed: claim.text.trim(),
    ...(computed ? { computed: computed.kind === 'math' ? computed.latex : computed.text } : {}),
    hints: [isFillKey(claim.key) ? 'Leave the cell empty to have the value filled in, or write the value.' : 'Write the value to have it checked.'],
  };
}

interface JudgedClaim {
  readonly claim: ClaimEntry;
  readonly judgement: Judgement;
}

/**
 * Two table cells under one key, each contradicted and each holding the other's diagram's value, are
 * an exchange: named `swapped` on both (the evidence a lone equal integer is not).
 */
function withCellSwaps(judged: readonly JudgedClaim[], reports: ReadonlyMap<string, DiagramReport>, convention: Convention): JudgedClaim[] {
  const agreesFor = (claim: ClaimEntry, target: string): boolean => {
    try {
      return judgeClaim(claim.key, claim.text, reports.get(target)!, { convention }).verdict === 'agrees';
    } catch (e) {
      if (isInputError(e)) return false;
      throw e;
    }
  };
  const open = (j: JudgedClaim): boolean =>
    j.claim.context !== undefined && j.judgement.verdict === 'contradicts' && (j.judgement.diagnosis === undefined || j.judgement.diagnosis.kind === 'none');
  const result = [...judged];
  for (let a = 0; a < result.length; a++) {
    if (!open(result[a]!)) continue;
    for (let b = a + 1; b < result.length; b++) {
      const [x, y] = [result[a]!, result[b]!];
      if (!open(y) || y.claim.key !== x.claim.key || y.claim.target === x.claim.target) continue;
      if (!reports.has(x.claim.target) || !reports.has(y.claim.target)) continue;
      if (!agreesFor(x.claim, y.claim.target) || !agreesFor(y.claim, x.claim.target)) continue;
      result[a] = { claim: x.claim, judgement: swappedWithCell(x.judgement, y.claim.target) };
      result[b] = { claim: y.claim, judgement: swappedWithCell(y.judgement, x.claim.target) };
      break;
    }
  }
  return result;
}

function swappedWithCell(j: Judgement, otherDiagram: string): Judgement {
  const noun = CLAIM_NOUNS[j.key];
  const detail = `the claim is the ${noun} of diagram \`${otherDiagram}\`, whose cell under the same key holds this diagram's value: the two cells are exchanged`;
  // A `none` diagnosis ends the reason with its own sentence, which the swap replaces.
  const unexplained = j.diagnosis?.kind === 'none' ? `; ${j.diagnosis.detail}` : undefined;
  const reason = unexplained && j.reason.endsWith(unexplained) ? `${j.reason.slice(0, -unexplained.length)}; ${detail}` : `${j.reason}: ${detail}`;
  return { ...j, diagnosis: { kind: 'swapped', otherDiagram, detail }, reason };
}

function groupBy<T>(items: readonly T[], keyOf: (item: T) => string): Map<string, T[]> {
  const groups = new Map<string, T[]>();
  for (const item of items) {
    const key = keyOf(item);
    const group = groups.get(key);
    if (group) group.push(item);
    else groups.set(key, [item]);
  }
  return groups;
}

function place(loc: SourceLocation): string {
  return `${loc.file}:${loc.start.line}:${loc.start.column}`;
}

function compareLocations(a: SourceLocation | undefined, b: SourceLocation | undefined): number {
  if (!a || !b) return a ? -1 : b ? 1 : 0;
  if (a.file !== b.file) return a.file < b.file ? -1 : 1;
  return a.start.line - b.start.line || a.start.column - b.start.column;
}

/** Suggests the closest known id (edit distance at most 2), then lists the ids. */
function hintsForUnknown(target: string, known: readonly string[]): string[] {
  if (known.length === 0) return ['The document defines no named diagram yet: add a `skein` block (Markdown) or a `skeincode` environment (LaTeX) with this id.'];
  const close = known
    .map((id) => ({ id, d: editDistance(id.toLowerCase(), target.toLowerCase()) }))
    // Two edits turn any two-letter id into any other: only suggest ids closer than that.
    .filter((x) => x.d <= 2 && x.d < Math.min(x.id.length, target.length))
    .sort((a, b) => a.d - b.d)[0];
  const hints = close ? [`Did you mean \`${close.id}\`?`] : [];
  hints.push(`The diagram ids are: ${known.slice(0, 20).join(', ')}${known.length > 20 ? ', …' : ''}.`);
  return hints;
}

/**
 * The edit distance of a and b when it is at most 2, else 3: only near ids are
 * suggested, so a band of width 2 around the diagonal suffices and the cost
 * stays linear in the length (an unknown id may be a whole pasted paragraph).
 */
function editDistance(a: string, b: string): number {
  const LIMIT = 3;
  if (Math.abs(a.length - b.length) >= LIMIT) return LIMIT;
  let prev = new Map<number, number>();
  for (let j = 0; j < LIMIT && j <= b.length; j++) prev.set(j, j);
  for (let i = 1; i <= a.length; i++) {
    const cur = new Map<number, number>();
    let best = LIMIT;
    for (let j = Math.max(0, i - LIMIT + 1); j <= Math.min(b.length, i + LIMIT - 1); j++) {
      const value =
        j === 0
          ? i
          : Math.min((prev.get(j) ?? LIMIT) + 1, (cur.get(j - 1) ?? LIMIT) + 1, (prev.get(j - 1) ?? LIMIT) + (a[i - 1] === b[j - 1] ? 0 : 1));
      cur.set(j, Math.min(value, LIMIT));
      best = Math.min(best, value);
    }
    if (best >= LIMIT) return LIMIT;
    prev = cur;
  }
  return Math.min(prev.get(b.length) ?? LIMIT, LIMIT);
}
