/**
 * `skeinproof compute CODE…`: parse each diagram code, analyse it once, and
 * print a summary (or one JSON object per code with --json). Invalid codes
 * are reported on stderr and do not stop the others; the exit status is 2
 * when any code was invalid.
 *
 * The per-code pipeline (`computeCode`) and the renderers are exported so
 * options such as claims can hook into the same steps.
 */
import type { Argv } from 'yargs';
import { analyzeDiagram } from '../../core/analyze/analyze.ts';
import type { DiagramReport, LinkingNumber } from '../../core/analyze/report.ts';
import type { LinkDiagram, Notation } from '../../core/diagram/model.ts';
import { isInputError, type InputError } from '../../core/errors.ts';
import { isLimitError, type ComputeLimits, type LimitError } from '../../core/limits.ts';
import type { ResultStore } from '../../core/cache/store.ts';
import type { FileResultStore } from '../result-store.ts';
import { cacheOptions, openCache } from '../cache-options.ts';
import { limitOptions, readLimits } from '../limit-options.ts';
import { NOTATIONS, parseDiagramCode, type ParseOptions } from '../../core/notation/index.ts';
import { computeJson, invalidCodeJson, JSON_FIELDS, notComputedErrors, simplifiedCodes } from '../compute-json.ts';
import { DEFAULT_CONVENTION, type Convention } from '../../core/convention/convention.ts';
import { parseConventionText } from '../../core/convention/settings.ts';
import { conventionBracket, conventionJones, jonesLetter } from '../../core/convention/convert.ts';
import { signatureInConvention } from '../../core/invariants/classical/signature.ts';
import type { Diagnostic, SourceLocation, TextSpan } from '../../core/diagnostics/diagnostic.ts';
import {
  CLAIM_NOUNS,
  choiceConflictDiagnostic,
  judgeDiagramClaims,
  judgementToDiagnostics,
  parseClaimAssignment,
  unreadableClaimDiagnostic,
  type ClaimAssignment,
} from '../../core/claims/index.ts';
import { exitStatus, formatDiagnostic, judgementJson, unreadableClaimJson, type JudgementJson, type UnreadableClaimJson } from '../../report/index.ts';
import { toFraction } from '../../core/poly/laurent.ts';
import { arfOf, braidIndexOf, dubrovnikOf, homflyOf, kauffmanOf } from '../../core/invariants/registered/skein-values.ts';
import { homflyValues } from '../../core/claims/skein-polynomial-claims.ts';
import { oddComponentsText, oddLinkingComponents } from '../../core/invariants/arf.ts';
import type { CliCommand } from './index.ts';
import { wantsColor } from '../terminal.ts';
import { conventionOptionText, repeatedOptionMessage } from '../repeated-option.ts';
import { figureOptions, readFigureArgs, runFigure } from '../figure-output.ts';
import { lendHelperThreads } from '../replay-helper.ts';
import { jobsOption, readJobs } from '../jobs-option.ts';

export const DEFAULT_NOTATION: Notation = 'pd';

// The exit statuses of main.ts (not imported from there: main.ts imports the command list).
const EXIT_ALL_VALID = 0;
const EXIT_INVALID_INPUT = 2;

export type CodeOutcome =
  | { readonly ok: true; readonly code: string; readonly notation: Notation; readonly report: DiagramReport }
  | { readonly ok: false; readonly code: string; readonly notation: Notation; readonly error: InputError };

/** Parses and analyses one code; bad input comes back as an outcome, anything else thrown is a bug. */
export function computeCode(code: string, notation: Notation, options: ParseOptions = {}, limits: ComputeLimits = {}, bracketFirst = true, store?: ResultStore): CodeOutcome {
  try {
    const maxCrossings = limits.maxCrossings !== undefined ? { maxCrossings: limits.maxCrossings } : {};
    const diagram = parseDiagramCode(code, notation, { ...options, ...maxCrossings });
    const report = analyzeDiagram(diagram, limits, store);
    // Every summary shows the bracket, and a diagram too wide or too large for it is an input error of the code
    // (JSON computes only its fields, and reports a field it could not compute in `notComputed`).
    if (bracketFirst) void report.bracket;
    return { ok: true, code, notation, report };
  } catch (error) {
    if (isInputError(error)) return { ok: false, code, notation, error };
    throw error;
  }
}

const yesNo = (flag: boolean, yes: string, no: string): string => (flag ? yes : no);
const signed = (k: number): string => (k > 0 ? `+${k}` : `${k}`);
const count = (k: number, noun: string): string => `${k} ${noun}${k === 1 ? '' : 's'}`;
/** A degree as the polynomial line writes its exponents: 5/2, not 2.5. */
const degree = (e: number): string => {
  const [p, q] = toFraction(e);
  return q === 1 ? `${p}` : `${p}/${q}`;
};

/** Up to this many pairs (six components) every linking number is listed; past it only the non-zero ones (JSON keeps all). */
const LINKING_PAIRS_LISTED = 15;

function linkingLine(linking: readonly LinkingNumber[]): string {
  const show = (l: LinkingNumber): string => `lk(${l.components[0]},${l.components[1]}) = ${signed(l.value)}`;
  if (linking.length <= LINKING_PAIRS_LISTED) return linking.map(show).join(', ');
  const nonZero = linking.filter((l) => l.value !== 0);
  const zeros = linking.length - nonZero.length;
  if (nonZero.length === 0) return `lk = 0 for all ${linking.length} pairs of components`;
  return `${nonZero.map(show).join(', ')}${zeros > 0 ? `; lk = 0 for the other ${zeros} pair${zeros === 1 ? '' : 's'}` : ''}`;
}

/** The largest diagram whose plain summary includes the classical invariants. */
export const PLAIN_CLASSICAL_LIMIT = 400;

/** The limit the classical invariants ran into, or undefined when they were computed. */
export function classicalLimit(r: DiagramReport): LimitError | undefined {
  try {
    void r.classical;
    return undefined;
  } catch (error) {
    if (isLimitError(error)) return error;
    throw error;
  }
}

/** The smaller diagram the moves reached, in every notation that can write it, so the author can use it instead. */
function simplifiedLines(d: LinkDiagram): string[] {
  const codes = simplifiedCodes(d);
  return [`  simplified to ${count(d.crossings.length, 'crossing')}:`, ...Object.entries(codes).map(([notation, code]) => `    ${notation.padEnd(6)} ${code}`)];
}

/** Δ, ∇, det and σ (in the declared sign, which the line names), and the genus bounds. */
function classicalLines(r: DiagramReport, convention: Convention): string[] {
  // Δ costs about n³ (seconds at 300 crossings, half a minute at 1000) while the bracket of a thin
  // diagram takes milliseconds: a large summary should not wait for what the user did not ask for.
  if (r.crossings > PLAIN_CLASSICAL_LIMIT) {
    return [`  classical not shown above ${PLAIN_CLASSICAL_LIMIT} crossings (Δ takes about n³ time); --json or a --claim about them computes Δ, ∇, det and σ`];
  }
  const limit = classicalLimit(r);
  if (limit) return [`  classical not computed: ${limit.message}`];
  const c = r.classical;
  const sigma = signatureInConvention(c.signature, convention.signatureSign);
  const sign = `sign convention: positive trefoil ${convention.signatureSign === 'negative' ? '-2' : '+2'}`;
  const lines = [
    `  Alexander Δ(t) = ${c.alexander.toPlainString('t')}  (Conway normalisation${c.split ? '; 0 for a split link' : ''})`,
    `  Conway   ∇(z) = ${c.conway.toPlainString('z')}`,
    `  det      ${c.determinant}, signature ${signed(sigma)}  (${sign})`,
  ];
  if (!c.split) {
    const lower = Math.max(...c.genusBounds.filter((b) => b.bound === 'lower').map((b) => b.value));
    const upper = c.genusBounds.find((b) => b.bound === 'upper')!.value;
    const value = lower === upper ? `${upper}` : `between ${lower} and ${upper}`;
    const surface = r.components === 1 ? '' : ' (connected Seifert surfaces)';
    lines.push(`  genus    ${value}${surface}: span Δ and |σ| give at least ${lower}, Seifert's algorithm on this diagram a surface of genus ${upper}`);
  }
  return lines;
}

/**
 * The largest diagrams whose plain summary shows P and the braid index, and F: unasked, they should cost a
 * fraction of a second (F has about n² terms against P's n; at 20 crossings F takes up to about 0.3 s, at 40
 * crossings P up to about 0.07 s, on the shared 2-core machine under load).
 */
export const PLAIN_HOMFLY_LIMIT = 40;
export const PLAIN_KAUFFMAN_LIMIT = 20;

/** `show()`, or the reason a limit gave for not computing it: what the summary shows unasked never fails the run. */
function unlessRefused(what: string, show: () => string): string {
  try {
    return show();
  } catch (error) {
    if (isInputError(error) && error.ruleId === 'limit-exceeded') return `  ${what} not computed: ${error.message}`;
    throw error;
  }
}

/** P, F (or the Dubrovnik polynomial) in the declared variables, the braid index and the Arf invariant. */
function skeinLines(r: DiagramReport, convention: Convention): string[] {
  const lines: string[] = [];
  if (r.crossings <= PLAIN_HOMFLY_LIMIT) {
    lines.push(
      unlessRefused('HOMFLY-PT', () => {
        const { declared, letters } = homflyValues(homflyOf(r), convention);
        const relation = convention.homflyVariables === 'vz' ? 'v^-1 P+ - v P- = z P0' : 'a P+ - a^-1 P- = z P0';
        return `  HOMFLY-PT P(${letters.join(',')}) = ${declared.toPlainString(letters[0], letters[1])}  (${relation})`;
      }),
    );
  }
  if (r.crossings <= PLAIN_KAUFFMAN_LIMIT) {
    const dubrovnik = convention.kauffmanVariant === 'dubrovnik';
    const name = dubrovnik ? 'Dubrovnik' : 'Kauffman';
    lines.push(unlessRefused(name, () => `  ${name} ${dubrovnik ? 'Y' : 'F'}(a,z) = ${(dubrovnik ? dubrovnikOf(r) : kauffmanOf(r)).toPlainString('a', 'z')}`));
  }
  if (r.crossings <= PLAIN_HOMFLY_LIMIT) {
    lines.push(
      unlessRefused('braid index', () => {
        const b = braidIndexOf(r);
        const value = b.exact !== null ? `exactly ${b.exact}` : `between ${b.lower} and ${b.upper}`;
        return `  braid index ${value} (at least ${b.lower} by Morton–Franks–Williams, at most ${b.upper} Seifert circles by Yamada)`;
      }),
    );
  } else {
    lines.push(`  HOMFLY-PT, Kauffman polynomial and braid index not shown above ${PLAIN_HOMFLY_LIMIT} crossings; --json or a --claim computes them`);
  }
  if (r.crossings <= PLAIN_CLASSICAL_LIMIT) {
    lines.push(
      unlessRefused('Arf invariant', () => {
        const arf = arfOf(r);
        if (arf.value !== null) return `  Arf      ${arf.value}`;
        return `  Arf      not defined, the link is not proper: ${oddComponentsText(oddLinkingComponents(r.linking, r.components), 0)}`;
      }),
    );
  }
  return lines;
}

/** The human summary of one analysed code: a heading line and indented facts. */
export function plainSummary(position: number, code: string, r: DiagramReport, convention: Convention = DEFAULT_CONVENTION): string {
  const lines: string[] = [];
  lines.push(`#${position} ${r.notation} ${JSON.stringify(code)}`);
  lines.push(`  ${count(r.crossings, 'crossing')}, ${count(r.components, 'component')}, writhe ${signed(r.writhe)} (${r.positiveCrossings} positive, ${r.negativeCrossings} negative)`);
  if (r.family) lines.push(`  family   ${r.family.description}`);
  lines.push(`  Jones    V(t) = ${r.jones.toPlainString('t')}`);
  lines.push(`           span ${r.span}, degrees ${degree(r.jonesMinDegree)} to ${degree(r.jonesMaxDegree)}`);
  lines.push(`  bracket  <D> = ${r.bracket.toPlainString('A')}`);
  lines.push(`           span ${r.bracketSpan}, degrees ${r.bracketMinDegree} to ${r.bracketMaxDegree}  (unit normalisation <O> = 1)`);
  // The summary keeps the reference variables above; a declared convention gets its own lines too.
  const orderNote = convention.termOrder === 'ascending' ? '' : `, order=${convention.termOrder}`;
  if (convention.jonesVariable !== 't' || convention.termOrder !== 'ascending') {
    const letter = jonesLetter(convention.jonesVariable);
    lines.push(`  declared (jones=${convention.jonesVariable}${orderNote})  V(${letter}) = ${conventionJones(r.jones, convention).toPlainString(letter, convention.termOrder)}`);
  }
  if (convention.bracketNormalization !== 'unit' || convention.termOrder !== 'ascending') {
    lines.push(`  declared (bracket=${convention.bracketNormalization}${orderNote})  <D> = ${conventionBracket(r.bracket, convention).toPlainString('A', convention.termOrder)}`);
  }
  const adequacy = r.adequate ? 'adequate' : r.aAdequate ? 'A-adequate only' : r.bAdequate ? 'B-adequate only' : 'neither A- nor B-adequate';
  lines.push(`  diagram  ${yesNo(r.connected, 'connected', 'split into several pieces')}, ${yesNo(r.reduced, 'reduced', 'not reduced')}, ${yesNo(r.alternating, 'alternating', 'not alternating')}, ${adequacy}`);
  lines.push(`           all-A state ${count(r.stateCircles.a, 'circle')}, all-B state ${count(r.stateCircles.b, 'circle')}`);
  lines.push(...classicalLines(r, convention));
  lines.push(...skeinLines(r, convention));
  if (r.nugatory.length > 0) lines.push(`  nugatory crossing${r.nugatory.length === 1 ? '' : 's'} (from 0): ${r.nugatory.join(', ')}`);
  if (r.linking.length > 0) lines.push(`  linking  ${linkingLine(r.linking)}`);
  const c = r.crossingNumber;
  const verdict = c.exact !== null ? `exactly ${c.exact}` : `between ${c.lower} and ${c.upper}`;
  lines.push(`  crossing number ${verdict}`);
  // Once a theorem fixes the value, the separate bounds add nothing for a reader; JSON keeps them all.
  const shown = c.exact !== null ? c.reasons.filter((x) => x.bound === 'exact') : c.reasons;
  for (const reason of shown) lines.push(`    ${reason.bound} ${reason.value} [${reason.theorem}]: ${reason.text}`);
  if (r.simplified) lines.push(...simplifiedLines(r.simplified.diagram));
  if (!r.chiralityFixed) lines.push('  note: this notation fixes the link only up to mirror image');
  return lines.join('\n');
}

/** A compiler-style message for an invalid code: what, where (with a caret), and the hints. */
export function invalidCodeMessage(position: number, code: string, notation: Notation, error: InputError): string {
  const lines = [`skeinproof: error[${error.ruleId}] in code #${position} (${notation}): ${error.message}`];
  if (error.span) {
    const lineStart = code.lastIndexOf('\n', error.span.start - 1) + 1;
    const lineEndAt = code.indexOf('\n', error.span.start);
    const line = code.slice(lineStart, lineEndAt < 0 ? code.length : lineEndAt);
    const column = error.span.start - lineStart;
    const width = Math.max(1, Math.min(error.span.end, lineStart + line.length) - error.span.start);
    // Tabs shown as single spaces: a terminal would widen them and push the caret off its token.
    lines.push(`  | ${line.replace(/\t/g, ' ')}`, `  | ${' '.repeat(column)}${'^'.repeat(width)}`);
  }
  for (const hint of error.hints) lines.push(`  hint: ${hint}`);
  return lines.join('\n');
}

interface ComputeArgs {
  readonly codes: readonly string[];
  readonly notation: Notation;
  readonly strands?: number;
  readonly json: boolean;
  /** `--claim KEY=VALUE`, judged against every code given. */
  readonly claims: readonly ClaimAssignment[];
  readonly convention: Convention;
  readonly strict: boolean;
  readonly limits: ComputeLimits;
  /** The disk cache (absent with --no-cache). */
  readonly resultStore?: FileResultStore;
  /** `--keys`: the JSON fields to compute and print (all when absent). */
  readonly keys?: ReadonlySet<string>;
}

interface ClaimsOutcome {
  readonly json: readonly (JudgementJson | UnreadableClaimJson)[];
  readonly diagnostics: readonly Diagnostic[];
  /** Plain output: one verdict line per claim, then the diagnostics with their excerpts. */
  readonly plain: string;
}

/**
 * Judges every claim about one code. Each claim is located in a virtual file
 * `<code N claim M>` whose only line is the claim as typed, so the human
 * reporter can put its caret under the offending part of the value.
 */
function judgeCodeClaims(position: number, report: DiagramReport, others: ReadonlyMap<string, DiagramReport>, args: ComputeArgs, color: boolean): ClaimsOutcome {
  const json: (JudgementJson | UnreadableClaimJson)[] = [];
  const diagnostics: Diagnostic[] = [];
  const lines = ['  claims'];
  const blocks: string[] = [];
  const verdicts = judgeDiagramClaims(
    report,
    args.claims.map((c) => ({ key: c.key, text: c.value })),
    { convention: args.convention, others, selfId: `<code ${position}>` },
  );
  const fileOf = (k: number): string => `<code ${position} claim ${k + 1}>`;
  args.claims.forEach((claim, k) => {
    const file = fileOf(k);
    const locate = (span?: TextSpan): SourceLocation => ({
      file,
      start: { line: 1, column: claim.valueOffset + 1 + (span?.start ?? 0) },
      end: { line: 1, column: claim.valueOffset + 1 + (span?.end ?? claim.value.length) },
    });
    let found: Diagnostic[];
    const outcome = verdicts.outcomes[k]!;
    if (outcome.kind === 'unreadable') {
      const error = outcome.error;
      json.push(unreadableClaimJson(claim.key, claim.value, error));
      const status = error.ruleId === 'claim-inapplicable' ? 'not applicable' : error.ruleId === 'limit-exceeded' ? 'not computed (over a limit)' : 'unreadable';
      lines.push(`    ${claim.key} = ${claim.value.trim()}: ${status}`);
      found = [unreadableClaimDiagnostic(error, locate)];
    } else {
      const judgement = outcome.kind === 'conflict' ? { ...outcome.judgement, verdict: 'contradicts' as const } : outcome.judgement;
      json.push(judgementJson(judgement));
      lines.push(`    ${claim.key} = ${claim.value.trim()}: ${judgement.verdict}${judgement.diagnosis ? ` (${judgement.diagnosis.kind})` : ''}`);
      found =
        outcome.kind === 'conflict'
          ? [choiceConflictDiagnostic(outcome, `the ${CLAIM_NOUNS[claim.key]} claimed`, { key: args.claims[outcome.other]!.key, place: fileOf(outcome.other) }, `code ${position}`, locate())]
          : judgementToDiagnostics(judgement, locate());
    }
    diagnostics.push(...found);
    const sources = new Map([[file, claim.text]]);
    for (const d of found) blocks.push(formatDiagnostic(d, { color, sources }));
  });
  return { json, diagnostics, plain: [...lines, ...blocks].join('\n') };
}

/** An argument that looks like a long or lettered option; codes such as `-1 2 -1` do not. */
const OPTION_LIKE = /^--?[A-Za-z]/;

function readArgs(args: Record<string, unknown>): ComputeArgs | string {
  const beforeSeparator = ((args['codes'] as unknown[] | undefined) ?? []).map(String);
  const unknownOption = beforeSeparator.find((code) => OPTION_LIKE.test(code));
  if (unknownOption !== undefined) {
    return `unknown option ${unknownOption}; \`skeinproof compute --help\` lists the options of compute (put codes that start with "-" after "--").`;
  }
  // Everything after `--` is a code, whatever it looks like (common practice for command lines).
  const codes = [...beforeSeparator, ...((args['--'] as unknown[] | undefined) ?? []).map(String)];
  if (codes.length === 0) {
    return 'no diagram code given: write one code per argument, e.g. skeinproof compute "(4,2,5,1) (2,6,3,5) (6,4,1,3)".';
  }
  const repeated = repeatedOptionMessage('notation', args['notation']) ?? repeatedOptionMessage('strands', args['strands']);
  if (repeated !== undefined) return repeated;
  const strands = args['strands'] as number | undefined;
  if (strands !== undefined && !(Number.isInteger(strands) && strands >= 1)) {
    return `--strands needs a positive whole number of strands${Number.isNaN(strands) ? '' : `, not ${strands}`}.`;
  }
  const notation = args['notation'] as Notation;
  if (strands !== undefined && notation !== 'braid') {
    return `--strands applies to braid words only; add --notation braid or leave --strands out.`;
  }
  const claimTexts = ([] as unknown[]).concat(args['claim'] ?? []).map(String);
  const claims: ClaimAssignment[] = [];
  for (const text of claimTexts) {
    try {
      claims.push(parseClaimAssignment(text));
    } catch (error) {
      if (!isInputError(error)) throw error;
      return `--claim: ${error.message}.`;
    }
  }
  const limits = readLimits(args);
  if (typeof limits === 'string') return limits;
  const jobs = readJobs(args);
  if (typeof jobs === 'string') return jobs;
  lendHelperThreads(jobs);
  const keys = readKeys(args);
  if (typeof keys === 'string') return keys;
  const resultStore = openCache(args);
  if (typeof resultStore === 'string') return resultStore;
  let convention = DEFAULT_CONVENTION;
  const conventionText = conventionOptionText(args['convention']);
  if (conventionText !== undefined) {
    const read = parseConventionText(conventionText);
    if (!read.ok) return `--convention: ${read.errors.map((e) => e.message).join('; ')}.`;
    convention = { ...DEFAULT_CONVENTION, ...read.settings };
  }
  return {
    codes,
    notation,
    strands,
    json: args['json'] === true,
    claims,
    convention,
    strict: args['strict'] === true,
    limits,
    ...(resultStore ? { resultStore } : {}),
    ...(keys ? { keys } : {}),
  };
}

/** `--keys jones,span`: a set of JSON fields, or a usage message. */
function readKeys(args: Record<string, unknown>): ReadonlySet<string> | undefined | string {
  if (args['keys'] === undefined) return undefined;
  if (args['json'] !== true) return '--keys selects fields of the JSON object: add --json.';
  const keys = ([] as unknown[]).concat(args['keys']).flatMap((value) => String(value).split(/[\s,]+/)).filter(Boolean);
  const unknown = keys.filter((key) => !JSON_FIELDS.includes(key));
  if (unknown.length > 0) return `--keys: unknown field${unknown.length === 1 ? '' : 's'} ${unknown.join(', ')}; the fields are ${JSON_FIELDS.join(', ')}.`;
  return new Set(keys);
}

export const computeCommand: CliCommand = {
  // `[codes..]`, not `<codes..>`: codes after `--` are not positionals to yargs, and readArgs asks for at least one.
  command: 'compute [codes..]',
  describe: 'Compute the invariants and diagram properties of each diagram code given',
  builder: (y: Argv) =>
    jobsOption(figureOptions(cacheOptions(limitOptions(y))))
      // Codes may begin with a minus sign (braid words, Gauss codes): let them through as positionals.
      .parserConfiguration({ 'unknown-options-as-args': true, 'populate--': true, 'parse-numbers': false, 'parse-positional-numbers': false })
      .positional('codes', { type: 'string', array: true, describe: 'One diagram code per argument (quote codes that contain spaces)' })
      // Case-insensitive, as the notations are usually written in capitals (PD, DT) in prose.
      .option('notation', { alias: 'n', choices: NOTATIONS, default: DEFAULT_NOTATION, coerce: (value: unknown) => (Array.isArray(value) ? value.map((v) => String(v).toLowerCase()) : String(value).toLowerCase()), describe: 'How the codes are written' })
      .option('strands', { type: 'number', describe: 'Braid words: the number of strands, when more than the largest generator + 1' })
      .option('json', { type: 'boolean', default: false, describe: 'One JSON object per code per line (JSON Lines)' })
      .option('keys', { type: 'string', describe: 'With --json: compute and print only these fields, e.g. jones,span (repeatable)' })
      // Not `array: true`, which would swallow the codes that follow; repeating the flag collects the claims.
      .option('claim', { type: 'string', describe: 'Check a stated value, KEY=VALUE (repeatable), e.g. jones=t+t^3-t^4 or crossing-number=<=7' })
      .option('convention', { type: 'string', describe: 'How claims are read and values written, e.g. "jones=q,bracket=loop" (keys: jones, bracket, order, half-powers, signature, homfly, kauffman)' })
      .option('strict', { type: 'boolean', default: false, describe: 'With --claim: warnings (undecided or mirror-only claims) fail too' }) as Argv,
  run: async (raw) => {
    const args = readArgs(raw);
    if (typeof args === 'string') {
      process.stderr.write(`skeinproof: ${args}\n`);
      return EXIT_INVALID_INPUT;
    }
    const parseOptions: ParseOptions = args.strands === undefined ? {} : { strands: args.strands };
    const figure = readFigureArgs(raw, args.codes.length);
    if (typeof figure === 'string') {
      process.stderr.write(`skeinproof: ${figure}\n`);
      return EXIT_INVALID_INPUT;
    }
    if (figure) return runFigure(figure, args.codes[0]!, args.notation, parseOptions, args.limits);
    let anyInvalid = false;
    const outcomes = args.codes.map((code) => computeCode(code, args.notation, parseOptions, args.limits, !args.json, args.resultStore));
    // Every analysed code, so a claim equal to another code's value is diagnosed as swapped.
    const reports = new Map(outcomes.flatMap((o, i) => (o.ok ? [[`<code ${i + 1}>`, o.report] as const] : [])));
    const claimDiagnostics: Diagnostic[] = [];
    const color = wantsColor(process.stdout);
    outcomes.forEach((outcome, i) => {
      const position = i + 1;
      const code = outcome.code;
      if (outcome.ok) {
        const claims = args.claims.length > 0 ? judgeCodeClaims(position, outcome.report, reports, args, color) : undefined;
        claimDiagnostics.push(...(claims?.diagnostics ?? []));
        // Only the output asked for is built: the JSON object reads Δ even where the summary leaves it out.
        if (args.json) {
          const json = computeJson(code, outcome.report, args.convention, args.keys);
          for (const message of new Set(notComputedErrors(json).map((e) => e.message))) {
            anyInvalid = true;
            process.stderr.write(`skeinproof: error[limit-exceeded] in code #${position} (${outcome.notation}): ${message}\n`);
          }
          process.stdout.write(`${JSON.stringify(claims ? { ...json, claims: claims.json } : json)}\n`);
        } else {
          // The summary shows the classical invariants only up to PLAIN_CLASSICAL_LIMIT crossings.
          const limit = outcome.report.crossings <= PLAIN_CLASSICAL_LIMIT ? classicalLimit(outcome.report) : undefined;
          if (limit) {
            anyInvalid = true;
            process.stderr.write(`${invalidCodeMessage(position, code, outcome.notation, limit)}\n`);
          }
          const summary = plainSummary(position, code, outcome.report, args.convention);
          process.stdout.write(`${claims ? `${summary}\n${claims.plain}` : summary}\n\n`);
        }
        return;
      }
      anyInvalid = true;
      process.stderr.write(`${invalidCodeMessage(position, code, outcome.notation, outcome.error)}\n`);
      if (args.json) process.stdout.write(`${JSON.stringify(invalidCodeJson(code, outcome.notation, outcome.error))}\n`);
    });
    args.resultStore?.finish();
    return anyInvalid ? EXIT_INVALID_INPUT : Math.max(EXIT_ALL_VALID, exitStatus(claimDiagnostics, { strict: args.strict }));
  },
};
