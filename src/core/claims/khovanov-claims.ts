/**
 * Claims and fill-ins about Khovanov homology: the rational Poincaré
 * polynomial (unreduced and reduced), the rank and the torsion at one
 * bidegree, the homological width, thinness and Rasmussen's s, all read and
 * typeset in the document's Khovanov grading (convention.ts).
 *
 * The values come from one computation per diagram (invariants/khovanov),
 * kept with the diagram; a diagram beyond the engine's budget is reported once
 * as `khovanov-over-limit`, never a hang.
 */
import type { DiagramReport } from '../analyze/report.ts';
import type { Convention, KhovanovGrading } from '../convention/convention.ts';
import { InputError } from '../errors.ts';
import { khovanovReport, isOverBudget, WORK_UNITS_PER_SECOND, workBudgetFor, type KhovanovHomology, type KhovanovReport } from '../invariants/khovanov/index.ts';
import { LIMIT_OPTIONS } from '../limits.ts';
import { primaryParts } from '../invariants/khovanov/homology.ts';
import { mirrorDiagram } from '../diagram/model.ts';
import { quantity, valueOf } from '../invariants/registry/lazy.ts';
import { storeOf, throughStore } from '../cache/store.ts';
import { STORED } from '../cache/stored.ts';
import type { Diagnosis, JudgeContext, Judgement, Typeset } from './api.ts';
import { UNREADABLE, readInteger } from './latex-poly-parser.ts';
import { readYesNo } from './scalar-claims.ts';

export const KHOVANOV_OVER_LIMIT = 'khovanov-over-limit';

type Outcome = { readonly ok: true; readonly value: KhovanovReport } | { readonly ok: false; readonly error: InputError };

const khovanovValue = quantity<Outcome>('khovanov', (report) => {
  try {
    return { ok: true, value: throughStore(storeOf(report), STORED.khovanov, report.diagram, () => khovanovReport(report.diagram, budgetOf(report))) };
  } catch (e) {
    if (!isOverBudget(e)) throw e;
    const n = report.diagram.crossings.length;
    // Only the work budget grows with the time budget; the width and the exact integer range are fixed.
    const raise =
      e.workBudget === undefined
        ? ''
        : `, raise the time budget (${LIMIT_OPTIONS.time} ${Number(((2 * e.workBudget) / WORK_UNITS_PER_SECOND).toPrecision(2))} doubles the ${e.workBudget.toExponential(0).replace('e+', '·10^')} steps it allows)`;
    return {
      ok: false,
      error: new InputError(
        KHOVANOV_OVER_LIMIT,
        `Khovanov homology of this ${n}-crossing diagram is over the limit of the computation (${e.message}); ` +
          `give a diagram of the same link with fewer crossings or fewer strands${raise}, or leave out the Khovanov claims for it`,
      ),
    };
  }
});

/** The work budget of the report's time budget (`--time-budget`): deterministic units, scaled. */
const budgetOf = (report: DiagramReport): { workBudget: number } => ({ workBudget: workBudgetFor(report.limits.timeBudgetMs) });

/** The Khovanov data of the report's diagram (computed once); throws `khovanov-over-limit` beyond the budget. */
export function khovanovOf(report: DiagramReport): KhovanovReport {
  const outcome = valueOf(report, khovanovValue);
  if (!outcome.ok) throw outcome.error;
  return outcome.value;
}

/** Bigraded groups in a document's grading: ranks and torsion by "i,j". */
export interface Graded {
  readonly ranks: Map<string, number>;
  /** Prime-power orders (sorted) by "i,j". */
  readonly torsion: Map<string, number[]>;
}

const at = (i: number, j: number): string => `${i + 0},${j + 0}`;

/** Relabels the computed (standard) homology into `grading`. */
export function inGrading(h: KhovanovHomology, grading: KhovanovGrading): Graded {
  const rankMove = (i: number, j: number): [number, number] =>
    grading === 'q-inverse' ? [i, -j] : grading === 'homological' ? [-i, j] : grading === 'mirror' ? [-i, -j] : [i, j];
  // The mirror's torsion sits one step up (universal coefficients): ℤ/n at (i, j) moves to (1 − i, −j).
  const torsionMove = (i: number, j: number): [number, number] => (grading === 'mirror' ? [1 - i, -j] : rankMove(i, j));
  const ranks = new Map<string, number>();
  for (const [i, j, r] of h.ranks) ranks.set(at(...rankMove(i, j)), r);
  const torsion = new Map<string, number[]>();
  for (const [i, j, order, m] of h.torsion) {
    const k = at(...torsionMove(i, j));
    const list = torsion.get(k) ?? [];
    for (let c = 0; c < m; c++) list.push(order);
    torsion.set(k, list.sort((a, b) => a - b));
  }
  return { ranks, torsion };
}

const GRADING_SLIPS: Record<KhovanovGrading, string> = {
  standard: 'the standard grading (t cohomological, right-handed trefoil q + q³ + t²q⁵ + t³q⁹)',
  'q-inverse': 'the quantum grading negated (q ↦ q⁻¹)',
  homological: 'homological indexing (t ↦ t⁻¹)',
  mirror: 'the mirror convention (t ↦ t⁻¹ and q ↦ q⁻¹)',
};

// ---------------------------------------------------------------- reading

/** A Poincaré polynomial as the author wrote it: "i,j" → coefficient. */
export function readPoincarePolynomial(text: string): Map<string, number> {
  const terms = new Map<string, number>();
  let value = text;
  let offset = 0;
  const eq = text.lastIndexOf('=');
  if (eq >= 0) {
    value = text.slice(eq + 1);
    offset = eq + 1;
  }
  const fail = (message: string, start: number, end: number): never => {
    throw new InputError(UNREADABLE, message, { start: offset + start, end: offset + end });
  };
  const s = value.replace(/\$/g, ' ');
  let p = 0;
  const skipSpace = (): void => {
    for (;;) {
      const rest = s.slice(p);
      const m = /^(\s+|\\[,;:! ]|\\cdot\b|\\quad\b|\{\}|\\left\b|\\right\b)/.exec(rest);
      if (!m) return;
      p += m[0].length;
    }
  };
  const readExponent = (): number => {
    skipSpace();
    const m = /^(\{\s*([+\-−]?)\s*(\d+)\s*\}|([+\-−]?)(\d))/.exec(s.slice(p));
    if (!m) fail('an exponent must be an integer, as q^{-3} or t^2', p, Math.min(s.length, p + 1));
    p += m![0].length;
    const sign = (m![2] ?? m![4]) === '-' || (m![2] ?? m![4]) === '−' ? -1 : 1;
    return sign * Number(m![3] ?? m![5]);
  };
  skipSpace();
  if (p >= s.length) fail('the claim is empty: write the Poincaré polynomial, e.g. q + q^3 + t^2 q^5 + t^3 q^9', 0, text.length - offset);
  for (;;) {
    skipSpace();
    const termStart = p;
    let coefficient = 1;
    const digits = /^\d+/.exec(s.slice(p));
    if (digits) {
      coefficient = Number(digits[0]);
      p += digits[0].length;
    }
    let i = 0;
    let j = 0;
    let factors = digits ? 1 : 0;
    for (;;) {
      skipSpace();
      const c = s[p];
      if (c !== 't' && c !== 'q') break;
      p++;
      skipSpace();
      let e = 1;
      if (s[p] === '^') {
        p++;
        e = readExponent();
      }
      if (c === 't') i += e;
      else j += e;
      factors++;
    }
    if (factors === 0) {
      if (p >= s.length) fail('the claim ends after `+`: a term is missing (write it, or delete the `+`)', s.lastIndexOf('+'), s.lastIndexOf('+') + 1);
      const bad = s[p] ?? '';
      if (bad === '-' || bad === '−') fail('a Poincaré polynomial has no negative coefficients (ranks are counted, not signed); the graded Euler characteristic is claimed as the Jones polynomial instead', p, p + 1);
      fail(`unexpected \`${bad}\`: a Poincaré polynomial is a sum of terms like 2t^{3}q^{-7} in t and q`, p, p + 1);
    }
    if (!Number.isSafeInteger(coefficient)) fail('this coefficient is too large to be a rank', termStart, p);
    const k = at(i, j);
    terms.set(k, (terms.get(k) ?? 0) + coefficient);
    skipSpace();
    if (p >= s.length) break;
    if (s[p] !== '+') {
      if (s[p] === '-' || s[p] === '−') fail('a Poincaré polynomial has no negative coefficients (ranks are counted, not signed)', p, p + 1);
      fail(`unexpected \`${s[p]}\`: terms of a Poincaré polynomial are joined by +`, p, p + 1);
    }
    p++;
  }
  for (const [k, v] of terms) if (v === 0) terms.delete(k);
  return terms;
}

/** "i, j" or "(i, j)" before ":" or "=", then the rest; throws `claim-unreadable`. */
function readBidegree(text: string, what: string): { i: number; j: number; rest: string; restStart: number } {
  const m = /^\s*\$?\s*\(?\s*([+\-−]?\d+)\s*,\s*([+\-−]?\d+)\s*\)?\s*[:=]\s*/.exec(text);
  if (!m) {
    throw new InputError(UNREADABLE, `a ${what} claim names the bidegree first, as \`3, 7: ...\` or \`(3, 7) = ...\` (homological degree, then quantum degree)`, {
      start: 0,
      end: text.length,
    });
  }
  const num = (x: string): number => Number(x.replace('−', '-'));
  return { i: num(m[1]!), j: num(m[2]!), rest: text.slice(m[0].length), restStart: m[0].length };
}

/** ℤ as written: ℤ, Z, \mathbb{Z}, \mathbf{Z}, \Bbb{Z}, also without braces (TeX reads one token as the argument). */
const INTEGERS = String.raw`(?:\\(?:mathbb|mathbf|Bbb)\s*(?:\{\s*Z\s*\}|Z)|ℤ|Z)`;
const CYCLIC_SUMMAND = new RegExp(String.raw`^\s*\(?\s*${INTEGERS}\s*(?:\/\s*\{?\s*(\d+)\s*\}?|_\s*\{?\s*(\d+)\s*\}?)\s*\)?\s*(?:\^\s*\{?\s*(\d+)\s*\}?)?\s*$`);
const FREE_SUMMAND = new RegExp(String.raw`^\s*${INTEGERS}\s*(?:\^\s*\{?\s*(\d+)\s*\}?)?\s*$`);

/** A finite abelian torsion group: 0, or ℤ/n summands joined by ⊕ (ℤ/n, Z/n, \mathbb{Z}/n, \mathbb{Z}_n, (ℤ/2)^2). */
export function readTorsionGroup(text: string, offset = 0): number[] {
  const bare = text.replace(/\$/g, ' ').trim().replace(/[.;]$/, '');
  if (/^0$|^\\?\{?0\}?$|^\\mathbf\{0\}$/.test(bare)) return [];
  const orders: number[] = [];
  const parts = bare.split(/\\oplus|⊕|\+/);
  for (const part of parts) {
    const m = CYCLIC_SUMMAND.exec(part);
    if (!m) {
      throw new InputError(UNREADABLE, `\`${part.trim()}\` is not a cyclic group: write the torsion as 0 or as summands like \\mathbb{Z}/2 \\oplus \\mathbb{Z}/4`, {
        start: offset,
        end: offset + text.length,
      });
    }
    const order = Number(m[1] ?? m[2]);
    const times = m[3] === undefined ? 1 : Number(m[3]);
    if (order < 2) continue;
    for (let c = 0; c < times; c++) for (const q of primaryParts(BigInt(order))) orders.push(Number(q));
  }
  return orders.sort((a, b) => a - b);
}

/** A finitely generated abelian group: its free rank and its torsion as prime-power orders, sorted. */
export interface IntegralGroup {
  readonly rank: number;
  readonly torsion: readonly number[];
}

/**
 * A finitely generated abelian group as written: 0, or summands joined by ⊕ (or `,`, `+`), each ℤ (`\mathbb{Z}`,
 * `ℤ`, `Z`, with a power `^2` for several), a cyclic ℤ/n (as `readTorsionGroup` reads it), or a bare count r
 * for ℤ^r, so a grid's `1, \mathbb{Z}/2` and `\mathbb{Z} \oplus \mathbb{Z}/2` are the same group.
 */
export function readIntegralGroup(text: string, offset = 0): IntegralGroup {
  const bare = text.replace(/\$/g, ' ').trim().replace(/[.;]$/, '');
  if (/^0$|^\\?\{?0\}?$|^\\mathbf\{0\}$/.test(bare)) return { rank: 0, torsion: [] };
  let rank = 0;
  const torsion: number[] = [];
  for (const part of bare.split(/\\oplus|⊕|\+|,/)) {
    const count = /^\s*(\d+)\s*$/.exec(part);
    const free = FREE_SUMMAND.exec(part);
    if (count) rank += Number(count[1]);
    else if (free) rank += free[1] === undefined ? 1 : Number(free[1]);
    else if (part.trim() === '') {
      throw new InputError(UNREADABLE, 'an empty summand: write the group as 0 or as summands like \\mathbb{Z} \\oplus \\mathbb{Z}/2', { start: offset, end: offset + text.length });
    } else torsion.push(...readTorsionGroup(part, offset));
    if (!Number.isSafeInteger(rank)) throw new InputError(UNREADABLE, 'this rank is too large', { start: offset, end: offset + text.length });
  }
  return { rank, torsion: torsion.sort((a, b) => a - b) };
}

// ---------------------------------------------------------------- typesetting

function monomial(i: number, j: number): string {
  const power = (x: string, e: number): string => (e === 0 ? '' : e === 1 ? x : `${x}^{${e}}`);
  return power('t', i) + power('q', j);
}

/** Σ rank·t^i q^j in the given order (by i, then j). */
export function poincareLatex(ranks: Map<string, number>, convention: Convention): string {
  const entries = [...ranks].map(([k, r]) => [...(k.split(',').map(Number) as [number, number]), r] as const);
  entries.sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  if (convention.termOrder === 'descending') entries.reverse();
  if (entries.length === 0) return '0';
  return entries.map(([i, j, r]) => (r === 1 ? monomial(i, j) || '1' : `${r}${monomial(i, j)}`)).join(' + ');
}

const groupLatex = (orders: readonly number[]): string => (orders.length === 0 ? '0' : orders.map((o) => `\\mathbb{Z}/${o}`).join(' \\oplus '));

/** ℤ^r ⊕ torsion, e.g. `\mathbb{Z}^{2} \oplus \mathbb{Z}/2`; `0` for the zero group. */
export function integralGroupLatex(group: IntegralGroup): string {
  const free = group.rank === 0 ? [] : [group.rank === 1 ? '\\mathbb{Z}' : `\\mathbb{Z}^{${group.rank}}`];
  const parts = [...free, ...group.torsion.map((o) => `\\mathbb{Z}/${o}`)];
  return parts.length === 0 ? '0' : parts.join(' \\oplus ');
}

/** A group as the messages print it, in the Unicode both front ends' authors read: `ℤ^2 ⊕ ℤ/2`, not LaTeX. */
export const groupText = (latex: string): string => latex.replace(/\\mathbb\{Z\}/g, 'ℤ').replace(/ \\oplus /g, ' ⊕ ').replace(/\^\{(\d+)\}/g, '^$1');

/** The integral group at (i, j) of homology relabelled into a grading. */
export function groupAt(g: Graded, i: number, j: number): IntegralGroup {
  return { rank: g.ranks.get(at(i, j)) ?? 0, torsion: g.torsion.get(at(i, j)) ?? [] };
}

export function khovanovFill(key: 'khovanov' | 'khovanov-reduced' | 'khovanov-width' | 'rasmussen', report: DiagramReport, convention: Convention): Typeset {
  const kh = khovanovOf(report);
  switch (key) {
    case 'khovanov':
      return { kind: 'math', latex: poincareLatex(inGrading(kh.homology, convention.khovanovGrading).ranks, convention) };
    case 'khovanov-reduced':
      if (!kh.reduced) throw inapplicable(key, report);
      return { kind: 'math', latex: poincareLatex(inGrading(kh.reduced, convention.khovanovGrading).ranks, convention) };
    case 'khovanov-width':
      return { kind: 'math', latex: String(kh.width) };
    case 'rasmussen':
      if (kh.rasmussen === null) throw inapplicable(key, report);
      return { kind: 'math', latex: String(kh.rasmussen) };
  }
}

/** The keys whose values are defined for knots only, with their nouns. */
const KNOT_ONLY: Readonly<Record<string, string>> = { 'khovanov-reduced': 'reduced Khovanov homology', rasmussen: "Rasmussen's s" };

/** Why `key` does not apply to the diagram (a knot-only value asked of a link), or undefined when it does. */
export function khovanovInapplicable(report: DiagramReport, key: string): string | undefined {
  const noun = KNOT_ONLY[key];
  return noun !== undefined && report.components !== 1 ? `${noun} is defined here for knots, but this diagram has ${report.components} components` : undefined;
}

function inapplicable(key: 'khovanov-reduced' | 'rasmussen', report: DiagramReport): InputError {
  return new InputError('claim-inapplicable', `${khovanovInapplicable(report, key) ?? `${KNOT_ONLY[key]} is not defined for this diagram`}; remove the claim or attach it to a knot`);
}

// ---------------------------------------------------------------- judging

const sameMap = <V>(a: Map<string, V>, b: Map<string, V>): boolean =>
  a.size === b.size && [...a].every(([k, v]) => JSON.stringify(b.get(k)) === JSON.stringify(v));

/** The claim as computed times t^a q^b, if it is one. */
function shiftOf(claim: Map<string, number>, computed: Map<string, number>): [number, number] | undefined {
  if (claim.size !== computed.size || claim.size === 0) return undefined;
  const key = (m: Map<string, number>): [number, number][] =>
    [...m.keys()].map((k) => k.split(',').map(Number) as [number, number]).sort((x, y) => x[0] - y[0] || x[1] - y[1]);
  const [c0] = key(claim);
  const [k0] = key(computed);
  const [a, b] = [c0![0] - k0![0], c0![1] - k0![1]];
  if (a === 0 && b === 0) return undefined;
  for (const [k, r] of computed) {
    const [i, j] = k.split(',').map(Number) as [number, number];
    if (claim.get(at(i + a, j + b)) !== r) return undefined;
  }
  return [a, b];
}

/** The mirror image's homology (computed once per diagram). */
const mirrorValue = quantity<KhovanovReport | undefined>('khovanov-mirror', (report) => {
  try {
    // Stored as the Khovanov homology of the mirror diagram, which is what it is.
    const mirror = mirrorDiagram(report.diagram);
    return throughStore(storeOf(report), STORED.khovanov, mirror, () => khovanovReport(mirror, budgetOf(report)));
  } catch (e) {
    if (isOverBudget(e)) return undefined;
    throw e;
  }
});

function mirrorAgreement(noun: string, computedText: string, claimedText: string, key: string, diagnosis: Diagnosis): Judgement {
  return {
    key,
    claimed: claimedText,
    computed: computedText,
    verdict: 'agrees',
    diagnosis,
    reason: `the claim is the ${noun} of the mirror image, which a DT code cannot tell apart from the diagram itself`,
    warning: `a DT code fixes the knot only up to mirror image; the claim matches the mirror, the code's own ${noun} is ${computedText}`,
  };
}

export function judgePoincareClaim(key: 'khovanov' | 'khovanov-reduced', text: string, report: DiagramReport, ctx: JudgeContext): Judgement {
  const claim = readPoincarePolynomial(text);
  const kh = khovanovOf(report);
  const reduced = key === 'khovanov-reduced';
  const noun = reduced ? 'reduced Khovanov Poincaré polynomial' : 'Khovanov Poincaré polynomial';
  const own = reduced ? kh.reduced : kh.homology;
  if (!own) throw inapplicable('khovanov-reduced', report);
  const grading = ctx.convention.khovanovGrading;
  const computed = inGrading(own, grading).ranks;
  const computedText = poincareLatex(computed, ctx.convention);
  const base = { key, claimed: text, computed: computedText };
  if (sameMap(claim, computed)) return { ...base, verdict: 'agrees', reason: `the ${noun} is ${computedText}` };
  const diagnosis = poincareSlip(claim, own, grading, reduced, kh, report);
  if (diagnosis?.kind === 'mirror' && !report.chiralityFixed) return mirrorAgreement(noun, computedText, text, key, diagnosis);
  return {
    ...base,
    verdict: 'contradicts',
    ...(diagnosis ? { diagnosis } : {}),
    reason: `the ${noun} is ${computedText}, not ${poincareLatex(claim, ctx.convention)}${diagnosis ? `: ${diagnosis.detail}` : ''}`,
  };
}

function poincareSlip(
  claim: Map<string, number>,
  own: KhovanovHomology,
  grading: KhovanovGrading,
  reduced: boolean,
  kh: KhovanovReport,
  report: DiagramReport,
): Diagnosis | undefined {
  const mirror = valueOf(report, mirrorValue);
  const mirrorOwn = mirror ? (reduced ? mirror.reduced : mirror.homology) : undefined;
  if (mirrorOwn && sameMap(claim, inGrading(mirrorOwn, grading).ranks)) {
    return { kind: 'mirror', detail: 'the claim is the Poincaré polynomial of the mirror image (t ↦ t⁻¹, q ↦ q⁻¹)' };
  }
  for (const other of ['standard', 'q-inverse', 'homological'] as const) {
    if (other !== grading && sameMap(claim, inGrading(own, other).ranks)) {
      return { kind: 'normalization', detail: `the claim is written in ${GRADING_SLIPS[other]}, but this document declares ${GRADING_SLIPS[grading]}` };
    }
  }
  const counterpart = reduced ? kh.homology : kh.reduced;
  if (counterpart && sameMap(claim, inGrading(counterpart, grading).ranks)) {
    return {
      kind: 'normalization',
      detail: reduced ? 'the claim is the unreduced Poincaré polynomial, but the key asks for the reduced one' : 'the claim is the reduced Poincaré polynomial, but the key asks for the unreduced one',
    };
  }
  const shift = shiftOf(claim, inGrading(own, grading).ranks);
  if (shift) {
    return { kind: 'shifted', detail: `the claim is the right polynomial times ${monomial(shift[0], shift[1])}: a grading shift (check the normalisation [−n₋]{n₊ − 2n₋})` };
  }
  return undefined;
}

/** A rank; a group written instead (ℤ, ℤ/2, a sum) is refused with the key that states groups. */
function readRank(rest: string, restStart: number): string {
  if (/\\mathbb|\\Bbb|\\mathbf\s*\{?\s*Z|ℤ|\\oplus|⊕|Z\s*[/_^]/.test(rest)) {
    throw new InputError(
      UNREADABLE,
      `\`${rest.trim()}\` is a group, and a rank is a number: write the rank of the free part, or state the whole group with the key khovanov-group (in a grid: values=groups)`,
      { start: restStart, end: restStart + rest.length },
    );
  }
  return String(readInteger(rest, 'a rank'));
}

export type BidegreeKey = 'khovanov-rank' | 'khovanov-torsion' | 'khovanov-group';

const BIDEGREE_CLAIMS: Record<BidegreeKey, { what: string; noun: string; read: (rest: string, restStart: number) => string; valueAt: (g: Graded, i: number, j: number) => string }> = {
  'khovanov-rank': { what: 'Khovanov rank', noun: 'rank of Khovanov homology', read: readRank, valueAt: (g, i, j) => String(groupAt(g, i, j).rank) },
  'khovanov-torsion': {
    what: 'Khovanov torsion',
    noun: 'torsion of Khovanov homology',
    read: (rest, restStart) => groupLatex(readTorsionGroup(rest, restStart)),
    valueAt: (g, i, j) => groupLatex(groupAt(g, i, j).torsion),
  },
  'khovanov-group': {
    what: 'Khovanov group',
    noun: 'integral Khovanov homology',
    read: (rest, restStart) => integralGroupLatex(readIntegralGroup(rest, restStart)),
    valueAt: (g, i, j) => integralGroupLatex(groupAt(g, i, j)),
  },
};

/** The rank, the torsion or the whole integral group at one bidegree. */
export function judgeBidegreeClaim(key: BidegreeKey, text: string, report: DiagramReport, ctx: JudgeContext): Judgement {
  const spec = BIDEGREE_CLAIMS[key];
  const { i, j, rest, restStart } = readBidegree(text, spec.what);
  const kh = khovanovOf(report);
  const grading = ctx.convention.khovanovGrading;
  const graded = inGrading(kh.homology, grading);
  const place = `(${i}, ${j})`;
  const valueAt = spec.valueAt;
  const claimed = spec.read(rest, restStart);
  const computed = valueAt(graded, i, j);
  const noun = `${spec.noun} at ${place}`;
  const base = { key, claimed: text, computed };
  if (claimed === computed) return { ...base, verdict: 'agrees', reason: `the ${noun} is ${groupText(computed)}` };
  let diagnosis: Diagnosis | undefined;
  const mirror = valueOf(report, mirrorValue);
  if (mirror && valueAt(inGrading(mirror.homology, grading), i, j) === claimed) {
    diagnosis = { kind: 'mirror', detail: 'the claim is the value of the mirror image at this bidegree' };
  } else {
    for (const other of ['standard', 'q-inverse', 'homological'] as const) {
      if (other !== grading && valueAt(inGrading(kh.homology, other), i, j) === claimed) {
        diagnosis = { kind: 'normalization', detail: `the claim is the value at this bidegree in ${GRADING_SLIPS[other]}, but this document declares ${GRADING_SLIPS[grading]}` };
        break;
      }
    }
  }
  if (diagnosis?.kind === 'mirror' && !report.chiralityFixed) return mirrorAgreement(noun, computed, text, key, diagnosis);
  return { ...base, verdict: 'contradicts', ...(diagnosis ? { diagnosis } : {}), reason: `the ${noun} is ${groupText(computed)}, not ${groupText(claimed)}${diagnosis ? `: ${diagnosis.detail}` : ''}` };
}

export function judgeWidthClaim(text: string, report: DiagramReport): Judgement {
  const claimed = readInteger(text, 'a homological width');
  const kh = khovanovOf(report);
  const computed = String(kh.width);
  const verdict = claimed === BigInt(kh.width) ? 'agrees' : 'contradicts';
  const reason = `rational Khovanov homology spans ${kh.width} diagonal${kh.width === 1 ? '' : 's'} j − 2i`;
  return { key: 'khovanov-width', claimed: text, computed, verdict, reason: verdict === 'agrees' ? reason : `${reason}, not ${claimed}` };
}

export function judgeThinClaim(text: string, report: DiagramReport): Judgement {
  const claimed = readYesNo(text, 'Khovanov-thin');
  const kh = khovanovOf(report);
  const reason = `rational Khovanov homology spans ${kh.width} diagonal${kh.width === 1 ? '' : 's'} j − 2i, so the link is ${kh.thin ? '' : 'not '}thin`;
  return { key: 'thin', claimed: text, computed: kh.thin ? 'yes' : 'no', verdict: claimed === kh.thin ? 'agrees' : 'contradicts', reason };
}

export function judgeRasmussenClaim(text: string, report: DiagramReport): Judgement {
  const claimed = readInteger(text, "Rasmussen's s");
  const kh = khovanovOf(report);
  if (kh.rasmussen === null) throw inapplicable('rasmussen', report);
  const s = kh.rasmussen;
  const computed = String(s);
  const base = { key: 'rasmussen', claimed: text, computed };
  const bound = `so the slice genus is at least ${Math.abs(s) / 2}`;
  if (claimed === BigInt(s)) return { ...base, verdict: 'agrees', reason: `s = ${s} (Rasmussen, Invent. Math. 182 (2010)), ${bound}` };
  const diagnosis: Diagnosis | undefined =
    s !== 0 && claimed === BigInt(-s) ? { kind: 'mirror', detail: 'the claim is −s: the value of the mirror image (s(right-handed trefoil) = 2 here)' } : undefined;
  if (diagnosis && !report.chiralityFixed) return mirrorAgreement("Rasmussen invariant", computed, text, 'rasmussen', diagnosis);
  return { ...base, verdict: 'contradicts', ...(diagnosis ? { diagnosis } : {}), reason: `s = ${s}, not ${claimed}${diagnosis ? `: ${diagnosis.detail}` : ''}` };
}
