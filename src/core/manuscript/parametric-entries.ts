/**
 * The session's side of diagrams with a free parameter (src/core/parametric):
 * building them at every value, judging a formula claim value by value, and
 * refusing a fill-in, which has no single value to show.
 */
import { analyzeDiagram } from '../analyze/analyze.ts';
import type { DiagramReport } from '../analyze/report.ts';
import { judgeClaim, judgementToDiagnostics, unreadableClaimDiagnostic, CLAIM_NOUNS } from '../claims/index.ts';
import type { Verdict } from '../claims/api.ts';
import type { Convention } from '../convention/convention.ts';
import type { Diagnostic } from '../diagnostics/diagnostic.ts';
import { isInputError } from '../errors.ts';
import type { ComputeLimits } from '../limits.ts';
import type { ResultStore } from '../cache/store.ts';
import { parseDiagramCode } from '../notation/index.ts';
import { buildInstances, judgeInstances, listValues, PARAMETER_INVALID, readParameter, type ParametricDiagram } from '../parametric/parametric.ts';
import type { ClaimEntry, DiagramEntry, Locator } from './api.ts';

/** Builds the family at each value into `into`; returns the refusal when the setting or a value's code is refused. */
export function buildParametric(
  entry: DiagramEntry,
  reports: ReadonlyMap<string, DiagramReport>,
  limits: ComputeLimits,
  into: Map<string, ParametricDiagram>,
  store?: ResultStore,
): Diagnostic | undefined {
  const setting = entry.parameter!;
  if (entry.notation !== 'family') {
    return { severity: 'error', ruleId: PARAMETER_INVALID, message: `diagram \`${entry.id}\`: a free parameter needs a family code (notation=family), and this is a ${entry.notation} code`, location: setting.locate() };
  }
  let parameter;
  try {
    parameter = readParameter(setting.text);
  } catch (e) {
    if (!isInputError(e)) throw e;
    return { severity: 'error', ruleId: e.ruleId, message: `diagram \`${entry.id}\`: ${e.message}`, location: setting.locate() };
  }
  if (!new RegExp(`(^|[^a-zA-Z])${parameter.name}([^a-zA-Z]|$)`).test(entry.code)) {
    return { severity: 'error', ruleId: PARAMETER_INVALID, message: `diagram \`${entry.id}\`: the code does not use the parameter ${parameter.name}: write it where a number goes, e.g. torus 2 ${parameter.name}`, location: setting.locate() };
  }
  const named = (id: string) => reports.get(id)?.diagram;
  const options = { named, ...(limits.maxCrossings !== undefined ? { maxCrossings: limits.maxCrossings } : {}) };
  try {
    into.set(entry.id, buildInstances(entry.code, parameter, (code) => analyzeDiagram(parseDiagramCode(code, 'family', options), limits, store)));
    return undefined;
  } catch (e) {
    if (!isInputError(e)) throw e;
    return { severity: 'error', ruleId: e.ruleId, message: `diagram \`${entry.id}\`: ${e.message}`, location: entry.locateCode(), ...(e.hints.length > 0 ? { hints: [...e.hints] } : {}) };
  }
}

/**
 * A formula claim about a family with a free parameter: judged at each value in turn. The first value where it
 * does not agree gets that value's diagnostics, named by the value; a formula that agrees everywhere gets a note
 * saying which instances were checked, since that is all a check of instances shows.
 */
export function judgeParametricClaim(claim: ClaimEntry, family: ParametricDiagram, subject: string, convention: Convention): { diagnostics: Diagnostic[]; verdict?: Verdict } {
  const name = family.parameter.name;
  let outcome;
  try {
    outcome = judgeInstances(family, claim.text, (text, report) => judgeClaim(claim.key, text, report, { convention }));
  } catch (e) {
    if (!isInputError(e)) throw e;
    return { diagnostics: [unreadableClaimDiagnostic(e, claim.locate, subject)] };
  }
  const { failingValue, checked } = outcome;
  const judgement = outcome.judgement.key === '' ? { ...outcome.judgement, key: claim.key } : outcome.judgement;
  const all = family.parameter.values;
  if (failingValue === undefined) {
    return {
      verdict: 'agrees',
      diagnostics: [
        {
          severity: 'note',
          ruleId: 'claim-instances',
          message: `${subject}: the formula agrees at each of the ${all.length} values ${name} = ${listValues(all)}; this checks these instances, not the formula for every ${name}`,
          location: claim.locate(),
          data: { key: claim.key, verdict: 'agrees', parameter: name, values: [...all] },
        },
      ],
    };
  }
  const where = `at ${name} = ${failingValue} (${checked.length === 1 ? 'the first value checked' : `after it agreed at ${name} = ${listValues(checked.slice(0, -1))}`})`;
  const diagnostics = judgementToDiagnostics(judgement, claim.locate(), claim.context ? `${claim.context} ${where}` : `the ${CLAIM_NOUNS[claim.key]} formula ${where}`);
  return { verdict: judgement.verdict, diagnostics: diagnostics.map((d) => ({ ...d, data: { ...(d.data ?? {}), parameter: name, value: failingValue } })) };
}

export function parametricFill(target: string, family: ParametricDiagram, subject: string, locate: Locator): Diagnostic {
  return {
    severity: 'error',
    ruleId: PARAMETER_INVALID,
    message: `${subject}: \`${target}\` has a free parameter ${family.parameter.name}, so it has no single value to fill in; state the paper's formula as a claim instead, and it is checked at each value`,
    location: locate(),
  };
}
