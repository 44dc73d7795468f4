/**
 * Judging the claims about one diagram whose code leaves choices open (DT
 * codes: each independent part's chirality, each kink's sign). The claims are
 * judged against every realisation the code allows, and one realisation is
 * chosen for the whole document: the code's own drawing when every claim holds
 * there, else the first realisation in which they all hold. A claim that holds
 * only in another realisation than the chosen one is a conflict; a claim that
 * holds in none is contradicted as usual. Keys that no choice changes are
 * judged against the chosen realisation, which has the same value.
 */
import type { DiagramReport } from '../analyze/report.ts';
import { analyzeDiagram } from '../analyze/analyze.ts';
import type { LinkDiagram, OpenPart, Sign } from '../diagram/model.ts';
import { isInputError, type InputError } from '../errors.ts';
import { claimSpec } from '../invariants/registry/index.ts';
import type { ClaimKey, JudgeContext, Judgement } from './api.ts';
import { judgeClaim } from './judge.ts';

/** Realisations tried per diagram: past this a claim that none of them satisfies is undecided, not contradicted. */
export const MAX_REALISATIONS = 64;

export interface DiagramClaim {
  readonly key: ClaimKey;
  readonly text: string;
}

export type ClaimOutcome =
  | { readonly kind: 'judged'; readonly judgement: Judgement }
  /** The claim holds only in a realisation that contradicts claim `other` (an index into the claims). */
  | { readonly kind: 'conflict'; readonly judgement: Judgement; readonly other: number; readonly detail: string }
  | { readonly kind: 'unreadable'; readonly error: InputError };

export interface DiagramVerdicts {
  /** The realisation every claim is judged in and every value is filled in. */
  readonly report: DiagramReport;
  /** The choice made, in words, when it is not the code's own drawing. */
  readonly choice?: string;
  /** The part signs of the chosen realisation, as the `part-signs` attribute would state them. */
  readonly partSigns?: string;
  readonly outcomes: readonly ClaimOutcome[];
}

interface Candidate {
  readonly signs: readonly Sign[];
  readonly mirror: boolean;
}

function signWord(s: Sign): string {
  return s === 1 ? '+' : '-';
}

/** The realisations to try, the code's own drawing first, then its mirror image, then by fewest parts reflected. */
function candidates(diagram: LinkDiagram): { list: Candidate[]; total: number } {
  const parts = diagram.openChoices!.parts;
  const own = parts.map((p) => diagram.crossings[p.crossings[0]!]!.sign);
  const mirrored = own.map((s) => -s as Sign);
  const bodies = parts.map((p, i) => (p.kink ? -1 : i)).filter((i) => i >= 0);
  const kinks = parts.map((p, i) => (p.kink ? i : -1)).filter((i) => i >= 0);
  // Only how many kinks are positive changes a value (writhe, bracket), not which.
  const total = 2 ** bodies.length * (kinks.length + 1);
  const list: Candidate[] = [{ signs: own, mirror: false }];
  if (parts.length > 0) list.push({ signs: mirrored, mirror: true });
  const seen = new Set<string>();
  const keyOf = (signs: readonly Sign[]) => `${bodies.map((i) => signs[i]).join()}|${kinks.filter((i) => signs[i] === 1).length}`;
  for (const c of list) seen.add(keyOf(c.signs));
  const options: { signs: Sign[]; flips: number }[] = [];
  for (let mask = 0; mask < 2 ** Math.min(bodies.length, 20) && options.length < MAX_REALISATIONS * 4; mask++) {
    for (let positive = 0; positive <= kinks.length; positive++) {
      const signs = [...own];
      bodies.forEach((i, b) => {
        if ((mask >> b) & 1) signs[i] = -own[i]! as Sign;
      });
      // Reach `positive` positive kinks by reflecting as few kinks as possible.
      let have = kinks.filter((i) => own[i] === 1).length;
      for (const i of kinks) {
        if (have < positive && signs[i] === -1) (signs[i] = 1), have++;
        else if (have > positive && signs[i] === 1) (signs[i] = -1), have--;
      }
      const flips = signs.filter((s, i) => s !== own[i]).length;
      options.push({ signs, flips });
    }
  }
  options.sort((a, b) => a.flips - b.flips);
  for (const o of options) {
    const key = keyOf(o.signs);
    if (seen.has(key)) continue;
    seen.add(key);
    list.push({ signs: o.signs, mirror: false });
  }
  return { list: list.slice(0, MAX_REALISATIONS), total };
}

function entriesOf(part: OpenPart): string {
  const e = part.crossings.map((c) => c + 1);
  if (e.length === 1) return `entry ${e[0]}`;
  return e.every((x, i) => i === 0 || x === e[i - 1]! + 1) ? `entries ${e[0]}–${e[e.length - 1]}` : `entries ${e.join(', ')}`;
}

/** "the mirror image of the code's drawing", or "the part at entries 4–6 reflected and the kink at entry 7 positive". */
function describeChoice(diagram: LinkDiagram, c: Candidate): string {
  if (c.mirror) return "the mirror image of the code's own drawing";
  const parts = diagram.openChoices!.parts;
  const changes = parts
    .map((p, i) => {
      const own = diagram.crossings[p.crossings[0]!]!.sign;
      if (c.signs[i] === own) return undefined;
      return p.kink ? `the kink at ${entriesOf(p)} ${c.signs[i] === 1 ? 'positive' : 'negative'}` : `the part at ${entriesOf(p)} reflected (its chirality reversed)`;
    })
    .filter((x): x is string => x !== undefined);
  if (changes.length === 0) return "the code's own drawing";
  const list = changes.length === 1 ? changes[0]! : `${changes.slice(0, -1).join(', ')} and ${changes[changes.length - 1]}`;
  return `the code's drawing with ${list}`;
}

function agrees(claim: DiagramClaim, report: DiagramReport, ctx: JudgeContext): boolean {
  try {
    return judgeClaim(claim.key, claim.text, report, ctx).verdict === 'agrees';
  } catch (e) {
    if (isInputError(e)) return false;
    throw e;
  }
}

function judgeOne(claim: DiagramClaim, report: DiagramReport, ctx: JudgeContext): ClaimOutcome {
  try {
    return { kind: 'judged', judgement: judgeClaim(claim.key, claim.text, report, ctx) };
  } catch (e) {
    if (!isInputError(e)) throw e;
    return { kind: 'unreadable', error: e };
  }
}

/**
 * Judges the claims about one diagram (in document order). A diagram whose code leaves no choice open is
 * judged as it is; otherwise as described above.
 */
export function judgeDiagramClaims(report: DiagramReport, claims: readonly DiagramClaim[], ctx: JudgeContext): DiagramVerdicts {
  const open = report.diagram.openChoices;
  if (!open) return { report, outcomes: claims.map((c) => judgeOne(c, report, ctx)) };
  const { list, total } = candidates(report.diagram);
  // The code's own drawing is the report itself, read with its chirality fixed (no second analysis).
  const realised = new Map<Candidate, DiagramReport>([[list[0]!, Object.create(report, { chiralityFixed: { value: true } }) as DiagramReport]]);
  const reportOf = (c: Candidate): DiagramReport => {
    let r = realised.get(c);
    if (!r) realised.set(c, (r = analyzeDiagram(open.realise(c.signs), report.limits)));
    return r;
  };
  const dependent = claims.map((c, i) => ((claimSpec(c.key)?.changedBy.length ?? 0) > 0 ? i : -1)).filter((i) => i >= 0);
  const holds = new Map<Candidate, boolean[]>();
  const holdsIn = (c: Candidate): boolean[] => {
    let h = holds.get(c);
    if (!h) holds.set(c, (h = dependent.map((i) => agrees(claims[i]!, reportOf(c), ctx))));
    return h;
  };
  // The realisation in which most claims hold; among equals, the one in which the earliest claims hold,
  // so that a later claim is the one reported as conflicting.
  const better = (a: boolean[], b: boolean[]): boolean => {
    const count = (h: boolean[]) => h.filter(Boolean).length;
    if (count(a) !== count(b)) return count(a) > count(b);
    const first = a.findIndex((x, i) => x !== b[i]);
    return first >= 0 && a[first]!;
  };
  let chosen = list[0]!;
  for (const c of list) {
    if (better(holdsIn(c), holdsIn(chosen))) chosen = c;
    if (holdsIn(c).every(Boolean)) break;
  }
  const chosenHolds = holdsIn(chosen);
  const everyHolds = chosenHolds.every(Boolean);
  const chosenReport = reportOf(chosen);
  const ownHolds = holdsIn(list[0]!);
  const firstNeeding = dependent.find((_, d) => chosenHolds[d] && !ownHolds[d]);
  const choice = chosen === list[0] ? undefined : describeChoice(report.diagram, chosen);
  const partSigns = chosen.signs.map(signWord).join(' ');
  const outcomes = claims.map((claim, i): ClaimOutcome => {
    const outcome = judgeOne(claim, chosenReport, ctx);
    if (outcome.kind !== 'judged') return outcome;
    const d = dependent.indexOf(i);
    if (d >= 0 && i === firstNeeding && choice !== undefined) {
      const noun = claimSpec(claim.key)!.noun;
      const warning = `the ${noun} claimed here holds only for ${choice}, which the code leaves open; every value of this diagram in the document is judged and filled in for that realisation (write part-signs="${partSigns}" on the diagram to fix it there)`;
      return { kind: 'judged', judgement: { ...outcome.judgement, ...(chosen.mirror ? { diagnosis: { kind: 'mirror', detail: `the claim is the value of ${choice}` } } : {}), warning } };
    }
    if (d >= 0 && !everyHolds && !chosenHolds[d]) {
      const elsewhere = list.find((c) => holds.has(c) && holdsIn(c)[d]);
      if (elsewhere) {
        const excluded = dependent.find((_, e) => chosenHolds[e] && !holdsIn(elsewhere)[e]) ?? dependent.find((_, e) => chosenHolds[e]);
        if (excluded !== undefined) {
          return { kind: 'conflict', judgement: outcome.judgement, other: excluded, detail: `it holds only for ${describeChoice(report.diagram, elsewhere)}` };
        }
      }
      if (list.length < total && outcome.judgement.verdict === 'contradicts') {
        return {
          kind: 'judged',
          judgement: {
            ...outcome.judgement,
            verdict: 'undecided',
            reason: `${outcome.judgement.reason}; the DT code allows ${total} realisations (its parts' chiralities and kink signs) and only ${list.length} were tried, so whether another one has this value is open`,
          },
        };
      }
    }
    return outcome;
  });
  return { report: chosenReport, ...(choice !== undefined ? { choice, partSigns } : {}), outcomes };
}
